package org.linewright.ingest.registry;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.ingest.source.IsotopologueLookup;
import org.linewright.ingest.source.LineFormatException;
import org.linewright.ingest.testsupport.ReferenceSamples;

class MoleculeRegistryTest {
    private final MoleculeRegistry registry = MoleculeRegistry.builtIn();

    @TempDir
    Path tmp;

    @Test
    void computedMassesMatchPublishedMolecularMasses() {
        // Published molecular masses in g/mol (HITRAN isotopologue metadata, from memory); each cross-checked by
        // hand from AME2020 nuclide masses (Wang et al., Chin. Phys. C 45 (2021) 030003):
        // 12C16O  = 12 + 15.994914619 = 27.994914619
        assertEquals(27.994915, registry.massGPerMol(5, 1), 1e-6);
        // 13C16O  = 13.003354835 + 15.994914619 = 28.998269455
        assertEquals(28.998270, registry.massGPerMol(5, 2), 1e-6);
        // 12C16O2 = 12 + 2 × 15.994914619 = 43.989829239
        assertEquals(43.989830, registry.massGPerMol(2, 1), 1e-6);
        // 1H2 16O = 2 × 1.007825032 + 15.994914619 = 18.010564683
        assertEquals(18.010565, registry.massGPerMol(1, 1), 1e-6);
        // 31P 1H3 = 30.973761998 + 3 × 1.007825032 = 33.997237094
        assertEquals(33.997238, registry.massGPerMol(28, 1), 1e-6);
        // 14N2 16O = 2 × 14.003074004 + 15.994914619 = 44.001062628
        assertEquals(44.001062, registry.massGPerMol(4, 1), 1e-6);
        // 12C 1H4 = 12 + 4 × 1.007825032 = 16.031300128
        assertEquals(16.031300, registry.massGPerMol(6, 1), 1e-6);
        // 14N 1H3 = 14.003074004 + 3 × 1.007825032 = 17.026549100
        assertEquals(17.026549, registry.massGPerMol(11, 1), 1e-6);
        // 1H 35Cl = 1.007825032 + 34.968852694 = 35.976677726
        assertEquals(35.976678, registry.massGPerMol(15, 1), 1e-6);
        // 16O 12C 32S = 15.994914619 + 12 + 31.972071174 = 59.966985793
        assertEquals(59.966986, registry.massGPerMol(19, 1), 1e-6);
        // 1H 127I = 1.007825032 + 126.9044719 = 127.912296932
        assertEquals(127.912297, registry.massGPerMol(17, 1), 1e-6);
        // 1H 19F = 1.007825032 + 18.998403162 = 20.006228194
        assertEquals(20.006229, registry.massGPerMol(14, 1), 1e-6);
    }

    @Test
    void coversTheRequiredMoleculesAndIsotopologues() {
        // Molecule numbering of the 160-character line-list format (common practice).
        Map<String, Integer> ids = Map.ofEntries(Map.entry("H2O", 1), Map.entry("CO2", 2), Map.entry("O3", 3),
                Map.entry("N2O", 4), Map.entry("CO", 5), Map.entry("CH4", 6), Map.entry("O2", 7), Map.entry("NO", 8),
                Map.entry("SO2", 9), Map.entry("NO2", 10), Map.entry("NH3", 11), Map.entry("HNO3", 12), Map.entry("OH", 13),
                Map.entry("HF", 14), Map.entry("HCl", 15), Map.entry("HBr", 16), Map.entry("HI", 17), Map.entry("OCS", 19),
                Map.entry("H2CO", 20), Map.entry("N2", 22), Map.entry("HCN", 23), Map.entry("CH3Cl", 24), Map.entry("C2H2", 26),
                Map.entry("C2H6", 27), Map.entry("PH3", 28), Map.entry("H2S", 31), Map.entry("H2", 45));
        ids.forEach((formula, id) -> {
            Molecule m = registry.molecule(formula);
            assertNotNull(m, formula);
            assertEquals(id, m.id(), formula);
            assertTrue(registry.isKnown(id, 1), formula + " main isotopologue");
            // The main isotopologue's isotope formula has the molecule's atoms (compared as element counts).
            assertEquals(elementCounts(formula), elementCounts(IsotopeFormula.chemicalFormula(
                    registry.isotopologue(id, 1).isotopeFormula())), formula);
        });
        for (int i = 1; i <= 6; i++) {
            assertTrue(registry.isKnown(5, i), "CO " + i);
        }
        for (int i = 1; i <= 12; i++) {
            assertTrue(registry.isKnown(2, i), "CO2 " + i);
        }
        for (int i = 1; i <= 5; i++) {
            assertTrue(registry.isKnown(4, i), "N2O " + i);
        }
        // CO2 local numbers 8-12 with their codes (line-list format convention, common practice).
        assertEquals("827", registry.isotopologue(2, 8).code());
        assertEquals("727", registry.isotopologue(2, 9).code());
        assertEquals("838", registry.isotopologue(2, 10).code());
        assertEquals("837", registry.isotopologue(2, 11).code());
        assertEquals("737", registry.isotopologue(2, 12).code());
    }

