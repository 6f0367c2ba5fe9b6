package org.leadline.pipeline;

import org.leadline.cleaning.Cleaner;
import org.leadline.cleaning.CleaningSettings;
import org.leadline.cleaning.CleaningStats;
import org.leadline.cleaning.Edit;
import org.leadline.cleaning.EditJournal;
import org.leadline.io.AttitudeCsvReader;
import org.leadline.io.EditJournalFile;
import org.leadline.io.NavigationCsvReader;
import org.leadline.io.PingChunks;
import org.leadline.io.PingFiles;
import org.leadline.io.SoundingsCsvWriter;
import org.leadline.io.TileSpill;
import org.leadline.reduction.MergedPings;
import org.leadline.reduction.Reducer;
import org.leadline.reduction.SensorMerge;
import org.leadline.survey.AttitudeSeries;
import org.leadline.survey.NavigationSeries;
import org.leadline.survey.PingTable;
import org.leadline.survey.Project;
import org.leadline.survey.SoundingTable;
import org.leadline.survey.SoundingTable.Reason;
import org.leadline.survey.SoundingTable.Status;
import org.leadline.survey.Vessel;
import org.leadline.surface.Contours;
import org.leadline.surface.Coverage;
import org.leadline.surface.Grid;
import org.leadline.surface.GridSpec;
import org.leadline.surface.Gridder;
import org.leadline.surface.MapProjection;
import org.leadline.surface.SoundingSelection;
import org.leadline.uncertainty.Compliance;
import org.leadline.uncertainty.CrosslineCheck;
import org.leadline.uncertainty.CrosslineResult;
import org.leadline.uncertainty.S44Order;
import org.leadline.uncertainty.TpuModel;
import org.leadline.watercolumn.SoundSpeedProfile;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

/**
 * A processing run for a day too large to hold in memory (docs/performance.md, "100 million
 * soundings"): the same science as {@link ProcessingRun#compute} in bounded memory, by streaming
 * the pings in chunks of whole survey lines and cleaning and gridding tile by tile.
 * <ol>
 * <li>A first pass over the pings merges the sensors and gathers the survey-wide quantities
 *   ({@link DaySummary}, the own-position track of each file).</li>
 * <li>Pass two reduces each chunk (ray bending, TPU), runs the per-sounding gates and the
 *   along-track spike test (series never cross lines, and a chunk holds whole lines), keeps one
 *   status byte and one reason byte per sounding, and spills the soundings to tile files
 *   ({@link TileSpill}) with a margin of {@link Cleaner#spatialReach} around every tile.</li>
 * <li>Each tile, with its margin, gets the spatial cleaning ({@link Cleaner#spatial}); its own
 *   soundings' statuses are kept. The edit journal is applied per sounding.</li>
 * <li>Each tile's grid cells (a cell belongs to the tile holding its centre) are computed by
 *   {@link Gridder#window}, with the soundings selected for the chart.</li>
 * <li>A last pass reduces the chunks again (the same arithmetic, so the same soundings), sets
 *   their final statuses, and writes soundings.csv and the TPU and S-44 tallies.</li>
 * </ol>
 * Soundings, cleaning and surface are those of the in-memory run for the same input
 * (TiledRunTest compares the outputs byte for byte), with these differences: a survey line split
 * between distant parts of a file, or longer than four chunks, is cleaned along-track in parts;
 * the automatic cell size comes from a sample of accepted depths taken in tile order; and the
 * chart selection is made tile by tile, so two selected soundings either side of a tile edge may
 * lie closer than the selection radius. CUBE is not available here (its nodes look beyond their
 * cell); the run says so and stops.
 */
final class TiledRun {
    /** Memory the in-memory run needs per sounding, about (bytes; measured: 5.5 GiB RSS for 10 million, docs/performance.md). */
    static final long BYTES_PER_SOUNDING = 400;

    private final Project project;
    private final Progress progress;
    private final int chunkRows;
    private final double tileOverride;

