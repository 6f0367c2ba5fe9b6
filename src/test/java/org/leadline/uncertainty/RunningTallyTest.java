package org.leadline.uncertainty;

import org.junit.jupiter.api.Test;
import org.leadline.survey.SoundingTable;

import java.util.List;
import java.util.SplittableRandom;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * The running TPU and S-44 tallies of a day read in chunks (processing in tiles) must give the
 * same bits as the whole table's summaries, whatever the chunk boundaries: chunks that end inside
 * the 65 536-row blocks of the deterministic block-wise sums, exactly on them, and a single row.
 */
class RunningTallyTest {
    @Test
    void chunkedTalliesEqualTheWholeTableBitForBit() {
        int n = 300_000;
        SplittableRandom rnd = new SplittableRandom(3);
        SoundingTable all = new SoundingTable(n, List.of("L1"));
        double[] heave = new double[n], cs = new double[n], zs = new double[n];
        for (int i = 0; i < n; i++) {
            all.depth[i] = 2 + 60 * rnd.nextDouble();
            all.surfaceDepth[i] = all.depth[i] + 1.5;
            all.acrossTrack[i] = -80 + 160 * rnd.nextDouble();
            all.speedOverGround[i] = 4 * rnd.nextDouble();
            all.tvu[i] = 0.1 + 0.5 * rnd.nextDouble();
            all.thu[i] = 0.5 + 3 * rnd.nextDouble();
            all.status[i] = rnd.nextInt(50) == 0 ? SoundingTable.Status.REJECTED.code : SoundingTable.Status.ACCEPTED.code;
            heave[i] = 0.3 * rnd.nextGaussian();
            cs[i] = 1480 + 20 * rnd.nextDouble();
            zs[i] = rnd.nextBoolean() ? 0.05 : 0;
        }
        TpuModel model = new TpuModel(TpuModelTest.VESSEL);
        TpuSummary whole = model.summarize(all, heave, cs, zs);
        S44Order order = S44Order.parse("1a");
        ComplianceSummary wholeC = Compliance.evaluate(all, order).summary(all);

        int[] cuts = {0, 1, 2, 40_000, 65_536, 65_537, 131_072, 200_001, 299_999, n};
        TpuModel.Tally tally = model.tally();
        Compliance.Tally cTally = new Compliance.Tally(order, Compliance.DEFAULT_BANDS);
        for (int k = 0; k + 1 < cuts.length; k++) {
            int from = cuts[k], to = cuts[k + 1];
            SoundingTable c = new SoundingTable(to - from, List.of("L1"));
            System.arraycopy(all.depth, from, c.depth, 0, to - from);
            System.arraycopy(all.surfaceDepth, from, c.surfaceDepth, 0, to - from);
            System.arraycopy(all.acrossTrack, from, c.acrossTrack, 0, to - from);
            System.arraycopy(all.speedOverGround, from, c.speedOverGround, 0, to - from);
            System.arraycopy(all.tvu, from, c.tvu, 0, to - from);
            System.arraycopy(all.thu, from, c.thu, 0, to - from);
            System.arraycopy(all.status, from, c.status, 0, to - from);
            tally.add(c, java.util.Arrays.copyOfRange(heave, from, to), java.util.Arrays.copyOfRange(cs, from, to),
                    java.util.Arrays.copyOfRange(zs, from, to));
            cTally.add(c, Compliance.evaluate(c, order));
        }
        TpuSummary chunked = tally.summary();
        assertThat(chunked.count()).isEqualTo(whole.count());
        assertThat(Double.doubleToLongBits(chunked.meanTvu())).isEqualTo(Double.doubleToLongBits(whole.meanTvu()));
        assertThat(Double.doubleToLongBits(chunked.meanThu())).isEqualTo(Double.doubleToLongBits(whole.meanThu()));
        assertThat(chunked.entries()).isEqualTo(whole.entries());
        assertThat(cTally.summary()).isEqualTo(wholeC);
    }

    @Test
    void summaryFromComputeEqualsSummingAgainAfterCleaningChangedStatuses() {
        int n = 150_000;
        SplittableRandom rnd = new SplittableRandom(5);
        SoundingTable t = new SoundingTable(n, List.of("L1"));
        double[] heave = new double[n], cs = new double[n];
        for (int i = 0; i < n; i++) {
            t.depth[i] = 2 + 60 * rnd.nextDouble();
            t.surfaceDepth[i] = rnd.nextInt(1000) == 0 ? Double.NaN : t.depth[i] + 1.5;
            t.acrossTrack[i] = -80 + 160 * rnd.nextDouble();
            t.speedOverGround[i] = 4 * rnd.nextDouble();
            t.status[i] = rnd.nextInt(100) == 0 ? SoundingTable.Status.REJECTED.code : SoundingTable.Status.ACCEPTED.code;
            heave[i] = 0.3 * rnd.nextGaussian();
            cs[i] = 1480 + 20 * rnd.nextDouble();
        }
        TpuModel model = new TpuModel(TpuModelTest.VESSEL);
        TpuModel.Computed done = model.compute(t, heave, cs, null);
        // cleaning: spikes rejected here and there (the deepest soundings, which carry the largest
        // TVU, so a stale sum would show in the maximum too), and one rejected sounding accepted again
        int changed = 0;
        for (int i = 0; i < n; i += 1 + rnd.nextInt(3000)) {
            if (t.accepted(i)) {
                t.reject(i, SoundingTable.Reason.SPIKE);
                changed++;
            }
        }
        int deepest = 0;
        for (int i = 0; i < n; i++) if (t.accepted(i) && t.surfaceDepth[i] > t.surfaceDepth[deepest]) deepest = i;
        t.reject(deepest, SoundingTable.Reason.SPIKE);
        for (int i = 0; i < n; i++) {
            if (!t.accepted(i)) {
                t.status[i] = SoundingTable.Status.ACCEPTED.code;
                t.reason[i] = 0;
                break;
            }
        }
        assertThat(changed).isGreaterThan(30);

        TpuSummary reused = model.summarize(done);
        TpuSummary again = model.summarize(t, heave, cs, null);
        assertThat(reused.count()).isEqualTo(again.count());
        assertThat(Double.doubleToLongBits(reused.meanTvu())).isEqualTo(Double.doubleToLongBits(again.meanTvu()));
        assertThat(Double.doubleToLongBits(reused.maxTvu())).isEqualTo(Double.doubleToLongBits(again.maxTvu()));
        assertThat(Double.doubleToLongBits(reused.meanThu())).isEqualTo(Double.doubleToLongBits(again.meanThu()));
        assertThat(reused.entries()).isEqualTo(again.entries());
    }
}
