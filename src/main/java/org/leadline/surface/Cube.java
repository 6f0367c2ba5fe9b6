package org.leadline.surface;

import java.util.Arrays;

/**
 * CUBE-style multiple-hypothesis depth estimation at grid nodes, after B. R. Calder and L. A.
 * Mayer (2003), "Automatic processing of high-rate, high-density multibeam echosounder data",
 * Geochemistry, Geophysics, Geosystems 4(6), 1048, doi:10.1029/2002GC000486, with parameter
 * choices discussed in B. R. Calder and D. E. Wells (2007), "CUBE User's Manual", version 1.13,
 * CCOM/JHC, University of New Hampshire. This is an independent implementation of the published
 * ideas, simplified as listed below.
 *
 * <p>Nodes sit at the cell centres. Soundings are taken in index order (deterministic). A sounding
 * at horizontal distance r from a node, within the capture radius
 * R = max(cell / sqrt 2, captureFraction x depth), reaches the node with its vertical variance
 * inflated for the distance and its horizontal uncertainty (Calder and Mayer 2003, eq. 8, from
 * memory): sigma_n^2 = sigma_v^2 (1 + ((r + k sigma_h) / s)^alpha), with sigma_v = tvu/1.96,
 * sigma_h = thu/1.96 (0 when unknown), s = distance scale (the cell size), alpha = distance
 * exponent, k = horizontal error scale. The minimum radius cell/sqrt 2 guarantees every sounding
 * reaches the node of its own cell.
 *
 * <p>Each node keeps a list of depth hypotheses (mean m, variance v, count). A sounding d with
 * variance sigma_n^2 is tested against every hypothesis by its normalised innovation
 * |d - m| / sqrt(v + sigma_n^2); the hypothesis with the smallest one takes the sounding if that
 * value is at most the intervention threshold, by the scalar Kalman update
 * K = v / (v + sigma_n^2), m += K (d - m), v = (1 - K) v (a constant-depth state: no process
 * noise). Otherwise the sounding starts a new hypothesis (m = d, v = sigma_n^2). This stands in for
 * the paper's monitoring and intervention step.
 *
 * <p>Disambiguation: the node reports the hypothesis that took the most soundings (the paper's
 * "number of samples" rule); ties go to the smaller variance, then the shoaler depth, then the
 * earlier hypothesis. Node uncertainty (95 %) = max(1.96 sqrt(v), 1.96 x the sample standard
 * deviation of the depths the chosen hypothesis took).
 *
 * <p>Left out (documented in docs/science/surface.md): the pre-filter median queue that reorders
 * the first soundings, Page's CUSUM monitoring of slow drift, disambiguation by neighbouring
 * nodes ("locale") or by a reference surface ("predicted surface"), and process noise for a
 * changing seabed.
 */
public final class Cube {
    /** Name of the extra layer holding the number of hypotheses at each node. */
    public static final String HYPOTHESES = "hypotheses";
    private static final double Z95 = 1.96;

    private Cube() {}

    /**
     * CUBE parameters. Defaults (see {@link #defaults()}) follow the orders of magnitude given by
     * Calder and Wells (2007) (from memory): capture distance 5 % of depth, distance exponent 2,
     * horizontal error scale 1.96, intervention threshold 3 standard deviations (chosen here: about
     * 0.3 % of normal soundings start a spurious hypothesis that then loses disambiguation).
     *
     * @param captureFraction       capture radius as a fraction of depth (the radius is never below cell/sqrt 2)
     * @param distanceExponent      alpha in the variance inflation
     * @param horizontalErrorScale  k in the variance inflation
     * @param interventionThreshold largest normalised innovation that joins a hypothesis
     * @param maxHypotheses         most hypotheses a node keeps (a bound on run time, not in the paper):
     *                              when TVU is far below the real scatter almost every sounding would
     *                              start its own hypothesis; a full node ignores further disagreeing
     *                              soundings (they still count in COUNT and STDDEV)
     */
    public record Parameters(double captureFraction, double distanceExponent, double horizontalErrorScale,
                             double interventionThreshold, int maxHypotheses) {
        public Parameters {
            if (!(captureFraction >= 0) || !(distanceExponent > 0) || !(horizontalErrorScale >= 0)
                    || !(interventionThreshold > 0) || maxHypotheses < 1) {
                throw new IllegalArgumentException("CUBE parameters must be non-negative (threshold and exponent positive): "
                        + captureFraction + ", " + distanceExponent + ", " + horizontalErrorScale + ", "
                        + interventionThreshold + ", " + maxHypotheses);
            }
        }

        public static Parameters defaults() { return new Parameters(0.05, 2.0, 1.96, 3.0, 32); }
    }

    /** Per node (row-major, like Grid layers): depth and 95 % uncertainty of the chosen hypothesis (NaN if none), hypothesis count. */
    public record Result(double[] depth, double[] uncertainty, float[] hypotheses) {}

