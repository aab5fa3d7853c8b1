package org.linewright.grid.engine.fast;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.jtransforms.fft.DoubleFFT_1D;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.voigt.VoigtProfile;
import org.linewright.broadening.wings.ChiFactorKind;
import org.linewright.broadening.wings.FixedCutoff;
import org.linewright.broadening.wings.PressureScaledCutoff;
import org.linewright.broadening.wings.WingKernel;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.engine.CrossSectionEngine;
import org.linewright.grid.engine.LineChunk;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.InputException;
import pl.edu.icm.jlargearrays.ConcurrencyUtils;

/**
 * The fast cross-section engine (id {@code fast}): a discrete integral transform after D.C.M. van den Bekerom and
 * E. Pannier, "A discrete integral transform for rapid spectral synthesis", JQSRT 261 (2021) 107476.
 *
 * <p><b>Method.</b> σ(ν) = Σᵢ Sᵢ·V(ν − νᵢ; αᵢ, γᵢ). Every line is spread over a three-dimensional grid — position on
 * an internal uniform wavenumber grid of step h, Doppler HWHM on nodes evenly spaced in ln αD, Lorentz HWHM on nodes
 * evenly spaced in ln γL — and each (αD, γL) node pair (a "slice") is convolved along ν with the Voigt profile of
 * its node widths; the slices are summed. The convolutions are products of FFTs (JTransforms), the slices summed in
 * the frequency domain, so one inverse transform gives σ. Cost O(lines·16·6 + slices·L·log L), L the FFT length.
 *
 * <p><b>Weights.</b> Where the paper uses two-point weights per axis, this engine uses Lagrange weights
 * ({@link LagrangeWeights}): four points in αD² (Gaussians convolve by adding variances) and in γL (Lorentzians
 * convolve by adding widths), six points in position. They reproduce the first four (six) moments exactly, so the
 * errors fall as the fourth power of the log-width steps and the sixth power of the internal step; that keeps the
 * number of slices and the grid refinement small under this engine's strict criterion (the relative error wherever
 * σ ≥ 10⁻⁶·max σ, which reaches deep into Gaussian wings).
 *
 * <p><b>Steps from the tolerance ε.</b> All errors are measured by {@link FastErrorModel} on the Voigt profile.
 * First the internal step: the output step divided by the smallest integer m (at most {@value #MAX_OVERSAMPLING})
 * whose position error e_ν for each family's narrowest widths is within ε/4 (on resolving-power grids the output
 * interpolation costs e_ν again). The width axes share B = 0.8·(ε − position error) − round-off allowance: the
 * Doppler log step is the largest whose error at the family's most Gaussian width ratio is within B/2, the Lorentz
 * log step the largest whose error at the most Lorentzian ratio is within B minus the Doppler axis's actual error.
 *
 * <p><b>Lorentz floor and the Doppler-dominated family.</b> Lorentz widths far below the Doppler width change the
 * Voigt profile (even at the criterion's depth) only through the first, smooth terms of its expansion in γL/αD, so
 * they need no log-spaced nodes of their own; but such lines are the ones whose Doppler axis must be fine (the most
 * Gaussian lines set the Doppler step, since deep Gaussian wings are the hardest to interpolate). So lines with αD &gt; 0
 * are split at γ_s = γ_f·e^δ: those below (pure Doppler included) form the Doppler-dominated family, whose Lorentz
 * axis is one floored stencil {0, γ_f, γ_f·e^δ, γ_f·e^(2δ)} ({@link WidthAxis#floored}: four nodes, whatever the
 * spread of small widths) and whose Doppler axis is fine; those above keep a log-spaced Lorentz axis from γ_s up and
 * a Doppler axis chosen at their most Gaussian ratio γ_s/αD,max, much coarser. δ is the Lorentz log step with half
 * the width budget B at the most Lorentzian ratio; γ_f = r·αD,min is the largest floor (r ≥ {@value #MIN_FLOOR_RATIO})
 * whose measured first-stencil error ({@link FastErrorModel#flooredLorentzError}, at the smallest αD, the worst
 * case) is within B/2; the family's Lorentz error counted in the estimate is that error measured at its own smallest
 * αD. Before, a separate pure-Doppler family existed and the Voigt family's Lorentz axis reached down to its
 * smallest non-zero γL, so lists with air widths from near 0 spent many slices on widths the profile cannot show.
 *
 * <p>{@link #estimatedRelativeError()} is the sum of the measured errors at the chosen steps plus a round-off allowance
 * (64·2⁻⁵²·log₂L/10⁻⁶); it can exceed ε only when m is capped (lines much narrower than the grid spacing).
 *
 * <p><b>Grids.</b> Uniform grids: the internal grid is the output grid refined m times, and σ is read at every
 * m-th point. Resolving-power grids: a uniform internal grid of step (ν₁ − ν₀)/m (the finest output spacing) over
 * the whole range, and σ at the output points by six-point Lagrange interpolation (its error is the same position
 * error, counted twice).
 *
 * <p><b>Wings.</b> Each slice's kernel is the profile truncated exactly as the exact engine truncates a line
 * ({@link WingKernel#addLine}: |Δν| ≤ d, pedestal V(d) subtracted when asked), with d taken at the slice's node
 * widths. Two ways to its transform:
 * <ul>
 * <li><i>Analytic</i> (families with αD &gt; 0, no χ factor, a finite cutoff R that does not depend on the widths —
 * fixed or pressure-scaled — and R ≫ αD: αD ≤ R/{@value #MIN_CUTOFF_OVER_DOPPLER} and the wing model's remainder
 * within ε/100). The transform of the untruncated profile, exp(−π²f²αD²/ln2 − 2πγL|f|) (the paper's), sampled at
 * the DFT frequencies with its aliases summed ({@link AnalyticKernels#voigtTransform}: no FFT), is that of the
 * profile periodised around the buffer. It differs from the truncated kernel by the wings beyond R, their images
 * around the ring and the pedestal box; beyond R ≫ αD the profile is L + (s²/2)·L'' to relative O(s⁴/R⁴)
 * (s² = αD²/(2 ln 2); the asymptotic series of the Faddeeva function), so that difference is c_γ + (s²/2)·d_γ with
 * two kernels that depend on the Lorentz node γ only ({@link AnalyticKernels#correctionKernel}, closed-form
 * periodic sums). The slices sharing a Lorentz node are run one after the other: c_γ and d_γ are transformed once
 * at the node's first slice, and each slice's kernel transform is K_s − Ĉ_γ − (s²/2)·D̂_γ. FFTs per (p, T):
 * slices + 2·(Lorentz nodes with γ &gt; 0) + 1 instead of 2·slices + 1 (the D̂_γ transform is left out where its
 * effect is below {@value #NEGLIGIBLE_CURVATURE} of the line peak, {@link #curvatureBound}, counted in the
 * estimate). The estimate adds the remainder's bound 30·s⁴/R⁴ ({@link AnalyticKernels#wingModelError}, at the
 * largest αD) and the neglected alias tail; the result agrees with the sampled path to about 10⁻⁸ relative
 * (tested).</li>
 * <li><i>Sampled</i> (everything else: χ families, width-dependent cutoffs, no cutoff, αD = 0, R not ≫ αD, or an
 * alias sum that does not converge within {@value AnalyticKernels#MAX_PERIODS} periods): the profile sampled in
 * real space at multiples of h, cut and de-pedestalled, and transformed numerically (one more FFT per slice).</li>
 * </ul>
 * So the result equals the exact engine's
 * truncated lines to within the tolerance, with two documented differences: (1) a line's cutoff edge is spread over
 * its six position nodes, so at points within 3h of a line's cutoff distance the truncation step is blurred (no
 * such points without a cutoff, and only a kink with pedestal removal); (2) for a width-dependent cutoff
 * (multiple of the HWHM) d is the slice's, not the line's. Without a cutoff the kernel spans every line-to-point
 * distance, so wings are untruncated and nothing wraps around. A χ factor (Perrin–Hartmann) is applied, like the
 * exact engine, to the lines the chunk flags ({@link LineChunk#chiFactor}) when the treatment asks for one: those
 * lines form families of their own whose kernels carry χ (it depends on the detuning only, so it is exact in the
 * sampled kernel).
 *
 * <p>Negative values (FFT round-off where no line reaches, a blurred cutoff edge; all far below 10⁻⁶·max σ) are
 * added as zero, since a cross section is never negative; where no line reaches, σ is round-off (about 10⁻¹⁶ of the
 * largest line peak) rather than exactly zero.
 *
 * <p><b>Lines.</b> Families by width kind, each with its own axes: αD &gt; 0 and γ_s ≤ γL &lt; r_L·αD (Voigt);
 * αD &gt; 0 and γL &lt; γ_s (Doppler-dominated, pure Doppler included, floored Lorentz axis); αD &gt; 0 and
 * γL ≥ r_L·αD (Lorentz-dominated, a single Doppler node); αD = 0 (pure Lorentz); each split again by the χ flag.
 * Lines with S = 0 are skipped.
 *
 * <p><b>The Lorentz-dominated family.</b> Where γL ≫ αD the profile depends on αD only through the small terms of
 * its expansion in the Gaussian's moments, V = L + (s²/2)·L'' + …, about (αD/γL)² relative, so such lines need no
 * Doppler axis: one node at the middle of their αD² range, √((αD,min² + αD,max²)/2). r_L is the smallest ratio
 * whose measured error ({@link FastErrorModel#singleDopplerNodeError}, over the αD range of all lines with αD &gt; 0,
 * at γL = r_L·αD) is within half the width budget; the family's Doppler error in the estimate is measured at its
 * own αD range and smallest γL/αD, its Lorentz axis chosen like the Voigt family's. At high pressure nearly every
 * line is in it: one Doppler node instead of six or seven (60 → 16 slices on the 100 atm test set).
 *
 * <p><b>Segments.</b> The convolutions need not run over the whole internal grid at once: it is cut into consecutive
 * segments ({@link SegmentLayout}), each convolved in its own ring of one power-of-two length L, of which a segment
 * owns L − 2K − 8 points (K the kernel reach in internal steps; on resolving-power grids 2·{@value
 * #INTERPOLATION_MARGIN} fewer, the output interpolation stencil's margin). L minimises the estimated FFT time,
 * segments × L × t(L), t the measured time per point, which jumps by half beyond 2²⁰ (cache): 10⁶ points with a
 * 25 cm⁻¹ cutoff at 0.0005 cm⁻¹ take three rings of 2¹⁹ instead of one of 2²¹ (48 % padding). A grid that fits a
 * small ring stays one segment. The plan — m, families, width axes, error estimate — is chosen once from all
 * lines, so the error contract is the same; each segment takes the lines whose position stencil lies within the
 * reach of its points (a line near a boundary goes to both neighbours, with the same weights), the slices non-empty
 * there, one inverse FFT, and σ at the output points it owns. A convolution is local within K, so σ does not depend
 * on the cut up to round-off with sampled kernels; analytic kernels are those of the profile periodised around the
 * ring, so their wing-model remainder (in the estimate) moves with L too (tested: 2×10⁻¹⁴ of max σ at
 * R = 25 cm⁻¹, 4×10⁻¹⁰ at R/αD = 50). The Lorentz nodes' correction transforms depend on L, h, R and γ only: with
 * several segments they are kept for all of them (at most a quarter of the heap), else redone per segment.
 * Plan entries: {@code fast.segments}, {@code fast.segment_fft_length}, {@code fast.segment_points};
 * {@code fast.slices} and {@code fast.ffts} count over all segments, {@code fast.distinct_slices} the width slices
 * used anywhere.
 *
 * <p><b>Threads and determinism.</b> The segment layout depends on the grid and the reach only. Within a segment the
 * non-empty slices are split into {@value #BLOCKS} fixed contiguous blocks;
 * each block sums its slices' spectra in slice order, and the blocks are summed in block order, so σ is bitwise the
 * same for any thread count. The FFT library's own threading is switched off (a process-wide JTransforms setting),
 * because this engine already runs slices in parallel.
 *
 * <p><b>Memory.</b> {@link #accumulate} keeps the lines (33 bytes each); {@link #finish} needs 240 bytes per
 * line for the distribution weights (computed once, for all segments, and copied in stencil order for the segment
 * being convolved, so that spreading reads them front to back) plus ({@value #BLOCKS} + 2·threads + 1)·L
 * doubles (on the analytic path 3·threads: two half-length transforms per thread for the Lorentz node's
 * corrections, plus L/2 for a sin² table), L the segments' ring length (at most m·N + 2K + 8 rounded up to a power
 * of two, N output points, K the cutoff in internal steps; without a cutoff K spans every line-to-point distance).
 * {@link #finish} refuses with an {@link InputException} naming the figures when this exceeds the heap. The shared
 * node corrections (2·(L/2 + 1) doubles per Lorentz node of the analytic families) are kept only when they fit
 * within a quarter of the heap and the total within the heap.
 */
