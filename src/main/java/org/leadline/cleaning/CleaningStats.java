package org.leadline.cleaning;

import org.leadline.survey.SoundingTable.Reason;

import java.util.Collections;
import java.util.EnumMap;
import java.util.Map;

/**
 * What one run of {@link Cleaner#clean} did: how many soundings each filter rejected, and how
 * many were accepted before and after.
 *
 * @param soundings      rows in the table
 * @param acceptedBefore accepted soundings when cleaning started
 * @param acceptedAfter  accepted soundings when cleaning ended
 * @param rejected       soundings newly rejected, per reason (reasons with none are absent)
 * @param untestedSpike  soundings the along-track spike filter could not test (series too short)
 * @param untestedSurface soundings the surface filter could not test (no provisional surface or no TVU)
 */
public record CleaningStats(int soundings, int acceptedBefore, int acceptedAfter, Map<Reason, Integer> rejected,
                            int untestedSpike, int untestedSurface) {
    public CleaningStats {
        rejected = Collections.unmodifiableMap(new EnumMap<>(rejected.isEmpty() ? new EnumMap<>(Reason.class) : rejected));
    }

    /** Soundings rejected for this reason in this run (0 when none). */
    public int count(Reason r) { return rejected.getOrDefault(r, 0); }

    /** Soundings rejected in this run, all reasons. */
    public int totalRejected() {
        int t = 0;
        for (int v : rejected.values()) t += v;
        return t;
    }
}
