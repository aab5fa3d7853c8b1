package org.linewright.ingest.catalog;

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
import org.linewright.ingest.exomol.CarbonMonoxideLookup;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.source.LineFormatException;
import org.linewright.ingest.source.ReadOptions;

class CatalogReaderTest {
    /**
     * ¹²C¹⁶O J = 1–0, 2–1, 3–2 as catalog records (species 28001; FREQ, LGINT and ELO from memory of the
     * microwave catalog, laid out in the 80-column format of Pickett et al. 1998).
     */
    static final String CO_LINES =
            "  115271.2018  0.0005 -5.0105 2    0.0000  3 -28001 101 1           0          \n"
            + "  230538.0000  0.0005 -4.1197 2    3.8450  5 -28001 101 2           1          \n"
            + "  345795.9899  0.0005 -3.6118 2   11.5350  7 -28001 101 3           2          \n";
    /**
     * The same lines in HITRAN2020 (I.E. Gordon et al., JQSRT 277 (2022) 107949; records of
     * reference-data/hitran2020-samples/sample_CO.par): ν (cm⁻¹), S(296 K) abundance-weighted, A (s⁻¹).
     */
    static final double[] NU_HITRAN = {3.845033, 7.689920, 11.534513};
    static final double[] S_HITRAN = {3.300e-24, 2.566e-23, 8.256e-23};
    static final double[] A_HITRAN = {7.207e-8, 6.914e-7, 2.497e-6};

    private final CarbonMonoxideLookup registry = new CarbonMonoxideLookup();

    private CatalogReader reader(String text, ReadOptions options) {
        return new CatalogReader(new ByteArrayInputStream(text.getBytes(StandardCharsets.US_ASCII)), "c028001.cat", options);
    }

    @Test
    void carbonMonoxideLinesAgreeWithTheIndependentLineList() throws IOException {
        LineBatch batch = new LineBatch(8);
        try (CatalogReader r = reader(CO_LINES, ReadOptions.strict(registry))) {
            assertTrue(r.read(batch));
            assertEquals(3, batch.size);
            // 115271.2018 MHz / 29979.2458 MHz per cm-1 = 3.845033 cm-1 (common practice; c exact by SI definition)
            assertEquals(3.845033413, batch.wavenumberCm1[0], 1e-9);
            for (int k = 0; k < 3; k++) {
                assertEquals(NU_HITRAN[k], batch.wavenumberCm1[k], 1e-6);
                // S(296 K): LGINT to 4 decimals (2.3e-4), S to 4 digits (1.5e-4), Q(300)/Q(296) model: 1e-3 in all.
                // Without the natural abundance (0.986544) the values would be 1.4 % high and fail.
                assertEquals(S_HITRAN[k], batch.intensityCmPerMolecule[k], S_HITRAN[k] * 1e-3, "S of line " + k);
                // A derived from S with g' = GUP and Q(296 K): as above plus the 4 digits of A
                assertEquals(A_HITRAN[k], batch.einsteinAS1[k], A_HITRAN[k] * 1.5e-3, "A of line " + k);
                assertEquals(0.0005 / 29979.2458, batch.wavenumberUncertaintyCm1[k], 1e-15);
                assertEquals(2 * k + 3, batch.upperDegeneracy[k], 0.0);
                assertTrue(Double.isNaN(batch.lowerDegeneracy[k]));
                assertEquals(k + 1, batch.upperJ[k], 0.0);
                assertEquals(k, batch.lowerJ[k], 0.0);
                assertEquals(Integer.toString(k + 1), batch.upperLocalQuanta.get(k));
                assertEquals(Integer.toString(k), batch.lowerLocalQuanta.get(k));
                assertEquals("-28001", batch.referenceCodes.get(k));
                assertEquals(k + 1, batch.sourceLine[k]);
                assertEquals(5, batch.moleculeId[k]);
                assertEquals(1, batch.isotopologue[k]);
                assertEquals(batch.lowerEnergyCm1[k] + batch.wavenumberCm1[k], batch.upperEnergyCm1[k], 0.0);
            }
            assertEquals(3.8450, batch.lowerEnergyCm1[1], 0.0);
            assertFalse(r.read(batch));
            assertEquals(3, r.recordsRead());
        }
    }

    /** c·10⁸ with c = 299 792 458 m/s exact (SI 2019): 10^LGINT nm²·MHz → cm/molecule. */
    @Test
    void intensityConversionFactor() {
        assertEquals(2.99792458e18, CatalogReader.NM2_MHZ_PER_CM_PER_MOLECULE, 2.99792458e18 * 1e-15);
    }

