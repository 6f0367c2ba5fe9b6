package org.leadline.pipeline;

import org.leadline.survey.PingTable;

import java.util.Arrays;

/**
 * The survey-wide quantities a run needs before it reduces anything, gathered in one pass over
 * the pings in file order (whole, or chunk by chunk for a day processed in tiles, with the same
 * result): systematic samples of the merged positions (median latitude for the cast conversion,
 * median position for the automatic UTM zone) and of the rough seabed depth (how far to extend
 * the profiles), the heave plausibility count, and the extents the ray tables must cover.
 *
 * <p>A sample keeps every row while it holds fewer than its cap, then every 2nd, 4th, ... row
 * (the stride doubles and every other kept value is dropped): a day of up to 2^20 rows gives the
 * exact medians, a larger day the medians of an evenly spread sample of at least 2^19 positions,
 * which choose the same UTM zone and a latitude good to far better than the profiles need.
 */
public final class DaySummary {
    static final int POSITION_CAP = 1 << 20;
    static final int DEPTH_CAP = 1 << 18;

    private final Sample lat = new Sample(POSITION_CAP), lon = new Sample(POSITION_CAP), depth = new Sample(DEPTH_CAP);
    private long rows;
    private int heaveCount;
    private double heaveWorst;
    private double maxT, maxAngle, minZ = Double.POSITIVE_INFINITY, maxZ = Double.NEGATIVE_INFINITY;

    /**
     * Adds the next rows (pings in file order, with their merged sensors).
     *
     * @param setSpeed sounder set speed, m/s (turns depths without travel times into times)
     */
    public void add(PingTable p, double[] mLat, double[] mLon, double[] heave, double[] roll, double[] pitch,
                    double setSpeed) {
        int n = p.size;
        // the samples only look at the rows they keep; the counts and extremes go in parallel
        // blocks folded in row order, so the result is that of one pass in file order
        lat.addEvery(n, i -> mLat[i]);
        lon.addEvery(n, i -> mLon[i]);
        depth.addEvery(n, i -> {
            double x = Double.isFinite(p.twtt[i]) ? 1600 * p.twtt[i] / 2 : p.depth[i] * 1600 / setSpeed;
            return Double.isFinite(x) ? x : 0;
        });
        int block = 1 << 16;
        double[][] part = new double[(n + block - 1) / block][];
        java.util.stream.IntStream.range(0, part.length).parallel().forEach(b -> {
            int count = 0;
            double worst = 0, mT = 0, mA = 0, lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
            for (int i = b * block, end = Math.min(n, (b + 1) * block); i < end; i++) {
                double h = heave[i];
                if (Math.abs(h) > Plausibility.MAX_HEAVE_M) {
                    count++;
                    if (Math.abs(h) > Math.abs(worst)) worst = h;
                }
                double t = Double.isFinite(p.twtt[i]) ? p.twtt[i] / 2 : p.depth[i] / setSpeed;
                if (t > mT) mT = t;
                double a = Math.abs(Double.isNaN(p.angle[i]) ? 0 : p.angle[i])
                        + Math.abs(Double.isNaN(roll[i]) ? 0 : roll[i])
                        + Math.abs(Double.isNaN(pitch[i]) ? 0 : pitch[i]);
                if (a > mA) mA = a;
                double hz = Double.isNaN(h) ? 0 : h;
                lo = Math.min(lo, -hz);
                hi = Math.max(hi, -hz);
            }
            part[b] = new double[] {count, worst, mT, mA, lo, hi};
        });
        for (double[] q : part) {
            heaveCount += (int) q[0];
            if (Math.abs(q[1]) > Math.abs(heaveWorst)) heaveWorst = q[1];
            if (q[2] > maxT) maxT = q[2];
            if (q[3] > maxAngle) maxAngle = q[3];
            minZ = Math.min(minZ, q[4]);
            maxZ = Math.max(maxZ, q[5]);
        }
        rows += n;
    }

    public long rows() { return rows; }

    /** Sampled merged latitudes and longitudes (NaN where a ping had none), degrees. */
    public double[] latitudes() { return lat.values(); }
    public double[] longitudes() { return lon.values(); }

    /** Median finite latitude (upper middle), degrees; NaN with none. */
    public double medianLatitude() { return SurveyInputs.median(lat.values()); }

    /**
     * Rough deepest seabed below the surface (m), to extend profiles: 1600 m/s x the 99.9th
     * percentile of one-way times (second echoes and other spikes beyond it are not seabed),
     * plus the draft and 2 m, rounded up.
     */
    public double deepest(double draft) {
        double[] d = depth.values();
        Arrays.sort(d);
        int k = d.length;
        double deep = k == 0 ? 0 : d[Math.min(k - 1, (int) (0.999 * k))];
        return Math.ceil(deep + draft + 2);
    }

    /** The heave plausibility warning, or null (see {@link Plausibility#heave}). */
    public String heaveWarning() { return Plausibility.heave(heaveWorst, heaveCount, rows); }

    /** Longest one-way travel time, s. */
    public double maxOneWayTime() { return maxT; }
    /** Largest |beam angle| + |roll| + |pitch|, degrees. */
    public double maxAngle() { return maxAngle; }
    /** Least and greatest transducer depth change from heave (-heave), m; 0 with no rows. */
    public double minHeaveDepth() { return rows == 0 ? 0 : minZ; }
    public double maxHeaveDepth() { return rows == 0 ? 0 : maxZ; }

    /** A systematic sample: every stride-th value added, the stride doubling whenever the cap is reached. */
    static final class Sample {
        private final int cap;
        private double[] v = new double[1024];
        private int n;
        private long seen, stride = 1;

        Sample(int cap) { this.cap = cap; }

        void add(double x) {
            if ((seen++ & (stride - 1)) != 0) return;   // stride is a power of two
            if (n == cap) {
                for (int k = 0; k < n / 2; k++) v[k] = v[2 * k];
                n /= 2;
                stride *= 2;
                if (((seen - 1) & (stride - 1)) != 0) return;
            }
            if (n == v.length) v = Arrays.copyOf(v, Math.min(cap, 2 * n));
            v[n++] = x;
        }

        /**
         * {@link #add} of f(0), ..., f(n - 1), calling f only for the rows kept: the rows in
         * between would only be counted.
         */
        void addEvery(int count, java.util.function.IntToDoubleFunction f) {
            int i = 0;
            while (i < count) {
                long r = seen & (stride - 1);
                if (r != 0) {
                    long skip = Math.min(stride - r, count - i);
                    seen += skip;
                    i += (int) skip;
                    continue;
                }
                add(f.applyAsDouble(i));
                i++;
            }
        }

        double[] values() { return Arrays.copyOf(v, n); }
    }
}
