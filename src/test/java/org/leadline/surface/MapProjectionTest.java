package org.leadline.surface;

import org.junit.jupiter.api.Test;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

class MapProjectionTest {
    /** Metres per degree of latitude, near enough to turn an angular error into a distance for a 1 mm test. */
    private static final double M_PER_DEG = 111_320;

    record Ref(String code, double lat, double lon, double e, double n) {}

    /** PROJ 9.1.1 via pyproj 3.4.1: src/test/resources/reference/pyproj-utm.csv (scripts/reference/make_pyproj_table.py). */
    static List<Ref> pyprojTable() throws IOException {
        return table("/reference/pyproj-utm.csv");
    }

    static List<Ref> table(String resource) throws IOException {
        List<Ref> refs = new ArrayList<>();
        try (BufferedReader r = new BufferedReader(new InputStreamReader(
                MapProjectionTest.class.getResourceAsStream(resource), StandardCharsets.UTF_8))) {
            String line;
            boolean header = true;
            while ((line = r.readLine()) != null) {
                if (line.startsWith("#") || line.isBlank()) continue;
                if (header) { header = false; continue; }
                String[] f = line.split(",");
                refs.add(new Ref(f[0], Double.parseDouble(f[1]), Double.parseDouble(f[2]),
                        Double.parseDouble(f[3]), Double.parseDouble(f[4])));
            }
        }
        return refs;
    }

    @Test
    void agreesWithPyprojWithinOneMillimetreBothWays() throws IOException {
        List<Ref> refs = pyprojTable();
        assertThat(refs).hasSizeGreaterThanOrEqualTo(100);
        Map<String, List<Ref>> byCode = new LinkedHashMap<>();
        for (Ref r : refs) byCode.computeIfAbsent(r.code(), k -> new ArrayList<>()).add(r);
        assertThat(byCode).containsKeys("EPSG:32631", "EPSG:32734", "EPSG:32661", "EPSG:32761", "EPSG:5041", "EPSG:5042");
        double maxForward = 0, maxInverse = 0;
        for (var entry : byCode.entrySet()) {
            MapProjection p = MapProjection.forCode(entry.getKey());
            assertThat(p.code()).isEqualTo(entry.getKey());
            List<Ref> rs = entry.getValue();
            int n = rs.size();
            double[] lat = new double[n], lon = new double[n], e = new double[n], no = new double[n];
            for (int i = 0; i < n; i++) { lat[i] = rs.get(i).lat(); lon[i] = rs.get(i).lon(); e[i] = rs.get(i).e(); no[i] = rs.get(i).n(); }
            double[] pe = new double[n], pn = new double[n], plat = new double[n], plon = new double[n];
            p.forward(lat, lon, pe, pn);
            p.inverse(e, no, plat, plon);
            for (int i = 0; i < n; i++) {
                double df = Math.hypot(pe[i] - e[i], pn[i] - no[i]);
                double di = Math.hypot((plat[i] - lat[i]) * M_PER_DEG,
                        wrap(plon[i] - lon[i]) * M_PER_DEG * Math.cos(Math.toRadians(lat[i])));
                assertThat(df).as("forward %s at %s, %s", entry.getKey(), lat[i], lon[i]).isLessThan(0.001);
                assertThat(di).as("inverse %s at %s, %s", entry.getKey(), e[i], no[i]).isLessThan(0.001);
                maxForward = Math.max(maxForward, df);
                maxInverse = Math.max(maxInverse, di);
            }
        }
        System.out.printf("MapProjection vs pyproj over %d points: max forward %.3e m, max inverse %.3e m%n",
                refs.size(), maxForward, maxInverse);
    }

    private static double wrap(double dLon) { return dLon - 360 * Math.rint(dLon / 360); }

