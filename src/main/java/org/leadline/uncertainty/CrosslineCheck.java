package org.leadline.uncertainty;

import java.util.ArrayList;
import java.util.List;
import java.util.function.DoubleBinaryOperator;
import java.util.function.DoubleUnaryOperator;

/**
 * Crossline check: compares crossline soundings with the main-scheme surface at the same
 * position, the independent check of vertical accuracy that IHO S-44 (edition 6.0, 2020) asks
 * for. For each crossline sounding the difference is {@code crossline depth - surface depth}
 * (positive: the crossline is deeper); it is within the order's limit when
 * {@code |difference| <= tvuLimit(surface depth)}. Results are given overall and per band of the
 * surface depth: 0-5, 5-10, 10-20, 20-50 and 50+ m (a drying surface depth, below 0, counts in
 * the first band).
 *
 * <p>Mean and sample standard deviation by Welford's one-pass update (Welford 1962,
 * Technometrics 4:419, doi:10.1080/00401706.1962.10490022), stable for many soundings with a
 * large common depth. Pure: no I/O.
 *
 * <pre>{@code
 * CrosslineResult r = CrosslineCheck.compare(e, n, depth, surface::depthAt,
 *         d -> Math.sqrt(0.5 * 0.5 + Math.pow(0.013 * d, 2))); // an S-44 order's TVU limit
 * }</pre>
 */
public final class CrosslineCheck {
    /** Band edges in metres of surface depth; the last band is open ended. */
    public static final double[] BAND_EDGES = {0, 5, 10, 20, 50};

    private CrosslineCheck() {}

    /**
     * @param easting        crossline sounding eastings, m (projected CRS of the surface)
     * @param northing       crossline sounding northings, m
     * @param depth          crossline sounding depths reduced to chart datum, m, positive down
     * @param surfaceDepthAt main-scheme surface depth at (easting, northing), m; NaN where none
     * @param tvuLimit       allowed TVU (95 %) at a depth, m, e.g. an S-44 order's sqrt(a^2 + (b d)^2)
     */
    public static CrosslineResult compare(double[] easting, double[] northing, double[] depth,
                                          DoubleBinaryOperator surfaceDepthAt, DoubleUnaryOperator tvuLimit) {
        int n = depth.length;
        if (easting.length != n || northing.length != n) {
            throw new IllegalArgumentException("crossline arrays differ in length: " + easting.length + ", "
                    + northing.length + ", " + n);
        }
        int nb = BAND_EDGES.length;
        Accumulator all = new Accumulator();
        Accumulator[] band = new Accumulator[nb];
        for (int b = 0; b < nb; b++) band[b] = new Accumulator();
        int unmatched = 0;
        for (int i = 0; i < n; i++) {
            double e = easting[i], no = northing[i], d = depth[i];
            if (!Double.isFinite(e) || !Double.isFinite(no) || !Double.isFinite(d)) {
                unmatched++;
                continue;
            }
            double ref = surfaceDepthAt.applyAsDouble(e, no);
            if (!Double.isFinite(ref)) {
                unmatched++;
                continue;
            }
            double diff = d - ref;
            boolean within = Math.abs(diff) <= tvuLimit.applyAsDouble(ref);
            all.add(diff, within);
            band[bandOf(ref)].add(diff, within);
        }
        List<CrosslineResult.Stats> bands = new ArrayList<>(nb);
        for (int b = 0; b < nb; b++) {
            double lo = b == 0 ? Double.NEGATIVE_INFINITY : BAND_EDGES[b];
            double hi = b + 1 < nb ? BAND_EDGES[b + 1] : Double.POSITIVE_INFINITY;
            String label = b + 1 < nb ? fmt(BAND_EDGES[b]) + "-" + fmt(hi) + " m" : fmt(BAND_EDGES[b]) + "+ m";
            bands.add(band[b].stats(label, lo, hi));
        }
        return new CrosslineResult(all.stats("all", Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY), bands, unmatched);
    }

    /** Index of the band holding a surface depth. */
    static int bandOf(double depth) {
        int b = 0;
        while (b + 1 < BAND_EDGES.length && depth >= BAND_EDGES[b + 1]) b++;
        return b;
    }

    private static String fmt(double v) { return v == Math.rint(v) ? String.valueOf((long) v) : String.valueOf(v); }

    /** Welford running mean and sum of squared deviations, plus the within-limit count. */
    private static final class Accumulator {
        int count, within;
        double mean, m2;

        void add(double x, boolean ok) {
            count++;
            double delta = x - mean;
            mean += delta / count;
            m2 += delta * (x - mean);
            if (ok) within++;
        }

        CrosslineResult.Stats stats(String label, double lo, double hi) {
            return new CrosslineResult.Stats(label, lo, hi, count, count > 0 ? mean : Double.NaN,
                    count > 1 ? Math.sqrt(m2 / (count - 1)) : Double.NaN,
                    count > 0 ? within / (double) count : Double.NaN);
        }
    }
}
