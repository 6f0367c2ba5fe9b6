package org.leadline.reduction;

import java.util.Arrays;
import org.leadline.survey.AttitudeSeries;
import org.leadline.survey.NavigationSeries;
import org.leadline.survey.PingTable;
import org.leadline.survey.SoundingTable.Reason;
import org.leadline.survey.TimeSeries;
import org.leadline.survey.Vessel;

/**
 * Time merge of navigation and attitude to pings (docs/science/time-merge.md).
 *
 * <p><b>Latency.</b> {@link org.leadline.survey.Vessel#latency()} is the time by which the
 * position and attitude stamps lag the sounder's stamps: an event that happens at sounder time t
 * carries the stamp t + latency in the sensor records. The sensor state at a ping stamped t is
 * therefore read from the series at t + latency. A positive latency means "look later in the
 * sensor record".
 *
 * <p><b>Sources.</b> A separate series, when given, replaces the ping file's own values of the
 * quantities it carries (an attitude file without heading leaves the ping headings in place).
 * Values taken from the ping file are used as they are, without the latency: they were merged by
 * the acquisition system when it logged the ping. No value is ever extrapolated: a ping whose
 * latency-shifted time lies outside a given series (or inside one of its refused gaps) is marked
 * {@link Reason#NO_NAVIGATION} or {@link Reason#NO_ATTITUDE} and its merged values from that
 * series are NaN.
 *
 * <p><b>Speed and course over ground</b> come from the navigation (the separate series, else the
 * ping file's own positions, one per distinct ping time, bridging gaps up to
 * {@link #OWN_TRACK_MAX_GAP}) by a central difference over a window W:
 * the positions at t - W/2 and t + W/2 (clipped to the record) are turned into WGS84
 * earth-centred coordinates, their difference is projected onto the local east and north at the
 * mean position, speed = horizontal length / elapsed time and course = atan2(east, north); a window
 * end beyond the record or inside a refused gap is moved to t (one-sided difference). The
 * chord differs from the arc by s^3/(24 R^2), under a micrometre for 100 m. Central differences
 * are the usual way to get speed from fixes (common practice); WGS84 to earth-centred coordinates
 * from NIMA TR8350.2 (3rd ed., 2000), eq. 4-14.
 */
public final class SensorMerge {
    /** Default window of the speed-over-ground central difference, s (common practice: a few fixes). */
    public static final double DEFAULT_SPEED_WINDOW = 5.0;

    /**
     * Longest gap between distinct ping times that the speed computation bridges on the ping
     * file's own positions, s: a longer one is a break between lines, not a straight run.
     */
    public static final double OWN_TRACK_MAX_GAP = 60.0;

    private static final double A = 6378137.0, F = 1 / 298.257223563, E2 = F * (2 - F);

    private SensorMerge() {}

    /** Merge with the vessel's latency and the default speed window. */
    public static MergedPings merge(PingTable pings, NavigationSeries navigation, AttitudeSeries attitude, Vessel vessel) {
        return merge(pings, navigation, attitude, vessel.latency(), DEFAULT_SPEED_WINDOW);
    }

    /** Merge with the default speed window. */
    public static MergedPings merge(PingTable pings, NavigationSeries navigation, AttitudeSeries attitude, double latency) {
        return merge(pings, navigation, attitude, latency, DEFAULT_SPEED_WINDOW);
    }

    /**
     * Merges sensor values to every ping.
     *
     * @param pings       the raw pings
     * @param navigation  separate navigation record, or null to use the ping file's positions
     * @param attitude    separate attitude record, or null to use the ping file's attitude
     * @param latency     sensor-stamp lag behind sounder stamps, s (Vessel.latency)
     * @param speedWindow window of the speed/course central difference, s (> 0)
     */
    public static MergedPings merge(PingTable pings, NavigationSeries navigation, AttitudeSeries attitude,
                                    double latency, double speedWindow) {
        return merge(pings, navigation, attitude, latency, speedWindow, null);
    }

