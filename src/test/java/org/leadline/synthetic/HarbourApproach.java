package org.leadline.synthetic;

import org.leadline.io.NmeaReader;
import org.leadline.io.VesselWriter;
import org.leadline.raypath.RayTracer;
import org.leadline.survey.Vessel;
import org.leadline.watercolumn.PressureDepth;
import org.leadline.watercolumn.Pss78;
import org.leadline.watercolumn.SoundSpeedEquation;
import org.leadline.watercolumn.SoundSpeedProfile;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.time.ZoneOffset;
import java.time.ZonedDateTime;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Random;

/**
 * The invented survey of Leadline's sample data: the approach to "Wrenmouth", a fictional
 * harbour, surveyed one morning by a launch with a swath sounder (main-scheme lines north-south),
 * a single-beam sounder (crosslines east-west, one line also logged as NMEA 0183), two CTD casts
 * through an estuarine halocline, and a tide gauge with two tide zones.
 *
 * <p>The seabed is analytic: a natural slope deepening northward, a dredged channel (flat 14 m
 * floor, 1:8 sides), a Gaussian shoal, and a wreck-sized obstruction (20 m x 6 m, 4.2 m high,
 * smooth 0.6 m edges). {@link #depth(double, double)} is the truth; {@link #write} produces the
 * files by the forward model {@link SurveySimulator} (rays traced through the true profile to
 * the seabed) and writes the truth beside them.
 */
public final class HarbourApproach {
    /** Origin of the local east/north frame: open water, positions invented. */
    public static final double LAT0 = 54.52, LON0 = 3.05;
    public static final Instant START = Instant.parse("2026-05-14T07:00:00Z");
    public static final double WIDTH = 300, LENGTH = 400;
    static final double WRECK_E = 225, WRECK_N = 120, WRECK_LEN = 20, WRECK_WID = 6, WRECK_H = 4.2,
            WRECK_BEARING = Math.toRadians(30), WRECK_EDGE = 0.6;
    static final double SHOAL_E = 60, SHOAL_N = 280, SHOAL_H = 5.5, SHOAL_SIGMA = 25;

    /** What to generate. */
    public record Options(boolean noise, boolean spikes, boolean twoCasts, int swathLines, int beams,
                          double pingInterval, boolean singleBeamLines, boolean nmeaLine, long seed) {
        /** The bundled sample survey. */
        public static Options sample() {
            return new Options(true, true, true, 12, 32, 0.6, true, true, 20260514L);
        }

        /** Noise-free, spike-free, one cast: the recovery test of the reduction. */
        public static Options exact(int swathLines) {
            return new Options(false, false, false, swathLines, 32, 1.0, true, false, 1L);
        }
    }

    /** Chart-datum depth of the seabed at local east/north (m): the truth. */
    public static double depth(double e, double n) {
        double d = 9 + 8 * n / LENGTH + 0.6 * Math.sin(e / 45);
        double centre = 150 + 0.1 * (n - 200);
        double channel = 14 - Math.max(0, Math.abs(e - centre) - 25) / 8;
        d = Math.max(d, channel);
        double r2 = (e - SHOAL_E) * (e - SHOAL_E) + (n - SHOAL_N) * (n - SHOAL_N);
        d -= SHOAL_H * Math.exp(-r2 / (2 * SHOAL_SIGMA * SHOAL_SIGMA));
        return d - WRECK_H * wreckShape(e, n);
    }

    /** 1 on the wreck's flat top, 0 off it, smooth (smoothstep) across its edges. */
    static double wreckShape(double e, double n) {
        double de = e - WRECK_E, dn = n - WRECK_N;
        double along = de * Math.sin(WRECK_BEARING) + dn * Math.cos(WRECK_BEARING);
        double across = de * Math.cos(WRECK_BEARING) - dn * Math.sin(WRECK_BEARING);
        return edge(WRECK_LEN / 2 - Math.abs(along)) * edge(WRECK_WID / 2 - Math.abs(across));
    }

