package org.leadline.surface;

/**
 * Forward WGS84 Universal Transverse Mercator by the Krüger series to sixth order in the third
 * flattening n, as given by Karney (2011), "Transverse Mercator with an accuracy of a few
 * nanometers", J. Geodesy 85(8), 475-485, doi:10.1007/s00190-011-0445-3, eqs. 7, 9, 10 and 35
 * (coefficients alpha_1..alpha_6, from memory; checked against Apache SIS and PROJ below).
 * It is used within 15 degrees of longitude of the central meridian (five zone widths), where it
 * agrees with SIS to better than a micrometre; farther out the caller uses SIS.
 *
 * <p>Why: this is the bulk path of the reduction (every sounding's footprint is projected), and a
 * closed series costs a third of SIS's general transform. SIS still defines the CRS, does every
 * inverse and every other projection, and {@link MapProjection} checks this series against SIS
 * at points across the zone before it trusts it ({@code MapProjectionTest} against PROJ too).
 */
final class KruegerUtm {
    private static final double A = 6378137.0, F = 1 / 298.257223563, K0 = 0.9996;
    private static final double N = F / (2 - F);
    private static final double E = Math.sqrt(F * (2 - F));
    /** Rectifying radius times k0, m (Karney eq. 14). */
    private static final double K0A;
    private static final double[] ALPHA = new double[7];

    static {
        double n = N, n2 = n * n, n3 = n2 * n, n4 = n3 * n, n5 = n4 * n, n6 = n5 * n;
        K0A = K0 * A / (1 + n) * (1 + n2 / 4 + n4 / 64 + n6 / 256);
        ALPHA[1] = n / 2 - 2 * n2 / 3 + 5 * n3 / 16 + 41 * n4 / 180 - 127 * n5 / 288 + 7891 * n6 / 37800;
        ALPHA[2] = 13 * n2 / 48 - 3 * n3 / 5 + 557 * n4 / 1440 + 281 * n5 / 630 - 1983433 * n6 / 1935360;
        ALPHA[3] = 61 * n3 / 240 - 103 * n4 / 140 + 15061 * n5 / 26880 + 167603 * n6 / 181440;
        ALPHA[4] = 49561 * n4 / 161280 - 179 * n5 / 168 + 6601661 * n6 / 7257600;
        ALPHA[5] = 34729 * n5 / 80640 - 3418889 * n6 / 1995840;
        ALPHA[6] = 212378941 * n6 / 319334400;
    }

    /** Longitude difference from the central meridian beyond which {@link #forward} declines, degrees. */
    static final double MAX_DLON = 15;

    private final double lon0Rad;
    private final double falseNorthing;

    /** @param zone 1..60; @param south southern hemisphere (false northing 10 000 km) */
    KruegerUtm(int zone, boolean south) {
        this.lon0Rad = Math.toRadians(6.0 * zone - 183.0);
        this.falseNorthing = south ? 10_000_000.0 : 0.0;
    }

    /**
     * Projects one point; returns false (and leaves out untouched) where the series is not used:
     * non-finite input, |latitude| over 89.9 degrees or more than {@link #MAX_DLON} from the
     * central meridian.
     *
     * @param out receives easting, northing (m)
     */
    boolean forward(double latDeg, double lonDeg, double[] out) {
        if (!(Math.abs(latDeg) <= 89.9)) return false;
        double lam = Math.toRadians(lonDeg) - lon0Rad;
        // IEEEremainder leaves |lam| <= pi as it is; it is a slow native call, so only when needed
        if (lam > Math.PI || lam < -Math.PI) lam = Math.IEEEremainder(lam, 2 * Math.PI);
        if (!(Math.abs(lam) <= Math.toRadians(MAX_DLON))) return false;
        double phi = Math.toRadians(latDeg);
        double s = Math.sin(phi);
        // conformal latitude (Karney eq. 7-9): tau' = sinh(atanh(sin phi) - e atanh(e sin phi))
        double u = atanh(s) - E * atanh(E * s);
        double eu = Math.exp(u);
        double t = (eu - 1 / eu) / 2;                            // sinh u
        double cl = Math.cos(lam);
        double xi1 = Math.atan2(t, cl);
        double eta1 = atanh(Math.sin(lam) / Math.sqrt(1 + t * t));
        // sum of alpha_j sin(2 j zeta'), zeta' = xi' + i eta', by Clenshaw's recurrence in complex
        // arithmetic (Karney eq. 11 and sect. 4): four transcendental calls instead of 24
        double s2 = Math.sin(2 * xi1), c2 = Math.cos(2 * xi1);
        double ex = Math.exp(2 * eta1), sh2 = (ex - 1 / ex) / 2, ch2 = (ex + 1 / ex) / 2;
        double ar = 2 * c2 * ch2, ai = -2 * s2 * sh2;            // 2 cos(2 zeta')
        double b1r = 0, b1i = 0, b2r = 0, b2i = 0;               // b_{k+1}, b_{k+2}
        for (int k = 6; k >= 1; k--) {
            double br = ALPHA[k] + ar * b1r - ai * b1i - b2r;
            double bi = ar * b1i + ai * b1r - b2i;
            b2r = b1r; b2i = b1i;
            b1r = br; b1i = bi;
        }
        double sr = s2 * ch2, si = c2 * sh2;                     // sin(2 zeta')
        double xi = xi1 + (b1r * sr - b1i * si);
        double eta = eta1 + (b1r * si + b1i * sr);
        out[0] = 500_000.0 + K0A * eta;
        out[1] = falseNorthing + K0A * xi;
        return true;
    }

    /**
     * atanh by the JIT's Math.log intrinsic: log1p, sinh and IEEEremainder are slow native calls in
     * Java 17 (fdlibm). The argument of log is rounded near 1 for small x, an absolute error of
     * about 1e-16 in the result, 1e-9 m on the ground; the start-up check against SIS still holds.
     */
    private static double atanh(double x) { return 0.5 * Math.log((1 + x) / (1 - x)); }
}
