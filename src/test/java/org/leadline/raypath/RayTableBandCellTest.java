package org.leadline.raypath;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import org.junit.jupiter.api.Test;
import org.leadline.watercolumn.SoundSpeedProfile;

/**
 * Regression: a profile sample strictly inside a start-depth cell flags that cell, and the node
 * below the flagged one has no stored speed either; start depths in the cell above a flagged cell
 * used to fall back to exact tracing (37 % of a synthetic swath day's soundings, about half of the
 * reduction's CPU). The table must answer there itself, as accurately as elsewhere.
 */
class RayTableBandCellTest {
    @Test
    void noFallbackNextToAFlaggedCell() {
        int n = 201;
        double[] z = new double[n], c = new double[n];
        for (int k = 0; k < n; k++) {
            z[k] = k; // samples at whole metres: inside the cells [0.95, 1.2] and [1.95, 2.2] of the band below
            c[k] = 1488 + 24 / (1 + Math.exp((z[k] - 15) / 3.0)) + 0.016 * z[k];
        }
        SoundSpeedProfile p = new SoundSpeedProfile(z, c, List.of());
        RayTable table = new RayTable(p, 0.2, 2.8, Math.toRadians(71.4), 0.0633);
        RayTracer exact = new RayTracer(p);
        double[] out = new double[2], ref = new double[2];
        for (double zs = 0.2; zs <= 2.8; zs += 0.01) {
            for (double deg = 0; deg <= 70; deg += 7) {
                table.lookup(zs, Math.toRadians(deg), 0.03, out);
                exact.trace(zs, Math.toRadians(deg), 0.03, ref);
                // RayTable's documented accuracy: better than 1 mm in depth and 1 cm horizontally
                assertThat(out[0]).as("depth at zs %.2f, %.0f deg", zs, deg).isCloseTo(ref[0], within(1e-3));
                assertThat(out[1]).as("distance at zs %.2f, %.0f deg", zs, deg).isCloseTo(ref[1], within(1e-2));
            }
        }
        assertThat(table.fallbackCount()).isZero();
    }
}
