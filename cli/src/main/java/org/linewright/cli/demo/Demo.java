package org.linewright.cli.demo;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;

/**
 * The demo: runs a list of {@link DemoStep}s in order on the shipped synthetic data, times each, and writes
 * {@code report.txt} and {@code report.html} into the output folder.
 *
 * <p>{@link #availableSteps()} lists the steps this build runs, in order: stage the shipped synthetic data,
 * ingest it into a line store, verify the store, draw the stick spectrum (and, with the table builder, build and plot the plan's
 * table).
 */
public final class Demo {
    private final Path demoDir;
    private final Path outDir;
    private final List<DemoStep> steps;
    private final boolean quiet;

    /**
     * @param demoDir the shipped demo folder ({@code plan.toml}, {@code data/})
     * @param outDir  the output folder, created when missing
     * @param steps   the steps, run in this order
     * @param quiet   the {@code --quiet} option
     */
    public Demo(Path demoDir, Path outDir, List<DemoStep> steps, boolean quiet) {
        this.demoDir = demoDir;
        this.outDir = outDir.toAbsolutePath().normalize();
        this.steps = List.copyOf(steps);
        this.quiet = quiet;
    }

    /** The steps this build runs: stage the data, ingest the lines, verify them, draw the stick spectrum, build the table. */
    public static List<DemoStep> availableSteps() {
        return List.of(new StageDataStep(), new IngestStep(), new VerifyStep(), new StickSpectrumStep(),
                new TableStep());
    }

    /**
     * Runs every step, then writes the reports.
     *
     * @param listener told when each step starts and ends (e.g. to print a line per step)
     * @return what was done
     */
    public DemoReport run(StepListener listener) throws IOException {
        Files.createDirectories(outDir);
        DemoContext context = new DemoContext(demoDir, outDir, quiet);
        Instant started = Instant.now();
        long t0 = System.nanoTime();
        List<DemoReport.StepRecord> records = new ArrayList<>();
        for (DemoStep step : steps) {
            listener.started(step);
            long s0 = System.nanoTime();
            StepOutcome outcome = step.run(context);
            Duration took = Duration.ofNanos(System.nanoTime() - s0);
            DemoReport.StepRecord record = new DemoReport.StepRecord(step.name(), took, outcome.details(),
                    outcome.files());
            records.add(record);
            listener.finished(record);
        }
        Duration total = Duration.ofNanos(System.nanoTime() - t0);
        DemoReport report = new DemoReport(started, outDir, records, total, context.plan());
        report.write();
        return report;
    }

    /** Told when a step starts and ends. */
    public interface StepListener {
        /** A listener that ignores everything. */
        StepListener NONE = new StepListener() {
            @Override
            public void started(DemoStep step) {
            }

            @Override
            public void finished(DemoReport.StepRecord record) {
            }
        };

        void started(DemoStep step);

        void finished(DemoReport.StepRecord record);
    }
}
