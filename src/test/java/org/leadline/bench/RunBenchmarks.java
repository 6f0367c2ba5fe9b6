package org.leadline.bench;

import org.openjdk.jmh.runner.Runner;
import org.openjdk.jmh.runner.RunnerException;
import org.openjdk.jmh.runner.options.Options;
import org.openjdk.jmh.runner.options.OptionsBuilder;

/**
 * Runs Leadline's JMH benchmarks: {@code java -cp <test classpath> org.leadline.bench.RunBenchmarks [regex]}.
 * The optional argument selects benchmarks by a regular expression (default: all in this package).
 * See docs/performance.md for the exact command.
 */
public final class RunBenchmarks {
    private RunBenchmarks() {}

    public static void main(String[] args) throws RunnerException {
        String include = args.length > 0 ? args[0] : "org\\.leadline\\.bench\\..*";
        Options opt = new OptionsBuilder().include(include).build();
        new Runner(opt).run();
    }
}
