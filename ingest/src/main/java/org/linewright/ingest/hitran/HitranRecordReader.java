package org.linewright.ingest.hitran;

import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.Collections;
import java.util.EnumSet;
import java.util.List;
import java.util.Set;
import org.linewright.ingest.line.Broadener;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.source.DuplicateCounter;
import org.linewright.ingest.source.IsotopologueLookup;
import org.linewright.ingest.source.LineFormat;
import org.linewright.ingest.source.LineFormatException;
import org.linewright.ingest.source.ReadOptions;
import org.linewright.ingest.source.RecordPerLineReader;
import org.linewright.ingest.text.DecimalParser;

/**
 * Reads line lists in the 160-character fixed-column layout (2004 and later; see {@link HitranField}) into
 * {@link LineBatch}es.
 *
 * <p>Every field goes into the batch; quanta, uncertainty and reference codes and the line-mixing flag are
 * kept verbatim. J', J'' and K' are read from the local quanta by {@link HitranQuanta} (NaN where
 * unreadable). Numbers are parsed in place from one large byte buffer by {@link DecimalParser} (bitwise
 * equal to {@code Double.parseDouble}); no object is created per record unless the record is bad.
 *
 * <p>Records must be exactly 160 characters (LF or CRLF terminated). Wholly blank lines carry no data and
 * are skipped; they are not records. Rejected: other lengths, non-numeric or non-finite numbers, negative
 * wavenumber, intensity, Einstein A, widths or degeneracies, molecule numbers below 1, isotopologue codes
 * outside 1–9/0/A/B, and (molecule, isotopologue) pairs the isotopologue lookup does not know.
 *
 * <p>Duplicates: a record with the same molecule, isotopologue, wavenumber (same double) and the same four
 * quanta fields (byte for byte) as the previous kept record is kept and counted in {@link #duplicatesSeen()}.
 */
public final class HitranRecordReader extends RecordPerLineReader implements DuplicateCounter {
    private static final int QUANTA_START = HitranField.UPPER_GLOBAL_QUANTA.start();
    private static final int QUANTA_LENGTH = HitranField.LOWER_LOCAL_QUANTA.end() - QUANTA_START;
    private static final byte KNOWN_UNCHECKED = 0;
    private static final byte KNOWN_YES = 1;
    private static final byte KNOWN_NO = 2;
    private static final int MAX_ISOTOPOLOGUE_CODE = 12;

    private final IsotopologueLookup isotopologues;
    /** Per (molecule, isotopologue): whether the lookup knows it, asked once. */
    private final byte[] knownCache = new byte[100 * (MAX_ISOTOPOLOGUE_CODE + 1)];
    private final double[] quanta = new double[3];
    private final byte[] previousQuanta = new byte[QUANTA_LENGTH];
    private int previousMolecule = -1;
    private int previousIsotopologue = -1;
    private long previousWavenumberBits;
    private long duplicates;

    /**
     * @param in the decompressed record bytes (closed by {@link #close()})
     * @param fileName the file name shown in error messages and passed to the reject sink
     */
    public HitranRecordReader(InputStream in, String fileName, ReadOptions options) {
        super(in, fileName, options);
        this.isotopologues = options.isotopologues();
    }

    /** Parses the current line into row {@code row}; returns null when good, else the problem (row content then undefined). */
    @Override
    protected void startBatch(LineBatch batch) {
        // Sequential fills once per batch instead of seventeen scattered stores per record.
        batch.clearOptional();
    }

