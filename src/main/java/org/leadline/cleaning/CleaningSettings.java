package org.leadline.cleaning;

import java.util.EnumSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;

/**
 * Settings of the automatic cleaning ({@link Cleaner}); the project YAML's {@code cleaning:} map.
 * Rules and sources of every filter: docs/science/cleaning.md.
 *
 * @param minDepth       depth gate, m: reject a sounding shallower than this below the water
 *                       surface (default 0.1 m; catches dropouts reported as zero depth)
 * @param maxDepth       depth gate, m: reject a sounding deeper than this (default +infinity)
 * @param minQuality     sounder quality gate: reject when the sounder gave a quality value
 *                       (&gt;= 0) lower than this (default 0: every given value passes)
 * @param spikeWindow    along-track spike filter: number of neighbours N in the moving window,
 *                       about N/2 before and N/2 after (default 10)
 * @param spikeK         Hampel multiplier k on the robust scale 1.4826 * MAD (default 3)
 * @param spikeKTvu      multiplier on the sounding's TVU for the lower bound of the spike
 *                       threshold (default 2)
 * @param spikeFloor     smallest spike threshold, m, used when TVU is unknown and MAD is zero
 *                       (quantised depths) (default 0.1 m)
 * @param spikeAngleBand width of the launch-angle bands, degrees, that form along-track series
 *                       for soundings with no beam number that are not stored ping by ping
 *                       (default 5 deg; see {@link Cleaner#seriesBeamKeys})
 * @param surfaceK       surface filter: reject when |depth - provisional surface| &gt; surfaceK * TVU
 *                       (default 2.5)
 * @param surfaceCell    cell size of the provisional surface, m (default 5 m)
 * @param surfaceMinCount fewest soundings for a cell median to enter the provisional surface
 *                       (default 3)
 * @param filters        the filters that run (default all of {@link Filter})
 */
