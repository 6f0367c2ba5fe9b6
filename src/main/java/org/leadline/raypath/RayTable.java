package org.leadline.raypath;

import org.leadline.watercolumn.SoundSpeedProfile;

/**
 * Fast ray bending by table: for one sound-speed profile, the same answer as {@link RayTracer}
 * (depth below the start depth and horizontal distance after a one-way time) read from tables
 * built once, for start depths in a band, launch angles up to a maximum and times up to a maximum.
 *
 * <p>Design. A ray launched at angle a from start depth zs has Snell parameter p = sin(a)/c(zs)
 * and is the same ray, from zs on, as the ray of parameter p that passes through the top of the
 * band zMin going down. So the table holds, for rays on a grid in p that all start at zMin:
 * <ul>
 *   <li>a start table, on a depth grid over the band: the time T0(p, z) and horizontal distance
 *       X0(p, z) from zMin down to z, with their exact depth derivatives 1/(c cos th) and tan th;</li>
 *   <li>a path table, on a uniform grid of times from zMin: depth Z(p, tau) and horizontal distance
 *       X(p, tau), with their exact time derivatives c cos th and c sin th.</li>
 * </ul>
 * A look-up is then tau = T0(p, zs) + t, depth = Z(p, tau) - zs, distance = X(p, tau) - X0(p, zs),
 * with cubic Hermite interpolation along depth or time (values and exact slopes at the two
 * neighbouring nodes) and four-point Lagrange interpolation across rays. The ray grid is uniform in
 * tan(th_r), where sin(th_r) = p cRef and cRef is the slowest speed in the band: that packs rays
 * densely towards grazing angles, where Z and X change fastest with p. The rays at negative p needed
 * by the stencil near the vertical are mirror images (Z even, X odd in p). Every node lies on an
 * exact ray from {@link RayTracer}; the only error is interpolation.
 *
 * <p>Domain: zMin &lt;= zs &lt;= zMax, |a| &lt;= maxAngle, 0 &lt;= t &lt;= maxTime, and the ray must stay
 * below {@value #DEFAULT_GRAZING_DEG} degrees from the vertical up to the point asked for (beyond
 * that, near a turning point, the table holds no data). Anywhere else {@link #lookup} falls back to
 * exact tracing, so it always answers. Accuracy inside the domain with the default grids: better than
 * 1 mm in depth and 1 cm horizontally, measured against exact tracing on dense random samples in
 * {@code RayTableTest} (numbers in docs/science/raypath.md). Thread-safe; immutable apart from a
 * diagnostic count of fall-backs to exact tracing.
 *
 * <pre>{@code
 * RayTable table = RayTable.forDepth(profile, 0, 10, Math.toRadians(75), 120);
 * double[] out = new double[2];
 * table.lookup(4.2, Math.toRadians(60), 0.05, out);   // same as RayTracer.trace to < 1 mm
 * }</pre>
 */
public final class RayTable {
    /** Rays beyond this angle from the vertical are left to exact tracing (near turning points). */
    public static final double DEFAULT_GRAZING_DEG = 86;
    /** Longest time step of the path table, s (used when the profile has no sharp gradient change). */
    public static final double MAX_TIME_STEP = 0.002;
    /** Shortest time step chosen automatically, s (bounds the table's size for very jagged profiles). */
    public static final double MIN_TIME_STEP = 0.00025;
    /** Default depth step of the start table, m. */
    public static final double DEFAULT_DEPTH_STEP = 0.25;
    /** Default number of ray intervals between the vertical and the maximum angle. */
    public static final int DEFAULT_RAYS = 160;

