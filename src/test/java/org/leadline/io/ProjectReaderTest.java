package org.leadline.io;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.leadline.survey.Project;

class ProjectReaderTest {
    @TempDir Path dir;
    private static final Path FILE = Path.of("src/test/resources/project/survey.yaml");
    private static final Path FOLDER = FILE.toAbsolutePath().getParent();

    @Test
    void readsTheFullExample() {
        Project p = ProjectReader.read(FILE);
        assertThat(p.name()).isEqualTo("Harbour approach 2026");
        assertThat(p.folder()).isEqualTo(FOLDER);
        assertThat(p.soundings()).containsExactly(FOLDER.resolve("pings/line1.csv"), FOLDER.resolve("pings/line2.csv"));
        assertThat(p.nmea()).containsExactly(FOLDER.resolve("log.nmea"));
        assertThat(p.navigation()).isEqualTo(FOLDER.resolve("nav.csv"));
        assertThat(p.attitude()).isEqualTo(FOLDER.resolve("attitude.csv"));
        assertThat(p.casts()).containsExactly(FOLDER.resolve("casts/c1.csv"));
        assertThat(p.tide()).isEqualTo(FOLDER.resolve("tide.csv"));
        assertThat(p.tideZones()).isEqualTo(FOLDER.resolve("zones.geojson"));
        assertThat(p.vessel()).isEqualTo(FOLDER.resolve("vessel.yaml"));
        assertThat(p.journal()).isEqualTo(FOLDER.resolve("edits.journal")); // need not exist
        Project.Settings s = p.settings();
        assertThat(s.equation()).isEqualTo("del-grosso");
        assertThat(s.cell()).isEqualTo(2.5);
        assertThat(s.crs()).isEqualTo("EPSG:32631");
        assertThat(s.surface()).isEqualTo("shoalest");
        assertThat(s.order()).isEqualTo("1a");
        assertThat(s.castSelection()).isEqualTo("nearest-distance");
        assertThat(s.latitude()).isEqualTo(50.1);
        assertThat(s.sounderSpeed()).isEqualTo(1480.0);
        assertThat(s.draft()).isEqualTo(0.7);
        assertThat(s.cleaning()).containsEntry("depth_gate_m", List.of(1.0, 60.0))
                .containsEntry("spike", Map.of("window", 9L, "threshold_sigma", 3.5))
                .containsEntry("angle_gate_deg", 60L).containsEntry("enabled", true);
        assertThat(p.inputs()).hasSize(10);
        // the vessel and tide it names are readable by their readers
        assertThat(VesselReader.read(p.vessel()).transducerDraft()).isEqualTo(0.62);
    }

    @Test
    void defaultsAndOverrides() throws IOException {
        Path f = dir.resolve("p.yaml");
        Files.writeString(f, "inputs:\n  soundings: a.csv\n");
        Files.writeString(dir.resolve("a.csv"), "time,lat,lon,depth\n");
        Project p = ProjectReader.read(f);
        assertThat(p.soundings()).containsExactly(dir.toAbsolutePath().normalize().resolve("a.csv"));
        assertThat(p.settings()).isEqualTo(Project.Settings.DEFAULT);
        assertThat(p.vessel()).isNull();
    }

    private void fails(String text, long line, int column, String fragment) throws IOException {
        Path p = dir.resolve("bad.yaml");
        Files.writeString(p, text);
        assertThatThrownBy(() -> ProjectReader.read(p)).isInstanceOfSatisfying(InputException.class, e -> {
            assertThat(e.file()).isEqualTo(p.toString());
            assertThat(e.line()).as(e.getMessage()).isEqualTo(line);
            assertThat(e.column()).as(e.getMessage()).isEqualTo(column);
            assertThat(e.getMessage()).contains(fragment);
        });
    }

    @Test
    void refusesPathsOutsideTheProjectFolder() throws IOException {
        fails("inputs:\n  vessel: /etc/passwd\n", 2, 11, "expected a path relative to the project folder, found the absolute path '/etc/passwd'");
        fails("inputs:\n  soundings:\n    - ok.csv\n    - ../other/pings.csv\n", 3, 7, "expected an existing file"); // ok.csv absent: first error wins
        Files.writeString(dir.resolve("ok.csv"), "x\n");
        fails("inputs:\n  soundings:\n    - ok.csv\n    - ../other/pings.csv\n", 4, 7, "found '..' in '../other/pings.csv'");
        fails("inputs:\n  tide: sub/../../tide.csv\n", 2, 9, "'..'");
        fails("inputs:\n  tide: 'C:\\data\\tide.csv'\n", 2, 9, "absolute path");
        fails("inputs:\n  tide: '..\\tide.csv'\n", 2, 9, "'..'");
        fails("inputs:\n  tide: ''\n", 2, 9, "empty name");
        assertThat(ProjectReader.unsafe("sub/dir/file..csv")).isNull(); // '..' inside a name is fine
        assertThat(ProjectReader.unsafe("./a.csv")).isNull();
    }

    @Test
    void settingErrors() throws IOException {
        fails("settings:\n  cell: 2\n", 2, 3, "unknown key 'cell' in settings");
        fails("settings:\n  cell_m: -2\n", 2, 11, "expected 'cell_m' in [0, 100000] m, found -2");
        fails("settings:\n  equation: chen\n", 2, 13, "expected 'equation' one of unesco, del-grosso, mackenzie, coppens, found 'chen'");
        fails("settings:\n  order: 3\n", 2, 10, "expected 'order' one of");
        fails("settings:\n  crs: UTM31\n", 2, 8, "expected crs 'auto' or 'EPSG:<code>'");
        fails("settings:\n  cleaning: 5\n", 2, 13, "expected a mapping under 'cleaning'");
        fails("inputs: [a.csv]\n", 1, 9, "expected a mapping under 'inputs'");
        fails("inputs:\n  sonar: a.csv\n", 2, 3, "unknown key 'sonar' in inputs");
    }

    @Test
    void builderValidatesOverrides() {
        Project p = ProjectReader.read(FILE);
        Project q = p.toBuilder().cell(0.5).order("special").soundings(List.of(Path.of("x.csv"))).draft(Double.NaN).build();
        assertThat(q.settings().cell()).isEqualTo(0.5);
        assertThat(q.settings().order()).isEqualTo("special");
        assertThat(q.soundings()).containsExactly(Path.of("x.csv").toAbsolutePath().normalize());
        assertThat(q.settings().draft()).isNaN();
        assertThat(q.vessel()).isEqualTo(p.vessel());
        assertThat(p.settings().cell()).isEqualTo(2.5); // the original is unchanged
        assertThatThrownBy(() -> p.toBuilder().surface("kriging").build()).isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("surface");
        assertThatThrownBy(() -> p.toBuilder().cell(0).build()).isInstanceOf(IllegalArgumentException.class);
        assertThatThrownBy(() -> p.toBuilder().crs("EPSG:").build()).isInstanceOf(IllegalArgumentException.class);
    }
}