    /** Element counts of a chemical formula such as CH3Cl. */
    private static Map<String, Integer> elementCounts(String f) {
        Map<String, Integer> m = new HashMap<>();
        int i = 0;
        while (i < f.length()) {
            int s = i++;
            while (i < f.length() && Character.isLowerCase(f.charAt(i))) {
                i++;
            }
            String el = f.substring(s, i);
            int d = i;
            while (i < f.length() && Character.isDigit(f.charAt(i))) {
                i++;
            }
            m.merge(el, d == i ? 1 : Integer.parseInt(f.substring(d, i)), Integer::sum);
        }
        return m;
    }

    @Test
    void abundancesAndQ296ReproduceTheSampleReadmeTable() throws IOException {
        Path readme = ReferenceSamples.dir(ReferenceSamples.HITRAN_SAMPLES).resolve("README.md");
        int rows = 0;
        for (String line : Files.readAllLines(readme, StandardCharsets.UTF_8)) {
            String[] cells = line.split("\\|");
            if (cells.length < 5 || !cells[1].trim().matches("\\d+/\\d+")) {
                continue;
            }
            String[] id = cells[1].trim().split("/");
            int mol = Integer.parseInt(id[0]);
            int iso = Integer.parseInt(id[1]);
            double abundance = Double.parseDouble(cells[3].trim());
            String qText = cells[4].trim();
            // Source: the samples README (HITRAN isotopologue metadata, TIPS-2021), including its note that the
            // N2O 4/1 value is approximate ("≈5002").
            boolean approximate = qText.startsWith("≈");
            double q = Double.parseDouble(qText.replace("≈", "").split(" ")[0]);
            assertEquals(abundance, registry.naturalAbundance(mol, iso), abundance * 1e-9, "abundance " + mol + "/" + iso);
            assertEquals(q, registry.isotopologue(mol, iso).q296(), q * (approximate ? 1e-3 : 1e-9), "Q(296) " + mol + "/" + iso);
            assertEquals(q, registry.partitionSum(mol, iso, 296.0), q * (approximate ? 1e-3 : 1e-9));
            rows++;
        }
        assertEquals(19, rows, "rows of the README table");
    }

    @Test
    void intensitiesOfTheSamplesAreConsistentWithAbundanceAndQ296() throws IOException {
        // Published relation (Šimečková et al. 2006, JQSRT 98, 130) between S, A, g', E'' at 296 K:
        // S = Ia·A·g'/(8πcν²)·exp(−c2E''/T)·(1−exp(−c2ν/T))/Q(T). The median of Ia/Q implied by each
        // isotopologue's records must agree with the registry's Ia/Q(296) to 2e-3 (README: confirmed to 2e-3).
        Path dir = ReferenceSamples.dir(ReferenceSamples.HITRAN_SAMPLES);
        double c2 = 1.438776877;
        double c = 2.99792458e10;
        double t = 296.0;
        int checked = 0;
        for (String name : new String[] {"sample_CO.par", "sample_CO2.par", "sample_N2O.par", "sample_PH3.par"}) {
            Map<String, List<Double>> ratios = new HashMap<>();
            try (BufferedReader r = Files.newBufferedReader(dir.resolve(name), StandardCharsets.US_ASCII)) {
                String line;
                while ((line = r.readLine()) != null) {
                    if (line.length() < 160) {
                        continue;
                    }
                    // Columns of the 160-character format (common practice): mol 1-2, iso 3, ν 4-15, S 16-25,
                    // A 26-35, E'' 46-55, g' 147-153.
                    String key = line.substring(0, 2).trim() + "/" + line.charAt(2);
                    double nu = Double.parseDouble(line.substring(3, 15).trim());
                    double s = Double.parseDouble(line.substring(15, 25).trim());
                    double a = Double.parseDouble(line.substring(25, 35).trim());
                    double e = Double.parseDouble(line.substring(45, 55).trim());
                    double g = Double.parseDouble(line.substring(146, 153).trim());
                    double implied = s * 8 * Math.PI * c * nu * nu / (a * g * Math.exp(-c2 * e / t) * -Math.expm1(-c2 * nu / t));
                    ratios.computeIfAbsent(key, k -> new ArrayList<>()).add(implied);
                }
            }
            for (Map.Entry<String, List<Double>> en : ratios.entrySet()) {
                List<Double> v = en.getValue();
                v.sort(Double::compare);
                double median = v.get(v.size() / 2);
                String[] id = en.getKey().split("/");
                int mol = Integer.parseInt(id[0]);
                int iso = Integer.parseInt(id[1]);
                double expected = registry.naturalAbundance(mol, iso) / registry.isotopologue(mol, iso).q296();
                assertEquals(1.0, median / expected, 2e-3, name + " isotopologue " + en.getKey());
                checked++;
            }
        }
        assertEquals(6 + 8 + 5 + 1, checked);
    }

