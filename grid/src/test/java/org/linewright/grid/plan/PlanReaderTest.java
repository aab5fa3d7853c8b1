package org.linewright.grid.plan;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.linewright.broadening.background.BackgroundGas;
import org.linewright.ingest.InputException;

class PlanReaderTest {
    private static final String GOOD = """
            [lines]
            sources = ["data/lines.par"]
            [grid]
            wavenumber = { from = 2000.0, to = 2300.0, step = 0.01 }
            pressures_bar = [1e-4, 1e-2, 1.0]
            temperatures_K = [300.0, 600.0, 1000.0]
            [background]
            H2 = 0.85
            He = 0.15
            [profile]
            engine = "exact"
            cutoff_cm1 = 25.0
            [output]
            table = "tables/co-h2he.arrow"
            """;

    @TempDir
    Path dir;

    @BeforeEach
    void data() throws IOException {
        Files.createDirectories(dir.resolve("data"));
        Files.writeString(dir.resolve("data/lines.par"), "");
        Files.writeString(dir.resolve("data/q.txt"), "296 100\n");
    }

    private TablePlan read(String text) throws IOException {
        Path plan = dir.resolve("plan.toml");
        Files.writeString(plan, text);
        return PlanReader.read(plan);
    }

    @Test
    void readsTheDocumentedExample() throws IOException {
        TablePlan plan = read(GOOD);
        assertEquals(dir.resolve("data/lines.par").toAbsolutePath().normalize(), plan.sources().get(0));
        // 2000..2300 cm-1 by 0.01: (2300 - 2000)/0.01 + 1 = 30001 points (arithmetic)
        assertEquals(30_001, plan.grid().size());
        assertEquals(0.85, plan.composition().fraction(BackgroundGas.H2));
        assertEquals(25.0, plan.profile().cutoffCm1());
        assertEquals(TablePlan.Precision.FLOAT64, plan.precision());
        assertTrue(plan.outputTable().endsWith("tables/co-h2he.arrow"));
        // 1 bar = 1e5 Pa and 1 atm = 101325 Pa (SI definitions): 1 bar = 0.986923... atm
        assertEquals(0.9869232667160128, plan.pressuresAtm()[2], 1e-15);
    }

    @Test
    void convertsWavelengthAndFrequencyRanges() throws IOException {
        // 4 um .. 5 um = 2000 .. 2500 cm-1 (nu = 1e4 / lambda); resolving power grid
        TablePlan um = read(GOOD.replace("{ from = 2000.0, to = 2300.0, step = 0.01 }",
                "{ from = 4.0, to = 5.0, resolving_power = 1.0e4, unit = \"um\" }"));
        assertEquals(2000.0, um.grid().firstCm1(), 1e-9);
        assertTrue(um.grid().lastCm1() <= 2500.0 && um.grid().lastCm1() > 2499.0);
        // 1 cm-1 = 29.9792458 GHz (c = 299792458 m/s, SI definition)
        TablePlan ghz = read(GOOD.replace("{ from = 2000.0, to = 2300.0, step = 0.01 }",
                "{ from = 299.792458, to = 599.584916, step = 29.9792458, unit = \"GHz\" }"));
        assertEquals(10.0, ghz.grid().firstCm1(), 1e-12);
        assertEquals(11, ghz.grid().size());
    }

