package org.leadline.survey;

import java.util.List;

/**
 * Water levels observed at a gauge: time and height of the water surface above chart datum, m
 * (positive up), linearly interpolated and never extrapolated. A thin typed wrapper over
 * {@link TimeSeries} (column "level").
 */
public final class WaterLevelSeries {
    private final TimeSeries series;

    private WaterLevelSeries(TimeSeries series) { this.series = series; }

    public static WaterLevelSeries of(double[] time, double[] level) {
        return new WaterLevelSeries(TimeSeries.of(time, List.of("level"), level));
    }

    /** The same record refusing to bridge gaps longer than {@code seconds}. */
    public WaterLevelSeries withMaxGap(double seconds) { return new WaterLevelSeries(series.withMaxGap(seconds)); }

    public TimeSeries series() { return series; }
    public int size() { return series.size(); }
    public boolean covers(double t) { return series.covers(t); }
    public TimeSeries.Refusal refusal(double t) { return series.refusal(t); }
    /** Water level above chart datum at t, m; NaN outside the record. */
    public double level(double t) { return series.at(0, t); }
}
