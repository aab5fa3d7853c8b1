package org.linewright.grid.engine.fast;

import org.linewright.broadening.wings.WingKernel;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.engine.fast.Family.FamilyStatistics;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.InputException;

/**
 * Chooses the {@link FastPlan} of one computation from its lines, grid, wing treatment and tolerance ε: the internal
 * step, the families and their width axes, the slices, the segments, the lines summed directly, and the a-priori
 * error terms. All errors are measured by {@link FastErrorModel} on the profile itself.
 *
 * <p><b>Internal step.</b> The output step divided by the smallest integer m ≤ {@value #MAX_OVERSAMPLING} whose
 * position error for each family's narrowest widths is within ε/4 (on resolving-power grids the output
 * interpolation costs it again). Lines too narrow for the finest internal grid are summed directly (exactly)
 * instead, so capping m never breaks the tolerance.
 *
 * <p><b>Width budget.</b> The width axes share B = 0.8·(ε − position error − edge error) − round-off allowance
 * (at least ε/10). Doppler log step: the largest whose error at the family's most Gaussian width ratio is within
 * B/2; Lorentz log step: the largest whose error at the most Lorentzian ratio is within B minus the Doppler axis's
 * actual error.
 *
 * <p><b>Families.</b> Lines with αD &gt; 0 are split at γ_s = γ_f·e^δ: below it (pure Doppler included) the
 * Doppler-dominated family, whose Lorentz axis is one floored stencil {0, γ_f, γ_f·e^δ, γ_f·e^(2δ)}
 * ({@link WidthAxis#floored}); δ is the Lorentz log step with half the budget at the most Lorentzian ratio, γ_f the
 * largest floor r·αD,min (r ≥ {@value #MIN_FLOOR_RATIO}) whose first-stencil error is within B/2. Lines with
 * γL/αD above r_L (the smallest ratio at which one Doppler node keeps half the budget,
 * {@link FastErrorModel#singleDopplerNodeError}) form the Lorentz-dominated family with one Doppler node; αD = 0
 * gives the pure Lorentz family; each kind splits again by the χ flag.
 *
 * <p><b>Lines summed directly.</b> (1) Every line when the cutoff depends on the line widths (a multiple of the
 * HWHM): a slice's kernel is cut at its node widths, not at each line's own distance, and interpolating kernels of
 * different supports is not accurate at their edges; (2) lines narrower than the finest internal grid resolves.
 * The plan says how many and why.
 */
final class FastPlanner {
    /** Largest internal refinement of the output step. */
    static final int MAX_OVERSAMPLING = 32;
    /** Largest number of slices accepted (beyond it the exact engine is the better tool). */
    static final int MAX_SLICES = 20_000;
    /** Bounds of the log-width steps searched. */
    static final double MIN_LOG_STEP = 1e-3;
    static final double MAX_LOG_STEP = 2.0;
    /** Largest γL/αD searched for the Lorentz-dominated family's lower bound. */
    static final double MAX_SPLIT_RATIO = 1e6;
    /** Smallest Lorentz floor searched, relative to the smallest Doppler HWHM. */
    static final double MIN_FLOOR_RATIO = 1e-9;
    /** Smallest cutoff, in Doppler HWHM, for the analytic kernel path (its wing model needs R ≫ αD). */
    static final double MIN_CUTOFF_OVER_DOPPLER = 10;
    /** Fewest Doppler nodes per Lorentz node for which the analytic path saves FFTs. */
    static final int MIN_DOPPLER_NODES_SHARING = 3;
    /** Round-off allowance 64·2⁻⁵²·log₂L/10⁻⁶ at the largest L accepted. */
    static final double ROUND_OFF_ALLOWANCE = 64 * 0x1.0p-52 * 29 / FastErrorModel.DEPTH;
    /**
     * Largest ratio, per unit of tolerance, of a transformed line's peak to max σ on the grid: at it the round-off
     * allowance times the ratio is a quarter of the tolerance (≈ 610 at ε = 10⁻³).
     */
    static final double MAX_PEAK_RATIO_PER_TOLERANCE = 0.25 / ROUND_OFF_ALLOWANCE;
    /** Points of the position stencil, and how many of them lie below the line's lower neighbour. */
    static final int P = FastErrorModel.POSITION_POINTS;
    static final int SHIFT = P / 2 - 1;
    /**
     * Internal points kept each side of a segment on resolving-power grids: the output interpolation stencil
     * reaches 2 points below and 3 above an output point's lower neighbour.
     */
    static final int INTERPOLATION_MARGIN = 3;

    private final LineBuffer lines;
    private final WavenumberGrid grid;
    private final WingTreatment wings;
    private final WingKernel wingKernel;
    private final WingKernel plainKernel;
    private final double tolerance;
    private final boolean analyticKernels;
    /** Whether a family whose transform would cost more than summing its lines directly is summed directly. */
    private final boolean costChoice;

    /** The kernel's cutoff (+∞ for none), whether the pedestal is removed, the criterion's effective depth. */
    private double cutoffCm1 = Double.POSITIVE_INFINITY;
    private boolean removePedestal;
    private double depth = FastErrorModel.DEPTH;
    /** The current internal step (the edge band is six of them). */
    private double stepCm1;

    // family splits, set while planning
    private double lowSplitCm1;
    private double lowFloorCm1;
    private double lowLogStep;
    private double highSplitRatio = Double.POSITIVE_INFINITY;

    /**
     * @param wingKernel  the treatment at this (p, T), for lines with the χ factor
     * @param plainKernel the same without χ (the same object when χ is off)
     */
    FastPlanner(LineBuffer lines, WavenumberGrid grid, WingTreatment wings, WingKernel wingKernel,
                WingKernel plainKernel, double tolerance, boolean analyticKernels, boolean costChoice) {
        this.lines = lines;
        this.grid = grid;
        this.wings = wings;
        this.wingKernel = wingKernel;
        this.plainKernel = plainKernel;
        this.tolerance = tolerance;
        this.analyticKernels = analyticKernels;
        this.costChoice = costChoice;
    }

