package org.leadline.surface;

import java.util.ArrayList;
import java.util.List;

/**
 * Depth contours of a grid by marching squares (W. E. Lorensen and H. E. Cline 1987, "Marching
 * cubes", SIGGRAPH 87, doi:10.1145/37402.37422, in its two-dimensional form).
 *
 * <p>The DEPTH values sit at the cell centres; each square of four neighbouring centres is
 * classified by which corners are deeper than the level ({@code depth > level}; a corner exactly at
 * the level counts as not deeper). Where an edge joins a deeper and a not-deeper corner the
 * contour crosses it at the linear interpolation t = (level - v0) / (v1 - v0) from corner 0, so
 * every vertex reproduces the level under linear interpolation along its edge. A square with a
 * NaN corner is skipped (lines end at the edge of the data: open lines). The two saddle cases
 * (diagonal corners deeper) are resolved by the square's centre value, the mean of its four
 * corners: when that mean is deeper than the level the deeper corners are joined through the
 * centre. Segments are chained through their shared edges into continuous lines; a line that
 * returns to its first edge is a closed ring and repeats its first vertex at the end.
 */
public final class Contours {
    private Contours() {}

    /**
     * One contour line in the grid's projected coordinates (or whatever a caller transformed them
     * to: the {@link org.leadline.io.GeoJsonWriter} takes x = longitude, y = latitude).
     *
     * @param level  contour depth, m
     * @param x      eastings, m
     * @param y      northings, m
     * @param closed whether the line is a ring (then the last vertex repeats the first)
     */
    public record Polyline(double level, double[] x, double[] y, boolean closed) {
        public int size() { return x.length; }
    }

    /** Levels min, min + interval, ... up to max (inclusive), starting at the first multiple of interval >= min. */
    public static double[] levels(double min, double max, double interval) {
        if (!(interval > 0) || !Double.isFinite(min) || !Double.isFinite(max)) {
            throw new IllegalArgumentException("contour levels need finite min/max and a positive interval, got "
                    + min + ", " + max + ", " + interval);
        }
        long first = (long) Math.ceil(min / interval - 1e-9);
        long last = (long) Math.floor(max / interval + 1e-9);
        if (last < first) return new double[0];
        if (last - first > 100_000) throw new IllegalArgumentException("more than 100000 contour levels requested");
        double[] out = new double[(int) (last - first + 1)];
        for (int i = 0; i < out.length; i++) out[i] = (first + i) * interval;
        return out;
    }

    /** Contours of the DEPTH layer; one list (possibly empty) per level, in the order given. */
    public static List<List<Polyline>> trace(Grid g, double[] levels) {
        return trace(g, Grid.DEPTH, levels);
    }

    /** Contours of a named layer. */
    public static List<List<Polyline>> trace(Grid g, String layer, double[] levels) {
        float[] v = g.layer(layer);
        if (v == null) throw new IllegalArgumentException("grid has no layer '" + layer + "'");
        // each level traced on its own (a Tracer reads the grid and writes only its own state), on
        // all cores; the list keeps the levels' order
        return java.util.stream.IntStream.range(0, levels.length).parallel()
                .mapToObj(k -> new Tracer(g, v, levels[k]).run()).toList();
    }

    // edges of a square: 0 top (TL-TR), 1 right (TR-BR), 2 bottom (BL-BR), 3 left (TL-BL)
    private static final int TOP = 0, RIGHT = 1, BOTTOM = 2, LEFT = 3;
    /** Edge pairs by case (bits TL=8 TR=4 BR=2 BL=1 deeper); saddles 5 and 10 handled apart. */
    private static final int[][][] SEGMENTS = {
            {}, {{LEFT, BOTTOM}}, {{BOTTOM, RIGHT}}, {{LEFT, RIGHT}},
            {{TOP, RIGHT}}, null, {{TOP, BOTTOM}}, {{TOP, LEFT}},
            {{TOP, LEFT}}, {{TOP, BOTTOM}}, null, {{TOP, RIGHT}},
            {{LEFT, RIGHT}}, {{BOTTOM, RIGHT}}, {{LEFT, BOTTOM}}, {}};
    private static final int[][] CUT_TR_BL = {{TOP, RIGHT}, {BOTTOM, LEFT}};
    private static final int[][] CUT_TL_BR = {{TOP, LEFT}, {RIGHT, BOTTOM}};

