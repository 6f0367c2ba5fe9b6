package org.leadline.surface;

import org.apache.sis.metadata.iso.citation.Citations;
import org.apache.sis.referencing.CRS;
import org.apache.sis.referencing.CommonCRS;
import org.apache.sis.referencing.IdentifiedObjects;
import org.apache.sis.referencing.crs.AbstractCRS;
import org.apache.sis.referencing.cs.AxesConvention;
import org.opengis.referencing.IdentifiedObject;
import org.opengis.referencing.crs.CoordinateReferenceSystem;
import org.opengis.referencing.crs.GeographicCRS;
import org.opengis.referencing.crs.ProjectedCRS;
import org.opengis.referencing.operation.MathTransform;
import org.opengis.referencing.operation.NoninvertibleTransformException;
import org.opengis.referencing.operation.TransformException;
import org.opengis.util.FactoryException;

import java.util.Arrays;
import java.util.Locale;
import java.util.Map;
import java.util.stream.IntStream;

/**
 * The map projection of a survey: WGS84 latitude/longitude to the easting/northing of a projected
 * coordinate reference system, and back, done by Apache SIS.
 *
 * <p>The automatic choice is the WGS84 Universal Transverse Mercator zone that holds the median
 * position of the data, or the Universal Polar Stereographic projection north of 84°N and south of
 * 80°S (NGA.SIG.0012, "The Universal Grids and the Transverse Mercator and Polar Stereographic Map
 * Projections", 2014; chosen by SIS {@code CommonCRS.WGS84.universal}). Agreement with PROJ
 * (pyproj 3.4.1, PROJ 9.1.1) over a committed table of points in several zones of both hemispheres
 * and both polar caps is better than 1 mm each way (measured: 0.0007 mm forward, 0.015 mm inverse;
 * docs/science/crs.md).
 *
 * <p>Axis order: the arrays are always (latitude, longitude) in degrees on the geographic side and
 * (easting, northing) in metres on the projected side, whatever the axis order the EPSG register
 * gives the projected CRS (the transform is built for the right-handed form of the CRS).
 * {@link #crs()} is the CRS as registered, with its EPSG identifier, for writing into files.
 *
 * <p>WGS84 UTM (EPSG 32601-32660, 32701-32760) and UPS (EPSG 5041, 5042, 32661, 32761) codes work without the
 * EPSG database; any other EPSG code needs the optional EPSG data set (build with {@code -Pepsg}).
 *
 * <pre>{@code
 * MapProjection p = MapProjection.parse("auto", lat, lon);   // or "EPSG:32631"
 * p.forward(lat, lon, easting, northing);                      // bulk, metres
 * }</pre>
 *
 * Instances are immutable and thread-safe.
 */
public final class MapProjection {
    /** Points per call into the SIS transform: keeps the packed buffers small and in cache. */
    private static final int CHUNK = 8192;

    private final CoordinateReferenceSystem crs;
    private final String code;
    private final MathTransform toProjected;
    private final MathTransform toGeographic;
    /** Krüger-series fast path for WGS84 UTM zones (checked against SIS when built); null otherwise. */
    private final KruegerUtm fast;

    private MapProjection(CoordinateReferenceSystem crs) throws FactoryException {
        this.crs = crs;
        var id = IdentifiedObjects.getIdentifier(crs, Citations.EPSG);
        Integer epsg = id != null ? null : IdentifiedObjects.lookupEPSG(crs);
        this.code = id != null ? "EPSG:" + id.getCode() : epsg != null ? "EPSG:" + epsg : IdentifiedObjects.getIdentifierOrName(crs);
        GeographicCRS geographic = CommonCRS.WGS84.geographic();        // axes: latitude, longitude
        CoordinateReferenceSystem rightHanded =
                AbstractCRS.castOrCopy(crs).forConvention(AxesConvention.RIGHT_HANDED); // easting, northing
        this.toProjected = CRS.findOperation(geographic, rightHanded, null).getMathTransform();
        try {
            this.toGeographic = toProjected.inverse();
        } catch (NoninvertibleTransformException e) {
            throw new IllegalArgumentException(code + " has no inverse projection: " + e.getMessage(), e);
        }
        this.fast = checkedSeries(code, toProjected);
    }

