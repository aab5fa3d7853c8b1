package org.linewright.cli.demo;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.apache.commons.compress.compressors.bzip2.BZip2CompressorInputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * The synthetic demo lists against published spectroscopy: line positions, level energies, partition sums and
 * intensities of the real molecules the invented data imitate, and the HITRAN 160-character layout.
 */
class SyntheticLineListGeneratorTest {

    private static SyntheticLine find(List<SyntheticLine> lines, int iso, String vUpper, char branch, int lowerJ) {
        for (SyntheticLine l : lines) {
            if (l.isotopologue() == iso && l.upperVibration().strip().equals(vUpper) && l.branch() == branch
                    && l.lowerJ() == lowerJ) {
                return l;
            }
        }
        throw new AssertionError("no line " + iso + " v'=" + vUpper + " " + branch + "(" + lowerJ + ")");
    }

    @Test
    void carbonMonoxideFundamentalMatchesPublishedBandOriginAndLowJLines() {
        // from memory (Huber & Herzberg 1979 constants; HITRAN line list): 12C16O 1-0 band origin 2143.271 cm-1,
        // R(0) 2147.081 cm-1, P(1) 2139.426 cm-1
        double origin = SyntheticLineListGenerator.carbonMonoxideLevelEnergyCm1(1, 1, 0);
        assertEquals(2143.271, origin, 0.002);
        List<SyntheticLine> co = SyntheticLineListGenerator.carbonMonoxideLines();
        assertEquals(2147.081, find(co, 1, "1", 'R', 0).wavenumberCm1(), 0.002);
        assertEquals(2139.426, find(co, 1, "1", 'P', 1).wavenumberCm1(), 0.002);
        // from memory: 13C16O 1-0 band origin 2096.07 cm-1 (isotopic scaling must land within 0.05 cm-1)
        assertEquals(2096.07, SyntheticLineListGenerator.carbonMonoxideLevelEnergyCm1(2, 1, 0), 0.05);
    }

    @Test
    void partitionSumsAgreeWithTabulatedValuesAt296K() {
        // HITRAN isotopologue metadata (TIPS-2021), Q(296 K), from memory, as listed in
        // ../shared/reference-data/hitran2020-samples/README.md: 12C16O 107.42, 13C16O 224.69, 12C16O2 286.09.
        // A rigid rotor with a harmonic oscillator is expected within 0.3 %.
        assertEquals(107.42, SyntheticLineListGenerator.carbonMonoxidePartitionSum(1, 296.0), 107.42 * 3e-3);
        assertEquals(224.69, SyntheticLineListGenerator.carbonMonoxidePartitionSum(2, 296.0), 224.69 * 3e-3);
        assertEquals(286.09, SyntheticLineListGenerator.carbonDioxidePartitionSum(296.0), 286.09 * 3e-3);
    }

    @Test
    void honlLondonFractionsOfOneUpperLevelSumToOne() {
        // common practice (sum rule of the Hönl-London factors of a 1Σ-1Σ band): S_R + S_P = 2J'+1
        for (int j = 1; j < 50; j++) {
            assertEquals(1.0, SyntheticLineListGenerator.honlLondonFraction('R', j)
                    + SyntheticLineListGenerator.honlLondonFraction('P', j), 1e-15);
        }
        // R(0) of CO carries 1/3 of the band A: J'=1 -> J''=0 (textbook, Herzberg 1950)
        assertEquals(1.0 / 3.0, SyntheticLineListGenerator.honlLondonFraction('R', 1), 1e-15);
    }

    /** Key of a CO line in a HITRAN record: isotopologue, upper v, branch, J''. */
    private static String coKey(int iso, int vUpper, char branch, int lowerJ) {
        return iso + "/" + vUpper + "/" + branch + lowerJ;
    }

    @Test
    void carbonMonoxideLinesMatchRealHitran2020Lines() throws IOException {
        // Real data: HITRAN2020 sample records (Gordon et al., JQSRT 277 (2022) 107949), read-only shared data.
        Path sample = ReferenceData.hitranSample("sample_CO.par");
        Map<String, double[]> reference = new HashMap<>();
        for (String r : Files.readAllLines(sample, StandardCharsets.US_ASCII)) {
            int iso = r.charAt(2) - '0';
            int vUpper = Integer.parseInt(r.substring(67, 82).strip());
            int vLower = Integer.parseInt(r.substring(82, 97).strip());
            String local = r.substring(112, 127);
            char branch = local.charAt(5);
            if ((iso != 1 && iso != 2) || vUpper - vLower != 1 || vLower > 1 || (branch != 'P' && branch != 'R')) {
                continue;
            }
            int lowerJ = Integer.parseInt(local.substring(6, 9).strip());
            reference.put(coKey(iso, vUpper, branch, lowerJ), new double[] {
                Double.parseDouble(r.substring(3, 15)), Double.parseDouble(r.substring(15, 25)),
                Double.parseDouble(r.substring(45, 55)), Double.parseDouble(r.substring(146, 153)),
                Double.parseDouble(r.substring(153, 160))});
        }
        int compared = 0;
        double worstPosition = 0;
        double worstIntensity = 0;
        for (SyntheticLine l : SyntheticLineListGenerator.carbonMonoxideLines()) {
            double[] ref = reference.get(coKey(l.isotopologue(), Integer.parseInt(l.upperVibration().strip()),
                    l.branch(), l.lowerJ()));
            if (ref == null || l.lowerJ() > 30) {
                continue;
            }
            compared++;
            worstPosition = Math.max(worstPosition, Math.abs(l.wavenumberCm1() - ref[0]));
            if (l.lowerJ() <= 10) {
                worstIntensity = Math.max(worstIntensity, Math.abs(l.intensityCmPerMolecule() / ref[1] - 1));
            }
            // the lower-state energy comes from the same term values as the position
            assertEquals(ref[2], l.lowerEnergyCm1(), 0.02, "E'' of " + l);
            // HITRAN degeneracy convention, nuclear-spin factor included (2 for 13C16O)
            assertEquals(ref[3], l.upperDegeneracy(), 0.0, "g' of " + l);
            assertEquals(ref[4], l.lowerDegeneracy(), 0.0, "g'' of " + l);
        }
        assertTrue(compared >= 20, "only " + compared + " lines in common with the sample");
        // truncated Dunham series: positions within 0.01 cm-1 up to J'' = 30
        assertTrue(worstPosition < 0.01, "worst position difference " + worstPosition + " cm-1");
        // Herman-Wallis factors neglected (their effect grows by about 0.7 % per unit of |m|) and a band A of
        // the right order: intensities within 8 % up to J'' = 10
        assertTrue(worstIntensity < 0.08, "worst relative intensity difference " + worstIntensity);
    }

