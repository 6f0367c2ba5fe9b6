package org.leadline.io;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.stream.IntStream;
import org.leadline.survey.PingTable;

/**
 * The fast path of {@link PingCsvReader}: the file is split into byte ranges of about
 * {@link #RANGE_BYTES} that start and end at line boundaries, the ranges are parsed in parallel
 * (common fork/join pool) into columnar chunks, and the chunks are concatenated in file order, so
 * the table is the same whatever the number of threads.
 *
 * <p>It handles the plain form of the ping CSV (no quotes, {@code \n} or {@code \r\n} line ends,
 * decimal numbers) and gives up, returning null, on anything else or on any error: the caller then
 * reads the whole file again with the general Commons CSV path, which gives the same table or the
 * exact error message with its line and column. So the fast path never decides what is an error.
 *
 * <p>Numbers of at most 17 significant digits and 22 decimals are converted as an exact integer
 * divided by an exact power of ten, which IEEE 754 rounds correctly, i.e. to the same double as
 * {@link Double#parseDouble} (the classic exact fast path, W. D. Clinger, "How to read floating
 * point numbers accurately", PLDI 1990); other numbers go through {@link Double#parseDouble}.
 */
final class ParallelPingCsv {
    /**
     * Bytes per parsed range: small enough to balance two to eight cores, large enough to amortise a
     * task. The system property {@code leadline.csv.rangeBytes} overrides it (tests use tiny ranges
     * to exercise the boundaries); the table does not depend on it.
     */
    static final int RANGE_BYTES = 8 << 20;
    private static final double[] POW10 = new double[23];
    static {
        double p = 1;
        for (int i = 0; i < POW10.length; i++) { POW10[i] = p; p *= 10; }
    }

    /** Thrown inside to abandon the fast path. */
    private static final class GiveUp extends RuntimeException {
        GiveUp() { super(null, null, false, false); }
    }
    private static final GiveUp GIVE_UP = new GiveUp();

    // field indices into the per-row column map
    private static final int TIME = 0, LAT = 1, LON = 2, TWTT = 3, DEPTH = 4, ANGLE = 5, HEADING = 6, HEAVE = 7,
            ROLL = 8, PITCH = 9, LINE = 10, BEAM = 11, QUALITY = 12;
    private static final String[] NAMES = {"time", "lat", "lon", "twtt", "depth", "angle", "heading", "heave", "roll",
            "pitch", "line", "beam", "quality"};

    private ParallelPingCsv() {}

    /** The table, or null when the general reader must read this file (unusual form or any error). */
    static PingTable read(Path file, boolean separateNavigation) {
        return read(file, separateNavigation, Math.max(1, Integer.getInteger("leadline.csv.rangeBytes", RANGE_BYTES)));
    }

    /** As {@link #read(Path, boolean)} with ranges of about {@code rangeBytes}. */
    static PingTable read(Path file, boolean separateNavigation, int rangeBytes) {
        try (FileChannel ch = FileChannel.open(file, StandardOpenOption.READ)) {
            long size = ch.size();
            int[] col = new int[NAMES.length];
            long dataStart = header(ch, size, col);
            if (dataStart < 0) return null;
            if (col[TIME] < 0 || (!separateNavigation && (col[LAT] < 0 || col[LON] < 0))
                    || (col[TWTT] < 0 && col[DEPTH] < 0)) return null;
            List<long[]> ranges = ranges(ch, dataStart, size, rangeBytes);
            List<Chunk> chunks = IntStream.range(0, ranges.size()).parallel()
                    .mapToObj(k -> parse(ch, ranges.get(k)[0], ranges.get(k)[1], col, separateNavigation))
                    .toList();
            return concat(chunks, col);
        } catch (GiveUp | IOException | java.io.UncheckedIOException e) {
            return null;
        }
    }

