package org.leadline.io;

import org.leadline.survey.SoundingTable;

import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.stream.IntStream;

/**
 * Writes {@code soundings.csv} (DESIGN.md section 4): every sounding, rejected ones included, as
 * {@code time,line,beam,lat,lon,easting,northing,depth,tvu,thu,status,reason}. Fixed decimals:
 * 8 for lat/lon (about 1 mm), 3 for projected coordinates and depths; times ISO-8601 UTC with
 * milliseconds, as {@link IsoTime#append} and {@link Fixed#append} write them.
 *
 * <p>Speed: a swath day has tens of millions of rows. Rows are formatted by hand straight into
 * ASCII bytes, in blocks of {@link #BLOCK_ROWS} rows formatted in parallel (common fork/join pool)
 * and written in row order, so the file is byte-for-byte the same for any number of threads.
 */
public final class SoundingsCsvWriter {
    public static final String HEADER = "time,line,beam,lat,lon,easting,northing,depth,tvu,thu,status,reason";
    /** Rows per formatted block: about 0.5 MB of text, under half a G1 region, so these buffers are ordinary young objects (larger ones are "humongous" and each starts a concurrent collection once the heap is full of soundings). */
    static final int BLOCK_ROWS = 4096;
    /** Blocks formatted at once before they are written (bounds the memory held in text). */
    static final int BATCH_BLOCKS = 128;
    private static final long[] POW10 = new long[19];
    static {
        POW10[0] = 1;
        for (int i = 1; i < POW10.length; i++) POW10[i] = POW10[i - 1] * 10;
    }

    /** "00", "01", ... "99": two digits per division. */
    private static final byte[] PAIRS = new byte[200];
    static {
        for (int i = 0; i < 100; i++) {
            PAIRS[2 * i] = (byte) ('0' + i / 10);
            PAIRS[2 * i + 1] = (byte) ('0' + i % 10);
        }
    }

    private SoundingsCsvWriter() {}

    /** Writes the table to {@code out} (the caller decides about atomic placement). */
    public static void write(SoundingTable s, Path out) throws IOException {
        try (Appender w = open(out)) {
            w.append(s);
        }
    }

    /** Opens {@code out} for a table written chunk by chunk (a day processed in tiles). */
    public static Appender open(Path out) throws IOException {
        // a gigabyte or more on a swath day: written around the page cache where the file system allows
        return new Appender(DirectFileOutput.open(out));
    }

    /**
     * soundings.csv written chunk after chunk: the header, then each appended table's rows in
     * order. The bytes equal {@link #write} of the concatenated table (rows are formatted one by one).
     */
    public static final class Appender implements AutoCloseable {
        private final OutputStream os;
        private final byte[][] status = {SoundingTable.Status.of((byte) 0).label.getBytes(StandardCharsets.UTF_8),
                SoundingTable.Status.of((byte) 1).label.getBytes(StandardCharsets.UTF_8)};
        private final byte[][] reason = new byte[256][];

        private Appender(OutputStream os) throws IOException {
            this.os = os;
            for (SoundingTable.Reason r : SoundingTable.Reason.values()) reason[r.code & 0xff] = r.label.getBytes(StandardCharsets.UTF_8);
            os.write((HEADER + "\n").getBytes(StandardCharsets.US_ASCII));
        }

        /** Appends every row of {@code s}. */
        public void append(SoundingTable s) throws IOException {
            byte[][] lines = new byte[s.lineNames().size()][];
            for (int l = 0; l < lines.length; l++) lines[l] = field(s.lineNames().get(l)).getBytes(StandardCharsets.UTF_8);
            int blocks = (s.size + BLOCK_ROWS - 1) / BLOCK_ROWS;
            for (int b0 = 0; b0 < blocks; b0 += BATCH_BLOCKS) {
                int first = b0, count = Math.min(BATCH_BLOCKS, blocks - b0);
                List<Ascii> text = IntStream.range(first, first + count).parallel()
                        .mapToObj(b -> format(s, b * BLOCK_ROWS, Math.min(s.size, (b + 1) * BLOCK_ROWS), lines, status, reason))
                        .toList();
                for (Ascii t : text) os.write(t.b, 0, t.n);
            }
        }

