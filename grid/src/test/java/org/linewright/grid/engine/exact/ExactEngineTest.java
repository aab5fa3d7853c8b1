package org.linewright.grid.engine.exact;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;
import org.linewright.broadening.wings.ChiFactorKind;
import org.linewright.broadening.wings.WingCutoff;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.engine.LineChunk;
import org.linewright.grid.wavenumber.WavenumberGrid;

class ExactEngineTest {

    private static final double SQRT_LN2_OVER_PI = Math.sqrt(Math.log(2) / Math.PI);

    private static double[] run(int threads, WingTreatment wings, WavenumberGrid grid, LineChunk chunk) {
        double[] sigma = new double[grid.size()];
        try (ExactEngine engine = new ExactEngine(threads, wings)) {
            engine.begin(grid, 1.0, 296.0);
            engine.accumulate(chunk, sigma);
            engine.finish(sigma);
        }
        return sigma;
    }

    private static LineChunk oneLine(double centre, double s, double alphaD, double gammaL) {
        LineChunk c = new LineChunk(4);
        c.size = 1;
        c.centerCm1[0] = centre;
        c.intensityCmPerMolecule[0] = s;
        c.dopplerHwhmCm1[0] = alphaD;
        c.lorentzHwhmCm1[0] = gammaL;
        return c;
    }

    private static int nearest(WavenumberGrid grid, double nu) {
        double[] p = grid.pointsCm1();
        int best = 0;
        for (int i = 1; i < p.length; i++) {
            if (Math.abs(p[i] - nu) < Math.abs(p[best] - nu)) {
                best = i;
            }
        }
        return best;
    }

    /** Trapezoid integral of σ over the grid. */
    private static double integral(WavenumberGrid grid, double[] sigma) {
        double[] p = grid.pointsCm1();
        double sum = 0;
        for (int i = 1; i < p.length; i++) {
            sum += 0.5 * (sigma[i] + sigma[i - 1]) * (p[i] - p[i - 1]);
        }
        return sum;
    }

    @Test
    void isolatedLorentzLinePeakAndAreaWithinCutoff() {
        double s = 3.0e-20;
        double gamma = 0.08;
        double cutoff = 5.0;
        WavenumberGrid grid = WavenumberGrid.uniform(990.0, 1010.0, 0.001);
        double[] sigma = run(1, WingTreatment.defaults().withCutoff(WingCutoff.fixed(cutoff)), grid,
                oneLine(1000.0, s, 0.0, gamma));
        // Lorentz peak 1/(πγ): analytic (common practice)
        assertEquals(s / (Math.PI * gamma), sigma[nearest(grid, 1000.0)], 1e-12 * s / (Math.PI * gamma));
        // area inside ±d: 1 − (2/π)·atan(γ/d), exact for the Lorentzian (common practice); trapezoid error on a
        // 0.001 cm-1 step is below 1e-7 of the area here
        double expected = s * (1 - 2 / Math.PI * Math.atan(gamma / cutoff));
        assertEquals(expected, integral(grid, sigma), 2e-6 * expected);
        // nothing beyond the cutoff
        assertEquals(0.0, sigma[nearest(grid, 994.9)]);
        assertEquals(0.0, sigma[nearest(grid, 1005.1)]);
        assertTrue(sigma[nearest(grid, 995.1)] > 0);
    }

    @Test
    void isolatedDopplerLinePeakAndArea() {
        double s = 1.0e-21;
        double alpha = 0.004;
        WavenumberGrid grid = WavenumberGrid.uniform(995.0, 1005.0, 0.0002);
        double[] sigma = run(1, WingTreatment.defaults(), grid, oneLine(1000.0, s, alpha, 0.0));
        // Gaussian peak √(ln2/π)/αD: analytic (common practice)
        double peak = s * SQRT_LN2_OVER_PI / alpha;
        assertEquals(peak, sigma[nearest(grid, 1000.0)], 1e-12 * peak);
        // the whole Gaussian lies inside a 25 cm-1 cutoff: area S (erfc(√ln2·25/0.004) is 0 in double)
        assertEquals(s, integral(grid, sigma), 1e-9 * s);
    }

    @Test
    void voigtPeaksMatchScipy() {
        // V(0) from scipy.special.voigt_profile(0, αD/sqrt(2 ln2), γL), scipy 1.17.1 / numpy 2.4.6, generated once:
        // python3 -c "import numpy as np; from scipy.special import voigt_profile as v;
        //   print([v(0.0, a/np.sqrt(2*np.log(2)), g) for a, g in [(0.003,0.07),(0.01,0.01),(0.05,0.002)]])"
        double[][] cases = {
            {0.003, 0.07, 4.541283072481284},
            {0.01, 0.01, 22.455546962575994},
            {0.05, 0.002, 9.05151917767483},
        };
        WavenumberGrid grid = WavenumberGrid.uniform(999.0, 1001.0, 0.0005);
        for (double[] c : cases) {
            double[] sigma = run(1, WingTreatment.defaults(), grid, oneLine(1000.0, 2.0, c[0], c[1]));
            assertEquals(2.0 * c[2], sigma[nearest(grid, 1000.0)], 1e-12 * 2.0 * c[2], Arrays.toString(c));
        }
    }

