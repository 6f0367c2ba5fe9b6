package org.leadline.io;

import java.io.IOException;
import java.io.InputStream;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.Locale;

/**
 * Checks shared by the text readers (issue 8, docs/reliability.md): a file that is not text (gzip
 * or zip data, NUL bytes) or not UTF-8 is refused with one clear {@link InputException} naming the
 * line and column of the first offending byte, instead of a decoder exception; a UTF-8 byte-order
 * mark is dropped; values quoted back in messages are abbreviated so that a 10 MB field does not
 * become a 10 MB error line.
 */
final class TextFiles {
    private TextFiles() {}

    /** Bytes looked at by {@link #sniff}. */
    static final int SNIFF = 1 << 16;

    /**
     * Refuses a file whose first 64 KiB show that it is not a text file: gzip or zip magic
     * numbers, or a NUL byte (which no Leadline text format contains).
     */
    static void sniff(Path file) {
        byte[] b;
        try (InputStream in = Files.newInputStream(file)) {
            b = in.readNBytes(SNIFF);
        } catch (NoSuchFileException e) {
            throw new InputException(file, "file not found");
        } catch (IOException e) {
            throw new InputException(file.toString(), 0, 0, "cannot read: " + e.getMessage(), e);
        }
        sniff(file, b, b.length);
    }

    static void sniff(Path file, byte[] b, int n) {
        if (n >= 2 && (b[0] & 0xFF) == 0x1F && (b[1] & 0xFF) == 0x8B) {
            throw new InputException(file, "expected a text file, found gzip-compressed data: decompress it first");
        }
        if (n >= 4 && b[0] == 'P' && b[1] == 'K' && b[2] == 3 && b[3] == 4) {
            throw new InputException(file, "expected a text file, found a zip archive: extract the file first");
        }
        for (int i = 0; i < n; i++) {
            if (b[i] == 0) {
                long[] lc = lineColumn(b, i);
                throw new InputException(file, lc[0], (int) lc[1], "expected a text file, found binary data (a NUL byte)");
            }
        }
    }

    /**
     * The exception for a file that is not UTF-8: scans it for the first malformed sequence and
     * names its line and column (in characters).
     */
    static InputException notUtf8(Path file, Throwable cause) {
        try (InputStream in = Files.newInputStream(file)) {
            CharsetDecoder d = StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                    .onUnmappableCharacter(CodingErrorAction.REPORT);
            ByteBuffer bb = ByteBuffer.allocate(1 << 16);
            CharBuffer cb = CharBuffer.allocate(1 << 16);
            long line = 1, col = 1;
            boolean eof = false;
            while (true) {
                int r = eof ? -1 : in.read(bb.array(), bb.position(), bb.remaining());
                if (r < 0) eof = true; else bb.position(bb.position() + r);
                bb.flip();
                CoderResult cr = d.decode(bb, cb, eof);
                cb.flip();
                for (int i = 0; i < cb.length(); i++) {
                    if (cb.charAt(i) == '\n') { line++; col = 1; } else col++;
                }
                cb.clear();
                if (cr.isError()) {
                    int bad = bb.get(bb.position()) & 0xFF;
                    return new InputException(file.toString(), line, (int) Math.min(col, Integer.MAX_VALUE),
                            String.format(Locale.ROOT, "expected UTF-8 text, found the byte 0x%02X that is not UTF-8"
                                    + " (saved in another encoding?)", bad), cause);
                }
                bb.compact();
                if (eof) break;
            }
        } catch (IOException e) {
            // fall through to a message without a location
        }
        return new InputException(file.toString(), 0, 0, "expected UTF-8 text, found bytes that are not UTF-8", cause);
    }

    /**
     * Reads a whole text file of at most {@code maxBytes}: checks that it is text and UTF-8 and
     * drops a byte-order mark.
     *
     * @param what what the file should be, for the size message ("a vessel file")
     */
    static String read(Path file, long maxBytes, String what) {
        try {
            long size = Files.size(file);
            if (size > maxBytes) {
                throw new InputException(file, "expected " + what + " of at most " + size(maxBytes) + ", found "
                        + size(size));
            }
            byte[] b = Files.readAllBytes(file);
            sniff(file, b, Math.min(b.length, SNIFF));
            String s;
            try {
                s = StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
                        .onUnmappableCharacter(CodingErrorAction.REPORT).decode(ByteBuffer.wrap(b)).toString();
            } catch (CharacterCodingException e) {
                throw notUtf8(file, e);
            }
            return !s.isEmpty() && s.charAt(0) == '\uFEFF' ? s.substring(1) : s;
        } catch (NoSuchFileException e) {
            throw new InputException(file, "file not found");
        } catch (IOException e) {
            throw new InputException(file.toString(), 0, 0, "cannot read: " + e.getMessage(), e);
        }
    }

    private static String size(long bytes) {
        if (bytes < 10_000) return bytes + " bytes";
        return String.format(Locale.ROOT, "%.1f MB", bytes / 1e6);
    }

    /** Line and column (1-based; column in bytes) of byte offset {@code at}. */
    private static long[] lineColumn(byte[] b, int at) {
        long line = 1;
        int start = 0;
        for (int i = 0; i < at; i++) if (b[i] == '\n') { line++; start = i + 1; }
        return new long[] {line, at - start + 1};
    }

    /** A value quoted back in a message: at most 40 characters and then its length. */
    static String abbreviate(String s) {
        if (s.length() <= 60) return s;
        return s.substring(0, 40) + "... (" + s.length() + " characters)";
    }

    /**
     * A hint for a header row that uses another separator than the comma: the separator found,
     * or 0 when the row looks comma-separated.
     */
    static char otherSeparator(String headerLine) {
        if (headerLine.indexOf(',') >= 0) return 0;
        if (headerLine.indexOf(';') >= 0) return ';';
        if (headerLine.indexOf('\t') >= 0) return '\t';
        if (headerLine.indexOf('|') >= 0) return '|';
        return 0;
    }

    static String separatorName(char c) {
        return switch (c) {
            case ';' -> "semicolons";
            case '\t' -> "tabs";
            case '|' -> "'|' characters";
            default -> "'" + c + "'";
        };
    }

    /** Names ending in a non-SI length unit, which Leadline never reads as metres. */
    static boolean feetOrFathoms(String name) {
        String n = name.toLowerCase(Locale.ROOT);
        return n.endsWith("_ft") || n.endsWith("_feet") || n.endsWith("(ft)") || n.endsWith("[ft]")
                || n.endsWith("_fm") || n.endsWith("_fathoms");
    }
}
