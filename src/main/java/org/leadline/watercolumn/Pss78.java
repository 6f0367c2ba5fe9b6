package org.leadline.watercolumn;

/**
 * Practical salinity from conductivity: the Practical Salinity Scale 1978 (PSS-78), with the
 * Hill et al. (1986) extension below practical salinity 2.
 *
 * <p>PSS-78: Lewis and Perkin (1981), Unesco (1981, Tech. Pap. Mar. Sci. 36/37), coded as in
 * UNESCO Technical Papers in Marine Science 44 (Fofonoff and Millard 1983), function SAL78:
 * check value S = 40.0000 for R = 1.888091, T68 = 40 deg C, p = 10000 dbar. The scale's
 * temperature is IPTS-68; inputs here are ITS-90 and converted with {@link Temperature}.
 * Stated range: practical salinity 2..42, temperature -2..35 deg C, pressure 0..10000 dbar.
 *
 * <p>Below 2 the scale is continued with Hill, Dauphinee and Woods (1986, IEEE J. Oceanic Eng.
 * OE-11, 109-112), scaled so the two meet without a step at S = 2, as TEOS-10's
 * {@code gsw_SP_from_C} does; this matters for estuarine and river water. Agreement with GSW
 * {@code SP_from_C} over 0..40: see {@code Pss78Test} (about 1e-12, i.e. rounding).
 *
 * <p>Conductivity ratio R = C(S, t, p) / C(35, 15 deg C (T68), 0), where C(35, 15, 0) =
 * 42.914 mS/cm (Culkin and Smith 1980, as used by UNESCO 44 and TEOS-10).
 */
public final class Pss78 {
    /** Conductivity of standard seawater, S = 35, T68 = 15 deg C, p = 0: mS/cm. */
    public static final double C3515 = 42.914;

    private static final double[] A = {0.0080, -0.1692, 25.3851, 14.0941, -7.0261, 2.7081};
    private static final double[] B = {0.0005, -0.0056, -0.0066, -0.0375, 0.0636, -0.0144};
    private static final double K = 0.0162;

    private Pss78() {}

    /**
     * Practical salinity from conductivity ratio R (dimensionless), ITS-90 temperature, deg C,
     * and sea pressure, dbar. Returns NaN for NaN input; never negative.
     */
    public static double salinity(double conductivityRatio, double t90, double pressureDbar) {
        double r = conductivityRatio;
        if (!(r >= 0) || !Double.isFinite(t90) || !Double.isFinite(pressureDbar)) return Double.NaN;
        double t = Temperature.its90ToIts68(t90);
        double rt = r / (rp(r, t, pressureDbar) * rt35(t));
        double dt = t - 15;
        double ft = dt / (1 + K * dt);
        double x = Math.sqrt(rt);
        double s = sal(x, ft);
        if (s < 2) {
            s = hillRatio(ft) * hillRaw(s, rt, ft);
        }
        return Math.max(0, s);
    }

    /** Practical salinity from conductivity, mS/cm, ITS-90 temperature, deg C, pressure, dbar. */
    public static double salinityFromConductivity(double mSperCm, double t90, double pressureDbar) {
        return salinity(mSperCm / C3515, t90, pressureDbar);
    }

    /** Conductivity, mS/cm, of water of practical salinity S at ITS-90 temperature and pressure. */
    public static double conductivityFromSalinity(double salinity, double t90, double pressureDbar) {
        return conductivityRatio(salinity, t90, pressureDbar) * C3515;
    }

    /**
     * Conductivity ratio R giving practical salinity S at ITS-90 temperature t90 and pressure p:
     * the inverse of {@link #salinity(double, double, double)}, by safeguarded Newton iteration on
     * sqrt(R) so that {@code salinity(conductivityRatio(S)) == S} to 1e-10.
     */
    public static double conductivityRatio(double salinity, double t90, double pressureDbar) {
        if (!(salinity >= 0) || !Double.isFinite(t90) || !Double.isFinite(pressureDbar)) return Double.NaN;
        if (salinity == 0) return 0;
        // bracket u = sqrt(R): S(u) increases with u
        double lo = 0, hi = 1;
        while (salinity(hi * hi, t90, pressureDbar) < salinity) hi *= 1.5;
        double u = Math.sqrt(salinity / 35.0);
        if (u <= lo || u >= hi) u = 0.5 * (lo + hi);
        for (int i = 0; i < 100; i++) {
            double f = salinity(u * u, t90, pressureDbar) - salinity;
            if (f == 0) break;
            if (f > 0) hi = u; else lo = u;
            double h = 1e-7 * Math.max(u, 1e-3);
            double df = (salinity((u + h) * (u + h), t90, pressureDbar)
                    - salinity((u - h) * (u - h), t90, pressureDbar)) / (2 * h);
            double next = u - f / df;
            if (!(next > lo && next < hi)) next = 0.5 * (lo + hi); // fall back to bisection
            if (Math.abs(next - u) < 1e-15 * Math.max(1, u) || hi - lo < 1e-16) { u = next; break; }
            u = next;
        }
        return u * u;
    }

    /** PSS-78 polynomial in x = sqrt(Rt) and ft = (T68 - 15) / (1 + k (T68 - 15)). */
    private static double sal(double x, double ft) {
        double a = ((((A[5] * x + A[4]) * x + A[3]) * x + A[2]) * x + A[1]) * x + A[0];
        double b = ((((B[5] * x + B[4]) * x + B[3]) * x + B[2]) * x + B[1]) * x + B[0];
        return a + ft * b;
    }

    /** rt(T68) = C(35, T, 0) / C(35, 15, 0). */
    private static double rt35(double t) {
        return (((1.0031e-9 * t - 6.9698e-7) * t + 1.104259e-4) * t + 2.00564e-2) * t + 0.6766097;
    }

    /** Rp = C(S, T, p) / C(S, T, 0), pressure correction of the conductivity ratio. */
    private static double rp(double r, double t, double p) {
        double c = ((3.989e-15 * p - 6.370e-10) * p + 2.070e-5) * p;
        double b = (4.464e-4 * t + 3.426e-2) * t + 1.0;
        double a = -3.107e-3 * t + 0.4215;
        return 1 + c / (b + a * r);
    }

    /** Hill et al. (1986) low-salinity form before scaling. */
    private static double hillRaw(double s, double rt, double ft) {
        double x = 400 * rt;
        double sqrty = 10 * Math.sqrt(rt); // y = 100 rt
        double part1 = 1 + x * (1.5 + x);
        double part2 = 1 + sqrty * (1 + sqrty * (1 + sqrty));
        return s - A[0] / part1 - B[0] * ft / part2;
    }

    /**
     * 2 / (Hill form at PSS-78 salinity 2): makes the extension continuous at S = 2. The sqrt(Rt)
     * giving PSS-78 salinity 2 at this temperature is found by Newton iteration on the polynomial.
     */
    private static double hillRatio(double ft) {
        double x = 0.2641; // sqrt(Rt) near S = 2 at 15 deg C
        for (int i = 0; i < 50; i++) {
            double f = sal(x, ft) - 2;
            double h = 1e-7;
            double df = (sal(x + h, ft) - sal(x - h, ft)) / (2 * h);
            double step = f / df;
            x -= step;
            if (Math.abs(step) < 1e-15) break;
        }
        return 2.0 / hillRaw(2.0, x * x, ft);
    }
}
