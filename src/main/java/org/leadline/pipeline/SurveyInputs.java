package org.leadline.pipeline;

import org.leadline.io.AttitudeCsvReader;
import org.leadline.io.CastReader;
import org.leadline.io.NavigationCsvReader;
import org.leadline.io.NmeaLog;
import org.leadline.io.NmeaReader;
import org.leadline.io.PingFiles;
import org.leadline.io.TideZonesReader;
import org.leadline.io.VesselReader;
import org.leadline.io.WaterLevelCsvReader;
import org.leadline.reduction.MergedPings;
import org.leadline.reduction.SensorMerge;
import org.leadline.reduction.TideZoning;
import org.leadline.survey.AttitudeSeries;
import org.leadline.survey.NavigationSeries;
import org.leadline.survey.PingTable;
import org.leadline.survey.Project;
import org.leadline.survey.TideZone;
import org.leadline.survey.Vessel;
import org.leadline.survey.WaterLevelSeries;
import org.leadline.watercolumn.Cast;
import org.leadline.watercolumn.CastQc;
import org.leadline.watercolumn.DerivedProfile;
import org.leadline.watercolumn.ProfileBuilder;
import org.leadline.watercolumn.SoundSpeedEquation;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Everything a run reads, loaded and merged: vessel (with command-line overrides), pings from
 * CSV files and NMEA logs with their sensors merged in time, casts turned into sound-speed
 * profiles, and the water level (gauge and tide zones). Holds no outputs.
 */
public final class SurveyInputs {
    public final Vessel vessel;
    public final PingTable pings;
    /** Merged sensors, one row per ping (concatenated over the sources in the same order). */
    public final double[] lat, lon, heading, heave, roll, pitch, sog;
    public final byte[] mergeReason;
    public final List<Cast> casts;
    public final List<DerivedProfile> profiles;
    public final TideZoning waterLevel; // null: no gauge record
    public final List<String> warnings;
    /** Survey-wide quantities gathered from the pings before reduction. */
    public final DaySummary day;

    private SurveyInputs(Vessel vessel, PingTable pings, double[][] merged, byte[] reason, List<Cast> casts,
                         List<DerivedProfile> profiles, TideZoning waterLevel, List<String> warnings, DaySummary day) {
        this.vessel = vessel;
        this.pings = pings;
        this.day = day;
        if (merged == null) merged = new double[7][];
        lat = merged[0]; lon = merged[1]; heading = merged[2]; heave = merged[3];
        roll = merged[4]; pitch = merged[5]; sog = merged[6];
        this.mergeReason = reason;
        this.casts = casts;
        this.profiles = profiles;
        this.waterLevel = waterLevel;
        this.warnings = warnings;
    }

    /** Reads and merges all inputs of a project. */
    public static SurveyInputs load(Project project, Progress progress) throws IOException {
        List<String> warnings = new ArrayList<>();
        Project.Settings set = project.settings();

        progress.stage("Reading vessel");
        Vessel vessel = vessel(project, warnings);

        progress.stage("Reading navigation and attitude");
        NavigationSeries nav = project.navigation() == null ? null : NavigationCsvReader.read(project.navigation());
        AttitudeSeries att = project.attitude() == null ? null : AttitudeCsvReader.read(project.attitude());

        progress.stage("Reading pings");
        List<PingTable> tables = new ArrayList<>();
        List<MergedPings> merged = new ArrayList<>();
        int files = project.soundings().size() + project.nmea().size(), done = 0;
        for (Path f : project.soundings()) {
            PingTable t = PingFiles.read(f, nav != null);
            tables.add(t);
            merged.add(SensorMerge.merge(t, nav, att, vessel));
            progress.fraction(++done / (double) files);
        }
        for (Path f : project.nmea()) {
            NmeaPings np = nmea(f, nav, warnings);
            tables.add(np.pings());
            merged.add(SensorMerge.merge(np.pings(), np.navigation(), att, vessel));
            progress.fraction(++done / (double) files);
        }
        if (tables.isEmpty()) {
            throw new org.leadline.io.InputException((String) null, 0, 0,
                    "no soundings: give ping files (--soundings) or NMEA logs (--nmea), or name them in the project", null);
        }
        PingTable pings = tables.size() == 1 ? tables.get(0) : PingTable.concat(tables);
        int n = pings.size;
        double[][] cols;
        byte[] reason;
        if (merged.size() == 1) {   // one file (a swath day): its columns as they are, not copies
            MergedPings m = merged.get(0);
            cols = new double[][] {m.lat, m.lon, m.heading, m.heave, m.roll, m.pitch, m.speedOverGround};
            reason = m.reason;
        } else {
            cols = new double[7][n];
            reason = new byte[n];
            int at = 0;
            for (MergedPings m : merged) {
                double[][] src = {m.lat, m.lon, m.heading, m.heave, m.roll, m.pitch, m.speedOverGround};
                for (int k = 0; k < 7; k++) System.arraycopy(src[k], 0, cols[k], at, m.size);
                System.arraycopy(m.reason, 0, reason, at, m.size);
                at += m.size;
            }
        }

        DaySummary day = new DaySummary();
        day.add(pings, cols[0], cols[1], cols[3], cols[4], cols[5], vessel.sounderSetSpeed());
        SurveyInputs c = context(project, progress, vessel, day, warnings);
        return new SurveyInputs(vessel, pings, cols, reason, c.casts, c.profiles, c.waterLevel, c.warnings, day);
    }

