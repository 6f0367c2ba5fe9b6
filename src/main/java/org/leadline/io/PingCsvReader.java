package org.leadline.io;

import java.nio.file.Path;
import org.leadline.survey.PingTable;

/**
 * Reads a ping table CSV (DESIGN.md section 4; docs/formats/pings.md): {@code time} (ISO-8601
 * UTC), {@code lat}, {@code lon} (WGS84 degrees; required unless positions come from a separate
 * navigation file), {@code twtt} (s) and/or {@code depth} (m below the transducer at the sounder's
 * set speed), and optional {@code angle}, {@code heading}, {@code heave}, {@code roll},
 * {@code pitch}, {@code line}, {@code beam}, {@code quality}.
 *
 * <p>Rules: every row needs a twtt or a depth (an empty optional field is "not given", NaN);
 * numbers must be finite; lat in [-90, 90], lon in [-180, 180], roll and pitch in [-90, 90],
 * angle in [-90, 90], twtt in [0, 16] s and depth in [0, 12 000] m (beyond: a unit mix-up); times
 * must not decrease (several beams of one ping share a time); at least one row. Errors carry file,
 * physical line and 1-based field index; files that are not UTF-8 text are refused at the first
 * bad byte (docs/reliability.md).
 *
 * <p>Speed: plain files (no quotes) are read by {@link ParallelPingCsv}, memory-mapped byte ranges
 * parsed in parallel in one pass straight into the table's columns (about 0.4-0.5 s of CPU per
 * million rows of twelve columns); any other file, and any file with an error, by the general path
 * below, which gives the error with its line and column. Both give the same table. {@link #chunks}
 * reads a file in bounded memory, chunk by chunk ({@link PingCsvChunks}).
 *
 * <p>Speed of the general path: a million rows of twelve columns (94 MB) read in 1.2-1.4 s of CPU on the loaded
 * 2-core build machine, about 0.85 s of it Commons CSV's tokenizing; times go through the
 * hand-written path of {@link IsoTime}, numbers through {@link Double#parseDouble}.
 */
public final class PingCsvReader {
    private PingCsvReader() {}

    /**
     * Deepest plausible depth below the transducer, m: the deepest ocean sounding is about
     * 10 900 m (Challenger Deep, from memory); anything beyond 12 000 m is a unit mix-up (feet,
     * centimetres) or garbage, refused rather than traced.
     */
    public static final double MAX_DEPTH = 12_000;
    /** Longest plausible two-way travel time, s: {@link #MAX_DEPTH} at 1500 m/s, two ways. */
    public static final double MAX_TWTT = 16;

    /** Reads a ping file whose rows carry their own positions (lat, lon required). */
    public static PingTable read(Path file) { return read(file, false); }

    /**
     * Reads a ping file.
     *
     * @param separateNavigation true when a navigation file supplies the positions: lat and lon
     *                           may then be absent (read, and checked, when present)
     */
    public static PingTable read(Path file, boolean separateNavigation) {
        PingTable fast = ParallelPingCsv.read(file, separateNavigation);
        if (fast != null && plausible(fast)) return fast;
        // the careful path reads again and reports the exact problem (file, line, column)
        PingTable.Builder b = new PingTable.Builder();
        readInto(file, separateNavigation, b);
        return b.build();
    }

    /** Appends the pings of a file to a builder (several files into one table). */
    public static void readInto(Path file, boolean separateNavigation, PingTable.Builder b) {
        GeneralRows.Sink sink = new GeneralRows.Sink() {
            @Override public int lineId(String name) { return b.lineId(name); }
            @Override public void add(double t, double lat, double lon, double twtt, double depth, double angle, double heading,
                                      double heave, double roll, double pitch, int lineId, int beam, int quality) {
                b.addById(t, lat, lon, twtt, depth, angle, heading, heave, roll, pitch, lineId, beam, quality);
            }
        };
        try (GeneralRows rows = new GeneralRows(file, separateNavigation)) {
            while (rows.next(sink)) {
                // every row went to the builder
            }
        }
    }

    /**
     * The general (Commons CSV) path one row at a time: every check of the ping format, with the
     * file's physical line and the field's index in each message. {@link #readInto} runs it over a
     * whole file; the streaming reader {@link PingCsvChunks} resumes with it where the fast path
     * refuses a range.
     */
    static final class GeneralRows implements AutoCloseable {
        /** Where the rows go; line ids come from the sink's dictionary. */
        interface Sink {
            int lineId(String name);

            void add(double t, double lat, double lon, double twtt, double depth, double angle, double heading,
                     double heave, double roll, double pitch, int lineId, int beam, int quality);
        }

        private final Path file;
        private final CsvInput in;
        private final boolean separateNavigation;
        private final int ct, cla, clo, ctw, cd, ca, ch, chv, cr, cp, cl, cb, cq;
        private double previous = Double.NEGATIVE_INFINITY;
        private int rows;
        private String lastLine;
        private int lastLineId = -1;

