package org.leadline.cli;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.leadline.watercolumn.PressureDepth;
import org.leadline.watercolumn.SoundSpeedEquation;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

class CastCommandTest {
    @TempDir
    Path dir;

    record Run(int code, String out, String err) {}

    static Run run(String... args) {
        StringWriter out = new StringWriter(), err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out, true), new PrintWriter(err, true));
        return new Run(code, out.toString(), err.toString());
    }

    static Path estuaryCast() throws Exception {
        return Path.of(CastCommandTest.class.getResource("/casts/estuary-ctd.csv").toURI());
    }

    @Test
    void printsTheProfileOfAConductivityCast() throws Exception {
        Run r = run("cast", estuaryCast().toString());
        assertThat(r.code()).as(r.err()).isEqualTo(0);
        String[] lines = r.out().split("\\R");
        assertThat(lines[0]).isEqualTo("depth,pressure,temperature,salinity,sound_speed");
        // the cast (scripts/testdata/MakeEstuaryCast.java) is brackish and warm at the top: S ~6.5, T ~17.4
        String[] f = lines[1].split(",");
        assertThat(f).hasSize(5);
        assertThat(f[0]).matches("\\d+\\.\\d{3}");
        assertThat(f[2]).matches("\\d+\\.\\d{4}");
        assertThat(f[3]).matches("\\d+\\.\\d{4}");
        assertThat(f[4]).matches("\\d+\\.\\d{3}");
        double z = Double.parseDouble(f[0]), p = Double.parseDouble(f[1]), t = Double.parseDouble(f[2]),
                s = Double.parseDouble(f[3]), c = Double.parseDouble(f[4]);
        assertThat(z).isBetween(0.0, 1.0);
        assertThat(p).isCloseTo(PressureDepth.pressure(z, 53.55), within(0.001));
        assertThat(t).isBetween(17.0, 17.5);
        assertThat(s).isBetween(6.0, 7.0);
        // the printed speed is UNESCO's at the printed T, S (bin means) to within rounding and bin averaging
        assertThat(c).isCloseTo(SoundSpeedEquation.UNESCO.speed(t, s, p, z), within(0.05));
        // bins every metre down to the deepest sample, then stop (no upcast)
        double[] depths = Arrays.stream(lines).skip(1).mapToDouble(l -> Double.parseDouble(l.split(",")[0])).toArray();
        assertThat(depths[depths.length - 1]).isEqualTo(24.0);
        for (int i = 1; i < depths.length; i++) assertThat(depths[i] - depths[i - 1]).isCloseTo(1.0, within(1e-9));
        assertThat(r.err()).contains("# warning: ").contains("samples not used");
    }

    @Test
    void optionsChangeEquationStepAndExtension() throws Exception {
        Run r = run("cast", estuaryCast().toString(), "--equation", "mackenzie", "--step", "2", "--extend-to", "40");
        assertThat(r.code()).as(r.err()).isEqualTo(0);
        String[] lines = r.out().split("\\R");
        assertThat(lines[lines.length - 1]).startsWith("40.000,");
        assertThat(lines[2]).startsWith("2.000,");
        assertThat(r.err()).contains("# warning: Mackenzie 1981 is used outside its stated validity range")
                .contains("# warning: extended from 24.0 m to 40.0 m");
    }

    @Test
    void badFileGivesExitTwoAndOneLine() throws Exception {
        Path bad = dir.resolve("bad.csv");
        Files.writeString(bad, "depth,temperature,salinity\n1,10,35\n2,ten,35\n");
        Run r = run("cast", bad.toString());
        assertThat(r.code()).isEqualTo(2);
        assertThat(r.out()).isEmpty();
        assertThat(r.err().strip().lines()).hasSize(1);
        assertThat(r.err()).contains(bad.toString()).contains(":3:2:").contains("expected a number, found 'ten'");

        Run missing = run("cast", dir.resolve("nope.csv").toString());
        assertThat(missing.code()).isEqualTo(2);
        assertThat(missing.err().strip().lines()).hasSize(1);

        Run eq = run("cast", bad.toString(), "--equation", "wilson");
        assertThat(eq.code()).isEqualTo(2);
        assertThat(eq.err()).contains("unesco, del-grosso, mackenzie, coppens");
    }
}
