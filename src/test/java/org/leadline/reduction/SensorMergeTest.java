package org.leadline.reduction;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import org.junit.jupiter.api.Test;
import org.leadline.survey.AttitudeSeries;
import org.leadline.survey.NavigationSeries;
import org.leadline.survey.PingTable;
import org.leadline.survey.SoundingTable.Reason;

class SensorMergeTest {
    /** WGS84 semi-major axis and first eccentricity squared (NIMA TR8350.2, table 3.1). */
    private static final double A = 6378137.0, E2 = 0.00669437999014;
    private static final double V = 5.0; // m/s

    /** East along the equator at V: lon(t) = V t / a radians (the equator is a circle of radius a). */
    private static NavigationSeries eastOnEquator(double t0, double t1, double step) {
        int n = (int) Math.round((t1 - t0) / step) + 1;
        double[] t = new double[n], la = new double[n], lo = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = t0 + i * step;
            lo[i] = Math.toDegrees(V * t[i] / A);
        }
        return NavigationSeries.of(t, la, lo);
    }

    private static PingTable pings(double... times) {
        PingTable.Builder b = new PingTable.Builder();
        for (double t : times) b.add(t, Double.NaN, Double.NaN, 0.02, Double.NaN, 0, 10, 0.5, 1, 2, "L1", 0, -1);
        return b.build();
    }

    @Test
    void latencyShiftsTheSampleTimeLaterInTheSensorRecord() {
        NavigationSeries nav = eastOnEquator(0, 20, 1);
        double[] t = {0, 1, 2, 3, 4, 5, 6, 7, 8, 9, 10, 11, 12, 13, 14, 15};
        double[] heave = new double[t.length], heading = new double[t.length];
        for (int i = 0; i < t.length; i++) {
            heave[i] = 0.1 * t[i];
            heading[i] = (355 + 2 * t[i]) % 360;
        }
        AttitudeSeries att = AttitudeSeries.of(t, heading, heave, null, null);
        double latency = 0.2;
        MergedPings m = SensorMerge.merge(pings(10.0, 10.0, 2.4), nav, att, latency);
        // Worked by hand: the event at sounder time 10 carries sensor stamp 10.2, so
        // lon = deg(5 * 10.2 / a), heave = 0.1 * 10.2, heading = 355 + 20.4 = 375.4 -> 15.4.
        assertThat(m.lon[0]).isCloseTo(Math.toDegrees(V * 10.2 / A), within(1e-12));
        assertThat(m.lat[0]).isCloseTo(0.0, within(1e-12));
        assertThat(m.heave[0]).isCloseTo(1.02, within(1e-12));
        assertThat(m.heading[0]).isCloseTo(15.4, within(1e-9));
        assertThat(m.heading[2]).isCloseTo(0.2, within(1e-9)); // 2.4 + 0.2 = 2.6 s: 355 + 5.2 = 360.2 -> 0.2
        // roll and pitch: the attitude record has none, so the ping file's values stay
        assertThat(m.roll[0]).isEqualTo(1.0);
        assertThat(m.pitch[0]).isEqualTo(2.0);
        assertThat(m.ok(0)).isTrue();
        // second beam of the same ping: same state
        assertThat(m.lon[1]).isEqualTo(m.lon[0]);
        assertThat(m.heave[1]).isEqualTo(m.heave[0]);
        // a negative latency looks earlier
        MergedPings early = SensorMerge.merge(pings(10.0), nav, att, -0.2);
        assertThat(early.heave[0]).isCloseTo(0.98, within(1e-12));
    }

    @Test
    void pingsOutsideTheRecordsAreMarkedNeverExtrapolated() {
        NavigationSeries nav = eastOnEquator(0, 20, 1);
        AttitudeSeries att = AttitudeSeries.of(new double[] {0, 15}, null, new double[] {0, 1.5}, null, null);
        MergedPings m = SensorMerge.merge(pings(-0.3, -0.1, 5, 14.8, 15.0, 19.8, 19.9), nav, att, 0.2);
        // -0.3 + 0.2 = -0.1 < 0: before both records -> navigation wins
        assertThat(m.reason(0)).isEqualTo(Reason.NO_NAVIGATION);
        assertThat(m.lat[0]).isNaN();
        assertThat(m.heave[0]).isNaN();
        // -0.1 + 0.2 = 0.1: inside both
        assertThat(m.reason(1)).isEqualTo(Reason.NONE);
        assertThat(m.heave[1]).isCloseTo(0.01, within(1e-12));
        assertThat(m.reason(2)).isEqualTo(Reason.NONE);
        assertThat(m.reason(3)).isEqualTo(Reason.NONE); // 14.8 + 0.2 = 15.0: the last attitude sample itself
        assertThat(m.heave[3]).isCloseTo(1.5, within(1e-12));
        assertThat(m.reason(4)).isEqualTo(Reason.NO_ATTITUDE); // 15.2 > 15
        assertThat(m.heave[4]).isNaN();
        assertThat(m.lon[4]).isCloseTo(Math.toDegrees(V * 15.2 / A), within(1e-12));
        assertThat(m.reason(5)).isEqualTo(Reason.NO_ATTITUDE); // 20.0: last nav sample, attitude ended
        assertThat(m.reason(6)).isEqualTo(Reason.NO_NAVIGATION); // 20.1 > 20
        assertThat(m.count(Reason.NO_NAVIGATION)).isEqualTo(2);
        // a refused gap in the navigation is also "outside the record"
        NavigationSeries gappy = NavigationSeries.of(new double[] {0, 1, 30, 31}, new double[4], new double[] {0, 1e-5, 3e-4, 3.1e-4}).withMaxGap(10);
        MergedPings g = SensorMerge.merge(pings(0.5, 15), gappy, null, 0);
        assertThat(g.reason(0)).isEqualTo(Reason.NONE);
        assertThat(g.reason(1)).isEqualTo(Reason.NO_NAVIGATION);
    }

    @Test
    void speedOverGroundOfAConstantVelocityTrack() {
        // Constant velocity gives back its speed (common practice): east along the equator...
        MergedPings m = SensorMerge.merge(pings(3, 10, 19.5), eastOnEquator(0, 20, 1), null, 0);
        for (int i = 0; i < 3; i++) {
            assertThat(m.speedOverGround[i]).isCloseTo(V, within(1e-6));
            assertThat(m.courseOverGround[i]).isCloseTo(90.0, within(1e-6));
        }
        // ...and north along a meridian from the equator, where the meridian radius of curvature is
        // M0 = a (1 - e^2) = 6335439.327 m (worked by hand; dM/dlat = 0 there).
        double m0 = A * (1 - E2);
        assertThat(m0).isCloseTo(6335439.327, within(1e-3));
        int n = 21;
        double[] t = new double[n], la = new double[n], lo = new double[n];
        for (int i = 0; i < n; i++) {
            t[i] = i;
            la[i] = Math.toDegrees(V * i / m0);
            lo[i] = 30;
        }
        MergedPings north = SensorMerge.merge(pings(10), NavigationSeries.of(t, la, lo), null, 0, 4);
        assertThat(north.speedOverGround[0]).isCloseTo(V, within(1e-5));
        assertThat(Math.abs(org.leadline.survey.TimeSeries.shortestTurn(0, north.courseOverGround[0]))).isLessThan(1e-6);
        // south-west on the ping file's own positions (no separate series): speed from 1 Hz fixes
        PingTable.Builder b = new PingTable.Builder();
        for (int i = 0; i <= 20; i++) {
            double lat = -Math.toDegrees(V * i / Math.sqrt(2) / m0);
            double lon = -Math.toDegrees(V * i / Math.sqrt(2) / A);
            b.add(i, lat, lon, 0.02, Double.NaN, -20, Double.NaN, Double.NaN, Double.NaN, Double.NaN, "L", 0, -1);
            b.add(i, lat, lon, 0.02, Double.NaN, 20, Double.NaN, Double.NaN, Double.NaN, Double.NaN, "L", 1, -1);
        }
        MergedPings own = SensorMerge.merge(b.build(), null, null, 0.3);
        assertThat(own.lat[20]).isEqualTo(b.build().lat[20]); // own positions are used as logged
        assertThat(own.speedOverGround[20]).isCloseTo(V, within(1e-5));
        assertThat(own.courseOverGround[20]).isCloseTo(225.0, within(1e-4));
        assertThat(own.ok(20)).isTrue();
        // two runs 10 minutes apart: the speed at the end of the first does not bridge the break
        PingTable.Builder two = new PingTable.Builder();
        for (int i = 0; i <= 10; i++) two.add(i, 0, Math.toDegrees(V * i / A), 0.02, Double.NaN, 0, Double.NaN, Double.NaN, Double.NaN, Double.NaN, "L1", 0, -1);
        for (int i = 0; i <= 10; i++) two.add(600 + i, 0.01, 0.01 + Math.toDegrees(V * i / A), 0.02, Double.NaN, 0, Double.NaN, Double.NaN, Double.NaN, Double.NaN, "L2", 0, -1);
        MergedPings br = SensorMerge.merge(two.build(), null, null, 0);
        assertThat(br.speedOverGround[10]).isCloseTo(V, within(1e-5)); // one-sided at the end of L1
        assertThat(br.speedOverGround[11]).isCloseTo(V, within(1e-5)); // one-sided at the start of L2
        assertThat(br.courseOverGround[10]).isCloseTo(90.0, within(1e-4));
    }
}
