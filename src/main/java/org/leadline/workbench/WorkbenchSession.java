package org.leadline.workbench;

import org.leadline.cleaning.Edit;
import org.leadline.cleaning.EditJournal;
import org.leadline.io.EditJournalFile;
import org.leadline.io.InputException;
import org.leadline.io.ProjectReader;
import org.leadline.pipeline.ProcessingRun;
import org.leadline.pipeline.Progress;
import org.leadline.surface.Cube;
import org.leadline.surface.Grid;
import org.leadline.surface.GridSpec;
import org.leadline.surface.Gridder;
import org.leadline.survey.Project;
import org.leadline.survey.SoundingTable;
import org.leadline.uncertainty.Compliance;
import org.leadline.uncertainty.ComplianceSummary;
import org.leadline.uncertainty.CrosslineResult;
import org.leadline.uncertainty.S44Order;

import java.io.Closeable;
import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.List;
import java.util.concurrent.CopyOnWriteArrayList;

/**
 * One open project in the workbench, without any Swing: the project, the result of a processing
 * run, the reviewer's edit journal, and the sounding statuses as the journal leaves them.
 *
 * <p>How the statuses are kept: the run is computed without the journal, so the statuses of the
 * automatic cleaning are known and saved; the journal on disk is then replayed onto them with
 * {@link EditJournal#apply}, exactly as {@code leadline process} does. A new Reject pings or
 * Restore pings is appended to the journal file (written and forced to disk before this returns,
 * {@link EditJournalFile#append}) and applied to the in-memory statuses on top of the earlier
 * edits, which gives what a replay of the whole journal gives since a new edit is always the last
 * one in force. An undo or redo is appended likewise and the statuses are replayed from the
 * automatic ones. No full reprocess is needed for any edit.
 *
 * <p>Not thread-safe: call from one thread (the event thread in the workbench). The heavy parts,
 * {@link #open} and {@link #computeSurface}, are meant for a background thread and touch no
 * state that the event thread changes ({@link #computeSurface} works on a snapshot).
 */
public final class WorkbenchSession implements Closeable {
    private final Path projectFile;
    private final Project project;
    private final ProcessingRun.Result result;
    private final SoundingTable soundings;
    private final byte[] autoStatus, autoReason;
    private final EditJournalFile journal;
    private final List<Edit> edits;
    private final String user;
    private final List<Runnable> listeners = new CopyOnWriteArrayList<>();
    private final List<String> warnings = new ArrayList<>();
    private SurfaceState surface;
    private boolean surfaceStale;

    private WorkbenchSession(Path projectFile, Project project, ProcessingRun.Result result, EditJournalFile journal,
                             String user) {
        this.projectFile = projectFile;
        this.project = project;
        this.result = result;
        this.soundings = result.soundings();
        this.autoStatus = soundings.status.clone();
        this.autoReason = soundings.reason.clone();
        this.journal = journal;
        this.edits = new ArrayList<>(journal.edits());
        this.user = user == null ? "" : user;
        warnings.addAll(result.warnings());
        warnings.addAll(journal.warnings());
    }

    /**
     * Reads a project file, opens its edit journal (the project's {@code journal} input, else
     * {@link EditJournalFile#besideProject}) with an exclusive lock, runs the processing chain, and
     * replays the journal. Long: call off the event thread.
     *
     * @throws InputException on bad input (the message names file, line and problem)
     * @throws Progress.Cancelled when progress asks to stop
     */
    public static WorkbenchSession open(Path projectFile, Progress progress) throws IOException {
        Path file = projectFile.toAbsolutePath().normalize();
        Project p = ProjectReader.read(file);
        return open(file, p, progress);
    }

