package org.leadline.io;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.leadline.survey.Vessel;
import org.leadline.survey.Vessel.Offset;
import org.leadline.survey.Vessel.SensorSigmas;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;

/**
 * Reads {@code vessel.yaml} (docs/formats/vessel.md) into a {@link Vessel}. Units are in the key
 * names ({@code _m}, {@code _s}, {@code _m_s}, {@code _deg}, {@code _kn}); degrees and knots are
 * converted to radians and m/s (1 kn = 1852/3600 m/s exactly, the international nautical mile).
 * Only {@code draft_m} is required; everything else has the documented default. Unknown keys,
 * repeated keys, wrong types and values out of range are {@link InputException}s naming the file,
 * the line and the character column of the offending node.
 */
public final class VesselReader {
    private VesselReader() {}

    /** One knot in m/s: 1852 m per hour (international nautical mile, 1929). */
    public static final double KNOT = 1852.0 / 3600.0;

    static final Set<String> TOP = Set.of("name", "draft_m", "settlement", "offsets", "latency_s", "sounder", "uncertainty");
    static final Set<String> SETTLEMENT_ROW = Set.of("speed_kn", "settlement_m");
    static final Set<String> OFFSETS = Set.of("position_reference", "transducer");
    static final Set<String> XYZ = Set.of("x_m", "y_m", "z_m");
    static final Set<String> SOUNDER = Set.of("set_speed_m_s", "beam_width_deg");
    /** Keys of the uncertainty section, in the order of the {@link SensorSigmas} components. */
    static final List<String> SIGMA_KEYS = List.of("sounder_fixed_m", "sounder_relative_fraction",
            "sound_speed_surface_m_s", "sound_speed_profile_m_s", "draft_m", "settlement_m", "heave_fixed_m",
            "heave_relative_fraction", "roll_deg", "pitch_deg", "heading_deg", "position_m", "latency_s",
            "lever_arm_m", "water_level_m", "tide_zone_m");

    /** Default sounder set speed when the file gives none, m/s (common practice: 1500 m/s). */
    public static final double DEFAULT_SET_SPEED = 1500.0;
    /** Default full beam width when the file gives none, degrees (a common single-beam transducer). */
    public static final double DEFAULT_BEAM_WIDTH_DEG = 8.0;

    public static Vessel read(Path file) {
        YamlInput y = new YamlInput(file);
        MappingNode root = y.load();
        Map<String, Node> top = y.entries(root, "the vessel file", TOP);
        if (top.containsKey("name")) y.string(top.get("name"), "name");
        Node draftNode = top.get("draft_m");
        if (YamlInput.isNull(draftNode)) {
            throw draftNode == null ? new InputException(file, 0, 0, "expected a key 'draft_m' (static draft of the transducer, m)")
                    : y.error(draftNode, "expected a number for 'draft_m', found nothing");
        }
        double draft = y.number(draftNode, "draft_m", 0, 30, "m");

        double[] speeds = new double[0], values = new double[0];
        Node st = top.get("settlement");
        if (!YamlInput.isNull(st)) {
            List<Node> rows = y.sequence(st, "settlement");
            speeds = new double[rows.size()];
            values = new double[rows.size()];
            for (int i = 0; i < rows.size(); i++) {
                Map<String, Node> r = y.entries(y.mapping(rows.get(i), "settlement"), "a settlement row", SETTLEMENT_ROW);
                if (!r.containsKey("speed_kn") || !r.containsKey("settlement_m")) {
                    throw y.error(rows.get(i), "expected 'speed_kn' and 'settlement_m' in every settlement row");
                }
                double kn = y.number(r.get("speed_kn"), "speed_kn", 0, 60, "kn");
                speeds[i] = kn * KNOT;
                values[i] = y.number(r.get("settlement_m"), "settlement_m", -5, 5, "m");
                if (i > 0 && !(speeds[i] > speeds[i - 1])) {
                    throw y.error(r.get("speed_kn"), "expected settlement speeds to increase, found " + kn + " kn after "
                            + (speeds[i - 1] / KNOT) + " kn");
                }
            }
        }

        Offset position = Offset.ZERO, transducer = Offset.ZERO;
        Node off = top.get("offsets");
        if (!YamlInput.isNull(off)) {
            Map<String, Node> o = y.entries(y.mapping(off, "offsets"), "offsets", OFFSETS);
            if (!YamlInput.isNull(o.get("position_reference"))) position = offset(y, o.get("position_reference"), "position_reference");
            if (!YamlInput.isNull(o.get("transducer"))) transducer = offset(y, o.get("transducer"), "transducer");
        }

        double latency = top.containsKey("latency_s") ? y.number(top.get("latency_s"), "latency_s", -10, 10, "s") : 0.0;

        double setSpeed = DEFAULT_SET_SPEED, beamWidthDeg = DEFAULT_BEAM_WIDTH_DEG;
        Node so = top.get("sounder");
        if (!YamlInput.isNull(so)) {
            Map<String, Node> s = y.entries(y.mapping(so, "sounder"), "sounder", SOUNDER);
            if (s.containsKey("set_speed_m_s")) setSpeed = y.number(s.get("set_speed_m_s"), "set_speed_m_s", 1300, 1800, "m/s");
            if (s.containsKey("beam_width_deg")) {
                beamWidthDeg = y.number(s.get("beam_width_deg"), "beam_width_deg", 0, 180, "degrees");
                if (beamWidthDeg == 0) throw y.error(s.get("beam_width_deg"), "expected 'beam_width_deg' > 0, found 0");
            }
        }

        SensorSigmas sigmas = SensorSigmas.DEFAULT;
        Node un = top.get("uncertainty");
        if (!YamlInput.isNull(un)) {
            Map<String, Node> u = y.entries(y.mapping(un, "uncertainty"), "uncertainty", Set.copyOf(SIGMA_KEYS));
            double[] v = sigmaArray(SensorSigmas.DEFAULT);
            for (int k = 0; k < SIGMA_KEYS.size(); k++) {
                String key = SIGMA_KEYS.get(k);
                if (!u.containsKey(key)) continue;
                double d = y.number(u.get(key), key, 0, 1e6, "(one sigma, not negative)");
                v[k] = key.endsWith("_deg") ? Math.toRadians(d) : d;
            }
            sigmas = new SensorSigmas(v[0], v[1], v[2], v[3], v[4], v[5], v[6], v[7], v[8], v[9], v[10], v[11],
                    v[12], v[13], v[14], v[15]);
        }
        return new Vessel(draft, speeds, values, position, transducer, latency, setSpeed, Math.toRadians(beamWidthDeg), sigmas);
    }

    private static Offset offset(YamlInput y, Node n, String key) {
        Map<String, Node> m = y.entries(y.mapping(n, key), key, XYZ);
        double[] v = new double[3];
        String[] k = {"x_m", "y_m", "z_m"};
        for (int i = 0; i < 3; i++) v[i] = m.containsKey(k[i]) ? y.number(m.get(k[i]), k[i], -200, 200, "m") : 0.0;
        return new Offset(v[0], v[1], v[2]);
    }

    /** The sigma components in {@link #SIGMA_KEYS} order, SI (radians for angles). */
    static double[] sigmaArray(SensorSigmas s) {
        return new double[] {s.sounderFixed(), s.sounderRelative(), s.soundSpeedSurface(), s.soundSpeedProfile(),
                s.draft(), s.settlement(), s.heaveFixed(), s.heaveRelative(), s.roll(), s.pitch(), s.heading(),
                s.position(), s.latency(), s.leverArm(), s.waterLevel(), s.tideZone()};
    }
}
