package org.leadline.io;

import org.leadline.survey.PingTable;

import java.util.Arrays;

/**
 * The usable content of one NMEA 0183 log, columnar, as read by {@link NmeaReader}: depth epochs
 * (DBT, DPT), position fixes (GGA, RMC, GLL), true headings (HDT) and speeds over ground (RMC,
 * VTG), each in file order, with full UTC times in seconds since 1970-01-01T00:00Z.
 *
 * <p>Units (DESIGN.md section 3): metres, m/s, degrees (lat/lon WGS84 as the receiver gives them,
 * heading and course clockwise from true north). Arrays are shared, not copied: callers must not
 * modify them.
 *
 * <p>Time stamps of depths, headings and VTG speeds: those sentences carry no time in NMEA 0183,
 * so each is stamped with the time of the latest time-bearing sentence (GGA, RMC, GLL, ZDA) before
 * it in the log. That is the usual limitation of NMEA logs: the sounder's own latency and the
 * position of a depth between two fixes are not in the data; several depths can share one stamp.
 * The vessel file's latency setting corrects a constant delay later in the chain.
 */
public final class NmeaLog {

    /** The sentence types the reader uses (NMEA 0183 sentence formatters). */
    public enum Sentence { DBT, DPT, GGA, RMC, GLL, ZDA, HDT, VTG }

    /** Where the log came from (file name), for messages. */
    public final String source;

    // Depth epochs.
    public final int depthCount;
    public final double[] depthTime;
    /** Depth below the transducer, m (DBT metres field, or feet/fathoms converted; DPT field 1). */
    public final double[] depthBelowTransducer;
    /** DPT offset, m: positive = transducer to waterline, negative = transducer to keel; NaN for DBT. */
    public final double[] dptOffset;
    /** {@link Sentence#ordinal()} of the sentence each depth came from. */
    public final byte[] depthSource;

    // Position fixes (only fixes the receiver flagged valid).
    public final int fixCount;
    public final double[] fixTime;
    public final double[] fixLat;
    public final double[] fixLon;
    /** GGA fix quality (1 GPS, 2 DGPS, 4 RTK fixed, 5 RTK float, ...); -1 for RMC and GLL. */
    public final int[] fixQuality;
    /** GGA satellites in use; -1 when not given. */
    public final int[] fixSatellites;
    /** GGA horizontal dilution of precision; NaN when not given. */
    public final double[] fixHdop;
    /** GGA antenna altitude above mean sea level (geoid), m; NaN when not given. */
    public final double[] fixAltitude;
    public final byte[] fixSource;

    // True headings (HDT).
    public final int headingCount;
    public final double[] headingTime;
    public final double[] heading;

    // Speed and course over ground (RMC, VTG).
    public final int speedCount;
    public final double[] speedTime;
    /** Speed over ground, m/s (knots x 1852/3600). */
    public final double[] sog;
    /** Course over ground, degrees true; NaN when not given. */
    public final double[] cog;
    public final byte[] speedSource;

    /** Sentences read and used, per {@link Sentence} ordinal. */
    private final long[] sentenceCounts;
    private final NmeaProblems problems;

    // Navigation series: valid fixes sorted by time, one per time stamp.
    private final double[] navTime, navLat, navLon;
    // Headings sorted by time for look-up.
    private final double[] hdgT, hdgV;