    /**
     * Everything but the pings, for a day whose pings are read chunk by chunk (processing in
     * tiles): casts turned into profiles (latitude and depth reach from {@code day}), the water
     * level, and the plausibility warnings. {@link #pings} and the merged columns are null.
     */
    static SurveyInputs context(Project project, Progress progress, Vessel vessel, DaySummary day, List<String> warnings)
            throws IOException {
        Project.Settings set = project.settings();
        progress.stage("Building sound-speed profiles");
        SoundSpeedEquation eq = SoundSpeedEquation.parse(set.equation());
        double latitude = Double.isFinite(set.latitude()) ? set.latitude() : day.medianLatitude();
        double deepest = day.deepest(vessel.transducerDraft());
        List<Cast> casts = new ArrayList<>();
        List<DerivedProfile> profiles = new ArrayList<>();
        for (Path f : project.casts()) {
            Cast c = CastReader.read(f);
            DerivedProfile p = ProfileBuilder.build(c, eq, latitude,
                    CastQc.Settings.DEFAULTS.withExtendToDepth(deepest));
            casts.add(c);
            profiles.add(p);
            for (String w : p.warnings()) warnings.add(f.getFileName() + ": " + w);
        }
        if (profiles.isEmpty()) {
            warnings.add("no cast: rays are traced at the sounder's set speed " + vessel.sounderSetSpeed()
                    + " m/s (no refraction correction)");
        }

        progress.stage("Reading water levels");
        TideZoning zoning = null;
        if (project.tide() != null) {
            WaterLevelSeries gauge = WaterLevelCsvReader.read(project.tide());
            List<TideZone> zones = project.tideZones() == null ? List.of() : TideZonesReader.read(project.tideZones());
            zoning = new TideZoning(gauge, zones);
        } else {
            warnings.add("no water-level record: depths are below the water surface, NOT reduced to chart datum");
        }
        warnings.addAll(Plausibility.check(day.heaveWarning(), project.casts(), profiles, vessel.transducerDraft(),
                vessel.sounderSetSpeed()));
        return new SurveyInputs(vessel, null, null, null, casts, profiles, zoning, warnings, day);
    }

    /** The pings of an NMEA log (line named after the file) and the navigation their merge uses. */
    record NmeaPings(PingTable pings, NavigationSeries navigation) {}

    /**
     * Reads an NMEA log: its depth sentences as pings, its problems as a warning, and as navigation
     * the separate record when there is one, else the log's own position sentences (null: none).
     */
    static NmeaPings nmea(Path f, NavigationSeries nav, List<String> warnings) throws IOException {
        NmeaLog log = NmeaReader.read(f);
        if (log.problems().total() > 0) warnings.add(f.getFileName() + ": " + log.problems().summary());
        String line = f.getFileName().toString().replaceFirst("\\.[^.]*$", "");
        PingTable t = log.toPingTable(line);
        if (t.size == 0) {
            throw new org.leadline.io.InputException(f, "expected depth sentences (DBT or DPT) after a time-bearing"
                    + " sentence (ZDA, RMC, GGA), found none; problems: " + log.problems().oneLine());
        }
        NavigationSeries own = nav;
        if (own == null && log.navigationTimes().length >= 2) {
            own = NavigationSeries.of(log.navigationTimes(), log.navigationLat(), log.navigationLon());
        }
        return new NmeaPings(t, own);
    }

    /** The vessel file with the project's overrides (draft, set speed); defaults with a warning when there is none. */
    static Vessel vessel(Project project, List<String> warnings) throws IOException {
        Project.Settings set = project.settings();
        Vessel vessel = project.vessel() != null ? VesselReader.read(project.vessel())
                : Vessel.simple(0.0, VesselReader.DEFAULT_SET_SPEED);
        if (project.vessel() == null) {
            warnings.add("no vessel file: draft 0 m, no offsets, sounder set speed 1500 m/s, default sensor uncertainties");
        }
        if (Double.isFinite(set.draft()) || Double.isFinite(set.sounderSpeed())) {
            vessel = new Vessel(Double.isFinite(set.draft()) ? set.draft() : vessel.transducerDraft(),
                    vessel.settlementSpeeds(), vessel.settlementValues(), vessel.positionOffset(),
                    vessel.transducerOffset(), vessel.latency(),
                    Double.isFinite(set.sounderSpeed()) ? set.sounderSpeed() : vessel.sounderSetSpeed(),
                    vessel.beamWidth(), vessel.sigma());
        }
        return vessel;
    }

    /** The upper median of the finite values (element n/2 in sorted order), by selection: O(n), no full sort. */
    static double median(double[] a) {
        double[] f = Arrays.stream(a).filter(Double::isFinite).toArray();
        // upper middle for an even count: a value that occurs in the data (a latitude of a ping)
        return f.length == 0 ? Double.NaN : org.leadline.surface.Select.kth(f, 0, f.length, f.length / 2);
    }
}
