package org.leadline.cleaning;

import org.leadline.cleaning.CleaningSettings.Filter;
import org.leadline.survey.SoundingTable;
import org.leadline.survey.SoundingTable.Reason;
import org.leadline.survey.SoundingTable.Status;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.EnumMap;
import java.util.Map;

/**
 * Automatic cleaning of reduced soundings: four filters, run in this order, each rejecting only
 * soundings still accepted and recording its {@link Reason}:
 * <ol>
 * <li>sounder quality: the sounder's own quality value below {@code min_quality} ({@link Reason#QUALITY});</li>
 * <li>depth gates: depth below the water surface outside [{@code min_depth}, {@code max_depth}]
 *     ({@link Reason#DEPTH_GATE}; a NaN depth is {@link Reason#NO_RETURN});</li>
 * <li>along-track spike filter: a Hampel filter (Hampel 1974; Pearson et al. 2016, "Generalized
 *     Hampel filters", EURASIP J. Adv. Signal Process. 2016:87, doi:10.1186/s13634-016-0383-6)
 *     made robust on slopes: in each along-track series (one line and one beam; without beam numbers
 *     the rank of the launch angle within the ping, or a launch-angle band; the whole line for a
 *     single beam), in time order, the N neighbours of a sounding are
 *     detrended with a median-of-pair-slopes line (the Theil-Sen estimator, Sen 1968, on pairs half
 *     a window apart), and the sounding is rejected ({@link Reason#SPIKE}) when it differs from the
 *     median of the detrended neighbours by more than
 *     {@code max(spike_k * 1.4826 * MAD, spike_k_tvu * TVU, spike_floor)}; 1.4826 makes the median
 *     absolute deviation a consistent estimate of a normal standard deviation (Rousseeuw and Croux
 *     1993, JASA 88:1273, doi:10.1080/01621459.1993.10476408);</li>
 * <li>surface filter: a provisional surface of cell medians on a {@code surface_cell} grid,
 *     each cell refined by a plane fitted to its 3 x 3 neighbourhood (least squares, replaced by
 *     an exhaustive consensus search, after RANSAC, when a cell median is off the plane by more
 *     than {@code surface_k} times the cell's mean TVU; intercept by median); a sounding deviating
 *     from it by more than {@code surface_k * TVU} is rejected ({@link Reason#SURFACE}).</li>
 * </ol>
 * Full rules: docs/science/cleaning.md. Filters change only the status and reason columns.
 *
 * <p>Cost: linear in the soundings apart from small fixed-size sorts (series and cells are
 * formed by counting sorts over primitive arrays, no boxing). Pure: no I/O.
 *
 * <pre>{@code
 * CleaningStats st = Cleaner.clean(soundings, pings.quality, CleaningSettings.defaults());
 * }</pre>
 */
public final class Cleaner {
    private static final double MAD_TO_SIGMA = 1.4826;

    private Cleaner() {}

    /**
     * Runs the enabled filters over the accepted soundings of {@code s}, in place.
     *
     * @param s       reduced soundings (depth, surfaceDepth, time, line, beam, launchAngle,
     *                easting, northing and tvu are read; status and reason are written)
     * @param quality sounder quality per sounding (same rows; -1 or any negative value = not
     *                given), or null when the sounder gave none
     * @param cfg     settings
     * @return rejections per reason
     */
    public static CleaningStats clean(SoundingTable s, int[] quality, CleaningSettings cfg) {
        if (quality != null && quality.length != s.size) {
            throw new IllegalArgumentException("quality has " + quality.length + " rows, soundings " + s.size);
        }
        int before = s.countAccepted();
        int[] counts = new int[256];
        gates(s, quality, cfg, counts);
        boolean[] spike = new boolean[s.size];
        int untestedSpike = cfg.enabled(Filter.SPIKE) ? spikeFlags(s, cfg, spike) : 0;
        int untestedSurface = spatial(s, spike, cfg, counts, null);
        Map<Reason, Integer> byReason = new EnumMap<>(Reason.class);
        for (Reason r : Reason.values()) if (counts[r.code & 0xff] > 0) byReason.put(r, counts[r.code & 0xff]);
        return new CleaningStats(s.size, before, s.countAccepted(), byReason, untestedSpike, untestedSurface);
    }

    /**
     * The per-sounding gates of {@link #clean}: sounder quality, then depth (in place).
     * A day processed in tiles runs them chunk by chunk.
     *
     * @param counts rejections per reason code, added to
     */
    public static void gates(SoundingTable s, int[] quality, CleaningSettings cfg, int[] counts) {
        if (cfg.enabled(Filter.QUALITY) && quality != null) qualityGate(s, quality, cfg.minQuality(), counts);
        if (cfg.enabled(Filter.DEPTH_GATE)) depthGate(s, cfg.minDepth(), cfg.maxDepth(), counts);
    }

    /**
     * The spatial part of {@link #clean}: feature protection of the spike flags, the spike
     * rejections, then the surface filter with its own feature protection. Every decision about a
     * sounding looks only at soundings within {@link #spatialReach} of it, so a tile processed
     * with a margin of that width around it gets the same result for its own soundings as the
     * whole day.
     *
     * @param spike  flags from {@link #spikeFlags} (cleared where another pass confirms them)
     * @param counts rejections per reason code, added to
     * @param core   rows whose untested soundings are counted (null: all)
     * @return accepted soundings of the core the surface filter could not test
     */
    public static int spatial(SoundingTable s, boolean[] spike, CleaningSettings cfg, int[] counts, boolean[] core) {
        if (cfg.enabled(Filter.SPIKE)) {
            restoreSupported(s, spike, cfg.spikeFloor(), cfg.spikeKTvu());
            for (int i = 0; i < s.size; i++) if (spike[i]) reject(s, i, Reason.SPIKE, counts);
        }
        return cfg.enabled(Filter.SURFACE) ? surfaceFilter(s, cfg, counts, core) : 0;
    }

