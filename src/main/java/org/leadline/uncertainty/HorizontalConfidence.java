package org.leadline.uncertainty;

import org.apache.commons.math3.special.Erf;

/**
 * Radius of the 95 % confidence circle of a bivariate normal horizontal error with independent
 * one-sigma components along two perpendicular axes (here along-track and across-track).
 *
 * <p>For a circular error (equal sigmas, sigma each) the radius is exact:
 * {@code sigma * sqrt(-2 ln 0.05) = 2.4477 sigma} (Rayleigh distribution of the radial error). For
 * a one-dimensional error it is {@code 1.95996 sigma}. Between the two, the radius is found by
 * solving {@code P(x^2 + y^2 <= rho^2) = 0.95} for x ~ N(0, s1^2), y ~ N(0, s2^2) with
 * {@code P = 2 * integral_0^(pi/2) phi(rho sin t) erf(rho cos t / (k sqrt 2)) rho cos t dt},
 * k = s2/s1 <= 1, integrated by Simpson's rule and tabulated once in k (101 points, linear
 * interpolation; the table is accurate to better than 1e-4 of the radius).
 * This keeps IHO S-44's 95 % meaning for THU without assuming the error is circular.
 */
public final class HorizontalConfidence {
    /** sqrt(-2 ln 0.05): 95 % radius factor for a circular bivariate normal. */
    public static final double CIRCULAR_95 = Math.sqrt(-2 * Math.log(0.05));
    /** Two-sided 95 % factor of a one-dimensional normal, as used for TVU (IHO S-44 ed. 6.0.0). */
    public static final double LINEAR_95 = 1.959963984540054;

    private static final int STEPS = 100;
    private static final double[] FACTOR = new double[STEPS + 1];

    static {
        for (int j = 0; j <= STEPS; j++) FACTOR[j] = solve((double) j / STEPS, 0.95);
    }

    private HorizontalConfidence() { }

    /**
     * 95 % radius, m, for one-sigma errors s1 and s2 (m) along two perpendicular axes.
     * Returns NaN if either is NaN.
     */
    public static double radius95(double s1, double s2) {
        double hi = Math.max(Math.abs(s1), Math.abs(s2));
        double lo = Math.min(Math.abs(s1), Math.abs(s2));
        if (!(hi > 0)) return hi == 0 ? 0 : Double.NaN;
        double k = lo / hi * STEPS;
        int j = (int) k;
        if (j >= STEPS) return hi * FACTOR[STEPS];
        double f = k - j;
        return hi * (FACTOR[j] + f * (FACTOR[j + 1] - FACTOR[j]));
    }

    /** Probability that the radial error is within rho (rho in units of the larger sigma), k = s2/s1. */
    static double probabilityWithin(double rho, double k) {
        if (k == 0) return Erf.erf(rho / Math.sqrt(2));
        int n = 100; // Simpson intervals; the integrand is smooth on [0, pi/2]
        double h = (Math.PI / 2) / n;
        double sum = 0;
        for (int m = 0; m <= n; m++) {
            double t = m * h;
            double x = rho * Math.sin(t);
            double yMax = rho * Math.cos(t);
            double g = Math.exp(-0.5 * x * x) / Math.sqrt(2 * Math.PI)
                    * Erf.erf(yMax / (k * Math.sqrt(2))) * yMax;
            sum += g * (m == 0 || m == n ? 1 : (m % 2 == 1 ? 4 : 2));
        }
        return 2 * sum * h / 3;
    }

    /**
     * Radius (in units of the larger sigma) holding probability p, by the Illinois variant of
     * regula falsi on the bracket [1.9, 2.5] (the answer lies between 1.96 and 2.45 for p = 0.95).
     */
    static double solve(double k, double p) {
        double a = 1.9, b = 2.5;
        double fa = probabilityWithin(a, k) - p, fb = probabilityWithin(b, k) - p;
        int side = 0;
        for (int it = 0; it < 60 && Math.abs(b - a) > 1e-12; it++) {
            double c = (a * fb - b * fa) / (fb - fa);
            double fc = probabilityWithin(c, k) - p;
            if (Math.abs(fc) < 1e-14) return c;
            if (fc * fb > 0) {
                b = c; fb = fc;
                if (side == -1) fa /= 2;
                side = -1;
            } else {
                a = c; fa = fc;
                if (side == 1) fb /= 2;
                side = 1;
            }
        }
        return 0.5 * (a + b);
    }
}
