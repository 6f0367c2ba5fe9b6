package org.leadline.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.catchThrowable;
import static org.assertj.core.api.Assertions.fail;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.leadline.survey.PingTable;

/**
 * The streaming ping CSV reader ({@link PingCsvChunks}) against the whole-file read: the chunks,
 * concatenated, are the table {@link PingCsvReader#read} gives, value for value (bits), with the same
 * line ids; no ping is split; bad input late in the file gives the same error (line and column).
 */
class PingCsvChunksTest {
    @TempDir Path dir;

    /**
     * A swath-like file: pings of {@code beams} rows sharing time and line, several lines (names
     * reused after other lines), comments and blank lines among the data, CRLF and LF, spaces,
     * exponents and empty optional fields. Rows are 60-110 bytes, so small ranges cut inside pings.
     */
    private Path swath(String name, int pings, int beams, long seed, boolean sepNav) throws IOException {
        SplittableRandom r = new SplittableRandom(seed);
        StringBuilder sb = new StringBuilder("# survey of the test harbour\n\nTime,lat, lon,twtt,depth,angle,heading,heave,roll,pitch,line,beam,quality,extra\n");
        double t = 1778745600.0;
        for (int p = 0; p < pings; p++) {
            t += 0.2;
            if (r.nextInt(15) == 0) t += 0.0; // two pings of different lines at one time are told apart by the line
            String line = "L" + (p / 9 % 4) + (p % 23 == 0 ? "" : "");
            if (p % 31 == 30) sb.append("# line change ").append(p).append('\n');
            String time = IsoTime.format(t);
            int nb = 1 + r.nextInt(beams);
            for (int b = 0; b < nb; b++) {
                if (r.nextInt(300) == 0) sb.append(r.nextBoolean() ? "\n" : "\r\n");
                sb.append(time).append(',');
                boolean noNav = sepNav && r.nextInt(3) == 0;
                sb.append(noNav ? "" : String.format(Locale.ROOT, "%.8f", 50 + r.nextDouble() * 0.01)).append(", ");
                sb.append(noNav ? "" : r.nextInt(10) == 0 ? String.format(Locale.ROOT, "%.6e", -4 - r.nextDouble())
                        : String.format(Locale.ROOT, "%.9f", -4 - r.nextDouble())).append(',');
                boolean noTwtt = r.nextInt(7) == 0;
                sb.append(noTwtt ? "" : String.format(Locale.ROOT, "%.6f", r.nextDouble() * 0.2)).append(',');
                sb.append(noTwtt || r.nextInt(7) == 0 ? String.format(Locale.ROOT, "%.2f", r.nextDouble() * 80) : "").append(',');
                sb.append(String.format(Locale.ROOT, "%.3f", -65 + 130.0 * b / Math.max(1, nb - 1))).append(',');
                sb.append(r.nextInt(5) == 0 ? "" : String.format(Locale.ROOT, "%.2f", r.nextDouble() * 360)).append(',');
                sb.append(String.format(Locale.ROOT, "%.17g", r.nextGaussian() * 0.3)).append(',');
                sb.append(String.format(Locale.ROOT, " %.3f ", r.nextGaussian())).append(',');
                sb.append(String.format(Locale.ROOT, "%.3f", r.nextGaussian())).append(',');
                sb.append(r.nextInt(40) == 0 ? "" : line).append(',');
                sb.append(b).append(',');
                sb.append(r.nextInt(4) == 0 ? "" : "+" + r.nextInt(100));
                if (r.nextBoolean()) sb.append(",x");
                sb.append(r.nextInt(3) == 0 ? "\r\n" : "\n");
            }
        }
        Path f = dir.resolve(name);
        Files.writeString(f, sb.toString());
        return f;
    }

    private static List<PingTable> chunks(Path f, boolean sepNav, int target, int rangeBytes, int windowBytes) throws IOException {
        return chunks(f, sepNav, target, rangeBytes, windowBytes, false);
    }

    /** All chunks; {@code general}: whether the general path is expected to take over (else the fast path reads it all). */
    private static List<PingTable> chunks(Path f, boolean sepNav, int target, int rangeBytes, int windowBytes, boolean general)
            throws IOException {
        List<PingTable> out = new ArrayList<>();
        try (PingCsvChunks c = new PingCsvChunks(f, sepNav, target, rangeBytes, windowBytes)) {
            assertThat(c.expectedRows()).isEqualTo(-1);
            for (PingTable t = c.next(); t != null; t = c.next()) out.add(t);
            assertThat(c.next()).isNull();
            assertThat(c.general()).as("general path used").isEqualTo(general);
        }
        return out;
    }

