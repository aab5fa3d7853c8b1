package org.linewright.grid.engine.fast;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Map;
import org.junit.jupiter.api.Test;
import org.linewright.broadening.wings.WingCutoff;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.engine.LineChunk;
import org.linewright.grid.wavenumber.WavenumberGrid;

/**
 * The fast engine with its internal grid cut into segments, each convolved in its own FFT ring. The references are
 * (1) the same engine with one ring for the whole grid — a convolution is linear and local within the kernel
 * reach, so cutting the grid must change σ by round-off only (common practice: overlap-save block convolution) —
 * and (2) a direct summation of the closed-form Voigt profile ({@link org.linewright.broadening.voigt.VoigtProfile},
 * tested against SciPy's wofz in the broadening module), within the tolerance and the engine's estimate.
 */
class FastEngineSegmentTest {

    private static final double TOLERANCE = 1e-3;
    /** Segmented against one ring: round-off only, relative to the largest σ. */
    private static final double ROUND_OFF = 1e-12;

    /** σ and the plan of one run; {@code ringLength} 0 lets the engine choose. */
    private static double[] run(WavenumberGrid grid, LineChunk chunk, WingTreatment wings, int threads,
                                int ringLength, Map<String, String>[] plan, double[] estimate) {
        return run(grid, chunk, wings, threads, ringLength, true, plan, estimate);
    }

    private static double[] run(WavenumberGrid grid, LineChunk chunk, WingTreatment wings, int threads,
                                int ringLength, boolean analytic, Map<String, String>[] plan, double[] estimate) {
        try (FastEngine engine = FastEngine.transformOnly(threads, wings, TOLERANCE, analytic)) {
            engine.forceRingLength(ringLength);
            double[] sigma = new double[grid.size()];
            engine.begin(grid, 1.0, 296.0);
            int half = chunk.size / 2;
            engine.accumulate(FastEngineAccuracyTest.part(chunk, 0, half), sigma);
            engine.accumulate(FastEngineAccuracyTest.part(chunk, half, chunk.size), sigma);
            engine.finish(sigma);
            if (plan != null) {
                plan[0] = engine.describe();
            }
            if (estimate != null) {
                estimate[0] = engine.estimatedRelativeError();
            }
            return sigma;
        }
    }

    private static double maxAbsDifference(double[] a, double[] b) {
        double worst = 0;
        for (int k = 0; k < a.length; k++) {
            worst = Math.max(worst, Math.abs(a[k] - b[k]));
        }
        return worst;
    }

    private static double max(double[] a) {
        double m = 0;
        for (double v : a) {
            m = Math.max(m, v);
        }
        return m;
    }

    /**
     * The wavenumbers of the segment boundaries (first internal point of segments 1 … S−1) of a uniform grid, from
     * the plan: segment s owns internal points from ⌊s·N/S⌋.
     */
    private static double[] boundariesCm1(WavenumberGrid grid, Map<String, String> plan) {
        long points = Long.parseLong(plan.get("fast.internal_points"));
        int segments = Integer.parseInt(plan.get("fast.segments"));
        double h = Double.parseDouble(plan.get("fast.internal_step_cm1"));
        double[] b = new double[segments - 1];
        for (int s = 1; s < segments; s++) {
            b[s - 1] = grid.firstCm1() + (s * points / segments) * h;
        }
        return b;
    }

    /** The random lines plus lines on each boundary, half a step off it, and midway between two boundaries. */
    private static LineChunk withBoundaryLines(LineChunk random, double[] boundaries, double h) {
        int extra = 3 * boundaries.length + Math.max(0, boundaries.length - 1);
        LineChunk add = new LineChunk(extra);
        add.size = extra;
        int r = 0;
        for (int i = 0; i < boundaries.length; i++) {
            for (double at : new double[] {boundaries[i], boundaries[i] - 0.5 * h, boundaries[i] + 1e-7}) {
                add.centerCm1[r] = at;
                r++;
            }
            if (i + 1 < boundaries.length) {
                // within the reach of both boundaries when a segment is narrower than twice the reach
                add.centerCm1[r] = 0.5 * (boundaries[i] + boundaries[i + 1]);
                r++;
            }
        }
        for (int i = 0; i < extra; i++) {
            // widths and strengths inside the random lines' ranges, so the plan (steps, axes) is unchanged
            add.intensityCmPerMolecule[i] = 3e-21;
            add.dopplerHwhmCm1[i] = 0.003;
            add.lorentzHwhmCm1[i] = 0.03;
        }
        return FastEngineAccuracyTest.merge(random, add);
    }

