package org.leadline.surface;

import org.junit.jupiter.api.Test;

import java.util.Random;

import static org.assertj.core.api.Assertions.assertThat;

/** Properties of the shoal-biased selection on random data (stated in SoundingSelection). */
class SoundingSelectionTest {

    @Test
    void guaranteedPropertiesHoldOnRandomData() {
        Random r = new Random(5);
        for (int trial = 0; trial < 5; trial++) {
            int np = 8000;
            double[] e = new double[np], n = new double[np], d = new double[np];
            boolean[] acc = new boolean[np];
            for (int i = 0; i < np; i++) {
                e[i] = 500_000 + 200 * r.nextDouble();
                n[i] = -50 + 200 * r.nextDouble();   // negative northings: buckets below zero
                d[i] = Math.round((20 + 3 * r.nextGaussian()) * 10) / 10.0;   // ties at 0.1 m
                acc[i] = r.nextInt(10) != 0;
            }
            check(e, n, d, acc, 3 + trial);
        }
    }

    @Test
    void propertiesHoldForClustersFarApart() {
        // two clusters 5000 km apart: too wide for a dense bucket array, so the hashed buckets are used
        Random r = new Random(9);
        int np = 4000;
        double[] e = new double[np], n = new double[np], d = new double[np];
        for (int i = 0; i < np; i++) {
            double off = i % 2 == 0 ? 0 : 5_000_000;
            e[i] = off + 100 * r.nextDouble();
            n[i] = off + 100 * r.nextDouble();
            d[i] = Math.round((20 + 3 * r.nextGaussian()) * 10) / 10.0;
        }
        check(e, n, d, null, 2.5);
    }

    private static void check(double[] e, double[] n, double[] d, boolean[] acc, double radius) {
        int np = d.length;
        {
            int[] sel = SoundingSelection.select(e, n, d, acc, radius);
            boolean[] chosen = new boolean[np];
            for (int s : sel) {
                assertThat(acc == null || acc[s]).isTrue();
                chosen[s] = true;
            }
            // 1. selected soundings are more than the radius apart
            for (int a = 0; a < sel.length; a++) {
                for (int b = a + 1; b < sel.length; b++) {
                    assertThat(Math.hypot(e[sel[a]] - e[sel[b]], n[sel[a]] - n[sel[b]])).isGreaterThan(radius);
                }
            }
            // 2. every unselected accepted sounding has a selected one at least as shoal within the radius
            for (int i = 0; i < np; i++) {
                if ((acc != null && !acc[i]) || chosen[i]) continue;
                boolean covered = false;
                for (int s : sel) {
                    if (d[s] <= d[i] && Math.hypot(e[s] - e[i], n[s] - n[i]) <= radius) {
                        covered = true;
                        break;
                    }
                }
                assertThat(covered).as("sounding %d", i).isTrue();
            }
            // 3. the shoalest accepted sounding (first by index among ties) is selected, first
            int shoalest = -1;
            for (int i = 0; i < np; i++) {
                if ((acc == null || acc[i]) && (shoalest < 0 || d[i] < d[shoalest])) shoalest = i;
            }
            assertThat(sel[0]).isEqualTo(shoalest);
            // selection order is shoalest first
            for (int k = 1; k < sel.length; k++) assertThat(d[sel[k]]).isGreaterThanOrEqualTo(d[sel[k - 1]]);
            assertThat(sel.length).isGreaterThan(10);
        }
    }

    @Test
    void sameSelectionAsThePlainGreedyRule() {
        // the cover grid and the parallel sort are shortcuts: the result must be exactly that of the
        // rule in the class comment, applied literally (stable sort, test against every selected one)
        Random r = new Random(21);
        for (int trial = 0; trial < 4; trial++) {
            int np = 30_000 + trial * 20_000;
            double radius = 2 + trial;
            double[] e = new double[np], n = new double[np], d = new double[np];
            boolean[] acc = new boolean[np];
            for (int i = 0; i < np; i++) {
                // half the positions on multiples of radius / 8: soundings on the squares' edges
                boolean onEdge = i % 2 == 0;
                double x = 120 * r.nextDouble(), y = 80 * r.nextDouble();
                if (onEdge) { x = Math.floor(x / (radius / 8)) * (radius / 8); y = Math.floor(y / (radius / 8)) * (radius / 8); }
                e[i] = 400_000 + x;
                n[i] = 5_500_000 + y;
                d[i] = Math.round((20 + 2 * r.nextGaussian()) * 100) / 100.0;   // ties at 1 cm
                acc[i] = r.nextInt(20) != 0;
            }
            assertThat(SoundingSelection.select(e, n, d, acc, radius)).containsExactly(plainGreedy(e, n, d, acc, radius));
        }
    }

    private static int[] plainGreedy(double[] e, double[] n, double[] d, boolean[] acc, double radius) {
        java.util.List<Integer> order = new java.util.ArrayList<>();
        for (int i = 0; i < d.length; i++) if (acc[i]) order.add(i);
        order.sort(java.util.Comparator.comparingDouble((Integer i) -> d[i]));   // List.sort is stable
        java.util.List<Integer> sel = new java.util.ArrayList<>();
        for (int i : order) {
            boolean near = false;
            for (int s : sel) {
                double dx = e[s] - e[i], dy = n[s] - n[i];
                if (dx * dx + dy * dy <= radius * radius) { near = true; break; }
            }
            if (!near) sel.add(i);
        }
        return sel.stream().mapToInt(Integer::intValue).toArray();
    }

    @Test
    void chainShowsWhatIsNotGuaranteed() {
        // A (10 m) at 0, B (11 m) at 0.9, C (12 m) at 1.8, radius 1: A and C selected; B, shoaler than C,
        // lies within the radius of C (worked by hand in this test)
        int[] sel = SoundingSelection.select(new double[]{1.8, 0, 0.9}, new double[]{0, 0, 0},
                new double[]{12, 10, 11}, null, 1.0);
        assertThat(sel).containsExactly(1, 0);
    }

    @Test
    void depthSortIsStableAndOrdered() {
        Random r = new Random(13);
        for (int len : new int[]{0, 1, 15, 16, 17, 100, 1000, 4097, 140_001, 200_000, 300_000}) {
            double[] d = new double[len];
            for (int i = 0; i < len; i++) d[i] = r.nextInt(20);
            if (len == 300_000) for (int i = 0; i < len; i++) d[i] = i % 3 == 0 ? -0.0 : i % 3 == 1 ? 0.0 : -5 + r.nextGaussian();
            if (len == 140_001) d[7] = 1e6;   // one far outlier: nearly every sounding in one bucket
            int[] idx = new int[len];
            for (int i = 0; i < len; i++) idx[i] = i;
            SoundingSelection.sortByDepth(idx, d);
            for (int k = 1; k < len; k++) {
                assertThat(d[idx[k]]).isGreaterThanOrEqualTo(d[idx[k - 1]]);
                if (d[idx[k]] == d[idx[k - 1]]) assertThat(idx[k]).isGreaterThan(idx[k - 1]);
            }
        }
    }
}
