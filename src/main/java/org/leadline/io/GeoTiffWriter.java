package org.leadline.io;

import org.apache.sis.metadata.iso.citation.Citations;
import org.apache.sis.referencing.IdentifiedObjects;
import org.leadline.surface.Grid;
import org.opengis.referencing.crs.CoordinateReferenceSystem;
import org.opengis.referencing.crs.ProjectedCRS;
import org.opengis.util.FactoryException;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.file.StandardOpenOption;
import java.nio.file.Path;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.stream.IntStream;
import java.util.zip.Deflater;

/**
 * Writes a {@link Grid} as a GeoTIFF (OGC 19-008r4, GeoTIFF 1.1): one float32 band per layer, NaN
 * no-data, the projected CRS by its EPSG code, pixel-is-area, plus the two private tags GDAL reads
 * for the no-data value (42113, GDAL_NODATA) and the band names (42112, GDAL_METADATA).
 *
 * <p>The TIFF container follows TIFF 6.0 (Adobe, 1992): classic big-endian, pixel-interleaved
 * strips of about {@link #STRIP_BYTES} bytes, each compressed by zlib (compression 8, "Adobe
 * Deflate", what GDAL writes for DEFLATE). Strips are compressed side by side on all cores and
 * written in order, so the file is the same for any number of threads. Why this class writes the
 * container itself (the JDK's ImageIO TIFF writer compresses one strip after another, and Apache
 * SIS's writer lacks no-data and band names), and the exact tags, are in docs/formats/geotiff.md.
 * Classic TIFF: at most 4 GiB per file.
 *
 * <pre>{@code
 * GeoTiffWriter.write(grid, out.resolve("surface.tif"),
 *         List.of(Grid.DEPTH, Grid.UNCERTAINTY, Grid.COUNT), Map.of("LEADLINE_VERSION", "0.1.0"));
 * }</pre>
 */
public final class GeoTiffWriter {
    private GeoTiffWriter() {}

    /** GDAL's private TIFF tags (GDAL GTiff driver documentation, "Metadata" and "Nodata value"). */
    static final int TAG_GDAL_METADATA = 42112, TAG_GDAL_NODATA = 42113;

    // GeoTIFF 1.1 (OGC 19-008r4) keys and codes
    private static final int GT_MODEL_TYPE = 1024, GT_RASTER_TYPE = 1025, GT_CITATION = 1026,
            PROJECTED_CS_TYPE = 3072, PROJ_LINEAR_UNITS = 3076;
    private static final int MODEL_TYPE_PROJECTED = 1, RASTER_PIXEL_IS_AREA = 1, LINEAR_METER = 9001;

    /** Largest classic (32-bit offset) TIFF, less room for the tags. */
    private static final long MAX_BYTES = 0xFFFF_FFFFL - (1 << 20);

    /** Uncompressed bytes per strip aimed at (whole rows; at least one row). */
    static final int STRIP_BYTES = 1 << 18;
    /** Strips compressed at once before they are written (bounds the memory held in compressed strips). */
    private static final int BATCH_STRIPS = 64;
    /** zlib level: 9 took 4x as long as 5 for no smaller a file (docs/formats/geotiff.md). */
    static final int DEFLATE_LEVEL = 5;

