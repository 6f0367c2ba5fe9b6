package org.leadline.io;

import org.leadline.io.NmeaLog.Sentence;
import org.leadline.io.NmeaProblems.Kind;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.DateTimeException;
import java.time.LocalDate;
import java.util.Arrays;

/**
 * Reads an NMEA 0183 log (NMEA 0183 Standard for Interfacing Marine Electronic Devices, version
 * 4.x field layouts) into a columnar {@link NmeaLog}: depths from DBT and DPT, positions from GGA,
 * RMC and GLL, date and time from ZDA and RMC, true heading from HDT, speed over ground from RMC and
 * VTG. Any two-letter talker ID is accepted (GP, GN, SD, HE, II, ...).
 *
 * <p>Each line is one sentence: {@code $} or {@code !}, the address field, comma-separated data
 * fields, {@code *} and a two-digit hexadecimal checksum, the XOR of every character between the
 * {@code $} and the {@code *} (exclusive). LF, CRLF and lone CR line ends, a UTF-8 byte-order mark
 * and blank lines are accepted. A line that is not NMEA, a missing or wrong checksum, an unknown
 * sentence type, a field that does not parse, or a fix the receiver flags invalid is counted in
 * {@link NmeaLog#problems()} (with the first few line numbers) and skipped, never fatal.
 *
 * <p>Time: NMEA times are times of day. Full UTC times are built from the latest date (ZDA, or RMC
 * with a two-digit year read as 1980-2079). A time of day that lies more than 12 h before the
 * previous stamp is taken to be on the next day (midnight rollover), more than 12 h after it on the
 * previous day; so a gap of 12 h or more without any time-bearing sentence cannot be dated right.
 * Sentences before the first date are kept and dated backwards from it once it arrives; a log with
 * no date at all is dated from {@code startDate} (the survey date) when given, else an
 * {@link InputException}. When the log has its own date it wins over {@code startDate}, and a
 * disagreement is reported as a problem. Sentences with no time of their own (DBT, DPT, HDT, VTG)
 * take the time of the latest time-bearing sentence: see {@link NmeaLog}.
 *
 * <p>Speed: the reader splits lines by hand, without regular expressions or per-field strings; a
 * generated log of one million sentences took 0.2-0.3 s of CPU time (measured once on a loaded
 * 2-core machine; see docs/formats/nmea.md).
 *
 * <pre>{@code
 * NmeaLog log = NmeaReader.read(Path.of("line7.nmea"), LocalDate.of(2026, 5, 14));
 * System.out.println(log.problems().summary());
 * PingTable pings = log.toPingTable("L7");
 * }</pre>
 */
public final class NmeaReader {

    /** Metres per international foot, exact (common practice; 1959 international yard and pound agreement). */
    public static final double METRES_PER_FOOT = 0.3048;
    /** Metres per fathom (6 ft), exact. */
    public static final double METRES_PER_FATHOM = 6 * METRES_PER_FOOT;
    /** m/s per knot: one international nautical mile (1852 m) per hour, exact. */
    public static final double MS_PER_KNOT = 1852.0 / 3600.0;
    /** m/s per km/h, exact. */
    public static final double MS_PER_KMH = 1000.0 / 3600.0;

    private static final int MAX_LINE = 4096;
    private static final double DAY = 86400.0;

    private NmeaReader() { }

    /**
     * NMEA 0183 checksum of a sentence body: the XOR of the 8-bit codes of every character between
     * the '$' (or '!') and the '*', both exclusive. Written as two upper-case hex digits after '*'.
     */
    public static int checksum(CharSequence body) {
        int sum = 0;
        for (int i = 0; i < body.length(); i++) sum ^= body.charAt(i);
        return sum & 0xFF;
    }

    /** Reads a log that carries its own date (ZDA or RMC). */
    public static NmeaLog read(Path file) throws IOException {
        return read(file, null);
    }

    /**
     * Reads a log; {@code startDate} (UTC date of the first sentence; may be null) dates the log
     * only when it has no ZDA or RMC date of its own.
     *
     * @throws InputException when nothing in the log gives a date and {@code startDate} is null
     */
    public static NmeaLog read(Path file, LocalDate startDate) throws IOException {
        try (InputStream in = Files.newInputStream(file)) {
            return read(in, file.toString(), startDate);
        }
    }

