package org.linewright.ingest.exomol;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.zip.GZIPInputStream;
import java.util.zip.GZIPOutputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.ingest.line.Broadener;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.source.LineFormatException;
import org.linewright.ingest.source.ReadOptions;
import org.linewright.ingest.source.StreamOpener;

/**
 * Hand-made sets in the ExoMol layout. The states are the ¹²C¹⁶O ground-state levels J = 0..5, with energies
 * summed from the published pure-rotation line positions of HITRAN2020 (I.E. Gordon et al., JQSRT 277 (2022)
 * 107949; records of reference-data/hitran2020-samples/sample_CO.par): R(0)..R(4) at 3.845033, 7.689920,
 * 11.534513, 15.378665, 19.222229 cm⁻¹, so E(J) = 0, 3.845033, 11.534953, 23.069466, 38.448131, 57.670360 cm⁻¹;
 * g = 2J+1 (no nuclear spin degeneracy for ¹²C and ¹⁶O, common practice). The A values and intensities S(296 K)
 * of the same records are the references for the intensities.
 */
class ExomolReaderTest {
    static final double[] ENERGY = {0.0, 3.845033, 11.534953, 23.069466, 38.448131, 57.670360};
    /** HITRAN2020 R(J) records: A in s⁻¹ and S(296 K) in cm/molecule (sample_CO.par). */
    static final double[] A_R = {7.207e-8, 6.914e-7, 2.497e-6, 6.129e-6, 1.222e-5};
    static final double[] S_R = {3.300e-24, 2.566e-23, 8.256e-23, 1.830e-22, 3.280e-22};
    static final double[] NU_R = {3.845033, 7.689920, 11.534513, 15.378665, 19.222229};

    /** c = 2.99792458e10 cm/s and c2 = 1.438776877 cm K (CODATA 2018), written out here. */
    static double intensityByTheFormula(double a, double nu, double gUpper, double lowerEnergy, double q, double abundance) {
        return abundance * a * gUpper / (8 * Math.PI * 2.99792458e10 * nu * nu)
                * Math.exp(-1.438776877 * lowerEnergy / 296.0) * (1 - Math.exp(-1.438776877 * nu / 296.0)) / q;
    }

    @TempDir
    Path dir;

    private final CarbonMonoxideLookup registry = new CarbonMonoxideLookup();

    private void write(String name, String text) throws IOException {
        Files.writeString(dir.resolve(name), text, StandardCharsets.US_ASCII);
    }

    private String states(long[] ids) {
        StringBuilder sb = new StringBuilder();
        for (int j = 0; j < ENERGY.length; j++) {
            sb.append(String.format(Locale.ROOT, "%12d %12.6f %6d %7d + e X1Sigma+ 0%n", ids[j], ENERGY[j], 2 * j + 1, j));
        }
        return sb.toString();
    }

    private String transitions(long[] ids, boolean withWavenumber) {
        StringBuilder sb = new StringBuilder();
        for (int j = 0; j < A_R.length; j++) {
            sb.append(String.format(Locale.ROOT, "%12d %12d %10.4e", ids[j + 1], ids[j], A_R[j]));
            if (withWavenumber) {
                sb.append(String.format(Locale.ROOT, " %15.6f", NU_R[j]));
            }
            sb.append('\n');
        }
        return sb.toString();
    }

    private static final String PF = "  295.0     107.0700\n  296.0     107.4200\n  297.0     107.7700\n";

    private List<double[]> readAll(ExomolReader reader, int capacity) throws IOException {
        LineBatch batch = new LineBatch(capacity);
        List<double[]> rows = new ArrayList<>();
        while (reader.read(batch)) {
            for (int r = 0; r < batch.size; r++) {
                rows.add(new double[] {batch.wavenumberCm1[r], batch.intensityCmPerMolecule[r], batch.einsteinAS1[r],
                    batch.lowerEnergyCm1[r], batch.upperEnergyCm1[r], batch.upperDegeneracy[r], batch.lowerDegeneracy[r],
                    batch.upperJ[r], batch.lowerJ[r], batch.sourceLine[r]});
            }
        }
        return rows;
    }

