package org.leadline.io;

import java.io.BufferedOutputStream;
import java.io.Closeable;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collection;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import java.util.zip.CRC32;
import org.leadline.survey.PingTable;

/**
 * Writes a ping table in Leadline's binary ping format ({@code *.lpb}, docs/formats/binary-pings.md):
 * a header (magic {@code LLPB}, version, row count, column names and types, line names, block
 * size, CRC-32), then blocks of up to {@link #BLOCK_ROWS} rows stored column after column in
 * little-endian IEEE 754 doubles and 32-bit integers, each block closed by the CRC-32 (ISO 3309 /
 * ITU-T V.42 polynomial, {@link CRC32}) of its bytes, and an end record.
 *
 * <p>Only columns that hold at least one value are written ({@code time} always); a reader fills
 * the others with NaN / -1 as the CSV reader does for absent columns.
 *
 * <p>Two ways to write: {@link #write(PingTable, OutputStream)} for a table in memory, or
 * {@link #open} and {@link Stream#append} chunk by chunk for a day too large to hold (memory: one
 * block, about 5 MB, whatever the day's size). The header needs the row count, the line names and
 * the columns up front; given the same rows, both ways write the same bytes, however the rows
 * are split into chunks.
 * <pre>
 * try (BinaryPingWriter.Stream s = BinaryPingWriter.open(os, rows, lineNames, List.of("time", "lat", "lon", "twtt", "line", "beam"))) {
 *     for (PingTable chunk : chunks) s.append(chunk);
 * } // close() writes the end record and refuses a row count other than the header's
 * </pre>
 */
public final class BinaryPingWriter {
    /** File extension (without the dot). */
    public static final String EXTENSION = "lpb";
    static final byte[] MAGIC = {'L', 'L', 'P', 'B'};
    static final int VERSION = 1;
    static final int TYPE_F64 = 1, TYPE_I32 = 2;
    /** Rows per block: 64 Ki rows, about 5 MB of a full-width table; a damaged block loses only these rows. */
    public static final int BLOCK_ROWS = 1 << 16;
    static final String[] DOUBLE_NAMES = {"time", "lat", "lon", "twtt", "depth", "angle", "heading", "heave", "roll", "pitch"};
    static final String[] INT_NAMES = {"line", "beam", "quality"};

    private BinaryPingWriter() {}

    /** Writes the table to a file (the caller decides about atomic placement). */
    public static void write(PingTable t, Path file) throws IOException {
        try (OutputStream os = Files.newOutputStream(file)) {
            write(t, os);
        }
    }

    /** Writes the table to a stream (not closed). */
    public static void write(PingTable t, OutputStream os) throws IOException {
        try (Stream s = open(os, t.size, t.lineNames(), presentColumns(t))) {
            s.append(t);
        }
    }

    /**
     * The columns {@link #write(PingTable, OutputStream)} stores for this table: {@code time} and
     * every other column with at least one value (not NaN, not -1), in the file's order.
     */
    public static List<String> presentColumns(PingTable t) {
        double[][] d = doubles(t);
        int[][] in = ints(t);
        List<String> names = new ArrayList<>();
        for (int k = 0; k < d.length; k++) if (k == 0 || anyValue(d[k], 0, t.size)) names.add(DOUBLE_NAMES[k]);
        for (int k = 0; k < in.length; k++) if (anyValue(in[k], 0, t.size)) names.add(INT_NAMES[k]);
        return names;
    }

    /**
     * Starts a binary ping file of {@code rows} rows on {@code os} (not closed by {@link Stream#close}),
     * written chunk by chunk with {@link Stream#append}.
     *
     * @param rows      rows the file will hold (written in the header; {@link Stream#close} refuses another count)
     * @param lineNames the survey line names; the file's line column indexes this list
     * @param columns   the columns to store, by the ping CSV's names ({@code time lat lon twtt depth angle
     *                  heading heave roll pitch line beam quality}, any case, any order; the file lists them in
     *                  that canonical order); {@code time} is always stored. Appending a value in a column not
     *                  stored is refused. {@link #presentColumns} gives the columns {@code write} would store.
     */
    public static Stream open(OutputStream os, long rows, List<String> lineNames, Collection<String> columns) throws IOException {
        return new Stream(os, rows, lineNames, columns, BLOCK_ROWS, false);
    }

    /** As {@link #open(OutputStream, long, List, Collection)} on a new file, which {@link Stream#close} closes. */
    public static Stream open(Path file, long rows, List<String> lineNames, Collection<String> columns) throws IOException {
        OutputStream os = Files.newOutputStream(file);
        try {
            return new Stream(os, rows, lineNames, columns, BLOCK_ROWS, true);
        } catch (IOException | RuntimeException e) {
            os.close();
            throw e;
        }
    }

    /** With another block size: for tests that need many blocks from few rows. */
    static Stream open(OutputStream os, long rows, List<String> lineNames, Collection<String> columns, int blockRows) throws IOException {
        return new Stream(os, rows, lineNames, columns, blockRows, false);
    }

