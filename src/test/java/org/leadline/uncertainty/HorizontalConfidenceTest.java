package org.leadline.uncertainty;

import org.junit.jupiter.api.Test;

import java.util.Arrays;
import java.util.SplittableRandom;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

class HorizontalConfidenceTest {

    @Test
    void circularErrorIsRayleigh() {
        // Rayleigh distribution: P(R <= rho) = 1 - exp(-rho^2 / (2 sigma^2)) = 0.95
        // => rho = sigma sqrt(-2 ln 0.05) = 2.447747 sigma (worked by hand in this test)
        assertThat(HorizontalConfidence.radius95(1.0, 1.0)).isCloseTo(2.447747, within(1e-5));
        assertThat(HorizontalConfidence.radius95(0.3, 0.3)).isCloseTo(0.3 * 2.447747, within(1e-5));
    }

    @Test
    void oneDimensionalErrorIsNormal() {
        // two-sided 95 % point of the standard normal: 1.959964 (any statistics table)
        assertThat(HorizontalConfidence.radius95(2.0, 0.0)).isCloseTo(2 * 1.959964, within(1e-5));
        assertThat(HorizontalConfidence.radius95(0.0, 2.0)).isCloseTo(2 * 1.959964, within(1e-5));
        assertThat(HorizontalConfidence.radius95(0, 0)).isEqualTo(0);
        assertThat(HorizontalConfidence.radius95(Double.NaN, 1)).isNaN();
    }

    @Test
    void ellipticalErrorAgreesWithSampling() {
        // independent check: the 95th percentile of sampled radial errors, sigma 1 and 0.5
        SplittableRandom rnd = new SplittableRandom(7);
        int n = 400_000;
        double[] radius = new double[n];
        for (int i = 0; i < n; i++) {
            double x = gaussian(rnd), y = 0.5 * gaussian(rnd);
            radius[i] = Math.hypot(x, y);
        }
        Arrays.sort(radius);
        double sampled = radius[(int) (0.95 * n)];
        // sampling error of a 95th percentile at n = 400 000: about 0.003 sigma
        assertThat(HorizontalConfidence.radius95(1.0, 0.5)).isCloseTo(sampled, within(0.015));
        assertThat(HorizontalConfidence.radius95(1.0, 0.5)).isBetween(1.96, 2.4478);
    }

    static double gaussian(SplittableRandom r) {
        // Box-Muller; independent of the code under test
        double u = r.nextDouble(), v = r.nextDouble();
        return Math.sqrt(-2 * Math.log(1 - u)) * Math.cos(2 * Math.PI * v);
    }
}