    @Test
    void joinsStatesComputesWavenumbersAndIntensitiesOfThePublishedLines() throws IOException {
        long[] ids = {1, 2, 3, 4, 5, 6};
        write("12C-16O__Synth.states", states(ids));
        write("12C-16O__Synth.trans", transitions(ids, false));
        write("12C-16O__Synth.pf", PF);
        try (ExomolReader reader = ExomolReader.open(dir.resolve("12C-16O__Synth.states"), Files::newInputStream,
                ReadOptions.strict(registry))) {
            assertEquals(107.42, reader.partitionSumAt296K(), 0.0);
            assertEquals(6, reader.stateCount());
            LineBatch batch = new LineBatch(16);
            assertTrue(reader.read(batch));
            assertEquals(5, batch.size);
            for (int j = 0; j < 5; j++) {
                // E' - E'' reproduces the published position (energies were summed from the positions, 1e-6 rounding)
                assertEquals(NU_R[j], batch.wavenumberCm1[j], 2e-6);
                // S(296 K) against the published intensity: rounding of S and A (4 digits) and Q
                assertEquals(S_R[j], batch.intensityCmPerMolecule[j], S_R[j] * 1.5e-3, "R(" + j + ")");
                double independent = intensityByTheFormula(A_R[j], ENERGY[j + 1] - ENERGY[j], 2 * j + 3, ENERGY[j],
                        107.42, 0.986544);
                assertEquals(independent, batch.intensityCmPerMolecule[j], independent * 1e-12);
                assertEquals(A_R[j], batch.einsteinAS1[j], 0.0);
                assertEquals(ENERGY[j], batch.lowerEnergyCm1[j], 0.0);
                assertEquals(ENERGY[j + 1], batch.upperEnergyCm1[j], 0.0);
                assertEquals(2 * j + 3, batch.upperDegeneracy[j], 0.0);
                assertEquals(2 * j + 1, batch.lowerDegeneracy[j], 0.0);
                assertEquals(j + 1, batch.upperJ[j], 0.0);
                assertEquals(j, batch.lowerJ[j], 0.0);
                assertEquals(CarbonMonoxideLookup.MOLECULE, batch.moleculeId[j]);
                assertEquals(CarbonMonoxideLookup.ISOTOPOLOGUE, batch.isotopologue[j]);
                assertEquals(j + 1, batch.sourceLine[j]);
                assertEquals("+ e X1Sigma+ 0", batch.upperGlobalQuanta.get(j));
                assertEquals(Integer.toString(j + 1), batch.upperLocalQuanta.get(j));
                assertEquals(Integer.toString(j), batch.lowerLocalQuanta.get(j));
                assertTrue(Double.isNaN(batch.airWidthCm1PerAtm[j]));
                assertTrue(Double.isNaN(batch.wavenumberUncertaintyCm1[j]));
            }
            assertFalse(reader.read(batch));
            assertEquals(5, reader.recordsRead());
            assertEquals(0, reader.recordsRejected());
        }
    }

    @Test
    void givenWavenumberColumnIsUsedAndSparseUnorderedIdsAreJoined() throws IOException {
        // ids far apart (forces the sorted index) and in no order
        long[] ids = {900_000_000L, 7, 123_456, 3, 2_000_000_000L, 42};
        String s = states(ids);
        String[] lines = s.split("\n");
        write("12C-16O__Sparse.states", lines[3] + "\n" + lines[0] + "\n" + lines[5] + "\n" + lines[1] + "\n"
                + lines[4] + "\n" + lines[2] + "\n");
        write("12C-16O__Sparse.trans", transitions(ids, true));
        write("12C-16O__Sparse.pf", PF);
        try (ExomolReader reader = ExomolReader.open(dir.resolve("12C-16O__Sparse.trans"), Files::newInputStream,
                ReadOptions.strict(registry))) {
            List<double[]> rows = readAll(reader, 8);
            assertEquals(5, rows.size());
            for (int j = 0; j < 5; j++) {
                assertEquals(NU_R[j], rows.get(j)[0], 0.0);
                assertEquals(ENERGY[j], rows.get(j)[3], 0.0);
                assertEquals(ENERGY[j + 1], rows.get(j)[4], 0.0);
                assertEquals(j + 1, rows.get(j)[7], 0.0);
            }
        }
        // dense but unordered ids with gaps (direct table)
        long[] dense = {6, 1, 5, 2, 4, 3};
        write("12C-16O__Dense.states", states(dense));
        write("12C-16O__Dense.trans", transitions(dense, false));
        write("12C-16O__Dense.pf", PF);
        try (ExomolReader reader = ExomolReader.open(dir.resolve("12C-16O__Dense.pf"), Files::newInputStream,
                ReadOptions.strict(registry))) {
            List<double[]> rows = readAll(reader, 8);
            for (int j = 0; j < 5; j++) {
                assertEquals(NU_R[j], rows.get(j)[0], 2e-6);
            }
        }
    }