    /** As {@link #read(Path, LocalDate)} from a stream; {@code sourceName} names it in messages. */
    public static NmeaLog read(InputStream in, String sourceName, LocalDate startDate) throws IOException {
        Parser p = new Parser(sourceName);
        byte[] chunk = new byte[1 << 16];
        byte[] line = p.line;
        int len = 0;
        boolean overlong = false, prevCR = false, first = true;
        int r;
        while ((r = in.read(chunk)) > 0) {
            int i = 0;
            if (first) {
                first = false;
                if (r >= 3 && (chunk[0] & 0xFF) == 0xEF && (chunk[1] & 0xFF) == 0xBB && (chunk[2] & 0xFF) == 0xBF) i = 3;
            }
            for (; i < r; i++) {
                byte c = chunk[i];
                if (c == '\n' || c == '\r') {
                    if (c == '\n' && prevCR) { prevCR = false; continue; } // the LF of a CRLF
                    prevCR = c == '\r';
                    p.lineNo++;
                    p.processLine(len, overlong);
                    len = 0;
                    overlong = false;
                    continue;
                }
                prevCR = false;
                if (len < MAX_LINE) line[len++] = c;
                else overlong = true;
            }
        }
        if (len > 0 || overlong) {
            p.lineNo++;
            p.processLine(len, overlong);
        }
        return p.finish(startDate);
    }

    /** The state of one read: line buffer, field offsets, time state and growing columns. */
    private static final class Parser {
        final String source;
        final byte[] line = new byte[MAX_LINE];
        int lineLen;
        long lineNo;
        final NmeaProblems problems = new NmeaProblems();
        final long[] sentenceCounts = new long[Sentence.values().length];

        // Field k spans [fs[k], fe[k]) in line; field 0 is the address (after '$').
        int[] fs = new int[40], fe = new int[40];
        int nf;
        String bad; // set by a field parser that found a malformed field
        // Scratch of the last decimal parse: value = mant / 10^scale, intDigits before the point.
        long mant;
        int scale, intDigits;

        // Time state. lastTime is NaN until the first time-bearing sentence. Until the first date,
        // times are relative to day 0; the first date shifts every row stored so far.
        double lastTime = Double.NaN;
        boolean dated;
        long firstDateLine;
        int lastDdmmyy = -1;
        long lastRmcDay;

        // Columns.
        int nd, nfx, nh, ns;
        double[] dT = new double[1024], dDepth = new double[1024], dOff = new double[1024];
        byte[] dSrc = new byte[1024];
        double[] fT = new double[1024], fLat = new double[1024], fLon = new double[1024],
                fHdop = new double[1024], fAlt = new double[1024];
        int[] fQ = new int[1024], fSat = new int[1024];
        byte[] fSrc = new byte[1024];
        double[] hT = new double[1024], hV = new double[1024];
        double[] sT = new double[1024], sSog = new double[1024], sCog = new double[1024];
        byte[] sSrc = new byte[1024];

        Parser(String source) { this.source = source; }

        /** Counts a problem on the current line; the example text is built only while examples are kept. */
        void problem(Kind kind, String suffix) {
            problems.add(kind, lineNo, problems.keepsExample(kind) ? text() + suffix : null);
        }

        String text() {
            int n = Math.min(lineLen, 100);
            String s = new String(line, 0, n, StandardCharsets.ISO_8859_1);
            return n < lineLen ? s + "..." : s;
        }