    @Test
    @SuppressWarnings("unchecked")
    void segmentsEqualOneRingIncludingLinesOnBoundaries() {
        WingTreatment wings = WingTreatment.defaults().withCutoff(WingCutoff.fixed(1.0));
        WavenumberGrid grid = WavenumberGrid.uniform(1000, 1010, 0.002);
        LineChunk random = FastEngineAccuracyTest.lines(31, 300, 998.5, 1011.5, 0.002, 0.004, 0.01, 0.1);
        Map<String, String>[] plan = new Map[1];
        run(grid, random, wings, 2, 2048, plan, null);
        double[] boundaries = boundariesCm1(grid, plan[0]);
        assertTrue(boundaries.length >= 3, plan[0].toString());
        double h = Double.parseDouble(plan[0].get("fast.internal_step_cm1"));
        LineChunk chunk = withBoundaryLines(random, boundaries, h);

        Map<String, String>[] segPlan = new Map[1];
        Map<String, String>[] onePlan = new Map[1];
        double[] estimate = new double[1];
        double[] segmented = run(grid, chunk, wings, 2, 2048, segPlan, estimate);
        double[] oneRing = run(grid, chunk, wings, 2, 0, onePlan, null);
        assertEquals(plan[0].get("fast.segments"), segPlan[0].get("fast.segments"), segPlan[0].toString());
        assertEquals("2048", segPlan[0].get("fast.segment_fft_length"));
        assertEquals("1", onePlan[0].get("fast.segments"), onePlan[0].toString());
        double scale = max(oneRing);
        assertTrue(maxAbsDifference(segmented, oneRing) <= ROUND_OFF * scale,
                "segmented vs one ring: " + maxAbsDifference(segmented, oneRing) / scale);
        // the points either side of each boundary explicitly, where a mistake in the layout would show
        double[] p = grid.pointsCm1();
        for (double b : boundaries) {
            int k = (int) Math.round((b - p[0]) / grid.stepCm1());
            for (int j = Math.max(0, k - 3); j <= Math.min(p.length - 1, k + 3); j++) {
                assertEquals(oneRing[j], segmented[j], ROUND_OFF * scale, "point " + j + " next to boundary " + b);
            }
        }

        // and against direct summation, away from the blurred cutoff edges (a documented difference)
        double[] direct = FastEngineAccuracyTest.direct(grid, chunk, wings);
        boolean[] nearEdge = null; // every point, the cutoff edges included
        double observed = FastEngineAccuracyTest.maxRelativeError(segmented, direct, nearEdge);
        System.out.printf("boundaries: %s segments of %s points (ring %s), vs one ring %.2e of max sigma, "
                        + "vs direct %.2e (estimate %.2e)%n", segPlan[0].get("fast.segments"),
                segPlan[0].get("fast.segment_points"), segPlan[0].get("fast.segment_fft_length"),
                maxAbsDifference(segmented, oneRing) / scale, observed, estimate[0]);
        assertTrue(observed <= TOLERANCE, "observed " + observed);
        assertTrue(observed <= estimate[0], "observed " + observed + " > estimate " + estimate[0]);
    }