    /**
     * The Krüger series for a WGS84 UTM code (EPSG 32601-32660 north, 32701-32760 south), if it
     * agrees with SIS to 1 micrometre at points across the zone and beyond it (latitudes -80 to
     * 84, up to 14 degrees from the central meridian); null for other codes or any disagreement.
     */
    private static KruegerUtm checkedSeries(String code, MathTransform sis) {
        if (!code.matches("EPSG:32[67](0[1-9]|[1-5][0-9]|60)")) return null;
        int zone = Integer.parseInt(code.substring(8));
        KruegerUtm k = new KruegerUtm(zone, code.charAt(7) == '7');
        double lon0 = 6.0 * zone - 183.0;
        double[] p = new double[2], q = new double[2];
        for (double lat : new double[] {-80, -45.5, -10.25, -0.001, 0, 0.001, 10.25, 45.5, 66.6, 84}) {
            for (double dl : new double[] {-14, -9, -3.01, -0.5, 0, 0.5, 2.99, 9, 14}) {
                p[0] = lat;
                p[1] = lon0 + dl;
                try {
                    sis.transform(p, 0, p, 0, 1);
                } catch (TransformException e) {
                    return null;
                }
                if (!k.forward(lat, lon0 + dl, q) || !(Math.abs(q[0] - p[0]) < 1e-6 && Math.abs(q[1] - p[1]) < 1e-6)) {
                    return null;
                }
            }
        }
        return k;
    }

    /** {@link #forward} by SIS alone (tests compare the series with it). */
    void forwardBySis(double[] lat, double[] lon, double[] easting, double[] northing) {
        run(toProjected, lat, lon, easting, northing);
    }

    /** Whether the bulk forward projection uses the Krüger series (a WGS84 UTM zone). */
    boolean usesSeries() { return fast != null; }

    /**
     * The WGS84 UTM zone (or UPS cap) for data at these positions, chosen at the median latitude and
     * median longitude (NaN ignored; longitudes that straddle the antimeridian are unwrapped first).
     *
     * @param lat latitudes, degrees
     * @param lon longitudes, degrees
     * @throws IllegalArgumentException when there is no finite position
     */
    public static MapProjection utmFor(double[] lat, double[] lon) {
        double mLat = median(lat, false);
        double mLon = median(lon, true);
        if (Double.isNaN(mLat) || Double.isNaN(mLon)) {
            throw new IllegalArgumentException("cannot choose a UTM zone: no finite latitude/longitude in the data");
        }
        if (mLat < -90 || mLat > 90) {
            throw new IllegalArgumentException("cannot choose a UTM zone: median latitude " + mLat + " is not in [-90, 90] degrees");
        }
        try {
            return new MapProjection(CommonCRS.WGS84.universal(mLat, mLon));
        } catch (FactoryException e) {
            throw new IllegalStateException("Apache SIS could not build the UTM/UPS projection at "
                    + mLat + ", " + mLon + ": " + e.getMessage(), e);
        }
    }

    /**
     * The projected CRS of an EPSG code such as {@code "EPSG:32631"}.
     *
     * @throws IllegalArgumentException when the code is malformed, unknown, needs the EPSG database
     *         that this build does not carry, or is not a projected CRS
     */
    public static MapProjection forCode(String code) {
        String c = code == null ? "" : code.trim();
        if (!c.toUpperCase(Locale.ROOT).matches("EPSG:\\d+")) {
            throw new IllegalArgumentException("expected a CRS as EPSG:N (for example EPSG:32631) or auto, found '" + code + "'");
        }
        c = "EPSG:" + c.substring(5);
        CoordinateReferenceSystem crs;
        try {
            crs = CRS.forCode(c);
        } catch (FactoryException | RuntimeException e) {
            if (c.equals("EPSG:32661") || c.equals("EPSG:32761")) {
                return withoutRegister(upsNorthingFirst(c.equals("EPSG:32661")));
            }
            throw new IllegalArgumentException("cannot resolve " + c + ": this build knows only the WGS84 UTM codes "
                    + "(EPSG:32601-32660, EPSG:32701-32760) and UPS (EPSG:5041, 5042, 32661, 32761) without the EPSG database. "
                    + "Use --crs auto or one of those, or rebuild with the optional EPSG data set "
                    + "(mvn -Pepsg package; see docs/science/crs.md). Cause: " + e.getMessage(), e);
        }
        if (!(crs instanceof ProjectedCRS)) {
            throw new IllegalArgumentException(c + " is not a projected CRS (found " + crs.getName().getCode()
                    + "); a depth surface needs easting/northing in metres, for example a UTM zone");
        }
        try {
            return new MapProjection(crs);
        } catch (FactoryException e) {
            throw new IllegalArgumentException("cannot find a transformation from WGS84 to " + c + ": " + e.getMessage(), e);
        }
    }

