package org.leadline.watercolumn;

import org.junit.jupiter.api.Test;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

class SoundSpeedEquationTest {
    private static double t90(double t68) { return t68 / 1.00024; }

    @Test
    void chenMilleroIpts68MatchesUnesco44CheckValue() {
        // UNESCO 1983 (Tech. Pap. Mar. Sci. 44), SVEL check value: S=40, T68=40 degC, p=10000 dbar -> 1731.995 m/s
        assertThat(SoundSpeedEquation.chenMilleroIts68(40, 40, 10000)).isCloseTo(1731.995, within(0.0005));
    }

    @Test
    void wongZhuIts90CoefficientsReproduceTheIpts68Equation() {
        // Wong and Zhu 1995 refitted Chen-Millero to ITS-90 so that c(T90) = c_68(T68 = 1.00024 T90).
        // At the UNESCO 44 check point (S=40, T68=40, 10000 dbar, 1731.995 m/s) the published 5-digit
        // coefficients give 1732.0037 m/s at T90 = 40/1.00024 (measured here): the check value is met
        // to 0.01 m/s at this corner of the range, the refit's rounding at its most extreme point.
        assertThat(SoundSpeedEquation.UNESCO.speed(t90(40), 40, 10000, Double.NaN)).isCloseTo(1731.995, within(0.01));
        // Over the whole range (5 degC, 5, 1000 dbar grid) the two forms agree to 0.012 m/s: measured max 0.0095 m/s,
        // again at T = 40 degC, S = 40 (2000 dbar), where the refit's 5-digit coefficients are least exact.
        double worst = 0;
        for (double t68 = 0; t68 <= 40; t68 += 5) {
            for (double s = 0; s <= 40; s += 5) {
                for (double p = 0; p <= 10000; p += 1000) {
                    double d = SoundSpeedEquation.UNESCO.speed(t90(t68), s, p, 0) - SoundSpeedEquation.chenMilleroIts68(t68, s, p);
                    worst = Math.max(worst, Math.abs(d));
                }
            }
        }
        assertThat(worst).isLessThan(0.012);
    }

    @Test
    void mackenzieCheckValues() {
        // Mackenzie 1981 (J. Acoust. Soc. Am. 70, 807) check value T=25 degC, S=35, D=1000 m -> 1550.744 m/s
        // (from memory; worked by hand in this test: 1448.96 + 114.775 - 33.15 + 3.709375 + 16.30 + 0.1675
        // - 0.0178475 = 1550.7440275). Temperature of the paper is IPTS-68.
        assertThat(SoundSpeedEquation.MACKENZIE.speed(t90(25), 35, Double.NaN, 1000)).isCloseTo(1550.7440275, within(1e-9));
        // Check value printed with the MBARI Sndspd implementation of Mackenzie 1981: S=40, T=40, Z=10000 m -> 1718.774
        // (outside the validity range, a test of the polynomial only)
        assertThat(SoundSpeedEquation.MACKENZIE.speed(t90(40), 40, Double.NaN, 10000)).isCloseTo(1718.774, within(0.0005));
    }

    @Test
    void coppensCheckValue() {
        // Coppens 1981 (J. Acoust. Soc. Am. 69, 862): T=8 degC, D=1000 m, S=34 -> 1497.7 m/s, the example of the
        // animal-tag tools' sound_speed documentation; worked by hand in this test to 1497.70816:
        // 1449.05 + 36.56 - 3.3344 + 0.11776 - 1.23796 + 16.4324 + 0.133 - 0.01264
        assertThat(SoundSpeedEquation.COPPENS.speed(t90(8), 34, Double.NaN, 1000)).isCloseTo(1497.70816, within(1e-9));
    }

