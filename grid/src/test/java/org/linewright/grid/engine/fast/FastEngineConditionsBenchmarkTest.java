package org.linewright.grid.engine.fast;


import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.linewright.grid.testsupport.ChildJvm;
import org.linewright.grid.testsupport.RecordingEngine;
import org.linewright.broadening.background.Composition;
import org.linewright.broadening.sources.WidthOptions;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.calc.CrossSectionCalculator;
import org.linewright.grid.calc.CrossSectionRequest;
import org.linewright.grid.calc.LineSelection;
import org.linewright.grid.calc.ProgressListener;
import org.linewright.grid.engine.LineChunk;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.partition.PartitionSums;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.store.IngestCounts;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.store.LineStoreWriter;
import org.linewright.ingest.store.SourceMetadata;
import org.linewright.ingest.testsupport.SyntheticRecords;
import org.linewright.ingest.units.PhysicalConstants;

/**
 * Engine time per (p, T) with the analytic kernel path and with every kernel sampled, back to back on the same
 * engine input, at 10⁻⁴, 1 and 100 bar and 200 and 2000 K. The lines are the grid targets' synthetic, invented
 * list (the ingest test generator's block of 20,000 CO lines, seed 7, repeated at 2000 + i·0.0005 cm⁻¹; grid
 * 2000–2500 cm⁻¹ by 0.0005 cm⁻¹; background air; default wings, fixed 25 cm⁻¹ cutoff; tolerance 10⁻³;
 * 2 threads), passed once through the calculator (S(T), widths) and recorded, so only the engine is timed.
 * Runs in a child JVM with {@code -Xmx2g}; or directly:
 * {@code java -Xmx2g --add-opens=java.base/java.nio=ALL-UNNAMED -cp <grid test classpath>
 * org.linewright.grid.engine.fast.FastEngineConditionsBenchmarkTest LINES DIR}.
 */
@Tag("benchmark")
class FastEngineConditionsBenchmarkTest {

    private static final int BLOCK = 20_000;
    static final double FIRST_CM1 = 2000.0;
    static final double SPACING_CM1 = 0.0005;
    static final int THREADS = 2;
    private static final double[] PRESSURES_BAR = {1e-4, 1.0, 100.0};
    private static final double[] TEMPERATURES_K = {200.0, 2000.0};

    @Test
    void enginePerCondition() throws Exception {
        long lines = Long.getLong("linewright.benchmark.lines", 1_000_000L);
        ChildJvm.run(FastEngineConditionsBenchmarkTest.class, List.of(), Long.toString(lines));
    }

    /** The calculator of the benchmark's store (built-in registry); prints the set-up. */
    static CrossSectionCalculator calculator(LineStore store, long lines, WavenumberGrid grid) {
        System.out.printf(Locale.ROOT, "%d lines, grid %d points, %d threads, %d cores, java %s%n", lines,
                grid.size(), THREADS, Runtime.getRuntime().availableProcessors(), System.getProperty("java.version"));
        return new CrossSectionCalculator(List.of(store), PartitionSums.of(MoleculeRegistry.builtIn()).attachedRegistry());
    }

    /** The engine input at (p, T) in air, default wings, Voigt: the calculator's chunks, recorded once. */
    static RecordingEngine engineInput(CrossSectionCalculator calc, WavenumberGrid grid, double pressureAtm,
                                       double temperatureK) throws IOException {
        CrossSectionRequest request = new CrossSectionRequest(temperatureK, pressureAtm, Composition.parse("air=1"),
                grid, WingTreatment.defaults(), LineShapeKind.VOIGT, 0.0, LineSelection.ALL, WidthOptions.DEFAULTS);
        RecordingEngine rec = RecordingEngine.keeping();
        calc.compute(request, rec, ProgressListener.NONE);
        return rec;
    }

