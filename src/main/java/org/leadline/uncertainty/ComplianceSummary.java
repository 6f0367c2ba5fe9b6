package org.leadline.uncertainty;

import java.util.List;

/**
 * How well a survey meets an IHO S-44 order: the share of accepted soundings whose TVU and THU are
 * within the order's limits at their depth, overall and per depth band.
 *
 * @param order     the order tested
 * @param evaluated accepted soundings with a finite reduced depth (the denominator of every share)
 * @param pctTvu    percentage of them with TVU within the limit
 * @param pctThu    percentage with THU within the limit
 * @param pctBoth   percentage with both within
 * @param bands     per depth band, shallow to deep
 */
public record ComplianceSummary(S44Order order, int evaluated, double pctTvu, double pctThu, double pctBoth,
                                List<Band> bands) {

    public ComplianceSummary {
        bands = List.copyOf(bands);
    }

    /**
     * One depth band [fromDepth, toDepth) of reduced depth (m); the first band also holds drying
     * heights and the last is open-ended (toDepth = +infinity).
     *
     * @param count         accepted soundings in the band
     * @param pctTvu        percentage within the TVU limit
     * @param pctThu        percentage within the THU limit
     * @param pctBoth       percentage within both
     * @param meanTvu       mean TVU (95 %), m (NaN if any sounding in the band has none)
     * @param meanThu       mean THU (95 %), m
     * @param maxTvuRatio   largest TVU / TVU limit in the band (above 1 fails)
     */
    public record Band(double fromDepth, double toDepth, int count, double pctTvu, double pctThu, double pctBoth,
                       double meanTvu, double meanThu, double maxTvuRatio) {
        /** "0-5 m", "50+ m". */
        public String label() {
            String from = fmt(fromDepth);
            return Double.isInfinite(toDepth) ? from + "+ m" : from + "-" + fmt(toDepth) + " m";
        }

        private static String fmt(double d) {
            return d == Math.rint(d) ? Long.toString((long) d) : Double.toString(d);
        }
    }
}
