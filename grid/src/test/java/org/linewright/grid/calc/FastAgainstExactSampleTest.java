package org.linewright.grid.calc;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.broadening.background.Composition;
import org.linewright.broadening.sources.WidthOptions;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.wings.WingCutoff;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.engine.CrossSectionEngine;
import org.linewright.grid.engine.EngineFactory;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.partition.PartitionSums;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.testsupport.ReferenceSamples;

/**
 * The fast engine against the exact one on real lines — the HITRAN2020 CO and CO2 samples
 * ({@code ../shared/reference-data/hitran2020-samples/}) — with the same wing treatment (pedestal removed, so
 * neither engine has a step at the cutoff): relative difference within the requested tolerance wherever
 * σ ≥ 10⁻⁶·max σ, and within the fast engine's own error estimate.
 */
class FastAgainstExactSampleTest {
    private static final double TOLERANCE = 1e-3;

    @TempDir
    static Path tmp;
    static LineStore store;

    @BeforeAll
    static void ingest() throws IOException {
        store = LineStore.open(ReferenceSamples.ingest(tmp.resolve("store"), ReferenceSamples.hitranSample("sample_CO.par"),
                ReferenceSamples.hitranSample("sample_CO2.par")));
    }

    @ParameterizedTest(name = "p = {0} atm, T = {1} K, background {2}")
    @CsvSource({"1.0, 296, air=1", "0.01, 600, H2=0.85;He=0.15", "10.0, 1000, CO2=1"})
    void fastMatchesExactWithinTolerance(double pressureAtm, double temperatureK, String background) {
        Composition composition = Composition.parse(background.replace(';', ','));
        WavenumberGrid grid = WavenumberGrid.uniform(2000.0, 2400.0, 0.01);
        WingTreatment wings = WingTreatment.defaults().withCutoff(WingCutoff.fixed(25.0)).withPedestalRemoval(true);
        CrossSectionRequest request = new CrossSectionRequest(temperatureK, pressureAtm, composition, grid, wings,
                LineShapeKind.VOIGT, 0.0, LineSelection.ALL, WidthOptions.DEFAULTS);
        MoleculeRegistry registry = PartitionSums.of(MoleculeRegistry.builtIn()).attachedRegistry();
        CrossSectionCalculator calc = new CrossSectionCalculator(List.of(store), registry);
        CrossSectionResult exact;
        CrossSectionResult fast;
        try (CrossSectionEngine e = EngineFactory.create("exact", 2, wings, TOLERANCE)) {
            exact = calc.compute(request, e, ProgressListener.NONE);
        }
        try (CrossSectionEngine e = EngineFactory.create("fast", 2, wings, TOLERANCE)) {
            fast = calc.compute(request, e, ProgressListener.NONE);
        }
        double[] a = exact.sigmaCm2PerMolecule();
        double[] b = fast.sigmaCm2PerMolecule();
        double max = 0;
        for (double v : a) {
            max = Math.max(max, v);
        }
        assertTrue(max > 0, "lines in range");
        double worst = 0;
        for (int i = 0; i < a.length; i++) {
            if (a[i] >= 1e-6 * max) {
                worst = Math.max(worst, Math.abs(b[i] - a[i]) / a[i]);
            }
        }
        assertTrue(worst <= TOLERANCE, "worst relative difference " + worst);
        assertTrue(worst <= fast.estimatedRelativeError() * 1.0001 + 1e-12,
                "observed " + worst + " beyond the estimate " + fast.estimatedRelativeError());
    }
}