    /**
     * Merges sensor values to a chunk of a ping file's rows (a day processed in tiles).
     *
     * @param ownTrack the whole file's own positions ({@link OwnTrack}), used for speed and course
     *                 when there is no separate navigation, so that a chunk gets the speeds the
     *                 whole file would; null: the chunk's own positions
     */
    public static MergedPings merge(PingTable pings, NavigationSeries navigation, AttitudeSeries attitude,
                                    double latency, double speedWindow, NavigationSeries ownTrack) {
        if (!Double.isFinite(latency)) throw new IllegalArgumentException("latency must be finite, found " + latency);
        if (!(speedWindow > 0)) throw new IllegalArgumentException("speed window must be > 0 s, found " + speedWindow);
        int n = pings.size;
        boolean[] fromSeries = new boolean[4];
        if (attitude != null) for (int q = 0; q < 4; q++) fromSeries[q] = attitude.has(q);
        // columns taken as they are from the ping file are shared, not copied (their values are the
        // same: within a ping a row is copied from the row before only when they are equal)
        MergedPings m = new MergedPings(n,
                navigation == null ? pings.lat : null, navigation == null ? pings.lon : null,
                fromSeries[AttitudeSeries.HEAVE] ? null : pings.heave,
                fromSeries[AttitudeSeries.ROLL] ? null : pings.roll,
                fromSeries[AttitudeSeries.PITCH] ? null : pings.pitch);
        NavigationSeries track = navigation != null ? navigation : ownTrack != null ? ownTrack : trackOf(pings);
        double navShift = navigation != null ? latency : 0;
        // rows in blocks that each start at a new ping time, on all cores: a row copies only the row
        // before it within its own ping, so every row gets the same values for any thread count
        int[] starts = pingBlocks(pings, 1 << 16);
        final NavigationSeries trk = track;
        final double shift = navShift;
        java.util.stream.IntStream.range(0, starts.length - 1).parallel().forEach(blk ->
                mergeRows(pings, navigation, attitude, latency, speedWindow, trk, shift, fromSeries, m,
                        starts[blk], starts[blk + 1]));
        return m;
    }

    /** Merges rows [from, to) of {@link #merge}; {@code from} starts a ping time. */
    private static void mergeRows(PingTable pings, NavigationSeries navigation, AttitudeSeries attitude, double latency,
                                  double speedWindow, NavigationSeries track, double navShift, boolean[] fromSeries,
                                  MergedPings m, int from, int to) {
        double[] p = new double[2];
        double[] sc = new double[2];
        boolean ownPos = m.lat != pings.lat, ownHeave = m.heave != pings.heave, ownRoll = m.roll != pings.roll,
                ownPitch = m.pitch != pings.pitch;
        for (int i = from; i < to; i++) {
            double t = pings.time[i];
            if (i > 0 && t == pings.time[i - 1] && sameOwnValues(pings, i, navigation == null, attitude)) {
                // beams of one ping: same sensor state
                int j = i - 1;
                if (ownPos) { m.lat[i] = m.lat[j]; m.lon[i] = m.lon[j]; }
                if (ownHeave) m.heave[i] = m.heave[j];
                if (ownRoll) m.roll[i] = m.roll[j];
                if (ownPitch) m.pitch[i] = m.pitch[j];
                m.heading[i] = m.heading[j];
                m.speedOverGround[i] = m.speedOverGround[j];
                m.courseOverGround[i] = m.courseOverGround[j];
                m.reason[i] = m.reason[j];
                continue;
            }
            byte reason = Reason.NONE.code;
            if (navigation != null) {
                navigation.position(t + latency, p);
                m.lat[i] = p[0];
                m.lon[i] = p[1];
            } else if (ownPos) {
                m.lat[i] = pings.lat[i];
                m.lon[i] = pings.lon[i];
            }
            if (Double.isNaN(m.lat[i]) || Double.isNaN(m.lon[i])) reason = Reason.NO_NAVIGATION.code;
            if (track != null && speedAndCourse(track, t + navShift, speedWindow, sc)) {
                m.speedOverGround[i] = sc[0];
                m.courseOverGround[i] = sc[1];
            } else {
                m.speedOverGround[i] = Double.NaN;
                m.courseOverGround[i] = Double.NaN;
            }
            double ta = t + latency;
            boolean attOk = attitude == null || attitude.covers(ta);
            m.heading[i] = fromSeries[AttitudeSeries.HEADING] ? attitude.heading(ta) : TimeSeries.wrap360(pings.heading[i]);
            if (ownHeave) m.heave[i] = fromSeries[AttitudeSeries.HEAVE] ? attitude.heave(ta) : pings.heave[i];
            if (ownRoll) m.roll[i] = fromSeries[AttitudeSeries.ROLL] ? attitude.roll(ta) : pings.roll[i];
            if (ownPitch) m.pitch[i] = fromSeries[AttitudeSeries.PITCH] ? attitude.pitch(ta) : pings.pitch[i];
            if (!attOk && reason == Reason.NONE.code) reason = Reason.NO_ATTITUDE.code;
            m.reason[i] = reason;
        }
    }

