package org.leadline.reduction;

import org.junit.jupiter.api.Test;
import org.leadline.survey.PingTable;
import org.leadline.survey.SoundingTable;
import org.leadline.survey.Vessel;
import org.leadline.synthetic.SurveySimulator;

import java.util.List;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/**
 * The reducer's geometry (attitude rotation, lever arms, settlement, heave, water level and
 * georeferencing) against the independent forward model, in constant-speed water so that rays are
 * straight lines and only the geometry is tested. Sensor values at ping times are exact here; the
 * time merge and ray bending are tested elsewhere.
 */
class ReducerGeometryTest {
    static final double C = 1500.0;

    /** Straight rays in constant water (common practice: range = c t). */
    static final Reducer.BeamTracer STRAIGHT = (z0, theta, t, out) -> {
        out[0] = C * t * Math.cos(theta);
        out[1] = C * t * Math.sin(theta);
    };

    @Test
    void swathWithMotionLeverArmsAndTideIsRecovered() {
        Vessel v = new Vessel(0.8, new double[]{0, 2.5, 5}, new double[]{0, 0.04, 0.12},
                new Vessel.Offset(-1.2, 0.4, -3.1), new Vessel.Offset(0.9, -0.6, 0.7), 0, C,
                Math.toRadians(2), Vessel.SensorSigmas.DEFAULT);
        SurveySimulator.Seabed bed = (e, n) -> 12 + 0.05 * e - 0.02 * n + 2 * Math.sin(n / 40.0);
        SurveySimulator.WaterLevel tide = (t, e, n) -> 1.3 + 0.8 * Math.sin(t / 3000.0);
        SurveySimulator.Motion motion = new SurveySimulator.Motion() {
            public double heave(double t) { return 0.4 * Math.sin(t / 1.1); }
            public double roll(double t) { return 5 * Math.sin(t / 0.9); }
            public double pitch(double t) { return 2 * Math.sin(t / 1.3 + 1); }
            public double yaw(double t) { return 3 * Math.sin(t / 7); }
        };
        SurveySimulator sim = new SurveySimulator(50.5, -4.2, bed, tide, motion, v, STRAIGHT);
        double[] beams = {-60, -45, -30, -10, 0, 10, 30, 45, 60};
        var res = sim.run(List.of(new SurveySimulator.LinePlan("L1", -50, -200, 80, 200, 2.5, beams, 0.5, 1.7e9)), 10, 20);

        PingTable.Builder b = new PingTable.Builder();
        int n = res.time.size();
        for (int i = 0; i < n; i++) {
            b.add(res.time.get(i), res.lat.get(i), res.lon.get(i), res.twtt.get(i), Double.NaN, res.angle.get(i),
                    res.heading.get(i), res.heave.get(i), res.roll.get(i), res.pitch.get(i), "L1", res.beam.get(i), -1);
        }
        PingTable p = b.build();
        Reducer.MergedInputs in = new Reducer.MergedInputs(p.lat, p.lon, p.heading, p.heave, p.roll, p.pitch,
                res.sog.toArray(), null);
        int[] zero = new int[n];
        SoundingTable s = new Reducer(v, false).reduce(p, in, new Reducer.BeamTracer[]{STRAIGHT},
                new Reducer.CastChoice(zero, zero, null),
                (t, lat, lon) -> {
                    double[] en = sim.localEN(lat, lon);
                    return tide.level(t, en[0], en[1]);
                },
                (lat, lon, e, no) -> {});
        double maxDz = 0, maxDh = 0;
        for (int i = 0; i < n; i++) {
            assertThat(s.accepted(i)).isTrue();
            maxDz = Math.max(maxDz, Math.abs(s.depth[i] - res.trueDepth.get(i)));
            double[] a = sim.localEN(s.lat[i], s.lon[i]);
            maxDh = Math.max(maxDh, Math.hypot(a[0] - res.trueEast.get(i), a[1] - res.trueNorth.get(i)));
        }
        // Geometry alone: exact to well under a millimetre (tangent-plane vs radii-of-curvature
        // offsets differ by ~d^2/R, under 1e-3 mm for these 60 m offsets).
        assertThat(maxDz).isLessThan(1e-3);
        assertThat(maxDh).isLessThan(1e-3);
    }

    @Test
    void verticalBeamInConstantWaterIsHalfSpeedTimesTime() {
        // depth = c * twtt / 2 (common practice), plus draft, minus water level.
        Vessel v = Vessel.simple(0.5, C);
        PingTable p = new PingTable.Builder().add(0, 50, -4, 0.02, Double.NaN, Double.NaN, 0, 0, 0, 0, null, -1, -1).build();
        Reducer.MergedInputs in = new Reducer.MergedInputs(p.lat, p.lon, p.heading, p.heave, p.roll, p.pitch,
                new double[]{0}, null);
        SoundingTable s = new Reducer(v, false).reduce(p, in, new Reducer.BeamTracer[]{STRAIGHT},
                new Reducer.CastChoice(new int[1], new int[1], null), (t, la, lo) -> 1.25, (la, lo, e, no) -> {});
        assertThat(s.depth[0]).isCloseTo(1500 * 0.02 / 2 + 0.5 - 1.25, within(1e-12));
        assertThat(s.lat[0]).isEqualTo(50.0);
    }
}
