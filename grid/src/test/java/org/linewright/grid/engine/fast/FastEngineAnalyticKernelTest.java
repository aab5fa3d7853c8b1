package org.linewright.grid.engine.fast;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.linewright.broadening.wings.WingCutoff;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.engine.LineChunk;
import org.linewright.grid.wavenumber.WavenumberGrid;

/**
 * The fast engine on its analytic kernel path (closed-form transforms, per-Lorentz-node wing correction) against
 * direct summation of the truncated Voigt profile ({@code VoigtProfile} through the exact engine's wing kernel,
 * itself tested against SciPy's wofz in the broadening module): within the tolerance wherever σ ≥ 10⁻⁶·max σ and
 * within the engine's own estimate, for cutoffs 25 and 1 cm⁻¹, pedestal removal on and off, and Lorentz widths of
 * about 10⁻⁴, 1 and 100 atm (air widths of order 0.07 cm⁻¹/atm, common practice). Points within a few internal
 * steps of a line's cutoff are skipped as in {@link FastEngineAccuracyTest} (the documented blurred edge).
 */
class FastEngineAnalyticKernelTest {

    private static final double TOLERANCE = 1e-3;
    private static final double STEP = 0.002;

    private static Map<String, String> run(WavenumberGrid grid, LineChunk chunk, WingTreatment wings, int threads,
                                           boolean analytic, double[] sigma, double[] estimate) {
        try (FastEngine engine = FastEngine.transformOnly(threads, wings, TOLERANCE, analytic)) {
            engine.begin(grid, 1.0, 296.0);
            engine.accumulate(chunk, sigma);
            engine.finish(sigma);
            estimate[0] = engine.estimatedRelativeError();
            return engine.describe();
        }
    }

    @ParameterizedTest(name = "R={0} pedestal={1} gammaL {2}..{3}")
    @CsvSource({
        "25, false, 7e-6, 1e-5", "25, true, 7e-6, 1e-5",
        "25, false, 0.01, 0.1", "25, true, 0.01, 0.1",
        "25, false, 1.0, 10.0", "25, true, 1.0, 10.0",
        "1, false, 7e-6, 1e-5", "1, true, 7e-6, 1e-5",
        "1, false, 0.01, 0.1", "1, true, 0.01, 0.1",
        "1, false, 1.0, 10.0", "1, true, 1.0, 10.0"})
    void analyticPathMatchesDirectSummation(double cutoff, boolean pedestal, double gammaLo, double gammaHi) {
        WingTreatment wings = WingTreatment.defaults().withCutoff(WingCutoff.fixed(cutoff))
                .withPedestalRemoval(pedestal);
        WavenumberGrid grid = WavenumberGrid.uniform(1000, 1006, STEP);
        // αD of a light molecule near 1000 cm⁻¹ between 200 and 2000 K
        LineChunk chunk = FastEngineAccuracyTest.lines(21, 150, 999, 1007, 0.0015, 0.005, gammaLo, gammaHi);
        double[] sigma = new double[grid.size()];
        double[] estimate = new double[1];
        Map<String, String> plan = run(grid, chunk, wings, 2, true, sigma, estimate);
        int analytic = Integer.parseInt(plan.get("fast.analytic_slices"));
        int slices = Integer.parseInt(plan.get("fast.slices"));
        int corrections = Integer.parseInt(plan.get("fast.correction_kernels"));
        int ffts = Integer.parseInt(plan.get("fast.ffts"));
        if (plan.containsKey("fast.family.lorentz-dominated.lines")) {
            // γL ≫ αD: a Lorentz-dominated family has a single Doppler node and keeps sampled kernels (a node
            // correction per slice would cost more FFTs than it saves)
            assertEquals("1", plan.get("fast.family.lorentz-dominated.doppler_nodes"), plan.toString());
            assertEquals("sampled", plan.get("fast.family.lorentz-dominated.kernel"), plan.toString());
        } else if (gammaHi < 0.1 * cutoff) {
            // the cutoff far beyond the widths: the wing model holds, every slice analytic; where the cutoff lies
            // within a few widths its remainder, amplified against the criterion's floor, sends them to sampling
            assertTrue(analytic > 0 && analytic == slices, plan.toString());
        }
        // analytic slices + one or two transforms per corrected Lorentz node + 2 per sampled slice + the inverse
        int sampledSlices = slices - analytic;
        assertTrue(ffts >= analytic + corrections + 2 * sampledSlices + 1
                && ffts <= analytic + 2 * corrections + 2 * sampledSlices + 1, plan.toString());
        assertTrue(analytic == 0 || ffts < 2 * slices + 1, plan.toString());

        double[] direct = FastEngineAccuracyTest.direct(grid, chunk, wings);
        boolean[] nearEdge = null; // every point, the cutoff edges included
        // the sampled-kernel path on the same plan: the analytic path must reproduce it far below the tolerance
        double[] sampled = new double[grid.size()];
        run(grid, chunk, wings, 2, false, sampled, new double[1]);
        double againstSampled = FastEngineAccuracyTest.maxRelativeError(sigma, sampled, nearEdge);
        assertTrue(againstSampled <= 1e-8, "analytic vs sampled kernels " + againstSampled);
        double observed = FastEngineAccuracyTest.maxRelativeError(sigma, direct, nearEdge);
        System.out.printf(java.util.Locale.ROOT, "R=%s pedestal=%s gammaL %s..%s: observed %.2e, estimate %.2e, "
                + "against the sampled path %.2e, FFTs %d for %d slices (%d analytic)%n", cutoff, pedestal, gammaLo,
                gammaHi, observed, estimate[0], againstSampled, ffts, slices, analytic);
        assertTrue(observed <= TOLERANCE, "observed " + observed + ", plan " + plan);
        assertTrue(observed <= estimate[0], "observed " + observed + " > estimate " + estimate[0]);
        assertTrue(estimate[0] <= TOLERANCE, "estimate " + estimate[0]);
    }

