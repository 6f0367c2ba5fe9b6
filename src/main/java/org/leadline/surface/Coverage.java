package org.leadline.surface;

import java.util.ArrayList;
import java.util.List;

/**
 * Bathymetric coverage of a grid and its holidays.
 *
 * <p>Definitions (common practice, made exact here):
 * <ul>
 * <li>A cell <em>has data</em> when its DEPTH is finite.</li>
 * <li>The <em>outside</em> is every empty cell joined to the grid edge through empty cells
 *   (4-connected: sharing a side). It is the area the survey never reached around its data.</li>
 * <li>A <em>holiday</em> is a 4-connected group of empty cells that is not outside: it touches no
 *   grid edge, and every cell bordering it (sides and corners) has data. Because the empty cells
 *   are joined only through sides, a ring of data cells closed through corners (8-connected)
 *   encloses a holiday; this is the standard pairing of 4-connected background with 8-connected
 *   foreground in digital topology (Rosenfeld 1970, "Connectivity in digital pictures", J. ACM
 *   17(1), doi:10.1145/321556.321570).</li>
 * <li>The <em>footprint</em> is the cells with data plus the holiday cells (the grid minus the
 *   outside). {@code coverage} = cells with data / footprint cells; {@code gridFraction} = cells
 *   with data / all cells.</li>
 * </ul>
 * Holidays are listed in order of their first cell in row-major order (north-west first).
 *
 * @param cellsWithData  cells with a finite depth
 * @param footprintCells cells with data plus holiday cells
 * @param totalCells     all cells of the grid
 * @param coverage       cellsWithData / footprintCells (NaN for an empty footprint)
 * @param gridFraction   cellsWithData / totalCells
 * @param holidays       the holidays
 */
public record Coverage(int cellsWithData, int footprintCells, int totalCells, double coverage, double gridFraction,
                       List<Holiday> holidays) {

    public Coverage {
        holidays = List.copyOf(holidays);
    }

    /**
     * One holiday.
     *
     * @param easting  mean easting of its cells' centres, m
     * @param northing mean northing of its cells' centres, m
     * @param cells    number of empty cells
     * @param area     cells x cell^2, m^2
     * @param rowMin   northernmost row
     * @param rowMax   southernmost row
     * @param colMin   westernmost column
     * @param colMax   easternmost column
     */
    public record Holiday(double easting, double northing, int cells, double area,
                          int rowMin, int rowMax, int colMin, int colMax) {}

    /** Coverage of the grid's DEPTH layer. */
    public static Coverage of(Grid g) { return of(g, Grid.DEPTH); }

    /** Coverage of a named layer (finite value = data). */
    public static Coverage of(Grid g, String layer) {
        float[] v = g.layer(layer);
        if (v == null) throw new IllegalArgumentException("grid has no layer '" + layer + "'");
        int nx = g.nx, ny = g.ny, cells = g.cells();
        // label: 0 = unvisited empty, 1 = data, 2 = outside, 3 = holiday
        byte[] label = new byte[cells];
        int withData = 0;
        for (int k = 0; k < cells; k++) {
            if (Float.isFinite(v[k])) {
                label[k] = 1;
                withData++;
            }
        }
        int[] stack = new int[Math.max(16, 2 * (nx + ny))];
        int[] sp = {0};
        // flood the outside from every empty edge cell
        for (int c = 0; c < nx; c++) {
            stack = seed(label, stack, sp, c);
            stack = seed(label, stack, sp, (ny - 1) * nx + c);
        }
        for (int r = 0; r < ny; r++) {
            stack = seed(label, stack, sp, r * nx);
            stack = seed(label, stack, sp, r * nx + nx - 1);
        }
        stack = flood(label, stack, sp, nx, ny, (byte) 2, null);
        // remaining empty cells form holidays
        List<Holiday> holidays = new ArrayList<>();
        int holidayCells = 0;
        long[] acc = new long[7];
        for (int k = 0; k < cells; k++) {
            if (label[k] != 0) continue;
            label[k] = 3;
            sp[0] = 0;
            stack[sp[0]++] = k;
            java.util.Arrays.fill(acc, 0);
            acc[3] = Integer.MAX_VALUE;
            acc[5] = Integer.MAX_VALUE;
            stack = flood(label, stack, sp, nx, ny, (byte) 3, acc);
            int count = (int) acc[0];
            holidayCells += count;
            double meanCol = acc[1] / (double) count, meanRow = acc[2] / (double) count;
            holidays.add(new Holiday(g.xMin + (meanCol + 0.5) * g.cell, g.yMax - (meanRow + 0.5) * g.cell, count,
                    count * g.cell * g.cell, (int) acc[5], (int) acc[6], (int) acc[3], (int) acc[4]));
        }
        int footprint = withData + holidayCells;
        return new Coverage(withData, footprint, cells, footprint == 0 ? Double.NaN : withData / (double) footprint,
                withData / (double) cells, holidays);
    }

    private static int[] seed(byte[] label, int[] stack, int[] sp, int k) {
        if (label[k] != 0) return stack;
        label[k] = 2;
        if (sp[0] == stack.length) stack = java.util.Arrays.copyOf(stack, stack.length * 2);
        stack[sp[0]++] = k;
        return stack;
    }

    /**
     * Depth-first flood through 4-neighbours of unvisited empty cells, labelling them; acc (if not
     * null) sums count, col, row and tracks min/max col (3, 4) and row (5, 6).
     */
    private static int[] flood(byte[] label, int[] stack, int[] sp, int nx, int ny, byte mark, long[] acc) {
        while (sp[0] > 0) {
            int k = stack[--sp[0]];
            int r = k / nx, c = k - r * nx;
            if (acc != null) {
                acc[0]++;
                acc[1] += c;
                acc[2] += r;
                acc[3] = Math.min(acc[3], c);
                acc[4] = Math.max(acc[4], c);
                acc[5] = Math.min(acc[5], r);
                acc[6] = Math.max(acc[6], r);
            }
            if (stack.length - sp[0] < 4) stack = java.util.Arrays.copyOf(stack, stack.length * 2);
            if (c > 0 && label[k - 1] == 0) { label[k - 1] = mark; stack[sp[0]++] = k - 1; }
            if (c < nx - 1 && label[k + 1] == 0) { label[k + 1] = mark; stack[sp[0]++] = k + 1; }
            if (r > 0 && label[k - nx] == 0) { label[k - nx] = mark; stack[sp[0]++] = k - nx; }
            if (r < ny - 1 && label[k + nx] == 0) { label[k + nx] = mark; stack[sp[0]++] = k + nx; }
        }
        return stack;
    }
}
