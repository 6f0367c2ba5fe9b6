package org.leadline.io;

import java.nio.file.Path;
import java.util.Arrays;
import java.util.Locale;

/**
 * Reads a bar check table: CSV with columns {@code bar_depth,reading} (metres, both below the
 * still water surface), optional {@code # set_speed: 1500} comment giving the sounder's set speed
 * in m/s. Format in docs/formats.md. The rules of every Leadline CSV apply (header names
 * case-insensitive, {@code #} comments, UTF-8 with or without a byte-order mark, LF or CRLF);
 * errors name file, line and column.
 */
public final class BarCheckReader {
    private BarCheckReader() {}

    /** Largest bar check file read, bytes (a bar check has tens of rows). */
    static final long MAX_BYTES = 16L << 20;

    /** A bar check table as read. */
    public record Table(double[] barDepth, double[] reading, double setSpeed) {}

    public static Table read(Path file) {
        String text = TextFiles.read(file, MAX_BYTES, "a bar check table");
        double setSpeed = Double.NaN;
        // set_speed lives in a comment; read it first
        int no = 0;
        for (String line : text.split("\r\n|\r|\n", -1)) {
            no++;
            String t = line.strip();
            if (t.startsWith("#") && t.substring(1).strip().toLowerCase(Locale.ROOT).startsWith("set_speed:")) {
                String v = t.substring(t.indexOf(':') + 1).strip();
                try {
                    setSpeed = Double.parseDouble(v);
                } catch (NumberFormatException e) {
                    setSpeed = Double.NaN;
                }
                if (!(setSpeed >= 1300 && setSpeed <= 1800)) {
                    throw new InputException(file, no, 0, "set_speed comment: expected a speed in m/s (1300..1800), found '"
                            + TextFiles.abbreviate(v) + "'");
                }
            }
        }
        double[] bar = new double[16], rd = new double[16];
        int n = 0;
        try (CsvInput in = CsvInput.open(file, text)) {
            int cBar = in.require("bar_depth"), cRead = in.require("reading");
            while (in.next()) {
                if (n == bar.length) { bar = Arrays.copyOf(bar, 2 * n); rd = Arrays.copyOf(rd, 2 * n); }
                bar[n] = in.number(cBar, "bar_depth");
                rd[n] = in.number(cRead, "reading");
                n++;
            }
        }
        if (n < 2) throw new InputException(file, "a bar check needs at least two rows, found " + n);
        return new Table(Arrays.copyOf(bar, n), Arrays.copyOf(rd, n), setSpeed);
    }
}