    private static MapProjection withoutRegister(CoordinateReferenceSystem crs) {
        try {
            return new MapProjection(crs);
        } catch (FactoryException e) {
            throw new IllegalStateException("Apache SIS could not build " + crs.getName() + ": " + e.getMessage(), e);
        }
    }

    /**
     * EPSG:32661 / 32761, "WGS 84 / UPS North (N,E)" and "South (N,E)": the same projection as SIS's
     * built-in EPSG:5041 / 5042 (axes E,N) with the axis order the EPSG register gives these older
     * codes (northing first). Built here because SIS knows only the (E,N) codes without the EPSG
     * database; the projection itself (UPS, k0 = 0.994, false easting/northing 2 000 000 m) is SIS's.
     */
    private static ProjectedCRS upsNorthingFirst(boolean north) {
        ProjectedCRS en = (ProjectedCRS) CommonCRS.WGS84.universal(north ? 90 : -90, 0);
        var cs = en.getCoordinateSystem();
        var axes = new org.apache.sis.referencing.cs.DefaultCartesianCS(
                Map.of(IdentifiedObject.NAME_KEY, "Cartesian 2D CS. Axes: northing, easting (N,E)"),
                cs.getAxis(1), cs.getAxis(0));
        String name = "WGS 84 / UPS " + (north ? "North" : "South") + " (N,E)";
        Map<String, Object> props = Map.of(IdentifiedObject.NAME_KEY, name,
                IdentifiedObject.IDENTIFIERS_KEY, new org.apache.sis.referencing.ImmutableIdentifier(
                        Citations.EPSG, "EPSG", north ? "32661" : "32761"));
        var conversion = new org.apache.sis.referencing.operation.DefaultConversion(
                Map.of(IdentifiedObject.NAME_KEY, "Universal Polar Stereographic " + (north ? "North" : "South")),
                en.getConversionFromBase().getMethod(), null, en.getConversionFromBase().getParameterValues());
        return new org.apache.sis.referencing.crs.DefaultProjectedCRS(props, en.getBaseCRS(), conversion, axes);
    }

    /**
     * {@code "auto"} (case-insensitive, or null/blank) for {@link #utmFor}, otherwise {@link #forCode}.
     *
     * @param spec "auto" or "EPSG:N"
     * @param lat  latitudes of the data, degrees (used only for "auto")
     * @param lon  longitudes of the data, degrees (used only for "auto")
     */
    public static MapProjection parse(String spec, double[] lat, double[] lon) {
        if (spec == null || spec.isBlank() || spec.trim().equalsIgnoreCase("auto")) {
            return utmFor(lat, lon);
        }
        return forCode(spec);
    }

    /** The projected CRS as registered (with its EPSG identifier). */
    public CoordinateReferenceSystem crs() { return crs; }

    /** The EPSG code as {@code "EPSG:32631"}. */
    public String code() { return code; }

    /** The CRS name, for example {@code "WGS 84 / UTM zone 31N"}. */
    public String name() { return crs.getName().getCode(); }