    @Test
    void choosesUtmZoneAndHemisphereFromTheMedianPosition() {
        // Zone = floor((lon + 180) / 6) + 1, north 326zz, south 327zz: worked by hand in this test.
        assertThat(MapProjection.utmFor(new double[] {51.0, 51.1, 51.2}, new double[] {2.9, 3.1, 3.2}).code())
                .isEqualTo("EPSG:32631");
        // Cape Town: 33.9S 18.4E -> zone 34 south.
        assertThat(MapProjection.utmFor(new double[] {-33.9}, new double[] {18.4}).code()).isEqualTo("EPSG:32734");
        // A far outlier does not move the zone: median, not mean.
        assertThat(MapProjection.utmFor(new double[] {43.3, 43.3, 43.3, 0}, new double[] {5.4, 5.4, 5.5, -120}).code())
                .isEqualTo("EPSG:32631");
        // NaN positions are ignored.
        assertThat(MapProjection.utmFor(new double[] {Double.NaN, 40.7}, new double[] {Double.NaN, -74.0}).code())
                .isEqualTo("EPSG:32618");
        // Straddling the antimeridian: 179.9E and 179.9W median stays near 180, zone 60 or 1, not zone 30/31.
        String dateLine = MapProjection.utmFor(new double[] {-17, -17, -17}, new double[] {179.8, 179.9, -179.9}).code();
        assertThat(dateLine).isEqualTo("EPSG:32760");
    }

    @Test
    void choosesUpsBeyondTheUtmLimits() {
        // UTM spans 80S to 84N; beyond, UPS (NGA.SIG.0012, 2014). SIS picks EPSG's (E,N) codes,
        // 5041 north and 5042 south (same projection as 32661/32761, which put northing first).
        assertThat(MapProjection.utmFor(new double[] {85.0}, new double[] {10.0}).code()).isEqualTo("EPSG:5041");
        assertThat(MapProjection.utmFor(new double[] {-81.0}, new double[] {166.0}).code()).isEqualTo("EPSG:5042");
        // Svalbard exception (NGA.SIG.0012, 2014): between 72N and 84N, 9E-21E is zone 33, not 32.
        assertThat(MapProjection.utmFor(new double[] {83.5}, new double[] {10.0}).code()).isEqualTo("EPSG:32633");
        // Southwest Norway exception: 56N-64N, 3E-12E is zone 32, not 31.
        assertThat(MapProjection.utmFor(new double[] {60.0}, new double[] {5.0}).code()).isEqualTo("EPSG:32632");
        // Just outside the exception, 55N 5E stays in zone 31 (zone formula worked by hand).
        assertThat(MapProjection.utmFor(new double[] {55.0}, new double[] {5.0}).code()).isEqualTo("EPSG:32631");
    }

    @Test
    void parsesAutoAndCodes() {
        double[] lat = {-33.9}, lon = {18.4};
        assertThat(MapProjection.parse("auto", lat, lon).code()).isEqualTo("EPSG:32734");
        assertThat(MapProjection.parse("AUTO", lat, lon).code()).isEqualTo("EPSG:32734");
        MapProjection p = MapProjection.parse("epsg:32631", lat, lon);
        assertThat(p.code()).isEqualTo("EPSG:32631");
        assertThat(p.name()).isEqualTo("WGS 84 / UTM zone 31N");
        assertThat(p.crs()).isNotNull();
    }

    @Test
    void rejectsCodesItCannotResolveWithAClearMessage() {
        assertThatThrownBy(() -> MapProjection.forCode("UTM31"))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("EPSG:N");
        assertThatThrownBy(() -> MapProjection.forCode("EPSG:4326"))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("not a projected CRS");
        // British National Grid needs the EPSG data set unless the build carries it.
        if (!epsgDatabasePresent()) {
            assertThatThrownBy(() -> MapProjection.forCode("EPSG:27700"))
                    .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("-Pepsg");
        }
        assertThatThrownBy(() -> MapProjection.forCode("EPSG:999999"))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("EPSG:999999");
    }

    static boolean epsgDatabasePresent() {
        // Resource of org.apache.sis.non-free:sis-embedded-data (added by the -Pepsg profile).
        return MapProjectionTest.class.getResource("/SIS-DATA/Databases/SpatialMetadata/service.properties") != null;
    }

