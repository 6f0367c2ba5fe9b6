package org.leadline.workbench;

import org.jfree.chart.ChartPanel;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.DateAxis;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.axis.ValueAxis;
import org.jfree.chart.plot.DatasetRenderingOrder;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.DeviationRenderer;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.data.xy.DefaultXYDataset;
import org.jfree.data.xy.YIntervalSeries;
import org.jfree.data.xy.YIntervalSeriesCollection;

import javax.swing.Action;
import javax.swing.BorderFactory;
import javax.swing.JButton;
import javax.swing.JCheckBox;
import javax.swing.JComboBox;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JToolBar;
import java.awt.BasicStroke;
import java.awt.BorderLayout;
import java.awt.Color;
import java.awt.Graphics;
import java.awt.Graphics2D;
import java.awt.Point;
import java.awt.Rectangle;
import java.awt.event.MouseAdapter;
import java.awt.event.MouseEvent;
import java.awt.geom.Rectangle2D;
import java.util.Locale;
import java.util.TimeZone;
import java.util.function.Consumer;

/**
 * Along-track: one line's soundings against distance along the track or time, depth increasing
 * downwards. Accepted soundings are dark blue dots, rejected ones vermilion crosses, the selection
 * is ringed in orange; an optional band shows depth +/- TVU (95 %) of the accepted soundings.
 * Dragging a box selects; Reject pings and Restore pings act on the selection.
 */
final class AlongTrackView extends JPanel {
    private final JComboBox<String> lines = new JComboBox<>();
    private final JComboBox<String> axisBox = new JComboBox<>(new String[] {"Distance along track", "Time (UTC)"});
    private final JCheckBox tvuBand = new JCheckBox("TVU band");
    private final JLabel counts = new JLabel();
    private final DefaultXYDataset soundingsData = new DefaultXYDataset();
    private final DefaultXYDataset selectionData = new DefaultXYDataset();
    private final YIntervalSeriesCollection bandData = new YIntervalSeriesCollection();
    private final XYPlot plot;
    private final JFreeChart chart;
    private final BoxChartPanel panel;
    private WorkbenchSession session;
    private AlongTrackModel model;
    private boolean updating;
    private final Consumer<String> onLineChange;

    AlongTrackView(Action reject, Action restore, Action undo, Action redo, Consumer<String> onLineChange) {
        super(new BorderLayout());
        this.onLineChange = onLineChange;
        JToolBar bar = new JToolBar();
        bar.setFloatable(false);
        bar.add(new JLabel(" Line: "));
        bar.add(lines);
        bar.addSeparator();
        bar.add(new JLabel("Against: "));
        bar.add(axisBox);
        bar.addSeparator();
        bar.add(tvuBand);
        bar.addSeparator();
        for (Action a : new Action[] {reject, restore, undo, redo}) {
            JButton b = bar.add(a);
            b.setHideActionText(false);
        }
        JButton reset = new JButton("Whole line");
        reset.setToolTipText("Show the whole line again after zooming with the mouse wheel");
        reset.addActionListener(e -> { plot().getDomainAxis().setAutoRange(true); plot().getRangeAxis().setAutoRange(true); });
        bar.add(reset);
        add(bar, BorderLayout.NORTH);

        NumberAxis depth = new NumberAxis("Depth below chart datum (m)");
        depth.setInverted(true);
        depth.setAutoRangeIncludesZero(false);
        NumberAxis dist = new NumberAxis("Distance along track (m)");
        dist.setAutoRangeIncludesZero(false);
        plot = new XYPlot(selectionData, dist, depth, selectionRenderer());
        plot.setDataset(1, soundingsData);
        plot.setRenderer(1, soundingsRenderer());
        plot.setDataset(2, bandData);
        DeviationRenderer band = new DeviationRenderer(true, false);
        band.setSeriesPaint(0, new Color(0x56B4E9));
        band.setSeriesFillPaint(0, new Color(0x56B4E9));
        band.setAlpha(0.25f);
        band.setSeriesStroke(0, new BasicStroke(0.5f));
        plot.setRenderer(2, band);
        plot.setDatasetRenderingOrder(DatasetRenderingOrder.REVERSE); // selection on top, band below
        chart = new JFreeChart(null, JFreeChart.DEFAULT_TITLE_FONT, plot, true);
        Charts.style(chart);
        panel = new BoxChartPanel(chart);
        add(panel, BorderLayout.CENTER);
        counts.setBorder(BorderFactory.createEmptyBorder(2, 8, 2, 8));
        add(counts, BorderLayout.SOUTH);

        lines.addActionListener(e -> {
            if (!updating && lines.getSelectedItem() != null) showLine((String) lines.getSelectedItem());
        });
        axisBox.addActionListener(e -> {
            if (model != null) {
                model.clearSelection();
                rebuildAxis();
                refresh();
            }
        });
        tvuBand.addActionListener(e -> refresh());
    }

