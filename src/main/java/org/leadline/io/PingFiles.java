package org.leadline.io;

import java.nio.file.Path;
import org.leadline.survey.PingTable;

/**
 * Reads a ping table in whichever of Leadline's ping formats its name says: {@code *.lpb} is the
 * binary ping format ({@link BinaryPingReader}, docs/formats/binary-pings.md), anything else a ping
 * CSV ({@link PingCsvReader}, docs/formats/pings.md). Both give the same table for the same pings.
 */
public final class PingFiles {
    private PingFiles() {}

    /**
     * @param separateNavigation true when a navigation file supplies the positions (lat, lon may be absent)
     */
    public static PingTable read(Path file, boolean separateNavigation) {
        return BinaryPingReader.isBinary(file) ? BinaryPingReader.read(file, separateNavigation)
                : PingCsvReader.read(file, separateNavigation);
    }

    /**
     * Opens the file for reading chunk by chunk (streamed processing); the rows, values, checks
     * and errors are those of {@link #read}.
     *
     * @param targetRows rows per chunk, about (a chunk ends at a ping boundary)
     */
    public static PingChunks chunks(Path file, boolean separateNavigation, int targetRows) throws java.io.IOException {
        return BinaryPingReader.isBinary(file) ? BinaryPingReader.chunks(file, separateNavigation, targetRows)
                : PingCsvReader.chunks(file, separateNavigation, targetRows);
    }

    /**
     * Rows in a ping file, about, without reading it: the binary header's count, or for a CSV the
     * file size over the mean length of the lines in its first MiB. 0 when the file cannot be read
     * (the reader then says why).
     */
    public static long estimateRows(Path file) {
        try (var in = java.nio.file.Files.newInputStream(file)) {
            boolean binary = BinaryPingReader.isBinary(file);
            byte[] b = in.readNBytes(binary ? 14 : 1 << 20);
            if (binary) {
                if (b.length < 14) return 0;
                return java.nio.ByteBuffer.wrap(b, 6, 8).order(java.nio.ByteOrder.LITTLE_ENDIAN).getLong();
            }
            int lines = 0;
            for (byte x : b) if (x == '\n') lines++;
            if (lines == 0) return 0;
            return (long) (java.nio.file.Files.size(file) / (b.length / (double) lines));
        } catch (java.io.IOException e) {
            return 0;
        }
    }
}
