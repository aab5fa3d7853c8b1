package org.linewright.grid.bench;

import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.StringJoiner;
import org.linewright.grid.testsupport.RecordingEngine;
import org.linewright.broadening.background.Composition;
import org.linewright.broadening.sources.WidthOptions;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.wings.WingKernel;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.calc.CrossSectionCalculator;
import org.linewright.grid.calc.CrossSectionRequest;
import org.linewright.grid.calc.CrossSectionResult;
import org.linewright.grid.calc.LineSelection;
import org.linewright.grid.calc.ProgressListener;
import org.linewright.grid.engine.CrossSectionEngine;
import org.linewright.grid.engine.EngineFactory;
import org.linewright.grid.engine.LineChunk;
import org.linewright.grid.engine.fast.FastEngine;
import org.linewright.grid.plan.PlanReader;
import org.linewright.grid.table.BuildListener;
import org.linewright.grid.table.BuildReport;
import org.linewright.grid.table.CalculatorBlocks;
import org.linewright.grid.table.TableBuilder;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.partition.PartitionSums;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.store.LineCursor;
import org.linewright.ingest.store.LineQuery;
import org.linewright.ingest.store.LineStore;

/**
 * The grid module's end-to-end targets on {@link SyntheticLines} (synthetic, invented lines), one target per run
 * of {@code main} so that each runs in a JVM of its own with the heap limit under test:
 * {@code java -Xmx2g ... GridTargets TARGET LINES WORKDIR}, TARGET one of {@code calc}, {@code table},
 * {@code incremental}, {@code incremental-wide}, {@code block-sizes}, {@code exact}. System property {@code
 * linewright.benchmark.blockPoints} sets the tables' {@code build.block_points} (unset: the engine's choice). Prints its figures, the phases and the peak heap (sum of the heap pools'
 * peak usage, an upper bound). Exits non-zero on a wrong result (no line used, σ not positive, a rebuild that
 * recomputed the whole table); the figures themselves are judged by {@link GridTargetsBenchmarkTest}.
 */
public final class GridTargets {
    /** Engine threads: the target machine has 2 cores. */
    static final int THREADS = 2;
    /** Background for every target: air at mole fraction 1. */
    static final String BACKGROUND = "air=1";

    /** The incremental target's smaller table: 2 pressures × 2 temperatures. */
    static final double[] PRESSURES_2X2_BAR = {0.01, 1.0};
    static final double[] TEMPERATURES_2X2_K = {296.0, 1000.0};

    private GridTargets() {
    }

    public static void main(String[] args) throws IOException {
        String target = args[0];
        long lines = Long.parseLong(args[1]);
        Path work = Path.of(args[2]);
        switch (target) {
            case "calc" -> calc(lines, work);
            case "table" -> table(lines, work);
            case "incremental" -> incremental(lines, work);
            case "incremental-wide" -> incrementalWide(lines, work);
            case "block-sizes" -> blockSizes(lines, work);
            case "exact" -> exact(lines, work);
            default -> throw new IllegalArgumentException("unknown target " + target);
        }
        System.out.printf(Locale.ROOT, "peak heap %d MB (max heap %d MB), %d cores, java %s%n", peakHeapMb(),
                Runtime.getRuntime().maxMemory() >> 20, Runtime.getRuntime().availableProcessors(),
                System.getProperty("java.version"));
    }

    /** The grid that covers every line: one point per line spacing from the first centre to past the last. */
    static WavenumberGrid fullGrid(long lines) {
        return WavenumberGrid.uniform(SyntheticLines.FIRST_CM1,
                SyntheticLines.FIRST_CM1 + lines * SyntheticLines.SPACING_CM1, SyntheticLines.SPACING_CM1);
    }

    private static MoleculeRegistry registry() {
        return PartitionSums.of(MoleculeRegistry.builtIn()).attachedRegistry();
    }

