package org.leadline.workbench;

import org.leadline.io.ProjectReader;
import org.leadline.pipeline.ProcessingRun;
import org.leadline.survey.Project;
import org.leadline.watercolumn.SoundSpeedEquation;

import javax.swing.AbstractAction;
import javax.swing.Action;
import javax.swing.JComponent;
import javax.swing.JFileChooser;
import javax.swing.JFrame;
import javax.swing.JMenu;
import javax.swing.JMenuBar;
import javax.swing.JMenuItem;
import javax.swing.JOptionPane;
import javax.swing.JTabbedPane;
import javax.swing.KeyStroke;
import javax.swing.WindowConstants;
import javax.swing.filechooser.FileNameExtensionFilter;
import java.awt.BorderLayout;
import java.awt.Dimension;
import java.awt.event.ActionEvent;
import java.awt.event.InputEvent;
import java.awt.event.KeyEvent;
import java.awt.event.WindowAdapter;
import java.awt.event.WindowEvent;
import java.io.IOException;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.CountDownLatch;
import java.util.function.Consumer;

/**
 * The workbench window: the five views (Casts, Track, Along-track, Depth surface, Checks) in
 * tabs, the menus, the keyboard shortcuts and the status bar with progress and Cancel. Every
 * action is an {@link Action} shared by menu, tool bar, key and test.
 */
public final class WorkbenchFrame extends JFrame {
    /** Tab titles, the views' names. */
    public static final String CASTS = "Casts", TRACK = "Track", ALONG_TRACK = "Along-track",
            DEPTH_SURFACE = "Depth surface", CHECKS = "Checks";

    private final WorkbenchPrefs prefs;
    private final TaskBar tasks = new TaskBar();
    private final JTabbedPane tabs = new JTabbedPane();
    private final JMenu recent = new JMenu("Recent projects");
    private final CountDownLatch closed = new CountDownLatch(1);
    private WorkbenchSession session;
    private SoundSpeedEquation equation; // chosen in Casts; used by Reduce soundings

    private final Action open = action("Open project...", KeyStroke.getKeyStroke(KeyEvent.VK_O, InputEvent.CTRL_DOWN_MASK),
            "Open a project file (project.yaml)", e -> chooseProject());
    private final Action save = action("Save", KeyStroke.getKeyStroke(KeyEvent.VK_S, InputEvent.CTRL_DOWN_MASK),
            "Every edit is already in the edit journal on disk", e -> explainSave());
    private final Action export = action("Export...", KeyStroke.getKeyStroke(KeyEvent.VK_E, InputEvent.CTRL_DOWN_MASK),
            "Process the project with its edit journal and write every output into a folder", e -> chooseExport());
    private final Action quit = action("Quit", KeyStroke.getKeyStroke(KeyEvent.VK_Q, InputEvent.CTRL_DOWN_MASK),
            "Close the workbench", e -> quit());
    private final Action reject = action("Reject pings", KeyStroke.getKeyStroke(KeyEvent.VK_R, 0),
            "Reject the selected soundings (R); written to the edit journal at once", e -> rejectSelection());
    private final Action restore = action("Restore pings", KeyStroke.getKeyStroke(KeyEvent.VK_E, 0),
            "Restore the selected soundings (E); written to the edit journal at once", e -> restoreSelection());
    private final Action undo = action("Undo", KeyStroke.getKeyStroke(KeyEvent.VK_Z, InputEvent.CTRL_DOWN_MASK),
            "Undo the latest edit (Ctrl+Z); the undo is a journal entry too", e -> history(true));
    private final Action redo = action("Redo", KeyStroke.getKeyStroke(KeyEvent.VK_Z, InputEvent.CTRL_DOWN_MASK | InputEvent.SHIFT_DOWN_MASK),
            "Redo the latest undone edit (Ctrl+Shift+Z or Ctrl+Y)", e -> history(false));
    private final Action reduce = action("Reduce soundings", null,
            "Process the project again (e.g. with the sound-speed equation chosen in Casts)", e -> reduceSoundings());
    private final Action build = action("Build surface", KeyStroke.getKeyStroke(KeyEvent.VK_B, InputEvent.CTRL_DOWN_MASK),
            "Grid the soundings again with the current statuses", e -> buildSurface());
    private final Action about = action("About Leadline", null, "Version and cautions", e -> showAbout());