    /** As {@link #open(Path, Progress)} for a project already read (e.g. with changed settings). */
    public static WorkbenchSession open(Path projectFile, Project project, Progress progress) throws IOException {
        Progress prog = progress == null ? Progress.NONE : progress;
        Path journalPath = project.journal() != null ? project.journal() : EditJournalFile.besideProject(projectFile);
        Project withJournal = project.toBuilder().journal(journalPath).build();
        EditJournalFile journal = EditJournalFile.open(journalPath);
        try {
            // the run without the journal gives the automatic statuses the journal is replayed on
            ProcessingRun.Result r = new ProcessingRun(withJournal.toBuilder().journal(null).build(), prog).compute();
            WorkbenchSession s = new WorkbenchSession(projectFile, withJournal, r, journal,
                    System.getProperty("user.name"));
            if (!EditJournal.effective(s.edits).isEmpty()) {
                EditJournal.apply(s.soundings, s.edits);
                prog.stage("Building surface");
                Snapshot snap = s.snapshot();
                s.setSurface(s.computeSurface(snap), snap);
            } else {
                s.surface = new SurfaceState(r.grid(), countGridded(s.snapshot().accepted), SurfaceState.meanDepth(r.grid()),
                        r.compliance(), r.crosslines(), r.crosslineLines());
            }
            return s;
        } catch (IOException | RuntimeException e) {
            journal.close();
            throw e;
        }
    }

    public Path projectFile() { return projectFile; }
    /** The project, with its journal input set to the journal in use. */
    public Project project() { return project; }
    /** The processing run (computed without the journal; its soundings carry the current statuses). */
    public ProcessingRun.Result result() { return result; }
    public SoundingTable soundings() { return soundings; }
    public Path journalPath() { return journal.path(); }
    /** Every edit in the journal, oldest first. */
    public List<Edit> edits() { return List.copyOf(edits); }
    public List<String> warnings() { return List.copyOf(warnings); }
    /** The latest surface and checks; see {@link #surfaceStale()}. */
    public SurfaceState surface() { return surface; }
    /** True when statuses changed after the surface was built (Build surface brings it up to date). */
    public boolean surfaceStale() { return surfaceStale; }

    /** Status of sounding i after the automatic cleaning, before the journal. */
    public byte automaticStatus(int i) { return autoStatus[i]; }

    /** Called (on the editing thread) after every change of statuses or surface. */
    public void addListener(Runnable l) { listeners.add(l); }
    public void removeListener(Runnable l) { listeners.remove(l); }

    // ------------------------------------------------------------------ edits

    /** Appends a Reject pings edit to the journal (on disk when this returns) and applies it. */
    public Edit reject(Edit.Selection selection, String reason) throws IOException {
        return edit(Edit.Action.REJECT, selection, reason);
    }

    /** Appends a Restore pings edit to the journal (on disk when this returns) and applies it. */
    public Edit restore(Edit.Selection selection, String reason) throws IOException {
        return edit(Edit.Action.RESTORE, selection, reason);
    }

    private Edit edit(Edit.Action action, Edit.Selection selection, String reason) throws IOException {
        Edit e = journal.append(now(), user, action, selection, reason);
        edits.add(e);
        EditJournal.apply(soundings, List.of(e)); // the newest edit applies last, as in a full replay
        changed();
        return e;
    }

    public boolean canUndo() { return stacks()[0] > 0; }
    public boolean canRedo() { return stacks()[1] > 0; }

    /** Appends an undo to the journal and replays; null when there is nothing to undo. */
    public Edit undo() throws IOException {
        if (!canUndo()) return null;
        return history(Edit.Action.UNDO);
    }

    /** Appends a redo to the journal and replays; null when there is nothing to redo. */
    public Edit redo() throws IOException {
        if (!canRedo()) return null;
        return history(Edit.Action.REDO);
    }

    private Edit history(Edit.Action action) throws IOException {
        Edit e = journal.append(now(), user, action, null, "");
        edits.add(e);
        replay();
        changed();
        return e;
    }

    /** The statuses from the automatic cleaning with the whole journal replayed on them. */
    private void replay() {
        System.arraycopy(autoStatus, 0, soundings.status, 0, autoStatus.length);
        System.arraycopy(autoReason, 0, soundings.reason, 0, autoReason.length);
        EditJournal.apply(soundings, edits);
    }