    private static CrossSectionRequest request(WavenumberGrid grid, double pressureAtm, double temperatureK) {
        return new CrossSectionRequest(temperatureK, pressureAtm, Composition.parse(BACKGROUND), grid,
                WingTreatment.defaults(), LineShapeKind.VOIGT, 0.0, LineSelection.ALL, WidthOptions.DEFAULTS);
    }

    /** Target 1: fast engine, one (p, T), through the calculator from a store; three runs (first one cold). */
    static void calc(long lines, Path work) throws IOException {
        long t0 = System.nanoTime();
        LineStore store = new SyntheticLines().writeStore(work.resolve("store"), lines);
        System.out.printf(Locale.ROOT, "store of %d lines written in %.2f s (not part of the target)%n", lines,
                seconds(t0));
        resetPeaks();
        WavenumberGrid grid = fullGrid(lines);
        CrossSectionCalculator calc = new CrossSectionCalculator(List.of(store), registry(), THREADS);
        CrossSectionRequest request = request(grid, 1.0, 296.0);
        double readSeconds = readOnly(store, LineQuery.all().withColumns(LineQuery.CROSS_SECTION_COLUMNS));
        for (int run = 0; run < 3; run++) {
            long r0 = System.nanoTime();
            CrossSectionResult result;
            try (CrossSectionEngine engine = EngineFactory.create("fast", THREADS, request.wings(),
                    FastEngine.DEFAULT_TOLERANCE)) {
                result = calc.compute(request, engine, ProgressListener.NONE);
            }
            double s = seconds(r0);
            check(result);
            System.out.printf(Locale.ROOT, "calc fast run %d: %d lines on %d points, p = 1 atm, T = 296 K, tolerance %g:"
                            + " %.2f s end to end (estimated error %.2e)%n", run, result.linesUsed(), grid.size(),
                    FastEngine.DEFAULT_TOLERANCE, s, result.estimatedRelativeError());
            if (run == 0) {
                System.out.println("fast engine plan: " + fastPlan(result));
            }
        }
        System.out.printf(Locale.ROOT, "phase: reading the 15 cross-section columns of the store alone %.2f s%n",
                readSeconds);
        // engine alone: the same lines through the engine with no store reading, S(T) or widths
        phaseEngineOnly(store, grid, request);
    }

    private static void phaseEngineOnly(LineStore store, WavenumberGrid grid, CrossSectionRequest request)
            throws IOException {
        // Collect the calculator's engine input once with a recording engine, then time the engine on it.
        RecordingEngine rec = RecordingEngine.keeping();
        long p0 = System.nanoTime();
        new CrossSectionCalculator(List.of(store), registry(), THREADS).compute(request, rec, ProgressListener.NONE);
        double prepare = seconds(p0);
        try (CrossSectionEngine engine = EngineFactory.create("fast", THREADS, request.wings(),
                FastEngine.DEFAULT_TOLERANCE)) {
            for (int run = 0; run < 2; run++) {
                double[] sigma = new double[grid.size()];
                long e0 = System.nanoTime();
                engine.begin(grid, request.pressureAtm(), request.temperatureK());
                for (LineChunk c : rec.chunks) {
                    engine.accumulate(c, sigma);
                }
                engine.finish(sigma);
                System.out.printf(Locale.ROOT, "phase: read + S(T) + widths (calculator with a no-op engine) %.2f s; "
                        + "fast engine alone on the same %d chunks, run %d: %.2f s%n", prepare, rec.chunks.size(), run,
                        seconds(e0));
            }
        }
    }

