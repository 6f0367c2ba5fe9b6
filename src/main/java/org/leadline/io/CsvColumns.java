package org.leadline.io;

import org.apache.commons.csv.CSVRecord;

import java.nio.file.Path;
import java.util.Map;

/** Small shared helpers for Leadline's CSV readers: column lookup and number parsing with locations. */
final class CsvColumns {
    private CsvColumns() {}

    /** Index of a column by case-insensitive name, or null. */
    static Integer find(Map<String, Integer> header, String name) {
        for (var e : header.entrySet()) if (e.getKey().strip().equalsIgnoreCase(name)) return e.getValue();
        return null;
    }

    /** A finite number from column col (0-based) of rec; errors name file, line and 1-based column. */
    static double number(Path file, long line, CSVRecord rec, int col, String what) {
        if (col >= rec.size()) {
            throw new InputException(file, line, col + 1, "missing value for " + what + " (row has " + rec.size() + " fields)");
        }
        String s = rec.get(col).strip();
        double v;
        try {
            v = Double.parseDouble(s);
        } catch (NumberFormatException e) {
            throw new InputException(file, line, col + 1, what + ": expected a number, found '" + s + "'");
        }
        if (!Double.isFinite(v)) throw new InputException(file, line, col + 1, what + ": expected a finite number, found '" + s + "'");
        return v;
    }
}
