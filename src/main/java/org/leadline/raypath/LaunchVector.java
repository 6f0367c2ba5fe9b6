package org.leadline.raypath;

/**
 * The earth-frame launch direction of a beam from its across-track beam angle and the vessel's
 * roll and pitch: the angle from the vertical to trace with, and the azimuth of the vertical plane
 * the ray bends in, relative to the vessel heading.
 *
 * <p>Frames and signs are those of DESIGN.md section 3: vessel frame x forward, y starboard, z down;
 * roll positive starboard down, pitch positive bow up; the beam angle beta is measured across-track
 * from the transducer's down axis, positive to starboard, so the beam is b = (0, sin beta, cos beta)
 * in the transducer frame (taken aligned with the vessel frame here; mounting angles belong to the
 * caller). The vessel-to-level rotation is the usual Tait-Bryan sequence, roll about x first, then
 * pitch about y (heading about z would follow and only adds to the azimuth); see e.g.
 * Diebel 2006, "Representing attitude: Euler angles, unit quaternions, and rotation vectors"
 * (the 3-2-1 sequence; from memory):
 * <pre>
 *   Rx(roll):  (x, y, z) -&gt; (x, y cos r - z sin r, y sin r + z cos r)
 *   Ry(pitch): (x, y, z) -&gt; (x cos p + z sin p, y, -x sin p + z cos p)
 *   e = Ry(pitch) Rx(roll) b = (cos(beta - r) sin p, sin(beta - r), cos(beta - r) cos p)
 * </pre>
 * Roll starboard-down turns the down axis to port (e_y = -sin r for beta = 0), so the earth-frame
 * across-track angle is beta - roll as DESIGN.md states; bow-up pitch turns it forward. When the
 * sounder stabilises roll, beta is already the earth-frame across-track angle and only pitch is
 * applied: e = Ry(pitch) b.
 *
 * <p>Exact to rounding. Stateless.
 */
public final class LaunchVector {
    private LaunchVector() {}

    /**
     * @param beamAngle      across-track beam angle from the transducer down axis, rad, + starboard
     * @param roll           roll, rad, + starboard down
     * @param pitch          pitch, rad, + bow up
     * @param rollStabilised true when the beam angle is already compensated for roll
     * @param out            receives out[0] = angle of the launch vector from the downward vertical,
     *                       rad in [0, pi], and out[1] = its azimuth relative to the vessel heading,
     *                       rad in (-pi, pi], 0 forward, +pi/2 starboard (0 for a vertical vector)
     */
    public static void compute(double beamAngle, double roll, double pitch, boolean rollStabilised, double[] out) {
        double across = rollStabilised ? beamAngle : beamAngle - roll;
        double ca = Math.cos(across);
        double ex = ca * Math.sin(pitch);
        double ey = Math.sin(across);
        double ez = ca * Math.cos(pitch);
        out[0] = Math.atan2(Math.sqrt(ex * ex + ey * ey), ez);
        out[1] = (ex == 0 && ey == 0) ? 0 : Math.atan2(ey, ex);
    }

    /**
     * The earth-frame unit launch vector itself (x forward, y starboard, z down; heading not applied).
     * Same arguments as {@link #compute}; out receives {e_x, e_y, e_z}.
     */
    public static void unitVector(double beamAngle, double roll, double pitch, boolean rollStabilised, double[] out) {
        double across = rollStabilised ? beamAngle : beamAngle - roll;
        double ca = Math.cos(across);
        out[0] = ca * Math.sin(pitch);
        out[1] = Math.sin(across);
        out[2] = ca * Math.cos(pitch);
    }
}