    @Test
    void streamsManyTransitionsOverSeveralCompressedFilesInBatches() throws IOException {
        long[] ids = {1, 2, 3, 4, 5, 6};
        gzip("12C-16O__Big.states.gz", states(ids));
        gzip("12C-16O__Big.pf.gz", PF);
        // 2 files x 1300 transitions, read with batches of 1000: 3 batches (1000, 1000, 600)
        StringBuilder low = new StringBuilder();
        StringBuilder high = new StringBuilder();
        for (int k = 0; k < 1300; k++) {
            int j = k % 5;
            low.append(ids[j + 1]).append(' ').append(ids[j]).append(' ').append(String.format(Locale.ROOT, "%.4e", A_R[j])).append('\n');
            high.append(ids[j + 1]).append(' ').append(ids[j]).append(' ').append(String.format(Locale.ROOT, "%.4e", A_R[j] * 2)).append('\n');
        }
        gzip("12C-16O__Big__00010-00020.trans.gz", high.toString());
        gzip("12C-16O__Big__00000-00010.trans.gz", low.toString());
        StreamOpener gunzip = p -> {
            InputStream in = Files.newInputStream(p);
            return p.toString().endsWith(".gz") ? new GZIPInputStream(in) : in;
        };
        try (ExomolReader reader = ExomolReader.open(dir.resolve("12C-16O__Big__00010-00020.trans.gz"), gunzip,
                ReadOptions.strict(registry))) {
            LineBatch batch = new LineBatch(1000);
            int[] sizes = new int[4];
            int batches = 0;
            int index = 0;
            while (reader.read(batch)) {
                sizes[batches++] = batch.size;
                for (int r = 0; r < batch.size; r++, index++) {
                    int j = index % 1300 % 5;
                    // files in order of their range: the first 1300 lines carry A, the next 1300 carry 2A
                    double a = index < 1300 ? A_R[j] : 2 * A_R[j];
                    assertEquals(a, batch.einsteinAS1[r], a * 1e-15);
                    assertEquals(index % 1300 + 1, batch.sourceLine[r]);
                }
            }
            assertEquals(3, batches);
            assertArrayEquals(new int[] {1000, 1000, 600, 0}, sizes);
            assertEquals(2600, reader.recordsRead());
        }
    }

    private void gzip(String name, String text) throws IOException {
        try (OutputStream out = new GZIPOutputStream(Files.newOutputStream(dir.resolve(name)))) {
            out.write(text.getBytes(StandardCharsets.US_ASCII));
        }
    }