    /** Target 2: the 10×10 table through the table builder, from the 160-character file. */
    static void table(long lines, Path work) throws IOException {
        Path dir = Files.createDirectories(work.resolve("table"));
        long g0 = System.nanoTime();
        new SyntheticLines().writeRecords(dir.resolve("synthetic-co.par"), lines, 0, 0);
        System.out.printf(Locale.ROOT, "file of %d records written in %.2f s (not part of the target)%n", lines,
                seconds(g0));
        double[] pressuresBar = new double[10];
        double[] temperaturesK = new double[10];
        for (int i = 0; i < 10; i++) {
            pressuresBar[i] = Math.pow(10, -4 + 6.0 * i / 9); // 1e-4 .. 100 bar, log-spaced
            temperaturesK[i] = 200 + 200 * i;                 // 200 .. 2000 K
        }
        Path plan = writePlan(dir, lines, pressuresBar, temperaturesK);
        resetPeaks();
        BuildReport report = build(plan, "table 10x10", true);
        if (report.computed() != report.cells()) {
            throw new IllegalStateException("from scratch, yet " + report.reused() + " cells reused");
        }
        System.out.printf(Locale.ROOT, "table 10x10: %d cells (%d blocks each), %d lines, %d points: %.1f s, "
                        + "table file %d MB, estimated error %.2e%n", 100, report.cells() / 100, lines,
                fullGrid(lines).size(), report.seconds(), Files.size(report.table()) >> 20,
                report.estimatedRelativeError());
    }

    /**
     * Target 3 on the narrow list (2000–2500 cm⁻¹, 10⁶ lines): 2×2 table from scratch, then after a 1 % update
     * of the list (three times, median). Kept for comparison with earlier figures: with a ±25 cm⁻¹ reach a change
     * touches ≥ 55 cm⁻¹ of a 500 cm⁻¹ list, which bounds any incremental scheme at ≈ 9×.
     */
    static void incremental(long lines, Path work) throws IOException {
        SyntheticLines gen = new SyntheticLines();
        long updateFrom = lines / 2;
        incremental(gen, lines, updateFrom, SyntheticLines.SPACING_CM1, work, "incremental 2x2");
    }

    /**
     * Target 3 as a pipeline maintainer meets it: a band system much wider than a line's reach — 10⁶ lines
     * 0.002 cm⁻¹ apart over 2000–4000 cm⁻¹ on a grid of 0.001 cm⁻¹ (2,000,001 points, below the Doppler HWHM) —
     * of which one band is revised: 1 % of the lines, contiguous (lines 400,000–409,999, 2800–2820 cm⁻¹).
     */
    static void incrementalWide(long lines, Path work) throws IOException {
        SyntheticLines gen = new SyntheticLines(WIDE_SPACING_CM1);
        incremental(gen, lines, lines * 4 / 10, WIDE_GRID_STEP_CM1, work, "incremental-wide 2x2");
    }

    /** Line spacing of the wide list, cm⁻¹. */
    static final double WIDE_SPACING_CM1 = 0.002;
    /** Grid step of the wide list's table, cm⁻¹. */
    static final double WIDE_GRID_STEP_CM1 = 0.001;

