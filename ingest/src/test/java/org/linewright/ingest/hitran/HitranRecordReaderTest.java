package org.linewright.ingest.hitran;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeSet;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.source.LineFormatException;
import org.linewright.ingest.source.ReadOptions;
import org.linewright.ingest.testsupport.ReferenceSamples;
import org.linewright.ingest.testsupport.SampleIsotopologues;
import org.linewright.ingest.units.PhysicalConstants;

class HitranRecordReaderTest {
    private static final ReadOptions STRICT = ReadOptions.strict(new SampleIsotopologues());

    /** Field columns of the 2004 layout (common practice of the format), independent of HitranField. */
    private static final int[][] NUMERIC_COLUMNS = {{3, 15}, {15, 25}, {25, 35}, {35, 40}, {40, 45}, {45, 55},
        {55, 59}, {59, 67}, {146, 153}, {153, 160}};

    static List<String> records(String file) throws IOException {
        return ReferenceSamples.lines(ReferenceSamples.hitranSample(file));
    }

    static HitranRecordReader reader(String text, ReadOptions options) {
        return new HitranRecordReader(new ByteArrayInputStream(text.getBytes(StandardCharsets.ISO_8859_1)), "test.par", options);
    }

    /** Reads every line, batch by batch (a small batch so that batch boundaries are crossed). */
    static void forEachRow(HitranRecordReader r, RowCheck check) throws IOException {
        LineBatch b = new LineBatch(997);
        int index = 0;
        while (r.read(b)) {
            for (int row = 0; row < b.size; row++) {
                check.row(b, row, index++);
            }
        }
    }

    interface RowCheck {
        void row(LineBatch b, int row, int index);
    }

    // Record counts and isotopologues: the table of the samples' README.
    @ParameterizedTest
    @CsvSource({"sample_CO.par,5381,5,'1,2,3,4,5,6'", "sample_CO2.par,5492,2,'1,2,3,4,5,6,7,8'",
        "sample_N2O.par,5446,4,'1,2,3,4,5'", "sample_PH3.par,4424,28,'1'"})
    void everySampleRecordParsesIntoEveryField(String file, int count, int molecule, String isotopologues) throws IOException {
        List<String> lines = records(file);
        TreeSet<Integer> isos = new TreeSet<>();
        HitranRecordReader r = new HitranRecordReader(java.nio.file.Files.newInputStream(ReferenceSamples.hitranSample(file)), file, STRICT);
        forEachRow(r, (b, row, i) -> {
            String rec = lines.get(i);
            assertEquals(molecule, b.moleculeId[row]);
            isos.add(b.isotopologue[row]);
            double[] expected = new double[NUMERIC_COLUMNS.length];
            for (int k = 0; k < expected.length; k++) {
                // reference: the JDK's Double.parseDouble of the field text
                expected[k] = Double.parseDouble(rec.substring(NUMERIC_COLUMNS[k][0], NUMERIC_COLUMNS[k][1]).trim());
            }
            double[] actual = {b.wavenumberCm1[row], b.intensityCmPerMolecule[row], b.einsteinAS1[row],
                b.airWidthCm1PerAtm[row], b.selfWidthCm1PerAtm[row], b.lowerEnergyCm1[row], b.airWidthExponent[row],
                b.airShiftCm1PerAtm[row], b.upperDegeneracy[row], b.lowerDegeneracy[row]};
            for (int k = 0; k < expected.length; k++) {
                assertEquals(Double.doubleToRawLongBits(expected[k]), Double.doubleToRawLongBits(actual[k]),
                        file + " record " + (i + 1) + " field " + k);
            }
            assertEquals(rec.substring(67, 82), b.upperGlobalQuanta.get(row));
            assertEquals(rec.substring(82, 97), b.lowerGlobalQuanta.get(row));
            assertEquals(rec.substring(97, 112), b.upperLocalQuanta.get(row));
            assertEquals(rec.substring(112, 127), b.lowerLocalQuanta.get(row));
            assertEquals(rec.substring(127, 133), b.uncertaintyCodes.get(row));
            assertEquals(rec.substring(133, 145), b.referenceCodes.get(row));
            assertEquals(rec.substring(145, 146), b.lineMixingFlag.get(row));
            assertEquals(i + 1, b.sourceLine[row]);
            assertTrue(Double.isNaN(b.upperEnergyCm1[row]) && Double.isNaN(b.foreignWidthCm1PerAtm[0][row]));
        });
        assertEquals(count, r.recordsRead());
        assertEquals(count, r.linesKept());
        assertEquals(0, r.recordsRejected());
        assertEquals(isotopologues, String.join(",", isos.stream().map(String::valueOf).toArray(String[]::new)));
    }