public record CleaningSettings(double minDepth, double maxDepth, int minQuality,
                               int spikeWindow, double spikeK, double spikeKTvu, double spikeFloor,
                               double spikeAngleBand,
                               double surfaceK, double surfaceCell, int surfaceMinCount,
                               Set<Filter> filters) {

    /** The automatic filters, in the order {@link Cleaner} applies them. */
    public enum Filter {
        QUALITY("quality"), DEPTH_GATE("depth_gate"), SPIKE("spike"), SURFACE("surface");
        public final String key;
        Filter(String key) { this.key = key; }

        static Filter of(String key) {
            for (Filter f : values()) if (f.key.equals(key.toLowerCase(Locale.ROOT).trim())) return f;
            throw new IllegalArgumentException("cleaning: unknown filter '" + key + "'; allowed: "
                    + List.of(QUALITY.key, DEPTH_GATE.key, SPIKE.key, SURFACE.key));
        }
    }

    /** Keys accepted by {@link #fromMap}, in documentation order. */
    public static final List<String> KEYS = List.of("min_depth", "max_depth", "min_quality", "spike_window",
            "spike_k", "spike_k_tvu", "spike_floor", "spike_angle_band", "surface_k", "surface_cell",
            "surface_min_count", "filters");

    public CleaningSettings {
        filters = filters.isEmpty() ? Set.of() : Set.copyOf(EnumSet.copyOf(filters));
        if (Double.isNaN(minDepth) || Double.isNaN(maxDepth) || minDepth > maxDepth) {
            throw new IllegalArgumentException("cleaning: min_depth must not exceed max_depth, got "
                    + minDepth + " and " + maxDepth);
        }
        if (spikeWindow < 4) throw new IllegalArgumentException("cleaning: spike_window must be >= 4, got " + spikeWindow);
        positive("spike_k", spikeK);
        if (!(spikeKTvu >= 0)) throw new IllegalArgumentException("cleaning: spike_k_tvu must be >= 0, got " + spikeKTvu);
        if (!(spikeFloor >= 0)) throw new IllegalArgumentException("cleaning: spike_floor must be >= 0, got " + spikeFloor);
        positive("spike_angle_band", spikeAngleBand);
        positive("surface_k", surfaceK);
        positive("surface_cell", surfaceCell);
        if (surfaceMinCount < 1) throw new IllegalArgumentException("cleaning: surface_min_count must be >= 1, got " + surfaceMinCount);
    }

    private static void positive(String key, double v) {
        if (!(v > 0) || Double.isInfinite(v)) {
            throw new IllegalArgumentException("cleaning: " + key + " must be a positive finite number, got " + v);
        }
    }

    /** The documented defaults. */
    public static CleaningSettings defaults() {
        return new CleaningSettings(0.1, Double.POSITIVE_INFINITY, 0, 10, 3.0, 2.0, 0.1, 5.0,
                2.5, 5.0, 3, EnumSet.allOf(Filter.class));
    }

    public boolean enabled(Filter f) { return filters.contains(f); }

    /** A copy with another set of filters. */
    public CleaningSettings withFilters(Set<Filter> f) {
        return new CleaningSettings(minDepth, maxDepth, minQuality, spikeWindow, spikeK, spikeKTvu, spikeFloor,
                spikeAngleBand, surfaceK, surfaceCell, surfaceMinCount, f.isEmpty() ? Set.of() : EnumSet.copyOf(f));
    }

    /**
     * Settings from the project YAML's {@code cleaning:} map; missing keys keep their defaults.
     * Numbers may be YAML numbers or numeric strings ({@code .inf} / "inf" for no limit);
     * {@code filters} is a list of filter names (or one comma-separated string).
     *
     * @throws IllegalArgumentException for an unknown key (naming it and the allowed keys) or a
     *                                  value of the wrong kind
     */
    public static CleaningSettings fromMap(Map<String, Object> map) {
        CleaningSettings d = defaults();
        Map<String, Object> m = new LinkedHashMap<>();
        if (map != null) {
            for (Map.Entry<String, Object> e : map.entrySet()) {
                String key = String.valueOf(e.getKey()).toLowerCase(Locale.ROOT).trim();
                if (!KEYS.contains(key)) {
                    throw new IllegalArgumentException("cleaning: unknown key '" + e.getKey() + "'; allowed keys: "
                            + String.join(", ", KEYS));
                }
                m.put(key, e.getValue());
            }
        }
        Set<Filter> filters = EnumSet.allOf(Filter.class);
        if (m.containsKey("filters")) {
            filters = EnumSet.noneOf(Filter.class);
            Object v = m.get("filters");
            Iterable<?> items = v instanceof Iterable<?> it ? it
                    : v == null ? List.of() : List.of(String.valueOf(v).split(","));
            for (Object o : items) {
                String s = String.valueOf(o).trim();
                if (!s.isEmpty()) filters.add(Filter.of(s));
            }
        }
        return new CleaningSettings(
                num(m, "min_depth", d.minDepth), num(m, "max_depth", d.maxDepth),
                integer(m, "min_quality", d.minQuality), integer(m, "spike_window", d.spikeWindow),
                num(m, "spike_k", d.spikeK), num(m, "spike_k_tvu", d.spikeKTvu), num(m, "spike_floor", d.spikeFloor),
                num(m, "spike_angle_band", d.spikeAngleBand),
                num(m, "surface_k", d.surfaceK), num(m, "surface_cell", d.surfaceCell),
                integer(m, "surface_min_count", d.surfaceMinCount), filters);
    }

    private static double num(Map<String, Object> m, String key, double dflt) {
        if (!m.containsKey(key)) return dflt;
        Object v = m.get(key);
        if (v instanceof Number n) return n.doubleValue();
        if (v instanceof String s) {
            String t = s.trim().toLowerCase(Locale.ROOT);
            if (t.equals("inf") || t.equals(".inf") || t.equals("+inf") || t.equals("infinity")) return Double.POSITIVE_INFINITY;
            if (t.equals("-inf") || t.equals("-.inf") || t.equals("-infinity")) return Double.NEGATIVE_INFINITY;
            try {
                return Double.parseDouble(t);
            } catch (NumberFormatException e) {
                // fall through to the error below
            }
        }
        throw new IllegalArgumentException("cleaning: " + key + " must be a number, got '" + v + "'");
    }

    private static int integer(Map<String, Object> m, String key, int dflt) {
        if (!m.containsKey(key)) return dflt;
        double v = num(m, key, dflt);
        if (v != Math.rint(v) || Math.abs(v) > Integer.MAX_VALUE) {
            throw new IllegalArgumentException("cleaning: " + key + " must be a whole number, got '" + m.get(key) + "'");
        }
        return (int) v;
    }
}
