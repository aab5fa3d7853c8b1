package org.linewright.grid.calc;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.broadening.background.Composition;
import org.linewright.broadening.sources.WidthOptions;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.engine.CrossSectionEngine;
import org.linewright.grid.engine.EngineFactory;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.partition.PartitionSums;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.store.IngestCounts;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.store.LineStoreWriter;
import org.linewright.ingest.store.SourceMetadata;
import org.linewright.ingest.testsupport.SyntheticRecords;

/**
 * The Van Vleck–Weisskopf shape through the calculator: which lines get it (the documented rule), that the fast
 * engine's σ with those lines summed directly keeps its own accuracy promise against the exact engine at every
 * point, and that a symmetric shape's area at ν ≤ 0 is reported, not silently lost. Lines: synthetic CO-like
 * rotational lines at 3.845·J cm⁻¹ (J = 1..25; 2B of ¹²C¹⁶O ≈ 3.845 cm⁻¹, from memory), air width 0.06 cm⁻¹/atm,
 * lower-state energies of a rigid rotor.
 */
class VanVleckWeisskopfRoutingTest {

    private static final int LINES = 25;
    private static final double SPACING_CM1 = 3.845;
    private static final MoleculeRegistry REGISTRY = PartitionSums.of(MoleculeRegistry.builtIn()).attachedRegistry();
    /** Second radiation constant hc/k in cm·K, CODATA 2018 (1.438776877e-2 m K). */
    private static final double C2_CM_K = 1.438776877;

    @TempDir
    static Path tmp;
    static LineStore store;

    @BeforeAll
    static void write() throws IOException {
        LineBatch b = SyntheticRecords.block(LINES, 3);
        for (int i = 0; i < LINES; i++) {
            b.wavenumberCm1[i] = Math.round(SPACING_CM1 * (i + 1) * 1e4) / 1e4;
            b.isotopologue[i] = 1;
            b.airWidthCm1PerAtm[i] = 0.06;
            b.selfWidthCm1PerAtm[i] = 0.07;
            b.airShiftCm1PerAtm[i] = 0.0;
            // rigid-rotor lower-state energy B·J(J+1), B = 1.9225 cm⁻¹ (line J → J+1 at 2B(J+1), J = i)
            b.lowerEnergyCm1[i] = 1.9225 * i * (i + 1);
        }
        b.size = LINES;
        Path dir = tmp.resolve("co-rot");
        try (LineStoreWriter writer = LineStoreWriter.create(dir, "synthetic",
                SourceMetadata.of("synthetic-co-rotational.par", "", "hitran160", Map.of("generator", "test")))) {
            writer.write(b);
            writer.commit(new IngestCounts(LINES, LINES, 0, 0));
        }
        store = LineStore.open(dir);
    }

    private static CrossSectionResult compute(String engineId, LineShapeKind shape, double pressureAtm,
                                              double temperatureK) {
        WavenumberGrid grid = WavenumberGrid.uniform(0.5, 100.0, 0.05);
        CrossSectionRequest request = new CrossSectionRequest(temperatureK, pressureAtm, Composition.air(), grid,
                WingTreatment.defaults(), shape, 0.0, LineSelection.ALL, WidthOptions.DEFAULTS);
        try (CrossSectionEngine engine = EngineFactory.create(engineId, 2, request.wings(), 1e-3)) {
            return new CrossSectionCalculator(List.of(store), REGISTRY, 2).compute(request, engine, null);
        }
    }

    /** Lines by the rule of docs/physics.md: γL/ν₀ &gt; 1e-4 and c₂ν₀/T ≤ 0.2, counted here from its terms. */
    private static long expectedByRule(double pressureAtm, double temperatureK) {
        long n = 0;
        for (int i = 0; i < LINES; i++) {
            double nu = Math.round(SPACING_CM1 * (i + 1) * 1e4) / 1e4;
            // γL ≥ 0.06·p·(296/T)^n > 1e-4·ν₀ for every line here; only the frequency condition decides
            if (C2_CM_K * nu <= 0.2 * temperatureK) {
                n++;
            }
        }
        return n;
    }

    @Test
    void theRuleChoosesTheLowFrequencyLinesAndIsRecorded() {
        CrossSectionResult r = compute("exact", LineShapeKind.VOIGT, 10.0, 296.0);
        // ν₀ ≤ 0.2·296/c₂ = 41.1 cm⁻¹: J = 1..10
        assertEquals(10, expectedByRule(10.0, 296.0));
        assertEquals("10", r.metadata().get("lines_van_vleck_weisskopf"));
        assertTrue(r.metadata().get("line_shape_rule").contains("gamma_L/nu0 > 1.0E-4"), r.metadata().toString());
        assertEquals("25", compute("exact", LineShapeKind.VAN_VLECK_WEISSKOPF, 10.0, 296.0).metadata()
                .get("lines_van_vleck_weisskopf"));
        assertEquals("0", compute("exact", LineShapeKind.DOPPLER, 10.0, 296.0).metadata()
                .get("lines_van_vleck_weisskopf"));
    }

    @Test
    void fastEngineWithTheShapeKeepsItsPromiseAtEveryPoint() {
        for (LineShapeKind shape : List.of(LineShapeKind.VOIGT, LineShapeKind.VAN_VLECK_WEISSKOPF)) {
            for (double p : new double[] {0.01, 1.0, 10.0}) {
                CrossSectionResult exact = compute("exact", shape, p, 296.0);
                CrossSectionResult fast = compute("fast", shape, p, 296.0);
                assertTrue(fast.metadata().containsKey("exact_summation"), shape + " " + p);
                double[] e = exact.sigmaCm2PerMolecule();
                double[] f = fast.sigmaCm2PerMolecule();
                double max = 0;
                for (double v : e) {
                    max = Math.max(max, v);
                }
                // the fast engine's published criterion: relative error 1e-3 where σ ≥ 1e-6 max σ
                for (int i = 0; i < e.length; i++) {
                    if (e[i] >= 1e-6 * max) {
                        assertEquals(e[i], f[i], 1e-3 * e[i], shape + " p=" + p + " point " + i);
                    }
                }
            }
        }
    }

    @Test
    void areaAtNegativeWavenumberIsReportedForASymmetricShape() {
        // at 20 K the rule keeps only ν₀ ≤ 2.8 cm⁻¹: every line here stays Voigt; the 3.845 cm⁻¹ line at 10 atm
        // (γL ≈ 0.6·(296/20)^n cm⁻¹) has a few % of its area at ν ≤ 0 (Lorentz: (1/π)·atan(γ/ν₀) order)
        CrossSectionResult voigt = compute("exact", LineShapeKind.VOIGT, 10.0, 20.0);
        assertEquals("0", voigt.metadata().get("lines_van_vleck_weisskopf"));
        double lost = Double.parseDouble(voigt.metadata().get("negative_wavenumber_loss_fraction"));
        assertTrue(lost > 1e-6, "negative-wavenumber loss " + lost);
        assertTrue(voigt.warnings().stream().anyMatch(w -> w.contains("wavenumbers <= 0")), voigt.warnings().toString());
        // the same lines with the Van Vleck-Weisskopf shape lose nothing there
        CrossSectionResult vvw = compute("exact", LineShapeKind.VAN_VLECK_WEISSKOPF, 10.0, 20.0);
        assertEquals(0.0, Double.parseDouble(vvw.metadata().get("negative_wavenumber_loss_fraction")));
        assertFalse(vvw.warnings().stream().anyMatch(w -> w.contains("wavenumbers <= 0")));
    }
}
