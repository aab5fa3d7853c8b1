package org.linewright.ingest.catalog;

import java.io.InputStream;
import java.util.Collections;
import java.util.EnumSet;
import java.util.Set;
import org.linewright.ingest.line.Broadener;
import org.linewright.ingest.line.EinsteinCoefficients;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.source.DuplicateCounter;
import org.linewright.ingest.source.DuplicateTracker;
import org.linewright.ingest.source.IsotopologueLookup;
import org.linewright.ingest.source.LineFormat;
import org.linewright.ingest.source.LineFormatException;
import org.linewright.ingest.source.ReadOptions;
import org.linewright.ingest.source.RecordPerLineReader;
import org.linewright.ingest.text.DecimalParser;
import org.linewright.ingest.units.PhysicalConstants;

/**
 * Reads 80-column catalog lines (frequencies in MHz, log10 intensities at 300 K), the line format of the
 * microwave catalogs described by H.M. Pickett, R.L. Poynter, E.A. Cohen, M.L. Delitsky, J.C. Pearson and
 * H.S.P. Müller, "Submillimeter, millimeter, and microwave spectral line catalog", JQSRT 60 (1998) 883.
 *
 * <p>Columns (1-based, Fortran edit descriptors): FREQ 1–13 F13.4 (MHz), ERR 14–21 F8.4 (MHz), LGINT 22–29 F8.4,
 * DR 30–31 I2, ELO 32–41 F10.4 (cm⁻¹), GUP 42–44 I3, TAG 45–51 I7, QNFMT 52–55 I4, QN′ 56–67 6×I2,
 * QN″ 68–79 6×I2. Trailing blanks may be missing; the record must reach column 55.
 *
 * <p>Conversions (also in {@code docs/formats-state-lists-and-catalogs.md}):
 * <ul>
 *   <li>ν [cm⁻¹] = f [MHz] · 10⁶ / c [cm/s]; the uncertainty likewise. A negative ERR means that FREQ and ERR are
 *       already in cm⁻¹ (a convention of the catalog programs, from memory).</li>
 *   <li>Intensity: the catalog gives I(300 K) = ∫σ df, the integrated absorption cross section over frequency,
 *       in nm²·MHz (Pickett et al. 1998, section 2). The line model's S is the same integral over wavenumber in
 *       cm²·cm⁻¹ = cm/molecule. With 1 nm² = 10⁻¹⁴ cm² and df = (c / 10⁶) dν̃ (f in MHz, ν̃ in cm⁻¹, c in cm/s):
 *       S [cm/molecule] = I [nm²·MHz] · 10⁻¹⁴ · 10⁶ / c = 10^LGINT / (c · 10⁸) = 10^LGINT / 2.99792458×10¹⁸.</li>
 *   <li>300 K → 296 K by {@link EinsteinCoefficients#intensityRatio} (partition-sum ratio from the registry,
 *       Boltzmann factor of E″, stimulated emission). Only Q(300)/Q(296) enters, so the registry's degeneracy
 *       convention need not match the catalog's.</li>
 *   <li>Abundance: the catalogs give intensities of the pure isotopologue (checked for ¹²C¹⁶O against the
 *       160-character line list, see the tests), so by default S is multiplied by the registry's natural
 *       abundance; the four-argument constructor accepts catalogs that already include it.</li>
 *   <li>Einstein A from S(296 K) by {@link EinsteinCoefficients#einsteinAFromIntensity} with g′ = GUP and the
 *       registry's Q(296 K). Caveat: exact only when GUP and the registry's Q use the same nuclear-spin
 *       convention (true for molecules without identical nuclei).</li>
 * </ul>
 * Other fields: E″ = ELO, E′ = E″ + ν, g′ = GUP (g″ is not in the format: NaN); upper/lower local quanta = the
 * state's quantum numbers (QNFMT mod 10 of them, 6 when that digit is 0) decoded and joined by one blank; J′, J″
 * = the first quantum number of each state (common practice; it is N for some open-shell species); reference
 * codes = TAG as written (negative: frequency measured in the laboratory). Widths, shifts, K and global quanta
 * are not in the format (NaN / empty).
 *
 * <p>Letter codes (from memory): a GUP above 999 is written with a letter for the hundreds, A = 10, B = 11, ...
 * ({@code A23} = 1023); a quantum number above 99 is written with a capital letter for the tens
 * ({@code A0} = 100, {@code B5} = 115) and one below −9 with a small letter ({@code a0} = −10, {@code b3} = −23).
 */