    private static XYLineAndShapeRenderer selectionRenderer() {
        XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(false, true);
        r.setSeriesShape(0, Charts.dot(11));
        r.setSeriesPaint(0, Charts.SELECTED);
        r.setSeriesShapesFilled(0, false);
        r.setUseOutlinePaint(false);
        r.setDrawOutlines(true);
        r.setSeriesStroke(0, new BasicStroke(2f));
        return r;
    }

    private static XYLineAndShapeRenderer soundingsRenderer() {
        XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(false, true);
        r.setSeriesShape(0, Charts.dot(5));
        r.setSeriesPaint(0, Charts.ACCEPTED);
        r.setSeriesShape(1, Charts.cross(8));
        r.setSeriesPaint(1, Charts.REJECTED);
        return r;
    }

    void setSession(WorkbenchSession s) {
        session = s;
        updating = true;
        lines.removeAllItems();
        if (s != null) for (String l : s.soundings().lineNames()) lines.addItem(l);
        updating = false;
        model = null;
        if (s != null && lines.getItemCount() > 0) showLine(lines.getItemAt(0));
        else refresh();
    }

    /** Opens a line (from the Track view or the combo). */
    void showLine(String line) {
        if (session == null) return;
        model = new AlongTrackModel(session, line);
        updating = true;
        lines.setSelectedItem(line);
        updating = false;
        rebuildAxis();
        refresh();
        onLineChange.accept(line);
    }

    AlongTrackModel model() { return model; }
    private XYPlot plot() { return plot; }
    AlongTrackModel.Axis axis() { return axisBox.getSelectedIndex() == 1 ? AlongTrackModel.Axis.TIME : AlongTrackModel.Axis.DISTANCE; }
    JCheckBox tvuBandBox() { return tvuBand; }
    ChartPanel chartPanel() { return panel; }

    private void rebuildAxis() {
        ValueAxis x;
        if (axis() == AlongTrackModel.Axis.TIME) {
            DateAxis d = new DateAxis("Time (UTC)");
            d.setTimeZone(TimeZone.getTimeZone("UTC"));
            x = d;
        } else {
            NumberAxis n = new NumberAxis("Distance along track (m)");
            n.setAutoRangeIncludesZero(false);
            x = n;
        }
        plot.setDomainAxis(x);
        plot.getRangeAxis().setAutoRange(true);
    }

    /** Plot value of a model x (DateAxis wants milliseconds). */
    private double plotX(double x) { return axis() == AlongTrackModel.Axis.TIME ? x * 1000 : x; }

    private double modelX(double v) { return axis() == AlongTrackModel.Axis.TIME ? v / 1000 : v; }

    /** Redraws statuses, selection and band from the model. */
    void refresh() {
        for (String k : new String[] {"Accepted", "Rejected"}) if (soundingsData.indexOf(k) >= 0) soundingsData.removeSeries(k);
        if (selectionData.indexOf("Selected") >= 0) selectionData.removeSeries("Selected");
        bandData.removeAllSeries();
        if (model == null) {
            chart.setTitle((String) null);
            counts.setText(session == null ? "Open a project to review its lines." : "");
            return;
        }
        AlongTrackModel.Axis ax = axis();
        int n = model.size(), na = model.countAccepted();
        double[][] acc = new double[2][na], rej = new double[2][n - na];
        int a = 0, r = 0;
        YIntervalSeries band = new YIntervalSeries("Depth +/- TVU (95 %)");
        for (int k = 0; k < n; k++) {
            double x = plotX(model.x(k, ax)), d = model.depth(k);
            if (model.accepted(k)) {
                acc[0][a] = x;
                acc[1][a++] = d;
                double t = model.tvu(k);
                if (tvuBand.isSelected() && Double.isFinite(d) && Double.isFinite(t)) band.add(x, d, d - t, d + t);
            } else {
                rej[0][r] = x;
                rej[1][r++] = Double.isFinite(d) ? d : Double.NaN;
            }
        }
        soundingsData.addSeries("Accepted", acc);
        soundingsData.addSeries("Rejected", rej);
        int[] sel = model.selection();
        double[][] s = new double[2][sel.length];
        for (int j = 0; j < sel.length; j++) {
            s[0][j] = plotX(model.x(sel[j], ax));
            s[1][j] = model.depth(sel[j]);
        }
        selectionData.addSeries("Selected", s);
        if (tvuBand.isSelected()) bandData.addSeries(band);
        chart.setTitle("Line " + model.line());
        Charts.style(chart);
        counts.setText(String.format(Locale.ROOT, "Line %s: %d soundings, %d accepted, %d rejected; %d selected."
                        + "  Drag a box to select; R rejects, E restores, Ctrl+Z undoes.", model.line(), n, na, n - na,
                sel.length));
    }

