package org.leadline.uncertainty;

import org.leadline.survey.SoundingTable;

import java.util.ArrayList;
import java.util.List;
import java.util.stream.IntStream;

/**
 * Per-sounding test of TVU and THU against an IHO S-44 edition 6.0.0 order (Table 1 limits at the
 * sounding's reduced depth, {@link S44Order#tvuLimit}, {@link S44Order#thuLimit}), and the survey
 * shares for the report. A sounding passes a test when its uncertainty is finite and not above
 * the limit; a NaN uncertainty fails (it was not estimated, so it cannot be shown to comply).
 *
 * <p>Columnar: {@link #flags} holds one byte per sounding, bit {@link #TVU_OK} and bit
 * {@link #THU_OK}; all rows are tested, rejected ones included, while the shares count accepted
 * soundings with a finite reduced depth only.
 */
public final class Compliance {
    public static final byte TVU_OK = 1;
    public static final byte THU_OK = 2;
    /** Depth bands of the report, m: 0-5, 5-10, 10-20, 20-50, 50+ (common practice). */
    public static final double[] DEFAULT_BANDS = {0, 5, 10, 20, 50};
    /** Rows per parallel block (fixed, so that sums do not depend on the number of cores). */
    private static final int BLOCK = 65_536;

    public final S44Order order;
    /** Per sounding: TVU_OK | THU_OK bits. */
    public final byte[] flags;

    private Compliance(S44Order order, byte[] flags) {
        this.order = order;
        this.flags = flags;
    }

    /** Tests every sounding's tvu and thu (95 %, m) against the order at its reduced depth. */
    public static Compliance evaluate(SoundingTable soundings, S44Order order) {
        int n = soundings.size;
        byte[] f = new byte[n];
        // rows in fixed blocks on all cores; each flag is written by one task
        IntStream.range(0, (n + BLOCK - 1) / BLOCK).parallel().forEach(blk -> {
            for (int i = blk * BLOCK, end = Math.min(n, (blk + 1) * BLOCK); i < end; i++) {
                double d = soundings.depth[i];
                if (Double.isNaN(d)) continue;
                byte b = 0;
                if (soundings.tvu[i] <= order.tvuLimit(d)) b |= TVU_OK;
                if (soundings.thu[i] <= order.thuLimit(d)) b |= THU_OK;
                f[i] = b;
            }
        });
        return new Compliance(order, f);
    }

    public boolean tvuOk(int i) { return (flags[i] & TVU_OK) != 0; }

    public boolean thuOk(int i) { return (flags[i] & THU_OK) != 0; }

    public boolean bothOk(int i) { return (flags[i] & (TVU_OK | THU_OK)) == (TVU_OK | THU_OK); }

    /** Shares over the accepted soundings, with the default depth bands. */
    public ComplianceSummary summary(SoundingTable soundings) {
        return summary(soundings, DEFAULT_BANDS);
    }

    /**
     * Shares over the accepted soundings with a finite reduced depth.
     *
     * @param bandStarts increasing lower edges of the depth bands, m; the last band is open-ended and
     *                   the first also takes shallower depths and drying heights
     */
    public ComplianceSummary summary(SoundingTable soundings, double[] bandStarts) {
        if (soundings.size != flags.length) {
            throw new IllegalArgumentException("sounding table: expected " + flags.length + " soundings, found "
                    + soundings.size);
        }
        int nb = bandStarts.length;
        for (int k = 1; k < nb; k++) {
            if (!(bandStarts[k] > bandStarts[k - 1])) {
                throw new IllegalArgumentException("depth bands: expected increasing edges, found " + bandStarts[k - 1]
                        + " then " + bandStarts[k]);
            }
        }
        // Counts and sums by fixed blocks of rows (each in row order), then the blocks in order: a
        // deterministic reduction, the same bits for any thread count.
        int size = soundings.size;
        int[][] pn = new int[(size + BLOCK - 1) / BLOCK][];
        double[][] ps = new double[pn.length][];
        IntStream.range(0, pn.length).parallel().forEach(blk -> {
            int[] c = new int[4 * nb];             // n, nTvu, nThu, nBoth per band
            double[] x = new double[3 * nb];       // sTvu, sThu, maxRatio per band
            for (int i = blk * BLOCK, end = Math.min(size, (blk + 1) * BLOCK); i < end; i++) {
                double d = soundings.depth[i];
                if (!soundings.accepted(i) || !Double.isFinite(d)) continue;
                int k = nb - 1;
                while (k > 0 && d < bandStarts[k]) k--;
                c[k]++;
                if (tvuOk(i)) c[nb + k]++;
                if (thuOk(i)) c[2 * nb + k]++;
                if (bothOk(i)) c[3 * nb + k]++;
                x[k] += soundings.tvu[i];
                x[nb + k] += soundings.thu[i];
                if (Double.isFinite(soundings.tvu[i])) {
                    x[2 * nb + k] = Math.max(x[2 * nb + k], soundings.tvu[i] / order.tvuLimit(d));
                }
            }
            pn[blk] = c;
            ps[blk] = x;
        });
        int[] n = new int[nb], nTvu = new int[nb], nThu = new int[nb], nBoth = new int[nb];
        double[] sTvu = new double[nb], sThu = new double[nb], maxRatio = new double[nb];
        for (int blk = 0; blk < pn.length; blk++) {
            int[] c = pn[blk];
            double[] x = ps[blk];
            for (int k = 0; k < nb; k++) {
                n[k] += c[k];
                nTvu[k] += c[nb + k];
                nThu[k] += c[2 * nb + k];
                nBoth[k] += c[3 * nb + k];
                sTvu[k] += x[k];
                sThu[k] += x[nb + k];
                maxRatio[k] = Math.max(maxRatio[k], x[2 * nb + k]);
            }
        }
        List<ComplianceSummary.Band> bands = new ArrayList<>();
        int total = 0, tTvu = 0, tThu = 0, tBoth = 0;
        for (int k = 0; k < nb; k++) {
            double to = k + 1 < nb ? bandStarts[k + 1] : Double.POSITIVE_INFINITY;
            bands.add(new ComplianceSummary.Band(bandStarts[k], to, n[k], pct(nTvu[k], n[k]), pct(nThu[k], n[k]),
                    pct(nBoth[k], n[k]), n[k] == 0 ? Double.NaN : sTvu[k] / n[k],
                    n[k] == 0 ? Double.NaN : sThu[k] / n[k], n[k] == 0 ? Double.NaN : maxRatio[k]));
            total += n[k];
            tTvu += nTvu[k];
            tThu += nThu[k];
            tBoth += nBoth[k];
        }
        return new ComplianceSummary(order, total, pct(tTvu, total), pct(tThu, total), pct(tBoth, total), bands);
    }

    private static double pct(int k, int n) {
        return n == 0 ? Double.NaN : 100.0 * k / n;
    }
}