    /**
     * Writes the grid atomically (temporary file in the same folder, then moved into place).
     *
     * @param grid       the grid; its CRS must carry an EPSG code
     * @param out        the GeoTIFF to create or replace
     * @param layerNames layers to write, in band order; null or empty: every layer in the grid's order
     * @param metadata   dataset metadata written as GDAL metadata items (name, value); may be null
     * @throws IllegalArgumentException when a layer is missing, the CRS has no EPSG code, or the file would exceed 4 GiB
     * @throws IOException when the file cannot be written
     */
    public static void write(Grid grid, Path out, List<String> layerNames, Map<String, String> metadata) throws IOException {
        List<String> names = layerNames == null || layerNames.isEmpty() ? List.copyOf(grid.layers().keySet()) : List.copyOf(layerNames);
        if (names.isEmpty()) throw new IllegalArgumentException("grid has no layers to write to " + out);
        float[][] banks = new float[names.size()][];
        for (int b = 0; b < banks.length; b++) {
            banks[b] = grid.layer(names.get(b));
            if (banks[b] == null) {
                throw new IllegalArgumentException("grid has no layer '" + names.get(b) + "'; it has " + grid.layers().keySet());
            }
        }
        long bytes = (long) grid.nx * grid.ny * banks.length * Float.BYTES;
        if (bytes > MAX_BYTES) {
            throw new IllegalArgumentException("GeoTIFF of " + grid.nx + " x " + grid.ny + " cells x " + banks.length
                    + " bands would be " + bytes / (1 << 20) + " MiB, over the 4 GiB of a classic TIFF; choose a larger cell");
        }
        int epsg = epsgCode(grid.crs());
        String crsName = grid.crs().getName().getCode();
        int nx = grid.nx, ny = grid.ny, nb = banks.length;
        int rowBytes = nx * nb * Float.BYTES;
        int rowsPerStrip = Math.max(1, Math.min(ny, STRIP_BYTES / rowBytes));
        int strips = (ny + rowsPerStrip - 1) / rowsPerStrip;

        AtomicFiles.write(out, tmp -> {
            long[] offset = new long[strips], count = new long[strips];
            try (FileChannel ch = FileChannel.open(tmp, StandardOpenOption.WRITE, StandardOpenOption.CREATE,
                    StandardOpenOption.TRUNCATE_EXISTING)) {
                long at = HEADER;
                ch.position(at);
                // strips compressed side by side, written in order: the same bytes for any number of threads
                for (int s0 = 0; s0 < strips; s0 += BATCH_STRIPS) {
                    int first = s0, last = Math.min(strips, s0 + BATCH_STRIPS);
                    byte[][] packed = new byte[last - first][];
                    IntStream.range(first, last).parallel().forEach(s ->
                            packed[s - first] = strip(banks, nx, s * rowsPerStrip, Math.min(ny, (s + 1) * rowsPerStrip)));
                    for (int s = first; s < last; s++) {
                        byte[] z = packed[s - first];
                        offset[s] = at;
                        count[s] = z.length;
                        writeFully(ch, ByteBuffer.wrap(z));
                        at += z.length;
                    }
                }
                long ifdAt = (at + 1) & ~1L;   // word boundary (TIFF 6.0, section 2)
                if (ifdAt != at) writeFully(ch, ByteBuffer.allocate(1));
                byte[] ifd = directory(grid, names, metadata, epsg, crsName, rowsPerStrip, offset, count, ifdAt);
                if (ifdAt + ifd.length > 0xFFFF_FFFFL) {
                    throw new IOException(out + ": the compressed GeoTIFF would exceed the 4 GiB of a classic TIFF; choose a larger cell");
                }
                writeFully(ch, ByteBuffer.wrap(ifd));
                ByteBuffer head = ByteBuffer.allocate(HEADER).order(ByteOrder.BIG_ENDIAN);
                head.put((byte) 'M').put((byte) 'M').putShort((short) 42).putInt((int) ifdAt).flip();
                ch.position(0);
                writeFully(ch, head);
            }
        });
    }

    /** Bytes before the first strip: the 8-byte TIFF header. */
    private static final int HEADER = 8;

    /** Rows [r0, r1) pixel-interleaved as big-endian float32, zlib-compressed (TIFF compression 8). */
    private static byte[] strip(float[][] banks, int nx, int r0, int r1) {
        int nb = banks.length;
        ByteBuffer raw = ByteBuffer.allocate((r1 - r0) * nx * nb * Float.BYTES).order(ByteOrder.BIG_ENDIAN);
        for (int r = r0; r < r1; r++) {
            int base = r * nx;
            for (int c = 0; c < nx; c++) {
                for (float[] bank : banks) raw.putFloat(bank[base + c]);
            }
        }
        Deflater d = new Deflater(DEFLATE_LEVEL);
        try {
            d.setInput(raw.array());
            d.finish();
            byte[] z = new byte[raw.capacity() / 2 + 64];
            int n = 0;
            while (!d.finished()) {
                if (n == z.length) z = Arrays.copyOf(z, 2 * z.length);
                n += d.deflate(z, n, z.length - n);
            }
            return Arrays.copyOf(z, n);
        } finally {
            d.end();
        }
    }

    private static void writeFully(FileChannel ch, ByteBuffer b) throws IOException {
        while (b.hasRemaining()) ch.write(b);
    }

