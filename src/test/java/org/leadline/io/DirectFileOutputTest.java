package org.leadline.io;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.SplittableRandom;

import static org.assertj.core.api.Assertions.assertThat;

/**
 * The direct-I/O stream must leave exactly the bytes written, whatever their length against the
 * block size (padding of the last block cut off again), and replace an older, longer file.
 */
class DirectFileOutputTest {
    @TempDir
    Path dir;

    @Test
    void fileHoldsExactlyTheBytesWrittenForEveryLengthAroundTheBlockSize() throws Exception {
        SplittableRandom rnd = new SplittableRandom(11);
        int[] lengths = {0, 1, 511, 4095, 4096, 4097, 65_537, (8 << 20) - 1, 8 << 20, (8 << 20) + 4099, 20_000_003};
        for (int len : lengths) {
            byte[] data = new byte[len];
            for (int i = 0; i < len; i++) data[i] = (byte) rnd.nextInt(256);
            Path f = dir.resolve("f" + len + ".csv");
            Files.write(f, new byte[30_000_000]);   // an older, longer file is replaced
            try (OutputStream out = DirectFileOutput.open(f)) {
                // odd pieces and single bytes, as a writer of text blocks would
                int at = 0;
                while (at < len) {
                    if (rnd.nextInt(10) == 0) {
                        out.write(data[at++]);
                        continue;
                    }
                    int k = Math.min(len - at, 1 + rnd.nextInt(700_000));
                    out.write(data, at, k);
                    at += k;
                }
            }
            assertThat(Files.size(f)).as("length %d", len).isEqualTo(len);
            assertThat(Files.readAllBytes(f)).as("length %d", len).isEqualTo(data);
        }
    }

    @Test
    void directIoIsUsedWhereTheFileSystemAllowsItAndTheBufferedStreamOtherwise() throws Exception {
        Path f = dir.resolve("x.csv");
        try (OutputStream out = DirectFileOutput.open(f)) {
            out.write(new byte[] {1, 2, 3});
            // which one depends on the file system of the temporary folder; both must write the bytes
            System.out.println("temporary folder " + dir + ": " + (out instanceof DirectFileOutput ? "direct I/O" : "buffered"));
        }
        assertThat(Files.readAllBytes(f)).containsExactly(1, 2, 3);
        System.setProperty("leadline.directio", "false");
        try (OutputStream out = DirectFileOutput.open(f)) {
            assertThat(out).isNotInstanceOf(DirectFileOutput.class);
            out.write(7);
        } finally {
            System.clearProperty("leadline.directio");
        }
        assertThat(Files.readAllBytes(f)).containsExactly(7);
    }
}
