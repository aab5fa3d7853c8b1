package org.linewright.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.linewright.cli.progress.Progress;
import org.linewright.cli.table.TablePlot;
import org.linewright.grid.ktable.KTableBuilder;
import org.linewright.grid.ktable.KTablePlanSection;
import org.linewright.grid.plan.PlanReader;
import org.linewright.grid.plan.TablePlan;
import org.linewright.grid.table.BuildListener;
import org.linewright.grid.table.BuildReport;
import org.linewright.grid.table.CalculatorBlocks;
import org.linewright.grid.table.CrossSectionTable;
import org.linewright.grid.table.TableBuilder;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Spec;

/** {@code linewright build}: a plan's (p, T) cross-section table, computing only what changed. */
@Command(name = "build",
        mixinStandardHelpOptions = true,
        description = {
            "Build the cross-section table a plan describes (TOML; see docs/table-format.md): raw line lists are "
                    + "ingested into a cache beside the plan, the grid is computed block by block for every "
                    + "(pressure, temperature), and the table is written as Arrow IPC (.arrow) or HDF5 (.h5) with a "
                    + "TABLE.sha256 checksum beside it.",
            "Blocks are kept in TABLE.work/: after a line list or parameter changes, only the blocks it reaches are "
                    + "computed again, and an interrupted build resumes where it stopped.",
            ""
        },
        footer = {
            "",
            "Example:",
            "  linewright build plans/co-h2he.toml --threads 2 --plot co-h2he.png",
            "  linewright build plans/co-h2he.toml --dry-run"
        })
public final class BuildCommand implements Callable<Integer> {
    /** How many pending cells a dry run lists before summarising the rest. */
    private static final int DRY_RUN_LISTED = 20;
    /** How many distinct calculator warnings the summary prints. */
    private static final int WARNINGS_SHOWN = 3;

    @Spec
    private CommandSpec spec;

    @ParentCommand
    private LinewrightCommand root;

    @Parameters(index = "0", paramLabel = "PLAN", description = "The table plan (TOML).")
    private Path planFile;

    @Option(names = "--dry-run", description = "Say how many blocks would be computed and reused (and which), then stop.")
    private boolean dryRun;

    @Option(names = "--threads", paramLabel = "N",
            description = "Threads for the engine (default: the number of processors); results are the same for any number.")
    private Integer threads;

    @Option(names = "--spark", paramLabel = "MASTER",
            description = "Compute the cells as Apache Spark tasks: local[N] (embedded, N task threads), "
                    + "spark://HOST:PORT, yarn or k8s://URL (see docs/spark.md). Same table bits as a local build.")
    private String sparkMaster;

    @Option(names = "--plot", paramLabel = "FILE.png",
            description = "Also plot σ at every pressure and temperature of the table, one curve each.")
    private Path plot;

    @Option(names = "--plot-wavelength", description = "Draw the plot against wavelength (µm) instead of wavenumber.")
    private boolean plotWavelength;

