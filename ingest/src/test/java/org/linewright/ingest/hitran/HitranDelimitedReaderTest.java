package org.linewright.ingest.hitran;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.linewright.ingest.line.Broadener;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.source.LineFormatException;
import org.linewright.ingest.source.ReadOptions;
import org.linewright.ingest.testsupport.ReferenceSamples;
import org.linewright.ingest.testsupport.SampleIsotopologues;

/**
 * Delimited copies of the real samples are built here from {@code sample_X_out.par}: each line's
 * 160-character record gives the base columns (cut at the columns of the 2004 layout, common practice),
 * and the comma-separated triples after it (README of the samples) give the broadener columns.
 */
class HitranDelimitedReaderTest {
    private static final ReadOptions STRICT = ReadOptions.strict(new SampleIsotopologues());
    private static final String[] BASE = {"molec_id", "local_iso_id", "nu", "sw", "a", "gamma_air", "gamma_self",
        "elower", "n_air", "delta_air", "global_upper_quanta", "global_lower_quanta", "local_upper_quanta",
        "local_lower_quanta", "ierr", "iref", "line_mixing_flag", "gp", "gpp"};
    private static final int[][] BASE_COLUMNS = {{0, 2}, {2, 3}, {3, 15}, {15, 25}, {25, 35}, {35, 40}, {40, 45},
        {45, 55}, {55, 59}, {59, 67}, {67, 82}, {82, 97}, {97, 112}, {112, 127}, {127, 133}, {133, 145}, {145, 146},
        {146, 153}, {153, 160}};
    private static final int FIRST_TEXT = 10;
    private static final int LAST_TEXT = 16;

    /** Broadener columns of each file, in the order of its triples (README of the samples). */
    private static String[] broadenerColumns(String molecule) {
        switch (molecule) {
            case "CO":
            case "CO2": return new String[] {"gamma_He", "n_He", "gamma_H2", "n_H2", "gamma_CO2", "n_CO2"};
            case "N2O": return new String[] {"gamma_He", "n_He"};
            default: return new String[] {"gamma_He", "n_He", "gamma_H2", "n_H2"};
        }
    }

    private static String quote(String s) {
        return '"' + s.replace("\"", "\"\"") + '"';
    }

