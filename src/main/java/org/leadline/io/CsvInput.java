package org.leadline.io;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.Iterator;
import java.util.Locale;
import java.util.Map;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;

/**
 * Shared reading of Leadline's CSV files (DESIGN.md section 4) on top of Commons CSV: one header
 * row, names case-insensitive, extra columns ignored, {@code #} comment lines and blank lines
 * skipped. Every error is an {@link InputException} with the physical line of the file (1-based,
 * comments and blank lines counted) and the 1-based index of the field in its row as the column.
 */
final class CsvInput implements AutoCloseable {
    private static final CSVFormat FORMAT = CSVFormat.DEFAULT.builder()
            .setCommentMarker('#').setIgnoreEmptyLines(true).setIgnoreSurroundingSpaces(true)
            .setTrim(true).get();

    final Path file;
    private final CSVParser parser;
    private final Iterator<CSVRecord> records;
    private final Map<String, Integer> header = new HashMap<>();
    private final long headerLine;
    private int headerSize;
    private final String headerText;
    private CSVRecord record;
    private long line;
    private long lastLine;
    /** False when the file's last line has no line end (a file cut off while being written, or hand-made). */
    private final boolean endsWithLineEnd;

    private CsvInput(Path file, BufferedReader given, boolean endsWithLineEnd) {
        this.file = file;
        this.endsWithLineEnd = endsWithLineEnd;
        BufferedReader reader = given;
        if (reader == null) {
            TextFiles.sniff(file); // gzip, zip or binary data: one clear message instead of decoder noise
            try {
                reader = Files.newBufferedReader(file, StandardCharsets.UTF_8);
            } catch (NoSuchFileException e) {
                throw new InputException(file, "file not found");
            } catch (IOException e) {
                throw new InputException(file.toString(), 0, 0, "cannot open: " + e.getMessage(), e);
            }
        }
        try {
            parser = CSVParser.builder().setReader(reader).setFormat(FORMAT).get();
        } catch (IOException e) {
            throw new InputException(file.toString(), 0, 0, "cannot read: " + e.getMessage(), e);
        }
        records = parser.iterator();
        if (!next()) throw new InputException(file, "expected a header row, found an empty file");
        headerLine = line;
        headerSize = record.size();
        headerText = String.join(",", record.values());
        if (record.size() == 1) {
            char sep = TextFiles.otherSeparator(record.get(0));
            if (sep != 0) {
                throw new InputException(file, line, 0, "expected comma-separated columns, found a header separated by "
                        + TextFiles.separatorName(sep) + ": '" + TextFiles.abbreviate(record.get(0)) + "'");
            }
        }
        for (int c = 0; c < record.size(); c++) {
            String name = record.get(c).toLowerCase(Locale.ROOT);
            if (c == 0 && name.startsWith("\uFEFF")) name = name.substring(1).trim(); // byte-order mark of spreadsheet exports
            if (name.isEmpty()) continue;
            if (header.putIfAbsent(name, c) != null) {
                throw new InputException(file, line, c + 1, "column '" + TextFiles.abbreviate(name) + "' appears twice in the header");
            }
        }
    }

    static CsvInput open(Path file) { return new CsvInput(file, null, endsWithLineEnd(file)); }

    /** Reads CSV text; {@code file} names it in messages. */
    static CsvInput open(Path file, String text) {
        return new CsvInput(file, new BufferedReader(new java.io.StringReader(text)),
                text.isEmpty() || text.endsWith("\n") || text.endsWith("\r"));
    }

    /** Whether the file's last byte is a line end (an empty or unreadable file counts as ended). */
    private static boolean endsWithLineEnd(Path file) {
        try (var ch = Files.newByteChannel(file)) {
            long size = ch.size();
            if (size == 0) return true;
            java.nio.ByteBuffer b = java.nio.ByteBuffer.allocate(1);
            ch.position(size - 1);
            ch.read(b);
            return b.get(0) == '\n' || b.get(0) == '\r';
        } catch (IOException e) {
            return true;
        }
    }

    /** Index (0-based) of a column, -1 when the header does not have it. */
    int column(String name) {
        Integer c = header.get(name);
        return c == null ? -1 : c;
    }

    /** Index of a column that must be there. */
    int require(String name) {
        int c = column(name);
        if (c < 0) throw missingColumn("'" + name + "'");
        return c;
    }

    InputException missingColumn(String what) {
        for (var e : header.entrySet()) {
            if (TextFiles.feetOrFathoms(e.getKey())) {
                return new InputException(file, headerLine, e.getValue() + 1, "expected a column " + what
                        + " in metres, found '" + e.getKey() + "', a length in feet or fathoms: convert it to metres");
            }
        }
        return new InputException(file, headerLine, 0, "expected a column " + what + " in the header, found: "
                + TextFiles.abbreviate(headerText));
    }

