package org.leadline.io;

import java.io.IOException;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.leadline.survey.Vessel;

/**
 * Writes a {@link Vessel} as {@code vessel.yaml} (docs/formats/vessel.md), every key spelled out,
 * so that {@link VesselReader} reads back the same vessel (numbers printed with Java's shortest
 * round-trip representation; knots and degrees converted back from m/s and radians).
 */
public final class VesselWriter {
    private VesselWriter() {}

    public static void write(Vessel v, Path file) {
        try (Writer w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
            w.write(toYaml(v));
        } catch (IOException e) {
            throw new java.io.UncheckedIOException(e);
        }
    }

    public static String toYaml(Vessel v) {
        StringBuilder b = new StringBuilder("# Leadline vessel file (docs/formats/vessel.md)\n");
        b.append("draft_m: ").append(v.transducerDraft()).append('\n');
        b.append("settlement:\n");
        for (int i = 0; i < v.settlementSpeeds().length; i++) {
            b.append("  - {speed_kn: ").append(v.settlementSpeeds()[i] / VesselReader.KNOT)
                    .append(", settlement_m: ").append(v.settlementValues()[i]).append("}\n");
        }
        if (v.settlementSpeeds().length == 0) b.setLength(b.length() - 1);
        if (v.settlementSpeeds().length == 0) b.append(" []\n");
        b.append("offsets:\n");
        xyz(b, "position_reference", v.positionOffset());
        xyz(b, "transducer", v.transducerOffset());
        b.append("latency_s: ").append(v.latency()).append('\n');
        b.append("sounder:\n  set_speed_m_s: ").append(v.sounderSetSpeed())
                .append("\n  beam_width_deg: ").append(Math.toDegrees(v.beamWidth())).append('\n');
        b.append("uncertainty:    # one sigma\n");
        double[] s = VesselReader.sigmaArray(v.sigma());
        for (int k = 0; k < s.length; k++) {
            String key = VesselReader.SIGMA_KEYS.get(k);
            b.append("  ").append(key).append(": ").append(key.endsWith("_deg") ? Math.toDegrees(s[k]) : s[k]).append('\n');
        }
        return b.toString();
    }

    private static void xyz(StringBuilder b, String name, Vessel.Offset o) {
        b.append("  ").append(name).append(": {x_m: ").append(o.x()).append(", y_m: ").append(o.y())
                .append(", z_m: ").append(o.z()).append("}\n");
    }
}
