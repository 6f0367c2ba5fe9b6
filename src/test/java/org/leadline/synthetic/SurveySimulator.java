package org.leadline.synthetic;

import org.apache.commons.math3.geometry.euclidean.threed.Rotation;
import org.apache.commons.math3.geometry.euclidean.threed.RotationConvention;
import org.apache.commons.math3.geometry.euclidean.threed.RotationOrder;
import org.apache.commons.math3.geometry.euclidean.threed.Vector3D;
import org.leadline.reduction.Reducer;
import org.leadline.survey.Vessel;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;

/**
 * Forward model of a survey day: a known seabed, a vessel running lines with heave, roll, pitch,
 * settlement and a water level, and a sounder whose two-way travel times are found by tracing rays
 * through the true sound-speed profile until they meet the seabed.
 *
 * <p>Written independently of the reduction code on purpose: attitude uses Commons Math
 * {@link Rotation} (ZYX, heading-pitch-roll), positions go through earth-centred earth-fixed
 * coordinates (WGS84) rather than radii of curvature, and the travel time is solved by iteration
 * on the seabed intersection. Only the ray tracer (the physics under test elsewhere) is shared.
 */
public final class SurveySimulator {
    private static final double A = 6378137.0, F = 1 / 298.257223563, E2 = F * (2 - F);

    /** Chart-datum depth of the seabed at local east/north metres from the scenario origin. */
    @FunctionalInterface
    public interface Seabed { double depth(double east, double north); }

    /** Water level above chart datum at a time and local east/north position, m. */
    @FunctionalInterface
    public interface WaterLevel { double level(double time, double east, double north); }

    /** Vessel motion: heave (m, up), roll, pitch, heading wobble (deg) as functions of time. */
    public interface Motion {
        double heave(double t);
        double roll(double t);
        double pitch(double t);
        double yaw(double t);
    }

    /**
     * A planned line from (e0,n0) to (e1,n1) local metres at a speed, with its beams (degrees;
     * null for a vertical single beam) and ping interval.
     */
    public record LinePlan(String name, double e0, double n0, double e1, double n1, double speed,
                           double[] beamAnglesDeg, double pingInterval, double startTime) {}

    /** Everything simulated, columnar. Truth columns give the footprint and its datum depth. */
    public static final class Result {
        public final List<String> lineNames = new ArrayList<>();
        public final DoubleList time = new DoubleList(), lat = new DoubleList(), lon = new DoubleList(),
                twtt = new DoubleList(), angle = new DoubleList(), heading = new DoubleList(),
                heave = new DoubleList(), roll = new DoubleList(), pitch = new DoubleList(),
                trueLat = new DoubleList(), trueLon = new DoubleList(), trueDepth = new DoubleList(),
                trueEast = new DoubleList(), trueNorth = new DoubleList(), sog = new DoubleList();
        public final IntList line = new IntList(), beam = new IntList();
        /** Navigation (antenna) samples and attitude samples at their own rates. */
        public final DoubleList navTime = new DoubleList(), navLat = new DoubleList(), navLon = new DoubleList();
        public final DoubleList attTime = new DoubleList(), attHeading = new DoubleList(), attHeave = new DoubleList(),
                attRoll = new DoubleList(), attPitch = new DoubleList();
    }

    private final double originLat, originLon;
    private final Seabed seabed;
    private final WaterLevel water;
    private final Motion motion;
    private final Vessel vessel;
    private final Reducer.BeamTracer tracer;
    private final double[] originEcef;
    private final double[][] originEnu; // rows: east, north, up unit vectors in ECEF

    public SurveySimulator(double originLat, double originLon, Seabed seabed, WaterLevel water, Motion motion,
                           Vessel vessel, Reducer.BeamTracer tracer) {
        this.originLat = originLat;
        this.originLon = originLon;
        this.seabed = seabed;
        this.water = water;
        this.motion = motion;
        this.vessel = vessel;
        this.tracer = tracer;
        this.originEcef = ecef(originLat, originLon, 0);
        this.originEnu = enuAxes(originLat, originLon);
    }

