package org.leadline.survey;

import java.util.Arrays;
import java.util.List;

/**
 * A sampled sensor record: strictly increasing times (seconds since the epoch, UTC) and one or
 * more named columns of doubles, interpolated to any time inside the record.
 *
 * <p>Interpolation is linear between the two samples that bracket the requested time
 * ({@link #at}), along the shorter arc for angles in degrees ({@link #angleAt}), and along the
 * great circle for positions ({@link #positionAt}, see {@link GreatCircle}). It never
 * extrapolates: a time before the first or after the last sample gives NaN, and so does a time
 * inside a gap longer than the optional maximum gap ({@link #withMaxGap}); {@link #refusal} says
 * which. Exact sample times return the sample itself, even next to a gap.
 *
 * <p>Immutable: the arrays are copied on the way in and never handed out.
 *
 * <pre>{@code
 * TimeSeries s = TimeSeries.of(new double[]{0, 1, 2}, List.of("heave"), new double[]{0.1, 0.3, -0.1});
 * double h = s.at(0, 0.5);   // 0.2
 * double x = s.at(0, 2.5);   // NaN: after the record
 * }</pre>
 */
public final class TimeSeries {
    /** Why an interpolation gave NaN. */
    public enum Refusal {
        /** The time lies inside the record and no gap is too long. */
        NONE("inside the record"),
        BEFORE_START("before the first sample"),
        AFTER_END("after the last sample"),
        GAP("inside a gap longer than the maximum gap"),
        NOT_A_TIME("time is NaN");

        public final String text;
        Refusal(String text) { this.text = text; }
    }

    private final double[] time;
    private final double[][] columns;
    private final List<String> names;
    private final double maxGap;

    private TimeSeries(double[] time, double[][] columns, List<String> names, double maxGap) {
        this.time = time;
        this.columns = columns;
        this.names = names;
        this.maxGap = maxGap;
    }

    /**
     * A series from arrays (copied).
     *
     * @param time    strictly increasing finite times, s since the epoch
     * @param names   one name per column
     * @param columns one array per column, each as long as {@code time}; NaN values are allowed
     *                (interpolation next to them gives NaN)
     * @throws IllegalArgumentException if the times are not finite and strictly increasing, or
     *                                  the lengths disagree
     */
    public static TimeSeries of(double[] time, List<String> names, double[]... columns) {
        if (names.size() != columns.length) {
            throw new IllegalArgumentException(names.size() + " names for " + columns.length + " columns");
        }
        for (int i = 0; i < time.length; i++) {
            if (!Double.isFinite(time[i])) throw new IllegalArgumentException("time " + i + " is not finite: " + time[i]);
            if (i > 0 && !(time[i] > time[i - 1])) {
                throw new IllegalArgumentException("times must increase strictly: sample " + i + " at " + time[i]
                        + " s follows " + time[i - 1] + " s");
            }
        }
        double[][] cols = new double[columns.length][];
        for (int c = 0; c < columns.length; c++) {
            if (columns[c].length != time.length) {
                throw new IllegalArgumentException("column " + names.get(c) + " has " + columns[c].length
                        + " values for " + time.length + " times");
            }
            cols[c] = columns[c].clone();
        }
        return new TimeSeries(time.clone(), cols, List.copyOf(names), Double.POSITIVE_INFINITY);
    }

    /**
     * The same record refusing to interpolate across a gap between samples longer than
     * {@code seconds} (a dropped sensor must not be bridged by a straight line).
     */
    public TimeSeries withMaxGap(double seconds) {
        if (!(seconds > 0)) throw new IllegalArgumentException("maximum gap must be > 0 s, found " + seconds);
        return new TimeSeries(time, columns, names, seconds);
    }

    public double maxGap() { return maxGap; }
    public int size() { return time.length; }
    public int columnCount() { return columns.length; }
    public List<String> columnNames() { return names; }
    public double time(int i) { return time[i]; }
    public double value(int column, int i) { return columns[column][i]; }
    public double first() { return time.length == 0 ? Double.NaN : time[0]; }
    public double last() { return time.length == 0 ? Double.NaN : time[time.length - 1]; }

