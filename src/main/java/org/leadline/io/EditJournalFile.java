package org.leadline.io;

import org.leadline.cleaning.Edit;
import org.leadline.cleaning.Edit.Action;
import org.leadline.cleaning.Edit.Ids;
import org.leadline.cleaning.Edit.Selection;
import org.leadline.cleaning.Edit.Window;

import java.io.Closeable;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.time.Instant;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.zip.CRC32;

/**
 * The reviewer's edit journal on disk: an append-only, line-oriented UTF-8 text file beside the
 * project, one tab-separated line per {@link Edit} ending in a CRC-32 of the line, so a line torn
 * by a crash or power loss is detected. Format: docs/formats/journal.md.
 *
 * <p>Durability: every {@link #append} writes the whole line with one positioned write and then
 * calls {@link FileChannel#force(boolean) force(true)} before returning, so an edit the caller
 * saw returned survives a crash of the program or the machine. Raw data files are never written.
 *
 * <pre>{@code
 * try (EditJournalFile j = EditJournalFile.open(EditJournalFile.besideProject(projectYaml))) {
 *     j.append(now, "maria", Edit.Action.REJECT, Edit.Ids.of(selectedIds), "fish");
 * }
 * EditJournalFile.Contents c = EditJournalFile.read(path); // c.edits(), c.warnings()
 * }</pre>
 */
public final class EditJournalFile implements Closeable {
    /** First line of every journal. */
    public static final String HEADER = "# leadline edit journal, format 1";
    /** File name suffix beside the project file. */
    public static final String SUFFIX = ".journal";
    private static final int FIELDS = 11;

    /** What {@link #read} found: the edits, and warnings about a torn last line that was skipped. */
    public record Contents(List<Edit> edits, List<String> warnings) {
        public Contents {
            edits = List.copyOf(edits);
            warnings = List.copyOf(warnings);
        }
    }

    private final Path path;
    private final FileChannel channel;
    private final FileLock lock;
    private final List<Edit> edits;
    private final List<String> warnings;
    private long next;

    private EditJournalFile(Path path, FileChannel channel, FileLock lock, List<Edit> edits, List<String> warnings) {
        this.path = path;
        this.channel = channel;
        this.lock = lock;
        this.edits = new ArrayList<>(edits);
        this.warnings = List.copyOf(warnings);
        long m = 0;
        for (Edit e : edits) m = Math.max(m, e.sequence());
        this.next = m + 1;
    }

    /** The journal beside a project file: {@code harbour.yaml} -> {@code harbour.journal}. */
    public static Path besideProject(Path projectFile) {
        String name = projectFile.getFileName().toString();
        int dot = name.lastIndexOf('.');
        String base = dot > 0 ? name.substring(0, dot) : name;
        return projectFile.resolveSibling(base + SUFFIX);
    }

    /**
     * Opens a journal for appending, creating it (with its header, synced) when absent. A torn last
     * line left by a crash is cut off (reported in {@link #warnings()}) so the next edit starts
     * on a line of its own. Takes an exclusive lock: a second writer fails.
     *
     * @throws InputException when the existing file is not a valid journal
     * @throws IOException    on I/O failure or when another program holds the journal
     */
    public static EditJournalFile open(Path path) throws IOException {
        FileChannel ch = FileChannel.open(path, StandardOpenOption.CREATE, StandardOpenOption.READ,
                StandardOpenOption.WRITE);
        try {
            FileLock lock = ch.tryLock();
            if (lock == null) throw new IOException(path + ": the edit journal is open in another program");
            Parsed p = parse(path, readAll(ch));
            if (p.goodLength == 0) {
                ch.truncate(0);
                write(ch, 0, (HEADER + "\n").getBytes(StandardCharsets.UTF_8));
                ch.force(true);
                syncDirectory(path);
            } else if (ch.size() > p.goodLength) {
                ch.truncate(p.goodLength);
                ch.force(true);
            }
            return new EditJournalFile(path, ch, lock, p.edits, p.warnings);
        } catch (IOException | RuntimeException e) {
            ch.close();
            throw e;
        }
    }

