package org.leadline.workbench;

import org.leadline.io.InputException;
import org.leadline.pipeline.Progress;

import javax.swing.JOptionPane;
import java.awt.Component;
import java.nio.file.AccessDeniedException;
import java.nio.file.NoSuchFileException;
import java.util.concurrent.CancellationException;
import java.util.concurrent.ExecutionException;

/** Errors in words for the reviewer: the message, never a stack trace. */
public final class Errors {
    private Errors() {}

    /** The words for an error, or null when it was a cancellation (nothing to report). */
    public static String describe(Throwable t) {
        while ((t instanceof ExecutionException || t instanceof java.lang.reflect.InvocationTargetException)
                && t.getCause() != null) {
            t = t.getCause();
        }
        if (t instanceof Progress.Cancelled || t instanceof CancellationException) return null;
        if (t instanceof InputException) return t.getMessage();
        if (t instanceof NoSuchFileException e) return e.getFile() + ": file not found";
        if (t instanceof AccessDeniedException e) return e.getFile() + ": permission denied";
        if (t instanceof java.io.IOException) return t.getMessage() == null ? t.toString() : t.getMessage();
        if (t instanceof IllegalArgumentException && t.getMessage() != null) return t.getMessage();
        String m = t.getMessage();
        return "Internal error (" + t.getClass().getSimpleName() + ")" + (m == null ? "" : ": " + m);
    }

    /** Shows the error in a dialog (nothing for a cancellation). */
    static void show(Component parent, String what, Throwable t) {
        String words = describe(t);
        if (words == null) return;
        JOptionPane.showMessageDialog(parent, wrap(what + ":\n" + words), "Leadline", JOptionPane.ERROR_MESSAGE);
    }

    /** Wraps long lines for a dialog. */
    static String wrap(String s) {
        StringBuilder out = new StringBuilder();
        for (String line : s.split("\n", -1)) {
            int col = 0;
            for (String word : line.split(" ")) {
                if (col > 0 && col + word.length() > 90) {
                    out.append('\n');
                    col = 0;
                } else if (col > 0) {
                    out.append(' ');
                    col++;
                }
                out.append(word);
                col += word.length();
            }
            out.append('\n');
        }
        return out.toString().stripTrailing();
    }
}