    /** Simulates all lines; sensor series are sampled at navRate and attitudeRate (Hz). */
    public Result run(List<LinePlan> lines, double navRate, double attitudeRate) {
        Result r = new Result();
        double[] out = new double[2];
        for (LinePlan lp : lines) {
            int lineId = r.lineNames.size();
            r.lineNames.add(lp.name());
            double len = Math.hypot(lp.e1() - lp.e0(), lp.n1() - lp.n0());
            double duration = len / lp.speed();
            double course = Math.atan2(lp.e1() - lp.e0(), lp.n1() - lp.n0());
            // sensor series cover the line with a margin so interpolation never extrapolates
            for (double t = -2; t <= duration + 2; t += 1 / navRate) {
                double[] ll = antenna(lp, course, t);
                r.navTime.add(lp.startTime() + t);
                r.navLat.add(ll[0]);
                r.navLon.add(ll[1]);
            }
            for (double t = -2; t <= duration + 2; t += 1 / attitudeRate) {
                double T = lp.startTime() + t;
                r.attTime.add(T);
                r.attHeading.add(normDeg(Math.toDegrees(course) + motion.yaw(T)));
                r.attHeave.add(motion.heave(T));
                r.attRoll.add(motion.roll(T));
                r.attPitch.add(motion.pitch(T));
            }
            for (double t = 0; t <= duration; t += lp.pingInterval()) {
                double T = lp.startTime() + t;
                double[] ant = antenna(lp, course, t);
                double hdg = Math.toRadians(Math.toDegrees(course) + motion.yaw(T));
                Rotation att = new Rotation(RotationOrder.ZYX, RotationConvention.VECTOR_OPERATOR,
                        hdg, Math.toRadians(motion.pitch(T)), Math.toRadians(motion.roll(T)));
                Rotation level = new Rotation(RotationOrder.ZYX, RotationConvention.VECTOR_OPERATOR,
                        0, Math.toRadians(motion.pitch(T)), Math.toRadians(motion.roll(T)));
                Vessel.Offset To = vessel.transducerOffset(), Po = vessel.positionOffset();
                Vector3D tBody = new Vector3D(To.x(), To.y(), To.z());
                Vector3D arm = att.applyTo(new Vector3D(To.x() - Po.x(), To.y() - Po.y(), To.z() - Po.z()));
                double zt = vessel.transducerDraft() + vessel.settlement(lp.speed()) - motion.heave(T)
                        + level.applyTo(tBody).getZ() - To.z();
                // transducer position in the antenna's local NED frame
                double[] beams = lp.beamAnglesDeg() == null ? new double[]{Double.NaN} : lp.beamAnglesDeg();
                for (int b = 0; b < beams.length; b++) {
                    Vector3D launch;
                    if (Double.isNaN(beams[b])) {
                        launch = Vector3D.PLUS_K; // single beam: vertical in the earth frame
                    } else {
                        double ba = Math.toRadians(beams[b]);
                        launch = att.applyTo(new Vector3D(0, Math.sin(ba), Math.cos(ba)));
                    }
                    double theta = Math.acos(Math.max(-1, Math.min(1, launch.getZ())));
                    double az = Math.atan2(launch.getY(), launch.getX()); // earth azimuth, rad
                    double tOne = solveTime(T, ant, arm, zt, theta, az, out);
                    double range = out[1];
                    double north = arm.getX() + range * Math.cos(az), east = arm.getY() + range * Math.sin(az);
                    double[] fp = offset(ant[0], ant[1], east, north);
                    double[] en = localEN(fp[0], fp[1]);
                    r.time.add(T);
                    r.lat.add(ant[0]);
                    r.lon.add(ant[1]);
                    r.twtt.add(2 * tOne);
                    r.angle.add(beams[b]);
                    r.heading.add(normDeg(Math.toDegrees(hdg)));
                    r.heave.add(motion.heave(T));
                    r.roll.add(motion.roll(T));
                    r.pitch.add(motion.pitch(T));
                    r.trueLat.add(fp[0]);
                    r.trueLon.add(fp[1]);
                    r.trueEast.add(en[0]);
                    r.trueNorth.add(en[1]);
                    r.trueDepth.add(seabed.depth(en[0], en[1]));
                    r.sog.add(lp.speed());
                    r.line.add(lineId);
                    r.beam.add(beams.length == 1 ? -1 : b);
                }
            }
        }
        return r;
    }

    /**
     * One-way time at which the ray meets the seabed: solves depth-below-surface(ray) = seabed
     * depth + water level at the footprint. The misfit is negative at t = 0 and grows with time;
     * a bracket is found by doubling, then refined by the Illinois variant of false position
     * (robust on steep-sided features such as the wreck) to 0.01 micrometre.
     */
    private double solveTime(double T, double[] ant, Vector3D arm, double zt, double theta, double az, double[] out) {
        double lo = 0, flo = misfit(T, ant, arm, zt, theta, az, 0, out);
        if (!(flo < 0)) throw new IllegalStateException("transducer at or below the seabed: misfit " + flo + " m");
        double hi = 0.005, fhi = misfit(T, ant, arm, zt, theta, az, hi, out);
        while (fhi < 0) {
            lo = hi; flo = fhi;
            hi *= 2;
            if (hi > 10) throw new IllegalStateException("ray never meets the seabed");
            fhi = misfit(T, ant, arm, zt, theta, az, hi, out);
        }
        int side = 0;
        double t = hi;
        for (int k = 0; k < 200; k++) {
            t = (lo * fhi - hi * flo) / (fhi - flo);
            double ft = misfit(T, ant, arm, zt, theta, az, t, out);
            if (Math.abs(ft) < 1e-8 || hi - lo < 1e-13) break;
            if (ft > 0) {
                hi = t; fhi = ft;
                if (side == 1) flo /= 2;
                side = 1;
            } else {
                lo = t; flo = ft;
                if (side == -1) fhi /= 2;
                side = -1;
            }
        }
        double f = misfit(T, ant, arm, zt, theta, az, t, out);
        if (Math.abs(f) > 1e-6) throw new IllegalStateException("forward model did not converge: misfit " + f + " m");
        return t;
    }