    /**
     * WGS84 latitude/longitude to easting/northing, in bulk. Positions that cannot be projected
     * give NaN. Output arrays may be the input arrays.
     *
     * @param lat      latitudes, degrees
     * @param lon      longitudes, degrees
     * @param easting  out: eastings, m
     * @param northing out: northings, m
     */
    public void forward(double[] lat, double[] lon, double[] easting, double[] northing) {
        if (fast == null) {
            run(toProjected, lat, lon, easting, northing);
            return;
        }
        int n = lat.length;
        if (lon.length != n || easting.length < n || northing.length < n) {
            throw new IllegalArgumentException("coordinate arrays differ in length: " + lat.length + ", " + lon.length
                    + " in, " + easting.length + ", " + northing.length + " out");
        }
        int chunks = (n + CHUNK - 1) / CHUNK;
        IntStream range = IntStream.range(0, chunks);
        (chunks > 4 ? range.parallel() : range).forEach(k -> {
            double[] q = new double[2];
            for (int i = k * CHUNK, end = Math.min(n, (k + 1) * CHUNK); i < end; i++) {
                if (fast.forward(lat[i], lon[i], q)) {
                    easting[i] = q[0];
                    northing[i] = q[1];
                } else { // far from the zone, a pole or not a number: SIS decides
                    q[0] = lat[i];
                    q[1] = lon[i];
                    transformPoint(toProjected, q);
                    easting[i] = q[0];
                    northing[i] = q[1];
                }
            }
        });
    }

    /**
     * Easting/northing to WGS84 latitude/longitude, in bulk. Output arrays may be the input arrays.
     *
     * @param easting  eastings, m
     * @param northing northings, m
     * @param lat      out: latitudes, degrees
     * @param lon      out: longitudes, degrees
     */
    public void inverse(double[] easting, double[] northing, double[] lat, double[] lon) {
        run(toGeographic, easting, northing, lat, lon);
    }

    /** One position: {easting, northing} in metres from latitude, longitude in degrees. */
    public double[] forward(double lat, double lon) {
        double[] e = new double[1], n = new double[1];
        forward(new double[] {lat}, new double[] {lon}, e, n);
        return new double[] {e[0], n[0]};
    }

    /** One position: {latitude, longitude} in degrees from easting, northing in metres. */
    public double[] inverse(double easting, double northing) {
        double[] la = new double[1], lo = new double[1];
        inverse(new double[] {easting}, new double[] {northing}, la, lo);
        return new double[] {la[0], lo[0]};
    }

    @Override
    public String toString() { return code + " (" + name() + ")"; }

    private static void run(MathTransform mt, double[] a, double[] b, double[] outA, double[] outB) {
        int n = a.length;
        if (b.length != n || outA.length < n || outB.length < n) {
            throw new IllegalArgumentException("coordinate arrays differ in length: " + a.length + ", " + b.length
                    + " in, " + outA.length + ", " + outB.length + " out");
        }
        int chunks = (n + CHUNK - 1) / CHUNK;
        // SIS math transforms are immutable and thread-safe, so chunks may run on several cores.
        IntStream range = IntStream.range(0, chunks);
        (chunks > 4 ? range.parallel() : range).forEach(k -> {
            int start = k * CHUNK;
            int m = Math.min(CHUNK, n - start);
            double[] buf = new double[2 * m];
            for (int i = 0; i < m; i++) {
                buf[2 * i] = a[start + i];
                buf[2 * i + 1] = b[start + i];
            }
            try {
                mt.transform(buf, 0, buf, 0, m);
            } catch (TransformException e) {
                // A point outside the projection's domain fails the whole call; redo the chunk point by point.
                pointByPoint(mt, a, b, start, m, buf);
            }
            for (int i = 0; i < m; i++) {
                outA[start + i] = buf[2 * i];
                outB[start + i] = buf[2 * i + 1];
            }
        });
    }

    /** One point in place; NaN where the transform refuses it (outside its domain). */
    private static void transformPoint(MathTransform mt, double[] p) {
        try {
            mt.transform(p, 0, p, 0, 1);
        } catch (TransformException e) {
            p[0] = p[1] = Double.NaN;
        }
    }

    private static void pointByPoint(MathTransform mt, double[] a, double[] b, int start, int m, double[] buf) {
        double[] p = new double[2];
        for (int i = 0; i < m; i++) {
            p[0] = a[start + i];
            p[1] = b[start + i];
            transformPoint(mt, p);
            buf[2 * i] = p[0];
            buf[2 * i + 1] = p[1];
        }
    }

