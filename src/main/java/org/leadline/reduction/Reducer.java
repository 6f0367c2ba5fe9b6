package org.leadline.reduction;

import org.leadline.survey.PingTable;
import org.leadline.survey.SoundingTable;
import org.leadline.survey.SoundingTable.Reason;
import org.leadline.survey.Vessel;

import java.util.stream.IntStream;

/**
 * Sounding reduction: turns each ping's travel time into a depth below chart datum at a position.
 *
 * <pre>
 *   transducer depth  zt = draft + settlement(SOG) - heave + induced heave of the transducer lever arm
 *   depth below surface  = zt + ray depth (Snell's law through the profile, from zt, for the travel time)
 *   depth below datum    = depth below surface - water level above chart datum
 *   position             = position reference + R(heading, pitch, roll) (transducer - reference offsets)
 *                          + ray horizontal range along the beam's earth azimuth
 * </pre>
 * The attitude rotation is the usual body-to-local-level sequence {@code Rz(heading) Ry(pitch)
 * Rx(roll)} for a frame with x forward, y starboard, z down (e.g. Titterton and Weston 2004,
 * "Strapdown Inertial Navigation Technology", ch. 3), which gives exactly DESIGN.md's sign
 * conventions (roll positive starboard down, pitch positive bow up). Horizontal offsets are applied
 * in the local north/east plane with the WGS84 meridian and prime-vertical radii of curvature, then
 * projected: this avoids grid-convergence errors, and the curvature error over a 200 m offset is
 * below 0.01 mm.
 *
 * <p>Single-beam pings without a beam angle are taken as vertical in the earth frame: the first
 * return of a single-beam sounder comes from the nearest seabed within its cone, so roll and pitch
 * are not applied to them (common practice). A ping given as {@code depth} at the sounder's set
 * speed is turned back into a one-way time {@code depth / (setSpeed cos(beam angle))}.
 *
 * <p>Pure and thread-safe: pings are independent, reduced in parallel chunks with results identical
 * to a sequential run.
 */
public final class Reducer {
    private static final double WGS84_A = 6378137.0;
    private static final double WGS84_E2 = 6.69437999014e-3;

    /** Traces one beam: fills out[0] = depth below start depth (m), out[1] = horizontal range (m). */
    @FunctionalInterface
    public interface BeamTracer {
        void trace(double startDepth, double launchAngleFromVertical, double oneWayTime, double[] out);
    }

    /**
     * Per-ping sensor values after the time merge (degrees for angles, metres, m/s), and per-ping
     * choices made upstream (cast, water level). A NaN latitude means the ping had no navigation.
     */
    public record MergedInputs(double[] lat, double[] lon, double[] heading, double[] heave,
                               double[] roll, double[] pitch, double[] speedOverGround,
                               byte[] preReason) {}

    /**
     * Water level above chart datum at a time and the sounding's position, m; must be thread-safe.
     * Returns NaN when unknown (the sounding is then rejected as having no water level).
     */
    @FunctionalInterface
    public interface WaterLevelAt {
        double level(double time, double lat, double lon);
    }

    /**
     * How each ping chooses its ray tracer: {@code castA[i]} (and, when {@code weight[i] > 0},
     * {@code castB[i]} blended with that weight on B).
     */
    public record CastChoice(int[] castA, int[] castB, double[] weight) {}

    /** Converts WGS84 lat/lon (degrees) to projected easting/northing in bulk. */
    @FunctionalInterface
    public interface Projector {
        void forward(double[] lat, double[] lon, double[] easting, double[] northing);
    }

    private final Vessel vessel;
    private final boolean rollStabilised;

    /**
     * @param vessel         the survey vessel
     * @param rollStabilised true when the ping table's beam angles are already earth-referenced
     *                       across track (roll compensated by the sounder)
     */
    public Reducer(Vessel vessel, boolean rollStabilised) {
        this.vessel = vessel;
        this.rollStabilised = rollStabilised;
    }

    /**
     * Reduces all pings.
     *
     * @param pings    raw pings
     * @param in       merged sensors and water levels, one entry per ping
     * @param tracers  one tracer per cast (index as in {@code choice})
     * @param choice   which cast each ping uses
     * @param waterLevel water level above chart datum, looked up at the sounding's own position
     * @param projector to the run's projected CRS
     */
    public SoundingTable reduce(PingTable pings, MergedInputs in, BeamTracer[] tracers, CastChoice choice,
                                WaterLevelAt waterLevel, Projector projector) {
        int n = pings.size;
        SoundingTable s = new SoundingTable(n, pings.lineNames(), pings.time, pings.line, pings.beam);
        int chunk = 1 << 14;
        int chunks = (n + chunk - 1) / chunk;
        IntStream.range(0, chunks).parallel().forEach(c -> {
            double[] out = new double[2], out2 = new double[2];
            PingState ping = new PingState();
            int end = Math.min(n, (c + 1) * chunk);
            for (int i = c * chunk; i < end; i++) reduceOne(i, pings, in, tracers, choice, waterLevel, s, out, out2, ping);
        });
        projector.forward(s.lat, s.lon, s.easting, s.northing);
        return s;
    }

