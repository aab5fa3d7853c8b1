package org.linewright.spark;

import java.io.PrintStream;
import java.util.Locale;
import org.apache.spark.scheduler.SparkListener;
import org.apache.spark.scheduler.SparkListenerTaskEnd;

/**
 * Progress of a Spark build on stderr, from Spark's task events: cells done of total, rate, time left at that
 * rate, and tasks that failed and were tried again. At most one line a second, and a last line at the end.
 */
final class SparkProgress extends SparkListener {
    private static final long INTERVAL_NS = 1_000_000_000L;
    private final PrintStream out;
    private volatile boolean active;
    private int total;
    private int done;
    private int failed;
    private long startNs;
    private long lastNs;
    private final java.util.List<Double> taskSeconds = new java.util.ArrayList<>();

    SparkProgress(PrintStream out) {
        this.out = out;
    }

    synchronized void begin(int cells) {
        total = cells;
        done = 0;
        failed = 0;
        taskSeconds.clear();
        startNs = System.nanoTime();
        lastNs = startNs;
        active = true;
    }

    synchronized void end() {
        if (active) {
            print();
        }
        active = false;
    }

    /** Run times of the successful cell tasks of the last build (executor run time), s. */
    synchronized java.util.List<Double> taskSeconds() {
        return java.util.List.copyOf(taskSeconds);
    }

    synchronized int failedTasks() {
        return failed;
    }

    @Override
    public void onTaskEnd(SparkListenerTaskEnd end) {
        if (!active) {
            return;
        }
        synchronized (this) {
            if (end.taskInfo().successful()) {
                done++;
                if (end.taskMetrics() != null) {
                    taskSeconds.add(end.taskMetrics().executorRunTime() * 1e-3);
                }
            } else {
                failed++;
            }
            long now = System.nanoTime();
            if (now - lastNs >= INTERVAL_NS) {
                lastNs = now;
                print();
            }
        }
    }

    private void print() {
        if (out == null) {
            return;
        }
        double s = (System.nanoTime() - startNs) * 1e-9;
        double rate = s > 0 ? done / s : 0;
        String eta = rate > 0 ? String.format(Locale.ROOT, "%.0f s", (total - done) / rate) : "unknown";
        out.printf(Locale.ROOT, "spark: cells %d/%d, %.2f cells/s, ETA %s, %d failed task(s) retried%n", done, total,
                rate, eta, failed);
    }
}
