package org.leadline.watercolumn;

import org.junit.jupiter.api.Test;

import java.util.List;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

class SoundSpeedProfileTest {
    @Test
    void linearProfileMatchesClosedForm() {
        // c(z) = c0 + g z: one-way vertical time from 0 to z is ln(c(z)/c0)/g (integral of dz/c; Medwin and
        // Clay 1998, ch. 3), worked by hand in this test
        double c0 = 1480, g = 0.05, zMax = 200;
        SoundSpeedProfile p = new SoundSpeedProfile(new double[]{0, zMax}, new double[]{c0, c0 + g * zMax}, List.of());
        for (double z = 0.5; z <= zMax; z += 7.25) {
            double exact = Math.log((c0 + g * z) / c0) / g;
            assertThat(p.travelTime(0, z)).isCloseTo(exact, within(1e-9 * exact));
            // inverse: depth reached after that time
            assertThat(p.depthAfter(0, exact)).isCloseTo(z, within(1e-9 * z));
            // harmonic mean = distance / time
            assertThat(p.harmonicMeanSpeed(0, z)).isCloseTo(z / exact, within(1e-9 * c0));
        }
        // a negative gradient too (sound speed falling through a thermocline)
        SoundSpeedProfile q = new SoundSpeedProfile(new double[]{0, 50}, new double[]{1520, 1495}, List.of());
        double gq = -0.5, exact = Math.log((1520 + gq * 37) / 1520) / gq;
        assertThat(q.travelTime(0, 37)).isCloseTo(exact, within(1e-9 * exact));
        assertThat(q.depthAfter(0, exact)).isCloseTo(37, within(37e-9));
    }

    @Test
    void harmonicMeanOfMultiSegmentProfileIsSegmentWiseClosedForm() {
        double[] z = {0, 5, 12, 30, 80};
        double[] c = {1500, 1498, 1480, 1480, 1486};
        SoundSpeedProfile p = new SoundSpeedProfile(z, c, List.of());
        double za = 2, zb = 60;
        // segment-wise closed form, worked in this test: sum over layers of ln(c1/c0)/g (dz/c for g = 0)
        double t = 0;
        for (int i = 0; i + 1 < z.length; i++) {
            double a = Math.max(za, z[i]), b = Math.min(zb, z[i + 1]);
            if (b <= a) continue;
            double g = (c[i + 1] - c[i]) / (z[i + 1] - z[i]);
            double ca = c[i] + g * (a - z[i]), cb = c[i] + g * (b - z[i]);
            t += g == 0 ? (b - a) / ca : Math.log(cb / ca) / g;
        }
        assertThat(p.travelTime(za, zb)).isCloseTo(t, within(1e-9 * t));
        assertThat(p.harmonicMeanSpeed(za, zb)).isCloseTo((zb - za) / t, within(1e-9 * 1500));
        assertThat(p.depthAfter(za, t)).isCloseTo(zb, within(1e-9 * zb));
        // below the last sample the speed is held constant
        assertThat(p.travelTime(80, 100)).isCloseTo(20 / 1486.0, within(1e-15));
    }

    @Test
    void speedAtIsLinearInterpolationInTheRightSegment() {
        // the segment look-up table is a shortcut: every value must be the interpolation in the
        // segment found by a plain scan (largest sample depth <= z), bit for bit; regular 1 m casts,
        // clustered samples (long walks: binary search) and depths on the samples and on zero
        java.util.Random r = new java.util.Random(11);
        for (int trial = 0; trial < 6; trial++) {
            int n = 3 + r.nextInt(300);
            double[] z = new double[n], c = new double[n];
            double d = trial % 2 == 0 ? -2 : 0.5;
            for (int k = 0; k < n; k++) {
                z[k] = d;
                c[k] = 1480 + 40 * r.nextDouble();
                d += trial < 3 ? 1.0 : (k < n / 2 ? 1e-3 * (1 + r.nextDouble()) : 5 * r.nextDouble() + 0.01);
            }
            SoundSpeedProfile p = new SoundSpeedProfile(z, c, List.of());
            for (int q = 0; q < 20_000; q++) {
                double at = q % 10 == 0 ? z[r.nextInt(n)] : q % 97 == 0 ? 0.0 : z[0] + (z[n - 1] - z[0]) * r.nextDouble();
                double expected;
                if (at <= z[0]) expected = c[0];
                else if (at >= z[n - 1]) expected = c[n - 1];
                else {
                    int i = 0;
                    while (i < n - 2 && z[i + 1] <= at) i++;
                    double f = (at - z[i]) / (z[i + 1] - z[i]);
                    expected = c[i] + f * (c[i + 1] - c[i]);
                }
                assertThat(Double.doubleToRawLongBits(p.speedAt(at))).as("z %s", at).isEqualTo(Double.doubleToRawLongBits(expected));
            }
        }
    }
}
