package org.leadline.io;

import java.util.ArrayList;
import java.util.Collections;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;

/**
 * What {@link NmeaReader} could not use in a log: a count per kind of problem and the first few
 * examples of each kind with their 1-based line numbers. Nothing here is fatal; a log with many
 * bad sentences still yields the good ones. Immutable once the reader hands it out.
 */
public final class NmeaProblems {

    /** Kinds of problem, each with the phrase used in the summary. */
    public enum Kind {
        NOT_NMEA("line does not start with '$' or '!'"),
        MISSING_CHECKSUM("no '*hh' checksum"),
        BAD_CHECKSUM("checksum does not match"),
        UNKNOWN_TYPE("sentence type not read (not DBT, DPT, GGA, RMC, GLL, ZDA, HDT, VTG)"),
        MALFORMED_FIELD("field does not parse"),
        NO_VALID_FIX("receiver flagged the fix invalid (GGA quality 0, RMC/GLL status V or mode N)"),
        EMPTY_VALUE("value field empty (e.g. sounder without bottom)"),
        BEFORE_FIRST_TIME("untimed sentence before any time-bearing sentence"),
        START_DATE_DIFFERS("given start date differs from the log's own date");

        public final String description;

        Kind(String description) { this.description = description; }
    }

    /** One example problem: the line number (1-based), its kind and what was wrong. */
    public record Example(long line, Kind kind, String detail) {
        @Override
        public String toString() { return "line " + line + ": " + detail; }
    }

    /** Examples kept per kind. */
    public static final int EXAMPLES_PER_KIND = 5;

    private final long[] counts = new long[Kind.values().length];
    private final Map<Kind, List<Example>> examples = new EnumMap<>(Kind.class);

    NmeaProblems() { }

    boolean keepsExample(Kind kind) { return counts[kind.ordinal()] < EXAMPLES_PER_KIND; }

    void add(Kind kind, long line, String detail) {
        if (counts[kind.ordinal()]++ < EXAMPLES_PER_KIND) {
            examples.computeIfAbsent(kind, k -> new ArrayList<>()).add(new Example(line, kind, detail));
        }
    }

    /** Number of lines or sentences with this problem. */
    public long count(Kind kind) { return counts[kind.ordinal()]; }

    /** Total of all counts. */
    public long total() {
        long t = 0;
        for (long c : counts) t += c;
        return t;
    }

    /** The first few examples of this kind, in file order (empty when none). */
    public List<Example> examples(Kind kind) {
        return Collections.unmodifiableList(examples.getOrDefault(kind, List.of()));
    }

    /** One-line summary: the count of each kind that occurred ("3 x checksum does not match; ..."), or "none". */
    public String oneLine() {
        StringBuilder sb = new StringBuilder();
        for (Kind k : Kind.values()) {
            if (counts[k.ordinal()] == 0) continue;
            if (sb.length() > 0) sb.append("; ");
            sb.append(counts[k.ordinal()]).append(" x ").append(k.description);
        }
        return sb.length() == 0 ? "none" : sb.toString();
    }

    /** Multi-line summary: one line per kind that occurred, with its count and examples. */
    public String summary() {
        if (total() == 0) return "no problems";
        StringBuilder sb = new StringBuilder();
        for (Kind k : Kind.values()) {
            long c = count(k);
            if (c == 0) continue;
            sb.append(c).append(" x ").append(k.description).append('\n');
            for (Example e : examples(k)) sb.append("    ").append(e).append('\n');
        }
        return sb.toString();
    }

    @Override
    public String toString() { return summary(); }
}