    /**
     * What depends only on the ping's sensor state (attitude, heave, speed, position): the beams of
     * one ping share it, so it is computed once per ping. The same expressions on the same inputs,
     * so the results are bit-for-bit those of computing it per beam.
     */
    private static final class PingState {
        boolean valid;
        double roll, pitch, heave, heading, sog, lat;
        double cf, sf, ct, st, zt, ch, sh, fwd0, stb0, meridian, primeVertical, cosLat;

        /** sin and cos of recent beam angles (a swath repeats the same angles ping after ping), direct-mapped by bits. */
        final long[] angleBits = new long[256];
        final double[] angleSin = new double[256], angleCos = new double[256];

        PingState() { java.util.Arrays.fill(angleBits, Double.doubleToRawLongBits(Double.NaN)); }

        /** Math.sin(beam) into angleSin[slot], Math.cos(beam) into angleCos[slot]; returns slot. */
        int sinCos(double beam) {
            long bits = Double.doubleToRawLongBits(beam);
            int slot = (int) (bits ^ (bits >>> 17) ^ (bits >>> 35)) & 255;
            if (angleBits[slot] != bits) {
                angleBits[slot] = bits;
                angleSin[slot] = Math.sin(beam);
                angleCos[slot] = Math.cos(beam);
            }
            return slot;
        }

        boolean matches(double roll, double pitch, double heave, double heading, double sog, double lat) {
            return valid && same(roll, this.roll) && same(pitch, this.pitch) && same(heave, this.heave)
                    && same(heading, this.heading) && same(sog, this.sog) && same(lat, this.lat);
        }

        private static boolean same(double a, double b) {
            return Double.doubleToRawLongBits(a) == Double.doubleToRawLongBits(b);
        }
    }

