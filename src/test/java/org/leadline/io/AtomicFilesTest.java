package org.leadline.io;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;

import static org.assertj.core.api.Assertions.assertThat;
import static org.assertj.core.api.Assertions.assertThatThrownBy;

class AtomicFilesTest {
    @TempDir Path dir;

    @Test
    void writesAndReplaces() throws IOException {
        Path f = dir.resolve("sub/out.txt");
        AtomicFiles.write(f, tmp -> Files.writeString(tmp, "first"));
        assertThat(Files.readString(f)).isEqualTo("first");
        AtomicFiles.write(f, tmp -> Files.writeString(tmp, "second"));
        assertThat(Files.readString(f)).isEqualTo("second");
        try (var s = Files.list(f.getParent())) {
            assertThat(s.map(p -> p.getFileName().toString())).containsExactly("out.txt");
        }
    }

    @Test
    void theFileGetsTheUsualPermissionsNotOwnerOnly() throws IOException {
        Path f = dir.resolve("perm.txt");
        Path direct = dir.resolve("direct.txt");
        Files.writeString(direct, "x");
        AtomicFiles.write(f, tmp -> Files.writeString(tmp, "x"));
        if (f.getFileSystem().supportedFileAttributeViews().contains("posix")) {
            assertThat(Files.getPosixFilePermissions(f)).isEqualTo(Files.getPosixFilePermissions(direct));
        }
    }

    @Test
    void aFailedWriteKeepsTheOldFileAndLeavesNoTemporary() throws IOException {
        Path f = dir.resolve("out.txt");
        Files.writeString(f, "old");
        assertThatThrownBy(() -> AtomicFiles.write(f, tmp -> {
            Files.writeString(tmp, "half");
            throw new IOException("disk full");
        })).isInstanceOf(IOException.class).hasMessage("disk full");
        assertThat(Files.readString(f)).isEqualTo("old");
        try (var s = Files.list(dir)) {
            assertThat(s.map(p -> p.getFileName().toString())).containsExactly("out.txt");
        }
    }
}
