package org.linewright.reference.report;

import static org.linewright.reference.report.Cells.csv;
import static org.linewright.reference.report.Cells.csvNumber;
import static org.linewright.reference.report.Cells.json;
import static org.linewright.reference.report.Cells.jsonNumber;

import java.io.IOException;
import java.io.Writer;
import java.util.Locale;
import java.util.Map;

import org.linewright.reference.data.ReferenceLine;
import org.linewright.reference.verify.Check;
import org.linewright.reference.verify.Consistency;
import org.linewright.reference.verify.Finding;
import org.linewright.reference.verify.IsotopologueSummary;
import org.linewright.reference.verify.ReferenceMatch;
import org.linewright.reference.verify.Severity;
import org.linewright.reference.verify.VerificationReport;
import org.linewright.reference.verify.VerifyOptions;

/**
 * Writes a {@link VerificationReport} as text (for people), CSV (one table, one row per summary, isotopologue,
 * reference line and finding, told apart by the {@code record} column) or JSON (one object).
 */
public final class VerificationReportWriter {
    /** Header of the CSV form. */
    public static final String CSV_HEADER =
            "record,check,molecule,isotopologue,wavenumber_cm1,source_line,field,value,expected,message,severity";

    private VerificationReportWriter() {
    }

    /** Writes the report in the given format. */
    public static void write(VerificationReport report, ReportFormat format, Writer out) throws IOException {
        switch (format) {
            case TEXT -> text(report, out);
            case CSV -> csvForm(report, out);
            case JSON -> jsonForm(report, out);
            default -> throw new IllegalArgumentException(format.toString());
        }
        out.flush();
    }

    private static void text(VerificationReport r, Writer out) throws IOException {
        StringBuilder b = new StringBuilder();
        line(b, "linewright verify: %s", r.subject());
        line(b, "sources: %s (line numbers below are record numbers in the source files)", String.join(", ", r.sources()));
        line(b, "lines checked: %d", r.lines());
        line(b, "result: %s (%s)%s", r.passed() ? "PASSED" : "FAILED", r.severitySummary(),
                r.options().strict() ? " [strict: fixed tolerances, warnings count as errors]" : "");
        Consistency c = r.consistency();
        if (!Double.isNaN(c.robustSpread())) {
            line(b, "internal consistency of S and A: robust spread of S/S(A) - 1 %.2e; 99%% of lines within %.2e; "
                    + "%.1f%% of lines within the rounding of their printed digits", c.robustSpread(), c.deviation99(),
                    100 * c.withinDigitsFraction());
        }
        line(b, "");
        line(b, "Intensity / Einstein-A relation at 296 K (Simeckova et al. 2006), with each isotopologue's consensus");
        if (r.options().strict()) {
            line(b, "(median) Q(296 K)/abundance: per line |S/S(A) - 1| <= %s; consensus vs registry within %s (strict)",
                    r.options().relationTolerance(), r.options().registryTolerance());
        } else {
            line(b, "(median) Q(296 K)/abundance: a line is an error beyond %s, a warning when it stands out from its",
                    VerifyOptions.GROSS_LINE_DEVIATION);
            line(b, "isotopologue (limit: the larger of %s robust spreads, %s and its printed digits' rounding); consensus",
                    VerifyOptions.OUTLIER_SPREADS, VerifyOptions.RELATION_FLOOR);
            line(b, "vs registry: a warning beyond the allowance (registry accuracy %s + rounding), an error beyond %s",
                    VerifyOptions.REGISTRY_ACCURACY, VerifyOptions.GROSS_REGISTRY_DEVIATION);
        }
        line(b, "  %-6s %-20s %7s %7s %5s %5s %6s %9s %9s %13s %13s %10s %9s", "iso", "species", "lines", "checked",
                "warn", "error", "digits", "spread", "limit", "Q/Ia lines", "Q/Ia registry", "deviation", "allowance");
        for (IsotopologueSummary s : r.isotopologues()) {
            line(b, "  %-6s %-20s %7d %7d %5d %5d %6s %9.2e %9.2e %13.6g %13.6g %10.2e %9.2e", s.key(), s.name(),
                    s.lines(), s.relationChecked(), s.relationWarnings(), s.relationErrors(),
                    s.intensityDigits() + "/" + s.einsteinADigits(), s.robustSpread(), s.outlierLimit(),
                    s.consensusQOverAbundance(), s.registryQOverAbundance(), s.registryDeviation(),
                    s.registryAllowance());
        }
        line(b, "  (digits: significant digits of S/A the records carry; spread: 1.4826 x median |S/S(A) - 1|; limit: "
                + "where a line starts to stand out, unless its own printed-digit bound is larger)");
        line(b, "");
        line(b, "Reference lines (positions in cm-1)");
        line(b, "  %-22s %-6s %-17s %14s %14s %11s %10s  %s", "line", "iso", "status", "reference", "listed", "offset",
                "tolerance", "source");
        for (ReferenceMatch m : r.references()) {
            ReferenceLine ref = m.reference();
            line(b, "  %-22s %-6s %-17s %14.6f %14s %11s %10.2e  %s", ref.label(), ref.isotopologueKey(),
                    m.status().name().toLowerCase(Locale.ROOT).replace('_', '-'), ref.wavenumberCm1(),
                    Double.isNaN(m.wavenumberCm1()) ? "-" : String.format(Locale.ROOT, "%.6f", m.wavenumberCm1()),
                    Double.isNaN(m.offsetCm1()) ? "-" : String.format(Locale.ROOT, "%.2e", m.offsetCm1()),
                    ref.toleranceCm1(), ref.source());
        }
        line(b, "");
        line(b, "Checks");
        for (Map.Entry<Check, Long> e : r.findingCounts().entrySet()) {
            line(b, "  %-20s %s", e.getKey().id(), e.getValue() == 0 ? "ok" : e.getValue() + " finding(s)");
        }
        if (!r.findings().isEmpty()) {
            line(b, "");
            line(b, "Findings (%s)%s", r.severitySummary(), r.findingsNotListed() > 0 ? "; "
                    + r.findingsNotListed() + " not listed (at most " + r.options().maxListedFindings()
                    + " of each severity)" : "");
            for (Finding f : r.findings()) {
                line(b, "  %-7s %-18s %-6s %14s  line %-8d %s", f.severity().id(), f.check().id(),
                        f.moleculeId() + "/" + f.isotopologue(),
                        Double.isNaN(f.wavenumberCm1()) ? "-" : String.format(Locale.ROOT, "%.6f", f.wavenumberCm1()),
                        f.sourceLine(), f.message());
            }
        }
        out.write(b.toString());
    }