        void processLine(int len, boolean overlong) {
            // Trailing blanks are not part of a sentence (some loggers pad lines).
            while (len > 0 && (line[len - 1] == ' ' || line[len - 1] == '\t')) len--;
            lineLen = len;
            if (len == 0 && !overlong) return; // blank line
            if (overlong) { problem(Kind.NOT_NMEA, " : line longer than " + MAX_LINE + " characters"); return; }
            byte c0 = line[0];
            if (c0 != '$' && c0 != '!') { problem(Kind.NOT_NMEA, ""); return; }
            // Checksum and field split in one pass over the characters between '$' and '*'.
            int sum = 0, star = -1;
            nf = 0;
            fs[0] = 1;
            for (int i = 1; i < len; i++) {
                byte c = line[i];
                if (c == '*') { star = i; break; }
                sum ^= c;
                if (c == ',') {
                    fe[nf] = i;
                    if (++nf == fs.length) { fs = Arrays.copyOf(fs, nf * 2); fe = Arrays.copyOf(fe, nf * 2); }
                    fs[nf] = i + 1;
                }
            }
            if (star < 0) { problem(Kind.MISSING_CHECKSUM, ""); return; }
            fe[nf] = star;
            nf++;
            int h1 = star + 1 < len ? hex(line[star + 1]) : -1, h2 = star + 2 < len ? hex(line[star + 2]) : -1;
            if (h1 < 0 || h2 < 0 || star + 3 != len) {
                problem(Kind.BAD_CHECKSUM, " : expected two hex digits after '*'");
                return;
            }
            int given = h1 << 4 | h2;
            sum &= 0xFF;
            if (given != sum) {
                problem(Kind.BAD_CHECKSUM, String.format(" : checksum %02X, computed %02X", given, sum));
                return;
            }
            Sentence type = type();
            if (type == null) { problem(Kind.UNKNOWN_TYPE, ""); return; }
            bad = null;
            boolean used = switch (type) {
                case GGA -> gga();
                case RMC -> rmc();
                case GLL -> gll();
                case ZDA -> zda();
                case DBT -> dbt();
                case DPT -> dpt();
                case HDT -> hdt();
                case VTG -> vtg();
            };
            if (bad != null) problem(Kind.MALFORMED_FIELD, " : " + bad);
            else if (used) sentenceCounts[type.ordinal()]++;
        }

        static int hex(byte c) {
            if (c >= '0' && c <= '9') return c - '0';
            if (c >= 'A' && c <= 'F') return c - 'A' + 10;
            if (c >= 'a' && c <= 'f') return c - 'a' + 10; // lower case is off-standard but harmless
            return -1;
        }

        /** Sentence type from a five-character address (talker ID + formatter); null if not read. */
        Sentence type() {
            if (line[0] != '$' || fe[0] - fs[0] != 5 || line[fs[0]] == 'P') return null; // '!', proprietary
            int a = fs[0] + 2;
            byte x = line[a], y = line[a + 1], z = line[a + 2];
            if (x == 'G' && y == 'G' && z == 'A') return Sentence.GGA;
            if (x == 'R' && y == 'M' && z == 'C') return Sentence.RMC;
            if (x == 'G' && y == 'L' && z == 'L') return Sentence.GLL;
            if (x == 'Z' && y == 'D' && z == 'A') return Sentence.ZDA;
            if (x == 'D' && y == 'B' && z == 'T') return Sentence.DBT;
            if (x == 'D' && y == 'P' && z == 'T') return Sentence.DPT;
            if (x == 'H' && y == 'D' && z == 'T') return Sentence.HDT;
            if (x == 'V' && y == 'T' && z == 'G') return Sentence.VTG;
            return null;
        }

        // ---- field parsers: empty field -> NaN / -1 / 0; malformed -> sets 'bad' ----

        boolean empty(int k) { return k >= nf || fe[k] == fs[k]; }

        String fieldText(int k) {
            return k >= nf ? "" : new String(line, fs[k], fe[k] - fs[k], StandardCharsets.ISO_8859_1);
        }

        void malformed(int k, String name, String expected) {
            if (bad == null) bad = "field " + k + " (" + name + "): expected " + expected + ", found '" + fieldText(k) + "'";
        }

        /** One-character field (status, hemisphere, unit); 0 when empty. */
        char ch(int k) { return empty(k) ? 0 : (char) line[fs[k]]; }

