package org.leadline.bench;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Locale;
import org.leadline.io.PingChunks;
import org.leadline.io.PingFiles;
import org.leadline.survey.PingTable;

/**
 * Wall and process CPU time of reading a ping file (CSV or binary), repeated:
 * {@code java -cp <test classpath> org.leadline.bench.ReadPingsProbe FILE [repeats] [chunkRows]}.
 * With {@code chunkRows} the file is read chunk by chunk ({@link PingFiles#chunks}) and the chunks
 * dropped, as the streamed processing path does (run it with a small heap to see the bound).
 */
public final class ReadPingsProbe {
    private ReadPingsProbe() {}

    public static void main(String[] args) throws IOException {
        Path f = Path.of(args[0]);
        int repeats = args.length > 1 ? Integer.parseInt(args[1]) : 3;
        int chunkRows = args.length > 2 ? Integer.parseInt(args[2]) : 0;
        var os = (com.sun.management.OperatingSystemMXBean) java.lang.management.ManagementFactory.getOperatingSystemMXBean();
        for (int r = 0; r < repeats; r++) {
            long c0 = os.getProcessCpuTime(), t0 = System.nanoTime();
            long rows = 0, chunks = 0;
            double check = 0;
            if (chunkRows > 0) {
                try (PingChunks c = PingFiles.chunks(f, false, chunkRows)) {
                    for (PingTable t = c.next(); t != null; t = c.next()) {
                        rows += t.size;
                        chunks++;
                        check += t.twtt[t.size - 1];
                    }
                }
            } else {
                PingTable t = PingFiles.read(f, false);
                rows = t.size;
                chunks = 1;
                check = t.twtt[t.size - 1];
            }
            long c1 = os.getProcessCpuTime(), t1 = System.nanoTime();
            System.out.printf(Locale.ROOT, "%s: %d rows in %d chunks in %.2f s wall, %.2f s cpu (check %.6f)%n", f.getFileName(), rows,
                    chunks, (t1 - t0) / 1e9, (c1 - c0) / 1e9, check);
        }
    }
}
