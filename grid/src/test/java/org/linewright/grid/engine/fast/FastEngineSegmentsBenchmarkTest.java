package org.linewright.grid.engine.fast;


import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.linewright.grid.testsupport.ChildJvm;
import org.linewright.grid.testsupport.RecordingEngine;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.calc.CrossSectionCalculator;
import org.linewright.grid.engine.LineChunk;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.store.LineStore;

/**
 * Engine time with the segmented rings the cost model chooses against one ring for the whole grid, alternated on
 * the same engine input in one JVM (so that load changes hit both alike), with the largest difference between the
 * two results. Workload: the grid targets' synthetic, invented list (see {@link FastEngineConditionsBenchmarkTest}),
 * 1 atm and 296 K (target 1) and 10⁻⁴ bar and 200 K (the finest refinement), default wings, tolerance 10⁻³,
 * 2 threads. Runs in a child JVM with {@code -Xmx2g}: {@code ./mvnw -B -Pbenchmark -pl grid -am verify
 * -Dtest=FastEngineSegmentsBenchmarkTest -Dsurefire.failIfNoSpecifiedTests=false}.
 */
@Tag("benchmark")
class FastEngineSegmentsBenchmarkTest {

    private static final int THREADS = FastEngineConditionsBenchmarkTest.THREADS;
    private static final double[][] CONDITIONS = {{1.0, 296.0}, {1e-4 / 1.01325, 200.0}};

    @Test
    void segmentedAgainstOneRing() throws Exception {
        long lines = Long.getLong("linewright.benchmark.lines", 1_000_000L);
        ChildJvm.run(FastEngineSegmentsBenchmarkTest.class, List.of(), Long.toString(lines));
    }

    public static void main(String[] args) throws IOException {
        long lines = Long.parseLong(args[0]);
        LineStore store = FastEngineConditionsBenchmarkTest.writeStore(Path.of(args[1]).resolve("store"), lines);
        double first = FastEngineConditionsBenchmarkTest.FIRST_CM1;
        double step = FastEngineConditionsBenchmarkTest.SPACING_CM1;
        WavenumberGrid grid = WavenumberGrid.uniform(first, first + lines * step, step);
        CrossSectionCalculator calc = FastEngineConditionsBenchmarkTest.calculator(store, lines, grid);
        for (double[] c : CONDITIONS) {
            double pressureAtm = c[0];
            double temperatureK = c[1];
            RecordingEngine rec = FastEngineConditionsBenchmarkTest.engineInput(calc, grid, pressureAtm, temperatureK);
            double[][] sigma = new double[2][];
            for (int round = 0; round < 2; round++) {
                for (int mode = 0; mode < 2; mode++) {
                    boolean segmented = mode == 0;
                    double[] s = new double[grid.size()];
                    long t0 = System.nanoTime();
                    long cpu0 = FastEngineConditionsBenchmarkTest.processCpuNanos();
                    Map<String, String> plan;
                    try (FastEngine engine = new FastEngine(THREADS, WingTreatment.defaults(),
                            FastEngine.DEFAULT_TOLERANCE)) {
                        // one ring: a forced length beyond what one ring needs falls back to the one-ring layout
                        engine.forceRingLength(segmented ? 0 : FastEngine.MAX_FFT_LENGTH);
                        engine.begin(grid, pressureAtm, temperatureK);
                        for (LineChunk chunk : rec.chunks) {
                            engine.accumulate(chunk, s);
                        }
                        engine.finish(s);
                        plan = engine.describe();
                    }
                    double seconds = (System.nanoTime() - t0) * 1e-9;
                    double cpu = (FastEngineConditionsBenchmarkTest.processCpuNanos() - cpu0) * 1e-9;
                    sigma[mode] = s;
                    System.out.printf(Locale.ROOT, "p = %.3g atm, T = %.0f K, %s: %.2f s (process CPU %.2f s); "
                                    + "segments %s of FFT length %s, slices %s (distinct %s), FFTs %s, corrections %s, "
                                    + "m %s, estimate %s, load %s%n", pressureAtm, temperatureK,
                            segmented ? "segmented" : "one ring ", seconds, cpu, plan.get("fast.segments"),
                            plan.get("fast.segment_fft_length"), plan.get("fast.slices"),
                            plan.get("fast.distinct_slices"), plan.get("fast.ffts"),
                            plan.get("fast.correction_kernels"), plan.get("fast.oversampling"),
                            plan.get("fast.estimated_relative_error"), FastEngineConditionsBenchmarkTest.load());
                }
            }
            double max = 0;
            double diff = 0;
            for (int k = 0; k < sigma[0].length; k++) {
                max = Math.max(max, sigma[1][k]);
                diff = Math.max(diff, Math.abs(sigma[0][k] - sigma[1][k]));
            }
            System.out.printf(Locale.ROOT, "p = %.3g atm, T = %.0f K: segmented vs one ring, largest difference "
                            + "%.2e of max sigma, largest relative difference where sigma >= 1e-6 max: %.2e%n",
                    pressureAtm, temperatureK, diff / max,
                    FastEngineAccuracyTest.maxRelativeError(sigma[0], sigma[1], null));
        }
    }
}