    private void reduceOne(int i, PingTable p, MergedInputs in, BeamTracer[] tracers, CastChoice choice,
                           WaterLevelAt waterLevel, SoundingTable s, double[] out, double[] out2, PingState ps) {
        s.cast[i] = choice.castA()[i];
        s.speedOverGround[i] = in.speedOverGround()[i];
        byte pre = in.preReason() == null ? 0 : in.preReason()[i];
        if (pre != 0) {
            s.status[i] = SoundingTable.Status.REJECTED.code;
            s.reason[i] = pre;
            return;
        }
        double lat = in.lat()[i], lon = in.lon()[i];
        if (!Double.isFinite(lat) || !Double.isFinite(lon)) {
            s.reject(i, Reason.NO_NAVIGATION);
            return;
        }
        double oneWay;
        double beamDeg = p.angle[i];
        boolean vertical = Double.isNaN(beamDeg);
        double beam = vertical ? 0 : Math.toRadians(beamDeg);
        if (Double.isFinite(p.twtt[i])) {
            oneWay = p.twtt[i] / 2;
        } else {
            oneWay = p.depth[i] / (vessel.sounderSetSpeed() * Math.cos(beam));
        }
        if (!(oneWay > 0)) {
            s.reject(i, Reason.NO_RETURN);
            return;
        }
        double roll = nz(in.roll()[i]), pitch = nz(in.pitch()[i]), heave = nz(in.heave()[i]);
        double headingDeg = nz(in.heading()[i]);
        double sog = in.speedOverGround()[i];
        Vessel.Offset T = vessel.transducerOffset(), P = vessel.positionOffset();
        double dx = T.x() - P.x(), dy = T.y() - P.y(), dz = T.z() - P.z();
        if (!ps.matches(roll, pitch, heave, headingDeg, sog, lat)) {
            double hdg = Math.toRadians(headingDeg);
            double phi = Math.toRadians(roll), th = Math.toRadians(pitch);
            double cf = Math.cos(phi), sf = Math.sin(phi), ct = Math.cos(th), st = Math.sin(th);
            // Ry(pitch) Rx(roll) applied to v = (x, y, z): level-frame (forward, starboard, down) components
            double indHeave = levelZ(T.x(), T.y(), T.z(), cf, sf, ct, st) - T.z();
            ps.zt = vessel.transducerDraft() + vessel.settlement(sog) - heave + indHeave;
            ps.cf = cf; ps.sf = sf; ps.ct = ct; ps.st = st;
            ps.ch = Math.cos(hdg);
            ps.sh = Math.sin(hdg);
            ps.fwd0 = levelX(dx, dy, dz, cf, sf, ct, st);
            ps.stb0 = levelY(dx, dy, dz, cf, sf);
            double latR = Math.toRadians(lat);
            double sl = Math.sin(latR);
            double w2 = 1 - WGS84_E2 * sl * sl;
            ps.primeVertical = WGS84_A / Math.sqrt(w2);
            ps.meridian = WGS84_A * (1 - WGS84_E2) / (w2 * Math.sqrt(w2));
            ps.cosLat = Math.cos(latR);
            ps.roll = roll; ps.pitch = pitch; ps.heave = heave; ps.heading = headingDeg; ps.sog = sog; ps.lat = lat;
            ps.valid = true;
        }
        double cf = ps.cf, sf = ps.sf, ct = ps.ct, st = ps.st;
        double zt = ps.zt;

        // Launch direction in the level frame
        double lf, ls, ld; // forward, starboard, down components of the unit launch vector
        if (vertical) {
            lf = 0; ls = 0; ld = 1;
        } else if (rollStabilised) {
            // angle already earth-referenced across track; pitch still tilts it fore-aft
            int k = ps.sinCos(beam);
            double y = ps.angleSin[k], z = ps.angleCos[k];
            lf = st * z; ls = y; ld = ct * z;
        } else {
            int k = ps.sinCos(beam);
            double y = ps.angleSin[k], z = ps.angleCos[k];
            double y1 = cf * y - sf * z, z1 = sf * y + cf * z; // Rx(roll)
            lf = st * z1; ls = y1; ld = ct * z1;               // Ry(pitch)
        }
        double horiz = Math.sqrt(lf * lf + ls * ls); // not Math.hypot: 5x slower, and no overflow is possible here
        double theta = Math.atan2(horiz, ld);
        // direction of the launch vector's horizontal part relative to the bow, as its sine and
        // cosine (ls/horiz, lf/horiz; the angle itself is never needed)
        double sinAz = horiz == 0 ? 0 : ls / horiz, cosAz = horiz == 0 ? 1 : lf / horiz;

        int a = choice.castA()[i];
        tracers[a].trace(zt, theta, oneWay, out);
        double w = choice.weight() == null ? 0 : choice.weight()[i];
        if (w > 0) {
            tracers[choice.castB()[i]].trace(zt, theta, oneWay, out2);
            out[0] = (1 - w) * out[0] + w * out2[0];
            out[1] = (1 - w) * out[1] + w * out2[1];
        }
        double surfaceDepth = zt + out[0];
        s.surfaceDepth[i] = surfaceDepth;
        s.launchAngle[i] = theta;
        s.acrossTrack[i] = out[1] * sinAz + ps.stb0;

        // Horizontal offset of the footprint from the position reference, level frame then north/east
        double fwd = ps.fwd0 + out[1] * cosAz;
        double stb = ps.stb0 + out[1] * sinAz;
        double ch = ps.ch, sh = ps.sh;
        double north = fwd * ch - stb * sh;
        double east = fwd * sh + stb * ch;
        s.lat[i] = lat + Math.toDegrees(north / ps.meridian);
        s.lon[i] = wrapLon(lon + Math.toDegrees(east / (ps.primeVertical * ps.cosLat)));
        double level = waterLevel.level(p.time[i], s.lat[i], s.lon[i]);
        s.depth[i] = surfaceDepth - level;
        if (Double.isNaN(level)) {
            s.reject(i, Reason.NO_WATER_LEVEL);
            return;
        }
        s.status[i] = SoundingTable.Status.ACCEPTED.code;
    }

    /** x (forward) component of Ry(pitch) Rx(roll) v. */
    private static double levelX(double x, double y, double z, double cf, double sf, double ct, double st) {
        double z1 = sf * y + cf * z;
        return ct * x + st * z1;
    }

    /** y (starboard) component of Ry(pitch) Rx(roll) v. */
    private static double levelY(double x, double y, double z, double cf, double sf) {
        return cf * y - sf * z;
    }

    /** z (down) component of Ry(pitch) Rx(roll) v. */
    private static double levelZ(double x, double y, double z, double cf, double sf, double ct, double st) {
        double z1 = sf * y + cf * z;
        return -st * x + ct * z1;
    }

    private static double nz(double v) { return Double.isNaN(v) ? 0 : v; }

    private static double wrapLon(double lon) {
        if (lon > 180) return lon - 360;
        if (lon < -180) return lon + 360;
        return lon;
    }
}
