package org.leadline.watercolumn;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;

import java.io.BufferedReader;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * Against TEOS-10 GSW (python3-gsw 3.6.16): the committed table
 * src/test/resources/reference/gsw-watercolumn.csv made by scripts/reference/make_gsw_table.py.
 * The largest differences found are printed and recorded in docs/science/watercolumn.md.
 */
class GswReferenceTest {
    record Row(double sp, double t, double p, double lat, double c, double spFromC, double depth, double speed) {}

    static List<Row> rows = new ArrayList<>();

    @BeforeAll
    static void load() throws Exception {
        try (var in = GswReferenceTest.class.getResourceAsStream("/reference/gsw-watercolumn.csv");
             var br = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
            String line;
            boolean header = true;
            while ((line = br.readLine()) != null) {
                if (line.startsWith("#")) continue;
                if (header) { header = false; continue; }
                String[] f = line.split(",");
                rows.add(new Row(Double.parseDouble(f[0]), Double.parseDouble(f[1]), Double.parseDouble(f[2]),
                        Double.parseDouble(f[3]), Double.parseDouble(f[5]), Double.parseDouble(f[6]),
                        Double.parseDouble(f[7]), Double.parseDouble(f[8])));
            }
        }
        assertThat(rows).hasSizeGreaterThanOrEqualTo(200);
    }

    @Test
    void practicalSalinityFromConductivityMatchesGsw() {
        // Same equations (PSS-78 + Hill et al. 1986 as scaled in TEOS-10): agreement to rounding is expected;
        // we require 1e-6 (the brief's 1e-4 with margin) and record the measured maximum.
        double worst = 0;
        for (Row r : rows) {
            double s = Pss78.salinityFromConductivity(r.c, r.t, r.p);
            worst = Math.max(worst, Math.abs(s - r.spFromC));
        }
        System.out.printf(Locale.ROOT, "PSS-78 vs gsw.SP_from_C: max |dS| = %.3g over %d points%n", worst, rows.size());
        assertThat(worst).isLessThan(1e-6);
    }

    @Test
    void depthFromPressureAgreesWithGswWithinTheStandardOceanAssumption() {
        // UNESCO 1983 (Saunders and Fofonoff 1976) assumes a standard ocean (S=35, T=0) and a fitted gravity
        // gradient; TEOS-10 z_from_p integrates the TEOS-10 specific volume of SA=35.16504, CT=0 with the
        // gravity of Moritz 2000 and Saunders' vertical gradient. Both ignore the dynamic height anomaly;
        // their difference grows with pressure to about 1.1 m at 10000 dbar (1.1e-4 relative).
        // Tolerance: 5 mm + 1.2e-4 of the depth.
        double worstAbs = 0, worstRel = 0, worst1000 = 0;
        for (Row r : rows) {
            double d = PressureDepth.depth(r.p, r.lat) - r.depth;
            worstAbs = Math.max(worstAbs, Math.abs(d));
            if (r.p > 0) worstRel = Math.max(worstRel, Math.abs(d) / r.depth);
            if (r.p <= 1000) worst1000 = Math.max(worst1000, Math.abs(d));
            assertThat(Math.abs(d)).as("p=%s lat=%s", r.p, r.lat).isLessThan(0.005 + 1.2e-4 * r.depth);
        }
        System.out.printf(Locale.ROOT, "UNESCO depth vs -gsw.z_from_p: max |dz| = %.4f m (%.3g relative), %.4f m to 1000 dbar%n",
                worstAbs, worstRel, worst1000);
    }

    @Test
    void unescoSoundSpeedAgainstTeos10() {
        // Different equations: Chen-Millero (1977) was fitted to its own laboratory data; TEOS-10 sound speed
        // derives from the Gibbs function (Feistel 2008), whose pressure dependence follows Del Grosso's data.
        // Known disagreement: Chen-Millero is faster at high pressure, by about 0.5-1 m/s in the deep ocean
        // (Dushaw et al. 1993, J. Acoust. Soc. Am. 93, 255; from memory). Stated tolerances, measured maxima
        // printed and kept in docs/science/watercolumn.md:
        //   p <= 50 dbar (survey depths, all waters S 0..40, T -2..35):  0.35 m/s (measured 0.286)
        //   p <= 1000 dbar:                                                0.45 m/s (measured 0.393)
        //   deeper (S >= 30, T <= 5 degC; the worst is S=40 at 10000 dbar): 2.2 m/s (measured 1.972)
        // Part of the near-surface difference is TEOS-10's 75-term fit itself, which departs from the exact
        // Gibbs-function sound speed by up to ~0.09 m/s in warm fresh water outside the oceanographic funnel.
        java.util.TreeMap<Double, Double> worstByP = new java.util.TreeMap<>();
        for (Row r : rows) {
            double d = Math.abs(SoundSpeedEquation.UNESCO.speed(r.t, r.sp, r.p, r.depth) - r.speed);
            worstByP.merge(r.p, d, Math::max);
        }
        System.out.println("UNESCO vs gsw.sound_speed, max |dc| (m/s) by pressure (dbar): " + fmt(worstByP));
        for (Row r : rows) {
            double d = Math.abs(SoundSpeedEquation.UNESCO.speed(r.t, r.sp, r.p, r.depth) - r.speed);
            double tol = r.p <= 50 ? 0.35 : r.p <= 1000 ? 0.45 : 2.2;
            assertThat(d).as("S=%s T=%s p=%s", r.sp, r.t, r.p).isLessThan(tol);
        }
    }

    @Test
    void delGrossoSoundSpeedAgainstTeos10() {
        // Del Grosso 1974 (ITS-90 form, Wong and Zhu 1995) in its validity range (T 0..30, S 30..40): TEOS-10's
        // pressure dependence follows the same sound-speed data, so they agree closely at depth too.
        // Tolerance 0.45 m/s (measured max 0.399 m/s, at S=30, T=5 degC, 5000 dbar; 0.14 m/s near the surface).
        java.util.TreeMap<Double, Double> worstByP = new java.util.TreeMap<>();
        for (Row r : rows) {
            if (SoundSpeedEquation.DEL_GROSSO.rangeWarning(r.t, r.sp, r.p, r.depth).isPresent()) continue;
            double d = Math.abs(SoundSpeedEquation.DEL_GROSSO.speed(r.t, r.sp, r.p, r.depth) - r.speed);
            worstByP.merge(r.p, d, Math::max);
        }
        System.out.println("Del Grosso vs gsw.sound_speed, max |dc| (m/s) by pressure (dbar): " + fmt(worstByP));
        assertThat(java.util.Collections.max(worstByP.values())).isLessThan(0.45);
    }

    private static String fmt(java.util.Map<Double, Double> m) {
        StringBuilder sb = new StringBuilder();
        m.forEach((p, d) -> sb.append(String.format(Locale.ROOT, "%.0f: %.3f; ", p, d)));
        return sb.toString();
    }
}