    /**
     * A binary ping file being written chunk by chunk. Rows are gathered into blocks of the
     * header's block size, so the bytes do not depend on how the rows were split into chunks.
     * Not thread-safe.
     */
    public static final class Stream implements Closeable {
        private final OutputStream out;
        private final boolean closeOut;
        private final long rows;
        private final int blockRows;
        private final List<String> lineNames;
        private final Map<String, Integer> lineIds = new HashMap<>();
        private final int[] doubleCols; // stored column -> index in DOUBLE_NAMES, or -1
        private final int[] intCols;    // stored column -> index in INT_NAMES, or -1
        private final boolean[] storedD = new boolean[DOUBLE_NAMES.length], storedI = new boolean[INT_NAMES.length];
        private final Object[] staging; // one block of rows per stored column, filled up to 'pending'
        private final ByteBuffer block;
        private final CRC32 crc = new CRC32();
        private int pending;
        private long written;
        private boolean closed;

        private Stream(OutputStream os, long rows, List<String> lineNames, Collection<String> columns, int blockRows,
                       boolean closeOut) throws IOException {
            if (rows < 0 || rows > Integer.MAX_VALUE - 8) throw new IllegalArgumentException("row count " + rows + " outside [0, 2^31)");
            if (blockRows < 1) throw new IllegalArgumentException("block size " + blockRows + " < 1");
            this.out = new BufferedOutputStream(os, 1 << 16);
            this.closeOut = closeOut;
            this.rows = rows;
            this.blockRows = blockRows;
            this.lineNames = List.copyOf(lineNames);
            for (int l = 0; l < this.lineNames.size(); l++) lineIds.putIfAbsent(this.lineNames.get(l), l);
            Set<String> asked = new HashSet<>();
            asked.add("time");
            for (String c : columns) {
                String n = c.toLowerCase(Locale.ROOT);
                if (indexOf(DOUBLE_NAMES, n) < 0 && indexOf(INT_NAMES, n) < 0) {
                    throw new IllegalArgumentException("unknown ping column '" + c + "'");
                }
                asked.add(n);
            }
            List<String> names = new ArrayList<>(); // the file's order: the float64 columns, then the int32 ones
            for (String n : DOUBLE_NAMES) if (asked.contains(n)) names.add(n);
            for (String n : INT_NAMES) if (asked.contains(n)) names.add(n);
            int nCols = names.size();
            doubleCols = new int[nCols];
            intCols = new int[nCols];
            staging = new Object[nCols];
            int rowBytes = 0, c = 0;
            for (String n : names) {
                doubleCols[c] = indexOf(DOUBLE_NAMES, n);
                intCols[c] = indexOf(INT_NAMES, n);
                if (doubleCols[c] >= 0) {
                    storedD[doubleCols[c]] = true;
                    rowBytes += 8;
                } else {
                    storedI[intCols[c]] = true;
                    rowBytes += 4;
                }
                c++;
            }
            int blockCap = (int) Math.min(blockRows, Math.max(rows, 1)); // a small file needs no full-size block
            for (c = 0; c < nCols; c++) staging[c] = doubleCols[c] >= 0 ? new double[blockCap] : new int[blockCap];
            block = ByteBuffer.allocate((int) Math.min(4L + (long) blockCap * rowBytes + 4, Integer.MAX_VALUE - 16))
                    .order(ByteOrder.LITTLE_ENDIAN);
            writeHeader(names);
        }

        private void writeHeader(List<String> names) throws IOException {
            ByteBuffer h = ByteBuffer.allocate(1 << 16).order(ByteOrder.LITTLE_ENDIAN);
            h.put(MAGIC).putShort((short) VERSION).putLong(rows).putShort((short) names.size());
            for (int c = 0; c < names.size(); c++) {
                h.put((byte) (doubleCols[c] >= 0 ? TYPE_F64 : TYPE_I32));
                byte[] nb = names.get(c).getBytes(StandardCharsets.US_ASCII);
                h.put((byte) nb.length).put(nb);
            }
            h.putInt(lineNames.size());
            for (String l : lineNames) {
                byte[] lb = l.getBytes(StandardCharsets.UTF_8);
                if (lb.length > 65535) throw new IllegalArgumentException("line name longer than 65535 bytes");
                h = ensure(h, lb.length + 2 + 8);
                h.putShort((short) lb.length).put(lb);
            }
            h.putInt(blockRows);
            crc.reset();
            crc.update(h.array(), 0, h.position());
            h.putInt((int) crc.getValue());
            out.write(h.array(), 0, h.position());
        }