    /**
     * The plan.
     *
     * @param threads          worker threads (for the memory check)
     * @param forcedRingLength a ring length imposed on the segments (tests), or 0
     * @throws InputException when the plan would exceed the slice, FFT or heap limits (before any work)
     */
    FastPlan plan(int threads, int forcedRingLength) {
        FastPlan.Builder b = new FastPlan.Builder();
        b.grid = grid;
        b.uniform = grid.spacing() == WavenumberGrid.Spacing.UNIFORM;
        int count = lines.count;
        b.lineFamily = new byte[count];
        double[] points = grid.pointsCm1();
        int n = points.length;
        double outputStep = b.uniform ? grid.stepCm1()
                : (n >= 2 ? points[1] - points[0] : points[0] / grid.resolvingPower());
        b.edgeCutoffCm1 = edgeCutoffCm1();

        if (wings.cutoff().dependsOnWidths()) {
            // every line directly: slices cut at their node widths cannot reproduce each line's own cutoff edge
            java.util.Arrays.fill(b.lineFamily, FastPlan.DIRECT);
            b.directLines = count;
            b.directReason = "cutoff depends on each line's widths";
            b.stepCm1 = outputStep;
            b.originCm1 = points[0];
            b.layout = null;
            return new FastPlan(b);
        }

        cutoffCm1 = Double.isNaN(b.edgeCutoffCm1) ? Double.POSITIVE_INFINITY : b.edgeCutoffCm1;
        removePedestal = wings.removePedestal() && Double.isFinite(cutoffCm1);
        double lowerSigma = lowerBoundOfMaxSigma();
        int strong = markRoundOffDominant(b.lineFamily, lowerSigma);
        if (strong > 0) {
            b.directLines += strong;
            b.directReason = strong + " lines whose peaks exceed " + Math.round(MAX_PEAK_RATIO_PER_TOLERANCE * tolerance)
                    + " times max sigma on the grid (the transform's round-off would not keep the tolerance)";
        }
        depth = FastErrorModel.DEPTH / peakRatio(lowerSigma, b.lineFamily);
        b.effectiveDepth = depth;

        // first all lines with αD > 0 in one family, to choose the internal step and the split
        lowSplitCm1 = 0;
        highSplitRatio = Double.POSITIVE_INFINITY;
        classify(b.lineFamily);
        FamilyStatistics[] stats = gather(b.lineFamily);
        int m = chooseOversampling(stats, outputStep, tolerance / 4);
        double h = outputStep / m;
        stepCm1 = h;
        // lines the finest internal grid cannot resolve are summed directly
        if (worstPositionError(stats, h) > tolerance / 4) {
            int unresolved = markUnresolved(b.lineFamily, h, tolerance / 4);
            b.directLines += unresolved;
            b.directReason = (b.directReason.isEmpty() ? "" : b.directReason + "; ") + unresolved
                    + " lines narrower than the finest internal grid (step " + h + " cm-1)";
            stats = gather(b.lineFamily);
        }
        b.oversampling = m;
        b.stepCm1 = h;
        b.originCm1 = b.uniform ? points[0] : points[0] - INTERPOLATION_MARGIN * h;
        b.internalPoints = b.uniform ? (long) (n - 1) * m + 1
                : (long) Math.ceil((points[n - 1] - points[0]) / h) + 2 * INTERPOLATION_MARGIN + 1;
        if (b.internalPoints + 2L * FastEngine.MAX_FFT_LENGTH >= Integer.MAX_VALUE) {
            throw new InputException("fast engine: an internal grid of " + b.internalPoints + " points (grid of " + n
                    + " points refined " + m + " times) is beyond the engine's index range; use a smaller range or "
                    + "the exact engine");
        }
        // a family whose width axes cannot keep the budget even at the finest step (a cutoff within a few widths,
        // where the edge weighs much against the criterion's floor) is summed directly instead
        while (true) {
            double widthBudget = widthBudget(stats, h, b.uniform);
            chooseLorentzSplit(stats[Family.VOIGT], stats[Family.VOIGT + Family.KINDS], widthBudget);
            chooseDopplerSplit(stats[Family.VOIGT], stats[Family.VOIGT + Family.KINDS], widthBudget);
            wideSplitCm1 = Double.POSITIVE_INFINITY;
            classify(b.lineFamily);
            stats = gather(b.lineFamily);
            if (chooseWideSplit(stats, widthBudget(stats, h, b.uniform))) {
                classify(b.lineFamily);
                stats = gather(b.lineFamily);
            }
            double budget = widthBudget(stats, h, b.uniform);
            cheaperDirect = false;
            int failing = planFamilies(b, stats, budget);
            if (failing < 0) {
                break;
            }
            int moved = 0;
            for (int i = 0; i < count; i++) {
                if (b.lineFamily[i] == failing) {
                    b.lineFamily[i] = FastPlan.DIRECT;
                    moved++;
                }
            }
            b.directLines += moved;
            b.directReason = (b.directReason.isEmpty() ? "" : b.directReason + "; ") + moved + " lines of family "
                    + Family.name(failing) + (cheaperDirect ? " cheaper summed directly than transformed"
                    : " whose width interpolation cannot keep the tolerance at the cutoff " + cutoffCm1 + " cm-1");
            java.util.Arrays.fill(b.families, null);
            stats = gather(b.lineFamily);
            boolean any = false;
            for (FamilyStatistics f : stats) {
                any |= f != null;
            }
            if (!any) {
                return new FastPlan(b);
            }
        }
        double position = worstPositionError(stats, h);
        b.positionError = b.uniform ? position : 2 * position;

        planSlices(b, forcedRingLength);
        double widthError = 0;
        for (Family f : b.families) {
            if (f != null) {
                widthError = Math.max(widthError, f.dopplerError + f.lorentzError);
            }
        }
        b.widthError = widthError;
        if (b.layout != null) {
            b.roundOffError = 64 * Math.ulp(1.0) * (Math.log(b.layout.ringLength()) / Math.log(2)) / depth;
        }
        checkMemory(b, threads);
        return new FastPlan(b);
    }

