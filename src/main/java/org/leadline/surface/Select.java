package org.leadline.surface;

/**
 * In-place selection on a slice of a double array (Hoare's quickselect with median-of-three
 * pivots, C. A. R. Hoare 1961, "Algorithm 65: find", CACM 4(7)). Expected linear time; the slice
 * is reordered. Used by the gridder and by the cleaning filters.
 */
public final class Select {
    private Select() {}

    /**
     * The median of a[from, to): the middle value for an odd count, the mean of the two middle
     * values for an even count (the definition GMT's blockmedian uses; checked in
     * GridderGmtReferenceTest). Reorders the slice.
     */
    public static double median(double[] a, int from, int to) {
        int n = to - from;
        if (n <= 0) return Double.NaN;
        int mid = from + n / 2;
        if (n <= 16) {
            // small slices (the cleaning's moving windows, most grid cells): insertion sort beats
            // partitioning; the same two middle values, so the same median
            for (int i = from + 1; i < to; i++) {
                double v = a[i];
                int j = i - 1;
                while (j >= from && a[j] > v) {
                    a[j + 1] = a[j];
                    j--;
                }
                a[j + 1] = v;
            }
            return (n & 1) == 1 ? a[mid] : 0.5 * (a[mid - 1] + a[mid]);
        }
        double hi = kth(a, from, to, mid);
        if ((n & 1) == 1) return hi;
        // after selection every value left of mid is <= a[mid]: the lower middle is their maximum
        double lo = a[from];
        for (int i = from + 1; i < mid; i++) if (a[i] > lo) lo = a[i];
        return 0.5 * (lo + hi);
    }

    /** Places the k-th smallest of a[from, to) at a[k] (from <= k < to) and returns it. */
    public static double kth(double[] a, int from, int to, int k) {
        int lo = from, hi = to - 1;
        while (hi > lo) {
            int m = (lo + hi) >>> 1;
            // median of three to a[m]
            if (a[m] < a[lo]) swap(a, m, lo);
            if (a[hi] < a[lo]) swap(a, hi, lo);
            if (a[hi] < a[m]) swap(a, hi, m);
            double pivot = a[m];
            int i = lo, j = hi;
            while (i <= j) {
                while (a[i] < pivot) i++;
                while (a[j] > pivot) j--;
                if (i <= j) {
                    swap(a, i, j);
                    i++;
                    j--;
                }
            }
            if (k <= j) hi = j;
            else if (k >= i) lo = i;
            else return a[k];
        }
        return a[k];
    }

    private static void swap(double[] a, int i, int j) {
        double t = a[i];
        a[i] = a[j];
        a[j] = t;
    }
}