    @Test
    void definitionAnnouncesUncertaintyAndBroadeningFilesFillWidthsByLowerJ() throws IOException {
        write("12C-16O__Def.def", String.join("\n",
                "EXOMOL.def                                                                      # ID",
                "12C-16O                                                                         # Iso-slug",
                "1                                                                               # Uncertainty availability (1=yes, 0=no)",
                "0                                                                               # Lifetime availability (1=yes, 0=no)",
                "0                                                                               # Lande g-factor availability (1=yes, 0=no)",
                ""));
        StringBuilder s = new StringBuilder();
        double[] unc = {0.0, 0.0003, 0.0004, 0.001, 0.002, 0.003};
        for (int j = 0; j < ENERGY.length; j++) {
            s.append(String.format(Locale.ROOT, "%d %.6f %d %d %.6f Ma v=0%n", j + 1, ENERGY[j], 2 * j + 1, j, unc[j]));
        }
        write("12C-16O__Def.states", s.toString());
        write("12C-16O__Def.trans", transitions(new long[] {1, 2, 3, 4, 5, 6}, false));
        write("12C-16O__Def.pf", PF);
        // invented synthetic widths; J''=0..2 tabulated, default row without J''
        write("12C-16O__H2.broad", "a0 0.0700 0.500\na1 0.0650 0.600 0\na1 0.0640 0.610 2\na1 0.0630 0.620 1\n");
        write("12C-16O__air.broad", "a1 0.0500 0.700 0\n");
        try (ExomolReader reader = ExomolReader.open(dir.resolve("12C-16O__H2.broad"), Files::newInputStream,
                ReadOptions.strict(registry))) {
            assertEquals(List.of("H2", "air"), List.copyOf(reader.broadening().keySet()));
            BroadeningTable h2 = reader.broadening().get("H2");
            assertArrayEquals(new double[] {0, 1, 2}, h2.lowerJ());
            assertArrayEquals(new double[] {0.065, 0.063, 0.064}, h2.widthsCm1PerAtm());
            assertEquals(0.07, h2.defaultWidthCm1PerAtm(), 0.0);
            LineBatch batch = new LineBatch(8);
            assertTrue(reader.read(batch));
            int h = Broadener.H2.ordinal();
            double[] expectedWidth = {0.065, 0.063, 0.064, 0.064, 0.064}; // J''=3,4 above the table: last row
            for (int j = 0; j < 5; j++) {
                assertEquals(Math.sqrt(unc[j] * unc[j] + unc[j + 1] * unc[j + 1]), batch.wavenumberUncertaintyCm1[j], 1e-15);
                assertEquals(expectedWidth[j], batch.foreignWidthCm1PerAtm[h][j], 0.0);
                assertEquals("Ma v=0", batch.lowerGlobalQuanta.get(j));
                assertEquals(0.05, batch.airWidthCm1PerAtm[j], 0.0);
                assertEquals(0.7, batch.airWidthExponent[j], 0.0);
                assertTrue(Double.isNaN(batch.foreignWidthCm1PerAtm[Broadener.HE.ordinal()][j]));
            }
            assertEquals(0.61, batch.foreignWidthExponent[h][2], 0.0);
        }
    }

    @Test
    void partitionSumIsInterpolatedAndFallsBackToTheRegistry() throws IOException {
        long[] ids = {1, 2, 3, 4, 5, 6};
        write("12C-16O__Pf.states", states(ids));
        write("12C-16O__Pf.trans", transitions(ids, false));
        write("12C-16O__Pf.pf", "   290.0   100.0\n   300.0   110.0\n");
        try (ExomolReader reader = ExomolReader.open(dir.resolve("12C-16O__Pf.def"), Files::newInputStream,
                ReadOptions.strict(registry))) {
            assertEquals(106.0, reader.partitionSumAt296K(), 1e-12); // linear: 100 + 0.6 * 10
            assertArrayEquals(new double[] {290, 300}, reader.partitionFunction().temperaturesK());
        }
        write("12C-16O__NoPf.states", states(ids));
        write("12C-16O__NoPf.trans", transitions(ids, false));
        try (ExomolReader reader = ExomolReader.open(dir.resolve("12C-16O__NoPf.states"), Files::newInputStream,
                ReadOptions.strict(registry))) {
            assertNull(reader.partitionFunction());
            assertEquals(CarbonMonoxideLookup.directSum(296.0), reader.partitionSumAt296K(), 0.0);
            // the direct sum reproduces the published Q(296 K) = 107.42 (HITRAN metadata) to 5e-6
            assertEquals(107.42, reader.partitionSumAt296K(), 107.42 * 5e-6);
        }
    }

