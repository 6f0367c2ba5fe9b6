package org.leadline.io;

import java.time.Instant;
import java.time.LocalDateTime;
import java.time.ZoneOffset;

/** ISO-8601 UTC times with milliseconds, e.g. {@code 2026-05-14T09:15:02.250Z}, formatted fast. */
public final class IsoTime {
    private IsoTime() {}

    /** Appends epoch seconds t as ISO-8601 UTC with millisecond precision. */
    public static StringBuilder append(StringBuilder sb, double t) {
        if (Double.isNaN(t)) return sb;
        long ms = Math.round(t * 1000.0);
        long sec = Math.floorDiv(ms, 1000);
        int milli = (int) Math.floorMod(ms, 1000);
        LocalDateTime d = LocalDateTime.ofEpochSecond(sec, 0, ZoneOffset.UTC);
        pad(sb, d.getYear(), 4).append('-');
        pad(sb, d.getMonthValue(), 2).append('-');
        pad(sb, d.getDayOfMonth(), 2).append('T');
        pad(sb, d.getHour(), 2).append(':');
        pad(sb, d.getMinute(), 2).append(':');
        pad(sb, d.getSecond(), 2).append('.');
        pad(sb, milli, 3).append('Z');
        return sb;
    }

    /** Formats epoch seconds as ISO-8601 UTC with milliseconds. */
    public static String format(double t) {
        return append(new StringBuilder(24), t).toString();
    }

    /** Parses an ISO-8601 instant to epoch seconds (with fraction). */
    public static double parse(String s) {
        Instant i = Instant.parse(s);
        return i.getEpochSecond() + i.getNano() * 1e-9;
    }

    private static StringBuilder pad(StringBuilder sb, int v, int width) {
        String s = Integer.toString(v);
        for (int k = s.length(); k < width; k++) sb.append('0');
        return sb.append(s);
    }
}
