package org.leadline.workbench;

import org.leadline.cleaning.Edit;
import org.leadline.io.EditJournalFile;

import javax.imageio.ImageIO;
import javax.swing.AbstractButton;
import javax.swing.JDialog;
import javax.swing.SwingUtilities;
import java.awt.Component;
import java.awt.Container;
import java.awt.Graphics2D;
import java.awt.Point;
import java.awt.Window;
import java.awt.event.ActionEvent;
import java.awt.event.InputEvent;
import java.awt.event.MouseEvent;
import java.awt.image.BufferedImage;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Properties;
import java.util.concurrent.Callable;
import java.util.concurrent.atomic.AtomicReference;

/**
 * The workbench driven like a reviewer would, in a JVM with a display (started by
 * {@link WorkbenchGuiTest} under Xvfb): acknowledges the first-start cautions, opens the test
 * survey, clicks a line in Track, drags a box in Along-track, rejects through the Reject pings
 * action, builds the surface, undoes, and saves a screenshot of each view. Writes what it saw
 * into a properties file for the test to check.
 *
 * <p>Arguments: work folder, screenshot folder, results file.
 */
public final class WorkbenchGuiScenario {
    private static final Properties out = new Properties();

    public static void main(String[] args) throws Exception {
        Path work = Path.of(args[0]), shots = Path.of(args[1]), results = Path.of(args[2]);
        Files.createDirectories(shots);
        int code = 0;
        try {
            run(work, shots);
            out.setProperty("ok", "true");
        } catch (Throwable t) {
            out.setProperty("ok", "false");
            out.setProperty("error", t.toString());
            t.printStackTrace();
            code = 1;
        }
        try (OutputStream o = Files.newOutputStream(results)) {
            out.store(o, "workbench GUI scenario");
        }
        System.exit(code);
    }

