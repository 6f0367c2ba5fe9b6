package org.leadline.io;

import org.leadline.survey.PingTable;

import java.io.IOException;

/**
 * The pings of one file read a chunk at a time, for days too large to hold in memory
 * (the streamed processing path, docs/performance.md). Chunks follow the file's row order and
 * never split a ping: rows with the same time and line stay in one chunk, so per-ping work (beam
 * ranks, per-ping reduction terms) sees whole pings.
 *
 * <p>Line ids are stable across chunks: every chunk's {@code line} column indexes the same list,
 * numbered in order of first appearance in the file (as a whole-file read numbers them), and each
 * chunk's {@link PingTable#lineNames()} holds at least every name its rows use.
 */
public interface PingChunks extends AutoCloseable {
    /** The next chunk of about the requested number of rows, or null after the last one. */
    PingTable next() throws IOException;

    /** Rows in the file when its format says so up front (the binary header), else -1. */
    long expectedRows();

    @Override
    void close() throws IOException;

    /** Chunks of a table already in memory (small sources such as an NMEA log); saves no memory. */
    static PingChunks of(PingTable table, int targetRows) { return new WholeTableChunks(table, targetRows); }
}
