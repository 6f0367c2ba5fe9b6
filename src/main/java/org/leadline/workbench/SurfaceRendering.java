package org.leadline.workbench;

import org.leadline.report.DepthColours;
import org.leadline.surface.Grid;

import java.awt.image.BufferedImage;

/**
 * The Depth surface view without Swing: the grid as an image with {@link DepthColours}
 * (one pixel per cell, north up), optional hill-shading, and the read-out under the cursor.
 *
 * <p>Hill-shading is the Lambertian reflectance of the surface (heights = -depth) lit from azimuth
 * 315 deg (north-west) at 45 deg above the horizon, with slopes by Horn's finite differences over
 * the 3 x 3 neighbourhood (Horn 1981, "Hill shading and the reflectance map", Proc. IEEE 69(1),
 * 14-47; as in GDAL's gdaldem hillshade). Cells next to empty cells use the centre value in place
 * of the missing neighbours. The colour is multiplied by (0.35 + 0.65 x shade), keeping depth the
 * main reading of the colour.
 */
public final class SurfaceRendering {
    /** Light from the north-west, 45 deg up (the usual cartographic convention, common practice). */
    public static final double AZIMUTH_DEG = 315, ALTITUDE_DEG = 45;

    private SurfaceRendering() {}

    /** {shallowest, deepest} finite depth of the grid, m ({0, 1} when empty). */
    public static double[] depthRange(Grid g) {
        float[] d = g.layer(Grid.DEPTH);
        double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
        for (float v : d) {
            if (Float.isFinite(v)) {
                lo = Math.min(lo, v);
                hi = Math.max(hi, v);
            }
        }
        return lo > hi ? new double[] {0, 1} : new double[] {lo, hi};
    }

    /** The grid as an ARGB image, one pixel per cell; empty cells transparent. */
    public static BufferedImage image(Grid g, boolean hillShade) {
        float[] d = g.layer(Grid.DEPTH);
        double[] r = depthRange(g);
        double[] shade = hillShade ? hillShade(g, AZIMUTH_DEG, ALTITUDE_DEG) : null;
        BufferedImage img = new BufferedImage(g.nx, g.ny, BufferedImage.TYPE_INT_ARGB);
        for (int row = 0; row < g.ny; row++) {
            for (int col = 0; col < g.nx; col++) {
                int i = row * g.nx + col;
                if (!Float.isFinite(d[i])) continue;
                int rgb = DepthColours.rgb(d[i], r[0], r[1]);
                if (shade != null) {
                    double f = 0.35 + 0.65 * shade[i];
                    rgb = (scale(rgb >> 16, f) << 16) | (scale(rgb >> 8, f) << 8) | scale(rgb, f);
                }
                img.setRGB(col, row, 0xFF000000 | rgb);
            }
        }
        return img;
    }

    private static int scale(int c, double f) { return (int) Math.round((c & 0xFF) * f); }

    /**
     * Hill-shade of every cell, 0 (dark) .. 1 (facing the light); NaN for empty cells. Heights are
     * the negated depths, rows run south and columns east (Grid layout).
     *
     * @param azimuthDeg  direction the light comes from, degrees clockwise from grid north
     * @param altitudeDeg height of the light above the horizon, degrees
     */
    public static double[] hillShade(Grid g, double azimuthDeg, double altitudeDeg) {
        float[] d = g.layer(Grid.DEPTH);
        int nx = g.nx, ny = g.ny;
        double zenith = Math.toRadians(90 - altitudeDeg);
        double az = Math.toRadians(azimuthDeg);
        double[] out = new double[nx * ny];
        for (int row = 0; row < ny; row++) {
            for (int col = 0; col < nx; col++) {
                int i = row * nx + col;
                if (!Float.isFinite(d[i])) {
                    out[i] = Double.NaN;
                    continue;
                }
                double c0 = -d[i];
                double a = h(d, nx, ny, row - 1, col - 1, c0), b = h(d, nx, ny, row - 1, col, c0),
                        c = h(d, nx, ny, row - 1, col + 1, c0), dd = h(d, nx, ny, row, col - 1, c0),
                        f = h(d, nx, ny, row, col + 1, c0), gg = h(d, nx, ny, row + 1, col - 1, c0),
                        hh = h(d, nx, ny, row + 1, col, c0), ii = h(d, nx, ny, row + 1, col + 1, c0);
                // Horn (1981): east and north gradients of height
                double dzdx = ((c + 2 * f + ii) - (a + 2 * dd + gg)) / (8 * g.cell);
                double dzdy = ((a + 2 * b + c) - (gg + 2 * hh + ii)) / (8 * g.cell);
                out[i] = shade(dzdx, dzdy, zenith, az);
            }
        }
        return out;
    }

    /**
     * Lambertian shade of a plane with east and north height gradients: the cosine of the angle
     * between its upward normal (-dzdx, -dzdy, 1) and the direction to the light, clamped at 0.
     */
    static double shade(double dzdx, double dzdy, double zenith, double azimuth) {
        // unit vector to the light: east sin(az) sin(zen), north cos(az) sin(zen), up cos(zen)
        double le = Math.sin(azimuth) * Math.sin(zenith), ln = Math.cos(azimuth) * Math.sin(zenith), lu = Math.cos(zenith);
        double dot = (-dzdx * le - dzdy * ln + lu) / Math.sqrt(dzdx * dzdx + dzdy * dzdy + 1);
        return Math.max(0, dot);
    }

    private static double h(float[] d, int nx, int ny, int row, int col, double centre) {
        if (row < 0 || col < 0 || row >= ny || col >= nx) return centre;
        float v = d[row * nx + col];
        return Float.isFinite(v) ? -v : centre;
    }

    /**
     * What the read-out shows at a point.
     *
     * @param easting     m
     * @param northing    m
     * @param depth       cell depth, m (NaN: empty or outside)
     * @param uncertainty cell uncertainty (95 %), m
     * @param count       soundings in the cell
     */
    public record Readout(double easting, double northing, double depth, double uncertainty, int count) {
        /** One line of text for the status bar. */
        public String text() {
            String pos = String.format(java.util.Locale.ROOT, "E %.1f m  N %.1f m", easting, northing);
            if (Double.isNaN(depth)) return pos + "  (no data)";
            return pos + String.format(java.util.Locale.ROOT, "  depth %.2f m  uncertainty %.2f m (95 %%)  %d soundings",
                    depth, uncertainty, count);
        }
    }

    /** The cell values at (easting, northing). */
    public static Readout readout(Grid g, double e, double n) {
        int col = g.col(e), row = g.row(n);
        if (col < 0 || row < 0) return new Readout(e, n, Double.NaN, Double.NaN, 0);
        int i = row * g.nx + col;
        float[] u = g.layer(Grid.UNCERTAINTY), c = g.layer(Grid.COUNT);
        return new Readout(e, n, g.layer(Grid.DEPTH)[i], u == null ? Double.NaN : u[i], c == null ? 0 : Math.round(c[i]));
    }
}
