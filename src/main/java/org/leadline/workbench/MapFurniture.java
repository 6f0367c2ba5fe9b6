package org.leadline.workbench;

import org.leadline.report.DepthColours;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.FontMetrics;
import java.awt.Graphics2D;
import java.util.Locale;

/** Scale bar, north arrow and depth legend drawn on the map views (Track, Depth surface). */
final class MapFurniture {
    private MapFurniture() {}

    /** A round length (1, 2 or 5 x 10^k m) near a quarter of the given width in metres. */
    static double niceLength(double metres) {
        double quarter = metres / 4;
        double p = Math.pow(10, Math.floor(Math.log10(quarter)));
        double m = quarter / p;
        return (m >= 5 ? 5 : m >= 2 ? 2 : 1) * p;
    }

    /** Scale bar with its length, lower left at (x, y); pixelsPerMetre of the map. */
    static void scaleBar(Graphics2D g, int x, int y, double pixelsPerMetre, double mapWidthMetres) {
        double len = niceLength(mapWidthMetres);
        int px = (int) Math.round(len * pixelsPerMetre);
        g.setColor(new Color(255, 255, 255, 200));
        g.fillRect(x - 4, y - 22, px + 70, 28);
        g.setColor(Color.DARK_GRAY);
        g.setStroke(new BasicStroke(2));
        g.drawLine(x, y, x + px, y);
        g.drawLine(x, y - 5, x, y + 3);
        g.drawLine(x + px, y - 5, x + px, y + 3);
        g.drawLine(x + px / 2, y - 3, x + px / 2, y);
        g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 11));
        g.drawString(len >= 1000 ? String.format(Locale.ROOT, "%.0f km", len / 1000)
                : String.format(Locale.ROOT, "%.0f m", len), x + px + 6, y + 4);
    }

    /** North arrow (grid north of the projected CRS) with its tip at (x, y). */
    static void northArrow(Graphics2D g, int x, int y) {
        g.setColor(new Color(255, 255, 255, 200));
        g.fillRoundRect(x - 14, y - 16, 28, 58, 8, 8);
        g.setColor(Color.DARK_GRAY);
        g.setStroke(new BasicStroke(2));
        g.drawLine(x, y + 36, x, y + 4);
        g.fillPolygon(new int[] {x - 6, x, x + 6}, new int[] {y + 14, y, y + 14}, 3);
        g.setFont(new Font(Font.SANS_SERIF, Font.BOLD, 12));
        FontMetrics fm = g.getFontMetrics();
        g.drawString("N", x - fm.stringWidth("N") / 2, y - 3);
    }

    /** Vertical depth colour legend in metres: shallow (light) at the top, deep (dark) at the bottom. */
    static void depthLegend(Graphics2D g, int x, int y, int height, double shallow, double deep) {
        g.setColor(new Color(255, 255, 255, 220));
        g.fillRect(x - 6, y - 22, 96, height + 32);
        for (int k = 0; k < height; k++) {
            g.setColor(new Color(DepthColours.rgb(k / (double) (height - 1))));
            g.drawLine(x, y + k, x + 16, y + k);
        }
        g.setColor(Color.DARK_GRAY);
        g.setStroke(new BasicStroke(1));
        g.drawRect(x, y, 16, height);
        g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 11));
        g.drawString("Depth (m)", x - 2, y - 8);
        for (int k = 0; k <= 4; k++) {
            double d = shallow + k * (deep - shallow) / 4;
            int yy = y + (int) Math.round(k * (height - 1) / 4.0);
            g.drawLine(x + 16, yy, x + 20, yy);
            g.drawString(String.format(Locale.ROOT, "%.1f", d), x + 24, yy + 4);
        }
    }
}