    /**
     * Distance, m, along each axis, within which soundings can change the outcome of
     * {@link #spatial} for a sounding: the surface filter reads its own cell and the 8 around it
     * (every point of them lies within 2 cells along each axis), and the spike status of those
     * soundings depends on witnesses within {@link #SUPPORT_RADIUS}; the surface filter's own
     * witnesses lie within that radius and their spike status looks as far again.
     */
    public static double spatialReach(CleaningSettings cfg) {
        return Math.max(2 * cfg.surfaceCell() + SUPPORT_RADIUS, 2 * SUPPORT_RADIUS);
    }

    private static void reject(SoundingTable s, int i, Reason r, int[] counts) {
        if (s.status[i] == Status.ACCEPTED.code) {
            s.reject(i, r);
            counts[r.code & 0xff]++;
        }
    }

    static void qualityGate(SoundingTable s, int[] quality, int minQuality, int[] counts) {
        for (int i = 0; i < s.size; i++) {
            if (quality[i] >= 0 && quality[i] < minQuality) reject(s, i, Reason.QUALITY, counts);
        }
    }

    /** Depth gate on the depth below the water surface (the reduced depth when that is unknown). */
    static void depthGate(SoundingTable s, double min, double max, int[] counts) {
        for (int i = 0; i < s.size; i++) {
            if (s.status[i] != Status.ACCEPTED.code) continue;
            if (Double.isNaN(s.depth[i])) {
                reject(s, i, Reason.NO_RETURN, counts);
                continue;
            }
            double d = Double.isFinite(s.surfaceDepth[i]) ? s.surfaceDepth[i] : s.depth[i];
            if (!(d >= min && d <= max)) reject(s, i, Reason.DEPTH_GATE, counts);
        }
    }

    // ------------------------------------------------------------------ along-track spike filter

    /**
     * The along-track spike test of {@link #clean} (Hampel filter per line and beam series), flags
     * only: nothing is rejected until {@link #spatial} has looked for other passes that confirm a
     * flagged sounding. Series never cross lines, so a chunk of whole lines gives the same flags as
     * the whole day.
     *
     * @param spike receives true for each flagged sounding
     * @return accepted soundings that could not be tested (series too short)
     */
    public static int spikeFlags(SoundingTable s, CleaningSettings cfg, boolean[] spike) {
        int n = s.size;
        int[] cand = rowsWhere(n, i -> s.status[i] == Status.ACCEPTED.code && Double.isFinite(s.depth[i])
                && Double.isFinite(s.time[i]));
        int m = cand.length;
        // number the series: (line, beam); the whole line for a single beam
        int[] beamKey = seriesBeamKeys(s, Math.toRadians(cfg.spikeAngleBand()));
        int[] gid = new int[m];
        int groups = seriesIds(s, cand, m, beamKey, gid);
        int[] start = new int[groups + 1];
        int[] order = countingSort(cand, gid, m, groups, start);
        gid = null;
        cand = null;

        // series are independent: contiguous runs of series in parallel tasks, each writing only its
        // own soundings' flags, so the result does not depend on the number of threads
        int[] taskStart = tasks(start, groups, m);
        final int[] ord = order;
        int untested = java.util.stream.IntStream.range(0, taskStart.length - 1).parallel()
                .map(t -> spikeSeries(s, cfg, ord, start, taskStart[t], taskStart[t + 1], spike)).sum();
        return untested;
    }

    /** The spike test over series g0..g1-1 (sorted in place by time when needed); returns the untested count. */
    private static int spikeSeries(SoundingTable s, CleaningSettings cfg, int[] order, int[] start, int g0, int g1,
                                   boolean[] spike) {
        int win = cfg.spikeWindow();
        int half = win / 2;
        double[] tScratch = new double[win];
        double[] dScratch = new double[win];
        double[] work = new double[win];
        double[] resid = new double[win];
        int[] tmp = new int[0];
        double[] lt = new double[0], ld = new double[0];
        int untested = 0;
        double k = cfg.spikeK(), kTvu = cfg.spikeKTvu(), floor = cfg.spikeFloor();
        double[] time = s.time, depth = s.depth, tvu = s.tvu;
        for (int g = g0; g < g1; g++) {
            int from = start[g], to = start[g + 1], len = to - from;
            int kn = Math.min(win, len - 1);
            if (kn < 4) {
                untested += len;
                continue;
            }
            // the series into contiguous arrays: one scattered read per sounding, not one per neighbour
            if (lt.length < len) {
                lt = new double[Math.max(len, 2 * lt.length)];
                ld = new double[lt.length];
            }
            if (!gather(order, from, len, time, depth, lt, ld)) {
                if (tmp.length < len) tmp = new int[len];
                mergeSortByKey(order, from, to, time, tmp);
                gather(order, from, len, time, depth, lt, ld);
            }
            // one sounding per call: called millions of times, so compiled early (a loop over a
            // task's series would wait in the interpreter for an on-stack compile)
            for (int p = 0; p < len; p++) {
                int i = order[from + p];
                if (spikeAt(p, len, kn, half, lt, ld, tvu[i], floor, kTvu, k, tScratch, dScratch, work, resid)) spike[i] = true;
            }
        }
        return untested;
    }

