package org.leadline.survey;

import java.util.List;

/**
 * A navigation record: time, latitude, longitude (WGS84 degrees) of the position reference,
 * interpolated along the great circle ({@link GreatCircle}) and never extrapolated. A thin typed
 * wrapper over {@link TimeSeries} (columns "lat", "lon").
 */
public final class NavigationSeries {
    private final TimeSeries series;

    private NavigationSeries(TimeSeries series) { this.series = series; }

    /** From arrays (copied): strictly increasing times, s; lat in [-90, 90]; lon in [-180, 180]. */
    public static NavigationSeries of(double[] time, double[] lat, double[] lon) {
        for (int i = 0; i < lat.length; i++) {
            if (!(Math.abs(lat[i]) <= 90) || !(Math.abs(lon[i]) <= 180)) {
                throw new IllegalArgumentException("position " + i + " out of range: " + lat[i] + ", " + lon[i]);
            }
        }
        return new NavigationSeries(TimeSeries.of(time, List.of("lat", "lon"), lat, lon));
    }

    /** The same record refusing to bridge gaps longer than {@code seconds}. */
    public NavigationSeries withMaxGap(double seconds) { return new NavigationSeries(series.withMaxGap(seconds)); }

    public TimeSeries series() { return series; }
    public int size() { return series.size(); }
    public boolean covers(double t) { return series.covers(t); }
    public TimeSeries.Refusal refusal(double t) { return series.refusal(t); }

    /**
     * Position at time t.
     *
     * @param out receives {lat, lon} degrees, NaNs when refused
     * @return true when inside the record
     */
    public boolean position(double t, double[] out) { return series.positionAt(0, 1, t, out); }
}
