package org.leadline.uncertainty;

import java.util.List;

/**
 * Result of a crossline comparison ({@link CrosslineCheck}): statistics of the differences
 * crossline depth minus main-scheme surface depth, overall and per depth band.
 *
 * @param overall   all compared soundings
 * @param bands     one entry per depth band of {@link CrosslineCheck#BAND_EDGES}, shallow first
 * @param unmatched crossline soundings not compared (no surface there, or no finite depth/position)
 */
public record CrosslineResult(Stats overall, List<Stats> bands, int unmatched) {
    public CrosslineResult {
        bands = List.copyOf(bands);
    }

    /**
     * Statistics of one set of differences (metres; positive = crossline deeper than the surface).
     *
     * @param label             band name, e.g. "5-10 m" or "all"
     * @param minDepth          shallow edge of the band, m (inclusive; -infinity for the first band and "all")
     * @param maxDepth          deep edge of the band, m (exclusive; +infinity for the last band and "all")
     * @param count             soundings compared
     * @param meanDifference    mean difference, m (NaN when count is 0)
     * @param standardDeviation sample standard deviation (n - 1), m (NaN when count &lt; 2)
     * @param shareWithinLimit  share of soundings with |difference| &lt;= the TVU limit, 0..1 (NaN when count is 0)
     */
    public record Stats(String label, double minDepth, double maxDepth, int count, double meanDifference,
                        double standardDeviation, double shareWithinLimit) {}
}