    /**
     * The along-track test of sounding p of a series (times lt, depths ld, len soundings, window of
     * kn neighbours): true when it is a spike (see {@link #spikeFlags}).
     */
    private static boolean spikeAt(int p, int len, int kn, int half, double[] lt, double[] ld, double tvu, double floor,
                                   double kTvu, double k, double[] tScratch, double[] dScratch, double[] work,
                                   double[] resid) {
        int lo = p - half;
        if (lo < 0) lo = 0;
        int hi = lo + kn;
        if (hi > len - 1) {
            hi = len - 1;
            lo = hi - kn;
        }
        double ti = lt[p];
        int c = 0;
        for (int q = lo; q <= hi; q++) {
            if (q == p) continue;
            tScratch[c] = lt[q] - ti;
            dScratch[c] = ld[q];
            c++;
        }
        // local slope: median of slopes of pairs half a window apart (Theil-Sen on a fixed pairing)
        int h = c / 2, ns = 0;
        for (int q = 0; q + h < c; q++) {
            double dt = tScratch[q + h] - tScratch[q];
            if (dt != 0) work[ns++] = (dScratch[q + h] - dScratch[q]) / dt;
        }
        double slope = ns == 5 ? median5(work[0], work[1], work[2], work[3], work[4]) : ns > 0 ? median(work, ns) : 0;
        double thr = floor;
        if (Double.isFinite(tvu)) thr = Math.max(thr, kTvu * tvu);
        double nearLo = ld[p] - 0.999 * thr, nearHi = ld[p] + 0.999 * thr;
        int below = 0, above = 0;
        for (int q = 0; q < c; q++) {
            double r = dScratch[q] - slope * tScratch[q];
            resid[q] = r;
            if (r < nearLo) below++;
            if (r > nearHi) above++;
        }
        // the median (middle value, or mean of the two middle values, of the sorted residuals)
        // lies within [nearLo, nearHi] when at most (c-1)/2 residuals fall below it and at most
        // c-1-c/2 above: then this sounding is within its threshold of the fit and cannot be a
        // spike (most soundings), and the median need not be found. The 0.1 % margin keeps
        // rounding on the safe side.
        if (below <= (c - 1) / 2 && above <= c - 1 - c / 2) return false;
        System.arraycopy(resid, 0, work, 0, c);
        double fit = median(work, c);
        double dev = Math.abs(ld[p] - fit);
        if (dev <= thr) return false;
        for (int q = 0; q < c; q++) work[q] = Math.abs(resid[q] - fit);
        double mad = median(work, c);
        return dev > Math.max(thr, k * MAD_TO_SIGMA * mad);
    }

    /**
     * The median of five values (a window of ten neighbours gives five slopes) without sorting: the
     * middle two of a, b, c, d are max(min(a, b), min(c, d)) and min(max(a, b), max(c, d)), and the
     * median of all five is the median of those two and e. The same value as {@link #median}; only
     * the sign of a zero may differ between equal values, which changes no residual.
     */
    static double median5(double a, double b, double c, double d, double e) {
        double x = Math.max(Math.min(a, b), Math.min(c, d));
        double y = Math.min(Math.max(a, b), Math.max(c, d));
        return Math.max(Math.min(x, y), Math.min(Math.max(x, y), e));
    }

    /**
     * Copies the times and depths of series rows order[from, from + len) into lt and ld; returns
     * whether the times are in order. A method of its own: when the JIT's guesses about this loop
     * fail, only this small method is compiled again, not the spike test around it.
     */
    private static boolean gather(int[] order, int from, int len, double[] time, double[] depth, double[] lt, double[] ld) {
        boolean sorted = true;
        for (int p = 0; p < len; p++) {
            int i = order[from + p];
            lt[p] = time[i];
            ld[p] = depth[i];
            if (p > 0 && lt[p] < lt[p - 1]) sorted = false;
        }
        return sorted;
    }

    /**
     * Splits groups 0..groups-1 (start[] as from countingSort, m items in all) into contiguous runs
     * of about m/64 items: the boundaries depend only on the data, not on the thread count.
     */
    static int[] tasks(int[] start, int groups, int m) {
        int target = Math.max(4096, m / 64);
        int[] out = new int[Math.min(groups, 64 * 2 + 2) + 2];
        int k = 0;
        out[k++] = 0;
        int last = 0;
        for (int g = 1; g < groups; g++) {
            if (start[g] - start[last] >= target && k < out.length - 1) {
                out[k++] = g;
                last = g;
            }
        }
        out[k++] = groups;
        return Arrays.copyOf(out, k);
    }