    /**
     * The intensity/Einstein-A relation of Šimečková et al. 2006 (JQSRT 98, 130) with the abundances and
     * Q(296 K) of the samples README: S = Iₐ·A·g′/(8πcν²)·e^(−c2E″/T)·(1−e^(−c2ν/T))/Q(T), within 2×10⁻³
     * (rounding of S and A, and of the recalled Q, per the README). It fails when fields are swapped or
     * mis-scaled (ν, S, A, E″, g′).
     */
    @ParameterizedTest
    @CsvSource({"sample_CO.par", "sample_CO2.par", "sample_N2O.par", "sample_PH3.par"})
    void intensityMatchesEinsteinARelation(String file) throws IOException {
        SampleIsotopologues iso = new SampleIsotopologues();
        double c2 = PhysicalConstants.SECOND_RADIATION_CONSTANT_CM_K;
        double c = PhysicalConstants.SPEED_OF_LIGHT_CM_PER_S;
        double t = 296.0;
        int[] checked = {0};
        HitranRecordReader r = new HitranRecordReader(java.nio.file.Files.newInputStream(ReferenceSamples.hitranSample(file)), file, STRICT);
        forEachRow(r, (b, row, i) -> {
            double q = iso.partitionSum(b.moleculeId[row], b.isotopologue[row], t);
            double ia = iso.naturalAbundance(b.moleculeId[row], b.isotopologue[row]);
            double nu = b.wavenumberCm1[row];
            if (Double.isNaN(q) || nu < 1 || b.intensityCmPerMolecule[row] < 1e-99) {
                return;
            }
            double s = ia * b.einsteinAS1[row] * b.upperDegeneracy[row] / (8 * Math.PI * c * nu * nu)
                    * Math.exp(-c2 * b.lowerEnergyCm1[row] / t) * -Math.expm1(-c2 * nu / t) / q;
            assertEquals(1.0, s / b.intensityCmPerMolecule[row], 2e-3, file + " record " + (i + 1));
            checked[0]++;
        });
        assertTrue(checked[0] > 4000, "records checked: " + checked[0]);
    }

    /** PH3 (symmetric top): nuclear-spin statistics give g = 8(2J+1) (common practice), and |ΔJ| ≤ 1. */
    @Test
    void symmetricTopQuantaAgreeWithDegeneracies() throws IOException {
        HitranRecordReader r = reader(String.join("\n", records("sample_PH3.par")), STRICT);
        forEachRow(r, (b, row, i) -> {
            assertEquals(b.upperDegeneracy[row], 8 * (2 * b.upperJ[row] + 1), "record " + (i + 1));
            assertEquals(b.lowerDegeneracy[row], 8 * (2 * b.lowerJ[row] + 1), "record " + (i + 1));
            assertTrue(Math.abs(b.upperJ[row] - b.lowerJ[row]) <= 1);
            assertEquals(Double.parseDouble(b.upperLocalQuanta.get(row).substring(3, 6).trim()), b.upperK[row]);
        });
    }

