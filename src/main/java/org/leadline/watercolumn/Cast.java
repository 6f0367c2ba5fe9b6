package org.leadline.watercolumn;

import java.util.Arrays;

/**
 * One cast as measured: metadata plus columnar samples in recording order (soak, downcast and
 * upcast all included; {@link CastQc} chooses). A column the file did not have is all NaN; a
 * missing value inside a present column is NaN.
 *
 * @param name             cast name (from {@code # name:} or the file name)
 * @param time             UTC seconds since the epoch, or NaN when not given
 * @param latitude         degrees north, or NaN when not given
 * @param longitude        degrees east, or NaN when not given
 * @param temperatureScale scale of {@code temperature}
 * @param source           where the cast came from (a path), for lineage and messages
 * @param depth            m, positive down
 * @param pressure         sea pressure, dbar
 * @param temperature      in-situ temperature, deg C, on {@code temperatureScale}
 * @param salinity         practical salinity (PSS-78)
 * @param conductivity     mS/cm
 * @param soundSpeed       sound speed measured directly (velocimeter), m/s
 */
public record Cast(String name, double time, double latitude, double longitude, TemperatureScale temperatureScale,
                   String source, double[] depth, double[] pressure, double[] temperature, double[] salinity,
                   double[] conductivity, double[] soundSpeed) {

    /** Temperature scale of a cast's temperature column. */
    public enum TemperatureScale {
        ITS_90("ITS-90"), ITS_68("ITS-68");
        private final String label;
        TemperatureScale(String label) { this.label = label; }
        public String label() { return label; }

        /** {@code ITS-90} or {@code ITS-68} (also IPTS-68, T90, T68), case-insensitive. */
        public static TemperatureScale parse(String s) {
            String n = s.trim().toUpperCase(java.util.Locale.ROOT).replace("_", "-").replace(" ", "");
            return switch (n) {
                case "ITS-90", "ITS90", "T90" -> ITS_90;
                case "ITS-68", "ITS68", "IPTS-68", "IPTS68", "T68" -> ITS_68;
                default -> throw new IllegalArgumentException("expected ITS-90 or ITS-68, found '" + s + "'");
            };
        }
    }

    public Cast {
        if (name == null) name = "";
        if (temperatureScale == null) temperatureScale = TemperatureScale.ITS_90;
        int n = depth.length;
        for (double[] c : new double[][]{pressure, temperature, salinity, conductivity, soundSpeed}) {
            if (c.length != n) throw new IllegalArgumentException("cast columns differ in length: " + n + " and " + c.length);
        }
        depth = depth.clone();
        pressure = pressure.clone();
        temperature = temperature.clone();
        salinity = salinity.clone();
        conductivity = conductivity.clone();
        soundSpeed = soundSpeed.clone();
    }

    /** A column of n NaN values, for absent columns. */
    public static double[] absent(int n) {
        double[] a = new double[n];
        Arrays.fill(a, Double.NaN);
        return a;
    }

    public int size() { return depth.length; }

    @Override public double[] depth() { return depth.clone(); }
    @Override public double[] pressure() { return pressure.clone(); }
    @Override public double[] temperature() { return temperature.clone(); }
    @Override public double[] salinity() { return salinity.clone(); }
    @Override public double[] conductivity() { return conductivity.clone(); }
    @Override public double[] soundSpeed() { return soundSpeed.clone(); }

    /** Temperature converted to ITS-90, deg C. */
    public double[] temperatureIts90() {
        double[] t = temperature.clone();
        if (temperatureScale == TemperatureScale.ITS_68) {
            for (int i = 0; i < t.length; i++) t[i] = Temperature.its68ToIts90(t[i]);
        }
        return t;
    }

    public boolean hasDepth() { return anyFinite(depth); }
    public boolean hasPressure() { return anyFinite(pressure); }
    public boolean hasTemperature() { return anyFinite(temperature); }
    public boolean hasSalinity() { return anyFinite(salinity); }
    public boolean hasConductivity() { return anyFinite(conductivity); }
    public boolean hasSoundSpeed() { return anyFinite(soundSpeed); }

    private static boolean anyFinite(double[] a) {
        for (double v : a) if (Double.isFinite(v)) return true;
        return false;
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof Cast c && name.equals(c.name) && Double.compare(time, c.time) == 0
                && Double.compare(latitude, c.latitude) == 0 && Double.compare(longitude, c.longitude) == 0
                && temperatureScale == c.temperatureScale && java.util.Objects.equals(source, c.source)
                && Arrays.equals(depth, c.depth) && Arrays.equals(pressure, c.pressure)
                && Arrays.equals(temperature, c.temperature) && Arrays.equals(salinity, c.salinity)
                && Arrays.equals(conductivity, c.conductivity) && Arrays.equals(soundSpeed, c.soundSpeed);
    }

    @Override
    public int hashCode() {
        return java.util.Objects.hash(name, time, latitude, longitude, temperatureScale, source, Arrays.hashCode(depth));
    }

    @Override
    public String toString() {
        return "Cast[" + name + ", " + depth.length + " samples, lat " + latitude + ", lon " + longitude + "]";
    }
}