    /**
     * Numbers the series (line, beam key) of candidates cand[0, m) into gid; returns their count.
     * Densely (line x beam-key range, on all cores) when beam keys are small, as with beam numbers;
     * by a hash map in order of first appearance otherwise. The numbering does not change any
     * result: each series is tested on its own soundings in row order.
     */
    static int seriesIds(SoundingTable s, int[] cand, int m, int[] beamKey, int[] gid) {
        int lines = s.lineNames().size() + 1; // line -1 (none) too
        int[] range = java.util.stream.IntStream.range(0, (m + 65_535) / 65_536).parallel().mapToObj(b -> {
            int[] r = {Integer.MAX_VALUE, Integer.MIN_VALUE};
            for (int q = b * 65_536, end = Math.min(m, (b + 1) * 65_536); q < end; q++) {
                r[0] = Math.min(r[0], beamKey[cand[q]]);
                r[1] = Math.max(r[1], beamKey[cand[q]]);
            }
            return r;
        }).reduce(new int[] {Integer.MAX_VALUE, Integer.MIN_VALUE},
                (a, b) -> new int[] {Math.min(a[0], b[0]), Math.max(a[1], b[1])});
        long width = (long) range[1] - range[0] + 1;
        if (m > 0 && width * lines <= Math.max(4L * m, 1 << 16)) {
            int w = (int) width, k0 = range[0];
            java.util.stream.IntStream.range(0, (m + 65_535) / 65_536).parallel().forEach(b -> {
                for (int q = b * 65_536, end = Math.min(m, (b + 1) * 65_536); q < end; q++) {
                    int i = cand[q];
                    gid[q] = (s.line[i] + 1) * w + (beamKey[i] - k0);
                }
            });
            return w * lines;
        }
        LongIntMap ids = new LongIntMap(1024);
        for (int k = 0; k < m; k++) {
            int i = cand[k];
            long key = ((long) (s.line[i] + 1) << 32) | (beamKey[i] & 0xffffffffL);
            gid[k] = ids.putIfAbsent(key, ids.size());
        }
        return ids.size();
    }

    /**
     * The beam part of each sounding's series key: the beam number when given; otherwise, for a
     * ping whose soundings are consecutive rows (same line and time) with launch angles, the rank
     * of the sounding's angle within the ping (a beam number the sounder did not write); otherwise
     * the launch-angle band round(angle / band); -1 (the whole line) without an angle.
     */
    static int[] seriesBeamKeys(SoundingTable s, double bandRad) {
        int n = s.size;
        int[] key = new int[n];
        // pings are independent: blocks of whole pings (a block starts where line or time changes) on all cores
        List<Integer> starts = new ArrayList<>();
        starts.add(0);
        for (int i = 1 << 16; i < n; i += 1 << 16) {
            while (i < n && s.line[i] == s.line[i - 1] && s.time[i] == s.time[i - 1]) i++;
            if (i < n && i > starts.get(starts.size() - 1)) starts.add(i);
        }
        starts.add(n);
        java.util.stream.IntStream.range(0, starts.size() - 1).parallel()
                .forEach(b -> beamKeys(s, bandRad, starts.get(b), starts.get(b + 1), key));
        return key;
    }

    /** {@link #seriesBeamKeys} of the pings in rows [from, to). */
    private static void beamKeys(SoundingTable s, double bandRad, int from, int n, int[] key) {
        int[] run = new int[16];
        int i = from;
        while (i < n) {
            int j = i + 1;
            while (j < n && s.line[j] == s.line[i] && s.time[j] == s.time[i]) j++;
            int len = 0;
            for (int q = i; q < j; q++) {
                if (s.beam[q] >= 0) key[q] = s.beam[q];
                else if (!Double.isFinite(s.launchAngle[q])) key[q] = -1;
                else {
                    key[q] = (1 << 30) + (int) Math.floor(s.launchAngle[q] / bandRad + 0.5);
                    if (len == run.length) run = Arrays.copyOf(run, 2 * len);
                    run[len++] = q;
                }
            }
            if (len > 1) {
                // rank by angle: insertion sort, linear for pings already in angle order
                double[] ang = s.launchAngle;
                for (int a = 1; a < len; a++) {
                    int v = run[a];
                    int b = a - 1;
                    while (b >= 0 && ang[run[b]] > ang[v]) { run[b + 1] = run[b]; b--; }
                    run[b + 1] = v;
                }
                for (int a = 0; a < len; a++) key[run[a]] = (1 << 29) + a;
            }
            i = j;
        }
    }

    /** Rows i in [0, n) for which test(i) holds, in order; counted and gathered in parallel blocks. */
    static int[] rowsWhere(int n, java.util.function.IntPredicate test) {
        int block = 1 << 16, blocks = (n + block - 1) / block;
        int[][] parts = new int[blocks][];
        java.util.stream.IntStream.range(0, blocks).parallel().forEach(b -> {
            int from = b * block, to = Math.min(n, from + block);
            int[] out = new int[to - from];
            int k = 0;
            for (int i = from; i < to; i++) if (test.test(i)) out[k++] = i;
            parts[b] = k == out.length ? out : Arrays.copyOf(out, k);
        });
        int m = 0;
        for (int[] p : parts) m += p.length;
        int[] all = new int[m];
        m = 0;
        for (int[] p : parts) {
            System.arraycopy(p, 0, all, m, p.length);
            m += p.length;
        }
        return all;
    }

    // ------------------------------------------------------------------ surface filter

