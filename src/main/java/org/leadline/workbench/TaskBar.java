package org.leadline.workbench;

import org.leadline.pipeline.Progress;

import javax.swing.BorderFactory;
import javax.swing.JButton;
import javax.swing.JLabel;
import javax.swing.JPanel;
import javax.swing.JProgressBar;
import javax.swing.SwingWorker;
import java.awt.BorderLayout;
import java.awt.FlowLayout;
import java.util.List;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.function.Consumer;

/**
 * The status bar: a message, and while long work runs off the event thread (a SwingWorker) its
 * stage, a progress bar and a Cancel button. Cancel sets the flag that the work's
 * {@link Progress#cancelled()} reports; a processing run then stops at its next stage.
 */
final class TaskBar extends JPanel {
    /** Long work: runs off the event thread. */
    interface Work<T> {
        T run(Progress progress) throws Exception;
    }

    private final JLabel message = new JLabel(" ");
    private final JLabel stage = new JLabel();
    private final JProgressBar bar = new JProgressBar(0, 1000);
    private final JButton cancel = new JButton("Cancel");
    private final AtomicBoolean cancelFlag = new AtomicBoolean();
    private final List<Runnable> busyListeners = new java.util.concurrent.CopyOnWriteArrayList<>();
    private SwingWorker<?, ?> running;

    TaskBar() {
        super(new BorderLayout(8, 0));
        setBorder(BorderFactory.createEmptyBorder(3, 8, 3, 8));
        add(message, BorderLayout.CENTER);
        JPanel right = new JPanel(new FlowLayout(FlowLayout.RIGHT, 6, 0));
        right.add(stage);
        bar.setPreferredSize(new java.awt.Dimension(220, bar.getPreferredSize().height));
        right.add(bar);
        right.add(cancel);
        add(right, BorderLayout.EAST);
        cancel.addActionListener(e -> {
            cancelFlag.set(true);
            stage.setText("Cancelling...");
            cancel.setEnabled(false);
        });
        showIdle();
    }

    void setMessage(String text) { message.setText(text == null || text.isEmpty() ? " " : text); }
    String message() { return message.getText(); }
    boolean busy() { return running != null; }
    void onBusyChange(Runnable r) { busyListeners.add(r); }

    /**
     * Runs work in the background; on the event thread afterwards calls done with the result, or
     * shows the error in words (nothing for a cancellation).
     */
    <T> void run(String title, Work<T> work, Consumer<T> done) {
        if (running != null) throw new IllegalStateException("a task is already running");
        cancelFlag.set(false);
        stage.setText(title);
        bar.setIndeterminate(true);
        bar.setVisible(true);
        stage.setVisible(true);
        cancel.setVisible(true);
        cancel.setEnabled(true);
        Progress progress = new Progress() {
            @Override public void stage(String name) { javax.swing.SwingUtilities.invokeLater(() -> showStage(name)); }
            @Override public void fraction(double f) { javax.swing.SwingUtilities.invokeLater(() -> showFraction(f)); }
            @Override public boolean cancelled() { return cancelFlag.get(); }
        };
        SwingWorker<T, Void> w = new SwingWorker<>() {
            @Override
            protected T doInBackground() throws Exception {
                T r = work.run(progress);
                if (cancelFlag.get()) throw new Progress.Cancelled();
                return r;
            }

            @Override
            protected void done() {
                running = null;
                showIdle();
                fireBusy();
                T r;
                try {
                    r = get();
                } catch (Exception ex) {
                    String words = Errors.describe(ex);
                    setMessage(words == null ? title + ": cancelled" : title + " failed");
                    Errors.show(TaskBar.this, title, ex);
                    return;
                }
                done.accept(r);
            }
        };
        running = w;
        fireBusy();
        w.execute();
    }

    private void showStage(String name) {
        if (running == null) return;
        stage.setText(name);
        bar.setIndeterminate(true);
    }

    private void showFraction(double f) {
        if (running == null) return;
        bar.setIndeterminate(false);
        bar.setValue((int) Math.round(1000 * Math.max(0, Math.min(1, f))));
    }

    private void showIdle() {
        bar.setVisible(false);
        stage.setVisible(false);
        cancel.setVisible(false);
    }

    private void fireBusy() { for (Runnable r : busyListeners) r.run(); }
}
