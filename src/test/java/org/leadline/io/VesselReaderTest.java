package org.leadline.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.leadline.survey.Vessel;

class VesselReaderTest {
    @TempDir Path dir;
    private static final Path LAUNCH = Path.of("src/test/resources/vessel/launch.yaml");

    @Test
    void readsTheFullExample() {
        Vessel v = VesselReader.read(LAUNCH);
        assertThat(v.transducerDraft()).isEqualTo(0.62);
        // 1 kn = 1852/3600 m/s (international nautical mile): 4 kn = 2.057777... m/s, worked by hand
        assertThat(v.settlementSpeeds()).containsExactly(new double[] {0, 4 * 1852 / 3600.0, 6 * 1852 / 3600.0, 8 * 1852 / 3600.0}, within(1e-12));
        assertThat(v.settlementSpeeds()[1]).isCloseTo(2.0577778, within(1e-7));
        assertThat(v.settlementValues()).containsExactly(0.0, 0.03, 0.05, 0.09);
        assertThat(v.settlement(5 * 1852 / 3600.0)).isCloseTo(0.04, within(1e-12)); // half-way 4-6 kn
        assertThat(v.positionOffset()).isEqualTo(new Vessel.Offset(-1.2, 0.35, -3.4));
        assertThat(v.transducerOffset()).isEqualTo(new Vessel.Offset(0.8, -0.25, 0.55));
        assertThat(v.latency()).isEqualTo(0.045);
        assertThat(v.sounderSetSpeed()).isEqualTo(1500.0);
        assertThat(v.beamWidth()).isCloseTo(Math.toRadians(6.5), within(1e-15));
        Vessel.SensorSigmas s = v.sigma();
        assertThat(s.sounderFixed()).isEqualTo(0.02);
        assertThat(s.sounderRelative()).isEqualTo(0.0015);
        assertThat(s.soundSpeedSurface()).isEqualTo(0.3);
        assertThat(s.soundSpeedProfile()).isEqualTo(0.8);
        assertThat(s.draft()).isEqualTo(0.015);
        assertThat(s.settlement()).isEqualTo(0.025);
        assertThat(s.heaveFixed()).isEqualTo(0.05);
        assertThat(s.heaveRelative()).isEqualTo(0.05);
        assertThat(s.roll()).isCloseTo(Math.toRadians(0.04), within(1e-18));
        assertThat(s.pitch()).isCloseTo(Math.toRadians(0.04), within(1e-18));
        assertThat(s.heading()).isCloseTo(Math.toRadians(0.08), within(1e-18));
        assertThat(s.position()).isEqualTo(0.03);
        assertThat(s.latency()).isEqualTo(0.002);
        assertThat(s.leverArm()).isEqualTo(0.01);
        assertThat(s.waterLevel()).isEqualTo(0.02);
        assertThat(s.tideZone()).isEqualTo(0.04);
    }

    @Test
    void roundTripThroughTheWriter() throws IOException {
        Vessel v = VesselReader.read(LAUNCH);
        Path out = dir.resolve("again.yaml");
        VesselWriter.write(v, out);
        Vessel w = VesselReader.read(out);
        assertThat(w.transducerDraft()).isEqualTo(v.transducerDraft());
        assertThat(w.settlementSpeeds()).containsExactly(v.settlementSpeeds(), within(1e-12));
        assertThat(w.settlementValues()).containsExactly(v.settlementValues());
        assertThat(w.positionOffset()).isEqualTo(v.positionOffset());
        assertThat(w.transducerOffset()).isEqualTo(v.transducerOffset());
        assertThat(w.latency()).isEqualTo(v.latency());
        assertThat(w.sounderSetSpeed()).isEqualTo(v.sounderSetSpeed());
        assertThat(w.beamWidth()).isCloseTo(v.beamWidth(), within(1e-15));
        assertThat(VesselReader.sigmaArray(w.sigma())).containsExactly(VesselReader.sigmaArray(v.sigma()), within(1e-15));
        Vessel empty = VesselReader.read(write("e.yaml", "draft_m: 0.5\nsettlement: []\n"));
        assertThat(VesselReader.read(write("e2.yaml", VesselWriter.toYaml(empty))).settlementSpeeds()).isEmpty();
    }

