package org.linewright.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.linewright.cli.plot.VerificationPlot;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.reference.data.ReferenceLine;
import org.linewright.reference.data.ReferenceLines;
import org.linewright.reference.input.LineListInput;
import org.linewright.reference.report.ReportFiles;
import org.linewright.reference.report.ReportFormat;
import org.linewright.reference.report.VerificationReportWriter;
import org.linewright.reference.verify.LineListVerifier;
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
            "LIST is a line store or a line-list file (read into a temporary store). Findings are errors, warnings "
                    + "or notes; the intensity check calibrates itself from the list's own spread and printed digits "
                    + "(docs/reference-lines.md). Exit code 1 only when an error is found.",
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

    @Option(names = "--plot", paramLabel = "FILE.png",
            description = "Draw the residuals of the intensity/Einstein-A relation and of the reference positions.")
    private Path plot;

    @Option(names = "--strict",
            description = "Fixed tolerances (|S/S(A) - 1| <= 1.5e-3 per line, registry within 5e-3) and every warning "
                    + "counts as an error.")
    private boolean strict;

    @Mixin
    private SpeciesDataOptions speciesData;

    @Override
    public Integer call() throws Exception {
        if (formatDeprecated != null) {
            format = formatDeprecated;
        }
        ReportFormat reportFormat = ReportFormat.byId(format);
        List<ReferenceLine> references = new ArrayList<>(ReferenceLines.builtIn());
        for (Path file : referenceFiles) {
            references.addAll(ReferenceLines.read(file));
        }
        MoleculeRegistry registry = speciesData.registry();
        VerificationReport report;
        try (LineListInput input = LineListInput.open(list, registry)) {
            report = new LineListVerifier(registry, references, VerifyOptions.defaults().withStrict(strict))
                    .verify(input.store(), list.toString());
        }
        PrintWriter out = spec.commandLine().getOut();
        if (reportFile == null) {
            VerificationReportWriter.write(report, reportFormat, out);
        } else {
            ReportFiles.write(reportFile, w -> VerificationReportWriter.write(report, reportFormat, w));
        }
        if (plot != null) {
            VerificationPlot.write(report, plot);
        }
        if (!root.globalOptions().quiet() && reportFile != null) {
            out.printf(Locale.ROOT, "%s: %d lines, %s; report %s%n", list, report.lines(),
                    (report.passed() ? "passed" : "failed") + " (" + report.severitySummary() + ")", reportFile);
        }
        out.flush();
        return report.passed() ? ExitCodes.OK : ExitCodes.CHECK_FOUND_PROBLEMS;
    }
}
