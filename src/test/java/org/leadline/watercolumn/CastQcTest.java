package org.leadline.watercolumn;

import org.junit.jupiter.api.Test;

import java.util.ArrayList;
import java.util.List;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/**
 * A synthetic cast, worked by hand in this test: soak (lowered to 5 m, held, raised, then sitting at
 * 0.625 m), a downcast from 0.625 m to 19.875 m in 0.25 m steps, an upcast back to the surface, a
 * +5 m/s spike at 10.125 m and a 45 degC temperature at 15.125 m. Sound speed c = 1480 + 0.5 z m/s.
 */
class CastQcTest {
    static double speed(double z) { return 1480 + 0.5 * z; }

    record Synthetic(CastQc.Columns columns, int downStart, int downEnd, int spike, int hot) {}

    static Synthetic cast() {
        List<Double> z = new ArrayList<>();
        for (double d = 0.5; d <= 5; d += 0.5) z.add(d);          // lowered to the soak depth
        for (int i = 0; i < 10; i++) z.add(5.0);                  // soak
        for (double d = 4.5; d >= 1; d -= 0.5) z.add(d);          // raised again
        for (int i = 0; i < 10; i++) z.add(0.625);                // sitting below the surface
        int downStart = z.size() - 1;                             // the last of those starts the downcast
        int spike = -1, hot = -1;
        for (int i = 1; i <= 77; i++) {
            double d = 0.625 + 0.25 * i;
            if (d == 10.125) spike = z.size();
            if (d == 15.125) hot = z.size();
            z.add(d);
        }
        int downEnd = z.size() - 1;                               // 19.875 m
        for (double d = 19.625; d >= 0.125; d -= 0.25) z.add(d);  // upcast
        int n = z.size();
        double[] depth = new double[n], p = new double[n], t = new double[n], s = new double[n], c = new double[n];
        for (int i = 0; i < n; i++) {
            depth[i] = z.get(i);
            p[i] = 1.01 * depth[i];
            t[i] = 20 - 0.5 * depth[i];
            s[i] = 30 + 0.1 * depth[i];
            c[i] = speed(depth[i]);
        }
        c[spike] += 5;
        t[hot] = 45;
        return new Synthetic(new CastQc.Columns(depth, p, t, s, c), downStart, downEnd, spike, hot);
    }

    @Test
    void keepsTheDowncastRejectsSpikeAndBins() {
        Synthetic syn = cast();
        CastQc.Result r = CastQc.apply(syn.columns(), CastQc.Settings.DEFAULTS);
        assertThat(r.downcastStart()).isEqualTo(syn.downStart());
        assertThat(r.downcastEnd()).isEqualTo(syn.downEnd());
        int n = syn.columns().size();
        for (CastQc.Rejection j : r.rejections()) {
            if (j.index() < syn.downStart()) assertThat(j.reason()).isEqualTo("soak before the downcast");
            else if (j.index() > syn.downEnd()) assertThat(j.reason()).isEqualTo("upcast");
        }
        // every soak and upcast sample, the spike and the hot sample: nothing else
        assertThat(r.rejections()).hasSize(syn.downStart() + (n - 1 - syn.downEnd()) + 2);
        // running median of 7 around the spike, worked by hand: speeds at 9.375..10.875 m are 1484.6875, 1484.8125,
        // 1484.9375, (1490.0625), 1485.1875, 1485.3125, 1485.4375: median 1485.1875, departure 4.875 m/s
        assertThat(r.rejections()).filteredOn(j -> j.index() == syn.spike()).singleElement()
                .satisfies(j -> assertThat(j.reason()).startsWith("spike: sound speed 1490.063 m/s departs 4.875 m/s from the running median 1485.188 m/s"));
        assertThat(r.rejections()).filteredOn(j -> j.index() == syn.hot()).singleElement()
                .satisfies(j -> assertThat(j.reason()).isEqualTo("temperature 45.000 deg C outside -2..40"));

        CastQc.Columns b = r.binned();
        // bins of 1 m centred on whole metres: 1..20 (0.625 falls in bin 1)
        assertThat(b.depth()).hasSize(20);
        assertThat(b.depth()[0]).isEqualTo(1.0);
        assertThat(b.depth()[19]).isEqualTo(20.0);
        // bin 1 = {0.625, 0.875, 1.125, 1.375}: mean depth 1.0 -> 1480.5 m/s
        assertThat(b.soundSpeed()[0]).isCloseTo(1480.5, within(1e-9));
        // bin 5 = {4.625, 4.875, 5.125, 5.375}: 1482.5
        assertThat(b.soundSpeed()[4]).isCloseTo(1482.5, within(1e-9));
        // bin 10 lost its 10.125 m spike: {9.625, 9.875, 10.375}, mean depth 9.958333 -> 1484.9791667
        assertThat(b.soundSpeed()[9]).isCloseTo(1480 + 0.5 * (9.625 + 9.875 + 10.375) / 3, within(1e-9));
        assertThat(b.temperature()[9]).isCloseTo(20 - 0.5 * (9.625 + 9.875 + 10.375) / 3, within(1e-9));
        // bin 15 lost its hot sample: {14.625, 14.875, 15.375}
        assertThat(b.soundSpeed()[14]).isCloseTo(1480 + 0.5 * (14.625 + 14.875 + 15.375) / 3, within(1e-9));
        // bin 20 = {19.625, 19.875}: mean depth 19.75 -> 1489.875
        assertThat(b.soundSpeed()[19]).isCloseTo(1489.875, within(1e-9));
        assertThat(r.notes()).containsExactly("sound speed above 1.0 m held at the shallowest value 1480.500 m/s");
    }

    @Test
    void extendsToARequestedDepthAndSaysHow() {
        CastQc.Result r = CastQc.apply(cast().columns(), CastQc.Settings.DEFAULTS.withExtendToDepth(40));
        CastQc.Columns b = r.binned();
        assertThat(b.depth()).hasSize(21);
        assertThat(b.depth()[20]).isEqualTo(40.0);
        assertThat(b.soundSpeed()[20]).isEqualTo(b.soundSpeed()[19]);
        assertThat(b.pressure()[20]).isNaN(); // filled by ProfileBuilder, which knows the latitude
        assertThat(r.notes()).contains(
                "extended from 20.0 m to 40.0 m by holding the deepest sound speed (1489.875 m/s), temperature and salinity constant");
    }

    @Test
    void unbinnedKeepsAcceptedSamples() {
        CastQc.Result r = CastQc.apply(cast().columns(), CastQc.Settings.DEFAULTS.withBinStep(0));
        // 78 downcast samples less the spike and the hot one
        assertThat(r.binned().size()).isEqualTo(76);
        for (int i = 0; i < r.binned().size(); i++) {
            assertThat(r.binned().soundSpeed()[i]).isCloseTo(speed(r.binned().depth()[i]), within(1e-9));
        }
    }
}
