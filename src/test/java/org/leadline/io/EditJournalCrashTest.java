package org.leadline.io;

import org.leadline.cleaning.Edit;
import org.leadline.cleaning.Edit.Action;
import org.leadline.cleaning.EditJournal;
import org.leadline.survey.SoundingTable;
import org.leadline.survey.SoundingTable.Reason;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.File;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Set;
import java.util.concurrent.TimeUnit;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * Crash test: a real child JVM appends edits in a loop and reports each one after it is synced;
 * the parent kills it with SIGKILL mid-stream and checks that every reported edit survived, at
 * most the one in flight is missing, a torn tail is skipped with a warning, and replay works.
 */
class EditJournalCrashTest {
    @TempDir
    Path dir;

    /** Sequence numbers on complete lines of the child's output (a line cut by the kill is no report). */
    private static List<Long> completeNumbers(Path file) throws java.io.IOException {
        String text = java.nio.file.Files.readString(file, StandardCharsets.US_ASCII);
        List<Long> out = new ArrayList<>();
        int end = text.lastIndexOf('\n');
        if (end < 0) return out;
        for (String s : text.substring(0, end).split("\n")) if (!s.isBlank()) out.add(Long.parseLong(s.trim()));
        return out;
    }

    @Test
    void everyReportedEditSurvivesSigkill() throws Exception {
        Path journal = dir.resolve("crash.journal");
        int soundings = 2000;
        String javaBin = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        Set<String> cp = new LinkedHashSet<>();
        cp.add(Path.of(JournalCrashChild.class.getProtectionDomain().getCodeSource().getLocation().toURI()).toString());
        cp.add(Path.of(EditJournalFile.class.getProtectionDomain().getCodeSource().getLocation().toURI()).toString());
        for (String s : System.getProperty("java.class.path").split(File.pathSeparator)) if (!s.isEmpty()) cp.add(s);
        ProcessBuilder pb = new ProcessBuilder(javaBin, "-Xmx64m", "-cp", String.join(File.pathSeparator, cp),
                JournalCrashChild.class.getName(), journal.toString(), String.valueOf(soundings), "4242");
        pb.redirectError(ProcessBuilder.Redirect.DISCARD);
        // stdout goes to a file: Process.destroyForcibly() closes the pipes, and the reports the
        // child wrote just before it died must still be readable afterwards
        Path reports = dir.resolve("reports.txt");
        pb.redirectOutput(reports.toFile());
        Process child = pb.start();
        int target = 120;
        List<Long> reported = completeNumbers(reports);
        while (reported.size() < target && child.isAlive()) {
            Thread.sleep(20);
            reported = completeNumbers(reports);
        }
        child.destroyForcibly(); // SIGKILL on Linux
        assertThat(child.waitFor(30, TimeUnit.SECONDS)).isTrue();
        reported = completeNumbers(reports); // every report printed before the kill was synced first
        assertThat(reported).as("child reports").hasSizeGreaterThanOrEqualTo(target);
        long lastReported = reported.get(reported.size() - 1);

        EditJournalFile.Contents c = EditJournalFile.read(journal);
        List<Long> seqs = c.edits().stream().map(Edit::sequence).toList();
        System.out.printf("crash test: child reported %d edits, journal holds %d, warnings %s%n",
                reported.size(), seqs.size(), c.warnings());
        assertThat(seqs).containsAll(reported);
        for (int k = 0; k < seqs.size(); k++) assertThat(seqs.get(k)).isEqualTo(k + 1L);
        assertThat((long) seqs.size()).isBetween(lastReported, lastReported + 1); // at most the one in flight
        assertThat(c.warnings()).hasSizeLessThanOrEqualTo(1);
        c.warnings().forEach(w -> assertThat(w).contains("last line"));

        // a power loss can also leave half a line: simulate one and read again
        String half = EditJournalFile.format(new Edit(seqs.size() + 1L, 1.8e9, "child", Action.REJECT,
                org.leadline.cleaning.Edit.Ids.of(1, 2, 3), "in flight"));
        java.nio.file.Files.write(journal, half.substring(0, half.length() / 2).getBytes(StandardCharsets.UTF_8),
                java.nio.file.StandardOpenOption.APPEND);
        EditJournalFile.Contents torn = EditJournalFile.read(journal);
        assertThat(torn.edits()).isEqualTo(c.edits());
        assertThat(torn.warnings()).singleElement().asString().contains("incomplete last line");

        // replay works on what survived, and the journal can be continued
        SoundingTable s = new SoundingTable(soundings, List.of("L1"));
        s.reject(3, Reason.SPIKE);
        EditJournal.apply(s, c.edits());
        int rejected = soundings - s.countAccepted();
        assertThat(rejected).isGreaterThan(0);
        try (EditJournalFile j = EditJournalFile.open(journal)) {
            Edit e = j.append(1.8e9, "after", Action.UNDO, null, "");
            assertThat(e.sequence()).isEqualTo(seqs.size() + 1L);
        }
        assertThat(EditJournalFile.read(journal).edits()).hasSize(seqs.size() + 1);
    }
}
