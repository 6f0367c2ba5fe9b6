package org.leadline.uncertainty;

import java.util.List;

/**
 * Survey-level uncertainty budget for the report, over the accepted soundings.
 *
 * @param count   accepted soundings with a depth
 * @param entries one per {@link TpuComponent}, in its order
 * @param meanTvu mean TVU (95 %), m
 * @param maxTvu  largest TVU (95 %), m
 * @param meanThu mean THU (95 %), m
 * @param maxThu  largest THU (95 %), m
 */
public record TpuSummary(int count, List<Entry> entries, double meanTvu, double maxTvu, double meanThu,
                         double maxThu) {

    public TpuSummary {
        entries = List.copyOf(entries);
    }

    /** The entry of one component. */
    public Entry entry(TpuComponent c) { return entries.get(c.ordinal()); }

    /**
     * One component's share of the budget.
     *
     * @param component     the error source
     * @param rmsVertical   root-mean-square of its one-sigma vertical contribution, m
     * @param rmsHorizontal root-mean-square of its one-sigma horizontal contribution (both axes), m
     */
    public record Entry(TpuComponent component, double rmsVertical, double rmsHorizontal) {
        public String label() { return component.label(); }
    }
}
