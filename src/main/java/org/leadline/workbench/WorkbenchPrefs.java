package org.leadline.workbench;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.prefs.BackingStoreException;
import java.util.prefs.Preferences;

/**
 * The workbench's remembered settings (java.util.prefs, per user): whether the cautions were
 * acknowledged, and the recent projects. The node is {@code /org/leadline/workbench} unless the
 * system property {@code leadline.workbench.prefs} names another (the GUI test uses a fresh one).
 */
public final class WorkbenchPrefs {
    static final int MAX_RECENT = 8;
    private final Preferences node;

    public WorkbenchPrefs(Preferences node) { this.node = node; }

    /** The user's node (or the one named by {@code leadline.workbench.prefs}). */
    public static WorkbenchPrefs user() {
        String path = System.getProperty("leadline.workbench.prefs", "/org/leadline/workbench");
        return new WorkbenchPrefs(Preferences.userRoot().node(path));
    }

    public boolean cautionsAcknowledged() { return node.getBoolean(Cautions.ACKNOWLEDGED, false); }

    public void acknowledgeCautions() {
        node.putBoolean(Cautions.ACKNOWLEDGED, true);
        flush();
    }

    /** Recent project files, newest first. */
    public List<Path> recentProjects() {
        List<Path> out = new ArrayList<>();
        for (int k = 0; k < MAX_RECENT; k++) {
            String v = node.get("recent." + k, null);
            if (v != null && !v.isBlank()) out.add(Path.of(v));
        }
        return out;
    }

    /** Puts a project first in the recent list (dropping a repeat and the oldest beyond eight). */
    public void addRecent(Path project) {
        Path p = project.toAbsolutePath().normalize();
        List<Path> list = recentProjects();
        list.remove(p);
        list.add(0, p);
        for (int k = 0; k < MAX_RECENT; k++) {
            if (k < list.size()) node.put("recent." + k, list.get(k).toString());
            else node.remove("recent." + k);
        }
        flush();
    }

    private void flush() {
        try {
            node.flush();
        } catch (BackingStoreException e) {
            // not remembered across restarts; the workbench works on
        }
    }
}
