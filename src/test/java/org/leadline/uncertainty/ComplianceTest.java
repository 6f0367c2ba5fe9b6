package org.leadline.uncertainty;

import org.junit.jupiter.api.Test;
import org.leadline.survey.SoundingTable;

import java.util.List;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

class ComplianceTest {

    /** Six soundings against Special Order (IHO S-44 ed. 6.0.0 Table 1: a 0.25 m, b 0.0075, THU 2 m). */
    static SoundingTable table() {
        SoundingTable t = new SoundingTable(7, List.of());
        // depth, tvu, thu; limits worked by hand in this test:
        //  3 m:  TVU limit sqrt(0.0625 + 0.0225^2) = 0.25101; THU 2 m
        //  10 m: TVU limit 0.261008
        //  30 m: TVU limit sqrt(0.0625 + 0.225^2) = 0.336341
        set(t, 0, 3.0, 0.25, 1.5);     // TVU ok (0.25 <= 0.25101), THU ok
        set(t, 1, 3.0, 0.252, 1.5);    // TVU fails (0.252 > 0.25101), THU ok
        set(t, 2, 10.0, 0.26, 2.5);    // TVU ok, THU fails
        set(t, 3, 30.0, 0.33, 1.9);    // both ok
        set(t, 4, 30.0, 0.34, 2.1);    // both fail
        set(t, 5, -0.5, 0.2, 1.0);     // drying height: limit a = 0.25 -> both ok, first band
        set(t, 6, 10.0, 0.10, 0.5);    // would pass, but rejected: not counted in the shares
        t.reject(6, SoundingTable.Reason.REVIEWER);
        return t;
    }

    static void set(SoundingTable t, int i, double depth, double tvu, double thu) {
        t.depth[i] = depth;
        t.tvu[i] = tvu;
        t.thu[i] = thu;
    }

    @Test
    void perSoundingFlags() {
        Compliance c = Compliance.evaluate(table(), S44Order.SPECIAL);
        assertThat(c.order).isEqualTo(S44Order.SPECIAL);
        boolean[] tvu = {true, false, true, true, false, true, true};
        boolean[] thu = {true, true, false, true, false, true, true};
        for (int i = 0; i < 7; i++) {
            assertThat(c.tvuOk(i)).as("tvu %d", i).isEqualTo(tvu[i]);
            assertThat(c.thuOk(i)).as("thu %d", i).isEqualTo(thu[i]);
            assertThat(c.bothOk(i)).as("both %d", i).isEqualTo(tvu[i] && thu[i]);
        }
    }

    @Test
    void sharesAndBands() {
        SoundingTable t = table();
        ComplianceSummary s = Compliance.evaluate(t, S44Order.SPECIAL).summary(t);
        // counted by hand in this test: 6 accepted; TVU ok 4, THU ok 4, both 3
        assertThat(s.evaluated()).isEqualTo(6);
        assertThat(s.pctTvu()).isCloseTo(400.0 / 6, within(1e-9));
        assertThat(s.pctThu()).isCloseTo(400.0 / 6, within(1e-9));
        assertThat(s.pctBoth()).isCloseTo(50.0, within(1e-9));
        assertThat(s.bands()).extracting(ComplianceSummary.Band::label)
                .containsExactly("0-5 m", "5-10 m", "10-20 m", "20-50 m", "50+ m");
        ComplianceSummary.Band shallow = s.bands().get(0);   // 3 m, 3 m, drying height
        assertThat(shallow.count()).isEqualTo(3);
        assertThat(shallow.pctTvu()).isCloseTo(200.0 / 3, within(1e-9));
        assertThat(shallow.pctThu()).isCloseTo(100.0, within(1e-9));
        assertThat(shallow.meanTvu()).isCloseTo((0.25 + 0.252 + 0.2) / 3, within(1e-12));
        assertThat(shallow.maxTvuRatio()).isCloseTo(0.252 / S44Order.SPECIAL.tvuLimit(3), within(1e-12));
        assertThat(s.bands().get(1).count()).isZero();
        assertThat(s.bands().get(1).pctTvu()).isNaN();
        ComplianceSummary.Band ten = s.bands().get(2);       // 10 m, accepted only
        assertThat(ten.count()).isEqualTo(1);
        assertThat(ten.pctBoth()).isZero();
        ComplianceSummary.Band deep = s.bands().get(3);      // 30 m, 30 m
        assertThat(deep.count()).isEqualTo(2);
        assertThat(deep.pctBoth()).isCloseTo(50.0, within(1e-9));
        assertThat(s.bands().get(4).count()).isZero();
    }

    @Test
    void unestimatedSoundingFails() {
        SoundingTable t = new SoundingTable(1, List.of());
        t.depth[0] = 5;
        Compliance c = Compliance.evaluate(t, S44Order.ORDER_2);
        assertThat(c.tvuOk(0)).isFalse();
        assertThat(c.thuOk(0)).isFalse();
        assertThat(c.summary(t).pctBoth()).isZero();
    }

    @Test
    void order1aIsLooserThanSpecial() {
        SoundingTable t = table();
        ComplianceSummary s = Compliance.evaluate(t, S44Order.ORDER_1A).summary(t);
        // every TVU here is under 0.5 m and every THU under 5 m + 5 % of depth
        assertThat(s.pctBoth()).isCloseTo(100.0, within(1e-9));
    }
}
