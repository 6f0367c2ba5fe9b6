package org.leadline.survey;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

/**
 * Raw pings, columnar: one primitive array per field, one row per ping (one beam of one ping for
 * swath systems). A field that a source did not give holds NaN (doubles) or -1 (ints).
 *
 * <p>Units (DESIGN.md section 3): time in seconds since 1970-01-01T00:00Z (UTC); lat/lon WGS84
 * degrees; twtt seconds; depth metres below the transducer at the sounder's set speed; angle,
 * heading, roll, pitch in <em>degrees</em> as read (converted to radians where used); heave metres,
 * positive up. {@code line} indexes {@link #lineNames()}.
 *
 * <p>Build with {@link Builder}; the finished table is effectively immutable (arrays are not
 * exposed for writing by convention: callers must not modify them).
 */
public final class PingTable {
    public final int size;
    public final double[] time;
    public final double[] lat;
    public final double[] lon;
    public final double[] twtt;
    public final double[] depth;
    public final double[] angle;
    public final double[] heading;
    public final double[] heave;
    public final double[] roll;
    public final double[] pitch;
    public final int[] line;
    public final int[] beam;
    public final int[] quality;
    private final List<String> lineNames;

    private PingTable(Builder b) {
        size = b.n;
        time = Arrays.copyOf(b.time, b.n);
        lat = Arrays.copyOf(b.lat, b.n);
        lon = Arrays.copyOf(b.lon, b.n);
        twtt = Arrays.copyOf(b.twtt, b.n);
        depth = Arrays.copyOf(b.depth, b.n);
        angle = Arrays.copyOf(b.angle, b.n);
        heading = Arrays.copyOf(b.heading, b.n);
        heave = Arrays.copyOf(b.heave, b.n);
        roll = Arrays.copyOf(b.roll, b.n);
        pitch = Arrays.copyOf(b.pitch, b.n);
        line = Arrays.copyOf(b.line, b.n);
        beam = Arrays.copyOf(b.beam, b.n);
        quality = Arrays.copyOf(b.quality, b.n);
        lineNames = List.copyOf(b.lineNames);
    }

    private PingTable(int size, double[][] d, int[][] i, List<String> lineNames) {
        this.size = size;
        time = d[0]; lat = d[1]; lon = d[2]; twtt = d[3]; depth = d[4]; angle = d[5];
        heading = d[6]; heave = d[7]; roll = d[8]; pitch = d[9];
        line = i[0]; beam = i[1]; quality = i[2];
        this.lineNames = List.copyOf(lineNames);
    }

    /**
     * A table over columns the caller has filled (bulk readers: no per-row copy). The arrays are
     * taken over, not copied; each must hold exactly {@code size} values; {@code line} indexes
     * {@code lineNames} (-1: none).
     */
    public static PingTable ofColumns(int size, double[] time, double[] lat, double[] lon, double[] twtt,
                                      double[] depth, double[] angle, double[] heading, double[] heave,
                                      double[] roll, double[] pitch, int[] line, int[] beam, int[] quality,
                                      List<String> lineNames) {
        double[][] d = {time, lat, lon, twtt, depth, angle, heading, heave, roll, pitch};
        int[][] i = {line, beam, quality};
        for (double[] a : d) if (a.length != size) throw new IllegalArgumentException("column length " + a.length + " != " + size);
        for (int[] a : i) if (a.length != size) throw new IllegalArgumentException("column length " + a.length + " != " + size);
        for (int v : line) {
            if (v < -1 || v >= lineNames.size()) throw new IllegalArgumentException("line index " + v + " outside the line names");
        }
        return new PingTable(size, d, i, lineNames);
    }

    /** Rows [from, to) as a new table (columns copied) with the same line names and ids. */
    public PingTable slice(int from, int to) {
        double[][] d = {time, lat, lon, twtt, depth, angle, heading, heave, roll, pitch};
        int[][] in = {line, beam, quality};
        double[][] dc = new double[d.length][];
        int[][] ic = new int[in.length][];
        for (int k = 0; k < d.length; k++) dc[k] = Arrays.copyOfRange(d[k], from, to);
        for (int k = 0; k < in.length; k++) ic[k] = Arrays.copyOfRange(in[k], from, to);
        return new PingTable(to - from, dc, ic, lineNames);
    }

    public List<String> lineNames() { return lineNames; }

    /** Name of the survey line of ping i ("" when none was given). */
    public String lineName(int i) { return line[i] < 0 ? "" : lineNames.get(line[i]); }

    /** Concatenates tables (e.g. several ping files), renumbering line indices. */
    public static PingTable concat(List<PingTable> tables) {
        Builder b = new Builder();
        for (PingTable t : tables) {
            for (int i = 0; i < t.size; i++) {
                b.add(t.time[i], t.lat[i], t.lon[i], t.twtt[i], t.depth[i], t.angle[i], t.heading[i],
                        t.heave[i], t.roll[i], t.pitch[i], t.line[i] < 0 ? null : t.lineNames.get(t.line[i]),
                        t.beam[i], t.quality[i]);
            }
        }
        return b.build();
    }

    /** Growable builder; {@code add} appends one ping. */
    public static final class Builder {
        private int n;
        private double[] time = new double[1024], lat = new double[1024], lon = new double[1024],
                twtt = new double[1024], depth = new double[1024], angle = new double[1024],
                heading = new double[1024], heave = new double[1024], roll = new double[1024],
                pitch = new double[1024];
        private int[] line = new int[1024], beam = new int[1024], quality = new int[1024];
        private final List<String> lineNames = new ArrayList<>();
        private final java.util.Map<String, Integer> lineIndex = new java.util.HashMap<>();

        public int size() { return n; }

        /** Index of a line name, adding it when new; null or empty gives -1. */
        public int lineId(String name) {
            if (name == null || name.isEmpty()) return -1;
            return lineIndex.computeIfAbsent(name, k -> { lineNames.add(k); return lineNames.size() - 1; });
        }

        public Builder add(double time, double lat, double lon, double twtt, double depth, double angle,
                           double heading, double heave, double roll, double pitch,
                           String lineName, int beam, int quality) {
            return addById(time, lat, lon, twtt, depth, angle, heading, heave, roll, pitch, lineId(lineName), beam, quality);
        }

        public Builder addById(double time, double lat, double lon, double twtt, double depth, double angle,
                               double heading, double heave, double roll, double pitch,
                               int lineId, int beam, int quality) {
            if (n == this.time.length) grow();
            this.time[n] = time; this.lat[n] = lat; this.lon[n] = lon; this.twtt[n] = twtt;
            this.depth[n] = depth; this.angle[n] = angle; this.heading[n] = heading; this.heave[n] = heave;
            this.roll[n] = roll; this.pitch[n] = pitch; this.line[n] = lineId; this.beam[n] = beam;
            this.quality[n] = quality;
            n++;
            return this;
        }

        private void grow() {
            int m = time.length * 2;
            time = Arrays.copyOf(time, m); lat = Arrays.copyOf(lat, m); lon = Arrays.copyOf(lon, m);
            twtt = Arrays.copyOf(twtt, m); depth = Arrays.copyOf(depth, m); angle = Arrays.copyOf(angle, m);
            heading = Arrays.copyOf(heading, m); heave = Arrays.copyOf(heave, m); roll = Arrays.copyOf(roll, m);
            pitch = Arrays.copyOf(pitch, m); line = Arrays.copyOf(line, m); beam = Arrays.copyOf(beam, m);
            quality = Arrays.copyOf(quality, m);
        }

        public PingTable build() { return new PingTable(this); }
    }
}
