package org.leadline.io;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;

/**
 * Writes a file so that it appears complete or not at all: the content goes to a temporary file in
 * the target's folder (same file system, so the final move is a rename), which is then moved over
 * the target with {@code ATOMIC_MOVE}. A failed or interrupted write leaves the old target (or no
 * target) and removes the temporary file, so a half-written output never looks finished.
 *
 * <pre>{@code
 * AtomicFiles.write(out.resolve("surface.xyz"), tmp -> Files.writeString(tmp, text));
 * }</pre>
 */
public final class AtomicFiles {
    private AtomicFiles() {}

    /** Writes to a path; may throw IOException. */
    @FunctionalInterface
    public interface IOConsumer<T> {
        void accept(T t) throws IOException;
    }

    /**
     * Runs {@code writer} on a fresh temporary file next to {@code target}, then moves it into place.
     * Missing parent folders are created.
     *
     * @param target the file to create or replace
     * @param writer writes the whole content to the path it is given (which exists, empty)
     * @throws IOException from the writer or the move; the temporary file is deleted
     */
    public static void write(Path target, IOConsumer<Path> writer) throws IOException {
        Path abs = target.toAbsolutePath();
        Path dir = abs.getParent();
        Files.createDirectories(dir);
        Path tmp = createTemporary(dir, abs.getFileName().toString());
        boolean done = false;
        try {
            writer.accept(tmp);
            try {
                Files.move(tmp, abs, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
            } catch (AtomicMoveNotSupportedException e) {
                // Some file systems (certain network mounts) cannot rename atomically; a plain replace is the best left.
                Files.move(tmp, abs, StandardCopyOption.REPLACE_EXISTING);
            }
            done = true;
        } finally {
            if (!done) Files.deleteIfExists(tmp);
        }
    }

    /**
     * A new empty file ".name.NNNN.part" in dir. Not Files.createTempFile: that makes the file
     * owner-only (0600), which the output would keep after the move; this one gets the usual
     * permissions of a new file (umask applied), like a file written directly.
     */
    private static Path createTemporary(Path dir, String name) throws IOException {
        for (int attempt = 0; ; attempt++) {
            String unique = Long.toString(ProcessHandle.current().pid(), 36) + "-"
                    + Long.toString(System.nanoTime() & 0xFFFFFFFFFL, 36) + (attempt > 0 ? "-" + attempt : "");
            try {
                return Files.createFile(dir.resolve("." + name + "." + unique + ".part"));
            } catch (FileAlreadyExistsException e) {
                if (attempt > 100) throw e;
            }
        }
    }

    /** {@link #write} for callers that cannot throw IOException: wraps it in UncheckedIOException. */
    public static void writeUnchecked(Path target, IOConsumer<Path> writer) {
        try {
            write(target, writer);
        } catch (IOException e) {
            throw new UncheckedIOException("cannot write " + target + ": " + e.getMessage(), e);
        }
    }
}
