package org.leadline.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Path;

import static org.assertj.core.api.Assertions.assertThat;

/** {@code leadline workbench} where no window can open (surefire runs headless, pom.xml). */
class WorkbenchCommandTest {
    @TempDir Path dir;

    @Test
    void missingProjectIsBadInput() {
        CastCommandTest.Run r = CastCommandTest.run("workbench", dir.resolve("none.yaml").toString());
        assertThat(r.code()).isEqualTo(Main.BAD_INPUT);
        assertThat(r.err()).contains("none.yaml: file not found").doesNotContain("Exception");
    }

    @Test
    void withoutADisplayItSaysSo() {
        org.junit.jupiter.api.Assumptions.assumeTrue(java.awt.GraphicsEnvironment.isHeadless());
        CastCommandTest.Run r = CastCommandTest.run("workbench");
        assertThat(r.code()).isEqualTo(Main.INTERNAL_ERROR);
        assertThat(r.err()).contains("the workbench needs a graphical display");
    }

    @Test
    void listedInTheHelp() {
        CastCommandTest.Run r = CastCommandTest.run("--help");
        assertThat(r.out()).contains("workbench");
    }
}
