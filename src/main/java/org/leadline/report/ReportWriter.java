package org.leadline.report;

import org.jfree.chart.ChartFactory;
import org.jfree.chart.ChartUtils;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.plot.PlotOrientation;
import org.jfree.chart.plot.XYPlot;
import org.jfree.data.category.DefaultCategoryDataset;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.leadline.pipeline.OutputFolder;
import org.leadline.pipeline.ProcessingRun;
import org.leadline.survey.Project;
import org.leadline.survey.SoundingTable;
import org.leadline.surface.Coverage;
import org.leadline.surface.Grid;
import org.leadline.uncertainty.ComplianceSummary;
import org.leadline.uncertainty.CrosslineResult;
import org.leadline.uncertainty.TpuSummary;
import org.leadline.watercolumn.DerivedProfile;

import java.awt.image.BufferedImage;
import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Base64;
import java.util.List;
import java.util.Locale;

/**
 * Writes {@code report.html}: a self-contained processing report (charts embedded as PNG and also
 * written beside it) with the survey summary, inputs and their SHA-256, casts and profiles, the
 * corrections applied, TPU breakdown, IHO S-44 compliance, cleaning statistics, crosslines, the
 * surface with its colour legend, holidays, and the cautions. Every number comes from the run.
 */
public final class ReportWriter {
    private ReportWriter() {}