    private static final String[][] BAD_PLANS = {
        {"unknown section", "[extra]\nx = 1", "extra: unknown section"},
        {"unknown key", "[profile]\nengine = \"exact\"\ncutof_cm1 = 25.0", "profile.cutof_cm1: unknown key"},
        {"unknown wavenumber key", "[grid]\nwavenumber = { from = 1.0, to = 2.0, stp = 0.1 }", "grid.wavenumber.stp: unknown key"},
        {"wrong type", "[grid]\npressures_bar = \"1 bar\"", "grid.pressures_bar: is the string \"1 bar\""},
        {"zero pressure", "[grid]\npressures_bar = [0.0, 1.0]", "grid.pressures_bar: item 1 is 0.0"},
        {"negative temperature", "[grid]\ntemperatures_K = [-5.0]", "grid.temperatures_K: item 1 is -5.0"},
        {"descending", "[grid]\ntemperatures_K = [600.0, 300.0]", "grid.temperatures_K: item 2 (300.0) is not above"},
        {"empty range", "[grid]\nwavenumber = { from = 2300.0, to = 2000.0, step = 0.01 }", "grid.wavenumber: from 2300.0 to 2000.0"},
        {"empty list", "[grid]\npressures_bar = []", "grid.pressures_bar: is empty"},
        {"missing file", "[lines]\nsources = [\"data/nothing.par\"]", "lines.sources: "},
        {"fractions", "[background]\nH2 = 0.5\nHe = 0.15", "background: "},
        {"unknown gas", "[background]\nXe = 1.0", "background.Xe: unknown gas"},
        {"precision", "[output]\ntable = \"t.arrow\"\nprecision = \"float16\"", "output.precision: \"float16\""},
        {"extension", "[output]\ntable = \"t.csv\"", "output.table: \"t.csv\""},
        {"engine", "[profile]\nengine = \"quick\"", "profile.engine: \"quick\""},
        {"fast tolerance", "[profile]\nengine = \"fast\"\nmax_relative_error = 1e-9", "profile.max_relative_error: is 1.0E-9"},
        {"cutoff", "[profile]\ncutoff_cm1 = -1.0", "profile.cutoff_cm1: is -1.0"},
        {"partition file", "[partition_sums]\ntables = [\"5/1=nothing.txt\"]", "partition_sums.tables: "},
        {"width source", "[widths]\norder = [\"guess\"]", "widths.order: unknown width source"},
        {"block points", "[build]\nblock_points = 0", "build.block_points: is 0"},
        {"isotopologue", "[species]\nisotopologues = [\"5-1\"]", "species.isotopologues: \"5-1\""},
        {"intensity convention", "[species]\nintensity_per = \"molecule\"", "species.intensity_per: \"molecule\""},
        {"isotopologue convention over a molecule", "[species]\nmolecules = [5]\nintensity_per = \"isotopologue\"",
            "species.intensity_per: is \"isotopologue\" without one isotopologue selected"},
        {"abundance not a table", "[species]\nabundance = \"CO/2=0.02\"", "species.abundance: is the string"},
        {"unknown isotopologue", "[species]\nabundance = { \"CO/99\" = 0.02 }", "species.abundance.\"CO/99\": unknown isotopologue"},
        {"abundance above 1", "[species]\nabundance = { \"CO/2\" = 1.5 }", "species.abundance.\"CO/2\": is 1.5"},
        {"abundance twice", "[species]\nabundance = { \"CO/2\" = 0.02, \"5/2\" = 0.03 }", "names isotopologue 5/2 a second time"},
        {"abundance with the isotopologue convention",
            "[species]\nisotopologues = [\"5/2\"]\nintensity_per = \"isotopologue\"\nabundance = { \"CO/2\" = 0.02 }",
            "species.abundance.\"CO/2\": is given with species.intensity_per"},
        {"unknown molecule", "[species]\nvmr = { Kr = 0.5 }", "species.vmr.Kr: unknown molecule"},
        {"zero mixing ratio", "[species]\nvmr = { CO = 0.0 }", "species.vmr.CO: is 0.0"},
        {"mixing ratio text", "[species]\nvmr = { CO = \"much\" }", "species.vmr.CO: is the string \"much\""},
        {"empty mixture", "[species]\nvmr = {}", "species.vmr: is empty"},
        {"molecule twice", "[species]\nvmr = { CO = 0.5, 5 = 0.5 }", "species.vmr.5: names CO a second time"},
        {"mixture with a selection", "[species]\nmolecules = [5]\nvmr = { CO = 1.0 }",
            "species.vmr: is given with species.molecules"},
    };

    static java.util.stream.Stream<org.junit.jupiter.params.provider.Arguments> badPlans() {
        return java.util.Arrays.stream(BAD_PLANS).map(r -> org.junit.jupiter.params.provider.Arguments.of((Object[]) r));
    }

    @ParameterizedTest(name = "{0}")
    @org.junit.jupiter.params.provider.MethodSource("badPlans")
    void badPlansGiveOneLineNamingTheKey(String what, String replacement, String expected) throws IOException {
        String text = override(GOOD, replacement.replace("\\n", "\n"));
        InputException e = assertThrows(InputException.class, () -> read(text), what);
        assertFalse(e.getMessage().contains("\n"), "one line: " + e.getMessage());
        assertTrue(e.getMessage().contains(expected), e.getMessage() + " should contain " + expected);
        assertTrue(e.getMessage().startsWith(dir.resolve("plan.toml").toString()), e.getMessage());
    }

    @Test
    void cutoffRulesAreReadAndExclusive() throws IOException {
        TablePlan hwhm = read(GOOD.replace("cutoff_cm1 = 25.0", "cutoff_cm1 = 25.0\ncutoff_hwhm_multiple = 500.0"));
        assertEquals("voigt-hwhm-multiple", hwhm.profile().wings().cutoff().describe().get("wing.cutoff.rule"));
        TablePlan perAtm = read(GOOD.replace("cutoff_cm1 = 25.0", "cutoff_cm1 = 25.0\ncutoff_per_atm_cm1 = 5.0"));
        // d = min(25, max(1, 5 cm-1/atm x 2 atm)) = 10 cm-1 (the documented pressure rule)
        assertEquals(10.0, perAtm.profile().wings().cutoff().distanceCm1(0.003, 0.1, 2.0), 1e-12);
        InputException both = assertThrows(InputException.class, () -> read(GOOD.replace("cutoff_cm1 = 25.0",
                "cutoff_cm1 = 25.0\ncutoff_hwhm_multiple = 500.0\ncutoff_per_atm_cm1 = 5.0")));
        assertTrue(both.getMessage().contains("profile.cutoff_hwhm_multiple"), both.getMessage());
    }

