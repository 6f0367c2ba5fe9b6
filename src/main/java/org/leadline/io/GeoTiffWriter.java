package org.leadline.io;

import org.apache.sis.metadata.iso.citation.Citations;
import org.apache.sis.referencing.IdentifiedObjects;
import org.leadline.surface.Grid;
import org.opengis.referencing.crs.CoordinateReferenceSystem;
import org.opengis.referencing.crs.ProjectedCRS;
import org.opengis.util.FactoryException;

import javax.imageio.IIOImage;
import javax.imageio.ImageIO;
import javax.imageio.ImageWriteParam;
import javax.imageio.ImageWriter;
import javax.imageio.plugins.tiff.BaselineTIFFTagSet;
import javax.imageio.plugins.tiff.GeoTIFFTagSet;
import javax.imageio.plugins.tiff.TIFFDirectory;
import javax.imageio.plugins.tiff.TIFFField;
import javax.imageio.plugins.tiff.TIFFTag;
import javax.imageio.plugins.tiff.TIFFTagSet;
import javax.imageio.stream.ImageOutputStream;
import java.awt.Transparency;
import java.awt.color.ColorSpace;
import java.awt.image.BandedSampleModel;
import java.awt.image.BufferedImage;
import java.awt.image.ComponentColorModel;
import java.awt.image.DataBuffer;
import java.awt.image.DataBufferFloat;
import java.awt.image.Raster;
import java.awt.image.WritableRaster;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.file.StandardOpenOption;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Map;

