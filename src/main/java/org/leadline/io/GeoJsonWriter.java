package org.leadline.io;

import com.fasterxml.jackson.core.JsonEncoding;
import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonGenerator;
import org.leadline.surface.Contours;

import java.io.IOException;
import java.io.OutputStream;
import java.math.BigDecimal;
import java.math.RoundingMode;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.List;

/**
 * Writes depth contours and selected soundings as GeoJSON (IETF RFC 7946, "The GeoJSON Format",
 * 2016): a FeatureCollection in WGS84 longitude/latitude degrees (RFC 7946 sect. 4: no "crs"
 * member), coordinates rounded to 1e-7 degree (about 1 cm; RFC 7946 sect. 11.2 recommends no more
 * precision than the data carry). The caller converts positions to longitude/latitude first.
 *
 * <ul>
 * <li>Contours: one LineString feature per line, properties {@code depth} (m, positive down,
 *   rounded to 1 mm) and {@code closed} (true for a ring, whose last position repeats the first).</li>
 * <li>Selected soundings: one Point feature per sounding, properties {@code depth} and, when given,
 *   {@code tvu} (95 %, m), both rounded to 1 mm.</li>
 * </ul>
 * Files are written to a temporary name in the target folder and moved into place, so a failed
 * write never leaves a half-written file under the final name. See docs/formats/geojson.md.
 */
public final class GeoJsonWriter {
    private static final JsonFactory JSON = new JsonFactory();

    private GeoJsonWriter() {}

    /**
     * Writes contour lines.
     *
     * @param file  target file
     * @param lines lines whose x is longitude and y latitude, degrees (WGS84)
     */
    public static void writeContours(Path file, List<Contours.Polyline> lines) throws IOException {
        atomicWrite(file, out -> {
            try (JsonGenerator j = JSON.createGenerator(out, JsonEncoding.UTF8)) {
                startCollection(j);
                for (Contours.Polyline p : lines) {
                    if (p.size() < 2) continue;   // RFC 7946 sect. 3.1.4: two or more positions
                    j.writeStartObject();
                    j.writeStringField("type", "Feature");
                    j.writeObjectFieldStart("geometry");
                    j.writeStringField("type", "LineString");
                    j.writeArrayFieldStart("coordinates");
                    for (int i = 0; i < p.size(); i++) position(j, p.x()[i], p.y()[i]);
                    j.writeEndArray();
                    j.writeEndObject();
                    j.writeObjectFieldStart("properties");
                    j.writeFieldName("depth");
                    j.writeNumber(round(p.level(), 3));
                    j.writeBooleanField("closed", p.closed());
                    j.writeEndObject();
                    j.writeEndObject();
                }
                endCollection(j);
            }
        });
    }

    /**
     * Writes soundings as points.
     *
     * @param file  target file
     * @param lon   longitudes, degrees (WGS84)
     * @param lat   latitudes, degrees (WGS84)
     * @param depth depths, m, positive down
     * @param tvu   95 % vertical uncertainties, m (null to leave out; NaN values are left out)
     */
    public static void writeSoundings(Path file, double[] lon, double[] lat, double[] depth, double[] tvu)
            throws IOException {
        if (lat.length != lon.length || depth.length != lon.length || (tvu != null && tvu.length != lon.length)) {
            throw new IllegalArgumentException("sounding columns differ in length: lon " + lon.length + ", lat "
                    + lat.length + ", depth " + depth.length + (tvu != null ? ", tvu " + tvu.length : ""));
        }
        atomicWrite(file, out -> {
            try (JsonGenerator j = JSON.createGenerator(out, JsonEncoding.UTF8)) {
                startCollection(j);
                for (int i = 0; i < lon.length; i++) {
                    if (!Double.isFinite(lon[i]) || !Double.isFinite(lat[i]) || !Double.isFinite(depth[i])) continue;
                    j.writeStartObject();
                    j.writeStringField("type", "Feature");
                    j.writeObjectFieldStart("geometry");
                    j.writeStringField("type", "Point");
                    j.writeFieldName("coordinates");
                    position(j, lon[i], lat[i]);
                    j.writeEndObject();
                    j.writeObjectFieldStart("properties");
                    j.writeFieldName("depth");
                    j.writeNumber(round(depth[i], 3));
                    if (tvu != null && Double.isFinite(tvu[i])) {
                        j.writeFieldName("tvu");
                        j.writeNumber(round(tvu[i], 3));
                    }
                    j.writeEndObject();
                    j.writeEndObject();
                }
                endCollection(j);
            }
        });
    }

    private static void startCollection(JsonGenerator j) throws IOException {
        j.writeStartObject();
        j.writeStringField("type", "FeatureCollection");
        j.writeArrayFieldStart("features");
    }

    private static void endCollection(JsonGenerator j) throws IOException {
        j.writeEndArray();
        j.writeEndObject();
    }

    private static void position(JsonGenerator j, double lon, double lat) throws IOException {
        if (!(Math.abs(lon) <= 180) || !(Math.abs(lat) <= 90)) {
            throw new IllegalArgumentException("expected longitude/latitude in degrees, found " + lon + ", " + lat
                    + " (convert projected coordinates before writing GeoJSON)");
        }
        j.writeStartArray();
        j.writeNumber(round(lon, 7));
        j.writeNumber(round(lat, 7));
        j.writeEndArray();
    }

    /** Decimal rounding (half-up), written without binary noise such as 12.300000000000001. */
    static BigDecimal round(double v, int places) {
        return BigDecimal.valueOf(v).setScale(places, RoundingMode.HALF_UP).stripTrailingZeros();
    }

    interface Body {
        void write(OutputStream out) throws IOException;
    }

    /** Writes to a temporary file next to the target, then moves it into place ({@link AtomicFiles}). */
    static void atomicWrite(Path file, Body body) throws IOException {
        AtomicFiles.write(file.toAbsolutePath(), tmp -> {
            try (OutputStream out = new java.io.BufferedOutputStream(Files.newOutputStream(tmp), 1 << 16)) {
                body.write(out);
            }
        });
    }
}
