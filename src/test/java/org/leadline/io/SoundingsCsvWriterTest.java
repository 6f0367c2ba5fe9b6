package org.leadline.io;

import static org.assertj.core.api.Assertions.assertThat;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.leadline.survey.SoundingTable;

/** The parallel byte formatter of soundings.csv against the row format of the original sequential writer. */
class SoundingsCsvWriterTest {
    @TempDir Path dir;

    /** The original writer's row, built with IsoTime.append and Fixed.append (the format's definition). */
    private static String reference(SoundingTable s) {
        StringBuilder sb = new StringBuilder(SoundingsCsvWriter.HEADER).append('\n');
        for (int i = 0; i < s.size; i++) {
            IsoTime.append(sb, s.time[i]).append(',');
            String v = s.lineName(i);
            if (v.indexOf(',') >= 0 || v.indexOf('"') >= 0 || v.indexOf('\n') >= 0) sb.append('"').append(v.replace("\"", "\"\"")).append('"');
            else sb.append(v);
            sb.append(',');
            if (s.beam[i] >= 0) sb.append(s.beam[i]);
            sb.append(',');
            Fixed.append(sb, s.lat[i], 8).append(',');
            Fixed.append(sb, s.lon[i], 8).append(',');
            Fixed.append(sb, s.easting[i], 3).append(',');
            Fixed.append(sb, s.northing[i], 3).append(',');
            Fixed.append(sb, s.depth[i], 3).append(',');
            Fixed.append(sb, s.tvu[i], 3).append(',');
            Fixed.append(sb, s.thu[i], 3).append(',');
            sb.append(SoundingTable.Status.of(s.status[i]).label).append(',');
            sb.append(SoundingTable.Reason.of(s.reason[i]).label).append('\n');
        }
        return sb.toString();
    }

    @Test
    void sameBytesAsTheSequentialFormat() throws IOException {
        int n = SoundingsCsvWriter.BLOCK_ROWS * 2 + 1234; // several blocks, a short last one
        SoundingTable s = new SoundingTable(n, List.of("L1", "a, \"b\"", "Line 3"));
        SplittableRandom r = new SplittableRandom(2);
        double[] awkward = {Double.NaN, -0.0004, -0.0005, 0.0005, 2.5e-9, -12.3456, 1e9, -2e9, 899_999_999.9996, 0};
        double t = 1778745600.0;
        for (int i = 0; i < n; i++) {
            t += r.nextInt(4) == 0 ? r.nextDouble() * 0.9 : 0; // shared ping times, milliseconds rounding across seconds
            s.time[i] = r.nextInt(500) == 0 ? Double.NaN : t;
            s.line[i] = r.nextInt(4) - 1;
            s.beam[i] = r.nextInt(300) - 1;
            s.lat[i] = r.nextInt(50) == 0 ? awkward[r.nextInt(awkward.length)] : 50 + r.nextDouble();
            s.lon[i] = -4 - r.nextDouble();
            s.easting[i] = 400_000 + r.nextDouble() * 1000;
            s.northing[i] = 5_570_000 + r.nextDouble() * 1000;
            s.depth[i] = r.nextInt(20) == 0 ? awkward[r.nextInt(awkward.length)] : r.nextDouble() * 60 - 2;
            s.tvu[i] = r.nextDouble();
            s.thu[i] = r.nextInt(30) == 0 ? Double.NaN : r.nextDouble() * 2;
            if (r.nextInt(10) == 0) s.reject(i, SoundingTable.Reason.values()[1 + r.nextInt(SoundingTable.Reason.values().length - 1)]);
        }
        Path f = dir.resolve("soundings.csv");
        SoundingsCsvWriter.write(s, f);
        assertThat(Files.readString(f)).isEqualTo(reference(s));
    }

    @Test
    void handWorkedRow() throws IOException {
        SoundingTable s = new SoundingTable(1, List.of("L1"));
        s.time[0] = 1778745600.0 + 2.2506; // 2026-05-14T08:00:00Z (20587 days, worked by hand in CsvReadersTest) + 2.2506 s
        s.line[0] = 0;
        s.beam[0] = 17;
        s.lat[0] = 50.1234567851;
        s.lon[0] = -4.5;
        s.easting[0] = 412345.67851;
        s.northing[0] = 5553210.0004;
        s.depth[0] = -0.0004;  // rounds to zero: written without a sign
        s.tvu[0] = 0.25;
        s.thu[0] = Double.NaN; // empty field
        Path f = dir.resolve("one.csv");
        SoundingsCsvWriter.write(s, f);
        // worked by hand: 2.2506 s rounds to 2.251 s; 8 and 3 decimals, half away from zero
        assertThat(Files.readAllLines(f).get(1))
                .isEqualTo("2026-05-14T08:00:02.251Z,L1,17,50.12345679,-4.50000000,412345.679,5553210.000,0.000,0.250,,accepted,");
    }
}
