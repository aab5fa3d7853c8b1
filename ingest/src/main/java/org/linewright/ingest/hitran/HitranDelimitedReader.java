package org.linewright.ingest.hitran;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.EnumSet;
import java.util.List;
import java.util.Locale;
import java.util.Set;
import org.linewright.ingest.line.Broadener;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.line.TextColumn;
import org.linewright.ingest.source.DuplicateCounter;
import org.linewright.ingest.source.DuplicateTracker;
import org.linewright.ingest.source.LineFormat;
import org.linewright.ingest.source.LineFormatException;
import org.linewright.ingest.source.ReadOptions;
import org.linewright.ingest.source.RecordPerLineReader;
import org.linewright.ingest.text.DecimalParser;

/**
 * Reads comma- or tab-separated line-list exports whose first non-blank line names the parameters
 * ({@link Parameter}). The delimiter is a tab when the header holds one, else a comma. Fields may be
 * enclosed in double quotes (a doubled quote inside stands for one); quoted fields cannot span lines.
 * Wholly blank lines carry no data and are skipped; every other line must have as many fields as the header.
 *
 * <p>Required columns: {@code molec_id, local_iso_id, nu, sw, elower, gamma_air, n_air}; a file without
 * one of them is refused at once with a one-line error. All other known columns are optional: absent, an
 * empty value or {@code #} gives NaN (numbers) or an empty text. Columns the reader does not know are
 * ignored and listed by {@link #ignoredColumns()}. Broadener columns {@code gamma_X, n_X, delta_X} for X in
 * H2, He, CO2, H2O fill the {@code foreign*} arrays of {@link LineBatch} by {@link Broadener}.
 *
 * <p>{@code local_iso_id} is an integer 1–12; the one-character codes 0, A, B of the 160-character format
 * are read as 10, 11, 12. Validation and duplicate counting follow {@link HitranRecordReader}; J', J'', K'
 * are read from the local quanta when they keep their 15-character width.
 */
public final class HitranDelimitedReader extends RecordPerLineReader implements DuplicateCounter {
    /** The parameter columns this reader knows, by header name (matched without regard to case). */
    public enum Parameter {
        MOLEC_ID("molec_id", true), LOCAL_ISO_ID("local_iso_id", true), NU("nu", true), SW("sw", true),
        A("a", false), GAMMA_AIR("gamma_air", true), GAMMA_SELF("gamma_self", false), N_AIR("n_air", true),
        DELTA_AIR("delta_air", false), ELOWER("elower", true), GP("gp", false), GPP("gpp", false),
        GLOBAL_UPPER_QUANTA("global_upper_quanta", false), GLOBAL_LOWER_QUANTA("global_lower_quanta", false),
        LOCAL_UPPER_QUANTA("local_upper_quanta", false), LOCAL_LOWER_QUANTA("local_lower_quanta", false),
        IERR("ierr", false), IREF("iref", false), LINE_MIXING_FLAG("line_mixing_flag", false),
        GAMMA_H2("gamma_h2", false), N_H2("n_h2", false), DELTA_H2("delta_h2", false),
        GAMMA_HE("gamma_he", false), N_HE("n_he", false), DELTA_HE("delta_he", false),
        GAMMA_CO2("gamma_co2", false), N_CO2("n_co2", false), DELTA_CO2("delta_co2", false),
        GAMMA_H2O("gamma_h2o", false), N_H2O("n_h2o", false), DELTA_H2O("delta_h2o", false);

        private final String headerName;
        private final boolean required;

        Parameter(String headerName, boolean required) {
            this.headerName = headerName;
            this.required = required;
        }

        /** The header name in lower case. */
        public String headerName() {
            return headerName;
        }

        public boolean required() {
            return required;
        }

        static Parameter byHeader(String name) {
            String n = name.toLowerCase(Locale.ROOT);
            for (Parameter p : values()) {
                if (p.headerName.equals(n)) {
                    return p;
                }
            }
            return null;
        }
    }