    /** Sizes of the done and undone stacks, walking the journal as {@link EditJournal#effective} does. */
    private int[] stacks() {
        Deque<Edit> done = new ArrayDeque<>(), undone = new ArrayDeque<>();
        for (Edit e : edits) {
            switch (e.action()) {
                case REJECT, RESTORE -> {
                    done.push(e);
                    undone.clear();
                }
                case UNDO -> { if (!done.isEmpty()) undone.push(done.pop()); }
                case REDO -> { if (!undone.isEmpty()) done.push(undone.pop()); }
            }
        }
        return new int[] {done.size(), undone.size()};
    }

    private void changed() {
        surfaceStale = true;
        for (Runnable l : listeners) l.run();
    }

    private static double now() { return System.currentTimeMillis() / 1000.0; }

    // ------------------------------------------------------------------ surface

    /** The soundings to grid at this moment (call on the editing thread, then grid anywhere). */
    public Snapshot snapshot() {
        boolean[] acc = new boolean[soundings.size];
        for (int i = 0; i < soundings.size; i++) acc[i] = soundings.accepted(i) && Double.isFinite(soundings.easting[i]);
        return new Snapshot(acc, soundings.status.clone());
    }

    /** Which soundings were accepted when a snapshot was taken. */
    public record Snapshot(boolean[] accepted, byte[] status) {}

    /**
     * Builds the surface, S-44 compliance and crossline comparison from a snapshot with the run's
     * cell size and method (the same {@link GridSpec#covering} and {@link Gridder#build} calls as a
     * processing run). Pure computation; safe off the event thread.
     *
     * @throws InputException when no sounding is accepted
     */
    public SurfaceState computeSurface(Snapshot snap) {
        SoundingTable s = soundings;
        boolean[] acc = snap.accepted;
        int n = countGridded(acc);
        if (n == 0) {
            throw new InputException((String) null, 0, 0, "no accepted soundings to grid: restore some pings first", null);
        }
        double[] e = new double[n], no = new double[n];
        for (int i = 0, k = 0; i < s.size; i++) {
            if (acc[i]) {
                e[k] = s.easting[i];
                no[k++] = s.northing[i];
            }
        }
        GridSpec spec = GridSpec.covering(e, no, result.gridSpec().cell());
        Gridder.Method m = result.method();
        Grid grid = Gridder.build(spec, result.projection().crs(), s.easting, s.northing, s.depth, s.tvu, s.thu, acc, m,
                Cube.Parameters.defaults());
        List<String> names = new ArrayList<>();
        CrosslineResult cr = ProcessingRun.compareCrosslines(s, acc, project.settings().crosslines(), spec,
                result.projection().crs(), m, result.order(), names);
        // the S-44 compliance reads the statuses in the table, which the editing thread owns:
        // it is evaluated when the surface is installed (setSurface), one cheap pass
        return new SurfaceState(grid, n, SurfaceState.meanDepth(grid), null, cr, names);
    }

    /** Installs a surface built by {@link #computeSurface} (on the editing thread). */
    public void setSurface(SurfaceState s, Snapshot from) {
        surface = new SurfaceState(s.grid(), s.accepted(), s.meanDepth(), compliance(result.order()), s.crosslines(),
                s.crosslineNames());
        surfaceStale = !java.util.Arrays.equals(from.status, soundings.status);
        for (Runnable l : listeners) l.run();
    }

    /** S-44 compliance of the soundings accepted now, for any order (one pass; on the editing thread). */
    public ComplianceSummary compliance(S44Order order) {
        return Compliance.evaluate(soundings, order).summary(soundings);
    }

    private static int countGridded(boolean[] acc) {
        int n = 0;
        for (boolean b : acc) if (b) n++;
        return n;
    }

    /** Releases the journal's lock. Every edit is already on disk. */
    @Override
    public void close() throws IOException {
        journal.close();
    }
}
