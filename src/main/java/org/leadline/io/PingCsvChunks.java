package org.leadline.io;

import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.IntStream;
import org.leadline.survey.PingTable;

/**
 * A ping CSV read a chunk at a time in bounded memory (the streamed processing path,
 * docs/performance.md): the file is memory-mapped one window (16 MiB) at a time, in order;
 * the window's byte ranges are parsed in parallel by the fast path of {@link ParallelPingCsv}, then
 * appended in file order to a buffer of pending rows, from which chunks of about the requested rows
 * are cut at ping boundaries (a ping whose beams straddle a range or window boundary stays whole).
 * Memory: one window of mapped file, its parsed rows (about 15 MB), the pending rows (about one
 * chunk) and the chunks cut from one range: 10 million rows in chunks of 100 000 read in a 128 MiB
 * heap (docs/performance.md).
 *
 * <p>Line ids are numbered in order of first appearance in the file, as {@link PingCsvReader#read}
 * numbers them; every chunk carries the dictionary so far as its line names.
 *
 * <p>From the first range the fast path refuses (quoted fields, lone CR line ends, a value that is
 * not a plain decimal, any error, a header it does not take) on, the general path
 * ({@link PingCsvReader.GeneralRows}) reads the file again from its start, row by row, checking and
 * dropping the rows already served and serving the rest: the same rows, and for bad input the same
 * {@link InputException} (true line and column) as {@link PingCsvReader#read}, still in bounded memory.
 */
final class PingCsvChunks implements PingChunks {
    private final Path file;
    private final boolean sepNav;
    private final int target, rangeBytes, windowBytes;
    private FileChannel ch;
    private long size;
    private ParallelPingCsv.Header header;
    /** Next byte to map, and the physical lines before the next range to append. */
    private long mapped, linesBefore;
    /** Parsed ranges of the current window waiting to be appended (null: refused by the fast path). */
    private final ArrayDeque<ParallelPingCsv.Range> queuedRanges = new ArrayDeque<>();
    private final ArrayDeque<java.util.Optional<ParallelPingCsv.Cols>> queued = new ArrayDeque<>();
    private double lastTime = Double.NEGATIVE_INFINITY;
    private long served;

    private final List<String> names = new ArrayList<>();
    private final Map<String, Integer> index = new HashMap<>();

    // pending rows [head, n), global line ids
    private final double[][] d = new double[10][];
    private final int[][] in = new int[3][];
    private int head, n;
    private final ArrayDeque<PingTable> ready = new ArrayDeque<>();
    private boolean done;

    /** The general path once the fast path has given up; rows before line keepFrom were served already. */
    private PingCsvReader.GeneralRows general;
    private long keepFrom;

    PingCsvChunks(Path file, boolean separateNavigation, int targetRows, int rangeBytes, int windowBytes) {
        this.file = file;
        this.sepNav = separateNavigation;
        this.target = Math.max(1, targetRows);
        this.rangeBytes = Math.max(1, rangeBytes);
        this.windowBytes = Math.max(1, windowBytes);
        for (int k = 0; k < 10; k++) d[k] = new double[16];
        for (int j = 0; j < 3; j++) in[j] = new int[16];
        try {
            ch = FileChannel.open(file, StandardOpenOption.READ);
            size = ch.size();
            header = ParallelPingCsv.header(ch, size);
        } catch (IOException e) {
            header = null; // the general path names the problem
        }
        if (header == null || !header.usable(sepNav)) {
            try {
                startGeneral(0);
            } catch (RuntimeException e) {
                closeQuietly();
                throw e;
            }
        } else {
            mapped = header.dataStart;
            linesBefore = header.dataLines;
        }
    }

    @Override
    public PingTable next() throws IOException {
        while (ready.isEmpty() && !done) {
            if (general != null) fillGeneral(); else if (!queued.isEmpty()) appendQueued(); else fillFast();
        }
        return ready.poll();
    }

    @Override
    public long expectedRows() { return -1; }

    /** Bytes of the file the fast path has parsed so far (tests: the file is read a window at a time). */
    long position() { return mapped; }

    /** Whether the general path took over (tests). */
    boolean general() { return general != null; }

    @Override
    public void close() throws IOException {
        try {
            if (general != null) general.close();
        } finally {
            if (ch != null) ch.close();
        }
    }

    private void closeQuietly() {
        try {
            if (ch != null) ch.close();
        } catch (IOException ignored) {
            // the InputException being thrown says what matters
        }
    }

    /** Parses the next window through the fast path (its ranges are appended one by one as chunks are asked for). */
    private void fillFast() {
        if (mapped >= size) {
            if (served + (n - head) == 0) { startGeneral(0); return; } // no rows: the general path says so
            cut(true);
            done = true;
            return;
        }
        List<ParallelPingCsv.Range> ranges;
        try {
            ranges = ParallelPingCsv.window(ch, mapped, size, windowBytes, rangeBytes);
        } catch (ParallelPingCsv.GiveUp | IOException e) { // a line longer than a window, a file that cannot be mapped
            startGeneral(linesBefore + 1);
            return;
        }
        ParallelPingCsv.Cols[] parts = new ParallelPingCsv.Cols[ranges.size()];
        IntStream.range(0, ranges.size()).parallel().forEach(k -> {
            ParallelPingCsv.Range r = ranges.get(k);
            ParallelPingCsv.count(r);
            double[][] cd = new double[10][];
            int[][] ci = new int[3][];
            for (int c = 0; c < 13; c++) {
                if (header.col[c] < 0) continue;
                if (c < 10) cd[c] = new double[r.capacity]; else ci[c - 10] = new int[r.capacity];
            }
            ParallelPingCsv.Cols part = new ParallelPingCsv.Cols(cd, ci, 0, r.capacity);
            try {
                ParallelPingCsv.parse(r, header, sepNav, part);
                parts[k] = part;
            } catch (ParallelPingCsv.GiveUp e) {
                parts[k] = null;
            }
        });
        for (int k = 0; k < parts.length; k++) {
            queuedRanges.add(ranges.get(k));
            queued.add(java.util.Optional.ofNullable(parts[k]));
        }
        mapped = ranges.get(ranges.size() - 1).to;
    }