    /**
     * Reads a journal. A missing file is a journal with no edits yet. The last line is skipped
     * with a warning when it has no newline or its checksum does not match (a torn write).
     *
     * @throws InputException for a bad line before the last one (naming file and line) or a file
     *                        that does not start with {@link #HEADER}
     */
    public static Contents read(Path path) throws IOException {
        if (!Files.exists(path)) return new Contents(List.of(), List.of());
        Parsed p = parse(path, Files.readAllBytes(path));
        return new Contents(p.edits, p.warnings);
    }

    public Path path() { return path; }

    /** Edits in the journal, including those appended through this object. */
    public List<Edit> edits() { return List.copyOf(edits); }

    /** Warnings from opening (a torn last line cut off). */
    public List<String> warnings() { return warnings; }

    /** Sequence number the next edit gets. */
    public long nextSequence() { return next; }

    /**
     * Appends an edit with the next sequence number; returns only after the line is on disk.
     *
     * @param time UTC seconds since the epoch
     */
    public Edit append(double time, String user, Action action, Selection selection, String reason) throws IOException {
        Edit e = new Edit(next, time, user, action, selection, reason);
        append(e);
        return e;
    }

    /** Appends an edit whose sequence number must be {@link #nextSequence()}. */
    public void append(Edit e) throws IOException {
        if (e.sequence() != next) {
            throw new IllegalArgumentException("edit " + e.sequence() + " out of order; the journal expects " + next);
        }
        byte[] line = (format(e) + "\n").getBytes(StandardCharsets.UTF_8);
        write(channel, channel.size(), line);
        channel.force(true);
        edits.add(e);
        next++;
    }

    @Override
    public void close() throws IOException {
        try {
            if (lock.isValid()) lock.release();
        } finally {
            channel.close();
        }
    }

    // ------------------------------------------------------------------ format

    /** One journal line for an edit, without the newline. */
    public static String format(Edit e) {
        StringBuilder sb = new StringBuilder(128);
        sb.append(e.sequence()).append('\t').append(instant(e.time())).append('\t').append(escape(e.user()))
                .append('\t').append(e.action().name().toLowerCase(Locale.ROOT)).append('\t');
        Selection s = e.selection();
        if (s instanceof Ids ids) {
            int[] r = ids.ranges();
            for (int k = 0; k < r.length; k += 2) {
                if (k > 0) sb.append(',');
                sb.append(r[k]);
                if (r[k + 1] != r[k]) sb.append("..").append(r[k + 1]);
            }
            sb.append("\t\t\t\t");
        } else if (s instanceof Window w) {
            sb.append('\t').append(escape(w.line())).append('\t').append(instant(w.fromTime())).append('\t')
                    .append(instant(w.toTime())).append('\t');
            if (w.fromBeam() == Integer.MIN_VALUE && w.toBeam() == Integer.MAX_VALUE) sb.append('*');
            else sb.append(w.fromBeam()).append("..").append(w.toBeam());
        } else {
            sb.append("\t\t\t\t");
        }
        sb.append('\t').append(escape(e.reason()));
        String body = sb.toString();
        return body + '\t' + crc(body);
    }

    private static String crc(String body) {
        CRC32 c = new CRC32();
        c.update(body.getBytes(StandardCharsets.UTF_8));
        return String.format("%08x", c.getValue());
    }

    /**
     * ISO-8601 UTC to the nanosecond: for times of this era (ulp of a double near 1.7e9 s is
     * 2.4e-7 s) the nanosecond rounding is far below half an ulp, so reading it back gives the
     * same double and a time-range selection replays exactly.
     */
    private static String instant(double t) {
        if (!Double.isFinite(t)) throw new IllegalArgumentException("edit time must be finite, got " + t);
        double sec = Math.floor(t);
        long nanos = Math.round((t - sec) * 1e9);
        long s = (long) sec;
        if (nanos >= 1_000_000_000L) {
            s++;
            nanos -= 1_000_000_000L;
        }
        return Instant.ofEpochSecond(s, nanos).toString();
    }

    private static String escape(String s) {
        StringBuilder sb = new StringBuilder(s.length());
        for (int k = 0; k < s.length(); k++) {
            char ch = s.charAt(k);
            switch (ch) {
                case '\\' -> sb.append("\\\\");
                case '\t' -> sb.append("\\t");
                case '\n' -> sb.append("\\n");
                case '\r' -> sb.append("\\r");
                default -> sb.append(ch);
            }
        }
        return sb.toString();
    }

