package org.leadline.workbench;

import javax.imageio.ImageIO;
import javax.swing.SwingUtilities;
import java.awt.Graphics2D;
import java.awt.image.BufferedImage;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.concurrent.atomic.AtomicReference;
import java.util.stream.Stream;

/**
 * A tool, not a test: copies a project folder to a scratch folder (so no journal is written into
 * the source tree), opens it in the workbench and saves a PNG of every view. Needs a display:
 * <pre>
 * xvfb-run -a java -cp target/test-classes:target/classes:$(cat cp.txt) \
 *     org.leadline.workbench.WorkbenchScreenshots sample-surveys/harbour-approach target/screenshots/sample
 * </pre>
 */
public final class WorkbenchScreenshots {
    public static void main(String[] args) throws Exception {
        Path src = Path.of(args[0]), shots = Path.of(args[1]);
        Path work = Files.createTempDirectory("leadline-shots");
        try (Stream<Path> all = Files.walk(src)) {
            for (Path p : (Iterable<Path>) all::iterator) {
                Path t = work.resolve(src.relativize(p).toString());
                if (Files.isDirectory(p)) Files.createDirectories(t);
                else Files.copy(p, t);
            }
        }
        Files.deleteIfExists(work.resolve("edits.journal"));
        Files.createDirectories(shots);
        System.setProperty("java.util.prefs.userRoot", work.resolve("prefs").toString());
        new WorkbenchPrefs(java.util.prefs.Preferences.userRoot().node("/org/leadline/workbench")).acknowledgeCautions();
        WorkbenchFrame f = Workbench.start(null);
        SwingUtilities.invokeAndWait(() -> { f.setSize(1280, 820); f.openProject(work.resolve("project.yaml")); });
        long t0 = System.currentTimeMillis();
        do {
            Thread.sleep(200);
        } while (call(f::busy) || call(f::session) == null);
        System.out.printf("opened in %.1f s: %d soundings%n", (System.currentTimeMillis() - t0) / 1e3,
                call(() -> f.session().soundings().size));
        String[] views = {WorkbenchFrame.CASTS, WorkbenchFrame.TRACK, WorkbenchFrame.ALONG_TRACK,
                WorkbenchFrame.DEPTH_SURFACE, WorkbenchFrame.CHECKS};
        SwingUtilities.invokeAndWait(() -> f.surfaceView().hillShadeBox().doClick());
        for (int k = 0; k < views.length; k++) {
            String v = views[k];
            SwingUtilities.invokeAndWait(() -> f.showView(v));
            Thread.sleep(400);
            BufferedImage img = call(() -> {
                var c = f.getRootPane();
                BufferedImage i = new BufferedImage(c.getWidth(), c.getHeight(), BufferedImage.TYPE_INT_RGB);
                Graphics2D g = i.createGraphics();
                c.paint(g);
                g.dispose();
                return i;
            });
            ImageIO.write(img, "png", shots.resolve(k + "-" + v.toLowerCase().replace(' ', '-') + ".png").toFile());
        }
        SwingUtilities.invokeAndWait(f::quit);
        System.exit(0);
    }

    private static <T> T call(java.util.concurrent.Callable<T> c) throws Exception {
        AtomicReference<T> r = new AtomicReference<>();
        AtomicReference<Exception> ex = new AtomicReference<>();
        SwingUtilities.invokeAndWait(() -> {
            try { r.set(c.call()); } catch (Exception e) { ex.set(e); }
        });
        if (ex.get() != null) throw ex.get();
        return r.get();
    }
}
