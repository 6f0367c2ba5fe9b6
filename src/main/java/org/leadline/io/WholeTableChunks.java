package org.leadline.io;

import org.leadline.survey.PingTable;

/**
 * {@link PingChunks} over a table already in memory: slices of about the requested size, cut at
 * ping boundaries. For formats with no streaming reader (and for tests); it saves no memory.
 */
final class WholeTableChunks implements PingChunks {
    private final PingTable table;
    private final int target;
    private int at;

    WholeTableChunks(PingTable table, int targetRows) {
        this.table = table;
        this.target = Math.max(1, targetRows);
    }

    @Override
    public PingTable next() {
        if (at >= table.size) return null;
        int end = pingBoundary(table, Math.min(table.size, at + target));
        PingTable c = at == 0 && end == table.size ? table : table.slice(at, end);
        at = end;
        return c;
    }

    /** The first row at or after {@code i} that starts a ping (time or line differs from the row before). */
    static int pingBoundary(PingTable t, int i) {
        while (i > 0 && i < t.size && t.time[i] == t.time[i - 1] && t.line[i] == t.line[i - 1]) i++;
        return i;
    }

    @Override
    public long expectedRows() { return table.size; }

    @Override
    public void close() {}
}
