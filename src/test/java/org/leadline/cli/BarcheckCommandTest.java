package org.leadline.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.assertj.core.api.Assertions.assertThat;

class BarcheckCommandTest {

    @Test
    void printsFitAndResiduals() {
        StringWriter out = new StringWriter(), err = new StringWriter();
        int code = Main.run(new String[]{"barcheck", "src/test/resources/barcheck/launch-barcheck.csv"},
                new PrintWriter(out), new PrintWriter(err));
        assertThat(code).isZero();
        // slope 40.56/41.12792 = 0.986191 (worked by hand in BarCheckTest)
        assertThat(out.toString()).contains("sound_speed_scale,0.986191").contains("implied_mean_sound_speed_m_s,1479.29");
    }

    @Test
    void badNumberIsExitTwoWithLocation(@TempDir Path dir) throws Exception {
        Path f = dir.resolve("bar.csv");
        Files.writeString(f, "bar_depth,reading\n2,2.01\n4,four\n");
        StringWriter out = new StringWriter(), err = new StringWriter();
        int code = Main.run(new String[]{"barcheck", f.toString()}, new PrintWriter(out), new PrintWriter(err));
        assertThat(code).isEqualTo(2);
        assertThat(err.toString().strip()).isEqualTo("leadline: " + f + ":3:2: expected a number for 'reading', found 'four'");
    }
}
