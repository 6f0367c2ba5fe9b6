package org.leadline.io;

import java.nio.file.Path;
import java.util.Arrays;
import org.leadline.survey.AttitudeSeries;

/**
 * Reads an attitude time series CSV: {@code time} (ISO-8601 UTC, strictly increasing) and at
 * least one of {@code heading} (deg clockwise from true north), {@code heave} (m, positive up),
 * {@code roll} (deg, starboard down positive), {@code pitch} (deg, bow up positive). A column
 * that is present must have a value in every row. Format: docs/formats/pings.md.
 */
public final class AttitudeCsvReader {
    private AttitudeCsvReader() {}

    private static final String[] NAMES = {"heading", "heave", "roll", "pitch"};

    public static AttitudeSeries read(Path file) {
        try (CsvInput in = CsvInput.open(file)) {
            int ct = in.require("time");
            int[] col = new int[4];
            boolean any = false;
            for (int q = 0; q < 4; q++) {
                col[q] = in.column(NAMES[q]);
                any |= col[q] >= 0;
            }
            if (!any) throw in.missingColumn("'heading', 'heave', 'roll' or 'pitch'");
            double[] t = new double[1024];
            double[][] v = new double[4][1024];
            int n = 0;
            while (in.next()) {
                if (n == t.length) {
                    t = Arrays.copyOf(t, 2 * n);
                    for (int q = 0; q < 4; q++) v[q] = Arrays.copyOf(v[q], 2 * n);
                }
                t[n] = in.time(ct);
                if (n > 0) in.strictlyAfter(ct, t[n], t[n - 1]);
                for (int q = 0; q < 4; q++) {
                    if (col[q] < 0) continue;
                    double x = in.number(col[q], NAMES[q]);
                    if (q == AttitudeSeries.ROLL || q == AttitudeSeries.PITCH) {
                        if (Math.abs(x) > 90) throw in.error(col[q], "expected " + NAMES[q] + " in [-90, 90] degrees, found " + in.quoted(col[q]));
                    } else if (q == AttitudeSeries.HEADING) {
                        if (x < -360 || x > 360) throw in.error(col[q], "expected a heading in [0, 360) degrees, found " + in.quoted(col[q]));
                    }
                    v[q][n] = x;
                }
                n++;
            }
            if (n == 0) throw new InputException(file, "expected attitude rows after the header, found none");
            double[][] out = new double[4][];
            for (int q = 0; q < 4; q++) out[q] = col[q] < 0 ? null : Arrays.copyOf(v[q], n);
            return AttitudeSeries.of(Arrays.copyOf(t, n), out[0], out[1], out[2], out[3]);
        }
    }
}