    /** Row indices cutting the table into blocks of about {@code size} rows, each starting at a new ping time. */
    static int[] pingBlocks(PingTable p, int size) {
        int[] out = new int[p.size / size + 2];
        int k = 0;
        out[k++] = 0;
        for (int i = size; i < p.size; i += size) {
            while (i < p.size && p.time[i] == p.time[i - 1]) i++;
            if (i < p.size && i > out[k - 1]) out[k++] = i;
        }
        if (out[k - 1] != p.size) out[k++] = p.size;
        return java.util.Arrays.copyOf(out, k);
    }

    private static boolean sameOwnValues(PingTable p, int i, boolean ownPositions, AttitudeSeries att) {
        int j = i - 1;
        if (ownPositions && !(same(p.lat[i], p.lat[j]) && same(p.lon[i], p.lon[j]))) return false;
        return (att != null && att.has(AttitudeSeries.HEADING) || same(p.heading[i], p.heading[j]))
                && (att != null && att.has(AttitudeSeries.HEAVE) || same(p.heave[i], p.heave[j]))
                && (att != null && att.has(AttitudeSeries.ROLL) || same(p.roll[i], p.roll[j]))
                && (att != null && att.has(AttitudeSeries.PITCH) || same(p.pitch[i], p.pitch[j]));
    }

    private static boolean same(double a, double b) { return a == b || (Double.isNaN(a) && Double.isNaN(b)); }

    /** The ping file's own positions as a track: first position of each distinct time; null if none. */
    static NavigationSeries trackOf(PingTable p) {
        // primitive indices: a swath day has tens of millions of rows (boxing them cost seconds and GBs)
        int[] idx = new int[p.size];
        int k = 0;
        for (int i = 0; i < p.size; i++) if (!Double.isNaN(p.lat[i]) && !Double.isNaN(p.lon[i])) idx[k++] = i;
        if (k < 2) return null;
        boolean sorted = true;
        for (int j = 1; j < k && sorted; j++) sorted = p.time[idx[j]] >= p.time[idx[j - 1]];
        if (!sorted) { // rare (ping files have non-decreasing times): stable sort, first stays first
            Integer[] boxed = new Integer[k];
            for (int j = 0; j < k; j++) boxed[j] = idx[j];
            Arrays.sort(boxed, (a, b) -> Double.compare(p.time[a], p.time[b]));
            for (int j = 0; j < k; j++) idx[j] = boxed[j];
        }
        double[] t = new double[k], la = new double[k], lo = new double[k];
        int n = 0;
        for (int j = 0; j < k; j++) {
            int i = idx[j];
            if (n > 0 && p.time[i] == t[n - 1]) continue;
            t[n] = p.time[i]; la[n] = p.lat[i]; lo[n] = p.lon[i];
            n++;
        }
        if (n < 2) return null;
        return NavigationSeries.of(Arrays.copyOf(t, n), Arrays.copyOf(la, n), Arrays.copyOf(lo, n)).withMaxGap(OWN_TRACK_MAX_GAP);
    }

    /**
     * The own-position track of a ping file read chunk by chunk: the same series as the whole
     * file's {@link #trackOf} (first position of each distinct time), held as one position per
     * ping, not per beam.
     */
    public static final class OwnTrack {
        private double[] t = new double[1024], la = new double[1024], lo = new double[1024];
        private int n;
        private boolean sorted = true;

