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
        return new Tally(order, bandStarts).add(soundings, this).summary();
    }

    /**
     * Running sums of {@link #summary} over consecutive chunks of a day (each with its own
     * {@link #evaluate}), added in row order. Counts and sums are kept by fixed blocks of
     * {@link #BLOCK} rows of the whole day (each in row order, on any core) folded in block order,
     * a block cut by a chunk boundary carried into the next chunk: the same bits as the whole
     * table's summary for any thread count and any chunking.
     */
    public static final class Tally {
        private final S44Order order;
        private final double[] bandStarts;
        private final int nb;
        private final int[] c;       // n, nTvu, nThu, nBoth per band (folded blocks)
        private final double[] x;    // sTvu, sThu, maxRatio per band
        private int[] openC;
        private double[] openX;
        private long rows;

        public Tally(S44Order order, double[] bandStarts) {
            this.order = order;
            this.bandStarts = bandStarts.clone();
            nb = bandStarts.length;
            for (int k = 1; k < nb; k++) {
                if (!(bandStarts[k] > bandStarts[k - 1])) {
                    throw new IllegalArgumentException("depth bands: expected increasing edges, found " + bandStarts[k - 1]
                            + " then " + bandStarts[k]);
                }
            }
            c = new int[4 * nb];
            x = new double[3 * nb];
        }

        /** Adds the next rows of the day: the accepted soundings with a finite reduced depth of a table, with its flags. */
        public Tally add(SoundingTable soundings, Compliance flags) {
            if (soundings.size != flags.flags.length) {
                throw new IllegalArgumentException("sounding table: expected " + flags.flags.length + " soundings, found "
                        + soundings.size);
            }
            int n = soundings.size;
            if (n == 0) return this;
            long first = rows;
            List<int[]> seg = Compliance.blockSegments(first, n, BLOCK);
            int[][] pc = new int[seg.size()][];
            double[][] px = new double[seg.size()][];
            int[] carriedC = openC;
            double[] carriedX = openX;
            IntStream.range(0, seg.size()).parallel().forEach(blk -> {
                int[] cc = blk == 0 && carriedC != null ? carriedC : new int[4 * nb];
                double[] xx = blk == 0 && carriedX != null ? carriedX : new double[3 * nb];
                for (int i = seg.get(blk)[0], end = seg.get(blk)[1]; i < end; i++) {
                    double d = soundings.depth[i];
                    if (!soundings.accepted(i) || !Double.isFinite(d)) continue;
                    int k = nb - 1;
                    while (k > 0 && d < bandStarts[k]) k--;
                    cc[k]++;
                    if (flags.tvuOk(i)) cc[nb + k]++;
                    if (flags.thuOk(i)) cc[2 * nb + k]++;
                    if (flags.bothOk(i)) cc[3 * nb + k]++;
                    xx[k] += soundings.tvu[i];
                    xx[nb + k] += soundings.thu[i];
                    if (Double.isFinite(soundings.tvu[i])) {
                        xx[2 * nb + k] = Math.max(xx[2 * nb + k], soundings.tvu[i] / order.tvuLimit(d));
                    }
                }
                pc[blk] = cc;
                px[blk] = xx;
            });
            openC = null;
            openX = null;
            for (int k = 0; k < pc.length; k++) {
                if ((first + seg.get(k)[1]) % BLOCK == 0) fold(c, x, pc[k], px[k]);
                else {
                    openC = pc[k];
                    openX = px[k];
                }
            }
            rows += n;
            return this;
        }

        private void fold(int[] tc, double[] tx, int[] cc, double[] xx) {
            for (int k = 0; k < nb; k++) {
                tc[k] += cc[k];
                tc[nb + k] += cc[nb + k];
                tc[2 * nb + k] += cc[2 * nb + k];
                tc[3 * nb + k] += cc[3 * nb + k];
                tx[k] += xx[k];
                tx[nb + k] += xx[nb + k];
                tx[2 * nb + k] = Math.max(tx[2 * nb + k], xx[2 * nb + k]);
            }
        }

        public ComplianceSummary summary() {
            int[] tc = new int[4 * nb];
            double[] tx = new double[3 * nb];
            fold(tc, tx, c, x);
            if (openC != null) fold(tc, tx, openC, openX);
            List<ComplianceSummary.Band> bands = new ArrayList<>();
            int total = 0, tTvu = 0, tThu = 0, tBoth = 0;
            for (int k = 0; k < nb; k++) {
                int n = tc[k];
                double to = k + 1 < nb ? bandStarts[k + 1] : Double.POSITIVE_INFINITY;
                bands.add(new ComplianceSummary.Band(bandStarts[k], to, n, pct(tc[nb + k], n), pct(tc[2 * nb + k], n),
                        pct(tc[3 * nb + k], n), n == 0 ? Double.NaN : tx[k] / n,
                        n == 0 ? Double.NaN : tx[nb + k] / n, n == 0 ? Double.NaN : tx[2 * nb + k]));
                total += n;
                tTvu += tc[nb + k];
                tThu += tc[2 * nb + k];
                tBoth += tc[3 * nb + k];
            }
            return new ComplianceSummary(order, total, pct(tTvu, total), pct(tThu, total), pct(tBoth, total), bands);
        }
    }

    /**
     * The rows [from, to) of a chunk of n rows starting at row {@code first} of the day, cut where
     * the day's fixed blocks of {@code block} rows begin: the units of the deterministic block-wise
     * sums of the running tallies (here and in {@link TpuModel.Tally}).
     */
    static List<int[]> blockSegments(long first, int n, int block) {
        List<int[]> seg = new ArrayList<>();
        for (int i = 0; i < n; ) {
            int end = (int) Math.min(n, ((first + i) / block + 1) * block - first);
            seg.add(new int[] {i, end});
            i = end;
        }
        return seg;
    }

    private static double pct(int k, int n) {
        return n == 0 ? Double.NaN : 100.0 * k / n;
    }
}