    private Vessel vessel;
    private AttitudeSeries att;
    private final List<Source> sources = new ArrayList<>();
    private SurveyInputs context;
    private TpuModel tpuModel;
    private List<SoundSpeedProfile> profiles;
    private Reducer.BeamTracer[] tracers;
    private MapProjection projection;
    private final List<String> lineNames = new ArrayList<>();
    private final Map<String, Integer> lineIds = new LinkedHashMap<>();

    TiledRun(Project project, Progress progress) {
        this.project = project;
        this.progress = progress == null ? Progress.NONE : progress;
        this.chunkRows = Integer.getInteger("leadline.tiles.chunk-rows", 2_000_000);
        String t = System.getProperty("leadline.tiles.tile-m");
        this.tileOverride = t == null ? Double.NaN : Double.parseDouble(t);
    }

    /**
     * Whether a project should be processed in tiles: the system property {@code leadline.tiles}
     * ({@code always}, {@code never}, or {@code auto}, the default: when the soundings, estimated
     * from the ping files' sizes, would need more than 90 % of the maximum heap in memory).
     */
    static boolean wanted(Project project) throws IOException {
        String mode = System.getProperty("leadline.tiles", "auto").trim().toLowerCase(java.util.Locale.ROOT);
        if (mode.equals("always")) return true;
        if (mode.equals("never")) return false;
        long rows = 0;
        for (Path f : project.soundings()) rows += PingFiles.estimateRows(f);
        return rows * BYTES_PER_SOUNDING > 0.9 * Runtime.getRuntime().maxMemory();
    }

    /** One ping source: a ping file or an NMEA log, with the navigation its merge uses. */
    private static final class Source {
        final Path file;
        final PingTable nmeaTable;    // the log's pings (small), or null for a ping file
        NavigationSeries navigation;  // separate navigation (or the log's own), null: the file's positions
        NavigationSeries ownTrack;    // the file's own positions, when navigation is null
        Source(Path file, PingTable nmeaTable) { this.file = file; this.nmeaTable = nmeaTable; }
    }

