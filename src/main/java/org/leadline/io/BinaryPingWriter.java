package org.leadline.io;

import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
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
        OutputStream out = new BufferedOutputStream(os, 1 << 16);
        double[][] d = {t.time, t.lat, t.lon, t.twtt, t.depth, t.angle, t.heading, t.heave, t.roll, t.pitch};
        int[][] in = {t.line, t.beam, t.quality};
        List<String> names = new ArrayList<>();
        List<Object> cols = new ArrayList<>();
        for (int k = 0; k < d.length; k++) {
            if (k == 0 || anyValue(d[k])) { names.add(DOUBLE_NAMES[k]); cols.add(d[k]); }
        }
        for (int k = 0; k < in.length; k++) {
            if (anyValue(in[k])) { names.add(INT_NAMES[k]); cols.add(in[k]); }
        }

        ByteBuffer h = ByteBuffer.allocate(1 << 16).order(ByteOrder.LITTLE_ENDIAN);
        for (String l : t.lineNames()) h = ensure(h, l.length() * 3 + 8);
        h.put(MAGIC).putShort((short) VERSION).putLong(t.size).putShort((short) names.size());
        for (int c = 0; c < names.size(); c++) {
            h.put((byte) (cols.get(c) instanceof double[] ? TYPE_F64 : TYPE_I32));
            byte[] nb = names.get(c).getBytes(StandardCharsets.US_ASCII);
            h.put((byte) nb.length).put(nb);
        }
        h.putInt(t.lineNames().size());
        for (String l : t.lineNames()) {
            byte[] lb = l.getBytes(StandardCharsets.UTF_8);
            if (lb.length > 65535) throw new IllegalArgumentException("line name longer than 65535 bytes");
            h = ensure(h, lb.length + 2 + 8);
            h.putShort((short) lb.length).put(lb);
        }
        h.putInt(BLOCK_ROWS);
        CRC32 crc = new CRC32();
        crc.update(h.array(), 0, h.position());
        h.putInt((int) crc.getValue());
        out.write(h.array(), 0, h.position());

        int rowBytes = 0;
        for (Object c : cols) rowBytes += c instanceof double[] ? 8 : 4;
        ByteBuffer b = ByteBuffer.allocate(4 + BLOCK_ROWS * rowBytes + 4).order(ByteOrder.LITTLE_ENDIAN);
        for (int from = 0; from < t.size; from += BLOCK_ROWS) {
            int m = Math.min(BLOCK_ROWS, t.size - from);
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
        }
        b.clear();
        b.putInt(0).putLong(t.size);
        crc.reset();
        crc.update(b.array(), 0, b.position());
        b.putInt((int) crc.getValue());
        out.write(b.array(), 0, b.position());
        out.flush();
    }

    private static ByteBuffer ensure(ByteBuffer h, int more) {
        if (h.remaining() >= more) return h;
        ByteBuffer g = ByteBuffer.allocate(Math.max(h.capacity() * 2, h.position() + more)).order(ByteOrder.LITTLE_ENDIAN);
        h.flip();
        return g.put(h);
    }

    private static boolean anyValue(double[] a) {
        for (double v : a) if (!Double.isNaN(v)) return true;
        return false;
    }

    private static boolean anyValue(int[] a) {
        for (int v : a) if (v != -1) return true;
        return false;
    }
}