        @Override
        public void close() throws IOException { os.close(); }
    }

    private static String field(String v) {
        if (v.indexOf(',') >= 0 || v.indexOf('"') >= 0 || v.indexOf('\n') >= 0) return '"' + v.replace("\"", "\"\"") + '"';
        return v;
    }

    /** Text of rows [from, to). */
    private static Ascii format(SoundingTable s, int from, int to, byte[][] lines, byte[][] status, byte[][] reason) {
        Ascii a = new Ascii(Math.max(256, (to - from) * 140));
        // one row per call: called for every row, so compiled early (a loop over a block would run
        // interpreted until the JIT compiled it on the stack)
        for (int i = from; i < to; i++) a.row(s, i, lines, status, reason);
        return a;
    }

    private static final class Ascii {
        private byte[] b;
        private int n;
        private final byte[] digits = new byte[20];
        /** "yyyy-mm-ddThh:mm:ss." of the second of the last row written, and that second. */
        private byte[] prefix = new byte[0];
        private long lastSecond = Long.MIN_VALUE;
        private final StringBuilder sb = new StringBuilder(32);

        /** Row i of s, with its line end. */
        void row(SoundingTable s, int i, byte[][] lines, byte[][] status, byte[][] reason) {
            ensure(512);
            double t = s.time[i];
            if (!Double.isNaN(t)) {
                // IsoTime.append: whole seconds from java.time once per second, milliseconds by hand
                long ms = Math.round(t * 1000.0);
                long sec = Math.floorDiv(ms, 1000);
                if (sec != lastSecond) {
                    sb.setLength(0);
                    IsoTime.append(sb, sec);
                    String p = sb.toString(); // ends ".000Z"
                    prefix = p.substring(0, p.length() - 4).getBytes(StandardCharsets.US_ASCII);
                    lastSecond = sec;
                }
                put(prefix);
                int milli = (int) Math.floorMod(ms, 1000);
                digit(milli / 100).digit(milli / 10 % 10).digit(milli % 10).put((byte) 'Z');
            }
            put((byte) ',');
            if (s.line[i] >= 0) put(lines[s.line[i]]);
            put((byte) ',');
            if (s.beam[i] >= 0) integer(s.beam[i]);
            put((byte) ',');
            fixed8(s.lat[i]).put((byte) ',');
            fixed8(s.lon[i]).put((byte) ',');
            fixed3(s.easting[i]).put((byte) ',');
            fixed3(s.northing[i]).put((byte) ',');
            fixed3(s.depth[i]).put((byte) ',');
            fixed3(s.tvu[i]).put((byte) ',');
            fixed3(s.thu[i]).put((byte) ',');
            put(status[s.status[i] == 0 ? 0 : 1]).put((byte) ',');
            byte[] why = reason[s.reason[i] & 0xff];
            if (why == null) SoundingTable.Reason.of(s.reason[i]); // unknown code: refused as before
            put(why).put((byte) '\n');
        }

        Ascii(int capacity) { b = new byte[capacity]; }

        void ensure(int more) {
            if (n + more > b.length) b = Arrays.copyOf(b, Math.max(b.length * 2, n + more));
        }

        Ascii put(byte c) {
            b[n++] = c;
            return this;
        }

        Ascii put(byte[] t) {
            ensure(t.length);
            System.arraycopy(t, 0, b, n, t.length);
            n += t.length;
            return this;
        }

        Ascii digit(int d) {
            b[n++] = (byte) ('0' + d);
            return this;
        }

