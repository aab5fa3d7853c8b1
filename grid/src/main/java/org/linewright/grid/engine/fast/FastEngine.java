package org.linewright.grid.engine.fast;

import java.util.LinkedHashMap;
import java.util.Map;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import org.linewright.broadening.wings.ChiFactorKind;
import org.linewright.broadening.wings.WingKernel;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.engine.CrossSectionEngine;
import org.linewright.grid.engine.LineChunk;
import org.linewright.grid.engine.exact.ExactEngine;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.InputException;
import pl.edu.icm.jlargearrays.ConcurrencyUtils;

/**
 * The fast cross-section engine (id {@code fast}): a discrete integral transform after D.C.M. van den Bekerom and
 * E. Pannier, "A discrete integral transform for rapid spectral synthesis", JQSRT 261 (2021) 107476.
 *
 * <p><b>Method.</b> σ(ν) = Σᵢ Sᵢ·V(ν − νᵢ; αᵢ, γᵢ). Every line is spread over a three-dimensional grid — position on
 * an internal uniform wavenumber grid of step h, Doppler HWHM on nodes evenly spaced in ln αD, Lorentz HWHM on nodes
 * evenly spaced in ln γL — and each (αD, γL) node pair (a "slice") is convolved along ν with the truncated profile
 * of its node widths; the slices are summed in the frequency domain, so one inverse transform gives σ. Where the
 * paper uses two-point weights per axis, this engine uses Lagrange weights ({@link LagrangeWeights}): four points in
 * αD² (Gaussians convolve by adding variances) and in γL, six points in position, so the errors fall as the fourth
 * power of the log-width steps and the sixth power of the internal step.
 *
 * <p>The work is split over one class per concept:
 * <ul>
 * <li>{@link FastPlanner} chooses the immutable {@link FastPlan}: internal step, families of lines and their width
 * axes, slices, segments, lines summed directly instead, a-priori error terms;</li>
 * <li>{@link LineDistribution} buckets each segment's lines and spreads them over the nodes;</li>
 * <li>{@link SliceConvolver} convolves a segment's slices (sampled or analytic kernels) and sums them;</li>
 * <li>{@link OutputSampler} reads σ at the output points from each segment's ring;</li>
 * <li>{@link EdgeCorrection} makes every line's cutoff edge exact;</li>
 * <li>{@link PlanDescription} writes what was done into the metadata.</li>
 * </ul>
 * Lines the plan cannot treat within the tolerance (a cutoff that depends on each line's widths; lines too narrow
 * for the finest internal grid) are summed directly by an {@link ExactEngine} on the same threads, so the
 * tolerance holds for every line.
 *
 * <p><b>Accuracy.</b> The criterion: relative error ≤ ε wherever σ ≥ 10⁻⁶·max σ. {@link #estimatedRelativeError()}
 * is the sum of the measured position, width-axis, edge and round-off errors at the chosen steps plus, on the
 * analytic path, the wing-model remainder, the neglected alias tail and the omitted curvature terms; the planner
 * keeps it within ε (tested against the exact engine at every grid point over a matrix of regimes).
 *
 * <p>Negative values (FFT round-off where no line reaches) are added as zero, since a cross section is never
 * negative; where no line reaches, σ is round-off (about 10⁻¹⁶ of the largest line peak) rather than exactly zero.
 *
 * <p><b>Threads and determinism.</b> Slices run in parallel in fixed blocks summed in a fixed order; the edge
 * correction runs in line order; directly summed lines go through the exact engine's fixed blocks. σ is bitwise the
 * same for any thread count. The FFT library's own threading is switched off (a process-wide JTransforms setting).
 *
 * <p><b>Memory.</b> The lines are kept ({@value LineBuffer#BYTES_PER_LINE} bytes each, and their family, one byte)
 * until {@link #finish}, which computes the distribution weights of one segment's lines at a time
 * ({@value LineDistribution#BYTES_PER_SEGMENT_LINE} bytes per line of the largest segment) and needs
 * ({@value SliceConvolver#BLOCKS} + 2·threads + 1)·L doubles (on the analytic path 3·threads, plus L/2 for a sin²
 * table), L the segments' ring length, and one double per output point. {@link #finish} refuses with an
 * {@link InputException} naming the figures when this exceeds the heap. The lines themselves are not yet streamed:
 * the number of lines a heap holds is bounded by the 34 bytes each.
 */
