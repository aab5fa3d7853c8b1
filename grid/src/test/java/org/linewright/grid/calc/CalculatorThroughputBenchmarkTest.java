package org.linewright.grid.calc;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.grid.testsupport.RecordingEngine;
import org.linewright.broadening.background.Composition;
import org.linewright.broadening.sources.WidthOptions;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.wings.HwhmMultipleCutoff;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.partition.PartitionSums;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.store.IngestCounts;
import org.linewright.ingest.store.LineCursor;
import org.linewright.ingest.store.LineQuery;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.store.LineStoreWriter;
import org.linewright.ingest.store.SourceMetadata;
import org.linewright.ingest.testsupport.SyntheticRecords;

/**
 * The calculator's own work — reading the store plus S(T), widths, shifts, Doppler HWHMs, threshold and
 * statistics — for 10⁶ synthetic, invented CO lines ({@link SyntheticRecords} blocks of 20,000 lines laid out at
 * 2000 + i·0.0005 cm⁻¹, the grid targets' workload), handed to an engine that only copies its input. Run with
 * {@code ./mvnw -B -Pbenchmark -pl grid -am verify -Dtest=CalculatorThroughputBenchmarkTest
 * -Dsurefire.failIfNoSpecifiedTests=false} ({@code -Dlinewright.benchmark.lines=N} for another size).
 * Prints the time of each run; the figures go to {@code docs/performance.md}.
 */
@Tag("benchmark")
class CalculatorThroughputBenchmarkTest {
    private static final int BLOCK = 20_000;
    private static final double FIRST_CM1 = 2000.0;
    private static final double SPACING_CM1 = 0.0005;

    /** Timed runs per thread count (the machine is shared: best and median of several). */
    private static final int RUNS = 9;
    /** Wavenumber blocks of the table-like pass (the table builder's 20,000-point blocks are 10 cm⁻¹ here). */
    private static final int BLOCKS = 50;

    private static final com.sun.management.OperatingSystemMXBean PROCESS =
            (com.sun.management.OperatingSystemMXBean) java.lang.management.ManagementFactory.getOperatingSystemMXBean();
    private static final java.lang.management.ThreadMXBean THREADS =
            java.lang.management.ManagementFactory.getThreadMXBean();

    @TempDir
    Path tmp;

    @Test
    void readingAndPhysicsOfAMillionLines() throws IOException {
        long lines = Long.getLong("linewright.benchmark.lines", 1_000_000L);
        LineStore store = writeStore(tmp.resolve("store"), lines);
        WavenumberGrid grid = WavenumberGrid.uniform(FIRST_CM1, FIRST_CM1 + lines * SPACING_CM1, SPACING_CM1);
        CrossSectionRequest request = new CrossSectionRequest(296.0, 1.0, Composition.parse("air=1"), grid,
                WingTreatment.defaults(), LineShapeKind.VOIGT, 0.0, LineSelection.ALL, WidthOptions.DEFAULTS);
        MoleculeRegistry registry = PartitionSums.of(MoleculeRegistry.builtIn()).attachedRegistry();
        System.out.printf(Locale.ROOT, "calculator benchmark: %d lines, %d cores, java %s, load average %.2f%n",
                lines, Runtime.getRuntime().availableProcessors(), System.getProperty("java.version"),
                java.lang.management.ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage());
        for (int pass = 0; pass < 2; pass++) {
            System.out.printf(Locale.ROOT, "  read only, 15 cross-section columns: %.3f s; calculator columns: %.3f s%n",
                    readOnly(store, LineQuery.CROSS_SECTION_COLUMNS),
                    readOnly(store, LinePreparation.PHYSICS_COLUMNS));
        }
        wholeGrid(store, registry, request, lines, "fixed 25 cm-1 cutoff");
        // a cutoff of 20 half widths (at most 25 cm-1): the wing loss of each line is a numerical integral
        CrossSectionRequest hwhm = new CrossSectionRequest(296.0, 1.0, Composition.parse("air=1"), grid,
                WingTreatment.defaults().withCutoff(new HwhmMultipleCutoff(20, 25.0)), LineShapeKind.VOIGT, 0.0,
                LineSelection.ALL, WidthOptions.DEFAULTS);
        wholeGrid(store, registry, hwhm, lines, "cutoff 20 HWHM");
        // as the table builder calls it: one computation per wavenumber block, lines within the block's reach
        double span = lines * SPACING_CM1 / BLOCKS;
        for (int threads : new int[] {1, 2, 1, 2}) {
            CrossSectionCalculator calc = calculator(store, registry, threads);
            double[] seconds = new double[3];
            for (int run = 0; run < seconds.length; run++) {
                long t0 = System.nanoTime();
                long used = 0;
                for (int k = 0; k < BLOCKS; k++) {
                    double from = FIRST_CM1 + k * span;
                    WavenumberGrid block = WavenumberGrid.uniform(from, from + span - SPACING_CM1, SPACING_CM1);
                    CrossSectionRequest r = new CrossSectionRequest(296.0, 1.0, Composition.parse("air=1"), block,
                            WingTreatment.defaults(), LineShapeKind.VOIGT, 0.0, LineSelection.ALL,
                            WidthOptions.DEFAULTS);
                    used += calc.compute(r, RecordingEngine.copying(), from - 26.0, from + span + 26.0,
                            ProgressListener.NONE).linesUsed();
                }
                seconds[run] = (System.nanoTime() - t0) * 1e-9;
                assertEquals(true, used > lines);
            }
            System.out.printf(Locale.ROOT, "  %d blocks of %.0f cm-1 (lines within 26 cm-1), %d thread(s): runs %s s; "
                            + "load average %.2f%n", BLOCKS, span, threads, Arrays.toString(round(seconds)),
                    java.lang.management.ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage());
        }
    }