    @ParameterizedTest
    @CsvSource({"CO,','", "CO2,'\t'", "N2O,','", "PH3,'\t'"})
    void delimitedCopiesOfTheSamplesGiveEveryValue(String molecule, char delimiter) throws IOException {
        List<String> lines = ReferenceSamples.lines(ReferenceSamples.hitranSample("sample_" + molecule + "_out.par"));
        String[] extra = broadenerColumns(molecule);
        StringBuilder csv = new StringBuilder();
        List<String> header = new ArrayList<>(List.of(BASE));
        header.add("remark");
        header.addAll(List.of(extra));
        csv.append(String.join(String.valueOf(delimiter), header)).append("\r\n");
        List<String[]> values = new ArrayList<>();
        for (String line : lines) {
            String rec = line.substring(0, 160);
            String[] triples = line.substring(160).split(",", -1);
            List<String> row = new ArrayList<>();
            String[] expected = new String[BASE.length + extra.length];
            for (int k = 0; k < BASE.length; k++) {
                String v = rec.substring(BASE_COLUMNS[k][0], BASE_COLUMNS[k][1]);
                boolean text = k >= FIRST_TEXT && k <= LAST_TEXT;
                row.add(text ? quote(v) : v.trim());
                expected[k] = text ? v : v.trim();
            }
            row.add(quote("synthetic remark, ignored"));
            for (int k = 0; k < extra.length; k++) {
                String v = triples[1 + 3 * k].trim();
                row.add(v);
                expected[BASE.length + k] = v;
            }
            values.add(expected);
            csv.append(String.join(String.valueOf(delimiter), row)).append('\n');
        }
        HitranDelimitedReader r = new HitranDelimitedReader(
                new ByteArrayInputStream(csv.toString().getBytes(StandardCharsets.UTF_8)), "copy.csv", STRICT);
        assertEquals(delimiter, r.delimiter());
        assertEquals(List.of("remark"), r.ignoredColumns());
        LineBatch b = new LineBatch(1000);
        int i = 0;
        while (r.read(b)) {
            for (int row = 0; row < b.size; row++, i++) {
                String[] e = values.get(i);
                assertEquals(Integer.parseInt(e[0]), b.moleculeId[row]);
                assertEquals(HitranRecordReader.isotopologueCode((byte) e[1].charAt(0)), b.isotopologue[row]);
                double[][] numeric = {{2, b.wavenumberCm1[row]}, {3, b.intensityCmPerMolecule[row]}, {4, b.einsteinAS1[row]},
                    {5, b.airWidthCm1PerAtm[row]}, {6, b.selfWidthCm1PerAtm[row]}, {7, b.lowerEnergyCm1[row]},
                    {8, b.airWidthExponent[row]}, {9, b.airShiftCm1PerAtm[row]}, {17, b.upperDegeneracy[row]},
                    {18, b.lowerDegeneracy[row]}};
                for (double[] n : numeric) {
                    assertEquals(Double.doubleToRawLongBits(Double.parseDouble(e[(int) n[0]])), Double.doubleToRawLongBits(n[1]),
                            molecule + " row " + (i + 1) + " " + BASE[(int) n[0]]);
                }
                assertEquals(e[10], b.upperGlobalQuanta.get(row));
                assertEquals(e[11], b.lowerGlobalQuanta.get(row));
                assertEquals(e[12], b.upperLocalQuanta.get(row));
                assertEquals(e[13], b.lowerLocalQuanta.get(row));
                assertEquals(e[14], b.uncertaintyCodes.get(row));
                assertEquals(e[15], b.referenceCodes.get(row));
                assertEquals(e[16], b.lineMixingFlag.get(row));
                for (Broadener br : Broadener.values()) {
                    double width = Double.NaN;
                    double exponent = Double.NaN;
                    for (int k = 0; k < extra.length; k++) {
                        String name = extra[k].substring(extra[k].indexOf('_') + 1);
                        if (name.equalsIgnoreCase(br.name())) {
                            double v = Double.parseDouble(e[BASE.length + k]);
                            if (extra[k].startsWith("gamma")) {
                                width = v;
                            } else {
                                exponent = v;
                            }
                        }
                    }
                    assertEquals(width, b.foreignWidthCm1PerAtm[br.ordinal()][row], 0.0, molecule + " row " + (i + 1) + " " + br);
                    assertEquals(exponent, b.foreignWidthExponent[br.ordinal()][row], 0.0);
                    assertTrue(Double.isNaN(b.foreignShiftCm1PerAtm[br.ordinal()][row]));
                }
                // J from the 15-character local quanta, as in the fixed-column reader (common practice)
                String lower = e[13];
                if (!molecule.equals("PH3")) {
                    assertEquals(Integer.parseInt(lower.substring(6, 9).trim()), b.lowerJ[row]);
                } else {
                    assertEquals(Integer.parseInt(e[12].substring(0, 3).trim()), b.upperJ[row]);
                }
            }
        }
        assertEquals(lines.size(), i);
        assertEquals(lines.size(), r.recordsRead());
    }

    private static HitranDelimitedReader reader(String text, ReadOptions options) throws IOException {
        return new HitranDelimitedReader(new ByteArrayInputStream(text.getBytes(StandardCharsets.UTF_8)), "t.csv", options);
    }

    private static final String HEADER = "molec_id,local_iso_id,nu,sw,elower,gamma_air,n_air,gamma_self,delta_H2,local_lower_quanta\n";

    @Test
    void providesTheBroadenerColumnsItsHeaderNamesOnly() throws IOException {
        HitranDelimitedReader r = reader(HEADER + "5,1,2100.5,1.0E-20,10.0,0.05,0.7,,-0.002,\"R 1, synthetic\"\n", STRICT);
        java.util.Set<LineColumn> provided = r.columnsProvided();
        // The header above names delta_H2 and no other broadener column.
        assertTrue(provided.contains(LineColumn.H2_SHIFT));
        for (LineColumn absent : List.of(LineColumn.H2_WIDTH, LineColumn.H2_WIDTH_EXPONENT, LineColumn.HE_WIDTH,
                LineColumn.HE_SHIFT, LineColumn.CO2_WIDTH, LineColumn.H2O_WIDTH_EXPONENT, LineColumn.UPPER_ENERGY,
                LineColumn.WAVENUMBER_UNCERTAINTY)) {
            assertFalse(provided.contains(absent), absent.columnName());
        }
        for (LineColumn present : List.of(LineColumn.MOLECULE, LineColumn.WAVENUMBER, LineColumn.AIR_WIDTH,
                LineColumn.LOWER_LOCAL_QUANTA, LineColumn.SOURCE_LINE)) {
            assertTrue(provided.contains(present), present.columnName());
        }
    }

