package org.leadline.bench;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import java.util.stream.IntStream;
import org.leadline.io.Fixed;
import org.leadline.surface.Grid;
import org.leadline.surface.GridSpec;
import org.leadline.surface.Gridder;

/**
 * Median gridding of an XYZ file, end to end (read, grid with {@link Gridder} MEDIAN, write the
 * non-empty cell centres as {@code x y median}), for the side-by-side with GMT {@code blockmedian
 * -r -C} in scripts/bench/gridding-vs-gmt.sh.
 *
 * <pre>
 * java -cp ... org.leadline.bench.MedianGridXyz generate FILE N [seed]   # x y z, 3000 x 1000 m area
 * java -cp ... org.leadline.bench.MedianGridXyz grid FILE CELL XMIN XMAX YMIN YMAX OUT
 * </pre>
 * The reader splits the file into byte ranges at line ends and parses them on all cores
 * (whitespace- or comma-separated decimals; exact conversion as in the ping CSV reader).
 */
public final class MedianGridXyz {
    private MedianGridXyz() {}

    public static void main(String[] args) throws IOException {
        if (args[0].equals("generate")) {
            generate(Path.of(args[1]), Long.parseLong(args[2]), args.length > 3 ? Long.parseLong(args[3]) : 1);
            return;
        }
        Path in = Path.of(args[1]);
        double cell = Double.parseDouble(args[2]);
        double x0 = Double.parseDouble(args[3]), x1 = Double.parseDouble(args[4]);
        double y0 = Double.parseDouble(args[5]), y1 = Double.parseDouble(args[6]);
        Path out = Path.of(args[7]);
        long t0 = System.nanoTime();
        double[][] xyz = read(in);
        long t1 = System.nanoTime();
        GridSpec spec = new GridSpec(x0, y1, cell, (int) Math.round((x1 - x0) / cell), (int) Math.round((y1 - y0) / cell));
        Grid g = Gridder.build(spec, null, xyz[0], xyz[1], xyz[2], null, null, Gridder.Method.MEDIAN);
        long t2 = System.nanoTime();
        write(g, out);
        long t3 = System.nanoTime();
        System.err.printf(Locale.ROOT, "leadline: %d points; read %.2f s, grid %.2f s, write %.2f s%n", xyz[0].length,
                (t1 - t0) / 1e9, (t2 - t1) / 1e9, (t3 - t2) / 1e9);
    }

    static void generate(Path f, long n, long seed) throws IOException {
        SplittableRandom r = new SplittableRandom(seed);
        try (BufferedWriter w = Files.newBufferedWriter(f, StandardCharsets.US_ASCII)) {
            StringBuilder sb = new StringBuilder(1 << 16);
            for (long i = 0; i < n; i++) {
                // half-millimetre positions: never on a cell edge, so cell membership cannot differ between programs
                double x = (r.nextInt(3_000_000) + 0.5) / 1000, y = (r.nextInt(1_000_000) + 0.5) / 1000;
                double z = SwathDayGenerator.seabed(x, y) + 0.05 * r.nextGaussian();
                Fixed.append(sb, x, 4).append(' ');
                Fixed.append(sb, y, 4).append(' ');
                Fixed.append(sb, z, 3).append('\n');
                if (sb.length() > (1 << 16) - 100) {
                    w.append(sb);
                    sb.setLength(0);
                }
            }
            w.append(sb);
        }
    }

    /** Non-empty cells as "x y median" at cell centres, row by row from the north (blockmedian -C order may differ). */
    static void write(Grid g, Path out) throws IOException {
        float[] d = g.layer(Grid.DEPTH);
        int rows = g.ny;
        List<byte[]> parts = IntStream.range(0, rows).parallel().mapToObj(row -> {
            StringBuilder sb = new StringBuilder();
            for (int c = 0; c < g.nx; c++) {
                float v = d[row * g.nx + c];
                if (Float.isNaN(v)) continue;
                Fixed.append(sb, g.xMin + (c + 0.5) * g.cell, 3).append('\t');
                Fixed.append(sb, g.yMax - (row + 0.5) * g.cell, 3).append('\t');
                Fixed.append(sb, v, 3).append('\n');
            }
            return sb.toString().getBytes(StandardCharsets.US_ASCII);
        }).toList();
        try (OutputStream os = Files.newOutputStream(out)) {
            for (byte[] p : parts) os.write(p);
        }
    }

