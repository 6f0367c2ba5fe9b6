package org.leadline.survey;

/**
 * A discrete tide zone: an area where the water level is the reference gauge's level shifted in
 * time and scaled in range (see {@link org.leadline.reduction.TideZoning}).
 *
 * <p>The area is one or more rings of longitude/latitude vertices (WGS84 degrees), closed (first
 * vertex repeated last, RFC 7946 section 3.1.6). A point is inside when a ray from it crosses the
 * rings an odd number of times (even-odd rule), so inner rings are holes and several outer rings
 * make a multi-part zone. Edges are straight lines in longitude/latitude, as RFC 7946 section
 * 3.1.1 defines them; a zone must not cross the antimeridian (split it, RFC 7946 section 3.1.9).
 *
 * @param name       unique zone name
 * @param lon        rings of longitudes, degrees
 * @param lat        rings of latitudes, degrees (same shape as lon)
 * @param timeOffset time by which the tide in the zone lags the gauge, s (positive: later)
 * @param rangeRatio ratio of the zone's tidal range to the gauge's (dimensionless, > 0)
 */
public record TideZone(String name, double[][] lon, double[][] lat, double timeOffset, double rangeRatio) {
    public TideZone {
        if (lon.length != lat.length) throw new IllegalArgumentException("zone " + name + ": rings of lon and lat differ");
        lon = deepClone(lon);
        lat = deepClone(lat);
        for (int r = 0; r < lon.length; r++) {
            if (lon[r].length != lat[r].length) throw new IllegalArgumentException("zone " + name + ": ring " + r + " lengths differ");
        }
    }

    private static double[][] deepClone(double[][] a) {
        double[][] c = new double[a.length][];
        for (int i = 0; i < a.length; i++) c[i] = a[i].clone();
        return c;
    }

    /**
     * Even-odd point-in-polygon test over all rings (W. R. Franklin, "PNPOLY - Point Inclusion in
     * Polygon Test", 1970/2006: a horizontal ray to the east counts edge crossings).
     */
    public boolean contains(double latDeg, double lonDeg) {
        boolean inside = false;
        for (int r = 0; r < lon.length; r++) {
            double[] x = lon[r], y = lat[r];
            int n = x.length;
            for (int i = 0, j = n - 1; i < n; j = i++) {
                if ((y[i] > latDeg) != (y[j] > latDeg)
                        && lonDeg < (x[j] - x[i]) * (latDeg - y[i]) / (y[j] - y[i]) + x[i]) {
                    inside = !inside;
                }
            }
        }
        return inside;
    }
}
