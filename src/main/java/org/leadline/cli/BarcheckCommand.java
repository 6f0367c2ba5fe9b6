package org.leadline.cli;

import org.leadline.io.BarCheckReader;
import org.leadline.reduction.BarCheck;
import picocli.CommandLine.Command;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;

/** {@code barcheck F}: fits index correction and sound-speed scale from a bar check table. */
@Command(name = "barcheck", mixinStandardHelpOptions = true,
        description = "Fit index correction and sound-speed scale from a bar check table (bar_depth,reading).")
final class BarcheckCommand implements Callable<Integer> {
    @Parameters(index = "0", paramLabel = "FILE", description = "Bar check CSV: bar_depth,reading (m).")
    Path file;

    @Spec CommandSpec spec;

    @Override
    public Integer call() throws Exception {
        BarCheckReader.Table t = BarCheckReader.read(file);
        BarCheck.Result r = BarCheck.fit(t.barDepth(), t.reading());
        PrintWriter out = spec.commandLine().getOut();
        out.printf(Locale.ROOT, "index_correction_m,%.4f,standard_error_m,%.4f%n", r.indexCorrection(), r.indexCorrectionSe());
        out.printf(Locale.ROOT, "sound_speed_scale,%.6f,standard_error,%.6f%n", r.scale(), r.scaleSe());
        if (Double.isFinite(t.setSpeed())) {
            out.printf(Locale.ROOT, "implied_mean_sound_speed_m_s,%.2f%n", r.impliedSoundSpeed(t.setSpeed()));
        }
        out.printf(Locale.ROOT, "rms_residual_m,%.4f%n", r.rms());
        out.println("bar_depth,reading,corrected,residual");
        for (int i = 0; i < t.barDepth().length; i++) {
            out.printf(Locale.ROOT, "%.3f,%.3f,%.3f,%.4f%n", t.barDepth()[i], t.reading()[i],
                    r.correct(t.reading()[i]), r.residuals()[i]);
        }
        out.flush();
        return Main.OK;
    }
}
