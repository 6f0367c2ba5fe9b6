package org.leadline.cleaning;

import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * Throughput of {@link Cleaner#clean} on 10 million swath soundings. Not a unit test (no timed
 * assertion; needs about 2 GB of heap): runs only with {@code -Dleadline.bench=true}.
 */
class CleanerBenchmarkTest {
    /** CPU time of this thread, ns: the build machine is shared, so wall time says little. */
    private static long cpu() {
        return java.lang.management.ManagementFactory.getThreadMXBean().getCurrentThreadCpuTime();
    }

    @Test
    void tenMillionSoundings() {
        Assumptions.assumeTrue(Boolean.getBoolean("leadline.bench"), "benchmark: run with -Dleadline.bench=true");
        SyntheticSurvey sv = SyntheticSurvey.make((e, n) -> 20 + 0.2 * e, 250, 40, 1000, 1);
        CleaningSettings cfg = CleaningSettings.defaults();
        int[] counts = new int[256];
        long t0 = cpu();
        Cleaner.depthGate(sv.table, cfg.minDepth(), cfg.maxDepth(), counts);
        long ta = cpu();
        boolean[] spike = new boolean[sv.table.size];
        Cleaner.spikeFlags(sv.table, cfg, spike);
        long tb = cpu();
        Cleaner.spatial(sv.table, spike, cfg, counts, null);
        long t1 = cpu();
        System.out.printf("benchmark (CPU time): gates %.2f s, spike flags %.2f s, spike confirmation and surface filter %.2f s%n",
                (ta - t0) / 1e9, (tb - ta) / 1e9, (t1 - tb) / 1e9);
        java.util.Map<org.leadline.survey.SoundingTable.Reason, Integer> st = new java.util.EnumMap<>(org.leadline.survey.SoundingTable.Reason.class);
        for (var reason : org.leadline.survey.SoundingTable.Reason.values()) if (counts[reason.code] > 0) st.put(reason, counts[reason.code]);
        double[] r = sv.rates();
        System.out.printf("benchmark: %d soundings cleaned in %.2f s of CPU; spikes rejected %.2f %%, good rejected %.3f %%; %s%n",
                sv.table.size, (t1 - t0) / 1e9, 100 * r[0], 100 * r[1], st);
        assertThat(sv.table.size).isEqualTo(10_000_000);
    }
}