public final class CatalogReader extends RecordPerLineReader implements DuplicateCounter {
    /** Temperature of the catalog's intensities, K. */
    public static final double CATALOG_TEMPERATURE_K = 300.0;
    private static final double HZ_PER_MHZ = 1e6;
    private static final double CM2_PER_NM2 = 1e-14;
    /** MHz per cm⁻¹: c [cm/s] / 10⁶. */
    private static final double MHZ_PER_CM1 = PhysicalConstants.SPEED_OF_LIGHT_CM_PER_S / HZ_PER_MHZ;
    /** 10^LGINT [nm²·MHz] divided by this is S [cm/molecule]: c·10⁸ = 2.99792458×10¹⁸. */
    public static final double NM2_MHZ_PER_CM_PER_MOLECULE = MHZ_PER_CM1 / CM2_PER_NM2;
    private static final int MIN_RECORD_LENGTH = 55;
    private static final int QUANTA_PER_STATE = 6;

    private final boolean intensitiesIncludeAbundance;
    private final byte[] upperQuanta = new byte[QUANTA_PER_STATE * 5];
    private final byte[] lowerQuanta = new byte[QUANTA_PER_STATE * 5];
    private final int[] decoded = new int[QUANTA_PER_STATE];

    private int cachedTag = Integer.MIN_VALUE;
    private IsotopologueLookup.Id cachedId;
    private double cachedAbundance;
    private double cachedQ296;
    private double cachedQ300;

    private final DuplicateTracker duplicates = new DuplicateTracker();

    /** A reader for catalogs whose intensities exclude the natural abundance (the usual case). */
    public CatalogReader(InputStream in, String fileName, ReadOptions options) {
        this(in, fileName, options, false);
    }

    /**
     * @param intensitiesIncludeAbundance true when the catalog's intensities already include the natural
     *                                    abundance (then S is not multiplied by it)
     */
    public CatalogReader(InputStream in, String fileName, ReadOptions options, boolean intensitiesIncludeAbundance) {
        super(in, fileName, options);
        this.intensitiesIncludeAbundance = intensitiesIncludeAbundance;
    }

    @Override
    protected LineFormatException parseRecord(LineBatch batch, int row) {
        byte[] b = lines.buffer();
        int base = lines.lineStart();
        int length = lines.lineEnd() - base;
        if (length < MIN_RECORD_LENGTH) {
            throw new LineFormatException(fileName, lines.lineNumber(), 1, length, "record", lines.lineText(),
                    "at least " + MIN_RECORD_LENGTH + " columns (FREQ to QNFMT of the 80-column layout)");
        }
        double frequency = number(b, base, 1, 13, "FREQ", "F13.4 frequency in MHz");
        double error = number(b, base, 14, 21, "ERR", "F8.4 uncertainty in MHz");
        double logIntensity = number(b, base, 22, 29, "LGINT", "F8.4 log10 intensity in nm2 MHz");
        double lowerEnergy = number(b, base, 32, 41, "ELO", "F10.4 lower-state energy in cm-1");
        if (lowerEnergy < 0) {
            throw error(b, base, 32, 41, "ELO", "a non-negative energy in cm-1");
        }
        int gUpper = decodeDegeneracy(b, base);
        long tag = DecimalParser.parseInt(b, base + 44, base + 51);
        if (tag == DecimalParser.NOT_AN_INTEGER || tag == 0 || Math.abs(tag) > 9_999_999) {
            throw error(b, base, 45, 51, "TAG", "I7 species tag (negative: measured frequency)");
        }
        long qnfmt = DecimalParser.parseInt(b, base + 51, base + 55);
        if (qnfmt == DecimalParser.NOT_AN_INTEGER || qnfmt < 0) {
            throw error(b, base, 52, 55, "QNFMT", "I4 quantum-number format code");
        }
        int perState = (int) (qnfmt % 10);
        if (perState == 0) {
            perState = QUANTA_PER_STATE;
        }
        lookUp((int) Math.abs(tag), b, base);

        // a negative ERR marks FREQ and ERR given in cm-1 instead of MHz
        double wavenumber = error < 0 ? frequency : frequency / MHZ_PER_CM1;
        double uncertainty = error < 0 ? -error : error / MHZ_PER_CM1;
        if (!(wavenumber > 0)) {
            throw error(b, base, 1, 13, "FREQ", "a positive frequency");
        }
        double intensity300 = Math.pow(10.0, logIntensity) / NM2_MHZ_PER_CM_PER_MOLECULE;
        double intensity296 = intensity300 * EinsteinCoefficients.intensityRatio(wavenumber, lowerEnergy,
                CATALOG_TEMPERATURE_K, cachedQ300, LineBatch.REFERENCE_TEMPERATURE_K, cachedQ296);
        if (!intensitiesIncludeAbundance) {
            intensity296 *= cachedAbundance;
        }
        double a = EinsteinCoefficients.einsteinAFromIntensity(intensity296, wavenumber, gUpper, lowerEnergy,
                LineBatch.REFERENCE_TEMPERATURE_K, cachedQ296, cachedAbundance);

        // decode both states before appending anything, so that a bad field leaves the batch untouched
        int upperCount = decodeQuanta(b, base, 56, perState, length);
        int upperJ = decoded[0];
        int upperLength = writeQuanta(upperCount, upperQuanta);
        int lowerCount = decodeQuanta(b, base, 68, perState, length);
        int lowerJ = decoded[0];
        int lowerLength = writeQuanta(lowerCount, lowerQuanta);
        batch.upperLocalQuanta.append(upperQuanta, 0, upperLength);
        batch.lowerLocalQuanta.append(lowerQuanta, 0, lowerLength);

        batch.clearOptional(row);
        batch.moleculeId[row] = cachedId.moleculeId();
        batch.isotopologue[row] = cachedId.isotopologue();
        batch.wavenumberCm1[row] = wavenumber;
        batch.wavenumberUncertaintyCm1[row] = uncertainty;
        batch.intensityCmPerMolecule[row] = intensity296;
        batch.einsteinAS1[row] = a;
        batch.airWidthCm1PerAtm[row] = Double.NaN;
        batch.selfWidthCm1PerAtm[row] = Double.NaN;
        batch.airWidthExponent[row] = Double.NaN;
        batch.airShiftCm1PerAtm[row] = Double.NaN;
        batch.lowerEnergyCm1[row] = lowerEnergy;
        batch.upperEnergyCm1[row] = lowerEnergy + wavenumber;
        batch.upperDegeneracy[row] = gUpper;
        batch.lowerDegeneracy[row] = Double.NaN;
        batch.upperJ[row] = upperCount > 0 ? upperJ : Double.NaN;
        batch.lowerJ[row] = lowerCount > 0 ? lowerJ : Double.NaN;
        batch.sourceLine[row] = lines.lineNumber();
        batch.upperGlobalQuanta.appendEmpty();
        batch.lowerGlobalQuanta.appendEmpty();
        batch.uncertaintyCodes.appendEmpty();
        int tagStart = base + 44;
        int tagEnd = base + 51;
        while (b[tagStart] == ' ') {
            tagStart++;
        }
        batch.referenceCodes.append(b, tagStart, tagEnd - tagStart);
        batch.lineMixingFlag.appendEmpty();
        duplicates.offer(batch, row);
        return null;
    }

