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
 * Subcommands are thin: they parse options, call the library and print.
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
        return cl.execute(args);
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
