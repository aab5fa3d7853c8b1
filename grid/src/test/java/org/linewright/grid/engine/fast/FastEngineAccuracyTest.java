package org.linewright.grid.engine.fast;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Random;
import org.junit.jupiter.api.Test;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.voigt.VoigtProfile;
import org.linewright.broadening.wings.ChiFactorKind;
import org.linewright.broadening.wings.WingCutoff;
import org.linewright.broadening.wings.WingKernel;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.engine.LineChunk;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.units.PhysicalConstants;

/**
 * The fast engine against a direct summation of the closed-form Voigt profile ({@link VoigtProfile}, itself
 * tested against SciPy's wofz in the broadening module) on synthetic line sets: the relative error must stay within
 * the tolerance wherever σ ≥ 10⁻⁶·max σ, and within the engine's own estimate.
 */
class FastEngineAccuracyTest {

    private static final double TOLERANCE = 1e-3;
    private static final WingTreatment NO_CUTOFF = WingTreatment.defaults().withCutoff(WingCutoff.none());

    /** Synthetic lines: centres, intensities and widths drawn from a seeded generator. */
    static LineChunk lines(long seed, int n, double fromCm1, double toCm1, double alphaLo, double alphaHi,
                           double gammaLo, double gammaHi) {
        Random random = new Random(seed);
        double[] centers = new double[n];
        for (int i = 0; i < n; i++) {
            centers[i] = fromCm1 + (toCm1 - fromCm1) * random.nextDouble();
        }
        java.util.Arrays.sort(centers);
        LineChunk chunk = new LineChunk(n);
        chunk.size = n;
        for (int i = 0; i < n; i++) {
            chunk.centerCm1[i] = centers[i];
            // intensities over three decades
            chunk.intensityCmPerMolecule[i] = 1e-20 * Math.pow(10, -3 * random.nextDouble());
            chunk.dopplerHwhmCm1[i] = alphaHi == 0 ? 0 : alphaLo * Math.pow(alphaHi / alphaLo, random.nextDouble());
            chunk.lorentzHwhmCm1[i] = gammaHi == 0 ? 0 : gammaLo * Math.pow(gammaHi / gammaLo, random.nextDouble());
        }
        return chunk;
    }

    /** σ by direct summation of every line at every point, with the wing treatment's kernel. */
    static double[] direct(WavenumberGrid grid, LineChunk chunk, WingTreatment wings) {
        WingKernel kernel = wings.atConditions(1.0, 296.0);
        double[] sigma = new double[grid.size()];
        for (int i = 0; i < chunk.size; i++) {
            kernel.addLine(LineShapeKind.VOIGT, grid.pointsCm1(), 0, grid.size(), chunk.centerCm1[i],
                    chunk.dopplerHwhmCm1[i], chunk.lorentzHwhmCm1[i], chunk.intensityCmPerMolecule[i], sigma);
        }
        return sigma;
    }

    static double[] fast(WavenumberGrid grid, LineChunk chunk, WingTreatment wings, int threads, double[] estimate) {
        try (FastEngine engine = FastEngine.transformOnly(threads, wings, TOLERANCE)) {
            double[] sigma = new double[grid.size()];
            engine.begin(grid, 1.0, 296.0);
            // fed in two chunks, as the calculator does
            int half = chunk.size / 2;
            engine.accumulate(part(chunk, 0, half), sigma);
            engine.accumulate(part(chunk, half, chunk.size), sigma);
            engine.finish(sigma);
            if (estimate != null) {
                estimate[0] = engine.estimatedRelativeError();
            }
            return sigma;
        }
    }

    static LineChunk part(LineChunk chunk, int from, int to) {
        LineChunk p = new LineChunk(Math.max(1, to - from));
        p.size = to - from;
        System.arraycopy(chunk.centerCm1, from, p.centerCm1, 0, p.size);
        System.arraycopy(chunk.intensityCmPerMolecule, from, p.intensityCmPerMolecule, 0, p.size);
        System.arraycopy(chunk.dopplerHwhmCm1, from, p.dopplerHwhmCm1, 0, p.size);
        System.arraycopy(chunk.lorentzHwhmCm1, from, p.lorentzHwhmCm1, 0, p.size);
        System.arraycopy(chunk.chiFactor, from, p.chiFactor, 0, p.size);
        return p;
    }