    private static void run(Path work, Path shots) throws Exception {
        Path project = TestSurvey.write(work.resolve("survey"));
        put("headless", java.awt.GraphicsEnvironment.isHeadless());
        WorkbenchPrefs prefs = WorkbenchPrefs.user();
        put("cautionsBefore", prefs.cautionsAcknowledged());
        WorkbenchFrame f = Workbench.start(null);

        // the first-start cautions
        JDialog caution = waitFor(() -> {
            for (Window w : Window.getWindows()) {
                if (w instanceof JDialog d && d.isShowing() && Cautions.TITLE.equals(d.getTitle())) return d;
            }
            return null;
        }, 30_000, "the cautions dialog");
        settle();
        shoot(caution, shots.resolve("0-cautions.png"));
        onEdt(() -> { button(caution, "OK").doClick(); return null; });
        waitFor(() -> prefs.cautionsAcknowledged() ? Boolean.TRUE : null, 10_000, "the cautions to be remembered");
        put("cautionsAfter", prefs.cautionsAcknowledged());

        // open the project (the same call File > Open project... makes after the chooser)
        onEdt(() -> { f.setSize(1280, 820); f.openProject(project); return null; });
        waitFor(() -> !onEdt(f::busy) && onEdt(f::session) != null ? Boolean.TRUE : null, 120_000, "the project to open");
        WorkbenchSession s = onEdt(f::session);
        int accepted0 = onEdt(() -> s.soundings().countAccepted());
        put("soundings", s.soundings().size);
        put("accepted0", accepted0);
        put("gridded0", s.surface().accepted());
        put("mean0", s.surface().meanDepth());

        onEdt(() -> { f.showView(WorkbenchFrame.CASTS); f.castsView().castList().setSelectedIndex(1); return null; });
        settle();
        shoot(f, shots.resolve("1-casts.png"));
        put("castCount", onEdt(() -> f.castsView().model().size()));
        put("castQcRejected", onEdt(() -> f.castsView().model().profile(1).rejections().size()));
        put("castRejectedMarkers", onEdt(() -> f.castsView().model().rejectedPoints(1, CastsModel.Quantity.TEMPERATURE).size()));

        // Track: click on line L2 to open it in Along-track
        onEdt(() -> { f.showView(WorkbenchFrame.TRACK); return null; });
        settle();
        shoot(f, shots.resolve("2-track.png"));
        onEdt(() -> {
            TrackView tv = f.trackView();
            int i = firstOfLine(s, "L2") + 100;
            int[] p = tv.toPixel(s.soundings().easting[i], s.soundings().northing[i]);
            for (int id : new int[] {MouseEvent.MOUSE_PRESSED, MouseEvent.MOUSE_RELEASED, MouseEvent.MOUSE_CLICKED}) {
                tv.dispatchEvent(new MouseEvent(tv, id, System.currentTimeMillis(), 0, p[0], p[1], 1, false, MouseEvent.BUTTON1));
            }
            return null;
        });
        settle();
        put("alongTrackLine", onEdt(() -> f.alongTrackView().model().line()));
        put("tabAfterClick", onEdt(() -> f.tabs().getTitleAt(f.tabs().getSelectedIndex())));

        // Along-track: TVU band on, drag a box over pings 60..79 (every depth), then Reject pings
        onEdt(() -> { f.alongTrackView().tvuBandBox().doClick(); return null; });
        settle();
        AlongTrackModel m = onEdt(() -> f.alongTrackView().model());
        int[] expectAccepted = {0};
        onEdt(() -> {
            for (int k = 60; k <= 79; k++) if (m.accepted(k)) expectAccepted[0]++;
            double[] r = m.depthRange();
            AlongTrackView v = f.alongTrackView();
            Point a = v.toScreen(m.distance(60) - 0.5, r[0] - 0.2);
            Point b = v.toScreen(m.distance(79) + 0.5, r[1] + 0.2);
            Component c = v.chartPanel();
            long t = System.currentTimeMillis();
            c.dispatchEvent(new MouseEvent(c, MouseEvent.MOUSE_PRESSED, t, InputEvent.BUTTON1_DOWN_MASK, a.x, a.y, 1, false, MouseEvent.BUTTON1));
            c.dispatchEvent(new MouseEvent(c, MouseEvent.MOUSE_DRAGGED, t + 10, InputEvent.BUTTON1_DOWN_MASK, (a.x + b.x) / 2, (a.y + b.y) / 2, 0, false, MouseEvent.NOBUTTON));
            c.dispatchEvent(new MouseEvent(c, MouseEvent.MOUSE_DRAGGED, t + 20, InputEvent.BUTTON1_DOWN_MASK, b.x, b.y, 0, false, MouseEvent.NOBUTTON));
            c.dispatchEvent(new MouseEvent(c, MouseEvent.MOUSE_RELEASED, t + 30, 0, b.x, b.y, 1, false, MouseEvent.BUTTON1));
            return null;
        });
        put("selected", onEdt(() -> m.selection().length));
        put("selectedFirst", onEdt(() -> m.selection()[0]));
        put("expectRejected", expectAccepted[0]);
        onEdt(() -> { f.rejectAction().actionPerformed(new ActionEvent(f, ActionEvent.ACTION_PERFORMED, "reject")); return null; });
        settle();
        shoot(f, shots.resolve("3-along-track.png"));
        put("accepted1", onEdt(() -> s.soundings().countAccepted()));
        put("stale1", onEdt(s::surfaceStale));
        List<Edit> journal = EditJournalFile.read(s.journalPath()).edits();
        put("journalPath", s.journalPath());
        put("journalEdits1", journal.size());
        put("journalAction1", journal.isEmpty() ? "" : journal.get(0).action());
        put("journalSelection1", journal.isEmpty() ? "" : journal.get(0).selection());

        // Build surface: regrid off the event thread
        onEdt(() -> {
            f.surfaceView().hillShadeBox().doClick();
            f.showView(WorkbenchFrame.DEPTH_SURFACE);
            f.buildSurfaceAction().actionPerformed(new ActionEvent(f, ActionEvent.ACTION_PERFORMED, "build"));
            return null;
        });
        waitFor(() -> !onEdt(f::busy) && !onEdt(s::surfaceStale) ? Boolean.TRUE : null, 60_000, "Build surface");
        put("gridded1", onEdt(() -> s.surface().accepted()));
        put("mean1", onEdt(() -> s.surface().meanDepth()));
        settle();
        onEdt(() -> {
            SurfaceView.Canvas c = f.surfaceView().canvas();
            var g = s.surface().grid();
            float[] d = g.layer(org.leadline.surface.Grid.DEPTH);
            int cell = 0;
            while (!Float.isFinite(d[cell])) cell++; // the first cell with data, north-west first
            Point p = c.toPixel(g.centreX(cell % g.nx), g.centreY(cell / g.nx));
            put("readoutCellDepth", (double) d[cell]);
            c.dispatchEvent(new MouseEvent(c, MouseEvent.MOUSE_MOVED, System.currentTimeMillis(), 0, p.x, p.y, 0, false, MouseEvent.NOBUTTON));
            return null;
        });
        settle();
        put("readout", onEdt(() -> f.surfaceView().readoutText()));
        shoot(f, shots.resolve("4-depth-surface.png"));

        // Export: a processing run that replays the journal, written to a folder
        Path exportDir = work.resolve("export");
        onEdt(() -> { f.export(exportDir); return null; });
        waitFor(() -> !onEdt(f::busy) ? Boolean.TRUE : null, 120_000, "Export");
        put("exportMessage", onEdt(f::statusMessage));
        long reviewer = 0;
        Path csv = exportDir.resolve("soundings.csv");
        if (Files.exists(csv)) {
            try (var lines = Files.lines(csv)) { reviewer = lines.filter(l -> l.endsWith(",reviewer")).count(); }
        }
        put("exportSoundingsCsv", Files.exists(csv));
        put("exportReviewerRejected", reviewer);
        put("exportSurface", Files.exists(exportDir.resolve("surface.tif")));

        onEdt(() -> { f.showView(WorkbenchFrame.CHECKS); return null; });
        settle();
        shoot(f, shots.resolve("5-checks.png"));
        put("complianceRows", onEdt(() -> f.checksView().complianceRows().getRowCount()));
        put("crosslineRows", onEdt(() -> f.checksView().crosslineRows().getRowCount()));

        // Undo with Ctrl+Z and redo with Ctrl+Y through the window's key bindings, then undo with
        // its action: each is a journal line
        put("keyUndo", onEdt(() -> key(f, java.awt.event.KeyEvent.VK_Z, InputEvent.CTRL_DOWN_MASK)));
        put("accepted2", onEdt(() -> s.soundings().countAccepted()));
        put("redoEnabled", onEdt(() -> f.redoAction().isEnabled()));
        put("keyRedo", onEdt(() -> key(f, java.awt.event.KeyEvent.VK_Y, InputEvent.CTRL_DOWN_MASK)));
        put("accepted3", onEdt(() -> s.soundings().countAccepted()));
        onEdt(() -> { f.undoAction().actionPerformed(new ActionEvent(f, ActionEvent.ACTION_PERFORMED, "undo")); return null; });
        put("accepted4", onEdt(() -> s.soundings().countAccepted()));
        journal = EditJournalFile.read(s.journalPath()).edits();
        put("journalEdits2", journal.size());
        put("rejectKey", onEdt(() -> String.valueOf(f.rejectAction().getValue(javax.swing.Action.ACCELERATOR_KEY))));
        put("restoreKey", onEdt(() -> String.valueOf(f.restoreAction().getValue(javax.swing.Action.ACCELERATOR_KEY))));
        onEdt(() -> { f.quit(); return null; });
    }

