package org.leadline.surface;

import java.util.Arrays;
import java.util.HashMap;
import java.util.Map;
import java.util.stream.IntStream;

/**
 * Shoal-biased sounding selection for a chart or a field sheet: a thinned set of soundings
 * in which the shoal soundings survive. Common practice (the shoal bias nautical
 * charting uses so that thinning never hides a shoal), implemented as a greedy radius thinning.
 *
 * <p>Rule: the accepted soundings with a finite position and depth are taken from the shoalest
 * (least depth) to the deepest, ties in index order; a sounding is selected when no sounding
 * selected before it lies within the radius (horizontal distance {@code <= radius}).
 *
 * <p>Guaranteed properties (tested in SoundingSelectionTest on random data):
 * <ol>
 * <li>Selected soundings are more than the radius apart from each other.</li>
 * <li>Every usable sounding that is not selected lies within the radius of a selected sounding
 *   that is at least as shoal as it is (depth {@code <=} its depth).</li>
 * <li>The shoalest usable sounding is selected.</li>
 * </ol>
 * Not guaranteed: that no unselected sounding within the radius of a selected one is shoaler than
 * it. A chain A (shoalest) - B (within the radius of A, suppressed) - C (within the radius of B
 * but not of A) selects A and C while B, shoaler than C, lies within the radius of C.
 *
 * <p>Speed: O(n log n) for the stable sort by depth (parallel merge sort), then radius-sized buckets
 * make each test look at the 3 x 3 neighbouring buckets only; before that, a grid of squares an
 * eighth of the radius wide flags the squares wholly inside the radius of a selected sounding, so
 * that most soundings of a dense swath day are rejected by one look-up (same result as the exact
 * test, which they would fail).
 */
public final class SoundingSelection {
    private SoundingSelection() {}

    /**
     * @param e        eastings, m
     * @param n        northings, m
     * @param depth    depths, m, positive down
     * @param accepted which soundings may be selected (null: all)
     * @param radius   selection radius, m (positive)
     * @return indices of the selected soundings, in selection order (shoalest first)
     */
    public static int[] select(double[] e, double[] n, double[] depth, boolean[] accepted, double radius) {
        if (!(radius > 0) || Double.isInfinite(radius)) {
            throw new IllegalArgumentException("selection radius must be a positive number of metres, got " + radius);
        }
        int size = depth.length;
        if (e.length != size || n.length != size || (accepted != null && accepted.length != size)) {
            throw new IllegalArgumentException("sounding columns differ in length: e " + e.length + ", n " + n.length
                    + ", depth " + size + (accepted != null ? ", accepted " + accepted.length : ""));
        }
        int[] idx = usable(e, n, depth, accepted);
        int m = idx.length;
        // the extent (minimum and maximum do not depend on the order they are read in)
        double[] box = extent(e, n, idx);
        sortByDepth(idx, depth);

        double r2 = radius * radius;
        double minE = box[0], maxE = box[1], minN = box[2], maxN = box[3];
        double nbxD = Math.floor((maxE - minE) / radius) + 1, nbyD = Math.floor((maxN - minN) / radius) + 1;
        boolean dense = m > 0 && nbxD * nbyD <= Math.max(4.0 * m, 1 << 20);
        Buckets buckets = dense ? new DenseBuckets(minE, minN, radius, (int) nbxD, (int) nbyD) : new HashBuckets(radius);
        int[] out = new int[Math.min(m, 1024)];
        int k = 0;
        CoverGrid cover = dense ? CoverGrid.over(minE, minN, maxE, maxN, radius, m) : null;
        if (cover == null) {
            for (int i : idx) {
                if (buckets.anyWithin(e, n, e[i], n[i], r2)) continue;
                if (k == out.length) out = Arrays.copyOf(out, out.length * 2);
                out[k++] = i;
                buckets.add(i, e[i], n[i]);
            }
            return Arrays.copyOf(out, k);
        }
        // Most soundings lie in a small square wholly inside the disk of a sounding already
        // selected: they are rejected by one look-up, the others get the exact test above.
        int[] square = cover.squaresInOrder(idx, e, n);
        long[] covered = cover.covered;
        for (int q = 0; q < m; q++) {
            int sq = square[q];
            if ((covered[sq >>> 6] & (1L << sq)) != 0) continue;
            int i = idx[q];
            double x = e[i], y = n[i];
            if (buckets.anyWithin(e, n, x, y, r2)) continue;
            if (k == out.length) out = Arrays.copyOf(out, out.length * 2);
            out[k++] = i;
            buckets.add(i, x, y);
            cover.markInside(x, y, radius);
        }
        return Arrays.copyOf(out, k);
    }

