package org.leadline.workbench;

import org.jfree.chart.ChartPanel;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.leadline.watercolumn.SoundSpeedEquation;

import javax.swing.BorderFactory;
import javax.swing.DefaultListModel;
import javax.swing.JComboBox;
import javax.swing.JLabel;
import javax.swing.JList;
import javax.swing.JPanel;
import javax.swing.JScrollPane;
import javax.swing.JTextArea;
import javax.swing.ListSelectionModel;
import java.awt.BasicStroke;
import java.awt.BorderLayout;
import java.awt.Dimension;
import java.awt.FlowLayout;
import java.awt.GridLayout;
import java.util.List;
import java.util.function.Consumer;

/**
 * Casts: each cast's temperature, salinity and sound speed against depth (depth increasing
 * downwards), the derived profile as a line, the samples as measured as grey dots, and the
 * samples the QC rejected as vermilion crosses. The equation choice rebuilds the profiles.
 */
final class CastsView extends JPanel {
    private final DefaultListModel<String> names = new DefaultListModel<>();
    private final JList<String> list = new JList<>(names);
    private final JComboBox<SoundSpeedEquation> equation = new JComboBox<>(SoundSpeedEquation.values());
    private final JPanel charts = new JPanel(new GridLayout(1, 3, 4, 0));
    private final JTextArea notes = new JTextArea(4, 40);
    private final JLabel hint = new JLabel();
    private CastsModel model;
    private boolean updating;

    /** @param onEquation called after the equation changed (the frame records it for Reduce soundings) */
    CastsView(Consumer<SoundSpeedEquation> onEquation) {
        super(new BorderLayout(6, 6));
        setBorder(BorderFactory.createEmptyBorder(6, 6, 6, 6));
        JPanel top = new JPanel(new FlowLayout(FlowLayout.LEFT, 6, 0));
        top.add(new JLabel("Sound-speed equation:"));
        equation.setRenderer(new javax.swing.DefaultListCellRenderer() {
            @Override
            public java.awt.Component getListCellRendererComponent(JList<?> l, Object v, int i, boolean s, boolean f) {
                super.getListCellRendererComponent(l, v, i, s, f);
                if (v instanceof SoundSpeedEquation e) setText(e.title());
                return this;
            }
        });
        top.add(equation);
        top.add(hint);
        add(top, BorderLayout.NORTH);
        list.setSelectionMode(ListSelectionModel.SINGLE_SELECTION);
        JScrollPane ls = new JScrollPane(list);
        ls.setPreferredSize(new Dimension(150, 100));
        ls.setBorder(BorderFactory.createTitledBorder("Casts"));
        add(ls, BorderLayout.WEST);
        add(charts, BorderLayout.CENTER);
        notes.setEditable(false);
        JScrollPane ns = new JScrollPane(notes);
        ns.setBorder(BorderFactory.createTitledBorder("QC rejections and warnings"));
        add(ns, BorderLayout.SOUTH);
        list.addListSelectionListener(e -> { if (!e.getValueIsAdjusting()) showCast(); });
        equation.addActionListener(e -> {
            if (updating || model == null) return;
            SoundSpeedEquation eq = (SoundSpeedEquation) equation.getSelectedItem();
            model.rebuild(eq);
            hint.setText("Profiles rebuilt with " + eq.cliName() + "; Reduce soundings applies it to the soundings.");
            showCast();
            onEquation.accept(eq);
        });
    }

    void setModel(CastsModel m) {
        model = m;
        updating = true;
        names.clear();
        if (m != null) {
            for (int k = 0; k < m.size(); k++) {
                String n = m.cast(k).name();
                names.addElement(n == null || n.isEmpty() ? "cast " + (k + 1) : n);
            }
            if (m.equation() != null) equation.setSelectedItem(m.equation());
        }
        hint.setText("");
        updating = false;
        if (!names.isEmpty()) list.setSelectedIndex(0);
        else showCast();
    }

    CastsModel model() { return model; }
    JList<String> castList() { return list; }
    JComboBox<SoundSpeedEquation> equationBox() { return equation; }

