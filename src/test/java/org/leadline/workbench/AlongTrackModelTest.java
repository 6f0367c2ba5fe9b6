package org.leadline.workbench;

import org.leadline.cleaning.Edit;
import org.leadline.cleaning.EditJournal;
import org.leadline.io.EditJournalFile;
import org.leadline.pipeline.ProcessingRun;
import org.leadline.io.ProjectReader;
import org.leadline.survey.SoundingTable;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.within;

/** The Along-track model and the session's journal handling, on the small test survey. */
class AlongTrackModelTest {
    @TempDir static Path dir;
    static Path project;
    static WorkbenchSession session;

    @BeforeAll
    static void open() throws Exception {
        project = TestSurvey.write(dir.resolve("survey"));
        session = WorkbenchSession.open(project, null);
    }

    @AfterAll
    static void close() throws Exception {
        session.close();
    }

    @Test
    void distanceAlongTrackIsTwoMetresPerPing() {
        AlongTrackModel m = new AlongTrackModel(session, "L1");
        assertThat(m.size()).isEqualTo(TestSurvey.PINGS_PER_LINE);
        // 2 m/s x 1 s between pings (TestSurvey), worked by hand; distances are measured in UTM
        // zone 30 whose point scale at lon -4.2, lat 50.1 is 0.9996 (1 + (1.2 deg x cos 50.1)^2 / 2)
        // = 0.99969 (Snyder 1987, eq. 8-11, first terms), so 398 m on the ground is 397.88 m in the grid
        assertThat(m.distance(199)).isCloseTo(398 * 0.99969, within(0.02));
        assertThat(m.distance(10)).isCloseTo(20 * 0.99969, within(0.002));
    }

    @Test
    void boxOverWholeDepthRangeBecomesATimeWindow() {
        AlongTrackModel m = new AlongTrackModel(session, "L2");
        double[] r = m.depthRange();
        // pings at 2 m spacing: 20..40 m holds pings 10..20, 11 pings (worked by hand)
        int[] sel = m.selectBox(AlongTrackModel.Axis.DISTANCE, 19.9, 40.1, r[0] - 1, r[1] + 1);
        assertThat(sel).hasSize(11);
        Edit.Selection js = m.journalSelection();
        assertThat(js).isInstanceOf(Edit.Window.class);
        Edit.Window w = (Edit.Window) js;
        assertThat(w.line()).isEqualTo("L2");
        assertThat(w.toTime() - w.fromTime()).isEqualTo(10.0);
    }

    @Test
    void boxOnTheTimeAxisSelectsByPingTime() {
        AlongTrackModel m = new AlongTrackModel(session, "L5");
        double[] r = m.depthRange();
        // one ping a second: 10.0 .. 20.0 s after the line's first ping holds pings 10..20 (worked by hand)
        int[] sel = m.selectBox(AlongTrackModel.Axis.TIME, m.time(0) + 9.5, m.time(0) + 20.5, r[1] + 1, r[0] - 1);
        assertThat(sel).hasSize(11);
        assertThat(sel[0]).isEqualTo(10);
        assertThat(m.time(1) - m.time(0)).isEqualTo(1.0);
        m.clearSelection();
        assertThat(m.journalSelection()).isNull();
    }

    @Test
    void boxOverPartOfTheDepthsBecomesIds() {
        AlongTrackModel m = new AlongTrackModel(session, "L3");
        // the fish school: pings 100..102 of L3 read 4 m shoaler (TestSurvey); a box above the seabed
        // is every sounding of its time range on a single-beam line, so it is a window
        double seabedThere = m.depth(99);
        int[] sel = m.selectBox(AlongTrackModel.Axis.DISTANCE, m.distance(90), m.distance(110), 0, seabedThere - 2);
        assertThat(sel).containsExactly(100, 101, 102);
        assertThat(m.journalSelection()).isInstanceOf(Edit.Window.class);
        // L3 runs east, down the slope: a box down to the depth of ping 95 holds pings 90..95 and
        // the fish 100..102 but not 96..99, so it is stored as ids (worked by hand)
        sel = m.selectBox(AlongTrackModel.Axis.DISTANCE, m.distance(90), m.distance(110), 0, m.depth(95));
        assertThat(sel).containsExactly(90, 91, 92, 93, 94, 95, 100, 101, 102);
        Edit.Selection js = m.journalSelection();
        assertThat(js).isInstanceOf(Edit.Ids.class);
        assertThat(((Edit.Ids) js).ranges()).containsExactly(m.id(90), m.id(95), m.id(100), m.id(102));
    }

