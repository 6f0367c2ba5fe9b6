package org.leadline.surface;

import org.opengis.referencing.crs.CoordinateReferenceSystem;

/**
 * The geometry of a grid before it holds values: west edge, north edge, cell size and size, in a
 * projected CRS (metres), laid out like {@link Grid} (row 0 north, top-left origin, pixel is area).
 *
 * <p>{@link #covering} snaps the edges to whole multiples of the cell size, so grids built from
 * different runs or lines over the same area share cell boundaries and can be compared cell by
 * cell or mosaicked without resampling.
 *
 * @param xMin west edge, m
 * @param yMax north edge, m
 * @param cell cell size, m
 * @param nx   columns
 * @param ny   rows
 */
public record GridSpec(double xMin, double yMax, double cell, int nx, int ny) {

    public GridSpec {
        if (!(cell > 0) || !Double.isFinite(cell)) {
            throw new IllegalArgumentException("cell size must be a positive number of metres, got " + cell);
        }
        if (nx <= 0 || ny <= 0) {
            throw new IllegalArgumentException("grid needs at least one cell, got " + nx + " x " + ny);
        }
        if ((long) nx * ny > Integer.MAX_VALUE - 8) {
            throw new IllegalArgumentException("grid of " + nx + " x " + ny + " cells at " + cell
                    + " m is too large; choose a larger cell");
        }
    }

    public double xMax() { return xMin + nx * cell; }
    public double yMin() { return yMax - ny * cell; }
    public int cells() { return nx * ny; }

    /** An empty {@link Grid} with this geometry. */
    public Grid newGrid(CoordinateReferenceSystem crs) { return new Grid(xMin, yMax, cell, nx, ny, crs); }

    /** The geometry of an existing grid. */
    public static GridSpec of(Grid g) { return new GridSpec(g.xMin, g.yMax, g.cell, g.nx, g.ny); }

    /**
     * The smallest cell-aligned grid holding every finite position: the west edge is
     * floor(min e / cell) * cell and the north edge ceil(max n / cell) * cell, so cell boundaries lie
     * on whole multiples of the cell size. A point on the east or south boundary of the data gets
     * its own column/row, so every point falls inside ({@link Grid#col}, {@link Grid#row}).
     *
     * @param e    eastings, m
     * @param n    northings, m
     * @param cell cell size, m
     * @throws IllegalArgumentException when no position is finite
     */
    public static GridSpec covering(double[] e, double[] n, double cell) {
        if (!(cell > 0) || !Double.isFinite(cell)) {
            throw new IllegalArgumentException("cell size must be a positive number of metres, got " + cell);
        }
        double minE = Double.POSITIVE_INFINITY, maxE = Double.NEGATIVE_INFINITY;
        double minN = Double.POSITIVE_INFINITY, maxN = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < e.length; i++) {
            double x = e[i], y = n[i];
            if (!Double.isFinite(x) || !Double.isFinite(y)) continue;
            if (x < minE) minE = x;
            if (x > maxE) maxE = x;
            if (y < minN) minN = y;
            if (y > maxN) maxN = y;
        }
        if (minE > maxE) {
            throw new IllegalArgumentException("no finite position to grid (" + e.length + " soundings)");
        }
        return covering(minE, maxE, minN, maxN, cell);
    }

    /** As {@link #covering(double[], double[], double)}, from the extent of the positions. */
    public static GridSpec covering(double minE, double maxE, double minN, double maxN, double cell) {
        if (!(cell > 0) || !Double.isFinite(cell)) {
            throw new IllegalArgumentException("cell size must be a positive number of metres, got " + cell);
        }
        if (!(minE <= maxE && minN <= maxN)) throw new IllegalArgumentException("no finite position to grid");
        double xMin = Math.floor(minE / cell) * cell;
        double yMax = Math.ceil(maxN / cell) * cell;
        int nx = (int) Math.floor((maxE - xMin) / cell) + 1;
        int ny = (int) Math.floor((yMax - minN) / cell) + 1;
        return new GridSpec(xMin, yMax, cell, nx, ny);
    }

    /**
     * A default cell size from the depth and the sounder's beam width: the across-track width of
     * the nadir beam footprint, 2 d tan(beamwidth / 2), at the median finite depth d, rounded down
     * to a "nice" value 1, 2 or 5 x 10^k m, and never below {@code minCell}.
     *
     * <p>Why: a cell much smaller than the footprint does not resolve more of the seabed (each
     * sounding already averages over its footprint) and leaves most cells empty; a cell much larger
     * smooths away features. Setting the cell near the footprint is common practice. Rounding
     * down keeps the cell no larger than the footprint. IHO S-44 ed. 6.0 (2020), Table 1, asks for
     * detection of cubic features (from memory: 0.5 m for Exclusive Order, 1 m for Special Order,
     * 2 m to 40 m depth and 10 % of depth beyond for Order 1a), which needs several soundings across
     * the feature, so the cell should not exceed the feature size: a caller
     * may pass {@code maxCell} to cap the cell at the order's limit.
     *
     * @param depth        depths, m (positive down); non-finite and non-positive values ignored
     * @param beamWidthRad beam width (along or across track, whichever is wider), radians
     * @param minCell      smallest cell returned, m (e.g. 0.5)
     * @param maxCell      largest cell returned, m (e.g. from the survey order), or +infinity
     * @return the cell size, m
     */
    public static double suggestCell(double[] depth, double beamWidthRad, double minCell, double maxCell) {
        if (!(beamWidthRad > 0) || !(beamWidthRad < Math.PI)) {
            throw new IllegalArgumentException("beam width must be between 0 and pi radians, got " + beamWidthRad);
        }
        if (!(minCell > 0) || !(maxCell >= minCell)) {
            throw new IllegalArgumentException("need 0 < minCell <= maxCell, got " + minCell + ", " + maxCell);
        }
        double[] d = new double[depth.length];
        int k = 0;
        for (double v : depth) if (Double.isFinite(v) && v > 0) d[k++] = v;
        if (k == 0) throw new IllegalArgumentException("no positive finite depth to size the cell from");
        double median = Select.median(d, 0, k);
        double footprint = 2 * median * Math.tan(beamWidthRad / 2);
        double cell = Math.max(minCell, niceFloor(footprint));
        return Math.min(cell, maxCell);
    }

    /** {@link #suggestCell(double[], double, double, double)} with minCell 0.1 m and no upper cap. */
    public static double suggestCell(double[] depth, double beamWidthRad) {
        return suggestCell(depth, beamWidthRad, 0.1, Double.POSITIVE_INFINITY);
    }

    /** The largest value 1, 2 or 5 x 10^k not above v (v > 0). */
    static double niceFloor(double v) {
        double p = Math.pow(10, Math.floor(Math.log10(v)));
        // guard against log10 rounding just below an exact power of ten
        if (p * 10 <= v * (1 + 1e-12)) p *= 10;
        double m = v / p;
        double f = m >= 5 - 1e-9 ? 5 : m >= 2 - 1e-9 ? 2 : 1;
        return f * p;
    }
}
