package org.leadline.surface;

import org.junit.jupiter.api.Test;

import java.util.Arrays;
import java.util.SplittableRandom;

import static org.assertj.core.api.Assertions.assertThat;

/** Quickselect and the median (GMT blockmedian's rule: mean of the two middle values for an even count). */
class SelectTest {
    @Test
    void medianIsTheSortedMiddleForSmallAndLargeSlices() {
        SplittableRandom rnd = new SplittableRandom(7);
        for (int trial = 0; trial < 20_000; trial++) {
            int n = 1 + rnd.nextInt(trial < 10_000 ? 20 : 200);   // both sides of the small-slice path
            int from = rnd.nextInt(3);
            double[] a = new double[from + n + 2];
            for (int i = 0; i < a.length; i++) a[i] = rnd.nextInt(4) == 0 ? rnd.nextInt(5) : rnd.nextGaussian() * 10;
            double[] sorted = Arrays.copyOfRange(a, from, from + n);
            Arrays.sort(sorted);
            // worked by hand: the middle of the sorted slice, or the mean of the two middles
            double expected = (n & 1) == 1 ? sorted[n / 2] : 0.5 * (sorted[n / 2 - 1] + sorted[n / 2]);
            double before = a[0], after = a[a.length - 1];
            assertThat(Select.median(a, from, from + n)).isEqualTo(expected);
            if (from > 0) assertThat(a[0]).isEqualTo(before);   // nothing outside the slice moves
            assertThat(a[a.length - 1]).isEqualTo(after);
        }
    }

    @Test
    void kthPlacesTheKthSmallest() {
        SplittableRandom rnd = new SplittableRandom(11);
        for (int trial = 0; trial < 2000; trial++) {
            int n = 1 + rnd.nextInt(100);
            double[] a = new double[n];
            for (int i = 0; i < n; i++) a[i] = rnd.nextInt(20);
            double[] sorted = a.clone();
            Arrays.sort(sorted);
            int k = rnd.nextInt(n);
            assertThat(Select.kth(a, 0, n, k)).isEqualTo(sorted[k]);
            for (int i = 0; i < k; i++) assertThat(a[i]).isLessThanOrEqualTo(a[k]);
            for (int i = k + 1; i < n; i++) assertThat(a[i]).isGreaterThanOrEqualTo(a[k]);
        }
    }
}
