package org.leadline.bench;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import org.leadline.io.BinaryPingWriter;
import org.leadline.io.Fixed;
import org.leadline.io.IsoTime;
import org.leadline.raypath.RayTable;
import org.leadline.watercolumn.SoundSpeedProfile;
import org.leadline.survey.PingTable;

/**
 * A large synthetic multibeam day for benchmarks, deterministic from a seed: a ping table of
 * {@code beams x pings} soundings over a sloping, gently undulating seabed (20-60 m), a cast
 * (thermocline 1512 -> 1488 m/s), a semidiurnal water-level record and a {@code project.yaml};
 * optionally the same pings in Leadline's binary ping format ({@code pings.lpb}).
 *
 * <p>Forward model (invented data, for speed measurements only, not an accuracy reference):
 * lines 1000 m long, 100 m apart, run alternately east and west at 4 m/s, 5 pings per second;
 * 256 beams from -65 to +65 degrees, not roll-stabilised (earth-frame angle = beam angle - roll,
 * DESIGN.md section 3); roll 3 deg (8 s period), pitch 1.5 deg (6 s), heave 0.3 m (7 s); two-way
 * times of the ray bent through the cast's profile ({@link RayTable}, i.e. Leadline's own ray
 * bending: the day is consistent with the processing, it is not an independent reference) to the
 * seabed where the ray meets it, plus 0.1 % range noise and 1 in 20 000 spikes.
 *
 * <pre>
 * java -cp target/classes:target/test-classes org.leadline.bench.SwathDayGenerator \
 *      --out /tmp/day --soundings 10000000 [--beams 256] [--seed 1] [--binary] [--no-csv]
 * </pre>
 */
public final class SwathDayGenerator {
    static final double LAT0 = 50.30, LON0 = -4.20, M_PER_DEG = 111_320.0;
    static final double START = 1778745600.0; // 2026-05-14T08:00:00Z
    static final double DRAFT = 1.5, LINE_LENGTH = 1000, LINE_SPACING = 100, SPEED = 4, PING_RATE = 5;

    private SwathDayGenerator() {}

    public static void main(String[] args) throws IOException {
        Path out = Path.of("target/swath-day");
        long n = 10_000_000;
        int beams = 256;
        long seed = 1;
        boolean binary = false, csv = true;
        for (int i = 0; i < args.length; i++) {
            switch (args[i]) {
                case "--out" -> out = Path.of(args[++i]);
                case "--soundings" -> n = Long.parseLong(args[++i].replace("_", ""));
                case "--beams" -> beams = Integer.parseInt(args[++i]);
                case "--seed" -> seed = Long.parseLong(args[++i]);
                case "--binary" -> binary = true;
                case "--no-csv" -> csv = false;
                default -> throw new IllegalArgumentException("unknown option " + args[i]);
            }
        }
        long t0 = System.nanoTime();
        write(out, n, beams, seed, csv, binary);
        System.out.printf(Locale.ROOT, "wrote %d soundings to %s in %.1f s%n", n, out, (System.nanoTime() - t0) / 1e9);
    }