        /**
         * Appends the chunk's rows. Its line ids are translated by name to the names given to
         * {@code open} (a name not among them is refused); a value in a column that is not stored is refused.
         */
        public void append(PingTable chunk) throws IOException {
            if (closed) throw new IllegalStateException("stream already closed");
            if (written + pending + (long) chunk.size > rows) {
                throw new IllegalStateException("appending " + chunk.size + " rows to " + (written + pending)
                        + " would exceed the header's " + rows + " rows");
            }
            double[][] d = doubles(chunk);
            int[][] in = ints(chunk);
            for (int k = 0; k < d.length; k++) {
                if (!storedD[k] && anyValue(d[k], 0, chunk.size)) throw new IllegalArgumentException("column '" + DOUBLE_NAMES[k] + "' has values but is not stored");
            }
            for (int k = 0; k < in.length; k++) {
                if (!storedI[k] && anyValue(in[k], 0, chunk.size)) throw new IllegalArgumentException("column '" + INT_NAMES[k] + "' has values but is not stored");
            }
            int[] lineMap = lineMap(chunk.lineNames());
            int from = 0;
            while (from < chunk.size) {
                if (pending == 0 && chunk.size - from >= blockRows && lineMap == null) {
                    // a whole block straight from the chunk's columns
                    Object[] src = new Object[staging.length];
                    for (int c = 0; c < src.length; c++) src[c] = doubleCols[c] >= 0 ? d[doubleCols[c]] : in[intCols[c]];
                    writeBlock(src, from, blockRows);
                    from += blockRows;
                    continue;
                }
                int m = Math.min(blockRows - pending, chunk.size - from);
                for (int c = 0; c < staging.length; c++) {
                    if (doubleCols[c] >= 0) {
                        System.arraycopy(d[doubleCols[c]], from, staging[c], pending, m);
                    } else if (intCols[c] == 0 && lineMap != null) {
                        int[] dst = (int[]) staging[c], src = in[0];
                        for (int i = 0; i < m; i++) dst[pending + i] = src[from + i] < 0 ? -1 : lineMap[src[from + i]];
                    } else {
                        System.arraycopy(in[intCols[c]], from, staging[c], pending, m);
                    }
                }
                pending += m;
                from += m;
                if (pending == blockRows) flushBlock();
            }
        }

        /** Null when the chunk's line ids are already the file's; else chunk id -> file id. */
        private int[] lineMap(List<String> names) {
            if (names.equals(lineNames)) return null;
            int[] map = new int[names.size()];
            for (int l = 0; l < map.length; l++) {
                Integer id = lineIds.get(names.get(l));
                if (id == null) throw new IllegalArgumentException("line '" + names.get(l) + "' is not among the file's line names");
                map[l] = id;
            }
            return map;
        }

        private void flushBlock() throws IOException {
            if (pending == 0) return;
            writeBlock(staging, 0, pending);
            pending = 0;
        }

        private void writeBlock(Object[] cols, int from, int m) throws IOException {
            ByteBuffer b = block;
            b.clear();
            b.putInt(m);
            for (Object c : cols) {
                if (c instanceof double[] a) {
                    b.asDoubleBuffer().put(a, from, m);
                    b.position(b.position() + 8 * m);
                } else {
                    b.asIntBuffer().put((int[]) c, from, m);
                    b.position(b.position() + 4 * m);
                }
            }
            crc.reset();
            crc.update(b.array(), 0, b.position());
            b.putInt((int) crc.getValue());
            out.write(b.array(), 0, b.position());
            written += m;
        }

        /** Rows appended so far. */
        public long rows() { return written + pending; }

        /**
         * Writes the last block and the end record and flushes. Refuses (IllegalStateException,
         * no end record written) when the rows appended differ from the header's count, so such
         * a file is never read as complete.
         */
        @Override
        public void close() throws IOException {
            if (closed) return;
            closed = true;
            try {
                if (written + pending != rows) {
                    throw new IllegalStateException("appended " + (written + pending) + " rows, the header says " + rows
                            + " (no end record written)");
                }
                flushBlock();
                ByteBuffer b = ByteBuffer.allocate(16).order(ByteOrder.LITTLE_ENDIAN);
                b.putInt(0).putLong(rows);
                crc.reset();
                crc.update(b.array(), 0, b.position());
                b.putInt((int) crc.getValue());
                out.write(b.array(), 0, b.position());
                out.flush();
            } finally {
                if (closeOut) out.close();
            }
        }
    }

    private static double[][] doubles(PingTable t) {
        return new double[][]{t.time, t.lat, t.lon, t.twtt, t.depth, t.angle, t.heading, t.heave, t.roll, t.pitch};
    }

    private static int[][] ints(PingTable t) { return new int[][]{t.line, t.beam, t.quality}; }

    private static int indexOf(String[] a, String s) {
        for (int i = 0; i < a.length; i++) if (a[i].equals(s)) return i;
        return -1;
    }

    private static ByteBuffer ensure(ByteBuffer h, int more) {
        if (h.remaining() >= more) return h;
        ByteBuffer g = ByteBuffer.allocate(Math.max(h.capacity() * 2, h.position() + more)).order(ByteOrder.LITTLE_ENDIAN);
        h.flip();
        return g.put(h);
    }

    private static boolean anyValue(double[] a, int from, int to) {
        for (int i = from; i < to; i++) if (!Double.isNaN(a[i])) return true;
        return false;
    }

    private static boolean anyValue(int[] a, int from, int to) {
        for (int i = from; i < to; i++) if (a[i] != -1) return true;
        return false;
    }
}