    /** Advances to the next data row; false at the end of the file. */
    boolean next() {
        long n;
        boolean last;
        try {
            if (!records.hasNext()) return false;
            record = records.next();
            n = parser.getCurrentLineNumber();
            last = !endsWithLineEnd && !records.hasNext();
        } catch (UncheckedIOException | IllegalStateException e) {
            throw malformed(e);
        }
        // Commons CSV counts line ends consumed; a last line without its line end is one short.
        line = n <= lastLine ? lastLine + 1 : n;
        lastLine = line;
        if (last && !header.isEmpty() && record.size() < headerSize) {
            throw new InputException(file, line, record.size() + 1, "expected " + headerSize + " fields in the last row, found "
                    + record.size() + " and no line end: the file looks cut off");
        }
        return true;
    }

    private InputException malformed(RuntimeException e) {
        Throwable c = e.getCause();
        if (c instanceof java.nio.charset.CharacterCodingException) return TextFiles.notUtf8(file, e);
        String m = c != null && c.getMessage() != null ? c.getMessage() : String.valueOf(e.getMessage());
        if (m.contains("EOF reached before encapsulated token finished")) {
            return new InputException(file.toString(), lastLine + 1, 0,
                    "expected a closing '\"' for the quoted field that starts on this line, found the end of the file", e);
        }
        if (m.contains("invalid char between encapsulated token and delimiter")) {
            return new InputException(file.toString(), lastLine + 1, 0,
                    "expected a comma after a closing '\"', found another character", e);
        }
        return new InputException(file.toString(), lastLine + 1, 0, "malformed CSV: " + TextFiles.abbreviate(m), e);
    }

    /** Physical line of the current row (1-based). */
    long line() { return line; }

    /** Raw trimmed text of a field ("" when the row is short or the column absent). */
    String text(int col) {
        return col < 0 || col >= record.size() ? "" : record.get(col);
    }

    /** A field's text as quoted back in a message (abbreviated). */
    String quoted(int col) { return TextFiles.abbreviate(text(col)); }

    InputException error(int col, String problem) {
        return new InputException(file, line, col < 0 ? 0 : col + 1, problem);
    }

    /** A required finite number. */
    double number(int col, String name) {
        String s = text(col);
        if (s.isEmpty()) throw error(col, "expected a number for '" + name + "', found an empty field");
        return parse(col, name, s);
    }

    /** An optional finite number: NaN when the column is absent or the field empty. */
    double optional(int col, String name) {
        if (col < 0) return Double.NaN;
        String s = text(col);
        return s.isEmpty() ? Double.NaN : parse(col, name, s);
    }

    private double parse(int col, String name, String s) {
        double v;
        try {
            v = Double.parseDouble(s);
        } catch (NumberFormatException e) {
            String l = s.toLowerCase(Locale.ROOT).replaceFirst("^[+-]", "");
            String what = l.equals("nan") || l.startsWith("inf") ? "a finite number" : "a number";
            throw error(col, "expected " + what + " for '" + name + "', found '" + TextFiles.abbreviate(s) + "'");
        }
        if (!Double.isFinite(v)) throw error(col, "expected a finite number for '" + name + "', found '" + TextFiles.abbreviate(s) + "'");
        return v;
    }

    /** An optional integer: {@code absent} when the column is absent or the field empty. */
    int optionalInt(int col, String name, int absent) {
        if (col < 0) return absent;
        String s = text(col);
        if (s.isEmpty()) return absent;
        try {
            return Integer.parseInt(s);
        } catch (NumberFormatException e) {
            throw error(col, "expected a whole number for '" + name + "', found '" + TextFiles.abbreviate(s) + "'");
        }
    }

    /** A required ISO-8601 time, s since the epoch. */
    double time(int col) {
        String s = text(col);
        if (s.isEmpty()) throw error(col, "expected an ISO-8601 UTC time, found an empty field");
        try {
            return IsoTime.parse(s);
        } catch (IllegalArgumentException e) {
            throw error(col, e.getMessage());
        }
    }

    double latitude(int col) {
        double v = number(col, "lat");
        if (v < -90 || v > 90) throw error(col, "expected a latitude in [-90, 90] degrees, found " + quoted(col));
        return v;
    }

    double longitude(int col) {
        double v = number(col, "lon");
        if (v < -180 || v > 180) throw error(col, "expected a longitude in [-180, 180] degrees, found " + quoted(col));
        return v;
    }

    /** Checks that a series time increases strictly from the previous row. */
    void strictlyAfter(int col, double t, double previous) {
        if (!(t > previous)) {
            throw error(col, "expected times to increase strictly, found " + quoted(col) + " after "
                    + IsoTime.format(previous));
        }
    }

    @Override
    public void close() {
        try {
            parser.close();
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