    private static double edge(double inside) {
        double x = Math.max(0, Math.min(1, (inside + WRECK_EDGE / 2) / WRECK_EDGE));
        return x * x * (3 - 2 * x);
    }

    /** The wreck's least depth (m below chart datum), by a fine search over its top. */
    public static double wreckLeastDepth() {
        double least = Double.POSITIVE_INFINITY;
        for (double e = WRECK_E - 12; e <= WRECK_E + 12; e += 0.05) {
            for (double n = WRECK_N - 12; n <= WRECK_N + 12; n += 0.05) least = Math.min(least, depth(e, n));
        }
        return least;
    }

    /** Gauge water level above chart datum at time t (s since epoch), m: semi-diurnal M2 and S2. */
    public static double gauge(double t) {
        double h = (t - START.getEpochSecond()) / 3600.0;
        return 1.45 + 0.95 * Math.sin(2 * Math.PI * h / 12.4206 + 0.7) + 0.25 * Math.sin(2 * Math.PI * h / 12.0 + 1.9);
    }

    /** Tide zone rule: north of n = 200 the tide comes 6 minutes later with a 1.06 range ratio. */
    public static double waterLevel(double t, double e, double n) {
        return n >= 200 ? 1.06 * gauge(t - 360) : gauge(t);
    }

    /** True temperature (deg C, ITS-90) and salinity at depth for cast k (0 early, 1 late). */
    static double temperature(int k, double z) {
        return k == 0 ? 12.6 - 2.2 * Math.tanh((z - 3.0) / 1.2) : 13.2 - 2.0 * Math.tanh((z - 4.0) / 1.5);
    }

    static double salinity(int k, double z) {
        return k == 0 ? 27.0 + 5.0 * Math.tanh((z - 3.0) / 1.0) : 28.0 + 4.2 * Math.tanh((z - 4.0) / 1.4);
    }

    /** True sound-speed profile of cast k (UNESCO equation, fine 0.1 m samples to 40 m). */
    public static SoundSpeedProfile trueProfile(int k) {
        int m = 401;
        double[] z = new double[m], c = new double[m];
        for (int i = 0; i < m; i++) {
            z[i] = 0.1 * i;
            double p = PressureDepth.pressure(z[i], LAT0);
            c[i] = SoundSpeedEquation.UNESCO.speed(temperature(k, z[i]), salinity(k, z[i]), p, z[i]);
        }
        return new SoundSpeedProfile(z, c, List.of());
    }

    /** The survey launch. */
    public static Vessel vessel() {
        return new Vessel(0.62, new double[]{0, 4 * KN, 6 * KN, 8 * KN}, new double[]{0, 0.03, 0.06, 0.10},
                new Vessel.Offset(-1.10, 0.30, -2.60), new Vessel.Offset(0.85, 0.00, 0.55), 0.0, 1500.0,
                Math.toRadians(3.0), new Vessel.SensorSigmas(0.01, 0.0008, 0.3, 0.6, 0.01, 0.015, 0.03, 0.05,
                Math.toRadians(0.03), Math.toRadians(0.03), Math.toRadians(0.08), 0.03, 0.002, 0.01, 0.015, 0.02));
    }

    static final double KN = 1852.0 / 3600.0;

    static final SurveySimulator.Motion MOTION = new SurveySimulator.Motion() {
        public double heave(double t) { return 0.25 * Math.sin(2 * Math.PI * t / 5.5) + 0.08 * Math.sin(2 * Math.PI * t / 3.3 + 1); }
        public double roll(double t) { return 3.5 * Math.sin(2 * Math.PI * t / 6.1); }
        public double pitch(double t) { return 1.2 * Math.sin(2 * Math.PI * t / 4.7 + 0.5); }
        public double yaw(double t) { return 1.5 * Math.sin(2 * Math.PI * t / 23); }
    };

