package org.leadline.cli;

import org.leadline.io.InputException;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Option;

import java.io.PrintWriter;
import java.util.concurrent.Callable;

/**
 * The command-line front end (DESIGN.md section 5). Exit codes: 0 success, 2 bad input (one line
 * naming file, line and problem; stack trace only with {@code --debug}), 1 internal error.
 * Subcommands are thin: they parse options, call the library and print. The system property
 * {@code leadline.threads} (e.g. {@code java -Dleadline.threads=1 -jar leadline.jar ...}) sets the
 * number of worker threads of the parallel steps (default: the common fork/join pool, one per core);
 * outputs are the same for any number.
 */
@Command(name = "leadline", mixinStandardHelpOptions = true, versionProvider = Main.Version.class,
        description = "Hydrographic survey processing: echo soundings to depths reduced to chart datum.%n"
                + "Not for navigation unless validated by a qualified hydrographer.",
        subcommands = {CommandLine.HelpCommand.class})
public final class Main implements Callable<Integer> {
    public static final int OK = 0, INTERNAL_ERROR = 1, BAD_INPUT = 2;

    @Option(names = "--debug", description = "Print stack traces on errors.", scope = CommandLine.ScopeType.INHERIT)
    boolean debug;

    @Override
    public Integer call() {
        new CommandLine(this).usage(System.out);
        return OK;
    }

    public static void main(String[] args) {
        System.exit(run(args, new PrintWriter(System.out, true), new PrintWriter(System.err, true)));
    }

    /** Runs the command line with the given streams; returns the exit code (used by tests too). */
    public static int run(String[] args, PrintWriter out, PrintWriter err) {
        CommandLine cl = commandLine();
        cl.setOut(out);
        cl.setErr(err);
        boolean debug = java.util.Arrays.asList(args).contains("--debug");
        cl.setExecutionExceptionHandler((ex, commandLine, parseResult) -> {
            if (ex instanceof InputException || ex instanceof java.nio.file.NoSuchFileException) {
                String msg = ex instanceof java.nio.file.NoSuchFileException nf
                        ? nf.getFile() + ": file not found" : ex.getMessage();
                msg = msg.replaceAll("[\\r\\n]+", " "); // one line, even when a quoted value held a line end
                err.println("leadline: " + msg);
                if (debug) ex.printStackTrace(err);
                err.flush();
                return BAD_INPUT;
            }
            err.println("leadline: internal error: " + ex);
            if (debug) ex.printStackTrace(err);
            else err.println("(run again with --debug for details)");
            err.flush();
            return INTERNAL_ERROR;
        });
        cl.setParameterExceptionHandler((ex, a) -> {
            err.println("leadline: " + ex.getMessage());
            err.flush();
            return BAD_INPUT;
        });
        // -Dleadline.threads=N: run the command, and so every parallel step under it, in a pool of N threads
        Integer threads = Integer.getInteger("leadline.threads");
        if (threads == null || threads < 1) return cl.execute(args);
        java.util.concurrent.ForkJoinPool pool = new java.util.concurrent.ForkJoinPool(threads);
        try {
            return pool.submit(() -> cl.execute(args)).get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            return INTERNAL_ERROR;
        } catch (java.util.concurrent.ExecutionException e) {
            err.println("leadline: internal error: " + e.getCause());
            err.flush();
            return INTERNAL_ERROR;
        } finally {
            pool.shutdown();
        }
    }

    static CommandLine commandLine() {
        CommandLine cl = new CommandLine(new Main());
        // Subcommands register here, one class per command in this package.
        for (Object sub : Commands.all()) cl.addSubcommand(sub);
        return cl;
    }

    static final class Version implements CommandLine.IVersionProvider {
        @Override
        public String[] getVersion() {
            String v = Main.class.getPackage().getImplementationVersion();
            return new String[]{"Leadline " + (v == null ? "(development build)" : v)};
        }
    }
}