    /** Largest |fast − direct|/direct where direct ≥ 10⁻⁶·max direct, skipping {@code skip}-flagged points. */
    static double maxRelativeError(double[] fast, double[] direct, boolean[] skip) {
        double max = 0;
        for (double v : direct) {
            max = Math.max(max, v);
        }
        double worst = 0;
        for (int k = 0; k < direct.length; k++) {
            if (direct[k] >= 1e-6 * max && (skip == null || !skip[k])) {
                worst = Math.max(worst, Math.abs(fast[k] - direct[k]) / direct[k]);
            }
        }
        return worst;
    }

    private static void assertWithinTolerance(WavenumberGrid grid, LineChunk chunk, WingTreatment wings) {
        double[] estimate = new double[1];
        double[] f = fast(grid, chunk, wings, 2, estimate);
        double[] d = direct(grid, chunk, wings);
        double observed = maxRelativeError(f, d, null);
        assertTrue(observed <= TOLERANCE, "observed " + observed + " > tolerance " + TOLERANCE);
        assertTrue(observed <= estimate[0], "observed " + observed + " > estimate " + estimate[0]);
        assertTrue(estimate[0] <= TOLERANCE, "estimate " + estimate[0] + " > tolerance");
    }

    @Test
    void mixedVoigtWidthsWithoutCutoff() {
        // Doppler-dominated to pressure-broadened: γL/αD from 0.2 to 50
        WavenumberGrid grid = WavenumberGrid.uniform(1000, 1006, 0.002);
        LineChunk chunk = lines(1, 200, 999.5, 1006.5, 0.002, 0.006, 1.2e-3, 0.1);
        assertWithinTolerance(grid, chunk, NO_CUTOFF);
    }

    /**
     * A realistic width spread: 12C16O lines in its fundamental band, air widths drawn uniformly from 0 to 0.1
     * cm⁻¹/atm (a few exactly 0), Doppler HWHM of each line at a temperature drawn from 296–1000 K. αD = ν/c·
     * √(2 ln2·kT/m) (common practice); m(12C16O) = 27.9949 u (from memory, AME atomic masses 12C 12 u, 16O
     * 15.9949 u); constants CODATA 2018. The reference is direct summation of the closed-form Voigt profile.
     */
    static LineChunk coBandLines(long seed, int n, double fromCm1, double toCm1, double pressureAtm) {
        Random random = new Random(seed);
        LineChunk chunk = lines(seed, n, fromCm1, toCm1, 1, 1, 1, 1);
        double massKg = 27.9949 * PhysicalConstants.ATOMIC_MASS_CONSTANT_KG;
        for (int i = 0; i < n; i++) {
            double temperatureK = 296 + (1000 - 296) * random.nextDouble();
            chunk.dopplerHwhmCm1[i] = chunk.centerCm1[i] * Math.sqrt(2 * Math.log(2)
                    * PhysicalConstants.BOLTZMANN_J_PER_K * temperatureK / massKg)
                    / PhysicalConstants.SPEED_OF_LIGHT_M_PER_S;
            double airWidthCm1PerAtm = i % 25 == 0 ? 0.0 : 0.1 * random.nextDouble();
            chunk.lorentzHwhmCm1[i] = airWidthCm1PerAtm * pressureAtm;
        }
        return chunk;
    }

    @Test
    void realisticWidthSpreadAtOneAtmosphere() {
        // the grid step the end-to-end benchmark uses (0.0005 cm⁻¹), lines around 2100 cm⁻¹ (αD ≈ 0.0025–0.0045)
        WavenumberGrid grid = WavenumberGrid.uniform(2100, 2103, 0.0005);
        LineChunk chunk = coBandLines(21, 150, 2099.8, 2103.2, 1.0);
        assertWithinTolerance(grid, chunk, NO_CUTOFF);
    }

    @Test
    void realisticWidthSpreadAtOneHundredthOfAnAtmosphere() {
        // γL ≤ 0.001 cm⁻¹ against αD ≈ 0.0025–0.0045 cm⁻¹: Doppler-dominated lines, many far below the floor
        WavenumberGrid grid = WavenumberGrid.uniform(2100, 2103, 0.0005);
        LineChunk chunk = coBandLines(22, 150, 2099.9, 2103.1, 0.01);
        assertWithinTolerance(grid, chunk, NO_CUTOFF);
        assertFloorUsed(grid, chunk);
    }

    /** The Doppler-dominated family's floored Lorentz axis is in use (lines with 0 < γL ≪ αD exist here). */
    private static void assertFloorUsed(WavenumberGrid grid, LineChunk chunk) {
        try (FastEngine engine = FastEngine.transformOnly(1, NO_CUTOFF, TOLERANCE)) {
            double[] sigma = new double[grid.size()];
            engine.begin(grid, 1.0, 296.0);
            engine.accumulate(chunk, sigma);
            engine.finish(sigma);
            java.util.Map<String, String> plan = engine.describe();
            assertTrue(Double.parseDouble(plan.get("fast.family.doppler.lorentz_floor_cm1")) > 0, plan.toString());
        }
    }

