package org.leadline.pipeline;

import org.leadline.cleaning.Cleaner;
import org.leadline.cleaning.CleaningSettings;
import org.leadline.cleaning.CleaningStats;
import org.leadline.cleaning.Edit;
import org.leadline.cleaning.EditJournal;
import org.leadline.io.EditJournalFile;
import org.leadline.io.GeoJsonWriter;
import org.leadline.io.GeoTiffWriter;
import org.leadline.io.LineageWriter;
import org.leadline.io.SoundingsCsvWriter;
import org.leadline.io.XyzWriter;
import org.leadline.raypath.CastSelector;
import org.leadline.raypath.RayTable;
import org.leadline.reduction.Reducer;
import org.leadline.survey.Project;
import org.leadline.survey.SoundingTable;
import org.leadline.surface.Contours;
import org.leadline.surface.Coverage;
import org.leadline.surface.Grid;
import org.leadline.surface.GridSpec;
import org.leadline.surface.Gridder;
import org.leadline.surface.MapProjection;
import org.leadline.surface.SoundingSelection;
import org.leadline.uncertainty.Compliance;
import org.leadline.uncertainty.ComplianceSummary;
import org.leadline.uncertainty.CrosslineCheck;
import org.leadline.uncertainty.CrosslineResult;
import org.leadline.uncertainty.S44Order;
import org.leadline.uncertainty.TpuModel;
import org.leadline.uncertainty.TpuSummary;
import org.leadline.watercolumn.SoundSpeedProfile;

import java.io.IOException;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * One processing run of a project: read and merge, reduce (ray bending, draft, settlement,
 * heave, lever arms, water level), estimate TPU, clean (automatic filters then the reviewer's
 * edit journal), grid, check against the IHO S-44 order and the crosslines, and write every output
 * (DESIGN.md section 4) into an output folder so that a failed run never leaves a half-written
 * file under a final name ({@link OutputFolder}).
 */
public final class ProcessingRun {
    private final Project project;
    private final Progress progress;

    public ProcessingRun(Project project, Progress progress) {
        this.project = project;
        this.progress = progress == null ? Progress.NONE : progress;
    }

    /** The in-memory result of a run (everything the report and the workbench show). */
    public record Result(SurveyInputs inputs, SoundingTable soundings, MapProjection projection, Grid grid,
                         GridSpec gridSpec, Gridder.Method method, Coverage coverage, List<Contours.Polyline> contours,
                         SelectedSoundings selected, TpuSummary tpu, ComplianceSummary compliance, S44Order order,
                         CleaningStats cleaning, int journalEdits, CrosslineResult crosslines, List<String> crosslineLines,
                         double[] soundSpeedAtTransducer, List<String> warnings, String started,
                         SoundingCounts counts) {}

    /**
     * Counts over all soundings of a run (what the report and the lineage say about them).
     *
     * @param byReason rejected soundings per reason code (index {@link SoundingTable.Reason#code})
     * @param castUse  soundings per cast index that used it for ray bending
     */
    public record SoundingCounts(long soundings, long accepted, int lines, long[] byReason, long[] castUse) {
        /** Rejected soundings with this reason. */
        public long rejectedFor(SoundingTable.Reason why) { return byReason[why.code & 0xff]; }

        static SoundingCounts of(SoundingTable s, int casts) {
            long[] by = new long[256], use = new long[Math.max(1, casts)];
            long acc = 0;
            for (int i = 0; i < s.size; i++) {
                if (s.accepted(i)) acc++;
                else by[s.reason[i] & 0xff]++;
                int c = s.cast[i];
                if (c >= 0 && c < use.length) use[c]++;
            }
            return new SoundingCounts(s.size, acc, s.lineNames().size(), by, use);
        }
    }

    /** The shoal-biased selection of soundings for the chart, geographic positions. */
    public record SelectedSoundings(double[] lon, double[] lat, double[] depth, double[] tvu) {
        public int size() { return depth.length; }

        static SelectedSoundings of(SoundingTable s, int[] rows) {
            int m = rows.length;
            double[] lon = new double[m], lat = new double[m], d = new double[m], tvu = new double[m];
            for (int k = 0; k < m; k++) {
                int i = rows[k];
                lon[k] = s.lon[i];
                lat[k] = s.lat[i];
                d[k] = s.depth[i];
                tvu[k] = s.tvu[i];
            }
            return new SelectedSoundings(lon, lat, d, tvu);
        }
    }