    private static boolean usable(double[] e, double[] n, double[] depth, boolean[] accepted, int i) {
        return (accepted == null || accepted[i]) && Double.isFinite(depth[i]) && Double.isFinite(e[i])
                && Double.isFinite(n[i]);
    }

    /** {min e, max e, min n, max n} of the soundings idx, in parallel blocks. */
    private static double[] extent(double[] e, double[] n, int[] idx) {
        int m = idx.length, block = 1 << 16;
        double[][] part = new double[(m + block - 1) / block][];
        IntStream.range(0, part.length).parallel().forEach(b -> {
            double x0 = Double.POSITIVE_INFINITY, x1 = Double.NEGATIVE_INFINITY;
            double y0 = Double.POSITIVE_INFINITY, y1 = Double.NEGATIVE_INFINITY;
            for (int q = b * block, end = Math.min(m, (b + 1) * block); q < end; q++) {
                int i = idx[q];
                x0 = Math.min(x0, e[i]);
                x1 = Math.max(x1, e[i]);
                y0 = Math.min(y0, n[i]);
                y1 = Math.max(y1, n[i]);
            }
            part[b] = new double[] {x0, x1, y0, y1};
        });
        double[] box = {Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY};
        for (double[] p : part) {
            box[0] = Math.min(box[0], p[0]);
            box[1] = Math.max(box[1], p[1]);
            box[2] = Math.min(box[2], p[2]);
            box[3] = Math.max(box[3], p[3]);
        }
        return box;
    }

    /** Indices of the usable soundings in increasing order (counted and filled in parallel blocks). */
    private static int[] usable(double[] e, double[] n, double[] depth, boolean[] accepted) {
        int size = depth.length;
        int block = 1 << 16, blocks = (size + block - 1) / block;
        int[] count = new int[blocks + 1];
        IntStream.range(0, blocks).parallel().forEach(b -> {
            int c = 0;
            for (int i = b * block, end = Math.min(size, (b + 1) * block); i < end; i++) if (usable(e, n, depth, accepted, i)) c++;
            count[b + 1] = c;
        });
        for (int b = 0; b < blocks; b++) count[b + 1] += count[b];
        int[] idx = new int[count[blocks]];
        IntStream.range(0, blocks).parallel().forEach(b -> {
            int k = count[b];
            for (int i = b * block, end = Math.min(size, (b + 1) * block); i < end; i++) if (usable(e, n, depth, accepted, i)) idx[k++] = i;
        });
        return idx;
    }

    /**
     * Squares of an eighth of the radius over the data's extent, flagged once they lie wholly inside
     * the radius of a selected sounding (with a margin of a micrometre and a relative 1e-9 on the
     * squared distance, far above the rounding of the coordinates): any sounding in a flagged square
     * would fail the exact test against that selected sounding, so flagging changes no result.
     */
    private static final class CoverGrid {
        final double x0, y0, size;
        final int nx, ny;
        final long[] covered;   // one bit per square

        private CoverGrid(double x0, double y0, double size, int nx, int ny) {
            this.x0 = x0;
            this.y0 = y0;
            this.size = size;
            this.nx = nx;
            this.ny = ny;
            covered = new long[(int) (((long) nx * ny + 63) / 64)];
        }

        /** null when the grid would be too large for the number of soundings. */
        static CoverGrid over(double minE, double minN, double maxE, double maxN, double radius, int m) {
            double size = radius / 8;
            double nx = Math.floor((maxE - minE) / size) + 1, ny = Math.floor((maxN - minN) / size) + 1;
            if (!(nx * ny <= Math.max(4.0 * m, 1 << 20))) return null;
            return new CoverGrid(minE, minN, size, (int) nx, (int) ny);
        }

        int square(double x, double y) {
            int cx = Math.min(nx - 1, Math.max(0, (int) ((x - x0) / size)));
            int cy = Math.min(ny - 1, Math.max(0, (int) ((y - y0) / size)));
            return cy * nx + cx;
        }