    /** Runs and writes soundings.csv into the staged output; returns the result for the other outputs. */
    ProcessingRun.Result run(OutputFolder out) throws IOException {
        String started = Instant.now().toString();
        Project.Settings set = project.settings();
        List<String> warnings = new ArrayList<>();
        Gridder.Method method = Gridder.Method.parse(set.surface());
        if (method == Gridder.Method.CUBE) {
            throw new org.leadline.io.InputException((String) null, 0, 0, "surface cube needs the whole day in memory,"
                    + " and this day is processed in tiles (too large for the heap): choose median, mean, shoalest or"
                    + " weighted, or give Java more memory (-Xmx)", null);
        }
        progress.stage("Reading vessel");
        vessel = SurveyInputs.vessel(project, warnings);
        progress.stage("Reading navigation and attitude");
        NavigationSeries nav = project.navigation() == null ? null : NavigationCsvReader.read(project.navigation());
        att = project.attitude() == null ? null : AttitudeCsvReader.read(project.attitude());
        for (Path f : project.soundings()) {
            Source s = new Source(f, null);
            s.navigation = nav;
            sources.add(s);
        }
        for (Path f : project.nmea()) {
            SurveyInputs.NmeaPings np = SurveyInputs.nmea(f, nav, warnings);
            Source s = new Source(f, np.pings());
            s.navigation = np.navigation();
            sources.add(s);
        }
        if (sources.isEmpty()) {
            throw new org.leadline.io.InputException((String) null, 0, 0,
                    "no soundings: give ping files (--soundings) or NMEA logs (--nmea), or name them in the project", null);
        }

        // pass 1: survey-wide quantities
        progress.stage("Reading pings (survey-wide pass)");
        DaySummary day = new DaySummary();
        for (Source src : sources) {
            SensorMerge.OwnTrack own = src.navigation == null ? new SensorMerge.OwnTrack() : null;
            long read = 0;
            try (PingChunks c = open(src)) {
                for (PingTable p = c.next(); p != null; p = c.next()) {
                    if (own != null) own.add(p);
                    MergedPings m = SensorMerge.merge(p, src.navigation, att, vessel);
                    day.add(p, m.lat, m.lon, m.heave, m.roll, m.pitch, vessel.sounderSetSpeed());
                    fraction(read += p.size, c.expectedRows());
                    checkCancel();
                }
            }
            if (own != null) src.ownTrack = own.build();
        }
        if (day.rows() > Integer.MAX_VALUE - 8) {
            throw new org.leadline.io.InputException((String) null, 0, 0, "more than " + (Integer.MAX_VALUE - 8)
                    + " soundings in one run: split the day into several projects", null);
        }
        int total = (int) day.rows();
        context = SurveyInputs.context(project, progress, vessel, day, warnings);
        warnings = context.warnings;
        profiles = new ArrayList<>();
        for (var d : context.profiles) profiles.add(d.profile());
        if (profiles.isEmpty()) profiles.add(SoundSpeedProfile.constant(vessel.sounderSetSpeed()));
        progress.stage("Building ray tables");
        tracers = ProcessingRun.buildTracers(day, vessel, profiles);
        tpuModel = new TpuModel(vessel);
        projection = ProcessingRun.configured("crs", () -> MapProjection.parse(set.crs(), day.latitudes(), day.longitudes()));
        CleaningSettings cs = ProcessingRun.configured("cleaning", () -> CleaningSettings.fromMap(set.cleaning()));
        S44Order order = S44Order.parse(set.order());

        List<Edit> effective = null;
        int journalEdits = 0;
        if (project.journal() != null) {
            EditJournalFile.Contents j = EditJournalFile.read(project.journal());
            warnings.addAll(j.warnings());
            journalEdits = j.edits().size();
            effective = EditJournal.effective(j.edits());
        }

        double reach = Cleaner.spatialReach(cs);
        double cellGuess = Double.isFinite(set.cell()) ? set.cell() : 0;
        double margin = reach + cs.surfaceCell() + Math.max(2 * cellGuess, 1.0);
        double tile = tileSize(day, margin);
        byte[] status = new byte[total], reason = new byte[total];
        byte[] verdict = effective == null ? null : new byte[total];
        int[] gateCounts = new int[256];
        long acceptedBefore = 0;
        int untestedSpike = 0, untestedSurface = 0;
        Path tiles = out.scratch("tiles.tmp");
        try (TileSpill spill = new TileSpill(tiles, tile, margin)) {
            // pass 2: reduce, gate, spike flags, spill to tiles
            progress.stage("Reducing soundings into tiles of " + fmt(tile) + " m");
            int[] id0 = {0};
            List<Edit> eff = effective;
            long[] counters = new long[1];
            int[] untested = new int[2];
            forEachUnit(total, (p, src, first) -> {
                Reduced r = reduce(p, src);
                SoundingTable s = r.s;
                for (int i = 0; i < s.size; i++) if (s.accepted(i)) counters[0]++;
                Cleaner.gates(s, p.quality, cs, gateCounts);
                boolean[] spike = new boolean[s.size];
                if (cs.enabled(CleaningSettings.Filter.SPIKE)) untested[0] += Cleaner.spikeFlags(s, cs, spike);
                if (eff != null) {
                    byte[] v = new byte[s.size];
                    EditJournal.verdicts(s, first, eff, v);
                    System.arraycopy(v, 0, verdict, first, s.size);
                }
                int[] ids = lineIdsOf(s);
                for (int i = 0; i < s.size; i++) {
                    boolean acc = s.accepted(i);
                    boolean placed = Double.isFinite(s.easting[i]) && Double.isFinite(s.northing[i])
                            && Double.isFinite(s.depth[i]);
                    if (acc && !placed) {
                        // no position or depth: feature protection cannot keep a flag, the surface filter cannot test it
                        if (spike[i]) s.reject(i, Reason.SPIKE);
                        else if (cs.enabled(CleaningSettings.Filter.SURFACE)) untested[1]++;
                    }
                    status[first + i] = s.status[i];
                    reason[first + i] = s.reason[i];
                    if (placed) {
                        byte flags = (byte) ((acc ? 1 : 0) | (spike[i] ? 2 : 0));
                        spill.add(first + i, s.line[i] < 0 ? -1 : ids[s.line[i]], s.easting[i], s.northing[i],
                                s.depth[i], s.tvu[i], s.time[i], flags);
                    }
                }
            });
            spill.finish();
            acceptedBefore = counters[0];
            untestedSpike = untested[0];
            untestedSurface = untested[1];

            // spatial cleaning, tile by tile
            List<Long> keys = spill.tiles();
            progress.stage("Cleaning " + keys.size() + " tiles");
            Extent ext = new Extent();
            int done = 0;
            for (long key : keys) {
                TileSpill.Records rec = spill.read(key);
                SoundingTable t = new SoundingTable(rec.size, List.of());
                System.arraycopy(rec.e, 0, t.easting, 0, rec.size);
                System.arraycopy(rec.n, 0, t.northing, 0, rec.size);
                System.arraycopy(rec.depth, 0, t.depth, 0, rec.size);
                System.arraycopy(rec.tvu, 0, t.tvu, 0, rec.size);
                System.arraycopy(rec.time, 0, t.time, 0, rec.size);
                boolean[] spike = new boolean[rec.size], core = new boolean[rec.size];
                for (int i = 0; i < rec.size; i++) {
                    t.status[i] = (rec.flags[i] & 1) != 0 ? Status.ACCEPTED.code : Status.REJECTED.code;
                    spike[i] = (rec.flags[i] & 2) != 0;
                    core[i] = spill.home(rec.e[i], rec.n[i]) == key;
                }
                untestedSurface += Cleaner.spatial(t, spike, cs, new int[256], core);
                for (int i = 0; i < rec.size; i++) {
                    if (core[i] && (rec.flags[i] & 1) != 0) {
                        status[rec.id[i]] = t.status[i];
                        reason[rec.id[i]] = t.reason[i];
                    }
                    // without a journal these statuses are final: the surface extent needs no extra pass
                    if (verdict == null && core[i] && t.status[i] == Status.ACCEPTED.code) ext.add(rec.e[i], rec.n[i], rec.depth[i]);
                }
                progress.fraction(++done / (double) keys.size());
                checkCancel();
            }

            // cleaning statistics (before the journal), then the journal
            long acceptedAfter = 0;
            int[] spatialCounts = new int[256];
            for (int i = 0; i < total; i++) {
                if (status[i] == Status.ACCEPTED.code) acceptedAfter++;
                else if (reason[i] == Reason.SPIKE.code || reason[i] == Reason.SURFACE.code) spatialCounts[reason[i]]++;
            }
            Map<Reason, Integer> byReason = new EnumMap<>(Reason.class);
            for (Reason r : Reason.values()) {
                int k = gateCounts[r.code & 0xff] + spatialCounts[r.code & 0xff];
                if (k > 0) byReason.put(r, k);
            }
            CleaningStats stats = new CleaningStats(total, (int) acceptedBefore, (int) acceptedAfter, byReason,
                    untestedSpike, untestedSurface);
            if (verdict != null) for (int i = 0; i < total; i++) EditJournal.applyVerdict(verdict[i], status, reason, i);

            // extent and cell size
            progress.stage("Building surface");
            if (verdict != null) {
                // the journal changed statuses after cleaning: the extent of what is accepted now
                for (long key : keys) {
                    TileSpill.Records rec = spill.read(key);
                    for (int i = 0; i < rec.size; i++) {
                        if (status[rec.id[i]] == Status.ACCEPTED.code && spill.home(rec.e[i], rec.n[i]) == key) {
                            ext.add(rec.e[i], rec.n[i], rec.depth[i]);
                        }
                    }
                }
            }
            double minE = ext.minE, maxE = ext.maxE, minN = ext.minN, maxN = ext.maxN;
            DaySummary.Sample depthSample = ext.depths;
            long nAcc = ext.count;
            if (nAcc == 0) {
                Map<String, Integer> why = new java.util.TreeMap<>();
                for (int i = 0; i < total; i++) why.merge(Reason.of(reason[i]).label, 1, Integer::sum);
                throw new org.leadline.io.InputException((String) null, 0, 0,
                        "no accepted soundings to grid: all " + total + " were rejected " + why
                                + " (check that navigation, attitude and water-level records cover the ping times)", null);
            }
            double cell = Double.isFinite(set.cell()) ? set.cell()
                    : GridSpec.suggestCell(depthSample.values(), vessel.beamWidth());
            if (!Double.isFinite(set.cell())) warnings.add("cell size not set: using the suggested " + cell + " m (from depth and beam footprint)");
            if (cell > margin / 2) {
                throw new org.leadline.io.InputException((String) null, 0, 0, "cell size " + cell + " m is too large"
                        + " for tiles with a margin of " + fmt(margin) + " m: set cell_m in the project", null);
            }
            GridSpec spec = GridSpec.covering(minE, maxE, minN, maxN, cell);
            Grid grid = spec.newGrid(projection.crs());
            int cells = grid.cells();
            float[] dep = nan(cells), unc = nan(cells), cnt = new float[cells], sdv = nan(cells);
            boolean[] isCross = crosslineIds(set.crosslines());
            boolean anyCross = false;
            for (boolean b : isCross) anyCross |= b;
            float[] mainDepth = anyCross ? nan(cells) : null;
            DoubleList crossE = new DoubleList(), crossN = new DoubleList(), crossD = new DoubleList();
            double radius = Math.max(5 * cell, 10);
            DoubleList selE = new DoubleList(), selN = new DoubleList(), selD = new DoubleList(), selT = new DoubleList();
            done = 0;
            for (long key : keys) {
                TileSpill.Records rec = spill.read(key);
                boolean[] acc = new boolean[rec.size], home = new boolean[rec.size], main = anyCross ? new boolean[rec.size] : null;
                int c0 = Integer.MAX_VALUE, c1 = -1, r0 = Integer.MAX_VALUE, r1 = -1;
                for (int i = 0; i < rec.size; i++) {
                    if (status[rec.id[i]] != Status.ACCEPTED.code) continue;
                    int c = grid.col(rec.e[i]), r = grid.row(rec.n[i]);
                    if (c < 0 || r < 0) continue;
                    // a cell belongs to the tile holding its centre, so every cell is computed once, whole
                    if (spill.home(grid.xMin + (c + 0.5) * cell, grid.yMax - (r + 0.5) * cell) != key) continue;
                    acc[i] = true;
                    if (anyCross) main[i] = !(rec.line[i] >= 0 && rec.line[i] < isCross.length && isCross[rec.line[i]]);
                    c0 = Math.min(c0, c);
                    c1 = Math.max(c1, c);
                    r0 = Math.min(r0, r);
                    r1 = Math.max(r1, r);
                }
                if (c1 >= 0) {
                    int wnx = c1 - c0 + 1, wny = r1 - r0 + 1;
                    float[][] w = Gridder.window(grid, c0, r0, wnx, wny, rec.e, rec.n, rec.depth, rec.tvu, acc, method);
                    paste(w[0], dep, grid.nx, c0, r0, wnx, wny);
                    paste(w[1], unc, grid.nx, c0, r0, wnx, wny);
                    paste(w[2], cnt, grid.nx, c0, r0, wnx, wny);
                    paste(w[3], sdv, grid.nx, c0, r0, wnx, wny);
                    if (anyCross) {
                        for (int i = 0; i < rec.size; i++) main[i] &= acc[i];
                        float[][] m = Gridder.window(grid, c0, r0, wnx, wny, rec.e, rec.n, rec.depth, rec.tvu, main, method);
                        paste(m[0], mainDepth, grid.nx, c0, r0, wnx, wny);
                    }
                }
                // the tile's own accepted soundings: chart selection and crossline soundings
                for (int i = 0; i < rec.size; i++) {
                    home[i] = status[rec.id[i]] == Status.ACCEPTED.code && spill.home(rec.e[i], rec.n[i]) == key;
                    if (home[i] && anyCross && rec.line[i] >= 0 && rec.line[i] < isCross.length && isCross[rec.line[i]]) {
                        crossE.add(rec.e[i]);
                        crossN.add(rec.n[i]);
                        crossD.add(rec.depth[i]);
                    }
                }
                for (int i : SoundingSelection.select(rec.e, rec.n, rec.depth, home, radius)) {
                    selE.add(rec.e[i]);
                    selN.add(rec.n[i]);
                    selD.add(rec.depth[i]);
                    selT.add(rec.tvu[i]);
                }
                progress.fraction(++done / (double) keys.size());
                checkCancel();
            }
            grid.putLayer(Grid.DEPTH, dep).putLayer(Grid.UNCERTAINTY, unc).putLayer(Grid.COUNT, cnt).putLayer(Grid.STDDEV, sdv);
            Coverage coverage = Coverage.of(grid);
            List<Contours.Polyline> contours = ProcessingRun.contoursOf(grid);
            double[] sLat = new double[selE.size()], sLon = new double[selE.size()];
            projection.inverse(selE.toArray(), selN.toArray(), sLat, sLon);
            ProcessingRun.SelectedSoundings selected = new ProcessingRun.SelectedSoundings(sLon, sLat, selD.toArray(), selT.toArray());

            List<String> crossNames = new ArrayList<>();
            for (int l = 0; l < isCross.length; l++) if (isCross[l]) crossNames.add(lineNames.get(l));
            CrosslineResult cross = null;
            if (anyCross && crossD.size() > 0) {
                float[] md = mainDepth;
                cross = CrosslineCheck.compare(crossE.toArray(), crossN.toArray(), crossD.toArray(), (x, y) -> {
                    int c = grid.col(x), r = grid.row(y);
                    return c < 0 || r < 0 ? Double.NaN : md[r * grid.nx + c];
                }, order::tvuLimit);
            }

            // last pass: the soundings again, with their final statuses, to soundings.csv and the tallies
            progress.stage("Writing soundings.csv");
            TpuModel.Tally tpuTally = tpuModel.tally();
            Compliance.Tally compliance = new Compliance.Tally(order, Compliance.DEFAULT_BANDS);
            long[] byReasonAll = new long[256], castUse = new long[Math.max(1, context.casts.size())];
            long[] accepted = new long[1];
            try (SoundingsCsvWriter.Appender w = SoundingsCsvWriter.open(out.stage("soundings.csv"))) {
                forEachUnit(total, (p, src, first) -> {
                    Reduced r = reduce(p, src);
                    SoundingTable s = r.s;
                    System.arraycopy(status, first, s.status, 0, s.size);
                    System.arraycopy(reason, first, s.reason, 0, s.size);
                    w.append(s);
                    tpuTally.add(s, r.heave, r.cTransducer, r.zoneSigma);
                    compliance.add(s, Compliance.evaluate(s, order));
                    for (int i = 0; i < s.size; i++) {
                        if (s.accepted(i)) accepted[0]++;
                        else byReasonAll[s.reason[i] & 0xff]++;
                        int c = s.cast[i];
                        if (c >= 0 && c < castUse.length) castUse[c]++;
                    }
                });
            }
            warnings.add(String.format(java.util.Locale.ROOT, "processed in %d tiles of %s m, streaming the pings"
                    + " (a day this size does not fit the memory given to Java); temporary tile files %.1f GB", keys.size(), fmt(tile), spill.bytesWritten() / 1e9));
            ProcessingRun.SoundingCounts counts = new ProcessingRun.SoundingCounts(total, accepted[0], lineNames.size(),
                    byReasonAll, castUse);
            return new ProcessingRun.Result(context, null, projection, grid, spec, method, coverage, contours, selected,
                    tpuTally.summary(), compliance.summary(), order, stats, journalEdits, cross, crossNames, null,
                    warnings, started, counts);
        } finally {
            deleteTree(tiles);
        }
    }