    /** Traces one level. Squares are indexed by their top-left centre (r, c), r < ny-1, c < nx-1. */
    private static final class Tracer {
        final Grid g;
        final float[] v;
        final double level;
        final int nx, ny, sx, sy;
        /** per square: case bits TL=8 TR=4 BR=2 BL=1 (deeper than level), -1 if a corner is NaN. */
        final byte[] cases;
        /** per square: visited bits of its segment slots 0 and 1. */
        final byte[] seen;
        final List<Polyline> lines = new ArrayList<>();

        Tracer(Grid g, float[] v, double level) {
            this.g = g;
            this.v = v;
            this.level = level;
            nx = g.nx;
            ny = g.ny;
            sx = Math.max(0, nx - 1);
            sy = Math.max(0, ny - 1);
            cases = new byte[sx * sy];
            seen = new byte[sx * sy];
        }

        // Row by row in methods of their own: run() is called once per level, so a loop over the
        // whole grid in it would run interpreted until the JIT compiled it on the stack; a row
        // method is called thousands of times and is compiled early (same squares, same order).
        List<Polyline> run() {
            for (int r = 0; r < sy; r++) caseRow(r);
            for (int r = 0; r < sy; r++) traceRow(r);
            return lines;
        }

        private void caseRow(int r) {
            for (int c = 0; c < sx; c++) {
                int k = r * nx + c;
                double tl = v[k], tr = v[k + 1], bl = v[k + nx], br = v[k + nx + 1];
                if (Double.isNaN(tl) || Double.isNaN(tr) || Double.isNaN(bl) || Double.isNaN(br)) {
                    cases[r * sx + c] = -1;
                    continue;
                }
                cases[r * sx + c] = (byte) ((tl > level ? 8 : 0) | (tr > level ? 4 : 0)
                        | (br > level ? 2 : 0) | (bl > level ? 1 : 0));
            }
        }

        private void traceRow(int r) {
            for (int s = r * sx, end = s + sx; s < end; s++) {
                int cs = cases[s];
                if (cs <= 0 || cs == 15) continue;
                for (int slot = 0; slot < 2; slot++) {
                    int[] seg = segment(s, cs, slot);
                    if (seg == null || (seen[s] & (1 << slot)) != 0) continue;
                    chain(s, slot, seg);
                }
            }
        }

        /** The edge pair of segment slot (0 or 1) of square s with case cs, or null. */
        int[] segment(int s, int cs, int slot) {
            int[][] segs = segments(s, cs);
            return slot < segs.length ? segs[slot] : null;
        }

        int[][] segments(int s, int cs) {
            if (cs == 5 || cs == 10) {
                boolean centreDeeper = centre(s) > level;
                // case 10: TL, BR deeper; case 5: TR, BL deeper. A deeper centre joins the deeper
                // corners, so the lines cut off the other two corners.
                return (cs == 10) == centreDeeper ? CUT_TR_BL : CUT_TL_BR;
            }
            return SEGMENTS[cs];
        }

        double centre(int s) {
            int r = s / sx, c = s - r * sx, k = r * nx + c;
            return ((double) v[k] + v[k + 1] + v[k + nx] + v[k + nx + 1]) / 4;
        }