    @Test
    void catalogsIncludingTheAbundanceAreNotWeightedTwice() throws IOException {
        LineBatch plain = new LineBatch(4);
        LineBatch included = new LineBatch(4);
        try (CatalogReader a = reader(CO_LINES, ReadOptions.strict(registry));
             CatalogReader b = new CatalogReader(new ByteArrayInputStream(CO_LINES.getBytes(StandardCharsets.US_ASCII)),
                     "c028001.cat", ReadOptions.strict(registry), true)) {
            a.read(plain);
            b.read(included);
        }
        for (int k = 0; k < 3; k++) {
            assertEquals(plain.intensityCmPerMolecule[k] / CarbonMonoxideLookup.ABUNDANCE,
                    included.intensityCmPerMolecule[k], included.intensityCmPerMolecule[k] * 1e-14);
        }
    }

    /** Letter codes of the catalog format (from memory): GUP A23 = 1023; QN A0 = 100, a1 = -11, B9 = 119. */
    @Test
    void letterCodesAndWavenumberUnits() throws IOException {
        String line = "    1234.5678 -0.0012 -6.5000 3  100.0000A23  28001 303A0a1 5      B9-512      \n";
        LineBatch batch = new LineBatch(2);
        try (CatalogReader r = reader(line, ReadOptions.strict(registry))) {
            assertTrue(r.read(batch));
        }
        assertEquals(1023, batch.upperDegeneracy[0], 0.0);
        assertEquals("100 -11 5", batch.upperLocalQuanta.get(0));
        assertEquals("119 -5 12", batch.lowerLocalQuanta.get(0));
        assertEquals(100, batch.upperJ[0], 0.0);
        assertEquals(119, batch.lowerJ[0], 0.0);
        // negative ERR: FREQ and ERR in cm-1 (from memory)
        assertEquals(1234.5678, batch.wavenumberCm1[0], 0.0);
        assertEquals(0.0012, batch.wavenumberUncertaintyCm1[0], 0.0);
        assertEquals("28001", batch.referenceCodes.get(0));
    }

    @Test
    void badFieldsAreLocatedAndLenientModeCounts() throws IOException {
        String bad = "  115271.2018  0.0005 -5.01x5 2    0.0000  3 -28001 101 1           0          \n";
        LineFormatException e = assertThrows(LineFormatException.class,
                () -> reader(bad, ReadOptions.strict(registry)).read(new LineBatch(2)));
        assertEquals("c028001.cat:1:cols 22-29: field LGINT: \" -5.01x5\" (expected F8.4 log10 intensity in nm2 MHz)",
                e.getMessage());

        String unknownTag = "  110201.3541  0.0005 -5.0106 2    0.0000  3  29001 101 1           0          \n";
        String shortLine = "  115271.2018  0.0005 -5.0105 2\n";
        List<String> rejects = new ArrayList<>();
        ReadOptions lenient = ReadOptions.strict(registry).withLenient(true,
                (file, no, record, reason) -> rejects.add(no + ": " + reason));
        LineBatch batch = new LineBatch(2);
        int kept = 0;
        try (CatalogReader r = reader(CO_LINES + bad + "\n" + unknownTag + shortLine + CO_LINES, lenient)) {
            while (r.read(batch)) {
                kept += batch.size;
            }
            assertEquals(9, r.recordsRead());
            assertEquals(3, r.recordsRejected());
            assertEquals(6, r.linesKept());
        }
        assertEquals(6, kept);
        assertEquals(3, rejects.size());
        assertTrue(rejects.get(0).startsWith("4: cols 22-29: field LGINT"), rejects.get(0));
        assertTrue(rejects.get(1).startsWith("6: cols 45-51: field TAG: \"  29001\" (expected a species tag known"), rejects.get(1));
        assertTrue(rejects.get(2).startsWith("7: cols 1-31: field record"), rejects.get(2));
    }

    @Test
    void streamsInBatches() throws IOException {
        StringBuilder many = new StringBuilder();
        for (int i = 0; i < 1000; i++) {
            many.append(CO_LINES);
        }
        LineBatch batch = new LineBatch(256);
        int total = 0;
        int batches = 0;
        try (CatalogReader r = reader(many.toString(), ReadOptions.strict(registry))) {
            while (r.read(batch)) {
                batches++;
                for (int i = 0; i < batch.size; i++, total++) {
                    assertEquals(NU_HITRAN[total % 3], batch.wavenumberCm1[i], 1e-6);
                }
            }
        }
        assertEquals(3000, total);
        assertEquals(12, batches);
    }
}