    @Test
    void segmentedPedestalRemovedAgainstDirectSummation() {
        // pedestal removed: each truncated line is continuous at its cutoff, so every point is judged
        WingTreatment wings = WingTreatment.defaults().withCutoff(WingCutoff.fixed(0.5)).withPedestalRemoval(true);
        WavenumberGrid grid = WavenumberGrid.uniform(1000, 1008, 0.002);
        LineChunk chunk = FastEngineAccuracyTest.lines(32, 250, 999, 1009, 0.002, 0.004, 0.01, 0.1);
        double[] estimate = new double[1];
        @SuppressWarnings("unchecked")
        Map<String, String>[] plan = new Map[1];
        double[] f = run(grid, chunk, wings, 2, 1024, plan, estimate);
        assertTrue(Integer.parseInt(plan[0].get("fast.segments")) >= 4, plan[0].toString());
        double[] d = FastEngineAccuracyTest.direct(grid, chunk, wings);
        double h = Double.parseDouble(plan[0].get("fast.internal_step_cm1"));
        boolean[] nearEdge = null; // every point, the cutoff edges included
        double observed = FastEngineAccuracyTest.maxRelativeError(f, d, nearEdge);
        System.out.printf("pedestal removed: %s segments of %s points, vs direct %.2e (estimate %.2e)%n",
                plan[0].get("fast.segments"), plan[0].get("fast.segment_points"), observed, estimate[0]);
        assertTrue(observed <= TOLERANCE, "observed " + observed);
        assertTrue(observed <= estimate[0], "observed " + observed + " > estimate " + estimate[0]);
    }

    @Test
    void segmentedBitwiseIdenticalForAnyThreadCount() {
        WingTreatment wings = WingTreatment.defaults().withCutoff(WingCutoff.fixed(1.0));
        WavenumberGrid grid = WavenumberGrid.uniform(1000, 1006, 0.002);
        LineChunk chunk = FastEngineAccuracyTest.lines(33, 250, 999, 1007, 0.002, 0.006, 0.01, 0.1);
        double[] one = run(grid, chunk, wings, 1, 2048, null, null);
        double[] two = run(grid, chunk, wings, 2, 2048, null, null);
        double[] three = run(grid, chunk, wings, 3, 2048, null, null);
        assertArrayEquals(one, two);
        assertArrayEquals(one, three);
    }

    @Test
    @SuppressWarnings("unchecked")
    void resolvingPowerGridSegmented() {
        // ν/Δν = 200 000 over 3000–3010 cm⁻¹ (spacing ≈ 0.015 cm⁻¹), 1 cm⁻¹ cutoff
        WingTreatment wings = WingTreatment.defaults().withCutoff(WingCutoff.fixed(1.0));
        WavenumberGrid grid = WavenumberGrid.resolvingPower(3000, 3010, 200_000);
        LineChunk chunk = FastEngineAccuracyTest.lines(34, 200, 2999, 3011, 0.01, 0.02, 0.005, 0.2);
        Map<String, String>[] segPlan = new Map[1];
        Map<String, String>[] onePlan = new Map[1];
        double[] estimate = new double[1];
        run(grid, chunk, wings, 1, 0, false, onePlan, null);
        // half the one-ring length: still room beyond twice the reach, and several segments
        int ring = Integer.parseInt(onePlan[0].get("fast.segment_fft_length")) / 2;
        // sampled kernels: the convolution is then the same whatever the ring, up to round-off
        double[] segmented = run(grid, chunk, wings, 2, ring, false, segPlan, estimate);
        double[] oneRing = run(grid, chunk, wings, 2, 0, false, onePlan, null);

        assertEquals("1", onePlan[0].get("fast.segments"), onePlan[0].toString());
        assertTrue(Integer.parseInt(segPlan[0].get("fast.segments")) >= 2, segPlan[0].toString());
        double scale = max(oneRing);
        assertTrue(maxAbsDifference(segmented, oneRing) <= ROUND_OFF * scale,
                "segmented vs one ring: " + maxAbsDifference(segmented, oneRing) / scale);
        double[] direct = FastEngineAccuracyTest.direct(grid, chunk, wings);
        double h = Double.parseDouble(segPlan[0].get("fast.internal_step_cm1"));
        boolean[] nearEdge = null; // every point, the cutoff edges included
        double observed = FastEngineAccuracyTest.maxRelativeError(segmented, direct, nearEdge);
        assertTrue(observed <= TOLERANCE, "observed " + observed);
        assertTrue(observed <= estimate[0], "observed " + observed + " > estimate " + estimate[0]);

        // analytic kernels (here R/αD = 50–100): the closed-form transform is that of the profile periodised around
        // the ring and the wing model leaves a remainder O(αD⁴/R⁴) beyond R, so a different ring length moves σ by
        // that remainder, not only by round-off; bounded like the analytic path against the sampled one (10⁻⁸ of
        // max σ, FastEngineAnalyticKernelTest)
        double[] segmentedAnalytic = run(grid, chunk, wings, 2, ring, true, null, null);
        double[] oneRingAnalytic = run(grid, chunk, wings, 2, 0, true, null, null);
        assertTrue(maxAbsDifference(segmentedAnalytic, oneRingAnalytic) <= 1e-8 * scale,
                "analytic, segmented vs one ring: " + maxAbsDifference(segmentedAnalytic, oneRingAnalytic) / scale);
        assertTrue(maxAbsDifference(segmentedAnalytic, oneRing) <= 1e-8 * scale,
                "analytic segmented vs sampled one ring: " + maxAbsDifference(segmentedAnalytic, oneRing) / scale);
        double observedAnalytic = FastEngineAccuracyTest.maxRelativeError(segmentedAnalytic, direct, nearEdge);
        System.out.printf("resolving power: %s segments, sampled vs one ring %.2e, analytic vs one ring %.2e of max "
                        + "sigma; vs direct %.2e / %.2e (estimate %.2e)%n", segPlan[0].get("fast.segments"),
                maxAbsDifference(segmented, oneRing) / scale,
                maxAbsDifference(segmentedAnalytic, oneRingAnalytic) / scale, observed, observedAnalytic,
                estimate[0]);
        assertTrue(observedAnalytic <= TOLERANCE, "observed " + observedAnalytic);
    }