    @Test
    void looksUpByIdFormulaIsotopeFormulaAndCatalogTag() {
        assertEquals(5, registry.molecule("CO").id());
        assertEquals(5, registry.molecule("5").id());
        assertEquals(2, registry.molecule("co2").id());
        assertNull(registry.molecule("XeF6"));
        assertEquals(registry.isotopologue(2, 3), registry.isotopologue("CO2/3"));
        assertEquals(registry.isotopologue(2, 3), registry.isotopologue("2/3"));
        // State-list file naming (ExoMol format, common practice).
        assertEquals(new IsotopologueLookup.Id(5, 1), registry.byIsotopeFormula("12C-16O"));
        assertEquals(new IsotopologueLookup.Id(1, 1), registry.byIsotopeFormula("1H2-16O"));
        assertEquals(new IsotopologueLookup.Id(28, 1), registry.byIsotopeFormula("31P-1H3"));
        assertEquals(new IsotopologueLookup.Id(1, 4), registry.byIsotopeFormula("1H-2H-16O"));
        assertEquals(new IsotopologueLookup.Id(2, 3), registry.byIsotopeFormula("12C-16O-18O"));
        assertNull(registry.byIsotopeFormula("14C-16O"));
        // Catalog species tag of CO (mass 28, first entry; from memory).
        assertEquals(new IsotopologueLookup.Id(5, 1), registry.byCatalogTag(28001));
        assertNull(registry.byCatalogTag(99999));
        assertTrue(Double.isNaN(registry.massGPerMol(5, 99)));
        assertTrue(Double.isNaN(registry.partitionSum(5, 1, 500.0)), "no partition sums attached");
    }

    @Test
    void userFileAddsAndOverridesIsotopologues() throws IOException {
        Path file = tmp.resolve("mine.tsv");
        Files.writeString(file, String.join("\n",
                "# my additions",
                String.join("\t", MoleculeRegistry.COLUMNS),
                "5\tCO\tcarbon monoxide\t7\t46\t14C-16O\t-\t1e-12\t110.5\t30.003241988\t-\tinvented test row",
                "5\tCO\tcarbon monoxide\t1\t26\t12C-16O\t-\t0.5\t100\t-\t28001\toverride",
                ""));
        MoleculeRegistry mine = registry.withUserFile(file);
        assertTrue(mine.isKnown(5, 7));
        assertEquals(new IsotopologueLookup.Id(5, 7), mine.byIsotopeFormula("14C-16O"));
        assertEquals(30.003241988, mine.massGPerMol(5, 7));
        assertEquals(0.5, mine.naturalAbundance(5, 1));
        // The built-in registry is unchanged.
        assertEquals(0.986544, registry.naturalAbundance(5, 1));
        assertEquals(registry.isotopologues().size() + 1, mine.isotopologues().size());
    }

    @Test
    void malformedUserFileGivesALocatedOneLineError() throws IOException {
        Path file = tmp.resolve("bad.tsv");
        Files.writeString(file, String.join("\t", MoleculeRegistry.COLUMNS) + "\n"
                + "5\tCO\tcarbon monoxide\t7\t46\t14C-16O\t-\t1.7\t110.5\t30.0\t-\tbad abundance\n");
        LineFormatException e = assertThrows(LineFormatException.class, () -> registry.withUserFile(file));
        assertEquals(2, e.lineNumber());
        assertEquals("abundance", e.field());
        assertEquals("1.7", e.offendingText());
        assertTrue(e.getMessage().startsWith(file + ":2:cols "), e.getMessage());
        assertEquals(-1, e.getMessage().indexOf('\n'));

        Path unknownNuclide = tmp.resolve("nuclide.tsv");
        Files.writeString(unknownNuclide, String.join("\t", MoleculeRegistry.COLUMNS) + "\n"
                + "99\tXy\tinvented\t1\t1\t1Xy\t-\t1\t10\t-\t-\t-\n");
        LineFormatException e2 = assertThrows(LineFormatException.class, () -> registry.withUserFile(unknownNuclide));
        assertEquals("isotope_formula", e2.field());

        Path noHeader = tmp.resolve("noheader.tsv");
        Files.writeString(noHeader, "5\tCO\n");
        assertThrows(LineFormatException.class, () -> registry.withUserFile(noHeader));
    }

    @Test
    void isotopeFormulaParsing() {
        assertEquals(List.of(new IsotopeFormula.Part("12C", 1), new IsotopeFormula.Part("1H", 3), new IsotopeFormula.Part("2H", 1)),
                IsotopeFormula.parse("12C-1H3-2H"));
        assertEquals("CH4", IsotopeFormula.chemicalFormula("12C-1H3-2H"));
        assertThrows(IllegalArgumentException.class, () -> IsotopeFormula.parse("C-16O"));
        assertThrows(IllegalArgumentException.class, () -> IsotopeFormula.parse("12C--16O"));
        assertThrows(IllegalArgumentException.class, () -> IsotopeFormula.parse("12c-16O"));
    }
}