    private final CastsView castsView = new CastsView(eq -> equation = eq);
    private final TrackView trackView;
    private final AlongTrackView alongTrackView;
    private final SurfaceView surfaceView = new SurfaceView(build);
    private final ChecksView checksView = new ChecksView();
    private final Runnable sessionListener = this::sessionChanged;

    public WorkbenchFrame(WorkbenchPrefs prefs) {
        super("Leadline workbench");
        this.prefs = prefs;
        alongTrackView = new AlongTrackView(reject, restore, undo, redo, line -> trackViewHighlight(line));
        trackView = new TrackView(this::openLine, tasks::setMessage);
        tabs.addTab(CASTS, castsView);
        tabs.addTab(TRACK, trackView);
        tabs.addTab(ALONG_TRACK, alongTrackView);
        tabs.addTab(DEPTH_SURFACE, surfaceView);
        tabs.addTab(CHECKS, checksView);
        getContentPane().add(tabs, BorderLayout.CENTER);
        getContentPane().add(tasks, BorderLayout.SOUTH);
        setJMenuBar(menus());
        // second key for redo
        getRootPane().getInputMap(JComponent.WHEN_IN_FOCUSED_WINDOW)
                .put(KeyStroke.getKeyStroke(KeyEvent.VK_Y, InputEvent.CTRL_DOWN_MASK), "redo");
        getRootPane().getActionMap().put("redo", redo);
        setDefaultCloseOperation(WindowConstants.DO_NOTHING_ON_CLOSE);
        addWindowListener(new WindowAdapter() {
            @Override
            public void windowClosing(WindowEvent e) { quit(); }
        });
        tasks.onBusyChange(this::updateActions);
        setPreferredSize(new Dimension(1200, 800));
        pack();
        setLocationRelativeTo(null);
        updateActions();
        tasks.setMessage("Open a project: File > Open project...");
    }

    private JMenuBar menus() {
        JMenuBar bar = new JMenuBar();
        JMenu file = new JMenu("File");
        file.setMnemonic(KeyEvent.VK_F);
        file.add(open);
        file.add(recent);
        file.addSeparator();
        file.add(save);
        file.add(export);
        file.addSeparator();
        file.add(quit);
        refreshRecent();
        JMenu edit = new JMenu("Edit");
        edit.setMnemonic(KeyEvent.VK_E);
        edit.add(reject);
        edit.add(restore);
        edit.addSeparator();
        edit.add(undo);
        JMenuItem r = edit.add(redo);
        r.setToolTipText("Ctrl+Shift+Z or Ctrl+Y");
        JMenu process = new JMenu("Process");
        process.setMnemonic(KeyEvent.VK_P);
        process.add(reduce);
        process.add(build);
        JMenu help = new JMenu("Help");
        help.setMnemonic(KeyEvent.VK_H);
        help.add(about);
        bar.add(file);
        bar.add(edit);
        bar.add(process);
        bar.add(help);
        return bar;
    }

    private static Action action(String name, KeyStroke key, String tip, Consumer<ActionEvent> body) {
        Action a = new AbstractAction(name) {
            @Override
            public void actionPerformed(ActionEvent e) {
                if (isEnabled()) body.accept(e);
            }
        };
        if (key != null) a.putValue(Action.ACCELERATOR_KEY, key);
        a.putValue(Action.SHORT_DESCRIPTION, tip);
        return a;
    }

    // ------------------------------------------------------------------ accessors (views, actions, tests)

    public WorkbenchSession session() { return session; }
    public boolean busy() { return tasks.busy(); }
    public String statusMessage() { return tasks.message(); }
    public Action rejectAction() { return reject; }
    public Action restoreAction() { return restore; }
    public Action undoAction() { return undo; }
    public Action redoAction() { return redo; }
    public Action buildSurfaceAction() { return build; }
    public Action reduceAction() { return reduce; }
    public Action exportAction() { return export; }
    JTabbedPane tabs() { return tabs; }
    AlongTrackView alongTrackView() { return alongTrackView; }
    TrackView trackView() { return trackView; }
    SurfaceView surfaceView() { return surfaceView; }
    ChecksView checksView() { return checksView; }
    CastsView castsView() { return castsView; }

