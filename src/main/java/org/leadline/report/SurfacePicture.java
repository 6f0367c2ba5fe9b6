package org.leadline.report;

import org.leadline.surface.Grid;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.image.BufferedImage;
import java.util.Locale;

/**
 * A picture of the depth surface: cells coloured by {@link DepthColours} (shallow light, deep
 * dark), north up, with a colour legend in metres, a scale bar and a north arrow.
 */
public final class SurfacePicture {
    private SurfacePicture() {}

    /** Renders the grid's DEPTH layer into an image about {@code width} pixels wide. */
    public static BufferedImage render(Grid g, int width) {
        double[] r = ReportWriter.range(g);
        int legendW = 110;
        int mapW = width - legendW;
        double scale = Math.min(mapW / (double) g.nx, 560.0 / g.ny);
        int w = Math.max(1, (int) Math.round(g.nx * scale)), h = Math.max(1, (int) Math.round(g.ny * scale));
        BufferedImage img = new BufferedImage(w + legendW, Math.max(h, 260) + 40, BufferedImage.TYPE_INT_RGB);
        Graphics2D gr = img.createGraphics();
        gr.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
        gr.setColor(Color.WHITE);
        gr.fillRect(0, 0, img.getWidth(), img.getHeight());
        float[] d = g.layer(Grid.DEPTH);
        for (int y = 0; y < h; y++) {
            int row = Math.min(g.ny - 1, (int) (y / scale));
            for (int x = 0; x < w; x++) {
                int col = Math.min(g.nx - 1, (int) (x / scale));
                float v = d[row * g.nx + col];
                img.setRGB(x, y + 20, Float.isFinite(v) ? DepthColours.rgb(v, r[0], r[1]) : 0xFFFFFF);
            }
        }
        gr.setColor(Color.DARK_GRAY);
        gr.drawRect(0, 20, w - 1, h - 1);
        gr.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 11));
        gr.drawString("Depth below chart datum (m)", 4, 14);
        // legend
        int lx = w + 20, ly = 30, lh = 200;
        for (int k = 0; k < lh; k++) {
            gr.setColor(new Color(DepthColours.rgb(k / (double) (lh - 1))));
            gr.drawLine(lx, ly + k, lx + 20, ly + k);
        }
        gr.setColor(Color.DARK_GRAY);
        gr.drawRect(lx, ly, 20, lh);
        for (int k = 0; k <= 4; k++) {
            double depth = r[0] + k * (r[1] - r[0]) / 4;
            int yy = ly + (int) Math.round(k * (lh - 1) / 4.0);
            gr.drawLine(lx + 20, yy, lx + 25, yy);
            gr.drawString(String.format(Locale.ROOT, "%.1f m", depth), lx + 28, yy + 4);
        }
        // north arrow
        int nx = lx + 10, ny = ly + lh + 20;
        gr.setStroke(new BasicStroke(2));
        gr.drawLine(nx, ny + 30, nx, ny);
        gr.fillPolygon(new int[]{nx - 5, nx, nx + 5}, new int[]{ny + 8, ny, ny + 8}, 3);
        gr.drawString("N", nx - 4, ny - 3);
        // scale bar: a round length near a quarter of the map width
        double metres = g.nx * g.cell / 4;
        double nice = Math.pow(10, Math.floor(Math.log10(metres)));
        if (metres / nice >= 5) nice *= 5; else if (metres / nice >= 2) nice *= 2;
        int px = (int) Math.round(nice / g.cell * scale);
        gr.drawLine(10, h + 32, 10 + px, h + 32);
        gr.drawLine(10, h + 28, 10, h + 36);
        gr.drawLine(10 + px, h + 28, 10 + px, h + 36);
        gr.drawString(String.format(Locale.ROOT, "%.0f m", nice), 14 + px, h + 36);
        gr.dispose();
        return img;
    }
}
