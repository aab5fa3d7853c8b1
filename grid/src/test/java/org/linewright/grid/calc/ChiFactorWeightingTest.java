package org.linewright.grid.calc;

import static org.junit.jupiter.api.Assertions.assertEquals;
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
import org.linewright.broadening.wings.ChiFactorKind;
import org.linewright.broadening.wings.FixedCutoff;
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
 * The CO2 χ factor on the CO2-broadened share of the width only, inside its range of validity only. One synthetic
 * CO2 line at 2349 cm⁻¹ (self width 0.09, air width 0.07 cm⁻¹/atm, one exponent 0.75); σ 100 cm⁻¹ from the centre
 * with χ over σ without it is, by binary-collision additivity of the far wing, 1 − w + w·χ(100 cm⁻¹) with w the
 * CO2-broadened share of γL; χ by hand from the Perrin–Hartmann (JQSRT 42 (1989) 311) form with the coefficients
 * as transcribed in the class under test (from memory):
 * χ(100) = exp(−B1·(30 − 3) − B2·(100 − 30)), B1 = 0.0888 − 0.160·e^(−0.0041·T), B2 = 0.0526·e^(−0.00152·T).
 */
class ChiFactorWeightingTest {

    private static final double SELF_WIDTH = 0.09;
    private static final double AIR_WIDTH = 0.07;
    private static final MoleculeRegistry REGISTRY = PartitionSums.of(MoleculeRegistry.builtIn()).attachedRegistry();

    @TempDir
    static Path tmp;
    static LineStore store;

    @BeforeAll
    static void write() throws IOException {
        LineBatch b = SyntheticRecords.block(1, 11);
        b.moleculeId[0] = 2;
        b.isotopologue[0] = 1;
        b.wavenumberCm1[0] = 2349.0;
        b.intensityCmPerMolecule[0] = 1e-19;
        b.lowerEnergyCm1[0] = 100.0;
        b.selfWidthCm1PerAtm[0] = SELF_WIDTH;
        b.airWidthCm1PerAtm[0] = AIR_WIDTH;
        b.airWidthExponent[0] = 0.75;
        b.airShiftCm1PerAtm[0] = 0.0;
        b.size = 1;
        Path dir = tmp.resolve("co2-one");
        try (LineStoreWriter writer = LineStoreWriter.create(dir, "synthetic",
                SourceMetadata.of("synthetic-co2.par", "", "hitran160", Map.of("generator", "test")))) {
            writer.write(b);
            writer.commit(new IngestCounts(1, 1, 0, 0));
        }
        store = LineStore.open(dir);
    }

    private static CrossSectionResult sigma(String composition, double temperatureK, ChiFactorKind chi) {
        WavenumberGrid grid = WavenumberGrid.uniform(2449.0, 2450.0, 1.0);
        WingTreatment wings = new WingTreatment(new FixedCutoff(150.0), false, chi);
        CrossSectionRequest request = new CrossSectionRequest(temperatureK, 1.0, Composition.parse(composition), grid,
                wings, LineShapeKind.VOIGT, 0.0, LineSelection.ALL, WidthOptions.DEFAULTS);
        try (CrossSectionEngine engine = EngineFactory.create("fast", 1, wings, 1e-3)) {
            return new CrossSectionCalculator(List.of(store), REGISTRY, 1).compute(request, engine, null);
        }
    }

    private static double ratio(String composition, double temperatureK) {
        return sigma(composition, temperatureK, ChiFactorKind.PERRIN_HARTMANN_CO2).sigmaCm2PerMolecule()[0]
                / sigma(composition, temperatureK, ChiFactorKind.NONE).sigmaCm2PerMolecule()[0];
    }

    private static double chiByHand(double t) {
        double b1 = 0.0888 - 0.160 * Math.exp(-0.0041 * t);
        double b2 = 0.0526 * Math.exp(-0.00152 * t);
        return Math.exp(-b1 * 27 - b2 * 70);
    }

    @Test
    void chiWeightsTheCo2BroadenedShareOnly() {
        for (double t : new double[] {200.0, 250.0, 296.0}) {
            double chi = chiByHand(t);
            // pure CO2: the whole width is CO2-broadened
            assertEquals(chi, ratio("self=1", t), 1e-9 * chi, "self=1 T=" + t);
            // half CO2: w = 0.5·γself/(0.5·γself + 0.5·γair), the same exponent for both
            double w = SELF_WIDTH / (SELF_WIDTH + AIR_WIDTH);
            double expected = 1 - w + w * chi;
            assertEquals(expected, ratio("self=0.5,air=0.5", t), 1e-9 * expected, "half T=" + t);
            // Earth air with 400 ppm of the absorber: w ≈ 5e-4, the wing stays Lorentzian to that share
            double w400 = 4e-4 * SELF_WIDTH / (4e-4 * SELF_WIDTH + 0.9996 * AIR_WIDTH);
            double e400 = 1 - w400 + w400 * chi;
            assertEquals(e400, ratio("self=0.0004,air=0.9996", t), 1e-9 * e400, "400 ppm T=" + t);
            // no CO2 in the background: no χ
            assertEquals(1.0, ratio("air=1", t), 1e-12, "air T=" + t);
        }
    }

    @Test
    void outsideTheRangeOfValidityChiIsNotAppliedAndAWarningSaysSo() {
        for (double t : new double[] {150.0, 500.0, 1000.0}) {
            assertEquals(1.0, ratio("self=1", t), 1e-12, "T=" + t);
            CrossSectionResult r = sigma("self=1", t, ChiFactorKind.PERRIN_HARTMANN_CO2);
            assertTrue(r.warnings().stream().anyMatch(w -> w.contains("outside the chi factor's range")),
                    r.warnings().toString());
            assertEquals("1", r.metadata().get("wing.chi.lines_outside_validity"));
        }
    }
}