public final class FastEngine implements CrossSectionEngine {

    /** The engine id. */
    public static final String ID = "fast";
    /** Default tolerance: 10⁻³ relative wherever σ ≥ 10⁻⁶·max σ. */
    public static final double DEFAULT_TOLERANCE = 1e-3;
    /** Fixed number of slice blocks (independent of the thread count, for bitwise identical sums). */
    static final int BLOCKS = 8;
    /** Largest internal refinement of the output step. */
    static final int MAX_OVERSAMPLING = 32;
    /** Smallest ratio of a table block's transform length to its padding on both sides. */
    static final double BLOCK_TRANSFORM_FACTOR = 2.5;
    /** Largest number of slices accepted (beyond it the exact engine is the better tool). */
    static final int MAX_SLICES = 20_000;
    /** Largest FFT length accepted. */
    static final int MAX_FFT_LENGTH = 1 << 29;

    /**
     * Working memory per line in {@link #finish}: stencil indices and weights (6 + 4 + 4 doubles, 3 ints), and their
     * copy in stencil order for the segment being convolved (at most every line: 14 doubles, 1 int).
     */
    static final int BYTES_PER_LINE = 28 * Double.BYTES + 4 * Integer.BYTES;
    /** Bounds of the log-width steps searched. */
    static final double MIN_LOG_STEP = 1e-3;
    static final double MAX_LOG_STEP = 2.0;

    /** Round-off allowance 64·2⁻⁵²·log₂L/10⁻⁶ at the largest L accepted. */
    private static final double ROUND_OFF_ALLOWANCE = 64 * 0x1.0p-52 * 29 / FastErrorModel.DEPTH;
    /**
     * Internal points kept each side of a segment on resolving-power grids: the output interpolation stencil
     * reaches 2 points below and 3 above an output point's lower neighbour.
     */
    static final int INTERPOLATION_MARGIN = 3;
    /** Points of the position stencil, and how many of them lie below the line's lower neighbour. */
    private static final int P = FastErrorModel.POSITION_POINTS;
    private static final int SHIFT = P / 2 - 1;
    private static final int BOTH = 0;
    private static final int DOPPLER_DOMINATED = 1;
    private static final int LORENTZ_ONLY = 2;
    private static final int LORENTZ_DOMINATED = 3;
    /** Width kinds; a family index is a kind, plus this for lines with the χ factor. */
    private static final int KINDS = 4;
    private static final String[] FAMILY_NAMES = {"voigt", "doppler", "lorentz", "lorentz-dominated"};
    /** Fewest Doppler nodes per Lorentz node for which the analytic path saves FFTs. */
    static final int MIN_DOPPLER_NODES_SHARING = 3;
    /** Largest γL/αD searched for the Lorentz-dominated family's lower bound. */
    static final double MAX_SPLIT_RATIO = 1e6;
    /** Smallest Lorentz floor searched, relative to the smallest Doppler HWHM. */
    static final double MIN_FLOOR_RATIO = 1e-9;
    /**
     * Curvature corrections whose effect is below this fraction of a line's peak are left out: far below the
     * transforms' round-off (64·2⁻⁵²·log₂L ≈ 3×10⁻¹³ of the peak) and 10⁻⁷ relative at the criterion's depth.
     */
    static final double NEGLIGIBLE_CURVATURE = 1e-13;
    /** Smallest cutoff, in Doppler HWHM, for the analytic kernel path (its wing model needs R ≫ αD). */
    static final double MIN_CUTOFF_OVER_DOPPLER = 10;
    /** Families: four width kinds, each without and with the χ factor. */
    private static final int FAMILIES = 2 * KINDS;

    private final int threads;
    private final WingTreatment wings;
    private final double tolerance;
    private final boolean analyticKernels;
    private final ExecutorService pool;

    private WavenumberGrid grid;
    private WingKernel wingKernel;
    /** The same treatment without χ, for lines not flagged for it; {@code wingKernel} itself when χ is off. */
    private WingKernel plainKernel;
    private double[] centerCm1 = new double[0];
    private double[] strength = new double[0];
    private double[] dopplerCm1 = new double[0];
    private double[] lorentzCm1 = new double[0];
    private boolean[] chi = new boolean[0];
    private int count;
    /** Lines with αD &gt; 0 and γL below this go to the Doppler-dominated family (0: none). */
    private double lowSplitCm1;
    /** That family's Lorentz floor γ_f and log step δ. */
    private double lowFloorCm1;
    private double lowLogStep;
    /** Lines with αD &gt; 0 and γL/αD at least this go to the Lorentz-dominated family (infinite: none). */
    private double highSplitRatio = Double.POSITIVE_INFINITY;
    private double estimate;
    /** sin²(πn/L) table of the last FFT length on the analytic path. */
    private double[] sinSquared;
    private final Map<String, String> plan = new LinkedHashMap<>();
    /** Ring length imposed on the segment layout (a power of two), 0 to choose it from the cost model. */
    private int forcedRingLength;

    /**
     * @param threads   worker threads, at least 1
     * @param wings     wing treatment (cutoff, pedestal and χ factor as in the exact engine)
     * @param tolerance relative tolerance where σ ≥ 10⁻⁶·max σ, in (0, 0.1]
     * @throws InputException for a tolerance out of range
     */
    public FastEngine(int threads, WingTreatment wings, double tolerance) {
        this(threads, wings, tolerance, true);
    }

