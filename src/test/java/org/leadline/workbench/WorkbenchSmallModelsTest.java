package org.leadline.workbench;

import org.leadline.io.InputException;
import org.leadline.pipeline.Progress;
import org.leadline.survey.SoundingTable;
import org.leadline.watercolumn.Cast;
import org.leadline.watercolumn.CastQc;
import org.leadline.watercolumn.DerivedProfile;
import org.leadline.watercolumn.ProfileBuilder;
import org.leadline.watercolumn.SoundSpeedEquation;
import org.junit.jupiter.api.Test;

import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.ExecutionException;
import java.util.prefs.Preferences;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/** Track hit test, error words, preferences and the Casts model. */
class WorkbenchSmallModelsTest {

    @Test
    void cancelStopsOpeningAndReleasesTheJournal(@org.junit.jupiter.api.io.TempDir Path dir) throws Exception {
        Path project = TestSurvey.write(dir);
        java.util.List<String> stages = new java.util.concurrent.CopyOnWriteArrayList<>();
        Progress cancelAfterReading = new Progress() {
            @Override public void stage(String name) { stages.add(name); }
            @Override public boolean cancelled() { return stages.contains("Reading water levels"); }
        };
        org.assertj.core.api.Assertions.assertThatThrownBy(() -> WorkbenchSession.open(project, cancelAfterReading))
                .isInstanceOf(Progress.Cancelled.class);
        assertThat(stages).doesNotContain("Building surface");
        // the lock on the journal was released: the project opens again
        try (WorkbenchSession s = WorkbenchSession.open(project, null)) {
            assertThat(s.journalPath()).isEqualTo(dir.resolve("project.journal"));
            assertThat(s.edits()).isEmpty();
            assertThat(s.canUndo()).isFalse();
        }
    }

    @Test
    void trackFindsTheLineNearAClick() {
        SoundingTable s = new SoundingTable(4, List.of("A", "B"));
        double[][] en = {{0, 0}, {10, 0}, {0, 50}, {10, 50}};
        for (int i = 0; i < 4; i++) {
            s.easting[i] = en[i][0];
            s.northing[i] = en[i][1];
            s.depth[i] = 10 + i;
            s.line[i] = i < 2 ? 0 : 1;
        }
        TrackModel m = new TrackModel(s);
        assertThat(m.lineAt(5, 3, 6)).isEqualTo("A");   // 5.8 m from (0,0) and (10,0): within 6
        assertThat(m.lineAt(5, 47, 6)).isEqualTo("B");   // 5.83 m from (0,50) and (10,50)
        assertThat(m.lineAt(5, 25, 6)).isNull();        // 25.5 m from the nearest sounding
        assertThat(m.extent()).containsExactly(0, 0, 10, 50);
        assertThat(m.depthRange()).containsExactly(10, 13);
    }

    @Test
    void errorsAreWordsNotStackTraces() {
        InputException bad = new InputException("pings.csv", 12, 3, "twtt: expected a number, found 'x'", null);
        assertThat(Errors.describe(new ExecutionException(bad))).isEqualTo(bad.getMessage()).contains("pings.csv");
        assertThat(Errors.describe(new ExecutionException(new Progress.Cancelled()))).isNull();
        assertThat(Errors.describe(new java.nio.file.NoSuchFileException("/x/project.yaml")))
                .isEqualTo("/x/project.yaml: file not found");
        assertThat(Errors.describe(new NullPointerException())).isEqualTo("Internal error (NullPointerException)");
    }

    @Test
    void recentProjectsNewestFirstWithoutRepeats() throws Exception {
        Preferences node = Preferences.userRoot().node("/org/leadline/workbench-unit-test-" + System.nanoTime());
        try {
            WorkbenchPrefs p = new WorkbenchPrefs(node);
            assertThat(p.cautionsAcknowledged()).isFalse();
            for (int k = 0; k < 10; k++) p.addRecent(Path.of("/surveys/p" + k + ".yaml"));
            p.addRecent(Path.of("/surveys/p5.yaml"));
            List<Path> r = p.recentProjects();
            assertThat(r).hasSize(WorkbenchPrefs.MAX_RECENT);
            assertThat(r.get(0)).isEqualTo(Path.of("/surveys/p5.yaml"));
            assertThat(r.get(1)).isEqualTo(Path.of("/surveys/p9.yaml"));
            assertThat(r).doesNotHaveDuplicates();
            p.acknowledgeCautions();
            assertThat(new WorkbenchPrefs(node).cautionsAcknowledged()).isTrue();
        } finally {
            node.removeNode();
        }
    }

    @Test
    void equationChoiceRebuildsCtdProfilesOnly() {
        int n = 11;
        double[] z = new double[n], t = new double[n], sal = new double[n], c = new double[n];
        for (int i = 0; i < n; i++) {
            z[i] = i;
            t[i] = 25;
            sal[i] = 35;
            c[i] = 1500;
        }
        Cast ctd = new Cast("ctd", Double.NaN, 45, 0, null, "ctd.csv", z, Cast.absent(n), t, sal, Cast.absent(n), Cast.absent(n));
        Cast sv = new Cast("sv", Double.NaN, 45, 0, null, "sv.csv", z, Cast.absent(n), Cast.absent(n), Cast.absent(n),
                Cast.absent(n), c);
        List<DerivedProfile> built = List.of(
                ProfileBuilder.build(ctd, SoundSpeedEquation.UNESCO, 45, CastQc.Settings.DEFAULTS),
                ProfileBuilder.build(sv, SoundSpeedEquation.UNESCO, 45, CastQc.Settings.DEFAULTS));
        CastsModel m = new CastsModel(List.of(ctd, sv), built, SoundSpeedEquation.UNESCO);
        double unescoSurface = m.profilePoints(0, CastsModel.Quantity.SOUND_SPEED).get(0).value();
        m.rebuild(SoundSpeedEquation.MACKENZIE);
        assertThat(m.equation()).isEqualTo(SoundSpeedEquation.MACKENZIE);
        CastsModel.Point first = m.profilePoints(0, CastsModel.Quantity.SOUND_SPEED).get(0);
        double mackenzieSurface = first.value(), zz = first.depth();
        // Mackenzie (1981) at S 35, with T on IPTS-68 as published: T68 = 1.00024 T90 = 25.006 deg C
        // (Saunders 1990, the usual ITS-90 conversion). c = 1448.96 + 4.591 T - 5.304e-2 T^2
        // + 2.374e-4 T^3 + 1.630e-2 z + 1.675e-7 z^2 - 7.139e-13 T z^3 (salinity terms vanish at S 35),
        // worked by hand from the published nine-term equation
        double t68 = 1.00024 * 25;
        double expected = 1448.96 + 4.591 * t68 - 5.304e-2 * t68 * t68 + 2.374e-4 * t68 * t68 * t68
                + 1.630e-2 * zz + 1.675e-7 * zz * zz - 7.139e-13 * t68 * zz * zz * zz;
        assertThat(mackenzieSurface).isCloseTo(expected, within(1e-6));
        // the two equations agree to a few tenths of a m/s in warm surface water (common practice), but differ
        assertThat(unescoSurface).isCloseTo(mackenzieSurface, within(0.5)).isNotEqualTo(mackenzieSurface);
        // the velocimeter cast keeps its measured sound speed
        assertThat(m.profilePoints(1, CastsModel.Quantity.SOUND_SPEED)).allSatisfy(p -> assertThat(p.value()).isEqualTo(1500));
        assertThat(m.rawPoints(1, CastsModel.Quantity.TEMPERATURE)).isEmpty();
    }
}
