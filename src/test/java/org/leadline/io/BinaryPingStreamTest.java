package org.leadline.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.SplittableRandom;
import java.util.zip.CRC32;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.leadline.bench.SwathDayGenerator;
import org.leadline.survey.PingTable;

/**
 * Streamed reading ({@link BinaryPingReader#chunks}) and writing ({@link BinaryPingWriter#open}) of
 * the binary ping format: chunks concatenated give {@link BinaryPingReader#read}'s table and
 * errors; the stream writes {@link BinaryPingWriter#write}'s bytes however the rows are split;
 * the layout follows docs/formats/binary-pings.md (worked by hand in this test).
 */
class BinaryPingStreamTest {
    @TempDir Path dir;

    /** Columns of {@link #pings}: the file stores time, lat, lon, twtt, angle, heave, line, beam (depth, heading, roll, pitch, quality absent). */
    private static final int[] WIDTHS = {8, 8, 8, 8, 8, 8, 4, 4};

    /**
     * Pings of 1 to 40 beams; some pings share their time with the ping before on another line
     * (two lines logged at once), some lines repeat. Returns the table; {@code pingCount[0]} gets the
     * number of pings (time-and-line groups) as built.
     */
    private static PingTable pings(int nPings, long seed, int[] pingCount) {
        SplittableRandom r = new SplittableRandom(seed);
        PingTable.Builder b = new PingTable.Builder();
        double t = 1778745600.0;
        for (int p = 0; p < nPings; p++) {
            if (p == 0 || r.nextInt(5) != 0) t += 0.2; // else: same time as the ping before, next line
            String line = "L" + (p % 3 == 0 ? 7 : p % 5);
            int beams = 1 + r.nextInt(40);
            for (int k = 0; k < beams; k++) {
                b.add(t, 50 + r.nextDouble() * 1e-3, -4 - r.nextDouble() * 1e-3, 0.02 + r.nextDouble() * 0.05, Double.NaN,
                        -65 + 130.0 * k / 40, Double.NaN, r.nextGaussian() * 0.3, Double.NaN, Double.NaN, line, k, -1);
            }
        }
        PingTable table = b.build();
        int groups = 0;
        for (int i = 0; i < table.size; i++) if (i == 0 || table.time[i] != table.time[i - 1] || table.line[i] != table.line[i - 1]) groups++;
        pingCount[0] = groups;
        return table;
    }

    private static byte[] bytes(PingTable t, int blockRows, int... chunkSizes) throws IOException {
        ByteArrayOutputStream os = new ByteArrayOutputStream();
        try (BinaryPingWriter.Stream s = BinaryPingWriter.open(os, t.size, t.lineNames(), BinaryPingWriter.presentColumns(t), blockRows)) {
            int at = 0, k = 0;
            while (at < t.size) {
                int m = Math.min(chunkSizes[k++ % chunkSizes.length], t.size - at);
                s.append(t.slice(at, at + m));
                at += m;
            }
        }
        return os.toByteArray();
    }

    private static void assertSameTable(PingTable a, PingTable b) {
        assertThat(a.size).isEqualTo(b.size);
        double[][] da = {a.time, a.lat, a.lon, a.twtt, a.depth, a.angle, a.heading, a.heave, a.roll, a.pitch};
        double[][] db = {b.time, b.lat, b.lon, b.twtt, b.depth, b.angle, b.heading, b.heave, b.roll, b.pitch};
        for (int k = 0; k < da.length; k++) {
            long[] x = new long[a.size], y = new long[a.size];
            for (int i = 0; i < a.size; i++) { x[i] = Double.doubleToRawLongBits(da[k][i]); y[i] = Double.doubleToRawLongBits(db[k][i]); }
            assertThat(x).as("column %d", k).isEqualTo(y); // bit for bit, NaN included
        }
        assertThat(a.line).isEqualTo(b.line);
        assertThat(a.beam).isEqualTo(b.beam);
        assertThat(a.quality).isEqualTo(b.quality);
        assertThat(a.lineNames()).isEqualTo(b.lineNames());
    }