    /** Returns the number of accepted soundings that could not be tested. */
    static int surfaceFilter(SoundingTable s, CleaningSettings cfg, int[] counts, boolean[] core) {
        int n = s.size;
        double cell = cfg.surfaceCell();
        int[] cand = rowsWhere(n, i -> s.status[i] == Status.ACCEPTED.code && Double.isFinite(s.depth[i])
                && Double.isFinite(s.easting[i]) && Double.isFinite(s.northing[i]));
        int m = cand.length;
        int untested = (int) java.util.stream.IntStream.range(0, n).parallel()
                .filter(i -> s.status[i] == Status.ACCEPTED.code && (core == null || core[i])
                        && !(Double.isFinite(s.depth[i]) && Double.isFinite(s.easting[i]) && Double.isFinite(s.northing[i])))
                .count();
        int[] cid = new int[m];
        CellIndex ids = CellIndex.of(s, cand, m, cell, cid);
        int cells = ids.cells();
        long[] cellKeys = ids.keys();
        int[] start = new int[cells + 1];
        int[] order = countingSort(cand, cid, m, cells, start);
        cid = null;
        cand = null;

        // cell representative: (mean easting, mean northing, median depth), plus the mean TVU;
        // cells in parallel runs (each writes only its own cells)
        double[] ce = new double[cells], cn = new double[cells], cz = new double[cells], ct = new double[cells];
        boolean[] ok = new boolean[cells];
        int[] taskStart = tasks(start, cells, m);
        final int[] ord = order;
        // one cell per call below: these methods are called once per cell and compiled early,
        // where a loop over all cells of a task would wait in the interpreter for an on-stack compile
        int minCount = cfg.surfaceMinCount();
        java.util.stream.IntStream.range(0, taskStart.length - 1).parallel().forEach(t -> {
            double[] scratch = new double[64];
            for (int c = taskStart[t]; c < taskStart[t + 1]; c++) {
                scratch = representative(s, ord, start[c], start[c + 1], scratch, minCount, c, ce, cn, cz, ct, ok);
            }
        });

        boolean[] rejectIt = new boolean[n];
        double kS = cfg.surfaceK();
        final long[] keys = cellKeys;
        untested += java.util.stream.IntStream.range(0, taskStart.length - 1).parallel().map(t -> {
            double[] px = new double[9], py = new double[9], pz = new double[9], w = new double[9];
            double[] plane = new double[3];
            int notTested = 0;
            for (int c = taskStart[t]; c < taskStart[t + 1]; c++) {
                notTested += filterCell(s, ord, start, c, keys[c], cell, ids, ok, ce, cn, cz, ct, kS, core, rejectIt,
                        px, py, pz, w, plane);
            }
            return notTested;
        }).sum();
        restoreSupported(s, rejectIt, cfg.spikeFloor(), cfg.spikeKTvu());
        for (int i = 0; i < n; i++) if (rejectIt[i]) reject(s, i, Reason.SURFACE, counts);
        return untested;
    }

    /**
     * Cell c's representative for the surface filter: mean TVU into ct, and when it holds at least
     * minCount soundings, ok, the median depth, mean easting and northing. Returns the scratch
     * array (grown when the cell needed more room).
     */
    private static double[] representative(SoundingTable s, int[] ord, int from, int to, double[] scratch, int minCount,
                                           int c, double[] ce, double[] cn, double[] cz, double[] ct, boolean[] ok) {
        int len = to - from;
        if (scratch.length < len) scratch = new double[Math.max(len, scratch.length * 2)];
        double se = 0, sn = 0, stv = 0;
        int nt = 0;
        for (int q = 0; q < len; q++) {
            int i = ord[from + q];
            scratch[q] = s.depth[i];
            se += s.easting[i];
            sn += s.northing[i];
            double v = s.tvu[i];
            if (Double.isFinite(v)) {
                stv += v;
                nt++;
            }
        }
        ct[c] = nt > 0 ? stv / nt : Double.NaN;
        if (len < minCount) return scratch;
        ok[c] = true;
        cz[c] = median(scratch, len);
        ce[c] = se / len;
        cn[c] = sn / len;
        return scratch;
    }

    /**
     * The surface filter's test of the soundings of cell c against the plane through the
     * representatives of its 3 x 3 neighbourhood; marks rejections in rejectIt and returns the
     * number of the cell's soundings (of the core) it could not test.
     */
    private static int filterCell(SoundingTable s, int[] ord, int[] start, int c, long key, double cell, CellIndex ids,
                                  boolean[] ok, double[] ce, double[] cn, double[] cz, double[] ct, double kS,
                                  boolean[] core, boolean[] rejectIt, double[] px, double[] py, double[] pz,
                                  double[] w, double[] plane) {
        int cx = (int) (key >> 32), cy = (int) key;
        double e0 = (cx + 0.5) * cell, n0 = (cy + 0.5) * cell;
        int np = 0;
        for (int dx = -1; dx <= 1; dx++) {
            for (int dy = -1; dy <= 1; dy++) {
                int o = ids.find(cx + dx, cy + dy);
                if (o >= 0 && ok[o]) {
                    px[np] = ce[o] - e0;
                    py[np] = cn[o] - n0;
                    pz[np] = cz[o];
                    np++;
                }
            }
        }
        int from = start[c], to = start[c + 1];
        int notTested = 0;
        if (np == 0 || !Double.isFinite(ct[c])) {
            for (int q = from; q < to; q++) if (core == null || core[ord[q]]) notTested++;
            return notTested;
        }
        fitPlane(px, py, pz, np, kS * ct[c], w, plane);
        double a = plane[0], bx = plane[1], by = plane[2];
        for (int q = from; q < to; q++) {
            int i = ord[q];
            if (!Double.isFinite(s.tvu[i])) {
                if (core == null || core[i]) notTested++;
                continue;
            }
            double surf = a + bx * (s.easting[i] - e0) + by * (s.northing[i] - n0);
            if (Math.abs(s.depth[i] - surf) > kS * s.tvu[i]) rejectIt[i] = true;
        }
        return notTested;
    }

