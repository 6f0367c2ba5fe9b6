package org.leadline.survey;

import java.util.List;

/**
 * An attitude record from a motion sensor and gyro: time, heading (degrees clockwise from true
 * north), heave (m, positive up), roll (degrees, starboard down positive), pitch (degrees, bow up
 * positive), DESIGN.md section 3. A column the sensor did not give is all NaN and reported by
 * {@link #has}. Heading is interpolated along the shorter arc; the others linearly. A thin typed
 * wrapper over {@link TimeSeries} (columns "heading", "heave", "roll", "pitch").
 */
public final class AttitudeSeries {
    public static final int HEADING = 0, HEAVE = 1, ROLL = 2, PITCH = 3;
    private final TimeSeries series;
    private final boolean[] has;

    private AttitudeSeries(TimeSeries series, boolean[] has) {
        this.series = series;
        this.has = has;
    }

    /**
     * From arrays (copied); pass null for a quantity the sensor does not give.
     */
    public static AttitudeSeries of(double[] time, double[] heading, double[] heave, double[] roll, double[] pitch) {
        double[][] cols = {heading, heave, roll, pitch};
        boolean[] has = new boolean[4];
        for (int c = 0; c < 4; c++) {
            has[c] = cols[c] != null;
            if (cols[c] == null) {
                cols[c] = new double[time.length];
                java.util.Arrays.fill(cols[c], Double.NaN);
            }
        }
        return new AttitudeSeries(TimeSeries.of(time, List.of("heading", "heave", "roll", "pitch"), cols), has);
    }

    public AttitudeSeries withMaxGap(double seconds) { return new AttitudeSeries(series.withMaxGap(seconds), has); }

    public TimeSeries series() { return series; }
    public int size() { return series.size(); }
    /** Whether the record carries the quantity ({@link #HEADING}, {@link #HEAVE}, {@link #ROLL}, {@link #PITCH}). */
    public boolean has(int quantity) { return has[quantity]; }
    public boolean covers(double t) { return series.covers(t); }
    public TimeSeries.Refusal refusal(double t) { return series.refusal(t); }
    /** Heading at t, degrees in [0, 360), shorter-arc interpolation; NaN outside. */
    public double heading(double t) { return series.angleAt(HEADING, t); }
    /** Heave at t, m positive up; NaN outside. */
    public double heave(double t) { return series.at(HEAVE, t); }
    /** Roll at t, degrees; NaN outside. */
    public double roll(double t) { return series.at(ROLL, t); }
    /** Pitch at t, degrees; NaN outside. */
    public double pitch(double t) { return series.at(PITCH, t); }
}
