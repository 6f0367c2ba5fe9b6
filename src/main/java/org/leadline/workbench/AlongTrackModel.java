package org.leadline.workbench;

import org.leadline.cleaning.Edit;
import org.leadline.survey.SoundingTable;

import java.io.IOException;
import java.util.Arrays;

/**
 * The Along-track view without Swing: the soundings of one survey line in time order (beams of a
 * ping in beam order), each with its distance along the track and its time, and the reviewer's
 * box selection turned into edit-journal entries.
 *
 * <p>Distance along track is the running sum of the straight-line distances, in the run's
 * projected CRS, between the vessel positions of successive pings (beams of one ping share the
 * ping's distance); over a line of a few kilometres the difference from the geodesic distance is
 * the projection's scale error, below 0.04 % inside a UTM zone (from memory: UTM scale factor
 * 0.9996 at the central meridian).
 *
 * <p>A box becomes one journal selection: when the boxed soundings are every sounding of the line
 * between the first and last boxed ping times, a time window on the line
 * ({@link Edit.Window#allBeams}: compact, and it reads as what the reviewer did); otherwise the
 * sounding ids ({@link Edit.Ids}).
 */
public final class AlongTrackModel {
    /** What the horizontal axis shows. */
    public enum Axis { DISTANCE, TIME }

    private final WorkbenchSession session;
    private final String line;
    private final int[] ids;
    private final double[] distance;
    private int[] selection = new int[0];

    /**
     * @param session the open project
     * @param line    survey line name
     * @throws IllegalArgumentException when the line has no soundings
     */
    public AlongTrackModel(WorkbenchSession session, String line) {
        this.session = session;
        this.line = line;
        SoundingTable s = session.soundings();
        int lineId = s.lineNames().indexOf(line);
        if (lineId < 0) throw new IllegalArgumentException("no survey line named '" + line + "'");
        int n = 0;
        for (int i = 0; i < s.size; i++) if (s.line[i] == lineId) n++;
        Integer[] boxed = new Integer[n];
        for (int i = 0, k = 0; i < s.size; i++) if (s.line[i] == lineId) boxed[k++] = i;
        Arrays.sort(boxed, (a, b) -> {
            int c = Double.compare(s.time[a], s.time[b]);
            if (c != 0) return c;
            c = Integer.compare(s.beam[a], s.beam[b]);
            return c != 0 ? c : Integer.compare(a, b);
        });
        ids = new int[n];
        for (int k = 0; k < n; k++) ids[k] = boxed[k];
        distance = new double[n];
        double[] lat = session.result().inputs().lat, lon = session.result().inputs().lon;
        double sum = 0, pe = Double.NaN, pn = Double.NaN, pt = Double.NaN;
        for (int k = 0; k < n; k++) {
            int i = ids[k];
            if (s.time[i] != pt && Double.isFinite(lat[i]) && Double.isFinite(lon[i])) {
                double[] en = session.result().projection().forward(lat[i], lon[i]);
                if (Double.isFinite(pe)) sum += Math.hypot(en[0] - pe, en[1] - pn);
                pe = en[0];
                pn = en[1];
                pt = s.time[i];
            }
            distance[k] = sum;
        }
    }

    public String line() { return line; }
    public WorkbenchSession session() { return session; }
    /** Number of soundings on the line. */
    public int size() { return ids.length; }
    /** Sounding id (row in the session's SoundingTable) of the k-th sounding along the line. */
    public int id(int k) { return ids[k]; }
    /** Distance along track of the k-th sounding, m. */
    public double distance(int k) { return distance[k]; }
    /** Ping time of the k-th sounding, UTC seconds since the epoch. */
    public double time(int k) { return session.soundings().time[ids[k]]; }
    /** Reduced depth of the k-th sounding, m, positive down. */
    public double depth(int k) { return session.soundings().depth[ids[k]]; }
    /** TVU (95 %) of the k-th sounding, m. */
    public double tvu(int k) { return session.soundings().tvu[ids[k]]; }
    public boolean accepted(int k) { return session.soundings().accepted(ids[k]); }
    /** Why the k-th sounding is rejected ("" when accepted). */
    public String reason(int k) { return SoundingTable.Reason.of(session.soundings().reason[ids[k]]).label; }
    /** Horizontal coordinate of the k-th sounding on an axis (m or UTC seconds). */
    public double x(int k, Axis axis) { return axis == Axis.DISTANCE ? distance[k] : time(k); }

