package org.leadline.survey;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.util.List;
import org.junit.jupiter.api.Test;

class TimeSeriesTest {
    private static final TimeSeries S = TimeSeries.of(new double[] {0, 1, 10, 11}, List.of("x"),
            new double[] {0, 2, 20, 22});

    @Test
    void linearInsideNanOutsideNeverExtrapolates() {
        assertThat(S.at(0, 0.25)).isEqualTo(0.5); // worked by hand: 0 + 0.25 * (2 - 0)
        assertThat(S.at(0, 5.5)).isEqualTo(11.0);  // 2 + 0.5 * 18
        assertThat(S.at(0, 0)).isEqualTo(0.0);
        assertThat(S.at(0, 11)).isEqualTo(22.0);
        assertThat(S.at(0, -1e-9)).isNaN();
        assertThat(S.at(0, 11 + 1e-9)).isNaN();
        assertThat(S.at(0, Double.NaN)).isNaN();
        assertThat(S.covers(0)).isTrue();
        assertThat(S.covers(11)).isTrue();
        assertThat(S.covers(11.5)).isFalse();
        assertThat(S.refusal(-1)).isEqualTo(TimeSeries.Refusal.BEFORE_START);
        assertThat(S.refusal(12)).isEqualTo(TimeSeries.Refusal.AFTER_END);
        assertThat(S.column("X")).isZero();
    }

    @Test
    void maxGapRefusesInsideTheGapOnly() {
        TimeSeries g = S.withMaxGap(5);
        assertThat(g.at(0, 5)).isNaN();
        assertThat(g.refusal(5)).isEqualTo(TimeSeries.Refusal.GAP);
        assertThat(g.covers(5)).isFalse();
        assertThat(g.at(0, 0.5)).isEqualTo(1.0);
        assertThat(g.at(0, 10)).isEqualTo(20.0);  // an exact sample next to the gap is kept
        assertThat(g.at(0, 1)).isEqualTo(2.0);
        assertThat(g.at(0, 10.5)).isEqualTo(21.0);
        assertThat(S.withMaxGap(9).covers(5)).isTrue(); // a gap of exactly the maximum is still bridged
    }

    @Test
    void rejectsTimesThatDoNotIncrease() {
        assertThatThrownBy(() -> TimeSeries.of(new double[] {0, 1, 1}, List.of("x"), new double[3]))
                .isInstanceOf(IllegalArgumentException.class).hasMessageContaining("increase strictly");
        assertThatThrownBy(() -> TimeSeries.of(new double[] {0, Double.NaN}, List.of("x"), new double[2]))
                .isInstanceOf(IllegalArgumentException.class);
    }

    @Test
    void headingTakesTheShorterArcThroughNorth() {
        TimeSeries h = TimeSeries.of(new double[] {0, 2}, List.of("heading"), new double[] {359, 1});
        assertThat(h.angleAt(0, 1)).isCloseTo(0.0, within(1e-12));      // worked by hand: 359 + 0.5 * 2 = 360 -> 0
        assertThat(h.angleAt(0, 0.5)).isCloseTo(359.5, within(1e-12));  // 359 + 0.25 * 2
        assertThat(h.angleAt(0, 1.5)).isCloseTo(0.5, within(1e-12));
        assertThat(h.angleAt(0, 2)).isEqualTo(1.0);
        TimeSeries back = TimeSeries.of(new double[] {0, 1}, List.of("heading"), new double[] {10, 350});
        assertThat(back.angleAt(0, 0.75)).isCloseTo(355.0, within(1e-12)); // 10 - 0.75 * 20 = -5 -> 355
        TimeSeries wide = TimeSeries.of(new double[] {0, 1}, List.of("heading"), new double[] {90, 200});
        assertThat(wide.angleAt(0, 0.5)).isCloseTo(145.0, within(1e-12)); // 110 deg turn is already the shorter
        assertThat(h.angleAt(0, 3)).isNaN();
        assertThat(TimeSeries.wrap360(-1e-17)).isEqualTo(0.0);
        assertThat(TimeSeries.shortestTurn(350, 10)).isEqualTo(20.0);
    }

