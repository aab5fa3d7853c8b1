package org.linewright.cli.progress;

import java.io.PrintStream;
import java.time.temporal.ChronoUnit;
import me.tongfei.progressbar.ConsoleProgressBarConsumer;
import me.tongfei.progressbar.ProgressBar;
import me.tongfei.progressbar.ProgressBarBuilder;
import me.tongfei.progressbar.ProgressBarStyle;

/**
 * Progress of a long task on stderr — fraction done, rate and estimated time left — drawn by the
 * {@code me.tongfei:progressbar} library. Silent (every call a no-op) when {@code --quiet} was given or when
 * stderr is not an interactive terminal ({@code System.console() == null}: redirected to a file, a pipe or a
 * CI log), so logs stay free of redraw sequences. Thread-safe: the library updates the bar on its own thread.
 *
 * <pre>{@code
 * try (Progress p = Progress.start("reading lines", totalBytes, "MB", 1_000_000, quiet)) {
 *     ... p.stepBy(bytesRead);
 * }
 * }</pre>
 */
public final class Progress implements AutoCloseable {
    /** Redraw interval, ms: often enough to look alive, rare enough to cost nothing. */
    private static final int UPDATE_INTERVAL_MS = 250;

    private final ProgressBar bar;

    private Progress(ProgressBar bar) {
        this.bar = bar;
    }

    /**
     * A progress bar on stderr, or a silent one when {@code quiet} or when stderr is not a terminal.
     *
     * @param task      what is being done, e.g. {@code reading lines}
     * @param total     total amount of work, in the units counted by {@link #stepBy(long)}; −1 when unknown
     * @param unitName  the shown unit, e.g. {@code MB} or {@code lines}
     * @param unitSize  how many counted units make one shown unit (e.g. 1 000 000 bytes per MB)
     * @param quiet     the {@code --quiet} option
     */
    public static Progress start(String task, long total, String unitName, long unitSize, boolean quiet) {
        if (quiet || System.console() == null) {
            return silent();
        }
        return toStream(System.err, task, total, unitName, unitSize);
    }

    /** A progress bar that draws nothing. */
    public static Progress silent() {
        return new Progress(null);
    }

    /** A progress bar drawn on the given stream whatever it is (for callers that decided already). */
    public static Progress toStream(PrintStream stream, String task, long total, String unitName, long unitSize) {
        ProgressBar bar = new ProgressBarBuilder()
                .setTaskName(task)
                .setInitialMax(total)
                .setUnit(" " + unitName, unitSize)
                .setStyle(ProgressBarStyle.ASCII)
                .setUpdateIntervalMillis(UPDATE_INTERVAL_MS)
                .showSpeed()
                .setSpeedUnit(ChronoUnit.SECONDS)
                .setConsumer(new ConsoleProgressBarConsumer(stream))
                .build();
        return new Progress(bar);
    }

    /** @return true when nothing is drawn */
    public boolean isSilent() {
        return bar == null;
    }

    /** Adds {@code n} units of work done. */
    public void stepBy(long n) {
        if (bar != null) {
            bar.stepBy(n);
        }
    }

    /** Sets the amount of work done. */
    public void stepTo(long n) {
        if (bar != null) {
            bar.stepTo(n);
        }
    }

    /** Replaces the total when it becomes known or changes. */
    public void maxHint(long total) {
        if (bar != null) {
            bar.maxHint(total);
        }
    }

    /** Short text shown after the bar, e.g. the current file. */
    public void message(String text) {
        if (bar != null) {
            bar.setExtraMessage(text);
        }
    }

    /** Draws the final state and stops redrawing. */
    @Override
    public void close() {
        if (bar != null) {
            bar.close();
        }
    }
}
