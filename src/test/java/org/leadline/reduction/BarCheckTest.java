package org.leadline.reduction;

import org.junit.jupiter.api.Test;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

class BarCheckTest {

    @Test
    void recoversScaleAndIndexFromExactReadings() {
        // A sounder set to 1500 m/s in water whose mean speed is 1480 m/s reads depth*1500/1480;
        // with an index error of +0.05 m the model barDepth = ic + scale*reading holds exactly with
        // scale = 1480/1500 and ic = -0.05*scale (common practice: the bar check model).
        double[] bar = {2, 4, 6, 8, 10, 12};
        double[] reading = new double[bar.length];
        for (int i = 0; i < bar.length; i++) reading[i] = bar[i] * 1500.0 / 1480.0 + 0.05;
        BarCheck.Result r = BarCheck.fit(bar, reading);
        assertThat(r.scale()).isCloseTo(1480.0 / 1500.0, within(1e-12));
        assertThat(r.indexCorrection()).isCloseTo(-0.05 * 1480.0 / 1500.0, within(1e-12));
        assertThat(r.impliedSoundSpeed(1500)).isCloseTo(1480.0, within(1e-9));
        assertThat(r.rms()).isLessThan(1e-12);
    }

    @Test
    void handWorkedLeastSquares() {
        // Worked by hand in this test: readings x = 2.03, 4.06, 6.08, 8.12, 10.14; bars y = 2..10.
        // mean x = 30.43/5 = 6.086, mean y = 6. Sxx = sum (x-6.086)^2
        //   = 16.451136 + 4.104676 + 0.000036 + 4.137156 + 16.434916 = 41.12792
        // Sxy = sum (x-6.086)(y-6) = (-4.056)(-4) + (-2.026)(-2) + 0 + (2.034)(2) + (4.054)(4)
        //   = 16.224 + 4.052 + 4.068 + 16.216 = 40.56
        // slope = 40.56 / 41.12792 = 0.986191..., intercept = 6 - slope*6.086 = -0.00196...
        double[] y = {2, 4, 6, 8, 10};
        double[] x = {2.03, 4.06, 6.08, 8.12, 10.14};
        BarCheck.Result r = BarCheck.fit(y, x);
        double slope = 40.56 / 41.12792;
        assertThat(r.scale()).isCloseTo(slope, within(1e-9));
        assertThat(r.indexCorrection()).isCloseTo(6 - slope * 6.086, within(1e-9));
        // residual variance s^2 = SSE/(n-2); se(slope) = s/sqrt(Sxx) (Draper and Smith 1998, ch. 1)
        double sse = 0;
        for (int i = 0; i < 5; i++) sse += Math.pow(r.residuals()[i], 2);
        double s = Math.sqrt(sse / 3);
        assertThat(r.scaleSe()).isCloseTo(s / Math.sqrt(41.12792), within(1e-9));
        assertThat(r.indexCorrectionSe()).isCloseTo(s * Math.sqrt(1.0 / 5 + 6.086 * 6.086 / 41.12792), within(1e-9));
    }

    @Test
    void refusesDegenerateInput() {
        org.assertj.core.api.Assertions.assertThatThrownBy(() -> BarCheck.fit(new double[]{1}, new double[]{1}))
                .hasMessageContaining("at least two");
    }
}