    private static void incremental(SyntheticLines gen, long lines, long updateFrom, double gridStepCm1, Path work,
                                    String label) throws IOException {
        Path dir = Files.createDirectories(work.resolve("incremental"));
        Path file = dir.resolve("synthetic-co.par");
        long updateTo = updateFrom + lines / 100;
        double toCm1 = SyntheticLines.FIRST_CM1 + lines * gen.spacingCm1();
        Path plan = writePlan(dir, toCm1, gridStepCm1, PRESSURES_2X2_BAR, TEMPERATURES_2X2_K);
        // warm-up on a tenth of the list, in a folder of its own, so the timed builds run compiled code
        Path warm = Files.createDirectories(work.resolve("warm-up"));
        gen.writeRecords(warm.resolve("synthetic-co.par"), lines / 10, 0, 0);
        build(writePlan(warm, SyntheticLines.FIRST_CM1 + lines / 10 * gen.spacingCm1(), gridStepCm1,
                PRESSURES_2X2_BAR, TEMPERATURES_2X2_K), "warm-up", false);
        gen.writeRecords(file, lines, 0, 0);
        resetPeaks();
        BuildReport scratch = build(plan, "from scratch", false);
        double[] rebuild = new double[3];
        int computed = 0;
        for (int k = 0; k < rebuild.length; k++) {
            // updated, back to the original, updated again: each rebuild recomputes the same blocks
            boolean updated = k % 2 == 0;
            gen.writeRecords(file, lines, updated ? updateFrom : 0, updated ? updateTo : 0);
            // a revised list is a new file: every rebuild ingests it (no earlier ingest of the same bytes reused)
            deleteTree(dir.resolve(org.linewright.grid.plan.LineCache.CACHE_DIR));
            BuildReport r = build(plan, updated ? "after the 1 % update" : "back to the original", false);
            // a sanity check, not the target: a band revision must not recompute most of the table
            if (r.computed() * 2 > scratch.computed()) {
                throw new IllegalStateException("rebuild recomputed " + r.computed() + " of " + r.cells() + " cells");
            }
            if (!updated && !r.written().sigmaSha256().equals(scratch.written().sigmaSha256())) {
                // recomputed and reused cells together must give the bits of a build from scratch
                throw new IllegalStateException("the rebuild of the original list differs from the build from scratch");
            }
            rebuild[k] = r.seconds();
            computed = r.computed();
        }
        System.out.printf(Locale.ROOT, "%s: rebuild of the original list bit-identical to the build from scratch "
                + "(sigma SHA-256 %s)%n", label, scratch.written().sigmaSha256());
        double median = java.util.Arrays.stream(rebuild).sorted().toArray()[1];
        System.out.printf(Locale.ROOT, "%s: lines %d..%d of %d updated (air widths x%.1f, %.3f..%.3f "
                        + "cm-1); from scratch %.2f s (%d block cells); rebuilds %.2f / %.2f / %.2f s (%d block cells "
                        + "each), median %.2f s: %.1fx faster%n", label, updateFrom, updateTo - 1, lines,
                SyntheticLines.UPDATE_WIDTH_FACTOR, gen.centre(updateFrom), gen.centre(updateTo - 1),
                scratch.seconds(), scratch.computed(), rebuild[0], rebuild[1], rebuild[2], computed, median,
                scratch.seconds() / median);
    }

    /**
     * The fast engine's time per (p, T) over the whole grid for several block lengths, interleaved (each (p, T)
     * runs every length in turn, the order rotating) so that a change of machine load falls on all of them: the
     * 10×10 table's list and grid, blocks of the power-of-two rule at factors 1.25, 2.5 and 5 and the whole grid
     * as one block, at p = 10⁻⁴, 10⁻², 1, 100 bar and T = 200, 1000 K.
     */
    static void blockSizes(long lines, Path work) throws IOException {
        Path dir = Files.createDirectories(work.resolve("block-sizes"));
        new SyntheticLines().writeRecords(dir.resolve("synthetic-co.par"), lines, 0, 0);
        double[] pressuresBar = {1e-4, 1e-2, 1.0, 100.0};
        double[] temperaturesK = {200.0, 1000.0};
        org.linewright.grid.plan.TablePlan plan = PlanReader.read(writePlan(dir, lines, pressuresBar, temperaturesK));
        MoleculeRegistry registry = TableBuilder.registry(plan);
        List<LineStore> stores = org.linewright.grid.plan.LineCache.load(plan.sources(),
                dir.resolve(org.linewright.grid.plan.LineCache.CACHE_DIR), registry, BuildListener.NONE).stores();
        WavenumberGrid grid = plan.grid();
        double cutoff = plan.profile().cutoffCm1();
        int[] sizes = {CrossSectionEngine.transformBlockPoints(grid, cutoff, 1.25),
                CrossSectionEngine.transformBlockPoints(grid, cutoff, 2.5),
                CrossSectionEngine.transformBlockPoints(grid, cutoff, 5.0), grid.size()};
        double[][] seconds = new double[sizes.length][pressuresBar.length * temperaturesK.length];
        try (org.linewright.grid.table.BlockCalculator calc = CalculatorBlocks.factory().create(plan, stores,
                registry, THREADS)) {
            double reach = TableBuilder.blocks(plan, calc, stores).layout().reachCm1();
            int cell = 0;
            for (int p = 0; p < pressuresBar.length; p++) {
                for (int t = 0; t < temperaturesK.length; t++, cell++) {
                    for (int k = 0; k < sizes.length; k++) {
                        int which = (k + cell) % sizes.length;
                        org.linewright.grid.manifest.BlockLayout layout =
                                new org.linewright.grid.manifest.BlockLayout(grid, sizes[which], reach);
                        long t0 = System.nanoTime();
                        for (int b = 0; b < layout.blocks(); b++) {
                            calc.compute(layout.slice(b), plan.pressuresAtm()[p], temperaturesK[t],
                                    layout.lineMinCm1(b), layout.lineMaxCm1(b));
                        }
                        seconds[which][cell] = seconds(t0);
                        System.out.printf(Locale.ROOT, "block-sizes p = %s bar, T = %s K, blocks of %d points (%d "
                                        + "blocks): %.2f s (load %s)%n", pressuresBar[p], temperaturesK[t], sizes[which],
                                layout.blocks(), seconds[which][cell], loadAverage());
                    }
                }
            }
        }
        for (int k = 0; k < sizes.length; k++) {
            double sum = 0;
            for (double x : seconds[k]) {
                sum += x;
            }
            System.out.printf(Locale.ROOT, "block-sizes: blocks of %d points: %.1f s over the %d (p, T)%n", sizes[k],
                    sum, seconds[k].length);
        }
    }