        /** Parses field k as a decimal into mant/scale/intDigits; false if not a plain decimal. */
        boolean decimal(int k) {
            int i = fs[k], end = fe[k];
            boolean neg = false;
            if (i < end && (line[i] == '-' || line[i] == '+')) { neg = line[i] == '-'; i++; }
            long m = 0;
            int digits = 0, sc = 0, id = 0;
            boolean point = false;
            for (; i < end; i++) {
                byte c = line[i];
                if (c >= '0' && c <= '9') {
                    if (digits < 18) { m = m * 10 + (c - '0'); digits++; if (point) sc++; else id++; }
                    else if (!point) return false; // more than 18 integer digits: not NMEA
                    // beyond 18 significant digits, further fraction digits are below double precision
                } else if (c == '.' && !point) {
                    point = true;
                } else {
                    return false;
                }
            }
            if (digits == 0) return false;
            mant = neg ? -m : m;
            scale = sc;
            intDigits = id;
            return true;
        }

        double num(int k, String name) {
            if (empty(k)) return Double.NaN;
            if (!decimal(k)) { malformed(k, name, "a number"); return Double.NaN; }
            return mant / POW10[scale];
        }

        int integer(int k, String name) {
            if (empty(k)) return -1;
            if (!decimal(k) || scale > 0 || mant < 0) { malformed(k, name, "an unsigned integer"); return -1; }
            return (int) Math.min(mant, Integer.MAX_VALUE);
        }

        /** UTC time of day hhmmss(.sss) in seconds; NaN when empty. */
        double timeOfDay(int k) {
            if (empty(k)) return Double.NaN;
            if (!decimal(k) || mant < 0 || intDigits != 6) { malformed(k, "UTC time", "hhmmss.ss"); return Double.NaN; }
            long p = (long) POW10[scale];
            long whole = mant / p;
            int hh = (int) (whole / 10000), mm = (int) (whole / 100 % 100), ss = (int) (whole % 100);
            if (hh > 23 || mm > 59 || ss > 60) { malformed(k, "UTC time", "hhmmss.ss within a day"); return Double.NaN; }
            return hh * 3600 + mm * 60 + (mant - whole / 100 * 100 * p) / POW10[scale];
        }

        /**
         * Latitude ddmm.mmmm (or longitude dddmm.mmmm) with hemisphere field k+1, decimal degrees,
         * S and W negative; NaN when empty. Degrees and minutes are split in integer arithmetic so
         * that 4807.038 gives exactly 48 + 7.038/60.
         */
        double angle(int k, boolean isLat) {
            String name = isLat ? "latitude" : "longitude";
            if (empty(k)) return Double.NaN;
            if (!decimal(k) || mant < 0 || intDigits < 3 || intDigits > (isLat ? 4 : 5)) {
                malformed(k, name, isLat ? "ddmm.mmmm" : "dddmm.mmmm");
                return Double.NaN;
            }
            long p100 = (long) POW10[scale] * 100;
            long deg = mant / p100;
            double minutes = (mant - deg * p100) / POW10[scale];
            if (minutes >= 60 || deg > (isLat ? 90 : 180)) {
                malformed(k, name, "degrees and minutes below 60");
                return Double.NaN;
            }
            double v = deg + minutes / 60.0;
            if (v > (isLat ? 90 : 180)) { malformed(k, name, "at most " + (isLat ? 90 : 180) + " degrees"); return Double.NaN; }
            char h = ch(k + 1);
            if (isLat ? (h != 'N' && h != 'S') : (h != 'E' && h != 'W')) {
                malformed(k + 1, "hemisphere", isLat ? "N or S" : "E or W");
                return Double.NaN;
            }
            return h == 'S' || h == 'W' ? -v : v;
        }

        // ---- time state ----

        /** Full (or, before the first date, relative) time for a time of day: nearest to the last stamp. */
        double stamp(double tod) {
            if (Double.isNaN(lastTime)) return lastTime = tod;
            double c = Math.floor(lastTime / DAY) * DAY + tod;
            double d = c - lastTime;
            if (d > DAY / 2) c -= DAY;        // a late sentence of the previous day
            else if (d < -DAY / 2) c += DAY;  // midnight rollover
            return lastTime = c;
        }

        /** Full time from a date sentence; the first date shifts all rows stored so far. */
        double stampDated(double tod, long epochDay) {
            double abs = epochDay * DAY + tod;
            if (!dated) {
                double rel = Double.isNaN(lastTime) ? tod : stamp(tod);
                shiftAll(abs - rel);
                dated = true;
                firstDateLine = lineNo;
            }
            return lastTime = abs;
        }

