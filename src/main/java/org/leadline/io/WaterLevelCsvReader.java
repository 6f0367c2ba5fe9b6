package org.leadline.io;

import java.nio.file.Path;
import java.util.Arrays;
import org.leadline.survey.WaterLevelSeries;

/**
 * Reads a water-level (tide gauge) CSV: columns {@code time} (ISO-8601 UTC) and {@code level}
 * (m above chart datum, positive up), times strictly increasing. Format: docs/formats/pings.md.
 */
public final class WaterLevelCsvReader {
    private WaterLevelCsvReader() {}

    public static WaterLevelSeries read(Path file) {
        try (CsvInput in = CsvInput.open(file)) {
            int ct = in.require("time"), cl = in.require("level");
            double[] t = new double[256], v = new double[256];
            int n = 0;
            while (in.next()) {
                if (n == t.length) { t = Arrays.copyOf(t, 2 * n); v = Arrays.copyOf(v, 2 * n); }
                t[n] = in.time(ct);
                if (n > 0) in.strictlyAfter(ct, t[n], t[n - 1]);
                v[n] = in.number(cl, "level");
                n++;
            }
            if (n == 0) throw new InputException(file, "expected water-level rows after the header, found none");
            return WaterLevelSeries.of(Arrays.copyOf(t, n), Arrays.copyOf(v, n));
        }
    }
}