    private static void csvForm(VerificationReport r, Writer out) throws IOException {
        StringBuilder b = new StringBuilder(CSV_HEADER).append('\n');
        b.append(String.join(",", "summary", r.passed() ? "passed" : "failed", "", "", "", "", "lines",
                Long.toString(r.lines()), "", csv(r.subject()), "")).append('\n');
        b.append(String.join(",", "summary", "consistency", "", "", "", "", "robust_spread",
                csvNumber(r.consistency().robustSpread()), "", csv(String.format(Locale.ROOT,
                        "99%% of lines within %s; fraction within printed digits %s", r.consistency().deviation99(),
                        r.consistency().withinDigitsFraction())), "")).append('\n');
        for (Map.Entry<Severity, Long> e : r.severityCounts().entrySet()) {
            b.append(String.join(",", "severity", e.getKey().id(), "", "", "", "", "findings", e.getValue().toString(),
                    "", "", "")).append('\n');
        }
        for (Map.Entry<Check, Long> e : r.findingCounts().entrySet()) {
            b.append(String.join(",", "check", e.getKey().id(), "", "", "", "", "findings", e.getValue().toString(), "",
                    "", "")).append('\n');
        }
        for (IsotopologueSummary s : r.isotopologues()) {
            b.append(String.join(",", "isotopologue", "intensity-relation", Integer.toString(s.moleculeId()),
                    Integer.toString(s.isotopologue()), csvNumber(s.maxDeviationWavenumberCm1()), "",
                    "q296_over_abundance", csvNumber(s.consensusQOverAbundance()), csvNumber(s.registryQOverAbundance()),
                    csv(String.format(Locale.ROOT, "%s: %d lines, %d checked, %d warnings, %d errors, max |S/S(A)-1| %s, "
                                    + "robust spread %s, digits S/A %d/%d, registry allowance %s", s.name(), s.lines(),
                            s.relationChecked(), s.relationWarnings(), s.relationErrors(), s.maxAbsDeviation(),
                            s.robustSpread(), s.intensityDigits(), s.einsteinADigits(), s.registryAllowance())), ""))
                    .append('\n');
        }
        for (ReferenceMatch m : r.references()) {
            ReferenceLine ref = m.reference();
            b.append(String.join(",", "reference", m.status().name().toLowerCase(Locale.ROOT).replace('_', '-'),
                    Integer.toString(ref.moleculeId()), Integer.toString(ref.isotopologue()),
                    csvNumber(m.wavenumberCm1()), m.sourceLine() == 0 ? "" : Long.toString(m.sourceLine()),
                    csv(ref.label()), csvNumber(m.wavenumberCm1()), csvNumber(ref.wavenumberCm1()),
                    csv("tolerance " + ref.toleranceCm1() + " cm-1; " + ref.source()), "")).append('\n');
        }
        for (Finding f : r.findings()) {
            b.append(String.join(",", "finding", f.check().id(), Integer.toString(f.moleculeId()),
                    Integer.toString(f.isotopologue()), csvNumber(f.wavenumberCm1()),
                    f.sourceLine() == 0 ? "" : Long.toString(f.sourceLine()), csv(f.field()), csvNumber(f.value()),
                    csvNumber(f.expected()), csv(f.message()), f.severity().id())).append('\n');
        }
        out.write(b.toString());
    }