    /**
     * @param inputs the run's inputs with their SHA-256 (as written to lineage.json)
     */
    public static void write(ProcessingRun.Result r, Project project, List<org.leadline.io.LineageWriter.Input> inputs,
                             Path html, OutputFolder out) throws IOException {
        StringBuilder h = new StringBuilder(1 << 15);
        h.append("<!DOCTYPE html><html lang=\"en\"><head><meta charset=\"utf-8\"><title>Leadline processing report</title>")
                .append("<style>body{font-family:sans-serif;max-width:60em;margin:2em auto;color:#222}")
                .append("table{border-collapse:collapse}td,th{border:1px solid #bbb;padding:.2em .5em;text-align:right}")
                .append("th{background:#eef}.caution{border:2px solid #a33;padding:.6em;background:#fff4f4}</style></head><body>\n");
        h.append("<h1>Leadline processing report</h1>\n");
        caution(h);
        ProcessingRun.SoundingCounts s = r.counts();
        long acc = s.accepted();
        h.append("<h2 id=\"summary\">Survey summary</h2><table>");
        row(h, "Project", esc(project.name().isEmpty() ? project.folder().getFileName().toString() : project.name()));
        row(h, "Processed", esc(r.started()) + " with Leadline " + esc(ProcessingRun.version()));
        row(h, "Soundings", s.soundings() + " (" + acc + " accepted, " + (s.soundings() - acc) + " rejected)");
        row(h, "Survey lines", String.valueOf(s.lines()));
        row(h, "Projected CRS", esc(r.projection().code() + " " + r.projection().name()));
        row(h, "Surface", r.method().name().toLowerCase(Locale.ROOT) + ", cell " + f(r.gridSpec().cell(), 2) + " m, "
                + r.grid().nx + " x " + r.grid().ny + " cells");
        h.append("</table>\n");

        h.append("<h2 id=\"inputs\">Inputs</h2><table><tr><th>file</th><th>SHA-256</th></tr>");
        for (org.leadline.io.LineageWriter.Input in : inputs) {
            h.append("<tr><td style=\"text-align:left\">").append(esc(in.path().getFileName().toString())).append("</td><td><code>")
                    .append(in.sha256()).append("</code></td></tr>");
        }
        h.append("</table>\n");

        h.append("<h2 id=\"casts\">Casts and sound-speed profiles</h2>");
        if (r.inputs().profiles.isEmpty()) {
            h.append("<p>No cast: rays traced at the sounder's set speed.</p>");
        } else {
            XYSeriesCollection ds = new XYSeriesCollection();
            h.append("<table><tr><th>cast</th><th>samples kept</th><th>QC rejections</th><th>depth range (m)</th><th>speed range (m/s)</th></tr>");
            for (int k = 0; k < r.inputs().profiles.size(); k++) {
                DerivedProfile d = r.inputs().profiles.get(k);
                String name = r.inputs().casts.get(k).name();
                XYSeries ser = new XYSeries(name == null || name.isEmpty() ? "cast " + (k + 1) : name, false, true); // keep depth order
                double cmin = Double.MAX_VALUE, cmax = -Double.MAX_VALUE;
                for (int i = 0; i < d.depth().length; i++) {
                    ser.add(d.soundSpeed()[i], d.depth()[i]);
                    cmin = Math.min(cmin, d.soundSpeed()[i]);
                    cmax = Math.max(cmax, d.soundSpeed()[i]);
                }
                ds.addSeries(ser);
                h.append("<tr><td>").append(esc(ser.getKey().toString())).append("</td><td>").append(d.depth().length)
                        .append("</td><td>").append(d.rejections().size()).append("</td><td>")
                        .append(f(d.depth()[0], 1)).append(" - ").append(f(d.depth()[d.depth().length - 1], 1))
                        .append("</td><td>").append(f(cmin, 2)).append(" - ").append(f(cmax, 2)).append("</td></tr>");
            }
            h.append("</table>");
            JFreeChart ch = ChartFactory.createXYLineChart("Sound-speed profiles", "sound speed (m/s)", "depth (m)", ds,
                    PlotOrientation.VERTICAL, true, false, false);
            XYPlot plot = (XYPlot) ch.getPlot();
            plot.getRangeAxis().setInverted(true);
            plot.setBackgroundPaint(java.awt.Color.WHITE);
            plot.setDomainGridlinePaint(java.awt.Color.LIGHT_GRAY);
            plot.setRangeGridlinePaint(java.awt.Color.LIGHT_GRAY);
            ((org.jfree.chart.axis.NumberAxis) plot.getDomainAxis()).setNumberFormatOverride(new java.text.DecimalFormat("0.0"));
            image(h, out, "report-profiles.png", ch.createBufferedImage(640, 420), "Sound-speed profiles");
        }

        h.append("<h2 id=\"corrections\">Corrections applied</h2><table>");
        var v = r.inputs().vessel;
        row(h, "Transducer draft", f(v.transducerDraft(), 3) + " m");
        row(h, "Settlement table", v.settlementSpeeds().length + " entries, up to "
                + f(max(v.settlementValues()), 3) + " m");
        row(h, "Transducer offset (x, y, z)", offset(v.transducerOffset()));
        row(h, "Position reference offset (x, y, z)", offset(v.positionOffset()));
        row(h, "Latency", f(v.latency(), 3) + " s");
        row(h, "Sounder set speed", f(v.sounderSetSpeed(), 1) + " m/s");
        row(h, "Water level", r.inputs().waterLevel == null ? "none (depths NOT reduced to chart datum)"
                : "gauge record" + (r.inputs().waterLevel.zones().isEmpty() ? "" : " with " + r.inputs().waterLevel.zones().size() + " tide zones"));
        h.append("</table>\n");

        TpuSummary t = r.tpu();
        h.append("<h2 id=\"tpu\">Total propagated uncertainty</h2><p>Mean TVU ").append(f(t.meanTvu(), 3))
                .append(" m (max ").append(f(t.maxTvu(), 3)).append(" m), mean THU ").append(f(t.meanThu(), 3))
                .append(" m (max ").append(f(t.maxThu(), 3)).append(" m), 95 % confidence, over ").append(t.count())
                .append(" accepted soundings.</p><table><tr><th>component</th><th>vertical RMS 1&sigma; (m)</th><th>horizontal RMS 1&sigma; (m)</th></tr>");
        DefaultCategoryDataset tds = new DefaultCategoryDataset();
        for (TpuSummary.Entry e : t.entries()) {
            h.append("<tr><td style=\"text-align:left\">").append(esc(e.label())).append("</td><td>").append(f(e.rmsVertical(), 4))
                    .append("</td><td>").append(f(e.rmsHorizontal(), 4)).append("</td></tr>");
            tds.addValue(e.rmsVertical(), "vertical", e.label());
        }
        h.append("</table>");
        JFreeChart tch = ChartFactory.createBarChart("TVU components (RMS, one sigma)", "", "m", tds,
                PlotOrientation.HORIZONTAL, false, false, false);
        tch.getCategoryPlot().setBackgroundPaint(java.awt.Color.WHITE);
        tch.getCategoryPlot().setRangeGridlinePaint(java.awt.Color.LIGHT_GRAY);
        image(h, out, "report-tpu.png", tch.createBufferedImage(640, 420), "TVU components");

        ComplianceSummary c = r.compliance();
        h.append("<h2 id=\"s44\">IHO S-44 compliance: ").append(esc(r.order().label())).append("</h2><p>")
                .append(f(c.pctTvu(), 2)).append(" % of ").append(c.evaluated()).append(" accepted soundings within the TVU limit, ")
                .append(f(c.pctThu(), 2)).append(" % within the THU limit, ").append(f(c.pctBoth(), 2))
                .append(" % within both (IHO S-44 edition 6.0.0).</p><table><tr><th>depth band</th><th>soundings</th><th>% TVU</th><th>% THU</th><th>mean TVU (m)</th><th>mean THU (m)</th></tr>");
        for (ComplianceSummary.Band b : c.bands()) {
            if (b.count() == 0) continue;
            h.append("<tr><td>").append(esc(b.label())).append("</td><td>").append(b.count()).append("</td><td>")
                    .append(f(b.pctTvu(), 2)).append("</td><td>").append(f(b.pctThu(), 2)).append("</td><td>")
                    .append(f(b.meanTvu(), 3)).append("</td><td>").append(f(b.meanThu(), 3)).append("</td></tr>");
        }
        h.append("</table>\n");

        h.append("<h2 id=\"cleaning\">Cleaning</h2><table><tr><th>reason</th><th>soundings rejected</th></tr>");
        for (SoundingTable.Reason why : SoundingTable.Reason.values()) {
            long k = why == SoundingTable.Reason.NONE ? 0 : s.rejectedFor(why);
            if (k > 0) {
                h.append("<tr><td style=\"text-align:left\">").append(why.label).append("</td><td>").append(k).append("</td></tr>");
            }
        }
        h.append("</table><p>Edit journal: ").append(r.journalEdits()).append(" reviewer edits replayed.</p>\n");

        h.append("<h2 id=\"crosslines\">Crosslines</h2>");
        CrosslineResult x = r.crosslines();
        if (x == null) {
            h.append("<p>No crosslines named in the project (settings: crosslines).</p>");
        } else {
            h.append("<p>Lines ").append(esc(String.join(", ", r.crosslineLines()))).append(" against the main-scheme surface; difference = crossline - surface.</p>")
                    .append("<table><tr><th>band</th><th>count</th><th>mean (m)</th><th>std dev (m)</th><th>% within TVU limit</th></tr>");
            crossRow(h, x.overall());
            for (CrosslineResult.Stats b : x.bands()) if (b.count() > 0) crossRow(h, b);
            h.append("</table>");
        }

        h.append("<h2 id=\"surface\">Depth surface</h2>");
        image(h, out, "report-surface.png", SurfacePicture.render(r.grid(), 640), "Depth surface with colour legend");
        Coverage cov = r.coverage();
        h.append("<p>Coverage: ").append(f(100 * cov.coverage(), 2)).append(" % of the surveyed footprint has data (")
                .append(cov.cellsWithData()).append(" cells).</p>");
        h.append("<h3 id=\"holidays\">Holidays</h3>");
        if (cov.holidays().isEmpty()) {
            h.append("<p>No holidays (empty cells surrounded by data).</p>");
        } else {
            h.append("<table><tr><th>easting</th><th>northing</th><th>cells</th><th>area (m&sup2;)</th></tr>");
            int k = 0;
            for (Coverage.Holiday ho : cov.holidays()) {
                if (k++ == 50) break;
                h.append("<tr><td>").append(f(ho.easting(), 1)).append("</td><td>").append(f(ho.northing(), 1))
                        .append("</td><td>").append(ho.cells()).append("</td><td>").append(f(ho.area(), 1)).append("</td></tr>");
            }
            h.append("</table><p>").append(cov.holidays().size()).append(" holidays in all.</p>");
        }

        if (!r.warnings().isEmpty()) {
            h.append("<h2 id=\"warnings\">Warnings</h2><ul>");
            for (String w : r.warnings()) h.append("<li>").append(esc(w)).append("</li>");
            h.append("</ul>");
        }
        caution(h);
        h.append("</body></html>\n");
        Files.writeString(html, h.toString(), StandardCharsets.UTF_8);
    }

