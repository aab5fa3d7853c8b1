package org.linewright.grid.output;

import java.io.IOException;
import java.io.Writer;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import org.linewright.broadening.background.BackgroundGas;
import org.linewright.broadening.listing.LineListing;
import org.linewright.broadening.listing.LineListingRequest;
import org.linewright.broadening.listing.ListingValues;
import org.linewright.ingest.InputException;
import org.linewright.ingest.atomic.AtomicFile;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.line.TextColumn;
import org.linewright.ingest.source.IsotopologueLookup;
import org.linewright.ingest.store.LineExportWriter;
import org.linewright.ingest.store.LineStore;

/**
 * Writes a line listing ({@link LineListing}: the selected lines with S(T) and background widths) as aligned
 * columns for people, CSV, or an Arrow IPC file.
 *
 * <p>CSV: a header row, then every {@link LineColumn} in declaration order (the first twelve are
 * {@code molecule,isotopologue,wavenumber_cm1,intensity_cm_per_molecule,einstein_a_s1,air_width_cm1_per_atm,
 * self_width_cm1_per_atm,air_width_exponent,air_shift_cm1_per_atm,lower_energy_cm1,upper_degeneracy,
 * lower_degeneracy}), then the computed columns. Numbers are printed with {@link Double#toString(double)}, which
 * reads back as the same double; missing values are empty; texts are always quoted (quanta keep their blanks).
 */
public final class LineListingWriter {
    private static final LineColumn[] COLUMNS = LineColumn.values();

    private LineListingWriter() {
    }

    /**
     * Lists the lines selected by {@code request}.
     *
     * @param lookup isotopologue data (Q(T), abundances, masses) for the computed columns
     * @param outOrNull the file to write (atomically); null writes CSV or table output to {@code stdout}
     * @param stdout where output goes when {@code outOrNull} is null (flushed, not closed)
     */
    public static LineListing.Summary write(LineStore store, LineListingRequest request, IsotopologueLookup lookup,
                                            ListingFormat format, Path outOrNull, Writer stdout) throws IOException {
        if (format == ListingFormat.ARROW && outOrNull == null) {
            throw new InputException("format arrow writes a file: give the output file (--out FILE.arrow)");
        }
        if (outOrNull == null) {
            LineListing.Summary s = LineListing.stream(store, request, lookup, new TextSink(stdout, format));
            stdout.flush();
            return s;
        }
        Path target = outOrNull.toAbsolutePath();
        Files.createDirectories(target.getParent());
        if (format == ListingFormat.ARROW) {
            ArrowSink sink = new ArrowSink(target);
            try {
                LineListing.Summary s = LineListing.stream(store, request, lookup, sink);
                sink.commit();
                return s;
            } finally {
                sink.close();
            }
        }
        LineListing.Summary[] s = new LineListing.Summary[1];
        AtomicFile.writeText(target, out -> s[0] = LineListing.stream(store, request, lookup, new TextSink(out, format)));
        return s[0];
    }

    /** Table or CSV rows into a character stream. */
    private static final class TextSink implements LineListing.Sink {
        private final Writer out;
        private final ListingFormat format;

        TextSink(Writer out, ListingFormat format) {
            this.out = out;
            this.format = format;
        }

        @Override
        public void begin(ListingValues values) throws IOException {
            header(out, format, values);
        }

        @Override
        public void accept(LineBatch lines, ListingValues values) throws IOException {
            if (format == ListingFormat.CSV) {
                csvRows(out, lines, values);
            } else {
                tableRows(out, lines, values);
            }
        }
    }

    /** The store's columns plus the computed ones into an Arrow IPC file, committed when complete. */
    private static final class ArrowSink implements LineListing.Sink {
        private final Path target;
        private LineExportWriter arrow;

        ArrowSink(Path target) {
            this.target = target;
        }

        @Override
        public void begin(ListingValues values) throws IOException {
            arrow = new LineExportWriter(target, values.arrowColumns(), values.metadata());
        }

        @Override
        public void accept(LineBatch lines, ListingValues values) throws IOException {
            arrow.write(lines, values.arrowValues());
        }

        void commit() throws IOException {
            arrow.commit();
        }

        void close() throws IOException {
            if (arrow != null) {
                arrow.close();
            }
        }
    }

