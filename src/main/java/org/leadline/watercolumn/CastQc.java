package org.leadline.watercolumn;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;

/**
 * Quality control of one cast, in the order a hydrographer does it by eye (common practice):
 * <ol>
 * <li>keep the downcast only: everything after the deepest sample is the upcast; before the
 * final descent the instrument soaks near the surface (lowered a few metres to let the sensors
 * settle, then raised again) and those samples are dropped;</li>
 * <li>in the downcast, drop samples where the instrument moved up (depth shallower than the
 * deepest depth already reached: ship roll on the wire);</li>
 * <li>reject non-physical values (temperature outside -2..40 deg C, salinity outside 0..42, sound
 * speed outside 1375..1625 m/s, or no sound speed at all);</li>
 * <li>reject spikes: sound speed departing from the running median of its neighbours by more than
 * {@link Settings#spikeThreshold()} (dense casts only, see {@link #MAX_SPIKE_SPACING});</li>
 * <li>average what is left in regular depth bins centred on multiples of the bin step;</li>
 * <li>optionally extend the profile to a requested depth by holding the deepest values constant,
 * stated as a note.</li>
 * </ol>
 * Every dropped sample gets a reason; nothing is silently lost. Pure: no I/O.
 */
public final class CastQc {
    private CastQc() {}

    /** Temperature, salinity and sound-speed limits of plausible seawater (common practice). */
    public static final double T_MIN = -2, T_MAX = 40, S_MIN = 0, S_MAX = 42, C_MIN = 1375, C_MAX = 1625;

    /** Spike test only where samples are at most this far apart, m (a CTD profiling at 2+ samples per metre). */
    public static final double MAX_SPIKE_SPACING = 0.5;

    /**
     * QC settings.
     *
     * @param binStep            depth bin, m; 0 or NaN keeps the samples unbinned
     * @param extendToDepth      extend the profile to this depth, m, when deeper than the cast; NaN: no extension
     * @param spikeThreshold     largest allowed departure of sound speed from the running median, m/s
     * @param spikeWindow        running-median window, samples (odd, at least 3)
     * @param reversalTolerance  an upward excursion larger than this, m, before the final descent marks the soak
     */
    public record Settings(double binStep, double extendToDepth, double spikeThreshold, int spikeWindow,
                           double reversalTolerance) {
        /** 1 m bins, no extension, 1.5 m/s spike threshold over 7 samples, 1 m soak reversal. */
        public static final Settings DEFAULTS = new Settings(1.0, Double.NaN, 1.5, 7, 1.0);

        public Settings {
            if (binStep < 0) throw new IllegalArgumentException("bin step must not be negative: " + binStep + " m");
            if (!(spikeThreshold > 0)) throw new IllegalArgumentException("spike threshold must be positive: " + spikeThreshold + " m/s");
            if (spikeWindow < 3) throw new IllegalArgumentException("spike window must be at least 3 samples: " + spikeWindow);
            if (!(reversalTolerance >= 0)) throw new IllegalArgumentException("reversal tolerance must not be negative");
        }

        public Settings withBinStep(double m) {
            return new Settings(m, extendToDepth, spikeThreshold, spikeWindow, reversalTolerance);
        }

        public Settings withExtendToDepth(double m) {
            return new Settings(binStep, m, spikeThreshold, spikeWindow, reversalTolerance);
        }
    }

    /** Columnar samples: input in recording order, output binned by depth. */
    public record Columns(double[] depth, double[] pressure, double[] temperature, double[] salinity,
                          double[] soundSpeed) {
        public Columns {
            int n = depth.length;
            if (pressure.length != n || temperature.length != n || salinity.length != n || soundSpeed.length != n) {
                throw new IllegalArgumentException("columns differ in length");
            }
        }

        public int size() { return depth.length; }
    }

    /** One dropped sample: its index in the input, its depth, m, and why. */
    public record Rejection(int index, double depth, String reason) {}

    /**
     * @param binned      the profile after QC, binning and extension; depth strictly increasing
     * @param rejections  every input sample not used, with its reason, in index order
     * @param notes       what was done that changes the data (extension, held surface value)
     * @param downcastStart first input index of the downcast
     * @param downcastEnd   last input index of the downcast (the deepest sample)
     */
    public record Result(Columns binned, List<Rejection> rejections, List<String> notes,
                         int downcastStart, int downcastEnd) {
        public Result {
            rejections = List.copyOf(rejections);
            notes = List.copyOf(notes);
        }
    }

