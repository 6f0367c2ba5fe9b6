package org.leadline.robust;

import com.code_intelligence.jazzer.junit.FuzzTest;
import org.leadline.io.CastReader;
import org.leadline.io.EditJournalFile;
import org.leadline.io.InputException;
import org.leadline.io.NmeaReader;
import org.leadline.io.PingCsvReader;
import org.leadline.io.ProjectReader;
import org.leadline.io.VesselReader;
import org.leadline.io.WaterLevelCsvReader;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDate;

/**
 * Fuzz tests of Leadline's readers (issue 8, docs/reliability.md) with Jazzer: whatever the bytes,
 * a reader either returns what it parsed or throws Leadline's own {@link InputException}; any
 * other exception (or error) is a finding.
 *
 * <p>Under plain {@code mvn test} each fuzz test replays its committed seed corpus,
 * {@code src/test/resources/org/leadline/robust/ReaderFuzzTestInputs/<method>/}, as a regression
 * test (every crash once found is kept there). Fuzzing for real, one reader at a time:
 * <pre>
 * JAZZER_FUZZ=1 nice -n 10 mvn -B -o test -Dtest='ReaderFuzzTest#pingCsv'
 * </pre>
 * runs until {@code maxDuration} (or add {@code -Djazzer.max_duration=10m}); new crashing inputs
 * are written to the corpus folder of that method.
 */
class ReaderFuzzTest {
    private static final Path DIR;

    static {
        try {
            DIR = Files.createTempDirectory("leadline-fuzz");
            DIR.toFile().deleteOnExit();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /** The bytes as a file of that name (the readers take paths); the same file is reused. */
    private static Path file(String name, byte[] data) {
        try {
            Path p = DIR.resolve(name);
            Files.write(p, data);
            p.toFile().deleteOnExit();
            return p;
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    @FuzzTest(maxDuration = "5m")
    void pingCsv(byte[] data) {
        try {
            PingCsvReader.read(file("pings.csv", data), data.length % 2 == 0);
        } catch (InputException expected) {
            // the only allowed failure
        }
    }

    @FuzzTest(maxDuration = "5m")
    void cast(byte[] data) {
        try {
            CastReader.read(file("cast.csv", data));
        } catch (InputException expected) {
            // the only allowed failure
        }
    }

    @FuzzTest(maxDuration = "5m")
    void waterLevel(byte[] data) {
        try {
            WaterLevelCsvReader.read(file("tide.csv", data));
        } catch (InputException expected) {
            // the only allowed failure
        }
    }

    @FuzzTest(maxDuration = "5m")
    void nmea(byte[] data) throws IOException {
        try {
            // a stream cannot fail to read: an IOException here would be a finding too
            NmeaReader.read(new ByteArrayInputStream(data), "log.nmea", data.length % 2 == 0 ? null : LocalDate.of(2026, 5, 14))
                    .toPingTable("L1");
        } catch (InputException expected) {
            // the only allowed failure
        }
    }

    @FuzzTest(maxDuration = "5m")
    void vesselYaml(byte[] data) {
        try {
            VesselReader.read(file("vessel.yaml", data));
        } catch (InputException expected) {
            // the only allowed failure
        }
    }

    @FuzzTest(maxDuration = "5m")
    void projectYaml(byte[] data) {
        // inputs named in a project must exist beside it: give the fuzzer a few to find
        file("pings.csv", new byte[0]);
        file("cast.csv", new byte[0]);
        try {
            ProjectReader.read(file("project.yaml", data));
        } catch (InputException expected) {
            // the only allowed failure
        }
    }

    @FuzzTest(maxDuration = "5m")
    void editJournal(byte[] data) throws IOException {
        try {
            EditJournalFile.read(file("edits.journal", data));
        } catch (InputException expected) {
            // the only allowed failure
        }
    }
}