    /** Summary of what was written. */
    public record Written(Path project, int soundings, int spikes, List<String> crosslines, double[] trueLat,
                          double[] trueLon, double[] trueDepth, double[] angle) {}

    /** Generates the survey into dir (created); returns the project file. */
    public static Written write(Path dir, Options o) throws IOException {
        Files.createDirectories(dir.resolve("pings"));
        Files.createDirectories(dir.resolve("casts"));
        Files.createDirectories(dir.resolve("tide"));
        Random rnd = new Random(o.seed());
        Vessel v = vessel();
        double t0 = START.getEpochSecond();
        SurveySimulator.WaterLevel tide = HarbourApproach::waterLevel;
        double[] beams = new double[o.beams()];
        for (int b = 0; b < beams.length; b++) beams[b] = -60 + 120.0 * b / (beams.length - 1);

        List<SurveySimulator.Result> swath = new ArrayList<>(), single = new ArrayList<>();
        List<SurveySimulator.Result> all = new ArrayList<>();
        double t = t0 + 300;
        double spacing = WIDTH / o.swathLines();
        for (int k = 0; k < o.swathLines(); k++) {
            double e = spacing * (k + 0.5);
            boolean north = k % 2 == 0;
            var plan = new SurveySimulator.LinePlan(String.format(Locale.ROOT, "M%02d", k + 1), e, north ? 0 : LENGTH, e,
                    north ? LENGTH : 0, 3.0, beams, o.pingInterval(), t);
            var r = simulator(o, t, v, tide).run(List.of(plan), 5, 10);
            swath.add(r);
            all.add(r);
            t += LENGTH / 3.0 + 60;
        }
        List<String> cross = new ArrayList<>();
        if (o.singleBeamLines()) {
            double[] ns = {60, 180, 300};
            for (int k = 0; k < ns.length; k++) {
                String name = "X" + (k + 1);
                cross.add(name);
                boolean east = k % 2 == 0;
                var plan = new SurveySimulator.LinePlan(name, east ? 0 : WIDTH, ns[k], east ? WIDTH : 0, ns[k], 2.5, null, 0.25, t);
                var r = simulator(o, t, v, tide).run(List.of(plan), 5, 10);
                single.add(r);
                all.add(r);
                t += WIDTH / 2.5 + 60;
            }
        }
        SurveySimulator.Result nmea = null;
        if (o.nmeaLine()) {
            var plan = new SurveySimulator.LinePlan("S1", 20, 20, 280, 380, 2.5, null, 0.2, t);
            nmea = simulator(o, t, v, tide).run(List.of(plan), 5, 20);
            all.add(nmea);
            t += Math.hypot(260, 360) / 2.5 + 60;
        }
        double tEnd = t;

        // pings
        int[] counts = new int[2];
        writePings(dir.resolve("pings/swath.csv"), swath, o, rnd, counts, true);
        if (!single.isEmpty()) writePings(dir.resolve("pings/singlebeam.csv"), single, o, rnd, counts, false);
        writeNavigation(dir.resolve("navigation.csv"), all);
        writeAttitude(dir.resolve("attitude.csv"), all);
        if (nmea != null) writeNmea(dir.resolve("pings/S1.nmea"), nmea, v, o, rnd);

        // casts, tide, zones, vessel, bar check
        writeCast(dir.resolve("casts/ctd-0655.csv"), 0, t0 - 300, rnd, o.noise());
        if (o.twoCasts()) writeCast(dir.resolve("casts/ctd-late.csv"), 1, tEnd + 120, rnd, o.noise());
        writeGauge(dir.resolve("tide/gauge.csv"), t0 - 1800, tEnd + 1800);
        writeZones(dir.resolve("tide/zones.geojson"));
        VesselWriter.write(v, dir.resolve("vessel.yaml"));
        writeBarCheck(dir.resolve("barcheck.csv"), v, rnd);
        writeTruth(dir.resolve("truth.csv"));

        StringBuilder p = new StringBuilder();
        p.append("# Leadline sample survey: approach to Wrenmouth (an invented harbour). Generated by\n")
                .append("# org.leadline.synthetic.HarbourApproach (src/test/java); invented data, not for navigation.\n")
                .append("name: Wrenmouth approach (sample)\ninputs:\n  soundings:\n    - pings/swath.csv\n");
        if (!single.isEmpty()) p.append("    - pings/singlebeam.csv\n");
        if (nmea != null) p.append("  nmea: [pings/S1.nmea]\n");
        p.append("  navigation: navigation.csv\n  attitude: attitude.csv\n  casts:\n    - casts/ctd-0655.csv\n");
        if (o.twoCasts()) p.append("    - casts/ctd-late.csv\n");
        p.append("  tide: tide/gauge.csv\n  tide_zones: tide/zones.geojson\n  vessel: vessel.yaml\n")
                .append("  journal: edits.journal\nsettings:\n  equation: unesco\n  cell_m: 2.0\n  crs: auto\n")
                .append("  surface: median\n  order: special\n")
                .append("  cast_selection: ").append(o.twoCasts() ? "interpolate-time" : "nearest-time").append('\n');
        if (!cross.isEmpty()) p.append("  crosslines: [").append(String.join(", ", cross)).append("]\n");
        Path project = dir.resolve("project.yaml");
        Files.writeString(project, p.toString(), StandardCharsets.UTF_8);
        List<SurveySimulator.Result> order = new ArrayList<>(swath);
        order.addAll(single);
        if (nmea != null) order.add(nmea);
        int total = 0;
        for (var r : order) total += r.time.size();
        double[] la = new double[total], lo = new double[total], de = new double[total], an = new double[total];
        int at = 0;
        for (var r : order) {
            for (int i = 0; i < r.time.size(); i++, at++) {
                la[at] = r.trueLat.get(i);
                lo[at] = r.trueLon.get(i);
                de[at] = r.trueDepth.get(i);
                an[at] = r.angle.get(i);
            }
        }
        return new Written(project, counts[0], counts[1], cross, la, lo, de, an);
    }