    private static String loadAverage() {
        try {
            return Files.readString(Path.of("/proc/loadavg")).trim().split(" ")[0];
        } catch (IOException e) {
            return "?";
        }
    }

    /**
     * Target 4: exact engine through the calculator on a 2 cm⁻¹ part of the list (every line within 25 cm⁻¹), 1 and 2 threads. One
     * evaluation = one line at one grid point within its cutoff; counted from the stored centres (the pressure
     * shift, ≤ 0.01 cm⁻¹ at 1 atm, moves at most one point per line edge).
     */
    static void exact(long lines, Path work) throws IOException {
        LineStore store = new SyntheticLines().writeStore(work.resolve("store"), lines);
        WavenumberGrid grid = WavenumberGrid.uniform(2200.0, 2202.0, SyntheticLines.SPACING_CM1);
        CrossSectionRequest request = request(grid, 1.0, 296.0);
        double cutoffCm1 = 25.0; // WingTreatment.defaults(): fixed 25 cm-1 cutoff
        double[] p = grid.pointsCm1();
        long evaluations = 0;
        for (long i = 0; i < lines; i++) {
            double c = SyntheticLines.centreCm1(i);
            if (c < grid.firstCm1() - cutoffCm1 - 1 || c > p[p.length - 1] + cutoffCm1 + 1) {
                continue;
            }
            int lo = WingKernel.firstIndexAtOrAbove(p, 0, p.length, c - cutoffCm1);
            evaluations += WingKernel.firstIndexAbove(p, lo, p.length, c + cutoffCm1) - lo;
        }
        CrossSectionCalculator calc = new CrossSectionCalculator(List.of(store), registry(), THREADS);
        for (int threads : new int[] {1, 2, 1, 2}) {
            double best = 0;
            long used = 0;
            try (CrossSectionEngine engine = EngineFactory.create("exact", threads, request.wings(), 0)) {
                for (int run = 0; run < 2; run++) {
                    long t0 = System.nanoTime();
                    CrossSectionResult r = calc.compute(request, engine, ProgressListener.NONE);
                    double s = seconds(t0);
                    check(r);
                    used = r.linesUsed();
                    best = Math.max(best, evaluations / s);
                }
            }
            System.out.printf(Locale.ROOT, "exact via calculator, %d thread(s): %d lines, %d evaluations, best of 2 "
                    + "runs %.1f million evaluations/s%n", threads, used, evaluations, best / 1e6);
        }
    }