    /** A chunk's soundings with the per-sounding TPU inputs. */
    private record Reduced(SoundingTable s, double[] heave, double[] cTransducer, double[] zoneSigma) {}

    private Reduced reduce(PingTable p, Source src) {
        MergedPings m = SensorMerge.merge(p, src.navigation, att, vessel.latency(), SensorMerge.DEFAULT_SPEED_WINDOW,
                src.ownTrack);
        Reducer.MergedInputs merged = new Reducer.MergedInputs(m.lat, m.lon, m.heading, m.heave, m.roll, m.pitch,
                m.speedOverGround, m.reason);
        Reducer.CastChoice choice = ProcessingRun.castChoice(project.settings(), context.casts, context.profiles.size(),
                p.time, m.lat, m.lon);
        Reducer.WaterLevelAt level = context.waterLevel == null ? (t, la, lo) -> 0.0 : context.waterLevel::level;
        SoundingTable s = new Reducer(vessel, false).reduce(p, merged, tracers, choice, level, projection::forward);
        double[] cT = new double[s.size], zs = new double[s.size];
        ProcessingRun.transducerTerms(s, m.heave, choice.castA(), profiles, vessel, context.waterLevel, cT, zs);
        tpuModel.compute(s, m.heave, cT, zs);
        return new Reduced(s, m.heave, cT, zs);
    }