    @Test
    void severalVoigtLinesMatchScipySums() {
        // σ(ν) = Σ S·voigt_profile(ν − ν0, αD/sqrt(2 ln2), γL) summed in numpy from scipy.special.voigt_profile
        // (scipy 1.17.1, numpy 2.4.6), generated once for these five lines and eight wavenumbers; the last line
        // is a pure Gaussian (γL = 0).
        double[][] lines = {
            {1000.00, 2.0e-20, 0.0030, 0.070},
            {1000.37, 5.0e-21, 0.0031, 0.055},
            {1001.10, 1.2e-19, 0.0029, 0.081},
            {999.52, 7.5e-22, 0.0030, 0.012},
            {1000.81, 3.3e-20, 0.0030, 0.0},
        };
        double[][] expected = {
            {999.3, 1.988786850974096e-21},
            {999.9, 3.2479910599212737e-20},
            {1000.0, 9.400701514093772e-20},
            {1000.2, 1.6467479004385855e-20},
            {1000.5, 1.4589225676515404e-20},
            {1000.81, 5.202159206498142e-18},
            {1001.1, 4.716666767126334e-19},
            {1001.6, 1.2292379001759222e-20},
        };
        // lines sorted by centre, as the calculator delivers them
        double[][] sorted = lines.clone();
        Arrays.sort(sorted, (a, b) -> Double.compare(a[0], b[0]));
        LineChunk chunk = new LineChunk(8);
        for (double[] l : sorted) {
            int i = chunk.size++;
            chunk.centerCm1[i] = l[0];
            chunk.intensityCmPerMolecule[i] = l[1];
            chunk.dopplerHwhmCm1[i] = l[2];
            chunk.lorentzHwhmCm1[i] = l[3];
        }
        WavenumberGrid grid = WavenumberGrid.uniform(990.0, 1010.0, 0.01);
        double[] sigma = run(2, WingTreatment.defaults(), grid, chunk);
        for (double[] e : expected) {
            int j = nearest(grid, e[0]);
            assertEquals(e[0], grid.pointsCm1()[j], 1e-9);
            // profile accuracy 1e-9 relative in the far-wing closed forms (VoigtProfile), plus grid-point rounding
            assertEquals(e[1], sigma[j], 2e-9 * e[1], "at " + e[0]);
        }
    }

    @Test
    void matchesBruteForceCompensatedLorentzSum() {
        // independent reference: Neumaier-compensated sum of the closed-form Lorentzian S·γ/(π(Δ² + γ²)) over the
        // lines within the cutoff (common practice), computed here point by point
        SplittableRandom rnd = new SplittableRandom(20261202L);
        int n = 400;
        double cutoff = 2.5;
        double[][] lines = new double[n][];
        for (int i = 0; i < n; i++) {
            lines[i] = new double[] {2000 + 20 * rnd.nextDouble(), Math.pow(10, -18 - 6 * rnd.nextDouble()),
                0.01 + 0.1 * rnd.nextDouble()};
        }
        Arrays.sort(lines, (a, b) -> Double.compare(a[0], b[0]));
        LineChunk chunk = new LineChunk(n);
        for (double[] l : lines) {
            int i = chunk.size++;
            chunk.centerCm1[i] = l[0];
            chunk.intensityCmPerMolecule[i] = l[1];
            chunk.lorentzHwhmCm1[i] = l[2];
        }
        WavenumberGrid grid = WavenumberGrid.uniform(1995.0, 2025.0, 0.003);
        double[] sigma = run(3, WingTreatment.defaults().withCutoff(WingCutoff.fixed(cutoff)), grid, chunk);
        double[] p = grid.pointsCm1();
        double worst = 0;
        for (int j = 0; j < p.length; j++) {
            double sum = 0;
            double comp = 0;
            for (double[] l : lines) {
                double d = p[j] - l[0];
                if (Math.abs(d) > cutoff) {
                    continue;
                }
                double v = l[1] * l[2] / (Math.PI * (d * d + l[2] * l[2]));
                double t = sum + v;
                comp += Math.abs(sum) >= Math.abs(v) ? (sum - t) + v : (v - t) + sum;
                sum = t;
            }
            double ref = sum + comp;
            if (ref == 0) {
                assertEquals(0.0, sigma[j], "at " + p[j]);
            } else {
                worst = Math.max(worst, Math.abs(sigma[j] / ref - 1));
            }
        }
        assertTrue(worst < 1e-12, "largest relative difference " + worst);
    }

    @Test
    void bitwiseIdenticalForAnyThreadCount() {
        SplittableRandom rnd = new SplittableRandom(7L);
        int n = 3000;
        double[][] lines = new double[n][];
        for (int i = 0; i < n; i++) {
            lines[i] = new double[] {500 + 100 * rnd.nextDouble(), Math.pow(10, -19 - 8 * rnd.nextDouble()),
                0.0005 + 0.002 * rnd.nextDouble(), 0.2 * rnd.nextDouble(), rnd.nextInt(4) == 0 ? 1 : 0};
        }
        Arrays.sort(lines, (a, b) -> Double.compare(a[0], b[0]));
        LineChunk chunk = new LineChunk(n);
        for (double[] l : lines) {
            int i = chunk.size++;
            chunk.centerCm1[i] = l[0];
            chunk.intensityCmPerMolecule[i] = l[1];
            chunk.dopplerHwhmCm1[i] = l[2];
            chunk.lorentzHwhmCm1[i] = l[3];
            chunk.chiFactor[i] = l[4] == 1;
        }
        WavenumberGrid grid = WavenumberGrid.uniform(480.0, 620.0, 0.002);
        WingTreatment wings = WingTreatment.defaults().withPedestalRemoval(true)
                .withChiFactor(ChiFactorKind.PERRIN_HARTMANN_CO2);
        double[] one = run(1, wings, grid, chunk);
        double[] two = run(2, wings, grid, chunk);
        double[] three = run(3, wings, grid, chunk);
        // Arrays.equals on double[] compares doubleToLongBits: bit for bit
        assertTrue(Arrays.equals(one, two), "1 vs 2 threads");
        assertTrue(Arrays.equals(one, three), "1 vs 3 threads");
        assertTrue(Arrays.stream(one).anyMatch(v -> v > 0));
    }
}
