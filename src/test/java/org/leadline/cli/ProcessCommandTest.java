package org.leadline.cli;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.leadline.synthetic.HarbourApproach;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.assertj.core.api.Assertions.assertThat;

/** The process command: outputs of DESIGN.md section 4, exit codes and one-line errors. */
class ProcessCommandTest {
    static Path survey;

    @BeforeAll
    static void generate(@TempDir Path tmp) throws Exception {
        survey = HarbourApproach.write(tmp.resolve("survey"), HarbourApproach.Options.exact(1)).project();
    }

    record Run(int code, String out, String err) {}

    static Run run(String... args) {
        StringWriter out = new StringWriter(), err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new Run(code, out.toString(), err.toString());
    }

    @Test
    void writesEveryOutput(@TempDir Path out) throws Exception {
        Run r = run("process", survey.toString(), "--out", out.toString(), "--quiet", "--surface", "weighted", "--cell", "2.5");
        assertThat(r.code()).as(r.err()).isZero();
        for (String f : new String[]{"soundings.csv", "surface.tif", "surface.xyz", "contours.geojson",
                "selected-soundings.geojson", "report.html", "lineage.json"}) {
            assertThat(out.resolve(f)).as(f).exists();
        }
        assertThat(Files.readAllLines(out.resolve("soundings.csv")).get(0))
                .isEqualTo("time,line,beam,lat,lon,easting,northing,depth,tvu,thu,status,reason");
        String lineage = Files.readString(out.resolve("lineage.json"));
        assertThat(lineage).contains("\"surface\" : \"weighted\"").contains("\"cell_m\" : 2.5").contains("sha256");
        // no staging folder left behind
        try (var s = Files.list(out)) {
            assertThat(s.filter(p -> p.getFileName().toString().startsWith(".leadline")).count()).isZero();
        }
        assertThat(r.out()).contains("Caution: not for navigation");
    }

    @Test
    void missingFileIsBadInput(@TempDir Path out) {
        Run r = run("process", "--soundings", out.resolve("nope.csv").toString(), "--out", out.resolve("o").toString(), "--quiet");
        assertThat(r.code()).isEqualTo(2);
        assertThat(r.err().strip().lines().count()).isEqualTo(1);
        assertThat(r.err()).contains("nope.csv").doesNotContain("Exception");
        assertThat(out.resolve("o")).doesNotExist();
    }

    @Test
    void unknownCrsIsBadInput(@TempDir Path out) {
        Run r = run("process", survey.toString(), "--crs", "EPSG:999999", "--out", out.resolve("o").toString(), "--quiet");
        assertThat(r.code()).as(r.err()).isEqualTo(2);
        assertThat(r.err()).contains("999999").doesNotContain("\tat ");
    }

    @Test
    void unknownSurfaceMethodIsBadInput(@TempDir Path out) {
        Run r = run("process", survey.toString(), "--surface", "kriging", "--out", out.toString());
        assertThat(r.code()).isEqualTo(2);
        assertThat(r.err()).contains("kriging");
    }
}
