package org.leadline.survey;

import java.util.List;

/**
 * Reduced soundings, columnar: one row per ping of the source {@link PingTable} (same order, same
 * index, so a sounding id is its row number). Depth is reduced to chart datum, positive down;
 * easting/northing are in the run's projected CRS; tvu/thu are 95 % uncertainties in metres (NaN
 * until estimated). {@code status} holds {@link Status#code}; {@code reason} holds a
 * {@link Reason#code} (0 = none).
 *
 * <p>Arrays are mutable on purpose: reduction, uncertainty and cleaning fill their own columns in
 * place, one stage after another, without copying tens of millions of rows.
 */
public final class SoundingTable {
    public final int size;
    public final double[] time;
    public final int[] line;
    public final int[] beam;
    public final double[] lat;
    public final double[] lon;
    public final double[] easting;
    public final double[] northing;
    public final double[] depth;
    /** Depth below the instantaneous water surface (before the water-level reduction), m. */
    public final double[] surfaceDepth;
    /** Across-track horizontal distance of the footprint from the transducer, m (signed, + starboard). */
    public final double[] acrossTrack;
    /** Earth-frame launch angle from the vertical, radians. */
    public final double[] launchAngle;
    /** Index of the cast (profile) used for ray bending, -1 for none. */
    public final int[] cast;
    /** Speed over ground at the ping, m/s. */
    public final double[] speedOverGround;
    public final double[] tvu;
    public final double[] thu;
    public final byte[] status;
    public final byte[] reason;
    private final List<String> lineNames;

    public SoundingTable(int size, List<String> lineNames) {
        this(size, lineNames, new double[size], new int[size], new int[size]);
    }

    /**
     * A table whose time, line and beam columns are the given arrays, shared rather than copied
     * (the ping table's own: a sounding has its ping's time, line and beam; on a swath day each
     * column is tens of megabytes). Nothing in Leadline writes into them after reading.
     */
    public SoundingTable(int size, List<String> lineNames, double[] time, int[] line, int[] beam) {
        if (time.length != size || line.length != size || beam.length != size) {
            throw new IllegalArgumentException("time, line and beam columns must have " + size + " rows");
        }
        this.size = size;
        this.lineNames = List.copyOf(lineNames);
        this.time = time;
        this.line = line;
        this.beam = beam;
        lat = nan(size);
        lon = nan(size);
        easting = nan(size);
        northing = nan(size);
        depth = nan(size);
        surfaceDepth = nan(size);
        acrossTrack = nan(size);
        launchAngle = nan(size);
        cast = new int[size];
        speedOverGround = nan(size);
        tvu = nan(size);
        thu = nan(size);
        status = new byte[size];
        reason = new byte[size];
    }

    private static double[] nan(int n) {
        double[] a = new double[n];
        // a swath day's columns are tens of megabytes each: filled in parallel blocks
        int block = 1 << 18;
        if (n < 2 * block) java.util.Arrays.fill(a, Double.NaN);
        else java.util.stream.IntStream.range(0, (n + block - 1) / block).parallel()
                .forEach(b -> java.util.Arrays.fill(a, b * block, Math.min(n, (b + 1) * block), Double.NaN));
        return a;
    }

    public List<String> lineNames() { return lineNames; }
    public String lineName(int i) { return line[i] < 0 ? "" : lineNames.get(line[i]); }
    public boolean accepted(int i) { return status[i] == Status.ACCEPTED.code; }

    /** Rejects sounding i with a reason unless it is already rejected (the first reason wins). */
    public void reject(int i, Reason why) {
        if (status[i] == Status.ACCEPTED.code) {
            status[i] = Status.REJECTED.code;
            reason[i] = why.code;
        }
    }

    public int countAccepted() {
        int k = 0;
        for (int i = 0; i < size; i++) if (status[i] == Status.ACCEPTED.code) k++;
        return k;
    }

    /** Sounding status as written in soundings.csv. */
    public enum Status {
        ACCEPTED(0, "accepted"), REJECTED(1, "rejected");
        public final byte code;
        public final String label;
        Status(int code, String label) { this.code = (byte) code; this.label = label; }
        public static Status of(byte code) { return code == 0 ? ACCEPTED : REJECTED; }
    }

    /**
     * Why a sounding was rejected; the label is the reason code written in soundings.csv and the
     * report. Codes are stable: append new reasons, never renumber.
     */
    public enum Reason {
        NONE(0, ""),
        NO_NAVIGATION(1, "outside-navigation"),
        NO_ATTITUDE(2, "outside-attitude"),
        NO_RETURN(3, "no-return"),
        DEPTH_GATE(4, "depth-gate"),
        SPIKE(5, "along-track-spike"),
        SURFACE(6, "surface-deviation"),
        QUALITY(7, "sounder-quality"),
        REVIEWER(8, "reviewer"),
        ANGLE_GATE(9, "angle-gate"),
        BEYOND_PROFILE(10, "beyond-profile"),
        NO_WATER_LEVEL(11, "outside-water-level");

        public final byte code;
        public final String label;
        Reason(int code, String label) { this.code = (byte) code; this.label = label; }

        public static Reason of(byte code) {
            for (Reason r : values()) if (r.code == code) return r;
            throw new IllegalArgumentException("unknown reason code " + code);
        }
    }
}