        /** Adds the next rows of the file, in file order. */
        public void add(PingTable p) {
            for (int i = 0; i < p.size; i++) {
                if (Double.isNaN(p.lat[i]) || Double.isNaN(p.lon[i])) continue;
                double ti = p.time[i];
                if (n > 0 && ti == t[n - 1]) continue; // a later beam of the same ping: first position stays
                if (n > 0 && ti < t[n - 1]) sorted = false;
                if (n == t.length) {
                    t = Arrays.copyOf(t, 2 * n);
                    la = Arrays.copyOf(la, 2 * n);
                    lo = Arrays.copyOf(lo, 2 * n);
                }
                t[n] = ti;
                la[n] = p.lat[i];
                lo[n] = p.lon[i];
                n++;
            }
        }

        /** The track, or null with fewer than two distinct times (as {@link #trackOf}). */
        public NavigationSeries build() {
            PingTable.Builder b = new PingTable.Builder();
            if (!sorted) { // rare: the whole-file rule (stable sort by time, first stays first)
                for (int k = 0; k < n; k++) b.add(t[k], la[k], lo[k], 0, Double.NaN, Double.NaN, Double.NaN, Double.NaN,
                        Double.NaN, Double.NaN, null, -1, -1);
                return trackOf(b.build());
            }
            if (n < 2) return null;
            return NavigationSeries.of(Arrays.copyOf(t, n), Arrays.copyOf(la, n), Arrays.copyOf(lo, n)).withMaxGap(OWN_TRACK_MAX_GAP);
        }
    }

    /**
     * Speed (m/s) and course (deg in [0, 360)) over ground at time t by a central difference of
     * the track over a window (clipped to the record).
     *
     * @param out receives {speed, course}
     * @return false when the track does not give two distinct positions around t
     */
    public static boolean speedAndCourse(NavigationSeries track, double t, double window, double[] out) {
        TimeSeries s = track.series();
        if (!track.covers(t)) return false;
        double a = Math.max(s.first(), t - window / 2), b = Math.min(s.last(), t + window / 2);
        if (!(b > a)) return false;
        double[] p1 = new double[2], p2 = new double[2];
        // a window end inside a refused gap falls back to t itself: one-sided next to the gap
        if (!track.position(a, p1)) { a = t; track.position(a, p1); }
        if (!track.position(b, p2)) { b = t; track.position(b, p2); }
        if (!(b > a)) return false;
        double[] e1 = ecef(p1[0], p1[1]), e2 = ecef(p2[0], p2[1]);
        double dx = e2[0] - e1[0], dy = e2[1] - e1[1], dz = e2[2] - e1[2];
        // local east/north at the mean normal
        double[] mid = new double[2];
        org.leadline.survey.GreatCircle.interpolate(p1[0], p1[1], p2[0], p2[1], 0.5, mid);
        double phi = Math.toRadians(mid[0]), lam = Math.toRadians(mid[1]);
        double east = -Math.sin(lam) * dx + Math.cos(lam) * dy;
        double north = -Math.sin(phi) * Math.cos(lam) * dx - Math.sin(phi) * Math.sin(lam) * dy + Math.cos(phi) * dz;
        out[0] = Math.hypot(east, north) / (b - a);
        double c = Math.toDegrees(Math.atan2(east, north));
        out[1] = c < 0 ? c + 360 : (c >= 360 ? 0 : c);
        return true;
    }

    /** WGS84 geodetic (height 0) to earth-centred earth-fixed, m (NIMA TR8350.2 eq. 4-14). */
    static double[] ecef(double latDeg, double lonDeg) {
        double phi = Math.toRadians(latDeg), lam = Math.toRadians(lonDeg);
        double sp = Math.sin(phi), cp = Math.cos(phi);
        double nu = A / Math.sqrt(1 - E2 * sp * sp);
        return new double[] {nu * cp * Math.cos(lam), nu * cp * Math.sin(lam), nu * (1 - E2) * sp};
    }
}
