package org.leadline.watercolumn;

import java.util.Arrays;
import java.util.List;

/**
 * A sound-speed profile: speed as a piecewise-linear function of depth between samples, held
 * constant above the first and below the last sample.
 *
 * <p>Travel times are exact integrals over the piecewise-linear profile, not means of samples: in a
 * layer where {@code c(z) = c0 + g (z - z0)} the one-way vertical time is {@code ln(c1/c0) / g}
 * (a standard result for constant-gradient layers, e.g. Medwin and Clay 1998, "Fundamentals of
 * Acoustical Oceanography", ch. 3). The harmonic-mean speed between two depths is their distance
 * over that time. Accuracy: to rounding (about 1e-15 relative), see {@code SoundSpeedProfileTest}.
 *
 * <pre>{@code
 * SoundSpeedProfile p = new SoundSpeedProfile(new double[]{0, 10, 50}, new double[]{1500, 1490, 1485}, List.of());
 * double cMean = p.harmonicMeanSpeed(0.8, 30.0);     // m/s
 * double z = p.depthAfter(0.8, 0.02);                 // m reached after 20 ms one way
 * }</pre>
 *
 * Immutable and thread-safe.
 */
public final class SoundSpeedProfile {
    private final double[] depth;   // m, strictly increasing
    private final double[] speed;   // m/s, > 0
    private final double[] cumTime; // s, one-way vertical time from depth[0] to depth[i]
    private final List<String> warnings;

    /**
     * @param depth    sample depths, m, strictly increasing, at least one
     * @param speed    sound speed at each depth, m/s, positive
     * @param warnings notes attached to the profile (validity ranges exceeded, extension, QC)
     */
    public SoundSpeedProfile(double[] depth, double[] speed, List<String> warnings) {
        if (depth.length == 0 || depth.length != speed.length) {
            throw new IllegalArgumentException("profile needs matching depth and speed samples, got "
                    + depth.length + " depths and " + speed.length + " speeds");
        }
        for (int i = 0; i < depth.length; i++) {
            if (!Double.isFinite(depth[i]) || !Double.isFinite(speed[i]) || speed[i] <= 0) {
                throw new IllegalArgumentException("profile sample " + i + " is not physical: depth "
                        + depth[i] + " m, speed " + speed[i] + " m/s");
            }
            if (i > 0 && depth[i] <= depth[i - 1]) {
                throw new IllegalArgumentException("profile depths must increase strictly; sample " + i
                        + " at " + depth[i] + " m follows " + depth[i - 1] + " m");
            }
        }
        this.depth = depth.clone();
        this.speed = speed.clone();
        this.warnings = List.copyOf(warnings);
        this.cumTime = new double[depth.length];
        for (int i = 1; i < depth.length; i++) {
            cumTime[i] = cumTime[i - 1] + layerTime(this.depth[i - 1], this.speed[i - 1],
                    this.depth[i], this.speed[i], this.depth[i]);
        }
        // segment look-up table: cells of equal depth over the samples, each naming a nearby segment
        int n = this.depth.length;
        if (n >= 3) {
            int cells = Math.min(4 * n, 1 << 16);
            double d0 = this.depth[0], scale = cells / (this.depth[n - 1] - d0);
            int[] g = new int[cells];
            int i = 0;
            for (int c = 0; c < cells; c++) {
                double z = d0 + c / scale;
                while (i < n - 2 && this.depth[i + 1] <= z) i++;
                g[c] = i;
            }
            this.guess = Double.isFinite(scale) ? g : null;
            this.guessScale = scale;
        } else {
            this.guess = null;
            this.guessScale = 0;
        }
    }

    /** Per depth cell a segment index near the answer of {@link #segment} (null for two samples or fewer). */
    private final int[] guess;
    private final double guessScale;

    /** A profile of one constant speed, m/s. */
    public static SoundSpeedProfile constant(double speed) {
        return new SoundSpeedProfile(new double[]{0}, new double[]{speed}, List.of());
    }

    public int size() { return depth.length; }
    public double depth(int i) { return depth[i]; }
    public double speed(int i) { return speed[i]; }
    /** Copy of the sample depths, m. */
    public double[] depths() { return depth.clone(); }
    /** Copy of the sample speeds, m/s. */
    public double[] speeds() { return speed.clone(); }
    public double minDepth() { return depth[0]; }
    public double maxDepth() { return depth[depth.length - 1]; }
    public List<String> warnings() { return warnings; }

    /** A copy of this profile carrying extra warnings. */
    public SoundSpeedProfile withWarnings(List<String> more) {
        List<String> all = new java.util.ArrayList<>(warnings);
        all.addAll(more);
        return new SoundSpeedProfile(depth, speed, all);
    }

