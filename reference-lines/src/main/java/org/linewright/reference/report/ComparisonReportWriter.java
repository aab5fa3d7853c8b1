package org.linewright.reference.report;

import static org.linewright.reference.report.Cells.csv;
import static org.linewright.reference.report.Cells.csvNumber;
import static org.linewright.reference.report.Cells.json;
import static org.linewright.reference.report.Cells.jsonNumber;

import java.io.IOException;
import java.io.Writer;
import java.util.Locale;
import java.util.Map;

import org.linewright.ingest.line.LineColumn;
import org.linewright.reference.compare.ComparisonReport;
import org.linewright.reference.compare.FieldChange;
import org.linewright.reference.compare.LineChange;

/**
 * Writes a {@link ComparisonReport} as text (for people), CSV (one row per changed field of a changed line, one
 * row per added or removed line) or JSON (one object).
 */
public final class ComparisonReportWriter {
    /** Header of the CSV form. */
    public static final String CSV_HEADER = "change,matched_by,molecule,isotopologue,old_wavenumber_cm1,"
            + "new_wavenumber_cm1,old_source_line,new_source_line,upper_global_quanta,lower_global_quanta,"
            + "upper_local_quanta,lower_local_quanta,field,old_value,new_value,absolute_change,relative_change";

    private ComparisonReportWriter() {
    }

    /** Writes the report in the given format. */
    public static void write(ComparisonReport report, ReportFormat format, Writer out) throws IOException {
        switch (format) {
            case TEXT -> text(report, out);
            case CSV -> csvForm(report, out);
            case JSON -> jsonForm(report, out);
            default -> throw new IllegalArgumentException(format.toString());
        }
        out.flush();
    }

    private static void text(ComparisonReport r, Writer out) throws IOException {
        StringBuilder b = new StringBuilder();
        line(b, "linewright compare: %s -> %s", r.oldName(), r.newName());
        line(b, "old lines %d, new lines %d: %d unchanged, %d changed, %d added, %d removed", r.oldLines(),
                r.newLines(), r.unchanged(), r.changed(), r.added(), r.removed());
        line(b, "pairing: same species and quantum labels within %s cm-1, else nearest line within %s cm-1",
                r.options().matchWindowCm1(), r.options().nearestToleranceCm1());
        if (!r.fields().isEmpty()) {
            line(b, "");
            line(b, "Changed fields");
            line(b, "  %-28s %9s %14s %14s %14s", "field", "lines", "max |change|", "max |rel.|", "at cm-1");
            for (Map.Entry<LineColumn, ComparisonReport.FieldSummary> e : r.fields().entrySet()) {
                ComparisonReport.FieldSummary f = e.getValue();
                line(b, "  %-28s %9d %14s %14s %14s", e.getKey().columnName(), f.lines(), g(f.maxAbsoluteChange()),
                        g(f.maxRelativeChange()), Double.isNaN(f.atWavenumberCm1()) ? "-"
                                : String.format(Locale.ROOT, "%.6f", f.atWavenumberCm1()));
            }
        }
        if (!r.bands().isEmpty()) {
            line(b, "");
            line(b, "Per band (species, upper -> lower global quanta)");
            line(b, "  %-6s %-34s %8s %8s %8s  %s", "iso", "band", "added", "removed", "changed", "range cm-1");
            for (ComparisonReport.BandSummary s : r.bands()) {
                line(b, "  %-6s %-34s %8d %8d %8d  %.6f-%.6f", s.moleculeId() + "/" + s.isotopologue(),
                        s.upperGlobal() + " -> " + s.lowerGlobal(), s.added(), s.removed(), s.changed(),
                        s.minWavenumberCm1(), s.maxWavenumberCm1());
            }
        }
        if (!r.changes().isEmpty()) {
            line(b, "");
            line(b, "Changes%s", r.changesNotListed() > 0 ? " (first " + r.changes().size() + "; "
                    + r.changesNotListed() + " more not listed)" : "");
            for (LineChange c : r.changes()) {
                StringBuilder fields = new StringBuilder();
                for (FieldChange f : c.fields()) {
                    fields.append(fields.length() == 0 ? "" : "; ").append(f.column().columnName()).append(' ');
                    if (f.isText()) {
                        fields.append('"').append(f.oldText()).append("\" -> \"").append(f.newText()).append('"');
                    } else {
                        fields.append(f.oldValue()).append(" -> ").append(f.newValue())
                                .append(" (").append(g(f.absoluteChange())).append(')');
                    }
                }
                line(b, "  %-7s %-6s %14s %14s  lines %s/%s  [%s|%s|%s|%s]%s%s",
                        c.kind().name().toLowerCase(Locale.ROOT), c.moleculeId() + "/" + c.isotopologue(),
                        wn(c.oldWavenumberCm1()), wn(c.newWavenumberCm1()),
                        c.oldSourceLine() == 0 ? "-" : c.oldSourceLine(), c.newSourceLine() == 0 ? "-" : c.newSourceLine(),
                        c.upperGlobal().strip(), c.lowerGlobal().strip(), c.upperLocal().strip(), c.lowerLocal().strip(),
                        c.matchedBy() == LineChange.MatchedBy.NEAREST ? " (paired by position)" : "",
                        fields.length() == 0 ? "" : "  " + fields);
            }
        }
        out.write(b.toString());
    }

