package org.leadline.uncertainty;

/**
 * The one-sigma contribution of every {@link TpuComponent} to one sounding, m, and the combined
 * 95 % values. Arrays are indexed by {@link TpuComponent#ordinal()}.
 *
 * @param vertical    one-sigma vertical contribution of each component, m
 * @param alongTrack  one-sigma horizontal contribution along the vessel's heading, m
 * @param acrossTrack one-sigma horizontal contribution across the vessel's heading, m
 * @param tvu         total vertical uncertainty at 95 %: 1.96 * root-sum-square of {@code vertical}, m
 * @param thu         total horizontal uncertainty at 95 %: radius of the 95 % circle, m
 */
public record TpuBreakdown(double[] vertical, double[] alongTrack, double[] acrossTrack, double tvu, double thu) {

    public TpuBreakdown {
        vertical = vertical.clone();
        alongTrack = alongTrack.clone();
        acrossTrack = acrossTrack.clone();
    }

    /** One-sigma vertical part of a component, m. */
    public double vertical(TpuComponent c) { return vertical[c.ordinal()]; }

    /** One-sigma along-track part of a component, m. */
    public double alongTrack(TpuComponent c) { return alongTrack[c.ordinal()]; }

    /** One-sigma across-track part of a component, m. */
    public double acrossTrack(TpuComponent c) { return acrossTrack[c.ordinal()]; }

    /** Horizontal one-sigma of a component as the root-sum-square of its two axes (drms), m. */
    public double horizontal(TpuComponent c) { return Math.hypot(alongTrack(c), acrossTrack(c)); }

    /** Combined one-sigma vertical uncertainty (root-sum-square), m. */
    public double sigmaVertical() { return rss(vertical); }

    /** Combined one-sigma along-track uncertainty, m. */
    public double sigmaAlongTrack() { return rss(alongTrack); }

    /** Combined one-sigma across-track uncertainty, m. */
    public double sigmaAcrossTrack() { return rss(acrossTrack); }

    private static double rss(double[] a) {
        double s = 0;
        for (double v : a) s += v * v;
        return Math.sqrt(s);
    }
}