    @Test
    void otherCodesWorkWithTheEpsgDataSet() throws IOException {
        org.junit.jupiter.api.Assumptions.assumeTrue(epsgDatabasePresent(), "EPSG data set not in this build (-Pepsg)");
        // PROJ 9.1.1 via pyproj 3.4.1: src/test/resources/reference/pyproj-epsg.csv
        // (scripts/reference/make_pyproj_epsg_table.py). NZTM 2193 has northing-first axes in EPSG.
        for (Ref r : table("/reference/pyproj-epsg.csv")) {
            MapProjection p = MapProjection.forCode(r.code());
            double[] en = p.forward(r.lat(), r.lon());
            double d = Math.hypot(en[0] - r.e(), en[1] - r.n());
            // British National Grid needs a datum shift: SIS applies the EPSG Helmert transformation
            // (OSGB36 to WGS 84 (6), stated accuracy 2 m); the committed table shows PROJ chose the same
            // operation (no OSTN15 grid in Debian's proj-data), so 1 mm holds for it too. A table regenerated
            // where PROJ has the OSTN15 grid would differ by up to about 2 m for 27700. The other codes
            // share the WGS84 ellipsoid (NZGD2000 to WGS 84 is a null transformation in EPSG).
            double tol = 0.001;
            assertThat(d).as("%s at %s, %s: %s vs %s, %s", r.code(), r.lat(), r.lon(), en[0], en[1], r.e(), r.n())
                    .isLessThan(tol);
            System.out.printf("with EPSG data set: %s differs from pyproj by %.3e m%n", r.code(), d);
        }
    }

    @Test
    void singlePointHelpersMatchBulkAndRoundTrip() {
        MapProjection p = MapProjection.forCode("EPSG:32631");
        // On the central meridian at the equator: easting is the false easting 500 000 m, northing 0
        // (UTM definition, NGA.SIG.0012).
        double[] en = p.forward(0.0, 3.0);
        assertThat(en[0]).isCloseTo(500_000, within(1e-6));
        assertThat(en[1]).isCloseTo(0, within(1e-6));
        double[] back = p.inverse(612_345.6, 5_712_345.6);
        double[] again = p.forward(back[0], back[1]);
        assertThat(again[0]).isCloseTo(612_345.6, within(1e-6));
        assertThat(again[1]).isCloseTo(5_712_345.6, within(1e-6));
    }

    @Test
    void bulkTransformOfAMillionPointsRoundTrips() {
        int n = 1_000_000;
        double[] lat = new double[n], lon = new double[n];
        for (int i = 0; i < n; i++) { lat[i] = 50 + (i % 1000) * 1e-3; lon[i] = 2 + (i / 1000) * 2e-3; }
        MapProjection p = MapProjection.forCode("EPSG:32631");
        double[] e = new double[n], no = new double[n], la = new double[n], lo = new double[n];
        long t0 = System.nanoTime();
        p.forward(lat, lon, e, no);
        long t1 = System.nanoTime();
        p.inverse(e, no, la, lo);
        long t2 = System.nanoTime();
        // Printed for the record only (first pass, JIT not warm; no timed assertion in unit tests).
        System.out.printf("MapProjection: 1e6 points forward %.0f ms, inverse %.0f ms%n", (t1 - t0) / 1e6, (t2 - t1) / 1e6);
        for (int i = 0; i < n; i += 997) {
            assertThat(la[i]).isCloseTo(lat[i], within(1e-9));
            assertThat(lo[i]).isCloseTo(lon[i], within(1e-9));
        }
        // Same easting for the same point whether done in bulk or alone.
        double[] one = p.forward(lat[123_456], lon[123_456]);
        assertThat(one[0]).isEqualTo(e[123_456]);
        assertThat(one[1]).isEqualTo(no[123_456]);
    }

    @Test
    void missingPositionsGiveNaNAndDoNotStopTheRest() {
        MapProjection p = MapProjection.forCode("EPSG:32631");
        double[] lat = {51.0, Double.NaN, 51.0}, lon = {3.0, 3.0, Double.NaN};
        double[] e = new double[3], n = new double[3];
        p.forward(lat, lon, e, n);
        assertThat(e[0]).isCloseTo(500_000, within(1e-6));   // on the central meridian: false easting
        assertThat(e[1]).isNaN();
        assertThat(n[2]).isNaN();
        assertThatThrownBy(() -> p.forward(lat, new double[2], e, n)).isInstanceOf(IllegalArgumentException.class);
    }