    private static void csvForm(ComparisonReport r, Writer out) throws IOException {
        StringBuilder b = new StringBuilder(CSV_HEADER).append('\n');
        for (LineChange c : r.changes()) {
            String prefix = String.join(",", c.kind().name().toLowerCase(Locale.ROOT),
                    c.matchedBy() == null ? "" : c.matchedBy().name().toLowerCase(Locale.ROOT),
                    Integer.toString(c.moleculeId()), Integer.toString(c.isotopologue()),
                    csvNumber(c.oldWavenumberCm1()), csvNumber(c.newWavenumberCm1()),
                    c.oldSourceLine() == 0 ? "" : Long.toString(c.oldSourceLine()),
                    c.newSourceLine() == 0 ? "" : Long.toString(c.newSourceLine()),
                    csv(c.upperGlobal()), csv(c.lowerGlobal()), csv(c.upperLocal()), csv(c.lowerLocal()));
            if (c.fields().isEmpty()) {
                b.append(prefix).append(",,,,,\n");
            }
            for (FieldChange f : c.fields()) {
                b.append(prefix).append(',').append(f.column().columnName()).append(',');
                if (f.isText()) {
                    b.append(csv(f.oldText())).append(',').append(csv(f.newText())).append(",,\n");
                } else {
                    b.append(csvNumber(f.oldValue())).append(',').append(csvNumber(f.newValue())).append(',')
                            .append(csvNumber(f.absoluteChange())).append(',').append(csvNumber(f.relativeChange()))
                            .append('\n');
                }
            }
        }
        out.write(b.toString());
    }

