package org.leadline.io;

import org.leadline.surface.Grid;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * Writes a {@link Grid} as XYZ text: one line per non-empty cell, at the cell centre, as
 * {@code easting,northing,depth,uncertainty,count} under a header line. Eastings, northings,
 * depths and uncertainties in metres with 3 decimals (millimetres), count as an integer; a cell
 * with no depth (NaN) is left out; a missing uncertainty is written {@code NaN}. Rows run north to
 * south, west to east (the grid's row order). Written atomically (see {@link AtomicFiles}).
 */
public final class XyzWriter {
    private XyzWriter() {}

    /** The header line, also the column order. */
    public static final String HEADER = "easting,northing,depth,uncertainty,count";

    /**
     * @param grid grid with at least a {@link Grid#DEPTH} layer ({@link Grid#UNCERTAINTY} and {@link Grid#COUNT} when present)
     * @param out  the file to create or replace
     * @throws IllegalArgumentException when the grid has no depth layer
     */
    public static void write(Grid grid, Path out) throws IOException {
        float[] depth = grid.layer(Grid.DEPTH);
        if (depth == null) throw new IllegalArgumentException("grid has no '" + Grid.DEPTH + "' layer to write to " + out);
        float[] unc = grid.layer(Grid.UNCERTAINTY);
        float[] count = grid.layer(Grid.COUNT);
        // rows formatted in parallel blocks and written in row order: the same bytes for any thread count
        int rowsPerBlock = Math.max(1, 16_384 / Math.max(1, grid.nx)) /* text under 1 MB: not a G1 humongous object */, blocks = (grid.ny + rowsPerBlock - 1) / rowsPerBlock;
        AtomicFiles.write(out, tmp -> {
            try (java.io.OutputStream os = Files.newOutputStream(tmp)) {
                os.write((HEADER + "\n").getBytes(StandardCharsets.UTF_8));
                for (int b0 = 0; b0 < blocks; b0 += 32) {
                    int first = b0, last = Math.min(blocks, b0 + 32);
                    java.util.List<byte[]> text = java.util.stream.IntStream.range(first, last).parallel().mapToObj(b -> {
                        int r0 = b * rowsPerBlock, r1 = Math.min(grid.ny, (b + 1) * rowsPerBlock);
                        // straight into ASCII bytes, sized for the block (no StringBuilder growth)
                        Bytes tx = new Bytes(Math.max(64, (r1 - r0) * grid.nx * 48));
                        for (int r = r0; r < r1; r++) {
                            double y = grid.centreY(r);
                            // one cell per call: compiled early (see SoundingsCsvWriter.format)
                            for (int c = 0; c < grid.nx; c++) cell(tx, grid, c, r * grid.nx + c, y, depth, unc, count);
                        }
                        return java.util.Arrays.copyOf(tx.b, tx.n);
                    }).toList();
                    for (byte[] t : text) os.write(t);
                }
            }
        });
    }

    /** Appends v with exactly three decimals, half away from zero; NaN/infinite as Java prints them. */
    /** The line of cell i (column c, centre northing y); nothing for an empty cell. */
    private static void cell(Bytes tx, Grid grid, int c, int i, double y, float[] depth, float[] unc, float[] count) {
        if (Float.isNaN(depth[i])) return;
        tx.ensure(160);
        tx.fixed3(grid.centreX(c)).put(',');
        tx.fixed3(y).put(',');
        tx.fixed3(depth[i]).put(',');
        tx.fixed3(unc == null ? Double.NaN : unc[i]).put(',');
        if (count == null || Float.isNaN(count[i])) tx.text("NaN");
        else tx.integer(Math.round(count[i]));
        tx.put('\n');
    }

    static StringBuilder fixed3(StringBuilder sb, double v) {
        if (!Double.isFinite(v) || Math.abs(v) >= 9e15 / 1000) return sb.append(v);
        long m = Math.round(Math.abs(v) * 1000);
        if (v < 0 && m != 0) sb.append('-');
        sb.append(m / 1000).append('.');
        long f = m % 1000;
        if (f < 100) sb.append('0');
        if (f < 10) sb.append('0');
        return sb.append(f);
    }

    /** A growable ASCII buffer writing exactly what {@link #fixed3} and {@code StringBuilder.append(long)} write. */
    private static final class Bytes {
        /** "00", "01", ... "99". */
        private static final byte[] PAIRS = new byte[200];
        static {
            for (int i = 0; i < 100; i++) {
                PAIRS[2 * i] = (byte) ('0' + i / 10);
                PAIRS[2 * i + 1] = (byte) ('0' + i % 10);
            }
        }

        byte[] b;
        int n;

        Bytes(int capacity) { b = new byte[capacity]; }

        void ensure(int more) {
            if (n + more > b.length) b = java.util.Arrays.copyOf(b, Math.max(2 * b.length, n + more));
        }

        Bytes put(char c) {
            b[n++] = (byte) c;
            return this;
        }

        Bytes text(String t) {
            ensure(t.length());
            for (int k = 0; k < t.length(); k++) b[n++] = (byte) t.charAt(k);
            return this;
        }

        Bytes integer(long v) {
            if (v < 0) {
                if (v == Long.MIN_VALUE) return text(Long.toString(v));
                put('-');
                v = -v;
            }
            if (v <= Integer.MAX_VALUE) return natural((int) v);
            int len = 1;
            for (long t = v; t >= 10; t /= 10) len++;
            int p = n + len;
            n = p;
            do {
                b[--p] = (byte) ('0' + v % 10);
                v /= 10;
            } while (v > 0);
            return this;
        }

        /** 0 <= w as decimal digits, two at a time (int division by a constant is a multiplication). */
        private Bytes natural(int w) {
            int len = 1;
            for (int t = w; t >= 10; t /= 10) len++;
            int p = n + len;
            n = p;
            while (w >= 100) {
                int q = w / 100, r = w - 100 * q;
                w = q;
                b[--p] = PAIRS[2 * r + 1];
                b[--p] = PAIRS[2 * r];
            }
            if (w >= 10) {
                b[--p] = PAIRS[2 * w + 1];
                b[--p] = PAIRS[2 * w];
            } else {
                b[--p] = (byte) ('0' + w);
            }
            return this;
        }

        /** As {@link XyzWriter#fixed3}: three decimals, half away from zero; NaN, infinities and huge values as Java prints them. */
        Bytes fixed3(double v) {
            if (!Double.isFinite(v) || Math.abs(v) >= 9e15 / 1000) return text(Double.toString(v));
            long m = Math.round(Math.abs(v) * 1000);
            if (v < 0 && m != 0) put('-');
            long whole = m / 1000;   // constant divisor: a multiplication
            integer(whole).put('.');
            int f = (int) (m - whole * 1000);
            b[n++] = (byte) ('0' + f / 100);
            b[n++] = (byte) ('0' + f / 10 % 10);
            b[n++] = (byte) ('0' + f % 10);
            return this;
        }
    }
}