    /** Writes the day into {@code dir}: pings.csv (if csv), pings.lpb (if binary), cast.csv, tide.csv, project.yaml. */
    public static void write(Path dir, long soundings, int beams, long seed, boolean csv, boolean binary) throws IOException {
        Files.createDirectories(dir);
        double[] castZ = new double[401], castC = new double[401];
        for (int k = 0; k < castZ.length; k++) {
            castZ[k] = 0.5 * k;
            castC[k] = Math.round(speed(castZ[k]) * 1000) / 1000.0; // as written to cast.csv
        }
        RayTable rays = new RayTable(new SoundSpeedProfile(castZ, castC, List.of()), 0.5, 3.0, Math.toRadians(75), 0.2);
        int pings = (int) ((soundings + beams - 1) / beams);
        if (csv) {
            try (BufferedWriter w = new BufferedWriter(new OutputStreamWriter(Files.newOutputStream(dir.resolve("pings.csv")),
                    StandardCharsets.US_ASCII), 1 << 20)) {
                w.write("time,lat,lon,twtt,angle,heading,heave,roll,pitch,line,beam\n");
                StringBuilder sb = new StringBuilder(1 << 16);
                double[] lastT = {Double.NaN};
                StringBuilder timeText = new StringBuilder();
                generate(soundings, beams, seed, rays, (t, la, lo, tw, an, hd, hv, ro, pi, line, beam) -> {
                    if (t != lastT[0]) { // beams of one ping share a time: format it once
                        timeText.setLength(0);
                        IsoTime.append(timeText, t);
                        lastT[0] = t;
                    }
                    sb.append(timeText).append(',');
                    Fixed.append(sb, la, 8).append(',');
                    Fixed.append(sb, lo, 8).append(',');
                    Fixed.append(sb, tw, 6).append(',');
                    Fixed.append(sb, an, 3).append(',');
                    Fixed.append(sb, hd, 2).append(',');
                    Fixed.append(sb, hv, 3).append(',');
                    Fixed.append(sb, ro, 3).append(',');
                    Fixed.append(sb, pi, 3).append(',');
                    sb.append(lineName(line)).append(',').append(beam).append('\n');
                    if (sb.length() > (1 << 16) - 200) {
                        try {
                            w.append(sb);
                        } catch (IOException e) {
                            throw new java.io.UncheckedIOException(e);
                        }
                        sb.setLength(0);
                    }
                });
                w.append(sb);
            }
        }
        if (binary) {
            // the binary file holds exactly what the CSV reader reads from pings.csv: values rounded as written
            // there; streamed in chunks of one block, so memory does not grow with the day
            try (OutputStream os = Files.newOutputStream(dir.resolve("pings.lpb"));
                 BinaryChunker chunker = new BinaryChunker(os, soundings, beams)) {
                generate(soundings, beams, seed, rays, chunker);
            }
        }
        try (BufferedWriter w = Files.newBufferedWriter(dir.resolve("cast.csv"))) {
            w.write("# name: synthetic day cast\n# time: 2026-05-14T07:50:00Z\n");
            w.write(String.format(Locale.ROOT, "# lat: %.5f%n# lon: %.5f%n", LAT0, LON0));
            w.write("depth,sound_speed\n");
            for (int k = 0; k < castZ.length; k++) w.write(String.format(Locale.ROOT, "%.1f,%.3f%n", castZ[k], castC[k]));
        }
        double end = START + pings / PING_RATE + 60.0 * (pings / (LINE_LENGTH / SPEED * PING_RATE) + 2) + 3600;
        try (BufferedWriter w = Files.newBufferedWriter(dir.resolve("tide.csv"))) {
            w.write("time,level\n");
            for (double t = START - 3600; t <= end; t += 360) {
                double level = 2.0 + 1.5 * Math.sin(2 * Math.PI * (t - START) / (12.42 * 3600));
                w.write(IsoTime.format(t) + "," + String.format(Locale.ROOT, "%.3f", level) + "\n");
            }
        }
        String soundingsFile = csv ? "pings.csv" : "pings.lpb";
        Files.writeString(dir.resolve("project.yaml"), String.join("\n",
                "name: Synthetic swath day (benchmark, invented data)",
                "inputs:",
                "  soundings: [" + soundingsFile + "]",
                "  casts: [cast.csv]",
                "  tide: tide.csv",
                "settings:",
                "  cell_m: 1.0",
                "  crs: auto",
                "  surface: median",
                "  order: 1a",
                "  draft_m: " + DRAFT,
                ""));
    }

    /** Line names of the day: L001, L002, ... for the lines its pings reach (what a reader of pings.csv numbers). */
    static List<String> lineNames(long soundings, int beams) {
        long pings = (soundings + beams - 1) / beams;
        long pingsPerLine = (long) (LINE_LENGTH / SPEED * PING_RATE);
        List<String> names = new java.util.ArrayList<>();
        for (int l = 0; l < (pings + pingsPerLine - 1) / pingsPerLine; l++) names.add(lineName(l));
        return names;
    }