    /** The cutoff whose edges {@link EdgeCorrection} treats: finite and the same for every line, else NaN. */
    private double edgeCutoffCm1() {
        if (wings.cutoff().dependsOnWidths()) {
            return Double.NaN;
        }
        double d = wingKernel.cutoffCm1(0.0, 0.0);
        return Double.isFinite(d) && d > 0 ? d : Double.NaN;
    }

    /** γL from which Voigt and Lorentz-dominated lines form the wide families (+∞: none), set while planning. */
    private double wideSplitCm1 = Double.POSITIVE_INFINITY;
    /** Lorentz nodes of a family from which a wide split is worth searching. */
    static final int WIDE_SPLIT_MIN_NODES = 48;
    /** Log distance between the wide-split candidates below the widest γL. */
    static final double WIDE_SPLIT_LOG_STEP = 0.5;
    /** Candidates searched. */
    static final int WIDE_SPLIT_CANDIDATES = 10;

    /**
     * Chooses the wide split γ_w. The Lorentz axis of a family takes the log step its worst line needs — the one of
     * largest γL, whose cutoff edge (at R/γL of a few) weighs most against the criterion's floor, so that step can
     * be ten times finer than the rest of the family needs. Giving the lines with γL ≥ γ_w their own families (the
     * same kinds, their own axes, every error still measured for each family's own worst line) lets the narrower
     * lines take the coarser step. γ_w is the candidate γ_max·e^(−k/2), k = 1 … {@value #WIDE_SPLIT_CANDIDATES}, of
     * fewest width slices (Lorentz nodes × Doppler nodes, each axis as {@link #planFamilies} would choose it),
     * kept only when it saves at least a sixth of the slices.
     *
     * @return whether a split was set (the lines must then be classified again)
     */
    private boolean chooseWideSplit(FamilyStatistics[] stats, double budget) {
        FastErrorModel.Form form = formCm1(stepCm1);
        int[] candidates = {Family.VOIGT, Family.LORENTZ_DOMINATED, Family.VOIGT + Family.KINDS,
            Family.LORENTZ_DOMINATED + Family.KINDS};
        double gammaLo = Double.POSITIVE_INFINITY;
        double gammaHi = 0;
        double full = 0;
        boolean worth = false;
        for (int index : candidates) {
            FamilyStatistics f = stats[index];
            if (f == null || !(f.gammaMin > 0)) {
                continue;
            }
            int nodes = lorentzNodes(f.gammaMin, f.gammaMax, f.alphaMin, budget, form);
            worth |= nodes >= WIDE_SPLIT_MIN_NODES;
            full += nodes * dopplerNodes(index, f.alphaMin, f.alphaMax, f.gammaMin, f.gammaMax, budget, form);
            gammaLo = Math.min(gammaLo, f.gammaMin);
            gammaHi = Math.max(gammaHi, f.gammaMax);
        }
        if (!worth) {
            return false;
        }
        double best = full;
        double bestSplit = Double.POSITIVE_INFINITY;
        for (int k = 1; k <= WIDE_SPLIT_CANDIDATES; k++) {
            double split = gammaHi * Math.exp(-WIDE_SPLIT_LOG_STEP * k);
            if (split <= gammaLo * Math.exp(WIDE_SPLIT_LOG_STEP)) {
                break;
            }
            double total = 0;
            for (int index : candidates) {
                FamilyStatistics f = stats[index];
                if (f == null || !(f.gammaMin > 0)) {
                    continue;
                }
                // the narrow part keeps the family's αD range (conservative: its narrowest αD stays the worst case)
                if (f.gammaMin < split) {
                    double hi = Math.min(f.gammaMax, split);
                    total += lorentzNodes(f.gammaMin, hi, f.alphaMin, budget, form)
                            * dopplerNodes(index, f.alphaMin, f.alphaMax, f.gammaMin, hi, budget, form);
                }
                if (f.gammaMax >= split) {
                    double lo = Math.max(f.gammaMin, split);
                    total += lorentzNodes(lo, f.gammaMax, f.alphaMin, budget, form)
                            * dopplerNodes(index, f.alphaMin, f.alphaMax, lo, f.gammaMax, budget, form);
                }
            }
            if (total < best) {
                best = total;
                bestSplit = split;
            }
        }
        if (best > full * 5 / 6) {
            return false;
        }
        wideSplitCm1 = bestSplit;
        return true;
    }

    /** Lorentz nodes of a geometric axis over [γlo, γhi] as {@link #planFamilies} chooses it (half the budget). */
    private static int lorentzNodes(double gammaLoCm1, double gammaHiCm1, double alphaMinCm1, double budget,
                                    FastErrorModel.Form form) {
        double step = FastErrorModel.Planner.lorentzStep(alphaMinCm1 / gammaHiCm1, budget / 2, MIN_LOG_STEP,
                MAX_LOG_STEP, form.rescaled(gammaHiCm1));
        return WidthAxis.geometric(gammaLoCm1, gammaHiCm1, step, 1).size();
    }

    /** Doppler nodes as {@link #planFamilies} chooses them for a kind over these width ranges (half the budget). */
    private static int dopplerNodes(int index, double alphaLoCm1, double alphaHiCm1, double gammaLoCm1,
                                    double gammaHiCm1, double budget, FastErrorModel.Form form) {
        if (Family.axisKind(index) == Family.LORENTZ_DOMINATED) {
            return 1;
        }
        FastErrorModel.Form perAlpha = form.rescaled(alphaHiCm1);
        double step = Math.min(
                FastErrorModel.Planner.dopplerStep(gammaLoCm1 / alphaHiCm1, budget / 2, MIN_LOG_STEP, MAX_LOG_STEP,
                        perAlpha),
                FastErrorModel.Planner.dopplerStep(gammaHiCm1 / alphaHiCm1, budget / 2, MIN_LOG_STEP, MAX_LOG_STEP,
                        perAlpha));
        return WidthAxis.geometric(alphaLoCm1, alphaHiCm1, step, 2).size();
    }