    private final RayTracer tracer;
    private final java.util.concurrent.atomic.LongAdder fallbacks = new java.util.concurrent.atomic.LongAdder();
    private final SoundSpeedProfile profile;
    private final double zMin, zMax, maxAngle, maxTime;
    private final double cRef;
    private final double hw, invHw;        // ray grid step in tan(th_r)
    private final double hz, invHz;        // start-table depth step, m
    private final double ht, invHt;        // path-table time step, s
    private final int nRays;               // stored rays, including the mirrored one at index 0
    private final int nz, nt;
    // layout [grid node][ray][value]: the four rays of a stencil at one node are adjacent in memory
    private final double[] start;          // [z][ray][T, hz T', X, hz X']
    private final double[] path;           // [tau][ray][Z, ht Z', X, ht X']
    // sound speed over the band: c(z) at the start-table nodes, m/s, linear inside a cell unless a
    // profile sample lies strictly inside it (then the cell is flagged with NaN and the profile is asked)
    private final double[] bandSpeed;

    /**
     * A table with the default grids.
     *
     * @param profile  the sound-speed profile
     * @param zMin     shallowest start depth served, m
     * @param zMax     deepest start depth served, m (&gt;= zMin)
     * @param maxAngle largest launch angle from the vertical served, rad (&lt; pi/2)
     * @param maxTime  longest one-way time served, s
     */
    public RayTable(SoundSpeedProfile profile, double zMin, double zMax, double maxAngle, double maxTime) {
        this(profile, zMin, zMax, maxAngle, maxTime, DEFAULT_RAYS, DEFAULT_DEPTH_STEP, timeStepFor(profile),
                Math.toRadians(DEFAULT_GRAZING_DEG));
    }

    /**
     * Time step of the path table for a profile, s. Depth along a ray is smooth in time except where
     * the ray crosses a profile sample: there d2z/dt2 = g c cos(2 th) jumps by J = |g_below - g_above| c.
     * A cubic Hermite cell straddling such a kink errs by about J h^2 / 67 (fitted on the strongly
     * refracting test profile, where a 2 ms step gave 1.76 mm); the step is chosen so the worst kink
     * errs by at most 0.25 mm, between {@value #MIN_TIME_STEP} and {@value #MAX_TIME_STEP} s.
     */
    public static double timeStepFor(SoundSpeedProfile profile) {
        double jump = 0;
        for (int i = 1; i + 1 < profile.size(); i++) {
            double gAbove = (profile.speed(i) - profile.speed(i - 1)) / (profile.depth(i) - profile.depth(i - 1));
            double gBelow = (profile.speed(i + 1) - profile.speed(i)) / (profile.depth(i + 1) - profile.depth(i));
            jump = Math.max(jump, Math.abs(gBelow - gAbove) * profile.speed(i));
        }
        // the ends: the profile turns constant beyond its first and last sample
        int n = profile.size();
        if (n > 1) {
            double gTop = (profile.speed(1) - profile.speed(0)) / (profile.depth(1) - profile.depth(0));
            double gBot = (profile.speed(n - 1) - profile.speed(n - 2)) / (profile.depth(n - 1) - profile.depth(n - 2));
            jump = Math.max(jump, Math.max(Math.abs(gTop) * profile.speed(0), Math.abs(gBot) * profile.speed(n - 1)));
        }
        double h = jump > 0 ? Math.sqrt(67 * 0.25e-3 / jump) : MAX_TIME_STEP;
        return Math.max(MIN_TIME_STEP, Math.min(MAX_TIME_STEP, h));
    }

    /**
     * A table sized to reach a given depth: maxTime is the time a ray at maxAngle launched from zMin
     * would take to reach maxDepth if it kept its launch angle at the slowest speed of the profile,
     * (maxDepth - zMin) / (cMin cos maxAngle), which is longer than any real ray needs unless
     * refraction bends it towards the horizontal. Example: maxDepth twice the profile's deepest sample.
     */
    public static RayTable forDepth(SoundSpeedProfile profile, double zMin, double zMax, double maxAngle,
                                    double maxDepth) {
        double cMin = Double.POSITIVE_INFINITY;
        for (int i = 0; i < profile.size(); i++) cMin = Math.min(cMin, profile.speed(i));
        double maxTime = (maxDepth - zMin) / (cMin * Math.cos(maxAngle));
        return new RayTable(profile, zMin, zMax, maxAngle, maxTime);
    }

