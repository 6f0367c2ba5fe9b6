package org.leadline.reduction;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.leadline.io.InputException;
import org.leadline.io.TideZonesReader;
import org.leadline.survey.TideZone;
import org.leadline.survey.WaterLevelSeries;

class TideZoningTest {
    @TempDir Path dir;
    private static final Path ZONES = Path.of("src/test/resources/tide/zones.geojson");
    /** Gauge rising linearly from 1.0 m at t = 0 to 2.0 m at t = 3600 s: level = 1 + t / 3600. */
    private static final WaterLevelSeries GAUGE = WaterLevelSeries.of(new double[] {0, 3600}, new double[] {1.0, 2.0});

    @Test
    void readsZones() {
        List<TideZone> z = TideZonesReader.read(ZONES);
        assertThat(z).hasSize(2);
        assertThat(z.get(0).name()).isEqualTo("A-outer");
        assertThat(z.get(0).timeOffset()).isEqualTo(1800.0); // 30 min
        assertThat(z.get(0).rangeRatio()).isEqualTo(1.1);
        assertThat(z.get(0).lon()).hasNumberOfRows(2);
        assertThat(z.get(1).timeOffset()).isEqualTo(-900.0);
        assertThat(z.get(1).lat()[0]).hasSize(7);
    }

    @Test
    void pointInPolygonEvenOdd() {
        List<TideZone> z = TideZonesReader.read(ZONES);
        TideZoning zoning = new TideZoning(GAUGE, z);
        assertThat(zoning.zoneAt(50.2, 0.2)).isEqualTo(0);
        assertThat(zoning.zoneAt(50.5, 0.5)).isEqualTo(-1);  // in the hole
        assertThat(zoning.zoneAt(50.5, 0.3)).isEqualTo(0);   // beside the hole
        assertThat(zoning.zoneAt(50.5, 1.5)).isEqualTo(-1);  // between the zones
        // B is an L: the square 2..4 x 50..51 plus 3..4 x 51..52 (worked by hand from its vertices)
        assertThat(zoning.zoneAt(51.5, 3.5)).isEqualTo(1);
        assertThat(zoning.zoneAt(51.5, 2.5)).isEqualTo(-1);  // the notch of the L
        assertThat(zoning.zoneAt(50.5, 2.5)).isEqualTo(1);
        assertThat(zoning.zoneAt(49.9, 3.0)).isEqualTo(-1);
    }

    @Test
    void offsetAndRatioWorkedByHand() {
        TideZoning zoning = new TideZoning(GAUGE, TideZonesReader.read(ZONES));
        // Zone A at t = 2700 s: gauge(2700 - 1800) = 1 + 900/3600 = 1.25 m; x 1.1 = 1.375 m
        assertThat(zoning.level(2700, 50.2, 0.2)).isCloseTo(1.375, within(1e-12));
        // Zone B at t = 2700 s: offset -15 min -> gauge(3600) = 2.0 m; x 0.9 = 1.8 m
        assertThat(zoning.level(2700, 50.5, 2.5)).isCloseTo(1.8, within(1e-12));
        // outside every zone: the gauge itself, 1 + 2700/3600 = 1.75 m
        assertThat(zoning.level(2700, 50.5, 0.5)).isCloseTo(1.75, within(1e-12));
        assertThat(zoning.refusal(2700, 50.5, 0.5)).isEqualTo(TideZoning.Refusal.NONE);
        // zone A at t = 1000 s needs gauge(-800): before the record, never extrapolated
        assertThat(zoning.level(1000, 50.2, 0.2)).isNaN();
        assertThat(zoning.refusal(1000, 50.2, 0.2)).isEqualTo(TideZoning.Refusal.OUTSIDE_GAUGE_RECORD);
        // zone B at t = 2800 s needs gauge(3700): after the record
        assertThat(zoning.level(2800, 50.5, 2.5)).isNaN();
        TideZoning strict = new TideZoning(GAUGE, TideZonesReader.read(ZONES), true);
        assertThat(strict.level(2700, 50.5, 0.5)).isNaN();
        assertThat(strict.refusal(2700, 50.5, 0.5)).isEqualTo(TideZoning.Refusal.OUTSIDE_ZONES);
        assertThat(strict.level(2700, 50.2, 0.2)).isCloseTo(1.375, within(1e-12));
    }

    private void fails(String json, long line, int column, String fragment) throws IOException {
        Path p = dir.resolve("z.geojson");
        Files.writeString(p, json);
        assertThatThrownBy(() -> TideZonesReader.read(p)).isInstanceOfSatisfying(InputException.class, e -> {
            assertThat(e.file()).isEqualTo(p.toString());
            assertThat(e.line()).as(e.getMessage()).isEqualTo(line);
            assertThat(e.column()).as(e.getMessage()).isEqualTo(column);
            assertThat(e.getMessage()).contains(fragment);
        });
    }

    private static final String SQUARE = "\"geometry\": {\"type\": \"Polygon\", \"coordinates\": [[[0,0],[1,0],[1,1],[0,1],[0,0]]]}";

    @Test
    void badFiles() throws IOException {
        fails("{\"type\": \"FeatureCollection\", \"features\": [\n  {\"type\": \"Feature\", \"properties\": {\"name\": \"a\", \"time_offset_min\": 5}, "
                + SQUARE + "}]}", 2, 3, "feature 1 ('a'): expected a number property 'range_ratio'");
        fails("{\"type\": \"FeatureCollection\", \"features\": [\n{\"type\": \"Feature\", \"properties\": {\"name\": \"a\", \"time_offset_min\": 5, \"range_ratio\": 1}, "
                + SQUARE.replace("[0,1],[0,0]", "[0,1],[0,0.5]") + "}]}", 2, 1, "expected a closed ring");
        String ok = "{\"type\": \"Feature\", \"properties\": {\"name\": \"a\", \"time_offset_min\": 5, \"range_ratio\": 1}, " + SQUARE + "}";
        fails("{\"type\": \"FeatureCollection\", \"features\": [\n" + ok + ",\n " + ok + "]}", 3, 2, "zone name 'a' is used twice");
        fails("{\"type\": \"FeatureCollection\", \"features\": [\n" + ok.replace("\"range_ratio\": 1", "\"range_ratio\": 0") + "]}",
                2, 1, "expected 'range_ratio' > 0");
        fails("{\"type\": \"FeatureCollection\", \"features\": [\n" + ok.replace("Polygon", "LineString") + "]}",
                2, 1, "expected a Polygon or MultiPolygon geometry, found LineString");
        fails("{\"type\": \"FeatureCollection\", \"features\": [\n" + ok.replace("[1,1]", "[1,91]") + "]}", 2, 1, "lat in [-90, 90]");
        fails("{\"type\": \"FeatureCollection\",\n \"features\": [,]}", 2, 15, "not valid JSON");
        fails("{\"type\": \"Feature\"}", 1, 10, "expected \"type\": \"FeatureCollection\"");
        fails("{\"type\": \"FeatureCollection\", \"features\": []}", 0, 0, "at least one tide zone");
    }
}
