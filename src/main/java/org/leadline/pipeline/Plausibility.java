package org.leadline.pipeline;

import org.leadline.watercolumn.DerivedProfile;
import org.leadline.watercolumn.SoundSpeedEquation;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Plausibility checks across inputs that each read correctly on their own (issue 8,
 * docs/reliability.md). They never stop a run: each finding is a warning in the run's warnings,
 * which the command prints and the report and lineage record.
 *
 * <ul>
 * <li>Heave beyond {@value #MAX_HEAVE_M} m: a survey launch does not ride 5 m swells while
 * sounding; usually centimetres given as metres, or a record of another vessel.</li>
 * <li>A cast whose temperature at the transducer differs by more than {@value #MAX_TEMPERATURE_GAP}
 * deg C from the temperature that the sounder's set speed implies at the cast's salinity and
 * depth: the set speed was not updated, or the cast belongs to another place or day.</li>
 * </ul>
 * Casts shallower than the soundings are extended by {@code CastQc} (deepest sound speed held
 * constant), which says so in its own warning.
 */
public final class Plausibility {
    private Plausibility() {}

    /** Largest plausible heave, m (common practice: survey launches stop work well below 5 m swell). */
    public static final double MAX_HEAVE_M = 5.0;
    /** Largest plausible gap between a cast and the set speed, as temperature, deg C (issue 8). */
    public static final double MAX_TEMPERATURE_GAP = 5.0;

    /** The heave warning for {@code count} of {@code total} pings beyond {@link #MAX_HEAVE_M}, the worst being {@code worst}; null for none. */
    static String heave(double worst, long count, long total) {
        if (count == 0) return null;
        return String.format(Locale.ROOT, "heave of %.2f m at %d of %d pings (more than %.0f m is implausible for a"
                + " survey launch: heave in centimetres, or another vessel's record?)", worst, count, total, MAX_HEAVE_M);
    }

    /**
     * Warning when the cast's temperature at the transducer depth is more than
     * {@link #MAX_TEMPERATURE_GAP} deg C away from the temperature at which the cast's equation
     * gives the sounder's set speed (same salinity, pressure and depth), or null. Casts measured
     * as sound speed (no equation) are not checked.
     */
    public static String castAgainstSetSpeed(Path file, DerivedProfile p, double draft, double setSpeed) {
        SoundSpeedEquation eq = p.equation();
        if (eq == null || p.size() == 0) return null;
        int i = 0;
        while (i < p.size() - 1 && p.depth()[i] < draft) i++;
        double t = p.temperature()[i], s = p.salinity()[i], pr = p.pressure()[i], z = p.depth()[i];
        if (!Double.isFinite(t) || !Double.isFinite(s)) return null;
        // the speed rises with temperature over -2..40 deg C at any salinity and shallow pressure: bisect
        double lo = -2, hi = 40;
        if (eq.speed(lo, s, pr, z) > setSpeed || eq.speed(hi, s, pr, z) < setSpeed) {
            return String.format(Locale.ROOT, "%s: the sounder's set speed %.1f m/s is outside the speeds of water at"
                    + " -2..40 deg C with the cast's salinity %.2f: check the set speed", name(file), setSpeed, s);
        }
        for (int k = 0; k < 60; k++) {
            double m = 0.5 * (lo + hi);
            if (eq.speed(m, s, pr, z) < setSpeed) lo = m; else hi = m;
        }
        double implied = 0.5 * (lo + hi);
        if (Math.abs(t - implied) <= MAX_TEMPERATURE_GAP) return null;
        return String.format(Locale.ROOT, "%s: the cast reads %.2f deg C at %.1f m, %.1f deg C %s than the %.2f deg C"
                        + " at which the sounder's set speed %.1f m/s holds (salinity %.2f): set speed not updated, or a cast"
                        + " from another place or day?", name(file), t, z, Math.abs(t - implied), t > implied ? "warmer" : "colder",
                implied, setSpeed, s);
    }

    private static String name(Path f) { return f == null || f.getFileName() == null ? "cast" : f.getFileName().toString(); }

    /** Every finding for a loaded survey, the heave warning ({@link DaySummary#heaveWarning}, or null) first. */
    static List<String> check(String heaveWarning, List<Path> castFiles, List<DerivedProfile> profiles, double draft,
                              double setSpeed) {
        List<String> out = new ArrayList<>();
        if (heaveWarning != null) out.add(heaveWarning);
        for (int k = 0; k < profiles.size(); k++) {
            String c = castAgainstSetSpeed(castFiles.get(k), profiles.get(k), draft, setSpeed);
            if (c != null) out.add(c);
        }
        return out;
    }
}
