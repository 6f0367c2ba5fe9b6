package org.leadline.cli;

import org.leadline.pipeline.Progress;

import java.io.PrintWriter;
import java.util.Locale;

/**
 * Progress on the terminal: one line per stage with its elapsed time, and a bar that redraws in
 * place while a long stage reports fractions (only on an interactive console, so logs stay clean).
 */
final class TerminalProgress implements Progress {
    private final PrintWriter err;
    private final boolean interactive;
    private final long t0 = System.nanoTime();
    private String stage;
    private long stageStart;
    private long stageCpu;
    private int lastPercent = -1;

    TerminalProgress(PrintWriter err, boolean quiet) {
        this.err = quiet ? null : err;
        this.interactive = System.console() != null;
    }

    @Override
    public synchronized void stage(String name) {
        finish();
        stage = name;
        stageStart = System.nanoTime();
        stageCpu = processCpu();
        lastPercent = -1;
        if (err != null && interactive) {
            err.print(String.format(Locale.ROOT, "%-34s", name));
            err.flush();
        }
    }

    @Override
    public synchronized void fraction(double done) {
        if (err == null || !interactive || stage == null) return;
        int p = (int) Math.round(100 * Math.max(0, Math.min(1, done)));
        if (p == lastPercent) return;
        lastPercent = p;
        int filled = p / 4;
        err.print("\r" + String.format(Locale.ROOT, "%-34s", stage) + "[" + "#".repeat(filled) + " ".repeat(25 - filled)
                + "] " + p + " %");
        err.flush();
    }

    /** Ends the current stage's line. */
    synchronized void finish() {
        if (stage != null && err != null) {
            double s = (System.nanoTime() - stageStart) / 1e9;
            long cpu = processCpu();
            // CPU time of the whole process (all threads, GC included): the measure that other work on the machine does not inflate
            String line = String.format(Locale.ROOT, "%-34s done in %.1f s", stage, s)
                    + (cpu >= 0 && stageCpu >= 0 ? String.format(Locale.ROOT, " (cpu %.1f s)", (cpu - stageCpu) / 1e9) : "");
            err.println(interactive ? "\r" + line + " ".repeat(10) : line);
            err.flush();
        }
        stage = null;
    }

    private static long processCpu() {
        if (java.lang.management.ManagementFactory.getOperatingSystemMXBean() instanceof com.sun.management.OperatingSystemMXBean os) {
            return os.getProcessCpuTime();
        }
        return -1;
    }

    double elapsed() { return (System.nanoTime() - t0) / 1e9; }
}