    @Test
    void missingPlanFileIsNamed() {
        InputException e = assertThrows(InputException.class, () -> PlanReader.read(dir.resolve("none.toml")));
        assertTrue(e.getMessage().contains("none.toml"));
    }

    @Test
    void optionalSectionsAreRead() throws IOException {
        TablePlan plan = read(GOOD + """
                [species]
                molecules = [5]
                isotopologues = ["2/1"]
                [partition_sums]
                tables = ["5/1=data/q.txt"]
                [widths]
                order = ["line", "rule", "default"]
                no_default_widths = true
                [build]
                block_points = 500
                """);
        assertEquals(java.util.List.of(5), plan.species().molecules());
        assertEquals(1, plan.partitionTables().size());
        assertTrue(plan.partitionTables().get(0).file().isAbsolute());
        assertTrue(plan.widths().forbidDefaults());
        assertEquals(500, plan.blockPoints());
    }

    @Test
    void intensityConventionAbundancesAndMixingRatiosAreRead() throws IOException {
        TablePlan plan = read(GOOD + """
                [species]
                abundance = { "CO/2" = 0.02, "2/1" = 0.9 }
                vmr = { CO = 1e-3, co2 = 4e-4 }
                """);
        // names as the registry spells them: CO = molecule 5, CO2 = molecule 2 (HITRAN numbering, common practice)
        assertEquals(java.util.Map.of("5/2", 0.02, "2/1", 0.9), plan.species().intensityScaling().userAbundances());
        assertEquals(java.util.List.of(new TablePlan.Vmr(5, "CO", 1e-3), new TablePlan.Vmr(2, "CO2", 4e-4)),
                plan.species().vmr());
        assertEquals("5/2=0.02;2/1=0.9", plan.describe().get("abundance"));
        assertEquals("CO=0.001;CO2=4.0E-4", plan.describe().get("vmr"));
        assertEquals("natural-abundance", plan.describe().get("intensity_per"));
        TablePlan iso = read(GOOD + """
                [species]
                isotopologues = ["5/2"]
                intensity_per = "isotopologue"
                """);
        assertEquals("isotopologue", iso.describe().get("intensity_per"));
        assertEquals("none", iso.describe().get("vmr"));
    }

    /** Replaces or adds the sections of {@code patch} in {@code base} (a key of the patch replaces the same key). */
    private static String override(String base, String patch) {
        String section = patch.substring(0, patch.indexOf('\n') < 0 ? patch.length() : patch.indexOf('\n'));
        if (!base.contains(section)) {
            return base + patch + "\n";
        }
        StringBuilder out = new StringBuilder();
        String current = "";
        java.util.Set<String> patchKeys = new java.util.HashSet<>();
        for (String l : patch.split("\n")) {
            if (l.contains("=")) {
                patchKeys.add(l.substring(0, l.indexOf('=')).trim());
            }
        }
        for (String line : base.split("\n")) {
            if (line.startsWith("[")) {
                current = line;
                out.append(line).append('\n');
                if (line.equals(section)) {
                    for (String l : patch.split("\n")) {
                        if (!l.startsWith("[")) {
                            out.append(l).append('\n');
                        }
                    }
                }
                continue;
            }
            if (current.equals(section) && line.contains("=")
                    && patchKeys.contains(line.substring(0, line.indexOf('=')).trim())) {
                continue;
            }
            out.append(line).append('\n');
        }
        return out.toString();
    }

    /** Each deprecated plan key (DEVELOPERS.md, "Naming") is still read for one version and gives the same plan. */
    @Test
    void deprecatedKeysGiveTheSamePlan() throws IOException {
        String[][] pairs = {
            {"cutoff_cm1 = 25.0\ncutoff_hwhm = 500.0", "cutoff_cm1 = 25.0\ncutoff_hwhm_multiple = 500.0"},
            {"cutoff_cm1 = 25.0\nthreshold = 1e-25", "cutoff_cm1 = 25.0\nthreshold_cm_per_molecule = 1e-25"},
            {"cutoff_cm1 = 25.0\ntolerance = 0.01", "cutoff_cm1 = 25.0\nmax_relative_error = 0.01"},
        };
        for (String[] p : pairs) {
            assertEquals(read(GOOD.replace("cutoff_cm1 = 25.0", p[1])).describe(),
                    read(GOOD.replace("cutoff_cm1 = 25.0", p[0])).describe(), p[0]);
        }
    }
}