    /** Reads all chunks, checking that none splits a ping and that each has at least the target rows but the last. */
    private static List<PingTable> allChunks(Path f, boolean sepNav, int target, int longestPing) throws IOException {
        List<PingTable> chunks = new ArrayList<>();
        try (PingChunks c = PingFiles.chunks(f, sepNav, target)) {
            for (PingTable t; (t = c.next()) != null; ) chunks.add(t);
            assertThat(c.next()).isNull();
        }
        for (int k = 0; k < chunks.size(); k++) {
            PingTable t = chunks.get(k);
            assertThat((long) t.size).isPositive().isLessThanOrEqualTo((long) Math.max(target, 1) + longestPing - 1);
            if (k < chunks.size() - 1) {
                assertThat(t.size).isGreaterThanOrEqualTo(target);
                PingTable u = chunks.get(k + 1);
                assertThat(u.time[0] != t.time[t.size - 1] || u.line[0] != t.line[t.size - 1])
                        .as("chunk %d ends inside a ping", k).isTrue();
            }
        }
        return chunks;
    }

    @Test
    void chunksConcatenatedAreTheWholeTable() throws IOException {
        int[] groups = new int[1];
        PingTable t = pings(600, 3, groups);
        assertThat(t.size).isGreaterThan(5000);
        Path f = dir.resolve("day.lpb");
        Files.write(f, bytes(t, 97, t.size)); // blocks of 97 rows: pings straddle block boundaries
        PingTable whole = BinaryPingReader.read(f);
        assertSameTable(whole, t);
        for (int target : new int[]{1, 5, 39, 97, 333, 1000, t.size - 1, t.size, Integer.MAX_VALUE}) {
            List<PingTable> chunks = allChunks(f, false, target, 40);
            assertSameTable(PingTable.concat(chunks), whole);
            // the header's line names, the same ids as read(): no renumbering per chunk
            for (PingTable c : chunks) assertThat(c.lineNames()).isEqualTo(whole.lineNames());
            if (target == 1) assertThat(chunks).hasSize(groups[0]); // one ping per chunk
            if (target >= t.size) assertThat(chunks).hasSize(1);
        }
        try (PingChunks c = BinaryPingReader.chunks(f, false, 10)) {
            assertThat(c.expectedRows()).isEqualTo(t.size);
        }
        // the writer's own block size (64 Ki rows), 2.5 blocks, chunks cut across blocks
        PingTable big = pings(9000, 4, groups);
        Path g = dir.resolve("big.lpb");
        BinaryPingWriter.write(big, g);
        assertSameTable(PingTable.concat(allChunks(g, false, 50_000, 40)), BinaryPingReader.read(g));
    }

    @Test
    void emptyFileGivesNoChunk() throws IOException {
        Path f = dir.resolve("empty.lpb");
        BinaryPingWriter.open(f, 0, List.of(), List.of("time", "twtt")).close();
        assertThat(BinaryPingReader.read(f, true).size).isZero();
        try (PingChunks c = BinaryPingReader.chunks(f, true, 100)) {
            assertThat(c.expectedRows()).isZero();
            assertThat(c.next()).isNull();
        }
    }

    @Test
    void separateNavigation() throws IOException {
        PingTable.Builder b = new PingTable.Builder();
        for (int i = 0; i < 300; i++) b.add(1.7e9 + i / 10 * 0.2, Double.NaN, Double.NaN, 0.05, Double.NaN, i % 10, 90, 0, 0, 0, "A", i % 10, -1);
        Path f = dir.resolve("nonav.lpb");
        BinaryPingWriter.write(b.build(), f);
        assertThatThrownBy(() -> BinaryPingReader.read(f, false)).isInstanceOf(InputException.class)
                .hasMessageContaining("expected a column 'lat' in the header");
        String expected = message(() -> BinaryPingReader.read(f, false));
        assertThat(message(() -> BinaryPingReader.chunks(f, false, 10))).isEqualTo(expected);
        List<PingTable> chunks = allChunks(f, true, 25, 10);
        assertThat(chunks).hasSize(10); // 30 pings of 10 beams, 25 rows -> 3 pings per chunk (worked by hand)
        PingTable all = PingTable.concat(chunks);
        assertSameTable(all, BinaryPingReader.read(f, true));
        assertThat(all.lat).containsOnly(Double.NaN);
    }

    /** The message of the InputException that reading throws (read(), or chunks until one fails). */
    private static String message(ThrowingRead r) {
        try {
            r.run();
        } catch (InputException e) {
            return e.line() + ":" + e.column() + ":" + e.getMessage();
        } catch (IOException e) {
            throw new AssertionError(e);
        }
        throw new AssertionError("no error");
    }

