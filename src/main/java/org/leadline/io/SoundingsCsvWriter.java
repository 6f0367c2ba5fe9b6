package org.leadline.io;

import org.leadline.survey.SoundingTable;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.OutputStreamWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * Writes {@code soundings.csv} (DESIGN.md section 4): every sounding, rejected ones included, as
 * {@code time,line,beam,lat,lon,easting,northing,depth,tvu,thu,status,reason}. Fixed decimals:
 * 8 for lat/lon (about 1 mm), 3 for projected coordinates and depths. Numbers are formatted by hand
 * (no String.format) because a swath day has tens of millions of rows.
 */
public final class SoundingsCsvWriter {
    public static final String HEADER = "time,line,beam,lat,lon,easting,northing,depth,tvu,thu,status,reason";

    private SoundingsCsvWriter() {}

    /** Writes the table to {@code out} (the caller decides about atomic placement). */
    public static void write(SoundingTable s, Path out) throws IOException {
        try (BufferedWriter w = new BufferedWriter(new OutputStreamWriter(Files.newOutputStream(out),
                StandardCharsets.UTF_8), 1 << 16)) {
            w.write(HEADER);
            w.write('\n');
            StringBuilder sb = new StringBuilder(160);
            for (int i = 0; i < s.size; i++) {
                sb.setLength(0);
                IsoTime.append(sb, s.time[i]);
                sb.append(',');
                appendField(sb, s.lineName(i));
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
                w.append(sb);
            }
        }
    }

    private static void appendField(StringBuilder sb, String v) {
        if (v.indexOf(',') >= 0 || v.indexOf('"') >= 0 || v.indexOf('\n') >= 0) {
            sb.append('"').append(v.replace("\"", "\"\"")).append('"');
        } else {
            sb.append(v);
        }
    }
}
