package org.leadline.uncertainty;

import org.junit.jupiter.api.Test;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;
import static org.assertj.core.api.Assertions.within;

/**
 * IHO S-44 edition 6.0.0 (2020), "IHO Standards for Hydrographic Surveys", Table 1 (minimum
 * standards for safety-of-navigation surveys). Table values are (from memory), cross-checked against
 * secondary reproductions of Table 1 found by search; the IHO's authentic text prevails
 * (docs/science/uncertainty.md).
 */
class S44OrderTest {

    @Test
    void tableOneCoefficients() {
        // IHO S-44 ed. 6.0.0 Table 1: Exclusive Order TVU a = 0.15 m, b = 0.0075; THU 1 m
        assertThat(S44Order.EXCLUSIVE.tvuA).isEqualTo(0.15);
        assertThat(S44Order.EXCLUSIVE.tvuB).isEqualTo(0.0075);
        assertThat(S44Order.EXCLUSIVE.thuFixed).isEqualTo(1.0);
        assertThat(S44Order.EXCLUSIVE.thuFraction).isEqualTo(0.0);
        // IHO S-44 ed. 6.0.0 Table 1: Special Order TVU a = 0.25 m, b = 0.0075; THU 2 m
        assertThat(S44Order.SPECIAL.tvuA).isEqualTo(0.25);
        assertThat(S44Order.SPECIAL.tvuB).isEqualTo(0.0075);
        assertThat(S44Order.SPECIAL.thuFixed).isEqualTo(2.0);
        assertThat(S44Order.SPECIAL.thuFraction).isEqualTo(0.0);
        // IHO S-44 ed. 6.0.0 Table 1: Order 1a TVU a = 0.5 m, b = 0.013; THU 5 m + 5 % of depth
        assertThat(S44Order.ORDER_1A.tvuA).isEqualTo(0.5);
        assertThat(S44Order.ORDER_1A.tvuB).isEqualTo(0.013);
        assertThat(S44Order.ORDER_1A.thuFixed).isEqualTo(5.0);
        assertThat(S44Order.ORDER_1A.thuFraction).isEqualTo(0.05);
        // IHO S-44 ed. 6.0.0 Table 1: Order 1b TVU a = 0.5 m, b = 0.013; THU 5 m + 5 % of depth
        assertThat(S44Order.ORDER_1B.tvuA).isEqualTo(0.5);
        assertThat(S44Order.ORDER_1B.tvuB).isEqualTo(0.013);
        assertThat(S44Order.ORDER_1B.thuFixed).isEqualTo(5.0);
        assertThat(S44Order.ORDER_1B.thuFraction).isEqualTo(0.05);
        // IHO S-44 ed. 6.0.0 Table 1: Order 2 TVU a = 1.0 m, b = 0.023; THU 20 m + 10 % of depth
        assertThat(S44Order.ORDER_2.tvuA).isEqualTo(1.0);
        assertThat(S44Order.ORDER_2.tvuB).isEqualTo(0.023);
        assertThat(S44Order.ORDER_2.thuFixed).isEqualTo(20.0);
        assertThat(S44Order.ORDER_2.thuFraction).isEqualTo(0.10);
    }

    @Test
    void tableOneCoverageAndFeatures() {
        // IHO S-44 ed. 6.0.0 Table 1: bathymetric coverage 200 %, 100 %, <= 100 %, 5 %, 5 %
        assertThat(S44Order.EXCLUSIVE.bathymetricCoverage).isEqualTo("200 %");
        assertThat(S44Order.SPECIAL.bathymetricCoverage).isEqualTo("100 %");
        assertThat(S44Order.ORDER_1A.bathymetricCoverage).isEqualTo("<= 100 %");
        assertThat(S44Order.ORDER_1B.bathymetricCoverage).isEqualTo("5 %");
        assertThat(S44Order.ORDER_2.bathymetricCoverage).isEqualTo("5 %");
        // IHO S-44 ed. 6.0.0 Table 1: feature detection, cubic features > 0.5 m, > 1 m, > 2 m (to 40 m)
        assertThat(S44Order.EXCLUSIVE.featureDetection).contains("0.5 m");
        assertThat(S44Order.SPECIAL.featureDetection).contains("1 m");
        assertThat(S44Order.ORDER_1A.featureDetection).contains("2 m").contains("40 m");
    }

    @Test
    void tvuLimitsWorkedByHand() {
        // worked by hand in this test: sqrt(0.25^2 + (0.0075 * 10)^2) = sqrt(0.068125) = 0.261008 m
        assertThat(S44Order.SPECIAL.tvuLimit(10)).isCloseTo(0.261008, within(1e-6));
        // worked by hand in this test: sqrt(0.15^2 + (0.0075 * 20)^2) = sqrt(0.045) = 0.212132 m
        assertThat(S44Order.EXCLUSIVE.tvuLimit(20)).isCloseTo(0.212132, within(1e-6));
        // worked by hand in this test: sqrt(0.5^2 + (0.013 * 40)^2) = sqrt(0.5204) = 0.721388 m
        assertThat(S44Order.ORDER_1A.tvuLimit(40)).isCloseTo(0.721388, within(1e-6));
        // worked by hand in this test: sqrt(1.0^2 + (0.023 * 100)^2) = sqrt(6.29) = 2.507987 m
        assertThat(S44Order.ORDER_2.tvuLimit(100)).isCloseTo(2.507987, within(1e-6));
        // a drying height is tested at d = 0: only a remains (common practice)
        assertThat(S44Order.SPECIAL.tvuLimit(-1.5)).isEqualTo(0.25);
    }

    @Test
    void thuLimitsWorkedByHand() {
        // worked by hand in this test: 5 m + 0.05 * 40 m = 7 m; 20 m + 0.10 * 100 m = 30 m
        assertThat(S44Order.ORDER_1A.thuLimit(40)).isCloseTo(7.0, within(1e-12));
        assertThat(S44Order.ORDER_1B.thuLimit(40)).isCloseTo(7.0, within(1e-12));
        assertThat(S44Order.ORDER_2.thuLimit(100)).isCloseTo(30.0, within(1e-12));
        assertThat(S44Order.SPECIAL.thuLimit(100)).isEqualTo(2.0);
        assertThat(S44Order.EXCLUSIVE.thuLimit(5)).isEqualTo(1.0);
    }

    @Test
    void parsesCommandLineKeys() {
        assertThat(S44Order.parse("exclusive")).isEqualTo(S44Order.EXCLUSIVE);
        assertThat(S44Order.parse("Special")).isEqualTo(S44Order.SPECIAL);
        assertThat(S44Order.parse("1a")).isEqualTo(S44Order.ORDER_1A);
        assertThat(S44Order.parse("1B")).isEqualTo(S44Order.ORDER_1B);
        assertThat(S44Order.parse("2")).isEqualTo(S44Order.ORDER_2);
        assertThat(S44Order.parse("order_1a")).isEqualTo(S44Order.ORDER_1A);
        assertThat(S44Order.parse("Special Order")).isEqualTo(S44Order.SPECIAL);
        assertThat(S44Order.ORDER_1A.label()).isEqualTo("Order 1a");
        for (S44Order o : S44Order.values()) assertThat(S44Order.parse(o.key())).isEqualTo(o);
        assertThatThrownBy(() -> S44Order.parse("3"))
                .isInstanceOf(IllegalArgumentException.class)
                .hasMessageContaining("exclusive, special, 1a, 1b or 2").hasMessageContaining("'3'");
    }
}