    /** Sound speed at depth z, m/s (linear between samples, constant beyond the ends). */
    public double speedAt(double z) {
        if (z <= depth[0]) return speed[0];
        int n = depth.length;
        if (z >= depth[n - 1]) return speed[n - 1];
        int i = segment(z);
        double f = (z - depth[i]) / (depth[i + 1] - depth[i]);
        return speed[i] + f * (speed[i + 1] - speed[i]);
    }

    /** One-way vertical travel time from depth za down to zb (zb &gt;= za), s. */
    public double travelTime(double za, double zb) {
        if (zb < za) return -travelTime(zb, za);
        return timeFromTop(zb) - timeFromTop(za);
    }

    /**
     * Harmonic-mean sound speed between two depths, m/s: {@code (zb - za) / integral(dz / c(z))}.
     * Returns the speed at za when the depths coincide.
     */
    public double harmonicMeanSpeed(double za, double zb) {
        if (za == zb) return speedAt(za);
        return Math.abs(zb - za) / Math.abs(travelTime(za, zb));
    }

    /**
     * Depth reached after travelling vertically downwards for one-way time t from depth z0, m:
     * the inverse of {@link #travelTime(double, double)}.
     */
    public double depthAfter(double z0, double t) {
        if (t < 0) throw new IllegalArgumentException("travel time must not be negative: " + t + " s");
        double target = timeFromTop(z0) + t;
        int n = depth.length;
        if (z0 < depth[0]) {
            double tTop = (depth[0] - z0) / speed[0];
            if (t <= tTop) return z0 + t * speed[0];
            return depthAfter(depth[0], t - tTop);
        }
        if (target >= cumTime[n - 1]) {
            return depth[n - 1] + (target - cumTime[n - 1]) * speed[n - 1];
        }
        int i = Arrays.binarySearch(cumTime, target);
        if (i >= 0) return depth[i];
        i = -i - 2; // segment whose start time <= target
        double dt = target - cumTime[i];
        double c0 = speed[i];
        double g = (speed[i + 1] - speed[i]) / (depth[i + 1] - depth[i]);
        // z = z0 + c0 * (exp(g t) - 1) / g, with expm1 for small gradients
        double gt = g * dt;
        double dz = Math.abs(gt) < 1e-300 ? c0 * dt : c0 * Math.expm1(gt) / g;
        return Math.min(depth[i] + dz, depth[i + 1]);
    }

    /** One-way time from depth[0] to z (negative above it), s. */
    private double timeFromTop(double z) {
        int n = depth.length;
        if (z <= depth[0]) return (z - depth[0]) / speed[0];
        if (z >= depth[n - 1]) return cumTime[n - 1] + (z - depth[n - 1]) / speed[n - 1];
        int i = segment(z);
        return cumTime[i] + layerTime(depth[i], speed[i], depth[i + 1], speed[i + 1], z);
    }

    /** Index i with depth[i] &lt;= z &lt; depth[i+1]; z inside the sampled range. */
    private int segment(double z) {
        // from the look-up table's guess, a few steps to the largest i <= n - 2 with depth[i] <= z
        // (what the binary search below gives for strictly increasing depths; zero and NaN are left
        // to the search, which orders -0.0 before 0.0)
        if (guess != null && z != 0 && z == z) {
            int c = (int) ((z - depth[0]) * guessScale);
            if (c >= 0 && c < guess.length) {
                int i = guess[c], last = depth.length - 2;
                for (int step = 0; step < 8; step++) {
                    if (depth[i] > z) {
                        if (i == 0) break;
                        i--;
                    } else if (i < last && depth[i + 1] <= z) {
                        i++;
                    } else {
                        return i;
                    }
                }
            }
        }
        int i = Arrays.binarySearch(depth, z);
        if (i >= 0) return Math.min(i, depth.length - 2);
        return -i - 2;
    }

    /** Time from z0 to z in the linear layer (z0,c0)-(z1,c1), z0 &lt;= z &lt;= z1. */
    private static double layerTime(double z0, double c0, double z1, double c1, double z) {
        double dz = z - z0;
        if (dz == 0) return 0;
        double g = (c1 - c0) / (z1 - z0);
        double x = g * dz / c0; // relative speed change across [z0, z]
        // integral dz / (c0 + g dz) = ln(1 + x) / g = dz/c0 * ln(1+x)/x; log1p keeps small x exact
        if (Math.abs(x) < 1e-12) return dz / c0 * (1 - x / 2);
        return dz / c0 * Math.log1p(x) / x;
    }

    @Override
    public String toString() {
        return "SoundSpeedProfile[" + depth.length + " samples, " + depth[0] + ".." + depth[depth.length - 1] + " m]";
    }
}
