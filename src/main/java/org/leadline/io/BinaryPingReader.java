package org.leadline.io;

import java.io.EOFException;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.zip.CRC32;
import org.leadline.survey.PingTable;

/**
 * Reads Leadline's binary ping format ({@code *.lpb}, docs/formats/binary-pings.md; written by
 * {@link BinaryPingWriter}), whole ({@link #read}) or a chunk at a time ({@link #chunks}, bounded
 * memory for days larger than the heap). Every block's CRC-32 is checked before its values are
 * used, so a damaged or truncated file is refused with the block that failed, never read as
 * plausible numbers. Each block's values are then checked by the same rules as
 * {@link PingCsvReader} (ranges, finite numbers, times not decreasing, a twtt or a depth on every
 * row). All checks run in file order, so both ways of reading report the same first problem.
 *
 * <p>Error positions: an {@link InputException}'s line is the 1-based <em>row</em> of the table
 * (0 for the header and for block-level damage, whose message names the block and its byte
 * offset); its column is the 1-based index of the column in the header.
 */
public final class BinaryPingReader {
    private BinaryPingReader() {}

    /** True when the file name ends in {@code .lpb} (any case). */
    public static boolean isBinary(Path file) {
        String n = file.getFileName().toString().toLowerCase(java.util.Locale.ROOT);
        return n.endsWith("." + BinaryPingWriter.EXTENSION);
    }

    /** Reads a file whose rows carry their own positions (lat, lon required). */
    public static PingTable read(Path file) { return read(file, false); }

    /**
     * Reads a binary ping file.
     *
     * @param separateNavigation true when a navigation file supplies the positions (lat, lon may be absent)
     */
    public static PingTable read(Path file, boolean separateNavigation) {
        try (FileChannel ch = FileChannel.open(file, StandardOpenOption.READ)) {
            return read(file, ch, separateNavigation);
        } catch (NoSuchFileException e) {
            throw new InputException(file, "file not found");
        } catch (IOException e) {
            throw unreadable(file, e);
        }
    }

    /** The reading error of an I/O failure: a truncated file, or the system's reason. */
    private static InputException unreadable(Path file, IOException e) {
        if (e instanceof EOFException) {
            return new InputException(file.toString(), 0, 0, "expected more bytes, found the end of the file (truncated): "
                    + e.getMessage(), e);
        }
        return new InputException(file.toString(), 0, 0, "cannot read: " + e.getMessage(), e);
    }

    private static PingTable read(Path file, FileChannel ch, boolean separateNavigation) throws IOException {
        Header h = Header.read(file, ch, separateNavigation);
        int n = (int) h.rows;
        double[][] d = new double[10][];
        int[][] in = new int[3][];
        for (int k = 0; k < 10; k++) if (h.hasDouble[k]) d[k] = new double[n];
        for (int j = 0; j < 3; j++) if (h.hasInt[j]) in[j] = new int[n];
        Blocks blocks = new Blocks(file, ch, h);
        RowChecker checker = new RowChecker(file, h, separateNavigation);
        int at = 0;
        for (int m; (m = blocks.next(at)) > 0; at += m) {
            blocks.copy(d, in, at);
            checker.check(d, in, at, m, at + 1L);
        }
        for (int k = 0; k < 10; k++) {
            if (d[k] == null) { d[k] = new double[n]; Arrays.fill(d[k], Double.NaN); }
        }
        for (int j = 0; j < 3; j++) {
            if (in[j] == null) { in[j] = new int[n]; Arrays.fill(in[j], -1); }
        }
        return PingTable.ofColumns(n, d[0], d[1], d[2], d[3], d[4], d[5], d[6], d[7], d[8], d[9], in[0], in[1], in[2], h.lineNames);
    }

    /** The header, read and checked (magic, version, CRC-32, required columns). */
    private static final class Header {
        long rows;
        int nCols, nLines, blockRows, rowBytes;
        String[] names;
        int[] types;
        int[] where; // per column: index into the double columns (0..9), 100 + index into the int columns, -1 unknown (skipped)
        final boolean[] hasDouble = new boolean[10], hasInt = new boolean[3];
        List<String> lineNames;

