package org.leadline.pipeline;

import org.junit.jupiter.api.Test;
import org.leadline.survey.PingTable;

import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * The survey-wide summary gathered in parallel blocks and by sampling only the rows kept must be
 * exactly that of one pass over the rows in file order (the reference below), for a whole day and
 * for the same day added in uneven chunks (processing in tiles).
 */
class DaySummaryTest {
    @Test
    void blocksAndSkippedRowsGiveTheOnePassSummaryForWholeAndChunkedDays() {
        int n = 1_500_000;   // past the position cap (2^20), so the sampling stride doubles
        SplittableRandom rnd = new SplittableRandom(13);
        double[] time = new double[n], lat = new double[n], lon = new double[n], twtt = new double[n], depth = new double[n],
                angle = new double[n], heading = new double[n], heave = new double[n], roll = new double[n], pitch = new double[n];
        for (int i = 0; i < n; i++) {
            time[i] = i * 0.01;
            lat[i] = rnd.nextInt(500) == 0 ? Double.NaN : 50 + rnd.nextDouble();
            lon[i] = -4 + rnd.nextDouble();
            boolean byDepth = rnd.nextInt(10) == 0;
            twtt[i] = byDepth ? Double.NaN : 0.01 + 0.1 * rnd.nextDouble();
            depth[i] = byDepth ? 5 + 80 * rnd.nextDouble() : Double.NaN;
            angle[i] = rnd.nextInt(300) == 0 ? Double.NaN : -70 + 140 * rnd.nextDouble();
            heave[i] = rnd.nextInt(1000) == 0 ? Double.NaN : rnd.nextInt(2000) == 0 ? 8 * rnd.nextGaussian() : 0.3 * rnd.nextGaussian();
            roll[i] = 5 * rnd.nextGaussian();
            pitch[i] = rnd.nextInt(700) == 0 ? Double.NaN : 2 * rnd.nextGaussian();
        }
        double setSpeed = 1500;
        Reference ref = new Reference();
        ref.add(twtt, depth, angle, lat, lon, heave, roll, pitch, setSpeed, 0, n);

        DaySummary whole = new DaySummary();
        whole.add(table(0, n, time, lat, lon, twtt, depth, angle, heading, heave, roll, pitch), lat, lon, heave, roll, pitch, setSpeed);
        assertSame(whole, ref);

        DaySummary chunked = new DaySummary();
        int[] cuts = {0, 1, 3, 65_535, 65_537, 400_001, 1_048_576, 1_048_577, 1_300_000, n};
        for (int k = 0; k + 1 < cuts.length; k++) {
            int a = cuts[k], b = cuts[k + 1];
            chunked.add(table(a, b, time, lat, lon, twtt, depth, angle, heading, heave, roll, pitch),
                    Arrays.copyOfRange(lat, a, b), Arrays.copyOfRange(lon, a, b), Arrays.copyOfRange(heave, a, b),
                    Arrays.copyOfRange(roll, a, b), Arrays.copyOfRange(pitch, a, b), setSpeed);
        }
        assertSame(chunked, ref);
    }

    private static void assertSame(DaySummary d, Reference r) {
        assertThat(d.latitudes()).isEqualTo(r.lat.values());
        assertThat(d.longitudes()).isEqualTo(r.lon.values());
        assertThat(d.deepest(1.5)).isEqualTo(r.deepest(1.5));
        assertThat(d.heaveWarning()).isEqualTo(org.leadline.pipeline.Plausibility.heave(r.heaveWorst, r.heaveCount, r.rows));
        assertThat(d.heaveWarning()).isNotNull();
        assertThat(d.maxOneWayTime()).isEqualTo(r.maxT);
        assertThat(d.maxAngle()).isEqualTo(r.maxAngle);
        assertThat(d.minHeaveDepth()).isEqualTo(r.minZ);
        assertThat(d.maxHeaveDepth()).isEqualTo(r.maxZ);
        assertThat(d.rows()).isEqualTo(r.rows);
    }

    private static PingTable table(int a, int b, double[]... c) {
        double[][] x = new double[c.length][];
        for (int k = 0; k < c.length; k++) x[k] = Arrays.copyOfRange(c[k], a, b);
        int m = b - a;
        int[] line = new int[m], beam = new int[m], quality = new int[m];
        Arrays.fill(quality, -1);
        return PingTable.ofColumns(m, x[0], x[1], x[2], x[3], x[4], x[5], x[6], x[7], x[8], x[9], line, beam, quality, List.of("L1"));
    }

    /** The summary as one plain pass in file order (every row offered to the samples). */
    private static final class Reference {
        final DaySummary.Sample lat = new DaySummary.Sample(DaySummary.POSITION_CAP);
        final DaySummary.Sample lon = new DaySummary.Sample(DaySummary.POSITION_CAP);
        final DaySummary.Sample depth = new DaySummary.Sample(DaySummary.DEPTH_CAP);
        long rows;
        int heaveCount;
        double heaveWorst, maxT, maxAngle, minZ = Double.POSITIVE_INFINITY, maxZ = Double.NEGATIVE_INFINITY;

        void add(double[] twtt, double[] dep, double[] angle, double[] mLat, double[] mLon, double[] heave, double[] roll,
                 double[] pitch, double setSpeed, int from, int to) {
            for (int i = from; i < to; i++) {
                lat.add(mLat[i]);
                lon.add(mLon[i]);
                double x = Double.isFinite(twtt[i]) ? 1600 * twtt[i] / 2 : dep[i] * 1600 / setSpeed;
                depth.add(Double.isFinite(x) ? x : 0);
                double h = heave[i];
                if (Math.abs(h) > Plausibility.MAX_HEAVE_M) {
                    heaveCount++;
                    if (Math.abs(h) > Math.abs(heaveWorst)) heaveWorst = h;
                }
                double t = Double.isFinite(twtt[i]) ? twtt[i] / 2 : dep[i] / setSpeed;
                if (t > maxT) maxT = t;
                double a = Math.abs(Double.isNaN(angle[i]) ? 0 : angle[i]) + Math.abs(Double.isNaN(roll[i]) ? 0 : roll[i])
                        + Math.abs(Double.isNaN(pitch[i]) ? 0 : pitch[i]);
                if (a > maxAngle) maxAngle = a;
                double hz = Double.isNaN(h) ? 0 : h;
                minZ = Math.min(minZ, -hz);
                maxZ = Math.max(maxZ, -hz);
            }
            rows += to - from;
        }

        double deepest(double draft) {
            double[] d = depth.values();
            Arrays.sort(d);
            int k = d.length;
            double deep = k == 0 ? 0 : d[Math.min(k - 1, (int) (0.999 * k))];
            return Math.ceil(deep + draft + 2);
        }
    }
}