    /**
     * Linear molecules: P/Q/R branch gives J′ = J″−1, J″, J″+1 (common practice), and the rotational
     * degeneracies then satisfy g′(2J″+1) = g″(2J′+1) (records without hyperfine quanta).
     */
    @ParameterizedTest
    @CsvSource({"sample_CO.par", "sample_CO2.par", "sample_N2O.par"})
    void linearQuantaFollowTheBranch(String file) throws IOException {
        List<String> lines = records(file);
        int[] checked = {0};
        HitranRecordReader r = reader(String.join("\r\n", lines), STRICT);
        forEachRow(r, (b, row, i) -> {
            String lower = lines.get(i).substring(112, 127);
            double jLower = Integer.parseInt(lower.substring(6, 9).trim());
            char branch = lower.charAt(5);
            assertEquals(jLower, b.lowerJ[row]);
            assertEquals(jLower + (branch == 'P' ? -1 : branch == 'R' ? 1 : 0), b.upperJ[row]);
            assertTrue(Double.isNaN(b.upperK[row]));
            if (lower.substring(10).isBlank()) {
                assertEquals(b.upperDegeneracy[row] * (2 * b.lowerJ[row] + 1),
                        b.lowerDegeneracy[row] * (2 * b.upperJ[row] + 1), 1e-9, file + " record " + (i + 1));
                checked[0]++;
            }
        });
        assertTrue(checked[0] > 5000);
    }

    @Test
    void crlfAndLfReadAlike() throws IOException {
        List<String> lines = records("sample_N2O.par");
        List<Double> lf = new ArrayList<>();
        forEachRow(reader(String.join("\n", lines) + "\n", STRICT), (b, row, i) -> lf.add(b.wavenumberCm1[row]));
        List<Double> crlf = new ArrayList<>();
        HitranRecordReader r = reader(String.join("\r\n", lines) + "\r\n\r\n", STRICT);
        forEachRow(r, (b, row, i) -> crlf.add(b.wavenumberCm1[row]));
        assertEquals(lines.size(), lf.size());
        assertEquals(lf, crlf);
        assertEquals(lines.size(), r.recordsRead(), "blank trailing lines are not records");
    }

    private static String firstCo() throws IOException {
        return records("sample_CO.par").get(0);
    }

    private static LineFormatException strictError(String text) {
        return assertThrows(LineFormatException.class, () -> forEachRow(reader(text, STRICT), (b, row, i) -> { }));
    }

    private static String replace(String rec, int from, String with) {
        return rec.substring(0, from) + with + rec.substring(from + with.length());
    }

    @Test
    void shortAndLongRecordsAreLocated() throws IOException {
        String rec = firstCo();
        LineFormatException e = strictError(rec + "\n" + rec.substring(0, 150) + "\n");
        assertEquals(2, e.lineNumber());
        assertTrue(e.getMessage().startsWith("test.par:2:cols 1-150: field record:"), e.getMessage());
        assertTrue(e.getMessage().contains("found 150"), e.getMessage());
        e = strictError(rec + "X\n");
        assertTrue(e.getMessage().contains("found 161"), e.getMessage());
    }

    @Test
    void nonNumericFieldIsLocated() throws IOException {
        LineFormatException e = strictError(replace(firstCo(), 45, " 6058.9x35"));
        assertEquals("test.par:1:cols 46-55: field lower_energy: \" 6058.9x35\" (expected not a number: a number (F10.4))",
                e.getMessage());
    }

    @Test
    void nanAndNegativeWidthsAreRefused() throws IOException {
        LineFormatException e = strictError(replace(firstCo(), 35, "  NaN"));
        assertEquals("air_width", e.field());
        assertEquals(36, e.firstColumn());
        assertEquals(40, e.lastColumn());
        assertTrue(e.expected().startsWith("NaN is not allowed"), e.getMessage());
        e = strictError(replace(firstCo(), 40, "-.087"));
        assertEquals("self_width", e.field());
        assertTrue(e.expected().contains("non-negative width"), e.getMessage());
        e = strictError(replace(firstCo(), 3, "   -3.401910"));
        assertEquals("wavenumber", e.field());
    }

