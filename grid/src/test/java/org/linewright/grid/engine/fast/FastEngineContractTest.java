package org.linewright.grid.engine.fast;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.junit.jupiter.api.Test;
import org.linewright.broadening.wings.WingCutoff;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.engine.LineChunk;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.InputException;

/** The engine contract: id, metadata, empty input, honest error reports, bad arguments. */
class FastEngineContractTest {

    @Test
    void describesItselfAndItsWingTreatment() {
        try (FastEngine engine = FastEngine.transformOnly(1, WingTreatment.defaults(), 1e-3)) {
            assertEquals("fast", engine.id());
            Map<String, String> m = engine.describe();
            assertEquals("fast", m.get("engine"));
            assertEquals("0.001", m.get("fast.tolerance"));
            assertEquals("fixed", m.get("wing.cutoff.rule"));
            assertEquals("false", m.get("wing.pedestal_removed"));
            assertTrue(m.containsKey("fast.cutoff_edge"));
        }
    }

    @Test
    void noLinesLeaveSigmaUntouched() {
        WavenumberGrid grid = WavenumberGrid.uniform(100, 101, 0.01);
        double[] sigma = new double[grid.size()];
        sigma[3] = 7.0;
        try (FastEngine engine = FastEngine.transformOnly(2, WingTreatment.defaults(), 1e-3)) {
            engine.begin(grid, 1.0, 296.0);
            LineChunk chunk = new LineChunk(4);
            chunk.size = 0;
            engine.accumulate(chunk, sigma);
            engine.finish(sigma);
            assertEquals(0.0, engine.estimatedRelativeError());
        }
        double[] expected = new double[grid.size()];
        expected[3] = 7.0;
        assertArrayEquals(expected, sigma);
    }

    @Test
    void linesBeyondTheCutoffOfEveryPointContributeNothing() {
        WavenumberGrid grid = WavenumberGrid.uniform(100, 101, 0.01);
        LineChunk chunk = FastEngineAccuracyTest.lines(11, 20, 110, 120, 0.001, 0.002, 0.01, 0.05);
        double[] sigma = new double[grid.size()];
        try (FastEngine engine = FastEngine.transformOnly(1, WingTreatment.defaults().withCutoff(WingCutoff.fixed(5.0)), 1e-3)) {
            engine.begin(grid, 1.0, 296.0);
            engine.accumulate(chunk, sigma);
            engine.finish(sigma);
        }
        // nothing but FFT round-off: far below 10⁻¹² of the strongest line's peak S/(πγL) (the exact engine: 0)
        double peak = 0;
        for (int i = 0; i < chunk.size; i++) {
            peak = Math.max(peak, chunk.intensityCmPerMolecule[i] / (Math.PI * chunk.lorentzHwhmCm1[i]));
        }
        for (double v : sigma) {
            assertTrue(v >= 0 && v <= 1e-12 * peak, "sigma " + v + " against peak " + peak);
        }
    }

    @Test
    void linesFarNarrowerThanTheGridAreSummedDirectly() {
        // αD = 10⁻⁵ cm⁻¹ on a 0.01 cm⁻¹ grid would need a refinement far above the cap: those lines are summed
        // exactly instead (beside a wide line that the transform takes), and σ equals a direct summation
        WavenumberGrid grid = WavenumberGrid.uniform(100, 101, 0.01);
        LineChunk narrow = FastEngineAccuracyTest.lines(12, 5, 100.2, 100.8, 1e-5, 2e-5, 0, 0);
        LineChunk chunk = new LineChunk(6);
        chunk.size = 6;
        for (int i = 0; i < 5; i++) {
            chunk.centerCm1[i] = narrow.centerCm1[i];
            chunk.intensityCmPerMolecule[i] = narrow.intensityCmPerMolecule[i];
            chunk.dopplerHwhmCm1[i] = narrow.dopplerHwhmCm1[i];
        }
        chunk.centerCm1[5] = 100.5;
        chunk.intensityCmPerMolecule[5] = 1e-20;
        chunk.dopplerHwhmCm1[5] = 0.001;
        chunk.lorentzHwhmCm1[5] = 0.07;
        try (FastEngine engine = FastEngine.transformOnly(1, WingTreatment.defaults(), 1e-3)) {
            double[] sigma = new double[grid.size()];
            engine.begin(grid, 1.0, 296.0);
            engine.accumulate(chunk, sigma);
            engine.finish(sigma);
            assertEquals("5", engine.describe().get("fast.direct_lines"));
            assertTrue(engine.estimatedRelativeError() <= 1e-3, "estimate " + engine.estimatedRelativeError());
            double[] direct = FastEngineAccuracyTest.direct(grid, chunk, WingTreatment.defaults());
            double observed = FastEngineAccuracyTest.maxRelativeError(sigma, direct, null);
            assertTrue(observed <= 1e-3, "observed " + observed);
        }
    }

    @Test
    void refusesBadArguments() {
        assertThrows(InputException.class, () -> new FastEngine(1, WingTreatment.defaults(), 0.0));
        assertThrows(InputException.class, () -> new FastEngine(1, WingTreatment.defaults(), 0.5));
        // below the smallest tolerance the transforms' round-off is not small against the criterion: refused
        assertThrows(InputException.class, () -> new FastEngine(1, WingTreatment.defaults(), 1e-9));
        assertThrows(IllegalArgumentException.class, () -> new FastEngine(0, WingTreatment.defaults(), 1e-3));
        try (FastEngine engine = FastEngine.transformOnly(1, WingTreatment.defaults(), 1e-3)) {
            WavenumberGrid grid = WavenumberGrid.uniform(100, 101, 0.01);
            engine.begin(grid, 1.0, 296.0);
            LineChunk chunk = new LineChunk(1);
            chunk.size = 1;
            chunk.centerCm1[0] = 100.5;
            chunk.intensityCmPerMolecule[0] = 1e-20;
            IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                    () -> engine.accumulate(chunk, new double[grid.size()]));
            assertTrue(e.getMessage().contains("100.5"), e.getMessage());
        }
    }
}