    /** Appends the next parsed range and cuts what chunks it completes. */
    private void appendQueued() {
        ParallelPingCsv.Range r = queuedRanges.poll();
        ParallelPingCsv.Cols p = queued.poll().orElse(null);
        if (p == null || (p.n > 0 && p.firstTime < lastTime)) {
            queued.clear();
            queuedRanges.clear();
            startGeneral(linesBefore + 1); // the rows before were appended; the general path serves the rest
            cut(false);
            return;
        }
        append(p);
        if (p.n > 0) lastTime = p.lastTime;
        linesBefore += r.lines;
        cut(false);
    }

    /** Appends a range's rows, its line ids turned into the file's. */
    private void append(ParallelPingCsv.Cols p) {
        reserve(p.n);
        for (int c = 0; c < 10; c++) {
            if (p.d[c] != null) System.arraycopy(p.d[c], 0, d[c], n, p.n); else Arrays.fill(d[c], n, n + p.n, Double.NaN);
        }
        for (int j = 1; j < 3; j++) {
            if (p.in[j] != null) System.arraycopy(p.in[j], 0, in[j], n, p.n); else Arrays.fill(in[j], n, n + p.n, -1);
        }
        if (p.in[0] == null) {
            Arrays.fill(in[0], n, n + p.n, -1);
        } else {
            int[] map = new int[p.names.size()];
            for (int l = 0; l < map.length; l++) map[l] = lineId(p.names.get(l));
            int[] src = p.in[0], dst = in[0];
            for (int i = 0; i < p.n; i++) dst[n + i] = src[i] < 0 ? -1 : map[src[i]];
        }
        n += p.n;
    }

    private int lineId(String name) {
        if (name == null || name.isEmpty()) return -1;
        return index.computeIfAbsent(name, x -> { names.add(x); return names.size() - 1; });
    }

    /** Room for m more rows: moves the pending rows to the front or grows the columns. */
    private void reserve(int m) {
        if (head > 0) {
            int live = n - head;
            for (double[] a : d) System.arraycopy(a, head, a, 0, live);
            for (int[] a : in) System.arraycopy(a, head, a, 0, live);
            n = live;
            head = 0;
        }
        if (n + m > d[0].length) {
            int cap = (int) Math.min(Integer.MAX_VALUE - 16, Math.max((long) n + m, 2L * d[0].length));
            for (int c = 0; c < 10; c++) d[c] = Arrays.copyOf(d[c], cap);
            for (int j = 0; j < 3; j++) in[j] = Arrays.copyOf(in[j], cap);
        }
    }

    /** Cuts the pending rows into chunks of at least target rows ending at ping boundaries; at the end, the rest too. */
    private void cut(boolean end) {
        while (n - head > target) {
            int i = head + target;
            while (i < n && d[0][i] == d[0][i - 1] && in[0][i] == in[0][i - 1]) i++;
            if (i >= n) break; // the ping goes on past the rows read so far
            emit(i);
        }
        if (end && n > head) emit(n);
    }

    private void emit(int to) {
        int from = head;
        double[][] c = new double[10][];
        for (int k = 0; k < 10; k++) c[k] = Arrays.copyOfRange(d[k], from, to);
        int[][] ci = new int[3][];
        for (int j = 0; j < 3; j++) ci[j] = Arrays.copyOfRange(in[j], from, to);
        ready.add(PingTable.ofColumns(to - from, c[0], c[1], c[2], c[3], c[4], c[5], c[6], c[7], c[8], c[9],
                ci[0], ci[1], ci[2], names));
        served += to - from;
        head = to;
    }

    /** From here the general path: it reads from the file's start and keeps the rows from physical line {@code from} on. */
    private void startGeneral(long from) {
        keepFrom = from;
        general = new PingCsvReader.GeneralRows(file, sepNav);
    }

    private final PingCsvReader.GeneralRows.Sink sink = new PingCsvReader.GeneralRows.Sink() {
        @Override public int lineId(String name) { return PingCsvChunks.this.lineId(name); }

        @Override public void add(double t, double lat, double lon, double twtt, double depth, double angle, double heading,
                                  double heave, double roll, double pitch, int lineId, int beam, int quality) {
            if (general.line() < keepFrom) return; // served by the fast path already
            reserve(1);
            double[] v = {t, lat, lon, twtt, depth, angle, heading, heave, roll, pitch};
            for (int c = 0; c < 10; c++) d[c][n] = v[c];
            in[0][n] = lineId;
            in[1][n] = beam;
            in[2][n] = quality;
            n++;
        }
    };

    /** Rows through the general path until a chunk can be cut (or the file ends). */
    private void fillGeneral() {
        for (int i = 0; i < 65_536; i++) {
            if (!general.next(sink)) {
                cut(true);
                done = true;
                return;
            }
        }
        cut(false);
    }
}
