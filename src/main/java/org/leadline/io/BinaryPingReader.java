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
 * {@link BinaryPingWriter}). Every block's CRC-32 is checked before its values are used, so a
 * damaged or truncated file is refused with the block that failed, never read as plausible numbers.
 * The values are then checked by the same rules as {@link PingCsvReader} (ranges, finite numbers,
 * times not decreasing, a twtt or a depth on every row).
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
        } catch (EOFException e) {
            throw new InputException(file.toString(), 0, 0, "expected more bytes, found the end of the file (truncated): "
                    + e.getMessage(), e);
        } catch (IOException e) {
            throw new InputException(file.toString(), 0, 0, "cannot read: " + e.getMessage(), e);
        }
    }

    private static PingTable read(Path file, FileChannel ch, boolean separateNavigation) throws IOException {
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

        int n = (int) rows;
        double[][] d = new double[10][];
        int[][] in = new int[3][];
        int[] where = new int[nCols]; // index into d (0..9) or 100 + index into in; -1 unknown (skipped)
        int rowBytes = 0;
        for (int c = 0; c < nCols; c++) {
            where[c] = -1;
            rowBytes += types[c] == BinaryPingWriter.TYPE_F64 ? 8 : 4;
            int k = indexOf(BinaryPingWriter.DOUBLE_NAMES, names[c]);
            int j = indexOf(BinaryPingWriter.INT_NAMES, names[c]);
            if (k >= 0) {
                if (types[c] != BinaryPingWriter.TYPE_F64) throw new InputException(file, 0, c + 1, "expected float64 for '" + names[c] + "', found int32");
                if (d[k] != null) throw new InputException(file, 0, c + 1, "column '" + names[c] + "' appears twice in the header");
                d[k] = new double[n];
                where[c] = k;
            } else if (j >= 0) {
                if (types[c] != BinaryPingWriter.TYPE_I32) throw new InputException(file, 0, c + 1, "expected int32 for '" + names[c] + "', found float64");
                if (in[j] != null) throw new InputException(file, 0, c + 1, "column '" + names[c] + "' appears twice in the header");
                in[j] = new int[n];
                where[c] = 100 + j;
            }
        }
        String header = String.join(",", names);
        if (d[0] == null) throw new InputException(file, 0, 0, "expected a column 'time' in the header, found: " + header);
        if (!separateNavigation && d[1] == null) throw new InputException(file, 0, 0, "expected a column 'lat' in the header, found: " + header);
        if (!separateNavigation && d[2] == null) throw new InputException(file, 0, 0, "expected a column 'lon' in the header, found: " + header);
        if (d[3] == null && d[4] == null) throw new InputException(file, 0, 0, "expected a column 'twtt' or 'depth' in the header, found: " + header);

        ByteBuffer block = ByteBuffer.allocate((int) Math.min((long) blockRows * rowBytes + 8, Integer.MAX_VALUE - 16))
                .order(ByteOrder.LITTLE_ENDIAN);
        int at = 0, blockNo = 0;
        while (true) {
            long offset = ch.position();
            ByteBuffer cb = readFully(ch, 4, "a block");
            int m = cb.getInt();
            if (m == 0) {
                ByteBuffer end = readFully(ch, 12, "the end record");
                long total = end.getLong();
                crc.reset();
                crc.update(cb.array(), 0, 4);
                crc.update(end.array(), 0, 8);
                if (end.getInt() != (int) crc.getValue() || total != rows) {
                    throw new InputException(file.toString(), 0, 0, "end record damaged or row count " + total
                            + " != header's " + rows, null);
                }
                break;
            }
            if (m < 0 || m > blockRows || at + (long) m > n) {
                throw new InputException(file.toString(), 0, 0, "block " + blockNo + " at byte " + offset
                        + ": expected 1.." + Math.min(blockRows, n - at) + " rows, found " + m + " (damaged file)", null);
            }
            block.clear().limit(m * rowBytes + 4);
            readFully(ch, block, "block " + blockNo);
            crc.reset();
            crc.update(cb.array(), 0, 4);
            crc.update(block.array(), 0, m * rowBytes);
            int storedBlock = block.getInt(m * rowBytes);
            if (storedBlock != (int) crc.getValue()) {
                throw new InputException(file.toString(), 0, 0, "block " + blockNo + " at byte " + offset + " (rows "
                        + (at + 1) + ".." + (at + m) + "): CRC-32 mismatch, expected " + hex(storedBlock) + ", computed "
                        + hex((int) crc.getValue()) + " (damaged file)", null);
            }
            int pos = 0;
            for (int c = 0; c < nCols; c++) {
                int size = types[c] == BinaryPingWriter.TYPE_F64 ? 8 : 4;
                if (where[c] >= 100) {
                    block.position(pos);
                    block.asIntBuffer().get(in[where[c] - 100], at, m);
                } else if (where[c] >= 0) {
                    block.position(pos);
                    block.asDoubleBuffer().get(d[where[c]], at, m);
                }
                pos += size * m;
            }
            at += m;
            blockNo++;
        }
        if (at != n) throw new InputException(file.toString(), 0, 0, "expected " + n + " rows, found " + at + " (truncated file)", null);
        for (int k = 0; k < 10; k++) {
            if (d[k] == null) { d[k] = new double[n]; Arrays.fill(d[k], Double.NaN); }
        }
        for (int j = 0; j < 3; j++) {
            if (in[j] == null) { in[j] = new int[n]; Arrays.fill(in[j], -1); }
        }
        check(file, names, d, in, n, nLines, separateNavigation);
        return PingTable.ofColumns(n, d[0], d[1], d[2], d[3], d[4], d[5], d[6], d[7], d[8], d[9], in[0], in[1], in[2], lineNames);
    }

    /** The CSV reader's rules, row by row (DESIGN.md section 4, docs/formats/pings.md). */
    private static void check(Path file, String[] names, double[][] d, int[][] in, int n, int nLines, boolean sepNav) {
        double previous = Double.NEGATIVE_INFINITY;
        double[] t = d[0], lat = d[1], lon = d[2], tw = d[3], dp = d[4];
        for (int i = 0; i < n; i++) {
            long row = i + 1L;
            if (!Double.isFinite(t[i])) throw err(file, row, names, "time", "expected a finite time, found " + t[i]);
            if (t[i] < previous) throw err(file, row, names, "time", "expected times not to decrease, found "
                    + IsoTime.format(t[i]) + " after " + IsoTime.format(previous));
            previous = t[i];
            if (!(sepNav && Double.isNaN(lat[i])) && !(lat[i] >= -90 && lat[i] <= 90)) {
                throw err(file, row, names, "lat", "expected a latitude in [-90, 90] degrees, found " + lat[i]);
            }
            if (!(sepNav && Double.isNaN(lon[i])) && !(lon[i] >= -180 && lon[i] <= 180)) {
                throw err(file, row, names, "lon", "expected a longitude in [-180, 180] degrees, found " + lon[i]);
            }
            if (!(Double.isNaN(tw[i]) || tw[i] >= 0 && tw[i] < Double.POSITIVE_INFINITY)) {
                throw err(file, row, names, "twtt", "expected 'twtt' >= 0 and finite, found " + tw[i]);
            }
            if (!(Double.isNaN(dp[i]) || dp[i] >= 0 && dp[i] < Double.POSITIVE_INFINITY)) {
                throw err(file, row, names, "depth", "expected 'depth' >= 0 and finite, found " + dp[i]);
            }
            if (Double.isNaN(tw[i]) && Double.isNaN(dp[i])) {
                throw err(file, row, names, "twtt", "expected a value for 'twtt' or 'depth', found neither");
            }
            bounded(file, row, names, "angle", d[5][i], 90);
            bounded(file, row, names, "heading", d[6][i], 360);
            bounded(file, row, names, "heave", d[7][i], Double.MAX_VALUE);
            bounded(file, row, names, "roll", d[8][i], 90);
            bounded(file, row, names, "pitch", d[9][i], 90);
            int l = in[0][i];
            if (l < -1 || l >= nLines) throw err(file, row, names, "line", "expected a line index in [-1, " + nLines + "), found " + l);
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
     * Reads the file a chunk at a time ({@link PingChunks}); same rows, values and errors as {@link #read}.
     * For now the whole table is read and served in slices.
     */
    public static PingChunks chunks(Path file, boolean separateNavigation, int targetRows) {
        return new WholeTableChunks(read(file, separateNavigation), targetRows);
    }
}