    public int countAccepted() {
        int c = 0;
        for (int k = 0; k < ids.length; k++) if (accepted(k)) c++;
        return c;
    }

    /**
     * Selects the soundings inside a box: horizontal range [x0, x1] on the axis and depth range
     * [d0, d1] (either order; bounds inclusive). Soundings without a depth are inside when the box
     * spans the line's whole depth range. Replaces the previous selection.
     *
     * @return positions along the line (indices k) of the selected soundings, ascending
     */
    public int[] selectBox(Axis axis, double x0, double x1, double d0, double d1) {
        double xa = Math.min(x0, x1), xb = Math.max(x0, x1), da = Math.min(d0, d1), db = Math.max(d0, d1);
        double[] range = depthRange();
        boolean allDepths = da <= range[0] && db >= range[1];
        int[] out = new int[ids.length];
        int m = 0;
        for (int k = 0; k < ids.length; k++) {
            double x = x(k, axis), d = depth(k);
            if (x < xa || x > xb) continue;
            if (Double.isFinite(d) ? d >= da && d <= db : allDepths) out[m++] = k;
        }
        selection = Arrays.copyOf(out, m);
        return selection.clone();
    }

    /** Selects positions k0..k1 along the line (inclusive). */
    public void selectRange(int k0, int k1) {
        int a = Math.max(0, Math.min(k0, k1)), b = Math.min(ids.length - 1, Math.max(k0, k1));
        selection = b < a ? new int[0] : java.util.stream.IntStream.rangeClosed(a, b).toArray();
    }

    public void clearSelection() { selection = new int[0]; }
    /** Positions along the line (indices k) of the selected soundings, ascending. */
    public int[] selection() { return selection.clone(); }
    public boolean hasSelection() { return selection.length > 0; }

    /** Shallowest and deepest finite depth on the line, m ({NaN, NaN} when none). */
    public double[] depthRange() {
        double lo = Double.POSITIVE_INFINITY, hi = Double.NEGATIVE_INFINITY;
        for (int k = 0; k < ids.length; k++) {
            double d = depth(k);
            if (Double.isFinite(d)) {
                lo = Math.min(lo, d);
                hi = Math.max(hi, d);
            }
        }
        return lo > hi ? new double[] {Double.NaN, Double.NaN} : new double[] {lo, hi};
    }

    /**
     * The selection as the journal stores it: a time window on the line when the selection is every
     * sounding of the line between its first and last ping times, else the ids. Null when nothing
     * is selected.
     */
    public Edit.Selection journalSelection() {
        if (selection.length == 0) return null;
        int first = selection[0], last = selection[selection.length - 1];
        double t0 = time(first), t1 = time(last);
        // every sounding with a time in [t0, t1] lies between positions lo and hi (time order)
        int lo = first, hi = last;
        while (lo > 0 && time(lo - 1) >= t0) lo--;
        while (hi < ids.length - 1 && time(hi + 1) <= t1) hi++;
        if (hi - lo + 1 == selection.length) return Edit.Window.allBeams(line, t0, t1);
        int[] rows = new int[selection.length];
        for (int j = 0; j < rows.length; j++) rows[j] = ids[selection[j]];
        return Edit.Ids.of(rows);
    }

    /** Reject pings: appends the selection to the journal as a reject; null when nothing is selected. */
    public Edit rejectSelection(String reason) throws IOException {
        Edit.Selection sel = journalSelection();
        return sel == null ? null : session.reject(sel, reason);
    }

    /** Restore pings: appends the selection to the journal as a restore; null when nothing is selected. */
    public Edit restoreSelection(String reason) throws IOException {
        Edit.Selection sel = journalSelection();
        return sel == null ? null : session.restore(sel, reason);
    }

    public Edit undo() throws IOException { return session.undo(); }
    public Edit redo() throws IOException { return session.redo(); }
}
