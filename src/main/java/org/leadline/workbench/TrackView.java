package org.leadline.workbench;

import org.leadline.report.DepthColours;
import org.leadline.survey.SoundingTable;

import javax.swing.JComponent;
import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.event.MouseAdapter;
import java.awt.event.MouseEvent;
import java.util.Locale;
import java.util.function.Consumer;

/**
 * Track: the survey lines on a map in the run's projected CRS, accepted soundings coloured by
 * depth ({@link DepthColours}), rejected ones as small grey crosses, with a scale bar, a north
 * arrow (grid north) and a depth legend. Clicking a line opens it in Along-track.
 */
final class TrackView extends JComponent {
    private static final int MARGIN = 40, LEGEND = 110;
    private TrackModel model;
    private String crsLabel = "";
    private String highlighted;
    private final Consumer<String> onLine;
    private final Consumer<String> onStatus;
    private double scale, e0, n1; // pixels per metre, west edge, north edge of the view
    private int ox, oy;

    TrackView(Consumer<String> onLine, Consumer<String> onStatus) {
        this.onLine = onLine;
        this.onStatus = onStatus;
        setOpaque(true);
        setBackground(Color.WHITE);
        MouseAdapter m = new MouseAdapter() {
            @Override
            public void mouseClicked(MouseEvent e) {
                String line = lineAt(e.getX(), e.getY());
                if (line != null) onLine.accept(line);
            }

            @Override
            public void mouseMoved(MouseEvent e) {
                if (model == null || scale == 0) return;
                double[] en = toMap(e.getX(), e.getY());
                // the hit test scans every sounding: on big surveys only a click runs it
                String line = model.soundings().size <= 200_000 ? lineAt(e.getX(), e.getY()) : null;
                onStatus.accept(String.format(Locale.ROOT, "E %.1f m  N %.1f m", en[0], en[1])
                        + (line != null ? "  line " + line + " (click to open in Along-track)" : ""));
                setCursor(java.awt.Cursor.getPredefinedCursor(line != null ? java.awt.Cursor.HAND_CURSOR
                        : java.awt.Cursor.DEFAULT_CURSOR));
            }
        };
        addMouseListener(m);
        addMouseMotionListener(m);
    }

    void setModel(TrackModel m, String crs) {
        model = m;
        crsLabel = crs == null ? "" : crs;
        repaint();
    }

    void highlight(String line) {
        highlighted = line;
        repaint();
    }

    /** The line under a pixel (within 8 pixels), or null. */
    String lineAt(int x, int y) {
        if (model == null || scale == 0) return null;
        double[] en = toMap(x, y);
        return model.lineAt(en[0], en[1], 8 / scale);
    }

    /** Pixel position of a map point (for tests and the along-track link). */
    int[] toPixel(double e, double n) {
        return new int[] {(int) Math.round(ox + (e - e0) * scale), (int) Math.round(oy + (n1 - n) * scale)};
    }

    double[] toMap(int x, int y) { return new double[] {e0 + (x - ox) / scale, n1 - (y - oy) / scale}; }

    @Override
    protected void paintComponent(Graphics g0) {
        Graphics2D g = (Graphics2D) g0.create();
        g.setColor(getBackground());
        g.fillRect(0, 0, getWidth(), getHeight());
        g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
        if (model == null) {
            g.setColor(Color.GRAY);
            g.drawString("Open a project (File > Open project...) to see its survey lines.", 20, 30);
            g.dispose();
            return;
        }
        double[] ext = model.extent();
        if (!Double.isFinite(ext[0])) {
            g.setColor(Color.GRAY);
            g.drawString("No sounding has a position.", 20, 30);
            g.dispose();
            return;
        }
        int w = getWidth() - 2 * MARGIN - LEGEND, h = getHeight() - MARGIN - 80; // room below for the scale bar
        double spanE = Math.max(ext[2] - ext[0], 1), spanN = Math.max(ext[3] - ext[1], 1);
        scale = Math.max(1e-9, Math.min(w / spanE, h / spanN));
        e0 = ext[0] - (w / scale - spanE) / 2;
        n1 = ext[3] + (h / scale - spanN) / 2;
        ox = MARGIN;
        oy = MARGIN;
        double[] dr = model.depthRange();
        SoundingTable s = model.soundings();
        int hl = highlighted == null ? -1 : s.lineNames().indexOf(highlighted);
        if (hl >= 0) { // a halo under the line shown in Along-track
            g.setColor(new Color(Charts.SELECTED.getRed(), Charts.SELECTED.getGreen(), Charts.SELECTED.getBlue(), 110));
            for (int i = 0; i < s.size; i++) {
                if (s.line[i] != hl || !Double.isFinite(s.easting[i])) continue;
                int[] p = toPixel(s.easting[i], s.northing[i]);
                g.fillOval(p[0] - 6, p[1] - 6, 12, 12);
            }
        }
        g.setStroke(new BasicStroke(1));
        for (int i = 0; i < s.size; i++) {
            if (!Double.isFinite(s.easting[i]) || !Double.isFinite(s.northing[i])) continue;
            int[] p = toPixel(s.easting[i], s.northing[i]);
            if (s.accepted(i) && Double.isFinite(s.depth[i])) {
                g.setColor(new Color(DepthColours.rgb(s.depth[i], dr[0], dr[1])));
                g.fillOval(p[0] - 2, p[1] - 2, 5, 5);
            } else {
                g.setColor(Charts.REJECTED);
                g.drawLine(p[0] - 2, p[1] - 2, p[0] + 2, p[1] + 2);
                g.drawLine(p[0] - 2, p[1] + 2, p[0] + 2, p[1] - 2);
            }
        }
        // line names at each line's first sounding
        g.setFont(new Font(Font.SANS_SERIF, Font.BOLD, 11));
        boolean[] named = new boolean[s.lineNames().size()];
        for (int i = 0; i < s.size; i++) {
            int l = s.line[i];
            if (l < 0 || named[l] || !Double.isFinite(s.easting[i])) continue;
            named[l] = true;
            int[] p = toPixel(s.easting[i], s.northing[i]);
            String name = s.lineNames().get(l);
            g.setColor(new Color(255, 255, 255, 200));
            g.fillRect(p[0] + 5, p[1] - 16, g.getFontMetrics().stringWidth(name) + 4, 14);
            g.setColor(l == hl ? Charts.REJECTED.darker() : Color.BLACK);
            g.drawString(name, p[0] + 7, p[1] - 5);
        }
        g.setColor(Color.GRAY);
        g.drawRect(ox - 10, oy - 10, w + 20, h + 20);
        // scale bar below the map frame, north arrow under the legend: neither hides a sounding
        MapFurniture.scaleBar(g, ox - 6, oy + h + 40, scale, w / scale);
        int lh = Math.min(220, Math.max(60, h - 120));
        MapFurniture.depthLegend(g, getWidth() - LEGEND + 14, MARGIN + 24, lh, dr[0], dr[1]);
        MapFurniture.northArrow(g, getWidth() - LEGEND + 22, MARGIN + lh + 60);
        g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 11));
        g.setColor(Color.DARK_GRAY);
        g.drawString("Soundings in " + crsLabel + "; rejected: crosses. Click a line to open it in Along-track.",
                ox - 10, getHeight() - 8);
        g.dispose();
    }
}
