package org.leadline.cleaning;

import org.leadline.cleaning.Edit.Action;
import org.leadline.cleaning.Edit.Ids;
import org.leadline.cleaning.Edit.Selection;
import org.leadline.cleaning.Edit.Window;
import org.leadline.survey.SoundingTable;
import org.leadline.survey.SoundingTable.Reason;
import org.junit.jupiter.api.Test;

import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Deque;
import java.util.List;
import java.util.Random;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

class EditJournalTest {
    static final double T0 = 1.7e9;

    private static SoundingTable table(int n) {
        SoundingTable s = new SoundingTable(n, List.of("L1", "L2"));
        for (int i = 0; i < n; i++) {
            s.time[i] = T0 + i / 4;   // 4 beams per ping
            s.beam[i] = i % 4;
            s.line[i] = i < n / 2 ? 0 : 1;
            s.depth[i] = 20;
        }
        return s;
    }

    private static Edit edit(long seq, Action a, Selection sel) {
        return new Edit(seq, T0 + 10 * seq, "maria", a, sel, a == Action.UNDO || a == Action.REDO ? "" : "test");
    }

    /** Compression worked by hand in this test: ids {12,3,4,5,9,11,4} -> 3..5, 9, 11..12. */
    @Test
    void aSelectionBecomesCompressedRanges() {
        assertThat(Ids.of(12, 3, 4, 5, 9, 11, 4).ranges()).containsExactly(3, 5, 9, 9, 11, 12);
        boolean[] lasso = new boolean[20];
        for (int i : new int[] {0, 1, 2, 7, 8, 19}) lasso[i] = true;
        Ids ids = Ids.of(lasso);
        assertThat(ids.ranges()).containsExactly(0, 2, 7, 8, 19, 19);
        assertThat(ids.count()).isEqualTo(6);
        List<Integer> seen = new ArrayList<>();
        ids.forEach(table(20), seen::add);
        assertThat(seen).containsExactly(0, 1, 2, 7, 8, 19);
        assertThatThrownBy(() -> new Ids(new int[] {5, 3})).isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> new Ids(new int[] {1, 3, 4, 6})).isInstanceOf(IllegalArgumentException.class);
    }

    @Test
    void windowSelectsLineTimeAndBeams() {
        SoundingTable s = table(40); // line L2 holds rows 20..39, pings T0+5 .. T0+9
        List<Integer> seen = new ArrayList<>();
        new Window("L2", T0 + 6, T0 + 7, 1, 2).forEach(s, seen::add);
        // worked by hand: ping T0+6 is rows 24..27, T0+7 rows 28..31; beams 1..2
        assertThat(seen).containsExactly(25, 26, 29, 30);
        seen.clear();
        Window.allBeams("nope", T0, T0 + 100).forEach(s, seen::add);
        assertThat(seen).isEmpty();
    }

    /** Undo/redo worked by hand in this test on a 12-sounding table. */
    @Test
    void undoRedoRoundTrip() {
        SoundingTable base = table(12);
        base.reject(5, Reason.SPIKE);
        base.reject(6, Reason.NO_NAVIGATION);
        List<Edit> j = new ArrayList<>();
        j.add(edit(1, Action.REJECT, Ids.of(0, 1, 2)));
        j.add(edit(2, Action.RESTORE, Ids.of(1, 5, 6)));
        SoundingTable s = copy(base);
        EditJournal.apply(s, j);
        // 0, 2 rejected by the reviewer; 1 restored; 5 restored over the spike filter; 6 stays (no navigation)
        assertThat(statuses(s)).isEqualTo("RARAAARAAAAA");
        assertThat(Reason.of(s.reason[0])).isEqualTo(Reason.REVIEWER);
        assertThat(Reason.of(s.reason[6])).isEqualTo(Reason.NO_NAVIGATION);

        j.add(edit(3, Action.UNDO, null));      // undoes the restore
        s = copy(base);
        EditJournal.apply(s, j);
        assertThat(statuses(s)).isEqualTo("RRRAARRAAAAA");
        assertThat(Reason.of(s.reason[5])).isEqualTo(Reason.SPIKE);

        j.add(edit(4, Action.UNDO, null));      // undoes the reject: back to the automatic result
        j.add(edit(5, Action.UNDO, null));      // nothing left to undo: no effect
        s = copy(base);
        EditJournal.apply(s, j);
        assertThat(s.status).isEqualTo(base.status);
        assertThat(s.reason).isEqualTo(base.reason);

        j.add(edit(6, Action.REDO, null));      // the reject again
        j.add(edit(7, Action.REDO, null));      // the restore again
        s = copy(base);
        EditJournal.apply(s, j);
        assertThat(statuses(s)).isEqualTo("RARAAARAAAAA");

        j.add(edit(8, Action.UNDO, null));      // undo the restore ...
        j.add(edit(9, Action.REJECT, Ids.of(11)));  // ... a new edit clears the redo stack
        j.add(edit(10, Action.REDO, null));     // nothing to redo
        s = copy(base);
        EditJournal.apply(s, j);
        assertThat(statuses(s)).isEqualTo("RRRAARRAAAAR");
        assertThat(EditJournal.effective(j)).extracting(Edit::sequence).containsExactly(1L, 9L);
        assertThat(EditJournal.nextSequence(j)).isEqualTo(11);
    }

    /**
     * Replay against an independent model: the model keeps a snapshot of all statuses per edit and
     * undoes/redoes by swapping snapshots; the journal replays from the automatic result. Every
     * prefix of a random journal must give identical statuses and reasons.
     */
    @Test
    void replayReproducesEveryStatusExactly() {
        SyntheticSurvey sv = SyntheticSurvey.make((e, n) -> 20 + 0.2 * e, 16, 3, 100, 5);
        Cleaner.clean(sv.table, null, CleaningSettings.defaults());
        SoundingTable base = sv.table;
        Random rnd = new Random(99);
        List<Edit> journal = randomJournal(base, 300, rnd);
        Model m = new Model(base);
        for (int k = 0; k < journal.size(); k++) {
            m.apply(journal.get(k));
            SoundingTable s = copy(base);
            EditJournal.apply(s, journal.subList(0, k + 1));
            assertThat(s.status).as("status after edit %d", k + 1).isEqualTo(m.status);
            assertThat(s.reason).as("reason after edit %d", k + 1).isEqualTo(m.reason);
        }
    }

    /** Random REJECT / RESTORE (by ids or window) / UNDO / REDO edits over a table. */
    static List<Edit> randomJournal(SoundingTable s, int count, Random rnd) {
        List<Edit> out = new ArrayList<>();
        for (int k = 1; k <= count; k++) {
            int r = rnd.nextInt(10);
            Action a = r < 4 ? Action.REJECT : r < 6 ? Action.RESTORE : r < 8 ? Action.UNDO : Action.REDO;
            Selection sel = null;
            if (a == Action.REJECT || a == Action.RESTORE) {
                if (rnd.nextBoolean()) {
                    int[] ids = new int[1 + rnd.nextInt(40)];
                    int at = rnd.nextInt(s.size);
                    for (int q = 0; q < ids.length; q++) ids[q] = Math.min(s.size - 1, at + rnd.nextInt(60));
                    sel = Ids.of(ids);
                } else {
                    int i = rnd.nextInt(s.size);
                    int b = Math.max(0, s.beam[i] - 2);
                    sel = new Window(s.lineName(i), s.time[i], s.time[i] + rnd.nextInt(20) * 0.5, b, b + rnd.nextInt(5));
                }
            }
            out.add(new Edit(k, T0 + k, "reviewer " + (k % 3), a, sel, a == Action.REJECT ? "fish" : ""));
        }
        return out;
    }

    /** Snapshot model of the reviewer's session: independent of EditJournal's replay. */
    static final class Model {
        byte[] status, reason;
        final Deque<byte[][]> undo = new ArrayDeque<>(), redo = new ArrayDeque<>();
        final SoundingTable base;

        Model(SoundingTable base) {
            this.base = base;
            status = base.status.clone();
            reason = base.reason.clone();
        }

        void apply(Edit e) {
            switch (e.action()) {
                case UNDO -> {
                    if (undo.isEmpty()) return;
                    redo.push(new byte[][] {status, reason});
                    byte[][] prev = undo.pop();
                    status = prev[0];
                    reason = prev[1];
                }
                case REDO -> {
                    if (redo.isEmpty()) return;
                    undo.push(new byte[][] {status, reason});
                    byte[][] next = redo.pop();
                    status = next[0];
                    reason = next[1];
                }
                default -> {
                    undo.push(new byte[][] {status.clone(), reason.clone()});
                    redo.clear();
                    boolean reject = e.action() == Action.REJECT;
                    e.selection().forEach(base, i -> {
                        Reason why = Reason.of(reason[i]);
                        if (status[i] == 1 && (why == Reason.NO_NAVIGATION || why == Reason.NO_ATTITUDE
                                || why == Reason.NO_RETURN || why == Reason.BEYOND_PROFILE)) return;
                        status[i] = (byte) (reject ? 1 : 0);
                        reason[i] = reject ? Reason.REVIEWER.code : 0;
                    });
                }
            }
        }
    }

    static SoundingTable copy(SoundingTable t) {
        SoundingTable s = new SoundingTable(t.size, t.lineNames());
        System.arraycopy(t.time, 0, s.time, 0, t.size);
        System.arraycopy(t.line, 0, s.line, 0, t.size);
        System.arraycopy(t.beam, 0, s.beam, 0, t.size);
        System.arraycopy(t.depth, 0, s.depth, 0, t.size);
        System.arraycopy(t.status, 0, s.status, 0, t.size);
        System.arraycopy(t.reason, 0, s.reason, 0, t.size);
        return s;
    }

    private static String statuses(SoundingTable s) {
        StringBuilder sb = new StringBuilder();
        for (int i = 0; i < s.size; i++) sb.append(s.accepted(i) ? 'A' : 'R');
        return sb.toString();
    }
}
