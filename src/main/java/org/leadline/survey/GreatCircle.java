package org.leadline.survey;

/**
 * Interpolation between two positions along the great circle of their normal vectors
 * (n-vectors), which has no singularity at the poles and no seam at the antimeridian.
 *
 * <p>Method: each geodetic latitude/longitude becomes the unit normal of the WGS84 ellipsoid,
 * n = (cos lat cos lon, cos lat sin lon, sin lat) (Gade 2010, eq. 3). The two normals are joined by
 * spherical linear interpolation (Shoemake 1985, "slerp"): n(f) = [sin((1-f)w) n1 + sin(f w) n2] /
 * sin w with w the angle between them, so the point moves at a constant angular rate; it is then
 * converted back with lat = atan2(z, hypot(x, y)), lon = atan2(y, x) (Gade 2010, eq. 5-6). Because
 * n-vectors are normals of the ellipsoid, the geodetic latitudes come back exactly at f = 0 and 1;
 * between them the path is the normal-section on the sphere of normals, which differs from the
 * ellipsoidal geodesic by far less than a millimetre over the few hundred metres between two
 * navigation fixes.
 *
 * <p>Source: K. Gade, "A Non-singular Horizontal Position Representation", Journal of Navigation
 * 63(3), 395-417, 2010, doi:10.1017/S0373463309990415; K. Shoemake, "Animating rotation with
 * quaternion curves", SIGGRAPH 1985.
 */
public final class GreatCircle {
    private GreatCircle() {}

    /**
     * Position a fraction f of the way from point 1 to point 2.
     *
     * @param lat1 degrees
     * @param lon1 degrees
     * @param lat2 degrees
     * @param lon2 degrees
     * @param f    fraction, 0 gives point 1, 1 gives point 2
     * @param out  receives {lat, lon} in degrees, lon in [-180, 180]
     */
    public static void interpolate(double lat1, double lon1, double lat2, double lon2, double f, double[] out) {
        double p1 = Math.toRadians(lat1), l1 = Math.toRadians(lon1);
        double p2 = Math.toRadians(lat2), l2 = Math.toRadians(lon2);
        double x1 = Math.cos(p1) * Math.cos(l1), y1 = Math.cos(p1) * Math.sin(l1), z1 = Math.sin(p1);
        double x2 = Math.cos(p2) * Math.cos(l2), y2 = Math.cos(p2) * Math.sin(l2), z2 = Math.sin(p2);
        // angle between the normals from atan2(|n1 x n2|, n1.n2): accurate also for tiny angles
        double cx = y1 * z2 - z1 * y2, cy = z1 * x2 - x1 * z2, cz = x1 * y2 - y1 * x2;
        double w = Math.atan2(Math.sqrt(cx * cx + cy * cy + cz * cz), x1 * x2 + y1 * y2 + z1 * z2);
        double a, b;
        if (w < 1e-9) { // points closer than ~6 mm: slerp weights tend to linear ones
            a = 1 - f;
            b = f;
        } else {
            double s = Math.sin(w);
            a = Math.sin((1 - f) * w) / s;
            b = Math.sin(f * w) / s;
        }
        double x = a * x1 + b * x2, y = a * y1 + b * y2, z = a * z1 + b * z2;
        out[0] = Math.toDegrees(Math.atan2(z, Math.hypot(x, y)));
        out[1] = Math.toDegrees(Math.atan2(y, x));
    }
}
