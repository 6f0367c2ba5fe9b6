package org.leadline.raypath;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.leadline.watercolumn.SoundSpeedProfile;

class RayTableExploreTest {
    @Test
    void explore() {
        SoundSpeedProfile p = RayTracerTest.strong();
        RayTracer tr = new RayTracer(p);
        double tmax = 120 / (1480 * Math.cos(Math.toRadians(75)));
        for (int[] cfg : new int[][]{{160, 250, 750}, {80, 250, 750}, {120, 250, 750}, {160, 500, 750}, {160, 1000, 750}}) {
            RayTable t = new RayTable(p, 0, 10, Math.toRadians(75), tmax, cfg[0], cfg[1] * 1e-3, cfg[2] * 1e-6, Math.toRadians(86));
            SplittableRandom rnd = new SplittableRandom(42);
            double[] a = new double[2], b = new double[2];
            double mz = 0, mx = 0; double[] worst = null;
            for (int i = 0; i < 200000; i++) {
                double zs = rnd.nextDouble() * 10, ang = rnd.nextDouble() * Math.toRadians(75), tt = rnd.nextDouble() * tmax;
                if (!t.fromTable(zs, ang, tt, a)) continue;
                tr.trace(zs, ang, tt, b);
                double ez = Math.abs(a[0] - b[0]);
                if (ez > mz) { mz = ez; worst = new double[]{zs, Math.toDegrees(ang), tt, b[0], b[1]}; }
                mx = Math.max(mx, Math.abs(a[1] - b[1]));
            }
            System.err.printf("cfg %d %d %d: dz %.3g dx %.3g worst %s%n", cfg[0], cfg[1], cfg[2], mz, mx, java.util.Arrays.toString(worst));
        }
    }
}