        void shiftAll(double s) {
            if (s == 0) return;
            for (int i = 0; i < nd; i++) dT[i] += s;
            for (int i = 0; i < nfx; i++) fT[i] += s;
            for (int i = 0; i < nh; i++) hT[i] += s;
            for (int i = 0; i < ns; i++) sT[i] += s;
        }

        /** Time for a sentence without its own time: the latest stamp, or NaN (problem counted). */
        double untimed() {
            if (Double.isNaN(lastTime)) problem(Kind.BEFORE_FIRST_TIME, "");
            return lastTime;
        }

        // ---- sentences (field numbers as in NMEA 0183 4.x; field 0 is the address) ----

        /** GGA: 1 time, 2-3 lat, 4-5 lon, 6 quality, 7 satellites, 8 HDOP, 9 altitude (m, MSL). */
        boolean gga() {
            int q = integer(6, "fix quality");
            if (bad != null) return false;
            if (q == 0) { problem(Kind.NO_VALID_FIX, ""); return false; }
            double tod = timeOfDay(1), lat = angle(2, true), lon = angle(4, false);
            int sats = integer(7, "satellites");
            double hdop = num(8, "HDOP"), alt = num(9, "altitude");
            if (bad == null && (q < 0 || Double.isNaN(tod) || Double.isNaN(lat) || Double.isNaN(lon))) {
                bad = "time, position and fix quality are required in a GGA with a fix";
            }
            if (bad != null) return false;
            addFix(stamp(tod), lat, lon, q, sats, hdop, alt, Sentence.GGA);
            return true;
        }

        /**
         * RMC: 1 time, 2 status A/V, 3-4 lat, 5-6 lon, 7 SOG kn, 8 COG true, 9 date ddmmyy, 12 mode
         * (NMEA 2.3+), 13 navigational status (4.1+; V = not valid).
         */
        boolean rmc() {
            char status = ch(2), mode = ch(12);
            if (status == 'V' || mode == 'N' || ch(13) == 'V') { problem(Kind.NO_VALID_FIX, ""); return false; }
            if (status != 'A') { malformed(2, "status", "A or V"); return false; }
            double tod = timeOfDay(1), lat = angle(3, true), lon = angle(5, false);
            double sogKn = num(7, "speed over ground"), cog = num(8, "course over ground");
            long day = rmcDate(9);
            if (bad == null && (Double.isNaN(tod) || Double.isNaN(lat) || Double.isNaN(lon))) {
                bad = "time and position are required in an RMC with status A";
            }
            if (bad != null) return false;
            double t = stampDated(tod, day);
            addFix(t, lat, lon, -1, -1, Double.NaN, Double.NaN, Sentence.RMC);
            if (!Double.isNaN(sogKn)) addSpeed(t, sogKn * MS_PER_KNOT, cog, Sentence.RMC);
            return true;
        }

        long rmcDate(int k) {
            if (empty(k) || !decimal(k) || scale != 0 || intDigits != 6 || mant < 0) {
                malformed(k, "date", "ddmmyy");
                return 0;
            }
            int v = (int) mant;
            if (v == lastDdmmyy) return lastRmcDay;
            int dd = v / 10000, mm = v / 100 % 100, yy = v % 100;
            // Two-digit year: GPS time began in 1980, so 80-99 are 1980-1999 (common practice).
            int year = yy >= 80 ? 1900 + yy : 2000 + yy;
            try {
                lastRmcDay = LocalDate.of(year, mm, dd).toEpochDay();
                lastDdmmyy = v;
                return lastRmcDay;
            } catch (DateTimeException e) {
                malformed(k, "date", "a calendar date ddmmyy");
                return 0;
            }
        }