    /** Runs the QC on samples in recording order. */
    public static Result apply(Columns in, Settings s) {
        int n = in.size();
        double[] z = in.depth();
        String[] reason = new String[n];
        // 1. downcast: deepest sample ends it; the soak is cut where the instrument last came up
        int end = -1;
        for (int i = 0; i < n; i++) {
            if (Double.isFinite(z[i]) && (end < 0 || z[i] > z[end])) end = i;
        }
        if (end < 0) {
            throw new IllegalArgumentException("cast has no sample with a depth");
        }
        int walk = end;
        double shallowest = z[end];
        for (int i = end - 1; i >= 0; i--) {
            if (!Double.isFinite(z[i])) continue;
            if (z[i] > shallowest + s.reversalTolerance()) break; // went up before this: soak
            walk = i;
            shallowest = Math.min(shallowest, z[i]);
        }
        // start the downcast at the last sample that is at the shallowest depth of the final descent
        // (within 0.1 m of sensor noise), so time spent sitting just below the surface is dropped too
        int start = walk;
        for (int i = walk; i <= end; i++) {
            if (Double.isFinite(z[i]) && z[i] <= shallowest + 0.1) start = i;
        }
        for (int i = 0; i < start; i++) reason[i] = "soak before the downcast";
        for (int i = end + 1; i < n; i++) reason[i] = "upcast";
        // 2. depth reversals and missing depth within the downcast
        double deepest = Double.NEGATIVE_INFINITY;
        for (int i = start; i <= end; i++) {
            if (!Double.isFinite(z[i])) { reason[i] = "no depth"; continue; }
            if (z[i] < deepest) {
                reason[i] = String.format(Locale.ROOT, "depth reversal: %.2f m after %.2f m (instrument moving up)", z[i], deepest);
                continue;
            }
            deepest = z[i];
        }
        // 3. non-physical values
        double[] t = in.temperature(), sal = in.salinity(), c = in.soundSpeed();
        for (int i = start; i <= end; i++) {
            if (reason[i] != null) continue;
            if (t[i] < T_MIN || t[i] > T_MAX) {
                reason[i] = String.format(Locale.ROOT, "temperature %.3f deg C outside %.0f..%.0f", t[i], T_MIN, T_MAX);
            } else if (sal[i] < S_MIN || sal[i] > S_MAX) {
                reason[i] = String.format(Locale.ROOT, "salinity %.3f outside %.0f..%.0f", sal[i], S_MIN, S_MAX);
            } else if (Double.isNaN(c[i])) {
                reason[i] = "no sound speed (temperature, salinity or sound speed missing)";
            } else if (c[i] < C_MIN || c[i] > C_MAX) {
                reason[i] = String.format(Locale.ROOT, "sound speed %.3f m/s outside %.0f..%.0f", c[i], C_MIN, C_MAX);
            }
        }
        // 4. spikes against the running median of the samples still accepted, on a window centred on the
        // sample (shortened symmetrically near the ends, so a steady gradient never looks like a spike; the
        // first and last samples cannot be judged). Only dense casts are judged: between samples more than
        // MAX_SPIKE_SPACING apart a real sound-speed minimum would look like a spike.
        int[] ok = accepted(reason, start, end);
        int half = s.spikeWindow() / 2;
        String[] spike = new String[ok.length];
        double spacing = medianSpacing(z, ok);
        List<String> notes = new ArrayList<>();
        if (ok.length >= 3 && spacing > MAX_SPIKE_SPACING) {
            notes.add(String.format(Locale.ROOT, "spike test skipped: samples are %.2f m apart (it needs %.1f m or less)",
                    spacing, MAX_SPIKE_SPACING));
        }
        for (int k = 0; k < ok.length && spacing <= MAX_SPIKE_SPACING; k++) {
            int h = Math.min(half, Math.min(k, ok.length - 1 - k));
            if (h < 1) continue;
            double[] w = new double[2 * h + 1];
            for (int j = -h; j <= h; j++) w[j + h] = c[ok[k + j]];
            Arrays.sort(w);
            double med = w[h];
            double dev = c[ok[k]] - med;
            if (Math.abs(dev) > s.spikeThreshold()) {
                spike[k] = String.format(Locale.ROOT, "spike: sound speed %.3f m/s departs %.3f m/s from the running median %.3f m/s (limit %.3f)",
                        c[ok[k]], dev, med, s.spikeThreshold());
            }
        }
        for (int k = 0; k < ok.length; k++) if (spike[k] != null) reason[ok[k]] = spike[k];
        ok = accepted(reason, start, end);
        if (ok.length == 0) {
            throw new IllegalArgumentException("no sample of the cast passed QC (" + n + " samples, downcast "
                    + start + ".." + end + ")");
        }
        List<Rejection> rejections = new ArrayList<>();
        for (int i = 0; i < n; i++) if (reason[i] != null) rejections.add(new Rejection(i, z[i], reason[i]));

        // 5. binning
        Columns binned = bin(in, ok, s.binStep());
        // 6. extension and notes
        int m = binned.size();
        double last = binned.depth()[m - 1];
        if (Double.isFinite(s.extendToDepth()) && s.extendToDepth() > last) {
            binned = extend(binned, s.extendToDepth());
            notes.add(String.format(Locale.ROOT,
                    "extended from %.1f m to %.1f m by holding the deepest sound speed (%.3f m/s), temperature and salinity constant",
                    last, s.extendToDepth(), binned.soundSpeed()[m - 1]));
        }
        if (binned.depth()[0] > 0) {
            notes.add(String.format(Locale.ROOT, "sound speed above %.1f m held at the shallowest value %.3f m/s",
                    binned.depth()[0], binned.soundSpeed()[0]));
        }
        return new Result(binned, rejections, notes, start, end);
    }

