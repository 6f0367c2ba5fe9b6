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
        size = n;
        lat = new double[n]; lon = new double[n]; heading = new double[n]; heave = new double[n];
        roll = new double[n]; pitch = new double[n]; speedOverGround = new double[n];
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