    /** Registry ids, abundance and Q(296), Q(300) of a species tag, cached (a catalog file is usually one species). */
    private void lookUp(int tag, byte[] b, int base) {
        if (tag == cachedTag) {
            return;
        }
        IsotopologueLookup lookup = options.isotopologues();
        IsotopologueLookup.Id id = lookup.byCatalogTag(tag);
        if (id == null) {
            throw error(b, base, 45, 51, "TAG", "a species tag known to the isotopologue registry (add tag " + tag
                    + " to it to read this catalog)");
        }
        double abundance = lookup.naturalAbundance(id.moleculeId(), id.isotopologue());
        double q296 = lookup.partitionSum(id.moleculeId(), id.isotopologue(), LineBatch.REFERENCE_TEMPERATURE_K);
        double q300 = lookup.partitionSum(id.moleculeId(), id.isotopologue(), CATALOG_TEMPERATURE_K);
        if (!(abundance > 0) || !(q296 > 0) || !(q300 > 0)) {
            throw error(b, base, 45, 51, "TAG", "a species whose natural abundance and partition sums at 296 K and "
                    + "300 K the registry knows (molecule " + id.moleculeId() + ", isotopologue " + id.isotopologue() + ")");
        }
        cachedTag = tag;
        cachedId = id;
        cachedAbundance = abundance;
        cachedQ296 = q296;
        cachedQ300 = q300;
    }

    private double number(byte[] b, int base, int firstColumn, int lastColumn, String field, String expected) {
        double v = DecimalParser.parse(b, base + firstColumn - 1, base + lastColumn);
        if (Double.isNaN(v) || Double.isInfinite(v)) {
            throw error(b, base, firstColumn, lastColumn, field, expected);
        }
        return v;
    }

    /** GUP, columns 42-44: I3, or a letter for the hundreds above 999 (A23 = 1023). */
    private int decodeDegeneracy(byte[] b, int base) {
        int from = base + 41;
        int to = base + 44;
        int i = from;
        while (i < to && b[i] == ' ') {
            i++;
        }
        int value;
        if (i < to && b[i] >= 'A' && b[i] <= 'Z') {
            long rest = DecimalParser.parseInt(b, i + 1, to);
            value = rest == DecimalParser.NOT_AN_INTEGER || rest < 0 || to - (i + 1) != 2
                    ? -1 : (b[i] - 'A' + 10) * 100 + (int) rest;
        } else {
            long v = DecimalParser.parseInt(b, from, to);
            value = v == DecimalParser.NOT_AN_INTEGER ? -1 : (int) v;
        }
        if (value <= 0) {
            throw error(b, base, 42, 44, "GUP", "a positive I3 degeneracy (letter for the hundreds above 999)");
        }
        return value;
    }

