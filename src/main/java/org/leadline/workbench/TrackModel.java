package org.leadline.workbench;

import org.leadline.survey.SoundingTable;

import java.util.List;

/**
 * The Track view without Swing: the survey lines' soundings in the run's projected CRS, the
 * extent, the depth range for the colour ramp, and which line a click is on.
 */
public final class TrackModel {
    private final SoundingTable s;
    private final double minE, maxE, minN, maxN, shallow, deep;

    public TrackModel(SoundingTable soundings) {
        this.s = soundings;
        double e0 = Double.POSITIVE_INFINITY, e1 = Double.NEGATIVE_INFINITY, n0 = e0, n1 = e1, d0 = e0, d1 = e1;
        for (int i = 0; i < s.size; i++) {
            double e = s.easting[i], n = s.northing[i];
            if (!Double.isFinite(e) || !Double.isFinite(n)) continue;
            e0 = Math.min(e0, e);
            e1 = Math.max(e1, e);
            n0 = Math.min(n0, n);
            n1 = Math.max(n1, n);
            if (s.accepted(i) && Double.isFinite(s.depth[i])) {
                d0 = Math.min(d0, s.depth[i]);
                d1 = Math.max(d1, s.depth[i]);
            }
        }
        minE = e0; maxE = e1; minN = n0; maxN = n1;
        shallow = d0 > d1 ? 0 : d0;
        deep = d0 > d1 ? 1 : d1;
    }

    public SoundingTable soundings() { return s; }
    public List<String> lines() { return s.lineNames(); }
    /** {minE, minN, maxE, maxN}, m; infinite when no sounding has a position. */
    public double[] extent() { return new double[] {minE, minN, maxE, maxN}; }
    /** {shallowest, deepest} accepted depth, m. */
    public double[] depthRange() { return new double[] {shallow, deep}; }

    /**
     * The survey line with a sounding nearest to (e, n) within maxDistance metres, or null.
     *
     * @param e           easting, m
     * @param n           northing, m
     * @param maxDistance largest distance to a sounding, m
     */
    public String lineAt(double e, double n, double maxDistance) {
        double best = maxDistance * maxDistance;
        int bestLine = -1;
        for (int i = 0; i < s.size; i++) {
            double de = s.easting[i] - e, dn = s.northing[i] - n;
            double d2 = de * de + dn * dn;
            if (d2 <= best && s.line[i] >= 0) {
                best = d2;
                bestLine = s.line[i];
            }
        }
        return bestLine < 0 ? null : s.lineNames().get(bestLine);
    }
}