    private static SurveySimulator simulator(Options o, double t, Vessel v, SurveySimulator.WaterLevel tide) {
        SoundSpeedProfile truth = o.twoCasts() ? blend(trueProfile(0), trueProfile(1),
                Math.max(0, Math.min(1, (t - START.getEpochSecond()) / 3300.0))) : trueProfile(0);
        return new SurveySimulator(LAT0, LON0, HarbourApproach::depth, tide, MOTION, v, new RayTracer(truth)::trace);
    }

    static SoundSpeedProfile blend(SoundSpeedProfile a, SoundSpeedProfile b, double w) {
        double[] z = a.depths(), c = new double[z.length];
        for (int i = 0; i < z.length; i++) c[i] = (1 - w) * a.speedAt(z[i]) + w * b.speedAt(z[i]);
        return new SoundSpeedProfile(z, c, List.of());
    }

    private static void writePings(Path f, List<SurveySimulator.Result> rs, Options o, Random rnd, int[] counts,
                                   boolean swath) throws IOException {
        try (BufferedWriter w = Files.newBufferedWriter(f, StandardCharsets.UTF_8)) {
            w.write(swath ? "time,twtt,angle,line,beam\n" : "time,twtt,line\n");
            for (SurveySimulator.Result r : rs) {
                for (int i = 0; i < r.time.size(); i++) {
                    double twtt = r.twtt.get(i);
                    if (o.noise()) twtt += 2 * rnd.nextGaussian() * 0.008 / 1480;
                    if (o.spikes()) {
                        double u = rnd.nextDouble();
                        if (u < 0.003) { twtt *= 0.3 + 0.4 * rnd.nextDouble(); counts[1]++; }       // fish / mid-water return
                        else if (u < 0.004) { twtt *= 2; counts[1]++; }                            // second echo
                        else if (u < 0.005) { twtt = 0; counts[1]++; }                             // dropout
                    }
                    w.write(iso(r.time.get(i)));
                    w.write(String.format(Locale.ROOT, ",%.7f", twtt));
                    if (swath) w.write(String.format(Locale.ROOT, ",%.3f", r.angle.get(i)));
                    w.write(',');
                    w.write(r.lineNames.get(r.line.get(i)));
                    if (swath) w.write("," + r.beam.get(i));
                    w.write('\n');
                    counts[0]++;
                }
            }
        }
    }