    /**
     * @param threads          worker threads, at least 1
     * @param wings            wing treatment
     * @param tolerance        relative tolerance, in (0, 0.1]
     * @param analyticKernels  whether slices may take the closed-form kernel transforms (false: every kernel sampled
     *                         and transformed numerically, the reference for tests and benchmarks)
     */
    FastEngine(int threads, WingTreatment wings, double tolerance, boolean analyticKernels) {
        if (threads < 1) {
            throw new IllegalArgumentException("threads must be at least 1, got " + threads);
        }
        if (!(tolerance > 0 && tolerance <= 0.1)) {
            throw new InputException("fast engine tolerance: " + tolerance + " (expected a number in (0, 0.1])");
        }
        this.threads = threads;
        this.wings = wings;
        this.tolerance = tolerance;
        this.analyticKernels = analyticKernels;
        // slices already run in parallel here; the FFT's own threads would only compete (and are process-wide)
        ConcurrencyUtils.setNumberOfThreads(1);
        this.pool = Executors.newFixedThreadPool(threads, r -> {
            Thread t = new Thread(r, "fast-engine");
            t.setDaemon(true);
            return t;
        });
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
    public void begin(WavenumberGrid newGrid, double pressureAtm, double temperatureK) {
        this.grid = newGrid;
        this.wingKernel = wings.atConditions(pressureAtm, temperatureK);
        this.plainKernel = wings.chiFactor() == ChiFactorKind.NONE ? wingKernel
                : wings.withChiFactor(ChiFactorKind.NONE).atConditions(pressureAtm, temperatureK);
        this.count = 0;
        this.estimate = 0;
        plan.clear();
    }

    @Override
    public void accumulate(LineChunk chunk, double[] sigmaCm2PerMolecule) {
        if (grid == null) {
            throw new IllegalStateException("accumulate before begin");
        }
        ensureCapacity(count + chunk.size);
        for (int i = 0; i < chunk.size; i++) {
            double s = chunk.intensityCmPerMolecule[i];
            double a = chunk.dopplerHwhmCm1[i];
            double g = chunk.lorentzHwhmCm1[i];
            double c = chunk.centerCm1[i];
            if (!(a >= 0) || !(g >= 0) || Double.isInfinite(a) || Double.isInfinite(g) || (a == 0 && g == 0)
                    || !Double.isFinite(s) || !Double.isFinite(c)) {
                throw new IllegalArgumentException("fast engine: line at " + c + " cm-1 with S=" + s + ", alphaD=" + a
                        + ", gammaL=" + g + " (expected finite values and widths not both zero)");
            }
            if (s == 0) {
                continue;
            }
            centerCm1[count] = c;
            strength[count] = s;
            dopplerCm1[count] = a;
            lorentzCm1[count] = g;
            chi[count] = chunk.chiFactor[i] && wingKernel != plainKernel;
            count++;
        }
    }

    private void ensureCapacity(int needed) {
        if (needed <= centerCm1.length) {
            return;
        }
        int capacity = Math.max(needed, Math.max(1 << 12, 2 * centerCm1.length));
        centerCm1 = Arrays.copyOf(centerCm1, capacity);
        strength = Arrays.copyOf(strength, capacity);
        dopplerCm1 = Arrays.copyOf(dopplerCm1, capacity);
        lorentzCm1 = Arrays.copyOf(lorentzCm1, capacity);
        chi = Arrays.copyOf(chi, capacity);
    }

    /** Widths and axes of one family of lines. */
    private static final class Family {
        double alphaMin = Double.POSITIVE_INFINITY;
        double alphaMax = 0;
        double gammaMin = Double.POSITIVE_INFINITY;
        double gammaMax = 0;
        int lines;
        WidthAxis doppler;
        WidthAxis lorentz;
        /** Cutoff, pedestal and (for the χ families) χ factor of this family's lines. */
        WingKernel kernel;
        double dopplerError;
        double lorentzError;
        /** The floored Lorentz axis's first non-zero node, 0 when the axis is not floored. */
        double lorentzFloorCm1;
        int firstSlice;
        /** Smallest γL/αD of the family's lines (+∞ for pure Lorentz lines). */
        double minLorentzOverDoppler = Double.POSITIVE_INFINITY;
        /** Whether this family's slices take the analytic kernel transform with wing correction. */
        boolean analytic;
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
        describeStatic(plan);
        if (count == 0) {
            estimate = 0;
            plan.put("fast.lines", "0");
            return;
        }
        // first all lines with αD > 0 in one family, to choose the internal step and the split
        lowSplitCm1 = 0;
        highSplitRatio = Double.POSITIVE_INFINITY;
        Family[] families = gatherFamilies();

        // internal uniform grid: the position error gets a quarter of the tolerance (twice on resolving-power grids,
        // where the output interpolation costs the same again)
        boolean uniform = grid.spacing() == WavenumberGrid.Spacing.UNIFORM;
        double[] points = grid.pointsCm1();
        int n = points.length;
        double outputStep = uniform ? grid.stepCm1()
                : (n >= 2 ? points[1] - points[0] : points[0] / grid.resolvingPower());
        int m = chooseOversampling(families, outputStep, tolerance / 4);
        double h = outputStep / m;
        double widthBudget = widthBudget(families, h, uniform);
        // Doppler-dominated lines (γL below the split, pure Doppler included) form a family of their own with a
        // floored Lorentz axis; the others keep a log-spaced Lorentz axis that starts at the split
        chooseLorentzSplit(families[BOTH], families[BOTH + KINDS], widthBudget);
        // Lorentz-dominated lines (γL/αD above a ratio) form a family with a single Doppler node
        chooseDopplerSplit(families[BOTH], families[BOTH + KINDS], widthBudget);
        families = gatherFamilies();
        double positionError = 0;
        for (Family f : families) {
            if (f != null) {
                positionError = Math.max(positionError, FastErrorModel.Planner.position(h, f.alphaMin, f.gammaMin));
            }
        }
        double positionTotal = uniform ? positionError : 2 * positionError;
        // the width axes share what is left, with a margin of 20 % for the sampled maxima and round-off
        // (at least a tenth of the tolerance, should the position error alone exceed it: m capped)
        planAxes(families, widthBudget(families, h, uniform));
        // resolving-power grids: a margin of 3 internal points each side for the output interpolation stencil
        double origin = uniform ? points[0] : points[0] - 3 * h;
        long internalPoints = uniform ? (long) (n - 1) * m + 1
                : (long) Math.ceil((points[n - 1] - points[0]) / h) + 7;

        // kernel half-length K: the cutoff, or every line-to-point distance without one
        double lineMin = Double.POSITIVE_INFINITY;
        double lineMax = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < count; i++) {
            lineMin = Math.min(lineMin, centerCm1[i]);
            lineMax = Math.max(lineMax, centerCm1[i]);
        }
        double internalEnd = origin + (internalPoints - 1) * h;
        long maxReach = (long) Math.ceil(Math.max(Math.max(internalEnd - lineMin, lineMax - origin), 0) / h) + 4;
        List<double[]> sliceWidths = new ArrayList<>();
        for (Family f : families) {
            if (f == null) {
                continue;
            }
            f.firstSlice = sliceWidths.size();
            for (int ig = 0; ig < f.doppler.size(); ig++) {
                for (int il = 0; il < f.lorentz.size(); il++) {
                    sliceWidths.add(new double[] {f.doppler.widthCm1(ig), f.lorentz.widthCm1(il)});
                }
            }
        }
        if (sliceWidths.size() > MAX_SLICES) {
            throw new InputException("fast engine: the line widths need " + sliceWidths.size() + " width slices at "
                    + "tolerance " + tolerance + " (at most " + MAX_SLICES + "; loosen the tolerance or use the exact engine)");
        }
        int slices = sliceWidths.size();
        int[] sliceReach = new int[slices];
        long reach = 0;
        for (int s = 0; s < slices; s++) {
            double d = wingKernel.cutoffCm1(sliceWidths.get(s)[0], sliceWidths.get(s)[1]);
            long k = Double.isInfinite(d) ? maxReach : Math.min(maxReach, (long) Math.floor(d / h) + 1);
            sliceReach[s] = (int) Math.min(k, MAX_FFT_LENGTH);
            reach = Math.max(reach, k);
        }
        // segments of the internal grid, each in its own ring: a segment owning U points needs U + pad ring points
        // (the reach both sides, guard points and, on resolving-power grids, the interpolation stencil's margin)
        int margin = uniform ? 0 : INTERPOLATION_MARGIN;
        long pad = 2 * reach + 8 + 2L * margin;
        if (pad + 1 > MAX_FFT_LENGTH) {
            throw new InputException("fast engine: an FFT of " + (pad + 1) + " points would be needed (grid of " + n
                    + " points refined " + m + " times, wing reach " + reach + " steps; at most " + MAX_FFT_LENGTH
                    + "; use a cutoff, a smaller range or the exact engine)");
        }
        if (internalPoints + 2 * pad >= Integer.MAX_VALUE) {
            throw new InputException("fast engine: an internal grid of " + internalPoints + " points (grid of " + n
                    + " points refined " + m + " times) is beyond the engine's index range; use a smaller range or "
                    + "the exact engine");
        }
        SegmentLayout layout = SegmentLayout.choose(internalPoints, pad, MAX_FFT_LENGTH, forcedRingLength);
        int fftLength = layout.ringLength();
        int segments = layout.segments();
        int offset = (int) reach + 4;
        // refuse up front, with the figures, rather than fail half-way for want of heap
        double analyticCutoff = analyticCutoffCm1();
        double wingError = 0;
        boolean anyAnalytic = false;
        int correctionNodes = 0;
        for (int kind : new int[] {BOTH, DOPPLER_DOMINATED, LORENTZ_DOMINATED}) {
            Family f = families[kind];
            if (f != null && isAnalytic(f, analyticCutoff)) {
                f.analytic = true;
                anyAnalytic = true;
                correctionNodes += f.lorentz.size();
                wingError = Math.max(wingError, AnalyticKernels.wingModelError(f.alphaMax, analyticCutoff));
            }
        }
        // per thread: lines, kernel and, on the analytic path, two half-length node corrections; the sin² table
        long perThread = anyAnalytic ? 3 : 2;
        long bytes = ((long) Math.min(BLOCKS, slices) + perThread * threads + 1) * fftLength * Double.BYTES
                + (anyAnalytic ? (long) (fftLength / 2 + 1) * Double.BYTES : 0)
                + (long) count * BYTES_PER_LINE;
        long heap = Runtime.getRuntime().maxMemory();
        if (bytes > heap) {
            throw new InputException("fast engine: about " + bytes / (1 << 20) + " MB needed (FFT length " + fftLength
                    + ", " + count + " lines) but the heap allows " + heap / (1 << 20)
                    + " MB; use a cutoff, a smaller range, fewer threads, a larger -Xmx or the exact engine");
        }
        // the node corrections' transforms depend on the ring length, step, cutoff and γ only: with several
        // segments they are kept for all segments when that fits (at most a quarter of the heap), else redone
        long cacheBytes = 2L * correctionNodes * (fftLength / 2 + 1) * Double.BYTES;
        CorrectionCache cache = segments > 1 && correctionNodes > 0 && cacheBytes <= heap / 4
                && bytes + cacheBytes <= heap ? new CorrectionCache() : null;

        // distribution weights, line by line, once; which lines each segment takes, per segment
        Distribution dist = distribute(families, origin, h, -offset - margin,
                layout.start(segments - 1) - margin - offset + fftLength - P);
        double[] sinSquared = anyAnalytic ? sinSquaredTable(fftLength) : null;
        Convolution totals = new Convolution();
        DoubleFFT_1D fft = new DoubleFFT_1D(fftLength);
        // the blocks' spectra and the threads' scratch, reused by every segment
        double[][] spectra = new double[BLOCKS][];
        ConcurrentLinkedQueue<double[][]> scratch = new ConcurrentLinkedQueue<>();
        double[] w = uniform ? null : new double[P];
        int nextOutput = 0;
        long distinctSlices = 0;
        boolean[] sliceUsed = new boolean[slices];
        for (int seg = 0; seg < segments; seg++) {
            long ownedFrom = layout.start(seg);
            long ownedTo = layout.end(seg);
            // ring index r holds internal point ringStart + r − offset
            long ringStart = ownedFrom - margin;
            dist.bucket(ringStart - offset, ringStart - offset + fftLength - P, (int) (offset - ringStart));

            // slices in fixed blocks, spectra summed in a fixed order
            Convolution conv = convolveSlices(families, sliceWidths, sliceReach, dist, h, fft, fftLength,
                    analyticCutoff, sinSquared, cache, sliceUsed, spectra, scratch);
            totals.add(conv);
            if (conv.slices == 0) {
                // no line reaches this segment: σ gets nothing here
                nextOutput = skipOutputs(points, origin, h, m, uniform, nextOutput, ownedTo, seg == segments - 1);
                continue;
            }
            double[][] blockSpectra = conv.spectra;
            double[] total = blockSpectra[0];
            for (int b = 1; b < blockSpectra.length; b++) {
                double[] add = blockSpectra[b];
                for (int i = 0; i < fftLength; i++) {
                    total[i] += add[i];
                }
                blockSpectra[b] = null;
            }
            fft.realInverse(total, true);
            totals.ffts++;

            // values below zero can only be FFT round-off or the blurred cutoff edge, far below the criterion's
            // 10⁻⁶·max σ: a cross section is never negative, so they are added as zero
            if (uniform) {
                // output point k is internal point k·m; this segment's are those in [ownedFrom, ownedTo)
                int to = (int) Math.min(n, (ownedTo - 1) / m + 1);
                for (int k = nextOutput; k < to; k++) {
                    sigmaCm2PerMolecule[k] += Math.max(0.0, total[(int) ((long) k * m - ringStart) + offset]);
                }
                nextOutput = Math.max(nextOutput, to);
            } else {
                // an output point belongs to the segment owning its lower neighbour k0; its stencil
                // k0 − 2 … k0 + 3 lies within the margin
                int k = nextOutput;
                for (; k < n; k++) {
                    double pos = (points[k] - origin) / h;
                    int k0 = (int) Math.floor(pos);
                    if (k0 >= ownedTo && seg < segments - 1) {
                        break;
                    }
                    LagrangeWeights.centred(P, pos - k0, w, 0);
                    int base = (int) (k0 - SHIFT - ringStart) + offset;
                    double value = 0;
                    for (int j = 0; j < P; j++) {
                        value += w[j] * total[base + j];
                    }
                    sigmaCm2PerMolecule[k] += Math.max(0.0, value);
                }
                nextOutput = k;
            }
        }
        for (boolean used : sliceUsed) {
            distinctSlices += used ? 1 : 0;
        }
        double widthError = 0;
        for (Family f : families) {
            if (f != null) {
                widthError = Math.max(widthError, f.dopplerError + f.lorentzError);
            }
        }
        double roundOff = 64 * Math.ulp(1.0) * (Math.log(fftLength) / Math.log(2)) / FastErrorModel.DEPTH;
        // the analytic path: the wing model's remainder and the alias tail left out of the transforms
        double analyticError = totals.analyticSlices > 0
                ? wingError + totals.aliasError + totals.curvatureError : 0;
        estimate = widthError + positionTotal + roundOff + analyticError;

        plan.put("fast.lines", Integer.toString(count));
        plan.put("fast.oversampling", Integer.toString(m));
        plan.put("fast.internal_step_cm1", Double.toString(h));
        plan.put("fast.internal_points", Long.toString(internalPoints));
        plan.put("fast.segments", Integer.toString(segments));
        plan.put("fast.segment_fft_length", Integer.toString(fftLength));
        plan.put("fast.segment_points", Long.toString(layout.end(0) - layout.start(0)));
        // kept for readers of the one-ring plan: the length of every FFT done
        plan.put("fast.fft_length", Integer.toString(fftLength));
        // slice convolutions summed over the segments, and distinct width slices used anywhere
        plan.put("fast.slices", Integer.toString(totals.slices));
        plan.put("fast.distinct_slices", Long.toString(distinctSlices));
        plan.put("fast.analytic_slices", Integer.toString(totals.analyticSlices));
        plan.put("fast.correction_kernels", Integer.toString(totals.corrections));
        plan.put("fast.correction_kernels_shared", Boolean.toString(cache != null));
        plan.put("fast.ffts", Integer.toString(totals.ffts));
        if (totals.analyticSlices > 0) {
            plan.put("fast.analytic_cutoff_cm1", Double.toString(analyticCutoff));
            plan.put("fast.wing_model_error", String.format(Locale.ROOT, "%.3e", wingError));
            plan.put("fast.alias_error", String.format(Locale.ROOT, "%.3e", totals.aliasError));
            plan.put("fast.omitted_curvature_error", String.format(Locale.ROOT, "%.3e", totals.curvatureError));
        }
        for (int fi = 0; fi < families.length; fi++) {
            Family f = families[fi];
            if (f != null) {
                String key = "fast.family." + FAMILY_NAMES[fi % KINDS] + (fi >= KINDS ? "-chi" : "");
                plan.put(key + ".lines", Integer.toString(f.lines));
                plan.put(key + ".doppler_nodes", Integer.toString(f.doppler.size()));
                plan.put(key + ".doppler_log_step", Double.toString(f.doppler.logStep()));
                plan.put(key + ".lorentz_nodes", Integer.toString(f.lorentz.size()));
                plan.put(key + ".lorentz_log_step", Double.toString(f.lorentz.logStep()));
                plan.put(key + ".lorentz_floor_cm1", Double.toString(f.lorentzFloorCm1));
                plan.put(key + ".kernel", f.analytic ? "analytic" : "sampled");
            }
        }
        plan.put("fast.estimated_relative_error", String.format(Locale.ROOT, "%.3e", estimate));
    }