    /**
     * Gathers soundings into chunks of one block and appends them to a {@link BinaryPingWriter.Stream}:
     * the same columns, line names and rounded values as the whole table the generator used to build
     * ({@code BinaryPingWriter.write} of the CSV's table), hence the same bytes.
     */
    private static final class BinaryChunker implements Sink, java.io.Closeable {
        private final BinaryPingWriter.Stream out;
        private final List<String> names;
        private final int cap = BinaryPingWriter.BLOCK_ROWS;
        private final double[][] d = new double[10][cap];
        private final int[][] in = new int[3][cap];
        private int n;

        BinaryChunker(OutputStream os, long soundings, int beams) throws IOException {
            names = lineNames(soundings, beams);
            // every generated column has values (depth and quality never do); an empty day stores time only
            List<String> columns = soundings == 0 ? List.of("time")
                    : List.of("time", "lat", "lon", "twtt", "angle", "heading", "heave", "roll", "pitch", "line", "beam");
            out = BinaryPingWriter.open(os, soundings, names, columns);
        }

        @Override
        public void accept(double t, double la, double lo, double tw, double an, double hd, double hv, double ro,
                           double pi, int line, int beam) {
            d[0][n] = roundTime(t); d[1][n] = round(la, 8); d[2][n] = round(lo, 8); d[3][n] = round(tw, 6);
            d[4][n] = Double.NaN; d[5][n] = round(an, 3); d[6][n] = round(hd, 2); d[7][n] = round(hv, 3);
            d[8][n] = round(ro, 3); d[9][n] = round(pi, 3);
            in[0][n] = line; in[1][n] = beam; in[2][n] = -1;
            if (++n == cap) flush();
        }

        private void flush() {
            if (n == 0) return;
            double[][] c = new double[10][];
            int[][] ci = new int[3][];
            for (int k = 0; k < 10; k++) c[k] = java.util.Arrays.copyOf(d[k], n);
            for (int k = 0; k < 3; k++) ci[k] = java.util.Arrays.copyOf(in[k], n);
            try {
                out.append(PingTable.ofColumns(n, c[0], c[1], c[2], c[3], c[4], c[5], c[6], c[7], c[8], c[9],
                        ci[0], ci[1], ci[2], names));
            } catch (IOException e) {
                throw new java.io.UncheckedIOException(e);
            }
            n = 0;
        }

        @Override
        public void close() throws IOException {
            flush();
            out.close();
        }
    }

    /** The value the CSV reader gets back from {@link Fixed#append}'s text (half away from zero, no -0). */
    static double round(double v, int decimals) {
        double s = Math.pow(10, decimals);
        long q = Math.round(Math.abs(v) * s);
        return q == 0 ? 0.0 : (v < 0 ? -q : q) / s;
    }

    /** The value {@code IsoTime.parse} gets back from {@link IsoTime#append}'s text (whole seconds + fraction). */
    static double roundTime(double t) {
        long ms = Math.round(t * 1000.0);
        return Math.floorDiv(ms, 1000) + Math.floorMod(ms, 1000) / 1000.0;
    }

    /** Receives one sounding. */
    interface Sink {
        void accept(double time, double lat, double lon, double twtt, double angle, double heading, double heave,
                    double roll, double pitch, int line, int beam);
    }

    private static final java.util.Map<Integer, String> NAMES = new java.util.concurrent.ConcurrentHashMap<>();

    static String lineName(int line) { return NAMES.computeIfAbsent(line, l -> String.format(Locale.ROOT, "L%03d", l + 1)); }

    /** Sound speed of the synthetic cast at depth z (m): a 1512 m/s mixed layer over a thermocline to 1488 m/s. */
    static double speed(double z) {
        return 1488 + 24 / (1 + Math.exp((z - 15) / 3.0)) + 0.016 * z;
    }