        static Header read(Path file, FileChannel ch, boolean separateNavigation) throws IOException {
            Header h = new Header();
            CRC32 crc = new CRC32();
            ByteBuffer fixed = readFully(ch, 16, "the header");
            byte[] magic = new byte[4];
            fixed.get(magic);
            if (!Arrays.equals(magic, BinaryPingWriter.MAGIC)) {
                throw new InputException(file.toString(), 0, 0, "expected the binary ping magic 'LLPB', found "
                        + printable(magic) + " (not a Leadline binary ping file)", null);
            }
            int version = fixed.getShort() & 0xffff;
            if (version != BinaryPingWriter.VERSION) {
                throw new InputException(file.toString(), 0, 0, "expected format version 1, found " + version, null);
            }
            long rows = fixed.getLong();
            int nCols = fixed.getShort() & 0xffff;
            if (rows < 0 || rows > Integer.MAX_VALUE - 8) {
                throw new InputException(file.toString(), 0, 0, "expected a row count in [0, 2^31), found " + rows, null);
            }
            crc.update(fixed.array(), 0, 16);
            String[] names = new String[nCols];
            int[] types = new int[nCols];
            for (int c = 0; c < nCols; c++) {
                ByteBuffer tl = readFully(ch, 2, "the column list");
                crc.update(tl.array(), 0, 2);
                types[c] = tl.get() & 0xff;
                int len = tl.get() & 0xff;
                ByteBuffer nb = readFully(ch, len, "a column name");
                crc.update(nb.array(), 0, len);
                names[c] = new String(nb.array(), 0, len, StandardCharsets.US_ASCII).toLowerCase(java.util.Locale.ROOT);
                if (types[c] != BinaryPingWriter.TYPE_F64 && types[c] != BinaryPingWriter.TYPE_I32) {
                    throw new InputException(file, 0, c + 1, "expected column type 1 (float64) or 2 (int32) for '"
                            + names[c] + "', found " + types[c]);
                }
            }
            ByteBuffer kb = readFully(ch, 4, "the line-name count");
            crc.update(kb.array(), 0, 4);
            int nLines = kb.getInt();
            if (nLines < 0) throw new InputException(file.toString(), 0, 0, "expected a line-name count >= 0, found " + nLines, null);
            List<String> lineNames = new ArrayList<>();
            for (int l = 0; l < nLines; l++) {
                ByteBuffer lb = readFully(ch, 2, "a line name");
                crc.update(lb.array(), 0, 2);
                int len = lb.getShort() & 0xffff;
                ByteBuffer s = readFully(ch, len, "a line name");
                crc.update(s.array(), 0, len);
                lineNames.add(new String(s.array(), 0, len, StandardCharsets.UTF_8));
            }
            ByteBuffer tail = readFully(ch, 8, "the header's end");
            crc.update(tail.array(), 0, 4);
            int blockRows = tail.getInt();
            int stored = tail.getInt();
            if (stored != (int) crc.getValue()) {
                throw new InputException(file.toString(), 0, 0, "header CRC-32 mismatch: expected "
                        + hex(stored) + ", computed " + hex((int) crc.getValue()) + " (damaged file)", null);
            }
            if (blockRows < 1) throw new InputException(file.toString(), 0, 0, "expected a block size >= 1, found " + blockRows, null);

            int[] where = new int[nCols];
            int rowBytes = 0;
            for (int c = 0; c < nCols; c++) {
                where[c] = -1;
                rowBytes += types[c] == BinaryPingWriter.TYPE_F64 ? 8 : 4;
                int k = indexOf(BinaryPingWriter.DOUBLE_NAMES, names[c]);
                int j = indexOf(BinaryPingWriter.INT_NAMES, names[c]);
                if (k >= 0) {
                    if (types[c] != BinaryPingWriter.TYPE_F64) throw new InputException(file, 0, c + 1, "expected float64 for '" + names[c] + "', found int32");
                    if (h.hasDouble[k]) throw new InputException(file, 0, c + 1, "column '" + names[c] + "' appears twice in the header");
                    h.hasDouble[k] = true;
                    where[c] = k;
                } else if (j >= 0) {
                    if (types[c] != BinaryPingWriter.TYPE_I32) throw new InputException(file, 0, c + 1, "expected int32 for '" + names[c] + "', found float64");
                    if (h.hasInt[j]) throw new InputException(file, 0, c + 1, "column '" + names[c] + "' appears twice in the header");
                    h.hasInt[j] = true;
                    where[c] = 100 + j;
                }
            }
            String header = String.join(",", names);
            if (!h.hasDouble[0]) throw new InputException(file, 0, 0, "expected a column 'time' in the header, found: " + header);
            if (!separateNavigation && !h.hasDouble[1]) throw new InputException(file, 0, 0, "expected a column 'lat' in the header, found: " + header);
            if (!separateNavigation && !h.hasDouble[2]) throw new InputException(file, 0, 0, "expected a column 'lon' in the header, found: " + header);
            if (!h.hasDouble[3] && !h.hasDouble[4]) throw new InputException(file, 0, 0, "expected a column 'twtt' or 'depth' in the header, found: " + header);
            h.rows = rows;
            h.nCols = nCols;
            h.nLines = nLines;
            h.blockRows = blockRows;
            h.rowBytes = rowBytes;
            h.names = names;
            h.types = types;
            h.where = where;
            h.lineNames = List.copyOf(lineNames);
            return h;
        }
    }

