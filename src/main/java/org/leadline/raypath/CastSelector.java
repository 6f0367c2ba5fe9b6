package org.leadline.raypath;

import java.util.Arrays;
import java.util.Comparator;
import java.util.Locale;
import java.util.stream.IntStream;

/**
 * Chooses, for every ping, the sound-speed cast whose profile its beams are traced through.
 *
 * <ul>
 *   <li>{@link Mode#NEAREST_TIME} (default): the cast closest in time, earlier or later.</li>
 *   <li>{@link Mode#NEAREST_DISTANCE}: the cast closest in position (great-circle distance on a
 *       sphere, haversine form; the radius does not change which is nearest). Ties, and pings without
 *       a position (NaN latitude or longitude), go by nearest time.</li>
 *   <li>{@link Mode#INTERPOLATE_TIME}: the two casts that bracket the ping in time and the weight w of
 *       the later one, w = (t - t1) / (t2 - t1). The caller traces the beam through both profiles and
 *       blends the two ray solutions, depth = (1 - w) z1 + w z2 and likewise the horizontal distance.
 *       Blending solutions rather than building a blended profile keeps one ray table per cast and
 *       makes the result vary linearly and continuously in time between casts. Before the first and
 *       after the last cast the nearest one is used alone (w = 0).</li>
 * </ul>
 * Time-based choice between casts is common practice; none of these modes models the water between
 * casts, they only choose or blend measured profiles.
 */
public final class CastSelector {
    private CastSelector() {}

    /** How a cast is chosen for each ping. */
    public enum Mode {
        NEAREST_TIME("nearest-time"), NEAREST_DISTANCE("nearest-distance"), INTERPOLATE_TIME("interpolate-time");

        private final String label;
        Mode(String label) { this.label = label; }

        /** The name used on the command line and in project files. */
        public String label() { return label; }

        /** Parses {@code nearest-time|nearest-distance|interpolate-time} (case-insensitive). */
        public static Mode parse(String text) {
            String s = text == null ? "" : text.trim().toLowerCase(Locale.ROOT);
            for (Mode m : values()) if (m.label.equals(s)) return m;
            throw new IllegalArgumentException("cast selection must be one of nearest-time, nearest-distance,"
                    + " interpolate-time; found '" + text + "'");
        }
    }

    /**
     * Per-ping choice, columnar: {@code first(i)} is the cast used (the earlier of the two when
     * blending), {@code second(i)} the later cast and {@code weight(i)} its weight in [0, 1]; in the
     * nearest modes second == first and weight == 0. Indices refer to the cast arrays as given.
     */
    public static final class Selection {
        private final int[] first;
        private final int[] second;
        private final double[] weight;

        Selection(int[] first, int[] second, double[] weight) {
            this.first = first;
            this.second = second;
            this.weight = weight;
        }

        public int size() { return first.length; }
        public int first(int ping) { return first[ping]; }
        public int second(int ping) { return second[ping]; }
        public double weight(int ping) { return weight[ping]; }
        /** Copy of the first-cast column. */
        public int[] firstColumn() { return first.clone(); }
        /** Copy of the second-cast column. */
        public int[] secondColumn() { return second.clone(); }
        /** Copy of the weight column. */
        public double[] weightColumn() { return weight.clone(); }
    }

    /**
     * @param mode     how to choose
     * @param castTime cast times, s since the epoch (any order)
     * @param castLat  cast latitudes, deg (used by NEAREST_DISTANCE only; may be null otherwise)
     * @param castLon  cast longitudes, deg
     * @param pingTime ping times, s since the epoch
     * @param pingLat  ping latitudes, deg (used by NEAREST_DISTANCE only; may be null otherwise)
     * @param pingLon  ping longitudes, deg
     */
    public static Selection select(Mode mode, double[] castTime, double[] castLat, double[] castLon,
                                   double[] pingTime, double[] pingLat, double[] pingLon) {
        int nc = castTime.length;
        if (nc == 0) throw new IllegalArgumentException("no cast to choose from: at least one cast is needed");
        for (int i = 0; i < nc; i++) {
            if (!Double.isFinite(castTime[i])) {
                throw new IllegalArgumentException("cast " + i + " has no valid time: " + castTime[i]);
            }
        }
        Integer[] boxed = IntStream.range(0, nc).boxed().toArray(Integer[]::new);
        Arrays.sort(boxed, Comparator.comparingDouble(i -> castTime[i])); // stable: ties keep input order
        int[] order = new int[nc];
        double[] sortedTime = new double[nc];
        for (int i = 0; i < nc; i++) { order[i] = boxed[i]; sortedTime[i] = castTime[boxed[i]]; }

        int np = pingTime.length;
        int[] first = new int[np], second = new int[np];
        double[] weight = new double[np];
        for (int k = 0; k < np; k++) {
            double t = pingTime[k];
            int hi = upperIndex(sortedTime, t);        // first cast strictly later than t (nc if none)
            int lo = hi - 1;                           // last cast at or before t (-1 if none)
            int nearest;
            if (lo < 0) nearest = 0;
            else if (hi >= nc) nearest = lo;
            else nearest = (t - sortedTime[lo] <= sortedTime[hi] - t) ? lo : hi;
            // among casts at the same time as the nearest one, the first in input order
            while (nearest > 0 && sortedTime[nearest - 1] == sortedTime[nearest]) nearest--;
            switch (mode) {
                case NEAREST_TIME -> { first[k] = second[k] = order[nearest]; }
                case NEAREST_DISTANCE -> {
                    int best = order[nearest];
                    if (Double.isFinite(pingLat[k]) && Double.isFinite(pingLon[k])) {
                        double bestD = Double.POSITIVE_INFINITY, bestDt = Double.POSITIVE_INFINITY;
                        for (int c = 0; c < nc; c++) {
                            double dist = angularDistance(pingLat[k], pingLon[k], castLat[c], castLon[c]);
                            double dt = Math.abs(castTime[c] - t);
                            if (dist < bestD || (dist == bestD && dt < bestDt)) { bestD = dist; bestDt = dt; best = c; }
                        }
                    }
                    first[k] = second[k] = best;
                }
                case INTERPOLATE_TIME -> {
                    if (lo < 0 || hi >= nc || sortedTime[hi] == sortedTime[lo]) {
                        first[k] = second[k] = order[nearest];
                    } else {
                        first[k] = order[lo];
                        second[k] = order[hi];
                        weight[k] = (t - sortedTime[lo]) / (sortedTime[hi] - sortedTime[lo]);
                    }
                }
            }
        }
        return new Selection(first, second, weight);
    }

    /** Index of the first element strictly greater than t in a sorted array (length if none). */
    private static int upperIndex(double[] sorted, double t) {
        int lo = 0, hi = sorted.length;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (sorted[mid] <= t) lo = mid + 1; else hi = mid;
        }
        return lo;
    }

    /** Central angle between two points, rad (haversine formula, Sinnott 1984, Sky and Telescope 68:159). */
    static double angularDistance(double lat1, double lon1, double lat2, double lon2) {
        double p1 = Math.toRadians(lat1), p2 = Math.toRadians(lat2);
        double dp = p2 - p1, dl = Math.toRadians(lon2 - lon1);
        double h = Math.sin(dp / 2) * Math.sin(dp / 2) + Math.cos(p1) * Math.cos(p2) * Math.sin(dl / 2) * Math.sin(dl / 2);
        return 2 * Math.asin(Math.min(1, Math.sqrt(h)));
    }
}