        /** Follows the line through segment (s, slot) both ways and stores it. */
        void chain(int s0, int slot0, int[] seg0) {
            seen[s0] |= (byte) (1 << slot0);
            DoubleList xs = new DoubleList(), ys = new DoubleList();
            addVertex(s0, seg0[0], xs, ys);
            addVertex(s0, seg0[1], xs, ys);
            // forward from seg0[1]
            boolean closed = walk(s0, seg0[1], s0, seg0[0], xs, ys);
            if (!closed) {
                DoubleList bx = new DoubleList(), by = new DoubleList();
                walk(s0, seg0[0], -1, -1, bx, by);
                // prepend the backward part, reversed
                DoubleList fx = new DoubleList(), fy = new DoubleList();
                for (int i = bx.size - 1; i >= 0; i--) { fx.add(bx.a[i]); fy.add(by.a[i]); }
                for (int i = 0; i < xs.size; i++) { fx.add(xs.a[i]); fy.add(ys.a[i]); }
                xs = fx;
                ys = fy;
            }
            lines.add(new Polyline(level, xs.toArray(), ys.toArray(), closed));
        }

        /**
         * Walks from square s leaving through edge 'exit', appending vertices, until the line leaves
         * the data or reaches (stopSquare, stopEdge) (returns true; the last vertex then equals the first).
         */
        boolean walk(int s, int exit, int stopSquare, int stopEdge, DoubleList xs, DoubleList ys) {
            while (true) {
                int r = s / sx, c = s - r * sx;
                int nr = r, nc = c, entry;
                switch (exit) {
                    case TOP -> { nr = r - 1; entry = BOTTOM; }
                    case RIGHT -> { nc = c + 1; entry = LEFT; }
                    case BOTTOM -> { nr = r + 1; entry = TOP; }
                    default -> { nc = c - 1; entry = RIGHT; }
                }
                if (nr < 0 || nr >= sy || nc < 0 || nc >= sx) return false;
                int ns = nr * sx + nc;
                int cs = cases[ns];
                if (cs <= 0 || cs == 15) return false;
                int[][] segs = segments(ns, cs);
                int slot = -1, next = -1;
                for (int i = 0; i < segs.length; i++) {
                    if (segs[i][0] == entry) { slot = i; next = segs[i][1]; }
                    else if (segs[i][1] == entry) { slot = i; next = segs[i][0]; }
                }
                if (slot < 0) return false;   // cannot happen: a crossed edge is crossed in both squares
                if ((seen[ns] & (1 << slot)) != 0) {
                    // only the starting segment can be met again: the ring is closed
                    // the vertex on the shared edge was already added by the previous square and is
                    // bit-identical to the first vertex (same edge, same corner order)
                    if (ns == stopSquare) return true;
                    return false;
                }
                seen[ns] |= (byte) (1 << slot);
                addVertex(ns, next, xs, ys);
                s = ns;
                exit = next;
            }
        }

        /** The crossing on an edge of square s, interpolated from the edge's west/north corner. */
        void addVertex(int s, int edge, DoubleList xs, DoubleList ys) {
            int r = s / sx, c = s - r * sx;
            int ra, ca, rb, cb;   // corner a (west or north end), corner b
            switch (edge) {
                case TOP -> { ra = r; ca = c; rb = r; cb = c + 1; }
                case RIGHT -> { ra = r; ca = c + 1; rb = r + 1; cb = c + 1; }
                case BOTTOM -> { ra = r + 1; ca = c; rb = r + 1; cb = c + 1; }
                default -> { ra = r; ca = c; rb = r + 1; cb = c; }
            }
            double va = v[ra * nx + ca], vb = v[rb * nx + cb];
            double t = (level - va) / (vb - va);
            double xa = g.centreX(ca), ya = g.centreY(ra), xb = g.centreX(cb), yb = g.centreY(rb);
            xs.add(xa + t * (xb - xa));
            ys.add(ya + t * (yb - ya));
        }
    }

    private static final class DoubleList {
        double[] a = new double[16];
        int size;

        void add(double x) {
            if (size == a.length) a = java.util.Arrays.copyOf(a, size * 2);
            a[size++] = x;
        }

        double[] toArray() { return java.util.Arrays.copyOf(a, size); }
    }
}
