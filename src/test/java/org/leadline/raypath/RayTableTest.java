package org.leadline.raypath;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.leadline.watercolumn.SoundSpeedProfile;

class RayTableTest {

    /** Max |error| in depth and horizontal distance of the table against exact tracing, and coverage. */
    record Errors(double depth, double horizontal, double tableFraction, int samples) { }

    static Errors measure(RayTable table, RayTracer tracer, int samples, long seed) {
        SplittableRandom rnd = new SplittableRandom(seed);
        double[] a = new double[2], b = new double[2];
        double maxDz = 0, maxDx = 0;
        int fromTable = 0;
        for (int i = 0; i < samples; i++) {
            double zs = table.minStartDepth() + rnd.nextDouble() * (table.maxStartDepth() - table.minStartDepth());
            double ang = rnd.nextDouble() * table.maxAngle();
            double t = rnd.nextDouble() * table.maxTime();
            if (fromTable(table, zs, ang, t, a)) {
                fromTable++;
                tracer.trace(zs, ang, t, b);
                maxDz = Math.max(maxDz, Math.abs(a[0] - b[0]));
                maxDx = Math.max(maxDx, Math.abs(a[1] - b[1]));
            }
        }
        return new Errors(maxDz, maxDx, fromTable / (double) samples, samples);
    }

    /** Looks up and tells whether the table answered (true) or exact tracing did (false). */
    static boolean fromTable(RayTable table, double zs, double angle, double t, double[] out) {
        long before = table.fallbackCount();
        table.lookup(zs, angle, t, out);
        return table.fallbackCount() == before;
    }

    static SoundSpeedProfile coastal() {
        // a summer coastal profile shape: warm mixed layer, thermocline, slow rise below (invented for the test)
        return new SoundSpeedProfile(
                new double[]{0, 1, 2, 4, 6, 8, 10, 12, 15, 18, 22, 26, 30, 35, 40, 50, 60, 80, 100, 120, 150, 200},
                new double[]{1512.0, 1512.3, 1512.1, 1511.6, 1510.2, 1507.9, 1504.0, 1499.8, 1494.2, 1490.1,
                        1487.3, 1485.9, 1485.2, 1484.9, 1484.8, 1485.0, 1485.3, 1485.9, 1486.5, 1487.0, 1487.6, 1488.4},
                List.of());
    }

    @Test
    void matchesExactTracingInTheStronglyRefractingProfile() {
        SoundSpeedProfile p = RayTracerTest.strong();
        RayTable table = RayTable.forDepth(p, 0, 10, Math.toRadians(75), 120);
        Errors e = measure(table, new RayTracer(p), 200_000, 42);
        System.err.println("strong: " + e + " bytes " + table.sizeBytes());
        // task requirement: within 1 mm in depth and 1 cm horizontally of exact tracing
        assertThat(e.depth()).isLessThan(1e-3);
        assertThat(e.horizontal()).isLessThan(1e-2);
        assertThat(e.tableFraction()).isGreaterThan(0.95);
    }

    @Test
    void matchesExactTracingInACoastalProfile() {
        SoundSpeedProfile p = coastal();
        RayTable table = RayTable.forDepth(p, 0, 10, Math.toRadians(75), 400);
        Errors e = measure(table, new RayTracer(p), 200_000, 7);
        System.err.println("coastal: " + e + " bytes " + table.sizeBytes());
        assertThat(e.depth()).isLessThan(1e-3);
        assertThat(e.horizontal()).isLessThan(1e-2);
        assertThat(e.tableFraction()).isGreaterThan(0.95);
    }

    @Test
    void matchesExactTracingWhereRaysTurn() {
        SoundSpeedProfile p = RayTracerTest.ducting();
        RayTable table = new RayTable(p, 0, 10, Math.toRadians(80), 0.3);
        Errors e = measure(table, new RayTracer(p), 100_000, 3);
        System.err.println("ducting: " + e + " bytes " + table.sizeBytes());
        assertThat(e.depth()).isLessThan(1e-3);
        assertThat(e.horizontal()).isLessThan(1e-2);
    }

