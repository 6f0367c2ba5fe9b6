package org.leadline.io;

import java.time.OffsetDateTime;
import java.time.format.DateTimeParseException;

/**
 * ISO-8601 date-times (DESIGN.md section 3) to seconds since 1970-01-01T00:00Z as a double.
 *
 * <p>Accepted: {@code YYYY-MM-DDTHH:MM:SS[.fraction](Z|+HH:MM|-HH:MM)}; a space may stand for the
 * {@code T}; a time without a zone is taken as UTC (Leadline files are UTC by convention). The
 * common UTC form is parsed by a hand-written path (no allocation, about 20 ns); anything else
 * falls back to {@link OffsetDateTime#parse}. Leap seconds ({@code :60}) are refused, as POSIX
 * time has none.
 *
 * <p>Day count: "days from civil" of H. Hinnant, <i>chrono-Compatible Low-Level Date
 * Algorithms</i> (2013, public domain), proleptic Gregorian calendar.
 *
 * <p>Precision: a double holds epoch seconds of this century to about 0.2 microseconds.
 */
public final class IsoTime {
    private IsoTime() {}

    /**
     * Parses one time.
     *
     * @param s ISO-8601 text
     * @return seconds since the epoch, UTC
     * @throws IllegalArgumentException with a message saying what was expected and what was found
     */
    public static double parse(CharSequence s) {
        double fast = fastUtc(s);
        if (!Double.isNaN(fast)) return fast;
        String text = s.toString().trim();
        try {
            String t = text.length() > 10 && text.charAt(10) == ' ' ? text.substring(0, 10) + 'T' + text.substring(11) : text;
            OffsetDateTime odt;
            if (hasZone(t)) {
                odt = OffsetDateTime.parse(t);
            } else {
                odt = OffsetDateTime.parse(t + "Z");
            }
            return odt.toEpochSecond() + odt.getNano() * 1e-9;
        } catch (DateTimeParseException e) {
            throw new IllegalArgumentException("expected an ISO-8601 UTC time like 2026-05-14T09:15:02.250Z, found '"
                    + TextFiles.abbreviate(text) + "'");
        }
    }

    private static boolean hasZone(String t) {
        if (t.endsWith("Z") || t.endsWith("z")) return true;
        int tpos = t.indexOf('T');
        if (tpos < 0) return false;
        for (int i = tpos; i < t.length(); i++) if (t.charAt(i) == '+' || t.charAt(i) == '-') return true;
        return false;
    }

    /** Formats epoch seconds as ISO-8601 UTC with milliseconds, e.g. 2026-05-14T09:15:02.250Z. */
    public static String format(double epochSeconds) {
        long ms = Math.round(epochSeconds * 1000.0);
        return java.time.Instant.ofEpochMilli(ms).toString().replaceFirst("(:\\d\\d)Z$", "$1.000Z");
    }

    /** Hand path for YYYY-MM-DDTHH:MM:SS[.f*][Z]; NaN when the text has another shape. */
    private static double fastUtc(CharSequence s) {
        int n = s.length();
        if (n < 19) return Double.NaN;
        int y = digits(s, 0, 4), mo = digits(s, 5, 2), d = digits(s, 8, 2);
        int h = digits(s, 11, 2), mi = digits(s, 14, 2), se = digits(s, 17, 2);
        if (y < 0 || mo < 0 || d < 0 || h < 0 || mi < 0 || se < 0) return Double.NaN;
        if (s.charAt(4) != '-' || s.charAt(7) != '-' || s.charAt(13) != ':' || s.charAt(16) != ':') return Double.NaN;
        char tc = s.charAt(10);
        if (tc != 'T' && tc != 't' && tc != ' ') return Double.NaN;
        if (mo < 1 || mo > 12 || d < 1 || d > daysInMonth(y, mo) || h > 23 || mi > 59 || se > 59) return Double.NaN;
        int i = 19;
        double frac = 0;
        if (i < n && s.charAt(i) == '.') {
            i++;
            long num = 0;
            long scale = 1;
            int start = i;
            while (i < n && s.charAt(i) >= '0' && s.charAt(i) <= '9') {
                if (scale < 1_000_000_000_000L) { num = num * 10 + (s.charAt(i) - '0'); scale *= 10; }
                i++;
            }
            if (i == start) return Double.NaN;
            frac = (double) num / scale;
        }
        if (i < n && (s.charAt(i) == 'Z' || s.charAt(i) == 'z')) i++;
        if (i != n) return Double.NaN; // offsets and trailing text: slow path
        long days = daysFromCivil(y, mo, d);
        return (days * 86400L + h * 3600L + mi * 60L + se) + frac;
    }

    private static int digits(CharSequence s, int from, int count) {
        int v = 0;
        for (int i = from; i < from + count; i++) {
            char c = s.charAt(i);
            if (c < '0' || c > '9') return -1;
            v = v * 10 + (c - '0');
        }
        return v;
    }

    private static int daysInMonth(int y, int m) {
        switch (m) {
            case 2: return (y % 4 == 0 && (y % 100 != 0 || y % 400 == 0)) ? 29 : 28;
            case 4: case 6: case 9: case 11: return 30;
            default: return 31;
        }
    }

    /** Days since 1970-01-01 of a proleptic Gregorian date (Hinnant 2013, days_from_civil). */
    static long daysFromCivil(int y, int m, int d) {
        y -= m <= 2 ? 1 : 0;
        long era = (y >= 0 ? y : y - 399) / 400;
        long yoe = y - era * 400;
        long doy = (153L * (m + (m > 2 ? -3 : 9)) + 2) / 5 + d - 1;
        long doe = yoe * 365 + yoe / 4 - yoe / 100 + doy;
        return era * 146097 + doe - 719468;
    }

    /** Appends epoch seconds as ISO-8601 UTC with milliseconds (fast path for bulk writers). */
    public static StringBuilder append(StringBuilder sb, double t) {
        if (Double.isNaN(t)) return sb;
        long ms = Math.round(t * 1000.0);
        long sec = Math.floorDiv(ms, 1000);
        int milli = (int) Math.floorMod(ms, 1000);
        java.time.LocalDateTime d = java.time.LocalDateTime.ofEpochSecond(sec, 0, java.time.ZoneOffset.UTC);
        pad(sb, d.getYear(), 4).append('-');
        pad(sb, d.getMonthValue(), 2).append('-');
        pad(sb, d.getDayOfMonth(), 2).append('T');
        pad(sb, d.getHour(), 2).append(':');
        pad(sb, d.getMinute(), 2).append(':');
        pad(sb, d.getSecond(), 2).append('.');
        return pad(sb, milli, 3).append('Z');
    }

    private static StringBuilder pad(StringBuilder sb, int v, int width) {
        String s = Integer.toString(v);
        for (int k = s.length(); k < width; k++) sb.append('0');
        return sb.append(s);
    }
}
