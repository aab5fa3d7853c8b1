package org.linewright.cli.demo;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.apache.commons.compress.compressors.bzip2.BZip2CompressorInputStream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.ingest.hitran.HitranRecordReader;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.source.ReadOptions;
import org.linewright.ingest.testsupport.ReferenceSamples;

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
        // ../shared/reference-data/hitran2020-samples/README.md: 12C16O 107.42, 13C16O 224.69, 12C18O 112.77,
        // 12C16O2 286.09, 13C16O2 576.64. A rigid rotor with a harmonic oscillator is expected within 0.3 %.
        assertEquals(107.42, SyntheticLineListGenerator.carbonMonoxidePartitionSum(1, 296.0), 107.42 * 3e-3);
        assertEquals(224.69, SyntheticLineListGenerator.carbonMonoxidePartitionSum(2, 296.0), 224.69 * 3e-3);
        assertEquals(112.77, SyntheticLineListGenerator.carbonMonoxidePartitionSum(3, 296.0), 112.77 * 3e-3);
        assertEquals(286.09, SyntheticLineListGenerator.carbonDioxidePartitionSum(1, 296.0), 286.09 * 3e-3);
        assertEquals(576.64, SyntheticLineListGenerator.carbonDioxidePartitionSum(2, 296.0), 576.64 * 3e-3);
    }

    @Test
    void honlLondonFractionsOfOneUpperLevelSumToOne() {
        // common practice (sum rule of the Hönl-London factors of a parallel band, Herzberg 1950 ch. IV):
        // S_R + S_Q + S_P = 2J'+1 for every upper J', for Λ = 0 (no Q branch) and Λ = 1
        for (int j = 1; j < 50; j++) {
            assertEquals(1.0, SyntheticLineListGenerator.honlLondonFraction('R', j)
                    + SyntheticLineListGenerator.honlLondonFraction('P', j), 1e-15);
            assertEquals(0.0, SyntheticLineListGenerator.honlLondonFraction('Q', j, 0), 0.0);
            assertEquals(1.0, SyntheticLineListGenerator.honlLondonFraction('R', j, 1)
                    + SyntheticLineListGenerator.honlLondonFraction('Q', j, 1)
                    + SyntheticLineListGenerator.honlLondonFraction('P', j, 1), 1e-14);
        }
        // R(0) of CO carries 1/3 of the band A: J'=1 -> J''=0 (textbook, Herzberg 1950)
        assertEquals(1.0 / 3.0, SyntheticLineListGenerator.honlLondonFraction('R', 1), 1e-15);
        // Λ = 1, J' = 1: R needs J'' = 0, which a Π level does not have (textbook)
        assertEquals(0.0, SyntheticLineListGenerator.honlLondonFraction('R', 1, 1), 0.0);
    }

    /** Key of a CO line in a HITRAN record: isotopologue, upper v, branch, J''. */
    private static String coKey(int iso, int vUpper, char branch, int lowerJ) {
        return iso + "/" + vUpper + "/" + branch + lowerJ;
    }

    @Test
    void carbonMonoxideLinesMatchRealHitran2020Lines() throws IOException {
        // Real data: HITRAN2020 sample records (Gordon et al., JQSRT 277 (2022) 107949), read-only shared data.
        Path sample = ReferenceSamples.hitranSample("sample_CO.par");
        Map<String, double[]> reference = new HashMap<>();
        for (String r : Files.readAllLines(sample, StandardCharsets.US_ASCII)) {
            int iso = r.charAt(2) - '0';
            int vUpper = Integer.parseInt(r.substring(67, 82).strip());
            int vLower = Integer.parseInt(r.substring(82, 97).strip());
            String local = r.substring(112, 127);
            char branch = local.charAt(5);
            if (iso < 1 || iso > 3 || vUpper - vLower != 1 || vLower > 2 || (branch != 'P' && branch != 'R')) {
                continue;
            }
            int lowerJ = Integer.parseInt(local.substring(6, 9).strip());
            reference.put(coKey(iso, vUpper, branch, lowerJ), new double[] {
                Double.parseDouble(r.substring(3, 15)), Double.parseDouble(r.substring(15, 25)),
                Double.parseDouble(r.substring(45, 55)), Double.parseDouble(r.substring(146, 153)),
                Double.parseDouble(r.substring(153, 160))});
        }
        Map<String, Integer> comparedPerBand = new HashMap<>();
        double worstPosition = 0;
        double worstIntensity = 0;
        double worstPositionNewBands = 0;
        double[] worstLowerEnergy = new double[4];
        for (SyntheticLine l : SyntheticLineListGenerator.carbonMonoxideLines()) {
            int vUpper = Integer.parseInt(l.upperVibration().strip());
            double[] ref = reference.get(coKey(l.isotopologue(), vUpper, l.branch(), l.lowerJ()));
            if (ref == null || l.lowerJ() > 30) {
                continue;
            }
            comparedPerBand.merge(l.isotopologue() + "/" + vUpper, 1, Integer::sum);
            if (vUpper == 3 || l.isotopologue() == 3) {
                worstPositionNewBands = Math.max(worstPositionNewBands, Math.abs(l.wavenumberCm1() - ref[0]));
            } else {
                worstPosition = Math.max(worstPosition, Math.abs(l.wavenumberCm1() - ref[0]));
            }
            if (l.lowerJ() <= 10) {
                worstIntensity = Math.max(worstIntensity, Math.abs(l.intensityCmPerMolecule() / ref[1] - 1));
            }
            // the lower-state energy comes from the same term values as the position
            worstLowerEnergy[l.isotopologue()] = Math.max(worstLowerEnergy[l.isotopologue()],
                    Math.abs(ref[2] - l.lowerEnergyCm1()));
            // HITRAN degeneracy convention, nuclear-spin factor included (2 for 13C16O)
            assertEquals(ref[3], l.upperDegeneracy(), 0.0, "g' of " + l);
            assertEquals(ref[4], l.lowerDegeneracy(), 0.0, "g'' of " + l);
        }
        // every band of the model has real lines to compare with: 12C16O 1-0, 2-1, 3-2; 13C16O and 12C18O 1-0, 2-1
        for (String band : new String[] {"1/1", "1/2", "1/3", "2/1", "2/2", "3/1", "3/2"}) {
            assertTrue(comparedPerBand.getOrDefault(band, 0) >= 5,
                    "band iso/v' " + band + ": only " + comparedPerBand.get(band) + " lines in common with the sample");
        }
        // truncated Dunham series: positions within 0.01 cm-1 up to J'' = 30 for the 12C16O and 13C16O bands up
        // to v' = 2; v' = 3 extrapolates the three-term G(v) and 12C18O leans on isotopic scaling alone (no
        // Born-Oppenheimer breakdown terms), so 0.02 cm-1 there
        assertTrue(worstPosition < 0.01, "worst position difference " + worstPosition + " cm-1");
        assertTrue(worstPositionNewBands < 0.02, "worst position difference, v'=3 and 12C18O: "
                + worstPositionNewBands + " cm-1");
        // E'' within 0.02 cm-1 (12C16O, 13C16O) and 0.03 cm-1 (12C18O) up to J'' = 30, v'' <= 2
        assertTrue(worstLowerEnergy[1] < 0.02 && worstLowerEnergy[2] < 0.02 && worstLowerEnergy[3] < 0.03,
                "worst E'' differences by isotopologue " + java.util.Arrays.toString(worstLowerEnergy));
        // Herman-Wallis factors neglected (their effect grows by about 0.7 % per unit of |m|) and band A values
        // scaled as a harmonic oscillator: intensities within 8 % up to J'' = 10
        assertTrue(worstIntensity < 0.08, "worst relative intensity difference " + worstIntensity);
    }

    /** Energies E'' of the sample's 12C16O2 (iso 1) or 13C16O2 (iso 2) levels with the given global quanta. */
    private static Map<String, Double> carbonDioxideLevels(int iso, String lowerGlobalQuanta) throws IOException {
        Path sample = ReferenceSamples.hitranSample("sample_CO2.par");
        Map<String, Double> levels = new HashMap<>();
        for (String r : Files.readAllLines(sample, StandardCharsets.US_ASCII)) {
            if (r.startsWith(" 2" + iso) && r.substring(82, 97).equals(lowerGlobalQuanta)) {
                // key: J'' and e/f label
                levels.put(r.substring(118, 122).strip(), Double.parseDouble(r.substring(45, 55)));
            }
        }
        return levels;
    }

    @Test
    void carbonDioxideUpperLevelsMatchRealHitran2020Energies() throws IOException {
        // Real data: HITRAN2020 lines whose lower state is 00011 give that level's energies as E''.
        int compared = 0;
        for (Map.Entry<String, Double> e : carbonDioxideLevels(1, "       0 0 0 11").entrySet()) {
            int j = Integer.parseInt(e.getKey().substring(0, e.getKey().length() - 1).strip());
            if (j <= 60) {
                assertEquals(e.getValue(), SyntheticLineListGenerator.CO2_626_00011.termCm1(j), 0.01, "00011 J=" + j);
                compared++;
            }
        }
        assertTrue(compared >= 5, "only " + compared + " 12C16O2 00011 levels in the sample");
        compared = 0;
        // B' of 13C16O2 00011 was estimated from these energies (demo/data/README.md): a consistency check of the
        // band centre (from memory) and the J structure, not an independent one
        for (Map.Entry<String, Double> e : carbonDioxideLevels(2, "       0 0 0 11").entrySet()) {
            int j = Integer.parseInt(e.getKey().substring(0, e.getKey().length() - 1).strip());
            // common practice: the 00011 (Σu+) levels of a 16O-C-16O molecule exist for odd J only
            assertEquals(1, j % 2, "13C16O2 00011 J=" + j);
            assertEquals(e.getValue(), SyntheticLineListGenerator.CO2_636_00011.termCm1(j), 0.02, "636 00011 J=" + j);
            compared++;
        }
        assertTrue(compared >= 5, "only " + compared + " 13C16O2 00011 levels in the sample");
    }

    @Test
    void hotBandUpperLevelsMatchRealHitran2020EnergiesAndParities() throws IOException {
        // Real data: HITRAN2020 lines whose lower state is 12C16O2 01111 give that level's energies and e/f labels.
        Map<String, Double> levels = carbonDioxideLevels(1, "       0 1 1 11");
        assertTrue(levels.size() >= 10, "only " + levels.size() + " 01111 levels in the sample");
        // the upper levels (J', e/f) of the synthetic hot band: P and R keep the lower label, Q changes it
        Set<String> upperLevels = new HashSet<>();
        for (SyntheticLine l : SyntheticLineListGenerator.carbonDioxideLines()) {
            if (l.upperVibration().equals("       0 1 1 11")) {
                char parity = l.branch() == 'Q' ? (l.rotationalParity() == 'e' ? 'f' : 'e') : l.rotationalParity();
                upperLevels.add(l.upperJ() + "" + parity);
            }
        }
        for (Map.Entry<String, Double> e : levels.entrySet()) {
            String key = e.getKey().replace(" ", "");
            int j = Integer.parseInt(key.substring(0, key.length() - 1));
            // each real level (with its e/f label) is an upper level of the synthetic band
            assertTrue(upperLevels.contains(key), "01111 level " + key + " missing from the synthetic hot band");
            // B of 01111 was estimated from these energies (demo/data/README.md), G recalled.
            // l-type doubling is ignored: e and f differ from their mean by |q|/2 J(J+1), |q| < 7e-4 cm-1 for
            // the bending levels of CO2 (from memory)
            double tolerance = 0.02 + 3.5e-4 * j * (j + 1);
            assertEquals(e.getValue(), SyntheticLineListGenerator.CO2_626_01111.termCm1(j), tolerance, "01111 " + key);
        }
    }

    @Test
    void carbonDioxideBandsHaveTheRightSymmetryAndStrength() {
        List<SyntheticLine> co2 = SyntheticLineListGenerator.carbonDioxideLines();
        double strongest = 0;
        double fundamentalSum = 0;
        double hotSum = 0;
        double iso2Sum = 0;
        for (SyntheticLine l : co2) {
            if (l.lowerVibration().equals("       0 0 0 01")) {
                // common practice: 16O nuclei have spin 0, so only even J exist in the C16O2 ground state
                assertEquals(0, l.lowerJ() % 2, l.toString());
            }
            if (l.isotopologue() == 1 && l.lowerVibration().equals("       0 0 0 01")) {
                strongest = Math.max(strongest, l.intensityCmPerMolecule());
                fundamentalSum += l.intensityCmPerMolecule();
            } else if (l.isotopologue() == 1) {
                hotSum += l.intensityCmPerMolecule();
            } else {
                iso2Sum += l.intensityCmPerMolecule();
            }
        }
        // from memory: the strongest 12C16O2 nu3 lines (R(16)-R(18)) are about 3.5e-18 cm/molecule at 296 K
        assertEquals(3.5e-18, strongest, 0.7e-18);
        // from memory: the 01111-01101 hot band carries about 8 % of the nu3 fundamental's intensity at 296 K
        // (a Boltzmann factor of 4 % for 01101 times its degeneracy 2)
        assertEquals(0.08, hotSum / fundamentalSum, 0.02);
        // the 13C16O2 band follows the natural 13C/12C abundance ratio, 1.1 % (common practice), within 10 %
        assertEquals(0.011057 / 0.984204, iso2Sum / fundamentalSum, 0.1 * 0.011057 / 0.984204);
    }

    @Test
    void theDemoWindowIsWellPopulated() {
        // the demo (demo/data/README.md) asks for a few thousand lines, most of them in 2000-2400 cm-1
        List<SyntheticLine> co = SyntheticLineListGenerator.carbonMonoxideLines();
        List<SyntheticLine> co2 = SyntheticLineListGenerator.carbonDioxideLines();
        // 7 CO bands with J'' = 0..100: 101 R and 100 P lines each
        assertEquals(7 * 201, co.size());
        // 12C16O2 and 13C16O2 nu3: 81 R + 80 P each; hot band: 160 R + 159 P + 80 Q
        assertEquals(2 * 161 + 399, co2.size());
        long inWindow = 0;
        for (List<SyntheticLine> list : List.of(co, co2)) {
            for (SyntheticLine l : list) {
                if (l.wavenumberCm1() >= 2000 && l.wavenumberCm1() <= 2400) {
                    inWindow++;
                }
            }
        }
        assertTrue(inWindow >= 1500, inWindow + " lines in 2000-2400 cm-1");
    }

    @Test
    void recordsAre160CharactersInTheHitranColumns() {
        String records = SyntheticLineListGenerator.toRecords(SyntheticLineListGenerator.carbonMonoxideLines());
        String[] lines = records.split("\n");
        assertEquals(7 * 201, lines.length);
        for (String r : lines) {
            // HITRAN 2004 layout (Rothman et al., JQSRT 96 (2005) 139): 160 characters per record
            assertEquals(160, r.length(), r);
            assertEquals(" 5", r.substring(0, 2));
            // F12.6 wavenumber: six decimals, the decimal point 7 places from the end of the field
            assertEquals('.', r.charAt(8), r);
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
    void writtenRecordsReadBackAsTheBatch() throws IOException {
        // the ingest reader (whose own tests check it against the HITRAN2020 samples) must see exactly the
        // values of the batch: they were rounded to the precision of their fields before writing
        List<SyntheticLine> lines = SyntheticLineListGenerator.carbonDioxideLines();
        LineBatch expected = SyntheticLineListGenerator.toBatch(lines);
        byte[] text = SyntheticLineListGenerator.toRecords(lines).getBytes(StandardCharsets.US_ASCII);
        LineBatch actual = new LineBatch(expected.size + 1);
        try (HitranRecordReader reader = new HitranRecordReader(new ByteArrayInputStream(text), "co2.par",
                ReadOptions.strict(MoleculeRegistry.builtIn()))) {
            assertTrue(reader.read(actual));
        }
        assertEquals(expected.size, actual.size);
        for (int i = 0; i < expected.size; i++) {
            assertEquals(expected.moleculeId[i], actual.moleculeId[i]);
            assertEquals(expected.isotopologue[i], actual.isotopologue[i]);
            assertEquals(expected.wavenumberCm1[i], actual.wavenumberCm1[i], 0.0);
            assertEquals(expected.intensityCmPerMolecule[i], actual.intensityCmPerMolecule[i], 0.0);
            assertEquals(expected.einsteinAS1[i], actual.einsteinAS1[i], 0.0);
            assertEquals(expected.airWidthCm1PerAtm[i], actual.airWidthCm1PerAtm[i], 0.0);
            assertEquals(expected.selfWidthCm1PerAtm[i], actual.selfWidthCm1PerAtm[i], 0.0);
            assertEquals(expected.lowerEnergyCm1[i], actual.lowerEnergyCm1[i], 0.0);
            assertEquals(expected.airWidthExponent[i], actual.airWidthExponent[i], 0.0);
            assertEquals(expected.airShiftCm1PerAtm[i], actual.airShiftCm1PerAtm[i], 0.0);
            assertEquals(expected.upperDegeneracy[i], actual.upperDegeneracy[i], 0.0);
            assertEquals(expected.lowerDegeneracy[i], actual.lowerDegeneracy[i], 0.0);
            assertEquals(expected.lowerJ[i], actual.lowerJ[i], 0.0, "J'' of row " + i);
            assertEquals(expected.lowerLocalQuanta.get(i), actual.lowerLocalQuanta.get(i), "row " + i);
            assertEquals(expected.lowerGlobalQuanta.get(i), actual.lowerGlobalQuanta.get(i), "row " + i);
        }
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