    /** A table with explicit grid sizes (for accuracy studies). */
    RayTable(SoundSpeedProfile profile, double zMin, double zMax, double maxAngle, double maxTime,
             int rays, double depthStep, double timeStep, double grazing) {
        if (!(zMax >= zMin) || !(maxAngle > 0 && maxAngle < grazing && grazing < Math.PI / 2)
                || !(maxTime > 0) || rays < 2 || !(depthStep > 0) || !(timeStep > 0)
                || !Double.isFinite(zMin) || !Double.isFinite(zMax) || !Double.isFinite(maxTime)) {
            throw new IllegalArgumentException("ray table needs zMin <= zMax, 0 < maxAngle < grazing limit < pi/2,"
                    + " maxTime > 0 and positive grid steps; got zMin " + zMin + " m, zMax " + zMax + " m, maxAngle "
                    + maxAngle + " rad, maxTime " + maxTime + " s");
        }
        this.tracer = new RayTracer(profile);
        this.profile = profile;
        this.zMin = zMin;
        this.zMax = zMax;
        this.maxAngle = maxAngle;
        this.maxTime = maxTime;
        double cr = Math.min(profile.speedAt(zMin), profile.speedAt(zMax));
        for (int i = 0; i < profile.size(); i++) {
            if (profile.depth(i) > zMin && profile.depth(i) < zMax) cr = Math.min(cr, profile.speed(i));
        }
        this.cRef = cr;
        this.hw = Math.tan(maxAngle) / rays;
        this.invHw = 1 / hw;
        // nodes at w = (m - 1) hw for m = 0..rays+3: one mirrored node below 0, two spare above the top
        this.nRays = rays + 4;
        this.nz = Math.max(2, (int) Math.ceil((zMax - zMin) / depthStep) + 1);
        this.hz = nz > 1 && zMax > zMin ? (zMax - zMin) / (nz - 1) : depthStep;
        this.invHz = 1 / hz;
        this.ht = timeStep;
        this.invHt = 1 / ht;

        this.bandSpeed = new double[nz];
        for (int i = 0; i < nz; i++) bandSpeed[i] = profile.speedAt(zMin + i * hz);
        for (int i = 0; i + 1 < nz; i++) {
            double za = zMin + i * hz, zb = za + hz;
            for (int q = 0; q < profile.size(); q++) {
                if (profile.depth(q) > za && profile.depth(q) < zb) { bandSpeed[i] = Double.NaN; break; }
            }
        }

        double maxSin = Math.sin(grazing);
        double[] tmp = new double[4];
        this.start = new double[nRays * nz * 4];
        double t0Max = 0;
        for (int m = 1; m < nRays; m++) {
            double p = rayParameter(m);
            for (int i = 0; i < nz; i++) {
                double z = zMin + i * hz;
                if (p == 0) {
                    double cz = profile.speedAt(z);
                    tmp[0] = profile.travelTime(zMin, z); tmp[1] = 0; tmp[2] = 1 / cz; tmp[3] = 0;
                } else {
                    tracer.descend(zMin, z, p, maxSin, tmp);
                }
                int b = (i * nRays + m) * 4;
                start[b] = tmp[0];
                start[b + 1] = hz * tmp[2];
                start[b + 2] = tmp[1];
                start[b + 3] = hz * tmp[3];
                if (tmp[0] > t0Max) t0Max = tmp[0];
            }
        }
        mirror(start, nz, nRays);

        this.nt = (int) Math.ceil((t0Max + maxTime) / ht) + 2;
        this.path = new double[nRays * nt * 4];
        double[] zs = new double[nt], zr = new double[nt], xs = new double[nt], xr = new double[nt];
        for (int m = 1; m < nRays; m++) {
            double p = rayParameter(m);
            int filled;
            if (p == 0) {
                for (int k = 0; k < nt; k++) {
                    zs[k] = profile.depthAfter(zMin, k * ht);
                    zr[k] = profile.speedAt(zs[k]);
                    xs[k] = 0;
                    xr[k] = 0;
                }
                filled = nt;
            } else {
                filled = tracer.sampleDown(zMin, p, ht, nt, zs, zr, xs, xr, maxSin);
            }
            for (int k = 0; k < nt; k++) {
                int b = (k * nRays + m) * 4;
                boolean ok = k < filled;
                path[b] = ok ? zs[k] : Double.NaN;
                path[b + 1] = ok ? ht * zr[k] : Double.NaN;
                path[b + 2] = ok ? xs[k] : Double.NaN;
                path[b + 3] = ok ? ht * xr[k] : Double.NaN;
            }
        }
        mirror(path, nt, nRays);
    }