    /** Screen point (in the chart panel) of a model x and depth: used by the GUI test to drag a box. */
    Point toScreen(double x, double depth) {
        Rectangle2D area = panel.getScreenDataArea();
        double px = plot.getDomainAxis().valueToJava2D(plotX(x), area, plot.getDomainAxisEdge());
        double py = plot.getRangeAxis().valueToJava2D(depth, area, plot.getRangeAxisEdge());
        return new Point((int) Math.round(px), (int) Math.round(py));
    }

    /** Selects the box between two screen points of the chart panel. */
    private void selectScreenBox(Point p0, Point p1) {
        if (model == null) return;
        Rectangle2D area = panel.getScreenDataArea();
        double x0 = modelX(plot.getDomainAxis().java2DToValue(p0.x, area, plot.getDomainAxisEdge()));
        double x1 = modelX(plot.getDomainAxis().java2DToValue(p1.x, area, plot.getDomainAxisEdge()));
        double d0 = plot.getRangeAxis().java2DToValue(p0.y, area, plot.getRangeAxisEdge());
        double d1 = plot.getRangeAxis().java2DToValue(p1.y, area, plot.getRangeAxisEdge());
        model.selectBox(axis(), x0, x1, d0, d1);
        refresh();
    }

    /** A chart panel where a left-button drag draws a selection box instead of zooming. */
    private final class BoxChartPanel extends ChartPanel {
        private Point start, end;

        BoxChartPanel(JFreeChart c) {
            super(c, false, false, false, false, true);
            setMouseZoomable(false);
            setMouseWheelEnabled(true);
            setMinimumDrawWidth(10);
            setMinimumDrawHeight(10);
            setMaximumDrawWidth(4000);
            setMaximumDrawHeight(3000);
            MouseAdapter m = new MouseAdapter() {
                @Override
                public void mousePressed(MouseEvent e) {
                    if (e.getButton() != MouseEvent.BUTTON1) return;
                    start = e.getPoint();
                    end = start;
                }

                @Override
                public void mouseDragged(MouseEvent e) {
                    if (start == null) return;
                    end = e.getPoint();
                    repaint();
                }

                @Override
                public void mouseReleased(MouseEvent e) {
                    if (start == null) return;
                    end = e.getPoint();
                    Point a = start;
                    start = null;
                    if (Math.abs(end.x - a.x) < 2 && Math.abs(end.y - a.y) < 2) {
                        // a click: select the nearest sounding within 6 pixels
                        selectScreenBox(new Point(a.x - 6, a.y - 6), new Point(a.x + 6, a.y + 6));
                    } else {
                        selectScreenBox(a, end);
                    }
                    repaint();
                }
            };
            addMouseListener(m);
            addMouseMotionListener(m);
        }

        @Override
        public void paintComponent(Graphics g) {
            super.paintComponent(g);
            if (start != null && end != null) {
                Graphics2D g2 = (Graphics2D) g.create();
                Rectangle r = new Rectangle(start);
                r.add(end);
                g2.setColor(new Color(230, 159, 0, 50));
                g2.fill(r);
                g2.setColor(Charts.SELECTED.darker());
                g2.setStroke(new BasicStroke(1f, BasicStroke.CAP_BUTT, BasicStroke.JOIN_MITER, 10f, new float[] {4f, 3f}, 0f));
                g2.draw(r);
                g2.dispose();
            }
        }
    }
}