    /**
     * The blocks after the header, one at a time: each block's row count and CRC-32 are checked
     * before its values are copied out; the end record and the total row count at the end.
     */
    private static final class Blocks {
        private final Path file;
        private final FileChannel ch;
        private final Header h;
        private final CRC32 crc = new CRC32();
        private ByteBuffer block = ByteBuffer.allocate(0);
        private int blockNo, m;

        Blocks(Path file, FileChannel ch, Header h) {
            this.file = file;
            this.ch = ch;
            this.h = h;
        }

        /** Reads the next block after {@code at} rows; its row count, or 0 after the end record (checked). */
        int next(int at) throws IOException {
            long n = h.rows;
            long offset = ch.position();
            ByteBuffer cb = readFully(ch, 4, "a block");
            m = cb.getInt();
            if (m == 0) {
                ByteBuffer end = readFully(ch, 12, "the end record");
                long total = end.getLong();
                crc.reset();
                crc.update(cb.array(), 0, 4);
                crc.update(end.array(), 0, 8);
                if (end.getInt() != (int) crc.getValue() || total != n) {
                    throw new InputException(file.toString(), 0, 0, "end record damaged or row count " + total
                            + " != header's " + n, null);
                }
                if (at != n) throw new InputException(file.toString(), 0, 0, "expected " + n + " rows, found " + at + " (truncated file)", null);
                return 0;
            }
            if (m < 0 || m > h.blockRows || at + (long) m > n) {
                throw new InputException(file.toString(), 0, 0, "block " + blockNo + " at byte " + offset
                        + ": expected 1.." + Math.min(h.blockRows, n - at) + " rows, found " + m + " (damaged file)", null);
            }
            int bytes = m * h.rowBytes;
            if (block.capacity() < bytes + 4) block = ByteBuffer.allocate(bytes + 4).order(ByteOrder.LITTLE_ENDIAN);
            block.clear().limit(bytes + 4);
            readFully(ch, block, "block " + blockNo);
            crc.reset();
            crc.update(cb.array(), 0, 4);
            crc.update(block.array(), 0, bytes);
            int storedBlock = block.getInt(bytes);
            if (storedBlock != (int) crc.getValue()) {
                throw new InputException(file.toString(), 0, 0, "block " + blockNo + " at byte " + offset + " (rows "
                        + (at + 1) + ".." + (at + m) + "): CRC-32 mismatch, expected " + hex(storedBlock) + ", computed "
                        + hex((int) crc.getValue()) + " (damaged file)", null);
            }
            blockNo++;
            return m;
        }

        /** Copies the block's known columns into the arrays (null: column absent) from index {@code to}. */
        void copy(double[][] d, int[][] in, int to) {
            int pos = 0;
            for (int c = 0; c < h.nCols; c++) {
                int w = h.where[c];
                if (w >= 100) {
                    block.position(pos);
                    block.asIntBuffer().get(in[w - 100], to, m);
                } else if (w >= 0) {
                    block.position(pos);
                    block.asDoubleBuffer().get(d[w], to, m);
                }
                pos += (h.types[c] == BinaryPingWriter.TYPE_F64 ? 8 : 4) * m;
            }
        }
    }

    /**
     * The CSV reader's rules, row by row in file order (DESIGN.md section 4, docs/formats/pings.md);
     * keeps the previous time so that the rule "times do not decrease" spans blocks and chunks.
     */
    private static final class RowChecker {
        private final Path file;
        private final String[] names;
        private final int nLines;
        private final boolean sepNav;
        private double previous = Double.NEGATIVE_INFINITY;

        RowChecker(Path file, Header h, boolean sepNav) {
            this.file = file;
            this.names = h.names;
            this.nLines = h.nLines;
            this.sepNav = sepNav;
        }