    /** Index of a column by name (case-insensitive), -1 when absent. */
    public int column(String name) {
        for (int c = 0; c < names.size(); c++) if (names.get(c).equalsIgnoreCase(name)) return c;
        return -1;
    }

    /** A copy of the times. */
    public double[] times() { return time.clone(); }

    /** A copy of one column. */
    public double[] values(int column) { return columns[column].clone(); }

    /** True when {@code t} lies in [first, last] and not inside a gap longer than the maximum gap. */
    public boolean covers(double t) { return refusal(t) == Refusal.NONE; }

    /** Why interpolation at {@code t} is refused, or {@link Refusal#NONE}. */
    public Refusal refusal(double t) {
        if (Double.isNaN(t)) return Refusal.NOT_A_TIME;
        int n = time.length;
        if (n == 0 || t < time[0]) return Refusal.BEFORE_START;
        if (t > time[n - 1]) return Refusal.AFTER_END;
        int i = lower(t);
        if (time[i] == t) return Refusal.NONE;
        return time[i + 1] - time[i] > maxGap ? Refusal.GAP : Refusal.NONE;
    }

    /**
     * Index i of the last sample with time[i] <= t, for t in [first, last]; at t == last it is
     * the last index.
     */
    private int lower(double t) {
        int i = Arrays.binarySearch(time, t);
        return i >= 0 ? i : -i - 2;
    }

    /**
     * Linear interpolation of one column at time t.
     *
     * @return the value, or NaN outside the record or inside a too-long gap
     */
    public double at(int column, double t) {
        // refusal(t) inlined, so that the binary search runs once (same tests, same result)
        int n = time.length;
        if (Double.isNaN(t) || n == 0 || t < time[0] || t > time[n - 1]) return Double.NaN;
        double[] v = columns[column];
        int i = lower(t);
        if (time[i] == t) return v[i];
        if (time[i + 1] - time[i] > maxGap) return Double.NaN;
        double f = (t - time[i]) / (time[i + 1] - time[i]);
        return v[i] + f * (v[i + 1] - v[i]);
    }

    /**
     * Interpolation of an angle in degrees (heading, course) along the shorter arc, so that 359
     * and 1 interpolate through 0 and not through 180.
     *
     * @return degrees in [0, 360), or NaN when refused
     */
    public double angleAt(int column, double t) {
        if (refusal(t) != Refusal.NONE) return Double.NaN;
        double[] v = columns[column];
        int i = lower(t);
        if (time[i] == t) return wrap360(v[i]);
        double f = (t - time[i]) / (time[i + 1] - time[i]);
        return wrap360(v[i] + f * shortestTurn(v[i], v[i + 1]));
    }

    /**
     * Interpolated position along the great circle (n-vector) between the bracketing samples.
     *
     * @param latColumn column of latitudes, degrees
     * @param lonColumn column of longitudes, degrees
     * @param out       receives {lat, lon} in degrees, lon in [-180, 180); NaNs when refused
     * @return true when a position was written that is not NaN
     */
    public boolean positionAt(int latColumn, int lonColumn, double t, double[] out) {
        if (refusal(t) != Refusal.NONE) {
            out[0] = Double.NaN;
            out[1] = Double.NaN;
            return false;
        }
        double[] la = columns[latColumn], lo = columns[lonColumn];
        int i = lower(t);
        if (time[i] == t) {
            out[0] = la[i];
            out[1] = lo[i];
        } else {
            double f = (t - time[i]) / (time[i + 1] - time[i]);
            GreatCircle.interpolate(la[i], lo[i], la[i + 1], lo[i + 1], f, out);
        }
        return !Double.isNaN(out[0]);
    }

    /** The signed turn from a to b, degrees in [-180, 180): the shorter way round. */
    public static double shortestTurn(double a, double b) {
        double d = (b - a) % 360.0;
        if (d >= 180) d -= 360;
        if (d < -180) d += 360;
        return d;
    }

    /** An angle in degrees brought into [0, 360). */
    public static double wrap360(double a) {
        double r = a % 360.0;
        if (r < 0) r += 360.0;
        return r >= 360.0 ? 0.0 : r; // -1e-17 % 360 + 360 rounds to 360
    }
}