    public static void main(String[] args) throws IOException {
        long lines = Long.parseLong(args[0]);
        Path work = Path.of(args[1]);
        LineStore store = writeStore(work.resolve("store"), lines);
        WavenumberGrid grid = WavenumberGrid.uniform(FIRST_CM1, FIRST_CM1 + lines * SPACING_CM1, SPACING_CM1);
        CrossSectionCalculator calc = calculator(store, lines, grid);
        for (double pressureBar : PRESSURES_BAR) {
            for (double temperatureK : TEMPERATURES_K) {
                double pressureAtm = pressureBar * 1e5 / PhysicalConstants.STANDARD_ATMOSPHERE_PA;
                RecordingEngine rec = engineInput(calc, grid, pressureAtm, temperatureK);
                double[][] sigma = new double[2][];
                // alternate the two paths, twice each, so that load changes hit both alike
                for (int round = 0; round < 2; round++) {
                    for (int path = 0; path < 2; path++) {
                        boolean analytic = path == 0;
                        double[] s = new double[grid.size()];
                        long t0 = System.nanoTime();
                        long cpu0 = processCpuNanos();
                        Map<String, String> plan;
                        double estimate;
                        try (FastEngine engine = new FastEngine(THREADS, WingTreatment.defaults(),
                                FastEngine.DEFAULT_TOLERANCE, analytic, true)) {
                            engine.begin(grid, pressureAtm, temperatureK);
                            for (LineChunk c : rec.chunks) {
                                engine.accumulate(c, s);
                            }
                            engine.finish(s);
                            plan = engine.describe();
                            estimate = engine.estimatedRelativeError();
                        }
                        double seconds = (System.nanoTime() - t0) * 1e-9;
                        double cpuSeconds = (processCpuNanos() - cpu0) * 1e-9;
                        sigma[path] = s;
                        System.out.printf(Locale.ROOT, "p = %g bar, T = %.0f K, %s: %.2f s (process CPU %.2f s); slices %s, analytic %s, "
                                        + "corrections %s, FFTs %s, FFT length %s, m %s, estimate %.2e, load %s%n",
                                pressureBar, temperatureK, analytic ? "analytic" : "sampled ", seconds, cpuSeconds,
                                plan.get("fast.slices"), plan.get("fast.analytic_slices"),
                                plan.get("fast.correction_kernels"), plan.get("fast.ffts"),
                                plan.get("fast.fft_length"), plan.get("fast.oversampling"), estimate, load());
                    }
                }
                System.out.printf(Locale.ROOT, "p = %g bar, T = %.0f K: analytic vs sampled, largest relative "
                        + "difference where sigma >= 1e-6 max: %.2e%n", pressureBar, temperatureK,
                        FastEngineAccuracyTest.maxRelativeError(sigma[0], sigma[1], null));
            }
        }
    }

    /** CPU time of the whole process (all threads, GC included), ns. */
    static long processCpuNanos() {
        return ((com.sun.management.OperatingSystemMXBean) java.lang.management.ManagementFactory
                .getOperatingSystemMXBean()).getProcessCpuTime();
    }

    static String load() throws IOException {
        String[] f = Files.readString(Path.of("/proc/loadavg")).trim().split(" ");
        return f[0];
    }

    /** The grid targets' synthetic list, written straight into a store. */
    static LineStore writeStore(Path storeDir, long lines) throws IOException {
        LineBatch b = SyntheticRecords.block(BLOCK, 7);
        try (LineStoreWriter writer = LineStoreWriter.create(storeDir, "synthetic",
                SourceMetadata.of("synthetic-co.par", "", "hitran160", Map.of("generator", "benchmark")))) {
            for (long done = 0; done < lines; done += BLOCK) {
                int n = (int) Math.min(BLOCK, lines - done);
                for (int i = 0; i < n; i++) {
                    long index = done + i;
                    b.wavenumberCm1[i] = Math.round((FIRST_CM1 + index * SPACING_CM1) * 1e6) / 1e6;
                    b.sourceLine[i] = index + 1;
                }
                b.size = n;
                writer.write(b);
            }
            writer.commit(new IngestCounts(lines, lines, 0, 0));
        }
        return LineStore.open(storeDir);
    }

}