    /** Presses a key in the window as the keyboard would (key bindings of the focused window). */
    private static boolean key(WorkbenchFrame f, int code, int modifiers) {
        java.awt.event.KeyEvent e = new java.awt.event.KeyEvent(f.getRootPane(), java.awt.event.KeyEvent.KEY_PRESSED,
                System.currentTimeMillis(), modifiers, code, java.awt.event.KeyEvent.CHAR_UNDEFINED);
        return SwingUtilities.processKeyBindings(e);
    }

    private static int firstOfLine(WorkbenchSession s, String line) {
        int id = s.soundings().lineNames().indexOf(line);
        for (int i = 0; i < s.soundings().size; i++) if (s.soundings().line[i] == id) return i;
        throw new IllegalStateException("no line " + line);
    }

    private static void put(String k, Object v) {
        String text = v instanceof Double d ? String.format(Locale.ROOT, "%.6f", d) : String.valueOf(v);
        out.setProperty(k, text);
        System.out.println(k + " = " + text);
    }

    private static AbstractButton button(Container c, String text) {
        for (Component k : c.getComponents()) {
            if (k instanceof AbstractButton b && text.equals(b.getText())) return b;
            if (k instanceof Container cc) {
                AbstractButton b = button(cc, text);
                if (b != null) return b;
            }
        }
        return null;
    }

    /** Lets pending events and repaints run. */
    private static void settle() throws Exception {
        for (int k = 0; k < 3; k++) {
            SwingUtilities.invokeAndWait(() -> {});
            Thread.sleep(60);
        }
    }

    private static <T> T onEdt(Callable<T> c) throws Exception {
        AtomicReference<T> r = new AtomicReference<>();
        AtomicReference<Exception> ex = new AtomicReference<>();
        SwingUtilities.invokeAndWait(() -> {
            try {
                r.set(c.call());
            } catch (Exception e) {
                ex.set(e);
            }
        });
        if (ex.get() != null) throw ex.get();
        return r.get();
    }

    private static <T> T waitFor(Callable<T> c, long millis, String what) throws Exception {
        long end = System.currentTimeMillis() + millis;
        while (System.currentTimeMillis() < end) {
            T v = c.call();
            if (v != null) return v;
            Thread.sleep(100);
        }
        throw new IllegalStateException("timed out waiting for " + what);
    }

    /** Paints a window's root pane (menus included) into a PNG. */
    private static void shoot(Window w, Path file) throws Exception {
        BufferedImage img = onEdt(() -> {
            var root = w instanceof javax.swing.RootPaneContainer rc ? rc.getRootPane() : null;
            Component c = root != null ? root : w;
            BufferedImage i = new BufferedImage(Math.max(1, c.getWidth()), Math.max(1, c.getHeight()), BufferedImage.TYPE_INT_RGB);
            Graphics2D g = i.createGraphics();
            c.paint(g);
            g.dispose();
            return i;
        });
        ImageIO.write(img, "png", file.toFile());
        put("shot." + file.getFileName(), img.getWidth() + "x" + img.getHeight());
    }
}
