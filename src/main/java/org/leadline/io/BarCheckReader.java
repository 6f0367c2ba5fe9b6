package org.leadline.io;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;

/**
 * Reads a bar check table: CSV with columns {@code bar_depth,reading} (metres, both below the
 * still water surface), optional {@code # set_speed: 1500} comment giving the sounder's set speed
 * in m/s. Format in docs/formats.md.
 */
public final class BarCheckReader {
    private BarCheckReader() {}

    /** A bar check table as read. */
    public record Table(double[] barDepth, double[] reading, double setSpeed) {}

    public static Table read(Path file) throws IOException {
        double setSpeed = Double.NaN;
        double[] bar = new double[16], rd = new double[16];
        int n = 0;
        CSVFormat fmt = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true)
                .setCommentMarker('#').setIgnoreSurroundingSpaces(true).setIgnoreHeaderCase(true)
                .setIgnoreEmptyLines(true).get();
        try (Reader r = Files.newBufferedReader(file, StandardCharsets.UTF_8)) {
            // set_speed lives in a comment; read it first
            for (String line : Files.readAllLines(file, StandardCharsets.UTF_8)) {
                String t = line.strip();
                if (t.startsWith("#") && t.substring(1).strip().toLowerCase().startsWith("set_speed:")) {
                    String v = t.substring(t.indexOf(':') + 1).strip();
                    try {
                        setSpeed = Double.parseDouble(v);
                    } catch (NumberFormatException e) {
                        throw new InputException(file, 0, 0, "set_speed comment: expected a speed in m/s, found '" + v + "'");
                    }
                }
            }
            try (CSVParser p = fmt.parse(r)) {
                var header = p.getHeaderMap();
                Integer cBar = CsvColumns.find(header, "bar_depth");
                Integer cRead = CsvColumns.find(header, "reading");
                if (cBar == null || cRead == null) {
                    throw new InputException(file, 1, 0, "expected columns bar_depth and reading, found "
                            + p.getHeaderNames());
                }
                for (CSVRecord rec : p) {
                    long line = rec.getParser().getCurrentLineNumber();
                    if (n == bar.length) { bar = Arrays.copyOf(bar, 2 * n); rd = Arrays.copyOf(rd, 2 * n); }
                    bar[n] = CsvColumns.number(file, line, rec, cBar, "bar_depth");
                    rd[n] = CsvColumns.number(file, line, rec, cRead, "reading");
                    n++;
                }
            } catch (java.io.UncheckedIOException | IllegalStateException e) {
                throw new InputException(file.toString(), 0, 0, "not a readable CSV table: " + e.getMessage(), e);
            }
        }
        if (n < 2) throw new InputException(file, "a bar check needs at least two rows, found " + n);
        return new Table(Arrays.copyOf(bar, n), Arrays.copyOf(rd, n), setSpeed);
    }
}