    @Test
    void delGrossoWorkedByHandAndAgainstUnesco() {
        // Del Grosso 1974, ITS-90 coefficients of Wong and Zhu 1995, at p = 0, T = 10, S = 35, worked by hand in this test:
        // 1402.392 + (50.12285 - 5.51184 + 0.221649) + (46.53355 + 0.15785326) - 4.465776 + 0.33909544 = 1489.789382
        assertThat(SoundSpeedEquation.DEL_GROSSO.speed(10, 35, 0, Double.NaN)).isCloseTo(1489.789381, within(1e-5));
        // Del Grosso and Chen-Millero differ by up to about 0.6-1 m/s at high pressure, Chen-Millero being the faster
        // (Dushaw et al. 1993, J. Acoust. Soc. Am. 93, 255; from memory); near the surface by a few cm/s.
        // Bound over ocean water (T <= 30 near the surface, <= 5 degC below 2000 dbar): measured max 1.08 m/s.
        double worst = 0, worstSurface = 0;
        for (double t = 0; t <= 30; t += 5) {
            for (double s = 30; s <= 40; s += 2.5) {
                for (double p = 0; p <= 9000; p += 500) {
                    if (p > 2000 && t > 5 || p > 1000 && t > 15) continue;
                    double d = SoundSpeedEquation.DEL_GROSSO.speed(t, s, p, 0) - SoundSpeedEquation.UNESCO.speed(t, s, p, 0);
                    worst = Math.max(worst, Math.abs(d));
                    if (p == 0) worstSurface = Math.max(worstSurface, Math.abs(d));
                }
            }
        }
        assertThat(worst).isLessThan(1.2).isGreaterThan(0.3);
        assertThat(worstSurface).isLessThan(0.2);
    }

    @Test
    void depthEquationsAgreeWithUnescoInTheUpperOcean() {
        // Mackenzie and Coppens fitted depth-based forms to ocean data; in the upper 1000 m of ocean water
        // (T falling from 30 degC at the surface to 10 degC at 1000 m) they agree with Chen-Millero to
        // better than 0.35 m/s (measured max 0.32 m/s for Mackenzie, 0.26 m/s for Coppens).
        for (double t = 2; t <= 30; t += 4) {
            for (double s = 30; s <= 40; s += 5) {
                for (double z = 0; z <= 1000; z += 250) {
                    if (t > 30 - 0.02 * z) continue;
                    double p = PressureDepth.pressure(z, 45);
                    double u = SoundSpeedEquation.UNESCO.speed(t, s, p, z);
                    assertThat(SoundSpeedEquation.MACKENZIE.speed(t, s, p, z)).isCloseTo(u, within(0.35));
                    assertThat(SoundSpeedEquation.COPPENS.speed(t, s, p, z)).isCloseTo(u, within(0.35));
                }
            }
        }
    }

    @Test
    void rangeWarningsNameTheVariable() {
        assertThat(SoundSpeedEquation.UNESCO.rangeWarning(10, 35, 100, 99)).isEmpty();
        assertThat(SoundSpeedEquation.MACKENZIE.rangeWarning(10, 5, 0, 10)).get().asString()
                .contains("salinity 5 outside 25..40").contains("Mackenzie 1981");
        assertThat(SoundSpeedEquation.DEL_GROSSO.rangeWarning(35, 35, 100, 0)).get().asString()
                .contains("temperature 35 deg C outside 0..30");
        assertThat(SoundSpeedEquation.COPPENS.rangeWarning(10, 35, 0, 4500)).get().asString().contains("depth 4500 m");
        assertThat(SoundSpeedEquation.UNESCO.rangeWarning(10, 35, 12000, 0)).get().asString().contains("pressure 12000 dbar");
        // never throws, returns a value out of range
        assertThat(SoundSpeedEquation.UNESCO.speed(45, 50, 12000, 0)).isFinite();
    }

    @Test
    void parseNames() {
        assertThat(SoundSpeedEquation.parse("unesco")).isEqualTo(SoundSpeedEquation.UNESCO);
        assertThat(SoundSpeedEquation.parse("Del-Grosso")).isEqualTo(SoundSpeedEquation.DEL_GROSSO);
        assertThat(SoundSpeedEquation.parse("mackenzie")).isEqualTo(SoundSpeedEquation.MACKENZIE);
        assertThat(SoundSpeedEquation.parse("coppens")).isEqualTo(SoundSpeedEquation.COPPENS);
        for (SoundSpeedEquation e : SoundSpeedEquation.values()) assertThat(SoundSpeedEquation.parse(e.cliName())).isEqualTo(e);
        assertThatThrownBy(() -> SoundSpeedEquation.parse("wilson"))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("unesco, del-grosso, mackenzie, coppens");
    }
}
