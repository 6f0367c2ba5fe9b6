package org.leadline.uncertainty;

import java.util.Locale;

/**
 * The five safety-of-navigation survey orders of IHO S-44 edition 6.0.0 (2020), "IHO Standards for
 * Hydrographic Surveys", Table 1, with their maximum allowable uncertainties at 95 % confidence.
 *
 * <p>Total vertical uncertainty limit (S-44 ed. 6.0.0, section 2 / Table 1):
 * {@code TVU_max(d) = sqrt(a^2 + (b * d)^2)}, d the depth in metres. Total horizontal uncertainty
 * limit: {@code THU_max(d) = fixed + fraction * d}. Feature detection, feature search and
 * bathymetric coverage are carried as text for the report (the standard gives them in words).
 *
 * <p>Values (from memory) cross-checked against secondary reproductions of Table 1; the IHO's
 * authentic text could not be opened when this was written and prevails (docs/science/uncertainty.md).
 *
 * <p>Drying heights (negative reduced depths) are tested at d = 0: only the depth-independent part
 * applies (common practice; the standard does not give a separate formula for them).
 *
 * <pre>{@code
 * S44Order o = S44Order.parse("special");
 * double limit = o.tvuLimit(10.0);   // 0.2610 m
 * }</pre>
 */
public enum S44Order {
    EXCLUSIVE("Exclusive Order", "exclusive", 0.15, 0.0075, 1.0, 0.0,
            "cubic features > 0.5 m", "200 %", "200 %"),
    SPECIAL("Special Order", "special", 0.25, 0.0075, 2.0, 0.0,
            "cubic features > 1 m", "100 %", "100 %"),
    ORDER_1A("Order 1a", "1a", 0.5, 0.013, 5.0, 0.05,
            "cubic features > 2 m in depths down to 40 m; 10 % of depth beyond 40 m", "100 %", "<= 100 %"),
    ORDER_1B("Order 1b", "1b", 0.5, 0.013, 5.0, 0.05,
            "not applicable", "recommended but not required", "5 %"),
    ORDER_2("Order 2", "2", 1.0, 0.023, 20.0, 0.10,
            "not applicable", "recommended but not required", "5 %");

    private final String label;
    private final String key;
    /** TVU depth-independent part a, m (95 %). */
    public final double tvuA;
    /** TVU depth-dependent coefficient b (dimensionless; multiplies depth in m). */
    public final double tvuB;
    /** THU fixed part, m (95 %). */
    public final double thuFixed;
    /** THU fraction of depth (0.05 = 5 % of depth). */
    public final double thuFraction;
    /** Feature detection requirement, as worded in S-44 ed. 6.0.0 Table 1. */
    public final String featureDetection;
    /** Feature search requirement, S-44 ed. 6.0.0 Table 1. */
    public final String featureSearch;
    /** Bathymetric coverage requirement, S-44 ed. 6.0.0 Table 1. */
    public final String bathymetricCoverage;

    S44Order(String label, String key, double tvuA, double tvuB, double thuFixed, double thuFraction,
             String featureDetection, String featureSearch, String bathymetricCoverage) {
        this.label = label;
        this.key = key;
        this.tvuA = tvuA;
        this.tvuB = tvuB;
        this.thuFixed = thuFixed;
        this.thuFraction = thuFraction;
        this.featureDetection = featureDetection;
        this.featureSearch = featureSearch;
        this.bathymetricCoverage = bathymetricCoverage;
    }

    /** Name as printed in the standard and the report, e.g. "Order 1a". */
    public String label() { return label; }

    /** Command-line key: exclusive, special, 1a, 1b or 2. */
    public String key() { return key; }

    /** Maximum allowable TVU at 95 %, m, at depth d (m, positive down; drying heights use d = 0). */
    public double tvuLimit(double depth) {
        double d = depth > 0 ? depth : 0;
        double bd = tvuB * d;
        return Math.sqrt(tvuA * tvuA + bd * bd);
    }

    /** Maximum allowable THU at 95 %, m, at depth d (m, positive down; drying heights use d = 0). */
    public double thuLimit(double depth) {
        double d = depth > 0 ? depth : 0;
        return thuFixed + thuFraction * d;
    }

    /**
     * The order named by {@code exclusive|special|1a|1b|2} (case-insensitive; "order 1a", "order_1a"
     * and "special order" are accepted too).
     *
     * @throws IllegalArgumentException naming what was expected and what was found
     */
    public static S44Order parse(String text) {
        if (text != null) {
            String t = text.trim().toLowerCase(Locale.ROOT).replace('_', ' ').replace('-', ' ');
            if (t.startsWith("order ")) t = t.substring(6).trim();
            if (t.endsWith(" order")) t = t.substring(0, t.length() - 6).trim();
            for (S44Order o : values()) if (o.key.equals(t)) return o;
        }
        throw new IllegalArgumentException("IHO S-44 order: expected exclusive, special, 1a, 1b or 2, found '"
                + text + "'");
    }
}