    /** Reads the header line; fills col with the field index of each known name (-1 absent); returns the data's first byte, -1 to give up. */
    private static long header(FileChannel ch, long size, int[] col) throws IOException {
        Arrays.fill(col, -1);
        int n = (int) Math.min(size, 1 << 16);
        byte[] b = new byte[n];
        readFully(ch, ByteBuffer.wrap(b), 0);
        int p = 0;
        while (p < n) {
            int e = p;
            while (e < n && b[e] != '\n') e++;
            if (e == n && e < size) return -1; // header longer than 64 KiB: general path
            int le = e > p && b[e - 1] == '\r' ? e - 1 : e;
            if (le == p || b[p] == '#') { p = e + 1; continue; } // blank or comment line
            String line = new String(b, p, le - p, StandardCharsets.UTF_8);
            if (line.indexOf('"') >= 0 || line.indexOf('\r') >= 0 || line.isBlank()) return -1;
            String[] names = line.split(",", -1);
            Map<String, Integer> seen = new HashMap<>();
            for (int c = 0; c < names.length; c++) {
                String name = names[c].trim().toLowerCase(Locale.ROOT);
                if (c == 0 && name.startsWith("\uFEFF")) return -1;
                if (name.isEmpty()) continue;
                if (seen.putIfAbsent(name, c) != null) return -1;
                for (int k = 0; k < NAMES.length; k++) if (NAMES[k].equals(name)) col[k] = c;
            }
            return e + 1L;
        }
        return -1;
    }

    /** Byte ranges of about rangeBytes, each starting at a line start. */
    private static List<long[]> ranges(FileChannel ch, long start, long size, int rangeBytes) throws IOException {
        List<long[]> out = new ArrayList<>();
        byte[] probe = new byte[1 << 16];
        long from = start;
        while (from < size) {
            long to = from + rangeBytes;
            if (to >= size) {
                to = size;
            } else {
                // move to just after the next line end
                long at = to;
                outer:
                while (true) {
                    int got = readSome(ch, probe, at);
                    if (got <= 0) { at = size; break; }
                    for (int i = 0; i < got; i++) {
                        if (probe[i] == '\n') { at += i + 1; break outer; }
                    }
                    at += got;
                }
                to = Math.min(at, size);
            }
            out.add(new long[]{from, to});
            from = to;
        }
        return out;
    }

    /** One parsed range: columns of the fields present, lines as chunk-local ids. */
    private static final class Chunk {
        int n;
        final double[][] d = new double[10][];
        final int[][] in = new int[3][];
        final List<String> lineNames = new ArrayList<>();
        double firstTime = Double.NaN, lastTime = Double.NaN;

        Chunk(int[] col, int capacity) {
            for (int k = 0; k < 10; k++) if (col[k] >= 0) d[k] = new double[capacity];
            for (int j = 0; j < 3; j++) if (col[10 + j] >= 0) in[j] = new int[capacity];
        }

        void grow() {
            int m = Math.max(16, n * 2);
            for (int k = 0; k < 10; k++) if (d[k] != null) d[k] = Arrays.copyOf(d[k], m);
            for (int j = 0; j < 3; j++) if (in[j] != null) in[j] = Arrays.copyOf(in[j], m);
        }

        int capacity() {
            return d[TIME].length;
        }
    }

    /** CharSequence over ASCII bytes, reused for time parsing (no allocation on IsoTime's fast path). */
    private static final class Bytes implements CharSequence {
        byte[] b;
        int s, e;

        @Override public int length() { return e - s; }
        @Override public char charAt(int i) { return (char) (b[s + i] & 0xff); }
        @Override public CharSequence subSequence(int a, int z) { return toString().substring(a, z); }
        @Override public String toString() { return new String(b, s, e - s, StandardCharsets.UTF_8); }
    }