    // A foreign broadener's header names follow from its column prefix (gamma_h2, n_h2, delta_h2), so the
    // broadener list lives in Broadener alone; indexed by Broadener.ordinal().
    private static final Parameter[] FOREIGN_WIDTH = foreignParameters("gamma_");
    private static final Parameter[] FOREIGN_EXPONENT = foreignParameters("n_");
    private static final Parameter[] FOREIGN_SHIFT = foreignParameters("delta_");

    private static Parameter[] foreignParameters(String headerPrefix) {
        Broadener[] broadeners = Broadener.values();
        Parameter[] parameters = new Parameter[broadeners.length];
        for (Broadener b : broadeners) {
            parameters[b.ordinal()] = Parameter.byHeader(headerPrefix + b.columnPrefix());
            if (parameters[b.ordinal()] == null) {
                throw new ExceptionInInitializerError("no delimited header " + headerPrefix + b.columnPrefix());
            }
        }
        return parameters;
    }

    private final byte delimiter;
    private final String[] headerNames;
    private final int[] columnOf = new int[Parameter.values().length];
    private final List<String> ignored = new ArrayList<>();
    private int[] fieldStart;
    private int[] fieldEnd;
    private boolean[] fieldEscaped;
    private int fieldCount;
    private LineFormatException problem;
    private final byte[] quantaScratch = new byte[2 * HitranQuanta.FIELD_WIDTH];
    private final double[] quanta = new double[3];
    private byte[] unescapeScratch = new byte[64];
    private final DuplicateTracker duplicates = new DuplicateTracker();

    /**
     * Reads the header row.
     *
     * @param in the decompressed bytes (closed by {@link #close()})
     * @throws LineFormatException when there is no header or a required column is missing
     */
    public HitranDelimitedReader(InputStream in, String fileName, ReadOptions options) throws IOException {
        super(in, fileName, options);
        boolean found;
        while ((found = lines.next()) && lines.isBlank()) {
            // skip blank lines before the header
        }
        if (!found) {
            throw LineFormatException.ofFile(fileName, "no header row (the content is empty)", null);
        }
        byte[] b = lines.buffer();
        boolean tab = false;
        for (int i = lines.lineStart(); i < lines.lineEnd(); i++) {
            tab |= b[i] == '\t';
        }
        delimiter = (byte) (tab ? '\t' : ',');
        fieldStart = new int[32];
        fieldEnd = new int[32];
        fieldEscaped = new boolean[32];
        LineFormatException bad = tokenize();
        if (bad != null) {
            throw bad;
        }
        headerNames = new String[fieldCount];
        Arrays.fill(columnOf, -1);
        for (int f = 0; f < fieldCount; f++) {
            String name = text(f).trim();
            if (f == 0 && name.startsWith("\uFEFF")) {
                name = name.substring(1).trim(); // a UTF-8 byte-order mark before the first name
            }
            headerNames[f] = name;
            Parameter p = Parameter.byHeader(name);
            if (p == null) {
                ignored.add(name);
            } else if (columnOf[p.ordinal()] >= 0) {
                throw new LineFormatException(fileName, lines.lineNumber(), fieldStart[f] + 1 - lines.lineStart(),
                        Math.max(fieldStart[f] + 1, fieldEnd[f]) - lines.lineStart(), "header", name,
                        "each column name once (" + name + " appears twice)");
            } else {
                columnOf[p.ordinal()] = f;
            }
        }
        List<String> missing = new ArrayList<>();
        for (Parameter p : Parameter.values()) {
            if (p.required && columnOf[p.ordinal()] < 0) {
                missing.add(p.headerName);
            }
        }
        if (!missing.isEmpty()) {
            throw new LineFormatException(fileName, lines.lineNumber(), 0, 0, "header", null,
                    "missing required column(s) " + String.join(", ", missing)
                            + " (the header must name molec_id, local_iso_id, nu, sw, elower, gamma_air, n_air)");
        }
    }

