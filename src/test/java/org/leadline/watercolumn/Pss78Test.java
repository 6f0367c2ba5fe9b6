package org.leadline.watercolumn;

import org.junit.jupiter.api.Test;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

class Pss78Test {
    @Test
    void unesco44CheckValue() {
        // UNESCO 1983 (Tech. Pap. Mar. Sci. 44), SAL78 check value: R = 1.888091, T68 = 40 degC, p = 10000 dbar -> S = 40.0000
        assertThat(Pss78.salinity(1.888091, Temperature.its68ToIts90(40), 10000)).isCloseTo(40.0000, within(5e-5));
    }

    @Test
    void standardSeawaterDefinesTheScale() {
        // PSS-78 definition (Lewis and Perkin 1981): K15 = 1 (R = 1 at T68 = 15 degC, p = 0) is S = 35
        // (the a-coefficients sum to 35.0000; the published rt(T) polynomial gives rt(15) = 0.99999998,
        // hence 34.99999992, worked by hand in this test)
        assertThat(Pss78.salinity(1.0, Temperature.its68ToIts90(15), 0)).isCloseTo(35.0, within(1e-7));
        assertThat(Pss78.salinityFromConductivity(42.914, Temperature.its68ToIts90(15), 0)).isCloseTo(35.0, within(1e-7));
    }

    @Test
    void inverseIsConsistent() {
        double worst = 0;
        for (double s : new double[]{0.001, 0.01, 0.1, 0.5, 1, 1.999, 2, 2.001, 5, 10, 20, 30, 35, 40, 42}) {
            for (double t = -2; t <= 35; t += 3.7) {
                for (double p : new double[]{0, 10, 100, 1000, 5000, 10000}) {
                    double r = Pss78.conductivityRatio(s, t, p);
                    worst = Math.max(worst, Math.abs(Pss78.salinity(r, t, p) - s));
                }
            }
        }
        assertThat(worst).isLessThan(1e-10);
        assertThat(Pss78.conductivityRatio(0, 10, 0)).isEqualTo(0.0);
    }

    @Test
    void hillExtensionIsContinuousAtTwo() {
        // Hill et al. 1986 as scaled in TEOS-10: no step at S = 2
        for (double t = 0; t <= 30; t += 10) {
            double r = Pss78.conductivityRatio(2.0, t, 0);
            assertThat(Pss78.salinity(r * (1 - 1e-9), t, 0)).isCloseTo(2.0, within(1e-7));
            assertThat(Pss78.salinity(r * (1 + 1e-9), t, 0)).isCloseTo(2.0, within(1e-7));
        }
        assertThat(Pss78.salinity(0, 10, 0)).isCloseTo(0.0, within(1e-15));
        assertThat(Pss78.salinity(Double.NaN, 10, 0)).isNaN();
    }
}