    /** Median spacing of consecutive accepted depths, m (0 for fewer than two samples). */
    private static double medianSpacing(double[] z, int[] ok) {
        if (ok.length < 2) return 0;
        double[] d = new double[ok.length - 1];
        for (int k = 1; k < ok.length; k++) d[k - 1] = z[ok[k]] - z[ok[k - 1]];
        Arrays.sort(d);
        return d[d.length / 2];
    }

    private static int[] accepted(String[] reason, int start, int end) {
        int[] ok = new int[end - start + 1];
        int k = 0;
        for (int i = start; i <= end; i++) if (reason[i] == null) ok[k++] = i;
        return Arrays.copyOf(ok, k);
    }

    /**
     * Means of the accepted samples in bins [k step - step/2, k step + step/2), labelled k step;
     * empty bins are left out (the profile interpolates linearly across them). Without a step,
     * samples at equal depth are averaged.
     */
    private static Columns bin(Columns in, int[] ok, double step) {
        double[] z = in.depth(), p = in.pressure(), t = in.temperature(), sal = in.salinity(), c = in.soundSpeed();
        boolean binning = Double.isFinite(step) && step > 0;
        List<double[]> rows = new ArrayList<>(); // depth, p, t, s, c
        long currentKey = Long.MIN_VALUE;
        double[] sum = null;
        int count = 0;
        for (int i : ok) {
            long key = binning ? Math.round(z[i] / step) : Double.doubleToLongBits(z[i]);
            // ok[] is in non-decreasing depth order (reversals were rejected), so bins arrive in order
            if (key != currentKey) {
                if (sum != null) rows.add(mean(sum, count, binning ? currentKey * step : Double.NaN));
                sum = new double[5];
                count = 0;
                currentKey = key;
            }
            sum[0] += z[i]; sum[1] += p[i]; sum[2] += t[i]; sum[3] += sal[i]; sum[4] += c[i];
            count++;
        }
        rows.add(mean(sum, count, binning ? currentKey * step : Double.NaN));
        int m = rows.size();
        double[][] cols = new double[5][m];
        for (int r = 0; r < m; r++) for (int q = 0; q < 5; q++) cols[q][r] = rows.get(r)[q];
        return new Columns(cols[0], cols[1], cols[2], cols[3], cols[4]);
    }

    private static double[] mean(double[] sum, int count, double label) {
        double[] r = new double[5];
        for (int q = 0; q < 5; q++) r[q] = sum[q] / count;
        if (!Double.isNaN(label)) r[0] = label;
        return r;
    }

    private static Columns extend(Columns b, double toDepth) {
        int m = b.size();
        double[][] cols = {b.depth(), b.pressure(), b.temperature(), b.salinity(), b.soundSpeed()};
        for (int q = 0; q < 5; q++) {
            cols[q] = Arrays.copyOf(cols[q], m + 1);
            cols[q][m] = cols[q][m - 1];
        }
        cols[0][m] = toDepth;
        cols[1][m] = Double.NaN; // pressure at the new depth: the caller knows the latitude
        return new Columns(cols[0], cols[1], cols[2], cols[3], cols[4]);
    }
}