    interface ThrowingRead { void run() throws IOException; }

    private static String streamed(Path f, int target) {
        return message(() -> {
            try (PingChunks c = BinaryPingReader.chunks(f, false, target)) {
                while (c.next() != null) { /* read on */ }
            }
        });
    }

    /** Header length of a file written from {@code t} (docs/formats/binary-pings.md, Header). */
    private static int headerLength(PingTable t) {
        int n = 16;
        for (String c : BinaryPingWriter.presentColumns(t)) n += 2 + c.length();
        n += 4;
        for (String l : t.lineNames()) n += 2 + l.getBytes(StandardCharsets.UTF_8).length;
        return n + 8;
    }

    /**
     * Overwrites the value of (row, column) in a file of full blocks of {@code blockRows} rows and
     * recomputes that block's CRC-32: a consistent file with a bad value, built from the layout
     * in docs/formats/binary-pings.md.
     */
    private static void patch(byte[] file, int header, int blockRows, int row, int column, double dv, int iv) {
        int rowBytes = Arrays.stream(WIDTHS).sum();
        int blockNo = row / blockRows, r = row % blockRows;
        int start = header + blockNo * (4 + blockRows * rowBytes + 4);
        ByteBuffer b = ByteBuffer.wrap(file).order(ByteOrder.LITTLE_ENDIAN);
        int m = b.getInt(start);
        assertThat(m).isEqualTo(blockRows); // a full block
        int at = start + 4;
        for (int c = 0; c < column; c++) at += WIDTHS[c] * m;
        if (WIDTHS[column] == 8) b.putDouble(at + 8 * r, dv); else b.putInt(at + 4 * r, iv);
        CRC32 crc = new CRC32();
        crc.update(file, start, 4 + m * rowBytes);
        b.putInt(start + 4 + m * rowBytes, (int) crc.getValue());
    }

    @Test
    void lateErrorsAreReadsErrors() throws IOException {
        int[] groups = new int[1];
        PingTable t = pings(300, 5, groups);
        int blockRows = 64;
        byte[] good = bytes(t, blockRows, 1000);
        int header = headerLength(t);
        Path f = dir.resolve("bad.lpb");
        int lastFull = (t.size / blockRows - 1) * blockRows; // first row of the last full block

        // a damaged late block: one bit flipped, CRC-32 mismatch; chunks before it are delivered
        byte[] bad = good.clone();
        bad[header + (t.size / blockRows - 1) * (4 + blockRows * Arrays.stream(WIDTHS).sum() + 4) + 100] ^= 0x04;
        Files.write(f, bad);
        String expected = message(() -> BinaryPingReader.read(f));
        assertThat(expected).contains("block " + (t.size / blockRows - 1)).contains("CRC-32 mismatch");
        for (int target : new int[]{1, 50, 1000}) assertThat(streamed(f, target)).isEqualTo(expected);
        try (PingChunks c = BinaryPingReader.chunks(f, false, 50)) {
            assertThat(c.next().size).isBetween(50, 89); // read before the damage is reached
        }

        // truncated: the end record cut
        Files.write(f, Arrays.copyOf(good, good.length - 7));
        expected = message(() -> BinaryPingReader.read(f));
        assertThat(expected).contains("truncated");
        assertThat(streamed(f, 100)).isEqualTo(expected);

        // end record's row count changed (CRC then wrong too)
        bad = good.clone();
        bad[good.length - 12] ^= 0x01;
        Files.write(f, bad);
        expected = message(() -> BinaryPingReader.read(f));
        assertThat(expected).contains("end record damaged");
        assertThat(streamed(f, 100)).isEqualTo(expected);

        // values in a late block, consistent CRC: the row number is the file's, not the chunk's
        int row = lastFull + 10;
        bad = good.clone();
        patch(bad, header, blockRows, row, 0, t.time[row] - 3600, 0); // time goes back an hour
        Files.write(f, bad);
        expected = message(() -> BinaryPingReader.read(f));
        assertThat(expected).startsWith((row + 1) + ":1:").contains("expected times not to decrease");
        for (int target : new int[]{1, 7, 500}) assertThat(streamed(f, target)).isEqualTo(expected);

        bad = good.clone();
        patch(bad, header, blockRows, row, 1, 91.5, 0);
        Files.write(f, bad);
        expected = message(() -> BinaryPingReader.read(f));
        assertThat(expected).startsWith((row + 1) + ":2:").contains("expected a latitude in [-90, 90] degrees, found 91.5");
        assertThat(streamed(f, 33)).isEqualTo(expected);

        bad = good.clone();
        patch(bad, header, blockRows, row, 6, 0, t.lineNames().size()); // line index one past the names
        Files.write(f, bad);
        expected = message(() -> BinaryPingReader.read(f));
        assertThat(expected).startsWith((row + 1) + ":7:").contains("expected a line index in [-1, " + t.lineNames().size() + ")");
        assertThat(streamed(f, 33)).isEqualTo(expected);
    }