    /**
     * Block length of the 10×10 table: a third of the grid (three blocks per (p, T), 2¹⁹-point transforms), which a
     * plan sets with {@code [build] block_points}. The engine's own choice (0: seven blocks of 2¹⁸-point transforms,
     * each spending 50 of its ≈ 131 cm⁻¹ on the ±25 cm⁻¹ padding) keeps incremental rebuilds finer and is measured
     * too ({@code -Dlinewright.benchmark.blockPoints=0}; docs/performance.md gives both figures).
     */
    static final int TABLE_BLOCK_POINTS = 333_334;

    private static Path writePlan(Path dir, long lines, double[] pressuresBar, double[] temperaturesK)
            throws IOException {
        return writePlan(dir, SyntheticLines.FIRST_CM1 + lines * SyntheticLines.SPACING_CM1,
                SyntheticLines.SPACING_CM1, pressuresBar, temperaturesK,
                Integer.getInteger("linewright.benchmark.blockPoints", TABLE_BLOCK_POINTS));
    }

    private static Path writePlan(Path dir, double toCm1, double stepCm1, double[] pressuresBar,
                                  double[] temperaturesK) throws IOException {
        return writePlan(dir, toCm1, stepCm1, pressuresBar, temperaturesK,
                Integer.getInteger("linewright.benchmark.blockPoints", 0));
    }

    private static Path writePlan(Path dir, double toCm1, double stepCm1, double[] pressuresBar,
                                  double[] temperaturesK, int blockPoints) throws IOException {
        Path plan = dir.resolve("plan.toml");
        Files.writeString(plan, String.format(Locale.ROOT, """
                [lines]
                sources = ["synthetic-co.par"]
                [grid]
                wavenumber = { from = %s, to = %s, step = %s }
                pressures_bar = %s
                temperatures_K = %s
                [background]
                air = 1.0
                [profile]
                engine = "fast"
                [output]
                table = "out/table.arrow"
                %s
                """, SyntheticLines.FIRST_CM1, toCm1, stepCm1, list(pressuresBar), list(temperaturesK),
                blockPoints > 0 ? "[build]\nblock_points = " + blockPoints : ""));
        return plan;
    }

    private static String list(double[] values) {
        StringJoiner j = new StringJoiner(", ", "[", "]");
        for (double v : values) {
            j.add(Double.toString(v));
        }
        return j.toString();
    }

