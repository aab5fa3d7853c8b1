package org.linewright.grid.engine.fast;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.wings.WingKernel;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.engine.LineChunk;
import org.linewright.grid.wavenumber.WavenumberGrid;

/**
 * Fast engine at scale (excluded from the default build; run with
 * {@code ./mvnw -B -Pbenchmark -pl grid -am verify -Dtest=FastEngineBenchmarkTest -Dsurefire.failIfNoSpecifiedTests=false}).
 * Target: 1,000,000 lines on a 1,000,000-point grid, one (p, T), default tolerance and wings (25 cm⁻¹ cutoff),
 * within 5 s on 2 cores and 2 GB of heap. Figures go to docs/performance.md.
 *
 * <p>Synthetic lines, labelled as such: centres uniform over 1000–3000 cm⁻¹, Doppler HWHM of a mass-44 molecule at
 * 296 K (αD = 9.29×10⁻⁷·ν), Lorentz HWHM uniform in [0.03, 0.09] cm⁻¹ (1 atm), intensities log-uniform over six
 * decades. Grid 1000–3000 cm⁻¹ at 0.002 cm⁻¹ (1,000,001 points). The result is checked at 200 points against a
 * direct summation of {@link org.linewright.broadening.voigt.VoigtProfile} (tested against SciPy).
 */
@Tag("benchmark")
class FastEngineBenchmarkTest {

    private static final int LINES = 1_000_000;
    private static final int CHUNK = 65_536;

    /**
     * Runs the benchmark outside Surefire, so the heap limit can be chosen: {@code java -Xmx2g -cp
     * <test classpath> org.linewright.grid.engine.fast.FastEngineBenchmarkTest}.
     */
    public static void main(String[] args) {
        new FastEngineBenchmarkTest().millionLinesOnMillionPoints();
    }

    @Test
    void millionLinesOnMillionPoints() {
        WavenumberGrid grid = WavenumberGrid.uniform(1000, 3000, 0.002);
        SplittableRandom random = new SplittableRandom(20261202L);
        double[] centre = new double[LINES];
        for (int i = 0; i < LINES; i++) {
            centre[i] = 1000 + 2000 * random.nextDouble();
        }
        java.util.Arrays.sort(centre);
        LineChunk all = new LineChunk(LINES);
        all.size = LINES;
        for (int i = 0; i < LINES; i++) {
            all.centerCm1[i] = centre[i];
            all.intensityCmPerMolecule[i] = 1e-19 * Math.pow(10, -6 * random.nextDouble());
            all.dopplerHwhmCm1[i] = 9.29e-7 * centre[i];
            all.lorentzHwhmCm1[i] = 0.03 + 0.06 * random.nextDouble();
        }
        WingTreatment wings = WingTreatment.defaults();
        double[] sigma = null;
        double best = Double.POSITIVE_INFINITY;
        int threads = Runtime.getRuntime().availableProcessors();
        String plan = "";
        double estimate = 0;
        for (int round = 0; round < 3; round++) {
            sigma = new double[grid.size()];
            long start = System.nanoTime();
            try (FastEngine engine = new FastEngine(threads, wings, FastEngine.DEFAULT_TOLERANCE)) {
                engine.begin(grid, 1.0, 296.0);
                LineChunk chunk = new LineChunk(CHUNK);
                for (int from = 0; from < LINES; from += CHUNK) {
                    chunk.size = Math.min(CHUNK, LINES - from);
                    System.arraycopy(all.centerCm1, from, chunk.centerCm1, 0, chunk.size);
                    System.arraycopy(all.intensityCmPerMolecule, from, chunk.intensityCmPerMolecule, 0, chunk.size);
                    System.arraycopy(all.dopplerHwhmCm1, from, chunk.dopplerHwhmCm1, 0, chunk.size);
                    System.arraycopy(all.lorentzHwhmCm1, from, chunk.lorentzHwhmCm1, 0, chunk.size);
                    engine.accumulate(chunk, sigma);
                }
                engine.finish(sigma);
                plan = engine.describe().toString();
                estimate = engine.estimatedRelativeError();
            }
            best = Math.min(best, (System.nanoTime() - start) * 1e-9);
        }
        long peakHeap = 0;
        for (MemoryPoolMXBean pool : ManagementFactory.getMemoryPoolMXBeans()) {
            if (pool.getType() == MemoryType.HEAP) {
                peakHeap += pool.getPeakUsage().getUsed();
            }
        }
        // spot check against direct summation at 200 points spread over the grid
        WingKernel kernel = wings.atConditions(1.0, 296.0);
        double[] points = grid.pointsCm1();
        double worst = 0;
        for (int q = 0; q < 200; q++) {
            int k = 2500 + q * ((grid.size() - 5000) / 200);
            double[] one = new double[points.length];
            int lo = WingKernel.firstIndexAtOrAbove(centre, 0, LINES, points[k] - 25.0);
            int hi = WingKernel.firstIndexAbove(centre, 0, LINES, points[k] + 25.0);
            for (int i = lo; i < hi; i++) {
                kernel.addLine(LineShapeKind.VOIGT, points, k, k + 1, all.centerCm1[i], all.dopplerHwhmCm1[i],
                        all.lorentzHwhmCm1[i], all.intensityCmPerMolecule[i], one);
            }
            worst = Math.max(worst, Math.abs(sigma[k] - one[k]) / one[k]);
        }
        System.out.printf("fast engine: %d lines, %d points, %d threads: best of 3 %.2f s; peak heap %.0f MB; "
                        + "estimated error %.2e, observed at 200 points %.2e%n%s%n",
                LINES, grid.size(), threads, best, peakHeap / 1e6, estimate, worst, plan);
        assertTrue(worst <= FastEngine.DEFAULT_TOLERANCE, "spot-check error " + worst);
    }
}
