package org.leadline.cli;

import org.leadline.io.CastReader;
import org.leadline.io.InputException;
import org.leadline.watercolumn.Cast;
import org.leadline.watercolumn.CastQc;
import org.leadline.watercolumn.DerivedProfile;
import org.leadline.watercolumn.ProfileBuilder;
import org.leadline.watercolumn.SoundSpeedEquation;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;

/**
 * {@code cast F [--equation ...] [--latitude DEG] [--step M] [--extend-to M]}: prints the derived
 * sound-speed profile of a cast as CSV {@code depth,pressure,temperature,salinity,sound_speed} on
 * standard output; warnings go to standard error as {@code # warning: ...} lines.
 */
@Command(name = "cast", mixinStandardHelpOptions = true,
        description = "Derive the sound-speed profile of a cast (QC, 1 m bins by default) and print it as CSV.")
public final class CastCommand implements Callable<Integer> {
    @CommandLine.Spec
    CommandLine.Model.CommandSpec spec;

    @Parameters(index = "0", paramLabel = "F", description = "Cast CSV file (docs/formats/cast.md).")
    Path file;

    @Option(names = "--equation", paramLabel = "NAME", defaultValue = "unesco",
            description = "Sound-speed equation: unesco, del-grosso, mackenzie or coppens (default ${DEFAULT-VALUE}).")
    String equation;

    @Option(names = "--latitude", paramLabel = "DEG",
            description = "Latitude for pressure <-> depth when the cast has none (default 45 with a warning).")
    Double latitude;

    @Option(names = "--step", paramLabel = "M", description = "Depth bin, m; 0 keeps the samples (default 1).")
    Double step;

    @Option(names = "--extend-to", paramLabel = "M",
            description = "Extend the profile to this depth, m, holding the deepest sound speed constant.")
    Double extendTo;

    @Override
    public Integer call() {
        SoundSpeedEquation eq;
        try {
            eq = SoundSpeedEquation.parse(equation);
        } catch (IllegalArgumentException e) {
            throw new CommandLine.ParameterException(spec.commandLine(), "--equation: " + e.getMessage());
        }
        CastQc.Settings settings = CastQc.Settings.DEFAULTS;
        if (step != null) {
            if (!(step >= 0)) throw new CommandLine.ParameterException(spec.commandLine(), "--step must be 0 or positive, found " + step);
            settings = settings.withBinStep(step);
        }
        if (extendTo != null) settings = settings.withExtendToDepth(extendTo);
        if (latitude != null && !(latitude >= -90 && latitude <= 90)) {
            throw new CommandLine.ParameterException(spec.commandLine(), "--latitude must be in -90..90, found " + latitude);
        }
        Cast cast = CastReader.read(file);
        DerivedProfile d;
        try {
            d = ProfileBuilder.build(cast, eq, latitude == null ? Double.NaN : latitude, settings);
        } catch (IllegalArgumentException e) {
            throw new InputException(file, e.getMessage());
        }
        PrintWriter out = spec.commandLine().getOut();
        PrintWriter err = spec.commandLine().getErr();
        out.println("depth,pressure,temperature,salinity,sound_speed");
        for (int i = 0; i < d.size(); i++) {
            out.println(String.format(Locale.ROOT, "%.3f,%.3f,%s,%s,%.3f", d.depth()[i], d.pressure()[i],
                    fixed(d.temperature()[i]), fixed(d.salinity()[i]), d.soundSpeed()[i]));
        }
        out.flush();
        for (String w : d.warnings()) err.println("# warning: " + w);
        if (!d.rejections().isEmpty()) {
            err.println("# warning: " + d.rejections().size() + " of " + cast.size()
                    + " samples not used (soak, upcast, reversals, non-physical values, spikes)");
        }
        err.flush();
        return Main.OK;
    }

    /** Four decimals, or empty for a value the cast did not have. */
    private static String fixed(double v) {
        return Double.isNaN(v) ? "" : String.format(Locale.ROOT, "%.4f", v);
    }
}