    NmeaLog(String source,
            int depthCount, double[] depthTime, double[] depthBelowTransducer, double[] dptOffset, byte[] depthSource,
            int fixCount, double[] fixTime, double[] fixLat, double[] fixLon, int[] fixQuality, int[] fixSatellites,
            double[] fixHdop, double[] fixAltitude, byte[] fixSource,
            int headingCount, double[] headingTime, double[] heading,
            int speedCount, double[] speedTime, double[] sog, double[] cog, byte[] speedSource,
            long[] sentenceCounts, NmeaProblems problems) {
        this.source = source;
        this.depthCount = depthCount;
        this.depthTime = Arrays.copyOf(depthTime, depthCount);
        this.depthBelowTransducer = Arrays.copyOf(depthBelowTransducer, depthCount);
        this.dptOffset = Arrays.copyOf(dptOffset, depthCount);
        this.depthSource = Arrays.copyOf(depthSource, depthCount);
        this.fixCount = fixCount;
        this.fixTime = Arrays.copyOf(fixTime, fixCount);
        this.fixLat = Arrays.copyOf(fixLat, fixCount);
        this.fixLon = Arrays.copyOf(fixLon, fixCount);
        this.fixQuality = Arrays.copyOf(fixQuality, fixCount);
        this.fixSatellites = Arrays.copyOf(fixSatellites, fixCount);
        this.fixHdop = Arrays.copyOf(fixHdop, fixCount);
        this.fixAltitude = Arrays.copyOf(fixAltitude, fixCount);
        this.fixSource = Arrays.copyOf(fixSource, fixCount);
        this.headingCount = headingCount;
        this.headingTime = Arrays.copyOf(headingTime, headingCount);
        this.heading = Arrays.copyOf(heading, headingCount);
        this.speedCount = speedCount;
        this.speedTime = Arrays.copyOf(speedTime, speedCount);
        this.sog = Arrays.copyOf(sog, speedCount);
        this.cog = Arrays.copyOf(cog, speedCount);
        this.speedSource = Arrays.copyOf(speedSource, speedCount);
        this.sentenceCounts = sentenceCounts.clone();
        this.problems = problems;

        // Navigation: fixes in time order, one per time stamp, preferring GGA over RMC over GLL
        // (enum order) because GGA carries the quality indicator and HDOP.
        int[] order = timeOrder(this.fixTime, fixCount);
        double[] t = new double[fixCount], la = new double[fixCount], lo = new double[fixCount];
        int m = 0, bestSrc = Integer.MAX_VALUE;
        for (int k = 0; k < fixCount; k++) {
            int i = order[k];
            if (m > 0 && t[m - 1] == this.fixTime[i]) {
                if (this.fixSource[i] < bestSrc) { // same stamp, preferred sentence: replace
                    la[m - 1] = this.fixLat[i]; lo[m - 1] = this.fixLon[i]; bestSrc = this.fixSource[i];
                }
                continue;
            }
            t[m] = this.fixTime[i]; la[m] = this.fixLat[i]; lo[m] = this.fixLon[i]; m++;
            bestSrc = this.fixSource[i];
        }
        navTime = Arrays.copyOf(t, m); navLat = Arrays.copyOf(la, m); navLon = Arrays.copyOf(lo, m);

        int[] ho = timeOrder(this.headingTime, headingCount);
        hdgT = new double[headingCount]; hdgV = new double[headingCount];
        for (int k = 0; k < headingCount; k++) { hdgT[k] = this.headingTime[ho[k]]; hdgV[k] = this.heading[ho[k]]; }
    }

    /** Indices 0..n-1 in non-decreasing time order (stable); a log is nearly always in order already. */
    private static int[] timeOrder(double[] time, int n) {
        int[] order = new int[n];
        boolean sorted = true;
        for (int i = 0; i < n; i++) {
            order[i] = i;
            if (i > 0 && time[i] < time[i - 1]) sorted = false;
        }
        if (sorted) return order;
        Integer[] boxed = new Integer[n];
        for (int i = 0; i < n; i++) boxed[i] = i;
        Arrays.sort(boxed, (a, b) -> Double.compare(time[a], time[b]));
        for (int i = 0; i < n; i++) order[i] = boxed[i];
        return order;
    }

    public NmeaProblems problems() { return problems; }

    /** One paragraph for a log or report: sentences used per type, rows per column, problems. */
    public String summary() {
        StringBuilder sb = new StringBuilder(source == null ? "NMEA log" : source).append(": sentences used");
        for (Sentence s : Sentence.values()) {
            if (sentenceCounts[s.ordinal()] > 0) sb.append(' ').append(s).append(' ').append(sentenceCounts[s.ordinal()]);
        }
        sb.append("; ").append(depthCount).append(" depths, ").append(fixCount).append(" fixes, ")
                .append(headingCount).append(" headings, ").append(speedCount).append(" speeds; ");
        long p = problems.total();
        sb.append(p == 0 ? "no problems" : p + " problem lines:\n" + problems.summary());
        return sb.toString();
    }

    @Override
    public String toString() { return summary(); }

    /** Number of sentences of this type that were read and used. */
    public long sentenceCount(Sentence s) { return sentenceCounts[s.ordinal()]; }

    public Sentence depthSource(int i) { return Sentence.values()[depthSource[i]]; }

    public Sentence fixSource(int i) { return Sentence.values()[fixSource[i]]; }

    public Sentence speedSource(int i) { return Sentence.values()[speedSource[i]]; }

    /** Times of the navigation series: valid fixes sorted by time, one per stamp (GGA preferred). */
    public double[] navigationTimes() { return navTime.clone(); }

