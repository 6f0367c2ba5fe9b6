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
        Map<Long, int[]> buckets = new HashMap<>();   // bucket -> [count, i0, i1, ...]
        int[] out = new int[Math.min(m, 1024)];
        int k = 0;
        for (int i : idx) {
            long bx = (long) Math.floor(e[i] / radius), by = (long) Math.floor(n[i] / radius);
            boolean near = false;
            for (long dx = -1; dx <= 1 && !near; dx++) {
                for (long dy = -1; dy <= 1 && !near; dy++) {
                    int[] b = buckets.get(key(bx + dx, by + dy));
                    if (b == null) continue;
                    for (int j = 1; j <= b[0]; j++) {
                        int s = b[j];
                        double ex = e[s] - e[i], ny = n[s] - n[i];
                        if (ex * ex + ny * ny <= r2) {
                            near = true;
                            break;
                        }
                    }
                }
            }
            if (near) continue;
            if (k == out.length) out = Arrays.copyOf(out, out.length * 2);
            out[k++] = i;
            buckets.merge(key(bx, by), new int[]{1, i}, (a, unused) -> {
                int c = a[0] + 1;
                int[] b = c < a.length ? a : Arrays.copyOf(a, a.length * 2);
                b[c] = i;
                b[0] = c;
                return b;
            });
        }
        return Arrays.copyOf(out, k);
    }

    private static long key(long bx, long by) { return bx * 0x9E3779B97F4A7C15L ^ by; }

    /** Stable merge sort of indices by depth (ties keep index order). */
    static void sortByDepth(int[] idx, double[] depth) {
        int[] tmp = new int[idx.length];
        for (int width = 1; width < idx.length; width *= 2) {
            for (int lo = 0; lo < idx.length - width; lo += 2 * width) {
                int mid = lo + width, hi = Math.min(lo + 2 * width, idx.length);
                if (depth[idx[mid - 1]] <= depth[idx[mid]]) continue;   // already in order
                int a = lo, b = mid, t = lo;
                while (a < mid && b < hi) tmp[t++] = depth[idx[b]] < depth[idx[a]] ? idx[b++] : idx[a++];
                while (a < mid) tmp[t++] = idx[a++];
                while (b < hi) tmp[t++] = idx[b++];
                System.arraycopy(tmp, lo, idx, lo, hi - lo);
            }
        }
    }
}