    /** Family of each line not summed directly, from the current splits. */
    private void classify(byte[] lineFamily) {
        for (int i = 0; i < lines.count; i++) {
            if (lineFamily[i] != FastPlan.DIRECT) {
                lineFamily[i] = (byte) familyOf(lines.dopplerCm1[i], lines.lorentzCm1[i], lines.chi[i]);
            }
        }
    }

    /** Width kind (Voigt, Doppler-dominated, pure Lorentz, Lorentz-dominated), plus {@link Family#KINDS} with χ. */
    private int familyOf(double a, double g, boolean chi) {
        int kind = a == 0 ? Family.LORENTZ_ONLY
                : (g < lowSplitCm1 ? Family.DOPPLER_DOMINATED
                : (g >= highSplitRatio * a ? Family.LORENTZ_DOMINATED : Family.VOIGT));
        if (g >= wideSplitCm1) {
            kind = Family.wide(kind);
        }
        return chi ? kind + Family.KINDS : kind;
    }

    private FamilyStatistics[] gather(byte[] lineFamily) {
        FamilyStatistics[] stats = new FamilyStatistics[Family.COUNT];
        for (int i = 0; i < lines.count; i++) {
            int f = lineFamily[i];
            if (f == FastPlan.DIRECT) {
                continue;
            }
            if (stats[f] == null) {
                stats[f] = new FamilyStatistics();
            }
            stats[f].add(lines.dopplerCm1[i], lines.lorentzCm1[i]);
        }
        return stats;
    }

    /**
     * The kernel form in cm⁻¹ at internal step h: the cutoff, the pedestal, the effective depth and the edge band
     * (the six internal steps below R in which {@link EdgeCorrection} replaces the transform's values).
     */
    private FastErrorModel.Form formCm1(double h) {
        return new FastErrorModel.Form(cutoffCm1, removePedestal, depth, Double.isFinite(cutoffCm1) ? 6 * h : 0);
    }

    /**
     * The largest position error over the families at step h: at each family's narrowest widths (the hardest to
     * interpolate) and at its widest (whose kernel weighs most at the cutoff).
     */
    private double worstPositionError(FamilyStatistics[] stats, double h) {
        FastErrorModel.Form form = formCm1(h);
        double worst = 0;
        for (FamilyStatistics f : stats) {
            if (f != null) {
                worst = Math.max(worst, FastErrorModel.Planner.position(h, f.alphaMin, f.gammaMin, form));
                worst = Math.max(worst, FastErrorModel.Planner.position(h, f.alphaMax, f.gammaMax, form));
            }
        }
        return worst;
    }

    /**
     * A lower bound of max σ on the grid: the larger of the largest S·(V(d) − pedestal) of any line (d the distance
     * from its centre to the nearest grid point) and σ itself at three probe points — both ends of the grid and the
     * grid point nearest that line — summed over every line without the χ factor that reaches them (terms are never
     * negative, so leaving the χ lines out keeps it a lower bound). The probes matter where the strongest lines lie
     * outside the grid (a block beside a band): there many lines' wings add up to max σ, and a single line's wing
     * would make the bound far too low.
     */
    private double lowerBoundOfMaxSigma() {
        double[] points = grid.pointsCm1();
        int n = points.length;
        double lower = 0;
        int lowerPoint = 0;
        for (int i = 0; i < lines.count; i++) {
            double a = lines.dopplerCm1[i];
            double g = lines.lorentzCm1[i];
            double s = lines.strength[i];
            // V(0) ≤ min(1/(πγL), √(ln2/π)/αD) (the peaks of the pure shapes, common practice): the profile is
            // evaluated only for lines whose bound could raise the figure
            if (peakBound(i) <= lower) {
                continue;
            }
            double c = lines.centerCm1[i];
            int k = WingKernel.firstIndexAtOrAbove(points, 0, n, c);
            double d = Double.POSITIVE_INFINITY;
            if (k < n) {
                d = points[k] - c;
            }
            if (k > 0) {
                d = Math.min(d, c - points[k - 1]);
            }
            if (d > cutoffCm1) {
                continue;
            }
            double pedestal = removePedestal ? org.linewright.broadening.voigt.VoigtProfile.value(cutoffCm1, a, g) : 0;
            double v = s * (org.linewright.broadening.voigt.VoigtProfile.value(d, a, g) - pedestal);
            if (v > lower) {
                lower = v;
                lowerPoint = k < n && (k == 0 || points[k] - c <= c - points[k - 1]) ? k : k - 1;
            }
        }
        lower = Math.max(lower, Math.max(sigmaLowerBound(points[0]), sigmaLowerBound(points[n - 1])));
        return Math.max(lower, sigmaLowerBound(points[lowerPoint]));
    }

    /** min(1/(πγL), √(ln2/π)/αD)·S ≥ S·V(0) of line i (the peaks of the pure shapes, common practice). */
    private double peakBound(int i) {
        double a = lines.dopplerCm1[i];
        double g = lines.lorentzCm1[i];
        return lines.strength[i] * Math.min(g > 0 ? 1 / (Math.PI * g) : Double.POSITIVE_INFINITY,
                a > 0 ? PEAK_GAUSSIAN / a : Double.POSITIVE_INFINITY);
    }

