package org.leadline.workbench;

import org.leadline.watercolumn.Cast;
import org.leadline.watercolumn.CastQc;
import org.leadline.watercolumn.DerivedProfile;
import org.leadline.watercolumn.PressureDepth;
import org.leadline.watercolumn.ProfileBuilder;
import org.leadline.watercolumn.Pss78;
import org.leadline.watercolumn.SoundSpeedEquation;

import java.util.ArrayList;
import java.util.List;

/**
 * The Casts view without Swing: each cast as measured, its derived sound-speed profile (after QC,
 * binning and extension) and the samples the QC rejected, as points (depth, value) to draw. The
 * equation choice rebuilds every profile with {@link ProfileBuilder#build} at the latitude and
 * extension depth the run used; the new equation reaches the soundings only with Reduce soundings.
 */
public final class CastsModel {
    /** The quantities plotted against depth. */
    public enum Quantity {
        TEMPERATURE("Temperature (deg C, ITS-90)"), SALINITY("Salinity (PSS-78)"), SOUND_SPEED("Sound speed (m/s)");
        public final String label;
        Quantity(String label) { this.label = label; }
    }

    /** A plotted point: depth (m, positive down) and value. */
    public record Point(double depth, double value) {}

    private final List<Cast> casts;
    private final List<DerivedProfile> profiles;
    private SoundSpeedEquation equation;

    public CastsModel(List<Cast> casts, List<DerivedProfile> profiles, SoundSpeedEquation equation) {
        this.casts = List.copyOf(casts);
        this.profiles = new ArrayList<>(profiles);
        this.equation = equation;
    }

    public int size() { return casts.size(); }
    public Cast cast(int k) { return casts.get(k); }
    public DerivedProfile profile(int k) { return profiles.get(k); }
    public SoundSpeedEquation equation() { return equation; }

    /** Rebuilds every profile with another sound-speed equation (casts measuring sound speed are unchanged). */
    public void rebuild(SoundSpeedEquation eq) {
        for (int k = 0; k < casts.size(); k++) {
            DerivedProfile old = profiles.get(k);
            double[] z = old.depth();
            double extend = z.length == 0 ? Double.NaN : z[z.length - 1];
            profiles.set(k, ProfileBuilder.build(casts.get(k), eq, old.latitude(),
                    CastQc.Settings.DEFAULTS.withExtendToDepth(extend)));
        }
        equation = eq;
    }

    /** The derived profile of cast k for one quantity (NaN values left out). */
    public List<Point> profilePoints(int k, Quantity q) {
        DerivedProfile p = profiles.get(k);
        double[] v = switch (q) {
            case TEMPERATURE -> p.temperature();
            case SALINITY -> p.salinity();
            case SOUND_SPEED -> p.soundSpeed();
        };
        return points(p.depth(), v, null);
    }

    /** The samples of cast k as measured (sound speed from the equation when not measured). */
    public List<Point> rawPoints(int k, Quantity q) {
        double[][] raw = raw(k);
        return points(raw[0], raw[1 + q.ordinal()], null);
    }

    /** The samples of cast k that the QC rejected, with their raw values. */
    public List<Point> rejectedPoints(int k, Quantity q) {
        double[][] raw = raw(k);
        boolean[] rejected = new boolean[raw[0].length];
        for (CastQc.Rejection r : profiles.get(k).rejections()) {
            if (r.index() >= 0 && r.index() < rejected.length) rejected[r.index()] = true;
        }
        return points(raw[0], raw[1 + q.ordinal()], rejected);
    }

    /** Rejections of cast k in words, one per line ("12.3 m: reason"). */
    public List<String> rejectionReasons(int k) {
        List<String> out = new ArrayList<>();
        for (CastQc.Rejection r : profiles.get(k).rejections()) {
            out.add(String.format(java.util.Locale.ROOT, "%.2f m: %s", r.depth(), r.reason()));
        }
        return out;
    }

    /** Raw depth, temperature (ITS-90), salinity and sound speed of cast k, as ProfileBuilder derives them. */
    private double[][] raw(int k) {
        Cast c = casts.get(k);
        double lat = profiles.get(k).latitude();
        int n = c.size();
        double[] z = c.depth(), p = c.pressure(), t = c.temperatureIts90(), s = c.salinity(), cond = c.conductivity();
        boolean hasDepth = c.hasDepth();
        for (int i = 0; i < n; i++) {
            if (hasDepth) {
                if (Double.isNaN(p[i])) p[i] = PressureDepth.pressure(z[i], lat);
            } else {
                z[i] = PressureDepth.depth(p[i], lat);
            }
            if (Double.isNaN(s[i]) && Double.isFinite(cond[i])) s[i] = Pss78.salinityFromConductivity(cond[i], t[i], p[i]);
        }
        double[] cs = c.soundSpeed();
        if (!c.hasSoundSpeed()) {
            for (int i = 0; i < n; i++) cs[i] = equation == null ? Double.NaN : equation.speed(t[i], s[i], p[i], z[i]);
        }
        return new double[][] {z, t, s, cs};
    }

    private static List<Point> points(double[] z, double[] v, boolean[] only) {
        List<Point> out = new ArrayList<>();
        for (int i = 0; i < z.length; i++) {
            if (only != null && !only[i]) continue;
            if (Double.isFinite(z[i]) && Double.isFinite(v[i])) out.add(new Point(z[i], v[i]));
        }
        return out;
    }
}