    private static void writeNavigation(Path f, List<SurveySimulator.Result> rs) throws IOException {
        try (BufferedWriter w = Files.newBufferedWriter(f, StandardCharsets.UTF_8)) {
            w.write("time,lat,lon\n");
            for (SurveySimulator.Result r : rs) {
                for (int i = 0; i < r.navTime.size(); i++) {
                    w.write(iso(r.navTime.get(i)) + String.format(Locale.ROOT, ",%.9f,%.9f\n", r.navLat.get(i), r.navLon.get(i)));
                }
            }
        }
    }

    private static void writeAttitude(Path f, List<SurveySimulator.Result> rs) throws IOException {
        try (BufferedWriter w = Files.newBufferedWriter(f, StandardCharsets.UTF_8)) {
            w.write("time,heading,heave,roll,pitch\n");
            for (SurveySimulator.Result r : rs) {
                for (int i = 0; i < r.attTime.size(); i++) {
                    w.write(iso(r.attTime.get(i)) + String.format(Locale.ROOT, ",%.3f,%.4f,%.4f,%.4f\n", r.attHeading.get(i),
                            r.attHeave.get(i), r.attRoll.get(i), r.attPitch.get(i)));
                }
            }
        }
    }

    /** NMEA 0183 log of a single-beam line: ZDA once a second, GGA + HDT + VTG + DBT per ping. */
    private static void writeNmea(Path f, SurveySimulator.Result r, Vessel v, Options o, Random rnd) throws IOException {
        try (BufferedWriter w = Files.newBufferedWriter(f, StandardCharsets.US_ASCII)) {
            long lastZda = Long.MIN_VALUE;
            for (int i = 0; i < r.time.size(); i++) {
                double t = r.time.get(i);
                ZonedDateTime z = Instant.ofEpochMilli(Math.round(t * 1000)).atZone(ZoneOffset.UTC);
                String hms = String.format(Locale.ROOT, "%02d%02d%06.3f", z.getHour(), z.getMinute(), z.getSecond() + z.getNano() / 1e9);
                if ((long) Math.floor(t) != lastZda) {
                    lastZda = (long) Math.floor(t);
                    w.write(sentence(String.format(Locale.ROOT, "GPZDA,%s,%02d,%02d,%04d,00,00", hms, z.getDayOfMonth(),
                            z.getMonthValue(), z.getYear())));
                }
                double lat = r.lat.get(i), lon = r.lon.get(i);
                w.write(sentence(String.format(Locale.ROOT, "GPGGA,%s,%s,%s,4,14,0.7,2.1,M,45.0,M,1.0,0001", hms,
                        latField(lat), lonField(lon))));
                w.write(sentence(String.format(Locale.ROOT, "HEHDT,%.2f,T", r.heading.get(i))));
                w.write(sentence(String.format(Locale.ROOT, "GPVTG,%.1f,T,,M,%.2f,N,%.2f,K,D", r.heading.get(i),
                        2.5 / KN, 2.5 * 3.6)));
                double twtt = r.twtt.get(i) + (o.noise() ? 2 * rnd.nextGaussian() * 0.008 / 1480 : 0);
                double d = v.sounderSetSpeed() * twtt / 2; // the sounder's own depth at its set speed
                w.write(sentence(String.format(Locale.ROOT, "SDDBT,%.1f,f,%.2f,M,%.1f,F", d / 0.3048, d, d / 1.8288)));
            }
        }
    }

