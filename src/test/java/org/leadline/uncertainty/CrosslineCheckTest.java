package org.leadline.uncertainty;

import org.junit.jupiter.api.Test;

import java.util.function.DoubleUnaryOperator;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

class CrosslineCheckTest {
    /** IHO S-44 ed. 6.0 Order 1a TVU limit, a = 0.5 m, b = 0.013 (from memory). */
    static final DoubleUnaryOperator ORDER_1A = d -> Math.sqrt(0.5 * 0.5 + (0.013 * d) * (0.013 * d));

    /**
     * Worked by hand in this test. Surface: 4 m for easting below 10, 12 m from 10 to 100, none
     * beyond. Crossline: (1, 4.1) (2, 3.8) (3, 4.6) (20, 12.3) (21, 11.9), plus one beyond the
     * surface and one without a depth. Differences 0.1, -0.2, 0.6 (band 0-5) and 0.3, -0.1
     * (band 10-20). Order 1a limits: sqrt(0.25 + 0.052^2) = 0.5027 m at 4 m, 0.5238 m at 12 m,
     * so only 0.6 is outside.
     * All: mean 0.7/5 = 0.14; squared deviations 0.0016 + 0.1156 + 0.2116 + 0.0256 + 0.0576 =
     * 0.412, / 4 = 0.103, sd = 0.320936; share 4/5.
     * 0-5 m: mean 0.5/3 = 0.166667; squares 0.004444 + 0.134444 + 0.187778 = 0.326667, / 2,
     * sd = 0.404145; share 2/3. 10-20 m: mean 0.1, sd sqrt(0.08) = 0.282843, share 1.
     */
    @Test
    void handWorkedExample() {
        double[] e = {1, 2, 3, 20, 21, 200, 5};
        double[] n = {0, 0, 0, 0, 0, 0, 0};
        double[] d = {4.1, 3.8, 4.6, 12.3, 11.9, 30, Double.NaN};
        CrosslineResult r = CrosslineCheck.compare(e, n, d,
                (x, y) -> x < 10 ? 4.0 : x <= 100 ? 12.0 : Double.NaN, ORDER_1A);
        assertThat(r.unmatched()).isEqualTo(2);
        CrosslineResult.Stats all = r.overall();
        assertThat(all.count()).isEqualTo(5);
        assertThat(all.meanDifference()).isCloseTo(0.14, within(1e-12));
        assertThat(all.standardDeviation()).isCloseTo(0.320936, within(1e-6));
        assertThat(all.shareWithinLimit()).isCloseTo(0.8, within(1e-12));

        assertThat(r.bands()).extracting(CrosslineResult.Stats::label)
                .containsExactly("0-5 m", "5-10 m", "10-20 m", "20-50 m", "50+ m");
        CrosslineResult.Stats b0 = r.bands().get(0);
        assertThat(b0.count()).isEqualTo(3);
        assertThat(b0.meanDifference()).isCloseTo(0.166667, within(1e-6));
        assertThat(b0.standardDeviation()).isCloseTo(0.404145, within(1e-6));
        assertThat(b0.shareWithinLimit()).isCloseTo(2 / 3.0, within(1e-12));
        CrosslineResult.Stats b2 = r.bands().get(2);
        assertThat(b2.count()).isEqualTo(2);
        assertThat(b2.meanDifference()).isCloseTo(0.1, within(1e-12));
        assertThat(b2.standardDeviation()).isCloseTo(0.282843, within(1e-6));
        assertThat(b2.shareWithinLimit()).isEqualTo(1.0);
        CrosslineResult.Stats b1 = r.bands().get(1);
        assertThat(b1.count()).isZero();
        assertThat(b1.meanDifference()).isNaN();
        assertThat(b1.shareWithinLimit()).isNaN();
    }

    /** Band edges worked by hand: 5 m belongs to 5-10, a drying -0.5 m to the first band, 50 to 50+. */
    @Test
    void bandEdges() {
        assertThat(CrosslineCheck.bandOf(-0.5)).isEqualTo(0);
        assertThat(CrosslineCheck.bandOf(4.999)).isEqualTo(0);
        assertThat(CrosslineCheck.bandOf(5)).isEqualTo(1);
        assertThat(CrosslineCheck.bandOf(19.9)).isEqualTo(2);
        assertThat(CrosslineCheck.bandOf(50)).isEqualTo(4);
        assertThat(CrosslineCheck.bandOf(3000)).isEqualTo(4);
    }

    /** Deep water, worked by hand: differences 0.1, 0.2, 0.3 m at 20 km depth have mean 0.2 and sd 0.1, all in 50+. */
    @Test
    void deepSoundingsGoToTheLastBand() {
        double[] d = {10000.1 + 1e4, 10000.2 + 1e4, 10000.3 + 1e4};
        CrosslineResult r = CrosslineCheck.compare(new double[3], new double[3], d, (x, y) -> 2e4, x -> 0.25);
        assertThat(r.overall().meanDifference()).isCloseTo(0.2, within(1e-9));
        assertThat(r.overall().standardDeviation()).isCloseTo(0.1, within(1e-9));
        assertThat(r.bands().get(4).count()).isEqualTo(3);
        assertThat(r.overall().shareWithinLimit()).isCloseTo(2 / 3.0, within(1e-12)); // 0.3 > 0.25
    }
}