    @Test
    void unknownIsotopologueNamesTheRemedy() throws IOException {
        LineFormatException e = strictError(replace(firstCo(), 0, " 57"));
        assertEquals("isotopologue", e.field());
        assertTrue(e.getMessage().contains("supply its metadata"), e.getMessage());
        e = strictError(replace(firstCo(), 2, "Z"));
        assertTrue(e.getMessage().contains("isotopologue code"), e.getMessage());
    }

    @Test
    void lenientModeRejectsVerbatimAndGoesOn() throws IOException {
        String good = firstCo();
        String bad1 = replace(good, 35, "  NaN");
        String bad2 = good.substring(0, 100);
        List<String> rejected = new ArrayList<>();
        ReadOptions lenient = STRICT.withLenient(true, (file, line, record, reason) ->
                rejected.add(file + "|" + line + "|" + record + "|" + reason));
        HitranRecordReader r = reader(good + "\n" + bad1 + "\n" + good + "\r\n" + bad2 + "\n", lenient);
        int[] kept = {0};
        forEachRow(r, (b, row, i) -> kept[0]++);
        assertEquals(2, kept[0]);
        assertEquals(4, r.recordsRead());
        assertEquals(2, r.recordsRejected());
        assertEquals(2, r.linesKept());
        assertEquals("test.par|2|" + bad1 + "|cols 36-40: field air_width: \"  NaN\" (expected NaN is not allowed: a non-negative width (F5.4))",
                rejected.get(0));
        assertTrue(rejected.get(1).startsWith("test.par|4|" + bad2 + "|cols 1-100"), rejected.get(1));
        assertEquals(1, r.duplicatesSeen(), "the two good records are the same line");
    }

    /** Duplicates counted independently here by comparing record text (molecule, isotopologue, ν and quanta). */
    @Test
    void duplicatesAreKeptAndCounted() throws IOException {
        List<String> lines = new ArrayList<>(records("sample_CO2.par"));
        int expected = 0;
        for (int i = 1; i < lines.size(); i++) {
            String a = lines.get(i - 1);
            String c = lines.get(i);
            if (a.substring(0, 3).equals(c.substring(0, 3))
                    && Double.parseDouble(a.substring(3, 15)) == Double.parseDouble(c.substring(3, 15))
                    && a.substring(67, 127).equals(c.substring(67, 127))) {
                expected++;
            }
        }
        lines.add(1, lines.get(0));
        lines.add(5, lines.get(4).substring(0, 3) + lines.get(4).substring(3, 15).replace(" ", "0").substring(0, 12)
                + lines.get(4).substring(15)); // same wavenumber written with leading zeros: still a duplicate
        HitranRecordReader r = reader(String.join("\n", lines), STRICT);
        forEachRow(r, (b, row, i) -> { });
        assertEquals(expected + 2, r.duplicatesSeen());
        assertEquals(lines.size(), r.linesKept());
    }

    @Test
    void isotopologueCodesOfTheFormat() {
        // common practice of the 160-character format: 0 → 10, A → 11, B → 12
        assertEquals(Map.of('1', 1, '9', 9, '0', 10, 'A', 11, 'B', 12, 'C', -1, ' ', -1),
                Map.of('1', HitranRecordReader.isotopologueCode((byte) '1'), '9', HitranRecordReader.isotopologueCode((byte) '9'),
                        '0', HitranRecordReader.isotopologueCode((byte) '0'), 'A', HitranRecordReader.isotopologueCode((byte) 'A'),
                        'B', HitranRecordReader.isotopologueCode((byte) 'B'), 'C', HitranRecordReader.isotopologueCode((byte) 'C'),
                        ' ', HitranRecordReader.isotopologueCode((byte) ' ')));
    }

    @Test
    void emptyInputHasNoLines() throws IOException {
        HitranRecordReader r = reader("\n  \n", STRICT);
        assertFalse(r.read(new LineBatch(4)));
        assertEquals(0, r.recordsRead());
    }
}