    /**
     * Every column but the upper-state energy and the wavenumber uncertainty as a number (no header names them),
     * and a foreign broadener's width, exponent or shift only when the header has that column.
     */
    @Override
    public Set<LineColumn> columnsProvided() {
        EnumSet<LineColumn> columns = EnumSet.allOf(LineColumn.class);
        columns.remove(LineColumn.UPPER_ENERGY);
        columns.remove(LineColumn.WAVENUMBER_UNCERTAINTY);
        for (Broadener b : Broadener.values()) {
            LineColumn[] foreign = LineColumn.foreignColumns(b);
            Parameter[] parameters = {FOREIGN_WIDTH[b.ordinal()], FOREIGN_EXPONENT[b.ordinal()], FOREIGN_SHIFT[b.ordinal()]};
            for (int k = 0; k < foreign.length; k++) {
                if (columnOf[parameters[k].ordinal()] < 0) {
                    columns.remove(foreign[k]);
                }
            }
        }
        return Collections.unmodifiableSet(columns);
    }

    /** Header names the reader does not know; their values are ignored. */
    public List<String> ignoredColumns() {
        return Collections.unmodifiableList(ignored);
    }

    /** The delimiter found in the header: ',' or '\t'. */
    public char delimiter() {
        return (char) delimiter;
    }

    @Override
    protected LineFormatException parseRecord(LineBatch b, int row) {
        LineFormatException bad = tokenize();
        if (bad != null) {
            return bad;
        }
        if (fieldCount != headerNames.length) {
            return new LineFormatException(fileName, lines.lineNumber(), 1, Math.max(1, lines.lineLength()), "row",
                    lines.lineText(), headerNames.length + " fields as in the header, found " + fieldCount);
        }
        problem = null;
        int molecule = integer(Parameter.MOLEC_ID);
        int isotopologue = isotopologue();
        if (problem != null) {
            return problem;
        }
        if (molecule < 1 || molecule > 99) {
            return error(Parameter.MOLEC_ID, "a molecule number 1-99");
        }
        if (!options.isotopologues().isKnown(molecule, isotopologue)) {
            return error(Parameter.LOCAL_ISO_ID, "an isotopologue known for molecule " + molecule + " (isotopologue "
                    + isotopologue + " is not in the registry; supply its metadata)");
        }
        double nu = nonNegative(Parameter.NU, "a non-negative wavenumber");
        double sw = nonNegative(Parameter.SW, "a non-negative intensity");
        double a = nonNegative(Parameter.A, "a non-negative Einstein A");
        double gammaAir = nonNegative(Parameter.GAMMA_AIR, "a non-negative width");
        double gammaSelf = nonNegative(Parameter.GAMMA_SELF, "a non-negative width");
        double nAir = number(Parameter.N_AIR, "a number");
        double deltaAir = number(Parameter.DELTA_AIR, "a number");
        double elower = number(Parameter.ELOWER, "a number");
        double gp = nonNegative(Parameter.GP, "a non-negative degeneracy");
        double gpp = nonNegative(Parameter.GPP, "a non-negative degeneracy");
        if (problem != null) {
            return problem;
        }
        b.clearOptional(row);
        for (int k = 0; k < FOREIGN_WIDTH.length; k++) {
            b.foreignWidthCm1PerAtm[k][row] = nonNegative(FOREIGN_WIDTH[k], "a non-negative width");
            b.foreignWidthExponent[k][row] = number(FOREIGN_EXPONENT[k], "a number");
            b.foreignShiftCm1PerAtm[k][row] = number(FOREIGN_SHIFT[k], "a number");
        }
        if (problem != null) {
            return problem;
        }
        b.moleculeId[row] = molecule;
        b.isotopologue[row] = isotopologue;
        b.wavenumberCm1[row] = nu;
        b.intensityCmPerMolecule[row] = sw;
        b.einsteinAS1[row] = a;
        b.airWidthCm1PerAtm[row] = gammaAir;
        b.selfWidthCm1PerAtm[row] = gammaSelf;
        b.airWidthExponent[row] = nAir;
        b.airShiftCm1PerAtm[row] = deltaAir;
        b.lowerEnergyCm1[row] = elower;
        b.upperDegeneracy[row] = gp;
        b.lowerDegeneracy[row] = gpp;
        b.sourceLine[row] = lines.lineNumber();
        int upperLocal = columnOf[Parameter.LOCAL_UPPER_QUANTA.ordinal()];
        int lowerLocal = columnOf[Parameter.LOCAL_LOWER_QUANTA.ordinal()];
        if (upperLocal >= 0 && lowerLocal >= 0 && rawLength(upperLocal) == HitranQuanta.FIELD_WIDTH
                && rawLength(lowerLocal) == HitranQuanta.FIELD_WIDTH && !fieldEscaped[upperLocal] && !fieldEscaped[lowerLocal]) {
            byte[] buf = lines.buffer();
            System.arraycopy(buf, fieldStart[upperLocal], quantaScratch, 0, HitranQuanta.FIELD_WIDTH);
            System.arraycopy(buf, fieldStart[lowerLocal], quantaScratch, HitranQuanta.FIELD_WIDTH, HitranQuanta.FIELD_WIDTH);
            HitranQuanta.read(molecule, quantaScratch, 0, HitranQuanta.FIELD_WIDTH, quanta);
            b.upperJ[row] = quanta[0];
            b.lowerJ[row] = quanta[1];
            b.upperK[row] = quanta[2];
        }
        appendText(b.upperGlobalQuanta, Parameter.GLOBAL_UPPER_QUANTA);
        appendText(b.lowerGlobalQuanta, Parameter.GLOBAL_LOWER_QUANTA);
        appendText(b.upperLocalQuanta, Parameter.LOCAL_UPPER_QUANTA);
        appendText(b.lowerLocalQuanta, Parameter.LOCAL_LOWER_QUANTA);
        appendText(b.uncertaintyCodes, Parameter.IERR);
        appendText(b.referenceCodes, Parameter.IREF);
        appendText(b.lineMixingFlag, Parameter.LINE_MIXING_FLAG);
        duplicates.offer(b, row);
        return null;
    }

