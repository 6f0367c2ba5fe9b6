package org.leadline.report;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.leadline.io.ProjectReader;
import org.leadline.pipeline.ProcessingRun;
import org.leadline.pipeline.Progress;
import org.leadline.survey.Project;
import org.leadline.synthetic.HarbourApproach;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;

import static org.assertj.core.api.Assertions.assertThat;

/** The processing report: every section present, its numbers from the run, and they follow the inputs. */
class ReportWriterTest {
    static Path dir;
    static String first, second;
    static ProcessingRun.Result r1, r2;

    @BeforeAll
    static void runTwice(@TempDir Path tmp) throws Exception {
        dir = tmp;
        Path project = HarbourApproach.write(tmp.resolve("survey"), HarbourApproach.Options.exact(2)).project();
        Project p = ProjectReader.read(project);
        r1 = new ProcessingRun(p, Progress.NONE).run(tmp.resolve("out1"));
        // the same survey with the draft mis-stated by 0.25 m and another order
        Project changed = p.toBuilder().draft(0.87).order("1a").build();
        r2 = new ProcessingRun(changed, Progress.NONE).run(tmp.resolve("out2"));
        first = Files.readString(tmp.resolve("out1/report.html"));
        second = Files.readString(tmp.resolve("out2/report.html"));
    }

    @Test
    void everySectionIsPresent() {
        for (String id : new String[]{"summary", "inputs", "casts", "corrections", "tpu", "s44", "cleaning",
                "crosslines", "surface", "holidays"}) {
            assertThat(first).as(id).contains("id=\"" + id + "\"");
        }
        assertThat(first).contains("Not for navigation unless validated by a qualified hydrographer");
        assertThat(first).contains("data:image/png;base64,");
        assertThat(dir.resolve("out1/report-surface.png")).exists();
        assertThat(dir.resolve("out1/report-tpu.png")).exists();
        assertThat(dir.resolve("out1/report-profiles.png")).exists();
    }

    @Test
    void numbersComeFromTheRun() throws Exception {
        var s = r1.soundings();
        assertThat(first).contains(s.size + " (" + s.countAccepted() + " accepted");
        assertThat(first).contains(String.format(Locale.ROOT, "%.2f %% of %d accepted soundings within the TVU limit",
                r1.compliance().pctTvu(), r1.compliance().evaluated()));
        assertThat(first).contains(org.leadline.io.LineageWriter.sha256(dir.resolve("survey/pings/swath.csv")));
        assertThat(first).contains("Lines X1, X2, X3 against the main-scheme surface");
    }

    @Test
    void reportFollowsTheInputs() {
        assertThat(first).contains("Transducer draft</th><td style=\"text-align:left\">0.620 m");
        assertThat(second).contains("Transducer draft</th><td style=\"text-align:left\">0.870 m");
        assertThat(first).contains("IHO S-44 compliance: Special Order");
        assertThat(second).contains("IHO S-44 compliance: Order 1a");
        // a 0.25 m draft change moves every depth by 0.25 m, plus a fraction of a millimetre because
        // the ray now starts deeper in the halocline (different start speed)
        assertThat(r2.soundings().depth[0] - r1.soundings().depth[0]).isCloseTo(0.25, org.assertj.core.api.Assertions.within(1e-3));
        assertThat(first).isNotEqualTo(second);
    }
}
