package org.leadline.watercolumn;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

/**
 * Empirical equations for the speed of sound in seawater from temperature, salinity and pressure
 * or depth. Each constant implements one published equation; inputs are always ITS-90
 * temperature (deg C), practical salinity, sea pressure (dbar) and depth (m), and each equation
 * uses the pressure or the depth as its paper does (the other argument is ignored).
 *
 * <ul>
 * <li>{@link #UNESCO}: Chen and Millero (1977, J. Acoust. Soc. Am. 62, 1129-1135) as given in
 * UNESCO Tech. Pap. Mar. Sci. 44 (Fofonoff and Millard 1983), with the ITS-90 coefficients of
 * Wong and Zhu (1995, J. Acoust. Soc. Am. 97, 1732-1736). Pressure. Valid T 0..40 deg C,
 * S 0..40, p 0..10000 dbar.</li>
 * <li>{@link #DEL_GROSSO}: Del Grosso (1974, J. Acoust. Soc. Am. 56, 1084-1091) in the ITS-90 form
 * of Wong and Zhu (1995). Pressure, converted to kg/cm^2 (1 kg/cm^2 = 9.80665 dbar). Valid
 * T 0..30 deg C, S 30..40, p 0..1000 kg/cm^2 (0..9806.65 dbar).</li>
 * <li>{@link #MACKENZIE}: Mackenzie (1981, J. Acoust. Soc. Am. 70, 807-812), nine terms. Depth.
 * IPTS-68 temperature (converted internally). Valid T -2..30 deg C, S 25..40, z 0..8000 m.</li>
 * <li>{@link #COPPENS}: Coppens (1981, J. Acoust. Soc. Am. 69, 862-863). Depth. IPTS-68
 * temperature (converted internally). Valid T 0..35 deg C, S 0..45, z 0..4000 m.</li>
 * </ul>
 *
 * Outside its range an equation still returns its polynomial's value; {@link #rangeWarning}
 * says so. Check values are in {@code SoundSpeedEquationTest}.
 */
public enum SoundSpeedEquation {
    UNESCO("unesco", "UNESCO (Chen and Millero 1977, ITS-90 coefficients of Wong and Zhu 1995)",
            0, 40, 0, 40, 10000, Double.NaN) {
        @Override
        public double speed(double t, double s, double p, double z) {
            return chenMilleroIts90(t, s, p);
        }
    },
    DEL_GROSSO("del-grosso", "Del Grosso 1974 (ITS-90 coefficients of Wong and Zhu 1995)",
            0, 30, 30, 40, 1000 * 9.80665, Double.NaN) {
        @Override
        public double speed(double t, double s, double p, double z) {
            return delGrossoIts90(t, s, p / KGCM2_DBAR);
        }
    },
    MACKENZIE("mackenzie", "Mackenzie 1981", -2, 30, 25, 40, Double.NaN, 8000) {
        @Override
        public double speed(double t, double s, double p, double z) {
            return mackenzie(Temperature.its90ToIts68(t), s, z);
        }
    },
    COPPENS("coppens", "Coppens 1981", 0, 35, 0, 45, Double.NaN, 4000) {
        @Override
        public double speed(double t, double s, double p, double z) {
            return coppens(Temperature.its90ToIts68(t), s, z);
        }
    };

    /** dbar per kg/cm^2 (standard gravity 9.80665 m/s^2). */
    static final double KGCM2_DBAR = 9.80665;

    private final String cliName;
    private final String title;
    private final double tMin, tMax, sMin, sMax, pMax, zMax;

    SoundSpeedEquation(String cliName, String title, double tMin, double tMax, double sMin, double sMax,
                       double pMax, double zMax) {
        this.cliName = cliName;
        this.title = title;
        this.tMin = tMin;
        this.tMax = tMax;
        this.sMin = sMin;
        this.sMax = sMax;
        this.pMax = pMax;
        this.zMax = zMax;
    }

    /**
     * Speed of sound, m/s.
     *
     * @param temperatureIts90 in-situ temperature, deg C, ITS-90
     * @param salinity         practical salinity (PSS-78)
     * @param pressureDbar     sea pressure, dbar (used by UNESCO and Del Grosso)
     * @param depthM           depth, m, positive down (used by Mackenzie and Coppens)
     */
    public abstract double speed(double temperatureIts90, double salinity, double pressureDbar, double depthM);

