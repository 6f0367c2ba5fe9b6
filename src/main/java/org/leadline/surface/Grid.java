package org.leadline.surface;

import org.opengis.referencing.crs.CoordinateReferenceSystem;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * A regular grid of square cells in a projected CRS, north up, with named float32 layers.
 *
 * <p>Cell (row, col) covers easting {@code [xMin + col*cell, xMin + (col+1)*cell)} and northing
 * {@code (yMax - (row+1)*cell, yMax - row*cell]}; row 0 is the northernmost row, so the layout is
 * the one a GeoTIFF stores (top-left origin, pixel-is-area). A layer is a {@code float[ny*nx]}
 * indexed {@code row*nx + col}; empty cells hold NaN (counts hold 0).
 */
public final class Grid {
    /** Standard layer names, in the order they are exported. */
    public static final String DEPTH = "depth", UNCERTAINTY = "uncertainty", COUNT = "count", STDDEV = "stddev";

    public final double xMin;
    public final double yMax;
    public final double cell;
    public final int nx;
    public final int ny;
    private final CoordinateReferenceSystem crs;
    private final Map<String, float[]> layers = new LinkedHashMap<>();

    /**
     * @param xMin west edge, m (projected)
     * @param yMax north edge, m (projected)
     * @param cell cell size, m
     * @param nx   columns
     * @param ny   rows
     * @param crs  projected CRS of the grid (may be null only in pure-geometry tests)
     */
    public Grid(double xMin, double yMax, double cell, int nx, int ny, CoordinateReferenceSystem crs) {
        if (!(cell > 0) || nx <= 0 || ny <= 0) {
            throw new IllegalArgumentException("grid needs a positive cell size and size, got cell " + cell
                    + " m, " + nx + " x " + ny);
        }
        if ((long) nx * ny > Integer.MAX_VALUE - 8) {
            throw new IllegalArgumentException("grid of " + nx + " x " + ny + " cells is too large; choose a larger cell");
        }
        this.xMin = xMin;
        this.yMax = yMax;
        this.cell = cell;
        this.nx = nx;
        this.ny = ny;
        this.crs = crs;
    }

    public CoordinateReferenceSystem crs() { return crs; }
    public double xMax() { return xMin + nx * cell; }
    public double yMin() { return yMax - ny * cell; }
    public int cells() { return nx * ny; }
    /** Easting of the centre of column col, m. */
    public double centreX(int col) { return xMin + (col + 0.5) * cell; }
    /** Northing of the centre of row row, m. */
    public double centreY(int row) { return yMax - (row + 0.5) * cell; }
    /** Column containing easting x, or -1 outside. */
    public int col(double x) {
        double f = (x - xMin) / cell;
        return f >= 0 && f < nx ? (int) f : -1;
    }
    /** Row containing northing y, or -1 outside. */
    public int row(double y) {
        double f = (yMax - y) / cell;
        return f >= 0 && f < ny ? (int) f : -1;
    }

    /** Adds (or replaces) a layer; the array is kept, not copied. */
    public Grid putLayer(String name, float[] values) {
        if (values.length != nx * ny) {
            throw new IllegalArgumentException("layer " + name + " has " + values.length + " values, grid has " + nx * ny);
        }
        layers.put(name, values);
        return this;
    }

    /** The layer, or null when absent. */
    public float[] layer(String name) { return layers.get(name); }

    /** Layers in insertion order. */
    public Map<String, float[]> layers() { return Collections.unmodifiableMap(layers); }
}
