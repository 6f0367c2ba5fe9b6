package org.leadline.robust;

import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import org.leadline.cli.Main;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.Reader;
import java.io.StringWriter;
import java.net.URISyntaxException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Random;
import java.util.stream.Stream;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * The bad-input catalogue (issue 8): every file under {@code src/test/resources/bad-inputs/},
 * listed with its expected answer in {@code catalogue.csv}, goes through the real command line
 * ({@link Main#run}) in place of one input of a small good survey ({@code bad-inputs/good/}).
 *
 * <p>For a bad input (exit 2) standard error must be exactly one line, the expected message naming
 * file, line and column; nothing may be written to the output folder (it is empty or absent) and
 * there is no stack trace. For an accepted input (exit 0) the expected text is a warning line the
 * run must print (the run's warnings, which also go into the report and lineage), or empty.
 * {@code {file}} in an expected message stands for the path of the input as given on the command
 * line, {@code {dir}} for the catalogue folder. Files named {@code @...} are made by this test
 * (see {@link #generated}): a 10 MB line would bloat the repository.
 *
 * <p>Set {@code -Dcatalogue.print=true} to print what each case actually answers (for writing
 * new rows).
 */
class BadInputCatalogueTest {
    static final boolean PRINT = Boolean.getBoolean("catalogue.print");

    record Case(String id, String command, String role, String file, int exit, String expected) {
        @Override public String toString() { return id; }
    }

    static Path catalogueDir() {
        try {
            return Path.of(BadInputCatalogueTest.class.getResource("/bad-inputs/catalogue.csv").toURI()).getParent();
        } catch (URISyntaxException e) {
            throw new IllegalStateException(e);
        }
    }

    static Stream<Case> cases() throws IOException {
        List<Case> out = new ArrayList<>();
        try (Reader r = Files.newBufferedReader(catalogueDir().resolve("catalogue.csv"), StandardCharsets.UTF_8)) {
            CSVFormat f = CSVFormat.DEFAULT.builder().setHeader().setSkipHeaderRecord(true).setCommentMarker('#').get();
            for (CSVRecord rec : f.parse(r)) {
                out.add(new Case(rec.get("id"), rec.get("command"), rec.get("role"), rec.get("file"),
                        Integer.parseInt(rec.get("exit")), rec.get("expected")));
            }
        }
        return out.stream();
    }

    @TempDir
    Path tmp;

    @ParameterizedTest(name = "{0}")
    @MethodSource("cases")
    void answersAsCatalogued(Case c) throws Exception {
        Path dir = catalogueDir();
        Path input = c.file().startsWith("@") ? generated(c.file()) : dir.resolve(c.file());
        Path out = tmp.resolve("out");
        String[] args = arguments(c, dir, input, out);
        StringWriter so = new StringWriter(), se = new StringWriter();
        int code = Main.run(args, new PrintWriter(so, true), new PrintWriter(se, true));
        String err = se.toString().replace("\r\n", "\n");
        String expected = c.expected().replace("{file}", input.toString()).replace("{dir}", dir.toString());
        if (PRINT) {
            System.out.println("CASE " + c.id() + " exit " + code + "\n" + err.replace(input.toString(), "{file}")
                    .replace(dir.toString(), "{dir}"));
        }
        assertThat(code).as("exit code; stderr:%n%s", err).isEqualTo(c.exit());
        assertThat(err).as("no stack trace").doesNotContain("\tat ").doesNotContain("Exception");
        if (c.exit() == Main.BAD_INPUT) {
            assertThat(err).as("one line").isEqualTo(expected + System.lineSeparator().replace("\r\n", "\n"));
            if (Files.exists(out)) {
                try (Stream<Path> s = Files.list(out)) {
                    assertThat(s.toList()).as("output folder after a refused input").isEmpty();
                }
            }
        } else {
            if (!expected.isEmpty()) assertThat(err.lines().toList()).as("warnings").contains(expected);
            if (c.command().equals("process")) {
                assertThat(out.resolve("soundings.csv")).exists();
                assertThat(out.resolve("lineage.json")).exists();
            }
        }
    }

    @org.junit.jupiter.api.Test
    void debugAddsTheStackTraceAfterTheSameFirstLine() {
        Path bad = catalogueDir().resolve("pings-nan.csv");
        StringWriter so = new StringWriter(), se = new StringWriter();
        int code = Main.run(new String[] {"process", "--debug", "--quiet", "--soundings", bad.toString(), "--out",
                tmp.resolve("out").toString()}, new PrintWriter(so, true), new PrintWriter(se, true));
        assertThat(code).isEqualTo(Main.BAD_INPUT);
        List<String> lines = se.toString().lines().toList();
        assertThat(lines.get(0)).isEqualTo("leadline: " + bad + ":11:4: expected a finite number for 'twtt', found 'NaN'");
        assertThat(lines.subList(1, lines.size())).anyMatch(l -> l.startsWith("org.leadline.io.InputException"))
                .anyMatch(l -> l.contains("at org.leadline.io.PingCsvReader"));
        assertThat(tmp.resolve("out")).doesNotExist();
    }

    /** The command line of a case: the good survey with one input replaced (or added). */
    static String[] arguments(Case c, Path dir, Path input, Path out) {
        String f = input.toString();
        switch (c.command()) {
            case "cast": return new String[] {"cast", f};
            case "barcheck": return new String[] {"barcheck", f};
            case "process": break;
            default: throw new IllegalArgumentException("unknown command " + c.command());
        }
        if (c.role().equals("project")) return new String[] {"process", f, "--quiet", "--out", out.toString()};
        Path good = dir.resolve("good");
        List<String> a = new ArrayList<>(List.of("process", "--quiet", "--cell", "2", "--out", out.toString()));
        a.addAll(List.of("--vessel", c.role().equals("vessel") ? f : good.resolve("vessel.yaml").toString()));
        a.addAll(List.of("--tide", c.role().equals("tide") ? f : good.resolve("tide.csv").toString()));
        a.addAll(List.of("--cast", c.role().equals("cast") ? f : good.resolve("cast.csv").toString()));
        switch (c.role()) {
            case "soundings" -> a.addAll(List.of("--soundings", f));
            case "nmea" -> a.addAll(List.of("--nmea", f));
            case "tide-zones" -> a.addAll(List.of("--soundings", good.resolve("pings.csv").toString(), "--tide-zones", f));
            case "navigation", "attitude", "journal" -> a.addAll(List.of("--soundings", good.resolve("pings.csv").toString(),
                    "--" + c.role(), f));
            default -> a.addAll(List.of("--soundings", good.resolve("pings.csv").toString()));
        }
        return a.toArray(String[]::new);
    }

    /** Inputs too big or too odd to commit, made on the fly from a fixed recipe. */
    Path generated(String name) throws IOException {
        Path p = tmp.resolve(name.substring(1));
        Path good = catalogueDir().resolve("good").resolve("pings.csv");
        switch (name) {
            case "@pings-10mb-line.csv" -> {
                // a good file with one 10 MB field in row 6 (line 7): a logger that lost its line ends
                List<String> lines = new ArrayList<>(Files.readAllLines(good));
                char[] junk = new char[10_000_000];
                Arrays.fill(junk, '7');
                junk[0] = '0';
                junk[1] = '.';
                junk[5_000_000] = 'x';
                String[] f = lines.get(6).split(",");
                f[3] = new String(junk);
                lines.set(6, String.join(",", f));
                Files.write(p, lines);
            }
            case "@pings-10mb-no-line-end.csv" -> {
                byte[] b = new byte[10_000_000];
                Arrays.fill(b, (byte) 'a');
                Files.write(p, b);
            }
            case "@nmea-10mb-line.nmea" -> {
                byte[] b = new byte[10_000_000];
                Arrays.fill(b, (byte) '$');
                Files.write(p, b);
            }
            case "@cast-10mb-line.csv" -> {
                StringBuilder sb = new StringBuilder("depth,temperature,salinity\n0,12,33\n");
                sb.append("1,12,").append("3".repeat(10_000_000)).append('\n');
                Files.writeString(p, sb);
            }
            case "@vessel-10mb-line.yaml" -> Files.writeString(p, "draft_m: 0.5\nname: " + "n".repeat(10_000_000) + "\n");
            case "@journal-binary.journal" -> {
                byte[] b = new byte[4096];
                new Random(13).nextBytes(b);
                Files.write(p, b);
            }
            default -> throw new IllegalArgumentException("no recipe for " + name);
        }
        return p;
    }
}