    @Test
    void pureDopplerLines() {
        // γL = 0: Gaussian lines at low pressure, narrow and deep-winged
        WavenumberGrid grid = WavenumberGrid.uniform(2000, 2004, 0.001);
        LineChunk chunk = lines(2, 80, 2000, 2004, 0.003, 0.006, 0, 0);
        assertWithinTolerance(grid, chunk, NO_CUTOFF);
    }

    @Test
    void allThreeFamiliesTogether() {
        WavenumberGrid grid = WavenumberGrid.uniform(500, 505, 0.002);
        LineChunk voigt = lines(3, 60, 500, 505, 0.002, 0.004, 0.01, 0.05);
        LineChunk doppler = lines(4, 30, 500, 505, 0.003, 0.005, 0, 0);
        LineChunk lorentz = lines(5, 30, 500, 505, 0, 0, 0.02, 0.08);
        LineChunk all = merge(voigt, doppler, lorentz);
        assertWithinTolerance(grid, all, NO_CUTOFF);
    }

    @Test
    void resolvingPowerGrid() {
        // ν/Δν = 200 000 over 3000–3010 cm⁻¹ (spacing ≈ 0.015 cm⁻¹), lines a few spacings wide
        WavenumberGrid grid = WavenumberGrid.resolvingPower(3000, 3010, 200_000);
        LineChunk chunk = lines(6, 150, 2999, 3011, 0.01, 0.02, 0.005, 0.2);
        assertWithinTolerance(grid, chunk, NO_CUTOFF);
    }

    @Test
    void fixedCutoffWithPedestalRemoval() {
        // removing the pedestal makes each truncated line continuous at its cutoff: no blurred edge
        WingTreatment wings = WingTreatment.defaults().withCutoff(WingCutoff.fixed(1.0)).withPedestalRemoval(true);
        WavenumberGrid grid = WavenumberGrid.uniform(1000, 1008, 0.002);
        LineChunk chunk = lines(7, 200, 999, 1009, 0.002, 0.004, 0.01, 0.1);
        double[] estimate = new double[1];
        double[] f = fast(grid, chunk, wings, 2, estimate);
        double[] d = direct(grid, chunk, wings);
        // every point, where the pedestal-removed lines go to zero at the cutoff included
        double observed = maxRelativeError(f, d, null);
        assertTrue(observed <= TOLERANCE, "observed " + observed);
        assertTrue(observed <= estimate[0], "observed " + observed + " > estimate " + estimate[0]);
    }

    @Test
    void fixedCutoffAtEveryPointTheEdgesIncluded() {
        WingTreatment wings = WingTreatment.defaults().withCutoff(WingCutoff.fixed(2.0));
        WavenumberGrid grid = WavenumberGrid.uniform(1000, 1008, 0.002);
        LineChunk chunk = lines(8, 200, 998, 1010, 0.002, 0.004, 0.01, 0.1);
        double[] estimate = new double[1];
        double[] f = fast(grid, chunk, wings, 2, estimate);
        double[] d = direct(grid, chunk, wings);
        // the pedestal kept: each line jumps at its cutoff, and the edge is exact in position
        double observed = maxRelativeError(f, d, null);
        assertTrue(observed <= TOLERANCE, "observed " + observed);
        assertTrue(observed <= estimate[0], "observed " + observed + " > estimate " + estimate[0]);
    }

    @Test
    void integratedCrossSectionKeepsTheLineIntensities() {
        assertAreaKept(WingTreatment.defaults().withCutoff(WingCutoff.fixed(3.0)));
    }

    @Test
    void integratedCrossSectionWithAWidthDependentCutoff() {
        // the cutoff is 100 Voigt HWHM: each slice cuts at its node widths' distance, not the line's; the area
        // removed (≈ 2/(100π) for Lorentz-like lines, whatever the width) barely depends on which
        assertAreaKept(WingTreatment.defaults().withCutoff(WingCutoff.hwhmMultiple(100, Double.POSITIVE_INFINITY)));
    }