    private double misfit(double T, double[] ant, Vector3D arm, double zt, double theta, double az, double t, double[] out) {
        tracer.trace(zt, theta, t, out);
        double north = arm.getX() + out[1] * Math.cos(az), east = arm.getY() + out[1] * Math.sin(az);
        double[] fp = offset(ant[0], ant[1], east, north);
        double[] en = localEN(fp[0], fp[1]);
        return zt + out[0] - (seabed.depth(en[0], en[1]) + water.level(T, en[0], en[1]));
    }

    /** Antenna lat/lon at time t along a line (the antenna runs the planned line). */
    private double[] antenna(LinePlan lp, double course, double t) {
        double e = lp.e0() + Math.sin(course) * lp.speed() * t;
        double n = lp.n0() + Math.cos(course) * lp.speed() * t;
        return fromLocal(e, n);
    }

    /** Lat/lon (deg) of a point on the origin's tangent plane, by ECEF. */
    public double[] fromLocal(double east, double north) {
        double[] p = new double[3];
        for (int k = 0; k < 3; k++) p[k] = originEcef[k] + east * originEnu[0][k] + north * originEnu[1][k];
        return geodetic(p);
    }

    /** East/north (m) of a lat/lon on the origin's tangent plane, by ECEF (height ignored). */
    public double[] localEN(double lat, double lon) {
        double[] p = ecef(lat, lon, 0);
        double dx = p[0] - originEcef[0], dy = p[1] - originEcef[1], dz = p[2] - originEcef[2];
        return new double[]{dx * originEnu[0][0] + dy * originEnu[0][1] + dz * originEnu[0][2],
                dx * originEnu[1][0] + dy * originEnu[1][1] + dz * originEnu[1][2]};
    }

    /** Lat/lon of a point offset east/north metres in the tangent plane at (lat, lon), by ECEF. */
    static double[] offset(double lat, double lon, double east, double north) {
        double[] p = ecef(lat, lon, 0);
        double[][] enu = enuAxes(lat, lon);
        for (int k = 0; k < 3; k++) p[k] += east * enu[0][k] + north * enu[1][k];
        return geodetic(p);
    }

    static double[] ecef(double latDeg, double lonDeg, double h) {
        double la = Math.toRadians(latDeg), lo = Math.toRadians(lonDeg);
        double n = A / Math.sqrt(1 - E2 * Math.sin(la) * Math.sin(la));
        return new double[]{(n + h) * Math.cos(la) * Math.cos(lo), (n + h) * Math.cos(la) * Math.sin(lo),
                (n * (1 - E2) + h) * Math.sin(la)};
    }

    static double[][] enuAxes(double latDeg, double lonDeg) {
        double la = Math.toRadians(latDeg), lo = Math.toRadians(lonDeg);
        return new double[][]{
                {-Math.sin(lo), Math.cos(lo), 0},
                {-Math.sin(la) * Math.cos(lo), -Math.sin(la) * Math.sin(lo), Math.cos(la)},
                {Math.cos(la) * Math.cos(lo), Math.cos(la) * Math.sin(lo), Math.sin(la)}};
    }

    /** ECEF to geodetic lat/lon (deg) by fixed-point iteration on latitude (converges to 1e-12 rad). */
    static double[] geodetic(double[] p) {
        double lon = Math.atan2(p[1], p[0]);
        double r = Math.hypot(p[0], p[1]);
        double lat = Math.atan2(p[2], r * (1 - E2));
        for (int k = 0; k < 10; k++) {
            double n = A / Math.sqrt(1 - E2 * Math.sin(lat) * Math.sin(lat));
            double h = r / Math.cos(lat) - n;
            lat = Math.atan2(p[2], r * (1 - E2 * n / (n + h)));
        }
        return new double[]{Math.toDegrees(lat), Math.toDegrees(lon)};
    }

    static double normDeg(double d) {
        double x = d % 360;
        return x < 0 ? x + 360 : x;
    }

    /** Gaussian noise helper for scenarios. */
    public static double gauss(Random rnd, double sigma) { return rnd.nextGaussian() * sigma; }

    /** Growable primitive double list. */
    public static final class DoubleList {
        private double[] a = new double[256];
        private int n;
        public void add(double v) { if (n == a.length) a = java.util.Arrays.copyOf(a, 2 * n); a[n++] = v; }
        public double get(int i) { return a[i]; }
        public void set(int i, double v) { a[i] = v; }
        public int size() { return n; }
        public double[] toArray() { return java.util.Arrays.copyOf(a, n); }
    }

    /** Growable primitive int list. */
    public static final class IntList {
        private int[] a = new int[256];
        private int n;
        public void add(int v) { if (n == a.length) a = java.util.Arrays.copyOf(a, 2 * n); a[n++] = v; }
        public int get(int i) { return a[i]; }
        public int size() { return n; }
        public int[] toArray() { return java.util.Arrays.copyOf(a, n); }
    }
}