    @ParameterizedTest(name = "cutoff {0}")
    @CsvSource({"250", "0"})
    void voigtAndLorentzDominatedFamiliesTogether(double cutoff) {
        // γL from 0.02 to 2 cm⁻¹ against αD 0.002–0.004 cm⁻¹: part Voigt family, part Lorentz-dominated (one Doppler
        // node); against direct summation, a cutoff far beyond the widths (250 cm⁻¹) or none (0)
        WingTreatment wings = WingTreatment.defaults()
                .withCutoff(cutoff > 0 ? WingCutoff.fixed(cutoff) : WingCutoff.none());
        WavenumberGrid grid = WavenumberGrid.uniform(1000, 1006, STEP);
        LineChunk chunk = FastEngineAccuracyTest.lines(25, 120, 999, 1007, 0.002, 0.004, 0.02, 2.0);
        double[] sigma = new double[grid.size()];
        double[] estimate = new double[1];
        Map<String, String> plan = run(grid, chunk, wings, 2, true, sigma, estimate);
        assertEquals("1", plan.get("fast.family.lorentz-dominated.doppler_nodes"), plan.toString());
        assertTrue(Integer.parseInt(plan.get("fast.family.voigt.lines")) > 0, plan.toString());
        double[] direct = FastEngineAccuracyTest.direct(grid, chunk, wings);
        boolean[] nearEdge = null; // every point, the cutoff edges included
        double observed = FastEngineAccuracyTest.maxRelativeError(sigma, direct, nearEdge);
        System.out.printf(java.util.Locale.ROOT, "two families, cutoff %s: observed %.2e, estimate %.2e, slices %s%n",
                cutoff, observed, estimate[0], plan.get("fast.slices"));
        assertTrue(observed <= TOLERANCE, "observed " + observed + ", plan " + plan);
        assertTrue(observed <= estimate[0], "observed " + observed + " > estimate " + estimate[0]);
        assertTrue(estimate[0] <= TOLERANCE, "estimate " + estimate[0]);
    }

    @Test
    void analyticAndSampledKernelsAgreeFarBelowTheTolerance() {
        // the two paths differ only by the wing model's remainder and round-off: near 10⁻⁹ relative, not 10⁻³
        WingTreatment wings = WingTreatment.defaults().withCutoff(WingCutoff.fixed(3.0)).withPedestalRemoval(true);
        WavenumberGrid grid = WavenumberGrid.uniform(1000, 1006, STEP);
        LineChunk chunk = FastEngineAccuracyTest.lines(22, 150, 999, 1007, 0.0015, 0.005, 0.01, 0.1);
        double[] analytic = new double[grid.size()];
        double[] sampled = new double[grid.size()];
        double[] estimate = new double[1];
        run(grid, chunk, wings, 2, true, analytic, estimate);
        Map<String, String> plan = run(grid, chunk, wings, 2, false, sampled, estimate);
        assertEquals("0", plan.get("fast.analytic_slices"));
        double worst = FastEngineAccuracyTest.maxRelativeError(analytic, sampled, null);
        assertTrue(worst <= 1e-8, "analytic vs sampled " + worst);
    }

    @Test
    void bitwiseIdenticalForAnyThreadCountOnTheAnalyticPath() {
        // a cutoff far beyond the widths, where the analytic kernels' wing model is within the tolerance
        WingTreatment wings = WingTreatment.defaults().withCutoff(WingCutoff.fixed(5.0)).withPedestalRemoval(true);
        WavenumberGrid grid = WavenumberGrid.uniform(1000, 1005, STEP);
        LineChunk chunk = FastEngineAccuracyTest.lines(23, 200, 999, 1006, 0.002, 0.006, 0.001, 0.1);
        double[] estimate = new double[1];
        double[] one = new double[grid.size()];
        Map<String, String> plan = run(grid, chunk, wings, 1, true, one, estimate);
        assertTrue(Integer.parseInt(plan.get("fast.analytic_slices")) > 0, plan.toString());
        for (int threads : new int[] {2, 3}) {
            double[] other = new double[grid.size()];
            run(grid, chunk, wings, threads, true, other, estimate);
            assertArrayEquals(one, other, "threads " + threads);
        }
    }

    @Test
    void widthDependentCutoffsAndNoCutoffKeepTheSampledKernel() {
        WavenumberGrid grid = WavenumberGrid.uniform(1000, 1002, STEP);
        LineChunk chunk = FastEngineAccuracyTest.lines(24, 40, 1000, 1002, 0.002, 0.004, 0.01, 0.1);
        double[] estimate = new double[1];
        for (WingCutoff cutoff : new WingCutoff[] {WingCutoff.none(), WingCutoff.hwhmMultiple(100, 25)}) {
            Map<String, String> plan = run(grid, chunk, WingTreatment.defaults().withCutoff(cutoff), 1, true,
                    new double[grid.size()], estimate);
            assertEquals("0", plan.get("fast.analytic_slices"), cutoff.toString());
        }
    }
}