    private static String sentence(String body) {
        return "$" + body + String.format(Locale.ROOT, "*%02X\r\n", NmeaReader.checksum(body));
    }

    private static String latField(double lat) {
        double a = Math.abs(lat);
        int deg = (int) a;
        return String.format(Locale.ROOT, "%02d%09.6f,%s", deg, (a - deg) * 60, lat >= 0 ? "N" : "S");
    }

    private static String lonField(double lon) {
        double a = Math.abs(lon);
        int deg = (int) a;
        return String.format(Locale.ROOT, "%03d%09.6f,%s", deg, (a - deg) * 60, lon >= 0 ? "E" : "W");
    }

    /** A CTD downcast with conductivity (soak at 1 m, descent at 0.5 m/s, 8 Hz, then the upcast). */
    private static void writeCast(Path f, int k, double time, Random rnd, boolean noise) throws IOException {
        double maxDepth = 30;
        try (BufferedWriter w = Files.newBufferedWriter(f, StandardCharsets.UTF_8)) {
            w.write("# Invented CTD cast of the Leadline sample survey (HarbourApproach forward model)\n");
            w.write("# name: " + f.getFileName().toString().replace(".csv", "") + "\n");
            w.write("# time: " + iso(time) + "\n");
            w.write(String.format(Locale.ROOT, "# lat: %.6f%n# lon: %.6f%n", LAT0 + 0.0015, LON0 + 0.0020));
            w.write("# temperature_scale: ITS-90\npressure,temperature,conductivity\n");
            List<Double> zs = new ArrayList<>();
            for (int i = 0; i < 80; i++) zs.add(1.0 + 0.05 * Math.sin(i / 5.0));   // soak near 1 m
            for (double z = 0.4; z <= maxDepth; z += 0.5 / 8) zs.add(z);            // downcast
            for (double z = maxDepth; z >= 0.5; z -= 0.8 / 8) zs.add(z);            // upcast
            for (double z : zs) {
                double p = PressureDepth.pressure(z, LAT0);
                double tt = temperature(k, z) + (noise ? rnd.nextGaussian() * 0.002 : 0);
                double s = salinity(k, z) + (noise ? rnd.nextGaussian() * 0.003 : 0);
                double c = Pss78.conductivityFromSalinity(s, tt, p);
                w.write(String.format(Locale.ROOT, "%.3f,%.4f,%.4f%n", p, tt, c));
            }
        }
    }

    private static void writeGauge(Path f, double from, double to) throws IOException {
        try (BufferedWriter w = Files.newBufferedWriter(f, StandardCharsets.UTF_8)) {
            w.write("# Tide gauge at Wrenmouth quay (invented), levels above chart datum, 6-minute record\ntime,level\n");
            for (double t = Math.floor(from / 360) * 360; t <= to; t += 360) {
                w.write(iso(t) + String.format(Locale.ROOT, ",%.4f%n", gauge(t)));
            }
        }
    }

    /** Two zones split at n = 200 m (south: the gauge; north: 6 min later, ratio 1.06). */
    private static void writeZones(Path f) throws IOException {
        SurveySimulator sim = new SurveySimulator(LAT0, LON0, (e, n) -> 0, (t, e, n) -> 0, MOTION, vessel(), (a, b, c, d) -> {});
        StringBuilder s = new StringBuilder("{\"type\":\"FeatureCollection\",\"features\":[\n");
        double[][] south = {{-500, -500}, {800, -500}, {800, 200}, {-500, 200}};
        double[][] north = {{-500, 200}, {800, 200}, {800, 900}, {-500, 900}};
        s.append(zone(sim, "Wrenmouth south", south, 0, 1.0)).append(",\n");
        s.append(zone(sim, "Wrenmouth north", north, 6, 1.06)).append("\n]}\n");
        Files.writeString(f, s.toString(), StandardCharsets.UTF_8);
    }

