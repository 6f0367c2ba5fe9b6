package org.leadline.io;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.leadline.watercolumn.Cast;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.StringReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.LocalDateTime;
import java.time.OffsetDateTime;
import java.time.ZoneOffset;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

/**
 * Reads Leadline's cast CSV (DESIGN.md section 4, docs/formats/cast.md): a header row with
 * case-insensitive names, extra columns ignored, {@code #} comment lines, and metadata comments
 * {@code # time: ISO-8601}, {@code # lat: deg}, {@code # lon: deg}, {@code # name: text},
 * {@code # temperature_scale: ITS-90|ITS-68} (default ITS-90).
 *
 * <p>Columns: {@code depth} (m) or {@code pressure} (dbar); {@code temperature} (deg C) with
 * {@code salinity} (PSS-78) or {@code conductivity} (mS/cm); or {@code sound_speed} (m/s) measured
 * directly. An empty cell is a missing value (NaN). Problems throw {@link InputException} with the
 * file, 1-based line and column.
 */
public final class CastReader {
    private CastReader() {}

    /** Largest cast file read, bytes: a day of 24 Hz CTD samples is well below it. */
    static final long MAX_BYTES = 256L << 20;

    /**
     * Highest practical salinity read as salinity (PSS-78): open-ocean water is 32..38 and the
     * saltiest seas about 41 (common practice). Seawater conductivity in mS/cm is 30..60, so a
     * salinity column mostly above this limit holds conductivity: refused (see docs/reliability.md).
     */
    static final double MAX_SALINITY = 42;

    private static final String[] COLUMNS = {"depth", "pressure", "temperature", "salinity", "conductivity", "sound_speed"};

    /** Reads a cast file. */
    public static Cast read(Path file) {
        return read(file, TextFiles.read(file, MAX_BYTES, "a cast file"));
    }

