package org.linewright.ingest.partition;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.ingest.InputException;
import org.linewright.ingest.registry.Isotopologue;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.source.IsotopologueLookup;
import org.linewright.ingest.source.LineFormatException;

class PartitionSumsTest {
    @TempDir
    Path tmp;

    private final MoleculeRegistry registry = MoleculeRegistry.builtIn();

    private static double cubic(double t) {
        return 3.0 + 0.2 * t - 1e-4 * t * t + 2e-7 * t * t * t;
    }

    @Test
    void lagrangeInterpolationIsExactForACubicInsideTheTable() {
        // A property of 4-point Lagrange interpolation (common practice): exact for polynomials of degree ≤ 3,
        // also on an uneven grid.
        double[] t = {100, 150, 175, 250, 300, 420, 500, 700, 1000};
        double[] q = new double[t.length];
        for (int i = 0; i < t.length; i++) {
            q[i] = cubic(t[i]);
        }
        PartitionTable table = PartitionTable.of("cubic", t, q);
        for (double x = 150; x <= 700; x += 7.25) {
            assertEquals(cubic(x), table.value(x), 1e-12 * cubic(x), "T = " + x);
        }
        // First and last intervals: linear between the two end points (written out here by hand).
        double x0 = 120;
        assertEquals(q[0] + (x0 - 100) / 50 * (q[1] - q[0]), table.value(x0), 1e-12 * q[0]);
        double x1 = 900;
        assertEquals(q[7] + (x1 - 700) / 300 * (q[8] - q[7]), table.value(x1), 1e-12 * q[8]);
        assertEquals(q[4], table.value(300));
        assertEquals(q[0], table.value(100));
        assertEquals(q[8], table.value(1000));
    }

    @Test
    void outsideTheTableIsAnErrorNotAnExtrapolation() {
        PartitionTable table = PartitionTable.of("q.txt", new double[] {100, 200, 300}, new double[] {10, 20, 30});
        InputException low = assertThrows(InputException.class, () -> table.value(99.9));
        assertTrue(low.getMessage().contains("q.txt") && low.getMessage().contains("100.0–300.0 K"), low.getMessage());
        assertThrows(InputException.class, () -> table.value(300.1));
        assertThrows(InputException.class, () -> table.value(Double.NaN));
    }

    @Test
    void readsTablesWithCommentsAndExoMolLayout() throws IOException {
        Path f = tmp.resolve("q.pf");
        // Invented values in the two-column layout of ExoMol .pf files (T in K, Q).
        Files.writeString(f, "# T  Q\n\n   1.0      1.0000\n   2.0      1.5000  # note\n   3.0      2.2500\n\t4.0\t3.0\n");
        PartitionTable t = PartitionTable.read(f);
        assertEquals(4, t.size());
        assertEquals(1.0, t.minTemperatureK());
        assertEquals(4.0, t.maxTemperatureK());
        assertEquals(1.5, t.value(2.0));
    }

    @Test
    void malformedTablesGiveLocatedErrors() throws IOException {
        Path notIncreasing = tmp.resolve("a.txt");
        Files.writeString(notIncreasing, "100 10\n200 20\n200 21\n");
        LineFormatException e = assertThrows(LineFormatException.class, () -> PartitionTable.read(notIncreasing));
        assertEquals(3, e.lineNumber());
        assertEquals(1, e.firstColumn());
        assertEquals("temperature", e.field());
        assertTrue(e.getMessage().startsWith(notIncreasing + ":3:cols 1-3: field temperature: \"200\""), e.getMessage());

        Path notNumber = tmp.resolve("b.txt");
        Files.writeString(notNumber, "100 10\n200 2x0\n");
        LineFormatException e2 = assertThrows(LineFormatException.class, () -> PartitionTable.read(notNumber));
        assertEquals("partition sum", e2.field());
        assertEquals("2x0", e2.offendingText());
        assertEquals(5, e2.firstColumn());

        Path threeColumns = tmp.resolve("c.txt");
        Files.writeString(threeColumns, "100 10 5\n");
        assertThrows(LineFormatException.class, () -> PartitionTable.read(threeColumns));

        Path onePoint = tmp.resolve("d.txt");
        Files.writeString(onePoint, "# only\n100 10\n");
        assertThrows(LineFormatException.class, () -> PartitionTable.read(onePoint));
    }

    @Test
    void parsesTableSpecifications() {
        assertEquals(new TableSpec(19, 1, Path.of("q.txt")), TableSpec.parse("19/1=q.txt"));
        assertEquals(new TableSpec(2, 10, Path.of("dir/q=1.pf")), TableSpec.parse("2/10=dir/q=1.pf"));
        assertThrows(InputException.class, () -> TableSpec.parse("19=q.txt"));
        assertThrows(InputException.class, () -> TableSpec.parse("a/1=q.txt"));
        assertThrows(InputException.class, () -> TableSpec.parse("19/1="));
    }

    @Test
    void rrhoReproducesTabulatedQ296OfCarbonMonoxideAndDioxide() {
        // Q(296 K) of 12C16O = 107.42 and 12C16O2 = 286.09 (samples README: HITRAN isotopologue metadata,
        // TIPS-2021); the RRHO model should be within a few %.
        assertEquals(1.0, RigidRotorHarmonicOscillator.partitionSum(MolecularConstants.forMolecule(5), 296) / 107.42, 0.01);
        assertEquals(1.0, RigidRotorHarmonicOscillator.partitionSum(MolecularConstants.forMolecule(2), 296) / 286.09, 0.01);
    }