    /**
     * Numbers the surface filter's cells: densely (row by row over the candidates' extent, on all
     * cores) when that extent has at most four cells per candidate, as on any survey; by a hash map
     * of the cells in order of first appearance otherwise (scattered data). Results do not depend
     * on the numbering: every cell is computed from its own soundings in row order.
     */
    static final class CellIndex {
        private final LongIntMap map;   // sparse numbering, or null
        private final long[] keys;
        private final int cells, cx0, cy0, ncx, ncy;

        private CellIndex(LongIntMap map, long[] keys, int cells, int cx0, int cy0, int ncx, int ncy) {
            this.map = map;
            this.keys = keys;
            this.cells = cells;
            this.cx0 = cx0;
            this.cy0 = cy0;
            this.ncx = ncx;
            this.ncy = ncy;
        }

        /** Numbers the cells of candidates cand[0, m) of s; fills cid with each candidate's cell. */
        static CellIndex of(SoundingTable s, int[] cand, int m, double cell, int[] cid) {
            int[] bounds = java.util.stream.IntStream.range(0, (m + 65_535) / 65_536).parallel().mapToObj(b -> {
                int[] r = {Integer.MAX_VALUE, Integer.MIN_VALUE, Integer.MAX_VALUE, Integer.MIN_VALUE};
                for (int q = b * 65_536, end = Math.min(m, (b + 1) * 65_536); q < end; q++) {
                    int x = cellIndex(s.easting[cand[q]], cell), y = cellIndex(s.northing[cand[q]], cell);
                    r[0] = Math.min(r[0], x); r[1] = Math.max(r[1], x);
                    r[2] = Math.min(r[2], y); r[3] = Math.max(r[3], y);
                }
                return r;
            }).reduce(new int[] {Integer.MAX_VALUE, Integer.MIN_VALUE, Integer.MAX_VALUE, Integer.MIN_VALUE},
                    (a, b) -> new int[] {Math.min(a[0], b[0]), Math.max(a[1], b[1]), Math.min(a[2], b[2]), Math.max(a[3], b[3])});
            long ncx = (long) bounds[1] - bounds[0] + 1, ncy = (long) bounds[3] - bounds[2] + 1;
            if (m > 0 && ncx * ncy <= Math.max(4L * m, 1 << 16)) {
                int nx = (int) ncx, ny = (int) ncy, x0 = bounds[0], y0 = bounds[2];
                java.util.stream.IntStream.range(0, (m + 65_535) / 65_536).parallel().forEach(b -> {
                    for (int q = b * 65_536, end = Math.min(m, (b + 1) * 65_536); q < end; q++) {
                        int x = cellIndex(s.easting[cand[q]], cell), y = cellIndex(s.northing[cand[q]], cell);
                        cid[q] = (y - y0) * nx + (x - x0);
                    }
                });
                long[] keys = new long[nx * ny];
                for (int y = 0; y < ny; y++) for (int x = 0; x < nx; x++) keys[y * nx + x] = cellKey(x0 + x, y0 + y);
                return new CellIndex(null, keys, nx * ny, x0, y0, nx, ny);
            }
            LongIntMap ids = new LongIntMap(Math.max(16, m / 8));
            long[] keys = new long[Math.max(16, m / 8)];
            for (int q = 0; q < m; q++) {
                int i = cand[q];
                long key = cellKey(cellIndex(s.easting[i], cell), cellIndex(s.northing[i], cell));
                int id = ids.putIfAbsent(key, ids.size());
                if (id == keys.length) keys = Arrays.copyOf(keys, keys.length * 2);
                keys[id] = key;
                cid[q] = id;
            }
            return new CellIndex(ids, keys, ids.size(), 0, 0, 0, 0);
        }

        int cells() { return cells; }

        /** Cell keys ({@link #cellKey}) by cell number. */
        long[] keys() { return keys; }

        /** The number of cell (cx, cy), or -1 when no candidate lies in it (sparse) or it is outside (dense). */
        int find(int cx, int cy) {
            if (map != null) return map.get(cellKey(cx, cy));
            int x = cx - cx0, y = cy - cy0;
            return x < 0 || y < 0 || x >= ncx || y >= ncy ? -1 : y * ncx + x;
        }
    }

    /** Radius within which a flagged sounding looks for soundings of other pings that agree with it, m. */
    static final double SUPPORT_RADIUS = 6.0;
    /** Agreeing soundings of another pass that make a flagged sounding real seabed. */
    static final int SUPPORT_MIN = 3;
    /** Least time between two looks for them to count as separate passes, s. */
    static final double SUPPORT_SEPARATION = 30.0;

