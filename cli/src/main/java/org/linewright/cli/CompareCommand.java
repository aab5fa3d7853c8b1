package org.linewright.cli;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.linewright.cli.impact.TableImpact;
import org.linewright.cli.impact.TableImpactWriter;
import org.linewright.cli.units.QuantityConverters;
import org.linewright.cli.units.Wavenumber;
import org.linewright.grid.plan.PlanReader;
import org.linewright.grid.plan.TablePlan;
import org.linewright.ingest.InputException;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.reference.compare.CompareOptions;
import org.linewright.reference.compare.ComparisonReport;
import org.linewright.reference.compare.LineListComparer;
import org.linewright.reference.input.LineListInput;
import org.linewright.reference.report.ComparisonReportWriter;
import org.linewright.reference.report.ReportFiles;
import org.linewright.reference.report.ReportFormat;

import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code linewright compare}: the lines added, removed and changed between two line lists. */
@Command(name = "compare",
        mixinStandardHelpOptions = true,
        description = {
            "Compare two line lists and report the lines added, removed and changed, each changed field with the "
                    + "size of its change, summarised per band (species and vibrational labels). Lines are paired by "
                    + "species and quantum labels, else by nearest position within --pair-within.",
            "OLD and NEW are line stores or line-list files (read into temporary stores). Exit code 0 when the lists "
                    + "hold the same lines, 1 when they differ.",
            ""
        },
        footer = {
            "",
            "Example:",
            "  linewright compare stores/co-2016 stores/co-2020 --report co-changes.csv --format csv",
            "  linewright compare old.par new.par --max-shift 0.1cm-1",
            "  linewright compare stores/co-2016 stores/co-2020 --plan plans/co-h2he.toml"
        })
public final class CompareCommand implements Callable<Integer> {
    @Spec
    private CommandSpec spec;

    @ParentCommand
    private LinewrightCommand root;

    @Parameters(index = "0", paramLabel = "OLD", description = "The old line store or line-list file.")
    private Path oldList;

    @Parameters(index = "1", paramLabel = "NEW", description = "The new line store or line-list file.")
    private Path newList;

    @Option(names = "--report", paramLabel = "FILE", description = "Write the report to FILE (default: standard output).")
    private Path reportFile;

    @Option(names = "--report-format", paramLabel = "FORMAT", defaultValue = "text",
            description = "Report format: text, csv or json (default: ${DEFAULT-VALUE}).")
    private String format;

    /** Set by the deprecated spelling; applied after parsing, when picocli has filled in defaults. */
    private String formatDeprecated;

    /** Deprecated spelling of --report-format, read for one version. */
    @Option(names = "--format", hidden = true, paramLabel = "FORMAT")
    private void deprecatedReportFormat(String value) {
        DeprecatedSpelling.note(spec, "--format", "--report-format");
        formatDeprecated = value;
    }

    @Option(names = "--max-shift", paramLabel = "WIDTH", converter = QuantityConverters.WavenumberInterval.class,
            description = "Largest shift of a line whose labels are unchanged (default: 0.5 cm-1).")
    private Wavenumber window;

    @Option(names = "--pair-within", paramLabel = "WIDTH", converter = QuantityConverters.WavenumberInterval.class,
            description = "Lines whose labels changed are paired with the nearest line within this (default: 0.001 cm-1).")
    private Wavenumber tolerance;

    /** Deprecated spelling of --max-shift, read for one version. */
    @Option(names = "--window", hidden = true, paramLabel = "WIDTH", converter = QuantityConverters.WavenumberInterval.class)
    private void deprecatedWindow(Wavenumber value) {
        DeprecatedSpelling.note(spec, "--window", "--max-shift");
        window = value;
    }

    /** Deprecated spelling of --pair-within, read for one version. */
    @Option(names = "--tolerance", hidden = true, paramLabel = "WIDTH", converter = QuantityConverters.WavenumberInterval.class)
    private void deprecatedTolerance(Wavenumber value) {
        DeprecatedSpelling.note(spec, "--tolerance", "--pair-within");
        tolerance = value;
    }

    @Option(names = "--max-listed", paramLabel = "N", defaultValue = "100000",
            description = "Changes listed one by one in the report; all are counted (default: ${DEFAULT-VALUE}).")
    private int maxListed;

    @Option(names = "--plan", paramLabel = "PLAN.toml",
            description = "Also report which (p, T, wavenumber-block) cells of this plan's table the changes reach and "
                    + "the largest change of the cross section in each (the plan's sources are not read).")
    private Path plan;

    @Option(names = "--threads", paramLabel = "N",
            description = "Threads for the cross sections of --plan (default: the processors; same results for any count).")
    private Integer threads;

    @Mixin
    private SpeciesDataOptions speciesData;

    @Override
    public Integer call() throws Exception {
        if (formatDeprecated != null) {
            format = formatDeprecated;
        }
        ReportFormat reportFormat = ReportFormat.byId(format);
        double windowCm1 = window == null ? CompareOptions.DEFAULT_MATCH_WINDOW_CM1 : window.cm1();
        double toleranceCm1 = tolerance == null ? CompareOptions.DEFAULT_NEAREST_TOLERANCE_CM1 : tolerance.cm1();
        if (!(windowCm1 > 0)) {
            throw new InputException("--max-shift: " + windowCm1 + " cm-1 (expected a positive width)");
        }
        if (!(toleranceCm1 >= 0)) {
            throw new InputException("--pair-within: " + toleranceCm1 + " cm-1 (expected a width >= 0)");
        }
        if (maxListed < 0) {
            throw new InputException("--max-listed: " + maxListed + " (expected a whole number >= 0)");
        }
        if (threads != null && threads < 1) {
            throw new InputException("--threads: " + threads + " (expected a positive number)");
        }
        TablePlan tablePlan = plan == null ? null : PlanReader.read(plan);
        // the plan's cells follow from every change, so with --plan every change is kept
        CompareOptions options = new CompareOptions(windowCm1, toleranceCm1, plan == null ? maxListed : Integer.MAX_VALUE);
        MoleculeRegistry registry = speciesData.registry();
        ComparisonReport report;
        List<TableImpact.Cell> cells = null;
        try (LineListInput older = LineListInput.open(oldList, registry);
             LineListInput newer = LineListInput.open(newList, registry)) {
            report = new LineListComparer(options).compare(older.store(), oldList.toString(), newer.store(),
                    newList.toString());
            if (tablePlan != null) {
                cells = TableImpact.assess(tablePlan, older.store(), newer.store(), report,
                        threads == null ? Runtime.getRuntime().availableProcessors() : threads);
            }
        }
        PrintWriter out = spec.commandLine().getOut();
        List<TableImpact.Cell> planCells = cells;
        ReportFiles.Content content = w -> {
            if (planCells == null) {
                ComparisonReportWriter.write(report, reportFormat, w);
            } else {
                StringWriter comparison = new StringWriter();
                ComparisonReportWriter.write(report, reportFormat, comparison);
                TableImpactWriter.write(comparison.toString(), plan, planCells, reportFormat, w);
            }
        };
        if (reportFile == null) {
            content.writeTo(out);
        } else {
            ReportFiles.write(reportFile, content);
            if (!root.globalOptions().quiet()) {
                out.printf(Locale.ROOT, "%s -> %s: %d unchanged, %d changed, %d added, %d removed; report %s%n",
                        oldList, newList, report.unchanged(), report.changed(), report.added(), report.removed(),
                        reportFile);
            }
        }
        out.flush();
        return report.identical() ? ExitCodes.OK : ExitCodes.CHECK_FOUND_PROBLEMS;
    }
}