    /**
     * Marks as summed directly the lines whose peak S·V(0) exceeds {@link #MAX_PEAK_RATIO_PER_TOLERANCE}·ε times
     * {@code lowerSigma}: the transforms' round-off, 64·2⁻⁵²·log₂L of the largest peak on a ring, would exceed ε/4
     * at the criterion's depth (10⁻⁶·max σ) for such a peak even at the largest L. They are lines whose peaks the
     * grid does not hold (beside the grid, or far narrower than its step); their count.
     */
    private int markRoundOffDominant(byte[] lineFamily, double lowerSigma) {
        if (!(lowerSigma > 0)) {
            return 0;
        }
        double limit = MAX_PEAK_RATIO_PER_TOLERANCE * tolerance * lowerSigma;
        int marked = 0;
        for (int i = 0; i < lines.count; i++) {
            if (lineFamily[i] == FastPlan.DIRECT || peakBound(i) <= limit) {
                continue;
            }
            double peak = lines.strength[i]
                    * org.linewright.broadening.voigt.VoigtProfile.value(0, lines.dopplerCm1[i], lines.lorentzCm1[i]);
            if (peak > limit) {
                lineFamily[i] = FastPlan.DIRECT;
                marked++;
            }
        }
        return marked;
    }

    /**
     * max S·V(0) over the lines not summed directly, divided by {@code lowerSigma} (a lower bound of max σ on the
     * grid), at least 1. When the grid samples line peaks coarsely or sees only wings, 10⁻⁶·max σ is below 10⁻⁶ of
     * the strongest transformed peak by this factor, and the measures' depth is lowered by it.
     */
    private double peakRatio(double lowerSigma, byte[] lineFamily) {
        double upper = 0;
        for (int i = 0; i < lines.count; i++) {
            if (lineFamily[i] == FastPlan.DIRECT || peakBound(i) <= upper) {
                continue;
            }
            upper = Math.max(upper, lines.strength[i]
                    * org.linewright.broadening.voigt.VoigtProfile.value(0, lines.dopplerCm1[i], lines.lorentzCm1[i]));
        }
        return lowerSigma > 0 ? Math.max(1, upper / lowerSigma) : 1;
    }

    /**
     * σ at {@code xCm1} from the lines without the χ factor within the cutoff of it (each S·(V(d) − pedestal), never
     * negative): a lower bound of σ there.
     */
    private double sigmaLowerBound(double xCm1) {
        double sum = 0;
        for (int i = 0; i < lines.count; i++) {
            double d = Math.abs(xCm1 - lines.centerCm1[i]);
            if (d > cutoffCm1 || lines.chi[i]) {
                continue;
            }
            double a = lines.dopplerCm1[i];
            double g = lines.lorentzCm1[i];
            double pedestal = removePedestal ? org.linewright.broadening.voigt.VoigtProfile.value(cutoffCm1, a, g) : 0;
            sum += lines.strength[i] * Math.max(0, org.linewright.broadening.voigt.VoigtProfile.value(d, a, g) - pedestal);
        }
        return sum;
    }

    /** Marks the lines whose own position error at step h exceeds the share as summed directly; their count. */
    private int markUnresolved(byte[] lineFamily, double h, double share) {
        int direct = 0;
        for (int i = 0; i < lines.count; i++) {
            if (lineFamily[i] != FastPlan.DIRECT
                    && FastErrorModel.Planner.position(h, lines.dopplerCm1[i], lines.lorentzCm1[i], formCm1(h)) > share) {
                lineFamily[i] = FastPlan.DIRECT;
                direct++;
            }
        }
        return direct;
    }

    /**
     * The width axes' share B = 0.8·(ε − position error) − round-off allowance, at least ε/10; the position error
     * counted twice on resolving-power grids.
     */
    private double widthBudget(FamilyStatistics[] stats, double h, boolean uniform) {
        double position = worstPositionError(stats, h);
        double positionTotal = uniform ? position : 2 * position;
        return Math.max(0.1 * tolerance, 0.8 * (tolerance - positionTotal) - ROUND_OFF_ALLOWANCE);
    }

    /**
     * Smallest m ≤ {@link #MAX_OVERSAMPLING} whose position error is within the share for every family (the error
     * falls with m: bisection), or the cap when even that is not enough (the lines it cannot resolve are then summed
     * directly).
     */
    private int chooseOversampling(FamilyStatistics[] stats, double outputStep, double share) {
        if (worstPositionError(stats, outputStep) <= share) {
            return 1;
        }
        if (worstPositionError(stats, outputStep / MAX_OVERSAMPLING) > share) {
            return MAX_OVERSAMPLING;
        }
        int lo = 1;
        int hi = MAX_OVERSAMPLING;
        while (hi - lo > 1) {
            int mid = (lo + hi) >>> 1;
            if (worstPositionError(stats, outputStep / mid) <= share) {
                hi = mid;
            } else {
                lo = mid;
            }
        }
        return hi;
    }

    /**
     * Sets the Lorentz floor γ_f and the split γ_f·e^δ between the Doppler-dominated family and the Voigt family,
     * from the lines with αD &gt; 0 (both χ kinds): δ is the log step the Voigt family's Lorentz axis would take with
     * half the width budget, γ_f the largest floor whose first stencil keeps within that half. No split when every
     * such line has γL = 0, or none has γL below the split.
     */
    private void chooseLorentzSplit(FamilyStatistics plain, FamilyStatistics withChi, double budget) {
        lowSplitCm1 = 0;
        lowFloorCm1 = 0;
        lowLogStep = 0;
        double alphaMin = Double.POSITIVE_INFINITY;
        double gammaMin = Double.POSITIVE_INFINITY;
        double gammaMax = 0;
        for (FamilyStatistics f : new FamilyStatistics[] {plain, withChi}) {
            if (f != null) {
                alphaMin = Math.min(alphaMin, f.alphaMin);
                gammaMin = Math.min(gammaMin, f.gammaMin);
                gammaMax = Math.max(gammaMax, f.gammaMax);
            }
        }
        if (!(gammaMax > 0)) {
            return;
        }
        double step = FastErrorModel.Planner.lorentzStep(alphaMin / gammaMax, budget / 2, MIN_LOG_STEP, MAX_LOG_STEP,
                formCm1(stepCm1).rescaled(gammaMax));
        double floorCm1 = lorentzFloorCm1(alphaMin, step, budget / 2, formCm1(stepCm1).rescaled(alphaMin));
        double split = floorCm1 * Math.exp(step);
        if (gammaMin < split) {
            lowSplitCm1 = split;
            lowFloorCm1 = floorCm1;
            lowLogStep = step;
        }
    }

