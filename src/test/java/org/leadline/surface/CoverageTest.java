package org.leadline.surface;

import org.junit.jupiter.api.Test;

import static org.assertj.core.api.Assertions.assertThat;

/** Holidays in a grid with known holes; every expected number worked by hand in this test. */
class CoverageTest {
    /** A 12 x 10 grid of 2 m cells, west edge 1000, north edge 5000, from a picture ('.' empty). */
    static Grid grid(String... rows) {
        Grid g = new Grid(1000, 5000, 2, rows[0].length(), rows.length, null);
        float[] v = new float[g.cells()];
        for (int r = 0; r < rows.length; r++) {
            for (int c = 0; c < rows[r].length(); c++) v[r * g.nx + c] = rows[r].charAt(c) == '.' ? Float.NaN : 10f;
        }
        return g.putLayer(Grid.DEPTH, v);
    }

    @Test
    void findsHolesWithPositionAndSize() {
        Grid g = grid(
                "..##########",   // row 0: empty corner joined to the edge: outside, not a holiday
                "..##########",
                "############",
                "#####...####",   // rows 3-4, cols 5-7: a 6-cell holiday
                "#####...####",
                "############",
                "########.###",   // row 6, col 8: a single-cell holiday
                "############",
                "##.#########",   // row 8, col 2 to the south edge: outside
                "##.#########");
        Coverage cov = Coverage.of(g);
        assertThat(cov.totalCells()).isEqualTo(120);
        assertThat(cov.cellsWithData()).isEqualTo(120 - 4 - 6 - 1 - 2);
        assertThat(cov.footprintCells()).isEqualTo(120 - 4 - 2);
        assertThat(cov.coverage()).isEqualTo(107.0 / 114.0);
        assertThat(cov.gridFraction()).isEqualTo(107.0 / 120.0);
        assertThat(cov.holidays()).hasSize(2);
        Coverage.Holiday big = cov.holidays().get(0);
        assertThat(big.cells()).isEqualTo(6);
        assertThat(big.area()).isEqualTo(24.0);
        // centre: column 6 -> 1000 + 6.5 * 2 = 1013; rows 3.5 -> 5000 - 4 * 2 = 4992
        assertThat(big.easting()).isEqualTo(1013.0);
        assertThat(big.northing()).isEqualTo(4992.0);
        assertThat(big.rowMin()).isEqualTo(3);
        assertThat(big.rowMax()).isEqualTo(4);
        assertThat(big.colMin()).isEqualTo(5);
        assertThat(big.colMax()).isEqualTo(7);
        Coverage.Holiday small = cov.holidays().get(1);
        assertThat(small.cells()).isEqualTo(1);
        assertThat(small.easting()).isEqualTo(1017.0);
        assertThat(small.northing()).isEqualTo(4987.0);
    }

    @Test
    void ringClosedThroughCornersStillEnclosesAHoliday() {
        // the empty cells (1,2) and (2,1) touch only at a corner: two 4-connected holidays
        Grid g = grid(
                "#####",
                "##.##",
                "#.#.#",
                "##.##",
                "#####");
        Coverage cov = Coverage.of(g);
        assertThat(cov.holidays()).hasSize(4);
        assertThat(cov.holidays()).allMatch(h -> h.cells() == 1);
        // a gap reaching the edge opens the hole: no holiday
        Grid open = grid(
                "#####",
                "#...#",
                "#...#",
                "#..##",
                "#.###");
        assertThat(Coverage.of(open).holidays()).isEmpty();
        assertThat(Coverage.of(open).coverage()).isEqualTo(1.0);
    }

    @Test
    void gridderOutputWithAGapInTheSoundings() {
        // soundings on every 1 m point of a 20 x 20 m square except a 4 x 6 m gap
        GridSpec spec = new GridSpec(0, 20, 2, 10, 10);
        int m = 0;
        double[] e = new double[400], n = new double[400], d = new double[400];
        for (int i = 0; i < 20; i++) {
            for (int j = 0; j < 20; j++) {
                double x = i + 0.5, y = j + 0.5;
                if (x > 8 && x < 12 && y > 6 && y < 12) continue;
                e[m] = x;
                n[m] = y;
                d[m++] = 12;
            }
        }
        Grid g = Gridder.build(spec, null, java.util.Arrays.copyOf(e, m), java.util.Arrays.copyOf(n, m),
                java.util.Arrays.copyOf(d, m), null, null, Gridder.Method.MEDIAN);
        Coverage cov = Coverage.of(g);
        assertThat(cov.holidays()).hasSize(1);
        Coverage.Holiday h = cov.holidays().get(0);
        assertThat(h.cells()).isEqualTo(6);
        assertThat(h.area()).isEqualTo(24.0);
        assertThat(h.easting()).isEqualTo(10.0);
        assertThat(h.northing()).isEqualTo(9.0);
    }
}
