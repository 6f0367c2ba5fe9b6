package org.leadline.workbench;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Instant;
import java.util.Locale;

/**
 * A small invented survey written into a folder for the workbench tests (until the sample survey
 * is used): five east-west main lines 40 m apart and one north-south crossline over a plane
 * seabed sloping down to the north-east, a single-beam sounder at 1 ping/s and 2 m/s (2 m between
 * pings, worked by hand: 2 m/s x 1 s), a velocimeter cast at 1500 m/s, a CTD cast with one
 * temperature spike for the cast QC to reject, a water-level record and a vessel file.
 *
 * <p>Seabed below chart datum, m: {@code D(e, n) = 8 + 0.005 e + 0.02 n} with e, n metres east
 * and north of the survey origin. A fish school makes pings 100 to 102 of line L3 read 4 m
 * shoaler. Two-way travel time at 1500 m/s: {@code twtt = 2 (D + level - draft) / 1500}.
 */
final class TestSurvey {
    static final double LAT0 = 50.10, LON0 = -4.20;
    static final double T0 = Instant.parse("2026-05-14T09:00:00Z").getEpochSecond();
    static final double DRAFT = 0.5, SPEED = 2.0;
    static final int PINGS_PER_LINE = 200;
    static final String[] MAIN = {"L1", "L2", "L3", "L4", "L5"};

    private TestSurvey() {}

    static double seabed(double e, double n) { return 8 + 0.005 * e + 0.02 * n; }

    static double level(double t) { return 0.8 + 0.3 * Math.sin(2 * Math.PI * (t - T0) / (12.42 * 3600)); }

    /** Writes the survey into dir and returns the project file. */
    static Path write(Path dir) throws IOException {
        Files.createDirectories(dir);
        StringBuilder p = new StringBuilder("time,lat,lon,twtt,line\n");
        double t = T0;
        // metres per degree on the WGS84 ellipsoid at LAT0: meridian radius M and prime-vertical
        // radius N (e.g. Snyder 1987, USGS Prof. Paper 1395, eq. 4-18 and 4-20)
        double a = 6378137, e2 = 0.00669437999014, sin = Math.sin(Math.toRadians(LAT0));
        double w = Math.sqrt(1 - e2 * sin * sin);
        double mPerLat = Math.toRadians(a * (1 - e2) / (w * w * w));
        double mPerLon = Math.toRadians(a / w * Math.cos(Math.toRadians(LAT0)));
        for (int l = 0; l < MAIN.length; l++) {
            double n = 40 * l;
            boolean east = l % 2 == 0;
            for (int k = 0; k < PINGS_PER_LINE; k++, t += 1) {
                double e = east ? SPEED * k : SPEED * (PINGS_PER_LINE - 1 - k);
                double d = seabed(e, n);
                if (l == 2 && k >= 100 && k <= 102) d -= 4; // fish school
                ping(p, t, LAT0 + n / mPerLat, LON0 + e / mPerLon, d, MAIN[l]);
            }
            t += 60;
        }
        for (int k = 0; k < 90; k++, t += 1) { // crossline, north to south along e = 200 m
            double e = 200, n = 170 - SPEED * k;
            ping(p, t, LAT0 + n / mPerLat, LON0 + e / mPerLon, seabed(e, n), "X1");
        }
        Files.writeString(dir.resolve("pings.csv"), p);

        StringBuilder c1 = new StringBuilder("# name: SV1\n# time: 2026-05-14T08:55:00Z\n# lat: 50.1\n# lon: -4.2\n"
                + "depth,sound_speed\n");
        for (int z = 0; z <= 16; z++) c1.append(z).append(",1500.0\n");
        Files.writeString(dir.resolve("cast-sv.csv"), c1);

        StringBuilder c2 = new StringBuilder("# name: CTD2\n# time: 2026-05-14T10:30:00Z\n# lat: 50.101\n# lon: -4.198\n"
                + "depth,temperature,salinity\n");
        for (int k = 0; k <= 60; k++) {
            double z = 0.25 * k;
            double temp = 14.0 - 0.15 * z;
            if (k == 30) temp += 6; // a spike for the QC
            c2.append(String.format(Locale.ROOT, "%.2f,%.3f,%.3f%n", z, temp, 34.2 + 0.02 * z));
        }
        Files.writeString(dir.resolve("cast-ctd.csv"), c2);

        StringBuilder wl = new StringBuilder("time,level\n");
        for (double tt = T0 - 600; tt <= t + 600; tt += 300) {
            wl.append(Instant.ofEpochSecond((long) tt)).append(',')
                    .append(String.format(Locale.ROOT, "%.4f", level(tt))).append('\n');
        }
        Files.writeString(dir.resolve("tide.csv"), wl);

        Files.writeString(dir.resolve("vessel.yaml"), "name: Test launch\ndraft_m: " + DRAFT + "\n"
                + "sounder:\n  set_speed_m_s: 1500\n  beam_width_deg: 8\n");
        Path project = dir.resolve("project.yaml");
        Files.writeString(project, """
                name: Workbench test survey
                inputs:
                  soundings: [pings.csv]
                  casts: [cast-sv.csv, cast-ctd.csv]
                  tide: tide.csv
                  vessel: vessel.yaml
                settings:
                  cell_m: 5
                  order: 1a
                  crosslines: [X1]
                """);
        return project;
    }

    private static void ping(StringBuilder p, double t, double lat, double lon, double depth, String line) {
        double twtt = 2 * (depth + level(t) - DRAFT) / 1500;
        p.append(Instant.ofEpochSecond((long) t)).append(',')
                .append(String.format(Locale.ROOT, "%.8f,%.8f,%.7f,", lat, lon, twtt)).append(line).append('\n');
    }
}