    /**
     * Sets the ratio γL/αD from which lines with αD &gt; 0 form the Lorentz-dominated family (one Doppler node):
     * the smallest ratio r ≤ {@value #MAX_SPLIT_RATIO} at which one node for the whole αD range keeps the error
     * within half the width budget. None when no such ratio exists or no line reaches it.
     */
    private void chooseDopplerSplit(FamilyStatistics plain, FamilyStatistics withChi, double budget) {
        highSplitRatio = Double.POSITIVE_INFINITY;
        double alphaMin = Double.POSITIVE_INFINITY;
        double alphaMax = 0;
        double gammaMax = 0;
        for (FamilyStatistics f : new FamilyStatistics[] {plain, withChi}) {
            if (f != null) {
                alphaMin = Math.min(alphaMin, f.alphaMin);
                alphaMax = Math.max(alphaMax, f.alphaMax);
                gammaMax = Math.max(gammaMax, f.gammaMax);
            }
        }
        if (!(alphaMax > 0) || !(gammaMax > 0)) {
            return;
        }
        // error grows with 1/r: the smallest r (largest 1/r) within half the budget
        double ratio = FastErrorModel.Planner.singleNodeSplitRatio(alphaMin, alphaMax, budget / 2,
                1 / MAX_SPLIT_RATIO, 1.0, formCm1(stepCm1).rescaled(alphaMin));
        if (ratio < Double.POSITIVE_INFINITY && gammaMax >= ratio * alphaMin) {
            highSplitRatio = ratio;
        }
    }

    /**
     * The Lorentz floor γ_f of a family whose narrowest Doppler HWHM is {@code alphaMinCm1}: the largest
     * γ_f = r·αD,min, r ∈ [{@value #MIN_FLOOR_RATIO}, 1], whose floored first stencil keeps the profile error within
     * {@code budget} ({@link FastErrorModel#flooredLorentzError}, at the smallest αD, the worst case).
     */
    static double lorentzFloorCm1(double alphaMinCm1, double logStep, double budget, FastErrorModel.Form formPerAlpha) {
        double r = FastErrorModel.Planner.floorRatio(logStep, budget, MIN_FLOOR_RATIO, 1.0, formPerAlpha);
        return r * alphaMinCm1;
    }

    /**
     * Each family's width axes (the Doppler axis gets half the budget, the Lorentz axis the rest) and kernel path,
     * every error measured for the kernel form of this computation (cutoff, pedestal, depth, edge band).
     *
     * @return the index of a family whose axes cannot keep the budget even at the finest log step, or −1 when every
     *         family keeps it (the families are then set in the builder)
     */
    private int planFamilies(FastPlan.Builder b, FamilyStatistics[] stats, double budget) {
        double analyticCutoff = b.edgeCutoffCm1;
        FastErrorModel.Form form = formCm1(stepCm1);
        int slices = 0;
        int keys = 0;
        int widest = -1;
        int widestSlices = 0;
        for (int index = 0; index < Family.COUNT; index++) {
            FamilyStatistics f = stats[index];
            if (f == null) {
                continue;
            }
            int kind = Family.axisKind(index);
            WidthAxis doppler;
            double dopplerError = 0;
            if (kind == Family.LORENTZ_ONLY) {
                doppler = WidthAxis.exact(0.0);
            } else if (kind == Family.LORENTZ_DOMINATED) {
                // one Doppler node, in the middle of the family's αD² range; error measured at its smallest γL/αD
                doppler = WidthAxis.exact(FastErrorModel.singleDopplerNode(f.alphaMin, f.alphaMax));
                dopplerError = FastErrorModel.Planner.singleNodeError(f.alphaMin, f.alphaMax, f.minLorentzOverDoppler,
                        form.rescaled(f.alphaMin));
            } else {
                // the Doppler axis at the family's widest αD: its most Gaussian line (smallest γL/αD, the hardest to
                // interpolate) and its most Lorentzian (whose cutoff edge weighs most)
                FastErrorModel.Form perAlpha = form.rescaled(f.alphaMax);
                double gaussian = f.gammaMin / f.alphaMax;
                double lorentzian = f.gammaMax / f.alphaMax;
                double step = Math.min(
                        FastErrorModel.Planner.dopplerStep(gaussian, budget / 2, MIN_LOG_STEP, MAX_LOG_STEP, perAlpha),
                        FastErrorModel.Planner.dopplerStep(lorentzian, budget / 2, MIN_LOG_STEP, MAX_LOG_STEP, perAlpha));
                doppler = WidthAxis.geometric(f.alphaMin, f.alphaMax, step, 2);
                dopplerError = doppler.stencilSize() == 1 ? 0
                        : Math.max(FastErrorModel.Planner.dopplerError(doppler.logStep(), gaussian, perAlpha),
                        FastErrorModel.Planner.dopplerError(doppler.logStep(), lorentzian, perAlpha));
            }
            WidthAxis lorentz;
            double lorentzError = 0;
            double floor = 0;
            if (f.gammaMax == 0) {
                lorentz = WidthAxis.exact(0.0);
            } else if (kind == Family.DOPPLER_DOMINATED) {
                // 0 ≤ γL < γ_f·e^δ: one floored stencil, its error measured at the family's own smallest αD
                lorentz = WidthAxis.floored(lowFloorCm1, f.gammaMax, lowLogStep);
                floor = lowFloorCm1;
                lorentzError = FastErrorModel.Planner.floorError(lorentz.logStep(), f.alphaMin / lowFloorCm1,
                        form.rescaled(lowFloorCm1));
            } else {
                // worst case for the Lorentz axis: the most Lorentzian line, smallest αD/γL, at the widest γL
                double ratio = f.alphaMin / f.gammaMax;
                FastErrorModel.Form perGamma = form.rescaled(f.gammaMax);
                double step = FastErrorModel.Planner.lorentzStep(ratio, budget - dopplerError, MIN_LOG_STEP,
                        MAX_LOG_STEP, perGamma);
                lorentz = WidthAxis.geometric(f.gammaMin, f.gammaMax, step, 1);
                lorentzError = lorentz.stencilSize() == 1 ? 0
                        : FastErrorModel.Planner.lorentzError(lorentz.logStep(), ratio, perGamma);
            }
            if (dopplerError + lorentzError > budget && lorentzError < budget && doppler.stencilSize() > 1
                    && kind != Family.LORENTZ_ONLY && kind != Family.LORENTZ_DOMINATED) {
                // each axis was chosen for half the budget; where the Lorentz axis (a floored stencil measured at
                // the family's own smallest αD) takes more than its half, the Doppler axis gets what it left
                FastErrorModel.Form perAlpha = form.rescaled(f.alphaMax);
                double gaussian = f.gammaMin / f.alphaMax;
                double lorentzian = f.gammaMax / f.alphaMax;
                double rest = budget - lorentzError;
                double step = Math.min(
                        FastErrorModel.Planner.dopplerStep(gaussian, rest, MIN_LOG_STEP, MAX_LOG_STEP, perAlpha),
                        FastErrorModel.Planner.dopplerStep(lorentzian, rest, MIN_LOG_STEP, MAX_LOG_STEP, perAlpha));
                doppler = WidthAxis.geometric(f.alphaMin, f.alphaMax, step, 2);
                dopplerError = doppler.stencilSize() == 1 ? 0
                        : Math.max(FastErrorModel.Planner.dopplerError(doppler.logStep(), gaussian, perAlpha),
                        FastErrorModel.Planner.dopplerError(doppler.logStep(), lorentzian, perAlpha));
            }
            if (dopplerError + lorentzError > budget) {
                return index;
            }
            WingKernel kernel = Family.withChi(index) ? wingKernel : plainKernel;
            boolean analytic = isAnalytic(kernel, doppler, f, analyticCutoff);
            if (costChoice && directCheaper(b, f, doppler.size() * lorentz.size(), analytic)) {
                cheaperDirect = true;
                return index;
            }
            b.families[index] = new Family(index, f, kernel, doppler, lorentz, dopplerError, lorentzError, floor,
                    slices, keys, analytic);
            int familySlices = b.families[index].slices();
            slices += familySlices;
            keys += familySlices;
            if (familySlices > widestSlices) {
                widest = index;
                widestSlices = familySlices;
            }
        }
        b.keys = keys;
        // beyond the slice limit the transform costs more than summing the lines directly: the family with the
        // most slices goes that way
        return slices > MAX_SLICES ? widest : -1;
    }

