package org.leadline.watercolumn;

/**
 * Conversion between the temperature scales IPTS-68 and ITS-90 over the oceanographic range.
 *
 * <p>Uses the linear relation {@code T68 = 1.00024 T90} recommended for seawater work by Saunders
 * (1990, "The international temperature scale of 1990, ITS-90", WOCE Newsletter 10) and used by
 * TEOS-10 and by Wong and Zhu (1995). Accurate to about 1 mK over -2..40 deg C, far below the
 * accuracy of the equations that consume it. Equations published before 1990 (PSS-78, Chen and
 * Millero 1977, Mackenzie 1981, Coppens 1981) take T68.
 */
public final class Temperature {
    /** T68 / T90 over the oceanographic range (Saunders 1990). */
    public static final double T68_PER_T90 = 1.00024;

    private Temperature() {}

    /** ITS-90 temperature, deg C, from an IPTS-68 temperature, deg C. */
    public static double its68ToIts90(double t68) {
        return t68 / T68_PER_T90;
    }

    /** IPTS-68 temperature, deg C, from an ITS-90 temperature, deg C. */
    public static double its90ToIts68(double t90) {
        return t90 * T68_PER_T90;
    }
}
