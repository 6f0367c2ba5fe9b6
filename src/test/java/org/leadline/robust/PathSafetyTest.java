package org.leadline.robust;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.leadline.cli.Main;
import org.leadline.pipeline.OutputFolder;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

/**
 * Path safety (issue 8, docs/reliability.md): a run writes only inside {@code --out}, under fixed
 * names; names in a project file that leave the project folder are refused through the command
 * (the catalogue has the {@code ..} and absolute cases; here a project that names a file beside it
 * through a path that climbs out and back in, and one that tries the output folder's staging name).
 */
class PathSafetyTest {
    @TempDir
    Path tmp;

    record Run(int code, String out, String err) {}

    static Run run(String... args) {
        StringWriter o = new StringWriter(), e = new StringWriter();
        int code = Main.run(args, new PrintWriter(o, true), new PrintWriter(e, true));
        return new Run(code, o.toString(), e.toString());
    }

    static Path good() { return BadInputCatalogueTest.catalogueDir().resolve("good"); }

    static Path copyGood(Path to) throws Exception {
        Files.createDirectories(to);
        try (Stream<Path> s = Files.list(good())) {
            for (Path p : s.toList()) Files.copy(p, to.resolve(p.getFileName()));
        }
        return to;
    }

    @Test
    void aRunWritesOnlyTheFixedNamesInsideOut() throws Exception {
        Path work = tmp.resolve("work");
        Files.createDirectories(work);
        Path out = work.resolve("out");
        Run r = run("process", "--quiet", "--cell", "2", "--soundings", good().resolve("pings.csv").toString(),
                "--cast", good().resolve("cast.csv").toString(), "--tide", good().resolve("tide.csv").toString(),
                "--vessel", good().resolve("vessel.yaml").toString(), "--out", out.toString());
        assertThat(r.code()).as(r.err()).isZero();
        try (Stream<Path> s = Files.walk(work)) {
            List<String> all = s.map(p -> work.relativize(p).toString()).filter(n -> !n.isEmpty()).sorted().toList();
            assertThat(all).containsExactly("out", "out/contours.geojson", "out/lineage.json", "out/report-profiles.png",
                    "out/report-surface.png", "out/report-tpu.png", "out/report.html", "out/selected-soundings.geojson",
                    "out/soundings.csv", "out/surface.tif", "out/surface.xyz");
        }
    }

    @Test
    void outputNamesCannotLeaveTheFolder() throws Exception {
        Path out = tmp.resolve("o");
        try (OutputFolder f = OutputFolder.open(out)) {
            for (String bad : List.of("../x.csv", "a/b.csv", "..", ".", "", "..\\x", OutputFolder.MARKER)) {
                assertThatThrownBy(() -> f.stage(bad)).as(bad).isInstanceOf(IllegalArgumentException.class);
            }
            assertThat(f.stage("soundings.csv").getParent().getParent()).isEqualTo(out);
        }
        try (Stream<Path> s = Files.list(out)) {
            assertThat(s.toList()).as("staging folder removed on close").isEmpty();
        }
    }

    @Test
    void projectNamesThatClimbOutAreRefusedEvenWhenTheyComeBackIn() throws Exception {
        Path proj = copyGood(tmp.resolve("survey"));
        Path yaml = proj.resolve("p.yaml");
        Files.writeString(yaml, "inputs:\n  soundings: ../survey/pings.csv\n");
        Run r = run("process", yaml.toString(), "--quiet", "--out", tmp.resolve("out").toString());
        assertThat(r.code()).isEqualTo(Main.BAD_INPUT);
        assertThat(r.err()).isEqualTo("leadline: " + yaml + ":2:14: 'soundings': expected a path inside the project"
                + " folder, found '..' in '../survey/pings.csv'" + System.lineSeparator());
        assertThat(tmp.resolve("out")).doesNotExist();
    }

    @Test
    void windowsDriveAndHomePathsAreRefusedToo() throws Exception {
        Path proj = copyGood(tmp.resolve("survey"));
        for (String name : List.of("C:\\\\data\\\\pings.csv", "~/pings.csv", "sub\\\\..\\\\..\\\\pings.csv")) {
            Path yaml = proj.resolve("p.yaml");
            Files.writeString(yaml, "inputs:\n  soundings: \"" + name + "\"\n");
            Run r = run("process", yaml.toString(), "--quiet", "--out", tmp.resolve("out").toString());
            assertThat(r.code()).as(name).isEqualTo(Main.BAD_INPUT);
            assertThat(r.err()).startsWith("leadline: " + yaml + ":2:14: 'soundings': expected a path");
        }
        assertThat(tmp.resolve("out")).doesNotExist();
    }

    @Test
    void anOutputFolderThatIsAFileIsBadInput() throws Exception {
        Path file = Files.writeString(tmp.resolve("taken"), "not a folder");
        Run r = run("process", "--quiet", "--soundings", good().resolve("pings.csv").toString(), "--out", file.toString());
        assertThat(r.code()).isEqualTo(Main.BAD_INPUT);
        assertThat(r.err()).isEqualTo("leadline: " + file + ": --out: expected a folder, found a file" + System.lineSeparator());
        Run below = run("process", "--quiet", "--soundings", good().resolve("pings.csv").toString(),
                "--out", file.resolve("sub").toString());
        assertThat(below.code()).isEqualTo(Main.BAD_INPUT);
        assertThat(Files.readString(file)).isEqualTo("not a folder");
    }
}