    @Test
    void badFieldsAreLocatedOnOneLine() throws IOException {
        long[] ids = {1, 2, 3, 4, 5, 6};
        write("12C-16O__Bad.states", states(ids));
        write("12C-16O__Bad.pf", PF);
        write("12C-16O__Bad.trans", "2 1 7.207e-08\n3 2 6.9x4e-07\n");
        LineFormatException e = assertThrows(LineFormatException.class, () -> readAll(
                ExomolReader.open(dir.resolve("12C-16O__Bad.trans"), Files::newInputStream, ReadOptions.strict(registry)), 4));
        assertEquals("12C-16O__Bad.trans:2:cols 5-13: field A: \"6.9x4e-07\" (expected a non-negative number in s-1)",
                e.getMessage());

        write("12C-16O__Bad.trans", "2 1 7.207e-08\n3 99 6.914e-07\n");
        e = assertThrows(LineFormatException.class, () -> readAll(
                ExomolReader.open(dir.resolve("12C-16O__Bad.trans"), Files::newInputStream, ReadOptions.strict(registry)), 4));
        assertEquals(2, e.lineNumber());
        assertEquals("lower state id", e.field());
        assertEquals("99", e.offendingText());
        assertTrue(e.getMessage().contains("12C-16O__Bad.states"), e.getMessage());

        write("12C-16O__Neg.states", "1 0.0 1 0\n2 -3.845033 3 1\n");
        write("12C-16O__Neg.trans", "2 1 7.207e-08\n");
        e = assertThrows(LineFormatException.class, () -> ExomolReader.open(dir.resolve("12C-16O__Neg.trans"),
                Files::newInputStream, ReadOptions.strict(registry)));
        assertEquals("12C-16O__Neg.states:2:cols 3-11: field energy: \"-3.845033\" (expected a non-negative energy in cm-1)",
                e.getMessage());

        write("12C-16O__Lost.trans", "2 1 7.207e-08\n");
        e = assertThrows(LineFormatException.class, () -> ExomolReader.open(dir.resolve("12C-16O__Lost.trans"),
                Files::newInputStream, ReadOptions.strict(registry)));
        assertTrue(e.getMessage().startsWith("12C-16O__Lost.states: states file not found"), e.getMessage());

        write("13C-16O__X.states", "1 0.0 1 0\n");
        write("13C-16O__X.trans", "");
        e = assertThrows(LineFormatException.class, () -> ExomolReader.open(dir.resolve("13C-16O__X.states"),
                Files::newInputStream, ReadOptions.strict(registry)));
        assertTrue(e.getMessage().contains("unknown isotopologue '13C-16O'"), e.getMessage());
        assertTrue(e.getMessage().contains("add it to the isotopologue registry"), e.getMessage());
    }

    @Test
    void lenientModeRejectsAndCountsBadRecords() throws IOException {
        StringBuilder s = new StringBuilder(states(new long[] {1, 2, 3, 4, 5, 6}));
        s.append("7 abc 1 0\n");
        write("12C-16O__Len.states", s.toString());
        write("12C-16O__Len.pf", PF);
        write("12C-16O__Len.trans", "2 1 7.207e-08\n7 1 1e-3\n3 2 oops\n3 3 1e-3\n\n4 3 2.497e-06\n");
        List<String> rejects = new ArrayList<>();
        ReadOptions lenient = ReadOptions.strict(registry).withLenient(true,
                (file, line, record, reason) -> rejects.add(file + ":" + line + " [" + record + "] " + reason));
        try (ExomolReader reader = ExomolReader.open(dir.resolve("12C-16O__Len.states"), Files::newInputStream, lenient)) {
            assertEquals(1, reader.statesRejected());
            List<double[]> rows = readAll(reader, 2);
            assertEquals(2, rows.size());
            assertEquals(5, reader.recordsRead());
            assertEquals(3, reader.recordsRejected());
            assertEquals(reader.recordsRead(), reader.linesKept() + reader.recordsRejected());
            assertEquals(6, rows.get(1)[9], 0.0); // source line of the last kept transition
        }
        assertEquals(4, rejects.size());
        assertEquals("12C-16O__Len.states:7 [7 abc 1 0] cols 3-5: field energy: \"abc\" (expected a number in cm-1)",
                rejects.get(0));
        assertTrue(rejects.get(1).startsWith("12C-16O__Len.trans:2 [7 1 1e-3] col 1: field upper state id"), rejects.get(1));
        assertTrue(rejects.get(2).startsWith("12C-16O__Len.trans:3 [3 2 oops] cols 5-8: field A"), rejects.get(2));
        assertTrue(rejects.get(3).startsWith("12C-16O__Len.trans:4 [3 3 1e-3] cols 1-3: field state ids"), rejects.get(3));
    }
}
