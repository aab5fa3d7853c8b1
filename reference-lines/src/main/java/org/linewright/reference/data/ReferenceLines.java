package org.linewright.reference.data;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.linewright.ingest.source.LineFormatException;
import org.linewright.ingest.text.TabularDataFile;
import org.linewright.ingest.units.PhysicalConstants;

/**
 * Reads reference-line files: the built-in set (resource {@code org/linewright/reference/data/reference-lines.tsv})
 * and users' files in the same format. The format (documented in {@code docs/reference-lines.md} and at the top of
 * the resource): UTF-8, tab-separated; lines starting with {@code #} are comments; the first other line is the
 * header {@link #COLUMNS}; {@code -} marks an empty field; positions and tolerances are given in GHz, MHz or cm⁻¹
 * and converted to cm⁻¹ here (ν̃ = f / c, c from {@link PhysicalConstants}).
 */
public final class ReferenceLines {
    /** The header of a reference-line file, in order. */
    public static final List<String> COLUMNS = List.of("category", "molecule_id", "isotopologue", "upper_j",
            "lower_j", "upper_k", "upper_global", "lower_global", "position", "unit", "tolerance", "label", "source");
    static final String RESOURCE = "reference-lines.tsv";
    private static final double HZ_PER_GHZ = 1e9;
    private static final double HZ_PER_MHZ = 1e6;

    private ReferenceLines() {
    }

    /** The built-in reference lines. */
    public static List<ReferenceLine> builtIn() {
        try (InputStream in = ReferenceLines.class.getResourceAsStream(RESOURCE)) {
            if (in == null) {
                throw new IllegalStateException("resource " + RESOURCE + " is missing from the build");
            }
            return parse(in, RESOURCE);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }

    /**
     * Reads a user's reference-line file.
     *
     * @throws LineFormatException on a malformed row (file, line, column, field, text, expectation)
     */
    public static List<ReferenceLine> read(Path file) throws IOException {
        try (InputStream in = Files.newInputStream(file)) {
            return parse(in, file.toString());
        }
    }

    /** Parses a reference-line file from a stream; {@code fileName} is used in error messages. */
    public static List<ReferenceLine> parse(InputStream in, String fileName) throws IOException {
        List<ReferenceLine> lines = new ArrayList<>();
        TabularDataFile.read(in, fileName, COLUMNS, (lineNumber, line, afterHeader) -> { },
                (lineNumber, line, cells) -> lines.add(row(fileName, lineNumber, line, cells)));
        return List.copyOf(lines);
    }

    private static ReferenceLine row(String file, long lineNumber, String line, String[] cells) {
        Cells c = new Cells(file, lineNumber, line, cells);
        if (cells.length != COLUMNS.size()) {
            throw new LineFormatException(file, lineNumber, 1, line.length(), "row", line,
                    COLUMNS.size() + " tab-separated fields, found " + cells.length);
        }
        String unit = c.text(9);
        double factor = switch (unit) {
            case "cm-1" -> 1.0;
            case "GHz" -> HZ_PER_GHZ / PhysicalConstants.SPEED_OF_LIGHT_CM_PER_S;
            case "MHz" -> HZ_PER_MHZ / PhysicalConstants.SPEED_OF_LIGHT_CM_PER_S;
            default -> throw c.error(9, unit, "GHz, MHz or cm-1");
        };
        double position = c.positive(8);
        double tolerance = c.positive(10);
        if (c.isEmpty(11)) {
            throw c.error(11, "", "a label");
        }
        if (c.isEmpty(12)) {
            throw c.error(12, "", "the value's source (a publication, \"common practice\" or \"from memory\")");
        }
        return new ReferenceLine(c.text(0), c.integer(1), c.integer(2), c.quantumNumber(3), c.quantumNumber(4),
                c.quantumNumber(5), c.label(6), c.label(7), position * factor, tolerance * factor, c.text(11),
                c.text(12), file + ":" + lineNumber);
    }

    /** Trims a quantum label and collapses runs of blanks to one, the form labels are compared in. */
    public static String normalizeLabel(String label) {
        return label.strip().replaceAll("\\s+", " ");
    }

    /** The cells of one row with located conversions. */
    private record Cells(String file, long lineNumber, String line, String[] cells) {
        boolean isEmpty(int i) {
            return cells[i].isBlank() || cells[i].strip().equals("-");
        }

        String text(int i) {
            return cells[i].strip();
        }

        int integer(int i) {
            try {
                return Integer.parseInt(text(i));
            } catch (NumberFormatException e) {
                throw error(i, cells[i], "a whole number");
            }
        }

        double positive(int i) {
            double v;
            try {
                v = Double.parseDouble(text(i));
            } catch (NumberFormatException e) {
                throw error(i, cells[i], "a positive number");
            }
            if (!(v > 0) || Double.isInfinite(v)) {
                throw error(i, cells[i], "a positive number");
            }
            return v;
        }

        double quantumNumber(int i) {
            if (isEmpty(i)) {
                return Double.NaN;
            }
            double v;
            try {
                v = Double.parseDouble(text(i));
            } catch (NumberFormatException e) {
                throw error(i, cells[i], "a quantum number or -");
            }
            // half-integers occur (odd-electron species); anything else is a typing error
            if (!(v >= 0) || v * 2 != Math.rint(v * 2)) {
                throw error(i, cells[i], "a non-negative whole or half-integer quantum number, or -");
            }
            return v;
        }

        String label(int i) {
            return isEmpty(i) ? "" : normalizeLabel(cells[i]);
        }

        LineFormatException error(int i, String text, String expected) {
            int column = 1;
            for (int k = 0; k < i; k++) {
                column += cells[k].length() + 1;
            }
            return new LineFormatException(file, lineNumber, column, column + Math.max(0, cells[i].length() - 1),
                    COLUMNS.get(i).toLowerCase(Locale.ROOT), text, expected);
        }
    }
}
