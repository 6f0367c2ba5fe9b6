package org.leadline.pipeline;

import java.io.IOException;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.stream.Stream;

/**
 * Output folder of a run with all-or-nothing placement: files are written into a hidden staging
 * folder inside the output folder and moved to their final names (atomic renames on the same file
 * system) only by {@link #commit()}, after every output was written. If the run fails or is
 * killed, the output folder keeps the previous complete outputs (or none), never a half-written
 * file under a final name; a stale staging folder is removed by the next run.
 */
public final class OutputFolder implements AutoCloseable {
    private static final String STAGING_PREFIX = ".leadline-staging-";
    private final Path dir;
    private final Path staging;
    private final List<String> names = new ArrayList<>();
    private boolean committed;

    private OutputFolder(Path dir, Path staging) {
        this.dir = dir;
        this.staging = staging;
    }

    /** Opens (creating if needed) an output folder and a fresh staging folder inside it. */
    public static OutputFolder open(Path dir) throws IOException {
        Files.createDirectories(dir);
        try (DirectoryStream<Path> old = Files.newDirectoryStream(dir, STAGING_PREFIX + "*")) {
            for (Path p : old) deleteTree(p);
        }
        Path staging = Files.createTempDirectory(dir, STAGING_PREFIX);
        return new OutputFolder(dir, staging);
    }

    public Path directory() { return dir; }

    /**
     * Path in the staging folder for an output with this final name (a plain file name; no
     * separators or "..", so outputs stay inside the folder).
     */
    public Path stage(String name) {
        if (name.isEmpty() || name.contains("/") || name.contains("\\") || name.equals("..") || name.equals(".")) {
            throw new IllegalArgumentException("output name must be a plain file name, got '" + name + "'");
        }
        if (!names.contains(name)) names.add(name);
        return staging.resolve(name);
    }

    /** Moves every staged output to its final name. */
    public void commit() throws IOException {
        for (String name : names) {
            Path src = staging.resolve(name);
            if (!Files.exists(src)) continue;
            try {
                Files.move(src, dir.resolve(name), StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
            } catch (AtomicMoveNotSupportedException e) {
                Files.move(src, dir.resolve(name), StandardCopyOption.REPLACE_EXISTING);
            }
        }
        committed = true;
    }

    /** Removes the staging folder (and, without a commit, everything staged). */
    @Override
    public void close() throws IOException {
        deleteTree(staging);
    }

    public boolean committed() { return committed; }

    private static void deleteTree(Path p) throws IOException {
        if (!Files.exists(p)) return;
        try (Stream<Path> s = Files.walk(p)) {
            for (Path q : s.sorted(Comparator.reverseOrder()).toList()) Files.deleteIfExists(q);
        }
    }
}
