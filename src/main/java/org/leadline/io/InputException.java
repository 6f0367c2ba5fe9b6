package org.leadline.io;

import java.nio.file.Path;

/**
 * Bad input: a file that cannot be read as what it claims to be. Carries the file, the 1-based
 * line and column (0 when not known) so the command line can print one clear line and exit 2.
 */
public class InputException extends RuntimeException {
    private static final long serialVersionUID = 1L;
    private final String file;
    private final long line;
    private final int column;
    private final String problem;

    public InputException(Path file, long line, int column, String problem) {
        this(file == null ? null : file.toString(), line, column, problem, null);
    }

    public InputException(String file, long line, int column, String problem, Throwable cause) {
        super(format(file, line, column, problem), cause);
        this.file = file;
        this.line = line;
        this.column = column;
        this.problem = problem;
    }

    /** A problem with a file as a whole (no line). */
    public InputException(Path file, String problem) {
        this(file, 0, 0, problem);
    }

    private static String format(String file, long line, int column, String problem) {
        StringBuilder sb = new StringBuilder();
        if (file != null) sb.append(file);
        if (line > 0) sb.append(sb.length() > 0 ? ":" : "line ").append(line);
        if (column > 0) sb.append(':').append(column);
        if (sb.length() > 0) sb.append(": ");
        return sb.append(problem).toString();
    }

    public String file() { return file; }
    public long line() { return line; }
    public int column() { return column; }
    public String problem() { return problem; }
}
