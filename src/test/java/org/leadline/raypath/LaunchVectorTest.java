package org.leadline.raypath;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

import java.util.SplittableRandom;
import org.apache.commons.math3.geometry.euclidean.threed.Rotation;
import org.apache.commons.math3.geometry.euclidean.threed.RotationConvention;
import org.apache.commons.math3.geometry.euclidean.threed.Vector3D;
import org.junit.jupiter.api.Test;

class LaunchVectorTest {
    private static final double EPS = 1e-12;

    private static double[] launch(double beamDeg, double rollDeg, double pitchDeg, boolean stabilised) {
        double[] out = new double[2];
        LaunchVector.compute(Math.toRadians(beamDeg), Math.toRadians(rollDeg), Math.toRadians(pitchDeg), stabilised, out);
        return new double[]{Math.toDegrees(out[0]), Math.toDegrees(out[1])};
    }

    @Test
    void verticalBeamWithBowUpPitchLandsForward() {
        // worked by hand in this test: bow up by 5 deg tilts the hull's down axis forward by 5 deg,
        // e = (sin 5, 0, cos 5): 5 deg from the vertical, azimuth 0 (ahead)
        double[] r = launch(0, 0, 5, false);
        assertThat(r[0]).isCloseTo(5, within(EPS));
        assertThat(r[1]).isCloseTo(0, within(EPS));
        // bow down lands aft
        r = launch(0, 0, -5, false);
        assertThat(r[1]).isCloseTo(180, within(EPS));
    }

    @Test
    void verticalBeamWithStarboardDownRollLandsToPort() {
        // worked by hand in this test: starboard down by 10 deg turns the down axis 10 deg to port,
        // e = (0, -sin 10, cos 10): 10 deg from the vertical, azimuth -90 deg (port)
        double[] r = launch(0, 10, 0, false);
        assertThat(r[0]).isCloseTo(10, within(EPS));
        assertThat(r[1]).isCloseTo(-90, within(EPS));
    }

    @Test
    void rollOnlyGivesBeamMinusRoll() {
        // DESIGN.md sect. 3: earth-frame across-track angle = beam angle - roll (worked by hand in this test)
        double[] r = launch(30, 10, 0, false);
        assertThat(r[0]).isCloseTo(20, within(EPS));
        assertThat(r[1]).isCloseTo(90, within(EPS));
        r = launch(30, 40, 0, false);
        assertThat(r[0]).isCloseTo(10, within(EPS));     // |30 - 40|, now to port
        assertThat(r[1]).isCloseTo(-90, within(EPS));
        r = launch(-45, -5, 0, false);
        assertThat(r[0]).isCloseTo(40, within(EPS));
        assertThat(r[1]).isCloseTo(-90, within(EPS));
    }

    @Test
    void rollStabilisedBeamIgnoresRoll() {
        double[] r = launch(30, 10, 0, true);
        assertThat(r[0]).isCloseTo(30, within(EPS));
        assertThat(r[1]).isCloseTo(90, within(EPS));
    }

    @Test
    void beamWithRollAndPitch() {
        // worked by hand in this test: beam 30, roll 10 -> across 20 deg; then pitch 5 bow up:
        // e = (cos 20 sin 5, sin 20, cos 20 cos 5) = (0.081900, 0.342020, 0.936117);
        // angle = acos(0.936117) = 20.5907 deg, azimuth = atan2(0.342020, 0.081900) = 76.5336 deg
        double[] r = launch(30, 10, 5, false);
        assertThat(r[0]).isCloseTo(20.590671675526778, within(1e-9));
        assertThat(r[1]).isCloseTo(76.53360975056773, within(1e-9));
    }

    @Test
    void agreesWithCommonsMathRotationsOfTheBeamVector() {
        // reference library: Apache Commons Math Rotation. Roll is a right-handed turn about +x (starboard
        // side down), pitch a right-handed turn about +y (bow up), applied to the beam vector in that order.
        SplittableRandom rnd = new SplittableRandom(9);
        double[] out = new double[2], e = new double[3];
        for (int i = 0; i < 1000; i++) {
            double beam = Math.toRadians((rnd.nextDouble() * 2 - 1) * 75);
            double roll = Math.toRadians((rnd.nextDouble() * 2 - 1) * 20);
            double pitch = Math.toRadians((rnd.nextDouble() * 2 - 1) * 10);
            Vector3D b = new Vector3D(0, Math.sin(beam), Math.cos(beam));
            Rotation rx = new Rotation(Vector3D.PLUS_I, roll, RotationConvention.VECTOR_OPERATOR);
            Rotation ry = new Rotation(Vector3D.PLUS_J, pitch, RotationConvention.VECTOR_OPERATOR);
            Vector3D ref = ry.applyTo(rx.applyTo(b));
            LaunchVector.unitVector(beam, roll, pitch, false, e);
            assertThat(e).containsExactly(new double[]{ref.getX(), ref.getY(), ref.getZ()}, within(1e-12));
            LaunchVector.compute(beam, roll, pitch, false, out);
            assertThat(out[0]).isCloseTo(Vector3D.angle(ref, Vector3D.PLUS_K), within(1e-9));
            assertThat(out[1]).isCloseTo(Math.atan2(ref.getY(), ref.getX()), within(1e-9));
        }
    }
}
