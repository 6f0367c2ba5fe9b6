package org.leadline.survey;

/**
 * The survey vessel: static draft of the transducer, settlement table, sensor offsets, latency,
 * sounder settings and the one-sigma uncertainty of each sensor. SI units; angles in radians.
 *
 * @param transducerDraft     static depth of the transducer face below the still waterline, m
 * @param settlementSpeeds    speeds over ground of the settlement table, m/s, increasing
 * @param settlementValues    extra draft (settlement and squat) at each speed, m, positive down
 * @param positionOffset      position reference (GNSS antenna) from the vessel reference point, m (x fwd, y stbd, z down)
 * @param transducerOffset    transducer from the vessel reference point, m (x fwd, y stbd, z down)
 * @param latency             time the position/attitude stamps lag the sounder stamps, s (added to ping times)
 * @param sounderSetSpeed     the speed the sounder used for its own depths, m/s
 * @param beamWidth           full beam width (-3 dB) of the transducer, radians
 * @param sigma               one-sigma sensor uncertainties
 */
public record Vessel(double transducerDraft, double[] settlementSpeeds, double[] settlementValues,
                     Offset positionOffset, Offset transducerOffset, double latency,
                     double sounderSetSpeed, double beamWidth, SensorSigmas sigma) {

    public Vessel {
        if (settlementSpeeds.length != settlementValues.length) {
            throw new IllegalArgumentException("settlement table: " + settlementSpeeds.length
                    + " speeds but " + settlementValues.length + " values");
        }
        settlementSpeeds = settlementSpeeds.clone();
        settlementValues = settlementValues.clone();
    }

    /** A vessel with the given draft, no offsets, no settlement, default sensor sigmas. */
    public static Vessel simple(double draft, double sounderSetSpeed) {
        return new Vessel(draft, new double[0], new double[0], Offset.ZERO, Offset.ZERO, 0,
                sounderSetSpeed, Math.toRadians(8), SensorSigmas.DEFAULT);
    }

    /** Settlement (extra draft) at a speed over ground, m: linear in the table, held at its ends. */
    public double settlement(double speedOverGround) {
        int n = settlementSpeeds.length;
        if (n == 0 || !Double.isFinite(speedOverGround)) return 0;
        if (speedOverGround <= settlementSpeeds[0]) return settlementValues[0] * (n == 1 ? 1 : 1);
        if (speedOverGround >= settlementSpeeds[n - 1]) return settlementValues[n - 1];
        int i = 0;
        while (settlementSpeeds[i + 1] < speedOverGround) i++;
        double f = (speedOverGround - settlementSpeeds[i]) / (settlementSpeeds[i + 1] - settlementSpeeds[i]);
        return settlementValues[i] + f * (settlementValues[i + 1] - settlementValues[i]);
    }

    /** A lever arm in the vessel frame, m (x forward, y starboard, z down). */
    public record Offset(double x, double y, double z) {
        public static final Offset ZERO = new Offset(0, 0, 0);
    }

    /**
     * One-sigma uncertainties of the sensors and corrections, SI units, angles in radians.
     *
     * @param sounderFixed      range measurement, fixed part, m
     * @param sounderRelative   range measurement, depth-proportional part (fraction of depth)
     * @param soundSpeedSurface sound speed at the transducer, m/s
     * @param soundSpeedProfile sound speed through the profile (mean over the path), m/s
     * @param draft             static draft, m
     * @param settlement        settlement/squat, m
     * @param heaveFixed        heave, fixed part, m
     * @param heaveRelative     heave, fraction of the heave amplitude
     * @param roll              roll, rad
     * @param pitch             pitch, rad
     * @param heading           heading, rad
     * @param position          horizontal position of the position reference, m (per axis)
     * @param latency           timing, s
     * @param leverArm          measured lever arms, m (per axis)
     * @param waterLevel        water level at the gauge, m
     * @param tideZone          extra water-level uncertainty for zoning away from the gauge, m
     */
    public record SensorSigmas(double sounderFixed, double sounderRelative, double soundSpeedSurface,
                               double soundSpeedProfile, double draft, double settlement,
                               double heaveFixed, double heaveRelative, double roll, double pitch,
                               double heading, double position, double latency, double leverArm,
                               double waterLevel, double tideZone) {
        /** Typical values for a small launch with an RTK-less GNSS and a motion sensor (common practice). */
        public static final SensorSigmas DEFAULT = new SensorSigmas(0.01, 0.001, 0.5, 1.0, 0.01, 0.02,
                0.05, 0.05, Math.toRadians(0.05), Math.toRadians(0.05), Math.toRadians(0.1), 0.5, 0.005,
                0.01, 0.02, 0.03);
    }
}
