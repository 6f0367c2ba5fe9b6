package org.leadline.reduction;

import org.leadline.survey.SoundingTable.Reason;

/**
 * Sensor values merged to each ping, columnar, one row per row of the source
 * {@link org.leadline.survey.PingTable} (same order). Produced by {@link SensorMerge}.
 *
 * <p>Units as in the ping table: lat/lon WGS84 degrees; heading, roll, pitch and course over
 * ground in degrees (heading and course in [0, 360)); heave m positive up; speed over ground m/s.
 * A value nobody supplied is NaN. {@code reason} holds a {@link Reason#code}: 0 when the ping lies
 * inside every record it needs, {@link Reason#NO_NAVIGATION} or {@link Reason#NO_ATTITUDE}
 * otherwise (navigation is checked first).
 */
public final class MergedPings {
    public final int size;
    public final double[] lat, lon, heading, heave, roll, pitch, speedOverGround, courseOverGround;
    public final byte[] reason;

    MergedPings(int n) {
        this(n, null, null, null, null, null);
    }

    /**
     * Columns given (not null) are the ping table's own, shared rather than copied: on a swath day
     * each is tens of megabytes. The merge never writes into a shared column.
     */
    MergedPings(int n, double[] lat, double[] lon, double[] heave, double[] roll, double[] pitch) {
        size = n;
        this.lat = lat != null ? lat : new double[n];
        this.lon = lon != null ? lon : new double[n];
        this.heave = heave != null ? heave : new double[n];
        this.roll = roll != null ? roll : new double[n];
        this.pitch = pitch != null ? pitch : new double[n];
        heading = new double[n];
        speedOverGround = new double[n];
        courseOverGround = new double[n];
        reason = new byte[n];
    }

    public Reason reason(int i) { return Reason.of(reason[i]); }

    /** True when ping i lies inside the navigation and attitude records it needs. */
    public boolean ok(int i) { return reason[i] == Reason.NONE.code; }

    /** Number of pings marked with a reason. */
    public int count(Reason r) {
        int k = 0;
        for (byte b : reason) if (b == r.code) k++;
        return k;
    }
}
