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
 * Lines whose Lorentz width is large against a fixed cutoff (γL up to a third of R, as at ~100 bar with a 25 cm⁻¹
 * cutoff) beside lines a thousand times narrower: the plan gives the wide lines families of their own (their cutoff
 * edge needs a much finer Lorentz axis), and σ still meets the tolerance at every grid point against direct summation
 * of the closed-form Voigt profile ({@code VoigtProfile}, itself checked against SciPy's wofz in the broadening
 * module), with the estimate above what is observed.
 */
class FastEngineWideLinesTest {
    private static final double TOLERANCE = 1e-3;

    @Test
    void wideLinesGetTheirOwnFamiliesAndTheToleranceHolds() {
        WingTreatment wings = WingTreatment.defaults().withCutoff(WingCutoff.fixed(25));
        WavenumberGrid grid = WavenumberGrid.uniform(2000, 2200, 0.005);
        // αD 0.004–0.006 cm⁻¹ (CO near 2100 cm⁻¹ at 300–700 K); γL log-uniform over 0.008–8 cm⁻¹
        LineChunk chunk = FastEngineAccuracyTest.lines(11, 3000, 1990, 2210, 0.004, 0.006, 0.008, 8.0);
        double[] estimate = new double[1];
        double[] fast;
        Map<String, String> plan;
        try (FastEngine engine = FastEngine.transformOnly(2, wings, TOLERANCE)) {
            fast = new double[grid.size()];
            engine.begin(grid, 1.0, 296.0);
            engine.accumulate(chunk, fast);
            engine.finish(fast);
            estimate[0] = engine.estimatedRelativeError();
            plan = engine.describe();
        }
        assertTrue(plan.containsKey("fast.family.voigt-wide.lines"), plan.toString());
        int wide = Integer.parseInt(plan.get("fast.family.voigt-wide.lorentz_nodes"));
        int narrow = Integer.parseInt(plan.get("fast.family.voigt.lorentz_nodes"));
        double wideStep = Double.parseDouble(plan.get("fast.family.voigt-wide.lorentz_log_step"));
        double narrowStep = Double.parseDouble(plan.get("fast.family.voigt.lorentz_log_step"));
        assertTrue(narrowStep > 2 * wideStep, "narrow lines take a coarser Lorentz axis: " + narrowStep + " vs "
                + wideStep + " (" + narrow + " and " + wide + " nodes)");
        assertEquals(0, Integer.parseInt(plan.getOrDefault("fast.direct_lines", "0")));

        double[] direct = FastEngineAccuracyTest.direct(grid, chunk, wings);
        double observed = FastEngineAccuracyTest.maxRelativeError(fast, direct, null);
        double max = 0;
        double absolute = 0;
        for (int k = 0; k < direct.length; k++) {
            max = Math.max(max, direct[k]);
            absolute = Math.max(absolute, Math.abs(fast[k] - direct[k]));
        }
        assertTrue(observed <= TOLERANCE, "observed " + observed + " > tolerance");
        assertTrue(observed <= estimate[0], "observed " + observed + " > estimate " + estimate[0]);
        assertTrue(absolute <= TOLERANCE * max, "absolute " + absolute / max + " of max");
        System.out.printf(java.util.Locale.ROOT, "wide lines: observed %.2e, estimate %.2e, Lorentz nodes %d + %d%n",
                observed, estimate[0], narrow, wide);
    }
}