    /** Splits the current line into fields; returns an error for an unterminated quote. */
    private LineFormatException tokenize() {
        byte[] buf = lines.buffer();
        int i = lines.lineStart();
        int end = lines.lineEnd();
        fieldCount = 0;
        while (true) {
            if (fieldCount == fieldStart.length) {
                fieldStart = Arrays.copyOf(fieldStart, 2 * fieldCount);
                fieldEnd = Arrays.copyOf(fieldEnd, 2 * fieldCount);
                fieldEscaped = Arrays.copyOf(fieldEscaped, 2 * fieldCount);
            }
            int f = fieldCount++;
            int j = i;
            while (j < end && buf[j] == ' ') {
                j++;
            }
            if (j < end && buf[j] == '"') {
                int open = j;
                boolean escaped = false;
                j++;
                int start = j;
                while (true) {
                    if (j >= end) {
                        return new LineFormatException(fileName, lines.lineNumber(), open + 1 - lines.lineStart(),
                                end - lines.lineStart(), "quoted field", new String(buf, open, end - open, StandardCharsets.UTF_8),
                                "a closing double quote on the same line");
                    }
                    if (buf[j] == '"') {
                        if (j + 1 < end && buf[j + 1] == '"') {
                            escaped = true;
                            j += 2;
                            continue;
                        }
                        break;
                    }
                    j++;
                }
                fieldStart[f] = start;
                fieldEnd[f] = j;
                fieldEscaped[f] = escaped;
                j++;
                while (j < end && buf[j] != delimiter) {
                    j++; // text after the closing quote (spaces) is ignored
                }
            } else {
                j = i;
                while (j < end && buf[j] != delimiter) {
                    j++;
                }
                fieldStart[f] = i;
                fieldEnd[f] = j;
                fieldEscaped[f] = false;
            }
            if (j >= end) {
                return null;
            }
            i = j + 1;
        }
    }

    private int rawLength(int f) {
        return fieldEnd[f] - fieldStart[f];
    }

    /** True when the field is empty, blank or "#" (a missing value). */
    private boolean missing(int f) {
        byte[] buf = lines.buffer();
        int s = DecimalParser.skipSpaces(buf, fieldStart[f], fieldEnd[f]);
        int e = DecimalParser.trimSpaces(buf, s, fieldEnd[f]);
        return s == e || (e - s == 1 && buf[s] == '#');
    }

