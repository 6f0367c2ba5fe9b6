package org.leadline.io;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.leadline.watercolumn.Cast;

import java.nio.file.Files;
import java.nio.file.Path;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

class CastReaderTest {
    @TempDir
    Path dir;

    private Path write(String name, String text) throws Exception {
        Path f = dir.resolve(name);
        Files.writeString(f, text);
        return f;
    }

    @Test
    void readsMetadataAndColumnsCaseInsensitively() throws Exception {
        Path f = write("c1.csv", """
                # name: harbour entrance
                # time: 2026-05-14T09:15:02.250Z
                # lat: 53.5
                # lon: -4.25
                # temperature_scale: ITS-68
                Depth,TEMPERATURE,Salinity,remark
                # a comment between samples
                0.5,12.003,30.1,surface

                1.5,11.5,,x
                """);
        Cast c = CastReader.read(f);
        assertThat(c.name()).isEqualTo("harbour entrance");
        // 2026-05-14T09:15:02.250Z = 1778750102.25 s since the epoch (java.time, worked in this test)
        assertThat(c.time()).isEqualTo(java.time.Instant.parse("2026-05-14T09:15:02.250Z").toEpochMilli() / 1000.0);
        assertThat(c.latitude()).isEqualTo(53.5);
        assertThat(c.longitude()).isEqualTo(-4.25);
        assertThat(c.temperatureScale()).isEqualTo(Cast.TemperatureScale.ITS_68);
        assertThat(c.size()).isEqualTo(2);
        assertThat(c.depth()).containsExactly(0.5, 1.5);
        assertThat(c.salinity()[1]).isNaN();
        assertThat(c.hasPressure()).isFalse();
        assertThat(c.pressure()[0]).isNaN();
        // T90 = T68 / 1.00024 (Saunders 1990)
        assertThat(c.temperatureIts90()[0]).isCloseTo(12.003 / 1.00024, within(1e-12));
        assertThat(c.source()).isEqualTo(f.toString());
    }

    @Test
    void defaultsWithoutMetadata() throws Exception {
        Cast c = CastReader.read(write("velo-7.csv", "pressure,sound_speed\n1,1490.2\n2,1490.0\n"));
        assertThat(c.name()).isEqualTo("velo-7");
        assertThat(c.time()).isNaN();
        assertThat(c.latitude()).isNaN();
        assertThat(c.temperatureScale()).isEqualTo(Cast.TemperatureScale.ITS_90);
        assertThat(c.hasSoundSpeed()).isTrue();
        assertThat(c.hasTemperature()).isFalse();
    }

    @Test
    void missingDepthColumnNamesFileAndHeaderLine() throws Exception {
        Path f = write("nodepth.csv", "# lat: 50\ntemperature,salinity\n10,35\n");
        assertThatThrownBy(() -> CastReader.read(f))
                .isInstanceOf(InputException.class)
                .hasMessageStartingWith(f + ":2: no depth or pressure column")
                .hasMessageContaining("found columns: temperature, salinity")
                .satisfies(e -> assertThat(((InputException) e).line()).isEqualTo(2));
    }

    @Test
    void missingSalinityConductivityAndSpeed() throws Exception {
        Path f = write("nosal.csv", "depth,temperature\n1,10\n");
        assertThatThrownBy(() -> CastReader.read(f))
                .isInstanceOf(InputException.class)
                .hasMessageContaining("neither salinity, conductivity nor sound_speed");
        Path g = write("notemp.csv", "depth,conductivity\n1,30\n");
        assertThatThrownBy(() -> CastReader.read(g))
                .isInstanceOf(InputException.class)
                .hasMessageContaining("no temperature column");
    }

    @Test
    void badNumberNamesFileLineAndColumn() throws Exception {
        Path f = write("bad.csv", """
                # lat: 50
                depth,temperature,salinity
                1,10,35
                # comment
                2,10,35

                3,10,3x5
                """);
        assertThatThrownBy(() -> CastReader.read(f))
                .isInstanceOf(InputException.class)
                .hasMessage(f + ":7:3: salinity: expected a number, found '3x5'")
                .satisfies(e -> {
                    InputException ie = (InputException) e;
                    assertThat(ie.file()).isEqualTo(f.toString());
                    assertThat(ie.line()).isEqualTo(7);
                    assertThat(ie.column()).isEqualTo(3);
                });
    }

    @Test
    void badMetadataNamesItsLine() throws Exception {
        Path f = write("badlat.csv", "# name: x\n# lat: north\ndepth,sound_speed\n1,1500\n");
        assertThatThrownBy(() -> CastReader.read(f)).isInstanceOf(InputException.class)
                .hasMessageStartingWith(f + ":2: # lat: expected decimal degrees");
        Path g = write("badscale.csv", "# temperature_scale: kelvin\ndepth,sound_speed\n1,1500\n");
        assertThatThrownBy(() -> CastReader.read(g)).isInstanceOf(InputException.class)
                .hasMessageContaining(":1: temperature_scale: expected ITS-90 or ITS-68");
        Path h = write("badtime.csv", "# time: yesterday\ndepth,sound_speed\n1,1500\n");
        assertThatThrownBy(() -> CastReader.read(h)).isInstanceOf(InputException.class)
                .hasMessageContaining(":1: # time: expected ISO-8601");
    }

    @Test
    void emptyFileAndNoSamples() throws Exception {
        assertThatThrownBy(() -> CastReader.read(write("empty.csv", "# only comments\n")))
                .isInstanceOf(InputException.class).hasMessageContaining("empty cast file");
        assertThatThrownBy(() -> CastReader.read(write("hdr.csv", "depth,sound_speed\n")))
                .isInstanceOf(InputException.class).hasMessageContaining("no samples");
    }
}