    @Test
    void rrhoIsWithinAFewPercentOfTheTabulatedQ296OfEveryMainIsotopologue() {
        // Tabulated values: the registry's Q(296 K) (TIPS-2021, from memory). OH (13) is excluded: its ²Π
        // fine structure is far from the rigid-rotor picture (documented).
        int checked = 0;
        for (Isotopologue iso : registry.isotopologues()) {
            MolecularConstants c = MolecularConstants.forMolecule(iso.moleculeId());
            if (iso.number() != 1 || c == null || iso.moleculeId() == 13) {
                continue;
            }
            double rrho = RigidRotorHarmonicOscillator.partitionSum(c, 296);
            assertEquals(1.0, rrho / iso.q296(), 0.025, "molecule " + iso.moleculeId());
            checked++;
        }
        assertEquals(26, checked);
    }

    @Test
    void linearRotorSeriesAgreesWithDirectSummation() {
        // Independent check of the Mulholland expansion: direct sum Σ(2J+1)exp(−c2·B·J(J+1)/T) for CO at
        // 50 K and 296 K (common practice), rotational part only (no vibration, σ = 1, g_ns = 1).
        MolecularConstants co = new MolecularConstants(5, true, new double[] {1.92253}, 1, 1, new double[0], new int[0],
                new double[] {0}, new int[] {1});
        for (double t : new double[] {50, 296}) {
            double sum = 0;
            for (int j = 0; j < 400; j++) {
                sum += (2 * j + 1) * Math.exp(-1.438776877 * 1.92253 * j * (j + 1) / t);
            }
            assertEquals(sum, RigidRotorHarmonicOscillator.partitionSum(co, t), sum * 1e-6, "T = " + t);
        }
    }

    @Test
    void builtInValuesCarryTheirOrigin() {
        PartitionSums q = PartitionSums.of(registry);
        PartitionSums.Value at296 = q.value(5, 1, 296.0);
        // Q(296 K) of 12C16O = 107.42 (samples README: HITRAN isotopologue metadata, TIPS-2021, from memory).
        assertEquals(107.42, at296.q());
        assertEquals(PartitionSums.Origin.REGISTRY_296, at296.origin());
        PartitionSums.Value hot = q.value(5, 1, 1000.0);
        assertEquals(PartitionSums.Origin.BUILT_IN, hot.origin());
        assertTrue(hot.source().contains("built-in v") && hot.source().contains("levels"), hot.source());
        assertTrue(hot.withinStatedAccuracy(), hot.warnings().toString());
        // Rigid rotor: Q roughly proportional to T for CO, plus a few % of vibration at 1000 K
        // (e^(−c2·2143/1000) ≈ 0.046): between 1000/296 and 1.1 × 1000/296 times Q(296) (common practice).
        assertTrue(hot.q() > 107.42 * 1000 / 296 && hot.q() < 1.1 * 107.42 * 1000 / 296, Double.toString(hot.q()));
        assertThrows(InputException.class, () -> q.value(5, 99, 300.0));
    }

    @Test
    void anIsotopologueWithoutTabulatedNuclideDataHasNoModelButAClearError() throws IOException {
        // A user row for 14C16O (invented abundance and Q): 14C has no tabulated spin, so no level sum.
        Path f = tmp.resolve("extra.tsv");
        Files.writeString(f, String.join("\t", "molecule_id",
                "molecule", "molecule_name", "isotopologue", "code", "isotope_formula", "aliases", "abundance", "q296",
                "mass_g_per_mol", "catalog_tags", "provenance") + "\n"
                + String.join("\t", "5", "CO", "carbon monoxide", "9", "46", "14C-16O", "-", "1e-12", "100.0", "30.0",
                "-", "synthetic test row") + "\n");
        PartitionSums q = PartitionSums.of(registry.withUserFile(f));
        assertEquals(100.0, q.value(5, 9, 296.0).q());
        InputException e = assertThrows(InputException.class, () -> q.value(5, 9, 1000.0));
        assertTrue(e.getMessage().contains("5/9") && e.getMessage().contains("=FILE"), e.getMessage());
        assertTrue(Double.isNaN(q.attachedRegistry().partitionSum(5, 9, 1000.0)));
    }

    @Test
    void userTableReplacesBuiltInValuesAtEveryTemperature() throws IOException {
        Path f = tmp.resolve("co.txt");
        Files.writeString(f, "200 70\n296 100\n400 140\n500 180\n");
        PartitionSums q = PartitionSums.of(registry).withTables(List.of(TableSpec.parse("5/1=" + f)));
        assertEquals(100.0, q.value(5, 1, 296.0).q());
        assertEquals(PartitionSums.Origin.TABLE, q.value(5, 1, 296.0).origin());
        assertEquals(PartitionSums.Origin.TABLE, q.value(5, 1, 350.0).origin());
        assertThrows(InputException.class, () -> q.value(5, 1, 600.0));
        assertEquals(PartitionSums.Origin.REGISTRY_296, q.value(5, 2, 296.0).origin());

        IsotopologueLookup lookup = q.attachedRegistry();
        assertEquals(100.0, lookup.partitionSum(5, 1, 296.0));
        assertEquals(224.69, lookup.partitionSum(5, 2, 296.0));
        assertTrue(lookup.partitionSum(5, 2, 300.0) > 224.69);
        assertTrue(Double.isNaN(lookup.partitionSum(5, 99, 296.0)));
    }
}