public final class FastEngine implements CrossSectionEngine {

    /** The engine id. */
    public static final String ID = "fast";
    /** Default tolerance: 10⁻³ relative wherever σ ≥ 10⁻⁶·max σ. */
    public static final double DEFAULT_TOLERANCE = 1e-3;
    /**
     * Smallest tolerance accepted: below it the transforms' round-off, 64·2⁻⁵²·log₂L relative to the largest line
     * peak, is no longer small against the criterion's depth (10⁻⁶ of max σ).
     */
    public static final double MIN_TOLERANCE = 1e-5;
    /** Largest tolerance accepted. */
    public static final double MAX_TOLERANCE = 0.1;
    /** The criterion the tolerance applies to, as recorded in the metadata. */
    public static final String CRITERION = "relative error where sigma >= 1e-6 max sigma";
    /** Largest internal refinement of the output step. */
    static final int MAX_OVERSAMPLING = FastPlanner.MAX_OVERSAMPLING;
    /** Smallest ratio of a table block's transform length to its padding on both sides. */
    static final double BLOCK_TRANSFORM_FACTOR = 2.5;
    /** Largest FFT length accepted. */
    static final int MAX_FFT_LENGTH = 1 << 29;

    private final int threads;
    private final WingTreatment wings;
    private final double tolerance;
    private final boolean analyticKernels;
    /** Whether families cheaper summed directly are (false: the transform whenever it keeps the tolerance). */
    private final boolean costChoice;
    private final ExecutorService pool;
    private final LineBuffer lines = new LineBuffer();

    private WavenumberGrid grid;
    private double pressureAtm;
    private double temperatureK;
    private WingKernel wingKernel;
    /** The same treatment without χ, for lines not flagged for it; {@code wingKernel} itself when χ is off. */
    private WingKernel plainKernel;
    private double estimate;
    private final Map<String, String> plan = new LinkedHashMap<>();
    /** Ring length imposed on the segment layout (a power of two), 0 to choose it from the cost model. */
    private int forcedRingLength;
    /** sin²(πn/L) table of the last FFT length on the analytic path. */
    private double[] sinSquared;
    /** Engine for the lines summed directly, made when first needed. */
    private ExactEngine direct;

    /**
     * @param threads   worker threads, at least 1
     * @param wings     wing treatment (cutoff, pedestal and χ factor as in the exact engine)
     * @param tolerance relative tolerance where σ ≥ 10⁻⁶·max σ, in [{@value #MIN_TOLERANCE}, {@value #MAX_TOLERANCE}]
     * @throws InputException for a tolerance out of range
     */
    public FastEngine(int threads, WingTreatment wings, double tolerance) {
        this(threads, wings, tolerance, true, true);
    }

    /**
     * @param threads          worker threads, at least 1
     * @param wings            wing treatment
     * @param tolerance        relative tolerance, in [{@value #MIN_TOLERANCE}, {@value #MAX_TOLERANCE}]
     * @param analyticKernels  whether slices may take the closed-form kernel transforms (false: every kernel sampled
     *                         and transformed numerically, the reference for tests and benchmarks)
     * @param costChoice       whether a family of lines cheaper summed directly than transformed is summed directly
     *                         (false, for tests of the transform itself: only lines it cannot treat within the
     *                         tolerance are)
     */
    FastEngine(int threads, WingTreatment wings, double tolerance, boolean analyticKernels, boolean costChoice) {
        if (threads < 1) {
            throw new IllegalArgumentException("threads must be at least 1, got " + threads);
        }
        checkTolerance(tolerance);
        this.threads = threads;
        this.wings = wings;
        this.tolerance = tolerance;
        this.analyticKernels = analyticKernels;
        this.costChoice = costChoice;
        // slices already run in parallel here; the FFT's own threads would only compete (and are process-wide)
        ConcurrencyUtils.setNumberOfThreads(1);
        this.pool = Executors.newFixedThreadPool(threads, r -> {
            Thread t = new Thread(r, "fast-engine");
            t.setDaemon(true);
            return t;
        });
    }