    /** Runs the science without writing anything. */
    public Result compute() throws IOException {
        String started = Instant.now().toString();
        Project.Settings set = project.settings();
        SurveyInputs in = SurveyInputs.load(project, progress);
        List<String> warnings = new ArrayList<>(in.warnings);
        int n = in.pings.size;
        checkCancel();

        progress.stage("Choosing casts");
        List<SoundSpeedProfile> profiles = new ArrayList<>();
        for (var d : in.profiles) profiles.add(d.profile());
        if (profiles.isEmpty()) profiles.add(SoundSpeedProfile.constant(in.vessel.sounderSetSpeed()));
        Reducer.CastChoice choice = castChoice(project.settings(), in.casts, in.profiles.size(), in.pings.time, in.lat, in.lon);

        progress.stage("Building ray tables");
        Reducer.BeamTracer[] tracers = buildTracers(in.day, in.vessel, profiles);
        checkCancel();

        progress.stage("Reducing soundings");
        MapProjection projection = configured("crs", () -> MapProjection.parse(set.crs(), in.day.latitudes(), in.day.longitudes()));
        Reducer.MergedInputs merged = new Reducer.MergedInputs(in.lat, in.lon, in.heading, in.heave, in.roll, in.pitch,
                in.sog, in.mergeReason);
        Reducer.WaterLevelAt level = in.waterLevel == null ? (t, la, lo) -> 0.0 : in.waterLevel::level;
        SoundingTable s = new Reducer(in.vessel, false).reduce(in.pings, merged, tracers, choice, level,
                projection::forward);
        checkCancel();

        progress.stage("Estimating uncertainty");
        double[] cTransducer = new double[n];
        double[] zoneSigma = new double[n];
        transducerTerms(s, in.heave, choice.castA(), profiles, in.vessel, in.waterLevel, cTransducer, zoneSigma);
        TpuModel tpu = new TpuModel(in.vessel);
        TpuModel.Computed tpuDone = tpu.compute(s, in.heave, cTransducer, zoneSigma);
        checkCancel();

        progress.stage("Cleaning");
        CleaningSettings cs = configured("cleaning", () -> CleaningSettings.fromMap(set.cleaning()));
        CleaningStats stats = Cleaner.clean(s, in.pings.quality, cs);
        int journalEdits = 0;
        if (project.journal() != null) {
            EditJournalFile.Contents j = EditJournalFile.read(project.journal());
            warnings.addAll(j.warnings());
            List<Edit> edits = j.edits();
            EditJournal.apply(s, edits);
            journalEdits = edits.size();
        }
        TpuSummary tpuSummary = tpu.summarize(tpuDone);   // sums again only what cleaning changed
        S44Order order = S44Order.parse(set.order());
        ComplianceSummary compliance = Compliance.evaluate(s, order).summary(s);
        checkCancel();

        progress.stage("Building surface");
        Gridder.Method method = Gridder.Method.parse(set.surface());
        boolean[] acc = new boolean[n];
        int nAcc = java.util.stream.IntStream.range(0, (n + 65_535) / 65_536).parallel().map(b -> {
            int c = 0;
            for (int i = b * 65_536, end = Math.min(n, (b + 1) * 65_536); i < end; i++) {
                if (acc[i] = s.accepted(i) && Double.isFinite(s.easting[i])) c++;
            }
            return c;
        }).sum();
        if (nAcc == 0) {
            Map<String, Integer> why = new java.util.TreeMap<>();
            for (int i = 0; i < n; i++) why.merge(SoundingTable.Reason.of(s.reason[i]).label, 1, Integer::sum);
            throw new org.leadline.io.InputException((String) null, 0, 0,
                    "no accepted soundings to grid: all " + n + " were rejected " + why
                            + " (check that navigation, attitude and water-level records cover the ping times)", null);
        }
        double cell = Double.isFinite(set.cell()) ? set.cell()
                : GridSpec.suggestCell(select(s.depth, acc), in.vessel.beamWidth());
        if (!Double.isFinite(set.cell())) warnings.add("cell size not set: using the suggested " + cell + " m (from depth and beam footprint)");
        GridSpec spec = coveringAccepted(s, acc, cell);
        Grid grid = Gridder.build(spec, projection.crs(), s.easting, s.northing, s.depth, s.tvu, s.thu, acc, method,
                org.leadline.surface.Cube.Parameters.defaults());
        Coverage coverage = Coverage.of(grid);
        List<Contours.Polyline> contours = contoursOf(grid);
        int[] selected = SoundingSelection.select(s.easting, s.northing, s.depth, acc, Math.max(5 * cell, 10));

        progress.stage("Comparing crosslines");
        List<String> crossNames = new ArrayList<>();
        CrosslineResult cross = compareCrosslines(s, acc, set.crosslines(), spec, projection.crs(), method, order, crossNames);
        return new Result(in, s, projection, grid, spec, method, coverage, contours, SelectedSoundings.of(s, selected),
                tpuSummary, compliance, order, stats, journalEdits, cross, crossNames, cTransducer, warnings, started,
                SoundingCounts.of(s, in.casts.size()));
    }