    private static void jsonForm(ComparisonReport r, Writer out) throws IOException {
        StringBuilder b = new StringBuilder("{\n");
        b.append("  \"old\": ").append(json(r.oldName())).append(",\n");
        b.append("  \"new\": ").append(json(r.newName())).append(",\n");
        b.append("  \"identical\": ").append(r.identical()).append(",\n");
        b.append("  \"match_window_cm1\": ").append(jsonNumber(r.options().matchWindowCm1()))
                .append(",\n  \"nearest_tolerance_cm1\": ").append(jsonNumber(r.options().nearestToleranceCm1())).append(",\n");
        b.append("  \"counts\": {\"old_lines\": ").append(r.oldLines()).append(", \"new_lines\": ").append(r.newLines())
                .append(", \"unchanged\": ").append(r.unchanged()).append(", \"changed\": ").append(r.changed())
                .append(", \"added\": ").append(r.added()).append(", \"removed\": ").append(r.removed()).append("},\n");
        b.append("  \"fields\": {");
        boolean first = true;
        for (Map.Entry<LineColumn, ComparisonReport.FieldSummary> e : r.fields().entrySet()) {
            ComparisonReport.FieldSummary f = e.getValue();
            b.append(first ? "\n" : ",\n").append("    ").append(json(e.getKey().columnName()))
                    .append(": {\"lines\": ").append(f.lines())
                    .append(", \"max_absolute_change\": ").append(jsonNumber(f.maxAbsoluteChange()))
                    .append(", \"max_relative_change\": ").append(jsonNumber(f.maxRelativeChange()))
                    .append(", \"at_wavenumber_cm1\": ").append(jsonNumber(f.atWavenumberCm1())).append('}');
            first = false;
        }
        b.append(first ? "" : "\n  ").append("},\n  \"bands\": [");
        first = true;
        for (ComparisonReport.BandSummary s : r.bands()) {
            b.append(first ? "\n" : ",\n").append("    {\"molecule\": ").append(s.moleculeId())
                    .append(", \"isotopologue\": ").append(s.isotopologue())
                    .append(", \"upper_global_quanta\": ").append(json(s.upperGlobal()))
                    .append(", \"lower_global_quanta\": ").append(json(s.lowerGlobal()))
                    .append(", \"added\": ").append(s.added()).append(", \"removed\": ").append(s.removed())
                    .append(", \"changed\": ").append(s.changed())
                    .append(", \"min_wavenumber_cm1\": ").append(jsonNumber(s.minWavenumberCm1()))
                    .append(", \"max_wavenumber_cm1\": ").append(jsonNumber(s.maxWavenumberCm1())).append('}');
            first = false;
        }
        b.append(first ? "" : "\n  ").append("],\n  \"changes_not_listed\": ").append(r.changesNotListed())
                .append(",\n  \"changes\": [");
        first = true;
        for (LineChange c : r.changes()) {
            b.append(first ? "\n" : ",\n").append("    {\"change\": ").append(json(c.kind().name().toLowerCase(Locale.ROOT)))
                    .append(", \"matched_by\": ")
                    .append(c.matchedBy() == null ? "null" : json(c.matchedBy().name().toLowerCase(Locale.ROOT)))
                    .append(", \"molecule\": ").append(c.moleculeId()).append(", \"isotopologue\": ").append(c.isotopologue())
                    .append(", \"old_wavenumber_cm1\": ").append(jsonNumber(c.oldWavenumberCm1()))
                    .append(", \"new_wavenumber_cm1\": ").append(jsonNumber(c.newWavenumberCm1()))
                    .append(", \"old_source_line\": ").append(c.oldSourceLine())
                    .append(", \"new_source_line\": ").append(c.newSourceLine())
                    .append(", \"quanta\": [").append(json(c.upperGlobal())).append(", ").append(json(c.lowerGlobal()))
                    .append(", ").append(json(c.upperLocal())).append(", ").append(json(c.lowerLocal())).append(']')
                    .append(", \"fields\": [");
            boolean firstField = true;
            for (FieldChange f : c.fields()) {
                b.append(firstField ? "" : ", ").append("{\"field\": ").append(json(f.column().columnName()));
                if (f.isText()) {
                    b.append(", \"old\": ").append(json(f.oldText())).append(", \"new\": ").append(json(f.newText()));
                } else {
                    b.append(", \"old\": ").append(jsonNumber(f.oldValue())).append(", \"new\": ")
                            .append(jsonNumber(f.newValue())).append(", \"absolute_change\": ")
                            .append(jsonNumber(f.absoluteChange())).append(", \"relative_change\": ")
                            .append(jsonNumber(f.relativeChange()));
                }
                b.append('}');
                firstField = false;
            }
            b.append("]}");
            first = false;
        }
        b.append(first ? "" : "\n  ").append("]\n}\n");
        out.write(b.toString());
    }

    private static String g(double v) {
        return Double.isNaN(v) ? "-" : String.format(Locale.ROOT, "%.4g", v);
    }

    private static String wn(double v) {
        return Double.isNaN(v) ? "-" : String.format(Locale.ROOT, "%.6f", v);
    }

    private static void line(StringBuilder b, String format, Object... args) {
        b.append(String.format(Locale.ROOT, format, args)).append('\n');
    }
}