    @Test
    void streamWritesWritesBytes() throws IOException {
        int[] groups = new int[1];
        PingTable t = pings(500, 6, groups);
        ByteArrayOutputStream os = new ByteArrayOutputStream();
        BinaryPingWriter.write(t, os);
        byte[] whole = os.toByteArray();
        // however the rows come, the default block size gives write()'s bytes
        for (int[] sizes : new int[][]{{1}, {7}, {1000}, {3, 500, 1, 64}, {t.size}}) {
            assertThat(bytes(t, BinaryPingWriter.BLOCK_ROWS, sizes)).as("chunks %s", Arrays.toString(sizes)).isEqualTo(whole);
        }
        // blocks of 16 rows: the same bytes for every split, and read back exactly
        byte[] small = bytes(t, 16, t.size);
        for (int[] sizes : new int[][]{{1}, {15}, {16}, {17, 2}, {1000}}) assertThat(bytes(t, 16, sizes)).isEqualTo(small);
        Path f = dir.resolve("small.lpb");
        Files.write(f, small);
        assertSameTable(BinaryPingReader.read(f), t);

        // 2.5 blocks of the writer's size: the direct (whole-block) path and the staging path agree
        PingTable big = pings(8000, 7, groups);
        ByteArrayOutputStream bos = new ByteArrayOutputStream();
        BinaryPingWriter.write(big, bos);
        assertThat(bytes(big, BinaryPingWriter.BLOCK_ROWS, 10_007)).isEqualTo(bos.toByteArray());
        assertThat(bytes(big, BinaryPingWriter.BLOCK_ROWS, 1, 70_000)).isEqualTo(bos.toByteArray());

        // chunks with their own line numbering (as a CSV chunk reader gives) are translated by name
        ByteArrayOutputStream ros = new ByteArrayOutputStream();
        try (BinaryPingWriter.Stream s = BinaryPingWriter.open(ros, t.size, t.lineNames(), BinaryPingWriter.presentColumns(t))) {
            for (int at = 0; at < t.size; at += 100) s.append(PingTable.concat(List.of(t.slice(at, Math.min(t.size, at + 100)))));
        }
        assertThat(ros.toByteArray()).isEqualTo(whole);
    }

    @Test
    void streamRefusesWrongRowCountsAndUnstoredValues() throws IOException {
        int[] groups = new int[1];
        PingTable t = pings(20, 8, groups);
        ByteArrayOutputStream os = new ByteArrayOutputStream();
        BinaryPingWriter.Stream s = BinaryPingWriter.open(os, t.size + 1L, t.lineNames(), BinaryPingWriter.presentColumns(t));
        s.append(t);
        assertThatThrownBy(s::close).isInstanceOf(IllegalStateException.class).hasMessageContaining("the header says " + (t.size + 1));
        BinaryPingWriter.Stream s2 = BinaryPingWriter.open(new ByteArrayOutputStream(), t.size - 1L, t.lineNames(),
                BinaryPingWriter.presentColumns(t));
        assertThatThrownBy(() -> s2.append(t)).isInstanceOf(IllegalStateException.class).hasMessageContaining("exceed");
        BinaryPingWriter.Stream s3 = BinaryPingWriter.open(new ByteArrayOutputStream(), t.size, t.lineNames(), List.of("time", "twtt"));
        assertThatThrownBy(() -> s3.append(t)).isInstanceOf(IllegalArgumentException.class).hasMessageContaining("'lat' has values");
        assertThatThrownBy(() -> BinaryPingWriter.open(new ByteArrayOutputStream(), 1, List.of(), List.of("time", "speed")))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("unknown ping column 'speed'");
    }

