package org.leadline.pipeline;

import static org.assertj.core.api.Assertions.assertThat;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.ForkJoinPool;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.leadline.bench.SwathDayGenerator;
import org.leadline.io.ProjectReader;
import org.leadline.survey.Project;

/**
 * The whole chain gives byte-identical outputs with one and with two worker threads: parallel CSV
 * ranges (made tiny here so that there are many), reduction chunks, cleaning runs, gridding rows and
 * the parallel soundings.csv formatting all combine their parts in a fixed order. Also checks that
 * the binary ping file of the same day gives the same outputs as its CSV.
 */
class ThreadCountDeterminismTest {
    @TempDir Path dir;

    private static void runIn(int threads, Project p, Path out) throws Exception {
        ForkJoinPool pool = new ForkJoinPool(threads);
        try {
            pool.submit(() -> {
                new ProcessingRun(p, Progress.NONE).run(out);
                return null;
            }).get();
        } finally {
            pool.shutdown();
        }
    }

    @Test
    void oneAndTwoThreadsGiveTheSameBytes() throws Exception {
        Path day = dir.resolve("day");
        SwathDayGenerator.write(day, 24_000, 32, 5, true, true);
        Project csv = ProjectReader.read(day.resolve("project.yaml"));
        Project lpb = csv.toBuilder().soundings(java.util.List.of(day.resolve("pings.lpb"))).build();
        String old = System.getProperty("leadline.csv.rangeBytes");
        System.setProperty("leadline.csv.rangeBytes", "65536");
        try {
            runIn(1, csv, dir.resolve("one"));
            runIn(2, csv, dir.resolve("two"));
            runIn(2, lpb, dir.resolve("lpb"));
        } finally {
            if (old == null) System.clearProperty("leadline.csv.rangeBytes");
            else System.setProperty("leadline.csv.rangeBytes", old);
        }
        for (String f : new String[]{"soundings.csv", "surface.tif", "surface.xyz", "contours.geojson"}) {
            byte[] one = Files.readAllBytes(dir.resolve("one").resolve(f));
            assertThat(one.length).as(f).isGreaterThan(1000);
            assertThat(Files.readAllBytes(dir.resolve("two").resolve(f))).as(f + ", 1 vs 2 threads").isEqualTo(one);
            assertThat(Files.readAllBytes(dir.resolve("lpb").resolve(f))).as(f + ", CSV vs binary pings").isEqualTo(one);
        }
        // the day is a real swath day: 24 000 soundings
        long rows = Files.lines(dir.resolve("one").resolve("soundings.csv")).count() - 1;
        assertThat(rows).isEqualTo(24_000);
    }
}