        /** Checks rows [from, from + m) of the columns (null: absent, i.e. NaN / -1); {@code firstRow}: 1-based row of {@code from} in the file. */
        void check(double[][] d, int[][] in, int from, int m, long firstRow) {
            double[] t = d[0], lat = d[1], lon = d[2], tw = d[3], dp = d[4];
            for (int i = from; i < from + m; i++) {
                long row = firstRow + (i - from);
                if (!Double.isFinite(t[i])) throw err(file, row, names, "time", "expected a finite time, found " + t[i]);
                if (t[i] < previous) throw err(file, row, names, "time", "expected times not to decrease, found "
                        + IsoTime.format(t[i]) + " after " + IsoTime.format(previous));
                previous = t[i];
                double la = lat == null ? Double.NaN : lat[i], lo = lon == null ? Double.NaN : lon[i];
                double twi = tw == null ? Double.NaN : tw[i], dpi = dp == null ? Double.NaN : dp[i];
                if (!(sepNav && Double.isNaN(la)) && !(la >= -90 && la <= 90)) {
                    throw err(file, row, names, "lat", "expected a latitude in [-90, 90] degrees, found " + la);
                }
                if (!(sepNav && Double.isNaN(lo)) && !(lo >= -180 && lo <= 180)) {
                    throw err(file, row, names, "lon", "expected a longitude in [-180, 180] degrees, found " + lo);
                }
                if (!(Double.isNaN(twi) || twi >= 0 && twi < Double.POSITIVE_INFINITY)) {
                    throw err(file, row, names, "twtt", "expected 'twtt' >= 0 and finite, found " + twi);
                }
                if (!(Double.isNaN(dpi) || dpi >= 0 && dpi < Double.POSITIVE_INFINITY)) {
                    throw err(file, row, names, "depth", "expected 'depth' >= 0 and finite, found " + dpi);
                }
                if (Double.isNaN(twi) && Double.isNaN(dpi)) {
                    throw err(file, row, names, "twtt", "expected a value for 'twtt' or 'depth', found neither");
                }
                if (d[5] != null) bounded(file, row, names, "angle", d[5][i], 90);
                if (d[6] != null) bounded(file, row, names, "heading", d[6][i], 360);
                if (d[7] != null) bounded(file, row, names, "heave", d[7][i], Double.MAX_VALUE);
                if (d[8] != null) bounded(file, row, names, "roll", d[8][i], 90);
                if (d[9] != null) bounded(file, row, names, "pitch", d[9][i], 90);
                if (in[0] != null) {
                    int l = in[0][i];
                    if (l < -1 || l >= nLines) throw err(file, row, names, "line", "expected a line index in [-1, " + nLines + "), found " + l);
                }
            }
        }
    }

    private static void bounded(Path file, long row, String[] names, String name, double v, double limit) {
        if (!Double.isNaN(v) && !(Math.abs(v) <= limit)) {
            throw err(file, row, names, name, "expected '" + name + "' finite and within +-" + (limit == Double.MAX_VALUE ? "inf" : (int) limit)
                    + ", found " + v);
        }
    }

    private static InputException err(Path file, long row, String[] names, String col, String problem) {
        return new InputException(file, row, indexOf(names, col) + 1, "row " + row + ": " + problem);
    }

    private static int indexOf(String[] a, String s) {
        for (int i = 0; i < a.length; i++) if (a[i].equals(s)) return i;
        return -1;
    }

    private static ByteBuffer readFully(FileChannel ch, int bytes, String what) throws IOException {
        ByteBuffer b = ByteBuffer.allocate(bytes).order(ByteOrder.LITTLE_ENDIAN);
        readFully(ch, b, what);
        return b;
    }

    private static void readFully(FileChannel ch, ByteBuffer b, String what) throws IOException {
        while (b.hasRemaining()) {
            if (ch.read(b) < 0) throw new EOFException(what + " ends at byte " + ch.position());
        }
        b.flip();
    }

    private static String hex(int v) { return String.format("%08x", v); }

    private static String printable(byte[] b) {
        StringBuilder sb = new StringBuilder("'");
        for (byte x : b) sb.append(x >= 32 && x < 127 ? (char) x : '?');
        return sb.append('\'').toString();
    }

    /**
     * Opens the file for reading a chunk at a time ({@link PingChunks}): the rows, values, line ids
     * (the header's line names) and errors of {@link #read}, with memory bounded by about
     * {@code targetRows} plus one block (64 Ki rows) plus the longest ping, whatever the file's size.
     * Chunks end at ping boundaries (a ping may straddle a block boundary: it is completed from the
     * next block). The header is read and checked here; blocks, their CRC-32s, the rows' values and
     * the end record as {@link PingChunks#next()} reaches them, in file order, as {@link #read} does.
     *
     * @param targetRows rows per chunk, about (at least 1)
     */
    public static PingChunks chunks(Path file, boolean separateNavigation, int targetRows) {
        FileChannel ch;
        try {
            ch = FileChannel.open(file, StandardOpenOption.READ);
        } catch (NoSuchFileException e) {
            throw new InputException(file, "file not found");
        } catch (IOException e) {
            throw unreadable(file, e);
        }
        try {
            return new Streamed(file, ch, Header.read(file, ch, separateNavigation), separateNavigation, targetRows);
        } catch (IOException | RuntimeException e) {
            try {
                ch.close();
            } catch (IOException suppressed) {
                e.addSuppressed(suppressed);
            }
            if (e instanceof IOException io) throw unreadable(file, io);
            throw (RuntimeException) e;
        }
    }

