package org.leadline.bench;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Locale;
import org.leadline.io.PingChunks;
import org.leadline.io.PingFiles;
import org.leadline.survey.PingTable;

/**
 * Wall and process CPU time of reading a ping file (CSV or binary), repeated:
 * {@code java -cp <test classpath> org.leadline.bench.ReadPingsProbe FILE [repeats] [--chunks ROWS | ROWS]}.
 * With {@code --chunks} the file is read chunk by chunk ({@link PingFiles#chunks}) and each chunk
 * dropped: the streamed reader's speed, and (run with a small {@code -Xmx}) its bounded memory.
 */
public final class ReadPingsProbe {
    private ReadPingsProbe() {}

    public static void main(String[] args) throws IOException {
        Path f = Path.of(args[0]);
        int repeats = 3, chunkRows = 0, positional = 0;
        for (int i = 1; i < args.length; i++) {
            if (args[i].equals("--chunks")) chunkRows = Integer.parseInt(args[++i].replace("_", ""));
            else if (positional++ == 0) repeats = Integer.parseInt(args[i]);
            else chunkRows = Integer.parseInt(args[i].replace("_", "")); // FILE repeats chunkRows
        }
        var os = (com.sun.management.OperatingSystemMXBean) java.lang.management.ManagementFactory.getOperatingSystemMXBean();
        for (int r = 0; r < repeats; r++) {
            long c0 = os.getProcessCpuTime(), t0 = System.nanoTime();
            long rows = 0, chunks = 0;
            double lastTime = Double.NaN;
            if (chunkRows > 0) {
                try (PingChunks c = PingFiles.chunks(f, false, chunkRows)) {
                    for (PingTable t; (t = c.next()) != null; chunks++) {
                        rows += t.size;
                        lastTime = t.time[t.size - 1];
                    }
                }
            } else {
                PingTable t = PingFiles.read(f, false);
                rows = t.size;
                chunks = 1;
                lastTime = t.size > 0 ? t.time[t.size - 1] : Double.NaN;
            }
            long c1 = os.getProcessCpuTime(), t1 = System.nanoTime();
            System.out.printf(Locale.ROOT, "%s: %d rows in %d chunk(s) (last time %.3f) in %.2f s wall, %.2f s cpu%n",
                    f.getFileName(), rows, chunks, lastTime, (t1 - t0) / 1e9, (c1 - c0) / 1e9);
        }
    }
}