    private Family[] gatherFamilies() {
        Family[] families = new Family[FAMILIES];
        for (int i = 0; i < count; i++) {
            int kind = familyOf(i);
            Family f = families[kind];
            if (f == null) {
                f = new Family();
                f.kernel = kind >= KINDS ? wingKernel : plainKernel;
                families[kind] = f;
            }
            f.lines++;
            f.alphaMin = Math.min(f.alphaMin, dopplerCm1[i]);
            f.alphaMax = Math.max(f.alphaMax, dopplerCm1[i]);
            f.gammaMin = Math.min(f.gammaMin, lorentzCm1[i]);
            f.gammaMax = Math.max(f.gammaMax, lorentzCm1[i]);
            if (dopplerCm1[i] > 0) {
                f.minLorentzOverDoppler = Math.min(f.minLorentzOverDoppler, lorentzCm1[i] / dopplerCm1[i]);
            }
        }
        return families;
    }

    /**
     * The width axes' share B = 0.8·(ε − position error) − round-off allowance, at least ε/10 (should the position
     * error alone exceed ε: m capped); the position error counted twice on resolving-power grids.
     */
    private double widthBudget(Family[] families, double h, boolean uniform) {
        double positionError = 0;
        for (Family f : families) {
            if (f != null) {
                positionError = Math.max(positionError, FastErrorModel.Planner.position(h, f.alphaMin, f.gammaMin));
            }
        }
        double positionTotal = uniform ? positionError : 2 * positionError;
        return Math.max(0.1 * tolerance, 0.8 * (tolerance - positionTotal) - ROUND_OFF_ALLOWANCE);
    }

