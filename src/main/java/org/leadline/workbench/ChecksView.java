package org.leadline.workbench;

import org.jfree.chart.ChartPanel;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.StandardXYBarPainter;
import org.jfree.chart.renderer.xy.XYBarRenderer;
import org.jfree.chart.ui.RectangleAnchor;
import org.jfree.chart.ui.TextAnchor;
import org.jfree.data.statistics.HistogramDataset;
import org.leadline.survey.SoundingTable;
import org.leadline.uncertainty.ComplianceSummary;
import org.leadline.uncertainty.CrosslineResult;
import org.leadline.uncertainty.S44Order;

import javax.swing.BorderFactory;
import javax.swing.JComboBox;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JScrollPane;
import javax.swing.JSplitPane;
import javax.swing.JTable;
import javax.swing.table.DefaultTableModel;
import java.awt.BasicStroke;
import java.awt.BorderLayout;
import java.awt.Dimension;
import java.awt.FlowLayout;
import java.awt.GridLayout;
import java.util.Locale;

/**
 * Checks: the TPU histogram (TVU at 95 % of the accepted soundings), the IHO S-44 compliance per
 * depth band for the chosen order, and the crossline comparison.
 */
final class ChecksView extends JPanel {
    private final JComboBox<S44Order> order = new JComboBox<>(S44Order.values());
    private final DefaultTableModel complianceRows = new DefaultTableModel(
            new String[] {"Depth band", "Soundings", "TVU ok %", "THU ok %", "Both ok %", "Mean TVU m",
                    "Mean THU m", "Max TVU/limit"}, 0) {
        @Override public boolean isCellEditable(int r, int c) { return false; }
    };
    private final DefaultTableModel crossRows = new DefaultTableModel(
            new String[] {"Depth band", "Compared", "Mean difference m", "Std deviation m", "Within TVU limit %"}, 0) {
        @Override public boolean isCellEditable(int r, int c) { return false; }
    };
    private final JLabel complianceTitle = new JLabel();
    private final JLabel crossTitle = new JLabel();
    private final JPanel histogram = new JPanel(new BorderLayout());
    private WorkbenchSession session;
    private boolean updating;

    ChecksView() {
        super(new BorderLayout());
        JPanel tables = new JPanel(new GridLayout(2, 1, 0, 6));
        JPanel comp = new JPanel(new BorderLayout());
        JPanel head = new JPanel(new FlowLayout(FlowLayout.LEFT, 6, 2));
        head.add(new JLabel("IHO S-44 order:"));
        order.setRenderer(new javax.swing.DefaultListCellRenderer() {
            @Override
            public java.awt.Component getListCellRendererComponent(javax.swing.JList<?> l, Object v, int i, boolean s, boolean f) {
                super.getListCellRendererComponent(l, v, i, s, f);
                if (v instanceof S44Order o) setText(o.label());
                return this;
            }
        });
        head.add(order);
        head.add(complianceTitle);
        comp.add(head, BorderLayout.NORTH);
        comp.add(new JScrollPane(new JTable(complianceRows)), BorderLayout.CENTER);
        JPanel cross = new JPanel(new BorderLayout());
        crossTitle.setBorder(BorderFactory.createEmptyBorder(4, 6, 4, 6));
        cross.add(crossTitle, BorderLayout.NORTH);
        cross.add(new JScrollPane(new JTable(crossRows)), BorderLayout.CENTER);
        tables.add(comp);
        tables.add(cross);
        histogram.setPreferredSize(new Dimension(420, 300));
        JSplitPane split = new JSplitPane(JSplitPane.HORIZONTAL_SPLIT, histogram, tables);
        split.setResizeWeight(0.4);
        add(split, BorderLayout.CENTER);
        order.addActionListener(e -> { if (!updating) showCompliance(); });
    }

    void setSession(WorkbenchSession s) {
        session = s;
        updating = true;
        if (s != null) order.setSelectedItem(s.result().order());
        updating = false;
        refresh();
    }

    JComboBox<S44Order> orderBox() { return order; }
    DefaultTableModel complianceRows() { return complianceRows; }
    DefaultTableModel crosslineRows() { return crossRows; }

    void refresh() {
        histogram.removeAll();
        if (session != null) histogram.add(histogramChart(), BorderLayout.CENTER);
        histogram.revalidate();
        histogram.repaint();
        showCompliance();
        showCrosslines();
    }

