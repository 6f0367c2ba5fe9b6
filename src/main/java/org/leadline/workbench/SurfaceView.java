package org.leadline.workbench;

import org.leadline.surface.Grid;

import javax.swing.Action;
import javax.swing.BorderFactory;
import javax.swing.JButton;
import javax.swing.JCheckBox;
import javax.swing.JComponent;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JToolBar;
import java.awt.BorderLayout;
import java.awt.Color;
import java.awt.Font;
import java.awt.Graphics;
import java.awt.Graphics2D;
import java.awt.RenderingHints;
import java.awt.event.MouseAdapter;
import java.awt.event.MouseEvent;
import java.awt.image.BufferedImage;
import java.util.Locale;

/**
 * Depth surface: the grid coloured by depth ({@link org.leadline.report.DepthColours}), north up,
 * with a legend in metres, scale bar and north arrow, an optional hill-shading, and a read-out of
 * easting, northing, depth, uncertainty and sounding count under the cursor.
 */
final class SurfaceView extends JPanel {
    private final JCheckBox hillShade = new JCheckBox("Hill-shading");
    private final JLabel readout = new JLabel(" ");
    private final JLabel state = new JLabel();
    private final Canvas canvas = new Canvas();
    private WorkbenchSession session;
    private Grid grid;
    private BufferedImage image;

    SurfaceView(Action buildSurface) {
        super(new BorderLayout());
        JToolBar bar = new JToolBar();
        bar.setFloatable(false);
        JButton b = bar.add(buildSurface);
        b.setHideActionText(false);
        bar.addSeparator();
        bar.add(hillShade);
        bar.addSeparator();
        bar.add(state);
        add(bar, BorderLayout.NORTH);
        add(canvas, BorderLayout.CENTER);
        readout.setBorder(BorderFactory.createEmptyBorder(2, 8, 2, 8));
        readout.setFont(new Font(Font.MONOSPACED, Font.PLAIN, 12));
        add(readout, BorderLayout.SOUTH);
        hillShade.addActionListener(e -> {
            image = grid == null ? null : SurfaceRendering.image(grid, hillShade.isSelected());
            canvas.repaint();
        });
    }

    void setSession(WorkbenchSession s) {
        session = s;
        refresh();
    }

    JCheckBox hillShadeBox() { return hillShade; }
    String readoutText() { return readout.getText(); }
    Canvas canvas() { return canvas; }

    /** Shows the session's current surface (after open or Build surface) and whether it is up to date. */
    void refresh() {
        Grid g = session == null || session.surface() == null ? null : session.surface().grid();
        if (g != grid) {
            grid = g;
            image = g == null ? null : SurfaceRendering.image(g, hillShade.isSelected());
        }
        if (session == null || session.surface() == null) {
            state.setText("");
        } else {
            SurfaceState s = session.surface();
            String text = String.format(Locale.ROOT, "%d x %d cells of %.2f m, %s; %d soundings gridded, mean depth %.2f m",
                    grid.nx, grid.ny, grid.cell, session.result().method().label(), s.accepted(), s.meanDepth());
            state.setText(session.surfaceStale() ? text + "   (edits since: Build surface to update)" : text);
            state.setForeground(session.surfaceStale() ? Charts.REJECTED.darker() : null);
        }
        canvas.repaint();
    }

    /** The map area: fits the grid with equal scale in both axes. */
    final class Canvas extends JComponent {
        private static final int MARGIN = 30, LEGEND = 110;
        private double scale; // pixels per metre
        private int ox, oy;

        Canvas() {
            setOpaque(true);
            MouseAdapter m = new MouseAdapter() {
                @Override
                public void mouseMoved(MouseEvent e) { showReadout(e.getX(), e.getY()); }
            };
            addMouseMotionListener(m);
        }

        /** Puts the read-out of the cell under a pixel in the label. */
        void showReadout(int x, int y) {
            if (grid == null || scale == 0) return;
            double e = grid.xMin + (x - ox) / scale, n = grid.yMax - (y - oy) / scale;
            readout.setText(SurfaceRendering.readout(grid, e, n).text());
        }

        /** Pixel of a map point (for the GUI test). */
        java.awt.Point toPixel(double e, double n) {
            return new java.awt.Point((int) Math.round(ox + (e - grid.xMin) * scale), (int) Math.round(oy + (grid.yMax - n) * scale));
        }

        @Override
        protected void paintComponent(Graphics g0) {
            Graphics2D g = (Graphics2D) g0.create();
            g.setColor(Color.WHITE);
            g.fillRect(0, 0, getWidth(), getHeight());
            g.setRenderingHint(RenderingHints.KEY_ANTIALIASING, RenderingHints.VALUE_ANTIALIAS_ON);
            if (grid == null) {
                g.setColor(Color.GRAY);
                g.drawString("No surface yet: open a project.", 20, 30);
                g.dispose();
                return;
            }
            int w = getWidth() - 2 * MARGIN - LEGEND, h = getHeight() - MARGIN - 64; // room below for the scale bar
            double we = grid.nx * grid.cell, hn = grid.ny * grid.cell;
            scale = Math.max(1e-9, Math.min(w / we, h / hn));
            int iw = (int) Math.round(we * scale), ih = (int) Math.round(hn * scale);
            ox = MARGIN + (w - iw) / 2;
            oy = MARGIN + (h - ih) / 2;
            g.setColor(new Color(0xF4F4F4));
            g.fillRect(ox, oy, iw, ih);
            g.setRenderingHint(RenderingHints.KEY_INTERPOLATION, RenderingHints.VALUE_INTERPOLATION_NEAREST_NEIGHBOR);
            g.drawImage(image, ox, oy, iw, ih, null);
            g.setColor(Color.GRAY);
            g.drawRect(ox, oy, iw, ih);
            double[] r = SurfaceRendering.depthRange(grid);
            // scale bar below the map, north arrow under the legend: neither hides a cell
            MapFurniture.scaleBar(g, ox, oy + ih + 30, scale, we);
            int lh = Math.min(220, Math.max(60, h - 120));
            MapFurniture.depthLegend(g, getWidth() - LEGEND + 14, MARGIN + 24, lh, r[0], r[1]);
            MapFurniture.northArrow(g, getWidth() - LEGEND + 22, MARGIN + lh + 60);
            g.setColor(Color.DARK_GRAY);
            g.setFont(new Font(Font.SANS_SERIF, Font.PLAIN, 11));
            g.drawString("Depth below chart datum, " + session.result().projection().code() + ", cells of "
                    + String.format(Locale.ROOT, "%.2f m", grid.cell) + "; empty cells light grey", MARGIN, getHeight() - 8);
            g.dispose();
        }
    }
}