    @Test
    void carbonDioxideUpperLevelsMatchRealHitran2020Energies() throws IOException {
        // Real data: HITRAN2020 lines whose lower state is 00011 give that level's energies as E''.
        Path sample = ReferenceData.hitranSample("sample_CO2.par");
        int compared = 0;
        for (String r : Files.readAllLines(sample, StandardCharsets.US_ASCII)) {
            if (!r.startsWith(" 21") || !r.substring(82, 97).equals("       0 0 0 11")) {
                continue;
            }
            int lowerJ = Integer.parseInt(r.substring(118, 121).strip());
            if (lowerJ > 60) {
                continue;
            }
            double energy = Double.parseDouble(r.substring(45, 55));
            assertEquals(energy, SyntheticLineListGenerator.carbonDioxideLevelEnergyCm1(1, lowerJ), 0.01,
                    "00011 J=" + lowerJ);
            compared++;
        }
        assertTrue(compared >= 5, "only " + compared + " 00011 levels in the sample");
    }

    @Test
    void carbonDioxideHasEvenLowerJOnlyAndStrongestLineOfTheRightSize() {
        List<SyntheticLine> co2 = SyntheticLineListGenerator.carbonDioxideLines();
        double strongest = 0;
        for (SyntheticLine l : co2) {
            // common practice: 16O nuclei have spin 0, so only even J exist in the 12C16O2 ground state
            assertEquals(0, l.lowerJ() % 2, l.toString());
            strongest = Math.max(strongest, l.intensityCmPerMolecule());
        }
        // from memory: the strongest 12C16O2 nu3 lines (R(16)-R(18)) are about 3.5e-18 cm/molecule at 296 K
        assertEquals(3.5e-18, strongest, 0.7e-18);
    }

    @Test
    void recordsAre160CharactersInTheHitranColumns() {
        String records = SyntheticLineListGenerator.toRecords(SyntheticLineListGenerator.carbonMonoxideLines());
        String[] lines = records.split("\n");
        assertEquals(804, lines.length);
        for (String r : lines) {
            // HITRAN 2004 layout (Rothman et al., JQSRT 96 (2005) 139): 160 characters per record
            assertEquals(160, r.length(), r);
            assertEquals(" 5", r.substring(0, 2));
            assertTrue(r.charAt(14) != ' ' && r.charAt(5) != ' ' || r.charAt(4) != ' ', r);
        }
        // R(0) of 12C16O: E'' 0, g' 3, g'' 1, in fixed columns (46-55, 147-153, 154-160)
        String r0 = null;
        for (String r : lines) {
            if (r.startsWith(" 51") && r.substring(112, 127).equals("     R  0      ")
                    && r.substring(82, 97).strip().equals("0")) {
                r0 = r;
            }
        }
        assertTrue(r0 != null);
        assertEquals("    0.0000", r0.substring(45, 55));
        assertEquals("    3.0", r0.substring(146, 153));
        assertEquals("    1.0", r0.substring(153, 160));
        assertEquals(2147.081, Double.parseDouble(r0.substring(3, 15)), 0.002);
    }

    @Test
    void outputIsDeterministicAndTheCommittedDemoFilesAreCurrent(@TempDir Path tmp) throws IOException {
        SyntheticLineListGenerator.main(new String[] {tmp.toString()});
        byte[] first = Files.readAllBytes(tmp.resolve(SyntheticLineListGenerator.CO_FILE));
        SyntheticLineListGenerator.main(new String[] {tmp.toString()});
        byte[] second = Files.readAllBytes(tmp.resolve(SyntheticLineListGenerator.CO_FILE));
        assertTrue(java.util.Arrays.equals(first, second), "two runs wrote different bytes");
        for (String name : new String[] {SyntheticLineListGenerator.CO_FILE, SyntheticLineListGenerator.CO2_FILE}) {
            Path committed = Paths.get("..", "demo", "data", name);
            if (!Files.isRegularFile(committed)) {
                continue;
            }
            assertEquals(decompress(tmp.resolve(name)), decompress(committed),
                    name + " is stale; regenerate as demo/data/README.md says");
        }
    }

    private static String decompress(Path file) throws IOException {
        try (InputStream in = new BZip2CompressorInputStream(Files.newInputStream(file))) {
            return new String(in.readAllBytes(), StandardCharsets.US_ASCII);
        }
    }
}