    @Test
    void medianLongitudeUnwrapsTheAntimeridian() {
        assertThat(MapProjection.median(new double[] {179.0, -179.0, 179.5}, true)).isCloseTo(179.5, within(1e-12));
        assertThat(MapProjection.median(new double[] {1, 2, 3, 4}, false)).isEqualTo(2.5);
    }

    @Test
    void medianOfRepeatedPositionsIsTheMedianOfEveryValue() {
        // runs of equal values (a ping's position repeated for its beams) take the counted path; it must
        // give exactly the value of sorting everything, NaN, -0.0 and the antimeridian included
        java.util.Random r = new java.util.Random(3);
        for (int trial = 0; trial < 40; trial++) {
            int n = 1 + r.nextInt(5000);
            double[] lat = new double[n], lon = new double[n];
            double centre = trial % 4 == 0 ? 179.95 : -30 + 60 * r.nextDouble();
            for (int i = 0; i < n; ) {
                int run = 1 + r.nextInt(trial % 3 == 0 ? 2 : 300);
                double la = trial % 5 == 0 ? (r.nextBoolean() ? 0.0 : -0.0) : -0.5 + r.nextDouble();
                double lo = centre + 0.2 * r.nextGaussian();
                if (r.nextInt(50) == 0) { la = Double.NaN; lo = Double.NaN; }
                if (trial % 7 == 0) lo = Math.round(lo * 10) / 10.0;   // repeats that are not neighbours
                for (int k = 0; k < run && i < n; k++, i++) { lat[i] = la; lon[i] = lo; }
            }
            assertThat(Double.doubleToRawLongBits(MapProjection.median(lat, false)))
                    .isEqualTo(Double.doubleToRawLongBits(MapProjection.medianBySort(lat, false)));
            assertThat(Double.doubleToRawLongBits(MapProjection.median(lon, true)))
                    .isEqualTo(Double.doubleToRawLongBits(MapProjection.medianBySort(lon, true)));
        }
        assertThat(MapProjection.median(new double[] {Double.NaN}, false)).isNaN();
    }

    @Test
    void kruegerSeriesAgreesWithSisAcrossTheZone() {
        // Karney (2011) puts the 6th-order Krüger series' error at a few nanometres within the UTM
        // zone; here it must agree with SIS to 1 micrometre over 200 000 random points up to 15
        // degrees from the central meridian, in both hemispheres (the bulk path of every reduction)
        java.util.SplittableRandom rnd = new java.util.SplittableRandom(42);
        int n = 200_000;
        double worst = 0;
        for (String code : List.of("EPSG:32630", "EPSG:32701", "EPSG:32660", "EPSG:32717")) {
            MapProjection p = MapProjection.forCode(code);
            assertThat(p.usesSeries()).as(code).isTrue();
            int zone = Integer.parseInt(code.substring(8));
            double lon0 = 6.0 * zone - 183.0;
            double[] lat = new double[n], lon = new double[n];
            for (int i = 0; i < n; i++) {
                lat[i] = -80 + 164 * rnd.nextDouble();
                lon[i] = lon0 - 15 + 30 * rnd.nextDouble();
            }
            lon[0] = Double.NaN;            // not a number: SIS decides (NaN)
            lon[1] = lon0 + 40;             // beyond the series' reach: SIS decides
            double[] e1 = new double[n], n1 = new double[n], e2 = new double[n], n2 = new double[n];
            p.forward(lat, lon, e1, n1);
            p.forwardBySis(lat, lon, e2, n2);
            for (int i = 0; i < n; i++) {
                if (Double.isNaN(e2[i])) {
                    assertThat(e1[i]).isNaN();
                    continue;
                }
                worst = Math.max(worst, Math.max(Math.abs(e1[i] - e2[i]), Math.abs(n1[i] - n2[i])));
            }
            assertThat(Double.compare(e1[1], e2[1])).as("beyond the series: SIS").isZero();
        }
        System.out.printf("Krüger series vs SIS, 800 000 points within 15 deg of the central meridian: max %.3e m%n", worst);
        assertThat(worst).isLessThan(1e-6);
        assertThat(MapProjection.forCode("EPSG:5041").usesSeries()).isFalse(); // UPS: SIS
    }
}