    private ChartPanel histogramChart() {
        SoundingTable s = session.soundings();
        double[] tvu = new double[s.size];
        int k = 0;
        for (int i = 0; i < s.size; i++) if (s.accepted(i) && Double.isFinite(s.tvu[i])) tvu[k++] = s.tvu[i];
        // the order's TVU limit at the median depth, as a reference line; the axis runs from 0 to
        // past both the limit and the largest TVU, so the margin to the limit is seen at a glance
        S44Order o = (S44Order) order.getSelectedItem();
        double lim = Double.NaN, median = Double.NaN;
        double[] d = new double[s.size];
        int m = 0;
        for (int i = 0; i < s.size; i++) if (s.accepted(i) && Double.isFinite(s.depth[i])) d[m++] = s.depth[i];
        if (o != null && m > 0) {
            java.util.Arrays.sort(d, 0, m);
            median = d[m / 2];
            lim = o.tvuLimit(median);
        }
        double max = 0;
        for (int j = 0; j < k; j++) max = Math.max(max, tvu[j]);
        double upper = 1.1 * Math.max(max, Double.isFinite(lim) ? lim : 0);
        HistogramDataset data = new HistogramDataset();
        if (k > 0 && upper > 0) data.addSeries("TVU", java.util.Arrays.copyOf(tvu, k), 50, 0, upper);
        NumberAxis x = new NumberAxis("TVU, 95 % (m)");
        if (upper > 0) x.setRange(0, upper);
        NumberAxis y = new NumberAxis("Accepted soundings");
        XYBarRenderer r = new XYBarRenderer(0.05);
        r.setBarPainter(new StandardXYBarPainter());
        r.setShadowVisible(false);
        r.setSeriesPaint(0, Charts.ACCEPTED);
        XYPlot plot = new XYPlot(data, x, y, r);
        if (Double.isFinite(lim)) {
            {
                ValueMarker mk = new ValueMarker(lim, Charts.REJECTED, new BasicStroke(2f));
                mk.setLabel(String.format(Locale.ROOT, "%s TVU limit at %.1f m: %.2f m", o.label(), median, lim));
                boolean leftHalf = lim < plotMid(data);
                mk.setLabelAnchor(leftHalf ? RectangleAnchor.TOP_RIGHT : RectangleAnchor.TOP_LEFT);
                mk.setLabelTextAnchor(leftHalf ? TextAnchor.TOP_LEFT : TextAnchor.TOP_RIGHT);
                mk.setLabelOffset(new org.jfree.chart.ui.RectangleInsets(6, 6, 6, 6));
                mk.setLabelFont(new java.awt.Font(java.awt.Font.SANS_SERIF, java.awt.Font.PLAIN, 11));
                plot.addDomainMarker(mk);
            }
        }
        JFreeChart chart = new JFreeChart(String.format(Locale.ROOT, "TPU: TVU of %d accepted soundings", k),
                JFreeChart.DEFAULT_TITLE_FONT, plot, false);
        Charts.style(chart);
        return new ChartPanel(chart, false, true, false, false, true);
    }

    /** Middle of the histogram's x range (to put the limit's label on the roomier side). */
    private static double plotMid(HistogramDataset d) {
        if (d.getSeriesCount() == 0 || d.getItemCount(0) == 0) return 0;
        return (d.getStartXValue(0, 0) + d.getEndXValue(0, d.getItemCount(0) - 1)) / 2;
    }

    private void showCompliance() {
        complianceRows.setRowCount(0);
        if (session == null) {
            complianceTitle.setText("");
            return;
        }
        S44Order o = (S44Order) order.getSelectedItem();
        ComplianceSummary c = session.compliance(o);
        complianceTitle.setText(String.format(Locale.ROOT, "%d accepted soundings: %.1f %% within TVU, %.1f %% within THU",
                c.evaluated(), c.pctTvu(), c.pctThu()));
        for (ComplianceSummary.Band b : c.bands()) {
            complianceRows.addRow(new Object[] {b.label(), b.count(), pct(b.pctTvu()), pct(b.pctThu()), pct(b.pctBoth()),
                    num(b.meanTvu()), num(b.meanThu()), num(b.maxTvuRatio())});
        }
        complianceRows.addRow(new Object[] {"all", c.evaluated(), pct(c.pctTvu()), pct(c.pctThu()), pct(c.pctBoth()),
                "", "", ""});
        if (histogram.getComponentCount() > 0 && !updating) { // keep the limit line on the chosen order
            histogram.removeAll();
            histogram.add(histogramChart(), BorderLayout.CENTER);
            histogram.revalidate();
        }
    }

    private void showCrosslines() {
        crossRows.setRowCount(0);
        if (session == null || session.surface() == null) {
            crossTitle.setText("");
            return;
        }
        SurfaceState s = session.surface();
        CrosslineResult r = s.crosslines();
        if (r == null) {
            crossTitle.setText(s.crosslineNames().isEmpty()
                    ? "Crosslines: none named in the project (settings: crosslines)"
                    : "Crosslines " + s.crosslineNames() + ": no accepted crossline sounding over the main-scheme surface");
            return;
        }
        crossTitle.setText("Crosslines " + String.join(", ", s.crosslineNames()) + " minus the main-scheme surface ("
                + r.unmatched() + " crossline soundings off the surface)" + (session.surfaceStale() ? "; edits since: Build surface to update" : ""));
        for (CrosslineResult.Stats st : r.bands()) addCross(st);
        addCross(r.overall());
    }

    private void addCross(CrosslineResult.Stats st) {
        crossRows.addRow(new Object[] {st.label(), st.count(), num(st.meanDifference()), num(st.standardDeviation()),
                pct(100 * st.shareWithinLimit())});
    }

    private static String pct(double v) { return Double.isFinite(v) ? String.format(Locale.ROOT, "%.1f", v) : "-"; }

    private static String num(double v) { return Double.isFinite(v) ? String.format(Locale.ROOT, "%.3f", v) : "-"; }
}