    private double number(Parameter p, String expected) {
        int f = columnOf[p.ordinal()];
        if (f < 0) {
            return Double.NaN;
        }
        if (missing(f)) {
            if (p.required) {
                record(error(p, "a value (" + p.headerName + " is required)"));
            }
            return Double.NaN;
        }
        double v = DecimalParser.parse(lines.buffer(), fieldStart[f], fieldEnd[f]);
        if (!Double.isFinite(v)) {
            record(error(p, (Double.isNaN(v) ? "not a number: " : "not finite: ") + expected));
        }
        return v;
    }

    private double nonNegative(Parameter p, String expected) {
        double v = number(p, expected);
        if (v < 0) {
            record(error(p, "out of range: " + expected));
        }
        return v;
    }

    private int integer(Parameter p) {
        int f = columnOf[p.ordinal()];
        long v = DecimalParser.parseInt(lines.buffer(), fieldStart[f], fieldEnd[f]);
        if (v == Long.MIN_VALUE || v > Integer.MAX_VALUE || v < Integer.MIN_VALUE) {
            record(error(p, "an integer"));
            return -1;
        }
        return (int) v;
    }

    private int isotopologue() {
        int f = columnOf[Parameter.LOCAL_ISO_ID.ordinal()];
        byte[] buf = lines.buffer();
        int s = DecimalParser.skipSpaces(buf, fieldStart[f], fieldEnd[f]);
        int e = DecimalParser.trimSpaces(buf, s, fieldEnd[f]);
        if (e - s == 1) {
            int code = HitranRecordReader.isotopologueCode(buf[s]);
            if (code > 0) {
                return code;
            }
        }
        long v = DecimalParser.parseInt(buf, s, e);
        if (v < 1 || v > 12) {
            record(error(Parameter.LOCAL_ISO_ID, "an isotopologue number 1-12 (or code 0, A, B)"));
            return -1;
        }
        return (int) v;
    }

    private void record(LineFormatException e) {
        if (problem == null) {
            problem = e;
        }
    }

    private LineFormatException error(Parameter p, String expected) {
        int f = columnOf[p.ordinal()];
        int s = fieldStart[f] - lines.lineStart();
        int e = fieldEnd[f] - lines.lineStart();
        return new LineFormatException(fileName, lines.lineNumber(), s + 1, Math.max(s + 1, e), headerNames[f],
                text(f), expected);
    }

    private void appendText(TextColumn column, Parameter p) {
        int f = columnOf[p.ordinal()];
        if (f < 0 || missingText(f)) {
            column.appendEmpty();
            return;
        }
        if (!fieldEscaped[f]) {
            column.append(lines.buffer(), fieldStart[f], rawLength(f));
            return;
        }
        byte[] buf = lines.buffer();
        if (unescapeScratch.length < rawLength(f)) {
            unescapeScratch = new byte[2 * rawLength(f)];
        }
        int n = 0;
        for (int i = fieldStart[f]; i < fieldEnd[f]; i++) {
            unescapeScratch[n++] = buf[i];
            if (buf[i] == '"') {
                i++; // a doubled quote stands for one
            }
        }
        column.append(unescapeScratch, 0, n);
    }

    /** A text value is missing when it is exactly "#" (blank texts are kept verbatim: a blank flag is a value). */
    private boolean missingText(int f) {
        return rawLength(f) == 1 && lines.buffer()[fieldStart[f]] == '#' && !fieldEscaped[f];
    }

    private String text(int f) {
        return new String(lines.buffer(), fieldStart[f], rawLength(f), StandardCharsets.UTF_8);
    }

    /** Kept rows identical in molecule, isotopologue, wavenumber and the four quanta texts to the row before. */
    @Override
    public long duplicatesSeen() {
        return duplicates.duplicates();
    }

    @Override
    public LineFormat format() {
        return LineFormat.HITRAN_DELIMITED;
    }
}
