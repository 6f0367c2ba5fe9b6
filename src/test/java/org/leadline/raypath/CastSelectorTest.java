package org.leadline.raypath;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.leadline.raypath.CastSelector.Mode;
import org.leadline.raypath.CastSelector.Selection;

class CastSelectorTest {
    // three casts given out of time order: index 0 at 3000 s, index 1 at 0 s, index 2 at 1000 s
    static final double[] CAST_T = {3000, 0, 1000};
    static final double[] CAST_LAT = {50.0, 50.1, 50.0};
    static final double[] CAST_LON = {-4.0, -4.0, -4.5};
    static final double[] PING_T = {-50, 400, 500, 600, 2500, 5000};
    static final double[] PING_LAT = {50.09, 50.0, 50.0, Double.NaN, 50.01, 50.0};
    static final double[] PING_LON = {-4.01, -4.45, -4.02, Double.NaN, -4.0, -4.25};

    @Test
    void nearestTime() {
        Selection s = CastSelector.select(Mode.NEAREST_TIME, CAST_T, null, null, PING_T, null, null);
        // worked by hand in this test: -50 and 400 s -> cast at 0 s; 500 s is a tie, the earlier cast wins;
        // 600 s -> 1000 s; 2500 s -> 3000 s; 5000 s -> 3000 s
        assertThat(s.firstColumn()).containsExactly(1, 1, 1, 2, 0, 0);
        assertThat(s.secondColumn()).containsExactly(1, 1, 1, 2, 0, 0);
        assertThat(s.weightColumn()).containsOnly(0.0);
    }

    @Test
    void nearestDistance() {
        Selection s = CastSelector.select(Mode.NEAREST_DISTANCE, CAST_T, CAST_LAT, CAST_LON, PING_T, PING_LAT, PING_LON);
        // worked by hand in this test (1 deg of longitude at 50 N is about 71.5 km): (50.09,-4.01) is 1.3 km
        // from cast 1 (50.1,-4.0); (50.0,-4.45) 3.6 km from cast 2; (50.0,-4.02) 1.4 km from cast 0; no
        // position -> nearest time (cast 2 at 1000 s); (50.01,-4.0) 1.1 km from cast 0; (50.0,-4.25) lies
        // 0.25 deg of longitude from casts 0 and 2 alike: the nearer in time (cast 0 at 3000 s for a ping at
        // 5000 s) wins
        assertThat(s.firstColumn()).containsExactly(1, 2, 0, 2, 0, 0);
    }

    @Test
    void interpolateTime() {
        Selection s = CastSelector.select(Mode.INTERPOLATE_TIME, CAST_T, null, null, PING_T, null, null);
        // worked by hand in this test: w = (t - t1) / (t2 - t1)
        assertThat(s.first(0)).isEqualTo(1);
        assertThat(s.weight(0)).isEqualTo(0.0);                      // before the first cast: that cast alone
        assertThat(new int[]{s.first(1), s.second(1)}).containsExactly(1, 2);
        assertThat(s.weight(1)).isCloseTo(0.4, within(1e-15));        // 400 s between 0 and 1000 s
        assertThat(s.weight(3)).isCloseTo(0.6, within(1e-15));
        assertThat(new int[]{s.first(4), s.second(4)}).containsExactly(2, 0);
        assertThat(s.weight(4)).isCloseTo(0.75, within(1e-15));       // 2500 s between 1000 and 3000 s
        assertThat(new int[]{s.first(5), s.second(5)}).containsExactly(0, 0);
        assertThat(s.weight(5)).isEqualTo(0.0);                       // after the last cast
    }

    @Test
    void modeNamesParse() {
        assertThat(Mode.parse("nearest-time")).isEqualTo(Mode.NEAREST_TIME);
        assertThat(Mode.parse("Nearest-Distance")).isEqualTo(Mode.NEAREST_DISTANCE);
        assertThat(Mode.parse(" interpolate-time ")).isEqualTo(Mode.INTERPOLATE_TIME);
        assertThat(Mode.INTERPOLATE_TIME.label()).isEqualTo("interpolate-time");
        assertThatThrownBy(() -> Mode.parse("nearest")).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("nearest-time, nearest-distance, interpolate-time").hasMessageContaining("'nearest'");
    }

    @Test
    void needsACast() {
        assertThatThrownBy(() -> CastSelector.select(Mode.NEAREST_TIME, new double[0], null, null, PING_T, null, null))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("at least one cast");
    }

    @Test
    void haversineDistanceMatchesAHandWorkedValue() {
        // one degree of latitude on a 6371 km sphere is 6371 * pi / 180 = 111.194927 km (worked by hand)
        assertThat(CastSelector.angularDistance(50, -4, 51, -4) * 6371.0).isCloseTo(111.194927, within(1e-6));
        // the two tie candidates of nearestDistance() are exactly equidistant
        assertThat(CastSelector.angularDistance(50, -4.25, 50, -4.0))
                .isEqualTo(CastSelector.angularDistance(50, -4.25, 50, -4.5));
    }
}
