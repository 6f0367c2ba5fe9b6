package org.leadline.watercolumn;

import org.junit.jupiter.api.Test;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

class ProfileBuilderTest {
    private static Cast cast(double lat, double[] z, double[] p, double[] t, double[] s, double[] c, double[] v) {
        int n = Math.max(z == null ? 0 : z.length, p == null ? 0 : p.length);
        return new Cast("t", Double.NaN, lat, Double.NaN, Cast.TemperatureScale.ITS_90, null,
                z == null ? Cast.absent(n) : z, p == null ? Cast.absent(n) : p, t == null ? Cast.absent(n) : t,
                s == null ? Cast.absent(n) : s, c == null ? Cast.absent(n) : c, v == null ? Cast.absent(n) : v);
    }

    @Test
    void conductivityCastGivesEquationSpeedsAtBinDepths() {
        // samples exactly on whole metres so each 1 m bin holds one sample: the profile values are the equations'
        double lat = 30;
        int n = 21;
        double[] z = new double[n], t = new double[n], cond = new double[n];
        for (int i = 0; i < n; i++) {
            z[i] = i;
            t[i] = 15 - 0.3 * i;
            cond[i] = Pss78.conductivityFromSalinity(34 + 0.05 * i, t[i], PressureDepth.pressure(z[i], lat));
        }
        DerivedProfile d = ProfileBuilder.build(cast(lat, z, null, t, null, cond, null), SoundSpeedEquation.UNESCO,
                Double.NaN, CastQc.Settings.DEFAULTS);
        assertThat(d.size()).isEqualTo(n);
        assertThat(d.latitude()).isEqualTo(30.0);
        for (int i = 0; i < n; i++) {
            assertThat(d.salinity()[i]).isCloseTo(34 + 0.05 * i, within(1e-10));
            assertThat(d.pressure()[i]).isCloseTo(PressureDepth.pressure(i, lat), within(1e-12));
            assertThat(d.soundSpeed()[i]).isCloseTo(SoundSpeedEquation.UNESCO.speed(t[i], 34 + 0.05 * i, d.pressure()[i], i), within(1e-9));
            assertThat(d.profile().speedAt(i)).isEqualTo(d.soundSpeed()[i]);
        }
        // no range warning; only the note that 1 m sampling is too sparse for the spike test
        assertThat(d.warnings()).containsExactly("spike test skipped: samples are 1.00 m apart (it needs 0.5 m or less)");
        assertThat(d.equation()).isEqualTo(SoundSpeedEquation.UNESCO);
    }

    @Test
    void latitudeFallbackAndRangeWarnings() {
        double[] p = {0, 10, 20, 30};
        double[] t = {20, 18, 16, 14};
        double[] s = {5, 8, 12, 20}; // estuarine: below Mackenzie's 25..40
        DerivedProfile d = ProfileBuilder.build(cast(Double.NaN, null, p, t, s, null, null), SoundSpeedEquation.MACKENZIE,
                Double.NaN, CastQc.Settings.DEFAULTS.withBinStep(0).withExtendToDepth(50));
        assertThat(d.latitude()).isEqualTo(45.0);
        assertThat(d.warnings()).anySatisfy(w -> assertThat(w).contains("no latitude").contains("45"));
        assertThat(d.warnings()).anySatisfy(w -> assertThat(w).startsWith("Mackenzie 1981 is used outside its stated validity range")
                .contains("S 25..40").contains("in 5 of 5 profile samples"));
        assertThat(d.warnings()).anySatisfy(w -> assertThat(w).startsWith("extended from"));
        assertThat(d.profile().warnings()).isEqualTo(d.warnings());
        // depth from pressure at 45 deg (UNESCO 1983), and the extension's pressure from its depth
        assertThat(d.depth()[3]).isCloseTo(PressureDepth.depth(30, 45), within(1e-12));
        assertThat(d.depth()[4]).isEqualTo(50.0);
        assertThat(d.pressure()[4]).isCloseTo(PressureDepth.pressure(50, 45), within(1e-9));
        // the caller's latitude is used when the cast has none
        DerivedProfile e = ProfileBuilder.build(cast(Double.NaN, null, p, t, s, null, null), SoundSpeedEquation.UNESCO,
                10, CastQc.Settings.DEFAULTS.withBinStep(0));
        assertThat(e.latitude()).isEqualTo(10.0);
        assertThat(e.warnings()).noneMatch(w -> w.contains("validity range")); // UNESCO covers S 0..40
    }

    @Test
    void measuredSoundSpeedSkipsTheEquation() {
        double[] z = {1, 2, 3};
        double[] v = {1490.0, 1489.5, 1489.25};
        DerivedProfile d = ProfileBuilder.build(cast(50, z, null, null, null, null, v), SoundSpeedEquation.COPPENS,
                Double.NaN, CastQc.Settings.DEFAULTS);
        assertThat(d.equation()).isNull();
        assertThat(d.soundSpeed()).containsExactly(1490.0, 1489.5, 1489.25);
        assertThat(d.temperature()[0]).isNaN();
        assertThat(d.warnings()).noneMatch(w -> w.contains("validity range"))
                .contains("sound speed above 1.0 m held at the shallowest value 1490.000 m/s");
    }
}