    /**
     * Feature protection: a flagged sounding is kept when at least {@link #SUPPORT_MIN} soundings
     * of another pass (at least {@link #SUPPORT_SEPARATION} s apart, i.e. another line or a
     * revisit), within {@link #SUPPORT_RADIUS} horizontally, agree with its depth to within
     * {@code max(floor, kTvu * TVU)}. Spikes are transient: second echoes and dropouts are single
     * returns and a fish school has moved on by the next pass, whereas a wreck, a rock or a
     * channel edge is there on every pass. A median-based filter alone would clip such a feature,
     * and a clipped least depth is the most dangerous error a surface can carry (IHO S-44 ed.
     * 6.0.0 on feature detection; common practice: confirm a feature on a second pass). Flags are
     * cleared in place; the witnesses are every sounding still accepted, flagged or not.
     */
    static void restoreSupported(SoundingTable s, boolean[] flagged, double floor, double kTvu) {
        int n = s.size;
        int[] flags = rowsWhere(n, i -> flagged[i]);
        int nf = flags.length;
        if (nf == 0) return;
        double r = SUPPORT_RADIUS;
        // only cells next to a flagged sounding can hold its witnesses: index just those (flags are
        // few, so this is a small set instead of a map over every sounding of the day)
        LongIntMap near = new LongIntMap(Math.max(16, nf * 4));
        for (int i : flags) {
            if (!Double.isFinite(s.easting[i]) || !Double.isFinite(s.northing[i])) continue;
            int cx = cellIndex(s.easting[i], r), cy = cellIndex(s.northing[i], r);
            for (int dx = -1; dx <= 1; dx++) for (int dy = -1; dy <= 1; dy++) near.putIfAbsent(cellKey(cx + dx, cy + dy), 0);
        }
        // the accepted soundings in those cells, in row order, block by block (small methods that the
        // JIT compiles once, rather than day-long loops compiled again whenever a rare branch is taken)
        int blocks = (n + 65_535) / 65_536;
        int[][] parts = new int[blocks][];
        java.util.stream.IntStream.range(0, blocks).parallel()   // the map is only read here
                .forEach(b -> parts[b] = witnessesIn(s, near, r, b * 65_536, Math.min(n, (b + 1) * 65_536)));
        int m = 0;
        for (int[] q : parts) m += q.length;
        int[] pool = new int[m];
        long[] poolKey = new long[m];
        m = 0;
        for (int[] q : parts) {
            for (int i : q) {
                poolKey[m] = cellKey(cellIndex(s.easting[i], r), cellIndex(s.northing[i], r));
                pool[m++] = i;
            }
        }
        LongIntMap ids = new LongIntMap(Math.max(16, m / 8));
        int[] cid = new int[m];
        for (int q = 0; q < m; q++) cid[q] = ids.putIfAbsent(poolKey[q], ids.size());
        int cells = ids.size();
        int[] start = new int[cells + 1];
        int[] order = countingSort(pool, cid, m, cells, start);
        boolean[] keep = new boolean[n];
        for (int i : flags) {
            if (!Double.isFinite(s.easting[i]) || !Double.isFinite(s.northing[i])) continue;
            double tol = Double.isFinite(s.tvu[i]) ? Math.max(floor, kTvu * s.tvu[i]) : floor;
            int cx = cellIndex(s.easting[i], r), cy = cellIndex(s.northing[i], r);
            int support = 0;
            search:
            for (int dx = -1; dx <= 1; dx++) {
                for (int dy = -1; dy <= 1; dy++) {
                    int c = ids.get(cellKey(cx + dx, cy + dy));
                    if (c < 0) continue;
                    for (int q = start[c]; q < start[c + 1]; q++) {
                        int j = order[q];
                        if (Math.abs(s.time[j] - s.time[i]) < SUPPORT_SEPARATION) continue;
                        double de = s.easting[j] - s.easting[i], dn = s.northing[j] - s.northing[i];
                        if (de * de + dn * dn > r * r || Math.abs(s.depth[j] - s.depth[i]) > tol) continue;
                        if (++support >= SUPPORT_MIN) break search;
                    }
                }
            }
            keep[i] = support >= SUPPORT_MIN;
        }
        for (int i : flags) if (keep[i]) flagged[i] = false;
    }

    /** Accepted rows in [from, to) with a finite depth and position whose cell is in {@code near}, in order. */
    private static int[] witnessesIn(SoundingTable s, LongIntMap near, double r, int from, int to) {
        int[] out = new int[16];
        int k = 0;
        for (int i = from; i < to; i++) {
            if (s.status[i] != Status.ACCEPTED.code || !Double.isFinite(s.depth[i]) || !Double.isFinite(s.easting[i])
                    || !Double.isFinite(s.northing[i])) continue;
            if (near.get(cellKey(cellIndex(s.easting[i], r), cellIndex(s.northing[i], r))) < 0) continue;
            if (k == out.length) out = Arrays.copyOf(out, 2 * k);
            out[k++] = i;
        }
        return Arrays.copyOf(out, k);
    }

    static int cellIndex(double v, double cell) { return (int) Math.floor(v / cell); }

    static long cellKey(int cx, int cy) { return ((long) cx << 32) | (cy & 0xffffffffL); }