    /**
     * Builds the plan's table, printing the phases (ingest, layout and hashing, computing, writing) as they start
     * and a summary of their durations; with {@code perCell} the time of every (p, T).
     */
    private static BuildReport build(Path plan, String what, boolean perCell) throws IOException {
        long t0 = System.nanoTime();
        double[] marks = new double[4]; // hashing starts, planned, writing starts, done
        BuildListener phases = new BuildListener() {
            private int cells;
            private int lastP = -1;
            private int lastT = -1;
            private double lastEnd;

            @Override
            public void sourceStarted(Path source, long fileBytes) {
                System.out.printf(Locale.ROOT, "  %s %.2f s: ingest %s%n", what, seconds(t0), source.getFileName());
            }

            @Override
            public void hashing(int blocks, int blockPoints, double reachCm1) {
                marks[0] = seconds(t0);
                System.out.printf(Locale.ROOT, "  %s %.2f s: lines ready; %d blocks of %d points, reach %.4f cm-1%n",
                        what, marks[0], blocks, blockPoints, reachCm1);
            }

            @Override
            public void planned(int cells, int toCompute, long pointsToCompute) {
                marks[1] = seconds(t0);
                lastEnd = marks[1];
                System.out.printf(Locale.ROOT, "  %s %.2f s: lines hashed, %d of %d block cells to compute%n", what,
                        marks[1], toCompute, cells);
            }

            @Override
            public void computed(int pressureIndex, int temperatureIndex, int block, int points) {
                double now = seconds(t0);
                if (perCell && (pressureIndex != lastP || temperatureIndex != lastT) && lastP >= 0) {
                    System.out.printf(Locale.ROOT, "  %s cell p%d T%d: %.2f s%n", what, lastP, lastT, cellSeconds);
                    cellSeconds = 0;
                }
                cellSeconds += now - lastEnd;
                lastEnd = now;
                lastP = pressureIndex;
                lastT = temperatureIndex;
                if (++cells % 50 == 0) {
                    System.out.printf(Locale.ROOT, "  %s %.2f s: %d block cells computed (last p%d T%d)%n", what,
                            now, cells, pressureIndex, temperatureIndex);
                }
            }

            private double cellSeconds;

            @Override
            public void writing() {
                marks[2] = seconds(t0);
                if (perCell && lastP >= 0) {
                    System.out.printf(Locale.ROOT, "  %s cell p%d T%d: %.2f s%n", what, lastP, lastT, cellSeconds);
                }
                System.out.printf(Locale.ROOT, "  %s %.2f s: writing the table%n", what, marks[2]);
            }
        };
        BuildReport r = TableBuilder.build(PlanReader.read(plan), CalculatorBlocks.factory(), THREADS, false, phases);
        marks[3] = seconds(t0);
        System.out.printf(Locale.ROOT, "  %s %.2f s: done (%d computed, %d reused); phases: ingest (or cache check) "
                        + "and shift pre-pass %.2f s, hashing %.2f s, computing (and reading reused blocks) %.2f s, "
                        + "writing %.2f s%n", what, marks[3], r.computed(), r.reused(), marks[0], marks[1] - marks[0],
                marks[2] - marks[1], marks[3] - marks[2]);
        return r;
    }

    /** The fast engine's choices (oversampling, internal step, FFT length, slices) from the result's metadata. */
    static String fastPlan(CrossSectionResult r) {
        StringJoiner j = new StringJoiner(", ");
        for (String key : new String[] {"fast.oversampling", "fast.internal_step_cm1", "fast.fft_length",
                "fast.slices"}) {
            j.add(key + " = " + r.metadata().get("engine." + key));
        }
        return j.toString();
    }

    private static double readOnly(LineStore store, LineQuery query) throws IOException {
        long t0 = System.nanoTime();
        LineBatch b = new LineBatch(CrossSectionCalculator.CHUNK_LINES);
        try (LineCursor c = store.cursor(query)) {
            while (c.read(b)) {
                // reading only
            }
        }
        return seconds(t0);
    }

    private static void check(CrossSectionResult r) {
        double[] sigma = r.sigmaCm2PerMolecule();
        if (r.linesUsed() == 0 || !(sigma[sigma.length / 2] > 0)) {
            throw new IllegalStateException("no cross section: " + r.linesUsed() + " lines used");
        }
    }

    private static void deleteTree(Path dir) throws IOException {
        if (!Files.exists(dir)) {
            return;
        }
        try (java.util.stream.Stream<Path> walk = Files.walk(dir)) {
            for (Path p : walk.sorted(java.util.Comparator.reverseOrder()).toList()) {
                Files.delete(p);
            }
        }
    }

    private static double seconds(long t0) {
        return (System.nanoTime() - t0) * 1e-9;
    }

    private static void resetPeaks() {
        System.gc();
        for (MemoryPoolMXBean p : ManagementFactory.getMemoryPoolMXBeans()) {
            p.resetPeakUsage();
        }
    }

    private static long peakHeapMb() {
        long sum = 0;
        for (MemoryPoolMXBean p : ManagementFactory.getMemoryPoolMXBeans()) {
            if (p.getType() == MemoryType.HEAP) {
                sum += p.getPeakUsage().getUsed();
            }
        }
        return sum >> 20;
    }

}
