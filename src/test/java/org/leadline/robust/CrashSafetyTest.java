package org.leadline.robust;

import com.fasterxml.jackson.databind.ObjectMapper;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.leadline.cli.Main;
import org.leadline.pipeline.OutputFolder;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import java.util.concurrent.TimeUnit;
import java.util.function.Predicate;
import java.util.stream.Stream;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * Crash safety of the output folder (issue 8, docs/reliability.md): a real child JVM runs
 * {@code leadline process} on a survey big enough to take a few seconds and is killed with SIGKILL
 * ({@link Process#destroyForcibly()} on Linux) at several moments; the output folder held a
 * previous run's outputs. Afterwards every file under a final name must be complete: byte-identical
 * to the previous run's or to the new run's (reference runs, made in this JVM; lineage.json and
 * report.html carry times, so they must parse / be whole instead), and the set must be one run's
 * unless the commit marker shows an interrupted commit, which {@link OutputFolder#recover} then
 * finishes into the new run's complete set.
 */
class CrashSafetyTest {
    static final List<String> OUTPUTS = List.of("soundings.csv", "surface.tif", "surface.xyz", "contours.geojson",
            "selected-soundings.geojson", "report.html", "report-profiles.png", "report-surface.png", "report-tpu.png",
            "lineage.json");
    /** Outputs with no times in them: the same inputs give the same bytes. */
    static final Predicate<String> DETERMINISTIC = n -> !n.equals("lineage.json") && !n.equals("report.html");

    @TempDir
    static Path tmp;
    static Path survey, previous, reference;
    static Map<String, byte[]> prev, ref;

    @BeforeAll
    static void surveysAndReferenceRuns() throws IOException {
        survey = tmp.resolve("survey");
        Files.createDirectories(survey);
        Path good = Path.of(BadInputCatalogueTest.catalogueDir().toString(), "good");
        for (String f : List.of("cast.csv", "tide.csv", "vessel.yaml")) Files.copy(good.resolve(f), survey.resolve(f));
        writePings(survey.resolve("pings-a.csv"), 0.0);
        writePings(survey.resolve("pings-b.csv"), 0.7);
        previous = tmp.resolve("previous");
        assertThat(runHere("pings-a.csv", previous)).isZero();
        prev = contents(previous);
        assertThat(prev.keySet()).containsExactlyInAnyOrderElementsOf(OUTPUTS);
        // the new run's reference outputs come from a child JVM like the killed ones (a GeoTIFF
        // written in this JVM, after other tests loaded Apache SIS differently, need not be byte-identical)
        reference = tmp.resolve("reference");
        Process p;
        try {
            p = child(reference, 0, tmp.resolve("child-reference.log"));
            assertThat(p.waitFor(300, TimeUnit.SECONDS)).isTrue();
        } catch (InterruptedException e) {
            throw new IOException(e);
        }
        assertThat(p.exitValue()).as(Files.readString(tmp.resolve("child-reference.log"))).isZero();
        ref = contents(reference);
        assertThat(ref.keySet()).containsExactlyInAnyOrderElementsOf(OUTPUTS);
        for (String n : OUTPUTS) {
            if (DETERMINISTIC.test(n) && !n.startsWith("report-")) {
                assertThat(prev.get(n)).as("A and B differ in " + n).isNotEqualTo(ref.get(n));
            }
        }
    }

    /** Multibeam lines: 3 lines x 500 pings x 40 beams = 60 000 soundings over a sloping bottom. */
    static void writePings(Path f, double shift) throws IOException {
        try (BufferedWriter w = Files.newBufferedWriter(f, StandardCharsets.US_ASCII)) {
            w.write("time,lat,lon,twtt,angle,line,beam\n");
            double t0 = 1_778_749_200.0; // 2026-05-14T09:00:00Z, inside the tide record
            StringBuilder sb = new StringBuilder();
            for (int l = 0; l < 3; l++) {
                for (int p = 0; p < 500; p++) {
                    double t = t0 + l * 150 + p * 0.25;
                    String time = org.leadline.io.IsoTime.append(new StringBuilder(), t).toString();
                    double lat = 53.5500 + p * 2.0e-6, lon = 9.9000 + l * 4.0e-4;
                    for (int b = 0; b < 40; b++) {
                        double a = -50 + b * 100.0 / 39;
                        double depth = 12 + shift + 0.002 * p + 0.3 * Math.sin(b * 0.3);
                        double twtt = 2 * depth / Math.cos(Math.toRadians(a)) / 1495.0;
                        sb.setLength(0);
                        sb.append(time).append(',').append(String.format(Locale.ROOT, "%.7f,%.7f,%.6f,%.2f,L%d,%d%n",
                                lat, lon, twtt, a, l + 1, b));
                        w.write(sb.toString());
                    }
                }
            }
        }
    }

    static String[] args(String pings, Path out) {
        return new String[] {"process", "--quiet", "--cell", "2", "--soundings", survey.resolve(pings).toString(),
                "--cast", survey.resolve("cast.csv").toString(), "--tide", survey.resolve("tide.csv").toString(),
                "--vessel", survey.resolve("vessel.yaml").toString(), "--out", out.toString()};
    }

    static int runHere(String pings, Path out) {
        StringWriter so = new StringWriter(), se = new StringWriter();
        return Main.run(args(pings, out), new PrintWriter(so), new PrintWriter(se));
    }

    static Process child(Path out, long commitPauseMs, Path log) throws IOException {
        String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
        List<String> cmd = new ArrayList<>(List.of(java, "-Xmx512m", "-Djava.awt.headless=true",
                "-Dleadline.test.commitPauseMs=" + commitPauseMs, "-cp", System.getProperty("java.class.path"),
                "org.leadline.cli.Main"));
        cmd.addAll(Arrays.asList(args("pings-b.csv", out)));
        ProcessBuilder pb = new ProcessBuilder(cmd);
        pb.redirectErrorStream(true);
        pb.redirectOutput(log.toFile()); // a file, not a pipe: the kill must not depend on our reading
        return pb.start();
    }

    /** The moments at which the child is killed. */
    enum Moment {
        /** While reading and computing: nothing staged yet. */
        COMPUTING,
        /** As soon as the staging folder appears: outputs half-written there. */
        WRITING,
        /** Half a second into writing. */
        WRITING_LATER,
        /** Between two moves of the commit (the commit pauses 400 ms after each move). */
        COMMITTING,
        /** Not killed: the run finishes. */
        NEVER
    }

    @Test
    void killedRunLeavesPreviousOrNewCompleteOutputs() throws Exception {
        List<String> seen = new ArrayList<>();
        for (Moment m : Moment.values()) {
            Path out = tmp.resolve("out-" + m.name().toLowerCase(Locale.ROOT));
            copyTree(previous, out);
            Path log = tmp.resolve("child-" + m.name().toLowerCase(Locale.ROOT) + ".log");
            Process p = child(out, m == Moment.COMMITTING ? 400 : 0, log);
            boolean killed = false;
            switch (m) {
                case COMPUTING -> killed = killAfter(p, () -> true, 1500);
                case WRITING -> killed = killAfter(p, () -> hasStaging(out), 0);
                case WRITING_LATER -> killed = killAfter(p, () -> hasStaging(out), 500);
                case COMMITTING -> killed = killAfter(p, () -> Files.exists(out.resolve(OutputFolder.MARKER))
                        && !Arrays.equals(read(out.resolve("soundings.csv")), prev.get("soundings.csv")), 0);
                case NEVER -> assertThat(p.waitFor(120, TimeUnit.SECONDS)).isTrue();
            }
            if (!killed) p.waitFor(120, TimeUnit.SECONDS);
            if (m == Moment.NEVER) assertThat(p.exitValue()).as(Files.readString(log)).isZero();
            String state = check(out, m);
            seen.add(m + ": " + state);
        }
        System.out.println("crash safety: " + seen);
        assertThat(seen.get(Moment.COMMITTING.ordinal())).as(seen.toString()).contains("mixed");
        assertThat(seen.get(Moment.NEVER.ordinal())).contains("new");
        assertThat(seen.get(Moment.COMPUTING.ordinal())).contains("previous");
    }

    /** Polls every 5 ms until the condition holds, waits {@code delayMs}, then sends SIGKILL. */
    static boolean killAfter(Process p, Check c, long delayMs) throws Exception {
        long deadline = System.nanoTime() + TimeUnit.SECONDS.toNanos(120);
        while (!c.holds()) {
            if (!p.isAlive()) return false;
            if (System.nanoTime() > deadline) throw new AssertionError("child never reached the moment");
            Thread.sleep(5);
        }
        if (delayMs > 0) Thread.sleep(delayMs);
        p.destroyForcibly();
        p.waitFor(30, TimeUnit.SECONDS);
        return true;
    }

    interface Check { boolean holds() throws Exception; }

    static boolean hasStaging(Path out) throws IOException {
        try (Stream<Path> s = Files.list(out)) {
            return s.anyMatch(q -> q.getFileName().toString().startsWith(".leadline-staging-"));
        }
    }

    /**
     * Asserts the guarantees on a folder after the child ended; returns "previous", "new" or
     * "mixed, recovered to new".
     */
    static String check(Path out, Moment m) throws Exception {
        Map<String, byte[]> now = contents(out);
        int fromPrev = 0, fromNew = 0;
        for (var e : now.entrySet()) {
            String n = e.getKey();
            assertThat(OUTPUTS).as("unexpected file " + n + " after " + m).contains(n);
            if (DETERMINISTIC.test(n)) {
                boolean p = Arrays.equals(e.getValue(), prev.get(n)), r = Arrays.equals(e.getValue(), ref.get(n));
                assertThat(p || r).as(n + " after " + m + " is neither the previous nor the new complete file").isTrue();
                if (p && !r) fromPrev++;
                if (r && !p) fromNew++;
            }
        }
        assertComplete(out);
        boolean marker = Files.exists(out.resolve(OutputFolder.MARKER));
        if (fromPrev > 0 && fromNew > 0 || marker) {
            assertThat(marker).as("a mixed set without the commit marker after " + m).isTrue();
            assertThat(OutputFolder.recover(out)).isTrue();
            Map<String, byte[]> after = contents(out);
            assertThat(after.keySet()).containsExactlyInAnyOrderElementsOf(OUTPUTS);
            for (String n : OUTPUTS) {
                if (DETERMINISTIC.test(n) && !Arrays.equals(after.get(n), ref.get(n))) {
                    Path dbg = Path.of(System.getProperty("java.io.tmpdir"), "crash-debug");
                    Files.createDirectories(dbg);
                    Files.write(dbg.resolve("recovered-" + n), after.get(n));
                    Files.write(dbg.resolve("reference-" + n), ref.get(n));
                    Files.write(dbg.resolve("previous-" + n), prev.get(n));
                    throw new AssertionError(n + " after recovery from " + m + " differs from the new run's");
                }
            }
            assertComplete(out);
            return "mixed, recovered to new";
        }
        if (now.isEmpty()) return "none";
        assertThat(now.keySet()).containsExactlyInAnyOrderElementsOf(OUTPUTS);
        return fromNew > 0 ? "new" : "previous";
    }

    /** Whole-file checks of the outputs that carry times: lineage.json parses, report.html ends. */
    static void assertComplete(Path out) throws IOException {
        Path lineage = out.resolve("lineage.json");
        if (Files.exists(lineage)) assertThat(new ObjectMapper().readTree(lineage.toFile()).has("outputs")).isTrue();
        Path report = out.resolve("report.html");
        if (Files.exists(report)) assertThat(Files.readString(report).strip()).endsWith("</html>");
        Path tif = out.resolve("surface.tif");
        if (Files.exists(tif)) {
            // GDAL opens it (gdal-bin is installed here and in CI, DEVELOPERS.md)
            Process g = new ProcessBuilder("gdalinfo", tif.toString()).redirectErrorStream(true)
                    .redirectOutput(ProcessBuilder.Redirect.DISCARD).start();
            try {
                assertThat(g.waitFor(60, TimeUnit.SECONDS) && g.exitValue() == 0).as("gdalinfo " + tif).isTrue();
            } catch (InterruptedException e) {
                throw new IOException(e);
            }
        }
        Path sounds = out.resolve("soundings.csv");
        if (Files.exists(sounds)) {
            try (Stream<String> s = Files.lines(sounds)) {
                assertThat(s.count()).as("soundings.csv rows").isEqualTo(3 * 500 * 40 + 1);
            }
        }
    }

    static Map<String, byte[]> contents(Path dir) throws IOException {
        Map<String, byte[]> m = new TreeMap<>();
        try (Stream<Path> s = Files.list(dir)) {
            for (Path p : s.toList()) {
                String n = p.getFileName().toString();
                if (Files.isRegularFile(p) && !n.startsWith(".leadline-")) m.put(n, Files.readAllBytes(p));
            }
        }
        return m;
    }

    static byte[] read(Path p) {
        try {
            return Files.readAllBytes(p);
        } catch (IOException e) {
            return new byte[0];
        }
    }

    static void copyTree(Path from, Path to) throws IOException {
        Files.createDirectories(to);
        try (Stream<Path> s = Files.list(from)) {
            for (Path p : s.toList()) Files.copy(p, to.resolve(p.getFileName()), StandardCopyOption.REPLACE_EXISTING);
        }
    }

}