    @Test
    @SuppressWarnings("unchecked")
    void analyticKernelsSharedAcrossSegments() {
        // a 25 cm⁻¹ cutoff with αD ≪ R: analytic kernels, whose node corrections are transformed once for all
        // segments of equal ring length
        WingTreatment wings = WingTreatment.defaults().withCutoff(WingCutoff.fixed(25.0));
        WavenumberGrid grid = WavenumberGrid.uniform(1000, 1120, 0.004);
        LineChunk chunk = FastEngineAccuracyTest.lines(35, 150, 990, 1130, 0.0015, 0.005, 0.01, 0.1);
        Map<String, String>[] segPlan = new Map[1];
        Map<String, String>[] onePlan = new Map[1];
        double[] estimate = new double[1];
        double[] segmented = run(grid, chunk, wings, 2, 32768, segPlan, estimate);
        double[] oneRing = run(grid, chunk, wings, 2, 0, onePlan, null);
        int segments = Integer.parseInt(segPlan[0].get("fast.segments"));
        assertTrue(segments >= 2, segPlan[0].toString());
        assertEquals("1", onePlan[0].get("fast.segments"), onePlan[0].toString());
        assertTrue(Integer.parseInt(segPlan[0].get("fast.analytic_slices")) > 0, segPlan[0].toString());
        assertEquals("true", segPlan[0].get("fast.correction_kernels_shared"), segPlan[0].toString());
        // each node's correction transformed once, not once per segment
        assertEquals(onePlan[0].get("fast.correction_kernels"), segPlan[0].get("fast.correction_kernels"),
                segPlan[0] + " / " + onePlan[0]);
        double scale = max(oneRing);
        assertTrue(maxAbsDifference(segmented, oneRing) <= ROUND_OFF * scale,
                "segmented vs one ring: " + maxAbsDifference(segmented, oneRing) / scale);
        double[] direct = FastEngineAccuracyTest.direct(grid, chunk, wings);
        boolean[] nearEdge = null; // every point, the cutoff edges included
        double observed = FastEngineAccuracyTest.maxRelativeError(segmented, direct, nearEdge);
        System.out.printf("analytic, shared corrections: %d segments, %s correction transforms, vs one ring %.2e of "
                        + "max sigma, vs direct %.2e (estimate %.2e)%n", segments,
                segPlan[0].get("fast.correction_kernels"), maxAbsDifference(segmented, oneRing) / scale, observed,
                estimate[0]);
        assertTrue(observed <= TOLERANCE, "observed " + observed);
        assertTrue(observed <= estimate[0], "observed " + observed + " > estimate " + estimate[0]);
    }
}