    /** Runs and writes every output into {@code outDir}; returns the result. */
    public Result run(Path outDir) throws IOException {
        // the inputs are hashed (SHA-256, for lineage and report) on their own thread while the
        // science runs: on a multibeam day that is seconds of reading that need not wait
        java.util.concurrent.ExecutorService hasher = java.util.concurrent.Executors.newSingleThreadExecutor(rn -> {
            Thread t = new Thread(rn, "leadline-input-hashes");
            t.setDaemon(true);
            return t;
        });
        java.util.concurrent.Future<List<LineageWriter.Input>> hashes = hasher.submit(this::hashInputs);
        hasher.shutdown();
        // a day too large for the heap is processed in tiles (TiledRun), writing soundings.csv as it goes
        boolean tiled = TiledRun.wanted(project);
        Result computed = tiled ? null : compute();
        Result r;
        try (OutputFolder out = OutputFolder.open(outDir)) {
            r = tiled ? new TiledRun(project, progress).run(out) : computed;
            // soundings.csv (the largest output, formatted on all cores) is written by a task of its
            // own while this thread writes the surface files, contours, selection and report, which
            // are mostly single-threaded (Deflate, charts). Every file still goes to the staging
            // folder and only the commit below gives final names; the task is always waited for,
            // so nothing writes into the staging folder after it is removed.
            Path csvFile = out.stage("soundings.csv"); // already written by a tiled run
            java.util.concurrent.ForkJoinPool pool = java.util.concurrent.ForkJoinTask.inForkJoinPool()
                    ? java.util.concurrent.ForkJoinTask.getPool() : java.util.concurrent.ForkJoinPool.commonPool();
            // the task keeps its exception itself: a fork/join task rethrows a copy made by reflection
            Throwable[] csvFailure = new Throwable[1];
            java.util.concurrent.ForkJoinTask<?> csv = tiled ? null : pool.submit(() -> {
                try {
                    SoundingsCsvWriter.write(computed.soundings(), csvFile);
                    // to disk now, beside the other writers: the commit's own force then finds
                    // little left to do for the largest file (it still forces every file)
                    try (java.nio.channels.FileChannel ch = java.nio.channels.FileChannel.open(csvFile,
                            java.nio.file.StandardOpenOption.WRITE)) {
                        ch.force(true);
                    }
                } catch (Throwable t) {
                    csvFailure[0] = t;
                }
            });
            Map<String, String> outputs = new LinkedHashMap<>();
            List<LineageWriter.Input> inputs;
            try {
                progress.stage("Writing surface files");
                GeoTiffWriter.write(r.grid(), out.stage("surface.tif"),
                        List.of(Grid.DEPTH, Grid.UNCERTAINTY, Grid.COUNT, Grid.STDDEV),
                        tiffMetadata(r));
                XyzWriter.write(r.grid(), out.stage("surface.xyz"));
                progress.stage("Writing contours and selection");
                writeContours(r, out.stage("contours.geojson"));
                writeSelected(r, out.stage("selected-soundings.geojson"));
                for (String f : List.of("soundings.csv", "surface.tif", "surface.xyz", "contours.geojson",
                        "selected-soundings.geojson")) outputs.put(f, "produced");
                outputs.put("report.html", "produced");
                progress.stage("Writing report");
                inputs = await(hashes);
                org.leadline.report.ReportWriter.write(r, project, inputs, out.stage("report.html"), out);
                if (csv != null) {
                    progress.stage("Writing soundings.csv");
                    csv.join();
                    rethrow(csvFailure[0]);
                }
            } catch (Throwable t) {
                if (csv != null) csv.quietlyJoin();   // its own failure, if any, is secondary to this one
                throw t;
            }
            outputs.put("lineage.json", "produced");
            progress.stage("Writing lineage");
            LineageWriter.write(out.stage("lineage.json"), version(), r.started(), Instant.now().toString(), inputs,
                    settings(r), outputs, r.warnings());
            out.commit();
        }
        return r;
    }

