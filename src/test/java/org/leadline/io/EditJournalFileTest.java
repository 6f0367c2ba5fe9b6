package org.leadline.io;

import org.leadline.cleaning.Edit;
import org.leadline.cleaning.Edit.Action;
import org.leadline.cleaning.Edit.Ids;
import org.leadline.cleaning.Edit.Window;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

class EditJournalFileTest {
    @TempDir
    Path dir;

    static double t(String iso) {
        Instant i = Instant.parse(iso);
        return i.getEpochSecond() + i.getNano() / 1e9;
    }

    private List<Edit> sample() {
        List<Edit> e = new ArrayList<>();
        e.add(new Edit(1, t("2026-05-14T09:15:02.250Z"), "maria", Action.REJECT, Ids.of(120, 121, 122, 140), "fish school"));
        e.add(new Edit(2, t("2026-05-14T09:16:10Z"), "jo\tnas\\", Action.REJECT,
                new Window("L012 \u00e9", 1.7e9 + 0.123456789, 1.7e9 + 30.5, 40, 63), "second echo\nnear wreck"));
        e.add(new Edit(3, t("2026-05-14T09:17:00Z"), "maria", Action.UNDO, null, ""));
        e.add(new Edit(4, t("2026-05-14T09:17:01Z"), "maria", Action.REDO, null, ""));
        e.add(new Edit(5, t("2026-05-14T09:18:00Z"), "maria", Action.RESTORE,
                Window.allBeams("L013", 1.7e9 + 100, 1.7e9 + 200), ""));
        return e;
    }

    private Path writeSample() throws IOException {
        Path p = dir.resolve("harbour.journal");
        try (EditJournalFile j = EditJournalFile.open(p)) {
            for (Edit e : sample()) j.append(e);
        }
        return p;
    }

    @Test
    void roundTripKeepsEveryField() throws IOException {
        Path p = writeSample();
        EditJournalFile.Contents c = EditJournalFile.read(p);
        assertThat(c.warnings()).isEmpty();
        assertThat(c.edits()).isEqualTo(sample());
        List<String> lines = Files.readAllLines(p);
        assertThat(lines).hasSize(6);
        assertThat(lines.get(0)).isEqualTo(EditJournalFile.HEADER);
    }

    /**
     * The documented example line (docs/formats/journal.md); its CRC-32 was computed with Python's
     * zlib.crc32 (reference library), and the CRC-32 check value of "123456789" is cbf43926
     * (Williams 1993, "A painless guide to CRC error detection algorithms", from memory).
     */
    @Test
    void documentedExampleLineParses() throws IOException {
        String body = "7\t2026-05-14T09:15:02.250Z\tmaria\treject\t120..135,140\t\t\t\t\tfish school";
        java.util.zip.CRC32 crc = new java.util.zip.CRC32();
        crc.update("123456789".getBytes(StandardCharsets.US_ASCII));
        assertThat(crc.getValue()).isEqualTo(0xcbf43926L);
        Path p = dir.resolve("doc.journal");
        Files.writeString(p, EditJournalFile.HEADER + "\n" + body + "\t3c4107df\n"
                + "8\t2026-05-14T09:16:10Z\tmaria\treject\t\tL012\t2026-05-14T09:10:00Z\t2026-05-14T09:10:30.500Z\t40..63\tsecond echo\tfcea81fd\n");
        EditJournalFile.Contents c = EditJournalFile.read(p);
        assertThat(c.warnings()).isEmpty();
        assertThat(c.edits()).hasSize(2);
        Edit e = c.edits().get(0);
        assertThat(e.sequence()).isEqualTo(7);
        assertThat(((Ids) e.selection()).ranges()).containsExactly(120, 135, 140, 140);
        assertThat(e.reason()).isEqualTo("fish school");
        assertThat(c.edits().get(1).selection()).isEqualTo(
                new Window("L012", t("2026-05-14T09:10:00Z"), t("2026-05-14T09:10:30.500Z"), 40, 63));
        assertThat(EditJournalFile.format(e)).isEqualTo(body + "\t3c4107df");
    }

    @Test
    void tornLastLineIsSkippedWithAWarningAndCutOffBeforeTheNextAppend() throws IOException {
        Path p = writeSample();
        String extra = EditJournalFile.format(new Edit(6, 1.7e9, "maria", Action.REJECT, Ids.of(1), "x"));
        Files.write(p, extra.substring(0, 25).getBytes(StandardCharsets.UTF_8), StandardOpenOption.APPEND);
        EditJournalFile.Contents c = EditJournalFile.read(p);
        assertThat(c.edits()).isEqualTo(sample());
        assertThat(c.warnings()).singleElement().asString().contains(":7:").contains("incomplete last line");

        try (EditJournalFile j = EditJournalFile.open(p)) {
            assertThat(j.warnings()).hasSize(1);
            assertThat(j.nextSequence()).isEqualTo(6);
            j.append(1.7e9 + 5, "maria", Action.REJECT, Ids.of(7, 8), "after the crash");
        }
        c = EditJournalFile.read(p);
        assertThat(c.warnings()).isEmpty();
        assertThat(c.edits()).hasSize(6);
        assertThat(c.edits().get(5).reason()).isEqualTo("after the crash");
    }

    @Test
    void lastLineWithABadChecksumIsSkippedWithAWarning() throws IOException {
        Path p = writeSample();
        String line = EditJournalFile.format(new Edit(6, 1.7e9, "maria", Action.REJECT, Ids.of(1), "x"));
        String garbled = line.replace("maria", "mar\u0000a");
        Files.writeString(p, garbled + "\n", StandardOpenOption.APPEND);
        EditJournalFile.Contents c = EditJournalFile.read(p);
        assertThat(c.edits()).isEqualTo(sample());
        assertThat(c.warnings()).singleElement().asString().contains(":7:").contains("checksum");
    }