    /** Shows the view with this tab title. */
    public void showView(String title) { tabs.setSelectedIndex(tabs.indexOfTab(title)); }

    /** Blocks until the window is closed (the command line waits here). */
    public void awaitClosed() throws InterruptedException { closed.await(); }

    // ------------------------------------------------------------------ project

    private void chooseProject() {
        JFileChooser fc = new JFileChooser(session == null ? null : session.projectFile().getParent().toFile());
        fc.setFileFilter(new FileNameExtensionFilter("Leadline project (*.yaml, *.yml)", "yaml", "yml"));
        if (fc.showOpenDialog(this) == JFileChooser.APPROVE_OPTION) openProject(fc.getSelectedFile().toPath());
    }

    /** Opens a project in the background (reading, reducing, gridding), replacing the open one. */
    public void openProject(Path projectFile) {
        if (tasks.busy()) return;
        Path file = projectFile.toAbsolutePath().normalize();
        closeSession();
        tasks.run("Opening " + file.getFileName(), p -> WorkbenchSession.open(file, p), s -> {
            prefs.addRecent(file);
            refreshRecent();
            install(s);
        });
    }

    private void reduceSoundings() {
        if (session == null || tasks.busy()) return;
        Path file = session.projectFile();
        Project p = session.project();
        if (equation != null) p = p.toBuilder().equation(equation.cliName()).build();
        Project project = p;
        closeSession();
        tasks.run("Reduce soundings", pr -> WorkbenchSession.open(file, project, pr), this::install);
    }

    private void install(WorkbenchSession s) {
        session = s;
        s.addListener(sessionListener);
        equation = null;
        setTitle("Leadline workbench: " + (s.project().name().isEmpty() ? s.projectFile().getFileName()
                : s.project().name()) + " (" + s.projectFile() + ")");
        castsView.setModel(new CastsModel(s.result().inputs().casts, s.result().inputs().profiles,
                SoundSpeedEquation.parse(s.project().settings().equation())));
        trackView.setModel(new TrackModel(s.soundings()), s.result().projection().toString());
        alongTrackView.setSession(s);
        surfaceView.setSession(s);
        checksView.setSession(s);
        int edits = s.edits().size();
        tasks.setMessage(String.format(Locale.ROOT, "%s: %d soundings, %d accepted; edit journal %s (%d edits)%s",
                s.projectFile().getFileName(), s.soundings().size, s.soundings().countAccepted(),
                s.journalPath().getFileName(), edits, s.warnings().isEmpty() ? "" : "; " + s.warnings().size() + " warning(s)"));
        if (!s.warnings().isEmpty()) tasks.setToolTipText(String.join("\n", s.warnings()));
        updateActions();
    }

    private void closeSession() {
        if (session == null) return;
        session.removeListener(sessionListener);
        try {
            session.close();
        } catch (IOException e) {
            Errors.show(this, "Closing the edit journal", e);
        }
        session = null;
        castsView.setModel(null);
        trackView.setModel(null, null);
        alongTrackView.setSession(null);
        surfaceView.setSession(null);
        checksView.setSession(null);
        updateActions();
    }

    private void refreshRecent() {
        recent.removeAll();
        for (Path p : prefs.recentProjects()) {
            JMenuItem item = new JMenuItem(p.toString());
            item.addActionListener(e -> openProject(p));
            recent.add(item);
        }
        recent.setEnabled(recent.getItemCount() > 0);
    }

    // ------------------------------------------------------------------ edits

    private void openLine(String line) {
        alongTrackView.showLine(line);
        showView(ALONG_TRACK);
    }

    private void trackViewHighlight(String line) {
        if (trackView != null) trackView.highlight(line);
    }

    private void rejectSelection() {
        AlongTrackModel m = alongTrackView.model();
        if (m == null || !m.hasSelection()) {
            tasks.setMessage("Reject pings: select soundings first (drag a box in Along-track)");
            return;
        }
        int n = m.selection().length;
        try {
            m.rejectSelection("");
            tasks.setMessage("Rejected " + n + " soundings on line " + m.line() + "; written to the edit journal");
        } catch (IOException | RuntimeException ex) {
            Errors.show(this, "Reject pings", ex);
        }
    }

