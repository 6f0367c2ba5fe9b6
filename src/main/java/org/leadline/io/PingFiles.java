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
}