    /**
     * Plane z = a + bx*x + by*y through np cell medians (coordinates relative to the evaluation
     * cell's centre). First least squares on centred coordinates (a small ridge keeps the slope
     * across a single row of cells at zero); when some cell median is off that plane by more than
     * tol, an exhaustive consensus search replaces it: every plane through three medians, every
     * line through two (no slope across it) and every level plane through one is scored by how
     * many medians lie within tol of it (the consensus rule of RANSAC, Fischler and Bolles 1981,
     * Commun. ACM 24:381, doi:10.1145/358669.358692, here exhaustive over at most 9 points); ties
     * go to the flatter plane. Least squares is then refitted on the medians within tol. The
     * intercept is the median of the kept medians moved along the plane to the origin.
     * Result in out = {a, bx, by}.
     */
    static void fitPlane(double[] x, double[] y, double[] z, int np, double tol, double[] w, double[] out) {
        boolean[] keep = new boolean[np];
        Arrays.fill(keep, true);
        lsSlopes(x, y, z, np, keep, out);
        if (np >= 2 && maxResidual(x, y, z, np, keep, out) > tol) {
            double bestA = 0, bestBx = 0, bestBy = 0, bestG = Double.POSITIVE_INFINITY;
            int bestCount = -1;
            for (int j = 0; j < np; j++) {
                for (int k = j; k < np; k++) {
                    for (int l = k; l < np; l++) {
                        double bx, by;
                        if (k == j) { // level plane through j (visited once: l == k == j)
                            if (l != j) continue;
                            bx = 0;
                            by = 0;
                        } else if (l == k) { // line through j and k, no slope across it
                            double dx = x[k] - x[j], dy = y[k] - y[j], l2 = dx * dx + dy * dy;
                            if (l2 == 0) continue;
                            double g = (z[k] - z[j]) / l2;
                            bx = g * dx;
                            by = g * dy;
                        } else { // plane through j, k, l
                            double ux = x[k] - x[j], uy = y[k] - y[j], uz = z[k] - z[j];
                            double vx = x[l] - x[j], vy = y[l] - y[j], vz = z[l] - z[j];
                            double nx = uy * vz - uz * vy, ny = uz * vx - ux * vz, nz = ux * vy - uy * vx;
                            if (Math.abs(nz) <= 1e-3 * Math.hypot(ux, uy) * Math.hypot(vx, vy)) continue; // near collinear
                            bx = -nx / nz;
                            by = -ny / nz;
                        }
                        double a = z[j] - bx * x[j] - by * y[j];
                        int count = 0;
                        for (int q = 0; q < np; q++) if (Math.abs(z[q] - a - bx * x[q] - by * y[q]) <= tol) count++;
                        double g2 = bx * bx + by * by;
                        if (count > bestCount || (count == bestCount && g2 < bestG)) {
                            bestCount = count; bestG = g2; bestA = a; bestBx = bx; bestBy = by;
                        }
                    }
                }
            }
            for (int q = 0; q < np; q++) keep[q] = Math.abs(z[q] - bestA - bestBx * x[q] - bestBy * y[q]) <= tol;
            lsSlopes(x, y, z, np, keep, out);
        }
        int c = 0;
        for (int q = 0; q < np; q++) if (keep[q]) w[c++] = z[q] - out[1] * x[q] - out[2] * y[q];
        out[0] = median(w, c);
    }

    private static double maxResidual(double[] x, double[] y, double[] z, int np, boolean[] keep, double[] slopes) {
        double xm = 0, ym = 0, zm = 0;
        int c = 0;
        for (int q = 0; q < np; q++) if (keep[q]) { xm += x[q]; ym += y[q]; zm += z[q]; c++; }
        xm /= c; ym /= c; zm /= c;
        double worst = 0;
        for (int q = 0; q < np; q++) {
            if (keep[q]) worst = Math.max(worst, Math.abs(z[q] - (zm + slopes[1] * (x[q] - xm) + slopes[2] * (y[q] - ym))));
        }
        return worst;
    }

    private static void lsSlopes(double[] x, double[] y, double[] z, int np, boolean[] keep, double[] out) {
        double xm = 0, ym = 0, zm = 0;
        int c = 0;
        for (int q = 0; q < np; q++) {
            if (keep != null && !keep[q]) continue;
            xm += x[q]; ym += y[q]; zm += z[q]; c++;
        }
        xm /= c; ym /= c; zm /= c;
        double sxx = 0, syy = 0, sxy = 0, sxz = 0, syz = 0;
        for (int q = 0; q < np; q++) {
            if (keep != null && !keep[q]) continue;
            double dx = x[q] - xm, dy = y[q] - ym, dz = z[q] - zm;
            sxx += dx * dx; syy += dy * dy; sxy += dx * dy; sxz += dx * dz; syz += dy * dz;
        }
        double ridge = 1e-6 * (sxx + syy) + 1e-12;
        sxx += ridge;
        syy += ridge;
        double det = sxx * syy - sxy * sxy;
        out[1] = (sxz * syy - syz * sxy) / det;
        out[2] = (syz * sxx - sxz * sxy) / det;
    }

    // ------------------------------------------------------------------ primitive helpers

    /** Stable counting sort of items by group id (0..groups-1); fills start[0..groups]. */
    static int[] countingSort(int[] items, int[] group, int m, int groups, int[] start) {
        for (int k = 0; k < m; k++) start[group[k] + 1]++;
        for (int g = 0; g < groups; g++) start[g + 1] += start[g];
        int[] pos = Arrays.copyOf(start, groups);
        int[] out = new int[m];
        for (int k = 0; k < m; k++) out[pos[group[k]]++] = items[k];
        return out;
    }

    /** Stable merge sort of idx[from, to) by key[idx]. */
    static void mergeSortByKey(int[] idx, int from, int to, double[] key, int[] tmp) {
        int len = to - from;
        if (len < 2) return;
        for (int width = 1; width < len; width *= 2) {
            for (int lo = 0; lo < len - width; lo += 2 * width) {
                int mid = lo + width, hi = Math.min(lo + 2 * width, len);
                int a = lo, b = mid, o = lo;
                while (a < mid && b < hi) {
                    tmp[o++] = key[idx[from + b]] < key[idx[from + a]] ? idx[from + b++] : idx[from + a++];
                }
                while (a < mid) tmp[o++] = idx[from + a++];
                while (b < hi) tmp[o++] = idx[from + b++];
                System.arraycopy(tmp, lo, idx, from + lo, hi - lo);
            }
        }
    }

    /**
     * Median of a[0..len) (mean of the two middle values for an even count), reordering the
     * slice: the gridder's quickselect, {@link org.leadline.surface.Select#median}.
     */
    static double median(double[] a, int len) {
        return org.leadline.surface.Select.median(a, 0, len);
    }
}
