package org.leadline.io;

/** Fast fixed-decimal formatting of doubles for bulk text outputs; NaN is written as an empty field. */
public final class Fixed {
    private static final long[] POW10 = {1, 10, 100, 1000, 10_000, 100_000, 1_000_000, 10_000_000,
            100_000_000, 1_000_000_000, 10_000_000_000L};

    private Fixed() {}

    /** Appends v rounded half away from zero to {@code decimals} places (0..10). */
    public static StringBuilder append(StringBuilder sb, double v, int decimals) {
        if (Double.isNaN(v)) return sb;
        if (Double.isInfinite(v) || Math.abs(v) >= 9e8) {
            return sb.append(String.format(java.util.Locale.ROOT, "%." + decimals + "f", v));
        }
        long scale = POW10[decimals];
        long q = Math.round(Math.abs(v) * scale);
        if (v < 0 && q != 0) sb.append('-');
        sb.append(q / scale);
        if (decimals > 0) {
            sb.append('.');
            String frac = Long.toString(q % scale);
            for (int k = frac.length(); k < decimals; k++) sb.append('0');
            sb.append(frac);
        }
        return sb;
    }
}
