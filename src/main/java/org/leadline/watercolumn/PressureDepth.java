package org.leadline.watercolumn;

/**
 * Depth from sea pressure and back, for a standard ocean (S = 35, T = 0 deg C) on the normal
 * gravity of the Geodetic Reference System.
 *
 * <p>Forward: Saunders and Fofonoff (1976, Deep-Sea Research 23, 109-111) as coded in UNESCO
 * Technical Papers in Marine Science 44 (Fofonoff and Millard 1983), function DEPTH: check value
 * 9712.653 m at 10000 dbar, latitude 30 deg. The formula ignores the real water column's
 * temperature and salinity (and so the dynamic height), which is why it differs from TEOS-10's
 * {@code -z_from_p} by up to about 1.1 m at 10000 dbar and about 0.05 m at 1000 dbar; the
 * difference is bounded in {@code PressureDepthTest} against GSW.
 *
 * <p>Inverse: Newton iteration on the forward formula, so that {@code depth(pressure(z)) == z}
 * to 1e-9 m (not a separate approximate formula such as Leroy and Parthiot 1998, which would not
 * round-trip).
 *
 * <p>Validity: 0..10000 dbar (the formula is a fit over the oceanic pressure range); any latitude.
 */
public final class PressureDepth {
    private PressureDepth() {}

    /**
     * Depth, m (positive down), at sea pressure p, dbar, and latitude, degrees.
     * UNESCO 1983 (Tech. Pap. Mar. Sci. 44) DEPTH.
     */
    public static double depth(double pressureDbar, double latitudeDeg) {
        double p = pressureDbar;
        double x = Math.sin(Math.toRadians(latitudeDeg));
        x = x * x;
        // gravity variation with latitude (GRS 1967 normal gravity) and the mean vertical gradient
        double gr = 9.780318 * (1.0 + (5.2788e-3 + 2.36e-5 * x) * x) + 1.092e-6 * p;
        double d = (((-1.82e-15 * p + 2.279e-10) * p - 2.2512e-5) * p + 9.72659) * p;
        return d / gr;
    }

    /**
     * Sea pressure, dbar, at depth z, m (positive down), and latitude, degrees: the exact inverse of
     * {@link #depth(double, double)} by Newton iteration (converges in 3-4 steps from p = z).
     */
    public static double pressure(double depthM, double latitudeDeg) {
        if (!Double.isFinite(depthM) || !Double.isFinite(latitudeDeg)) return Double.NaN;
        double p = depthM * 1.0076; // first guess: about 1.0076 dbar per metre in the upper ocean
        for (int i = 0; i < 30; i++) {
            double f = depth(p, latitudeDeg) - depthM;
            double h = Math.max(1e-3, Math.abs(p) * 1e-7);
            double df = (depth(p + h, latitudeDeg) - depth(p - h, latitudeDeg)) / (2 * h);
            double step = f / df;
            p -= step;
            if (Math.abs(step) < 1e-12 * Math.max(1.0, Math.abs(p))) break;
        }
        return p;
    }
}