    /** Set by {@link #planFamilies} when the family it returns is cheaper summed directly (not beyond the budget). */
    private boolean cheaperDirect;
    /** √(ln 2/π): the peak of a unit-area Gaussian times its HWHM. */
    private static final double PEAK_GAUSSIAN = Math.sqrt(Math.log(2) / Math.PI);
    /** Time of one profile value of direct summation, one thread (docs/performance.md: about 300 M/s). */
    static final double DIRECT_NANOS_PER_VALUE = 3.3;

    /**
     * Whether summing a family's lines directly is estimated to cost less than its transform: lines × output points
     * within the cutoff × {@value #DIRECT_NANOS_PER_VALUE} ns against slices × transforms per slice (2 sampled, about
     * 1.2 analytic) × ring points × the measured FFT time per point ({@link SegmentLayout#nanosPerPoint}), the ring
     * covering the internal grid and twice the reach. Where a cutoff lies within a few widths the width axes must
     * be fine (the edge weighs much against the criterion's floor) and few lines fill few points: direct summation
     * is then both exact and cheaper.
     */
    private boolean directCheaper(FastPlan.Builder b, FamilyStatistics f, int slices, boolean analytic) {
        double[] points = grid.pointsCm1();
        int n = points.length;
        double span = n > 1 ? points[n - 1] - points[0] : 1;
        double inCutoff = Double.isFinite(cutoffCm1) ? Math.min(n, n * 2 * cutoffCm1 / span + 1) : n;
        double direct = f.lines * inCutoff * DIRECT_NANOS_PER_VALUE;
        double reach = Double.isFinite(cutoffCm1) ? cutoffCm1 / stepCm1 : b.internalPoints;
        long ring = FastEngine.fftLength((int) Math.min(FastEngine.MAX_FFT_LENGTH,
                (long) ((double) b.internalPoints + 2 * reach + 8)));
        double transform = slices * (analytic ? 1.2 : 2.0) * ring * SegmentLayout.nanosPerPoint((int) ring);
        return direct < transform;
    }

    /**
     * The wing model's remainder ({@link AnalyticKernels#wingModelError}, relative to a line's value at R) against
     * the criterion: amplified where R lies within the criterion's depth, by V(R)/(D·V(0)) of the family's widest
     * line (beyond R the exact kernel is 0 and σ may be made of other lines alone).
     */
    private double amplifiedWingModelError(FamilyStatistics f, double cutoff) {
        double atCutoff = org.linewright.broadening.voigt.VoigtProfile.value(cutoff, f.alphaMax, f.gammaMax)
                / (depth * org.linewright.broadening.voigt.VoigtProfile.value(0, f.alphaMax, f.gammaMax));
        return AnalyticKernels.wingModelError(f.alphaMax, cutoff) * Math.max(1, atCutoff);
    }

    /**
     * Whether a family takes the analytic path: at least {@value #MIN_DOPPLER_NODES_SHARING} Doppler nodes sharing
     * each Lorentz node, a width-independent finite cutoff R, no χ factor, αD &gt; 0, and R ≫ αD
     * (αD,max ≤ R/{@value #MIN_CUTOFF_OVER_DOPPLER} and the wing model's remainder within ε/100).
     */
    private boolean isAnalytic(WingKernel kernel, WidthAxis doppler, FamilyStatistics f, double cutoffCm1) {
        return analyticKernels && !Double.isNaN(cutoffCm1) && kernel == plainKernel && kernel.chiFactor() == null
                && doppler.size() >= MIN_DOPPLER_NODES_SHARING && f.alphaMin > 0
                && f.alphaMax * MIN_CUTOFF_OVER_DOPPLER <= cutoffCm1
                && amplifiedWingModelError(f, cutoffCm1) <= tolerance / 100;
    }