    /** Which cast (profile) each ping uses, by the project's cast-selection mode. */
    static Reducer.CastChoice castChoice(Project.Settings set, List<org.leadline.watercolumn.Cast> casts, int nProfiles,
                                         double[] time, double[] lat, double[] lon) {
        int n = time.length;
        if (nProfiles <= 1) return new Reducer.CastChoice(new int[n], new int[n], null);
        int k = casts.size();
        double[] ct = new double[k], cla = new double[k], clo = new double[k];
        for (int i = 0; i < k; i++) {
            ct[i] = casts.get(i).time();
            cla[i] = casts.get(i).latitude();
            clo[i] = casts.get(i).longitude();
        }
        CastSelector.Mode mode = CastSelector.Mode.parse(set.castSelection());
        CastSelector.Selection sel = CastSelector.select(mode, ct, cla, clo, time, lat, lon);
        return new Reducer.CastChoice(sel.firstColumn(), sel.secondColumn(), sel.weightColumn());
    }

    /**
     * TPU inputs per sounding: the sound speed at the transducer (from the cast the ping used, at
     * the transducer depth) and the tide-zone uncertainty where a zone applies.
     */
    static void transducerTerms(SoundingTable s, double[] heave, int[] castA, List<SoundSpeedProfile> profiles,
                                org.leadline.survey.Vessel vessel, org.leadline.reduction.TideZoning waterLevel,
                                double[] cTransducer, double[] zoneSigma) {
        int n = s.size;
        // rows in parallel blocks, each row written by one task: the same values for any thread count
        java.util.stream.IntStream.range(0, (n + 65_535) / 65_536).parallel().forEach(b -> {
            for (int i = b * 65_536, end = Math.min(n, (b + 1) * 65_536); i < end; i++) {
                int c = Math.max(0, castA[i]);
                double zt = vessel.transducerDraft() - (Double.isNaN(heave[i]) ? 0 : heave[i]);
                cTransducer[i] = profiles.get(c).speedAt(zt);
                zoneSigma[i] = waterLevel != null && Double.isFinite(s.lat[i])
                        && waterLevel.zoneAt(s.lat[i], s.lon[i]) >= 0 ? vessel.sigma().tideZone() : 0;
            }
        });
    }

    /**
     * Contours of the depth layer at a "nice" interval for its range; closed rings around fewer
     * than 4 cells are noise on a flat floor at a contour level, not features a chart would show
     * (common practice: contours are generalised), and are dropped.
     */
    static List<Contours.Polyline> contoursOf(Grid grid) {
        double cell = grid.cell;
        List<Contours.Polyline> contours = new ArrayList<>();
        for (List<Contours.Polyline> l : Contours.trace(grid, contourLevels(grid))) {
            for (Contours.Polyline pl : l) if (!pl.closed() || Math.abs(ringArea(pl)) >= 4 * cell * cell) contours.add(pl);
        }
        return contours;
    }

    /** One ray table per profile, covering the transducer depths, angles and times of this survey. */
    static Reducer.BeamTracer[] buildTracers(DaySummary day, org.leadline.survey.Vessel vessel,
                                             List<SoundSpeedProfile> profiles) {
        double maxT = day.maxOneWayTime(), maxAngle = day.maxAngle();
        double minZ = day.minHeaveDepth(), maxZ = day.maxHeaveDepth();
        double draft = vessel.transducerDraft();
        double settle = 0;
        for (double v : vessel.settlementValues()) settle = Math.max(settle, v);
        double zLo = Math.max(0, draft + minZ - 1.0), zHi = draft + settle + maxZ + 1.0;
        double angle = Math.toRadians(Math.min(80, maxAngle + 2));
        Reducer.BeamTracer[] out = new Reducer.BeamTracer[profiles.size()];
        for (int k = 0; k < out.length; k++) {
            RayTable table = new RayTable(profiles.get(k), zLo, zHi, angle, maxT * 1.05 + 1e-3);
            out[k] = table::lookup;
        }
        return out;
    }

    /** GeoTIFF metadata items in a fixed order (Map.of iterates in an order that changes from one JVM run to the next). */
    private static Map<String, String> tiffMetadata(Result r) {
        Map<String, String> m = new LinkedHashMap<>();
        m.put("LEADLINE_METHOD", r.method().name().toLowerCase());
        m.put("LEADLINE_CAUTION", "Not for navigation unless validated by a qualified hydrographer");
        return m;
    }