    /** A jagged profile like a raw CTD cast in 0.5 m bins: mixed layer, thermocline, +-0.3 m/s noise. */
    static SoundSpeedProfile jagged() {
        SplittableRandom rnd = new SplittableRandom(11);
        int n = 241;
        double[] z = new double[n], c = new double[n];
        for (int i = 0; i < n; i++) {
            z[i] = 0.5 * i;
            c[i] = 1490 + 18 / (1 + Math.exp((z[i] - 25) / 4)) + 0.02 * z[i] + (rnd.nextDouble() - 0.5) * 0.6;
        }
        return new SoundSpeedProfile(z, c, List.of());
    }

    @Test
    void matchesExactTracingInAJaggedCtdProfile() {
        SoundSpeedProfile p = jagged();
        RayTable table = RayTable.forDepth(p, 0, 10, Math.toRadians(75), 240);
        Errors e = measure(table, new RayTracer(p), 100_000, 5);
        System.err.println("jagged: " + e + " bytes " + table.sizeBytes() + " step " + RayTable.timeStepFor(p));
        assertThat(e.depth()).isLessThan(1e-3);
        assertThat(e.horizontal()).isLessThan(1e-2);
        assertThat(e.tableFraction()).isGreaterThan(0.95);
    }

    @Test
    void bandMayStartAboveTheFirstSample() {
        // casts often begin a metre or two down; the band above is water at the first sample's speed
        SoundSpeedProfile p = new SoundSpeedProfile(new double[]{1.5, 6, 20, 50},
                new double[]{1510, 1506, 1490, 1488}, List.of());
        RayTable table = RayTable.forDepth(p, 0, 10, Math.toRadians(75), 100);
        Errors e = measure(table, new RayTracer(p), 50_000, 13);
        assertThat(e.depth()).isLessThan(1e-3);
        assertThat(e.horizontal()).isLessThan(1e-2);
        assertThat(e.tableFraction()).isGreaterThan(0.95);
    }

    @Test
    void outsideItsDomainTheTableTracesExactly() {
        SoundSpeedProfile p = RayTracerTest.strong();
        RayTable table = new RayTable(p, 0, 10, Math.toRadians(75), 0.2);
        RayTracer tracer = new RayTracer(p);
        double[] a = new double[2], b = new double[2];
        double[][] outside = {{12, 0.5, 0.05}, {5, Math.toRadians(78), 0.05}, {5, 0.5, 0.3}, {-1, 0.5, 0.05}};
        for (double[] q : outside) {
            assertThat(fromTable(table, q[0], q[1], q[2], a)).isFalse();
            table.lookup(q[0], q[1], q[2], a);
            tracer.trace(q[0], q[1], q[2], b);
            assertThat(a).containsExactly(b);
        }
        // negative angles mirror the horizontal distance, from the table too
        table.lookup(5, -0.7, 0.05, a);
        tracer.trace(5, 0.7, 0.05, b);
        assertThat(a[0]).isCloseTo(b[0], within(1e-3));
        assertThat(a[1]).isCloseTo(-b[1], within(1e-2));
    }

    @Test
    void constantSpeedTableGivesStraightLines() {
        RayTable table = new RayTable(SoundSpeedProfile.constant(1500), 0, 10, Math.toRadians(75), 0.2);
        double[] out = new double[2];
        // common practice: depth = c * twtt / 2 for the vertical beam; slant beam straight (worked by hand)
        table.lookup(4, 0, 0.02, out);
        assertThat(out[0]).isCloseTo(30, within(1e-9));
        table.lookup(4, Math.toRadians(60), 0.02, out);
        assertThat(out[0]).isCloseTo(15, within(1e-6));
        assertThat(out[1]).isCloseTo(15 * Math.sqrt(3), within(1e-6));
    }
}
