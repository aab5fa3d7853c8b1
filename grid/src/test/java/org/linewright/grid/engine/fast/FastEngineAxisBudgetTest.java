package org.linewright.grid.engine.fast;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.junit.jupiter.api.Test;
import org.linewright.broadening.wings.WingCutoff;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.engine.LineChunk;
import org.linewright.grid.wavenumber.WavenumberGrid;

/**
 * A Doppler-dominated family whose floored Lorentz stencil takes a little more than half of the width budget (CO
 * near 2100 cm⁻¹ at 10⁻⁴ bar and 600 K: αD 0.00324–0.00363 cm⁻¹, γL up to 10⁻⁵ cm⁻¹, 25 cm⁻¹ cutoff, 0.0005 cm⁻¹
 * grid) is transformed with a Doppler axis chosen for what the Lorentz axis left, not summed directly, and σ meets
 * the tolerance at every grid point against direct summation of the closed-form Voigt profile ({@code VoigtProfile},
 * itself checked against SciPy's wofz in the broadening module).
 */
class FastEngineAxisBudgetTest {
    private static final double TOLERANCE = 1e-3;

    @Test
    void aFamilyJustOverHalfTheBudgetOnOneAxisIsTransformedWithinTheTolerance() {
        WingTreatment wings = WingTreatment.defaults().withCutoff(WingCutoff.fixed(25));
        WavenumberGrid grid = WavenumberGrid.uniform(2081.04, 2162.0795, 0.0005);
        LineChunk chunk = FastEngineAccuracyTest.lines(3, 1000, 2056.04, 2187.08, 0.0032391680285728543,
                0.0036259628436039045, 5.3372259431542815e-9, 9.859363434492968e-6);
        // the family's extreme widths, as in the table block where the planner met this case
        double[][] corners = {{0.0032391680285728543, 9.859363434492968e-6}, {0.0036259628436039045,
            5.3372259431542815e-9}, {0.0032391680285728543, 5.3372259431542815e-9}, {0.0036259628436039045,
            9.859363434492968e-6}};
        for (int c = 0; c < corners.length; c++) {
            chunk.dopplerHwhmCm1[100 * c] = corners[c][0];
            chunk.lorentzHwhmCm1[100 * c] = corners[c][1];
        }
        double[] fast = new double[grid.size()];
        double estimate;
        Map<String, String> plan;
        try (FastEngine engine = new FastEngine(2, wings, TOLERANCE)) {
            engine.begin(grid, 1.0, 296.0);
            engine.accumulate(chunk, fast);
            engine.finish(fast);
            estimate = engine.estimatedRelativeError();
            plan = engine.describe();
        }
        assertEquals("0", plan.get("fast.direct_lines"), plan.getOrDefault("fast.direct_reason", ""));
        double[] direct = FastEngineAccuracyTest.direct(grid, chunk, wings);
        double observed = FastEngineAccuracyTest.maxRelativeError(fast, direct, null);
        assertTrue(observed <= TOLERANCE, "observed " + observed);
        assertTrue(observed <= estimate, "observed " + observed + " > estimate " + estimate);
        assertTrue(estimate <= TOLERANCE, "estimate " + estimate);
    }
}
