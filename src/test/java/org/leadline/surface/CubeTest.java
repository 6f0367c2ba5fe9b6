package org.leadline.surface;

import org.junit.jupiter.api.Test;

import java.util.Random;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/**
 * CUBE (Calder and Mayer 2003, doi:10.1029/2002GC000486) keeps the seabed hypothesis when a fifth
 * of the soundings at a node come from mid-water targets (a fish school at half the depth), the
 * case the multiple-hypothesis design exists for (the paper's motivation, sect. 1-2).
 */
class CubeTest {
    static final GridSpec SPEC = new GridSpec(0, 6, 2, 3, 3);   // 3 x 3 nodes, 2 m cells; centre node (1, 1)

    @Test
    void nodeWithFishKeepsTheSeabedHypothesis() {
        int np = 500;
        Random r = new Random(3);
        double[] e = new double[np], n = new double[np], d = new double[np], t = new double[np];
        for (int i = 0; i < np; i++) {
            e[i] = 2 + 2 * r.nextDouble();   // inside the centre cell
            n[i] = 2 + 2 * r.nextDouble();
            boolean fish = i % 5 == 0;       // 20 %, and the very first sounding is a fish
            d[i] = fish ? 10 + 0.5 * r.nextGaussian() : 20 + 0.05 * r.nextGaussian();
            t[i] = 0.1;
        }
        Grid cube = Gridder.build(SPEC, null, e, n, d, t, null, Gridder.Method.CUBE);
        Grid mean = Gridder.build(SPEC, null, e, n, d, t, null, Gridder.Method.MEAN);
        int k = 1 * 3 + 1;
        // the mean is dragged 2 m shoal by the fish (0.8 * 20 + 0.2 * 10 = 18): the trap CUBE avoids
        assertThat((double) mean.layer(Grid.DEPTH)[k]).isCloseTo(18, within(0.1));
        assertThat((double) cube.layer(Grid.DEPTH)[k]).isCloseTo(20, within(0.02));
        assertThat(cube.layer(Cube.HYPOTHESES)[k]).isGreaterThanOrEqualTo(2f);
        // uncertainty of the chosen hypothesis reflects the seabed soundings only (1.96 * 0.05 ~ 0.1), not the fish
        assertThat((double) cube.layer(Grid.UNCERTAINTY)[k]).isBetween(0.05, 0.15);
        assertThat(cube.layer(Grid.COUNT)[k]).isEqualTo(500f);
        // nodes of empty cells stay empty even when soundings are within their capture radius
        assertThat(cube.layer(Grid.DEPTH)[0]).isNaN();
    }

    @Test
    void sameInputGivesTheSameSurface() {
        int np = 2000;
        Random r = new Random(11);
        double[] e = new double[np], n = new double[np], d = new double[np], t = new double[np];
        for (int i = 0; i < np; i++) {
            e[i] = 6 * r.nextDouble();
            n[i] = 6 * r.nextDouble();
            d[i] = 15 + 0.3 * r.nextGaussian() + (r.nextInt(7) == 0 ? -5 : 0);
            t[i] = 0.2;
        }
        Grid a = Gridder.build(SPEC, null, e, n, d, t, null, Gridder.Method.CUBE);
        Grid b = Gridder.build(SPEC, null, e, n, d, t, null, Gridder.Method.CUBE);
        assertThat(a.layer(Grid.DEPTH)).containsExactly(b.layer(Grid.DEPTH));
        assertThat(a.layer(Grid.UNCERTAINTY)).containsExactly(b.layer(Grid.UNCERTAINTY));
    }

    @Test
    void distanceInflatesTheVarianceAsDocumented() {
        // one sounding 1 m from its node, sigma_v = 0.1 m, cell 2 m, no THU:
        // sigma_n^2 = 0.01 * (1 + (1 / 2)^2) = 0.0125 (worked by hand), so the 95 % uncertainty of the
        // one-sounding hypothesis is 1.96 * sqrt(0.0125) = 0.21913
        double[] e = {3 + Math.sqrt(0.5)}, n = {3 + Math.sqrt(0.5)}, d = {20}, t = {0.196};
        Grid g = Gridder.build(SPEC, null, e, n, d, t, null, Gridder.Method.CUBE);
        assertThat((double) g.layer(Grid.UNCERTAINTY)[4]).isCloseTo(1.96 * Math.sqrt(0.0125), within(1e-6));
        assertThat(g.layer(Grid.DEPTH)[4]).isEqualTo(20f);
    }
}