    /** Chunks against the whole table: every column bit for bit, line ids and names, ping boundaries, sizes. */
    private static void assertSameRows(List<PingTable> chunks, PingTable whole, int target) {
        int at = 0;
        for (int c = 0; c < chunks.size(); c++) {
            PingTable k = chunks.get(c);
            assertThat(k.size).as("chunk %d", c).isPositive();
            if (c < chunks.size() - 1) assertThat(k.size).as("chunk %d of target %d", c, target).isGreaterThanOrEqualTo(target);
            double[][] dk = {k.time, k.lat, k.lon, k.twtt, k.depth, k.angle, k.heading, k.heave, k.roll, k.pitch};
            double[][] dw = {whole.time, whole.lat, whole.lon, whole.twtt, whole.depth, whole.angle, whole.heading,
                    whole.heave, whole.roll, whole.pitch};
            for (int i = 0; i < k.size; i++) {
                for (int col = 0; col < dk.length; col++) {
                    if (Double.doubleToRawLongBits(dk[col][i]) != Double.doubleToRawLongBits(dw[col][at + i])) {
                        fail("column %d row %d: %s in the chunk, %s in the table", col, at + i, dk[col][i], dw[col][at + i]);
                    }
                }
                if (k.line[i] != whole.line[at + i] || !k.lineName(i).equals(whole.lineName(at + i))
                        || k.beam[i] != whole.beam[at + i] || k.quality[i] != whole.quality[at + i]) {
                    fail("row %d: line %d '%s' beam %d quality %d in the chunk, line %d '%s' beam %d quality %d in the table", at + i,
                            k.line[i], k.lineName(i), k.beam[i], k.quality[i], whole.line[at + i], whole.lineName(at + i),
                            whole.beam[at + i], whole.quality[at + i]);
                }
            }
            // the chunk's dictionary is the file's so far: a prefix of the whole table's names
            assertThat(whole.lineNames().subList(0, k.lineNames().size())).isEqualTo(k.lineNames());
            if (at > 0) { // no ping is split between this chunk and the one before
                boolean samePing = whole.time[at] == whole.time[at - 1] && whole.line[at] == whole.line[at - 1];
                assertThat(samePing).as("ping split at row %d", at).isFalse();
            }
            at += k.size;
        }
        assertThat(at).isEqualTo(whole.size);
        assertThat(chunks.get(chunks.size() - 1).lineNames()).isEqualTo(whole.lineNames());
    }

    @Test
    void chunksConcatenateToTheWholeTable() throws IOException {
        Path f = swath("day.csv", 120, 40, 1, false);
        PingTable whole = PingCsvReader.read(f);
        assertThat(whole.size).isGreaterThan(2000);
        assertThat(whole.lineNames()).containsExactly("L0", "L1", "L2", "L3");
        // ranges of 1 byte (one line each: every ping straddles range boundaries), 97 bytes, 4 KiB, 1 MiB;
        // windows of 512 bytes and 8 KiB (pings straddle windows too) and one window for the file
        for (int rangeBytes : new int[]{1, 97, 4096, 1 << 20}) {
            for (int windowBytes : new int[]{512, 8192, 64 << 20}) {
                for (int target : new int[]{1, 57, 1000, whole.size + 1}) {
                    List<PingTable> c = chunks(f, false, target, rangeBytes, windowBytes);
                    assertSameRows(c, whole, target);
                    // cut where the whole-table slices of the other formats are cut: the first ping start at or after the target
                    List<Integer> sizes = new ArrayList<>();
                    WholeTableChunks w = new WholeTableChunks(whole, target);
                    for (PingTable t = w.next(); t != null; t = w.next()) sizes.add(t.size);
                    assertThat(c.stream().map(t -> t.size).toList()).isEqualTo(sizes);
                    if (target > whole.size) assertThat(c).hasSize(1);
                }
            }
        }
        // the public entry point too
        try (PingChunks c = PingFiles.chunks(f, false, 500)) {
            List<PingTable> all = new ArrayList<>();
            for (PingTable t = c.next(); t != null; t = c.next()) all.add(t);
            assertSameRows(all, whole, 500);
        }
    }