    private static String zone(SurveySimulator sim, String name, double[][] en, double offsetMin, double ratio) {
        StringBuilder s = new StringBuilder("{\"type\":\"Feature\",\"properties\":{\"name\":\"" + name
                + "\",\"time_offset_min\":" + offsetMin + ",\"range_ratio\":" + ratio
                + "},\"geometry\":{\"type\":\"Polygon\",\"coordinates\":[[");
        for (int i = 0; i <= en.length; i++) {
            double[] ll = sim.fromLocal(en[i % en.length][0], en[i % en.length][1]);
            s.append(i == 0 ? "" : ",").append(String.format(Locale.ROOT, "[%.8f,%.8f]", ll[1], ll[0]));
        }
        return s.append("]]}}").toString();
    }

    /** Bar check: readings at the set speed over the true early profile, with a +0.04 m index error. */
    private static void writeBarCheck(Path f, Vessel v, Random rnd) throws IOException {
        SoundSpeedProfile p = trueProfile(0);
        StringBuilder s = new StringBuilder("# Bar check before the survey (invented); depths below the still water surface\n");
        s.append(String.format(Locale.ROOT, "# set_speed: %.0f%nbar_depth,reading%n", v.sounderSetSpeed()));
        for (double bar = 2; bar <= 12; bar += 2) {
            double tOne = p.travelTime(v.transducerDraft(), bar);
            double reading = v.transducerDraft() + v.sounderSetSpeed() * tOne + 0.04 + rnd.nextGaussian() * 0.005;
            s.append(String.format(Locale.ROOT, "%.2f,%.3f%n", bar, reading));
        }
        Files.writeString(f, s.toString(), StandardCharsets.UTF_8);
    }

    /** The truth: seabed depth every 5 m over the area, as local and WGS84 coordinates. */
    private static void writeTruth(Path f) throws IOException {
        SurveySimulator sim = new SurveySimulator(LAT0, LON0, (e, n) -> 0, (t, e, n) -> 0, MOTION, vessel(), (a, b, c, d) -> {});
        try (BufferedWriter w = Files.newBufferedWriter(f, StandardCharsets.UTF_8)) {
            w.write(String.format(Locale.ROOT, "# True seabed of the sample survey (m below chart datum). Wreck least depth %.3f m.%n",
                    wreckLeastDepth()));
            w.write("east_m,north_m,lat,lon,depth\n");
            for (double n = 0; n <= LENGTH; n += 5) {
                for (double e = 0; e <= WIDTH; e += 5) {
                    double[] ll = sim.fromLocal(e, n);
                    w.write(String.format(Locale.ROOT, "%.0f,%.0f,%.8f,%.8f,%.3f%n", e, n, ll[0], ll[1], depth(e, n)));
                }
            }
        }
    }

    static String iso(double t) {
        return org.leadline.io.IsoTime.format(t);
    }

    /** Writes the bundled sample survey: {@code java ... HarbourApproach sample-surveys/harbour-approach}. */
    public static void main(String[] args) throws IOException {
        Path dir = Path.of(args.length > 0 ? args[0] : "sample-surveys/harbour-approach");
        Written w = write(dir, Options.sample());
        List<String> files = new ArrayList<>();
        try (var s = Files.walk(dir)) {
            s.filter(Files::isRegularFile).forEach(p -> files.add(dir.relativize(p).toString().replace('\\', '/')));
        }
        files.remove("FILES");
        java.util.Collections.sort(files);
        Files.writeString(dir.resolve("FILES"), String.join("\n", files) + "\n");
        System.out.println("wrote " + w.soundings() + " soundings (" + w.spikes() + " spikes) to " + dir);
    }
}
