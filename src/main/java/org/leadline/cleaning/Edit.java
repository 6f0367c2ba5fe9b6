package org.leadline.cleaning;

import org.leadline.survey.SoundingTable;

import java.util.Arrays;
import java.util.Objects;
import java.util.function.IntConsumer;

/**
 * One entry of the reviewer's edit journal: who did what to which soundings, when and why.
 * Replayed by {@link EditJournal}; stored by {@code org.leadline.io.EditJournalFile}
 * (docs/formats/journal.md).
 *
 * @param sequence  1, 2, 3, ... in the order the edits were made
 * @param time      when the edit was made, UTC seconds since 1970-01-01T00:00Z
 * @param user      who made it (user name)
 * @param action    what was done
 * @param selection the soundings acted on; null for {@link Action#UNDO} and {@link Action#REDO}
 * @param reason    the reviewer's reason text ("" when none)
 */
public record Edit(long sequence, double time, String user, Action action, Selection selection, String reason) {

    /** Kinds of edit: reject or restore a selection, undo the latest edit, redo the latest undone one. */
    public enum Action { REJECT, RESTORE, UNDO, REDO }

    public Edit {
        Objects.requireNonNull(action, "action");
        user = user == null ? "" : user;
        reason = reason == null ? "" : reason;
        if (sequence < 1) throw new IllegalArgumentException("edit sequence numbers start at 1, got " + sequence);
        boolean needs = action == Action.REJECT || action == Action.RESTORE;
        if (needs && selection == null) throw new IllegalArgumentException(action + " needs a selection");
        if (!needs && selection != null) throw new IllegalArgumentException(action + " takes no selection");
    }

    /** The soundings an edit acts on. */
    public sealed interface Selection permits Ids, Window {
        /** Calls {@code each} with every selected sounding id (row) of s, ascending, ids beyond the table skipped. */
        void forEach(SoundingTable s, IntConsumer each);
    }

    /**
     * Soundings by id (row index in the {@link SoundingTable}), compressed to inclusive ranges:
     * {@code ranges = {first0, last0, first1, last1, ...}}, ascending, not touching.
     */
    public record Ids(int[] ranges) implements Selection {
        public Ids {
            ranges = ranges.clone();
            if (ranges.length % 2 != 0) throw new IllegalArgumentException("id ranges come in pairs");
            for (int k = 0; k < ranges.length; k += 2) {
                if (ranges[k] < 0 || ranges[k] > ranges[k + 1] || (k > 0 && ranges[k] <= ranges[k - 1] + 1)) {
                    throw new IllegalArgumentException("id ranges must be ascending, non-negative and not touching: "
                            + Arrays.toString(ranges));
                }
            }
        }

        /** Compresses any ids (any order, repeats allowed) into ranges. */
        public static Ids of(int... ids) {
            int[] s = ids.clone();
            Arrays.sort(s);
            int[] r = new int[2 * s.length];
            int k = 0;
            for (int q = 0; q < s.length; q++) {
                if (s[q] < 0) throw new IllegalArgumentException("sounding ids are >= 0, got " + s[q]);
                if (k > 0 && s[q] <= r[k - 1] + 1) {
                    r[k - 1] = Math.max(r[k - 1], s[q]);
                } else {
                    r[k++] = s[q];
                    r[k++] = s[q];
                }
            }
            return new Ids(Arrays.copyOf(r, k));
        }

        /** Ids of the soundings for which {@code selected[i]} is true. */
        public static Ids of(boolean[] selected) {
            int[] r = new int[16];
            int k = 0;
            for (int i = 0; i < selected.length; i++) {
                if (!selected[i]) continue;
                if (k > 0 && r[k - 1] == i - 1) {
                    r[k - 1] = i;
                } else {
                    if (k + 2 > r.length) r = Arrays.copyOf(r, r.length * 2);
                    r[k++] = i;
                    r[k++] = i;
                }
            }
            return new Ids(Arrays.copyOf(r, k));
        }

        @Override
        public int[] ranges() { return ranges.clone(); }

        /** Number of ids selected. */
        public long count() {
            long c = 0;
            for (int k = 0; k < ranges.length; k += 2) c += (long) ranges[k + 1] - ranges[k] + 1;
            return c;
        }

        @Override
        public void forEach(SoundingTable s, IntConsumer each) {
            for (int k = 0; k < ranges.length; k += 2) {
                int last = Math.min(ranges[k + 1], s.size - 1);
                for (int i = ranges[k]; i <= last; i++) each.accept(i);
            }
        }

        @Override
        public boolean equals(Object o) { return o instanceof Ids other && Arrays.equals(ranges, other.ranges); }

        @Override
        public int hashCode() { return Arrays.hashCode(ranges); }

        @Override
        public String toString() { return "Ids" + Arrays.toString(ranges); }
    }

    /**
     * Soundings of one survey line within a time range and a beam range (both inclusive): what the
     * reviewer draws in the Along-track view. A single beam has beam number -1.
     *
     * @param line      survey line name
     * @param fromTime  first ping time, UTC seconds since the epoch
     * @param toTime    last ping time, UTC seconds since the epoch
     * @param fromBeam  first beam number
     * @param toBeam    last beam number
     */
    public record Window(String line, double fromTime, double toTime, int fromBeam, int toBeam) implements Selection {
        public Window {
            Objects.requireNonNull(line, "line");
            if (!(fromTime <= toTime)) throw new IllegalArgumentException("time range " + fromTime + " .. " + toTime);
            if (fromBeam > toBeam) throw new IllegalArgumentException("beam range " + fromBeam + " .. " + toBeam);
        }

        /** Every beam of the line in the time range. */
        public static Window allBeams(String line, double fromTime, double toTime) {
            return new Window(line, fromTime, toTime, Integer.MIN_VALUE, Integer.MAX_VALUE);
        }

        @Override
        public void forEach(SoundingTable s, IntConsumer each) {
            int id = s.lineNames().indexOf(line);
            if (id < 0) return;
            for (int i = 0; i < s.size; i++) {
                if (s.line[i] == id && s.time[i] >= fromTime && s.time[i] <= toTime
                        && s.beam[i] >= fromBeam && s.beam[i] <= toBeam) {
                    each.accept(i);
                }
            }
        }
    }
}