    @Test
    void layoutWorkedByHand() throws IOException {
        // two rows, columns time and twtt, one line "A": every byte from docs/formats/binary-pings.md
        PingTable.Builder b = new PingTable.Builder();
        b.add(1.5, 0, 0, 0.25, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, "A", -1, -1);
        b.add(2.0, 0, 0, 0.5, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, Double.NaN, "A", -1, -1);
        ByteArrayOutputStream os = new ByteArrayOutputStream();
        try (BinaryPingWriter.Stream s = BinaryPingWriter.open(os, 2, List.of("A"), List.of("TWTT", "lon", "line", "lat"))) {
            s.append(b.build().slice(0, 1));
            s.append(b.build().slice(1, 2));
        }
        ByteBuffer f = ByteBuffer.wrap(os.toByteArray()).order(ByteOrder.LITTLE_ENDIAN);
        int headerLen = 4 + 2 + 8 + 2 + (2 + 4) + (2 + 3) + (2 + 3) + (2 + 4) + (2 + 4) + 4 + (2 + 1) + 4 + 4; // 59
        int blockLen = 4 + 2 * (8 * 4 + 4) + 4;                                    // 80
        assertThat(f.capacity()).isEqualTo(headerLen + blockLen + 16);
        byte[] magic = new byte[4];
        f.get(magic);
        assertThat(new String(magic, StandardCharsets.US_ASCII)).isEqualTo("LLPB");
        assertThat(f.getShort()).isEqualTo((short) 1);
        assertThat(f.getLong()).isEqualTo(2L);
        assertThat(f.getShort()).isEqualTo((short) 5); // time, lat, lon, twtt (float64) then line (int32)
        for (String c : new String[]{"time", "lat", "lon", "twtt", "line"}) {
            assertThat(f.get()).isEqualTo((byte) (c.equals("line") ? 2 : 1));
            byte[] name = new byte[f.get()];
            f.get(name);
            assertThat(new String(name, StandardCharsets.US_ASCII)).isEqualTo(c);
        }
        assertThat(f.getInt()).isEqualTo(1);
        assertThat(f.getShort()).isEqualTo((short) 1);
        assertThat(f.get()).isEqualTo((byte) 'A');
        assertThat(f.getInt()).isEqualTo(BinaryPingWriter.BLOCK_ROWS);
        CRC32 crc = new CRC32();
        crc.update(f.array(), 0, f.position());
        assertThat(f.getInt()).isEqualTo((int) crc.getValue());
        assertThat(f.position()).isEqualTo(headerLen);
        assertThat(f.getInt()).isEqualTo(2);
        assertThat(new double[]{f.getDouble(), f.getDouble()}).containsExactly(1.5, 2.0);
        assertThat(new double[]{f.getDouble(), f.getDouble(), f.getDouble(), f.getDouble()}).containsExactly(0, 0, 0, 0);
        assertThat(new double[]{f.getDouble(), f.getDouble()}).containsExactly(0.25, 0.5);
        assertThat(new int[]{f.getInt(), f.getInt()}).containsExactly(0, 0);
        crc.reset();
        crc.update(f.array(), headerLen, blockLen - 4);
        assertThat(f.getInt()).isEqualTo((int) crc.getValue());
        assertThat(f.getInt()).isZero();
        assertThat(f.getLong()).isEqualTo(2L);
        crc.reset();
        crc.update(f.array(), headerLen + blockLen, 12);
        assertThat(f.getInt()).isEqualTo((int) crc.getValue());
    }

    @Test
    void generatorStreamsTheCsvTablesBytes() throws IOException {
        // the generator's streamed pings.lpb holds what the ping CSV reader reads from its pings.csv,
        // as write() of that table stores it (what the generator wrote before it streamed)
        Path day = dir.resolve("day");
        SwathDayGenerator.write(day, 70_001, 32, 9, true, true);
        PingTable csv = PingCsvReader.read(day.resolve("pings.csv"));
        ByteArrayOutputStream os = new ByteArrayOutputStream();
        BinaryPingWriter.write(csv, os);
        assertThat(Files.readAllBytes(day.resolve("pings.lpb"))).isEqualTo(os.toByteArray());
    }
}