    private interface UnitAction {
        void accept(PingTable unit, Source src, int firstId) throws IOException;
    }

    /**
     * Every processing unit in file order: chunks joined and cut so that a unit holds whole
     * survey lines (the rows of the last line of a chunk wait for the next chunk), unless a line
     * grows beyond four chunks.
     */
    private void forEachUnit(int total, UnitAction action) throws IOException {
        int first = 0;
        for (Source src : sources) {
            try (PingChunks c = open(src)) {
                PingTable pending = null;
                for (PingTable p = c.next(); ; p = c.next()) {
                    if (p == null) {
                        if (pending != null) {
                            action.accept(pending, src, first);
                            first += pending.size;
                        }
                        break;
                    }
                    PingTable all = pending == null ? p : join(pending, p);
                    int cut = all.size;
                    while (cut > 0 && all.line[cut - 1] == all.line[all.size - 1]) cut--;
                    if (cut == 0 && all.size < 4L * chunkRows) {
                        pending = all;
                        continue;
                    }
                    if (cut == 0) cut = all.size;
                    PingTable unit = cut == all.size ? all : all.slice(0, cut);
                    pending = cut == all.size ? null : all.slice(cut, all.size);
                    action.accept(unit, src, first);
                    first += unit.size;
                    fraction(first, total);
                    checkCancel();
                }
            }
        }
    }