    /** Ray parameter p of stored ray m, s/m (ray 1 is vertical; ray 0 its mirror). */
    private double rayParameter(int m) {
        double w = (m - 1) * hw;
        return w / Math.sqrt(1 + w * w) / cRef;
    }

    /** Fills ray 0 (w = -hw) as the mirror image of ray 2: depth and time even, distance odd in p. */
    private static void mirror(double[] table, int len, int rays) {
        for (int k = 0; k < len; k++) {
            int src = (k * rays + 2) * 4, dst = k * rays * 4;
            table[dst] = table[src];
            table[dst + 1] = table[src + 1];
            table[dst + 2] = -table[src + 2];
            table[dst + 3] = -table[src + 3];
        }
    }

    /** Outside the table: exact tracing, counted. */
    private void traceExactly(double startDepth, double launchAngle, double oneWayTime, double[] out) {
        fallbacks.increment();
        tracer.trace(startDepth, launchAngle, oneWayTime, out);
    }

    /** How many look-ups so far were answered by exact tracing because they fell outside the table. */
    public long fallbackCount() { return fallbacks.sum(); }

    public SoundSpeedProfile profile() { return profile; }
    public double minStartDepth() { return zMin; }
    public double maxStartDepth() { return zMax; }
    public double maxAngle() { return maxAngle; }
    public double maxTime() { return maxTime; }
    /** Memory held by the tables, bytes. */
    public long sizeBytes() { return 8L * (start.length + path.length); }

