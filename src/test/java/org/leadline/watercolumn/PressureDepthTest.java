package org.leadline.watercolumn;

import org.junit.jupiter.api.Test;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

class PressureDepthTest {
    @Test
    void unesco44CheckValue() {
        // UNESCO 1983 (Tech. Pap. Mar. Sci. 44), DEPTH check value: p = 10000 dbar, latitude 30 deg -> 9712.653 m
        assertThat(PressureDepth.depth(10000, 30)).isCloseTo(9712.653, within(0.0005));
        assertThat(PressureDepth.depth(0, 30)).isEqualTo(0.0);
    }

    @Test
    void inverseRoundTrips() {
        double worst = 0;
        for (double lat = -90; lat <= 90; lat += 15) {
            for (double z = 0; z <= 11000; z += 97.3) {
                worst = Math.max(worst, Math.abs(PressureDepth.depth(PressureDepth.pressure(z, lat), lat) - z));
            }
        }
        assertThat(worst).isLessThan(1e-9);
        // and the other way
        for (double p = 0; p <= 10000; p += 250) {
            assertThat(PressureDepth.pressure(PressureDepth.depth(p, 52), 52)).isCloseTo(p, within(1e-8));
        }
    }

    @Test
    void temperatureScales() {
        // Saunders 1990 (WOCE Newsletter 10): T68 = 1.00024 T90
        assertThat(Temperature.its90ToIts68(25)).isCloseTo(25.006, within(1e-12));
        assertThat(Temperature.its68ToIts90(Temperature.its90ToIts68(17.3))).isCloseTo(17.3, within(1e-12));
    }
}
