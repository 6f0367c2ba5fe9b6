package org.leadline.bench;

import java.lang.management.ManagementFactory;
import java.lang.management.ThreadMXBean;
import java.util.SplittableRandom;
import org.leadline.raypath.RayTable;
import org.leadline.raypath.RayTracer;
import org.leadline.watercolumn.SoundSpeedProfile;

/**
 * Lookups per second of thread CPU time (not wall time): a cross-check of the JMH figures on a
 * machine shared with other work, where wall-clock throughput understates what one core does.
 * {@code java -cp <test classpath> org.leadline.bench.CpuTimeProbe}
 */
public final class CpuTimeProbe {
    private CpuTimeProbe() {}

    public static void main(String[] args) {
        SoundSpeedProfile p = RayTableBenchmark.profile(args.length > 0 ? args[0] : "strong");
        RayTable table = RayTable.forDepth(p, 0, 10, Math.toRadians(75), 120);
        RayTracer tracer = new RayTracer(p);
        int n = 1 << 16;
        double[] z = new double[n], a = new double[n], t = new double[n];
        SplittableRandom rnd = new SplittableRandom(1);
        for (int i = 0; i < n; i++) {
            z[i] = rnd.nextDouble() * 10;
            a[i] = (rnd.nextDouble() * 2 - 1) * Math.toRadians(75);
            t[i] = rnd.nextDouble() * table.maxTime();
        }
        ThreadMXBean mx = ManagementFactory.getThreadMXBean();
        double[] out = new double[2];
        for (int round = 0; round < 12; round++) {
            double sink = 0;
            long c0 = mx.getCurrentThreadCpuTime();
            for (int rep = 0; rep < 40; rep++) {
                for (int i = 0; i < n; i++) { table.lookup(z[i], a[i], t[i], out); sink += out[0] + out[1]; }
            }
            long c1 = mx.getCurrentThreadCpuTime();
            for (int rep = 0; rep < 10; rep++) {
                for (int i = 0; i < n; i++) { tracer.trace(z[i], a[i], t[i], out); sink += out[0] + out[1]; }
            }
            long c2 = mx.getCurrentThreadCpuTime();
            System.out.printf("round %d: table %.2f M/s, exact %.2f M/s (cpu time) %s%n", round,
                    40.0 * n / (c1 - c0) * 1e3, 10.0 * n / (c2 - c1) * 1e3, sink == 42 ? "!" : "");
        }
    }
}