    /** Reads cast text; {@code file} names it in messages and as the cast's source. */
    public static Cast read(Path file, String text) {
        if (!text.isEmpty() && text.charAt(0) == '\uFEFF') text = text.substring(1);
        // metadata comments: scanned line by line so each problem gets its line number
        Map<String, String> meta = new LinkedHashMap<>();
        Map<String, Integer> metaLine = new LinkedHashMap<>();
        int headerLine = 0;
        try (BufferedReader br = new BufferedReader(new StringReader(text))) {
            String line;
            int no = 0;
            while ((line = br.readLine()) != null) {
                no++;
                String tr = line.trim();
                if (tr.startsWith("#")) {
                    String body = tr.substring(1).trim();
                    int colon = body.indexOf(':');
                    if (colon > 0) {
                        String key = body.substring(0, colon).trim().toLowerCase(Locale.ROOT);
                        if (key.matches("[a-z_ ]+")) {
                            meta.put(key.replace(' ', '_'), body.substring(colon + 1).trim());
                            metaLine.put(key.replace(' ', '_'), no);
                        }
                    }
                } else if (headerLine == 0 && !tr.isEmpty()) {
                    headerLine = no;
                }
            }
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
        if (headerLine == 0) throw new InputException(file, "empty cast file: expected a header row such as depth,temperature,salinity");

        String name = meta.getOrDefault("name", stem(file));
        double time = Double.NaN;
        if (meta.containsKey("time")) time = parseTime(file, metaLine.get("time"), meta.get("time"));
        double lat = metaNumber(file, meta, metaLine, "lat", -90, 90);
        double lon = metaNumber(file, meta, metaLine, "lon", -180, 360);
        Cast.TemperatureScale scale = Cast.TemperatureScale.ITS_90;
        if (meta.containsKey("temperature_scale")) {
            try {
                scale = Cast.TemperatureScale.parse(meta.get("temperature_scale"));
            } catch (IllegalArgumentException e) {
                throw new InputException(file, metaLine.get("temperature_scale"), 0, "temperature_scale: " + e.getMessage());
            }
        }

        CSVFormat fmt = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).setIgnoreHeaderCase(true)
                .setCommentMarker('#').setIgnoreEmptyLines(true).setTrim(true).setIgnoreSurroundingSpaces(true)
                .setAllowMissingColumnNames(true).setAllowDuplicateHeaderNames(true).get();
        try (CSVParser parser = CSVParser.builder().setReader(new StringReader(text)).setFormat(fmt).get()) {
            Map<String, Integer> header = new LinkedHashMap<>();
            List<String> names = parser.getHeaderNames();
            for (int i = 0; i < names.size(); i++) {
                String key = names.get(i).trim().toLowerCase(Locale.ROOT);
                header.putIfAbsent(key, i);
            }
            int iz = col(header, "depth"), ip = col(header, "pressure"), it = col(header, "temperature"),
                    is = col(header, "salinity"), ic = col(header, "conductivity"), iv = col(header, "sound_speed");
            String found = "found columns: " + TextFiles.abbreviate(String.join(", ", names));
            if (names.size() == 1 && TextFiles.otherSeparator(names.get(0)) != 0) {
                throw new InputException(file, headerLine, 0, "expected comma-separated columns, found a header separated by "
                        + TextFiles.separatorName(TextFiles.otherSeparator(names.get(0))) + ": '"
                        + TextFiles.abbreviate(names.get(0)) + "'");
            }
            for (int i = 0; i < names.size(); i++) {
                String nm = names.get(i).trim();
                if (iz < 0 && TextFiles.feetOrFathoms(nm)) {
                    throw new InputException(file, headerLine, i + 1, "expected a column depth in metres, found '" + nm
                            + "', a length in feet or fathoms: convert it to metres");
                }
            }
            if (iz < 0 && ip < 0) {
                throw new InputException(file, headerLine, 0,
                        "no depth or pressure column: expected a column named depth (m) or pressure (dbar); " + found);
            }
            if (iv < 0 && is < 0 && ic < 0) {
                throw new InputException(file, headerLine, 0,
                        "neither salinity, conductivity nor sound_speed column: expected temperature with salinity or "
                                + "conductivity (mS/cm), or sound_speed (m/s); " + found);
            }
            if (iv < 0 && it < 0) {
                throw new InputException(file, headerLine, 0,
                        "no temperature column: salinity or conductivity needs temperature (deg C) to give sound speed; " + found);
            }
            List<double[]> rows = new ArrayList<>();
            int[] idx = {iz, ip, it, is, ic, iv};
            LineCounter lines = new LineCounter(text);
            long firstSaltyLine = 0;
            int salty = 0, salts = 0;
            boolean endsWithLineEnd = text.endsWith("\n") || text.endsWith("\r");
            for (CSVRecord r : parser) {
                long line = lines.lineAt(r.getCharacterPosition());
                if (!endsWithLineEnd && !parser.iterator().hasNext() && r.size() < names.size()) {
                    throw new InputException(file, line, r.size() + 1, "expected " + names.size() + " fields in the last row, found "
                            + r.size() + " and no line end: the file looks cut off");
                }
                double[] row = new double[6];
                for (int k = 0; k < 6; k++) {
                    row[k] = idx[k] < 0 ? Double.NaN : number(file, line, r, idx[k], COLUMNS[k]);
                }
                rows.add(row);
                if (Double.isFinite(row[3])) {
                    salts++;
                    if (row[3] > MAX_SALINITY) {
                        if (salty++ == 0) firstSaltyLine = line;
                    }
                }
            }
            if (salty > 0 && 2 * salty >= salts) {
                throw new InputException(file, firstSaltyLine, is + 1, "expected practical salinity (PSS-78, at most "
                        + (int) MAX_SALINITY + "), found " + salty + " of " + salts + " values above it: conductivity in mS/cm?"
                        + " Name that column 'conductivity'");
            }
            if (rows.isEmpty()) throw new InputException(file, headerLine, 0, "cast has a header but no samples");
            int n = rows.size();
            double[][] c = new double[6][n];
            for (int i = 0; i < n; i++) for (int k = 0; k < 6; k++) c[k][i] = rows.get(i)[k];
            return new Cast(name, time, lat, lon, scale, file == null ? null : file.toString(),
                    c[0], c[1], c[2], c[3], c[4], c[5]);
        } catch (IOException | java.io.UncheckedIOException e) {
            throw new InputException(file == null ? null : file.toString(), 0, 0, "not readable as CSV: " + e.getMessage(), e);
        } catch (IllegalArgumentException | IllegalStateException e) {
            if (e instanceof InputException) throw e;
            throw new InputException(file == null ? null : file.toString(), headerLine, 0, "not readable as CSV: " + e.getMessage(), e);
        }
    }

