package org.leadline.cleaning;

import org.leadline.cleaning.CleaningSettings.Filter;
import org.junit.jupiter.api.Test;
import org.yaml.snakeyaml.Yaml;

import java.util.EnumSet;
import java.util.Map;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

class CleaningSettingsTest {
    @Test
    void defaultsAreTheDocumentedOnes() {
        CleaningSettings d = CleaningSettings.defaults();
        assertThat(d.minDepth()).isEqualTo(0.1);
        assertThat(d.maxDepth()).isEqualTo(Double.POSITIVE_INFINITY);
        assertThat(d.minQuality()).isEqualTo(0);
        assertThat(d.spikeWindow()).isEqualTo(10);
        assertThat(d.spikeK()).isEqualTo(3.0);
        assertThat(d.spikeKTvu()).isEqualTo(2.0);
        assertThat(d.spikeFloor()).isEqualTo(0.1);
        assertThat(d.spikeAngleBand()).isEqualTo(5.0);
        assertThat(d.surfaceK()).isEqualTo(2.5);
        assertThat(d.surfaceCell()).isEqualTo(5.0);
        assertThat(d.surfaceMinCount()).isEqualTo(3);
        assertThat(d.filters()).containsExactlyInAnyOrder(Filter.values());
        assertThat(CleaningSettings.fromMap(Map.of())).isEqualTo(d);
    }

    @Test
    void readsTheProjectYamlCleaningMap() {
        String yaml = """
                cleaning:
                  min_depth: 0.5
                  max_depth: .inf
                  spike_window: 14
                  spike_k: 3.5
                  surface_k: 3
                  surface_cell: 10
                  min_quality: 2
                  filters: [quality, spike]
                """;
        Map<String, Object> root = new Yaml().load(yaml);
        @SuppressWarnings("unchecked")
        CleaningSettings c = CleaningSettings.fromMap((Map<String, Object>) root.get("cleaning"));
        assertThat(c.minDepth()).isEqualTo(0.5);
        assertThat(c.maxDepth()).isInfinite();
        assertThat(c.spikeWindow()).isEqualTo(14);
        assertThat(c.spikeK()).isEqualTo(3.5);
        assertThat(c.surfaceK()).isEqualTo(3.0);
        assertThat(c.surfaceCell()).isEqualTo(10.0);
        assertThat(c.minQuality()).isEqualTo(2);
        assertThat(c.filters()).isEqualTo(EnumSet.of(Filter.QUALITY, Filter.SPIKE));
        assertThat(c.enabled(Filter.SURFACE)).isFalse();
    }

    @Test
    void unknownKeyNamesTheKeyAndTheAllowedOnes() {
        assertThatThrownBy(() -> CleaningSettings.fromMap(Map.of("spike_width", 5)))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("spike_width")
                .hasMessageContaining("spike_window")
                .hasMessageContaining("surface_cell");
        assertThatThrownBy(() -> CleaningSettings.fromMap(Map.of("spike_k", "lots")))
                .hasMessageContaining("spike_k");
        assertThatThrownBy(() -> CleaningSettings.fromMap(Map.of("spike_window", 7.5)))
                .hasMessageContaining("whole number");
        assertThatThrownBy(() -> CleaningSettings.fromMap(Map.of("filters", "spike,despeckle")))
                .hasMessageContaining("despeckle");
        assertThatThrownBy(() -> CleaningSettings.fromMap(Map.of("min_depth", 10, "max_depth", 5)))
                .hasMessageContaining("max_depth");
    }
}
