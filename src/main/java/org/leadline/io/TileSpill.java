package org.leadline.io;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/**
 * Temporary files of reduced soundings sorted into square tiles, for days processed tile by tile
 * (docs/performance.md). Each sounding goes to the file of its own ("home") tile and, when it lies
 * within {@code margin} of a neighbouring tile along each axis, to that tile's file too, so one
 * tile's file holds everything a decision about its own soundings can depend on. Records are
 * appended in the order they are added (sounding id order), fixed size, little-endian:
 * id int32, line int32, easting, northing, depth, tvu, time float64, flags uint8.
 *
 * <p>The files live in a folder of their own, removed by {@link #close}; nothing here is an
 * output of the run.
 */
public final class TileSpill implements AutoCloseable {
    static final int RECORD = 4 + 4 + 5 * 8 + 1;
    private static final int BUFFER = 64 * 1024 / RECORD * RECORD;

    private final Path dir;
    private final double tile, margin;
    private final Map<Long, ByteBuffer> buffers = new HashMap<>();
    private final Map<Long, Long> counts = new HashMap<>();
    private long bytes;

    /**
     * @param dir    folder for the files (created; must not hold anything else)
     * @param tile   tile side, m
     * @param margin width of the band copied to neighbouring tiles, m (less than the tile side)
     */
    public TileSpill(Path dir, double tile, double margin) throws IOException {
        if (!(margin >= 0 && margin < tile)) throw new IllegalArgumentException("margin " + margin + " must be below the tile side " + tile);
        this.dir = Files.createDirectories(dir);
        this.tile = tile;
        this.margin = margin;
    }

    public double tileSize() { return tile; }

    /** The home tile of a position: (floor(e / tile), floor(n / tile)) packed in a long. */
    public long home(double e, double n) { return key((int) Math.floor(e / tile), (int) Math.floor(n / tile)); }

    public static long key(int tx, int ty) { return ((long) tx << 32) | (ty & 0xffffffffL); }

    public static int tx(long key) { return (int) (key >> 32); }

    public static int ty(long key) { return (int) key; }

    /** Adds one sounding (finite easting and northing) to its home tile and to the tiles whose margin it lies in. */
    public void add(int id, int line, double e, double n, double depth, double tvu, double time, byte flags) throws IOException {
        int tx = (int) Math.floor(e / tile), ty = (int) Math.floor(n / tile);
        double fx = e - tx * tile, fy = n - ty * tile;
        int x0 = fx < margin ? -1 : 0, x1 = fx >= tile - margin ? 1 : 0;
        int y0 = fy < margin ? -1 : 0, y1 = fy >= tile - margin ? 1 : 0;
        for (int dx = x0; dx <= x1; dx++) {
            for (int dy = y0; dy <= y1; dy++) {
                long k = key(tx + dx, ty + dy);
                ByteBuffer b = buffers.computeIfAbsent(k, q -> ByteBuffer.allocate(BUFFER).order(ByteOrder.LITTLE_ENDIAN));
                b.putInt(id).putInt(line).putDouble(e).putDouble(n).putDouble(depth).putDouble(tvu).putDouble(time).put(flags);
                if (!b.hasRemaining()) flush(k, b);
            }
        }
    }

    private void flush(long k, ByteBuffer b) throws IOException {
        b.flip();
        try (FileChannel ch = FileChannel.open(file(k), StandardOpenOption.CREATE, StandardOpenOption.WRITE,
                StandardOpenOption.APPEND)) {
            while (b.hasRemaining()) bytes += ch.write(b);
        }
        counts.merge(k, (long) (b.limit() / RECORD), Long::sum);
        b.clear();
    }

    /** Writes what is buffered; call before reading. */
    public void finish() throws IOException {
        for (var en : buffers.entrySet()) if (en.getValue().position() > 0) flush(en.getKey(), en.getValue());
        buffers.clear();
    }

    /** The tiles that hold records, in ascending key order (west to east, then south to north within a column). */
    public List<Long> tiles() {
        List<Long> k = new ArrayList<>(counts.keySet());
        k.sort(null);
        return k;
    }

    /** Bytes written to the tile files so far. */
    public long bytesWritten() { return bytes; }

    /** The records of one tile, in the order they were added. */
    public Records read(long key) throws IOException {
        long count = counts.getOrDefault(key, 0L);
        if (count > Integer.MAX_VALUE / RECORD) throw new IOException("tile " + key + " holds too many soundings: " + count);
        Records r = new Records((int) count);
        ByteBuffer b = ByteBuffer.allocate(1 << 20).order(ByteOrder.LITTLE_ENDIAN);
        int i = 0;
        try (FileChannel ch = FileChannel.open(file(key), StandardOpenOption.READ)) {
            while (i < count) {
                b.clear();
                int want = (int) Math.min(b.capacity() / RECORD, count - i) * RECORD;
                b.limit(want);
                while (b.hasRemaining()) {
                    if (ch.read(b) < 0) throw new IOException("tile file " + file(key) + " ended after " + i + " of " + count + " records");
                }
                b.flip();
                while (b.hasRemaining()) {
                    r.id[i] = b.getInt();
                    r.line[i] = b.getInt();
                    r.e[i] = b.getDouble();
                    r.n[i] = b.getDouble();
                    r.depth[i] = b.getDouble();
                    r.tvu[i] = b.getDouble();
                    r.time[i] = b.getDouble();
                    r.flags[i] = b.get();
                    i++;
                }
            }
        }
        return r;
    }

    private Path file(long k) { return dir.resolve("tile_" + tx(k) + "_" + ty(k) + ".bin"); }

    /** Removes the tile files and their folder. */
    @Override
    public void close() throws IOException {
        buffers.clear();
        if (!Files.isDirectory(dir)) return;
        try (var s = Files.list(dir)) {
            for (Path p : (Iterable<Path>) s::iterator) Files.deleteIfExists(p);
        }
        Files.deleteIfExists(dir);
    }

    /** One tile's records, columnar. */
    public static final class Records {
        public final int size;
        public final int[] id, line;
        public final double[] e, n, depth, tvu, time;
        public final byte[] flags;

        Records(int size) {
            this.size = size;
            id = new int[size];
            line = new int[size];
            e = new double[size];
            n = new double[size];
            depth = new double[size];
            tvu = new double[size];
            time = new double[size];
            flags = new byte[size];
        }
    }
}