    /**
     * Runs CUBE over the soundings whose {@code use[i] >= 0} (the gridder passes its cell index).
     *
     * @param g    grid (geometry only)
     * @param tvu  95 % vertical uncertainty, m (finite and positive where used)
     * @param thu  95 % horizontal uncertainty, m (may be null)
     * @param use  negative to skip a sounding
     */
    public static Result estimate(Grid g, double[] e, double[] n, double[] depth, double[] tvu, double[] thu,
                                  int[] use, Parameters p) {
        int cells = g.cells();
        int[] head = new int[cells];
        Arrays.fill(head, -1);
        Hyps h = new Hyps(Math.max(16, Math.min(cells, 1 << 16)));
        double cell = g.cell, minR = cell / Math.sqrt(2) * (1 + 1e-12);
        boolean square = p.distanceExponent() == 2.0;
        for (int i = 0; i < depth.length; i++) {
            if (use[i] < 0) continue;
            double x = e[i], y = n[i], d = depth[i];
            double sv = tvu[i] / Z95;
            double varV = sv * sv;
            double sh = thu == null || !(thu[i] >= 0) || Double.isInfinite(thu[i]) ? 0 : thu[i] / Z95;
            double radius = Math.max(minR, p.captureFraction() * Math.abs(d));
            int c0 = Math.max(0, (int) Math.ceil((x - radius - g.xMin) / cell - 0.5));
            int c1 = Math.min(g.nx - 1, (int) Math.floor((x + radius - g.xMin) / cell - 0.5));
            int r0 = Math.max(0, (int) Math.ceil((g.yMax - (y + radius)) / cell - 0.5));
            int r1 = Math.min(g.ny - 1, (int) Math.floor((g.yMax - (y - radius)) / cell - 0.5));
            for (int r = r0; r <= r1; r++) {
                double dy = g.centreY(r) - y;
                for (int c = c0; c <= c1; c++) {
                    double dx = g.centreX(c) - x;
                    double dist = Math.sqrt(dx * dx + dy * dy);
                    if (dist > radius) continue;
                    double q = (dist + p.horizontalErrorScale() * sh) / cell;
                    double var = varV * (1 + (square ? q * q : Math.pow(q, p.distanceExponent())));
                    update(h, head, r * g.nx + c, d, var, p.interventionThreshold(), p.maxHypotheses());
                }
            }
        }
        double[] dep = new double[cells], unc = new double[cells];
        float[] nh = new float[cells];
        double[] a = h.a;
        for (int k = 0; k < cells; k++) {
            int best = -1, count = 0;
            for (int j = head[k]; j >= 0; j = (int) h.a[j + NEXT]) {
                count++;
                if (best < 0 || better(h.a, j, best)) best = j;
            }
            nh[k] = count;
            if (best < 0) {
                dep[k] = unc[k] = Double.NaN;
                continue;
            }
            double c = a[best + COUNT];
            dep[k] = a[best + MEAN];
            double sd = c > 1 ? Math.sqrt(a[best + M2] / (c - 1)) : Double.NaN;
            unc[k] = Gridder.maxDefined(Z95 * Math.sqrt(a[best + VAR]), Z95 * sd);
        }
        return new Result(dep, unc, nh);
    }

    /** Disambiguation order: more soundings, then smaller variance, then shoaler, then earlier (smaller offset). */
    private static boolean better(double[] a, int j, int best) {
        if (a[j + COUNT] != a[best + COUNT]) return a[j + COUNT] > a[best + COUNT];
        if (a[j + VAR] != a[best + VAR]) return a[j + VAR] < a[best + VAR];
        if (a[j + MEAN] != a[best + MEAN]) return a[j + MEAN] < a[best + MEAN];
        return j < best;
    }

    private static void update(Hyps h, int[] head, int node, double d, double var, double threshold, int maxHyp) {
        double[] a = h.a;
        int best = -1, last = -1, count = 0;
        double bestQ2 = Double.POSITIVE_INFINITY;
        for (int j = head[node]; j >= 0; j = (int) a[j + NEXT]) {
            double dz = d - a[j + MEAN];
            double q2 = dz * dz / (a[j + VAR] + var);   // squared normalised innovation
            if (q2 < bestQ2) {
                bestQ2 = q2;
                best = j;
            }
            last = j;
            count++;
        }
        if (best >= 0 && bestQ2 <= threshold * threshold) {
            double v = a[best + VAR];
            double gain = v / (v + var);
            a[best + MEAN] += gain * (d - a[best + MEAN]);
            a[best + VAR] = (1 - gain) * v;
            // Welford's running variance of the raw depths the hypothesis took
            double c = a[best + COUNT] + 1;
            a[best + COUNT] = c;
            double delta = d - a[best + RAW];
            a[best + RAW] += delta / c;
            a[best + M2] += delta * (d - a[best + RAW]);
            return;
        }
        if (count >= maxHyp) return;   // node full: TVU far below the real scatter; see Parameters
        int j = h.add(d, var);
        if (last < 0) head[node] = j;
        else h.a[last + NEXT] = j;
    }

    // fields of one hypothesis, interleaved in one array so an update touches one or two cache lines
    private static final int MEAN = 0, VAR = 1, RAW = 2, M2 = 3, COUNT = 4, NEXT = 5, STRIDE = 6;

    /** Hypotheses of all nodes: records of STRIDE doubles in one growable array (no object per hypothesis). */
    private static final class Hyps {
        double[] a;
        int size;   // in doubles

        Hyps(int capacity) { a = new double[capacity * STRIDE]; }

        /** Appends a one-sounding hypothesis; returns its offset. */
        int add(double d, double v) {
            if (size == a.length) {
                long cap = (long) a.length + (a.length >> 1) + 16 * STRIDE;
                if (cap > Integer.MAX_VALUE - 8) throw new IllegalStateException("too many CUBE hypotheses");
                a = Arrays.copyOf(a, (int) cap / STRIDE * STRIDE);
            }
            int j = size;
            size += STRIDE;
            a[j + MEAN] = d;
            a[j + VAR] = v;
            a[j + RAW] = d;
            a[j + M2] = 0;
            a[j + COUNT] = 1;
            a[j + NEXT] = -1;
            return j;
        }
    }
}