        GeneralRows(Path file, boolean separateNavigation) {
            this.file = file;
            this.separateNavigation = separateNavigation;
            CsvInput opened = CsvInput.open(file);
            try {
                ct = opened.require("time");
                cla = opened.column("lat");
                clo = opened.column("lon");
                if (!separateNavigation) {
                    if (cla < 0) opened.require("lat");
                    if (clo < 0) opened.require("lon");
                }
                ctw = opened.column("twtt");
                cd = opened.column("depth");
                if (ctw < 0 && cd < 0) throw opened.missingColumn("'twtt' or 'depth'");
                ca = opened.column("angle");
                ch = opened.column("heading");
                chv = opened.column("heave");
                cr = opened.column("roll");
                cp = opened.column("pitch");
                cl = opened.column("line");
                cb = opened.column("beam");
                cq = opened.column("quality");
            } catch (RuntimeException e) {
                opened.close();
                throw e;
            }
            in = opened;
        }

        /** Physical line (1-based) of the row read last. */
        long line() { return in.line(); }

        /** Reads the next row into the sink; false at the end of the file (a file without rows is refused). */
        boolean next(Sink sink) {
            if (!in.next()) {
                if (rows == 0) throw new InputException(file, "expected ping rows after the header, found none");
                return false;
            }
            double t = in.time(ct);
            if (t < previous) {
                throw in.error(ct, "expected times not to decrease, found " + in.quoted(ct) + " after "
                        + IsoTime.format(previous));
            }
            previous = t;
            double lat = Double.NaN, lon = Double.NaN;
            if (cla >= 0 && (!separateNavigation || !in.text(cla).isEmpty())) lat = in.latitude(cla);
            if (clo >= 0 && (!separateNavigation || !in.text(clo).isEmpty())) lon = in.longitude(clo);
            double twtt = nonNegative(in, ctw, "twtt");
            double depth = nonNegative(in, cd, "depth");
            if (twtt > MAX_TWTT) {
                throw in.error(ctw, "expected 'twtt' in seconds up to " + (int) MAX_TWTT + " s (" + (int) MAX_DEPTH
                        + " m of water), found " + in.quoted(ctw) + ": milliseconds, or not two-way travel time?");
            }
            if (depth > MAX_DEPTH) {
                throw in.error(cd, "expected 'depth' in metres up to " + (int) MAX_DEPTH + " m, found "
                        + in.quoted(cd) + ": deeper than any ocean (feet or centimetres?)");
            }
            if (Double.isNaN(twtt) && Double.isNaN(depth)) {
                throw in.error(ctw >= 0 ? ctw : cd, "expected a value for 'twtt' or 'depth', found empty fields");
            }
            double angle = bounded(in, ca, "angle", 90);
            double heading = in.optional(ch, "heading");
            if (heading < -360 || heading > 360) throw in.error(ch, "expected a heading in [0, 360) degrees, found " + in.quoted(ch));
            double heave = in.optional(chv, "heave");
            double roll = bounded(in, cr, "roll", 90);
            double pitch = bounded(in, cp, "pitch", 90);
            String name = cl < 0 ? "" : in.text(cl);
            int lineId;
            if (name.equals(lastLine)) {
                lineId = lastLineId; // avoid a hash look-up per beam
            } else {
                lineId = sink.lineId(name);
                lastLine = name;
                lastLineId = lineId;
            }
            int beam = in.optionalInt(cb, "beam", -1);
            int quality = in.optionalInt(cq, "quality", -1);
            sink.add(t, lat, lon, twtt, depth, angle, heading, heave, roll, pitch, lineId, beam, quality);
            rows++;
            return true;
        }

        @Override
        public void close() { in.close(); }
    }

    /**
     * Whether the fast parallel parse can be trusted as is: rows present, travel times and depths
     * within {@link #MAX_TWTT} and {@link #MAX_DEPTH}, line names valid UTF-8 (the fast path
     * decodes names leniently). Otherwise the careful path runs and names the problem.
     */
    private static boolean plausible(PingTable t) {
        if (t.size == 0) return false;
        for (int i = 0; i < t.size; i++) {
            if (t.twtt[i] > MAX_TWTT || t.depth[i] > MAX_DEPTH) return false;
        }
        for (String name : t.lineNames()) if (name.indexOf('\uFFFD') >= 0) return false;
        return true;
    }

    private static double nonNegative(CsvInput in, int col, String name) {
        double v = in.optional(col, name);
        if (v < 0) throw in.error(col, "expected '" + name + "' >= 0, found " + in.quoted(col));
        return v;
    }

    private static double bounded(CsvInput in, int col, String name, double limit) {
        double v = in.optional(col, name);
        if (Math.abs(v) > limit) {
            throw in.error(col, "expected '" + name + "' in [-" + (int) limit + ", " + (int) limit + "] degrees, found " + in.quoted(col));
        }
        return v;
    }

    /**
     * Reads the file a chunk at a time ({@link PingChunks}); same rows, values, line ids and errors
     * as {@link #read}, in bounded memory: the file is read in order, a window of byte ranges at a
     * time (16 MiB), parsed in parallel by the fast path ({@link PingCsvChunks}); from a range the fast path
     * refuses (quoted fields, lone CR line ends, an error, ...) on, the general path reads the rest
     * row by row, still in bounded memory.
     *
     * @param targetRows rows per chunk, about (a chunk ends at a ping boundary)
     */
    public static PingChunks chunks(Path file, boolean separateNavigation, int targetRows) {
        int rangeBytes = ParallelPingCsv.rangeBytes();
        return new PingCsvChunks(file, separateNavigation, targetRows, rangeBytes, ParallelPingCsv.streamWindowBytes(rangeBytes));
    }
}