    /**
     * Decodes up to {@code count} I2 quantum numbers starting at 1-based column {@code firstColumn} into
     * {@link #decoded}; stops at the first blank field or the end of the record.
     *
     * @return the number decoded
     */
    private int decodeQuanta(byte[] b, int base, int firstColumn, int count, int recordLength) {
        int n = 0;
        for (int k = 0; k < count; k++) {
            int c0 = firstColumn - 1 + 2 * k;
            if (c0 >= recordLength) {
                break;
            }
            byte hi = b[base + c0];
            byte lo = c0 + 1 < recordLength ? b[base + c0 + 1] : (byte) ' ';
            if (hi == ' ' && lo == ' ') {
                break;
            }
            int value;
            if (lo < '0' || lo > '9') {
                throw error(b, base, c0 + 1, c0 + 2, "QN", "an I2 quantum number");
            } else if (hi == ' ') {
                value = lo - '0';
            } else if (hi == '-') {
                value = -(lo - '0');
            } else if (hi >= '0' && hi <= '9') {
                value = (hi - '0') * 10 + (lo - '0');
            } else if (hi >= 'A' && hi <= 'Z') {
                value = (hi - 'A' + 10) * 10 + (lo - '0');
            } else if (hi >= 'a' && hi <= 'z') {
                value = -((hi - 'a' + 1) * 10 + (lo - '0'));
            } else {
                throw error(b, base, c0 + 1, c0 + 2, "QN", "an I2 quantum number");
            }
            decoded[n++] = value;
        }
        return n;
    }

    /** Writes decoded[0, count) into {@code quanta} as decimal numbers joined by one blank; returns the length. */
    private int writeQuanta(int count, byte[] quanta) {
        int p = 0;
        for (int k = 0; k < count; k++) {
            if (k > 0) {
                quanta[p++] = ' ';
            }
            int v = decoded[k];
            if (v < 0) {
                quanta[p++] = '-';
                v = -v;
            }
            if (v >= 100) {
                quanta[p++] = (byte) ('0' + v / 100);
            }
            if (v >= 10) {
                quanta[p++] = (byte) ('0' + v / 10 % 10);
            }
            quanta[p++] = (byte) ('0' + v % 10);
        }
        return p;
    }

    private LineFormatException error(byte[] b, int base, int firstColumn, int lastColumn, String field, String expected) {
        int length = lines.lineEnd() - base;
        int from = Math.min(firstColumn - 1, length);
        int to = Math.min(lastColumn, length);
        String text = new String(b, base + from, to - from, java.nio.charset.StandardCharsets.ISO_8859_1);
        return new LineFormatException(fileName, lines.lineNumber(), firstColumn, lastColumn, field, text, expected);
    }

    /** Kept lines identical in molecule, isotopologue, wavenumber and the four quanta texts to the line before. */
    @Override
    public long duplicatesSeen() {
        return duplicates.duplicates();
    }

    @Override
    public Set<LineColumn> columnsProvided() {
        return COLUMNS_PROVIDED;
    }

    /**
     * What a catalog record carries: no pressure broadening or shift, no lower-state degeneracy, no K, no global
     * labels, uncertainty codes or line-mixing flag (the species tag goes to the reference codes).
     */
    private static final Set<LineColumn> COLUMNS_PROVIDED;

    static {
        EnumSet<LineColumn> columns = EnumSet.allOf(LineColumn.class);
        for (Broadener b : Broadener.values()) {
            for (LineColumn c : LineColumn.foreignColumns(b)) {
                columns.remove(c);
            }
        }
        for (LineColumn c : new LineColumn[] {LineColumn.AIR_WIDTH, LineColumn.SELF_WIDTH, LineColumn.AIR_WIDTH_EXPONENT,
                LineColumn.AIR_SHIFT, LineColumn.LOWER_DEGENERACY, LineColumn.UPPER_K, LineColumn.UPPER_GLOBAL_QUANTA,
                LineColumn.LOWER_GLOBAL_QUANTA, LineColumn.UNCERTAINTY_CODES, LineColumn.LINE_MIXING_FLAG}) {
            columns.remove(c);
        }
        COLUMNS_PROVIDED = Collections.unmodifiableSet(columns);
    }

    @Override
    public LineFormat format() {
        return LineFormat.CATALOG;
    }
}