    private static Chunk parse(FileChannel ch, long start, long end, int[] col, boolean sepNav) {
        byte[] b = new byte[(int) (end - start)];
        try {
            readFully(ch, ByteBuffer.wrap(b), start);
        } catch (IOException e) {
            throw GIVE_UP;
        }
        int nf = 0;
        for (int c : col) nf = Math.max(nf, c + 1);
        int[] fs = new int[nf], fe = new int[nf];
        Chunk k = new Chunk(col, Math.max(16, b.length / 80));
        Bytes timeText = new Bytes();
        timeText.b = b;
        int lastTimeS = 0, lastTimeE = 0; // empty: no time parsed yet (a time is never empty)
        double lastTime = Double.NaN, previous = Double.NEGATIVE_INFINITY;
        int lastLineS = 0, lastLineE = 0, lastLineId = -1; // the empty name is line -1
        Map<String, Integer> lineIndex = new HashMap<>();
        int len = b.length, p = 0;
        while (p < len) {
            if (b[p] == '#') { // comment line
                while (p < len && b[p] != '\n') p++;
                p++;
                continue;
            }
            int f = 0, s = p, i = p;
            while (true) {
                byte c = i < len ? b[i] : (byte) '\n';
                if (c > ',') { // digits, letters, '.', '-', ':': one test for most bytes
                    i++;
                    continue;
                }
                if (c == ',' || c == '\n') {
                    if (f < nf) { fs[f] = s; fe[f] = i; }
                    f++;
                    if (c == '\n') break;
                    s = i + 1;
                } else if (c == '"') {
                    throw GIVE_UP;
                } else if (c == '\r' && (i + 1 >= len || b[i + 1] != '\n')) {
                    throw GIVE_UP; // a lone CR is a line end to Commons CSV
                }
                i++;
            }
            int lineStart = p;
            p = i + 1;
            int rawEnd = i > lineStart && b[i - 1] == '\r' ? i - 1 : i;
            if (rawEnd == lineStart) continue; // blank line
            if (f == 1) {
                boolean blank = true;
                for (int q = lineStart; q < rawEnd; q++) if (b[q] > ' ') { blank = false; break; }
                if (blank) throw GIVE_UP;
            }
            for (int q = f; q < nf; q++) { fs[q] = 0; fe[q] = 0; }
            for (int q = 0; q < Math.min(f, nf); q++) { // trim
                int a = fs[q], z = fe[q];
                while (a < z && (b[a] & 0xff) <= ' ') a++;
                while (z > a && (b[z - 1] & 0xff) <= ' ') z--;
                fs[q] = a;
                fe[q] = z;
            }
            if (k.n == k.capacity()) k.grow();
            int r = k.n;

            // time (required), parsed once per ping: beams of one ping repeat the same text
            int ts = fs[col[TIME]], te = fe[col[TIME]];
            if (ts == te) throw GIVE_UP;
            double t;
            if (te - ts == lastTimeE - lastTimeS && Arrays.equals(b, ts, te, b, lastTimeS, lastTimeE)) {
                t = lastTime;
            } else {
                timeText.s = ts;
                timeText.e = te;
                try {
                    t = IsoTime.parse(timeText);
                } catch (IllegalArgumentException | java.time.DateTimeException e) {
                    throw GIVE_UP;
                }
                lastTime = t;
                lastTimeS = ts;
                lastTimeE = te;
            }
            if (t < previous) throw GIVE_UP;
            previous = t;
            k.d[TIME][r] = t;
            if (Double.isNaN(k.firstTime)) k.firstTime = t;
            k.lastTime = t;

            if (col[LAT] >= 0) {
                int c = col[LAT];
                double v = sepNav && fs[c] == fe[c] ? Double.NaN : required(b, fs[c], fe[c]);
                if (v < -90 || v > 90) throw GIVE_UP;
                k.d[LAT][r] = v;
            }
            if (col[LON] >= 0) {
                int c = col[LON];
                double v = sepNav && fs[c] == fe[c] ? Double.NaN : required(b, fs[c], fe[c]);
                if (v < -180 || v > 180) throw GIVE_UP;
                k.d[LON][r] = v;
            }
            double twtt = optional(b, fs, fe, col[TWTT]), depth = optional(b, fs, fe, col[DEPTH]);
            if (twtt < 0 || depth < 0 || (Double.isNaN(twtt) && Double.isNaN(depth))) throw GIVE_UP;
            if (col[TWTT] >= 0) k.d[TWTT][r] = twtt;
            if (col[DEPTH] >= 0) k.d[DEPTH][r] = depth;
            if (col[ANGLE] >= 0) k.d[ANGLE][r] = bounded(optional(b, fs, fe, col[ANGLE]), 90);
            if (col[HEADING] >= 0) k.d[HEADING][r] = bounded(optional(b, fs, fe, col[HEADING]), 360);
            if (col[HEAVE] >= 0) k.d[HEAVE][r] = optional(b, fs, fe, col[HEAVE]);
            if (col[ROLL] >= 0) k.d[ROLL][r] = bounded(optional(b, fs, fe, col[ROLL]), 90);
            if (col[PITCH] >= 0) k.d[PITCH][r] = bounded(optional(b, fs, fe, col[PITCH]), 90);
            if (col[LINE] >= 0) {
                int ls = fs[col[LINE]], lz = fe[col[LINE]];
                int id;
                if (lz - ls == lastLineE - lastLineS && Arrays.equals(b, ls, lz, b, lastLineS, lastLineE)) {
                    id = lastLineId;
                } else {
                    String name = new String(b, ls, lz - ls, StandardCharsets.UTF_8);
                    if (name.isEmpty()) {
                        id = -1;
                    } else {
                        id = lineIndex.computeIfAbsent(name, x -> { k.lineNames.add(x); return k.lineNames.size() - 1; });
                    }
                    lastLineS = ls;
                    lastLineE = lz;
                    lastLineId = id;
                }
                k.in[0][r] = id;
            }
            if (col[BEAM] >= 0) k.in[1][r] = optionalInt(b, fs, fe, col[BEAM]);
            if (col[QUALITY] >= 0) k.in[2][r] = optionalInt(b, fs, fe, col[QUALITY]);
            k.n++;
        }
        return k;
    }

