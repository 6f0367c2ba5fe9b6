package org.leadline.surface;

import org.junit.jupiter.api.Test;

import java.util.List;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/** Marching squares on small grids; expected vertices worked by hand in this test. */
class ContoursTest {
    static Grid grid(int nx, int ny, float... v) {
        return new Grid(0, ny * 10.0, 10, nx, ny, null).putLayer(Grid.DEPTH, v);
    }

    @Test
    void deepPitGivesAClosedDiamond() {
        // centres at x = 5, 15, 25 and y = 25, 15, 5; depth 1 at the middle, 0 around; level 0.5
        Grid g = grid(3, 3, 0, 0, 0, 0, 1, 0, 0, 0, 0);
        List<Contours.Polyline> lines = Contours.trace(g, new double[]{0.5}).get(0);
        assertThat(lines).hasSize(1);
        Contours.Polyline p = lines.get(0);
        assertThat(p.closed()).isTrue();
        assertThat(p.size()).isEqualTo(5);
        // a diamond with half-diagonals 5 m around (15, 15): area 2 * 5^2 = 50 m^2
        assertThat(Math.abs(SyntheticShoalTest.shoelace(p))).isCloseTo(50, within(1e-9));
        for (int i = 0; i < 4; i++) {
            assertThat(Math.abs(p.x()[i] - 15) + Math.abs(p.y()[i] - 15)).isCloseTo(5, within(1e-12));
        }
    }

    @Test
    void saddleIsResolvedByTheCentreMean() {
        // TL = 1, TR = 0, BL = 0.25, BR = 1 (TL and BR deeper than 0.5); centre mean 0.5625 > 0.5:
        // the deep corners join through the centre, so the lines cut off TR and BL
        Grid g = grid(2, 2, 1, 0, 0.25f, 1);
        List<Contours.Polyline> lines = Contours.trace(g, new double[]{0.5}).get(0);
        assertThat(lines).hasSize(2);
        for (Contours.Polyline p : lines) {
            assertThat(p.closed()).isFalse();
            assertThat(p.size()).isEqualTo(2);
        }
        // TR cut: top edge midpoint (10, 15) to right edge midpoint (15, 10)
        Contours.Polyline a = lines.get(0);
        assertThat(new double[]{a.x()[0], a.y()[0], a.x()[1], a.y()[1]}).containsExactly(10, 15, 15, 10);
        // BL cut: bottom edge at t = (0.5 - 0.25) / 0.75 = 1/3 -> x = 5 + 10/3; left edge from TL (y 15)
        // to BL (y 5) at t = (0.5 - 1) / (0.25 - 1) = 2/3 -> y = 15 - 20/3
        Contours.Polyline b = lines.get(1);
        int bottom = b.y()[0] == 5.0 ? 0 : 1;
        assertThat(b.y()[bottom]).isEqualTo(5.0);
        assertThat(b.x()[bottom]).isCloseTo(5 + 10.0 / 3, within(1e-12));
        assertThat(b.x()[1 - bottom]).isEqualTo(5.0);
        assertThat(b.y()[1 - bottom]).isCloseTo(15 - 20.0 / 3, within(1e-12));
        // centre mean below the level (BL = 0): the shoal corners join instead, lines cut off TL and BR
        Grid h = grid(2, 2, 1, 0, 0, 1);   // centre mean exactly 0.5, not deeper
        List<Contours.Polyline> other = Contours.trace(h, new double[]{0.5}).get(0);
        assertThat(other).hasSize(2);
        assertThat(other.get(0).x()).containsExactlyInAnyOrder(10.0, 5.0);   // top midpoint, left midpoint
    }

    @Test
    void linesStopAtMissingDataAndJoinAcrossSquares() {
        // a slope deepening eastward, 4 x 3, with one NaN corner on the south-west
        float nan = Float.NaN;
        Grid g = grid(4, 3,
                0, 1, 2, 3,
                0, 1, 2, 3,
                nan, 1, 2, 3);
        List<Contours.Polyline> lines = Contours.trace(g, new double[]{1.5, 0.5}).get(0);
        assertThat(lines).hasSize(1);
        Contours.Polyline p = lines.get(0);
        assertThat(p.closed()).isFalse();
        assertThat(p.size()).isEqualTo(3);   // one vertex per crossed row of centres, joined
        assertThat(p.x()).containsOnly(20.0);
        // level 0.5 crosses only the two squares with all corners: the NaN square ends the line
        List<Contours.Polyline> half = Contours.trace(g, new double[]{0.5}).get(0);
        assertThat(half).hasSize(1);
        assertThat(half.get(0).size()).isEqualTo(2);
    }

    @Test
    void levelsAreWholeMultiplesOfTheInterval() {
        assertThat(Contours.levels(12.3, 20, 5)).containsExactly(15, 20);
        assertThat(Contours.levels(-1.2, 1, 0.5)).containsExactly(-1.0, -0.5, 0.0, 0.5, 1.0);
        assertThat(Contours.levels(3.1, 3.2, 1)).isEmpty();
    }
}
