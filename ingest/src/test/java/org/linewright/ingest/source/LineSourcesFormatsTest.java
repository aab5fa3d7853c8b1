package org.linewright.ingest.source;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.linewright.ingest.exomol.CarbonMonoxideLookup;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.testsupport.ReferenceSamples;

/**
 * Every format end to end through {@link LineSources#open}, plain and compressed (compressed with Commons
 * Compress in the test): format detection, the file list with the SHA-256 of each file's raw bytes (reference:
 * the JDK's {@code MessageDigest}), and the lines read (reference: the published ¹²C¹⁶O pure-rotation lines).
 */
class LineSourcesFormatsTest {
    /**
     * ¹²C¹⁶O R(0), R(1), R(2) of the 160-character line list HITRAN2020 (I.E. Gordon et al., JQSRT 277 (2022)
     * 107949; records of reference-data/hitran2020-samples/sample_CO.par): ν (cm⁻¹), S(296 K) (cm/molecule,
     * abundance-weighted), A (s⁻¹), E″ (cm⁻¹).
     */
    static final double[] NU = {3.845033, 7.689920, 11.534513};
    static final double[] S = {3.300e-24, 2.566e-23, 8.256e-23};
    static final double[] A = {7.207e-8, 6.914e-7, 2.497e-6};
    static final double[] LOWER_ENERGY = {0.0, 3.8450, 11.5350};
    /** Ground-state energies E(J), J = 0..3, summed from the positions NU (cm⁻¹). */
    static final double[] STATE_ENERGY = {0.0, 3.845033, 11.534953, 23.069466};
    /**
     * The same three lines as 80-column catalog records (species 28001; FREQ, LGINT and ELO from memory of the
     * microwave catalog, laid out in the format of Pickett et al., JQSRT 60 (1998) 883).
     */
    static final String CATALOG_CO =
            "  115271.2018  0.0005 -5.0105 2    0.0000  3 -28001 101 1           0          \n"
            + "  230538.0000  0.0005 -4.1197 2    3.8450  5 -28001 101 2           1          \n"
            + "  345795.9899  0.0005 -3.6118 2   11.5350  7 -28001 101 3           2          \n";
    private static final ReadOptions STRICT = ReadOptions.strict(new CarbonMonoxideLookup());
    private static final String[] SUFFIX = {"none", "", "gzip", ".gz", "bzip2", ".bz2", "xz", ".xz", "zstd", ".zst", "zip", ".zip"};

    @TempDir
    Path dir;

    private static String suffix(String kind) {
        for (int k = 0; k < SUFFIX.length; k += 2) {
            if (SUFFIX[k].equals(kind)) {
                return SUFFIX[k + 1];
            }
        }
        throw new IllegalArgumentException(kind);
    }

    /** Writes {@code text} compressed with {@code kind}; returns the file. */
    private Path write(String name, String kind, String text) throws IOException {
        Path p = dir.resolve(name + suffix(kind));
        Files.write(p, LineSourcesTest.compress(kind, text.getBytes(StandardCharsets.US_ASCII)));
        return p;
    }

    private static OpenedSource.FileDigest digestOf(Path p) throws Exception {
        return new OpenedSource.FileDigest(p.toString(), LineSourcesTest.sha256(Files.readAllBytes(p)));
    }

    /** All lines of the source as {ν, S, A, E″} rows. */
    private static List<double[]> readAll(OpenedSource s) throws IOException {
        LineBatch batch = new LineBatch(2);
        List<double[]> rows = new ArrayList<>();
        while (s.reader().read(batch)) {
            for (int r = 0; r < batch.size; r++) {
                rows.add(new double[] {batch.wavenumberCm1[r], batch.intensityCmPerMolecule[r], batch.einsteinAS1[r],
                    batch.lowerEnergyCm1[r]});
            }
        }
        return rows;
    }

    private static void assertSingleFile(OpenedSource s, Path p, LineFormat format, String kind) throws Exception {
        assertEquals(format, s.format());
        assertEquals(kind, s.compression());
        assertEquals(p.toString(), s.fileName());
        assertEquals(List.of(digestOf(p)), s.files().get());
        assertEquals(digestOf(p).sha256Hex(), s.sha256Hex().get());
    }

