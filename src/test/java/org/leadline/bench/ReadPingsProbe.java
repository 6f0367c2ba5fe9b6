package org.leadline.bench;

import java.nio.file.Path;
import java.util.Locale;
import org.leadline.io.PingFiles;
import org.leadline.survey.PingTable;

/**
 * Wall and process CPU time of reading a ping file (CSV or binary), repeated:
 * {@code java -cp <test classpath> org.leadline.bench.ReadPingsProbe FILE [repeats]}.
 */
public final class ReadPingsProbe {
    private ReadPingsProbe() {}

    public static void main(String[] args) {
        Path f = Path.of(args[0]);
        int repeats = args.length > 1 ? Integer.parseInt(args[1]) : 3;
        var os = (com.sun.management.OperatingSystemMXBean) java.lang.management.ManagementFactory.getOperatingSystemMXBean();
        for (int r = 0; r < repeats; r++) {
            long c0 = os.getProcessCpuTime(), t0 = System.nanoTime();
            PingTable t = PingFiles.read(f, false);
            long c1 = os.getProcessCpuTime(), t1 = System.nanoTime();
            System.out.printf(Locale.ROOT, "%s: %d rows in %.2f s wall, %.2f s cpu%n", f.getFileName(), t.size,
                    (t1 - t0) / 1e9, (c1 - c0) / 1e9);
        }
    }
}
