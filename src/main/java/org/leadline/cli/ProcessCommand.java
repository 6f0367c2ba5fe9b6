package org.leadline.cli;

import org.leadline.io.InputException;
import org.leadline.io.ProjectReader;
import org.leadline.pipeline.ProcessingRun;
import org.leadline.survey.Project;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;

/** {@code process}: the whole chain for one project (DESIGN.md section 5). */
@Command(name = "process", mixinStandardHelpOptions = true, sortOptions = false,
        description = {"Reduce soundings to chart datum, estimate uncertainty, clean, grid and export.",
                "Options override the project file. Not for navigation unless validated by a qualified hydrographer."})
final class ProcessCommand implements Callable<Integer> {
    @Parameters(index = "0", arity = "0..1", paramLabel = "PROJECT.yaml", description = "Project file (optional).")
    Path projectFile;

    @Option(names = "--soundings", paramLabel = "F", description = "Ping table CSV (repeatable).") List<Path> soundings = new ArrayList<>();
    @Option(names = "--nmea", paramLabel = "F", description = "NMEA 0183 log (repeatable).") List<Path> nmea = new ArrayList<>();
    @Option(names = "--cast", paramLabel = "F", description = "Cast CSV (repeatable).") List<Path> casts = new ArrayList<>();
    @Option(names = "--navigation", paramLabel = "F", description = "Navigation CSV time,lat,lon.") Path navigation;
    @Option(names = "--attitude", paramLabel = "F", description = "Attitude CSV time,heading,heave,roll,pitch.") Path attitude;
    @Option(names = "--tide", paramLabel = "F", description = "Water levels CSV time,level (m above chart datum).") Path tide;
    @Option(names = "--tide-zones", paramLabel = "F", description = "Tide zones GeoJSON.") Path tideZones;
    @Option(names = "--vessel", paramLabel = "F", description = "Vessel YAML.") Path vessel;
    @Option(names = "--journal", paramLabel = "F", description = "Edit journal to replay.") Path journal;
    @Option(names = "--draft", paramLabel = "M", description = "Transducer draft, m.") Double draft;
    @Option(names = "--sounder-speed", paramLabel = "M/S", description = "Sounder set speed, m/s.") Double sounderSpeed;
    @Option(names = "--cell", paramLabel = "M", description = "Grid cell size, m (default: suggested from depth and beam footprint).") Double cell;
    @Option(names = "--crs", paramLabel = "EPSG:N|auto", description = "Projected CRS of the grid.") String crs;
    @Option(names = "--surface", paramLabel = "METHOD", description = "median|mean|shoalest|weighted|cube") String surface;
    @Option(names = "--order", paramLabel = "ORDER", description = "IHO S-44 order: exclusive|special|1a|1b|2") String order;
    @Option(names = "--equation", paramLabel = "EQ", description = "unesco|del-grosso|mackenzie|coppens") String equation;
    @Option(names = "--cast-selection", paramLabel = "MODE", description = "nearest-time|nearest-distance|interpolate-time") String castSelection;
    @Option(names = "--out", required = true, paramLabel = "DIR", description = "Output folder.") Path out;
    @Option(names = "--quiet", description = "No progress lines.") boolean quiet;

    @Spec CommandSpec spec;

    @Override
    public Integer call() throws Exception {
        checkOutputFolder(out);
        Project project = buildProject();
        return runAndReport(project, out, quiet, spec);
    }

    static int runAndReport(Project project, Path out, boolean quiet, CommandSpec spec) throws Exception {
        var err = spec.commandLine().getErr();
        TerminalProgress progress = new TerminalProgress(err, quiet);
        ProcessingRun.Result r = new ProcessingRun(project, progress).run(out);
        progress.finish();
        var o = spec.commandLine().getOut();
        long acc = r.counts().accepted();
        o.printf(Locale.ROOT, "%d soundings, %d accepted; surface %d x %d cells of %.2f m in %s%n", r.counts().soundings(),
                acc, r.grid().nx, r.grid().ny, r.gridSpec().cell(), r.projection().code());
        o.printf(Locale.ROOT, "%s: %.2f %% of accepted soundings within TVU, %.2f %% within THU%n", r.order().label(),
                r.compliance().pctTvu(), r.compliance().pctThu());
        for (String w : r.warnings()) err.println("warning: " + w);
        o.println("outputs in " + out.toAbsolutePath().normalize());
        o.println("Caution: not for navigation unless validated by a qualified hydrographer.");
        o.flush();
        err.flush();
        return Main.OK;
    }

    /**
     * Refuses an output folder that cannot be one before any work is done: an existing file, or a
     * folder that exists but cannot be written (bad input, exit 2, rather than an internal error
     * after minutes of processing).
     */
    static void checkOutputFolder(Path out) {
        if (java.nio.file.Files.exists(out) && !java.nio.file.Files.isDirectory(out)) {
            throw new InputException(out.toString(), 0, 0, "--out: expected a folder, found a file", null);
        }
        Path existing = out.toAbsolutePath().normalize();
        while (existing != null && !java.nio.file.Files.exists(existing)) existing = existing.getParent();
        if (existing != null && !java.nio.file.Files.isDirectory(existing)) {
            throw new InputException(out.toString(), 0, 0, "--out: expected a folder, found the file " + existing
                    + " in its path", null);
        }
        if (existing != null && !java.nio.file.Files.isWritable(existing)) {
            throw new InputException(out.toString(), 0, 0, "--out: cannot write in " + existing, null);
        }
    }

    private Project buildProject() {
        Project.Builder b = projectFile != null ? ProjectReader.read(projectFile).toBuilder()
                : Project.builder(Path.of("."));
        try {
            if (!soundings.isEmpty()) b.soundings(soundings);
            if (!nmea.isEmpty()) b.nmea(nmea);
            if (!casts.isEmpty()) b.casts(casts);
            if (navigation != null) b.navigation(navigation);
            if (attitude != null) b.attitude(attitude);
            if (tide != null) b.tide(tide);
            if (tideZones != null) b.tideZones(tideZones);
            if (vessel != null) b.vessel(vessel);
            if (journal != null) b.journal(journal);
            if (draft != null) b.draft(draft);
            if (sounderSpeed != null) b.sounderSpeed(sounderSpeed);
            if (cell != null) b.cell(cell);
            if (crs != null) b.crs(crs.equalsIgnoreCase("auto") ? "auto" : crs.toUpperCase(Locale.ROOT));
            if (surface != null) b.surface(surface.toLowerCase(Locale.ROOT));
            if (order != null) b.order(order.toLowerCase(Locale.ROOT));
            if (equation != null) b.equation(equation.toLowerCase(Locale.ROOT));
            if (castSelection != null) b.castSelection(castSelection.toLowerCase(Locale.ROOT));
            return b.build();
        } catch (IllegalArgumentException e) {
            throw new InputException((String) null, 0, 0, "option: " + e.getMessage(), e);
        }
    }
}