    /**
     * Sets the Lorentz floor γ_f and the split γ_f·e^δ between the Doppler-dominated family and the Voigt family,
     * from the lines with αD &gt; 0 (both χ kinds): δ is the log step the Voigt family's Lorentz axis would take with
     * half the width budget (the Doppler axis takes at most the other half, so the Lorentz axis never gets less),
     * γ_f the largest floor whose first stencil keeps within that half ({@link #lorentzFloorCm1}). No split when
     * every such line has γL = 0, or none has γL below the split.
     */
    private void chooseLorentzSplit(Family plain, Family withChi, double budget) {
        lowSplitCm1 = 0;
        lowFloorCm1 = 0;
        lowLogStep = 0;
        double alphaMin = Double.POSITIVE_INFINITY;
        double gammaMin = Double.POSITIVE_INFINITY;
        double gammaMax = 0;
        for (Family f : new Family[] {plain, withChi}) {
            if (f != null) {
                alphaMin = Math.min(alphaMin, f.alphaMin);
                gammaMin = Math.min(gammaMin, f.gammaMin);
                gammaMax = Math.max(gammaMax, f.gammaMax);
            }
        }
        if (!(gammaMax > 0)) {
            return;
        }
        double ratio = alphaMin / gammaMax;
        double step = FastErrorModel.Planner.lorentzStep(ratio, budget / 2, MIN_LOG_STEP, MAX_LOG_STEP);
        double floorCm1 = lorentzFloorCm1(alphaMin, step, budget / 2);
        double split = floorCm1 * Math.exp(step);
        if (gammaMin < split) {
            lowSplitCm1 = split;
            lowFloorCm1 = floorCm1;
            lowLogStep = step;
        }
    }

    /**
     * Sets the ratio γL/αD from which lines with αD &gt; 0 form the Lorentz-dominated family, whose Doppler axis is a
     * single node: the smallest ratio r ≤ {@value #MAX_SPLIT_RATIO} at which one node for the whole αD range of
     * those lines (both χ kinds) keeps the error within half the width budget
     * ({@link FastErrorModel#singleDopplerNodeError}; the Voigt profile depends on αD less and less as γL/αD
     * grows, about as (αD/γL)²). None when no such ratio exists or no line reaches it.
     */
    private void chooseDopplerSplit(Family plain, Family withChi, double budget) {
        highSplitRatio = Double.POSITIVE_INFINITY;
        double alphaMin = Double.POSITIVE_INFINITY;
        double alphaMax = 0;
        double gammaMax = 0;
        for (Family f : new Family[] {plain, withChi}) {
            if (f != null) {
                alphaMin = Math.min(alphaMin, f.alphaMin);
                alphaMax = Math.max(alphaMax, f.alphaMax);
                gammaMax = Math.max(gammaMax, f.gammaMax);
            }
        }
        if (!(alphaMax > 0) || !(gammaMax > 0)) {
            return;
        }
        double lo = alphaMin;
        double hi = alphaMax;
        // error grows with 1/r: the smallest r (largest 1/r) within half the budget
        double ratio = FastErrorModel.Planner.singleNodeSplitRatio(lo, hi, budget / 2, 1 / MAX_SPLIT_RATIO, 1.0);
        if (ratio < Double.POSITIVE_INFINITY && gammaMax >= ratio * alphaMin) {
            highSplitRatio = ratio;
        }
    }

    /** Chooses each family's width axes: the Doppler axis gets half the budget, the Lorentz axis the rest. */
    private void planAxes(Family[] families, double budget) {
        for (int family = 0; family < FAMILIES; family++) {
            Family f = families[family];
            if (f == null) {
                continue;
            }
            int kind = family % KINDS;
            if (kind == LORENTZ_ONLY) {
                f.doppler = WidthAxis.exact(0.0);
            } else if (kind == LORENTZ_DOMINATED) {
                // one Doppler node, in the middle of the family's αD² range; error measured at its smallest γL/αD
                f.doppler = WidthAxis.exact(FastErrorModel.singleDopplerNode(f.alphaMin, f.alphaMax));
                f.dopplerError = FastErrorModel.Planner.singleNodeError(f.alphaMin, f.alphaMax, f.minLorentzOverDoppler);
            } else {
                // worst case for the Doppler axis: the most Gaussian line, smallest γL/αD
                double ratio = f.gammaMin / f.alphaMax;
                double step = FastErrorModel.Planner.dopplerStep(ratio, budget / 2, MIN_LOG_STEP, MAX_LOG_STEP);
                f.doppler = WidthAxis.geometric(f.alphaMin, f.alphaMax, step, 2);
                f.dopplerError = f.doppler.stencilSize() == 1 ? 0
                        : FastErrorModel.Planner.dopplerError(f.doppler.logStep(), ratio);
            }
            if (f.gammaMax == 0) {
                f.lorentz = WidthAxis.exact(0.0);
            } else if (kind == DOPPLER_DOMINATED) {
                // 0 ≤ γL < γ_f·e^δ: one floored stencil {0, γ_f, γ_f·e^δ, γ_f·e^(2δ)}, its error measured at the
                // family's own smallest αD (the floor was chosen at the smallest αD of all, within half the budget)
                f.lorentz = WidthAxis.floored(lowFloorCm1, f.gammaMax, lowLogStep);
                f.lorentzFloorCm1 = lowFloorCm1;
                f.lorentzError = FastErrorModel.Planner.floorError(f.lorentz.logStep(), f.alphaMin / lowFloorCm1);
            } else {
                // worst case for the Lorentz axis: the most Lorentzian line, smallest αD/γL
                double ratio = f.alphaMin / f.gammaMax;
                double lorentzBudget = budget - f.dopplerError;
                double step = FastErrorModel.Planner.lorentzStep(ratio, lorentzBudget, MIN_LOG_STEP, MAX_LOG_STEP);
                f.lorentz = WidthAxis.geometric(f.gammaMin, f.gammaMax, step, 1);
                f.lorentzError = f.lorentz.stencilSize() == 1 ? 0
                        : FastErrorModel.Planner.lorentzError(f.lorentz.logStep(), ratio);
            }
        }
    }

    /**
     * The Lorentz floor γ_f of a family whose narrowest Doppler HWHM is {@code alphaMinCm1}: the largest
     * γ_f = r·αD,min, r ∈ [{@value #MIN_FLOOR_RATIO}, 1], whose floored first stencil (nodes 0, γ_f, γ_f·e^δ,
     * γ_f·e^(2δ)) keeps the profile error within {@code budget} ({@link FastErrorModel#flooredLorentzError}, measured
     * at the smallest αD, the worst case). Below it a line's Lorentz width needs no nodes of its own: its effect on
     * the Voigt profile, to the criterion's depth, is interpolated from the zero node and the floor's nodes.
     */
    static double lorentzFloorCm1(double alphaMinCm1, double logStep, double budget) {
        double r = FastErrorModel.Planner.floorRatio(logStep, budget, MIN_FLOOR_RATIO, 1.0);
        return r * alphaMinCm1;
    }

    /**
     * Width kind (Voigt, Doppler-dominated, pure Lorentz, Lorentz-dominated), plus {@value #KINDS} for lines with
     * the χ factor.
     */
    private int familyOf(int line) {
        // Doppler-dominated lines (pure Doppler included) below the split get the floored Lorentz axis
        double a = dopplerCm1[line];
        double g = lorentzCm1[line];
        int kind = a == 0 ? LORENTZ_ONLY
                : (g < lowSplitCm1 ? DOPPLER_DOMINATED : (g >= highSplitRatio * a ? LORENTZ_DOMINATED : BOTH));
        return chi[line] ? kind + KINDS : kind;
    }