    /**
     * Crossline soundings against a surface of the main-scheme soundings (all accepted soundings
     * not on a crossline), gridded on the same spec and by the same method; null when no crossline
     * is named or none has an accepted sounding. Shared by the processing run and the workbench.
     *
     * @param names      line names run as crosslines (project setting)
     * @param crossNames receives the names of the crosslines found in the table
     */
    public static CrosslineResult compareCrosslines(SoundingTable s, boolean[] acc, List<String> names, GridSpec spec,
                                                    org.opengis.referencing.crs.CoordinateReferenceSystem crs,
                                                    Gridder.Method method, S44Order order, List<String> crossNames) {
        if (names == null || names.isEmpty()) return null;
        boolean[] isCross = new boolean[s.lineNames().size()];
        for (int l = 0; l < isCross.length; l++) {
            if (names.contains(s.lineNames().get(l))) {
                isCross[l] = true;
                crossNames.add(s.lineNames().get(l));
            }
        }
        boolean[] main = new boolean[s.size];
        int nc = 0;
        for (int i = 0; i < s.size; i++) {
            boolean c = s.line[i] >= 0 && isCross[s.line[i]];
            main[i] = acc[i] && !c;
            if (acc[i] && c) nc++;
        }
        if (nc == 0) return null;
        double[] e = new double[nc], no = new double[nc], d = new double[nc];
        for (int i = 0, k = 0; i < s.size; i++) {
            if (acc[i] && s.line[i] >= 0 && isCross[s.line[i]]) {
                e[k] = s.easting[i];
                no[k] = s.northing[i];
                d[k++] = s.depth[i];
            }
        }
        Grid mainGrid = Gridder.build(spec, crs, s.easting, s.northing, s.depth, s.tvu, s.thu, main,
                method, org.leadline.surface.Cube.Parameters.defaults());
        float[] depth = mainGrid.layer(Grid.DEPTH);
        return CrosslineCheck.compare(e, no, d, (x, y) -> {
            int c = mainGrid.col(x), r = mainGrid.row(y);
            return c < 0 || r < 0 ? Double.NaN : depth[r * mainGrid.nx + c];
        }, order::tvuLimit);
    }

    /** Shoelace area of a closed polyline, m^2 (signed). */
    static double ringArea(Contours.Polyline p) {
        double a = 0;
        double[] x = p.x(), y = p.y();
        for (int i = 0, j = x.length - 1; i < x.length; j = i++) a += (x[j] + x[i]) * (y[j] - y[i]);
        return a / 2;
    }

    private static double[] contourLevels(Grid g) {
        float[] d = g.layer(Grid.DEPTH);
        double min = Double.POSITIVE_INFINITY, max = Double.NEGATIVE_INFINITY;
        for (float v : d) if (Float.isFinite(v)) { min = Math.min(min, v); max = Math.max(max, v); }
        if (!(max > min)) return new double[0];
        double range = max - min;
        double interval = range <= 10 ? 1 : range <= 25 ? 2 : range <= 60 ? 5 : range <= 150 ? 10 : 20;
        return Contours.levels(Math.ceil(min / interval) * interval, max, interval);
    }

    private void writeContours(Result r, Path file) throws IOException {
        List<Contours.Polyline> geo = new ArrayList<>();
        for (Contours.Polyline p : r.contours()) {
            double[] lat = new double[p.x().length], lon = new double[p.x().length];
            r.projection().inverse(p.x(), p.y(), lat, lon);
            geo.add(new Contours.Polyline(p.level(), lon, lat, p.closed()));
        }
        GeoJsonWriter.writeContours(file, geo);
    }

    private void writeSelected(Result r, Path file) throws IOException {
        SelectedSoundings sel = r.selected();
        GeoJsonWriter.writeSoundings(file, sel.lon(), sel.lat(), sel.depth(), sel.tvu());
    }

    private Map<String, Object> settings(Result r) {
        Project.Settings s = project.settings();
        Map<String, Object> m = new LinkedHashMap<>();
        m.put("equation", s.equation());
        m.put("cell_m", r.gridSpec().cell());
        m.put("crs", r.projection().code());
        m.put("crs_requested", s.crs());
        m.put("surface", r.method().name().toLowerCase());
        m.put("order", r.order().key());
        m.put("cast_selection", s.castSelection());
        m.put("latitude_deg", Double.isFinite(s.latitude()) ? s.latitude() : null);
        m.put("draft_m", r.inputs().vessel.transducerDraft());
        m.put("sounder_set_speed_m_s", r.inputs().vessel.sounderSetSpeed());
        m.put("latency_s", r.inputs().vessel.latency());
        m.put("cleaning", s.cleaning());
        m.put("crosslines", r.crosslineLines());
        // which cast each ping used (the earlier of the two when interpolating in time)
        List<Map<String, Object>> casts = new ArrayList<>();
        long[] used = r.counts().castUse();
        for (int k = 0; k < r.inputs().casts.size(); k++) {
            Map<String, Object> c = new LinkedHashMap<>();
            c.put("cast", project.casts().get(k).getFileName().toString());
            c.put("pings", used[k]);
            casts.add(c);
        }
        m.put("casts_used", casts);
        return m;
    }

