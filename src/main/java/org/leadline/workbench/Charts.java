package org.leadline.workbench;

import org.jfree.chart.JFreeChart;
import org.jfree.chart.plot.XYPlot;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Shape;
import java.awt.geom.Ellipse2D;
import java.awt.geom.GeneralPath;
import java.awt.geom.Rectangle2D;

/** Shared chart styling and marker shapes of the workbench views. */
final class Charts {
    private Charts() {}

    /** Accepted soundings: small filled dots in dark blue. */
    static final Color ACCEPTED = new Color(0x1F4E79);
    /** Rejected soundings: crosses in vermilion (told apart from accepted by shape and colour). */
    static final Color REJECTED = new Color(0xD55E00);
    /** Selection highlight. */
    static final Color SELECTED = new Color(0xE69F00);
    static final Color RAW = new Color(0x9A9A9A);

    static Shape dot(double size) { return new Ellipse2D.Double(-size / 2, -size / 2, size, size); }

    static Shape square(double size) { return new Rectangle2D.Double(-size / 2, -size / 2, size, size); }

    /** An X cross as a filled outline (so that renderers fill it). */
    static Shape cross(double size) {
        BasicStroke s = new BasicStroke((float) (size / 4));
        GeneralPath p = new GeneralPath();
        double h = size / 2;
        p.moveTo(-h, -h);
        p.lineTo(h, h);
        p.moveTo(-h, h);
        p.lineTo(h, -h);
        return s.createStrokedShape(p);
    }

    /** Light background, grey grid lines, a plain title font. */
    static void style(JFreeChart chart) {
        chart.setBackgroundPaint(Color.WHITE);
        if (chart.getTitle() != null) chart.getTitle().setFont(new Font(Font.SANS_SERIF, Font.BOLD, 13));
        if (chart.getPlot() instanceof XYPlot p) {
            p.setBackgroundPaint(Color.WHITE);
            p.setDomainGridlinePaint(new Color(0xDDDDDD));
            p.setRangeGridlinePaint(new Color(0xDDDDDD));
            p.setOutlinePaint(Color.GRAY);
        }
    }
}