    private static double bounded(double v, double limit) {
        if (Math.abs(v) > limit) throw GIVE_UP;
        return v;
    }

    private static double optional(byte[] b, int[] fs, int[] fe, int c) {
        if (c < 0) return Double.NaN;
        return fs[c] == fe[c] ? Double.NaN : required(b, fs[c], fe[c]);
    }

    /** A finite decimal number from b[s, e) (non-empty, trimmed). */
    private static double required(byte[] b, int s, int e) {
        if (s == e) throw GIVE_UP;
        int i = s;
        boolean neg = false;
        if (b[i] == '-') { neg = true; i++; } else if (b[i] == '+') { i++; }
        long m = 0;
        int frac = 0, digits = 0;
        boolean dot = false;
        for (; i < e; i++) {
            int c = b[i];
            if (c >= '0' && c <= '9') {
                if (m >= 100_000_000_000_000_000L) return general(b, s, e);
                m = m * 10 + (c - '0');
                digits++;
                if (dot) frac++;
            } else if (c == '.' && !dot) {
                dot = true;
            } else {
                return general(b, s, e);
            }
        }
        if (digits == 0 || m > (1L << 53) || frac >= POW10.length) return general(b, s, e);
        double v = frac == 0 ? (double) m : m / POW10[frac];
        return neg ? -v : v;
    }

    private static double general(byte[] b, int s, int e) {
        try {
            double v = Double.parseDouble(new String(b, s, e - s, StandardCharsets.UTF_8));
            if (!Double.isFinite(v)) throw GIVE_UP;
            return v;
        } catch (NumberFormatException x) {
            throw GIVE_UP;
        }
    }