    @Test
    void missingOptionalValuesAreNaNAndQuotedCommasStay() throws IOException {
        // synthetic rows (invented values)
        HitranDelimitedReader r = reader(HEADER + "5,1,2100.5,1.0E-20,10.0,0.05,0.7,#,,\"R 1, synthetic\"\n"
                + "5,1,2100.5,1.0E-20,10.0,0.05,0.7,,-0.002,\"R 1, synthetic\"\n", STRICT);
        LineBatch b = new LineBatch(8);
        r.read(b);
        assertEquals(2, b.size);
        assertTrue(Double.isNaN(b.selfWidthCm1PerAtm[0]));
        assertTrue(Double.isNaN(b.foreignShiftCm1PerAtm[Broadener.H2.ordinal()][0]));
        assertEquals(-0.002, b.foreignShiftCm1PerAtm[Broadener.H2.ordinal()][1]);
        assertTrue(Double.isNaN(b.einsteinAS1[0]), "absent column");
        assertEquals("R 1, synthetic", b.lowerLocalQuanta.get(0));
        assertEquals("", b.upperLocalQuanta.get(0));
        assertEquals(1, r.duplicatesSeen());
    }

    @Test
    void missingRequiredColumnIsOneLine() {
        LineFormatException e = assertThrows(LineFormatException.class,
                () -> reader("molec_id,local_iso_id,nu,sw,gamma_air\n5,1,1,1,1\n", STRICT));
        assertEquals("t.csv:1: field header: missing required column(s) n_air, elower (the header must name molec_id, "
                + "local_iso_id, nu, sw, elower, gamma_air, n_air)", e.getMessage());
    }

    @Test
    void badValuesAreLocatedAndLenientRejects() throws IOException {
        String good = "5,1,2100.5,1.0E-20,10.0,0.05,0.7,0.06,,\n";
        LineFormatException e = assertThrows(LineFormatException.class,
                () -> reader(HEADER + good + "5,1,2100.5,1.0E-20,,0.05,0.7,0.06,,\n", STRICT).read(new LineBatch(8)));
        assertEquals("t.csv:3:col 20: field elower: \"\" (expected a value (elower is required))", e.getMessage());
        e = assertThrows(LineFormatException.class,
                () -> reader(HEADER + "5,1,2100.5,1.0E-20,10.0,-0.05,0.7,0.06,,\n", STRICT).read(new LineBatch(8)));
        assertEquals("gamma_air", e.field());
        e = assertThrows(LineFormatException.class,
                () -> reader(HEADER + "5,9,2100.5,1.0E-20,10.0,0.05,0.7,0.06,,\n", STRICT).read(new LineBatch(8)));
        assertTrue(e.getMessage().contains("supply its metadata"), e.getMessage());
        e = assertThrows(LineFormatException.class,
                () -> reader(HEADER + "5,1,2100.5\n", STRICT).read(new LineBatch(8)));
        assertTrue(e.getMessage().contains("10 fields as in the header, found 3"), e.getMessage());
        List<String> rejects = new ArrayList<>();
        HitranDelimitedReader r = reader(HEADER + good + "5,1,abc,1.0E-20,10.0,0.05,0.7,0.06,,\n" + good,
                STRICT.withLenient(true, (f, n, rec, why) -> rejects.add(n + "|" + rec + "|" + why)));
        LineBatch b = new LineBatch(8);
        r.read(b);
        assertEquals(2, b.size);
        assertEquals(1, r.recordsRejected());
        assertEquals(List.of("3|5,1,abc,1.0E-20,10.0,0.05,0.7,0.06,,|cols 5-7: field nu: \"abc\" (expected not a number: a non-negative wavenumber)"),
                rejects);
    }
}
