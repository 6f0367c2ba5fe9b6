package org.leadline.io;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.MappedByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
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
 * The fast path of {@link PingCsvReader}: the file is memory-mapped in windows, each window is split
 * into byte ranges of about {@link #RANGE_BYTES} that start and end at line boundaries, the line
 * ends of every range are counted (8 bytes at a time), and then every range is parsed in parallel
 * (common fork/join pool) in one pass over its bytes, straight into the table's columns at the row
 * offset its predecessors' line counts give. The table is the same whatever the number of threads.
 *
 * <p>It handles the plain form of the ping CSV (no quotes, {@code \n} or {@code \r\n} line ends,
 * decimal numbers, UTF-8) and gives up, returning null, on anything else or on any error: the caller
 * then reads the whole file again with the general Commons CSV path, which gives the same table or
 * the exact error message with its line and column. So the fast path never decides what is an error;
 * it refuses every row the general path would refuse (value ranges included).
 *
 * <p>Numbers of at most 17 significant digits and 22 decimals are converted as an exact integer
 * divided by an exact power of ten, which IEEE 754 rounds correctly, i.e. to the same double as
 * {@link Double#parseDouble} (the classic exact fast path, W. D. Clinger, "How to read floating
 * point numbers accurately", PLDI 1990); other numbers go through {@link Double#parseDouble}.
 *
 * <p>The range parser ({@link #parse}) is shared with the streaming reader {@link PingCsvChunks}.
 */
final class ParallelPingCsv {
    /**
     * Bytes per parsed range: small enough that a range's bytes stay in a core's 2 MB L2 cache while
     * it is parsed and that two to eight cores stay balanced, large enough to amortise a task. The
     * system property {@code leadline.csv.rangeBytes} overrides it (tests use tiny ranges to exercise
     * the boundaries); the table does not depend on it.
     */
    static final int RANGE_BYTES = 1 << 20;
    /** Bytes per memory-mapped window (at least): ranges are cut inside one window. */
    static final int WINDOW_BYTES = 64 << 20;
    /** Bytes per window of the streaming reader (16 ranges: both cores busy, about 15 MB of parsed rows). */
    static final int STREAM_WINDOW_BYTES = 16 << 20;
    private static final double[] POW10 = new double[23];
    static {
        double p = 1;
        for (int i = 0; i < POW10.length; i++) { POW10[i] = p; p *= 10; }
    }

    /** Thrown inside to abandon the fast path. */
    static final class GiveUp extends RuntimeException {
        GiveUp() { super(null, null, false, false); }
    }
    static final GiveUp GIVE_UP = new GiveUp();

    // column ids (indices into Cols.d for the ten doubles, 10 + j into Cols.in for the three ints)
    static final int TIME = 0, LAT = 1, LON = 2, TWTT = 3, DEPTH = 4, ANGLE = 5, HEADING = 6, HEAVE = 7,
            ROLL = 8, PITCH = 9, LINE = 10, BEAM = 11, QUALITY = 12, SKIP = -1;
    private static final String[] NAMES = {"time", "lat", "lon", "twtt", "depth", "angle", "heading", "heave", "roll",
            "pitch", "line", "beam", "quality"};

    private ParallelPingCsv() {}

    static int rangeBytes() {
        return Math.max(1, Integer.getInteger("leadline.csv.rangeBytes", RANGE_BYTES));
    }

    /** The table, or null when the general reader must read this file (unusual form or any error). */
    static PingTable read(Path file, boolean separateNavigation) {
        return read(file, separateNavigation, rangeBytes());
    }

    /** The header as the fast path understands it. */
    static final class Header {
        /** Field index of each known column (-1 absent). */
        final int[] col = new int[NAMES.length];
        /** Column id of each field of a row (SKIP for other fields), as long as the header. */
        int[] kind;
        /** First byte of the data (just after the header line) and physical lines up to it. */
        long dataStart, dataLines;

        boolean usable(boolean sepNav) {
            return col[TIME] >= 0 && (sepNav || (col[LAT] >= 0 && col[LON] >= 0)) && (col[TWTT] >= 0 || col[DEPTH] >= 0);
        }
    }

    /** One range of a window: bytes [from, to) of the file, its line count and the lines before it. */
    static final class Range {
        final MappedByteBuffer window;
        final long windowStart;
        final long from, to;
        int lines;
        /** Upper bound of its rows (lines, plus one for a last line without a line end). */
        int capacity;

        Range(MappedByteBuffer window, long windowStart, long from, long to) {
            this.window = window;
            this.windowStart = windowStart;
            this.from = from;
            this.to = to;
        }
    }

    /** As {@link #read(Path, boolean)} with ranges of about {@code rangeBytes}. */
    static PingTable read(Path file, boolean separateNavigation, int rangeBytes) {
        return read(file, separateNavigation, rangeBytes, windowBytes(rangeBytes));
    }

    /** As {@link #read(Path, boolean)} with ranges of about {@code rangeBytes} in mapped windows of about {@code windowBytes}. */
    static PingTable read(Path file, boolean separateNavigation, int rangeBytes, int windowBytes) {
        try (FileChannel ch = FileChannel.open(file, StandardOpenOption.READ)) {
            long size = ch.size();
            Header h = header(ch, size);
            if (h == null || !h.usable(separateNavigation)) return null;
            List<Range> ranges = new ArrayList<>();
            long from = h.dataStart;
            while (from < size) {
                List<Range> w = window(ch, from, size, windowBytes, rangeBytes);
                ranges.addAll(w);
                from = w.get(w.size() - 1).to;
            }
            ranges.parallelStream().forEach(ParallelPingCsv::count);
            long total = 0;
            int[] offset = new int[ranges.size()];
            for (int k = 0; k < ranges.size(); k++) {
                if (total > Integer.MAX_VALUE - 16) throw GIVE_UP;
                offset[k] = (int) total;
                total += ranges.get(k).capacity;
            }
            if (total > Integer.MAX_VALUE - 16) throw GIVE_UP;
            int cap = (int) total;
            double[][] d = new double[10][];
            int[][] in = new int[3][];
            for (int c = 0; c < 13; c++) {
                if (h.col[c] < 0) continue;
                if (c < 10) d[c] = new double[cap]; else in[c - 10] = new int[cap];
            }
            Cols[] parts = new Cols[ranges.size()];
            IntStream.range(0, ranges.size()).parallel().forEach(k -> {
                Cols part = new Cols(d, in, offset[k], ranges.get(k).capacity);
                parse(ranges.get(k), h, separateNavigation, part);
                parts[k] = part;
            });
            return assemble(parts, ranges, d, in, h, cap);
        } catch (GiveUp | IOException | java.io.UncheckedIOException | IllegalArgumentException e) {
            return null;
        }
    }

    static int windowBytes(int rangeBytes) {
        return (int) Math.min(1L << 30, Math.max(WINDOW_BYTES, 32L * rangeBytes));
    }

    /** Mapped window of the streaming reader: smaller, as its parsed rows are what it holds in memory. */
    static int streamWindowBytes(int rangeBytes) {
        return (int) Math.min(1L << 30, Math.max(STREAM_WINDOW_BYTES, 16L * rangeBytes));
    }

    /** Checks times across ranges, numbers the lines in order of first appearance, closes holes left by comment lines. */
    private static PingTable assemble(Cols[] parts, List<Range> ranges, double[][] d, int[][] in, Header h, int cap) {
        double previous = Double.NEGATIVE_INFINITY;
        List<String> names = new ArrayList<>();
        Map<String, Integer> index = new HashMap<>();
        int[][] remap = new int[parts.length][];
        int n = 0;
        for (int k = 0; k < parts.length; k++) {
            Cols p = parts[k];
            if (p.n > 0) {
                if (p.firstTime < previous) throw GIVE_UP; // times decrease across a range boundary
                previous = p.lastTime;
            }
            n += p.n;
            int[] map = new int[p.names.size()];
            boolean identity = true;
            for (int l = 0; l < map.length; l++) {
                map[l] = index.computeIfAbsent(p.names.get(l), x -> { names.add(x); return names.size() - 1; });
                identity &= map[l] == l;
            }
            remap[k] = identity ? null : map;
        }
        if (n == 0) throw GIVE_UP;
        if (in[0] != null) {
            int[] line = in[0];
            IntStream.range(0, parts.length).parallel().forEach(k -> {
                int[] map = remap[k];
                if (map == null) return;
                for (int r = parts[k].base, e = r + parts[k].n; r < e; r++) if (line[r] >= 0) line[r] = map[line[r]];
            });
        }
        final int rows = n;
        if (rows != cap) { // comment or blank lines among the data: move the rows together, in order
            int at = 0;
            for (Cols p : parts) {
                if (p.base != at) {
                    for (double[] a : d) if (a != null) System.arraycopy(a, p.base, a, at, p.n);
                    for (int[] a : in) if (a != null) System.arraycopy(a, p.base, a, at, p.n);
                }
                at += p.n;
            }
        }
        IntStream.range(0, 13).parallel().forEach(c -> {
            if (c < 10) {
                if (d[c] == null) { d[c] = new double[rows]; Arrays.fill(d[c], Double.NaN); }
                else if (d[c].length != rows) d[c] = Arrays.copyOf(d[c], rows);
            } else {
                int j = c - 10;
                if (in[j] == null) { in[j] = new int[rows]; Arrays.fill(in[j], -1); }
                else if (in[j].length != rows) in[j] = Arrays.copyOf(in[j], rows);
            }
        });
        return PingTable.ofColumns(rows, d[0], d[1], d[2], d[3], d[4], d[5], d[6], d[7], d[8], d[9], in[0], in[1], in[2], names);
    }

    /** Reads the header line; null to give up. */
    static Header header(FileChannel ch, long size) throws IOException {
        Header h = new Header();
        Arrays.fill(h.col, -1);
        int n = (int) Math.min(size, 1 << 16);
        byte[] b = new byte[n];
        readFully(ch, ByteBuffer.wrap(b), 0);
        int p = 0;
        long lines = 0;
        while (p < n) {
            int e = p;
            while (e < n && b[e] != '\n') e++;
            if (e == n && e < size) return null; // header longer than 64 KiB: general path
            lines++;
            int le = e > p && b[e - 1] == '\r' ? e - 1 : e;
            if (!validUtf8(b, p, le)) return null;
            if (le == p || b[p] == '#') { // blank or comment line
                for (int q = p; q < le; q++) if (b[q] == '\r') return null;
                p = e + 1;
                continue;
            }
            String line = new String(b, p, le - p, StandardCharsets.UTF_8);
            if (line.indexOf('"') >= 0 || line.indexOf('\r') >= 0 || line.isBlank()) return null;
            String[] names = line.split(",", -1);
            Map<String, Integer> seen = new HashMap<>();
            for (int c = 0; c < names.length; c++) {
                String name = names[c].trim().toLowerCase(Locale.ROOT);
                if (c == 0 && name.startsWith("\uFEFF")) return null;
                if (name.isEmpty()) continue;
                if (seen.putIfAbsent(name, c) != null) return null;
                for (int k = 0; k < NAMES.length; k++) if (NAMES[k].equals(name)) h.col[k] = c;
            }
            if (names.length == 1) return null; // the general path explains other separators
            h.kind = new int[names.length];
            Arrays.fill(h.kind, SKIP);
            for (int k = 0; k < NAMES.length; k++) if (h.col[k] >= 0) h.kind[h.col[k]] = k;
            h.dataStart = e + 1L;
            h.dataLines = lines;
            return h;
        }
        return null;
    }

    /**
     * Maps a window of the file from {@code from} and cuts it into ranges of about rangeBytes that
     * end at line ends (the window's end moves back to its last line end unless it is the file's end).
     */
    static List<Range> window(FileChannel ch, long from, long size, int windowBytes, int rangeBytes) throws IOException {
        long wEnd = Math.min(size, from + windowBytes);
        MappedByteBuffer w = ch.map(FileChannel.MapMode.READ_ONLY, from, wEnd - from);
        int len = (int) (wEnd - from);
        boolean eof = wEnd == size;
        if (!eof) {
            int q = len - 1;
            while (q >= 0 && w.get(q) != '\n') q--;
            if (q < 0) throw GIVE_UP; // a line longer than a window
            len = q + 1;
        }
        List<Range> out = new ArrayList<>();
        int s = 0;
        while (s < len) {
            int e;
            if ((long) s + rangeBytes >= len) {
                e = len;
            } else {
                e = s + rangeBytes - 1; // the range ends just after the first line end at or after here
                while (e < len && w.get(e) != '\n') e++;
                e = Math.min(len, e + 1);
            }
            out.add(new Range(w, from, from + s, from + e));
            s = e;
        }
        return out;
    }

    private static final java.lang.invoke.VarHandle LONGS =
            java.lang.invoke.MethodHandles.byteArrayViewVarHandle(long[].class, java.nio.ByteOrder.LITTLE_ENDIAN);

    /**
     * Counts a range's line ends, 8 bytes at a time (exact zero-byte test on x XOR '\n', S. E.
     * Anderson, "Bit Twiddling Hacks"), on a copy in the thread's buffer (faster than reading the
     * mapped buffer 8 bytes at a time through its bounds and scope checks).
     */
    static void count(Range r) {
        byte[] b = bytes(r);
        int e = (int) (r.to - r.from);
        long c = 0;
        int i = 0;
        for (; i + 8 <= e; i += 8) {
            long x = (long) LONGS.get(b, i) ^ 0x0A0A0A0A0A0A0A0AL;
            long y = (x & 0x7F7F7F7F7F7F7F7FL) + 0x7F7F7F7F7F7F7F7FL;
            c += Long.bitCount(~(y | x | 0x7F7F7F7F7F7F7F7FL));
        }
        for (; i < e; i++) if (b[i] == '\n') c++;
        boolean partial = e > 0 && b[e - 1] != '\n';
        r.lines = (int) (partial ? c + 1 : c);
        r.capacity = r.lines;
    }

    /** The range's bytes copied into the calling thread's buffer (from index 0). */
    private static byte[] bytes(Range r) {
        int len = (int) (r.to - r.from);
        byte[][] holder = BUFFER.get();
        if (holder[0].length < len) holder[0] = new byte[Math.max(len, 1 << 16)];
        byte[] b = holder[0];
        r.window.get((int) (r.from - r.windowStart), b, 0, len);
        return b;
    }

    /**
     * Parsed rows of one range: written into columns at rows [base, base + capacity) (the shared
     * table's columns, or a chunk's own), line ids local to the range ({@link #names}).
     */
    static final class Cols {
        final double[][] d;
        final int[][] in;
        final int base, capacity;
        int n;
        final List<String> names = new ArrayList<>();
        double firstTime = Double.NaN, lastTime = Double.NaN;

        Cols(double[][] d, int[][] in, int base, int capacity) {
            this.d = d;
            this.in = in;
            this.base = base;
            this.capacity = capacity;
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

    /** Per-thread copy of a range's bytes (reused: no garbage per range). */
    private static final ThreadLocal<byte[][]> BUFFER = ThreadLocal.withInitial(() -> new byte[1][0]);

    /** Parses one range into {@code k} (capacity at least the range's line count); throws GIVE_UP on anything unusual. */
    static void parse(Range r, Header h, boolean sepNav, Cols k) {
        new RangeParser(bytes(r), (int) (r.to - r.from), h, sepNav, k).run();
    }

    /** One pass over the bytes of a range: fields are found and converted as the bytes go by. */
    private static final class RangeParser {
        final byte[] b;
        final int len;
        final Header h;
        final int[] kind;
        final boolean sepNav;
        final Cols k;
        final double[] time, lat, lon, twtt, depth, angle, heading, heave, roll, pitch;
        final int[] line, beam, quality;
        final Bytes timeText = new Bytes();
        final Map<String, Integer> lineIndex = new HashMap<>();
        int lastTimeS, lastTimeE; // empty: no time parsed yet (a time is never empty)
        double lastTime = Double.NaN, previous = Double.NEGATIVE_INFINITY;
        int lastLineS, lastLineE, lastLineId = -1; // the empty name is line -1
        int p;

        RangeParser(byte[] b, int len, Header h, boolean sepNav, Cols k) {
            this.b = b;
            this.len = len;
            this.h = h;
            this.kind = h.kind;
            this.sepNav = sepNav;
            this.k = k;
            time = k.d[TIME]; lat = k.d[LAT]; lon = k.d[LON]; twtt = k.d[TWTT]; depth = k.d[DEPTH];
            angle = k.d[ANGLE]; heading = k.d[HEADING]; heave = k.d[HEAVE]; roll = k.d[ROLL]; pitch = k.d[PITCH];
            line = k.in[0]; beam = k.in[1]; quality = k.in[2];
            timeText.b = b;
        }

        void run() {
            final int fields = kind.length;
            int maxCol = 0;
            for (int c : h.col) maxCol = Math.max(maxCol, c);
            // one line per call: run() is called once per range, so its loop would run in the
            // interpreter until compiled on the stack; parseLine() is called per row and compiled early
            while (p < len) parseLine(fields, maxCol);
        }

        /** Parses the line at p (a row, a comment or a blank line) and moves p past it. */
        private void parseLine(int fields, int maxCol) {
            int rowStart = p;
            byte c0 = b[p];
            if (c0 == '#') { // comment line
                skipField(true);
                p++;
                return;
            }
            if (c0 == '\n') { p++; return; } // blank line
            if (c0 == '\r' && p + 1 < len && b[p + 1] == '\n') { p += 2; return; }
            if (k.n == k.capacity) throw GIVE_UP; // cannot happen: capacity counts the lines
            int r = k.base + k.n;
            int f = 0;
            while (true) {
                int kd = f < fields ? kind[f] : SKIP;
                switch (kd) {
                    case SKIP -> skipField(false);
                    case TIME -> time(r);
                    case LINE -> line(r);
                    case BEAM -> beam[r] = integer();
                    case QUALITY -> quality[r] = integer();
                    default -> k.d[kd][r] = checked(kd, number());
                }
                f++;
                if (p >= len || b[p] == '\n') break;
                p++; // the comma
            }
            boolean lineEnd = p < len;
            p++;
            if (f == 1) { // a line of spaces only
                boolean blank = true;
                for (int q = rowStart; q < Math.min(p, len); q++) if ((b[q] & 0xff) > ' ') { blank = false; break; }
                if (blank) throw GIVE_UP;
            }
            if (!lineEnd && f < fields) throw GIVE_UP; // a short last row without line end: the general path says the file is cut off
            if (f <= maxCol) missing(r, f);
            double tw = twtt == null ? Double.NaN : twtt[r], de = depth == null ? Double.NaN : depth[r];
            if (Double.isNaN(tw) && Double.isNaN(de)) throw GIVE_UP;
            k.n++;
        }

        /** Fields beyond a short row's end: empty. */
        private void missing(int r, int f) {
            for (int c = 0; c < 13; c++) {
                if (h.col[c] < f) continue;
                switch (c) {
                    case TIME -> throw GIVE_UP;
                    case LAT, LON -> { if (!sepNav) throw GIVE_UP; k.d[c][r] = Double.NaN; }
                    case LINE -> line[r] = -1;
                    case BEAM -> beam[r] = -1;
                    case QUALITY -> quality[r] = -1;
                    default -> k.d[c][r] = Double.NaN;
                }
            }
        }

        /** The value checks of the general path, as give-ups. */
        private double checked(int c, double v) {
            switch (c) {
                case LAT -> { if (v < -90 || v > 90 || (!sepNav && v != v)) throw GIVE_UP; }
                case LON -> { if (v < -180 || v > 180 || (!sepNav && v != v)) throw GIVE_UP; }
                case TWTT -> { if (v < 0 || v > PingCsvReader.MAX_TWTT) throw GIVE_UP; }
                case DEPTH -> { if (v < 0 || v > PingCsvReader.MAX_DEPTH) throw GIVE_UP; }
                case HEADING -> { if (Math.abs(v) > 360) throw GIVE_UP; }
                case ANGLE, ROLL, PITCH -> { if (Math.abs(v) > 90) throw GIVE_UP; }
                default -> { }
            }
            return v;
        }

        /** Moves p to the field's end (comma, line end or end of the bytes); refuses quotes, lone CRs and bad UTF-8. */
        private void skipField(boolean toLineEnd) {
            final byte[] b = this.b;
            final int len = this.len;
            int q = p;
            final int s = q;
            boolean ascii = true;
            while (q < len) {
                byte c = b[q];
                if (c > ',') { q++; continue; }
                if (c == '\n' || (c == ',' && !toLineEnd)) break;
                if (c == '"' && !toLineEnd) throw GIVE_UP;
                if (c == '\r' && (q + 1 >= len || b[q + 1] != '\n')) throw GIVE_UP; // a lone CR is a line end to Commons CSV
                if (c < 0) ascii = false;
                q++;
            }
            p = q;
            if (!ascii && !validUtf8(b, s, q)) throw GIVE_UP;
        }

        /**
         * Whether the field at p is exactly b[s, e) followed by a delimiter (a repeated time or line
         * name: no scan, one vectorised compare); if so p moves past it.
         */
        private boolean repeats(int s, int e) {
            int l = e - s, q = p;
            if (l == 0 || q + l > len) return false;
            int after = q + l;
            if (after < len) {
                byte c = b[after];
                if (c != ',' && c != '\n' && !(c == '\r' && after + 1 < len && b[after + 1] == '\n')) return false;
            }
            if (!Arrays.equals(b, q, after, b, s, e)) return false;
            p = c(after);
            return true;
        }

        /** Position of the delimiter at or after a field's last byte (skips the CR of a CRLF). */
        private int c(int after) {
            return after < len && b[after] == '\r' ? after + 1 : after;
        }

        /** Skips spaces (and the CR of a CRLF) before or after a value. */
        private void spaces() {
            while (p < len) {
                byte c = b[p];
                if (c == '\r') {
                    if (p + 1 >= len || b[p + 1] != '\n') throw GIVE_UP;
                    p++;
                } else if (c == ' ' || c == '\t' || (c >= 0 && c < ' ' && c != '\n')) {
                    p++;
                } else {
                    return;
                }
            }
        }

        private boolean atDelimiter() {
            return p >= len || b[p] == ',' || b[p] == '\n';
        }

        /** The field's trimmed bounds after skipping it from s: {start, end}. */
        private long trimmedFrom(int s) {
            p = s;
            skipField(false);
            int a = s, z = p;
            while (a < z && (b[a] & 0xff) <= ' ') a++;
            while (z > a && (b[z - 1] & 0xff) <= ' ') z--;
            return ((long) a << 32) | z;
        }

        /** A decimal number, NaN for an empty field. */
        private double number() {
            final byte[] b = this.b;
            final int len = this.len;
            final int s = p;
            int q = s;
            if (q < len && b[q] <= ' ' && b[q] != '\n') { spaces(); q = p; }
            if (q >= len || b[q] == ',' || b[q] == '\n') return Double.NaN;
            boolean neg = false;
            byte c = b[q];
            if (c == '-') { neg = true; q++; } else if (c == '+') { q++; }
            // integer part, then fraction: tight loops; more than 18 digits (a long could overflow) go to parseDouble
            long m = 0;
            int start = q, dgt;
            while (q < len && (dgt = b[q] - '0') >= 0 && dgt <= 9) { m = m * 10 + dgt; q++; }
            int digits = q - start, frac = 0;
            if (q < len && b[q] == '.') {
                int fs = ++q;
                while (q < len && (dgt = b[q] - '0') >= 0 && dgt <= 9) { m = m * 10 + dgt; q++; }
                frac = q - fs;
                digits += frac;
            }
            if (digits > 18) return slowNumber(s);
            p = q;
            if (q < len && b[q] != ',' && b[q] != '\n') { spaces(); q = p; }
            if (!(q >= len || b[q] == ',' || b[q] == '\n') || digits == 0 || m > (1L << 53) || frac >= POW10.length) {
                return slowNumber(s);
            }
            double v = frac == 0 ? (double) m : m / POW10[frac];
            return neg ? -v : v;
        }

        private double slowNumber(int s) {
            long t = trimmedFrom(s);
            int a = (int) (t >>> 32), z = (int) t;
            try {
                double v = Double.parseDouble(new String(b, a, z - a, StandardCharsets.UTF_8));
                if (!Double.isFinite(v)) throw GIVE_UP;
                return v;
            } catch (NumberFormatException x) {
                throw GIVE_UP;
            }
        }

        /** A whole number, -1 for an empty field. */
        private int integer() {
            final byte[] b = this.b;
            final int len = this.len;
            final int s = p;
            int q = s;
            if (q < len && b[q] <= ' ' && b[q] != '\n') { spaces(); q = p; }
            if (q >= len || b[q] == ',' || b[q] == '\n') return -1;
            boolean neg = false;
            byte c = b[q];
            if (c == '-') { neg = true; q++; } else if (c == '+') { q++; }
            int v = 0, digits = 0;
            while (q < len) {
                int dgt = b[q] - '0';
                if (dgt < 0 || dgt > 9) break;
                v = v * 10 + dgt;
                digits++;
                q++;
            }
            p = q;
            if (q < len && b[q] != ',' && b[q] != '\n') { spaces(); q = p; }
            if (!(q >= len || b[q] == ',' || b[q] == '\n') || digits == 0 || digits > 9) {
                long t = trimmedFrom(s);
                int a = (int) (t >>> 32), z = (int) t;
                try {
                    return Integer.parseInt(new String(b, a, z - a, StandardCharsets.UTF_8));
                } catch (NumberFormatException x) {
                    throw GIVE_UP;
                }
            }
            return neg ? -v : v;
        }

        /** The ping time, parsed once per ping (the beams of one ping repeat the same text). */
        private void time(int r) {
            if (repeats(lastTimeS, lastTimeE)) {
                time[r] = lastTime;
                if (k.n == 0) k.firstTime = lastTime;
                k.lastTime = lastTime;
                return;
            }
            long t = trimmedFrom(p);
            int ts = (int) (t >>> 32), te = (int) t;
            if (ts == te) throw GIVE_UP;
            double v;
            if (te - ts == lastTimeE - lastTimeS && Arrays.equals(b, ts, te, b, lastTimeS, lastTimeE)) {
                v = lastTime;
            } else {
                timeText.s = ts;
                timeText.e = te;
                try {
                    v = IsoTime.parse(timeText);
                } catch (IllegalArgumentException | java.time.DateTimeException e) {
                    throw GIVE_UP;
                }
                lastTime = v;
                lastTimeS = ts;
                lastTimeE = te;
            }
            if (v < previous) throw GIVE_UP;
            previous = v;
            time[r] = v;
            if (k.n == 0) k.firstTime = v;
            k.lastTime = v;
        }

        private void line(int r) {
            if (repeats(lastLineS, lastLineE)) {
                line[r] = lastLineId;
                return;
            }
            long t = trimmedFrom(p);
            int ls = (int) (t >>> 32), lz = (int) t;
            int id;
            if (lz - ls == lastLineE - lastLineS && Arrays.equals(b, ls, lz, b, lastLineS, lastLineE)) {
                id = lastLineId;
            } else {
                if (ls == lz) {
                    id = -1;
                } else {
                    String name = new String(b, ls, lz - ls, StandardCharsets.UTF_8); // valid: skipField checked it
                    id = lineIndex.computeIfAbsent(name, x -> { k.names.add(x); return k.names.size() - 1; });
                }
                lastLineS = ls;
                lastLineE = lz;
                lastLineId = id;
            }
            line[r] = id;
        }
    }

    /** Whether b[s, e) is well-formed UTF-8 (the general path refuses a file at its first bad byte). */
    static boolean validUtf8(byte[] b, int s, int e) {
        for (int i = s; i < e; i++) {
            if (b[i] < 0) {
                try {
                    StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                            .onUnmappableCharacter(CodingErrorAction.REPORT).decode(ByteBuffer.wrap(b, s, e - s));
                    return true;
                } catch (CharacterCodingException x) {
                    return false;
                }
            }
        }
        return true;
    }

    private static void readFully(FileChannel ch, ByteBuffer b, long position) throws IOException {
        while (b.hasRemaining()) {
            int got = ch.read(b, position);
            if (got < 0) throw new IOException("file shorter than expected");
            position += got;
        }
    }
}