        /** GLL: 1-2 lat, 3-4 lon, 5 time, 6 status A/V, 7 mode (time and status absent before NMEA 2.0). */
        boolean gll() {
            char status = ch(6), mode = ch(7);
            if (status == 'V' || mode == 'N') { problem(Kind.NO_VALID_FIX, ""); return false; }
            double lat = angle(1, true), lon = angle(3, false), tod = timeOfDay(5);
            if (bad == null && (Double.isNaN(lat) || Double.isNaN(lon))) bad = "position is required in GLL";
            if (bad != null) return false;
            double t = Double.isNaN(tod) ? untimed() : stamp(tod);
            if (Double.isNaN(t)) return false;
            addFix(t, lat, lon, -1, -1, Double.NaN, Double.NaN, Sentence.GLL);
            return true;
        }

        /** ZDA: 1 time, 2 day, 3 month, 4 year (four digits), 5-6 local zone (not needed: UTC). */
        boolean zda() {
            if (empty(1) && empty(2) && empty(3) && empty(4)) { problem(Kind.EMPTY_VALUE, ""); return false; }
            double tod = timeOfDay(1);
            int d = integer(2, "day"), m = integer(3, "month"), y = integer(4, "year");
            if (bad != null) return false;
            if (Double.isNaN(tod) || d < 0 || m < 0 || y < 0) { bad = "time, day, month and year are all required"; return false; }
            long day;
            try {
                day = LocalDate.of(y, m, d).toEpochDay();
            } catch (DateTimeException e) {
                bad = "fields 2-4: expected a calendar date, found " + fieldText(2) + "/" + fieldText(3) + "/" + fieldText(4);
                return false;
            }
            stampDated(tod, day);
            return true;
        }

        /** DBT: 1 depth ft, 2 'f', 3 depth m, 4 'M', 5 depth fathoms, 6 'F'; metres preferred. */
        boolean dbt() {
            double ft = num(1, "depth, feet"), m = num(3, "depth, metres"), fa = num(5, "depth, fathoms");
            if (bad != null) return false;
            double depth = !Double.isNaN(m) ? m : !Double.isNaN(ft) ? ft * METRES_PER_FOOT : fa * METRES_PER_FATHOM;
            if (Double.isNaN(depth)) { problem(Kind.EMPTY_VALUE, ""); return false; }
            if (depth < 0) { malformed(!Double.isNaN(m) ? 3 : !Double.isNaN(ft) ? 1 : 5, "depth", "a depth >= 0"); return false; }
            double t = untimed();
            if (Double.isNaN(t)) return false;
            addDepth(t, depth, Double.NaN, Sentence.DBT);
            return true;
        }

        /** DPT: 1 depth below transducer m, 2 offset m (+ to waterline, - to keel), 3 maximum range. */
        boolean dpt() {
            double depth = num(1, "depth"), off = num(2, "offset");
            if (bad != null) return false;
            if (Double.isNaN(depth)) { problem(Kind.EMPTY_VALUE, ""); return false; }
            if (depth < 0) { malformed(1, "depth", "a depth >= 0"); return false; }
            double t = untimed();
            if (Double.isNaN(t)) return false;
            addDepth(t, depth, off, Sentence.DPT);
            return true;
        }

        /** HDT: 1 heading degrees true, 2 'T'. */
        boolean hdt() {
            double h = num(1, "heading");
            if (bad != null) return false;
            if (Double.isNaN(h)) { problem(Kind.EMPTY_VALUE, ""); return false; }
            if (h < 0 || h > 360) { malformed(1, "heading", "0 to 360 degrees"); return false; }
            double t = untimed();
            if (Double.isNaN(t)) return false;
            if (nh == hT.length) { hT = Arrays.copyOf(hT, nh * 2); hV = Arrays.copyOf(hV, nh * 2); }
            hT[nh] = t;
            hV[nh] = h == 360 ? 0 : h;
            nh++;
            return true;
        }

        /**
         * VTG: 1 COG true, 2 'T', 3 COG magnetic, 4 'M', 5 SOG kn, 6 'N', 7 SOG km/h, 8 'K', 9 mode;
         * the pre-2.0 form without the unit letters (1 COG true, 2 COG magnetic, 3 kn, 4 km/h) too.
         */
        boolean vtg() {
            boolean old = nf == 5 && ch(2) != 'T';
            int kCog = 1, kKn = old ? 3 : 5, kKmh = old ? 4 : 7;
            if (!old && ch(9) == 'N') { problem(Kind.NO_VALID_FIX, ""); return false; }
            double cog = num(kCog, "course over ground"), kn = num(kKn, "speed, knots"), kmh = num(kKmh, "speed, km/h");
            if (bad != null) return false;
            double sog = !Double.isNaN(kn) ? kn * MS_PER_KNOT : kmh * MS_PER_KMH;
            if (Double.isNaN(sog)) { problem(Kind.EMPTY_VALUE, ""); return false; }
            double t = untimed();
            if (Double.isNaN(t)) return false;
            addSpeed(t, sog, cog, Sentence.VTG);
            return true;
        }

