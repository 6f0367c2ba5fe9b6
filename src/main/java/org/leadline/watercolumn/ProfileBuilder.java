package org.leadline.watercolumn;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

/**
 * Builds the sound-speed profile of a cast: depth and pressure from each other (UNESCO 1983,
 * {@link PressureDepth}), temperature to ITS-90, salinity from conductivity (PSS-78,
 * {@link Pss78}) when not given, sound speed from the chosen {@link SoundSpeedEquation} (or as
 * measured by a velocimeter, in which case no equation is used), then {@link CastQc}.
 *
 * <p>Latitude: the cast's own when it has one, else the given one, else 45 deg with a warning
 * (the latitude changes depth from pressure by at most 0.5 %, pole to equator).
 */
public final class ProfileBuilder {
    private ProfileBuilder() {}

    /** Latitude used when neither the cast nor the caller gives one, degrees. */
    public static final double DEFAULT_LATITUDE = 45;

    /**
     * @param cast        the cast as read
     * @param eq          sound-speed equation for casts without measured sound speed
     * @param latitudeDeg latitude to use when the cast has none, degrees; NaN for none
     * @param settings    QC, binning and extension settings
     * @throws IllegalArgumentException when the cast lacks what a profile needs or nothing passes QC
     */
    public static DerivedProfile build(Cast cast, SoundSpeedEquation eq, double latitudeDeg, CastQc.Settings settings) {
        List<String> warnings = new ArrayList<>();
        double lat;
        if (Double.isFinite(cast.latitude())) {
            lat = cast.latitude();
        } else if (Double.isFinite(latitudeDeg)) {
            lat = latitudeDeg;
        } else {
            lat = DEFAULT_LATITUDE;
            warnings.add("cast has no latitude and none was given: using 45 deg for pressure and depth");
        }
        int n = cast.size();
        boolean hasDepth = cast.hasDepth();
        if (!hasDepth && !cast.hasPressure()) throw new IllegalArgumentException("cast has neither depth nor pressure");
        double[] z = cast.depth(), p = cast.pressure();
        for (int i = 0; i < n; i++) {
            if (hasDepth) {
                if (Double.isNaN(p[i])) p[i] = PressureDepth.pressure(z[i], lat);
            } else {
                z[i] = PressureDepth.depth(p[i], lat);
            }
        }
        double[] t = cast.temperatureIts90();
        double[] s = cast.salinity();
        double[] cond = cast.conductivity();
        for (int i = 0; i < n; i++) {
            if (Double.isNaN(s[i]) && Double.isFinite(cond[i])) s[i] = Pss78.salinityFromConductivity(cond[i], t[i], p[i]);
        }
        boolean measured = cast.hasSoundSpeed();
        double[] c = new double[n];
        if (measured) {
            c = cast.soundSpeed();
        } else {
            if (eq == null) throw new IllegalArgumentException("no sound-speed equation given for a cast without measured sound speed");
            for (int i = 0; i < n; i++) c[i] = eq.speed(t[i], s[i], p[i], z[i]);
        }
        CastQc.Result qc = CastQc.apply(new CastQc.Columns(z, p, t, s, c), settings);
        CastQc.Columns b = qc.binned();
        double[] bz = b.depth(), bp = b.pressure();
        boolean binned = Double.isFinite(settings.binStep()) && settings.binStep() > 0;
        for (int i = 0; i < bz.length; i++) {
            // a bin is labelled with its centre depth, so its pressure is that depth's (not the samples' mean)
            if (binned || Double.isNaN(bp[i])) bp[i] = PressureDepth.pressure(bz[i], lat);
        }
        if (!measured) {
            rangeSummary(eq, b).ifPresent(warnings::add);
        }
        warnings.addAll(qc.notes());
        SoundSpeedProfile profile = new SoundSpeedProfile(bz, b.soundSpeed(), warnings);
        return new DerivedProfile(bz, bp, b.temperature(), b.salinity(), b.soundSpeed(), profile,
                qc.rejections(), warnings, measured ? null : eq, lat);
    }

    /**
     * One warning summarising the samples outside the equation's validity range: the validity range
     * is a box, so judging each variable's extremes is the same as judging every sample.
     */
    static java.util.Optional<String> rangeSummary(SoundSpeedEquation eq, CastQc.Columns b) {
        int outside = 0;
        double[] t = b.temperature(), s = b.salinity(), p = b.pressure(), z = b.depth();
        double tMin = Double.POSITIVE_INFINITY, tMax = Double.NEGATIVE_INFINITY, sMin = tMin, sMax = tMax,
                pMax = tMax, zMax = tMax;
        for (int i = 0; i < t.length; i++) {
            if (eq.rangeWarning(t[i], s[i], p[i], z[i]).isPresent()) outside++;
            tMin = Math.min(tMin, t[i]); tMax = Math.max(tMax, t[i]);
            sMin = Math.min(sMin, s[i]); sMax = Math.max(sMax, s[i]);
            pMax = Math.max(pMax, p[i]); zMax = Math.max(zMax, z[i]);
        }
        if (outside == 0) return java.util.Optional.empty();
        return java.util.Optional.of(String.format(Locale.ROOT,
                "%s is used outside its stated validity range (%s) in %d of %d profile samples: cast has T %.2f..%.2f deg C, S %.2f..%.2f, p up to %.1f dbar, depth up to %.1f m",
                eq.title(), eq.validityRange(), outside, t.length, tMin, tMax, sMin, sMax, pMax, zMax));
    }
}