    /** {@link #transformOnly(int, WingTreatment, double, boolean)} with the analytic kernels allowed. */
    static FastEngine transformOnly(int threads, WingTreatment wings, double tolerance) {
        return transformOnly(threads, wings, tolerance, true);
    }

    /** An engine that transforms every line it can treat within the tolerance (tests of the transform itself). */
    static FastEngine transformOnly(int threads, WingTreatment wings, double tolerance, boolean analyticKernels) {
        return new FastEngine(threads, wings, tolerance, analyticKernels, false);
    }

    /**
     * Refuses, before any work, a tolerance this engine cannot keep.
     *
     * @throws InputException outside [{@value #MIN_TOLERANCE}, {@value #MAX_TOLERANCE}]
     */
    public static void checkTolerance(double tolerance) {
        if (!(tolerance >= MIN_TOLERANCE && tolerance <= MAX_TOLERANCE)) {
            throw new InputException("fast engine tolerance: " + tolerance + " (expected a number in [" + MIN_TOLERANCE
                    + ", " + MAX_TOLERANCE + "]: below " + MIN_TOLERANCE + " the transforms' round-off is not small "
                    + "against the criterion's depth of 1e-6 max sigma; use the exact engine)");
        }
    }

    /**
     * Imposes the segments' ring length instead of the cost model's choice (for tests: a grid forced into several
     * segments); 0 restores the choice.
     *
     * @param ringLength a power of two above twice the kernel reach, or 0
     */
    void forceRingLength(int ringLength) {
        if (ringLength != 0 && Integer.bitCount(ringLength) != 1) {
            throw new IllegalArgumentException("ring length " + ringLength + " (expected a power of two or 0)");
        }
        this.forcedRingLength = ringLength;
    }

    @Override
    public void begin(WavenumberGrid newGrid, double newPressureAtm, double newTemperatureK) {
        this.grid = newGrid;
        this.pressureAtm = newPressureAtm;
        this.temperatureK = newTemperatureK;
        this.wingKernel = wings.atConditions(newPressureAtm, newTemperatureK);
        this.plainKernel = wings.chiFactor() == ChiFactorKind.NONE ? wingKernel
                : wings.withChiFactor(ChiFactorKind.NONE).atConditions(newPressureAtm, newTemperatureK);
        lines.clear();
        this.estimate = 0;
        plan.clear();
    }

    @Override
    public void accumulate(LineChunk chunk, double[] sigmaCm2PerMolecule) {
        if (grid == null) {
            throw new IllegalStateException("accumulate before begin");
        }
        lines.add(chunk, wingKernel != plainKernel);
    }

    @Override
    public void finish(double[] sigmaCm2PerMolecule) {
        if (grid == null) {
            throw new IllegalStateException("finish before begin");
        }
        if (sigmaCm2PerMolecule.length != grid.size()) {
            throw new IllegalArgumentException("sigma has " + sigmaCm2PerMolecule.length + " points, the grid "
                    + grid.size());
        }
        plan.putAll(PlanDescription.method(tolerance, wings));
        if (lines.count == 0) {
            estimate = 0;
            plan.put("fast.lines", "0");
            return;
        }
        FastPlan p = new FastPlanner(lines, grid, wings, wingKernel, plainKernel, tolerance, analyticKernels,
                costChoice).plan(threads, forcedRingLength);
        SliceConvolver.Counts counts = new SliceConvolver.Counts();
        int distinctSlices = 0;
        if (p.transformedLines() > 0 && p.slices() > 0) {
            int length = p.layout.ringLength();
            SegmentLayout layout = p.layout;
            int segments = layout.segments();
            // which lines each segment takes and their distribution weights, one segment at a time
            LineDistribution dist = new LineDistribution(p, lines, -p.offset - p.margin,
                    layout.start(segments - 1) - p.margin - p.offset + length - FastPlanner.P);
            SliceConvolver convolver = new SliceConvolver(p, pool, wings.removePedestal(),
                    p.anyAnalytic ? sinSquaredTable(length) : null);
            OutputSampler sampler = new OutputSampler(p);
            double[] raw = new double[grid.size()];
            for (int seg = 0; seg < segments; seg++) {
                // ring index r holds internal point ringStart + r − offset
                long ringStart = layout.start(seg) - p.margin;
                dist.bucket(ringStart - p.offset, ringStart - p.offset + length - FastPlanner.P,
                        (int) (p.offset - ringStart));
                double[] ring = convolver.convolve(dist, counts);
                sampler.sample(seg, ring, raw);
            }
            dist.release();
            EdgeCorrection.apply(p, lines, dist, raw, pool, threads);
            // values below zero can only be round-off: a cross section is never negative, so they are added as zero
            for (int k = 0; k < raw.length; k++) {
                sigmaCm2PerMolecule[k] += Math.max(0.0, raw[k]);
            }
            for (boolean used : convolver.sliceUsed) {
                distinctSlices += used ? 1 : 0;
            }
        }
        if (p.directLines > 0) {
            sumDirectly(p, sigmaCm2PerMolecule);
        }
        // the analytic path: the wing model's remainder and the alias tail left out of the transforms
        double analyticError = counts.analyticSlices > 0
                ? p.wingModelError + counts.aliasError + counts.curvatureError : 0;
        estimate = p.transformedLines() > 0 ? p.plannedError() + analyticError : 0;
        plan.putAll(PlanDescription.run(p, counts, distinctSlices, estimate, lines.count));
    }