        Ascii integer(long v) {
            if (v < 0) { put((byte) '-'); v = -v; }
            if (v < 10) {
                b[n++] = (byte) ('0' + v);
                return this;
            }
            int len = 2;
            while (len < 19 && v >= POW10[len]) len++;
            digits(v, len);
            return this;
        }

        /** The last {@code len} decimal digits of v >= 0 (leading zeros included), two at a time. */
        private void digits(long v, int len) {
            int p = n + len;
            n = p;
            if (v <= Integer.MAX_VALUE) {   // int division by a constant is a multiplication; long may not be
                int w = (int) v;
                while (len >= 2) {
                    int q = w / 100, r = w - 100 * q;
                    w = q;
                    b[--p] = PAIRS[2 * r + 1];
                    b[--p] = PAIRS[2 * r];
                    len -= 2;
                }
                if (len == 1) b[--p] = (byte) ('0' + w % 10);
                return;
            }
            while (len >= 2) {
                int r = (int) (v % 100);
                v /= 100;
                b[--p] = PAIRS[2 * r + 1];
                b[--p] = PAIRS[2 * r];
                len -= 2;
            }
            if (len == 1) b[--p] = (byte) ('0' + v % 10);
        }

        /** Exactly {@link Fixed#append}: half away from zero, NaN empty, no "-0". */
        Ascii fixed(double v, int decimals) {
            if (Double.isNaN(v)) return this;
            if (Double.isInfinite(v) || Math.abs(v) >= 9e8) {
                return put(Fixed.append(new StringBuilder(), v, decimals).toString().getBytes(StandardCharsets.US_ASCII));
            }
            long scale = POW10[decimals];
            long q = Math.round(Math.abs(v) * scale);
            if (v < 0 && q != 0) put((byte) '-');
            integer(q / scale);
            if (decimals > 0) {
                put((byte) '.');
                digits(q % scale, decimals);
            }
            return this;
        }

        /**
         * {@link #fixed}(v, 3) with the divisors as constants (the JIT turns them into
         * multiplications; a divisor read from POW10 costs a hardware division): same bytes.
         */
        Ascii fixed3(double v) {
            if (Double.isNaN(v)) return this;
            if (Double.isInfinite(v) || Math.abs(v) >= 9e8) return fixed(v, 3);
            long q = Math.round(Math.abs(v) * 1000.0);
            if (v < 0 && q != 0) b[n++] = '-';
            long whole = q / 1000;
            int frac = (int) (q - whole * 1000);
            natural((int) whole);
            b[n++] = '.';
            b[n++] = (byte) ('0' + frac / 100);
            int r = frac % 100;
            b[n++] = PAIRS[2 * r];
            b[n++] = PAIRS[2 * r + 1];
            return this;
        }

        /** {@link #fixed}(v, 8) with constant divisors, as {@link #fixed3}: same bytes. */
        Ascii fixed8(double v) {
            if (Double.isNaN(v)) return this;
            if (Double.isInfinite(v) || Math.abs(v) >= 9e8) return fixed(v, 8);
            long q = Math.round(Math.abs(v) * 100_000_000.0);
            if (v < 0 && q != 0) b[n++] = '-';
            long whole = q / 100_000_000;
            int frac = (int) (q - whole * 100_000_000);
            natural((int) whole);
            b[n++] = '.';
            int p = n + 8;
            n = p;
            for (int k = 0; k < 4; k++) {
                int w = frac / 100, r = frac - 100 * w;
                frac = w;
                b[--p] = PAIRS[2 * r + 1];
                b[--p] = PAIRS[2 * r];
            }
            return this;
        }

        /** A whole number 0 <= w < 10^9, as {@link #integer}. */
        private void natural(int w) {
            if (w < 10) {
                b[n++] = (byte) ('0' + w);
                return;
            }
            int len = 2;
            while (len < 10 && w >= POW10[len]) len++;
            digits(w, len);
        }
    }
}