    private static void header(Writer w, ListingFormat format, ListingValues computed) throws IOException {
        if (format == ListingFormat.CSV) {
            StringBuilder sb = new StringBuilder();
            for (LineColumn c : COLUMNS) {
                sb.append(c.columnName()).append(',');
            }
            for (String name : computed.csvColumns()) {
                sb.append(name).append(',');
            }
            sb.setLength(sb.length() - 1);
            w.write(sb.append('\n').toString());
        } else {
            StringBuilder sb = new StringBuilder(String.format(Locale.ROOT,
                    "%3s %3s %14s %11s %11s %9s %10s %5s %9s %11s %7s %7s  %-15s",
                    "mol", "iso", "wavenumber", "S(296K)", "A(s-1)", "gamma_air", "gamma_self", "n_air", "d_air",
                    "E''", "g'", "g''", "lower quanta"));
            if (computed.hasTemperature()) {
                sb.append(String.format(Locale.ROOT, " %11s", "S(T)"));
            }
            if (computed.hasWidths()) {
                sb.append(String.format(Locale.ROOT, " %9s %6s", "gamma_bg", "n_bg"));
            }
            w.write(sb.append('\n').toString());
        }
    }

    private static void csvRows(Writer w, LineBatch b, ListingValues computed) throws IOException {
        StringBuilder sb = new StringBuilder(512);
        for (int i = 0; i < b.size; i++) {
            sb.setLength(0);
            for (LineColumn c : COLUMNS) {
                switch (c.kind()) {
                    case INT -> sb.append(c.ints(b)[i]);
                    case LONG -> sb.append(c.longs(b)[i]);
                    case DOUBLE -> number(sb, c.doubles(b)[i]);
                    case TEXT -> quoted(sb, c.text(b), i);
                    default -> throw new AssertionError(c);
                }
                sb.append(',');
            }
            appendCsv(sb, computed, i);
            sb.setLength(sb.length() - 1);
            sb.append('\n');
            w.write(sb.toString());
        }
    }

    private static void tableRows(Writer w, LineBatch b, ListingValues computed) throws IOException {
        for (int i = 0; i < b.size; i++) {
            StringBuilder sb = new StringBuilder(String.format(Locale.ROOT,
                    "%3d %3d %14.6f %11.4e %11.4e %9.4f %10.4f %5.2f %9.6f %11.4f %7.1f %7.1f  %-15s",
                    b.moleculeId[i], b.isotopologue[i], b.wavenumberCm1[i], b.intensityCmPerMolecule[i],
                    b.einsteinAS1[i], b.airWidthCm1PerAtm[i], b.selfWidthCm1PerAtm[i], b.airWidthExponent[i],
                    b.airShiftCm1PerAtm[i], b.lowerEnergyCm1[i], b.upperDegeneracy[i], b.lowerDegeneracy[i],
                    b.lowerLocalQuanta.get(i).strip()));
            appendTable(sb, computed, i);
            w.write(sb.append('\n').toString());
        }
    }

    private static void number(StringBuilder sb, double v) {
        if (!Double.isNaN(v)) {
            sb.append(v);
        }
    }

    private static void quoted(StringBuilder sb, TextColumn column, int row) {
        sb.append('"');
        byte[] bytes = column.bytes();
        int start = column.start(row);
        int end = start + column.length(row);
        boolean ascii = true;
        for (int k = start; k < end; k++) {
            if (bytes[k] < 0) {
                ascii = false;
                break;
            }
        }
        String s = ascii ? null : column.get(row);
        if (ascii) {
            for (int k = start; k < end; k++) {
                char ch = (char) bytes[k];
                if (ch == '"') {
                    sb.append('"');
                }
                sb.append(ch);
            }
        } else {
            sb.append(s.replace("\"", "\"\""));
        }
        sb.append('"');
    }

    private static void appendCsv(StringBuilder sb, ListingValues v, int row) {
        if (v.hasTemperature()) {
            number(sb, v.intensityAtTemperature()[row]);
            sb.append(',');
        }
        if (v.hasWidths()) {
            number(sb, v.widths().backgroundWidthCm1PerAtm[row]);
            sb.append(',');
            number(sb, v.widths().backgroundWidthExponent[row]);
            sb.append(',');
            number(sb, v.widths().backgroundShiftCm1PerAtm[row]);
            sb.append(',');
            for (BackgroundGas g : v.gases()) {
                sb.append(v.widths().source(g, row).label()).append(',');
            }
        }
    }

    private static void appendTable(StringBuilder sb, ListingValues v, int row) {
        if (v.hasTemperature()) {
            sb.append(String.format(Locale.ROOT, " %11.4e", v.intensityAtTemperature()[row]));
        }
        if (v.hasWidths()) {
            sb.append(String.format(Locale.ROOT, " %9.5f %6.3f", v.widths().backgroundWidthCm1PerAtm[row],
                    v.widths().backgroundWidthExponent[row]));
        }
    }
}
