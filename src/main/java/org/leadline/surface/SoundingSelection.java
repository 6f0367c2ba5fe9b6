package org.leadline.surface;

import java.util.Arrays;
import java.util.HashMap;
import java.util.Map;

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
 * <p>Speed: O(n log n) for the stable sort by depth, then a hash of radius-sized buckets makes each
 * test look at the 3 x 3 neighbouring buckets only.
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
        int[] idx = new int[size];
        int m = 0;
        for (int i = 0; i < size; i++) {
            if ((accepted == null || accepted[i]) && Double.isFinite(depth[i]) && Double.isFinite(e[i])
                    && Double.isFinite(n[i])) {
                idx[m++] = i;
            }
        }
        idx = Arrays.copyOf(idx, m);
        sortByDepth(idx, depth);

        double r2 = radius * radius;
        double minE = Double.POSITIVE_INFINITY, minN = Double.POSITIVE_INFINITY;
        double maxE = Double.NEGATIVE_INFINITY, maxN = Double.NEGATIVE_INFINITY;
        for (int i : idx) {
            minE = Math.min(minE, e[i]);
            maxE = Math.max(maxE, e[i]);
            minN = Math.min(minN, n[i]);
            maxN = Math.max(maxN, n[i]);
        }
        double nbxD = Math.floor((maxE - minE) / radius) + 1, nbyD = Math.floor((maxN - minN) / radius) + 1;
        Buckets buckets = m > 0 && nbxD * nbyD <= Math.max(4.0 * m, 1 << 20)
                ? new DenseBuckets(minE, minN, radius, (int) nbxD, (int) nbyD) : new HashBuckets(radius);
        int[] out = new int[Math.min(m, 1024)];
        int k = 0;
        for (int i : idx) {
            if (buckets.anyWithin(e, n, e[i], n[i], r2)) continue;
            if (k == out.length) out = Arrays.copyOf(out, out.length * 2);
            out[k++] = i;
            buckets.add(i, e[i], n[i]);
        }
        return Arrays.copyOf(out, k);
    }

    /** Selected soundings by square buckets of the radius's size: a neighbour lies in the 3 x 3 block. */
    private interface Buckets {
        boolean anyWithin(double[] e, double[] n, double x, double y, double r2);

        void add(int i, double x, double y);
    }

    /** A dense bucket array over the data's extent, each bucket a linked list through next[]. */
    private static final class DenseBuckets implements Buckets {
        final double x0, y0, size;
        final int nbx, nby;
        final int[] head;
        int[] next = new int[1024], item = new int[1024];
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
                        int s = item[p];
                        double dx = e[s] - x, dy = n[s] - y;
                        if (dx * dx + dy * dy <= r2) return true;
                    }
                }
            }
            return false;
        }

        public void add(int i, double x, double y) {
            if (count == item.length) {
                item = Arrays.copyOf(item, count * 2);
                next = Arrays.copyOf(next, count * 2);
            }
            int b = (int) ((y - y0) / size) * nbx + (int) ((x - x0) / size);
            item[count] = i;
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
     * Stable sort of indices by depth (ties keep index order): bottom-up merge sort that carries the
     * depth keys beside the indices, so merging reads memory in sequence instead of depth[idx[i]].
     */
    static void sortByDepth(int[] idx, double[] depth) {
        int len = idx.length;
        double[] key = new double[len], keyTmp = new double[len];
        int[] tmp = new int[len];
        for (int i = 0; i < len; i++) key[i] = depth[idx[i]];
        // insertion sort of runs of 16
        final int run = 16;
        for (int lo = 0; lo < len; lo += run) {
            int hi = Math.min(lo + run, len);
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
        for (int width = run; width < len; width *= 2) {
            for (int lo = 0; lo < len; lo += 2 * width) {
                int mid = Math.min(lo + width, len), hi = Math.min(lo + 2 * width, len);
                int a = lo, b = mid, t = lo;
                while (a < mid && b < hi) {
                    if (ks[b] < ks[a]) { kd[t] = ks[b]; dst[t++] = src[b++]; }
                    else { kd[t] = ks[a]; dst[t++] = src[a++]; }
                }
                while (a < mid) { kd[t] = ks[a]; dst[t++] = src[a++]; }
                while (b < hi) { kd[t] = ks[b]; dst[t++] = src[b++]; }
            }
            int[] si = src; src = dst; dst = si;
            double[] sk = ks; ks = kd; kd = sk;
        }
        if (src != idx) System.arraycopy(src, 0, idx, 0, len);
    }
}