    @Test
    void corruptedMiddleLineIsAnErrorNamingFileAndLine() throws IOException {
        Path p = writeSample();
        List<String> lines = new ArrayList<>(Files.readAllLines(p));
        lines.set(2, lines.get(2).replace("second", "sec0nd"));
        Files.write(p, lines);
        assertThatThrownBy(() -> EditJournalFile.read(p))
                .isInstanceOfSatisfying(InputException.class, e -> {
                    assertThat(e.file()).isEqualTo(p.toString());
                    assertThat(e.line()).isEqualTo(3);
                    assertThat(e.problem()).contains("CRC-32");
                });
        assertThatThrownBy(() -> EditJournalFile.open(p)).isInstanceOf(InputException.class);
    }

    @Test
    void wrongHeaderAndOutOfOrderSequencesAreErrors() throws IOException {
        Path p = dir.resolve("x.journal");
        Files.writeString(p, "time,lat,lon\n");
        assertThatThrownBy(() -> EditJournalFile.read(p)).isInstanceOfSatisfying(InputException.class,
                e -> assertThat(e.line()).isEqualTo(1));
        Edit a = new Edit(2, 1.7e9, "m", Action.UNDO, null, "");
        Edit b = new Edit(2, 1.7e9, "m", Action.REDO, null, "");
        Files.writeString(p, EditJournalFile.HEADER + "\n" + EditJournalFile.format(a) + "\n"
                + EditJournalFile.format(b) + "\n");
        assertThatThrownBy(() -> EditJournalFile.read(p)).isInstanceOfSatisfying(InputException.class,
                e -> assertThat(e.line()).isEqualTo(3));
    }

    /** A long random session written to disk and read back replays to exactly the same statuses. */
    @Test
    void replayFromTheFileReproducesEveryStatus() throws IOException {
        int n = 3000;
        org.leadline.survey.SoundingTable base = new org.leadline.survey.SoundingTable(n, List.of("L1", "L2"));
        java.util.Random rnd = new java.util.Random(7);
        for (int i = 0; i < n; i++) {
            base.time[i] = 1.7e9 + 0.37 * (i / 10) + 1e-3 * rnd.nextDouble(); // irregular ping times
            base.line[i] = i < n / 2 ? 0 : 1;
            base.beam[i] = i % 10;
            if (rnd.nextInt(20) == 0) base.reject(i, org.leadline.survey.SoundingTable.Reason.SPIKE);
        }
        List<Edit> edits = new ArrayList<>();
        for (int k = 1; k <= 400; k++) {
            int r = rnd.nextInt(10);
            Action a = r < 4 ? Action.REJECT : r < 6 ? Action.RESTORE : r < 8 ? Action.UNDO : Action.REDO;
            Edit.Selection sel = null;
            if (a == Action.REJECT || a == Action.RESTORE) {
                int i = rnd.nextInt(n);
                if (rnd.nextBoolean()) {
                    int[] ids = new int[1 + rnd.nextInt(30)];
                    for (int q = 0; q < ids.length; q++) ids[q] = Math.min(n - 1, i + rnd.nextInt(80));
                    sel = Ids.of(ids);
                } else {
                    int j = Math.min(n - 1, i + rnd.nextInt(200));
                    sel = new Window(base.lineName(i), base.time[i], Math.max(base.time[i], base.time[j]), 2, 7);
                }
            }
            edits.add(new Edit(k, 1.7e9 + 3600 + k * 1.001, "r\\x" + (k % 3), a, sel, r == 0 ? "tab\there" : ""));
        }
        Path p = dir.resolve("session.journal");
        try (EditJournalFile j = EditJournalFile.open(p)) {
            for (Edit e : edits) j.append(e);
        }
        List<Edit> back = EditJournalFile.read(p).edits();
        assertThat(back).isEqualTo(edits);
        org.leadline.survey.SoundingTable a = copy(base), b = copy(base);
        int changed = org.leadline.cleaning.EditJournal.apply(a, edits);
        org.leadline.cleaning.EditJournal.apply(b, back);
        assertThat(changed).isGreaterThan(0);
        assertThat(b.status).isEqualTo(a.status);
        assertThat(b.reason).isEqualTo(a.reason);
    }

    private static org.leadline.survey.SoundingTable copy(org.leadline.survey.SoundingTable t) {
        org.leadline.survey.SoundingTable s = new org.leadline.survey.SoundingTable(t.size, t.lineNames());
        System.arraycopy(t.time, 0, s.time, 0, t.size);
        System.arraycopy(t.line, 0, s.line, 0, t.size);
        System.arraycopy(t.beam, 0, s.beam, 0, t.size);
        System.arraycopy(t.status, 0, s.status, 0, t.size);
        System.arraycopy(t.reason, 0, s.reason, 0, t.size);
        return s;
    }

    @Test
    void missingJournalHasNoEditsAndBesideProjectNamesIt() throws IOException {
        assertThat(EditJournalFile.read(dir.resolve("none.journal")).edits()).isEmpty();
        assertThat(EditJournalFile.besideProject(dir.resolve("harbour.yaml"))).isEqualTo(dir.resolve("harbour.journal"));
    }

    @Test
    void appendRefusesOutOfOrderEdits() throws IOException {
        try (EditJournalFile j = EditJournalFile.open(dir.resolve("o.journal"))) {
            assertThatThrownBy(() -> j.append(new Edit(3, 1.7e9, "m", Action.UNDO, null, "")))
                    .isInstanceOf(IllegalArgumentException.class);
        }
    }
}