    /** Slice widths and reaches, the kernel reach, the segment layout and the analytic kernels' terms. */
    private void planSlices(FastPlan.Builder b, int forcedRingLength) {
        double h = b.stepCm1;
        double[] points = grid.pointsCm1();
        double lineMin = Double.POSITIVE_INFINITY;
        double lineMax = Double.NEGATIVE_INFINITY;
        for (int i = 0; i < lines.count; i++) {
            if (b.lineFamily[i] != FastPlan.DIRECT) {
                lineMin = Math.min(lineMin, lines.centerCm1[i]);
                lineMax = Math.max(lineMax, lines.centerCm1[i]);
            }
        }
        int slices = 0;
        for (Family f : b.families) {
            slices += f == null ? 0 : f.slices();
        }
        b.sliceWidths = new double[slices][];
        b.sliceReach = new int[slices];
        if (slices == 0) {
            return;
        }
        // kernel half-length K: the cutoff, or every line-to-point distance without one
        double internalEnd = b.originCm1 + (b.internalPoints - 1) * h;
        long maxReach = (long) Math.ceil(Math.max(Math.max(internalEnd - lineMin, lineMax - b.originCm1), 0) / h) + 4;
        long reach = 0;
        for (Family f : b.families) {
            if (f == null) {
                continue;
            }
            for (int ig = 0; ig < f.doppler.size(); ig++) {
                for (int il = 0; il < f.lorentz.size(); il++) {
                    int s = f.firstSlice + ig * f.lorentz.size() + il;
                    double[] w = {f.doppler.widthCm1(ig), f.lorentz.widthCm1(il)};
                    b.sliceWidths[s] = w;
                    double d = wingKernel.cutoffCm1(w[0], w[1]);
                    long k = Double.isInfinite(d) ? maxReach : Math.min(maxReach, (long) Math.floor(d / h) + 1);
                    b.sliceReach[s] = (int) Math.min(k, FastEngine.MAX_FFT_LENGTH);
                    reach = Math.max(reach, k);
                }
            }
        }
        b.reach = reach;
        // segments of the internal grid, each in its own ring: a segment owning U points needs U + pad ring points
        // (the reach both sides, guard points and, on resolving-power grids, the interpolation stencil's margin)
        b.margin = b.uniform ? 0 : INTERPOLATION_MARGIN;
        long pad = 2 * reach + 8 + 2L * b.margin;
        if (pad + 1 > FastEngine.MAX_FFT_LENGTH) {
            throw new InputException("fast engine: an FFT of " + (pad + 1) + " points would be needed (grid of "
                    + points.length + " points refined " + b.oversampling + " times, wing reach " + reach
                    + " steps; at most " + FastEngine.MAX_FFT_LENGTH + "; use a cutoff, a smaller range or the exact "
                    + "engine)");
        }
        b.layout = SegmentLayout.choose(b.internalPoints, pad, FastEngine.MAX_FFT_LENGTH, forcedRingLength);
        b.offset = (int) reach + 4;
        for (Family f : b.families) {
            if (f != null && f.analytic) {
                FamilyStatistics widths = new FamilyStatistics();
                widths.add(f.alphaMax, f.gammaMax);
                b.anyAnalytic = true;
                b.wingModelError = Math.max(b.wingModelError, amplifiedWingModelError(widths, b.edgeCutoffCm1));
            }
        }
        b.analyticCutoffCm1 = b.anyAnalytic ? b.edgeCutoffCm1 : Double.NaN;
    }

    /**
     * Refuses up front, with the figures, rather than fail half-way for want of heap; decides whether the Lorentz
     * nodes' correction transforms are kept across segments (at most a quarter of the heap).
     */
    private void checkMemory(FastPlan.Builder b, int threads) {
        if (b.layout == null) {
            return;
        }
        int fftLength = b.layout.ringLength();
        int slices = b.sliceWidths.length;
        int correctionNodes = 0;
        for (Family f : b.families) {
            if (f != null && f.analytic) {
                correctionNodes += f.lorentz.size();
            }
        }
        // per thread: lines, kernel and, on the analytic path, two half-length node corrections; the sin² table;
        // the raw output values; the lines kept and their families; the weights of the largest segment's lines
        long perThread = b.anyAnalytic ? 3 : 2;
        int segmentLines = LineDistribution.maxSegmentLines(b, lines);
        long bytes = ((long) Math.min(SliceConvolver.BLOCKS, slices) + perThread * threads + 1) * fftLength
                * Double.BYTES
                + (b.anyAnalytic ? (long) (fftLength / 2 + 1) * Double.BYTES : 0)
                + (long) grid.size() * Double.BYTES
                + lines.bytes() + lines.count
                + (long) segmentLines * LineDistribution.BYTES_PER_SEGMENT_LINE;
        long heap = Runtime.getRuntime().maxMemory();
        if (bytes > heap) {
            throw new InputException("fast engine: about " + bytes / (1 << 20) + " MB needed (FFT length " + fftLength
                    + ", " + lines.count + " lines kept, at most " + segmentLines + " in one of "
                    + b.layout.segments() + " segments) but the heap allows " + heap / (1 << 20)
                    + " MB; use a cutoff, a smaller range, fewer threads, a larger -Xmx or the exact engine");
        }
        long cacheBytes = 2L * correctionNodes * (fftLength / 2 + 1) * Double.BYTES;
        b.shareCorrections = b.layout.segments() > 1 && correctionNodes > 0 && cacheBytes <= heap / 4
                && bytes + cacheBytes <= heap;
    }
}
