package org.leadline.reduction;

import java.util.List;
import org.leadline.survey.TideZone;
import org.leadline.survey.WaterLevelSeries;

/**
 * Water level at a sounding by discrete tide zoning from one reference gauge.
 *
 * <p>In the zone that contains the point, the level is the gauge's level read earlier by the
 * zone's time offset and scaled by its range ratio:
 * <pre>  level(t, zone) = rangeRatio * gauge(t - timeOffset)</pre>
 * A positive offset means the tide arrives later in the zone than at the gauge. This is the
 * simple discrete zoning of common practice (time and range correctors per zone applied to a
 * reference gauge). The ratio scales the whole level above chart datum, which is exact when
 * chart datum lies at the zone's low water; where it does not, the zone's datum offset must be
 * folded into the gauge record beforehand. The zone is the first in list order that contains the
 * point ({@link TideZone#contains}).
 *
 * <p>Outside every zone the gauge's own level is used, unless the zoning is built with
 * {@code zonesMustCover}: then such points get NaN and {@link Refusal#OUTSIDE_ZONES}. Outside the
 * gauge record (after the time offset) the level is NaN and {@link Refusal#OUTSIDE_GAUGE_RECORD}:
 * never extrapolated.
 */
public final class TideZoning {
    /** Why no level was given. */
    public enum Refusal { NONE, OUTSIDE_GAUGE_RECORD, OUTSIDE_ZONES }

    private final WaterLevelSeries gauge;
    private final List<TideZone> zones;
    private final boolean zonesMustCover;
    private final double[][] box; // per zone: min lat, max lat, min lon, max lon

    /** Zoning with the gauge's own level outside every zone. */
    public TideZoning(WaterLevelSeries gauge, List<TideZone> zones) { this(gauge, zones, false); }

    /**
     * @param gauge          the reference gauge, m above chart datum
     * @param zones          the zones, first match wins
     * @param zonesMustCover true to refuse points outside every zone instead of using the gauge
     */
    public TideZoning(WaterLevelSeries gauge, List<TideZone> zones, boolean zonesMustCover) {
        this.gauge = gauge;
        this.zones = List.copyOf(zones);
        this.zonesMustCover = zonesMustCover;
        box = new double[this.zones.size()][];
        for (int z = 0; z < box.length; z++) {
            double[] b = {Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY, Double.NEGATIVE_INFINITY};
            TideZone zone = this.zones.get(z);
            for (int r = 0; r < zone.lat().length; r++) {
                for (int i = 0; i < zone.lat()[r].length; i++) {
                    b[0] = Math.min(b[0], zone.lat()[r][i]); b[1] = Math.max(b[1], zone.lat()[r][i]);
                    b[2] = Math.min(b[2], zone.lon()[r][i]); b[3] = Math.max(b[3], zone.lon()[r][i]);
                }
            }
            box[z] = b;
        }
    }

    public List<TideZone> zones() { return zones; }
    public WaterLevelSeries gauge() { return gauge; }

    /** Index of the zone containing the point (first in list order), -1 when none. */
    public int zoneAt(double lat, double lon) {
        for (int z = 0; z < box.length; z++) {
            double[] b = box[z];
            if (lat < b[0] || lat > b[1] || lon < b[2] || lon > b[3]) continue;
            if (zones.get(z).contains(lat, lon)) return z;
        }
        return -1;
    }

    /**
     * Water level above chart datum at time t and position, m (positive up); NaN when refused.
     *
     * @param t   s since the epoch, UTC
     * @param lat degrees
     * @param lon degrees
     */
    public double level(double t, double lat, double lon) {
        int z = zoneAt(lat, lon);   // at the sounding's own position, every time
        if (z < 0 && zonesMustCover) return Double.NaN;
        // The beams of a ping share its time, and mostly its zone: the gauge is read once per
        // (time, zone) on each thread. The memo holds the exact value computed below for that pair.
        double[] m = memo.get();
        if (m[0] == z && Double.doubleToRawLongBits(m[1]) == Double.doubleToRawLongBits(t)) return m[2];
        double level;
        if (z < 0) {
            level = gauge.level(t);
        } else {
            TideZone zone = zones.get(z);
            level = zone.rangeRatio() * gauge.level(t - zone.timeOffset());
        }
        m[0] = z;
        m[1] = t;
        m[2] = level;
        return level;
    }

    /** Per thread: {zone, time, level} of the last gauge reading (zone -2: none yet). */
    private final ThreadLocal<double[]> memo = ThreadLocal.withInitial(() -> new double[] {-2, Double.NaN, Double.NaN});

    /** Why {@link #level} gives NaN at this time and place, or {@link Refusal#NONE}. */
    public Refusal refusal(double t, double lat, double lon) {
        int z = zoneAt(lat, lon);
        if (z < 0 && zonesMustCover) return Refusal.OUTSIDE_ZONES;
        double shifted = z < 0 ? t : t - zones.get(z).timeOffset();
        return gauge.covers(shifted) ? Refusal.NONE : Refusal.OUTSIDE_GAUGE_RECORD;
    }
}