    /**
     * ∫σ dν = Σ S·(1 − lost fraction) (common practice: area normalisation of the profile; WingLoss for the part a
     * cutoff removes); lines well inside the grid so no area leaves through its ends.
     */
    private static void assertAreaKept(WingTreatment wings) {
        WavenumberGrid grid = WavenumberGrid.uniform(990, 1020, 0.002);
        LineChunk chunk = lines(9, 100, 1000, 1010, 0.002, 0.004, 0.01, 0.1);
        double[] f = fast(grid, chunk, wings, 2, null);
        double area = 0;
        for (int k = 0; k < f.length; k++) {
            // trapezoid rule; the ends carry no line area
            area += f[k] * 0.002;
        }
        WingKernel kernel = wings.atConditions(1.0, 296.0);
        double expected = 0;
        for (int i = 0; i < chunk.size; i++) {
            double lost = kernel.lostFraction(LineShapeKind.VOIGT, chunk.dopplerHwhmCm1[i], chunk.lorentzHwhmCm1[i]);
            expected += chunk.intensityCmPerMolecule[i] * (1 - lost);
        }
        assertEquals(expected, area, 1e-4 * expected);
    }

    @Test
    void bitwiseIdenticalForAnyThreadCount() {
        WavenumberGrid grid = WavenumberGrid.uniform(1000, 1005, 0.002);
        LineChunk chunk = lines(10, 200, 999, 1006, 0.002, 0.006, 0.01, 0.1);
        WingTreatment wings = WingTreatment.defaults().withCutoff(WingCutoff.fixed(1.0));
        double[] one = fast(grid, chunk, wings, 1, null);
        double[] two = fast(grid, chunk, wings, 2, null);
        double[] three = fast(grid, chunk, wings, 3, null);
        assertArrayEquals(one, two);
        assertArrayEquals(one, three);
    }

    @Test
    void chiFactorOnFlaggedLinesOnly() {
        // CO2-broadened-by-CO2 lines carry the Perrin–Hartmann χ factor, the others not: the reference sums the
        // flagged lines with the χ kernel and the rest without, as the exact engine does
        WingTreatment wings = WingTreatment.defaults().withCutoff(WingCutoff.fixed(40.0)).withPedestalRemoval(true)
                .withChiFactor(ChiFactorKind.PERRIN_HARTMANN_CO2);
        WavenumberGrid grid = WavenumberGrid.uniform(2300, 2340, 0.01);
        LineChunk chunk = lines(13, 80, 2300, 2340, 0.002, 0.003, 0.05, 0.1);
        for (int i = 0; i < chunk.size; i++) {
            chunk.chiFactor[i] = i % 3 != 0;
        }
        double[] estimate = new double[1];
        double[] f = fast(grid, chunk, wings, 2, estimate);
        WingKernel withChi = wings.atConditions(1.0, 296.0);
        WingKernel without = wings.withChiFactor(ChiFactorKind.NONE).atConditions(1.0, 296.0);
        double[] d = new double[grid.size()];
        for (int i = 0; i < chunk.size; i++) {
            (chunk.chiFactor[i] ? withChi : without).addLine(LineShapeKind.VOIGT, grid.pointsCm1(), 0, grid.size(),
                    chunk.centerCm1[i], chunk.dopplerHwhmCm1[i], chunk.lorentzHwhmCm1[i],
                    chunk.intensityCmPerMolecule[i], d);
        }
        double observed = maxRelativeError(f, d, null);
        assertTrue(observed <= TOLERANCE, "observed " + observed);
        assertTrue(observed <= estimate[0], "observed " + observed + " > estimate " + estimate[0]);
        // and χ did act: far from the lines it lowers σ against the plain treatment
        double[] plain = fast(grid, chunk, wings.withChiFactor(ChiFactorKind.NONE), 1, null);
        assertTrue(maxRelativeError(f, plain, null) > 0.01);
    }

    static LineChunk merge(LineChunk... parts) {
        int n = 0;
        for (LineChunk p : parts) {
            n += p.size;
        }
        double[][] rows = new double[n][];
        int r = 0;
        for (LineChunk p : parts) {
            for (int i = 0; i < p.size; i++) {
                rows[r++] = new double[] {p.centerCm1[i], p.intensityCmPerMolecule[i], p.dopplerHwhmCm1[i],
                        p.lorentzHwhmCm1[i]};
            }
        }
        java.util.Arrays.sort(rows, (a, b) -> Double.compare(a[0], b[0]));
        LineChunk all = new LineChunk(n);
        all.size = n;
        for (int i = 0; i < n; i++) {
            all.centerCm1[i] = rows[i][0];
            all.intensityCmPerMolecule[i] = rows[i][1];
            all.dopplerHwhmCm1[i] = rows[i][2];
            all.lorentzHwhmCm1[i] = rows[i][3];
        }
        return all;
    }
}