    /** Smallest m ≤ {@link #MAX_OVERSAMPLING} whose position error is within the share for every family. */
    private static int chooseOversampling(Family[] families, double outputStep, double share) {
        int m = 1;
        while (true) {
            double worst = 0;
            for (Family f : families) {
                if (f != null) {
                    worst = Math.max(worst, FastErrorModel.Planner.position(outputStep / m, f.alphaMin, f.gammaMin));
                }
            }
            if (worst <= share || m >= MAX_OVERSAMPLING) {
                return m;
            }
            // the error falls about as h⁴: jump close to the answer, then step by one
            int guess = (int) Math.ceil(m * Math.pow(worst / share, 0.25));
            m = Math.min(MAX_OVERSAMPLING, Math.max(m + 1, guess - 1));
        }
    }

    /**
     * Per-line stencils and weights (computed once for all segments), and the current segment's lines ordered by
     * their (family, Doppler, Lorentz) stencil.
     */
    private static final class Distribution {
        /** Stencil key of each line, −1 for a line outside every ring. */
        int[] key;
        /** Internal grid index of each line's first position node. */
        int[] firstPoint;
        double[] positionWeights;
        double[] dopplerWeights;
        double[] lorentzWeights;
        /** The current segment's lines: bucketStart[key] .. bucketStart[key+1] of stencil key in {@link #order}. */
        int[] order;
        int[] bucketStart;
        /** Ring index of internal point j in the current segment: j + shift. */
        int shift;
        /**
         * The current segment's lines' weights and first nodes copied into {@link #order}'s order, so that spreading
         * a slice reads them front to back (by line index they are scattered across the arrays: a cache miss per
         * line and slice).
         */
        double[] orderedPositionWeights;
        double[] orderedDopplerWeights;
        double[] orderedLorentzWeights;
        int[] orderedFirstPoint;

        /**
         * Orders the lines whose first position node lies in [lo, hi] (internal indices: their whole stencil then
         * lies in the segment's ring) by stencil key, in line order within a key.
         */
        void bucket(long lo, long hi, int ringShift) {
            int keys = bucketStart.length - 1;
            Arrays.fill(bucketStart, 0);
            int n = key.length;
            for (int i = 0; i < n; i++) {
                int p = firstPoint[i];
                if (key[i] >= 0 && p >= lo && p <= hi) {
                    bucketStart[key[i] + 1]++;
                }
            }
            for (int k = 0; k < keys; k++) {
                bucketStart[k + 1] += bucketStart[k];
            }
            int[] fill = Arrays.copyOf(bucketStart, keys);
            for (int i = 0; i < n; i++) {
                int p = firstPoint[i];
                if (key[i] >= 0 && p >= lo && p <= hi) {
                    order[fill[key[i]]++] = i;
                }
            }
            int m = bucketStart[keys];
            if (orderedFirstPoint == null || orderedFirstPoint.length < m) {
                orderedPositionWeights = new double[P * m];
                orderedDopplerWeights = new double[4 * m];
                orderedLorentzWeights = new double[4 * m];
                orderedFirstPoint = new int[m];
            }
            for (int q = 0; q < m; q++) {
                int i = order[q];
                System.arraycopy(positionWeights, P * i, orderedPositionWeights, P * q, P);
                System.arraycopy(dopplerWeights, 4 * i, orderedDopplerWeights, 4 * q, 4);
                System.arraycopy(lorentzWeights, 4 * i, orderedLorentzWeights, 4 * q, 4);
                orderedFirstPoint[q] = firstPoint[i];
            }
            shift = ringShift;
        }
    }

    /**
     * Position, Doppler and Lorentz weights of every line; lines whose first position node lies outside
     * [lo, hi] (internal indices) are in no ring: they lie farther than the kernel reach from every point.
     */
    private Distribution distribute(Family[] families, double origin, double h, long lo, long hi) {
        int[] firstPoint = new int[count];
        int[] key = new int[count];
        double[] pw = new double[P * count];
        double[] gw = new double[4 * count];
        double[] lw = new double[4 * count];
        int keys = 0;
        int[] familyKeyBase = new int[FAMILIES];
        for (int kind = 0; kind < FAMILIES; kind++) {
            familyKeyBase[kind] = keys;
            if (families[kind] != null) {
                keys += families[kind].doppler.size() * families[kind].lorentz.size();
            }
        }
        for (int i = 0; i < count; i++) {
            double pos = (centerCm1[i] - origin) / h;
            double floor = Math.floor(pos);
            // compared as doubles: a line far off the grid may lie beyond the int range
            if (floor - SHIFT < lo || floor - SHIFT > hi) {
                key[i] = -1;
                continue;
            }
            int k0 = (int) floor;
            LagrangeWeights.centred(P, pos - floor, pw, P * i);
            for (int j = 0; j < P; j++) {
                pw[P * i + j] *= strength[i];
            }
            firstPoint[i] = k0 - SHIFT;
            int kind = familyOf(i);
            Family f = families[kind];
            int jg = f.doppler.stencil(dopplerCm1[i], gw, 4 * i);
            int jl = f.lorentz.stencil(lorentzCm1[i], lw, 4 * i);
            key[i] = familyKeyBase[kind] + jg * f.lorentz.size() + jl;
        }
        Distribution d = new Distribution();
        d.key = key;
        d.firstPoint = firstPoint;
        d.positionWeights = pw;
        d.dopplerWeights = gw;
        d.lorentzWeights = lw;
        d.order = new int[count];
        d.bucketStart = new int[keys + 1];
        return d;
    }

    /** One slice to convolve: its node indices and where its lines are. */
    private static final class Slice {
        final Family family;
        final int familyKeyBase;
        final int dopplerNode;
        final int lorentzNode;
        final double dopplerCm1;
        final double lorentzCm1;
        final int reach;
        /**
         * Wing-correction group (one per Lorentz node of an analytic family, in work order), or −1: slices of the
         * same group are contiguous in the work list and share one correction.
         */
        final int group;

        Slice(Family family, int familyKeyBase, int dopplerNode, int lorentzNode, double[] widths, int reach,
              int group) {
            this.family = family;
            this.familyKeyBase = familyKeyBase;
            this.dopplerNode = dopplerNode;
            this.lorentzNode = lorentzNode;
            this.dopplerCm1 = widths[0];
            this.lorentzCm1 = widths[1];
            this.reach = reach;
            this.group = group;
        }
    }

    /** The summed spectra of the blocks and what it took. */
    private static final class Convolution {
        double[][] spectra;
        int slices;
        int ffts;
        int analyticSlices;
        int corrections;
        double aliasError;
        double curvatureError;

        /** Adds another segment's counts (not its spectra). */
        void add(Convolution other) {
            slices += other.slices;
            ffts += other.ffts;
            analyticSlices += other.analyticSlices;
            corrections += other.corrections;
            aliasError = Math.max(aliasError, other.aliasError);
            curvatureError = Math.max(curvatureError, other.curvatureError);
        }
    }

    /** One block's spectrum and counts. */
    private static final class BlockOutput {
        double[] spectrum;
        int ffts;
        int analyticSlices;
        int corrections;
        double aliasError;
        double curvatureError;
    }

    /** Shared, read-only inputs of the blocks. */
    private static final class SliceContext {
        Distribution dist;
        DoubleFFT_1D fft;
        int length;
        double[] offsetsCm1;
        double stepCm1;
        double cutoffCm1;
        boolean removePedestal;
        double[] sinSquared;
        /** Node corrections kept across segments, or null: each block transforms its own. */
        CorrectionCache corrections;
    }

    /**
     * Transforms of the Lorentz nodes' correction kernels (real, L/2 + 1 values each), kept for all segments of one
     * {@link #finish}: they depend on γ, the ring length, the step and the cutoff only. Whichever block first needs
     * one computes it; the values do not depend on which, so results stay bitwise the same for any thread count.
     */
    private static final class CorrectionCache {
        private final ConcurrentHashMap<Long, double[]> plain = new ConcurrentHashMap<>();
        private final ConcurrentHashMap<Long, double[]> curvature = new ConcurrentHashMap<>();

        /** The node's correction transform (its second-derivative kernel when {@code second}), counted in out. */
        double[] get(double lorentzCm1, boolean second, double[] scratch, SliceContext ctx, BlockOutput out) {
            return (second ? curvature : plain).computeIfAbsent(Double.doubleToLongBits(lorentzCm1), k -> {
                double[] half = new double[ctx.length / 2 + 1];
                correctionTransform(lorentzCm1, second, scratch, half, ctx);
                out.ffts++;
                if (!second) {
                    out.corrections++;
                }
                return half;
            });
        }
    }

