package org.leadline.bench;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.leadline.io.PingFiles;
import org.leadline.raypath.RayTable;
import org.leadline.reduction.MergedPings;
import org.leadline.reduction.Reducer;
import org.leadline.reduction.SensorMerge;
import org.leadline.surface.Gridder;
import org.leadline.surface.GridSpec;
import org.leadline.surface.MapProjection;
import org.leadline.survey.PingTable;
import org.leadline.survey.SoundingTable;
import org.leadline.survey.Vessel;
import org.leadline.watercolumn.SoundSpeedProfile;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Level;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OperationsPerInvocation;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.TearDown;
import org.openjdk.jmh.annotations.Warmup;

/**
 * Soundings per second of the bulk kernels of a processing run, on a 262 144-sounding synthetic swath
 * day ({@link SwathDayGenerator}, 256 beams): reading the ping CSV (parallel ranges) and the binary
 * ping file, reduction (ray bending by table, lever arms, georeferencing, projection), and median
 * gridding at 1 m. Parallel kernels use every core; run with {@link RunBenchmarks} "Kernel".
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.SECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(value = 1, jvmArgs = {"-Xmx4g"})
public class KernelBenchmarks {
    static final int N = 1 << 18;

    private Path dir;
    private PingTable pings;
    private Reducer.MergedInputs merged;
    private Reducer.BeamTracer[] tracers;
    private Reducer.CastChoice choice;
    private MapProjection projection;
    private Reducer reducer;
    private double[] e, n, z;
    private GridSpec spec;

    @Setup(Level.Trial)
    public void setUp() throws IOException {
        dir = Files.createTempDirectory("leadline-kernels");
        SwathDayGenerator.write(dir, N, 256, 1, true, true);
        pings = PingFiles.read(dir.resolve("pings.csv"), false);
        Vessel v = Vessel.simple(SwathDayGenerator.DRAFT, 1500);
        MergedPings m = SensorMerge.merge(pings, null, null, v);
        merged = new Reducer.MergedInputs(m.lat, m.lon, m.heading, m.heave, m.roll, m.pitch, m.speedOverGround, m.reason);
        double[] cz = new double[401], cc = new double[401];
        for (int k = 0; k < cz.length; k++) { cz[k] = 0.5 * k; cc[k] = SwathDayGenerator.speed(cz[k]); }
        RayTable table = new RayTable(new SoundSpeedProfile(cz, cc, List.of()), 0.5, 3.0, Math.toRadians(75), 0.2);
        tracers = new Reducer.BeamTracer[]{table::lookup};
        choice = new Reducer.CastChoice(new int[N], new int[N], null);
        projection = MapProjection.parse("auto", m.lat, m.lon);
        reducer = new Reducer(v, false);
        SoundingTable s = reduce();
        e = s.easting; n = s.northing; z = s.depth;
        spec = GridSpec.covering(e, n, 1.0);
    }

    @TearDown(Level.Trial)
    public void tearDown() throws IOException {
        try (var files = Files.list(dir)) { for (Path p : files.toList()) Files.delete(p); }
        Files.delete(dir);
    }

    private SoundingTable reduce() {
        return reducer.reduce(pings, merged, tracers, choice, (t, la, lo) -> 0.0, projection::forward);
    }

    @Benchmark
    @OperationsPerInvocation(N)
    public PingTable readPingCsv() { return PingFiles.read(dir.resolve("pings.csv"), false); }

    @Benchmark
    @OperationsPerInvocation(N)
    public PingTable readBinaryPings() { return PingFiles.read(dir.resolve("pings.lpb"), false); }

    @Benchmark
    @OperationsPerInvocation(N)
    public SoundingTable reduction() { return reduce(); }

    @Benchmark
    @OperationsPerInvocation(N)
    public Object medianGrid() { return Gridder.build(spec, null, e, n, z, null, null, Gridder.Method.MEDIAN); }

    /** A quick look without JMH: {@code java -cp ... org.leadline.bench.KernelBenchmarks}. */
    public static void main(String[] args) throws IOException {
        KernelBenchmarks b = new KernelBenchmarks();
        b.setUp();
        for (int r = 0; r < 5; r++) {
            long t0 = System.nanoTime(); b.readPingCsv();
            long t1 = System.nanoTime(); b.readBinaryPings();
            long t2 = System.nanoTime(); b.reduction();
            long t3 = System.nanoTime(); b.medianGrid();
            long t4 = System.nanoTime();
            System.out.printf(java.util.Locale.ROOT, "csv %.2f, lpb %.2f, reduce %.2f, median grid %.2f M soundings/s%n",
                    N / ((t1 - t0) / 1e3), N / ((t2 - t1) / 1e3), N / ((t3 - t2) / 1e3), N / ((t4 - t3) / 1e3));
        }
        b.tearDown();
    }
}
