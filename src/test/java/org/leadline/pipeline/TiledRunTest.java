package org.leadline.pipeline;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.leadline.bench.SwathDayGenerator;
import org.leadline.io.InputException;
import org.leadline.io.PingFiles;
import org.leadline.io.ProjectReader;
import org.leadline.survey.Project;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

/**
 * Processing in tiles ({@link TiledRun}, for days larger than the heap) against the in-memory run
 * on the same input: soundings.csv, surface.tif, surface.xyz and contours.geojson must be the same
 * bytes, and the report's uncertainty, S-44, cleaning and crossline sections the same text. Small
 * chunks (a few thousand rows) and small tiles make the test cut survey lines across chunks and
 * cut the survey into tiles whose margins overlap the data, so it fails if a decision near a chunk
 * or tile edge depends on soundings the tile does not hold.
 */
class TiledRunTest {
    static final List<String> SAME_BYTES = List.of("soundings.csv", "surface.tif", "surface.xyz", "contours.geojson");

    static Path sampleMemory, sampleTiled, dayMemory, dayTiled;

    @BeforeAll
    static void run(@TempDir Path dir) throws Exception {
        Project sample = ProjectReader.read(Path.of("sample-surveys/harbour-approach/project.yaml"));
        sampleMemory = dir.resolve("sample-memory");
        sampleTiled = dir.resolve("sample-tiled");
        new ProcessingRun(sample, Progress.NONE).run(sampleMemory);
        tiled(Map.of("leadline.tiles.chunk-rows", "7000", "leadline.tiles.tile-m", "300"),
                () -> new ProcessingRun(sample, Progress.NONE).run(sampleTiled));

        // a swath day in the binary ping format: chunks of the .lpb reader, 4 lines of 1000 m
        Path day = dir.resolve("day");
        SwathDayGenerator.write(day, 400_000, 64, 7, false, true);
        Project p = ProjectReader.read(day.resolve("project.yaml"));
        dayMemory = dir.resolve("day-memory");
        dayTiled = dir.resolve("day-tiled");
        new ProcessingRun(p, Progress.NONE).run(dayMemory);
        tiled(Map.of("leadline.tiles.chunk-rows", "30000", "leadline.tiles.tile-m", "250"),
                () -> new ProcessingRun(p, Progress.NONE).run(dayTiled));
    }

    interface Run { void run() throws Exception; }

    static void tiled(Map<String, String> props, Run r) throws Exception {
        System.setProperty("leadline.tiles", "always");
        props.forEach(System::setProperty);
        try {
            r.run();
        } finally {
            System.clearProperty("leadline.tiles");
            props.keySet().forEach(System::clearProperty);
        }
    }

    @Test
    void sampleSurveyGivesTheSameOutputsInTiles() throws Exception {
        for (String f : SAME_BYTES) {
            assertThat(Files.mismatch(sampleMemory.resolve(f), sampleTiled.resolve(f))).as(f).isEqualTo(-1L);
        }
        assertThat(reportSections(sampleTiled)).isEqualTo(reportSections(sampleMemory));
        assertThat(Files.readString(sampleTiled.resolve("report.html"))).contains("processed in 6 tiles of 300 m");
        assertThat(sampleTiled.resolve("tiles.tmp")).doesNotExist();
    }

    @Test
    void binarySwathDayGivesTheSameOutputsInTiles() throws Exception {
        for (String f : SAME_BYTES) {
            assertThat(Files.mismatch(dayMemory.resolve(f), dayTiled.resolve(f))).as(f).isEqualTo(-1L);
        }
        assertThat(reportSections(dayTiled)).isEqualTo(reportSections(dayMemory));
    }

    @Test
    void selectionTileByTileKeepsTheShoalGuarantee() throws Exception {
        // tile by tile the selection may hold a few more soundings near tile edges, never fewer
        int mem = features(sampleMemory.resolve("selected-soundings.geojson"));
        int til = features(sampleTiled.resolve("selected-soundings.geojson"));
        assertThat(til).isGreaterThanOrEqualTo(mem).isLessThan((int) (mem * 1.2));
    }

    @Test
    void cubeIsRefusedInTilesWithAClearMessage(@TempDir Path dir) throws Exception {
        Path day = dir.resolve("day");
        SwathDayGenerator.write(day, 20_000, 64, 3, true, false);
        Path yaml = day.resolve("project.yaml");
        Files.writeString(yaml, Files.readString(yaml).replace("surface: median", "surface: cube"));
        Project p = ProjectReader.read(yaml);
        assertThatThrownBy(() -> tiled(Map.of(), () -> new ProcessingRun(p, Progress.NONE).run(dir.resolve("out"))))
                .isInstanceOf(InputException.class).hasMessageContaining("surface cube needs the whole day in memory");
        assertThat(dir.resolve("out").resolve("soundings.csv")).doesNotExist();
    }

    @Test
    void badRowInALateChunkStopsWithTheLineAndLeavesNoOutputs(@TempDir Path dir) throws Exception {
        Path day = dir.resolve("day");
        SwathDayGenerator.write(day, 20_000, 64, 3, true, false);
        Path csv = day.resolve("pings.csv");
        List<String> rows = new java.util.ArrayList<>(Files.readAllLines(csv));
        int bad = rows.size() - 100;                       // a row in the last chunk
        String[] f = rows.get(bad).split(",", -1);
        f[1] = "95.0";                                     // latitude beyond 90
        rows.set(bad, String.join(",", f));
        Files.write(csv, rows);
        Project p = ProjectReader.read(day.resolve("project.yaml"));
        Path out = dir.resolve("out");
        assertThatThrownBy(() -> tiled(Map.of("leadline.tiles.chunk-rows", "3000"),
                () -> new ProcessingRun(p, Progress.NONE).run(out)))
                .isInstanceOf(InputException.class)
                .hasMessageContaining("pings.csv:" + (bad + 1) + ":2: expected a latitude in [-90, 90] degrees, found 95.0");
        try (var files = Files.list(out)) {
            assertThat(files.toList()).as("nothing written or half-written").isEmpty();
        }
    }

    @Test
    void rowEstimatesForTheChoiceOfTiles(@TempDir Path dir) throws Exception {
        SwathDayGenerator.write(dir, 50_000, 64, 5, true, true);
        int rows = PingFiles.read(dir.resolve("pings.csv"), false).size;
        assertThat(PingFiles.estimateRows(dir.resolve("pings.lpb"))).isEqualTo(rows); // the header's count
        assertThat((double) PingFiles.estimateRows(dir.resolve("pings.csv"))).isCloseTo(rows, org.assertj.core.data.Percentage.withPercentage(3));
    }

    /** The report from the uncertainty section on, without the tiling note (the same science must give the same text). */
    static String reportSections(Path out) throws Exception {
        String h = Files.readString(out.resolve("report.html"));
        h = h.substring(h.indexOf("<h2 id=\"tpu\">") >= 0 ? h.indexOf("<h2 id=\"tpu\">") : h.indexOf("<h2"));
        return h.replaceAll("<li>processed in \\d+ tiles[^<]*</li>", "");
    }

    static int features(Path geojson) throws Exception {
        String s = Files.readString(geojson);
        int k = 0;
        for (int i = s.indexOf("\"Feature\""); i >= 0; i = s.indexOf("\"Feature\"", i + 1)) k++;
        return k;
    }
}