        /**
         * The square of each sounding in sorted order: computed in index order (reading e and n in
         * sequence), then gathered (one scattered read per sounding), both in parallel blocks.
         */
        int[] squaresInOrder(int[] idx, double[] e, double[] n) {
            int size = e.length, m = idx.length;
            int block = 1 << 15;
            int[] byIndex = new int[size];
            IntStream.range(0, (size + block - 1) / block).parallel().forEach(b -> {
                for (int i = b * block, end = Math.min(size, (b + 1) * block); i < end; i++) {
                    if (Double.isFinite(e[i]) && Double.isFinite(n[i])) byIndex[i] = square(e[i], n[i]);
                }
            });
            int[] sq = new int[m];
            IntStream.range(0, (m + block - 1) / block).parallel().forEach(b -> {
                for (int q = b * block, end = Math.min(m, (b + 1) * block); q < end; q++) sq[q] = byIndex[idx[q]];
            });
            return sq;
        }

        /** Flags the squares that lie wholly within {@code radius} of (x, y). */
        void markInside(double x, double y, double radius) {
            final double margin = 1e-6;
            double limit = radius * radius * (1 - 1e-9);
            int cx0 = Math.max(0, (int) Math.floor((x - radius - x0) / size)), cx1 = Math.min(nx - 1, (int) ((x + radius - x0) / size));
            int cy0 = Math.max(0, (int) Math.floor((y - radius - y0) / size)), cy1 = Math.min(ny - 1, (int) ((y + radius - y0) / size));
            for (int cy = cy0; cy <= cy1; cy++) {
                // a sounding counted in square cy lies within [y0 + cy size, y0 + (cy + 1) size] up to rounding
                double dy = Math.max(Math.abs(y0 + cy * size - margin - y), Math.abs(y0 + (cy + 1) * size + margin - y));
                if (cy == 0 || cy == ny - 1) continue;   // edge squares also hold the clamped soundings
                for (int cx = cx0; cx <= cx1; cx++) {
                    if (cx == 0 || cx == nx - 1) continue;
                    double dx = Math.max(Math.abs(x0 + cx * size - margin - x), Math.abs(x0 + (cx + 1) * size + margin - x));
                    int sq = cy * nx + cx;
                    if (dx * dx + dy * dy <= limit) covered[sq >>> 6] |= 1L << sq;
                }
            }
        }
    }

    /** Selected soundings by square buckets of the radius's size: a neighbour lies in the 3 x 3 block. */
    private interface Buckets {
        boolean anyWithin(double[] e, double[] n, double x, double y, double r2);

        void add(int i, double x, double y);
    }

    /**
     * A dense bucket array over the data's extent, each bucket a linked list through next[]; the
     * selected soundings' coordinates are kept beside the list (read in sequence, not scattered).
     */
    private static final class DenseBuckets implements Buckets {
        final double x0, y0, size;
        final int nbx, nby;
        final int[] head;
        int[] next = new int[1024];
        double[] itemX = new double[1024], itemY = new double[1024];
        int count;

        DenseBuckets(double x0, double y0, double size, int nbx, int nby) {
            this.x0 = x0;
            this.y0 = y0;
            this.size = size;
            this.nbx = nbx;
            this.nby = nby;
            head = new int[nbx * nby];
            Arrays.fill(head, -1);
        }

        public boolean anyWithin(double[] e, double[] n, double x, double y, double r2) {
            int bx = (int) ((x - x0) / size), by = (int) ((y - y0) / size);
            for (int cy = Math.max(0, by - 1); cy <= Math.min(nby - 1, by + 1); cy++) {
                for (int cx = Math.max(0, bx - 1); cx <= Math.min(nbx - 1, bx + 1); cx++) {
                    for (int p = head[cy * nbx + cx]; p >= 0; p = next[p]) {
                        double dx = itemX[p] - x, dy = itemY[p] - y;
                        if (dx * dx + dy * dy <= r2) return true;
                    }
                }
            }
            return false;
        }

        public void add(int i, double x, double y) {
            if (count == next.length) {
                itemX = Arrays.copyOf(itemX, count * 2);
                itemY = Arrays.copyOf(itemY, count * 2);
                next = Arrays.copyOf(next, count * 2);
            }
            int b = (int) ((y - y0) / size) * nbx + (int) ((x - x0) / size);
            itemX[count] = x;
            itemY[count] = y;
            next[count] = head[b];
            head[b] = count++;
        }
    }

    /** Buckets in a hash map, for sparse data over a wide extent. */
    private static final class HashBuckets implements Buckets {
        final double size;
        final Map<Long, int[]> map = new HashMap<>();   // bucket -> [count, i0, i1, ...]

        HashBuckets(double size) { this.size = size; }