        // ---- columns ----

        void addDepth(double t, double depth, double off, Sentence s) {
            if (nd == dT.length) {
                int m = nd * 2;
                dT = Arrays.copyOf(dT, m); dDepth = Arrays.copyOf(dDepth, m); dOff = Arrays.copyOf(dOff, m);
                dSrc = Arrays.copyOf(dSrc, m);
            }
            dT[nd] = t; dDepth[nd] = depth; dOff[nd] = off; dSrc[nd] = (byte) s.ordinal();
            nd++;
        }

        void addFix(double t, double lat, double lon, int q, int sats, double hdop, double alt, Sentence s) {
            if (nfx == fT.length) {
                int m = nfx * 2;
                fT = Arrays.copyOf(fT, m); fLat = Arrays.copyOf(fLat, m); fLon = Arrays.copyOf(fLon, m);
                fHdop = Arrays.copyOf(fHdop, m); fAlt = Arrays.copyOf(fAlt, m); fQ = Arrays.copyOf(fQ, m);
                fSat = Arrays.copyOf(fSat, m); fSrc = Arrays.copyOf(fSrc, m);
            }
            fT[nfx] = t; fLat[nfx] = lat; fLon[nfx] = lon; fQ[nfx] = q; fSat[nfx] = sats; fHdop[nfx] = hdop;
            fAlt[nfx] = alt; fSrc[nfx] = (byte) s.ordinal();
            nfx++;
        }

        void addSpeed(double t, double sog, double cog, Sentence s) {
            if (ns == sT.length) {
                int m = ns * 2;
                sT = Arrays.copyOf(sT, m); sSog = Arrays.copyOf(sSog, m); sCog = Arrays.copyOf(sCog, m);
                sSrc = Arrays.copyOf(sSrc, m);
            }
            sT[ns] = t; sSog[ns] = sog; sCog[ns] = cog; sSrc[ns] = (byte) s.ordinal();
            ns++;
        }

        NmeaLog finish(LocalDate startDate) {
            boolean anyTime = !Double.isNaN(lastTime);
            if (!dated && anyTime) {
                if (startDate == null) {
                    throw new InputException(source, 0, 0,
                            "no date: the log has no ZDA or RMC sentence; give the survey date", null);
                }
                // Relative times count from 00:00 of day 0 = the first time of day's date.
                shiftAll(startDate.toEpochDay() * DAY);
            } else if (dated && startDate != null && nd + nfx + nh + ns > 0) {
                double first = Math.min(Math.min(nd > 0 ? dT[0] : Double.MAX_VALUE, nfx > 0 ? fT[0] : Double.MAX_VALUE),
                        Math.min(nh > 0 ? hT[0] : Double.MAX_VALUE, ns > 0 ? sT[0] : Double.MAX_VALUE));
                LocalDate own = LocalDate.ofEpochDay((long) Math.floor(first / DAY));
                if (!own.equals(startDate)) {
                    problems.add(Kind.START_DATE_DIFFERS, firstDateLine,
                            "log starts on " + own + " (first date at this line), start date given " + startDate
                                    + "; the log's date was used");
                }
            }
            return new NmeaLog(source, nd, dT, dDepth, dOff, dSrc, nfx, fT, fLat, fLon, fQ, fSat, fHdop, fAlt, fSrc,
                    nh, hT, hV, ns, sT, sSog, sCog, sSrc, sentenceCounts, problems);
        }
    }

    private static final double[] POW10 = new double[19];

    static {
        POW10[0] = 1;
        for (int i = 1; i < POW10.length; i++) POW10[i] = POW10[i - 1] * 10; // exact up to 1e22
    }
}