    /** Rows of a then b (b's line names hold a's: chunks of one file). */
    private static PingTable join(PingTable a, PingTable b) {
        int n = a.size + b.size;
        return PingTable.ofColumns(n, cat(a.time, b.time), cat(a.lat, b.lat), cat(a.lon, b.lon), cat(a.twtt, b.twtt),
                cat(a.depth, b.depth), cat(a.angle, b.angle), cat(a.heading, b.heading), cat(a.heave, b.heave),
                cat(a.roll, b.roll), cat(a.pitch, b.pitch), cat(a.line, b.line), cat(a.beam, b.beam),
                cat(a.quality, b.quality), b.lineNames().size() >= a.lineNames().size() ? b.lineNames() : a.lineNames());
    }

    private static double[] cat(double[] a, double[] b) {
        double[] c = Arrays.copyOf(a, a.length + b.length);
        System.arraycopy(b, 0, c, a.length, b.length);
        return c;
    }

    private static int[] cat(int[] a, int[] b) {
        int[] c = Arrays.copyOf(a, a.length + b.length);
        System.arraycopy(b, 0, c, a.length, b.length);
        return c;
    }

    private PingChunks open(Source src) throws IOException {
        return src.nmeaTable != null ? PingChunks.of(src.nmeaTable, chunkRows)
                : PingFiles.chunks(src.file, src.navigation != null, chunkRows);
    }