    /** The name used on the command line and in project files. */
    public String cliName() { return cliName; }

    /** The equation's name and source, for reports. */
    public String title() { return title; }

    /** True when the equation takes depth (Mackenzie, Coppens) rather than pressure. */
    public boolean usesDepth() { return Double.isNaN(pMax); }

    /** Validity range as text, e.g. "T 0..40 deg C, S 0..40, p 0..10000 dbar". */
    public String validityRange() {
        return String.format(Locale.ROOT, "T %s..%s deg C, S %s..%s, %s", num(tMin), num(tMax), num(sMin), num(sMax),
                usesDepth() ? "depth 0.." + num(zMax) + " m" : "p 0.." + num(pMax) + " dbar");
    }

    /**
     * A description of the inputs that lie outside the equation's stated validity range, or
     * empty when all are inside (NaN inputs are not judged). Never throws.
     */
    public Optional<String> rangeWarning(double t, double s, double p, double z) {
        List<String> out = new ArrayList<>();
        if (t < tMin || t > tMax) out.add("temperature " + num(t) + " deg C outside " + num(tMin) + ".." + num(tMax));
        if (s < sMin || s > sMax) out.add("salinity " + num(s) + " outside " + num(sMin) + ".." + num(sMax));
        if (usesDepth()) {
            if (z < 0 || z > zMax) out.add("depth " + num(z) + " m outside 0.." + num(zMax));
        } else if (p < 0 || p > pMax) {
            out.add("pressure " + num(p) + " dbar outside 0.." + num(pMax));
        }
        if (out.isEmpty()) return Optional.empty();
        return Optional.of(title + ": " + String.join(", ", out) + " (stated validity range)");
    }

    /** The equation named {@code unesco}, {@code del-grosso}, {@code mackenzie} or {@code coppens}. */
    public static SoundSpeedEquation parse(String name) {
        String n = name == null ? "" : name.trim().toLowerCase(Locale.ROOT).replace('_', '-');
        for (SoundSpeedEquation e : values()) {
            if (e.cliName.equals(n)) return e;
        }
        throw new IllegalArgumentException("unknown sound-speed equation '" + name
                + "': expected one of unesco, del-grosso, mackenzie, coppens");
    }

    private static String num(double v) {
        if (v == Math.rint(v) && Math.abs(v) < 1e9) return Long.toString((long) v);
        return String.format(Locale.ROOT, "%.3f", v);
    }

    /** Chen and Millero (1977) with Wong and Zhu (1995) ITS-90 coefficients; t ITS-90, p dbar. */
    static double chenMilleroIts90(double t, double s, double pDbar) {
        double p = pDbar / 10; // bar
        double cw = ((((3.1419e-9 * t - 1.47797e-6) * t + 3.3432e-4) * t - 5.81090e-2) * t + 5.03830) * t + 1402.388
                + ((((-6.1260e-10 * t + 1.3632e-7) * t - 8.1829e-6) * t + 6.8999e-4) * t + 0.153563) * p
                + ((((1.0415e-12 * t - 2.5353e-10) * t + 2.5986e-8) * t - 1.7111e-6) * t + 3.1260e-5) * p * p
                + ((-2.3654e-12 * t + 3.8513e-10) * t - 9.7729e-9) * p * p * p;
        double a = (((-3.21e-8 * t + 2.008e-6) * t + 7.166e-5) * t - 1.262e-2) * t + 1.389
                + ((((-2.0142e-10 * t + 1.0515e-8) * t - 6.4928e-8) * t - 1.2583e-5) * t + 9.4742e-5) * p
                + (((7.994e-12 * t - 1.6009e-10) * t + 9.1061e-9) * t - 3.9064e-7) * p * p
                + ((-3.391e-13 * t + 6.651e-12) * t + 1.100e-10) * p * p * p;
        double b = -1.922e-2 - 4.42e-5 * t + (7.3637e-5 + 1.7950e-7 * t) * p;
        double d = 1.727e-3 - 7.9836e-6 * p;
        double sr = Math.sqrt(Math.max(s, 0));
        return cw + a * s + b * s * sr + d * s * s;
    }

