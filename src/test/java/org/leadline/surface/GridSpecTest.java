package org.leadline.surface;

import org.junit.jupiter.api.Test;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

class GridSpecTest {
    @Test
    void coveringSnapsToCellMultiplesAndHoldsEveryPoint() {
        double[] e = {412345.7, 412399.99, 412310.0, Double.NaN};
        double[] n = {6123456.2, 6123400.0, 6123499.5, 1};
        GridSpec s = GridSpec.covering(e, n, 2.0);
        // worked by hand: floor(412310 / 2) * 2 = 412310; ceil(6123499.5 / 2) * 2 = 6123500
        assertThat(s.xMin()).isEqualTo(412310.0);
        assertThat(s.yMax()).isEqualTo(6123500.0);
        assertThat(s.nx()).isEqualTo(45);   // floor(89.99 / 2) + 1
        assertThat(s.ny()).isEqualTo(51);   // floor(100 / 2) + 1: the southernmost point gets its own row
        Grid g = s.newGrid(null);
        for (int i = 0; i < 3; i++) {
            assertThat(g.col(e[i])).isBetween(0, s.nx() - 1);
            assertThat(g.row(n[i])).isBetween(0, s.ny() - 1);
        }
        // a second run over part of the area shares cell boundaries
        GridSpec t = GridSpec.covering(new double[]{412351.3}, new double[]{6123451.1}, 2.0);
        assertThat((t.xMin() - s.xMin()) / 2.0).isEqualTo(Math.rint((t.xMin() - s.xMin()) / 2.0));
        assertThat((s.yMax() - t.yMax()) / 2.0).isEqualTo(Math.rint((s.yMax() - t.yMax()) / 2.0));
    }

    @Test
    void suggestedCellIsTheNadirFootprintRoundedDown() {
        // worked by hand: 2 * 20 * tan(0.5 deg) = 0.349 m -> 0.2 m
        assertThat(GridSpec.suggestCell(new double[]{10, 20, 30}, Math.toRadians(1))).isCloseTo(0.2, within(1e-12));
        // 2 * 50 * tan(1 deg) = 1.745 m -> 1 m
        assertThat(GridSpec.suggestCell(new double[]{50, Double.NaN, 50, 60, 40}, Math.toRadians(2)))
                .isCloseTo(1.0, within(1e-12));
        // 2 * 100 * tan(0.75 deg) = 2.618 m -> 2 m; capped at 1 m by the caller's order
        assertThat(GridSpec.suggestCell(new double[]{100}, Math.toRadians(1.5))).isCloseTo(2.0, within(1e-12));
        assertThat(GridSpec.suggestCell(new double[]{100}, Math.toRadians(1.5), 0.5, 1.0)).isEqualTo(1.0);
        // 2 * 200 * tan(1 deg) = 6.98 m -> 5 m
        assertThat(GridSpec.suggestCell(new double[]{200}, Math.toRadians(2))).isCloseTo(5.0, within(1e-12));
        assertThat(GridSpec.niceFloor(10.0)).isEqualTo(10.0);
        assertThat(GridSpec.niceFloor(0.3)).isCloseTo(0.2, within(1e-15));
    }
}