    /** Seabed depth (m, below mean water) at local east x, north y (m): sloping with sand waves. */
    /** Depth of the ray below the seabed (negative above it) after one-way time t, the seabed taken where the ray is. */
    private static double miss(RayTable rays, double zt, double th, double t, double x0, double y0, double sx, double sy,
                               double tide, double[] out) {
        rays.lookup(zt, th, t, out);
        return zt + out[0] - (seabed(x0 + sx * out[1], y0 + sy * out[1]) + tide);
    }

    static double seabed(double x, double y) {
        return 22 + 0.008 * x + 0.01 * y + 1.2 * Math.sin(x / 37.0) * Math.cos(y / 53.0) + 0.4 * Math.sin((x + y) / 11.0);
    }

    static void generate(long soundings, int beams, long seed, RayTable rays, Sink sink) {
        double[] out = new double[2];
        SplittableRandom rnd = new SplittableRandom(seed);
        int pingsPerLine = (int) (LINE_LENGTH / SPEED * PING_RATE);
        double cosLat = Math.cos(Math.toRadians(LAT0));
        long written = 0;
        double t = START;
        int ping = 0;
        double rollPhase = rnd.nextDouble() * 6.28, pitchPhase = rnd.nextDouble() * 6.28, heavePhase = rnd.nextDouble() * 6.28;
        while (written < soundings) {
            int line = ping / pingsPerLine, k = ping % pingsPerLine;
            if (k == 0 && ping > 0) t += 60; // turn between lines
            boolean east = line % 2 == 0;
            double along = east ? k * SPEED / PING_RATE : LINE_LENGTH - k * SPEED / PING_RATE;
            double northing = line * LINE_SPACING + 0.8 * Math.sin(t / 90.0);
            double heading = (east ? 90 : 270) + 0.8 * Math.sin(t / 40.0);
            double roll = 3.0 * Math.sin(2 * Math.PI * t / 8 + rollPhase);
            double pitch = 1.5 * Math.sin(2 * Math.PI * t / 6 + pitchPhase);
            double heave = 0.3 * Math.sin(2 * Math.PI * t / 7 + heavePhase);
            double tide = 2.0 + 1.5 * Math.sin(2 * Math.PI * (t - START) / (12.42 * 3600));
            double lat = LAT0 + northing / M_PER_DEG, lon = LON0 + along / (M_PER_DEG * cosLat);
            double zt = DRAFT - heave;
            // starboard unit vector on the ground for this heading (east = (sin h, cos h) -> starboard = (cos h, -sin h))
            double hr = Math.toRadians(heading), sx = Math.cos(hr), sy = -Math.sin(hr);
            double d0 = seabed(along, northing) + tide; // below the water surface
            double slope = (seabed(along + sx, northing + sy) - seabed(along - sx, northing - sy)) / 2;
            for (int b = 0; b < beams && written < soundings; b++, written++) {
                double angle = -65 + 130.0 * b / (beams - 1);
                double th = Math.toRadians(angle - roll);
                // one-way time at which the bent ray meets the seabed: secant iterations on miss(t) = ray
                // depth - seabed depth under the ray, from the straight-ray guess to the local plane at 1500 m/s
                double t0 = (d0 - zt) / (Math.cos(th) - slope * Math.sin(th)) / 1500, t1 = t0 * 1.01;
                double m0 = miss(rays, zt, th, t0, along, northing, sx, sy, tide, out);
                double m1 = miss(rays, zt, th, t1, along, northing, sx, sy, tide, out);
                for (int it = 0; it < 8 && Math.abs(m1) > 1e-5 && m1 != m0; it++) {
                    double t2 = t1 - m1 * (t1 - t0) / (m1 - m0);
                    t0 = t1; m0 = m1;
                    t1 = t2; m1 = miss(rays, zt, th, t1, along, northing, sx, sy, tide, out);
                }
                double noise = 1 + 0.001 * rnd.nextGaussian();
                if (rnd.nextInt(20_000) == 0) noise *= 0.6 + 0.8 * rnd.nextDouble(); // spike
                double twtt = 2 * t1 * noise;
                sink.accept(t, lat, lon, twtt, angle, (heading + 360) % 360, heave, roll, pitch, line, b);
            }
            ping++;
            t += 1 / PING_RATE;
        }
    }
}