    private Convolution convolveSlices(Family[] families, List<double[]> sliceWidths, int[] sliceReach,
                                       Distribution dist, double h, DoubleFFT_1D fft, int fftLength,
                                       double analyticCutoffCm1, double[] sinSquared, CorrectionCache cache,
                                       boolean[] sliceUsed, double[][] spectra,
                                       ConcurrentLinkedQueue<double[][]> scratch) {
        // the non-empty slices in family order; within an analytic family Lorentz-node major, so that the slices
        // sharing a Lorentz node (and so a wing correction) are contiguous; otherwise Doppler-node major
        List<Slice> work = new ArrayList<>();
        int keyBase = 0;
        int groups = 0;
        for (Family f : families) {
            if (f == null) {
                continue;
            }
            int nl = f.lorentz.size();
            int ng = f.doppler.size();
            for (int outer = 0; outer < (f.analytic ? nl : ng); outer++) {
                boolean groupUsed = false;
                for (int inner = 0; inner < (f.analytic ? ng : nl); inner++) {
                    int ig = f.analytic ? inner : outer;
                    int il = f.analytic ? outer : inner;
                    if (linesOfSlice(f, keyBase, ig, il, dist) > 0) {
                        int s = f.firstSlice + ig * nl + il;
                        sliceUsed[s] = true;
                        work.add(new Slice(f, keyBase, ig, il, sliceWidths.get(s), sliceReach[s],
                                f.analytic ? groups : -1));
                        groupUsed = true;
                    }
                }
                if (f.analytic && groupUsed) {
                    groups++;
                }
            }
            keyBase += f.doppler.size() * nl;
        }
        int blocks = Math.max(1, Math.min(BLOCKS, work.size()));
        SliceContext ctx = new SliceContext();
        ctx.dist = dist;
        ctx.fft = fft;
        ctx.corrections = cache;
        ctx.length = fftLength;
        ctx.stepCm1 = h;
        ctx.cutoffCm1 = analyticCutoffCm1;
        ctx.removePedestal = wings.removePedestal();
        ctx.sinSquared = sinSquared;
        int maxReach = 0;
        for (Slice s : work) {
            maxReach = Math.max(maxReach, s.reach);
        }
        ctx.offsetsCm1 = new double[maxReach + 1];
        for (int r = 0; r <= maxReach; r++) {
            ctx.offsetsCm1[r] = r * h;
        }
        List<Callable<BlockOutput>> tasks = new ArrayList<>();
        for (int b = 0; b < blocks; b++) {
            int from = (int) ((long) b * work.size() / blocks);
            int to = (int) ((long) (b + 1) * work.size() / blocks);
            List<Slice> mine = work.subList(from, to);
            if (spectra[b] == null) {
                spectra[b] = new double[fftLength];
            }
            double[] spectrum = spectra[b];
            tasks.add(() -> {
                // lines and kernel scratch: at most one pair per running thread, fully overwritten before use
                double[][] pair = scratch.poll();
                if (pair == null) {
                    pair = new double[][] {new double[fftLength], new double[fftLength]};
                }
                try {
                    return convolveBlock(mine, ctx, spectrum, pair[0], pair[1]);
                } finally {
                    scratch.add(pair);
                }
            });
        }
        Convolution result = new Convolution();
        result.slices = work.size();
        result.spectra = new double[blocks][];
        try {
            List<Future<BlockOutput>> futures = pool.invokeAll(tasks);
            for (int b = 0; b < blocks; b++) {
                BlockOutput out = futures.get(b).get();
                result.spectra[b] = out.spectrum;
                result.ffts += out.ffts;
                result.analyticSlices += out.analyticSlices;
                result.corrections += out.corrections;
                result.aliasError = Math.max(result.aliasError, out.aliasError);
                result.curvatureError = Math.max(result.curvatureError, out.curvatureError);
            }
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new IllegalStateException("fast engine interrupted", e);
        } catch (ExecutionException e) {
            Throwable cause = e.getCause();
            if (cause instanceof RuntimeException) {
                throw (RuntimeException) cause;
            }
            if (cause instanceof Error) {
                throw (Error) cause;
            }
            throw new IllegalStateException(cause);
        }
        return result;
    }

    /** Number of lines whose stencil touches slice (ig, il) of a family. */
    private static int linesOfSlice(Family f, int keyBase, int ig, int il, Distribution dist) {
        int sg = f.doppler.stencilSize();
        int sl = f.lorentz.stencilSize();
        int nl = f.lorentz.size();
        int lines = 0;
        for (int jg = Math.max(0, ig - sg + 1); jg <= ig; jg++) {
            for (int jl = Math.max(0, il - sl + 1); jl <= il; jl++) {
                int k = keyBase + jg * nl + jl;
                lines += dist.bucketStart[k + 1] - dist.bucketStart[k];
            }
        }
        return lines;
    }

    /**
     * Sums the spectra of a block's slices, in order: spectrum(lines) × spectrum(kernel). A sampled slice's kernel
     * is transformed numerically. An analytic slice's kernel transform is the closed form of the untruncated,
     * periodised profile minus its Lorentz node's wing corrections, K_s − Ĉ_γ − (s²/2)·D̂_γ; Ĉ_γ and D̂_γ are
     * transformed when the block reaches the first slice of a node and kept (real, L/2 + 1 values each) for the
     * node's other slices, which follow it in the work order.
     */
    private BlockOutput convolveBlock(List<Slice> mine, SliceContext ctx, double[] spectrum, double[] lines,
                                      double[] kernel) {
        int length = ctx.length;
        int half = length / 2;
        Distribution dist = ctx.dist;
        DoubleFFT_1D fft = ctx.fft;
        BlockOutput out = new BlockOutput();
        // the block's spectrum is kept from segment to segment: cleared here
        Arrays.fill(spectrum, 0.0);
        double[] profile = new double[ctx.offsetsCm1.length];
        boolean anyGroup = false;
        for (Slice s : mine) {
            anyGroup |= s.group >= 0 && s.lorentzCm1 > 0;
        }
        boolean own = anyGroup && ctx.corrections == null;
        double[] plainCorrection = own ? new double[half + 1] : null;
        double[] curvatureCorrection = own ? new double[half + 1] : null;
        int loadedGroup = -1;
        boolean curvatureLoaded = false;
        for (Slice s : mine) {
            spreadLines(s, dist, lines);
            fft.realForward(lines);
            out.ffts++;
            boolean corrected = s.group >= 0 && s.lorentzCm1 > 0;
            if (corrected && s.group != loadedGroup) {
                if (own) {
                    correctionTransform(s.lorentzCm1, false, kernel, plainCorrection, ctx);
                    out.ffts++;
                    out.corrections++;
                } else {
                    plainCorrection = ctx.corrections.get(s.lorentzCm1, false, kernel, ctx, out);
                }
                // the curvature term's largest effect, relative to the node's lowest line peak: left out (one FFT
                // less) when far below round-off, and then counted in the estimate
                double widestDoppler = s.family.doppler.widthCm1(s.family.doppler.size() - 1);
                double curvature = curvatureBound(widestDoppler, s.lorentzCm1, ctx.cutoffCm1);
                curvatureLoaded = curvature > NEGLIGIBLE_CURVATURE;
                if (curvatureLoaded && own) {
                    correctionTransform(s.lorentzCm1, true, kernel, curvatureCorrection, ctx);
                    out.ffts++;
                } else if (curvatureLoaded) {
                    curvatureCorrection = ctx.corrections.get(s.lorentzCm1, true, kernel, ctx, out);
                } else {
                    out.curvatureError = Math.max(out.curvatureError, curvature / FastErrorModel.DEPTH);
                }
                loadedGroup = s.group;
            }
            double tail = s.group >= 0
                    ? AnalyticKernels.voigtTransform(s.dopplerCm1, s.lorentzCm1, ctx.stepCm1, length, kernel) : -1;
            if (tail >= 0) {
                out.analyticSlices++;
                // a line's weakest point of interest is 10⁻⁶ of its peak; the neglected aliases are at most
                // tail/h anywhere in real space
                double peak = VoigtProfile.value(0, s.dopplerCm1, s.lorentzCm1);
                out.aliasError = Math.max(out.aliasError, tail / (ctx.stepCm1 * FastErrorModel.DEPTH * peak));
                if (corrected && curvatureLoaded) {
                    double w = 0.5 * AnalyticKernels.dopplerVariance(s.dopplerCm1);
                    for (int k = 0; k <= half; k++) {
                        kernel[k] -= plainCorrection[k] + w * curvatureCorrection[k];
                    }
                } else if (corrected) {
                    for (int k = 0; k <= half; k++) {
                        kernel[k] -= plainCorrection[k];
                    }
                }
                // packed real-FFT layout: [Re0, Re(L/2), Re1, Im1, Re2, Im2, ...]; the kernel is real and even
                spectrum[0] += lines[0] * kernel[0];
                spectrum[1] += lines[1] * kernel[half];
                for (int k = 1; k < half; k++) {
                    double c = kernel[k];
                    spectrum[2 * k] += lines[2 * k] * c;
                    spectrum[2 * k + 1] += lines[2 * k + 1] * c;
                }
            } else {
                sampleKernel(s.family.kernel, s.dopplerCm1, s.lorentzCm1, ctx.offsetsCm1, s.reach, profile, kernel);
                fft.realForward(kernel);
                out.ffts++;
                multiplyAdd(lines, kernel, spectrum);
            }
        }
        out.spectrum = spectrum;
        return out;
    }

    /**
     * Bound of the curvature correction's effect, (s²/2)·max|L''| beyond R, relative to the peak of the node's
     * widest line: (s²/2)·6γ/(π(R² + γ²)²) / V(0; αD, γ) (|L''(x)| ≤ 6γ/(π(x² + γ²)²) for any x).
     */
    static double curvatureBound(double dopplerCm1, double lorentzCm1, double cutoffCm1) {
        double r2 = cutoffCm1 * cutoffCm1 + lorentzCm1 * lorentzCm1;
        double curvature = 6 * lorentzCm1 / (Math.PI * r2 * r2);
        return 0.5 * AnalyticKernels.dopplerVariance(dopplerCm1) * curvature
                / VoigtProfile.value(0, dopplerCm1, lorentzCm1);
    }

