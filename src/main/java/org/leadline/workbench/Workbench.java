package org.leadline.workbench;

import com.formdev.flatlaf.FlatLightLaf;

import javax.swing.SwingUtilities;
import java.awt.GraphicsEnvironment;
import java.nio.file.Path;
import java.util.concurrent.atomic.AtomicReference;

/**
 * Starts the Swing workbench (DESIGN.md section 5: {@code leadline workbench [PROJECT.yaml]}): a
 * thin front end over the same library the command line uses. Shows the cautions on first start.
 */
public final class Workbench {
    private Workbench() {}

    /**
     * Creates and shows the window (on the event thread), shows the cautions on the first start,
     * then opens the project when one is given. Returns at once; see {@link WorkbenchFrame#awaitClosed}.
     *
     * @param project project file, or null
     * @throws java.awt.HeadlessException when there is no display
     */
    public static WorkbenchFrame start(Path project) throws Exception {
        if (GraphicsEnvironment.isHeadless()) {
            throw new java.awt.HeadlessException("the workbench needs a graphical display (DISPLAY is not set or"
                    + " java.awt.headless is true)");
        }
        AtomicReference<WorkbenchFrame> frame = new AtomicReference<>();
        SwingUtilities.invokeAndWait(() -> {
            FlatLightLaf.setup();
            WorkbenchFrame f = new WorkbenchFrame(WorkbenchPrefs.user());
            f.setVisible(true);
            frame.set(f);
        });
        WorkbenchFrame f = frame.get();
        SwingUtilities.invokeLater(() -> {
            Cautions.showOnFirstStart(f, WorkbenchPrefs.user());
            if (project != null) f.openProject(project);
        });
        return f;
    }
}
