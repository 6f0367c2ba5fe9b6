package org.leadline.cleaning;

import org.leadline.cleaning.Edit.Action;
import org.leadline.survey.SoundingTable;
import org.leadline.survey.SoundingTable.Reason;
import org.leadline.survey.SoundingTable.Status;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.EnumSet;
import java.util.List;
import java.util.Set;

/**
 * Replays the reviewer's edit journal onto the statuses the automatic cleaning computed. The raw
 * data and the automatic result are never changed on disk: the journal is the record of the
 * reviewer's work and is replayed on every run.
 *
 * <p>Semantics (the usual undo/redo stacks, e.g. the command pattern's history): walking the
 * journal in order, REJECT and RESTORE are pushed on the done stack and clear the redo stack;
 * UNDO moves the latest done edit to the redo stack; REDO moves the latest undone edit back.
 * An UNDO with nothing to undo (or REDO with nothing to redo) does nothing. The edits left on
 * the done stack are then applied in order:
 * <ul>
 * <li>REJECT: each selected sounding becomes rejected with {@link Reason#REVIEWER};</li>
 * <li>RESTORE: each selected sounding becomes accepted, overriding automatic rejections (the
 *     reviewer's word wins), except soundings that have no depth or position to accept
 *     ({@link #UNRESTORABLE}: no navigation, no attitude, no return, beyond the profile).</li>
 * </ul>
 */
public final class EditJournal {
    /** Rejection reasons a RESTORE cannot undo: the sounding has no valid depth or position. */
    public static final Set<Reason> UNRESTORABLE = EnumSet.of(Reason.NO_NAVIGATION, Reason.NO_ATTITUDE,
            Reason.NO_RETURN, Reason.BEYOND_PROFILE);

    private EditJournal() {}

    /** The REJECT and RESTORE edits in force after the undo/redo history, in the order they apply. */
    public static List<Edit> effective(List<Edit> edits) {
        Deque<Edit> done = new ArrayDeque<>();
        Deque<Edit> undone = new ArrayDeque<>();
        for (Edit e : edits) {
            switch (e.action()) {
                case REJECT, RESTORE -> {
                    done.push(e);
                    undone.clear();
                }
                case UNDO -> {
                    if (!done.isEmpty()) undone.push(done.pop());
                }
                case REDO -> {
                    if (!undone.isEmpty()) done.push(undone.pop());
                }
            }
        }
        List<Edit> out = new ArrayList<>(done);
        java.util.Collections.reverse(out);
        return out;
    }

    /**
     * Applies the journal to s in place. Call it on the statuses just computed by the automatic
     * cleaning (not on a table the journal was already applied to).
     *
     * @return number of soundings whose status or reason changed
     */
    public static int apply(SoundingTable s, List<Edit> edits) {
        byte[] st0 = s.status.clone(), re0 = s.reason.clone();
        byte rejected = Status.REJECTED.code, accepted = Status.ACCEPTED.code, reviewer = Reason.REVIEWER.code;
        boolean[] locked = new boolean[256];
        for (Reason r : UNRESTORABLE) locked[r.code & 0xff] = true;
        for (Edit e : effective(edits)) {
            if (e.action() == Action.REJECT) {
                e.selection().forEach(s, i -> {
                    if (s.status[i] == rejected && locked[s.reason[i] & 0xff]) return;
                    s.status[i] = rejected;
                    s.reason[i] = reviewer;
                });
            } else {
                e.selection().forEach(s, i -> {
                    if (s.status[i] == rejected && locked[s.reason[i] & 0xff]) return;
                    s.status[i] = accepted;
                    s.reason[i] = Reason.NONE.code;
                });
            }
        }
        int changed = 0;
        for (int i = 0; i < s.size; i++) if (s.status[i] != st0[i] || s.reason[i] != re0[i]) changed++;
        return changed;
    }

    /** Verdict of {@link #verdicts}: no edit selects the sounding. */
    public static final byte NONE = 0, REJECT = 1, RESTORE = 2;

    /**
     * What the journal says about each sounding of a chunk of a day (rows firstId.. of the whole
     * table), for days processed in tiles: the action of the last effective edit that selects it.
     * {@link #applyVerdict} then gives exactly what {@link #apply} gives on the whole table: an edit
     * never sets a locked reason, so the last edit wins unless the automatic reason is locked.
     *
     * @param effective {@link #effective} edits
     * @param out       receives one verdict per row of {@code chunk}
     */
    public static void verdicts(SoundingTable chunk, long firstId, List<Edit> effective, byte[] out) {
        java.util.Arrays.fill(out, 0, chunk.size, NONE);
        for (Edit e : effective) {
            byte v = e.action() == Action.REJECT ? REJECT : RESTORE;
            if (e.selection() instanceof Edit.Ids ids) {
                int[] r = ids.ranges();
                for (int k = 0; k < r.length; k += 2) {
                    long from = Math.max(r[k], firstId), to = Math.min(r[k + 1], firstId + chunk.size - 1);
                    for (long i = from; i <= to; i++) out[(int) (i - firstId)] = v;
                }
            } else {
                e.selection().forEach(chunk, i -> out[i] = v);
            }
        }
    }

    /** Applies one verdict of {@link #verdicts} to a sounding's status and reason (index i of the arrays). */
    public static void applyVerdict(byte verdict, byte[] status, byte[] reason, int i) {
        if (verdict == NONE) return;
        if (status[i] == Status.REJECTED.code && UNRESTORABLE.contains(Reason.of(reason[i]))) return;
        if (verdict == REJECT) {
            status[i] = Status.REJECTED.code;
            reason[i] = Reason.REVIEWER.code;
        } else {
            status[i] = Status.ACCEPTED.code;
            reason[i] = Reason.NONE.code;
        }
    }

    /** Sequence number the next edit gets after these (1 for none). */
    public static long nextSequence(List<Edit> edits) {
        long m = 0;
        for (Edit e : edits) m = Math.max(m, e.sequence());
        return m + 1;
    }
}