    /**
     * Chen and Millero (1977) with the original IPTS-68 coefficients as printed in UNESCO Tech. Pap.
     * Mar. Sci. 44 (function SVEL); t68 IPTS-68, p dbar. Kept to verify the paper's check value and
     * the ITS-90 refit against it.
     */
    static double chenMilleroIts68(double t, double s, double pDbar) {
        double p = pDbar / 10;
        double cw = ((((3.1464e-9 * t - 1.47800e-6) * t + 3.3420e-4) * t - 5.80852e-2) * t + 5.03711) * t + 1402.388
                + ((((-6.1185e-10 * t + 1.3621e-7) * t - 8.1788e-6) * t + 6.8982e-4) * t + 0.153563) * p
                + ((((1.0405e-12 * t - 2.5335e-10) * t + 2.5974e-8) * t - 1.7107e-6) * t + 3.1260e-5) * p * p
                + ((-2.3643e-12 * t + 3.8504e-10) * t - 9.7729e-9) * p * p * p;
        double a = (((-3.21e-8 * t + 2.006e-6) * t + 7.164e-5) * t - 1.262e-2) * t + 1.389
                + ((((-2.0122e-10 * t + 1.0507e-8) * t - 6.4885e-8) * t - 1.2580e-5) * t + 9.4742e-5) * p
                + (((7.988e-12 * t - 1.6002e-10) * t + 9.1041e-9) * t - 3.9064e-7) * p * p
                + ((-3.389e-13 * t + 6.649e-12) * t + 1.100e-10) * p * p * p;
        double b = -1.922e-2 - 4.42e-5 * t + (7.3637e-5 + 1.7945e-7 * t) * p;
        double d = 1.727e-3 - 7.9836e-6 * p;
        double sr = Math.sqrt(Math.max(s, 0));
        return cw + a * s + b * s * sr + d * s * s;
    }

    /** Del Grosso (1974), ITS-90 coefficients of Wong and Zhu (1995); p in kg/cm^2 (gauge). */
    static double delGrossoIts90(double t, double s, double p) {
        double dct = (0.5012285e1 + (-0.551184e-1 + 0.221649e-3 * t) * t) * t;
        double dcs = (0.1329530e1 + 0.1288598e-3 * s) * s;
        double dcp = (0.1560592 + (0.2449993e-4 - 0.8833959e-8 * p) * p) * p;
        double dcstp = -0.1275936e-1 * t * s
                + 0.6353509e-2 * t * p
                + 0.2656174e-7 * t * t * p * p
                - 0.1593895e-5 * t * p * p
                + 0.5222483e-9 * t * p * p * p
                - 0.4383615e-6 * t * t * t * p
                - 0.1616745e-8 * s * s * p * p
                + 0.9688441e-4 * s * t * t
                + 0.4857614e-5 * s * s * t * p
                - 0.3406824e-3 * s * t * p;
        return 1402.392 + dct + dcs + dcp + dcstp;
    }

    /** Mackenzie (1981) nine-term equation; t68 IPTS-68, z depth m. */
    static double mackenzie(double t, double s, double z) {
        return 1448.96 + 4.591 * t - 5.304e-2 * t * t + 2.374e-4 * t * t * t
                + 1.340 * (s - 35) + 1.630e-2 * z + 1.675e-7 * z * z
                - 1.025e-2 * t * (s - 35) - 7.139e-13 * t * z * z * z;
    }

    /** Coppens (1981); t68 IPTS-68, z depth m (the paper uses t = T/10 and D in km). */
    static double coppens(double t68, double s, double zM) {
        double t = t68 / 10;
        double d = zM / 1000;
        double c0 = 1449.05 + 45.7 * t - 5.21 * t * t + 0.23 * t * t * t
                + (1.333 - 0.126 * t + 0.009 * t * t) * (s - 35);
        return c0 + (16.23 + 0.253 * t) * d + (0.213 - 0.1 * t) * d * d
                + (0.016 + 0.0002 * (s - 35)) * (s - 35) * t * d;
    }
}