    private void restoreSelection() {
        AlongTrackModel m = alongTrackView.model();
        if (m == null || !m.hasSelection()) {
            tasks.setMessage("Restore pings: select soundings first (drag a box in Along-track)");
            return;
        }
        int n = m.selection().length;
        try {
            m.restoreSelection("");
            tasks.setMessage("Restored " + n + " soundings on line " + m.line() + "; written to the edit journal");
        } catch (IOException | RuntimeException ex) {
            Errors.show(this, "Restore pings", ex);
        }
    }

    private void history(boolean isUndo) {
        if (session == null) return;
        try {
            var e = isUndo ? session.undo() : session.redo();
            tasks.setMessage(e == null ? (isUndo ? "Nothing to undo" : "Nothing to redo")
                    : (isUndo ? "Undone" : "Redone") + "; written to the edit journal");
        } catch (IOException | RuntimeException ex) {
            Errors.show(this, isUndo ? "Undo" : "Redo", ex);
        }
    }

    private void sessionChanged() {
        alongTrackView.refresh();
        trackView.repaint();
        surfaceView.refresh();
        checksView.refresh();
        updateActions();
    }

    private void updateActions() {
        boolean idle = !tasks.busy(), open = session != null;
        for (Action a : new Action[] {reject, restore}) a.setEnabled(idle && open);
        undo.setEnabled(idle && open && session.canUndo());
        redo.setEnabled(idle && open && session.canRedo());
        for (Action a : new Action[] {save, export, reduce, build}) a.setEnabled(idle && open);
        this.open.setEnabled(idle);
        recent.setEnabled(idle && recent.getItemCount() > 0);
    }

    // ------------------------------------------------------------------ surface, export

    private void buildSurface() {
        if (session == null || tasks.busy()) return;
        WorkbenchSession s = session;
        WorkbenchSession.Snapshot snap = s.snapshot();
        tasks.run("Build surface", p -> {
            p.stage("Building surface");
            return s.computeSurface(snap);
        }, st -> {
            if (session != s) return;
            s.setSurface(st, snap);
            tasks.setMessage(String.format(Locale.ROOT, "Surface built: %d soundings gridded, mean depth %.2f m",
                    st.accepted(), session.surface().meanDepth()));
        });
    }

    private void chooseExport() {
        if (session == null) return;
        JFileChooser fc = new JFileChooser(session.projectFile().getParent().toFile());
        fc.setFileSelectionMode(JFileChooser.DIRECTORIES_ONLY);
        fc.setDialogTitle("Export: choose the output folder");
        if (fc.showSaveDialog(this) == JFileChooser.APPROVE_OPTION) export(fc.getSelectedFile().toPath());
    }

    /** Processes the project with its edit journal and writes every output into dir (in the background). */
    public void export(Path dir) {
        if (session == null || tasks.busy()) return;
        Project p = session.project();
        tasks.run("Export", pr -> new ProcessingRun(p, pr).run(dir), r -> tasks.setMessage(String.format(Locale.ROOT,
                "Exported to %s: %d soundings, %d accepted (edit journal replayed: %d edits)", dir, r.soundings().size,
                r.soundings().countAccepted(), r.journalEdits())));
    }

    private void explainSave() {
        String where = session == null ? "" : "\n\n" + session.journalPath();
        JOptionPane.showMessageDialog(this, "Nothing to save: every Reject pings, Restore pings, undo and redo is written"
                + " to the edit journal on disk the moment you make it." + where, "Save", JOptionPane.INFORMATION_MESSAGE);
    }

    private void showAbout() {
        JOptionPane.showMessageDialog(this, "Leadline " + ProcessingRun.version()
                + "\nHydrographic survey processing: echo soundings to depths reduced to chart datum.\n\n"
                + Cautions.TEXT, "About Leadline", JOptionPane.INFORMATION_MESSAGE);
    }

    /** Closes the project (releasing the journal) and the window. */
    public void quit() {
        if (tasks.busy()) {
            int a = JOptionPane.showConfirmDialog(this, "Work is running. Quit anyway?", "Quit", JOptionPane.YES_NO_OPTION);
            if (a != JOptionPane.YES_OPTION) return;
        }
        closeSession();
        dispose();
        closed.countDown();
    }
}
