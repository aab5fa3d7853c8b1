package org.linewright.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.linewright.cli.plot.PlotStyle;
import org.linewright.cli.plot.ResidualPlot;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.reference.data.ReferenceLine;
import org.linewright.reference.data.ReferenceLines;
import org.linewright.reference.input.LineListInput;
import org.linewright.reference.report.ReportFiles;
import org.linewright.reference.report.ReportFormat;
import org.linewright.reference.report.VerificationReportWriter;
import org.linewright.reference.verify.LineListVerifier;
import org.linewright.reference.verify.ReferenceMatch;
import org.linewright.reference.verify.VerificationReport;
import org.linewright.reference.verify.VerifyOptions;

import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Spec;
import picocli.CommandLine.Model.CommandSpec;

/** {@code linewright verify}: a line list checked against physics and reference lines. */
@Command(name = "verify",
        mixinStandardHelpOptions = true,
        description = {
            "Check a line list: per isotopologue, the intensity S against the Einstein A (the relation of "
                    + "Simeckova et al. 2006 at 296 K) with the Q(296 K)/abundance the lines imply and the registry's; "
                    + "negative or missing values, negative lower-state energies, non-positive statistical weights, "
                    + "duplicate lines, upper-state energies unlike E'' + wavenumber; and the positions of reference "
                    + "lines (built in, plus --reference files).",
            "LIST is a line store or a line-list file (read into a temporary store). Exit code 1 when a check fails.",
            ""
        },
        footer = {
            "",
            "Example:",
            "  linewright verify stores/planet-b --report verify.txt --plot verify.png",
            "  linewright verify lines.par --reference my-lines.tsv --format json"
        })
public final class VerifyCommand implements Callable<Integer> {
    @Spec
    private CommandSpec spec;

    @ParentCommand
    private LinewrightCommand root;

    @Parameters(index = "0", paramLabel = "LIST", description = "A line store (directory) or a line-list file.")
    private Path list;

    @Option(names = "--reference", paramLabel = "FILE",
            description = "Further reference lines in the reference-line format (docs/reference-lines.md). Repeatable.")
    private List<Path> referenceFiles = new ArrayList<>();

    @Option(names = "--report", paramLabel = "FILE", description = "Write the report to FILE (default: standard output).")
    private Path reportFile;

    @Option(names = "--format", paramLabel = "FORMAT", defaultValue = "text",
            description = "Report format: text, csv or json (default: ${DEFAULT-VALUE}).")
    private String format;

    @Option(names = "--plot", paramLabel = "FILE.png",
            description = "Draw the residuals of the intensity/Einstein-A relation and of the reference positions.")
    private Path plot;

    @Mixin
    private SpeciesDataOptions speciesData;

    @Override
    public Integer call() throws Exception {
        ReportFormat reportFormat = ReportFormat.byId(format);
        List<ReferenceLine> references = new ArrayList<>(ReferenceLines.builtIn());
        for (Path file : referenceFiles) {
            references.addAll(ReferenceLines.read(file));
        }
        MoleculeRegistry registry = speciesData.registry();
        VerificationReport report;
        try (LineListInput input = LineListInput.open(list, registry)) {
            report = new LineListVerifier(registry, references, VerifyOptions.defaults())
                    .verify(input.store(), list.toString());
        }
        PrintWriter out = spec.commandLine().getOut();
        if (reportFile == null) {
            VerificationReportWriter.write(report, reportFormat, out);
        } else {
            ReportFiles.write(reportFile, w -> VerificationReportWriter.write(report, reportFormat, w));
        }
        if (plot != null) {
            writePlot(report, plot);
        }
        if (!root.globalOptions().quiet() && reportFile != null) {
            out.printf(Locale.ROOT, "%s: %d lines, %s; report %s%n", list, report.lines(),
                    report.passed() ? "all checks passed" : report.totalFindings() + " finding(s)", reportFile);
        }
        out.flush();
        return report.passed() ? ExitCodes.OK : ExitCodes.CHECK_FOUND_PROBLEMS;
    }

    /** The residual plot: S/S(A) − 1 of every (thinned) line and offset/position of the reference lines found. */
    static void writePlot(VerificationReport report, Path png) throws IOException {
        List<ResidualPlot.Series> series = new ArrayList<>();
        if (report.relationResiduals().size() > 0) {
            series.add(new ResidualPlot.Series("lines: S/S(A) - 1", report.relationResiduals().x(),
                    report.relationResiduals().y()));
        }
        List<ReferenceMatch> found = report.references().stream().filter(m -> !Double.isNaN(m.offsetCm1())).toList();
        if (!found.isEmpty()) {
            double[] x = new double[found.size()];
            double[] y = new double[found.size()];
            for (int i = 0; i < x.length; i++) {
                x[i] = found.get(i).reference().wavenumberCm1();
                y[i] = found.get(i).relativeOffset();
            }
            series.add(new ResidualPlot.Series("reference lines: offset / position", x, y));
        }
        if (series.isEmpty()) {
            throw new org.linewright.ingest.InputException("--plot " + png
                    + ": nothing to plot (no line with S and A, no reference line found)");
        }
        ResidualPlot.write(png, PlotStyle.of("verify " + report.subject()), "wavenumber (cm-1)", "relative residual",
                series);
    }
}
