package org.leadline.io;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.leadline.surface.Grid;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

class XyzWriterTest {
    @TempDir Path dir;

    @Test
    void writesCellCentresOfNonEmptyCells() throws IOException {
        // 3 x 2 grid, 10 m cells, top-left corner (500000, 6000020): centres worked by hand in this test.
        Grid g = new Grid(500_000, 6_000_020, 10, 3, 2, null);
        g.putLayer(Grid.DEPTH, new float[] {12.5f, Float.NaN, -0.75f, 13.0004f, 14.25f, 15f});
        g.putLayer(Grid.UNCERTAINTY, new float[] {0.31f, Float.NaN, 0.2f, 0.3f, Float.NaN, 0.5f});
        g.putLayer(Grid.COUNT, new float[] {4, 0, 1, 7, 2, 12});
        Path f = dir.resolve("surface.xyz");
        XyzWriter.write(g, f);
        List<String> lines = Files.readAllLines(f);
        assertThat(lines).containsExactly(
                "easting,northing,depth,uncertainty,count",
                "500005.000,6000015.000,12.500,0.310,4",
                "500025.000,6000015.000,-0.750,0.200,1",      // a drying height: negative depth
                "500005.000,6000005.000,13.000,0.300,7",
                "500015.000,6000005.000,14.250,NaN,2",
                "500025.000,6000005.000,15.000,0.500,12");
        try (var s = Files.list(dir)) {
            assertThat(s.map(p -> p.getFileName().toString())).containsExactly("surface.xyz");
        }
    }

    @Test
    void fixedDecimalsRoundHalfAwayFromZeroAndKeepTheSign() {
        assertThat(XyzWriter.fixed3(new StringBuilder(), 1.0005).toString()).isEqualTo("1.001");
        assertThat(XyzWriter.fixed3(new StringBuilder(), -0.0004).toString()).isEqualTo("0.000");
        assertThat(XyzWriter.fixed3(new StringBuilder(), -2.0625).toString()).isEqualTo("-2.063");
        assertThat(XyzWriter.fixed3(new StringBuilder(), 5_712_345.6789).toString()).isEqualTo("5712345.679");
        assertThat(XyzWriter.fixed3(new StringBuilder(), 0.05).toString()).isEqualTo("0.050");
    }

    @Test
    void needsADepthLayer() {
        Grid g = new Grid(0, 0, 1, 1, 1, null).putLayer(Grid.COUNT, new float[] {1});
        assertThatThrownBy(() -> XyzWriter.write(g, dir.resolve("x.xyz")))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("depth");
    }

    @Test
    void sameTextAsTheStringFormatOnARandomGrid() throws IOException {
        // the byte formatter must write what fixed3 and StringBuilder.append(long) write, row for row
        java.util.SplittableRandom r = new java.util.SplittableRandom(4);
        int nx = 700, ny = 240;
        Grid g = new Grid(612_345.5, 5_400_000.25, 0.5, nx, ny, null);
        float[] d = new float[nx * ny], u = new float[nx * ny], c = new float[nx * ny];
        for (int i = 0; i < d.length; i++) {
            d[i] = r.nextInt(7) == 0 ? Float.NaN : (float) (r.nextDouble(-3, 80) * (r.nextInt(9) == 0 ? 1e-4 : 1));
            u[i] = r.nextInt(11) == 0 ? Float.NaN : (float) r.nextDouble(0, 2);
            c[i] = r.nextInt(13) == 0 ? Float.NaN : r.nextInt(100_000);
        }
        g.putLayer(Grid.DEPTH, d).putLayer(Grid.UNCERTAINTY, u).putLayer(Grid.COUNT, c);
        StringBuilder sb = new StringBuilder(XyzWriter.HEADER).append('\n');
        for (int row = 0; row < ny; row++) {
            for (int col = 0; col < nx; col++) {
                int i = row * nx + col;
                if (Float.isNaN(d[i])) continue;
                XyzWriter.fixed3(sb, g.centreX(col)).append(',');
                XyzWriter.fixed3(sb, g.centreY(row)).append(',');
                XyzWriter.fixed3(sb, d[i]).append(',');
                XyzWriter.fixed3(sb, u[i]).append(',');
                if (Float.isNaN(c[i])) sb.append("NaN"); else sb.append(Math.round(c[i]));
                sb.append('\n');
            }
        }
        Path f = dir.resolve("random.xyz");
        XyzWriter.write(g, f);
        assertThat(Files.readString(f)).isEqualTo(sb.toString());
    }
}