        public boolean anyWithin(double[] e, double[] n, double x, double y, double r2) {
            long bx = (long) Math.floor(x / size), by = (long) Math.floor(y / size);
            for (long dx = -1; dx <= 1; dx++) {
                for (long dy = -1; dy <= 1; dy++) {
                    int[] b = map.get(key(bx + dx, by + dy));
                    if (b == null) continue;
                    for (int j = 1; j <= b[0]; j++) {
                        double ex = e[b[j]] - x, ny = n[b[j]] - y;
                        if (ex * ex + ny * ny <= r2) return true;
                    }
                }
            }
            return false;
        }

        public void add(int i, double x, double y) {
            long bx = (long) Math.floor(x / size), by = (long) Math.floor(y / size);
            map.merge(key(bx, by), new int[]{1, i}, (a, unused) -> {
                int c = a[0] + 1;
                int[] b = c < a.length ? a : Arrays.copyOf(a, a.length * 2);
                b[c] = i;
                b[0] = c;
                return b;
            });
        }
    }

    /** Distinct buckets may share a key; that only adds candidates to check, never hides one. */
    private static long key(long bx, long by) { return bx * 0x9E3779B97F4A7C15L ^ by; }

    /**
     * Stable sort of indices by depth (ties keep index order). Large arrays: a stable counting
     * scatter into depth buckets (a monotone map of depth, so bucket order is depth order), then each
     * bucket sorted on its own; small arrays and unusual ranges: a parallel merge sort. A stable sort
     * has one result, so it is the same for any thread count and either way.
     */
    static void sortByDepth(int[] idx, double[] depth) {
        int len = idx.length;
        double[] key = new double[len];
        int block = 1 << 16;
        IntStream.range(0, (len + block - 1) / block).parallel().forEach(b -> {
            for (int i = b * block, end = Math.min(len, (b + 1) * block); i < end; i++) key[i] = depth[idx[i]];
        });
        if (len < (1 << 17) || !bucketSort(idx, key)) mergeSort(idx, key);
    }

    /** Bucket sort of idx by key (see {@link #sortByDepth}); false (nothing changed) when the keys do not suit it. */
    private static boolean bucketSort(int[] idx, double[] key) {
        int len = idx.length;
        final int parts = 8;                                  // fixed: the scatter does not depend on the cores
        int per = (len + parts - 1) / parts;
        double[][] mm = new double[parts][];
        IntStream.range(0, parts).parallel().forEach(t -> {
            double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
            for (int i = t * per, end = Math.min(len, (t + 1) * per); i < end; i++) {
                lo = Math.min(lo, key[i]);
                hi = Math.max(hi, key[i]);
            }
            mm[t] = new double[] {lo, hi};
        });
        double min = Double.POSITIVE_INFINITY, max = Double.NEGATIVE_INFINITY;
        for (double[] x : mm) { min = Math.min(min, x[0]); max = Math.max(max, x[1]); }
        if (!(max > min) || !Double.isFinite(max - min)) return false;
        final int nb = Integer.highestOneBit(Math.max(1024, Math.min(1 << 20, len / 16)));
        final double lo = min, scale = nb / (max - min);
        int[][] count = new int[parts][nb + 1];
        IntStream.range(0, parts).parallel().forEach(t -> {
            int[] c = count[t];
            for (int i = t * per, end = Math.min(len, (t + 1) * per); i < end; i++) c[bucket(key[i], lo, scale, nb)]++;
        });
        // start of each (bucket, part): buckets in order, parts in order within a bucket (stable)
        int[] bucketStart = new int[nb + 1];
        int run = 0;
        for (int b = 0; b < nb; b++) {
            bucketStart[b] = run;
            for (int t = 0; t < parts; t++) {
                int c = count[t][b];
                count[t][b] = run;
                run += c;
            }
        }
        bucketStart[nb] = run;
        int[] outIdx = new int[len];
        double[] outKey = new double[len];
        IntStream.range(0, parts).parallel().forEach(t -> {
            int[] pos = count[t];
            for (int i = t * per, end = Math.min(len, (t + 1) * per); i < end; i++) {
                int p = pos[bucket(key[i], lo, scale, nb)]++;
                outIdx[p] = idx[i];
                outKey[p] = key[i];
            }
        });
        // each bucket in place; idx and key serve as scratch (groups of buckets in parallel)
        int groups = 256;
        IntStream.range(0, groups).parallel().forEach(g -> {
            for (int b = (int) ((long) nb * g / groups), b1 = (int) ((long) nb * (g + 1) / groups); b < b1; b++) {
                int from = bucketStart[b], to = bucketStart[b + 1];
                if (to - from > 1) sortRange(outIdx, outKey, idx, key, from, to);
            }
        });
        System.arraycopy(outIdx, 0, idx, 0, len);
        return true;
    }