    @Override
    protected LineFormatException parseRecord(LineBatch b, int row) {
        byte[] buf = lines.buffer();
        int s = lines.lineStart();
        int length = lines.lineLength();
        if (length != HitranField.RECORD_LENGTH) {
            return new LineFormatException(fileName, lines.lineNumber(), 1, Math.max(1, length), "record",
                    lines.lineText(), "a record of " + HitranField.RECORD_LENGTH + " characters, found " + length);
        }
        long molecule = DecimalParser.parseInt(buf, s, s + 2);
        if (molecule < 1) {
            return fieldError(HitranField.MOLECULE, "a molecule number 1-99 (I2)");
        }
        int isotopologue = isotopologueCode(buf[s + 2]);
        if (isotopologue < 0) {
            return fieldError(HitranField.ISOTOPOLOGUE, "an isotopologue code 1-9, 0, A or B");
        }
        if (!isKnown((int) molecule, isotopologue)) {
            return fieldError(HitranField.ISOTOPOLOGUE, "an isotopologue known for molecule " + molecule
                    + " (isotopologue " + isotopologue + " is not in the registry; supply its metadata)");
        }
        double nu = DecimalParser.parse(buf, s + 3, s + 15);
        if (!(nu >= 0) || Double.isInfinite(nu)) {
            return numberError(HitranField.WAVENUMBER, nu, "a non-negative wavenumber (F12.6)");
        }
        double intensity = DecimalParser.parse(buf, s + 15, s + 25);
        if (!(intensity >= 0) || Double.isInfinite(intensity)) {
            return numberError(HitranField.INTENSITY, intensity, "a non-negative intensity (E10.3)");
        }
        double einsteinA = DecimalParser.parse(buf, s + 25, s + 35);
        if (!(einsteinA >= 0) || Double.isInfinite(einsteinA)) {
            return numberError(HitranField.EINSTEIN_A, einsteinA, "a non-negative Einstein A (E10.3)");
        }
        double airWidth = DecimalParser.parse(buf, s + 35, s + 40);
        if (!(airWidth >= 0) || Double.isInfinite(airWidth)) {
            return numberError(HitranField.AIR_WIDTH, airWidth, "a non-negative width (F5.4)");
        }
        double selfWidth = DecimalParser.parse(buf, s + 40, s + 45);
        if (!(selfWidth >= 0) || Double.isInfinite(selfWidth)) {
            return numberError(HitranField.SELF_WIDTH, selfWidth, "a non-negative width (F5.3)");
        }
        double lowerEnergy = DecimalParser.parse(buf, s + 45, s + 55);
        if (!Double.isFinite(lowerEnergy)) {
            return numberError(HitranField.LOWER_ENERGY, lowerEnergy, "a number (F10.4)");
        }
        double exponent = DecimalParser.parse(buf, s + 55, s + 59);
        if (!Double.isFinite(exponent)) {
            return numberError(HitranField.AIR_WIDTH_EXPONENT, exponent, "a number (F4.2)");
        }
        double shift = DecimalParser.parse(buf, s + 59, s + 67);
        if (!Double.isFinite(shift)) {
            return numberError(HitranField.AIR_SHIFT, shift, "a number (F8.6)");
        }
        double gUpper = DecimalParser.parse(buf, s + 146, s + 153);
        if (!(gUpper >= 0) || Double.isInfinite(gUpper)) {
            return numberError(HitranField.UPPER_DEGENERACY, gUpper, "a non-negative degeneracy (F7.1)");
        }
        double gLower = DecimalParser.parse(buf, s + 153, s + 160);
        if (!(gLower >= 0) || Double.isInfinite(gLower)) {
            return numberError(HitranField.LOWER_DEGENERACY, gLower, "a non-negative degeneracy (F7.1)");
        }

        // The optional columns this format never fills were cleared for the whole batch (see read); J and K are
        // set below for every row.
        b.moleculeId[row] = (int) molecule;
        b.isotopologue[row] = isotopologue;
        b.wavenumberCm1[row] = nu;
        b.intensityCmPerMolecule[row] = intensity;
        b.einsteinAS1[row] = einsteinA;
        b.airWidthCm1PerAtm[row] = airWidth;
        b.selfWidthCm1PerAtm[row] = selfWidth;
        b.lowerEnergyCm1[row] = lowerEnergy;
        b.airWidthExponent[row] = exponent;
        b.airShiftCm1PerAtm[row] = shift;
        b.upperDegeneracy[row] = gUpper;
        b.lowerDegeneracy[row] = gLower;
        b.sourceLine[row] = lines.lineNumber();
        HitranQuanta.read((int) molecule, buf, s + HitranField.UPPER_LOCAL_QUANTA.start(),
                s + HitranField.LOWER_LOCAL_QUANTA.start(), quanta);
        b.upperJ[row] = quanta[0];
        b.lowerJ[row] = quanta[1];
        b.upperK[row] = quanta[2];
        b.upperGlobalQuanta.append(buf, s + 67, 15);
        b.lowerGlobalQuanta.append(buf, s + 82, 15);
        b.upperLocalQuanta.append(buf, s + 97, 15);
        b.lowerLocalQuanta.append(buf, s + 112, 15);
        b.uncertaintyCodes.append(buf, s + 127, 6);
        b.referenceCodes.append(buf, s + 133, 12);
        b.lineMixingFlag.append(buf, s + 145, 1);
        countDuplicate((int) molecule, isotopologue, nu, buf, s + QUANTA_START);
        return null;
    }