    @Test
    void positionAcrossTheAntimeridian() {
        NavigationSeries nav = NavigationSeries.of(new double[] {0, 10}, new double[] {0, 0}, new double[] {179.9, -179.9});
        double[] p = new double[2];
        // Worked by hand: on the equator the great circle is the equator itself and slerp moves at a
        // constant angular rate, so the point at f is 179.9 + f * 0.2 degrees of longitude.
        assertThat(nav.position(5, p)).isTrue();
        assertThat(p[0]).isCloseTo(0.0, within(1e-12));
        assertThat(Math.abs(p[1])).isCloseTo(180.0, within(1e-9));
        nav.position(2.5, p);
        assertThat(p[1]).isCloseTo(179.95, within(1e-9));
        nav.position(7.5, p);
        assertThat(p[1]).isCloseTo(-179.95, within(1e-9));

        // Worked by hand at lat 60: n1 + n2 = (2 cos60 cos179.9, 0, 2 sin60), so the midpoint is at
        // lon 180 and lat = atan(tan 60 / cos 0.1) = 60.0000378 deg (a straight lat/lon average
        // would wrongly give lon 0).
        NavigationSeries n60 = NavigationSeries.of(new double[] {0, 10}, new double[] {60, 60}, new double[] {179.9, -179.9});
        n60.position(5, p);
        assertThat(Math.abs(p[1])).isCloseTo(180.0, within(1e-9));
        assertThat(p[0]).isCloseTo(Math.toDegrees(Math.atan(Math.tan(Math.toRadians(60)) / Math.cos(Math.toRadians(0.1)))), within(1e-10));
        assertThat(p[0]).isCloseTo(60.0000378, within(1e-7));
    }

    @Test
    void positionNearThePole() {
        double[] p = new double[2];
        // Worked by hand: n1 = (cos89, 0, sin89), n2 = (0, cos89, sin89); the midpoint direction is
        // n1 + n2 = (cos89, cos89, 2 sin89): lon 45, lat = atan(2 sin89 / (sqrt2 cos89)) =
        // atan(sqrt2 tan 89) = 90 deg - atan(1 / 81.020242) = 90 - 0.7071425 deg = 89.2928575 deg.
        GreatCircle.interpolate(89, 0, 89, 90, 0.5, p);
        assertThat(p[1]).isCloseTo(45.0, within(1e-9));
        assertThat(p[0]).isCloseTo(89.2928575, within(1e-6)); // hand arithmetic carried to 7 digits
        assertThat(p[0]).isCloseTo(Math.toDegrees(Math.atan(Math.sqrt(2) * Math.tan(Math.toRadians(89)))), within(1e-10));
        // Over the pole: 89N 0E to 89N 180E passes through the pole (a lat/lon average gives 89N 90E).
        NavigationSeries pole = NavigationSeries.of(new double[] {0, 2}, new double[] {89, 89}, new double[] {0, 180});
        pole.position(1, p);
        assertThat(p[0]).isCloseTo(90.0, within(1e-9));
        pole.position(0.5, p);
        assertThat(p[0]).isCloseTo(89.5, within(1e-9)); // constant rate: half-way to the pole
        assertThat(p[1]).isCloseTo(0.0, within(1e-9));
        pole.position(1.5, p);
        assertThat(p[0]).isCloseTo(89.5, within(1e-9));
        assertThat(Math.abs(p[1])).isCloseTo(180.0, within(1e-9));
        // along a meridian slerp is linear in latitude (worked by hand)
        GreatCircle.interpolate(0, 10, 10, 10, 0.3, p);
        assertThat(p[0]).isCloseTo(3.0, within(1e-12));
        assertThat(p[1]).isCloseTo(10.0, within(1e-12));
        // points a millimetre apart fall back to linear weights without dividing by ~0
        GreatCircle.interpolate(50, 1, 50 + 1e-11, 1, 0.5, p);
        assertThat(p[0]).isCloseTo(50 + 0.5e-11, within(1e-13));
    }

    @Test
    void attitudeAndWaterLevelWrappers() {
        AttitudeSeries a = AttitudeSeries.of(new double[] {0, 1}, new double[] {358, 2}, null, new double[] {1, 3}, null);
        assertThat(a.heading(0.5)).isCloseTo(0.0, within(1e-12));
        assertThat(a.roll(0.5)).isEqualTo(2.0);
        assertThat(a.has(AttitudeSeries.HEAVE)).isFalse();
        assertThat(a.heave(0.5)).isNaN();
        WaterLevelSeries w = WaterLevelSeries.of(new double[] {0, 600}, new double[] {1.2, 1.5});
        assertThat(w.level(300)).isCloseTo(1.35, within(1e-12));
        assertThat(w.withMaxGap(300).level(300)).isNaN();
        assertThat(w.level(601)).isNaN();
    }
}