    @Test
    void separateNavigationRowsWithoutPositions() throws IOException {
        Path f = swath("nav.csv", 60, 30, 2, true);
        PingTable whole = PingCsvReader.read(f, true);
        assertThat(java.util.Arrays.stream(whole.lat).filter(Double::isNaN).count()).isPositive();
        for (int target : new int[]{1, 100}) assertSameRows(chunks(f, true, target, 97, 1024), whole, target);
        // without separate navigation an empty position is an error, found by both readers at the same place
        InputException e = (InputException) catchThrowable(() -> PingCsvReader.read(f, false));
        assertThat(e).isNotNull();
        assertThatThrownBy(() -> chunks(f, false, 10, 97, 1024)).isInstanceOf(InputException.class).hasMessage(e.getMessage());
    }

    @Test
    void lateBadInputGivesTheWholeFileError() throws IOException {
        String good = Files.readString(swath("good.csv", 100, 30, 3, false));
        String[] lines = good.split("\n", -1);
        int bad = lines.length - 40; // a data line near the end
        assertThat(lines[bad]).startsWith("2026");
        String[][] damage = {
                {"twtt", "0.1x"}, // not a number
                {"lat", "91.5"},  // out of range
                {"time", "2026-05-14T07:00:00.000Z"}, // time going back
                {"twtt", "1500"}, // milliseconds
        };
        int[] field = {4, 2, 1, 4};
        for (int d = 0; d < damage.length; d++) {
            String[] copy = lines.clone();
            String[] fields = copy[bad].split(",", -1);
            fields[field[d] - 1] = damage[d][1];
            copy[bad] = String.join(",", fields);
            Path f = dir.resolve("bad-" + d + ".csv");
            Files.writeString(f, String.join("\n", copy));
            InputException expected = (InputException) catchThrowable(() -> PingCsvReader.read(f));
            assertThat(expected).as(damage[d][0]).isNotNull();
            assertThat(expected.line()).isEqualTo(bad + 1);
            assertThat(expected.column()).isEqualTo(field[d]);
            for (int rangeBytes : new int[]{1, 97, 1 << 20}) {
                List<PingTable> served = new ArrayList<>();
                Throwable got;
                try (PingCsvChunks c = new PingCsvChunks(f, false, 50, rangeBytes, 2048)) {
                    got = catchThrowable(() -> {
                        for (PingTable t = c.next(); t != null; t = c.next()) served.add(t);
                    });
                }
                assertThat(got).as("%s, ranges of %d bytes", damage[d][0], rangeBytes).isInstanceOfSatisfying(InputException.class, e -> {
                    assertThat(e.getMessage()).isEqualTo(expected.getMessage());
                    assertThat(e.line()).isEqualTo(expected.line());
                    assertThat(e.column()).isEqualTo(expected.column());
                });
                // a late chunk: earlier chunks were served before the error was found
                assertThat(served).isNotEmpty();
            }
        }
    }

    @Test
    void filesTheFastPathRefusesStreamThroughTheGeneralPath() throws IOException {
        String good = Files.readString(swath("plain.csv", 80, 20, 4, false));
        // a quoted line name late in the file: valid, read by the general path from there on
        int cut = good.lastIndexOf(",L");
        Path quoted = dir.resolve("quoted.csv");
        Files.writeString(quoted, good.substring(0, cut) + ",\"L,9\"" + good.substring(cut + 3));
        PingTable whole = PingCsvReader.read(quoted);
        assertThat(whole.lineNames()).contains("L,9");
        for (int target : new int[]{1, 64, 5000}) assertSameRows(chunks(quoted, false, target, 97, 1024, true), whole, target);
        // a byte-order mark: the fast path refuses the header, the general path reads it all
        Path bom = dir.resolve("bom.csv");
        Files.writeString(bom, "\uFEFF" + good.substring(good.indexOf("Time")));
        PingTable b = PingCsvReader.read(bom);
        assertSameRows(chunks(bom, false, 100, 97, 1024, true), b, 100);
        // no rows at all
        Path empty = dir.resolve("empty.csv");
        Files.writeString(empty, "time,lat,lon,twtt\n# nothing yet\n");
        assertThatThrownBy(() -> chunks(empty, false, 10, 97, 1024)).isInstanceOf(InputException.class)
                .hasMessageContaining("expected ping rows after the header, found none");
    }

    @Test
    void readsTheFileAWindowAtATime() throws IOException {
        Path f = swath("big.csv", 200, 40, 5, false);
        long size = Files.size(f);
        try (PingCsvChunks c = new PingCsvChunks(f, false, 100, 4096, 16384)) {
            PingTable first = c.next();
            assertThat(first.size).isGreaterThanOrEqualTo(100);
            // bounded memory: after the first chunk only about one window of the file has been parsed
            assertThat(c.position()).isLessThanOrEqualTo(16384 + 200).isLessThan(size / 4);
        }
    }
}