    /** The plan's directly summed lines, through the exact engine in line order (its blocks are thread-independent). */
    private void sumDirectly(FastPlan p, double[] sigma) {
        if (direct == null) {
            direct = new ExactEngine(threads, wings);
        }
        direct.begin(grid, pressureAtm, temperatureK);
        int capacity = 1 << 14;
        LineChunk chunk = new LineChunk(Math.min(capacity, Math.max(1, p.directLines)));
        for (int i = 0; i < lines.count; i++) {
            if (p.lineFamily[i] != FastPlan.DIRECT) {
                continue;
            }
            int k = chunk.size++;
            chunk.centerCm1[k] = lines.centerCm1[i];
            chunk.intensityCmPerMolecule[k] = lines.strength[i];
            chunk.dopplerHwhmCm1[k] = lines.dopplerCm1[i];
            chunk.lorentzHwhmCm1[k] = lines.lorentzCm1[i];
            chunk.chiFactor[k] = lines.chi[i];
            if (chunk.size == chunk.capacity()) {
                direct.accumulate(chunk, sigma);
                chunk.size = 0;
            }
        }
        if (chunk.size > 0) {
            direct.accumulate(chunk, sigma);
        }
        direct.finish(sigma);
    }

    /** sin²(πn/L), n = 0 … L/2, kept between computations of the same FFT length. */
    private double[] sinSquaredTable(int length) {
        if (sinSquared == null || sinSquared.length != length / 2 + 1) {
            sinSquared = AnalyticKernels.sinSquaredTable(length);
        }
        return sinSquared;
    }

    /**
     * Smallest power of two ≥ {@code needed}: the library's split-radix path for powers of two is several times
     * faster than its mixed-radix path, which outweighs the padding (less than a factor 2 in memory).
     */
    static int fftLength(int needed) {
        return Integer.highestOneBit(Math.max(2, needed - 1)) << 1;
    }

    /**
     * Table blocks for this engine: the power-of-two transform rule of {@link
     * CrossSectionEngine#transformBlockPoints} with factor {@value #BLOCK_TRANSFORM_FACTOR}, so that ≥ 60 % of every
     * block's transform is the block itself (measured against 1.25 and 5 in docs/performance.md, "Grid: table
     * blocks sized for the engine").
     */
    @Override
    public int preferredBlockPoints(WavenumberGrid blockGrid, double paddingCm1) {
        return CrossSectionEngine.transformBlockPoints(blockGrid, paddingCm1, BLOCK_TRANSFORM_FACTOR);
    }

    @Override
    public String id() {
        return ID;
    }

    @Override
    public Map<String, String> describe() {
        Map<String, String> m = new LinkedHashMap<>(PlanDescription.method(tolerance, wings));
        m.putAll(plan);
        return m;
    }

    @Override
    public double estimatedRelativeError() {
        return estimate;
    }

    @Override
    public void close() {
        pool.shutdownNow();
        if (direct != null) {
            direct.close();
        }
    }
}