    private void showCast() {
        charts.removeAll();
        int k = list.getSelectedIndex();
        if (model == null || k < 0) {
            notes.setText(model == null ? "" : "This project has no cast: rays are traced at the sounder's set speed.");
            charts.revalidate();
            charts.repaint();
            return;
        }
        for (CastsModel.Quantity q : CastsModel.Quantity.values()) charts.add(chart(k, q));
        StringBuilder sb = new StringBuilder();
        List<String> rej = model.rejectionReasons(k);
        java.util.Map<String, Integer> byKind = new java.util.LinkedHashMap<>();
        for (var r : model.profile(k).rejections()) {
            String kind = r.reason().contains(":") ? r.reason().substring(0, r.reason().indexOf(':')) : r.reason();
            byKind.merge(kind, 1, Integer::sum);
        }
        sb.append(rej.size()).append(" sample(s) rejected by the cast QC (crosses)");
        if (!byKind.isEmpty()) {
            sb.append(": ");
            java.util.StringJoiner j = new java.util.StringJoiner(", ");
            byKind.forEach((kind, count) -> j.add(count + " " + kind));
            sb.append(j);
        }
        sb.append('\n');
        for (String w : model.profile(k).warnings()) sb.append("warning: ").append(w).append('\n');
        for (String r : rej) sb.append("  ").append(r).append('\n');
        notes.setText(sb.toString());
        notes.setCaretPosition(0);
        charts.revalidate();
        charts.repaint();
    }

    private javax.swing.JComponent chart(int k, CastsModel.Quantity q) {
        if (model.profilePoints(k, q).isEmpty() && model.rawPoints(k, q).isEmpty()) {
            JLabel none = new JLabel("<html><center>" + q.label + "<br>not measured in this cast</center></html>",
                    javax.swing.SwingConstants.CENTER);
            none.setForeground(java.awt.Color.GRAY);
            none.setBorder(BorderFactory.createLineBorder(java.awt.Color.LIGHT_GRAY));
            return none;
        }
        // dataset 0, drawn last (on top): the derived profile; dataset 1: samples, then rejected ones
        XYSeriesCollection profile = new XYSeriesCollection(series("Profile", model.profilePoints(k, q)));
        XYSeriesCollection samples = new XYSeriesCollection();
        samples.addSeries(series("Samples", model.rawPoints(k, q)));
        samples.addSeries(series("Rejected by QC", model.rejectedPoints(k, q)));
        NumberAxis x = new NumberAxis(q.label);
        x.setAutoRangeIncludesZero(false);
        // a constant profile (a velocimeter cast in mixed water) still gets a readable axis
        x.setAutoRangeMinimumSize(q == CastsModel.Quantity.SOUND_SPEED ? 2.0 : 0.5);
        x.setNumberFormatOverride(new java.text.DecimalFormat(q == CastsModel.Quantity.SOUND_SPEED ? "0.0" : "0.00"));
        NumberAxis depth = new NumberAxis("Depth (m)");
        depth.setInverted(true); // depth increases downwards
        depth.setAutoRangeIncludesZero(true);
        XYLineAndShapeRenderer line = new XYLineAndShapeRenderer(true, false);
        line.setSeriesPaint(0, Charts.ACCEPTED);
        line.setSeriesStroke(0, new BasicStroke(2.5f));
        XYLineAndShapeRenderer dots = new XYLineAndShapeRenderer(false, true);
        dots.setSeriesShape(0, Charts.dot(4));
        dots.setSeriesPaint(0, Charts.RAW);
        dots.setSeriesShape(1, Charts.cross(7));
        dots.setSeriesPaint(1, Charts.REJECTED);
        XYPlot plot = new XYPlot(profile, x, depth, line);
        plot.setDataset(1, samples);
        plot.setRenderer(1, dots);
        plot.setDatasetRenderingOrder(org.jfree.chart.plot.DatasetRenderingOrder.REVERSE);
        // rejected samples underneath the accepted ones
        plot.setSeriesRenderingOrder(org.jfree.chart.plot.SeriesRenderingOrder.REVERSE);
        JFreeChart chart = new JFreeChart(q.label, JFreeChart.DEFAULT_TITLE_FONT, plot, q == CastsModel.Quantity.SOUND_SPEED);
        Charts.style(chart);
        ChartPanel p = new ChartPanel(chart, false, false, false, true, false);
        p.setMinimumDrawWidth(10);
        p.setMinimumDrawHeight(10);
        return p;
    }

    private static XYSeries series(String name, List<CastsModel.Point> pts) {
        XYSeries s = new XYSeries(name, false, true); // keep depth order: the value is on x
        for (CastsModel.Point p : pts) s.add(p.value(), p.depth());
        return s;
    }
}