    @ParameterizedTest
    @ValueSource(strings = {"none", "gzip", "bzip2", "xz", "zstd", "zip"})
    void hitran160(String kind) throws Exception {
        List<String> sample = ReferenceSamples.lines(ReferenceSamples.hitranSample("sample_CO.par"));
        StringBuilder text = new StringBuilder();
        for (String line : sample) {
            for (double nu : NU) {
                if (line.startsWith(" 51") && Double.parseDouble(line.substring(3, 15)) == nu) {
                    text.append(line).append('\n');
                }
            }
        }
        Path p = write("co-r-branch.par", kind, text.toString());
        try (OpenedSource s = LineSources.open(p, null, STRICT)) {
            List<double[]> rows = readAll(s);
            assertSingleFile(s, p, LineFormat.HITRAN160, kind);
            assertEquals(3, rows.size());
            for (int k = 0; k < 3; k++) {
                assertEquals(NU[k], rows.get(k)[0], 0.0);
                assertEquals(S[k], rows.get(k)[1], 0.0);
                assertEquals(A[k], rows.get(k)[2], 0.0);
                assertEquals(LOWER_ENERGY[k], rows.get(k)[3], 0.0);
            }
        }
    }

    @ParameterizedTest
    @ValueSource(strings = {"none", "gzip", "bzip2", "xz", "zstd", "zip"})
    void delimited(String kind) throws Exception {
        StringBuilder text = new StringBuilder("molec_id,local_iso_id,nu,sw,a,gamma_air,n_air,elower\n");
        for (int k = 0; k < 3; k++) {
            text.append(String.format(Locale.ROOT, "5,1,%.6f,%.3e,%.3e,0.0803,0.76,%.4f%n", NU[k], S[k], A[k], LOWER_ENERGY[k]));
        }
        Path p = write("co-r-branch.csv", kind, text.toString());
        try (OpenedSource s = LineSources.open(p, null, STRICT)) {
            List<double[]> rows = readAll(s);
            assertSingleFile(s, p, LineFormat.HITRAN_DELIMITED, kind);
            assertEquals(3, rows.size());
            for (int k = 0; k < 3; k++) {
                assertEquals(NU[k], rows.get(k)[0], 0.0);
                assertEquals(S[k], rows.get(k)[1], 0.0);
                assertEquals(A[k], rows.get(k)[2], 0.0);
            }
        }
    }

    @ParameterizedTest
    @ValueSource(strings = {"none", "gzip", "bzip2", "xz", "zstd", "zip"})
    void catalog(String kind) throws Exception {
        Path p = write("c028001.cat", kind, CATALOG_CO);
        try (OpenedSource s = LineSources.open(p, null, STRICT)) {
            List<double[]> rows = readAll(s);
            assertSingleFile(s, p, LineFormat.CATALOG, kind);
            assertEquals(3, rows.size());
            for (int k = 0; k < 3; k++) {
                // MHz → cm⁻¹ against the independent line list (6 decimals there)
                assertEquals(NU[k], rows.get(k)[0], 1e-6);
                // S(296 K): LGINT to 4 decimals, S to 4 digits, Q(300)/Q(296): 1e-3 in all
                assertEquals(S[k], rows.get(k)[1], S[k] * 1e-3);
            }
        }
    }

