package org.leadline.watercolumn;

import java.util.List;

/**
 * A cast turned into a sound-speed profile: columnar values after QC, binning and extension,
 * the profile itself, and what was rejected or warned about on the way.
 *
 * @param depth       m, strictly increasing
 * @param pressure    sea pressure, dbar
 * @param temperature in-situ temperature, deg C, ITS-90 (NaN for a velocimeter cast without it)
 * @param salinity    practical salinity (NaN when not measured)
 * @param soundSpeed  m/s
 * @param profile     the piecewise-linear profile over depth and soundSpeed, carrying the warnings
 * @param rejections  input samples not used, with reasons
 * @param warnings    validity-range, latitude and extension warnings (also on {@code profile})
 * @param equation    the equation used, or null when the cast measured sound speed directly
 * @param latitude    latitude used for pressure and depth, degrees
 */
public record DerivedProfile(double[] depth, double[] pressure, double[] temperature, double[] salinity,
                             double[] soundSpeed, SoundSpeedProfile profile, List<CastQc.Rejection> rejections,
                             List<String> warnings, SoundSpeedEquation equation, double latitude) {
    public DerivedProfile {
        rejections = List.copyOf(rejections);
        warnings = List.copyOf(warnings);
    }

    public int size() { return depth.length; }
}