    /** Run-wide line ids of a chunk's line indices, numbered in order of first appearance (as a whole-day table). */
    private int[] lineIdsOf(SoundingTable s) {
        List<String> names = s.lineNames();
        int[] ids = new int[names.size()];
        for (int l = 0; l < ids.length; l++) {
            ids[l] = lineIds.computeIfAbsent(names.get(l), k -> {
                lineNames.add(k);
                return lineNames.size() - 1;
            });
        }
        return ids;
    }

    private boolean[] crosslineIds(List<String> names) {
        boolean[] c = new boolean[lineNames.size()];
        if (names == null) return c;
        for (int l = 0; l < c.length; l++) c[l] = names.contains(lineNames.get(l));
        return c;
    }

    /**
     * Tile side, m: about 4 million soundings a tile from the density of the sampled ping
     * positions (bounding box of the projected sample), at least 8 margins, at most 100 km.
     */
    private double tileSize(DaySummary day, double margin) {
        if (Double.isFinite(tileOverride)) return Math.max(tileOverride, 2.5 * margin);
        double[] la = day.latitudes(), lo = day.longitudes();
        double[] e = new double[la.length], n = new double[la.length];
        projection.forward(la, lo, e, n);
        double x0 = Double.POSITIVE_INFINITY, x1 = Double.NEGATIVE_INFINITY, y0 = x0, y1 = x1;
        for (int i = 0; i < e.length; i++) {
            if (!Double.isFinite(e[i]) || !Double.isFinite(n[i])) continue;
            x0 = Math.min(x0, e[i]); x1 = Math.max(x1, e[i]);
            y0 = Math.min(y0, n[i]); y1 = Math.max(y1, n[i]);
        }
        double target = Long.getLong("leadline.tiles.soundings-per-tile", 4_000_000L);
        double area = Math.max(1, (x1 - x0 + 2 * margin) * (y1 - y0 + 2 * margin));
        double side = Double.isFinite(area) ? Math.sqrt(target * area / Math.max(1, day.rows())) : 1000;
        return Math.ceil(Math.min(100_000, Math.max(8 * margin, side)));
    }