    /** The ¹²C¹⁶O levels J = 0..3 (g = 2J+1, common practice for ¹²C¹⁶O) and the R(0)..R(2) transitions. */
    private List<Path> writeSet(String kind) throws IOException {
        StringBuilder states = new StringBuilder();
        for (int j = 0; j < STATE_ENERGY.length; j++) {
            states.append(String.format(Locale.ROOT, "%12d %12.6f %6d %7d + e X1Sigma+ 0%n", j + 1, STATE_ENERGY[j], 2 * j + 1, j));
        }
        StringBuilder trans = new StringBuilder();
        for (int j = 0; j < 3; j++) {
            trans.append(String.format(Locale.ROOT, "%12d %12d %10.4e%n", j + 2, j + 1, A[j]));
        }
        List<Path> files = new ArrayList<>();
        files.add(write("12C-16O__Synth.states", kind, states.toString()));
        files.add(write("12C-16O__Synth.trans", kind, trans.toString()));
        files.add(write("12C-16O__Synth.pf", kind, "  295.0     107.0700\n  296.0     107.4200\n  297.0     107.7700\n"));
        files.add(write("12C-16O__Synth.def", kind, "12C-16O  # Iso-slug\n0  # Uncertainty availability (1=yes, 0=no)\n"));
        files.add(write("12C-16O__air.broad", kind, "a0 0.0700 0.750\n"));
        return files;
    }

    @ParameterizedTest
    @ValueSource(strings = {"none", "gzip", "bzip2", "xz", "zstd", "zip"})
    void stateTransitionSetFromEachOfItsFiles(String kind) throws Exception {
        List<Path> files = writeSet(kind);
        List<OpenedSource.FileDigest> expected = new ArrayList<>();
        for (Path p : files) {
            expected.add(digestOf(p));
        }
        for (Path given : files) {
            try (OpenedSource s = LineSources.open(given, null, STRICT)) {
                assertEquals(LineFormat.EXOMOL, s.format());
                assertEquals(kind, s.compression());
                assertEquals(given.toString(), s.fileName());
                List<double[]> rows = readAll(s);
                assertEquals(expected, s.files().get(), "set opened from " + given.getFileName());
                assertEquals(digestOf(given).sha256Hex(), s.sha256Hex().get());
                assertEquals(3, rows.size());
                for (int k = 0; k < 3; k++) {
                    // E' − E'' reproduces the published positions (energies summed from them, 1e-6 rounding)
                    assertEquals(NU[k], rows.get(k)[0], 2e-6);
                    // S(296 K) from A with Q(296 K) = 107.42 against the published S: 4-digit rounding of S and A
                    assertEquals(S[k], rows.get(k)[1], S[k] * 1.5e-3);
                    assertEquals(A[k], rows.get(k)[2], 0.0);
                }
            }
        }
    }

    /** Files the reader has not read yet (here the transitions) are hashed by a second pass over their bytes. */
    @Test
    void setDigestsBeforeTheTransitionsAreRead() throws Exception {
        List<Path> files = writeSet("gzip");
        try (OpenedSource s = LineSources.open(files.get(0), null, STRICT)) {
            List<OpenedSource.FileDigest> expected = new ArrayList<>();
            for (Path p : files) {
                expected.add(digestOf(p));
            }
            assertEquals(expected, s.files().get());
        }
    }

    /** A repeated line is kept and counted alike by every reader ({@link DuplicateCounter}). */
    @Test
    void duplicatesAreCountedForCatalogsAndSets() throws Exception {
        String[] catalogLines = CATALOG_CO.split("\n");
        Path cat = write("dup.cat", "none", CATALOG_CO + catalogLines[2] + "\n");
        try (OpenedSource s = LineSources.open(cat, null, STRICT)) {
            assertEquals(4, readAll(s).size());
            assertEquals(1, s.duplicatesSeen());
        }
        List<Path> set = writeSet("none");
        Files.writeString(set.get(1), Files.readString(set.get(1)) + String.format(Locale.ROOT, "%12d %12d %10.4e%n", 4, 3, A[2]));
        try (OpenedSource s = LineSources.open(set.get(1), null, STRICT)) {
            assertEquals(4, readAll(s).size());
            assertEquals(1, s.duplicatesSeen());
        }
    }

    @Test
    void stateLinesUnderAnotherNameAreRefusedWithTheNamingRule() throws IOException {
        Path p = write("levels.txt", "none", "           1     0.000000      1       0\n           2     3.845033      3       1\n");
        LineFormatException e = assertThrows(LineFormatException.class, () -> LineSources.open(p, null, STRICT));
        assertTrue(e.getMessage().contains("not a file of a state/transition set"), e.getMessage());
    }
}