    /**
     * Median of the finite values; for longitudes, unwraps across the antimeridian first. A swath
     * day repeats each ping's position for all its beams, so the values are first collapsed into
     * runs of equal neighbours and only the distinct values are sorted (with their counts); the
     * result is exactly that of sorting every value ({@link #medianBySort}), to which data without
     * such repeats fall back.
     */
    static double median(double[] v, boolean longitude) {
        int n = v.length;
        double[] runValue = new double[Math.max(16, n / 8)];
        int[] runCount = new int[runValue.length];
        int runs = 0, finite = 0;
        long last = 0;
        for (int i = 0; i < n; i++) {
            double x = v[i];
            if (!Double.isFinite(x)) continue;
            finite++;
            long bits = Double.doubleToRawLongBits(x);
            if (runs > 0 && bits == last) { runCount[runs - 1]++; continue; }
            if (runs == runValue.length) return medianBySort(v, longitude);   // few repeats: sort everything
            runValue[runs] = x;
            runCount[runs++] = 1;
            last = bits;
        }
        if (finite == 0) return Double.NaN;
        if (longitude) for (int r = 0; r < runs; r++) runValue[r] = wrap(runValue[r]);
        // distinct values in Arrays.sort order (-0.0 before 0.0) and how many of each
        double[] distinct = Arrays.copyOf(runValue, runs);
        Arrays.parallelSort(distinct);
        int d = 0;
        for (int r = 0; r < runs; r++) {
            if (d == 0 || Double.compare(distinct[r], distinct[d - 1]) != 0) distinct[d++] = distinct[r];
        }
        distinct = Arrays.copyOf(distinct, d);
        long[] count = new long[d];
        for (int r = 0; r < runs; r++) count[Arrays.binarySearch(distinct, runValue[r])] += runCount[r];
        int cut = 0;   // first distinct value of the data's inside (longitudes): as medianBySort's cut
        if (longitude) {
            double gap = distinct[0] + 360 - distinct[d - 1];
            for (int j = 1; j < d; j++) {
                if (distinct[j] - distinct[j - 1] > gap) { gap = distinct[j] - distinct[j - 1]; cut = j; }
            }
        }
        // the sorted (unwrapped) order is distinct[cut..d) then distinct[0..cut) + 360
        int h = finite / 2;
        double hi = nth(distinct, count, cut, h);
        double m = finite % 2 == 1 ? hi : 0.5 * (nth(distinct, count, cut, h - 1) + hi);
        return longitude ? wrap(m) : m;
    }

    /** The k-th (from 0) value of the sorted, unwrapped order described in {@link #median}. */
    private static double nth(double[] distinct, long[] count, int cut, long k) {
        int d = distinct.length;
        for (int j = 0; j < d; j++) {
            int at = (cut + j) % d;
            if (k < count[at]) return at < cut ? distinct[at] + 360 : distinct[at];
            k -= count[at];
        }
        throw new IllegalStateException("median position beyond the data");
    }

    /** The median by sorting every finite value (the definition {@link #median} reproduces). */
    static double medianBySort(double[] v, boolean longitude) {
        double[] f = Arrays.stream(v).filter(Double::isFinite).toArray();
        if (f.length == 0) return Double.NaN;
        if (longitude) {
            for (int i = 0; i < f.length; i++) f[i] = wrap(f[i]);
            Arrays.parallelSort(f); // same order as Arrays.sort; a swath day has tens of millions of positions
            // Largest gap between sorted longitudes (including the wrap-around one) marks the data's outside.
            int cut = 0;
            double gap = f[0] + 360 - f[f.length - 1];
            for (int i = 1; i < f.length; i++) {
                if (f[i] - f[i - 1] > gap) { gap = f[i] - f[i - 1]; cut = i; }
            }
            for (int i = 0; i < cut; i++) f[i] += 360;
        }
        Arrays.parallelSort(f);
        int h = f.length / 2;
        double m = f.length % 2 == 1 ? f[h] : 0.5 * (f[h - 1] + f[h]);
        return longitude ? wrap(m) : m;
    }

    private static double wrap(double lon) {
        double w = ((lon + 180) % 360 + 360) % 360 - 180;
        return w;
    }
}