    /** The EPSG code of a projected CRS, or IllegalArgumentException saying what is needed. */
    static int epsgCode(CoordinateReferenceSystem crs) {
        if (crs == null) throw new IllegalArgumentException("a GeoTIFF needs the grid's CRS, and the grid has none");
        if (!(crs instanceof ProjectedCRS)) {
            throw new IllegalArgumentException("a depth surface GeoTIFF needs a projected CRS, found " + crs.getName().getCode());
        }
        Integer code = null;
        var id = IdentifiedObjects.getIdentifier(crs, Citations.EPSG);   // declared code first: no database needed
        if (id != null && id.getCode().matches("\\d+")) {
            code = Integer.valueOf(id.getCode());
        } else {
            try {
                code = IdentifiedObjects.lookupEPSG(crs);
            } catch (FactoryException e) {
                code = null;
            }
        }
        if (code == null) {
            throw new IllegalArgumentException("the grid's CRS '" + crs.getName().getCode() + "' has no EPSG code; "
                    + "the GeoTIFF writer records the CRS by its EPSG code (use --crs auto or EPSG:N)");
        }
        return code;
    }

    // TIFF 6.0 field types
    private static final short ASCII = 2, SHORT = 3, LONG = 4, DOUBLE = 12;

    /**
     * The image file directory (TIFF 6.0 section 2, entries sorted by tag) with its out-of-line
     * values, to be written at {@code at}.
     */
    private static byte[] directory(Grid grid, List<String> names, Map<String, String> metadata, int epsg,
                                    String crsName, int rowsPerStrip, long[] offset, long[] count, long at) {
        int n = names.size();
        Ifd d = new Ifd();
        d.longs(256, grid.nx);                                   // ImageWidth
        d.longs(257, grid.ny);                                   // ImageLength
        d.shorts(258, repeat(n, 32));                            // BitsPerSample
        d.shorts(259, 8);                                        // Compression: Deflate ("Adobe Deflate", zlib)
        // Not RGB even with three bands: each band is a measured quantity.
        d.shorts(262, 1);                                        // PhotometricInterpretation: BlackIsZero
        d.longs(273, offset);                                    // StripOffsets
        d.shorts(277, n);                                        // SamplesPerPixel
        d.longs(278, rowsPerStrip);                              // RowsPerStrip
        d.longs(279, count);                                     // StripByteCounts
        d.shorts(284, 1);                                        // PlanarConfiguration: chunky
        d.ascii(305, "Leadline");                                // Software
        // bands 2..n are extra samples of unspecified meaning (0), as GDAL writes them; without this
        // field libtiff warns on every open
        if (n > 1) d.shorts(338, repeat(n - 1, 0));              // ExtraSamples
        d.shorts(339, repeat(n, 3));                             // SampleFormat: IEEE floating point
        // Georeferencing (GeoTIFF 1.1 sections 7.2-7.3): raster (0,0) = top-left corner of cell (0,0).
        d.doubles(33550, grid.cell, grid.cell, 0);               // ModelPixelScale
        d.doubles(33922, 0, 0, 0, grid.xMin, grid.yMax, 0);      // ModelTiepoint
        String citation = crsName + "|";   // GeoAsciiParams strings end with '|'
        d.shorts(34735,                                          // GeoKeyDirectory
            1, 1, 0, 5,                                          // version 1, revision 1.0, 5 keys (sorted by id)
            GT_MODEL_TYPE, 0, 1, MODEL_TYPE_PROJECTED,
            GT_RASTER_TYPE, 0, 1, RASTER_PIXEL_IS_AREA,
            GT_CITATION, 34737, citation.length(), 0,
            PROJECTED_CS_TYPE, 0, 1, epsg,
            PROJ_LINEAR_UNITS, 0, 1, LINEAR_METER);
        d.ascii(34737, citation);                                // GeoAsciiParams
        // GDAL's private tags: band names and dataset items as XML, no-data as ASCII.
        d.ascii(TAG_GDAL_METADATA, gdalMetadata(names, metadata));
        d.ascii(TAG_GDAL_NODATA, "nan");
        return d.bytes(at);
    }

    private static int[] repeat(int n, int v) {
        int[] a = new int[n];
        Arrays.fill(a, v);
        return a;
    }

    /** Entries of one classic big-endian IFD, in the order added (which must be tag order). */
    private static final class Ifd {
        private final List<Object[]> entries = new ArrayList<>();   // {tag, type, count, value bytes}

