package org.leadline.io;

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

/**
 * Writes synthetic NMEA 0183 logs for the tests: a straight survey line at constant speed and
 * heading over an invented sea position, with deliberate bad lines. Deterministic (no random
 * numbers), so the committed {@code src/test/resources/nmea/line-midnight.nmea} can be regenerated:
 * <pre>
 *   java -cp target/test-classes:target/classes org.leadline.io.NmeaLogGenerator small src/test/resources/nmea/line-midnight.nmea
 *   java -cp target/test-classes:target/classes org.leadline.io.NmeaLogGenerator big /tmp/big.nmea 1000000
 * </pre>
 * The checksum here is computed by its own loop, independent of {@link NmeaReader#checksum}.
 */
public final class NmeaLogGenerator {

    /** Start of the small log: 30 s before midnight, so the line crosses 00:00 UTC. */
    public static final Instant START = Instant.parse("2026-05-14T23:59:30Z");
    /** Invented start position (open water), degrees. */
    public static final double LAT0 = 50.5, LON0 = -1.25;
    /** Course and speed over ground: 045 deg true, 2.0 m/s. */
    public static final double COURSE = 45.0, SPEED = 2.0;
    /** Seconds of the small log. */
    public static final int SECONDS = 60;
    /** ZDA and RMC start only at this second, so the first sentences must be dated backwards. */
    public static final int FIRST_DATE_SECOND = 3;

    private NmeaLogGenerator() { }

    static String sentence(String body) {
        int x = 0;
        for (char c : body.toCharArray()) x ^= c;
        return "$" + body + "*" + String.format("%02X", x);
    }

    /** Depth below transducer (m) of ping p (two pings a second) at second s; values with 2 decimals. */
    public static double depth(int s, int p) {
        return Math.round((20.0 + 0.05 * s + 0.02 * p) * 100) / 100.0;
    }

    /** Position at second s along the line, flat-earth steps (1 minute of latitude = 1852 m). */
    public static double[] position(double s) {
        double north = SPEED * s * Math.cos(Math.toRadians(COURSE)), east = SPEED * s * Math.sin(Math.toRadians(COURSE));
        double lat = LAT0 + north / 111120.0;
        double lon = LON0 + east / (111120.0 * Math.cos(Math.toRadians(LAT0)));
        return new double[]{lat, lon};
    }

    static String latField(double lat) {
        double a = Math.abs(lat);
        int d = (int) a;
        return String.format(Locale.ROOT, "%02d%07.4f,%s", d, (a - d) * 60, lat < 0 ? "S" : "N");
    }

    static String lonField(double lon) {
        double a = Math.abs(lon);
        int d = (int) a;
        return String.format(Locale.ROOT, "%03d%07.4f,%s", d, (a - d) * 60, lon < 0 ? "W" : "E");
    }

    /** Lines of a log of {@code seconds} seconds from {@code start}; {@code withJunk} adds bad lines. */
    public static List<String> lines(Instant start, int seconds, boolean withJunk) {
        List<String> out = new ArrayList<>();
        double knots = SPEED * 3600 / 1852;
        for (int s = 0; s < seconds; s++) {
            ZonedDateTime t = start.plusSeconds(s).atZone(ZoneOffset.UTC);
            String hms = String.format(Locale.ROOT, "%02d%02d%02d.00", t.getHour(), t.getMinute(), t.getSecond());
            double[] p = position(s);
            out.add(sentence("GPGGA," + hms + "," + latField(p[0]) + "," + lonField(p[1]) + ",2,09,0.9,1.2,M,47.0,M,,"));
            if (s >= FIRST_DATE_SECOND && s % 5 == FIRST_DATE_SECOND % 5) {
                out.add(sentence(String.format(Locale.ROOT, "GPZDA,%s,%02d,%02d,%04d,00,00", hms,
                        t.getDayOfMonth(), t.getMonthValue(), t.getYear())));
                out.add(sentence(String.format(Locale.ROOT, "GPRMC,%s,A,%s,%s,%.1f,%.1f,%02d%02d%02d,,,D", hms,
                        latField(p[0]), lonField(p[1]), knots, COURSE, t.getDayOfMonth(), t.getMonthValue(), t.getYear() % 100)));
            }
            out.add(sentence(String.format(Locale.ROOT, "HEHDT,%.1f,T", COURSE + 0.1 * (s % 10))));
            out.add(sentence(String.format(Locale.ROOT, "GPVTG,%.1f,T,,M,%.2f,N,%.2f,K,D", COURSE, knots, SPEED * 3.6)));
            for (int k = 0; k < 2; k++) {
                double d = depth(s, k);
                out.add(sentence(String.format(Locale.ROOT, "SDDPT,%.2f,0.50,100", d)));
                out.add(sentence(String.format(Locale.ROOT, "SDDBT,%.1f,f,%.2f,M,%.1f,F", d / 0.3048, d, d / 1.8288)));
            }
            if (withJunk && s == 10) {
                String good = sentence("SDDBT,65.6,f,20.00,M,10.9,F");
                out.add(good.substring(0, good.length() - 2) + "00");               // bad checksum
                out.add("$SDDBT,65.6,f,20.00,M,10.9,F");                            // no checksum
                out.add(sentence("GPGSV,3,1,11,03,03,111,00,04,15,270,00,06,01,010,00,13,06,292,00")); // not read
                out.add("logger restarted");                                        // not NMEA
                out.add("");                                                        // blank: ignored
            }
        }
        return out;
    }

    public static void main(String[] args) throws IOException {
        Path out = Path.of(args[1]);
        if (args[0].equals("small")) {
            Files.write(out, lines(START, SECONDS, true), StandardCharsets.US_ASCII);
            return;
        }
        long target = Long.parseLong(args[2]);
        long n = 0;
        try (BufferedWriter w = Files.newBufferedWriter(out, StandardCharsets.US_ASCII)) {
            Instant t = Instant.parse("2026-05-14T00:00:00Z");
            while (n < target) {
                for (String l : lines(t, 600, false)) { w.write(l); w.write("\r\n"); n++; }
                t = t.plusSeconds(600);
            }
        }
        // Wall time is shared with other processes on a loaded machine; thread CPU time is not.
        java.lang.management.ThreadMXBean mx = java.lang.management.ManagementFactory.getThreadMXBean();
        NmeaLog log = null;
        for (int run = 1; run <= 3; run++) {
            long c0 = mx.getCurrentThreadCpuTime(), t0 = System.nanoTime();
            log = NmeaReader.read(out);
            double wall = (System.nanoTime() - t0) / 1e9, cpu = (mx.getCurrentThreadCpuTime() - c0) / 1e9;
            System.out.printf(Locale.ROOT, "read %d: %d lines, %d bytes: wall %.2f s, cpu %.2f s = %.0f sentences per cpu-second%n",
                    run, n, Files.size(out), wall, cpu, n / cpu);
        }
        long c0 = mx.getCurrentThreadCpuTime();
        int pings = log.toPingTable("L1").size;
        System.out.printf(Locale.ROOT, "toPingTable: %d pings, cpu %.2f s; %d depths, %d fixes, %d problems%n",
                pings, (mx.getCurrentThreadCpuTime() - c0) / 1e9, log.depthCount, log.fixCount, log.problems().total());
    }
}