    private static void crossRow(StringBuilder h, CrosslineResult.Stats b) {
        h.append("<tr><td>").append(esc(b.label())).append("</td><td>").append(b.count()).append("</td><td>")
                .append(f(b.meanDifference(), 3)).append("</td><td>").append(f(b.standardDeviation(), 3)).append("</td><td>")
                .append(f(100 * b.shareWithinLimit(), 2)).append("</td></tr>");
    }

    private static void caution(StringBuilder h) {
        h.append("<p class=\"caution\"><b>Caution.</b> Not for navigation unless validated by a qualified hydrographer. ")
                .append("Local regulations, the charting authority and licensed professional practice prevail over anything in this report.</p>\n");
    }

    private static void image(StringBuilder h, OutputFolder out, String name, BufferedImage img, String alt) throws IOException {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        ChartUtils.writeBufferedImageAsPNG(bytes, img);
        Files.write(out.stage(name), bytes.toByteArray());
        h.append("<p><img alt=\"").append(esc(alt)).append("\" src=\"data:image/png;base64,")
                .append(Base64.getEncoder().encodeToString(bytes.toByteArray())).append("\"></p>\n");
    }

    private static void row(StringBuilder h, String k, String v) {
        h.append("<tr><th style=\"text-align:left\">").append(esc(k)).append("</th><td style=\"text-align:left\">").append(v).append("</td></tr>");
    }

    private static String offset(org.leadline.survey.Vessel.Offset o) {
        return f(o.x(), 3) + ", " + f(o.y(), 3) + ", " + f(o.z(), 3) + " m";
    }

    private static double max(double[] a) {
        double m = 0;
        for (double x : a) m = Math.max(m, x);
        return m;
    }

    static String f(double v, int d) {
        return Double.isNaN(v) ? "n/a" : String.format(Locale.ROOT, "%." + d + "f", v);
    }

    static String esc(String s) {
        return s.replace("&", "&amp;").replace("<", "&lt;").replace(">", "&gt;").replace("\"", "&quot;");
    }

    /** Grid layer statistics used by tests and the workbench. */
    static double[] range(Grid g) {
        double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
        for (float x : g.layer(Grid.DEPTH)) if (Float.isFinite(x)) { lo = Math.min(lo, x); hi = Math.max(hi, x); }
        return new double[]{lo, hi};
    }
}