    private List<LineageWriter.Input> hashInputs() throws IOException {
        List<LineageWriter.Input> inputs = new ArrayList<>();
        for (Path p : project.inputs()) {
            if (p != null && java.nio.file.Files.isRegularFile(p)) inputs.add(LineageWriter.input(role(p), p));
        }
        return inputs;
    }

    private static List<LineageWriter.Input> await(java.util.concurrent.Future<List<LineageWriter.Input>> f) throws IOException {
        try {
            return f.get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IOException("interrupted while hashing the inputs", e);
        } catch (java.util.concurrent.ExecutionException e) {
            if (e.getCause() instanceof IOException io) throw io;
            if (e.getCause() instanceof RuntimeException re) throw re;
            throw new IOException(e.getCause());
        }
    }

    /** Rethrows a writing task's failure as it was thrown (nothing when null). */
    private static void rethrow(Throwable t) throws IOException {
        if (t == null) return;
        if (t instanceof IOException io) throw io;
        if (t instanceof RuntimeException re) throw re;
        if (t instanceof Error er) throw er;
        throw new IOException(t);
    }

    private String role(Path p) {
        if (project.soundings().contains(p)) return "soundings";
        if (project.nmea().contains(p)) return "nmea";
        if (project.casts().contains(p)) return "cast";
        if (p.equals(project.navigation())) return "navigation";
        if (p.equals(project.attitude())) return "attitude";
        if (p.equals(project.tide())) return "water-level";
        if (p.equals(project.tideZones())) return "tide-zones";
        if (p.equals(project.vessel())) return "vessel";
        if (p.equals(project.journal())) return "edit-journal";
        return "input";
    }

    /** Program version from the jar manifest, or "development". */
    public static String version() {
        String v = ProcessingRun.class.getPackage().getImplementationVersion();
        return v == null ? "development" : v;
    }

    /** {@link GridSpec#covering} of the accepted soundings, from their extent found in parallel blocks (no copies). */
    private static GridSpec coveringAccepted(SoundingTable s, boolean[] acc, double cell) {
        int n = s.size;
        double[] box = java.util.stream.IntStream.range(0, (n + 65_535) / 65_536).parallel().mapToObj(b -> {
            double[] r = {Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY};
            for (int i = b * 65_536, end = Math.min(n, (b + 1) * 65_536); i < end; i++) {
                double x = s.easting[i], y = s.northing[i];
                if (!acc[i] || !Double.isFinite(x) || !Double.isFinite(y)) continue;
                if (x < r[0]) r[0] = x;
                if (x > r[1]) r[1] = x;
                if (y < r[2]) r[2] = y;
                if (y > r[3]) r[3] = y;
            }
            return r;
        }).reduce((a, b) -> new double[] {b[0] < a[0] ? b[0] : a[0], b[1] > a[1] ? b[1] : a[1],
                b[2] < a[2] ? b[2] : a[2], b[3] > a[3] ? b[3] : a[3]}).orElseThrow();   // as the loop in row order
        return GridSpec.covering(box[0], box[1], box[2], box[3], cell);
    }

    private static double[] select(double[] a, boolean[] keep) {
        int k = 0;
        for (boolean b : keep) if (b) k++;
        double[] out = new double[k];
        k = 0;
        for (int i = 0; i < a.length; i++) if (keep[i]) out[k++] = a[i];
        return out;
    }

    /** A setting that the library refuses is bad input (exit 2), named by its key. */
    static <T> T configured(String key, java.util.function.Supplier<T> make) {
        try {
            return make.get();
        } catch (IllegalArgumentException e) {
            throw new org.leadline.io.InputException((String) null, 0, 0, "setting '" + key + "': " + e.getMessage(), e);
        }
    }

    private void checkCancel() {
        if (progress.cancelled()) throw new Progress.Cancelled();
    }
}