    private static void jsonForm(VerificationReport r, Writer out) throws IOException {
        StringBuilder b = new StringBuilder("{\n");
        b.append("  \"subject\": ").append(json(r.subject())).append(",\n");
        b.append("  \"passed\": ").append(r.passed()).append(",\n");
        b.append("  \"strict\": ").append(r.options().strict()).append(",\n");
        b.append("  \"severities\": {");
        boolean firstSeverity = true;
        for (Map.Entry<Severity, Long> e : r.severityCounts().entrySet()) {
            b.append(firstSeverity ? "" : ", ").append(json(e.getKey().id())).append(": ").append(e.getValue());
            firstSeverity = false;
        }
        b.append("},\n");
        b.append("  \"consistency\": {\"robust_spread\": ").append(jsonNumber(r.consistency().robustSpread()))
                .append(", \"deviation_99\": ").append(jsonNumber(r.consistency().deviation99()))
                .append(", \"within_digits_fraction\": ").append(jsonNumber(r.consistency().withinDigitsFraction()))
                .append("},\n");
        b.append("  \"sources\": [");
        for (int i = 0; i < r.sources().size(); i++) {
            b.append(i == 0 ? "" : ", ").append(json(r.sources().get(i)));
        }
        b.append("],\n");
        b.append("  \"lines\": ").append(r.lines()).append(",\n");
        b.append("  \"tolerances\": {\"relation\": ").append(jsonNumber(r.options().relationTolerance()))
                .append(", \"registry\": ").append(jsonNumber(r.options().registryTolerance()))
                .append(", \"upper_energy_cm1\": ").append(jsonNumber(r.options().upperEnergyToleranceCm1())).append("},\n");
        b.append("  \"checks\": {");
        boolean first = true;
        for (Map.Entry<Check, Long> e : r.findingCounts().entrySet()) {
            b.append(first ? "" : ", ").append(json(e.getKey().id())).append(": ").append(e.getValue());
            first = false;
        }
        b.append("},\n  \"isotopologues\": [");
        first = true;
        for (IsotopologueSummary s : r.isotopologues()) {
            b.append(first ? "\n" : ",\n").append("    {\"molecule\": ").append(s.moleculeId())
                    .append(", \"isotopologue\": ").append(s.isotopologue())
                    .append(", \"name\": ").append(json(s.name()))
                    .append(", \"lines\": ").append(s.lines())
                    .append(", \"relation_checked\": ").append(s.relationChecked())
                    .append(", \"relation_flagged\": ").append(s.relationFlagged())
                    .append(", \"relation_warnings\": ").append(s.relationWarnings())
                    .append(", \"relation_errors\": ").append(s.relationErrors())
                    .append(", \"robust_spread\": ").append(jsonNumber(s.robustSpread()))
                    .append(", \"outlier_limit\": ").append(jsonNumber(s.outlierLimit()))
                    .append(", \"intensity_digits\": ").append(s.intensityDigits())
                    .append(", \"einstein_a_digits\": ").append(s.einsteinADigits())
                    .append(", \"registry_allowance\": ").append(jsonNumber(s.registryAllowance()))
                    .append(", \"registry_provenance\": ").append(json(s.registryProvenance()))
                    .append(", \"q296_over_abundance_lines\": ").append(jsonNumber(s.consensusQOverAbundance()))
                    .append(", \"q296_over_abundance_registry\": ").append(jsonNumber(s.registryQOverAbundance()))
                    .append(", \"registry_deviation\": ").append(jsonNumber(s.registryDeviation()))
                    .append(", \"implied_min\": ").append(jsonNumber(s.impliedQOverAbundanceMin()))
                    .append(", \"implied_max\": ").append(jsonNumber(s.impliedQOverAbundanceMax()))
                    .append(", \"implied_mean\": ").append(jsonNumber(s.impliedQOverAbundanceMean()))
                    .append(", \"max_abs_deviation\": ").append(jsonNumber(s.maxAbsDeviation()))
                    .append(", \"max_deviation_wavenumber_cm1\": ").append(jsonNumber(s.maxDeviationWavenumberCm1()))
                    .append('}');
            first = false;
        }
        b.append(first ? "" : "\n  ").append("],\n  \"references\": [");
        first = true;
        for (ReferenceMatch m : r.references()) {
            ReferenceLine ref = m.reference();
            b.append(first ? "\n" : ",\n").append("    {\"label\": ").append(json(ref.label()))
                    .append(", \"category\": ").append(json(ref.category()))
                    .append(", \"molecule\": ").append(ref.moleculeId())
                    .append(", \"isotopologue\": ").append(ref.isotopologue())
                    .append(", \"status\": ").append(json(m.status().name().toLowerCase(Locale.ROOT).replace('_', '-')))
                    .append(", \"passes\": ").append(m.status().passes())
                    .append(", \"reference_cm1\": ").append(jsonNumber(ref.wavenumberCm1()))
                    .append(", \"tolerance_cm1\": ").append(jsonNumber(ref.toleranceCm1()))
                    .append(", \"listed_cm1\": ").append(jsonNumber(m.wavenumberCm1()))
                    .append(", \"offset_cm1\": ").append(jsonNumber(m.offsetCm1()))
                    .append(", \"source_line\": ").append(m.sourceLine())
                    .append(", \"source\": ").append(json(ref.source()))
                    .append('}');
            first = false;
        }
        b.append(first ? "" : "\n  ").append("],\n  \"findings_not_listed\": ").append(r.findingsNotListed())
                .append(",\n  \"findings\": [");
        first = true;
        for (Finding f : r.findings()) {
            b.append(first ? "\n" : ",\n").append("    {\"check\": ").append(json(f.check().id()))
                    .append(", \"severity\": ").append(json(f.severity().id()))
                    .append(", \"molecule\": ").append(f.moleculeId())
                    .append(", \"isotopologue\": ").append(f.isotopologue())
                    .append(", \"wavenumber_cm1\": ").append(jsonNumber(f.wavenumberCm1()))
                    .append(", \"source_line\": ").append(f.sourceLine())
                    .append(", \"field\": ").append(json(f.field()))
                    .append(", \"value\": ").append(jsonNumber(f.value()))
                    .append(", \"expected\": ").append(jsonNumber(f.expected()))
                    .append(", \"message\": ").append(json(f.message()))
                    .append('}');
            first = false;
        }
        b.append(first ? "" : "\n  ").append("]\n}\n");
        out.write(b.toString());
    }

    private static void line(StringBuilder b, String format, Object... args) {
        b.append(String.format(Locale.ROOT, format, args)).append('\n');
    }
}
