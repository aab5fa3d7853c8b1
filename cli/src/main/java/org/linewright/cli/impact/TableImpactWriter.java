package org.linewright.cli.impact;

import java.io.IOException;
import java.io.Writer;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;

import org.linewright.reference.report.ReportFormat;

/**
 * Writes the cells of a {@link TableImpact} after a comparison report: a text section, a second CSV table (after
 * one empty line, with its own header), or — for JSON — the members {@code "plan"} and {@code "plan_cells"} of an
 * object that also holds the comparison under {@code "comparison"}.
 */
public final class TableImpactWriter {
    /** Header of the CSV table. */
    public static final String CSV_HEADER = "pressure_bar,temperature_K,block,from_cm1,to_cm1,change_positions,"
            + "max_abs_change_cm2_per_molecule,max_relative_change,at_wavenumber_cm1";

    private TableImpactWriter() {
    }

    /** Writes the comparison (already rendered in {@code format}) followed by the table impact. */
    public static void write(String comparison, Path plan, List<TableImpact.Cell> cells, ReportFormat format, Writer out)
            throws IOException {
        StringBuilder b = new StringBuilder();
        switch (format) {
            case TEXT -> {
                b.append(comparison).append('\n');
                b.append("Table plan ").append(plan).append(": ").append(cells.size())
                        .append(" (p, T, block) cell(s) reached\n");
                if (!cells.isEmpty()) {
                    b.append(String.format(Locale.ROOT, "  %11s %9s %6s %27s %9s %14s %12s %14s%n", "p (bar)", "T (K)",
                            "block", "range cm-1", "positions", "max |dsigma|", "max rel.", "at cm-1"));
                }
                for (TableImpact.Cell c : cells) {
                    b.append(String.format(Locale.ROOT, "  %11.4g %9.2f %6d %13.4f-%13.4f %9d %14.4e %12.4g %14.4f%n",
                            c.pressureBar(), c.temperatureK(), c.block(), c.fromCm1(), c.toCm1(), c.changePositions(),
                            c.maxAbsoluteChange(), c.maxRelativeChange(), c.atWavenumberCm1()));
                }
            }
            case CSV -> {
                b.append(comparison).append('\n').append(CSV_HEADER).append('\n');
                for (TableImpact.Cell c : cells) {
                    b.append(c.pressureBar()).append(',').append(c.temperatureK()).append(',').append(c.block())
                            .append(',').append(c.fromCm1()).append(',').append(c.toCm1()).append(',')
                            .append(c.changePositions()).append(',').append(c.maxAbsoluteChange()).append(',')
                            .append(Double.isInfinite(c.maxRelativeChange()) ? "inf" : Double.toString(c.maxRelativeChange()))
                            .append(',').append(c.atWavenumberCm1()).append('\n');
                }
            }
            case JSON -> {
                b.append("{\n\"comparison\": ").append(comparison.strip()).append(",\n\"plan\": \"")
                        .append(plan.toString().replace("\\", "\\\\").replace("\"", "\\\"")).append("\",\n\"plan_cells\": [");
                for (int i = 0; i < cells.size(); i++) {
                    TableImpact.Cell c = cells.get(i);
                    b.append(i == 0 ? "\n" : ",\n").append("  {\"pressure_bar\": ").append(c.pressureBar())
                            .append(", \"temperature_K\": ").append(c.temperatureK())
                            .append(", \"block\": ").append(c.block())
                            .append(", \"from_cm1\": ").append(c.fromCm1()).append(", \"to_cm1\": ").append(c.toCm1())
                            .append(", \"change_positions\": ").append(c.changePositions())
                            .append(", \"max_abs_change_cm2_per_molecule\": ").append(c.maxAbsoluteChange())
                            .append(", \"max_relative_change\": ")
                            .append(Double.isInfinite(c.maxRelativeChange()) ? "null" : Double.toString(c.maxRelativeChange()))
                            .append(", \"at_wavenumber_cm1\": ").append(c.atWavenumberCm1()).append('}');
                }
                b.append(cells.isEmpty() ? "" : "\n").append("]\n}\n");
            }
            default -> throw new IllegalArgumentException(format.toString());
        }
        out.write(b.toString());
        out.flush();
    }
}