    private void countDuplicate(int molecule, int isotopologue, double nu, byte[] buf, int quantaAt) {
        long bits = Double.doubleToRawLongBits(nu);
        if (molecule == previousMolecule && isotopologue == previousIsotopologue && bits == previousWavenumberBits
                && java.util.Arrays.equals(buf, quantaAt, quantaAt + QUANTA_LENGTH, previousQuanta, 0, QUANTA_LENGTH)) {
            duplicates++;
        }
        previousMolecule = molecule;
        previousIsotopologue = isotopologue;
        previousWavenumberBits = bits;
        System.arraycopy(buf, quantaAt, previousQuanta, 0, QUANTA_LENGTH);
    }

    /** Maps the one-character isotopologue code to its number: 1-9, 0 → 10, A → 11, B → 12; -1 otherwise. */
    public static int isotopologueCode(byte code) {
        if (code >= '1' && code <= '9') {
            return code - '0';
        }
        switch (code) {
            case '0': return 10;
            case 'A': return 11;
            case 'B': return 12;
            default: return -1;
        }
    }

    private boolean isKnown(int molecule, int isotopologue) {
        int key = molecule * (MAX_ISOTOPOLOGUE_CODE + 1) + isotopologue;
        byte state = knownCache[key];
        if (state == KNOWN_UNCHECKED) {
            state = isotopologues.isKnown(molecule, isotopologue) ? KNOWN_YES : KNOWN_NO;
            knownCache[key] = state;
        }
        return state == KNOWN_YES;
    }

    private LineFormatException numberError(HitranField field, double value, String expected) {
        String why = Double.isNaN(value) ? (isLiteralNaN(field) ? "NaN is not allowed: " : "not a number: ")
                : Double.isInfinite(value) ? "not finite: " : "out of range: ";
        return fieldError(field, why + expected);
    }

    private boolean isLiteralNaN(HitranField field) {
        return fieldText(field).trim().equalsIgnoreCase("nan");
    }

    private LineFormatException fieldError(HitranField field, String expected) {
        return new LineFormatException(fileName, lines.lineNumber(), field.start() + 1, field.end(),
                field.fieldName(), fieldText(field), expected);
    }

    private String fieldText(HitranField field) {
        return new String(lines.buffer(), lines.lineStart() + field.start(), field.width(), StandardCharsets.UTF_8);
    }

    /** Kept records identical in molecule, isotopologue, wavenumber and the four quanta to the record before. */
    @Override
    public long duplicatesSeen() {
        return duplicates;
    }

    @Override
    public Set<LineColumn> columnsProvided() {
        return COLUMNS_PROVIDED;
    }

    /**
     * Every column but the foreign-broadener ones, the upper-state energy and the wavenumber uncertainty as a
     * number: a 160-character record has no field for them.
     */
    private static final Set<LineColumn> COLUMNS_PROVIDED;

    static {
        EnumSet<LineColumn> columns = EnumSet.allOf(LineColumn.class);
        for (Broadener b : Broadener.values()) {
            columns.removeAll(List.of(LineColumn.foreignColumns(b)));
        }
        columns.remove(LineColumn.UPPER_ENERGY);
        columns.remove(LineColumn.WAVENUMBER_UNCERTAINTY);
        COLUMNS_PROVIDED = Collections.unmodifiableSet(columns);
    }

    @Override
    public LineFormat format() {
        return LineFormat.HITRAN160;
    }
}
