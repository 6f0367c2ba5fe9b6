package org.leadline.surface;

import org.junit.jupiter.api.Test;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

/** Per-cell statistics and the uncertainty layer, worked by hand in this test. */
class GridderTest {
    // three soundings in cell (0,0) of a 2 x 1 grid, one rejected sounding, one outside
    static final GridSpec SPEC = new GridSpec(0, 10, 10, 2, 1);
    static final double[] E = {1, 2, 3, 4, 50};
    static final double[] N = {5, 5, 5, 5, 5};
    static final boolean[] ACC = {true, true, true, false, true};

    private static Grid grid(double[] depth, double[] tvu, Gridder.Method m) {
        return Gridder.build(SPEC, null, E, N, depth, tvu, ACC, m);
    }

    @Test
    void meanUncertaintyIsPropagatedWhenSpreadIsSmall() {
        double[] d = {10, 10, 10.01, 0, 0};
        double[] t = {0.5, 0.5, 0.5, 0.5, 0.5};
        Grid g = grid(d, t, Gridder.Method.MEAN);
        assertThat((double) g.layer(Grid.DEPTH)[0]).isCloseTo(10.003333, within(1e-5));
        assertThat(g.layer(Grid.COUNT)[0]).isEqualTo(3f);
        // sample sd of {10, 10, 10.01} = 0.0057735; propagated sqrt(3 * 0.25) / 3 = 0.288675
        assertThat((double) g.layer(Grid.STDDEV)[0]).isCloseTo(0.0057735, within(1e-6));
        assertThat((double) g.layer(Grid.UNCERTAINTY)[0]).isCloseTo(0.288675, within(1e-6));
        assertThat(g.layer(Grid.DEPTH)[1]).isNaN();
        assertThat(g.layer(Grid.COUNT)[1]).isZero();
    }

    @Test
    void medianUncertaintyScalesBySqrtHalfPi() {
        double[] d = {10, 10, 10.01, 0, 0};
        double[] t = {0.5, 0.5, 0.5, 0.5, 0.5};
        Grid g = grid(d, t, Gridder.Method.MEDIAN);
        assertThat(g.layer(Grid.DEPTH)[0]).isEqualTo(10f);
        assertThat((double) g.layer(Grid.UNCERTAINTY)[0]).isCloseTo(Math.sqrt(Math.PI / 2) * 0.288675, within(1e-6));
    }

    @Test
    void spreadDominatesWhenSoundingsDisagree() {
        double[] d = {10, 10.2, 10.4, 0, 0};
        double[] t = {0.2, 0.2, 0.2, 0.2, 0.2};
        Grid g = grid(d, t, Gridder.Method.MEAN);
        // 1.96 * 0.2 = 0.392 > sqrt(3 * 0.04) / 3 = 0.1155
        assertThat((double) g.layer(Grid.UNCERTAINTY)[0]).isCloseTo(0.392, within(1e-6));
    }

    @Test
    void weightedMeanUsesInverseVariance() {
        double[] d = {10, 10.2, 10.4, 0, 0};
        double[] t = {0.1, 0.2, 0.4, 0.2, 0.2};
        Grid g = grid(d, t, Gridder.Method.WEIGHTED);
        // weights 1/tvu^2 = 100, 25, 6.25: (1000 + 255 + 65) / 131.25 = 10.057143
        assertThat((double) g.layer(Grid.DEPTH)[0]).isCloseTo(10.057143, within(1e-5));
        // propagated 1 / sqrt(131.25) = 0.087287 < spread 0.392
        assertThat((double) g.layer(Grid.UNCERTAINTY)[0]).isCloseTo(0.392, within(1e-6));
        double[] flat = {10, 10, 10, 0, 0};
        Grid f = grid(flat, t, Gridder.Method.WEIGHTED);
        assertThat((double) f.layer(Grid.UNCERTAINTY)[0]).isCloseTo(1 / Math.sqrt(131.25), within(1e-7));
    }