/**
 * Writes a {@link Grid} as a GeoTIFF (OGC 19-008r4, GeoTIFF 1.1): one float32 band per layer, NaN
 * no-data, the projected CRS by its EPSG code, pixel-is-area, plus the two private tags GDAL reads
 * for the no-data value (42113, GDAL_NODATA) and the band names (42112, GDAL_METADATA).
 *
 * <p>The TIFF itself (IFD layout, strips, Deflate compression, BitsPerSample, SampleFormat) is written
 * by the JDK's ImageIO TIFF plug-in; this class adds only the GeoTIFF and GDAL fields. Why not Apache
 * SIS's GeoTIFF writer, and the exact tags, are in docs/formats/geotiff.md. Classic TIFF: at most
 * 4 GiB per file.
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

        BandedSampleModel sm = new BandedSampleModel(DataBuffer.TYPE_FLOAT, grid.nx, grid.ny, banks.length);
        WritableRaster raster = Raster.createWritableRaster(sm, new DataBufferFloat(banks, grid.nx * grid.ny), null);
        // The ImageIO TIFF writer takes images, not bare rasters; the colour model is only a wrapper
        // (a generic n-component space) and the photometric tag is set explicitly below.
        ColorSpace space = banks.length == 1 ? ColorSpace.getInstance(ColorSpace.CS_GRAY) : new Samples(banks.length);
        BufferedImage image = new BufferedImage(new ComponentColorModel(space, false, false, Transparency.OPAQUE,
                DataBuffer.TYPE_FLOAT), raster, false, null);
        TIFFDirectory dir = directory(grid, names, metadata, epsg, crsName);

        AtomicFiles.write(out, tmp -> {
            Iterator<ImageWriter> it = ImageIO.getImageWritersByFormatName("tiff");
            if (!it.hasNext()) throw new IOException("this Java runtime has no ImageIO TIFF writer (needs Java 9 or later)");
            ImageWriter writer = it.next();
            try (ImageOutputStream ios = ImageIO.createImageOutputStream(tmp.toFile())) {
                writer.setOutput(ios);
                ImageWriteParam param = writer.getDefaultWriteParam();
                param.setCompressionMode(ImageWriteParam.MODE_EXPLICIT);
                param.setCompressionType("ZLib");   // TIFF compression 8, "Adobe Deflate": what GDAL writes for DEFLATE
                // ImageIO maps quality q to zlib level 1 + 8q; its default 1.0 (level 9) took 4x as long as
                // level 5 for no smaller a file (3000 x 2000 x 3 test grid, docs/formats/geotiff.md).
                param.setCompressionQuality(0.5f);
                writer.write(null, new IIOImage(image, null, dir.getAsMetadata()), param);
            } finally {
                writer.dispose();
            }
            if (banks.length > 1) declareExtraSamples(tmp, banks.length - 1);
        });
    }

    /**
     * Adds the ExtraSamples field (TIFF 6.0 tag 338) that the ImageIO writer cannot emit except for
     * alpha: with PhotometricInterpretation BlackIsZero only band 1 is the "colour" channel, and the
     * others must be declared as extra samples of unspecified meaning (value 0), as GDAL does itself;
     * without it libtiff warns on every open. The image file directory is copied, with the new field
     * in tag order, to the end of the file and the header is pointed at the copy; every other offset
     * is absolute and stays valid (TIFF 6.0, section 2: IFDs may be anywhere in the file).
     */
    static void declareExtraSamples(Path tiff, int extra) throws IOException {
        try (FileChannel ch = FileChannel.open(tiff, StandardOpenOption.READ, StandardOpenOption.WRITE)) {
            ByteBuffer head = readFully(ch, 0, 8);
            head.order(head.get(0) == 'I' ? ByteOrder.LITTLE_ENDIAN : ByteOrder.BIG_ENDIAN);
            if (head.getShort(2) != 42) throw new IOException(tiff + ": not a classic TIFF written by ImageIO");
            long ifd = Integer.toUnsignedLong(head.getInt(4));
            int count = Short.toUnsignedInt(readFully(ch, ifd, 2).order(head.order()).getShort(0));
            ByteBuffer old = readFully(ch, ifd + 2, count * 12 + 4).order(head.order());
            long at = (ch.size() + 3) & ~3L;                    // new IFD on a word boundary
            long valuesAt = at + 2 + (count + 1) * 12L + 4;     // ExtraSamples values when they do not fit in 4 bytes
            ByteBuffer out = ByteBuffer.allocate(2 + (count + 1) * 12 + 4 + (extra > 2 ? 2 * extra : 0)).order(head.order());
            out.putShort((short) (count + 1));
            boolean added = false;
            for (int i = 0; i < count; i++) {
                int tag = Short.toUnsignedInt(old.getShort(i * 12));
                if (tag == BaselineTIFFTagSet.TAG_EXTRA_SAMPLES) throw new IOException(tiff + ": already has ExtraSamples");
                if (!added && tag > BaselineTIFFTagSet.TAG_EXTRA_SAMPLES) { putExtraSamples(out, extra, valuesAt); added = true; }
                out.put(old.array(), i * 12, 12);
            }
            if (!added) putExtraSamples(out, extra, valuesAt);
            out.putInt(old.getInt(count * 12));                  // next IFD offset, unchanged (0)
            for (int i = 0; i < extra && extra > 2; i++) out.putShort((short) 0);
            ch.write(out.flip(), at);
            ch.write(head.putInt(4, (int) at).position(4).limit(8), 4);
        }
    }

    private static void putExtraSamples(ByteBuffer out, int extra, long valuesAt) {
        out.putShort((short) BaselineTIFFTagSet.TAG_EXTRA_SAMPLES).putShort((short) TIFFTag.TIFF_SHORT).putInt(extra);
        if (extra <= 2) out.putShort((short) 0).putShort((short) 0);   // 0 = unspecified data, stored in the entry
        else out.putInt((int) valuesAt);
    }

    private static ByteBuffer readFully(FileChannel ch, long pos, int n) throws IOException {
        ByteBuffer b = ByteBuffer.allocate(n);
        while (b.hasRemaining()) {
            if (ch.read(b, pos + b.position()) < 0) throw new IOException("TIFF ends early at byte " + (pos + b.position()));
        }
        return b.flip();
    }

    /** A colour space of n generic components: lets ImageIO carry n float bands that are not colours. */
    private static final class Samples extends ColorSpace {
        private static final long serialVersionUID = 1L;
        Samples(int n) { super(n <= 15 ? ColorSpace.TYPE_2CLR + n - 2 : ColorSpace.TYPE_FCLR, n); }
        @Override public float[] toRGB(float[] v) { return new float[] {v[0], v[0], v[0]}; }
        @Override public float[] fromRGB(float[] rgb) { float[] v = new float[getNumComponents()]; v[0] = rgb[0]; return v; }
        @Override public float[] toCIEXYZ(float[] v) { return toRGB(v); }
        @Override public float[] fromCIEXYZ(float[] xyz) { return fromRGB(xyz); }
        @Override public float getMinValue(int component) { return -Float.MAX_VALUE; }
        @Override public float getMaxValue(int component) { return Float.MAX_VALUE; }
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

    private static TIFFDirectory directory(Grid grid, List<String> names, Map<String, String> metadata, int epsg, String crsName) {
        BaselineTIFFTagSet base = BaselineTIFFTagSet.getInstance();
        GeoTIFFTagSet geo = GeoTIFFTagSet.getInstance();
        TIFFDirectory dir = new TIFFDirectory(new TIFFTagSet[] {base, geo}, null);
        int n = names.size();

        // Not RGB even with three bands: each band is a measured quantity (ImageIO would say RGB for three).
        dir.addTIFFField(new TIFFField(base.getTag(BaselineTIFFTagSet.TAG_PHOTOMETRIC_INTERPRETATION),
                BaselineTIFFTagSet.PHOTOMETRIC_INTERPRETATION_BLACK_IS_ZERO));
        char[] fmt = new char[n];
        java.util.Arrays.fill(fmt, (char) BaselineTIFFTagSet.SAMPLE_FORMAT_FLOATING_POINT);
        dir.addTIFFField(new TIFFField(base.getTag(BaselineTIFFTagSet.TAG_SAMPLE_FORMAT), TIFFTag.TIFF_SHORT, n, fmt));
        dir.addTIFFField(ascii(base.getTag(BaselineTIFFTagSet.TAG_SOFTWARE), "Leadline"));

        // Georeferencing (GeoTIFF 1.1 sections 7.2-7.3): raster (0,0) = top-left corner of cell (0,0).
        dir.addTIFFField(new TIFFField(geo.getTag(GeoTIFFTagSet.TAG_MODEL_PIXEL_SCALE), TIFFTag.TIFF_DOUBLE, 3,
                new double[] {grid.cell, grid.cell, 0}));
        dir.addTIFFField(new TIFFField(geo.getTag(GeoTIFFTagSet.TAG_MODEL_TIE_POINT), TIFFTag.TIFF_DOUBLE, 6,
                new double[] {0, 0, 0, grid.xMin, grid.yMax, 0}));
        String citation = crsName + "|";   // GeoAsciiParams strings end with '|'
        char[] keys = {
            1, 1, 0, 5,                                              // version 1, revision 1.0, 5 keys (sorted by id)
            GT_MODEL_TYPE, 0, 1, MODEL_TYPE_PROJECTED,
            GT_RASTER_TYPE, 0, 1, RASTER_PIXEL_IS_AREA,
            GT_CITATION, (char) GeoTIFFTagSet.TAG_GEO_ASCII_PARAMS, (char) citation.length(), 0,
            PROJECTED_CS_TYPE, 0, 1, (char) epsg,
            PROJ_LINEAR_UNITS, 0, 1, LINEAR_METER,
        };
        dir.addTIFFField(new TIFFField(geo.getTag(GeoTIFFTagSet.TAG_GEO_KEY_DIRECTORY), TIFFTag.TIFF_SHORT, keys.length, keys));
        dir.addTIFFField(ascii(geo.getTag(GeoTIFFTagSet.TAG_GEO_ASCII_PARAMS), citation));

        // GDAL's private tags: no-data as ASCII, band names and dataset items as XML.
        dir.addTIFFField(ascii(new TIFFTag("GDAL_NODATA", TAG_GDAL_NODATA, 1 << TIFFTag.TIFF_ASCII), "nan"));
        dir.addTIFFField(ascii(new TIFFTag("GDAL_METADATA", TAG_GDAL_METADATA, 1 << TIFFTag.TIFF_ASCII),
                gdalMetadata(names, metadata)));
        return dir;
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

    private static TIFFField ascii(TIFFTag tag, String value) {
        return new TIFFField(tag, TIFFTag.TIFF_ASCII, 1, new String[] {value});
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
