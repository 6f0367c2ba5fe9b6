package org.leadline.pipeline;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.leadline.io.ProjectReader;
import org.leadline.survey.SoundingTable;
import org.leadline.synthetic.HarbourApproach;
import org.leadline.synthetic.SurveySimulator;

import java.nio.file.Path;
import java.util.Arrays;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * The whole reduction chain against the committed forward model (issue acceptance): a known
 * seabed, a stratified estuarine profile, heave, roll, pitch, yaw, draft, settlement, lever arms,
 * a tide with two tide zones; travel times found by tracing rays through the true profile to the
 * seabed. The pipeline reads the generated files (navigation and attitude at their own rates,
 * a CTD cast given with conductivity, the gauge record) and must recover every sounding's depth to
 * at most 1 cm median and 5 cm at the 99th percentile on beams up to 60 degrees, and its position
 * to 5 cm.
 */
class ForwardModelRecoveryTest {
    static HarbourApproach.Written truth;
    static ProcessingRun.Result result;

    @BeforeAll
    static void run(@TempDir Path dir) throws Exception {
        truth = HarbourApproach.write(dir, HarbourApproach.Options.exact(12));
        result = new ProcessingRun(ProjectReader.read(truth.project()), Progress.NONE).compute();
    }

    @Test
    void depthsAndPositionsAreRecovered() {
        SoundingTable s = result.soundings();
        assertThat(s.size).isEqualTo(truth.trueDepth().length);
        SurveySimulator local = new SurveySimulator(HarbourApproach.LAT0, HarbourApproach.LON0, (e, n) -> 0,
                (t, e, n) -> 0, null, HarbourApproach.vessel(), (a, b, c, d) -> {});
        double[] dz = new double[s.size], dh = new double[s.size];
        int m = 0, accepted = 0;
        double maxAngle = 0;
        for (int i = 0; i < s.size; i++) {
            if (!Double.isFinite(s.depth[i])) continue;
            if (s.accepted(i)) accepted++;
            dz[m] = Math.abs(s.depth[i] - truth.trueDepth()[i]);
            double[] a = local.localEN(s.lat[i], s.lon[i]);
            double[] b = local.localEN(truth.trueLat()[i], truth.trueLon()[i]);
            dh[m] = Math.hypot(a[0] - b[0], a[1] - b[1]);
            if (!Double.isNaN(truth.angle()[i])) maxAngle = Math.max(maxAngle, Math.abs(truth.angle()[i]));
            m++;
        }
        assertThat(m).isEqualTo(s.size);
        assertThat(maxAngle).isEqualTo(60.0);
        double[] z = Arrays.copyOf(dz, m), h = Arrays.copyOf(dh, m);
        Arrays.sort(z);
        Arrays.sort(h);
        double median = z[m / 2], p99 = z[(int) (0.99 * m)], hMax = h[m - 1];
        System.out.printf("forward model: %d soundings, depth error median %.4f m, p99 %.4f m, max %.4f m; horizontal max %.4f m%n",
                m, median, p99, z[m - 1], hMax);
        assertThat(median).isLessThanOrEqualTo(0.01);
        assertThat(p99).isLessThanOrEqualTo(0.05);
        assertThat(hMax).isLessThanOrEqualTo(0.05);
        java.util.Map<String, Integer> why = new java.util.TreeMap<>();
        for (int i = 0; i < s.size; i++) if (!s.accepted(i)) why.merge(SoundingTable.Reason.of(s.reason[i]).label, 1, Integer::sum);
        System.out.println("rejected: " + why);
        // noise-free data: the automatic filters must not reject real seabed
        assertThat(accepted).isGreaterThanOrEqualTo((int) (0.995 * m));
    }
}
