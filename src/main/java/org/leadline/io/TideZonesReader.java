package org.leadline.io;

import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.JsonLocation;
import com.fasterxml.jackson.core.JsonParser;
import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.core.JsonToken;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import org.leadline.survey.TideZone;

/**
 * Reads tide zones from GeoJSON (RFC 7946): a FeatureCollection whose features have Polygon or
 * MultiPolygon geometries and the properties {@code name} (text, unique), {@code time_offset_min}
 * (minutes the zone's tide lags the gauge; negative: it leads) and {@code range_ratio} (zone range
 * / gauge range, > 0). Format: docs/formats/tide-zones.md.
 *
 * <p>Errors name the file and the line and character column where the offending feature
 * starts (Jackson's streaming location), plus the feature number and name; syntax errors carry
 * Jackson's exact position.
 */
public final class TideZonesReader {
    private TideZonesReader() {}

    private static final ObjectMapper MAPPER = new ObjectMapper();

    public static List<TideZone> read(Path file) {
        TextFiles.sniff(file); // gzip, zip or binary: one clear message
        List<TideZone> zones = new ArrayList<>();
        boolean sawType = false, sawFeatures = false;
        try (InputStream in = Files.newInputStream(file); JsonParser p = new JsonFactory(MAPPER).createParser(in)) {
            if (p.nextToken() != JsonToken.START_OBJECT) throw at(file, p.currentTokenLocation(), "expected a GeoJSON object");
            while (p.nextToken() == JsonToken.FIELD_NAME) {
                String field = p.currentName();
                JsonToken v = p.nextToken();
                if (field.equals("type")) {
                    if (v != JsonToken.VALUE_STRING || !p.getText().equals("FeatureCollection")) {
                        throw at(file, p.currentTokenLocation(), "expected \"type\": \"FeatureCollection\", found " + p.getText());
                    }
                    sawType = true;
                } else if (field.equals("features")) {
                    if (v != JsonToken.START_ARRAY) throw at(file, p.currentTokenLocation(), "expected an array of features");
                    sawFeatures = true;
                    Set<String> names = new HashSet<>();
                    int k = 0;
                    while (p.nextToken() != JsonToken.END_ARRAY) {
                        JsonLocation loc = p.currentTokenLocation();
                        JsonNode f = MAPPER.readTree(p);
                        k++;
                        TideZone z = feature(file, loc, k, f);
                        if (!names.add(z.name())) throw at(file, loc, "feature " + k + ": zone name '" + z.name() + "' is used twice");
                        zones.add(z);
                    }
                } else {
                    p.skipChildren();
                }
            }
        } catch (NoSuchFileException e) {
            throw new InputException(file, "file not found");
        } catch (JsonProcessingException e) {
            JsonLocation l = e.getLocation();
            throw new InputException(file.toString(), l == null ? 0 : l.getLineNr(), l == null ? 0 : l.getColumnNr(),
                    "not valid JSON: " + TextFiles.abbreviate(e.getOriginalMessage().replaceFirst(" \\(start marker at .*$", "")), e);
        } catch (IOException e) {
            throw new InputException(file.toString(), 0, 0, "cannot read: " + e.getMessage(), e);
        }
        if (!sawType) throw new InputException(file, "expected \"type\": \"FeatureCollection\" at the top level");
        if (!sawFeatures || zones.isEmpty()) throw new InputException(file, "expected at least one tide zone feature, found none");
        return zones;
    }

    private static InputException at(Path file, JsonLocation l, String problem) {
        return new InputException(file, l.getLineNr(), l.getColumnNr(), problem);
    }

    private static TideZone feature(Path file, JsonLocation loc, int k, JsonNode f) {
        String where = "feature " + k;
        if (!f.isObject() || !"Feature".equals(f.path("type").asText())) throw at(file, loc, where + ": expected \"type\": \"Feature\"");
        JsonNode props = f.path("properties");
        JsonNode nameNode = props.path("name");
        if (!nameNode.isTextual() || nameNode.asText().isBlank()) throw at(file, loc, where + ": expected a text property 'name'");
        String name = nameNode.asText();
        where += " ('" + name + "')";
        JsonNode off = props.path("time_offset_min"), ratio = props.path("range_ratio");
        if (!off.isNumber()) throw at(file, loc, where + ": expected a number property 'time_offset_min', found " + off);
        if (!ratio.isNumber()) throw at(file, loc, where + ": expected a number property 'range_ratio', found " + ratio);
        double offMin = off.asDouble(), r = ratio.asDouble();
        if (!(Math.abs(offMin) <= 24 * 60)) throw at(file, loc, where + ": expected 'time_offset_min' within +-1440 minutes, found " + offMin);
        if (!(r > 0 && r < 100)) throw at(file, loc, where + ": expected 'range_ratio' > 0, found " + r);
        JsonNode g = f.path("geometry");
        String type = g.path("type").asText();
        List<JsonNode> polygons = new ArrayList<>();
        if (type.equals("Polygon")) {
            polygons.add(g.path("coordinates"));
        } else if (type.equals("MultiPolygon")) {
            for (JsonNode poly : g.path("coordinates")) polygons.add(poly);
        } else {
            throw at(file, loc, where + ": expected a Polygon or MultiPolygon geometry, found " + (type.isEmpty() ? "none" : type));
        }
        List<double[]> lons = new ArrayList<>(), lats = new ArrayList<>();
        for (JsonNode poly : polygons) {
            if (!poly.isArray() || poly.isEmpty()) throw at(file, loc, where + ": expected polygon rings");
            for (JsonNode ring : poly) {
                if (!ring.isArray() || ring.size() < 4) {
                    throw at(file, loc, where + ": expected a ring of at least 4 positions, found " + (ring.isArray() ? ring.size() : 0));
                }
                double[] x = new double[ring.size()], y = new double[ring.size()];
                for (int i = 0; i < ring.size(); i++) {
                    JsonNode pos = ring.get(i);
                    if (!pos.isArray() || pos.size() < 2 || !pos.get(0).isNumber() || !pos.get(1).isNumber()) {
                        throw at(file, loc, where + ": expected a position [lon, lat], found " + pos);
                    }
                    x[i] = pos.get(0).asDouble();
                    y[i] = pos.get(1).asDouble();
                    if (!(Math.abs(x[i]) <= 180) || !(Math.abs(y[i]) <= 90)) {
                        throw at(file, loc, where + ": expected lon in [-180, 180] and lat in [-90, 90], found " + pos);
                    }
                }
                int n = x.length - 1;
                if (x[0] != x[n] || y[0] != y[n]) throw at(file, loc, where + ": expected a closed ring (last position = first, RFC 7946 3.1.6)");
                lons.add(x);
                lats.add(y);
            }
        }
        return new TideZone(name, lons.toArray(new double[0][]), lats.toArray(new double[0][]), offMin * 60.0, r);
    }
}