    private static String unescape(String s) {
        if (s.indexOf('\\') < 0) return s;
        StringBuilder sb = new StringBuilder(s.length());
        for (int k = 0; k < s.length(); k++) {
            char ch = s.charAt(k);
            if (ch != '\\') {
                sb.append(ch);
                continue;
            }
            if (++k >= s.length()) throw new IllegalArgumentException("a lone backslash at the end of '" + s + "'");
            char e = s.charAt(k);
            switch (e) {
                case '\\' -> sb.append('\\');
                case 't' -> sb.append('\t');
                case 'n' -> sb.append('\n');
                case 'r' -> sb.append('\r');
                default -> throw new IllegalArgumentException("unknown escape \\" + e + " in '" + s + "'");
            }
        }
        return sb.toString();
    }

    // ------------------------------------------------------------------ parsing

    private record Parsed(List<Edit> edits, List<String> warnings, long goodLength) {}

    private static Parsed parse(Path path, byte[] bytes) {
        List<Edit> edits = new ArrayList<>();
        List<String> warnings = new ArrayList<>();
        long good = 0;
        int lineNo = 0;
        int pos = 0;
        long lastSeq = 0;
        while (pos < bytes.length) {
            lineNo++;
            int nl = pos;
            while (nl < bytes.length && bytes[nl] != '\n') nl++;
            boolean complete = nl < bytes.length;
            int end = nl;
            if (end > pos && bytes[end - 1] == '\r') end--;
            boolean last = !complete || nl + 1 >= bytes.length;
            if (!complete) {
                warnings.add(path + ":" + lineNo + ": incomplete last line (no newline) skipped: an edit that was"
                        + " being written when the program stopped");
                break;
            }
            String text;
            try {
                text = StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                        .onUnmappableCharacter(CodingErrorAction.REPORT)
                        .decode(ByteBuffer.wrap(bytes, pos, end - pos)).toString();
            } catch (CharacterCodingException ex) {
                if (last) {
                    warnings.add(path + ":" + lineNo + ": garbled last line (not UTF-8) skipped");
                    break;
                }
                throw new InputException(path, lineNo, 0, "expected an edit line in UTF-8, found bytes that are not UTF-8");
            }
            if (lineNo == 1) {
                if (!text.equals(HEADER)) {
                    throw new InputException(path, 1, 1, "expected the edit journal header '" + HEADER + "', found '"
                            + abbreviate(text) + "'");
                }
            } else if (!text.isBlank() && !text.startsWith("#")) {
                try {
                    Edit e = parseLine(text);
                    if (e.sequence() <= lastSeq) {
                        throw new IllegalArgumentException("expected a sequence number above " + lastSeq + ", found "
                                + e.sequence());
                    }
                    lastSeq = e.sequence();
                    edits.add(e);
                } catch (BadLine ex) {
                    if (last && ex.checksum) {
                        warnings.add(path + ":" + lineNo + ": last line skipped, its checksum does not match"
                                + " (torn write): '" + abbreviate(text) + "'");
                        break;
                    }
                    throw new InputException(path.toString(), lineNo, ex.column, ex.getMessage(), null);
                } catch (IllegalArgumentException ex) {
                    throw new InputException(path.toString(), lineNo, 0, ex.getMessage(), null);
                }
            }
            pos = nl + 1;
            good = pos;
        }
        return new Parsed(edits, warnings, good);
    }

    private static final class BadLine extends IllegalArgumentException {
        private static final long serialVersionUID = 1L;
        final int column;
        final boolean checksum;

        BadLine(int column, boolean checksum, String msg) {
            super(msg);
            this.column = column;
            this.checksum = checksum;
        }
    }

