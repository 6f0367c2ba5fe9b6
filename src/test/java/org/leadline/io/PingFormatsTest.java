package org.leadline.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.io.RandomAccessFile;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.leadline.survey.PingTable;

/**
 * The parallel fast path of the ping CSV reader against the general (Commons CSV) path, and the
 * binary ping format: round trip, corruption and truncation detection, value checks.
 */
class PingFormatsTest {
    @TempDir Path dir;

    /** The general path alone (what PingCsvReader did before the fast path). */
    private static PingTable general(Path f, boolean sepNav) {
        PingTable.Builder b = new PingTable.Builder();
        PingCsvReader.readInto(f, sepNav, b);
        return b.build();
    }

    private static void assertSameTable(PingTable a, PingTable b) {
        assertThat(a.size).isEqualTo(b.size);
        double[][] da = {a.time, a.lat, a.lon, a.twtt, a.depth, a.angle, a.heading, a.heave, a.roll, a.pitch};
        double[][] db = {b.time, b.lat, b.lon, b.twtt, b.depth, b.angle, b.heading, b.heave, b.roll, b.pitch};
        for (int k = 0; k < da.length; k++) {
            for (int i = 0; i < a.size; i++) {
                // bit-for-bit, NaN included
                assertThat(Double.doubleToRawLongBits(da[k][i])).as("column %d row %d: %s vs %s", k, i, da[k][i], db[k][i])
                        .isEqualTo(Double.doubleToRawLongBits(db[k][i]));
            }
        }
        assertThat(a.line).isEqualTo(b.line);
        assertThat(a.beam).isEqualTo(b.beam);
        assertThat(a.quality).isEqualTo(b.quality);
        assertThat(a.lineNames()).isEqualTo(b.lineNames());
    }

    /** A messy but valid ping file: comments, blank lines, CRLF, spaces, exponents, signs, empty optional fields. */
    private Path messy(int rows, long seed) throws IOException {
        SplittableRandom r = new SplittableRandom(seed);
        StringBuilder sb = new StringBuilder("# a comment before the header\n\nTime, LAT,lon,twtt,depth,angle,heading,heave,roll,pitch,line,beam,quality,extra\n");
        double t = 1778745600.0;
        for (int i = 0; i < rows; i++) {
            if (r.nextInt(50) == 0) sb.append("# comment ").append(i).append('\n');
            if (r.nextInt(80) == 0) sb.append(r.nextBoolean() ? "\n" : "\r\n");
            if (r.nextInt(4) == 0) t += r.nextInt(3) * 0.001 + 0.123456789 * r.nextInt(2);
            sb.append(IsoTime.format(t).replace(".000Z", r.nextBoolean() ? "Z" : ".000Z")).append(',');
            sb.append(String.format(Locale.ROOT, " %.8f ,", 50 + r.nextDouble()));
            sb.append(r.nextInt(10) == 0 ? String.format(Locale.ROOT, "%.6e", -4 - r.nextDouble()) : String.format(Locale.ROOT, "%.9f", -4 - r.nextDouble())).append(',');
            boolean noTwtt = r.nextInt(7) == 0; // then a depth
            sb.append(noTwtt ? "" : String.format(Locale.ROOT, "%.6f", r.nextDouble() * 0.2)).append(',');
            sb.append(noTwtt || r.nextInt(7) == 0 ? String.format(Locale.ROOT, "+%.2f", r.nextDouble() * 80) : "").append(',');
            sb.append(String.format(Locale.ROOT, "%.3f", r.nextDouble() * 130 - 65)).append(',');
            sb.append(r.nextInt(5) == 0 ? "" : String.format(Locale.ROOT, "%.2f", r.nextDouble() * 360)).append(',');
            sb.append(String.format(Locale.ROOT, "%.17g", r.nextGaussian() * 0.3)).append(',');
            sb.append(r.nextInt(9) == 0 ? "-0.0" : "00" + r.nextInt(5) + "." + r.nextInt(1000)).append(',');
            sb.append(r.nextInt(3) == 0 ? ".5" : "1.").append(',');
            sb.append(r.nextInt(6) == 0 ? "" : "L" + (i / 37)).append(',');
            sb.append(r.nextInt(256)).append(',');
            sb.append(r.nextInt(4) == 0 ? "" : "+" + r.nextInt(100));
            if (r.nextBoolean()) sb.append(",x");
            sb.append(r.nextInt(3) == 0 ? "\r\n" : "\n");
        }
        Path f = dir.resolve("messy-" + seed + ".csv");
        Files.writeString(f, sb.toString());
        return f;
    }

    @Test
    void parallelRangesGiveTheGeneralReadersTable() throws IOException {
        for (long seed = 1; seed <= 3; seed++) {
            Path f = messy(3000, seed);
            PingTable reference = general(f, false);
            assertThat(reference.size).isEqualTo(3000);
            for (int rangeBytes : new int[]{1, 97, 4096, 1 << 20}) {
                PingTable fast = ParallelPingCsv.read(f, false, rangeBytes);
                assertThat(fast).as("fast path taken for seed %d, ranges of %d bytes", seed, rangeBytes).isNotNull();
                assertSameTable(fast, reference);
            }
            // mapped windows smaller than the file (ranges are cut inside a window)
            PingTable windows = ParallelPingCsv.read(f, false, 97, 1000);
            assertThat(windows).isNotNull();
            assertSameTable(windows, reference);
        }
    }

