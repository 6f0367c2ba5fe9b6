package org.leadline.pipeline;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.leadline.io.ProjectReader;
import org.leadline.survey.SoundingTable;
import org.leadline.surface.Grid;
import org.leadline.synthetic.HarbourApproach;
import org.leadline.synthetic.SurveySimulator;
import org.leadline.uncertainty.S44Order;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * The bundled sample survey end to end (issue acceptance): the committed files are exactly what
 * the forward model generates; the demo surface matches the known seabed within the IHO S-44
 * Special Order TVU (ed. 6.0.0, a = 0.25 m, b = 0.0075) in at least 99 % of its cells; the
 * wreck-sized obstruction's least depth is found within 0.1 m.
 */
class SampleSurveyAcceptanceTest {
    static final Path COMMITTED = Path.of("sample-surveys/harbour-approach");
    static HarbourApproach.Written written;
    static ProcessingRun.Result result;
    static Path generated;

    @BeforeAll
    static void run(@TempDir Path dir) throws Exception {
        generated = dir.resolve("survey");
        written = HarbourApproach.write(generated, HarbourApproach.Options.sample());
        result = new ProcessingRun(ProjectReader.read(COMMITTED.resolve("project.yaml")), Progress.NONE).run(dir.resolve("out"));
    }

    @Test
    void committedSampleIsWhatTheForwardModelWrites() throws Exception {
        for (String f : List.of("pings/swath.csv", "pings/singlebeam.csv", "pings/S1.nmea", "navigation.csv",
                "attitude.csv", "casts/ctd-0655.csv", "casts/ctd-late.csv", "tide/gauge.csv", "tide/zones.geojson",
                "vessel.yaml", "barcheck.csv", "project.yaml", "truth.csv")) {
            assertThat(Files.mismatch(COMMITTED.resolve(f), generated.resolve(f))).as(f).isEqualTo(-1L);
        }
    }

    @Test
    void surfaceMatchesTheKnownSeabedWithinSpecialOrder() {
        Grid g = result.grid();
        float[] d = g.layer(Grid.DEPTH);
        SurveySimulator local = localFrame();
        int cells = 0, within = 0;
        double[] e = new double[1], n = new double[1], lat = new double[1], lon = new double[1];
        for (int r = 0; r < g.ny; r++) {
            for (int c = 0; c < g.nx; c++) {
                float v = d[r * g.nx + c];
                if (!Float.isFinite(v)) continue;
                e[0] = g.centreX(c);
                n[0] = g.centreY(r);
                result.projection().inverse(e, n, lat, lon);
                double[] en = local.localEN(lat[0], lon[0]);
                double truth = HarbourApproach.depth(en[0], en[1]);
                cells++;
                if (Math.abs(v - truth) <= S44Order.SPECIAL.tvuLimit(truth)) within++;
            }
        }
        double share = within / (double) cells;
        System.out.printf("sample survey: %d cells, %.3f %% within Special Order TVU of the known seabed%n", cells, 100 * share);
        assertThat(cells).isGreaterThan(20000);
        assertThat(share).isGreaterThanOrEqualTo(0.99);
    }

    @Test
    void wreckLeastDepthIsFound() {
        Grid g = result.grid();
        float[] d = g.layer(Grid.DEPTH);
        SurveySimulator local = localFrame();
        double least = Double.POSITIVE_INFINITY;
        double[] e = new double[1], n = new double[1], lat = new double[1], lon = new double[1];
        for (int r = 0; r < g.ny; r++) {
            for (int c = 0; c < g.nx; c++) {
                float v = d[r * g.nx + c];
                if (!Float.isFinite(v)) continue;
                e[0] = g.centreX(c);
                n[0] = g.centreY(r);
                result.projection().inverse(e, n, lat, lon);
                double[] en = local.localEN(lat[0], lon[0]);
                if (Math.hypot(en[0] - 225, en[1] - 120) < 15) least = Math.min(least, v);
            }
        }
        double truth = HarbourApproach.wreckLeastDepth();
        // shoalest accepted sounding over the wreck, for the report
        SoundingTable s = result.soundings();
        double shoalest = Double.POSITIVE_INFINITY;
        for (int i = 0; i < s.size; i++) {
            if (!s.accepted(i)) continue;
            double[] en = local.localEN(s.lat[i], s.lon[i]);
            if (Math.hypot(en[0] - 225, en[1] - 120) < 15) shoalest = Math.min(shoalest, s.depth[i]);
        }
        java.util.Map<String, Integer> top = new java.util.TreeMap<>();
        for (int i = 0; i < Math.min(s.size, written.trueDepth().length); i++) {
            if (written.trueDepth()[i] < truth + 0.15) {
                top.merge(s.accepted(i) ? "accepted" : SoundingTable.Reason.of(s.reason[i]).label, 1, Integer::sum);
            }
        }
        System.out.println("soundings truly on the wreck top: " + top + " (table " + s.size + ", truth " + written.trueDepth().length + ")");
        System.out.printf("wreck: true least depth %.3f m, surface %.3f m, shoalest accepted sounding %.3f m%n", truth, least, shoalest);
        assertThat(Math.abs(least - truth)).isLessThanOrEqualTo(0.1);
    }

    static SurveySimulator localFrame() {
        return new SurveySimulator(HarbourApproach.LAT0, HarbourApproach.LON0, (a, b) -> 0, (t, a, b) -> 0, null,
                HarbourApproach.vessel(), (a, b, c, x) -> {});
    }
}