    private static void paste(float[] w, float[] g, int nx, int c0, int r0, int wnx, int wny) {
        for (int r = 0; r < wny; r++) System.arraycopy(w, r * wnx, g, (r0 + r) * nx + c0, wnx);
    }

    private static float[] nan(int n) {
        float[] a = new float[n];
        Arrays.fill(a, Float.NaN);
        return a;
    }

    private void fraction(long done, long total) {
        if (total > 0) progress.fraction(Math.min(1, done / (double) total));
    }

    private static String fmt(double v) { return String.format(java.util.Locale.ROOT, "%.0f", v); }

    private void checkCancel() {
        if (progress.cancelled()) throw new Progress.Cancelled();
    }

    private static void deleteTree(Path dir) throws IOException {
        if (!Files.exists(dir)) return;
        try (var s = Files.walk(dir)) {
            List<Path> all = s.sorted(java.util.Comparator.reverseOrder()).toList();
            for (Path p : all) Files.deleteIfExists(p);
        }
    }

    /** Extent and a depth sample of the accepted soundings, for the grid geometry and the suggested cell. */
    private static final class Extent {
        double minE = Double.POSITIVE_INFINITY, maxE = Double.NEGATIVE_INFINITY;
        double minN = Double.POSITIVE_INFINITY, maxN = Double.NEGATIVE_INFINITY;
        long count;
        final DaySummary.Sample depths = new DaySummary.Sample(DaySummary.POSITION_CAP);

        void add(double e, double n, double d) {
            count++;
            minE = Math.min(minE, e);
            maxE = Math.max(maxE, e);
            minN = Math.min(minN, n);
            maxN = Math.max(maxN, n);
            depths.add(d);
        }
    }

    /** A growable list of doubles. */
    private static final class DoubleList {
        private double[] v = new double[256];
        private int n;
        void add(double x) {
            if (n == v.length) v = Arrays.copyOf(v, 2 * n);
            v[n++] = x;
        }
        int size() { return n; }
        double[] toArray() { return Arrays.copyOf(v, n); }
    }
}