    @Test
    void decimalsConvertLikeParseDouble() throws IOException {
        // Double.parseDouble is correctly rounded (JLS / Double.valueOf javadoc): the reference for every digit string
        SplittableRandom r = new SplittableRandom(7);
        // heave: the one number column without a plausible range (twtt beyond 16 s would be refused)
        StringBuilder sb = new StringBuilder("time,lat,lon,twtt,heave\n");
        String[] texts = new String[20000];
        for (int i = 0; i < texts.length; i++) {
            long m = r.nextLong(1L << 54);
            int frac = r.nextInt(19);
            String digits = Long.toString(m);
            while (digits.length() <= frac) digits = "0" + digits;
            texts[i] = digits.substring(0, digits.length() - frac) + "." + digits.substring(digits.length() - frac);
            sb.append("2026-05-14T08:00:00Z,0,0,0.1,").append(texts[i]).append('\n');
        }
        Path f = dir.resolve("digits.csv");
        Files.writeString(f, sb.toString());
        PingTable t = ParallelPingCsv.read(f, false, 1 << 16);
        assertThat(t).isNotNull();
        for (int i = 0; i < texts.length; i++) assertThat(t.heave[i]).as(texts[i]).isEqualTo(Double.parseDouble(texts[i]));
        // worked by hand: 0.1 is not a double; both paths give the double nearest to it
        assertThat(t.heave.length).isEqualTo(20000);
    }

    @Test
    void unusualFilesAndErrorsGoThroughTheGeneralPath() throws IOException {
        Path quoted = dir.resolve("quoted.csv");
        Files.writeString(quoted, "time,lat,lon,twtt,line\n2026-05-14T08:00:00Z,50,-4,0.1,\"a, b\"\n");
        assertThat(ParallelPingCsv.read(quoted, false, 97)).isNull();
        assertThat(PingCsvReader.read(quoted).lineName(0)).isEqualTo("a, b");

        Path bad = dir.resolve("bad.csv");
        Files.writeString(bad, "time,lat,lon,twtt\n2026-05-14T08:00:00Z,50,-4,0.1\n# c\n2026-05-14T08:00:01Z,50,-4,0.1x\n");
        assertThat(ParallelPingCsv.read(bad, false, 1)).isNull();
        assertThatThrownBy(() -> PingCsvReader.read(bad)).isInstanceOfSatisfying(InputException.class, e -> {
            assertThat(e.line()).isEqualTo(4);
            assertThat(e.column()).isEqualTo(4);
            assertThat(e.getMessage()).contains("expected a number for 'twtt', found '0.1x'");
        });

        // times decreasing across a range boundary are found too
        Path back = dir.resolve("back.csv");
        Files.writeString(back, "time,lat,lon,twtt\n2026-05-14T08:00:01Z,50,-4,0.1\n2026-05-14T08:00:00Z,50,-4,0.1\n");
        assertThat(ParallelPingCsv.read(back, false, 1)).isNull();
        assertThatThrownBy(() -> PingCsvReader.read(back)).isInstanceOfSatisfying(InputException.class,
                e -> assertThat(e.line()).isEqualTo(3));
    }

    @Test
    void utf8AndCutOffRowsAsTheGeneralPathSeesThem() throws IOException {
        // a UTF-8 line name stays on the fast path and gives the general path's name
        Path utf8 = dir.resolve("utf8.csv");
        Files.write(utf8, "# Vermessung S\u00fcd\ntime,lat,lon,twtt,line\n2026-05-14T08:00:00Z,50,-4,0.1,S\u00fcd 1\n"
                .getBytes(java.nio.charset.StandardCharsets.UTF_8));
        PingTable t = ParallelPingCsv.read(utf8, false, 1);
        assertThat(t).isNotNull();
        assertThat(t.lineName(0)).isEqualTo("S\u00fcd 1");
        assertSameTable(t, general(utf8, false));
        // a Latin-1 byte, even in a column Leadline ignores: the general path refuses the file at that byte
        Path latin1 = dir.resolve("latin1.csv");
        Files.write(latin1, "time,lat,lon,twtt,note\n2026-05-14T08:00:00Z,50,-4,0.1,S\u00fcd\n"
                .getBytes(java.nio.charset.StandardCharsets.ISO_8859_1));
        assertThat(ParallelPingCsv.read(latin1, false, 1)).isNull();
        assertThatThrownBy(() -> PingCsvReader.read(latin1)).isInstanceOf(InputException.class).hasMessageContaining("not UTF-8");
        // a last row cut short without its line end: optional fields missing, still refused as cut off
        Path cut = dir.resolve("cut.csv");
        Files.writeString(cut, "time,lat,lon,twtt,heave,line\n2026-05-14T08:00:00Z,50,-4,0.1,0.2,L1\n2026-05-14T08:00:01Z,50,-4,0.1");
        assertThat(ParallelPingCsv.read(cut, false, 1)).isNull();
        assertThatThrownBy(() -> PingCsvReader.read(cut)).isInstanceOf(InputException.class).hasMessageContaining("cut off");
    }