    /**
     * The streaming reader: blocks are read into a pending buffer (only the file's columns) until it
     * holds more than the target, then the rows up to the first ping boundary at or after the
     * target are handed out and the rest moved to the front.
     */
    private static final class Streamed implements PingChunks {
        private final Path file;
        private final FileChannel ch;
        private final Header h;
        private final Blocks blocks;
        private final RowChecker checker;
        private final int target;
        private final double[][] d = new double[10][];
        private final int[][] in = new int[3][];
        private int pending; // rows in the buffer
        private int read;    // rows read from the file so far
        private boolean end;

        Streamed(Path file, FileChannel ch, Header h, boolean separateNavigation, int targetRows) {
            this.file = file;
            this.ch = ch;
            this.h = h;
            this.blocks = new Blocks(file, ch, h);
            this.checker = new RowChecker(file, h, separateNavigation);
            this.target = Math.max(1, targetRows);
            int cap = (int) Math.min(h.rows, (long) target + Math.min(h.blockRows, BinaryPingWriter.BLOCK_ROWS));
            for (int k = 0; k < 10; k++) if (h.hasDouble[k]) d[k] = new double[cap];
            for (int j = 0; j < 3; j++) if (h.hasInt[j]) in[j] = new int[cap];
        }

        @Override
        public PingTable next() {
            try {
                while (!end && pending <= target) readBlock();
                if (pending == 0) return null;
                int cut = Math.min(pending, target);
                while (true) {
                    while (cut < pending && samePing(cut)) cut++;
                    if (cut < pending || end) break;
                    readBlock(); // the ping at the cut goes on in the next block
                }
                return take(cut);
            } catch (IOException e) {
                throw unreadable(file, e);
            }
        }

        /** True when row i (i >= 1) belongs to the ping of row i - 1: same time, same line. */
        private boolean samePing(int i) {
            return d[0][i] == d[0][i - 1] && (in[0] == null || in[0][i] == in[0][i - 1]);
        }

        private void readBlock() throws IOException {
            int m = blocks.next(read);
            if (m == 0) {
                end = true;
                return;
            }
            ensure(pending + m);
            blocks.copy(d, in, pending);
            checker.check(d, in, pending, m, read + 1L);
            pending += m;
            read += m;
        }

        private void ensure(int rows) {
            int cap = d[0].length;
            if (rows <= cap) return;
            int grown = (int) Math.min(Integer.MAX_VALUE - 8, Math.max(rows, 2L * cap));
            for (int k = 0; k < 10; k++) if (d[k] != null) d[k] = Arrays.copyOf(d[k], grown);
            for (int j = 0; j < 3; j++) if (in[j] != null) in[j] = Arrays.copyOf(in[j], grown);
        }

        /** Hands out rows [0, cut) as a table and moves the rest of the buffer to its front. */
        private PingTable take(int cut) {
            double[][] c = new double[10][];
            int[][] ci = new int[3][];
            for (int k = 0; k < 10; k++) {
                if (d[k] == null) {
                    c[k] = new double[cut];
                    Arrays.fill(c[k], Double.NaN);
                } else {
                    c[k] = Arrays.copyOf(d[k], cut);
                    System.arraycopy(d[k], cut, d[k], 0, pending - cut);
                }
            }
            for (int j = 0; j < 3; j++) {
                if (in[j] == null) {
                    ci[j] = new int[cut];
                    Arrays.fill(ci[j], -1);
                } else {
                    ci[j] = Arrays.copyOf(in[j], cut);
                    System.arraycopy(in[j], cut, in[j], 0, pending - cut);
                }
            }
            pending -= cut;
            return PingTable.ofColumns(cut, c[0], c[1], c[2], c[3], c[4], c[5], c[6], c[7], c[8], c[9], ci[0], ci[1], ci[2],
                    h.lineNames);
        }

        @Override
        public long expectedRows() { return h.rows; }

        @Override
        public void close() throws IOException { ch.close(); }
    }
}