    @Override
    public Integer call() throws Exception {
        int threadCount = threads == null ? Runtime.getRuntime().availableProcessors() : threads;
        if (threadCount < 1) {
            throw new picocli.CommandLine.ParameterException(spec.commandLine(),
                    "--threads: " + threadCount + " (expected a positive number)");
        }
        boolean quiet = root.globalOptions().quiet();
        PrintWriter out = spec.commandLine().getOut();
        TablePlan plan = PlanReader.read(planFile);
        Optional<KTablePlanSection.Planned> ktable = KTablePlanSection.read(planFile); // checked before the build
        BuildReport report;
        if (sparkMaster != null && !dryRun) {
            report = SparkRunner.build(spec, plan, sparkMaster, quiet);
        } else try (Progress progress = Progress.start("build", -1, "points", 1, quiet || dryRun)) {
            report = TableBuilder.build(plan, CalculatorBlocks.factory(), threadCount, dryRun, new BuildListener() {
                @Override
                public void sourceStarted(Path source, long fileBytes) {
                    progress.message("ingest " + source.getFileName());
                }

                @Override
                public void planned(int cells, int toCompute, long pointsToCompute) {
                    progress.maxHint(pointsToCompute);
                    progress.message(toCompute + " of " + cells + " blocks to compute");
                }

                @Override
                public void computed(int pressureIndex, int temperatureIndex, int block, int points) {
                    progress.stepBy(points);
                }

                @Override
                public void writing() {
                    progress.message("writing " + plan.outputTable().getFileName());
                }
            });
        }
        if (dryRun) {
            out.printf(Locale.ROOT, "dry run: %d of %d blocks would be computed, %d reused (%s)%n", report.computed(),
                    report.cells(), report.reused(), plan.outputTable());
            int shown = 0;
            for (String cell : report.pending()) {
                if (shown++ == DRY_RUN_LISTED) {
                    out.printf(Locale.ROOT, "  ... and %d more%n", report.pending().size() - DRY_RUN_LISTED);
                    break;
                }
                out.println("  compute " + cell);
            }
            printIncremental(out, report.incremental(), "would be");
            return ExitCodes.OK;
        }
        KTableBuilder.Report ktableReport = ktable.isEmpty() ? null
                : KTableBuilder.build(report.table(), ktable.get().request(), threadCount, ktable.get().out());
        if (plot != null) {
            TablePlot.write(CrossSectionTable.open(report.table()), plot, plan.outputTable().getFileName().toString(),
                    plotWavelength);
        }
        if (!quiet) {
            out.printf(Locale.ROOT, "blocks: %d computed, %d reused (of %d); %d raw line list(s) ingested%n",
                    report.computed(), report.reused(), report.cells(), report.ingested());
            printIncremental(out, report.incremental(), "were");
            out.printf(Locale.ROOT, "lines: %d in the stores, %d used (summed over blocks)%n", report.linesInStores(),
                    report.linesUsed());
            for (Map.Entry<String, Long> e : report.counts().entrySet()) {
                out.printf(Locale.ROOT, "  %s: %d%n", e.getKey(), e.getValue());
            }
            out.printf(Locale.ROOT, "engine %s, worst estimated relative error of the cells %.3g (criterion: relative error where sigma >= 1e-6 max sigma; per cell in the table metadata); %.2f s%n", plan.profile().engine(),
                    report.estimatedRelativeError(), report.seconds());
            int shownWarnings = 0;
            for (String w : report.warnings()) {
                if (shownWarnings++ == WARNINGS_SHOWN) {
                    out.printf(Locale.ROOT, "  ... and %d more warning(s) in the table metadata (warning.N)%n",
                            report.warnings().size() - WARNINGS_SHOWN);
                    break;
                }
                out.println("warning: " + w);
            }
            out.printf(Locale.ROOT, "table %s (sha256 %s)%n", report.table(), report.written().fileSha256());
            if (plot != null) {
                out.printf(Locale.ROOT, "plot %s%n", plot);
            }
            if (ktableReport != null) {
                for (String w : ktableReport.warnings()) {
                    out.println("warning: " + w);
                }
                out.printf(Locale.ROOT, "ktable %s (%d bins x %d g points; sha256 %s)%n", ktableReport.written().file(),
                        ktableReport.content().bins(), ktableReport.content().gPoints(),
                        ktableReport.written().fileSha256());
            }
        }
        return ExitCodes.OK;
    }

    /** The rebuild's line changes and how the computed blocks were (or would be) obtained. */
    private static void printIncremental(java.io.PrintWriter out, BuildReport.Incremental inc, String verb) {
        if (inc.mode().isEmpty()) {
            return;
        }
        if (inc.cellsUpdated() > 0) {
            out.printf(Locale.ROOT, "changed lines: %d removed, %d added; %d block(s) %s updated from them, %d "
                    + "computed afresh; estimated cost %.3g of a full build (profile evaluations)%n",
                    inc.linesRemoved(), inc.linesAdded(), inc.cellsUpdated(), verb, inc.cellsRecomputed(),
                    inc.relativeCost());
        } else if (inc.cellsRecomputed() > 0) {
            out.printf(Locale.ROOT, "%d block(s) %s computed afresh (%s); estimated cost %.3g of a full build%n",
                    inc.cellsRecomputed(), verb, inc.mode(), inc.relativeCost());
        }
    }
}