    /** x, y, z columns of a whitespace- or comma-separated file, ranges parsed in parallel. */
    static double[][] read(Path f) throws IOException {
        try (FileChannel ch = FileChannel.open(f, StandardOpenOption.READ)) {
            long size = ch.size();
            int range = 8 << 20;
            List<long[]> ranges = new ArrayList<>();
            long from = 0;
            byte[] probe = new byte[4096];
            while (from < size) {
                long to = Math.min(size, from + range);
                if (to < size) {
                    long at = to;
                    search:
                    while (true) {
                        int got = ch.read(ByteBuffer.wrap(probe), at);
                        if (got <= 0) { at = size; break; }
                        for (int i = 0; i < got; i++) if (probe[i] == '\n') { at += i + 1; break search; }
                        at += got;
                    }
                    to = at;
                }
                ranges.add(new long[]{from, to});
                from = to;
            }
            List<double[][]> parts = IntStream.range(0, ranges.size()).parallel().mapToObj(k -> {
                try {
                    long a = ranges.get(k)[0], z = ranges.get(k)[1];
                    byte[] b = new byte[(int) (z - a)];
                    ByteBuffer bb = ByteBuffer.wrap(b);
                    long pos = a;
                    while (bb.hasRemaining()) pos += ch.read(bb, pos);
                    return parse(b);
                } catch (IOException e) {
                    throw new java.io.UncheckedIOException(e);
                }
            }).toList();
            int n = 0;
            for (double[][] p : parts) n += (int) p[3][0];
            double[][] out = new double[3][n];
            int at = 0;
            for (double[][] p : parts) {
                int m = (int) p[3][0];
                for (int c = 0; c < 3; c++) System.arraycopy(p[c], 0, out[c], at, m);
                at += m;
            }
            return out;
        }
    }

    private static double[][] parse(byte[] b) {
        int cap = b.length / 20 + 16;
        double[][] o = {new double[cap], new double[cap], new double[cap], new double[1]};
        int n = 0, p = 0, len = b.length;
        double[] v = new double[3];
        while (p < len) {
            int k = 0;
            while (p < len && b[p] != '\n') {
                while (p < len && (b[p] == ' ' || b[p] == '\t' || b[p] == ',' || b[p] == '\r')) p++;
                if (p >= len || b[p] == '\n') break;
                int s = p;
                while (p < len && b[p] > ' ' && b[p] != ',') p++;
                if (k < 3) v[k] = number(b, s, p);
                k++;
            }
            p++;
            if (k < 3) continue; // blank or short line
            if (n == o[0].length) for (int c = 0; c < 3; c++) o[c] = java.util.Arrays.copyOf(o[c], n * 2);
            o[0][n] = v[0];
            o[1][n] = v[1];
            o[2][n] = v[2];
            n++;
        }
        o[3][0] = n;
        return o;
    }

    private static final double[] POW10 = {1, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13,
            1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22};

    private static double number(byte[] b, int s, int e) {
        int i = s;
        boolean neg = b[i] == '-';
        if (neg || b[i] == '+') i++;
        long m = 0;
        int frac = 0;
        boolean dot = false;
        for (; i < e; i++) {
            int c = b[i];
            if (c >= '0' && c <= '9' && m < 100_000_000_000_000_000L) {
                m = m * 10 + (c - '0');
                if (dot) frac++;
            } else if (c == '.' && !dot) {
                dot = true;
            } else {
                return Double.parseDouble(new String(b, s, e - s, StandardCharsets.US_ASCII));
            }
        }
        if (m > (1L << 53) || frac > 22) return Double.parseDouble(new String(b, s, e - s, StandardCharsets.US_ASCII));
        double v = frac == 0 ? m : m / POW10[frac];
        return neg ? -v : v;
    }
}