    private static int col(Map<String, Integer> header, String name) {
        Integer i = header.get(name);
        return i == null ? -1 : i;
    }

    /** 1-based line numbers of increasing character offsets, counted incrementally. */
    private static final class LineCounter {
        private final String text;
        private int pos;
        private long line = 1;

        LineCounter(String text) { this.text = text; }

        /** Line of the record starting at offset; Commons CSV counts comments and blank lines before a record in it. */
        long lineAt(long offset) {
            int end = (int) Math.min(offset, text.length());
            for (; pos < end; pos++) if (text.charAt(pos) == '\n') line++;
            while (pos < text.length()) {
                int nl = text.indexOf('\n', pos);
                String l = (nl < 0 ? text.substring(pos) : text.substring(pos, nl)).trim();
                if (!(l.isEmpty() || l.startsWith("#")) || nl < 0) break;
                pos = nl + 1;
                line++;
            }
            return line;
        }
    }

    private static double number(Path file, long line, CSVRecord r, int index, String column) {
        if (index >= r.size()) return Double.NaN; // short row: missing values
        String v = r.get(index).trim();
        if (v.isEmpty() || v.equalsIgnoreCase("nan")) return Double.NaN;
        double d;
        try {
            d = Double.parseDouble(v);
        } catch (NumberFormatException e) {
            d = Double.NaN;
        }
        if (Double.isInfinite(d)) {
            throw new InputException(file, line, index + 1, column + ": expected a finite number, found '" + TextFiles.abbreviate(v) + "'");
        }
        if (Double.isNaN(d)) {
            throw new InputException(file, line, index + 1, column + ": expected a number, found '" + TextFiles.abbreviate(v) + "'");
        }
        return d;
    }

    private static double metaNumber(Path file, Map<String, String> meta, Map<String, Integer> lines, String key,
                                     double min, double max) {
        String v = meta.get(key);
        if (v == null || v.isEmpty()) return Double.NaN;
        try {
            double d = Double.parseDouble(v);
            if (!(d >= min && d <= max)) throw new NumberFormatException();
            return d;
        } catch (NumberFormatException e) {
            throw new InputException(file, lines.get(key), 0,
                    "# " + key + ": expected decimal degrees in " + (long) min + ".." + (long) max + ", found '" + v + "'");
        }
    }

    private static double parseTime(Path file, int line, String v) {
        try {
            OffsetDateTime t = OffsetDateTime.parse(v);
            return t.toEpochSecond() + t.getNano() * 1e-9;
        } catch (DateTimeParseException e) {
            try {
                LocalDateTime t = LocalDateTime.parse(v); // no offset: UTC by convention (DESIGN.md section 3)
                return t.toEpochSecond(ZoneOffset.UTC) + t.getNano() * 1e-9;
            } catch (DateTimeParseException e2) {
                throw new InputException(file, line, 0, "# time: expected ISO-8601 UTC such as 2026-05-14T09:15:02Z, found '" + v + "'");
            }
        }
    }

    private static String stem(Path file) {
        if (file == null || file.getFileName() == null) return "cast";
        String n = file.getFileName().toString();
        int dot = n.lastIndexOf('.');
        return dot > 0 ? n.substring(0, dot) : n;
    }
}