    private static int optionalInt(byte[] b, int[] fs, int[] fe, int c) {
        int s = fs[c], e = fe[c];
        if (s == e) return -1;
        int i = s;
        boolean neg = false;
        if (b[i] == '-') { neg = true; i++; } else if (b[i] == '+') { i++; }
        if (i == e || e - i > 9) return generalInt(b, s, e);
        int v = 0;
        for (; i < e; i++) {
            int d = b[i] - '0';
            if (d < 0 || d > 9) return generalInt(b, s, e);
            v = v * 10 + d;
        }
        return neg ? -v : v;
    }

    private static int generalInt(byte[] b, int s, int e) {
        try {
            return Integer.parseInt(new String(b, s, e - s, StandardCharsets.UTF_8));
        } catch (NumberFormatException x) {
            throw GIVE_UP;
        }
    }

    /** Concatenates chunks in file order; line ids renumbered in order of first appearance (as the sequential reader does). */
    private static PingTable concat(List<Chunk> chunks, int[] col) {
        long total = 0;
        double previous = Double.NEGATIVE_INFINITY;
        for (Chunk k : chunks) {
            total += k.n;
            if (k.n > 0) {
                if (k.firstTime < previous) throw GIVE_UP; // times decrease across a range boundary
                previous = k.lastTime;
            }
        }
        if (total > Integer.MAX_VALUE - 8) throw GIVE_UP;
        int n = (int) total;
        List<String> names = new ArrayList<>();
        Map<String, Integer> index = new HashMap<>();
        int[][] remap = new int[chunks.size()][];
        int[] offset = new int[chunks.size()];
        int at = 0;
        for (int c = 0; c < chunks.size(); c++) {
            Chunk k = chunks.get(c);
            remap[c] = new int[k.lineNames.size()];
            for (int l = 0; l < k.lineNames.size(); l++) {
                remap[c][l] = index.computeIfAbsent(k.lineNames.get(l), x -> { names.add(x); return names.size() - 1; });
            }
            offset[c] = at;
            at += k.n;
        }
        double[][] d = new double[10][];
        int[][] in = new int[3][];
        // one task per column: copies run in parallel and each array is written by one thread
        IntStream.range(0, 13).parallel().forEach(f -> {
            if (f < 10) {
                double[] a = new double[n];
                if (col[f] < 0) {
                    Arrays.fill(a, Double.NaN);
                } else {
                    for (int c = 0; c < chunks.size(); c++) System.arraycopy(chunks.get(c).d[f], 0, a, offset[c], chunks.get(c).n);
                }
                d[f] = a;
            } else {
                int j = f - 10;
                int[] a = new int[n];
                if (col[f] < 0) {
                    Arrays.fill(a, -1);
                } else if (j == 0) {
                    for (int c = 0; c < chunks.size(); c++) {
                        int[] src = chunks.get(c).in[0], map = remap[c];
                        for (int i = 0, o = offset[c]; i < chunks.get(c).n; i++) a[o + i] = src[i] < 0 ? -1 : map[src[i]];
                    }
                } else {
                    for (int c = 0; c < chunks.size(); c++) System.arraycopy(chunks.get(c).in[j], 0, a, offset[c], chunks.get(c).n);
                }
                in[j] = a;
            }
        });
        return PingTable.ofColumns(n, d[0], d[1], d[2], d[3], d[4], d[5], d[6], d[7], d[8], d[9], in[0], in[1], in[2], names);
    }

    private static void readFully(FileChannel ch, ByteBuffer b, long position) throws IOException {
        while (b.hasRemaining()) {
            int got = ch.read(b, position);
            if (got < 0) throw new IOException("file shorter than expected");
            position += got;
        }
    }

    private static int readSome(FileChannel ch, byte[] into, long position) throws IOException {
        return ch.read(ByteBuffer.wrap(into), position);
    }
}