    @Test
    void rejectUndoRedoRoundTripAndReplayFromDiskMatches() throws Exception {
        AlongTrackModel m = new AlongTrackModel(session, "L4");
        SoundingTable s = session.soundings();
        byte[] before = s.status.clone();
        int acc0 = m.countAccepted();
        int edits0 = session.edits().size();

        m.selectRange(50, 59);
        Edit rej = m.rejectSelection("test reject");
        assertThat(rej.action()).isEqualTo(Edit.Action.REJECT);
        assertThat(m.countAccepted()).isEqualTo(acc0 - countAccepted(before, m, 50, 59));
        for (int k = 50; k <= 59; k++) {
            assertThat(m.accepted(k)).isFalse();
            assertThat(m.reason(k)).isEqualTo("reviewer");
        }
        byte[] afterReject = s.status.clone();
        assertThat(session.surfaceStale()).isTrue();

        Edit undo = m.undo();
        assertThat(undo.action()).isEqualTo(Edit.Action.UNDO);
        assertThat(s.status).isEqualTo(before);
        assertThat(session.canRedo()).isTrue();

        Edit redo = m.redo();
        assertThat(redo.action()).isEqualTo(Edit.Action.REDO);
        assertThat(s.status).isEqualTo(afterReject);

        m.selectRange(55, 56);
        m.restoreSelection("keep these");
        assertThat(m.accepted(55)).isTrue();
        assertThat(m.accepted(54)).isFalse();

        // the journal on disk holds the four new edits, in order
        List<Edit> disk = EditJournalFile.read(session.journalPath()).edits();
        assertThat(disk).hasSize(edits0 + 4);
        assertThat(disk.subList(edits0, edits0 + 4)).extracting(Edit::action).containsExactly(Edit.Action.REJECT,
                Edit.Action.UNDO, Edit.Action.REDO, Edit.Action.RESTORE);

        // a processing run that replays the journal file gives the statuses held in memory
        ProcessingRun.Result replayed = new ProcessingRun(session.project(), null).compute();
        assertThat(replayed.soundings().status).isEqualTo(s.status);
        assertThat(replayed.soundings().reason).isEqualTo(s.reason);
        // and so does the replay of the file onto the automatic statuses
        SoundingTable auto = new ProcessingRun(ProjectReader.read(project), null).compute().soundings();
        EditJournal.apply(auto, disk);
        assertThat(auto.status).isEqualTo(s.status);

        // undo everything this test did so the other tests see the automatic statuses
        while (session.canUndo()) session.undo();
        assertThat(s.status).isEqualTo(before);
    }

    @Test
    void buildSurfaceReflectsRejections() throws Exception {
        SurfaceState s0 = session.surface();
        AlongTrackModel m = new AlongTrackModel(session, "L5");
        m.selectRange(0, 99);
        int rejectedNow = 0;
        for (int k = 0; k <= 99; k++) if (m.accepted(k)) rejectedNow++;
        m.rejectSelection("");
        WorkbenchSession.Snapshot snap = session.snapshot();
        session.setSurface(session.computeSurface(snap), snap);
        SurfaceState s1 = session.surface();
        assertThat(session.surfaceStale()).isFalse();
        assertThat(s1.accepted()).isEqualTo(s0.accepted() - rejectedNow);
        assertThat(s1.compliance().evaluated()).isEqualTo(s0.compliance().evaluated() - rejectedNow);
        session.undo();
        assertThat(Files.size(session.journalPath())).isPositive();
    }

    private static int countAccepted(byte[] status, AlongTrackModel m, int k0, int k1) {
        int c = 0;
        for (int k = k0; k <= k1; k++) if (status[m.id(k)] == SoundingTable.Status.ACCEPTED.code) c++;
        return c;
    }
}