    /** The slice's line distribution (position weights × width weights) on the internal grid, in {@code lines}. */
    private static void spreadLines(Slice s, Distribution dist, double[] lines) {
        Arrays.fill(lines, 0.0);
        Family f = s.family;
        int sg = f.doppler.stencilSize();
        int sl = f.lorentz.stencilSize();
        int nl = f.lorentz.size();
        for (int jg = Math.max(0, s.dopplerNode - sg + 1); jg <= s.dopplerNode; jg++) {
            int gIndex = s.dopplerNode - jg;
            for (int jl = Math.max(0, s.lorentzNode - sl + 1); jl <= s.lorentzNode; jl++) {
                int lIndex = s.lorentzNode - jl;
                int k = s.familyKeyBase + jg * nl + jl;
                double[] gw = dist.orderedDopplerWeights;
                double[] lw = dist.orderedLorentzWeights;
                double[] pw = dist.orderedPositionWeights;
                int[] first = dist.orderedFirstPoint;
                for (int q = dist.bucketStart[k]; q < dist.bucketStart[k + 1]; q++) {
                    double w = gw[4 * q + gIndex] * lw[4 * q + lIndex];
                    int p = first[q] + dist.shift;
                    for (int j = 0; j < P; j++) {
                        lines[p + j] += w * pw[P * q + j];
                    }
                }
            }
        }
    }

    /** spectrum += a × b, both in the packed real-FFT layout [Re0, Re(L/2), Re1, Im1, Re2, Im2, ...]. */
    private static void multiplyAdd(double[] a, double[] b, double[] spectrum) {
        spectrum[0] += a[0] * b[0];
        spectrum[1] += a[1] * b[1];
        for (int i = 2; i < a.length; i += 2) {
            double ar = a[i];
            double ai = a[i + 1];
            double br = b[i];
            double bi = b[i + 1];
            spectrum[i] += ar * br - ai * bi;
            spectrum[i + 1] += ar * bi + ai * br;
        }
    }

    /**
     * The transform of a Lorentz node's correction kernel c_γ (or d_γ), real and even, so real: its values at
     * k = 0 … L/2 in {@code half}; the imaginary parts the FFT returns are round-off and are left out.
     */
    private static void correctionTransform(double lorentzCm1, boolean second, double[] scratch, double[] half,
                                            SliceContext ctx) {
        AnalyticKernels.correctionKernel(lorentzCm1, ctx.offsetsCm1, ctx.cutoffCm1, ctx.removePedestal, ctx.stepCm1,
                ctx.sinSquared, second, scratch);
        ctx.fft.realForward(scratch);
        int n = half.length - 1;
        half[0] = scratch[0];
        half[n] = scratch[1];
        for (int k = 1; k < n; k++) {
            half[k] = scratch[2 * k];
        }
    }

    /**
     * The fixed cutoff R of this (p, T) when the analytic kernels may apply — a cutoff that does not depend on the
     * line widths ({@link FixedCutoff}, {@link PressureScaledCutoff}) and is finite — else NaN.
     */
    private double analyticCutoffCm1() {
        if (!(wings.cutoff() instanceof FixedCutoff || wings.cutoff() instanceof PressureScaledCutoff)) {
            return Double.NaN;
        }
        double d = wingKernel.cutoffCm1(0.0, 0.0);
        return Double.isFinite(d) && d > 0 ? d : Double.NaN;
    }

    /**
     * Whether a family takes the analytic path: at least {@value #MIN_DOPPLER_NODES_SHARING} Doppler nodes sharing
     * each Lorentz node (each node's correction costs up to two FFTs, so with fewer the sampled kernels are
     * cheaper), a width-independent finite cutoff R, no χ factor, αD &gt; 0, and
     * R ≫ αD: αD,max ≤ R/{@value #MIN_CUTOFF_OVER_DOPPLER} and the wing model's remainder
     * ({@link AnalyticKernels#wingModelError}) within a hundredth of the tolerance.
     */
    private boolean isAnalytic(Family f, double cutoffCm1) {
        return analyticKernels && !Double.isNaN(cutoffCm1) && f.kernel == plainKernel && f.kernel.chiFactor() == null
                && f.doppler.size() >= MIN_DOPPLER_NODES_SHARING && f.alphaMin > 0 && f.alphaMax * MIN_CUTOFF_OVER_DOPPLER <= cutoffCm1
                && AnalyticKernels.wingModelError(f.alphaMax, cutoffCm1) <= tolerance / 100;
    }

    /** sin²(πn/L), n = 0 … L/2, kept between computations of the same FFT length. */
    private double[] sinSquaredTable(int length) {
        if (sinSquared == null || sinSquared.length != length / 2 + 1) {
            sinSquared = AnalyticKernels.sinSquaredTable(length);
        }
        return sinSquared;
    }

    /**
     * A slice's convolution kernel: the profile at the offsets r·h, r = 0 … reach, cut and de-pedestalled exactly as
     * the exact engine treats a line ({@link WingKernel#addLine}), laid out circularly (r at index r, −r at
     * L − r) and zero elsewhere.
     *
     * @param wings          the wing treatment at this (p, T)
     * @param dopplerCm1     the slice's αD
     * @param lorentzCm1     the slice's γL
     * @param offsetsCm1     r·h for r = 0 … at least {@code reach}
     * @param reach          largest offset index kept, below L/2
     * @param profileScratch scratch of length ≥ reach + 1
     * @param kernelOut      receives the kernel, length L
     */
    static void sampleKernel(WingKernel wings, double dopplerCm1, double lorentzCm1, double[] offsetsCm1, int reach,
                             double[] profileScratch, double[] kernelOut) {
        int length = kernelOut.length;
        Arrays.fill(profileScratch, 0, reach + 1, 0.0);
        wings.addLine(LineShapeKind.VOIGT, offsetsCm1, 0, reach + 1, 0.0, dopplerCm1, lorentzCm1, 1.0,
                profileScratch);
        Arrays.fill(kernelOut, 0.0);
        kernelOut[0] = profileScratch[0];
        for (int r = 1; r <= reach; r++) {
            kernelOut[r] = profileScratch[r];
            kernelOut[length - r] = profileScratch[r];
        }
    }

    /**
     * The first output point after segment's own ones (those whose internal point, or on resolving-power grids
     * whose interpolation stencil's lower neighbour, lies before {@code ownedTo}), as the output loops count them.
     */
    private static int skipOutputs(double[] points, double origin, double h, int m, boolean uniform, int next,
                                   long ownedTo, boolean last) {
        int n = points.length;
        if (last) {
            return n;
        }
        if (uniform) {
            return (int) Math.max(next, Math.min(n, (ownedTo - 1) / m + 1));
        }
        int k = next;
        while (k < n && (int) Math.floor((points[k] - origin) / h) < ownedTo) {
            k++;
        }
        return k;
    }

    /**
     * Smallest power of two ≥ {@code needed}: the library's split-radix path for powers of two is several times
     * faster than its mixed-radix path, which outweighs the padding (less than a factor 2 in memory).
     */
    static int fftLength(int needed) {
        return Integer.highestOneBit(Math.max(2, needed - 1)) << 1;
    }

    private void describeStatic(Map<String, String> m) {
        m.put("engine", ID);
        m.put("fast.method", "discrete integral transform (van den Bekerom & Pannier 2021): 3-D distribution over "
                + "position (6-point Lagrange weights), ln alphaD and ln gammaL (4-point); FFT convolution per width slice");
        m.put("fast.tolerance", Double.toString(tolerance));
        m.put("fast.criterion", "relative error where sigma >= 1e-6 max sigma");
        m.put("fast.kernel", "per-slice Voigt truncated as in the exact engine (cutoff and pedestal at the slice's "
                + "node widths); with a fixed or pressure-scaled cutoff R >> alphaD and no chi factor, closed-form "
                + "transform of the periodised profile corrected per Lorentz node by the transforms of its periodic "
                + "Lorentz wings beyond R and their second derivative (remainder O(alphaD^4/R^4), in the estimate); "
                + "otherwise sampled and transformed numerically");
        m.put("fast.cutoff_edge", "within 3 internal steps of a line's cutoff distance the truncation is spread over "
                + "the line's position stencil; a width-dependent cutoff is taken at the slice's node widths");
        m.putAll(wings.describe());
    }

    /**
     * Table blocks for this engine: the power-of-two transform rule of {@link
     * CrossSectionEngine#transformBlockPoints} with factor {@value #BLOCK_TRANSFORM_FACTOR}, so that ≥ 60 % of every
     * block's transform is the block itself (measured against 1.25 and 5 in docs/performance.md, "Grid: table
     * blocks sized for the engine": 5 builds a table ≈ 10 % faster but makes a revised band recompute ≈ 1.9× the
     * points).
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
        Map<String, String> m = new LinkedHashMap<>();
        describeStatic(m);
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
    }
}