    public double[] navigationLat() { return navLat.clone(); }

    public double[] navigationLon() { return navLon.clone(); }

    /** Short names as the issue asked for them: same as {@link #navigationLat()}. */
    public double[] lat() { return navigationLat(); }

    /** Same as {@link #navigationLon()}. */
    public double[] lon() { return navigationLon(); }

    /**
     * The depth source {@link #toPingTable} uses: DPT when the log has any DPT sentence (a sounder
     * that sends both DBT and DPT reports each ping twice), otherwise DBT.
     */
    public Sentence pingDepthSource() {
        return sentenceCounts[Sentence.DPT.ordinal()] > 0 ? Sentence.DPT : Sentence.DBT;
    }

    /**
     * The depths as raw pings of one survey line: {@code depth} is the depth below the transducer
     * at the sounder's set speed (vessel file {@code sounder.set_speed}); lat/lon interpolated
     * linearly in time between the bracketing fixes ({@link #positionAt}), NaN outside the fix
     * record; heading from HDT ({@link #headingAt}) or NaN. Only depths of
     * {@link #pingDepthSource()} are taken.
     */
    public PingTable toPingTable(String lineName) {
        PingTable.Builder b = new PingTable.Builder();
        int lineId = b.lineId(lineName);
        byte src = (byte) pingDepthSource().ordinal();
        double[] pos = new double[2];
        for (int i = 0; i < depthCount; i++) {
            if (depthSource[i] != src) continue;
            double t = depthTime[i];
            positionAt(t, pos);
            b.addById(t, pos[0], pos[1], Double.NaN, depthBelowTransducer[i], Double.NaN, headingAt(t),
                    Double.NaN, Double.NaN, Double.NaN, lineId, -1, -1);
        }
        return b.build();
    }

    /**
     * Position at time t by linear interpolation in time between the two bracketing navigation
     * fixes (longitude through the shorter way round, so a line across 180 deg stays continuous);
     * NaN outside [first fix, last fix]. Writes {lat, lon} into {@code out} and returns it.
     */
    public double[] positionAt(double t, double[] out) {
        out[0] = Double.NaN; out[1] = Double.NaN;
        int n = navTime.length;
        if (n == 0 || !(t >= navTime[0]) || !(t <= navTime[n - 1])) return out;
        int j = Arrays.binarySearch(navTime, t);
        if (j >= 0) { out[0] = navLat[j]; out[1] = navLon[j]; return out; }
        int hi = -j - 1, lo = hi - 1;
        double f = (t - navTime[lo]) / (navTime[hi] - navTime[lo]);
        out[0] = navLat[lo] + f * (navLat[hi] - navLat[lo]);
        double dLon = wrap180(navLon[hi] - navLon[lo]);
        out[1] = wrap180(navLon[lo] + f * dLon);
        return out;
    }

    /** Seconds within which an HDT sample counts as "at" a time. */
    public static final double HEADING_WINDOW_S = 1.0;

    /**
     * True heading at time t, degrees in [0, 360): when HDT samples within
     * {@link #HEADING_WINDOW_S} lie on both sides of t, linear interpolation along the shorter arc
     * (so 359 and 1 give 0, not 180); otherwise the nearest sample within the window; otherwise NaN.
     */
    public double headingAt(double t) {
        int n = hdgT.length;
        if (n == 0 || Double.isNaN(t)) return Double.NaN;
        int j = Arrays.binarySearch(hdgT, t);
        if (j >= 0) return hdgV[j];
        int hi = -j - 1, lo = hi - 1;
        boolean loOk = lo >= 0 && t - hdgT[lo] <= HEADING_WINDOW_S;
        boolean hiOk = hi < n && hdgT[hi] - t <= HEADING_WINDOW_S;
        if (loOk && hiOk) {
            double f = (t - hdgT[lo]) / (hdgT[hi] - hdgT[lo]);
            double h = hdgV[lo] + f * wrap180(hdgV[hi] - hdgV[lo]);
            h %= 360.0;
            return h < 0 ? h + 360.0 : h;
        }
        if (loOk) return hdgV[lo];
        if (hiOk) return hdgV[hi];
        return Double.NaN;
    }

    /** Angle difference folded into [-180, 180). */
    static double wrap180(double a) {
        double r = (a + 180.0) % 360.0;
        if (r < 0) r += 360.0;
        return r - 180.0;
    }
}
