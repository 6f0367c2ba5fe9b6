package org.leadline.pipeline;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.nio.channels.FileChannel;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.stream.Stream;

/**
 * Output folder of a run with all-or-nothing placement (docs/reliability.md, "Crash safety").
 *
 * <p>Files are written into a hidden staging folder {@code .leadline-staging-*} inside the output
 * folder, forced to disk, and moved to their final names by {@link #commit()}, each move an atomic
 * rename on the same file system. Guarantees, whatever moment the program is killed (SIGKILL,
 * power loss after the staged files reached the disk):
 * <ol>
 * <li>a file under a final name is always complete: either the previous run's or this run's;</li>
 * <li>before {@link #commit()} starts, the folder holds exactly the previous outputs (or none);</li>
 * <li>a commit first writes the marker {@value #MARKER} naming its staging folder and deletes it
 * after the last move. A kill between two moves can leave a mix of previous and new complete
 * files: the marker is then present, and the next {@link #open} (the next run on the same folder)
 * or {@link #recover} first finishes the interrupted commit (every staged file is complete, so it
 * rolls forward), leaving this run's complete set;</li>
 * <li>{@code lineage.json} is moved last, so it describes the set as soon as the marker is gone.</li>
 * </ol>
 * A folder with no marker therefore holds one run's complete set (or the previous, or none).
 */
public final class OutputFolder implements AutoCloseable {
    private static final String STAGING_PREFIX = ".leadline-staging-";
    /** Present while a commit moves files; names the staging folder being committed. */
    public static final String MARKER = ".leadline-commit";
    /** Moved last: its presence without the marker means the set is one run's. */
    private static final String LAST = "lineage.json";

    private final Path dir;
    private final Path staging;
    private final List<String> names = new ArrayList<>();
    private boolean committed;

    private OutputFolder(Path dir, Path staging) {
        this.dir = dir;
        this.staging = staging;
    }

    /**
     * Opens (creating if needed) an output folder and a fresh staging folder inside it, after
     * finishing a commit that was interrupted ({@link #recover}) and removing stale staging folders.
     */
    public static OutputFolder open(Path dir) throws IOException {
        Files.createDirectories(dir);
        recover(dir);
        try (DirectoryStream<Path> old = Files.newDirectoryStream(dir, STAGING_PREFIX + "*")) {
            for (Path p : old) deleteTree(p);
        }
        Path staging = Files.createTempDirectory(dir, STAGING_PREFIX);
        return new OutputFolder(dir, staging);
    }

    /**
     * Finishes a commit interrupted by a kill: when the marker is present, moves every file still
     * in the staging folder it names to its final name, then removes the marker and that folder.
     *
     * @return true when an interrupted commit was finished
     */
    public static boolean recover(Path dir) throws IOException {
        Path marker = dir.resolve(MARKER);
        if (!Files.isRegularFile(marker)) return false;
        String name = Files.readString(marker, StandardCharsets.UTF_8).strip();
        Path staging = dir.resolve(name);
        if (name.startsWith(STAGING_PREFIX) && !name.contains("/") && Files.isDirectory(staging)) {
            List<Path> files;
            try (Stream<Path> s = Files.list(staging)) {
                files = new ArrayList<>(s.filter(Files::isRegularFile).toList());
            }
            files.sort(Comparator.comparing((Path p) -> p.getFileName().toString().equals(LAST)));
            for (Path f : files) move(f, dir.resolve(f.getFileName().toString()));
            deleteTree(staging);
        }
        Files.delete(marker);
        syncDirectory(dir);
        return true;
    }

    public Path directory() { return dir; }

    /** A path in the staging folder for temporary files that are not outputs (removed with the staging folder). */
    Path scratch(String name) { return staging.resolve(name); }

    /**
     * Path in the staging folder for an output with this final name (a plain file name; no
     * separators or "..", so outputs stay inside the folder).
     */

    public Path stage(String name) {
        if (name.isEmpty() || name.contains("/") || name.contains("\\") || name.equals("..") || name.equals(".")
                || name.startsWith(".leadline-")) {
            throw new IllegalArgumentException("output name must be a plain file name, got '" + name + "'");
        }
        if (!names.contains(name)) names.add(name);
        return staging.resolve(name);
    }

    /** Moves every staged output to its final name, {@code lineage.json} last (see the class comment). */
    public void commit() throws IOException {
        List<String> order = new ArrayList<>();
        for (String name : names) if (Files.exists(staging.resolve(name))) order.add(name);
        order.sort(Comparator.comparing(LAST::equals));
        // staged bytes on disk before any final name can point at them
        for (String name : order) force(staging.resolve(name));
        syncDirectory(staging);
        Path marker = dir.resolve(MARKER);
        Path tmp = staging.resolve(MARKER);
        Files.writeString(tmp, staging.getFileName().toString() + "\n", StandardCharsets.UTF_8);
        force(tmp);
        move(tmp, marker);
        syncDirectory(dir);
        long pause = Long.getLong("leadline.test.commitPauseMs", 0L); // test hook: widens the window between moves
        for (String name : order) {
            move(staging.resolve(name), dir.resolve(name));
            if (pause > 0) {
                try {
                    Thread.sleep(pause);
                } catch (InterruptedException e) {
                    Thread.currentThread().interrupt();
                }
            }
        }
        syncDirectory(dir);
        Files.delete(marker);
        syncDirectory(dir);
        committed = true;
    }

    /** Removes the staging folder (and, without a commit, everything staged). */
    @Override
    public void close() throws IOException {
        deleteTree(staging);
    }

    public boolean committed() { return committed; }

    private static void move(Path src, Path dst) throws IOException {
        try {
            Files.move(src, dst, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
        } catch (AtomicMoveNotSupportedException e) {
            Files.move(src, dst, StandardCopyOption.REPLACE_EXISTING);
        }
    }

    private static void force(Path file) throws IOException {
        try (FileChannel ch = FileChannel.open(file, StandardOpenOption.WRITE)) {
            ch.force(true);
        }
    }

    /** Makes renames in a folder durable (POSIX: fsync of the directory); a no-op where unsupported. */
    private static void syncDirectory(Path dir) {
        try (FileChannel ch = FileChannel.open(dir, StandardOpenOption.READ)) {
            ch.force(true);
        } catch (IOException | UnsupportedOperationException ignored) {
            // Windows cannot open a directory as a channel; its renames are journalled by NTFS
        }
    }

    private static void deleteTree(Path p) throws IOException {
        if (!Files.exists(p)) return;
        try (Stream<Path> s = Files.walk(p)) {
            for (Path q : s.sorted(Comparator.reverseOrder()).toList()) Files.deleteIfExists(q);
        }
    }
}
