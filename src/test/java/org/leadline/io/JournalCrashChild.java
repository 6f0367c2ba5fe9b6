package org.leadline.io;

import org.leadline.cleaning.Edit;
import org.leadline.cleaning.Edit.Action;
import org.leadline.cleaning.Edit.Ids;

import java.nio.file.Path;
import java.util.Random;

/**
 * Child process of {@link EditJournalCrashTest}: appends random edits to a journal for ever and
 * prints each sequence number after its append returned (the line is forced to disk), until the
 * parent kills it.
 */
public final class JournalCrashChild {
    private JournalCrashChild() {}

    public static void main(String[] args) throws Exception {
        Path path = Path.of(args[0]);
        int soundings = Integer.parseInt(args[1]);
        Random rnd = new Random(Long.parseLong(args[2]));
        try (EditJournalFile j = EditJournalFile.open(path)) {
            while (true) {
                int r = rnd.nextInt(10);
                Action a = r < 5 ? Action.REJECT : r < 7 ? Action.RESTORE : r < 9 ? Action.UNDO : Action.REDO;
                Ids sel = null;
                if (a == Action.REJECT || a == Action.RESTORE) {
                    int[] ids = new int[1 + rnd.nextInt(30)];
                    int at = rnd.nextInt(soundings);
                    for (int q = 0; q < ids.length; q++) ids[q] = Math.min(soundings - 1, at + rnd.nextInt(50));
                    sel = Ids.of(ids);
                }
                Edit e = j.append(1.7e9 + j.nextSequence(), "child", a, sel, a == Action.REJECT ? "spike\tby eye" : "");
                System.out.println(e.sequence());
                System.out.flush();
            }
        }
    }
}