    /**
     * Same contract as {@link RayTracer#trace}: out[0] = depth below the start depth, m (positive
     * down); out[1] = horizontal distance along the launch azimuth, m. Outside the table's domain
     * the answer comes from exact tracing.
     *
     * @param startDepth  transducer depth, m
     * @param launchAngle angle from the downward vertical, rad (negative mirrors the distance)
     * @param oneWayTime  one-way travel time, s
     */
    public void lookup(double startDepth, double launchAngle, double oneWayTime, double[] out) {
        // one method body on purpose: splitting the table part out costs ~20 % (it is too big to inline)
        double a = Math.abs(launchAngle);
        if (!(startDepth >= zMin && startDepth <= zMax && a <= maxAngle && oneWayTime >= 0 && oneWayTime <= maxTime)) {
            traceExactly(startDepth, launchAngle, oneWayTime, out);
            return;
        }
        double uz = (startDepth - zMin) * invHz;
        int iz = Math.min((int) uz, nz - 2);
        double fz = uz - iz;
        double ca = bandSpeed[iz], cb = bandSpeed[iz + 1];
        // a NaN flags a cell with a profile sample inside: then node iz + 1 has no stored speed either
        double cz = ca == ca && cb == cb ? ca + fz * (cb - ca) : profile.speedAt(startDepth);
        // u = tan(th_r) / hw with sin(th_r) = sin(a) cRef / c(zs), in one division and one square root
        double sc = Math.sin(a) * cRef;
        double u = sc * invHw / Math.sqrt((cz - sc) * (cz + sc));
        int j = (int) u;                       // stencil: stored rays j .. j+3 (w nodes j-1 .. j+2)
        double f = u - j;
        double fm1 = f - 1, fm2 = f - 2, fp1 = f + 1;
        double l0 = -f * fm1 * fm2 * (1.0 / 6);
        double l1 = fp1 * fm1 * fm2 * 0.5;
        double l2 = -fp1 * f * fm2 * 0.5;
        double l3 = fp1 * f * fm1 * (1.0 / 6);

        // cubic Hermite basis on the depth cell (slopes are stored pre-multiplied by the step)
        double a00 = (1 + 2 * fz) * (1 - fz) * (1 - fz), a10 = fz * (1 - fz) * (1 - fz);
        double a01 = fz * fz * (3 - 2 * fz), a11 = fz * fz * (fz - 1);
        double[] st = start;
        int b0 = (iz * nRays + j) * 4, b1 = b0 + nRays * 4;
        double t0 = l0 * (a00 * st[b0] + a10 * st[b0 + 1] + a01 * st[b1] + a11 * st[b1 + 1])
                + l1 * (a00 * st[b0 + 4] + a10 * st[b0 + 5] + a01 * st[b1 + 4] + a11 * st[b1 + 5])
                + l2 * (a00 * st[b0 + 8] + a10 * st[b0 + 9] + a01 * st[b1 + 8] + a11 * st[b1 + 9])
                + l3 * (a00 * st[b0 + 12] + a10 * st[b0 + 13] + a01 * st[b1 + 12] + a11 * st[b1 + 13]);
        double x0 = l0 * (a00 * st[b0 + 2] + a10 * st[b0 + 3] + a01 * st[b1 + 2] + a11 * st[b1 + 3])
                + l1 * (a00 * st[b0 + 6] + a10 * st[b0 + 7] + a01 * st[b1 + 6] + a11 * st[b1 + 7])
                + l2 * (a00 * st[b0 + 10] + a10 * st[b0 + 11] + a01 * st[b1 + 10] + a11 * st[b1 + 11])
                + l3 * (a00 * st[b0 + 14] + a10 * st[b0 + 15] + a01 * st[b1 + 14] + a11 * st[b1 + 15]);

        double ut = (t0 + oneWayTime) * invHt;
        int k = (int) ut;
        if (!(k >= 0 && k < nt - 1)) {
            traceExactly(startDepth, launchAngle, oneWayTime, out);
            return;
        }
        double ft = ut - k;
        double c00 = (1 + 2 * ft) * (1 - ft) * (1 - ft), c10 = ft * (1 - ft) * (1 - ft);
        double c01 = ft * ft * (3 - 2 * ft), c11 = ft * ft * (ft - 1);
        double[] pa = path;
        int p0 = (k * nRays + j) * 4, p1 = p0 + nRays * 4;
        double zz = l0 * (c00 * pa[p0] + c10 * pa[p0 + 1] + c01 * pa[p1] + c11 * pa[p1 + 1])
                + l1 * (c00 * pa[p0 + 4] + c10 * pa[p0 + 5] + c01 * pa[p1 + 4] + c11 * pa[p1 + 5])
                + l2 * (c00 * pa[p0 + 8] + c10 * pa[p0 + 9] + c01 * pa[p1 + 8] + c11 * pa[p1 + 9])
                + l3 * (c00 * pa[p0 + 12] + c10 * pa[p0 + 13] + c01 * pa[p1 + 12] + c11 * pa[p1 + 13]);
        double xx = l0 * (c00 * pa[p0 + 2] + c10 * pa[p0 + 3] + c01 * pa[p1 + 2] + c11 * pa[p1 + 3])
                + l1 * (c00 * pa[p0 + 6] + c10 * pa[p0 + 7] + c01 * pa[p1 + 6] + c11 * pa[p1 + 7])
                + l2 * (c00 * pa[p0 + 10] + c10 * pa[p0 + 11] + c01 * pa[p1 + 10] + c11 * pa[p1 + 11])
                + l3 * (c00 * pa[p0 + 14] + c10 * pa[p0 + 15] + c01 * pa[p1 + 14] + c11 * pa[p1 + 15]);
        double dz = zz - startDepth, dx = xx - x0;
        if (Double.isNaN(dz + dx)) { // a node in the stencil is past the grazing limit
            traceExactly(startDepth, launchAngle, oneWayTime, out);
            return;
        }
        out[0] = dz;
        out[1] = launchAngle < 0 ? -dx : dx;
        
    }

}