    @Test
    void defaultsForEverythingButTheDraft() throws IOException {
        Vessel v = VesselReader.read(write("min.yaml", "draft_m: 1.1\n"));
        assertThat(v.transducerDraft()).isEqualTo(1.1);
        assertThat(v.settlementSpeeds()).isEmpty();
        assertThat(v.positionOffset()).isEqualTo(Vessel.Offset.ZERO);
        assertThat(v.latency()).isZero();
        assertThat(v.sounderSetSpeed()).isEqualTo(1500.0);
        assertThat(v.beamWidth()).isEqualTo(Math.toRadians(8));
        assertThat(v.sigma()).isEqualTo(Vessel.SensorSigmas.DEFAULT);
        // a partial uncertainty section keeps the defaults of the keys it leaves out
        Vessel p = VesselReader.read(write("p.yaml", "draft_m: 1\nuncertainty:\n  roll_deg: 0.1\n"));
        assertThat(p.sigma().roll()).isCloseTo(Math.toRadians(0.1), within(1e-18));
        assertThat(p.sigma().pitch()).isEqualTo(Vessel.SensorSigmas.DEFAULT.pitch());
    }

    private Path write(String name, String text) throws IOException {
        Path p = dir.resolve(name);
        Files.writeString(p, text);
        return p;
    }

    private void fails(String text, long line, int column, String fragment) throws IOException {
        Path p = write("bad.yaml", text);
        assertThatThrownBy(() -> VesselReader.read(p)).isInstanceOfSatisfying(InputException.class, e -> {
            assertThat(e.file()).isEqualTo(p.toString());
            assertThat(e.line()).as(e.getMessage()).isEqualTo(line);
            assertThat(e.column()).as(e.getMessage()).isEqualTo(column);
            assertThat(e.getMessage()).contains(fragment);
        });
    }

    @Test
    void errorsNameKeyLineAndCharacterColumn() throws IOException {
        fails("draft: 0.5\n", 1, 1, "unknown key 'draft' in the vessel file");
        fails("name: x\n", 0, 0, "expected a key 'draft_m'");
        fails("draft_m: deep\n", 1, 10, "expected a finite number for 'draft_m', found 'deep'");
        fails("draft_m: .nan\n", 1, 10, "finite");
        fails("draft_m: 0.5\nsounder:\n  set_speed_m_s: [1500]\n", 3, 18, "expected a number for 'set_speed_m_s', found a list");
        fails("draft_m: 0.5\nsounder:\n  set_speed: 1500\n", 3, 3, "unknown key 'set_speed' in sounder");
        fails("draft_m: 0.5\nsounder:\n  set_speed_m_s: 150\n", 3, 18, "expected 'set_speed_m_s' in [1300, 1800] m/s, found 150");
        fails("draft_m: 0.5\nsettlement:\n  - {speed_kn: 4, settlement_m: 0.1}\n  - {speed_kn: 2, settlement_m: 0.2}\n",
                4, 16, "expected settlement speeds to increase");
        fails("draft_m: 0.5\nsettlement:\n  - {speed_kn: 4}\n", 3, 5, "expected 'speed_kn' and 'settlement_m'");
        fails("draft_m: 0.5\noffsets:\n  transducer: {x_m: 1, w_m: 2}\n", 3, 24, "unknown key 'w_m' in transducer");
        fails("draft_m: 0.5\nuncertainty:\n  roll_deg: -0.1\n", 3, 13, "not negative");
        fails("draft_m: 0.5\ndraft_m: 0.6\n", 2, 1, "appears twice");
        fails("draft_m: [0.5\n", 2, 1, "not valid YAML");
        fails("- 1\n- 2\n", 1, 1, "expected a mapping of keys at the top level");
        fails("", 0, 0, "empty file");
    }
}
