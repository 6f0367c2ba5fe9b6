package org.leadline.workbench;

import org.leadline.report.DepthColours;
import org.leadline.surface.Grid;
import org.junit.jupiter.api.Test;

import java.awt.image.BufferedImage;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

class SurfaceRenderingTest {
    private static Grid grid(int nx, int ny, double cell, java.util.function.BiFunction<Integer, Integer, Double> depth) {
        Grid g = new Grid(0, ny * cell, cell, nx, ny, null);
        float[] d = new float[nx * ny], u = new float[nx * ny], c = new float[nx * ny];
        for (int r = 0; r < ny; r++) {
            for (int k = 0; k < nx; k++) {
                d[r * nx + k] = (float) (double) depth.apply(r, k);
                u[r * nx + k] = 0.25f;
                c[r * nx + k] = 3;
            }
        }
        return g.putLayer(Grid.DEPTH, d).putLayer(Grid.UNCERTAINTY, u).putLayer(Grid.COUNT, c);
    }

    @Test
    void flatSeabedIsLitByTheCosineOfTheZenithAngle() {
        double[] s = SurfaceRendering.hillShade(grid(4, 4, 1, (r, c) -> 12.0), 315, 45);
        // flat: shade = cos(zenith) = cos 45 deg = 0.70711 (worked by hand)
        for (double v : s) assertThat(v).isCloseTo(Math.sqrt(0.5), within(1e-12));
    }

    @Test
    void seabedRisingEastwardsFacesTheNorthWestLight() {
        // depth falls 1 m per metre to the east: height gradient dz/dx = 1, dz/dy = 0. Normal
        // (-1, 0, 1)/sqrt 2, light (-0.5, 0.5, sqrt 0.5): shade = (0.5 + 0.70711)/1.41421 = 0.85355
        // (worked by hand; Horn's differences are exact on a plane)
        double[] s = SurfaceRendering.hillShade(grid(5, 5, 1, (r, c) -> 20.0 - c), 315, 45);
        assertThat(s[2 * 5 + 2]).isCloseTo(0.5 + 0.5 * Math.sqrt(0.5), within(1e-12));
    }

    @Test
    void matchesGdaldemHillshadeOnTheInterior() throws Exception {
        // the grid of scripts/reference/make_gdaldem_hillshade.sh
        Grid g = grid(7, 7, 2, (r, c) -> 10 + 0.3 * c + 0.2 * r + 2 * Math.exp(-((c - 3) * (c - 3) + (r - 3) * (r - 3)) / 2.0));
        double[] s = SurfaceRendering.hillShade(g, 315, 45);
        List<int[]> rows = new ArrayList<>();
        for (String line : Files.readAllLines(Path.of("src/test/resources/reference/gdal/hillshade-315-45.asc"))) {
            line = line.strip();
            if (line.isEmpty() || line.startsWith("#") || Character.isLetter(line.charAt(0))) continue;
            rows.add(java.util.Arrays.stream(line.split("\\s+")).mapToInt(Integer::parseInt).toArray());
        }
        assertThat(rows).hasSize(7);
        int compared = 0;
        for (int r = 1; r <= 5; r++) {
            for (int c = 1; c <= 5; c++) {
                // GDAL 3.6 gdaldem: byte = 1 + 254 x shade, truncated; one count of tolerance
                assertThat(1 + 254 * s[r * 7 + c]).as("row %d col %d", r, c).isCloseTo(rows.get(r)[c], within(1.0));
                compared++;
            }
        }
        assertThat(compared).isEqualTo(25);
    }

    @Test
    void imageUsesTheDepthRampAndLeavesEmptyCellsTransparent() {
        Grid g = grid(3, 1, 5, (r, c) -> c == 1 ? Double.NaN : 10.0 + c);
        BufferedImage img = SurfaceRendering.image(g, false);
        assertThat(img.getRGB(0, 0) & 0xFFFFFF).isEqualTo(DepthColours.rgb(0)); // shallowest: light end
        assertThat(img.getRGB(2, 0) & 0xFFFFFF).isEqualTo(DepthColours.rgb(1)); // deepest: dark end
        assertThat(img.getRGB(1, 0) >>> 24).isZero();
    }

    @Test
    void readoutNamesTheCellUnderThePoint() {
        Grid g = grid(4, 2, 10, (r, c) -> 5.0 + c + 10 * r);
        // (25, 5) lies in column 2 of the southern row 1 (north edge at 20 m): depth 5 + 2 + 10
        SurfaceRendering.Readout ro = SurfaceRendering.readout(g, 25, 5);
        assertThat(ro.depth()).isEqualTo(17.0);
        assertThat(ro.uncertainty()).isEqualTo(0.25);
        assertThat(ro.count()).isEqualTo(3);
        assertThat(ro.text()).contains("depth 17.00 m").contains("3 soundings");
        assertThat(SurfaceRendering.readout(g, -1, 5).text()).contains("no data");
    }
}