    /** Times the whole grid in {@link #RUNS} runs per thread count, 1, 2, 1, 2 threads. */
    private static void wholeGrid(LineStore store, MoleculeRegistry registry, CrossSectionRequest request, long lines,
                                  String what) {
        for (int threads : new int[] {1, 2, 1, 2}) {
            double[] seconds = new double[RUNS];
            double[] processCpu = new double[RUNS];
            double[] callerCpu = new double[RUNS];
            for (int run = 0; run < seconds.length; run++) {
                RecordingEngine engine = RecordingEngine.copying();
                long c0 = PROCESS.getProcessCpuTime();
                long k0 = THREADS.getCurrentThreadCpuTime();
                long t0 = System.nanoTime();
                CrossSectionResult r = calculator(store, registry, threads).compute(request, engine,
                        ProgressListener.NONE);
                seconds[run] = (System.nanoTime() - t0) * 1e-9;
                callerCpu[run] = (THREADS.getCurrentThreadCpuTime() - k0) * 1e-9;
                processCpu[run] = (PROCESS.getProcessCpuTime() - c0) * 1e-9;
                assertEquals(lines, r.linesUsed());
                assertEquals(lines, engine.lines);
            }
            double[] sorted = seconds.clone();
            Arrays.sort(sorted);
            System.out.printf(Locale.ROOT, "  calculator, %s, %d thread(s): runs %s s; best %.3f s, median %.3f s "
                            + "(%.2f M lines/s best); load average %.2f%n", what, threads, Arrays.toString(round(seconds)),
                    sorted[0], sorted[sorted.length / 2], lines / sorted[0] / 1e6,
                    java.lang.management.ManagementFactory.getOperatingSystemMXBean().getSystemLoadAverage());
            // CPU seconds do not depend on the load as wall time does: the whole process (workers, GC and JIT
            // included) and the calling thread (reading, merging, reducing), medians
            Arrays.sort(processCpu);
            Arrays.sort(callerCpu);
            System.out.printf(Locale.ROOT, "    cpu: process %.3f s, calling thread %.3f s (medians)%n",
                    processCpu[RUNS / 2], callerCpu[RUNS / 2]);
        }
    }

    private static CrossSectionCalculator calculator(LineStore store, MoleculeRegistry registry, int threads) {
        return new CrossSectionCalculator(List.of(store), registry, threads);
    }

    private static double[] round(double[] s) {
        return Arrays.stream(s).map(v -> Math.round(v * 1000) / 1000.0).toArray();
    }

    private static double readOnly(LineStore store, java.util.Set<org.linewright.ingest.line.LineColumn> columns)
            throws IOException {
        long t0 = System.nanoTime();
        LineBatch b = new LineBatch(CrossSectionCalculator.CHUNK_LINES);
        try (LineCursor c = store.cursor(LineQuery.all().withColumns(columns))) {
            while (c.read(b)) {
                // reading only
            }
        }
        return (System.nanoTime() - t0) * 1e-9;
    }

    /** {@code lines} synthetic lines straight into a store, centres FIRST + i·SPACING (rounded to 6 decimals). */
    private static LineStore writeStore(Path dir, long lines) throws IOException {
        LineBatch b = SyntheticRecords.block(BLOCK, 7);
        try (LineStoreWriter writer = LineStoreWriter.create(dir, "synthetic",
                SourceMetadata.of("synthetic-co.par", "", "hitran160", Map.of("generator", "benchmark")))) {
            for (long done = 0; done < lines; done += BLOCK) {
                int n = (int) Math.min(BLOCK, lines - done);
                for (int i = 0; i < n; i++) {
                    b.wavenumberCm1[i] = Math.round((FIRST_CM1 + (done + i) * SPACING_CM1) * 1e6) / 1e6;
                    b.sourceLine[i] = done + i + 1;
                }
                b.size = n;
                writer.write(b);
            }
            writer.commit(new IngestCounts(lines, lines, 0, 0));
        }
        return LineStore.open(dir);
    }

}