    /** Bucket of a key: non-decreasing in the key (floating-point subtraction, product and floor are monotone). */
    private static int bucket(double k, double lo, double scale, int nb) {
        int b = (int) ((k - lo) * scale);
        return b < 0 ? 0 : b >= nb ? nb - 1 : b;
    }

    /**
     * Stable bottom-up merge sort of idx by key that carries the keys beside the indices, so merging
     * reads memory in sequence; blocks are sorted in parallel, then merged pairwise (pairs in parallel).
     */
    private static void mergeSort(int[] idx, double[] key) {
        int len = idx.length;
        double[] keyTmp = new double[len];
        int[] tmp = new int[len];
        int blocks = 1;
        while (blocks < 64 && (long) len / (blocks * 2L) >= (1 << 16)) blocks *= 2;
        int width = (len + blocks - 1) / Math.max(1, blocks);
        int w0 = Math.max(1, width);
        IntStream.range(0, blocks).parallel().forEach(bl -> {
            int lo = Math.min(len, bl * w0), hi = Math.min(len, lo + w0);
            sortRange(idx, key, tmp, keyTmp, lo, hi);
        });
        int[] src = idx, dst = tmp;
        double[] ks = key, kd = keyTmp;
        for (int w = w0; w < len; w *= 2) {
            final int fw = w;
            final int[] s0 = src, d0 = dst;
            final double[] ks0 = ks, kd0 = kd;
            int pairs = (len + 2 * w - 1) / (2 * w);
            IntStream.range(0, pairs).parallel().forEach(pr -> {
                int lo = (int) Math.min(len, 2L * fw * pr);
                int mid = (int) Math.min(len, (long) lo + fw), hi = (int) Math.min(len, (long) lo + 2L * fw);
                merge(s0, ks0, d0, kd0, lo, mid, hi);
            });
            int[] si = src; src = dst; dst = si;
            double[] sk = ks; ks = kd; kd = sk;
        }
        if (src != idx) System.arraycopy(src, 0, idx, 0, len);
    }

    /** Sorts idx[lo, hi) by key[lo, hi) (stable); the result is left in idx and key. */
    private static void sortRange(int[] idx, double[] key, int[] tmp, double[] keyTmp, int lo0, int hi0) {
        final int run = 16;   // insertion sort of runs of 16, then bottom-up merges
        for (int lo = lo0; lo < hi0; lo += run) {
            int hi = Math.min(lo + run, hi0);
            for (int i = lo + 1; i < hi; i++) {
                double k = key[i];
                int v = idx[i], j = i - 1;
                while (j >= lo && key[j] > k) {
                    key[j + 1] = key[j];
                    idx[j + 1] = idx[j];
                    j--;
                }
                key[j + 1] = k;
                idx[j + 1] = v;
            }
        }
        int[] src = idx, dst = tmp;
        double[] ks = key, kd = keyTmp;
        int n = hi0 - lo0;
        for (int width = run; width < n; width *= 2) {
            for (int lo = lo0; lo < hi0; lo += 2 * width) {
                int mid = Math.min(lo + width, hi0), hi = Math.min(lo + 2 * width, hi0);
                merge(src, ks, dst, kd, lo, mid, hi);
            }
            int[] si = src; src = dst; dst = si;
            double[] sk = ks; ks = kd; kd = sk;
        }
        if (src != idx) {
            System.arraycopy(src, lo0, idx, lo0, n);
            System.arraycopy(ks, lo0, key, lo0, n);
        }
    }

    /** Merges the sorted runs [lo, mid) and [mid, hi) of src into dst; ties take the left run first. */
    private static void merge(int[] src, double[] ks, int[] dst, double[] kd, int lo, int mid, int hi) {
        int a = lo, b = mid, t = lo;
        while (a < mid && b < hi) {
            if (ks[b] < ks[a]) { kd[t] = ks[b]; dst[t++] = src[b++]; }
            else { kd[t] = ks[a]; dst[t++] = src[a++]; }
        }
        while (a < mid) { kd[t] = ks[a]; dst[t++] = src[a++]; }
        while (b < hi) { kd[t] = ks[b]; dst[t++] = src[b++]; }
    }
}
