package org.linewright.grid.bench;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.Locale;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.linewright.broadening.wings.WingKernel;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.engine.LineChunk;
import org.linewright.grid.engine.exact.ExactEngine;
import org.linewright.grid.wavenumber.WavenumberGrid;

/**
 * Throughput of the exact engine in line-profile evaluations per second (one evaluation = one line at one grid
 * point inside its cutoff). Synthetic, invented lines: 20,000 Voigt lines spread over 1000–3000 cm⁻¹ with
 * αD = 0.002–0.004 cm⁻¹ and γL = 0.02–0.12 cm⁻¹ (a gas near 1 bar), 25 cm⁻¹ cutoff, 0.01 cm⁻¹ grid.
 * Run: {@code ./mvnw -B -Pbenchmark -pl grid -am verify -Dtest=ExactEngineBenchmarkTest
 * -Dsurefire.failIfNoSpecifiedTests=false}.
 */
@Tag("benchmark")
class ExactEngineBenchmarkTest {

    @Test
    void profileEvaluationsPerSecond() {
        int n = 20_000;
        SplittableRandom rnd = new SplittableRandom(42);
        double[] centres = new double[n];
        for (int i = 0; i < n; i++) {
            centres[i] = 1000 + 2000 * rnd.nextDouble();
        }
        Arrays.sort(centres);
        LineChunk chunk = new LineChunk(n);
        for (int i = 0; i < n; i++) {
            chunk.centerCm1[i] = centres[i];
            chunk.intensityCmPerMolecule[i] = Math.pow(10, -19 - 6 * rnd.nextDouble());
            chunk.dopplerHwhmCm1[i] = 0.002 + 0.002 * rnd.nextDouble();
            chunk.lorentzHwhmCm1[i] = 0.02 + 0.1 * rnd.nextDouble();
        }
        chunk.size = n;
        WavenumberGrid grid = WavenumberGrid.uniform(975.0, 3025.0, 0.01);
        double[] p = grid.pointsCm1();
        long evaluations = 0;
        for (int i = 0; i < n; i++) {
            int lo = WingKernel.firstIndexAtOrAbove(p, 0, p.length, centres[i] - 25);
            evaluations += WingKernel.firstIndexAbove(p, lo, p.length, centres[i] + 25) - lo;
        }
        for (int threads : new int[] {1, 2}) {
            try (ExactEngine engine = new ExactEngine(threads, WingTreatment.defaults())) {
                double best = 0;
                for (int run = 0; run < 4; run++) {
                    double[] sigma = new double[grid.size()];
                    long t0 = System.nanoTime();
                    engine.begin(grid, 1.0, 296.0);
                    engine.accumulate(chunk, sigma);
                    engine.finish(sigma);
                    double seconds = (System.nanoTime() - t0) * 1e-9;
                    double rate = evaluations / seconds;
                    best = Math.max(best, rate);
                    System.out.printf(Locale.ROOT, "exact engine, %d thread(s), run %d: %d evaluations in %.3f s = "
                            + "%.1f million/s%n", threads, run, evaluations, seconds, rate / 1e6);
                    assertTrue(sigma[grid.size() / 2] > 0);
                }
                System.out.printf(Locale.ROOT, "exact engine, %d thread(s): best %.1f million evaluations/s%n",
                        threads, best / 1e6);
            }
        }
    }
}
