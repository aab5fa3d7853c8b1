package org.linewright.cli.demo;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.linewright.cli.plot.VerificationPlot;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.store.LineStore;
import org.linewright.reference.data.ReferenceLines;
import org.linewright.reference.report.ReportFiles;
import org.linewright.reference.report.ReportFormat;
import org.linewright.reference.report.VerificationReportWriter;
import org.linewright.reference.verify.Check;
import org.linewright.reference.verify.IsotopologueSummary;
import org.linewright.reference.verify.LineListVerifier;
import org.linewright.reference.verify.VerificationReport;
import org.linewright.reference.verify.VerifyOptions;

/**
 * Verifies the demo's line store as {@code linewright verify} does: intensities against Einstein A per
 * isotopologue, physical sanity, reference lines. Writes {@code verify-report.txt} and the residual plot
 * {@code plots/verify-residuals.png}.
 */
public final class VerifyStep implements DemoStep {
    /** The text report, inside the output folder. */
    public static final String REPORT_FILE = "verify-report.txt";
    /** The residual plot, inside the output folder. */
    public static final String PLOT_FILE = "plots/verify-residuals.png";

    @Override
    public String name() {
        return "verify the line store";
    }

    @Override
    public StepOutcome run(DemoContext context) throws IOException {
        LineStore store = LineStore.open(context.outDir().resolve(IngestStep.STORE_DIR));
        VerificationReport report = new LineListVerifier(MoleculeRegistry.builtIn(), ReferenceLines.builtIn(),
                VerifyOptions.defaults()).verify(store, IngestStep.STORE_DIR);
        Path reportFile = context.outDir().resolve(REPORT_FILE);
        ReportFiles.write(reportFile, w -> VerificationReportWriter.write(report, ReportFormat.TEXT, w));
        Path plot = context.outDir().resolve(PLOT_FILE);
        VerificationPlot.write(report, plot);
        List<String> details = new ArrayList<>();
        details.add(String.format(Locale.ROOT, "%d lines: %s (%s); internal consistency of S and A: robust spread %.1e",
                report.lines(), report.passed() ? "passed" : "failed", report.severitySummary(),
                report.consistency().robustSpread()));
        for (IsotopologueSummary s : report.isotopologues()) {
            details.add(String.format(Locale.ROOT, "%s %s: Q(296 K)/abundance from S and A %.6g, registry %.6g, "
                            + "largest line deviation %.1e", s.key(), s.name(), s.consensusQOverAbundance(),
                    s.registryQOverAbundance(), s.maxAbsDeviation()));
        }
        for (Check c : Check.values()) {
            if (report.count(c) > 0) {
                details.add(c.id() + ": " + report.count(c) + " finding(s)");
            }
        }
        return new StepOutcome(details, List.of(reportFile, plot));
    }
}
