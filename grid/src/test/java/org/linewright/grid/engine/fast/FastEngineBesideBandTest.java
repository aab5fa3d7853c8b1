package org.linewright.grid.engine.fast;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.junit.jupiter.api.Test;
import org.linewright.broadening.wings.WingCutoff;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.engine.LineChunk;
import org.linewright.grid.wavenumber.WavenumberGrid;

/**
 * A grid beside a band (a table block next to the block that holds the band): every line lies outside the grid,
 * narrow (low pressure: αD ≈ 6×10⁻⁴ cm⁻¹, γL ≤ 10⁻⁴ cm⁻¹), and σ on the grid is only their 25 cm⁻¹ wings, some
 * 10⁻⁶ of their peaks. The transforms' round-off scales with the peaks the ring holds, so the engine must either
 * take such lines out of the transform or report an estimate above the tolerance; it takes them out, and its
 * estimate is then within the tolerance and true at every grid point against direct summation of the closed-form
 * Voigt profile ({@code VoigtProfile}, itself checked against SciPy's wofz in the broadening module). Before the
 * planner bounded max σ by σ itself at probe points, this case reported an estimate of 10–100 (relative).
 */
class FastEngineBesideBandTest {
    private static final double TOLERANCE = 1e-3;

    @Test
    void linesBesideTheGridKeepTheToleranceAndAnEstimateWithinIt() {
        WingTreatment wings = WingTreatment.defaults().withCutoff(WingCutoff.fixed(25));
        WavenumberGrid grid = WavenumberGrid.uniform(581.0, 621.0, 0.002);
        LineChunk chunk = FastEngineAccuracyTest.lines(7, 20_000, 556.5, 580.9, 5.5e-4, 6.5e-4, 2e-5, 1e-4);
        double[] fast = new double[grid.size()];
        double estimate;
        Map<String, String> plan;
        try (FastEngine engine = new FastEngine(2, wings, TOLERANCE)) {
            engine.begin(grid, 0.01, 296.0);
            engine.accumulate(chunk, fast);
            engine.finish(fast);
            estimate = engine.estimatedRelativeError();
            plan = engine.describe();
        }
        double[] direct = FastEngineAccuracyTest.direct(grid, chunk, wings);
        double observed = FastEngineAccuracyTest.maxRelativeError(fast, direct, null);
        String where = "observed " + observed + ", estimate " + estimate + ", plan " + plan;
        assertTrue(estimate <= TOLERANCE, where);
        assertTrue(observed <= estimate, where);
    }
}