    @Test
    void shoalestTakesLeastDepthAndItsTvuAndIsNeverRoundedDeeper() {
        double[] d = {10.3, 0.1, 10.2, 0.05, 0};
        double[] t = {0.3, 0.25, 0.2, 0.1, 0.1};
        Grid g = grid(d, t, Gridder.Method.SHOALEST);
        // (float) 0.1 = 0.100000001 is deeper than 0.1: the grid must hold the float below it
        assertThat((double) g.layer(Grid.DEPTH)[0]).isLessThanOrEqualTo(0.1).isCloseTo(0.1, within(1e-7));
        assertThat((double) g.layer(Grid.UNCERTAINTY)[0]).isGreaterThanOrEqualTo(0.25);
    }

    @Test
    void singleSoundingHasNoSpreadTerm() {
        double[] d = {10, 0, 0, 0, 0};
        boolean[] only = {true, false, false, false, false};
        Grid g = Gridder.build(SPEC, null, E, N, d, new double[]{0.3, 0, 0, 0, 0}, only, Gridder.Method.MEAN);
        assertThat(g.layer(Grid.STDDEV)[0]).isNaN();
        assertThat((double) g.layer(Grid.UNCERTAINTY)[0]).isCloseTo(0.3, within(1e-7));
        Grid noTvu = Gridder.build(SPEC, null, E, N, d, null, only, Gridder.Method.MEAN);
        assertThat(noTvu.layer(Grid.UNCERTAINTY)[0]).isNaN();
    }

    @Test
    void methodNamesParse() {
        assertThat(Gridder.Method.parse("Median")).isEqualTo(Gridder.Method.MEDIAN);
        assertThat(Gridder.Method.parse("cube")).isEqualTo(Gridder.Method.CUBE);
        assertThat(Gridder.Method.SHOALEST.label()).isEqualTo("shoalest");
        assertThatThrownBy(() -> Gridder.Method.parse("idw")).hasMessageContaining("found 'idw'");
        assertThatThrownBy(() -> grid(new double[5], null, Gridder.Method.WEIGHTED)).hasMessageContaining("TVU");
    }

    @Test
    void medianSelectionMatchesSorting() {
        java.util.Random rnd = new java.util.Random(7);
        for (int trial = 0; trial < 200; trial++) {
            int len = 1 + rnd.nextInt(40);
            double[] a = new double[len];
            for (int i = 0; i < len; i++) a[i] = rnd.nextInt(10);   // many ties
            double[] s = a.clone();
            java.util.Arrays.sort(s);
            double expect = len % 2 == 1 ? s[len / 2] : 0.5 * (s[len / 2 - 1] + s[len / 2]);
            assertThat(Select.median(a, 0, len)).isEqualTo(expect);
        }
    }

    @Test
    void soundingTableOverloadUsesStatusAndColumns() {
        org.leadline.survey.SoundingTable t = new org.leadline.survey.SoundingTable(4, java.util.List.of("L1"));
        double[] d = {10, 11, 30, 12};
        for (int i = 0; i < 4; i++) {
            t.easting[i] = 1 + i;
            t.northing[i] = 5;
            t.depth[i] = d[i];
            t.tvu[i] = 0.2;
            t.thu[i] = 0.5;
        }
        t.reject(2, org.leadline.survey.SoundingTable.Reason.SPIKE);
        Grid g = Gridder.build(SPEC, null, t, Gridder.Method.MEDIAN);
        assertThat(g.layer(Grid.COUNT)[0]).isEqualTo(3f);
        assertThat(g.layer(Grid.DEPTH)[0]).isEqualTo(11f);
        Grid c = Gridder.build(SPEC, null, t, Gridder.Method.CUBE);
        assertThat(c.layer(Grid.COUNT)[0]).isEqualTo(3f);
        assertThat((double) c.layer(Grid.DEPTH)[0]).isBetween(10.0, 12.0);
        // before uncertainty is estimated (TVU NaN) the TVU-based methods refuse instead of gridding nothing
        java.util.Arrays.fill(t.tvu, Double.NaN);
        org.assertj.core.api.Assertions.assertThatThrownBy(() -> Gridder.build(SPEC, null, t, Gridder.Method.WEIGHTED))
                .hasMessageContaining("none of 3 accepted soundings has a finite positive TVU");
        assertThat(Gridder.build(SPEC, null, t, Gridder.Method.MEAN).layer(Grid.DEPTH)[0]).isEqualTo(11f);
    }
}
