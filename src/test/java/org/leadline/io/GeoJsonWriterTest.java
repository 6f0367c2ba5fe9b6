package org.leadline.io;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.leadline.surface.Contours;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

/** GeoJSON structure checked against IETF RFC 7946 (sections cited beside each check). */
class GeoJsonWriterTest {
    @TempDir
    Path dir;

    @Test
    void contoursAreLineStringFeaturesWithDepth() throws IOException {
        Contours.Polyline ring = new Contours.Polyline(10.0,
                new double[]{-3.123456789, -3.1, -3.2, -3.123456789}, new double[]{50.987654321, 51, 51, 50.987654321}, true);
        Contours.Polyline open = new Contours.Polyline(12.3, new double[]{-3, -3.05}, new double[]{50.5, 50.55}, false);
        Path f = dir.resolve("out/contours.geojson");
        GeoJsonWriter.writeContours(f, List.of(ring, open));
        JsonNode root = new ObjectMapper().readTree(f.toFile());
        assertThat(root.get("type").asText()).isEqualTo("FeatureCollection");   // RFC 7946 sect. 3.3
        assertThat(root.has("crs")).isFalse();                                  // sect. 4: WGS84 implied
        JsonNode feats = root.get("features");
        assertThat(feats).hasSize(2);
        JsonNode g0 = feats.get(0).get("geometry");
        assertThat(g0.get("type").asText()).isEqualTo("LineString");
        JsonNode c = g0.get("coordinates");
        assertThat(c).hasSize(4);
        // [longitude, latitude] (sect. 3.1.1), rounded to 1e-7 degree
        assertThat(c.get(0).get(0).decimalValue()).isEqualByComparingTo("-3.1234568");
        assertThat(c.get(0).get(1).decimalValue()).isEqualByComparingTo("50.9876543");
        assertThat(c.get(3)).isEqualTo(c.get(0));                              // closed ring repeats its first position
        assertThat(feats.get(0).get("properties").get("depth").asDouble()).isEqualTo(10.0);
        assertThat(feats.get(0).get("properties").get("closed").asBoolean()).isTrue();
        assertThat(feats.get(1).get("properties").get("depth").decimalValue()).isEqualByComparingTo("12.3");
        assertThat(Files.readString(f)).doesNotContain("12.300000");
        try (Stream<Path> s = Files.list(f.getParent())) {
            assertThat(s.map(p -> p.getFileName().toString())).containsExactly("contours.geojson");   // no temp file left
        }
    }

    @Test
    void soundingsArePointsWithDepthAndTvu() throws IOException {
        Path f = dir.resolve("selected-soundings.geojson");
        Files.writeString(f, "old content");   // replaced atomically
        GeoJsonWriter.writeSoundings(f, new double[]{4.5, 4.6, Double.NaN}, new double[]{52.1, 52.2, 52.3},
                new double[]{12.3456, 7.0, 9.0}, new double[]{0.25, Double.NaN, 0.3});
        JsonNode feats = new ObjectMapper().readTree(f.toFile()).get("features");
        assertThat(feats).hasSize(2);   // the sounding without a position is left out
        assertThat(feats.get(0).get("geometry").get("type").asText()).isEqualTo("Point");
        assertThat(feats.get(0).get("geometry").get("coordinates").get(0).asDouble()).isEqualTo(4.5);
        assertThat(feats.get(0).get("properties").get("depth").decimalValue()).isEqualByComparingTo("12.346");
        assertThat(feats.get(0).get("properties").get("tvu").asDouble()).isEqualTo(0.25);
        assertThat(feats.get(1).get("properties").has("tvu")).isFalse();
        GeoJsonWriter.writeSoundings(f, new double[]{1}, new double[]{2}, new double[]{3}, null);
        assertThat(new ObjectMapper().readTree(f.toFile()).get("features").get(0).get("properties").has("tvu")).isFalse();
    }

    @Test
    void projectedCoordinatesAreRefusedAndLeaveNoFile() {
        Path f = dir.resolve("bad.geojson");
        assertThatThrownBy(() -> GeoJsonWriter.writeSoundings(f, new double[]{412000}, new double[]{6120000},
                new double[]{10}, null)).hasMessageContaining("longitude/latitude");
        assertThat(f).doesNotExist();
        assertThat(dir.toFile().list()).isEmpty();
    }
}
