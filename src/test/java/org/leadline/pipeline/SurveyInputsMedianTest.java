package org.leadline.pipeline;

import static org.assertj.core.api.Assertions.assertThat;

import java.util.Arrays;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/** The selection median equals element n/2 of the sorted finite values (the definition it replaces a full sort for). */
class SurveyInputsMedianTest {
    @Test
    void selectionMatchesSortedElement() {
        SplittableRandom r = new SplittableRandom(9);
        for (int trial = 0; trial < 300; trial++) {
            int n = r.nextInt(1, 2000);
            double[] a = new double[n];
            for (int i = 0; i < n; i++) {
                a[i] = r.nextInt(10) == 0 ? Double.NaN : r.nextInt(4) == 0 ? r.nextInt(5) : 50 + r.nextGaussian();
            }
            double[] f = Arrays.stream(a).filter(Double::isFinite).sorted().toArray();
            double expected = f.length == 0 ? Double.NaN : f[f.length / 2];
            assertThat(SurveyInputs.median(a.clone())).isEqualTo(expected);
        }
        // worked by hand: finite values {1, 2, 3, 4} -> element 2 of the sorted list = 3
        assertThat(SurveyInputs.median(new double[]{4, Double.NaN, 1, 3, 2})).isEqualTo(3.0);
    }
}