    private PingTable sample() throws IOException {
        return general(messy(1000, 11), false);
    }

    @Test
    void binaryRoundTripIsExact() throws IOException {
        PingTable t = sample();
        Path f = dir.resolve("day.lpb");
        BinaryPingWriter.write(t, f);
        assertSameTable(BinaryPingReader.read(f), t);
        assertSameTable(PingFiles.read(f, false), t);
        // several blocks: 2.5 blocks of rows
        PingTable.Builder b = new PingTable.Builder();
        int n = BinaryPingWriter.BLOCK_ROWS * 5 / 2;
        for (int i = 0; i < n; i++) {
            b.add(1.7e9 + i * 0.01, 50 + i * 1e-7, -4, 0.05 + (i % 256) * 1e-4, Double.NaN, (i % 256) * 0.5 - 64, 90,
                    Double.NaN, 0.1, -0.2, "L" + (i / 100_000), i % 256, -1);
        }
        PingTable big = b.build();
        Path g = dir.resolve("big.LPB");
        BinaryPingWriter.write(big, g);
        PingTable back = PingFiles.read(g, false);
        assertSameTable(back, big);
        // absent columns are not stored: 8-byte time, lat, lon, twtt, angle, heading, roll, pitch + int line, beam
        long expected = (8 * 8 + 2 * 4) * (long) n;
        assertThat(Files.size(g)).isBetween(expected, expected + 200 + 3 * 8L * 3);
    }

    @Test
    void damagedOrTruncatedBinaryFilesAreRefused() throws IOException {
        PingTable t = sample();
        Path f = dir.resolve("day.lpb");
        BinaryPingWriter.write(t, f);
        byte[] good = Files.readAllBytes(f);

        byte[] flipped = good.clone();
        flipped[good.length / 2] ^= 0x10; // one bit in the data block
        Path g = dir.resolve("flipped.lpb");
        Files.write(g, flipped);
        assertThatThrownBy(() -> BinaryPingReader.read(g)).isInstanceOf(InputException.class)
                .hasMessageContaining("block 0").hasMessageContaining("CRC-32 mismatch");

        byte[] header = good.clone();
        header[20] ^= 0x01; // inside the column list
        Files.write(g, header);
        assertThatThrownBy(() -> BinaryPingReader.read(g)).isInstanceOf(InputException.class);

        Files.write(g, java.util.Arrays.copyOf(good, good.length - 7));
        assertThatThrownBy(() -> BinaryPingReader.read(g)).isInstanceOf(InputException.class)
                .hasMessageContaining("truncated");

        Files.writeString(g, "time,lat,lon,twtt\n");
        assertThatThrownBy(() -> BinaryPingReader.read(g)).isInstanceOf(InputException.class)
                .hasMessageContaining("expected the binary ping magic 'LLPB'");

        // a block whose bytes were all replaced consistently (CRC recomputed) still has its values checked
        PingTable.Builder b = new PingTable.Builder();
        b.add(1.7e9, 50, -4, 0.1, Double.NaN, 0, 0, 0, 0, 0, "L", 0, -1);
        b.add(1.7e9 + 1, 91, -4, 0.1, Double.NaN, 0, 0, 0, 0, 0, "L", 1, -1);
        Path h = dir.resolve("lat.lpb");
        BinaryPingWriter.write(b.build(), h);
        assertThatThrownBy(() -> BinaryPingReader.read(h)).isInstanceOfSatisfying(InputException.class, e -> {
            assertThat(e.line()).isEqualTo(2);
            assertThat(e.column()).isEqualTo(2); // time, lat, ...
            assertThat(e.getMessage()).contains("expected a latitude in [-90, 90] degrees, found 91.0");
        });
    }

    @Test
    void bitFlipsAnywhereAreDetected() throws IOException {
        PingTable t = sample();
        Path f = dir.resolve("day.lpb");
        BinaryPingWriter.write(t, f);
        byte[] good = Files.readAllBytes(f);
        SplittableRandom r = new SplittableRandom(3);
        Path g = dir.resolve("g.lpb");
        for (int k = 0; k < 200; k++) {
            int at = r.nextInt(good.length);
            try (RandomAccessFile raf = new RandomAccessFile(g.toFile(), "rw")) {
                raf.setLength(0);
                byte[] bad = good.clone();
                bad[at] ^= (byte) (1 << r.nextInt(8));
                raf.write(bad);
            }
            // CRC-32 detects every single-bit error (ISO 3309 polynomial)
            assertThatThrownBy(() -> BinaryPingReader.read(g)).as("bit flip at byte %d", at).isInstanceOf(InputException.class);
        }
    }
}