    private static Edit parseLine(String text) {
        int cut = text.lastIndexOf('\t');
        if (cut < 0) throw new BadLine(0, true, "expected " + FIELDS + " tab-separated fields ending in a CRC-32, found '" + abbreviate(text) + "'");
        String body = text.substring(0, cut);
        String sum = text.substring(cut + 1);
        if (!sum.equalsIgnoreCase(crc(body))) {
            throw new BadLine(cut + 2, true, "expected CRC-32 " + crc(body) + " of the line, found '" + abbreviate(sum) + "'");
        }
        String[] f = body.split("\t", -1);
        if (f.length != FIELDS - 1) {
            throw new BadLine(0, false, "expected " + FIELDS + " tab-separated fields, found " + (f.length + 1));
        }
        int col = 1;
        try {
            long seq = Long.parseLong(f[0]);
            col += f[0].length() + 1;
            double time = time(f[1]);
            col += f[1].length() + 1;
            String user = unescape(f[2]);
            col += f[2].length() + 1;
            Action action = Action.valueOf(f[3].toUpperCase(Locale.ROOT));
            col += f[3].length() + 1;
            Selection sel = null;
            if (action == Action.REJECT || action == Action.RESTORE) {
                if (f[5].isEmpty()) {
                    sel = new Ids(ranges(f[4]));
                } else {
                    col += f[4].length() + 1;
                    String line = unescape(f[5]);
                    col += f[5].length() + 1;
                    double from = time(f[6]);
                    col += f[6].length() + 1;
                    double to = time(f[7]);
                    col += f[7].length() + 1;
                    int b0 = Integer.MIN_VALUE, b1 = Integer.MAX_VALUE;
                    if (!f[8].equals("*")) {
                        int[] b = pair(f[8]);
                        b0 = b[0];
                        b1 = b[1];
                    }
                    sel = new Window(line, from, to, b0, b1);
                }
            } else if (!(f[4] + f[5] + f[6] + f[7] + f[8]).isEmpty()) {
                throw new IllegalArgumentException("expected no selection for " + f[3] + ", found one");
            }
            return new Edit(seq, time, user, action, sel, unescape(f[9]));
        } catch (DateTimeParseException ex) {
            throw new BadLine(col, false, "expected an ISO-8601 UTC time, found '" + abbreviate(ex.getParsedString()) + "'");
        } catch (IllegalArgumentException ex) {
            throw new BadLine(col, false, ex.getMessage());
        }
    }

    private static double time(String s) {
        Instant t = Instant.parse(s);
        return t.getEpochSecond() + t.getNano() / 1e9;
    }

    private static int[] ranges(String s) {
        if (s.isEmpty()) return new int[0];
        String[] parts = s.split(",", -1);
        int[] r = new int[2 * parts.length];
        for (int k = 0; k < parts.length; k++) {
            int[] p = pair(parts[k]);
            r[2 * k] = p[0];
            r[2 * k + 1] = p[1];
        }
        return r;
    }

    /** "a..b" or "a" (then b = a). */
    private static int[] pair(String s) {
        int dd = s.indexOf("..");
        try {
            if (dd < 0) {
                int a = Integer.parseInt(s);
                return new int[] {a, a};
            }
            return new int[] {Integer.parseInt(s.substring(0, dd)), Integer.parseInt(s.substring(dd + 2))};
        } catch (NumberFormatException ex) {
            throw new IllegalArgumentException("expected a number or a range 'first..last', found '" + abbreviate(s) + "'");
        }
    }

    private static String abbreviate(String s) {
        return s.length() <= 60 ? s : s.substring(0, 57) + "...";
    }

    // ------------------------------------------------------------------ I/O helpers

    private static byte[] readAll(FileChannel ch) throws IOException {
        long size = ch.size();
        if (size > Integer.MAX_VALUE - 16) throw new IOException("edit journal larger than 2 GB");
        ByteBuffer buf = ByteBuffer.allocate((int) size);
        long p = 0;
        while (buf.hasRemaining()) {
            int r = ch.read(buf, p);
            if (r < 0) break;
            p += r;
        }
        return buf.array();
    }

    private static void write(FileChannel ch, long at, byte[] bytes) throws IOException {
        ByteBuffer buf = ByteBuffer.wrap(bytes);
        long p = at;
        while (buf.hasRemaining()) p += ch.write(buf, p);
    }

    /** Makes a new file's directory entry durable (POSIX: fsync the directory); best effort elsewhere. */
    private static void syncDirectory(Path file) {
        Path dir = file.toAbsolutePath().getParent();
        if (dir == null) return;
        try (FileChannel d = FileChannel.open(dir, StandardOpenOption.READ)) {
            d.force(true);
        } catch (IOException | UnsupportedOperationException ignored) {
            // some platforms cannot open a directory; the file's own force still holds its data
        }
    }

}
