package org.linewright.broadening.voigt;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * Throughput of the Voigt kernels on one thread (excluded from the default build; run with
 * {@code ./mvnw -B -Pbenchmark -pl broadening -am verify}). Figures go to docs/performance.md.
 *
 * <p>Realistic mix: a 0.01 cm⁻¹ grid, lines with αD uniform in [0.003, 0.01] cm⁻¹ and γL log-uniform in
 * [10⁻⁴, 0.5] cm⁻¹, each evaluated out to a 25 cm⁻¹ cutoff (5001 points per line, mostly far wing).
 */
@Tag("benchmark")
class VoigtThroughputBenchmarkTest {

    private static final int GRID_POINTS = 20_001; // 1000 .. 1200 cm-1
    private static final double STEP_CM1 = 0.01;
    private static final double CUTOFF_CM1 = 25.0;
    private static final int LINES = 2_000;

    @Test
    void realisticMixOnOneThread() {
        double[] grid = new double[GRID_POINTS];
        for (int i = 0; i < GRID_POINTS; i++) {
            grid[i] = 1000.0 + STEP_CM1 * i;
        }
        SplittableRandom random = new SplittableRandom(20261202L);
        double[] centre = new double[LINES];
        double[] alphaD = new double[LINES];
        double[] gammaL = new double[LINES];
        for (int l = 0; l < LINES; l++) {
            centre[l] = 1025.0 + 150.0 * random.nextDouble();
            alphaD[l] = 0.003 + 0.007 * random.nextDouble();
            gammaL[l] = Math.pow(10, -4 + Math.log10(5000) * random.nextDouble());
        }
        double[] out = new double[GRID_POINTS];
        long evaluations = 0;
        // warm-up
        for (int round = 0; round < 3; round++) {
            evaluations = run(grid, centre, alphaD, gammaL, out);
        }
        int rounds = 10;
        long start = System.nanoTime();
        for (int round = 0; round < rounds; round++) {
            run(grid, centre, alphaD, gammaL, out);
        }
        double seconds = (System.nanoTime() - start) * 1e-9;
        double perSecond = rounds * evaluations / seconds;
        System.out.printf("Voigt addProfile, realistic mix: %d evaluations per round, %.1f million/s on one thread%n",
                evaluations, perSecond / 1e6);
        assertTrue(out[GRID_POINTS / 2] > 0);
    }

    @Test
    void coreRegionOnOneThread() {
        // points with |z| < 8 (Zaghloul–Ali series): the slowest path
        SplittableRandom random = new SplittableRandom(7L);
        int n = 1_000_000;
        double[] x = new double[n];
        double[] y = new double[n];
        for (int i = 0; i < n; i++) {
            double r = 8 * Math.sqrt(random.nextDouble());
            double angle = 0.5 * Math.PI * random.nextDouble();
            x[i] = r * Math.cos(angle);
            y[i] = r * Math.sin(angle);
        }
        double sink = 0;
        for (int round = 0; round < 3; round++) {
            for (int i = 0; i < n; i++) {
                sink += Faddeeva.voigtK(x[i], y[i]);
            }
        }
        int rounds = 5;
        long start = System.nanoTime();
        for (int round = 0; round < rounds; round++) {
            for (int i = 0; i < n; i++) {
                sink += Faddeeva.voigtK(x[i], y[i]);
            }
        }
        double seconds = (System.nanoTime() - start) * 1e-9;
        System.out.printf("Faddeeva.voigtK, |z| < 8: %.1f million/s on one thread%n", rounds * n / seconds / 1e6);
        assertTrue(sink > 0);
    }

    @Test
    void lineCentresOnFineGridOnOneThread() {
        // the opposite extreme: a 0.0005 cm-1 grid, only ±0.06 cm-1 around each line (|z| mostly below 8..20)
        double step = 0.0005;
        int points = 241;
        double[] grid = new double[points];
        for (int i = 0; i < points; i++) {
            grid[i] = 1000.0 - 0.06 + step * i;
        }
        SplittableRandom random = new SplittableRandom(99L);
        int lines = 20_000;
        double[] alphaD = new double[lines];
        double[] gammaL = new double[lines];
        for (int l = 0; l < lines; l++) {
            alphaD[l] = 0.003 + 0.007 * random.nextDouble();
            gammaL[l] = Math.pow(10, -4 + 2 * random.nextDouble());
        }
        double[] out = new double[points];
        for (int round = 0; round < 3; round++) {
            for (int l = 0; l < lines; l++) {
                VoigtProfile.addProfile(grid, 0, points, 1000.0, alphaD[l], gammaL[l], 1e-20, out);
            }
        }
        int rounds = 3;
        long start = System.nanoTime();
        for (int round = 0; round < rounds; round++) {
            for (int l = 0; l < lines; l++) {
                VoigtProfile.addProfile(grid, 0, points, 1000.0, alphaD[l], gammaL[l], 1e-20, out);
            }
        }
        double seconds = (System.nanoTime() - start) * 1e-9;
        System.out.printf("Voigt addProfile, line centres (0.0005 cm-1 grid, ±0.06 cm-1): %.1f million/s on one thread%n",
                (double) rounds * lines * points / seconds / 1e6);
        assertTrue(out[points / 2] > 0);
    }

    private static long run(double[] grid, double[] centre, double[] alphaD, double[] gammaL, double[] out) {
        long evaluations = 0;
        for (int l = 0; l < centre.length; l++) {
            int from = (int) Math.ceil((centre[l] - CUTOFF_CM1 - grid[0]) / STEP_CM1);
            int to = (int) Math.floor((centre[l] + CUTOFF_CM1 - grid[0]) / STEP_CM1) + 1;
            VoigtProfile.addProfile(grid, from, to, centre[l], alphaD[l], gammaL[l], 1e-20, out);
            evaluations += to - from;
        }
        return evaluations;
    }
}
