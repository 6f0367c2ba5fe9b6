package org.leadline.bench;

import java.util.List;
import java.util.SplittableRandom;
import java.util.concurrent.TimeUnit;
import org.leadline.raypath.RayTable;
import org.leadline.raypath.RayTracer;
import org.leadline.watercolumn.SoundSpeedProfile;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Threads;
import org.openjdk.jmh.annotations.Warmup;
import org.openjdk.jmh.infra.Blackhole;

/**
 * Beams per second of {@link RayTable#lookup} (and, for scale, exact {@link RayTracer#trace}) over
 * pre-generated random (start depth, launch angle, one-way time) inside the table's domain, one thread.
 * Run with {@link RunBenchmarks}; see docs/performance.md.
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.SECONDS)
@Warmup(iterations = 3, time = 1)
@Measurement(iterations = 5, time = 1)
@Fork(1)
@Threads(1)
public class RayTableBenchmark {
    static final int N = 1 << 16;

    /** strong: 4-sample strongly refracting profile; ctd: 241 samples in 0.5 m bins to 120 m, jagged. */
    @Param({"strong", "ctd"})
    public String profile;

    private RayTable table;
    private RayTracer tracer;
    private final double[] depth = new double[N];
    private final double[] angle = new double[N];
    private final double[] time = new double[N];
    private final double[] out = new double[2];

    @Setup
    public void setUp() {
        // the strongly refracting profile of RayTracerTest: surface layer, 1530 -> 1480 m/s at 15 m, 1495 at 60 m
        SoundSpeedProfile p = profile(profile);
        table = RayTable.forDepth(p, 0, 10, Math.toRadians(75), 120);
        tracer = new RayTracer(p);
        SplittableRandom rnd = new SplittableRandom(1);
        for (int i = 0; i < N; i++) {
            depth[i] = rnd.nextDouble() * 10;
            angle[i] = (rnd.nextDouble() * 2 - 1) * Math.toRadians(75);
            time[i] = rnd.nextDouble() * table.maxTime();
        }
    }

    /** The benchmark profiles (the same as RayTracerTest.strong() and RayTableTest.jagged()). */
    static SoundSpeedProfile profile(String name) {
        if (name.equals("strong")) {
            return new SoundSpeedProfile(new double[]{0, 0.5, 15, 60}, new double[]{1522, 1530, 1480, 1495}, List.of());
        }
        SplittableRandom rnd = new SplittableRandom(11);
        int n = 241;
        double[] z = new double[n], c = new double[n];
        for (int i = 0; i < n; i++) {
            z[i] = 0.5 * i;
            c[i] = 1490 + 18 / (1 + Math.exp((z[i] - 25) / 4)) + 0.02 * z[i] + (rnd.nextDouble() - 0.5) * 0.6;
        }
        return new SoundSpeedProfile(z, c, List.of());
    }

    @Benchmark
    @OperationsPerInvocation(N)
    public void tableLookup(Blackhole bh) {
        double[] o = out;
        for (int i = 0; i < N; i++) {
            table.lookup(depth[i], angle[i], time[i], o);
            bh.consume(o[0]);
            bh.consume(o[1]);
        }
    }

    @Benchmark
    @OperationsPerInvocation(N)
    public void exactTrace(Blackhole bh) {
        double[] o = out;
        for (int i = 0; i < N; i++) {
            tracer.trace(depth[i], angle[i], time[i], o);
            bh.consume(o[0]);
            bh.consume(o[1]);
        }
    }
}
