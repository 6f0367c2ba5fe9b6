package org.leadline.report;

/**
 * The depth colour ramp: shallow light to deep dark, perceptually uniform because it is
 * interpolated in CIELAB (CIE 1976 L*a*b*, D65 white) along a path whose lightness falls
 * linearly from L* 96 to L* 18, then converted to sRGB (IEC 61966-2-1). Not a rainbow: hue moves
 * only from pale sand-green through teal to deep blue, so lightness alone orders depths and the
 * ramp survives grey-scale printing and the common colour-vision deficiencies.
 */
public final class DepthColours {
    // anchors (L*, a*, b*) from shallow to deep
    private static final double[][] LAB = {{96, -4, 18}, {78, -22, 6}, {58, -24, -10}, {38, -6, -30}, {18, 8, -36}};

    private DepthColours() {}

    /** sRGB colour (0xRRGGBB) for a position 0 (shallow) .. 1 (deep); NaN gives light grey. */
    public static int rgb(double f) {
        if (Double.isNaN(f)) return 0xE6E6E6;
        f = Math.max(0, Math.min(1, f));
        double x = f * (LAB.length - 1);
        int i = Math.min((int) x, LAB.length - 2);
        double t = x - i;
        double L = LAB[i][0] + t * (LAB[i + 1][0] - LAB[i][0]);
        double a = LAB[i][1] + t * (LAB[i + 1][1] - LAB[i][1]);
        double b = LAB[i][2] + t * (LAB[i + 1][2] - LAB[i][2]);
        return labToRgb(L, a, b);
    }

    /** Colour for a depth between shallow and deep limits (m). */
    public static int rgb(double depth, double shallow, double deep) {
        return rgb(deep > shallow ? (depth - shallow) / (deep - shallow) : 0);
    }

    static int labToRgb(double L, double a, double b) {
        double fy = (L + 16) / 116, fx = fy + a / 500, fz = fy - b / 200;
        double X = 0.95047 * finv(fx), Y = finv(fy), Z = 1.08883 * finv(fz);
        double r = 3.2404542 * X - 1.5371385 * Y - 0.4985314 * Z;
        double g = -0.9692660 * X + 1.8760108 * Y + 0.0415560 * Z;
        double bl = 0.0556434 * X - 0.2040259 * Y + 1.0572252 * Z;
        return (gamma(r) << 16) | (gamma(g) << 8) | gamma(bl);
    }

    private static double finv(double t) {
        return t > 6.0 / 29 ? t * t * t : 3 * (6.0 / 29) * (6.0 / 29) * (t - 4.0 / 29);
    }

    private static int gamma(double c) {
        c = Math.max(0, Math.min(1, c));
        double v = c <= 0.0031308 ? 12.92 * c : 1.055 * Math.pow(c, 1 / 2.4) - 0.055;
        return (int) Math.round(v * 255);
    }
}
