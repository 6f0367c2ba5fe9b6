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
        for (int i = 0; i < p.size; i++) {
            lat.add(mLat[i]);
            lon.add(mLon[i]);
            double x = Double.isFinite(p.twtt[i]) ? 1600 * p.twtt[i] / 2 : p.depth[i] * 1600 / setSpeed;
            depth.add(Double.isFinite(x) ? x : 0);
            double h = heave[i];
            if (Math.abs(h) > Plausibility.MAX_HEAVE_M) {
                heaveCount++;
                if (Math.abs(h) > Math.abs(heaveWorst)) heaveWorst = h;
            }
            double t = Double.isFinite(p.twtt[i]) ? p.twtt[i] / 2 : p.depth[i] / setSpeed;
            if (t > maxT) maxT = t;
            double a = Math.abs(Double.isNaN(p.angle[i]) ? 0 : p.angle[i])
                    + Math.abs(Double.isNaN(roll[i]) ? 0 : roll[i])
                    + Math.abs(Double.isNaN(pitch[i]) ? 0 : pitch[i]);
            if (a > maxAngle) maxAngle = a;
            double hz = Double.isNaN(h) ? 0 : h;
            minZ = Math.min(minZ, -hz);
            maxZ = Math.max(maxZ, -hz);
        }
        rows += p.size;
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

        double[] values() { return Arrays.copyOf(v, n); }
    }
}
