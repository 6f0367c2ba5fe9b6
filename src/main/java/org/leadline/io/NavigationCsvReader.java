package org.leadline.io;

import java.nio.file.Path;
import java.util.Arrays;
import org.leadline.survey.NavigationSeries;

/**
 * Reads a navigation time series CSV: columns {@code time} (ISO-8601 UTC), {@code lat},
 * {@code lon} (WGS84 decimal degrees of the position reference), times strictly increasing.
 * Format: docs/formats/pings.md. Errors name file, physical line and 1-based field index.
 */
public final class NavigationCsvReader {
    private NavigationCsvReader() {}

    public static NavigationSeries read(Path file) {
        try (CsvInput in = CsvInput.open(file)) {
            int ct = in.require("time"), cla = in.require("lat"), clo = in.require("lon");
            double[] t = new double[1024], la = new double[1024], lo = new double[1024];
            int n = 0;
            while (in.next()) {
                if (n == t.length) {
                    t = Arrays.copyOf(t, 2 * n); la = Arrays.copyOf(la, 2 * n); lo = Arrays.copyOf(lo, 2 * n);
                }
                t[n] = in.time(ct);
                if (n > 0) in.strictlyAfter(ct, t[n], t[n - 1]);
                la[n] = in.latitude(cla);
                lo[n] = in.longitude(clo);
                n++;
            }
            if (n == 0) throw new InputException(file, "expected navigation rows after the header, found none");
            return NavigationSeries.of(Arrays.copyOf(t, n), Arrays.copyOf(la, n), Arrays.copyOf(lo, n));
        }
    }
}