        void shorts(int tag, int... v) {
            ByteBuffer b = ByteBuffer.allocate(2 * v.length);
            for (int x : v) b.putShort((short) x);
            add(tag, SHORT, v.length, b.array());
        }

        void longs(int tag, long... v) {
            ByteBuffer b = ByteBuffer.allocate(4 * v.length);
            for (long x : v) b.putInt((int) x);
            add(tag, LONG, v.length, b.array());
        }

        void doubles(int tag, double... v) {
            ByteBuffer b = ByteBuffer.allocate(8 * v.length);
            for (double x : v) b.putDouble(x);
            add(tag, DOUBLE, v.length, b.array());
        }

        void ascii(int tag, String v) {
            byte[] t = (v + "\0").getBytes(StandardCharsets.US_ASCII);
            add(tag, ASCII, t.length, t);
        }

        private void add(int tag, short type, int count, byte[] value) {
            if (!entries.isEmpty() && (int) entries.get(entries.size() - 1)[0] >= tag) {
                throw new IllegalStateException("TIFF tags out of order at " + tag);
            }
            entries.add(new Object[] {tag, type, count, value});
        }

        /** The directory and, after it, the values longer than 4 bytes (each on a word boundary). */
        byte[] bytes(long at) {
            int head = 2 + 12 * entries.size() + 4;
            int extra = 0;
            for (Object[] e : entries) {
                int len = ((byte[]) e[3]).length;
                if (len > 4) extra += (len + 1) & ~1;
            }
            ByteBuffer b = ByteBuffer.allocate(head + extra).order(ByteOrder.BIG_ENDIAN);
            b.putShort((short) entries.size());
            int values = head;
            for (Object[] e : entries) {
                byte[] v = (byte[]) e[3];
                b.putShort((short) (int) (Integer) e[0]).putShort((Short) e[1]).putInt((Integer) e[2]);
                if (v.length <= 4) {
                    b.put(v);
                    for (int k = v.length; k < 4; k++) b.put((byte) 0);   // left-justified in the field
                } else {
                    b.putInt((int) (at + values));
                    b.put(values, v);
                    values += (v.length + 1) & ~1;
                }
            }
            b.putInt(0);   // no next IFD
            return b.array();
        }
    }

    /** GDAL_METADATA XML: dataset items, then per band its description (and unit for lengths). */
    static String gdalMetadata(List<String> names, Map<String, String> metadata) {
        StringBuilder sb = new StringBuilder("<GDALMetadata>\n");
        if (metadata != null) {
            List<String> keys = new ArrayList<>(metadata.keySet());
            for (String k : keys) {
                sb.append("  <Item name=\"").append(xml(k)).append("\">").append(text(metadata.get(k))).append("</Item>\n");
            }
        }
        for (int b = 0; b < names.size(); b++) {
            sb.append("  <Item name=\"DESCRIPTION\" sample=\"").append(b).append("\" role=\"description\">")
              .append(text(names.get(b))).append("</Item>\n");
            if (isLength(names.get(b))) {
                sb.append("  <Item name=\"UNITTYPE\" sample=\"").append(b).append("\" role=\"unittype\">m</Item>\n");
            }
        }
        return sb.append("</GDALMetadata>").toString();
    }

    private static boolean isLength(String layer) {
        return layer.equals(Grid.DEPTH) || layer.equals(Grid.UNCERTAINTY) || layer.equals(Grid.STDDEV);
    }

    /**
     * Item text as GDAL writes and reads it: escaped twice (GDAL escapes the value, then its XML
     * serialiser escapes the result again, and it unescapes twice on reading), so "a&b" is "a&amp;amp;b".
     */
    private static String text(String s) { return xml(xml(s)); }

    private static String xml(String s) {
        if (s == null) return "";
        StringBuilder sb = new StringBuilder(s.length());
        s.codePoints().forEach(c -> {
            switch (c) {
                case '<' -> sb.append("&lt;");
                case '>' -> sb.append("&gt;");
                case '&' -> sb.append("&amp;");
                case '"' -> sb.append("&quot;");
                default -> {
                    if (c > 0x7e) sb.append("&#").append(c).append(';');   // TIFF ASCII is 7-bit
                    else sb.append(c < 0x20 && c != '\t' && c != '\n' ? ' ' : (char) c);
                }
            }
        });
        return sb.toString();
    }
}
