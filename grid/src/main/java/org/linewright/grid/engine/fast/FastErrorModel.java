package org.linewright.grid.engine.fast;

import org.linewright.broadening.voigt.VoigtProfile;

/**
 * Error of the fast engine's three distributions, measured on the Voigt profile itself rather than taken from an
 * asymptotic formula, and the step choices that keep each within a budget.
 *
 * <p>Each function returns the largest relative error |φ̃ − φ|/φ of one line's approximated profile φ̃ over the
 * detunings where φ ≥ {@link #DEPTH}·φ(0) (so a line alone meets the engine's criterion "σ ≥ 10⁻⁶·max σ"), the
 * maximum taken over 19 positions of the line between its stencil nodes (0.05 … 0.95) and 257 detunings placed
 * densely near the centre (x_k = x_depth·(k/256)³). The interpolation remainder is ω(u)·∂⁴φ/∂u⁴/4!
 * ({@link LagrangeWeights}); for a pure Gaussian it grows like the fourth power of the step times a Hermite
 * polynomial of the detuning, largest at the deepest point, which is why the depth is part of the measure.
 * About 25 000 profile evaluations per call.
 */
final class FastErrorModel {

    /**
     * Spacing in ln of the grid that {@link Planner}'s arguments are rounded to (1/64: 1.6 %), always towards the
     * worse side, so that a rounded call bounds the exact one from above.
     */
    static final double ROUNDING_LOG_STEP = 1.0 / 64;
    /** Largest number of remembered results before the memory is emptied (results do not depend on it). */
    private static final int MEMORY_LIMIT = 100_000;
    private static final java.util.concurrent.ConcurrentHashMap<MemoKey, Double> MEMORY =
            new java.util.concurrent.ConcurrentHashMap<>();

    private record MemoKey(int kind, double a, double b, double c, double d, Form form) {
    }

    /** Depth of the criterion: the engine's tolerance applies where σ ≥ 10⁻⁶·max σ. */
    static final double DEPTH = 1e-6;
    /** Points of the position stencil: six, so the position error falls as h⁶ (fewer refinements for narrow lines). */
    static final int POSITION_POINTS = 6;
    private static final int POSITIONS = 19;
    private static final int DETUNINGS = 256;

    private FastErrorModel() {
    }

    /**
     * The kernel a measure is made for, in units of the measured line's reference width (its αD for the Doppler axis,
     * its γL for the Lorentz axis, the floor for the floored axis, the smallest αD for the single node, αD for the
     * position): the cutoff R (+∞ for none), whether the pedestal V(R) is removed, the criterion's depth D (10⁻⁶, or
     * less when the output grid samples line peaks coarsely: then 10⁻⁶ of max σ is less than 10⁻⁶ of a line's peak)
     * and the width of the band below R in which the edge correction replaces the transform's value (where only the
     * width interpolation's error remains).
     *
     * <p>The measure of a kernel form is the largest of (1) |Δ(x) − Δ_p| / max(|K(x)|, D·V(0)) over 0 ≤ x ≤ R, where
     * Δ = approximation − profile, K = V − p the kernel (p the pedestal, Δ_p its approximation's error, both 0 when
     * the pedestal is kept): the error relative to the line's own contribution, or to the criterion's floor D·max σ
     * where the line is weaker than that (σ ≥ D·max σ ≥ D·S·V(0) wherever the criterion applies), and (2) with the
     * pedestal kept, Λ·|Δ(x)| / (D·V(0)) for x in the band below R: at points just beyond a line's cutoff its exact
     * value is 0 and σ may be made of other lines alone, while the corrected value still carries the width error of
     * the line's six position nodes (Λ, the six-point Lagrange weights' largest Σ|w_j|).
     *
     * @param cutoff         R in reference widths, or +∞
     * @param removePedestal whether the kernel is V − V(R)
     * @param depth          D
     * @param band           the edge band below R, in reference widths
     */
    record Form(double cutoff, boolean removePedestal, double depth, double band) {
        /** No cutoff, the criterion's own depth: the measure of the untruncated profile. */
        static final Form UNTRUNCATED = new Form(Double.POSITIVE_INFINITY, false, DEPTH, 0);

        boolean finite() {
            return Double.isFinite(cutoff);
        }

        /** The same form for another reference width, {@code factor} times the current one. */
        Form rescaled(double factor) {
            return new Form(cutoff / factor, removePedestal, depth, band / factor);
        }
    }

    /** Largest Σ|w_j| of the six-point centred Lagrange weights over positions in (0, 1) (their Lebesgue constant). */
    static final double LEBESGUE = lebesgue();

    private static double lebesgue() {
        double[] w = new double[POSITION_POINTS];
        double worst = 0;
        for (int p = 0; p <= 1000; p++) {
            LagrangeWeights.centred(POSITION_POINTS, p / 1000.0, w, 0);
            double sum = 0;
            for (double v : w) {
                sum += Math.abs(v);
            }
            worst = Math.max(worst, sum);
        }
        return worst;
    }

    /**
     * Detunings of a measure: {@value #DETUNINGS} + 1 placed densely near the centre, x_k = X·(k/256)³ up to
     * X = min(R, 4·x_D) (x_D where the profile falls to D of its peak), then, for a finite cutoff, 16 evenly in the
     * band below R and R itself (last).
     */
    private static double[] detunings(double alpha, double gamma, Form form) {
        double xDepth = depthDetuning(alpha, gamma, form.depth());
        double end = Math.min(form.cutoff(), 4 * xDepth);
        int extra = form.finite() ? 17 : 0;
        double[] x = new double[DETUNINGS + 1 + extra];
        for (int k = 0; k <= DETUNINGS; k++) {
            double f = (double) k / DETUNINGS;
            x[k] = end * f * f * f;
        }
        if (form.finite()) {
            double from = Math.max(0, form.cutoff() - form.band());
            for (int k = 0; k < 16; k++) {
                x[DETUNINGS + 1 + k] = from + (form.cutoff() - from) * k / 16.0;
            }
            x[x.length - 1] = form.cutoff();
        }
        return x;
    }

    /**
     * The measure of {@link Form} for one placement of the line: {@code exact[k]} and {@code approx[k]} at the
     * detunings {@code x} of {@link #detunings} (the last one R when the cutoff is finite), V(0) = {@code peak}.
     */
    private static double formError(double[] x, double[] exact, double[] approx, double peak, Form form) {
        int n = x.length;
        double floor = form.depth() * peak;
        double pedestal = 0;
        double pedestalError = 0;
        if (form.finite() && form.removePedestal()) {
            pedestal = exact[n - 1];
            pedestalError = approx[n - 1] - exact[n - 1];
        }
        double worst = 0;
        double bandFrom = form.finite() ? form.cutoff() - form.band() : Double.POSITIVE_INFINITY;
        for (int k = 0; k < n; k++) {
            double delta = approx[k] - exact[k];
            double kernel = Math.abs(exact[k] - pedestal);
            worst = Math.max(worst, Math.abs(delta - pedestalError) / Math.max(kernel, floor));
            if (!form.removePedestal() && x[k] >= bandFrom) {
                worst = Math.max(worst, LEBESGUE * Math.abs(delta) / floor);
            }
        }
        return worst;
    }

    /**
     * Doppler-axis error: a line of αD = 1, γL = {@code lorentzOverDoppler} placed between log-spaced nodes
     * {@code logStep} apart, weights Lagrange in αD², measured for the untruncated profile.
     */
    static double dopplerAxisError(double logStep, double lorentzOverDoppler) {
        return widthAxisError(logStep, lorentzOverDoppler, true, Form.UNTRUNCATED);
    }

    /** Doppler-axis error for a kernel form (in units of the line's αD). */
    static double dopplerAxisError(double logStep, double lorentzOverDoppler, Form form) {
        return widthAxisError(logStep, lorentzOverDoppler, true, form);
    }

    /**
     * Lorentz-axis error: a line of γL = 1, αD = {@code dopplerOverLorentz} placed between log-spaced nodes
     * {@code logStep} apart, weights Lagrange in γL, measured for the untruncated profile.
     */
    static double lorentzAxisError(double logStep, double dopplerOverLorentz) {
        return widthAxisError(logStep, dopplerOverLorentz, false, Form.UNTRUNCATED);
    }

    /** Lorentz-axis error for a kernel form (in units of the line's γL). */
    static double lorentzAxisError(double logStep, double dopplerOverLorentz, Form form) {
        return widthAxisError(logStep, dopplerOverLorentz, false, form);
    }

    private static double widthAxisError(double logStep, double otherWidth, boolean dopplerAxis, Form form) {
        double alpha = dopplerAxis ? 1.0 : otherWidth;
        double gamma = dopplerAxis ? otherWidth : 1.0;
        double[] x = detunings(alpha, gamma, form);
        double[] exact = new double[x.length];
        for (int k = 0; k < x.length; k++) {
            exact[k] = VoigtProfile.value(x[k], alpha, gamma);
        }
        double peak = VoigtProfile.value(0, alpha, gamma);
        return maxOverPlacements(POSITIONS, p -> {
            double t = p / (POSITIONS + 1.0);
            double[] nodes = new double[4];
            double[] variable = new double[4];
            double[] weights = new double[4];
            double[] approx = new double[x.length];
            for (int j = 0; j < 4; j++) {
                double w = Math.exp((j - 1 - t) * logStep);
                nodes[j] = w;
                variable[j] = dopplerAxis ? w * w : w;
            }
            // the line's own width is 1, so its variable (w or w²) is 1 as well
            LagrangeWeights.general(1.0, variable, 0, weights, 0);
            for (int k = 0; k < x.length; k++) {
                double a = 0;
                for (int j = 0; j < 4; j++) {
                    a += weights[j] * (dopplerAxis ? VoigtProfile.value(x[k], nodes[j], gamma)
                            : VoigtProfile.value(x[k], alpha, nodes[j]));
                }
                approx[k] = a;
            }
            return formError(x, exact, approx, peak, form);
        });
    }

    /** A measure's value at one placement p = 1 … n of the line (independent of the others). */
    private interface Placement {
        double error(int p);
    }

    /**
     * The largest error over placements 1 … n, evaluated in parallel (the common pool; a maximum does not depend on
     * the order, so the result is the same bit for bit).
     */
    private static double maxOverPlacements(int n, Placement placement) {
        return java.util.stream.IntStream.rangeClosed(1, n).parallel().mapToDouble(placement::error).max().orElse(0);
    }

    /**
     * Error of the floored Lorentz axis's first stencil ({@link WidthAxis#floored}): nodes {0, 1, e^δ, e^(2δ)} in
     * units of the floor, δ = {@code logStep}, a line of αD = {@code dopplerOverFloor} and γL = t·e^δ at 19 values
     * t ∈ (0, 1) — every Lorentz width from 0 to the second non-zero node — weights Lagrange in γL. Below the floor
     * the profile depends on γL only through the smooth first terms of its expansion in γL/αD, so this error falls
     * nearly as (floor/αD)⁴ (measured: a factor 11–13 per halving of floor/αD between 1/10 and 1/320); a larger αD
     * only makes it smaller, so the family's smallest αD is the worst case.
     */
    static double flooredLorentzError(double logStep, double dopplerOverFloor) {
        return flooredLorentzError(logStep, dopplerOverFloor, Form.UNTRUNCATED);
    }

    /** {@link #flooredLorentzError(double, double)} for a kernel form (in units of the floor). */
    static double flooredLorentzError(double logStep, double dopplerOverFloor, Form form) {
        double alpha = dopplerOverFloor;
        double[] nodes = {0.0, 1.0, Math.exp(logStep), Math.exp(2 * logStep)};
        return maxOverPlacements(POSITIONS, p -> {
            double gamma = p / (POSITIONS + 1.0) * nodes[2];
            double[] weights = new double[4];
            double[] x = detunings(alpha, gamma, form);
            double[] exact = new double[x.length];
            double[] approx = new double[x.length];
            LagrangeWeights.general(gamma, nodes, 0, weights, 0);
            for (int k = 0; k < x.length; k++) {
                exact[k] = VoigtProfile.value(x[k], alpha, gamma);
                double a = 0;
                for (int j = 0; j < 4; j++) {
                    a += weights[j] * VoigtProfile.value(x[k], alpha, nodes[j]);
                }
                approx[k] = a;
            }
            return formError(x, exact, approx, VoigtProfile.value(0, alpha, gamma), form);
        });
    }

    /**
     * The single Doppler node of a Lorentz-dominated family whose lines have αD in [lo, hi]: the middle of the αD²
     * range, √((lo² + hi²)/2), since the profile's αD dependence is, to first order, linear in αD² (the Gaussian's
     * variance).
     */
    static double singleDopplerNode(double alphaLoCm1, double alphaHiCm1) {
        return Math.sqrt(0.5 * (alphaLoCm1 * alphaLoCm1 + alphaHiCm1 * alphaHiCm1));
    }

    /**
     * Error of one Doppler node ({@link #singleDopplerNode}) for lines of αD in [lo, hi] and γL = r·αD, r =
     * {@code lorentzOverDoppler} (the family's smallest ratio, the worst case): the profile at the node's αD
     * against the line's own, at 9 values of αD evenly spaced in αD² over the range (the ends included), for the
     * untruncated profile. For r ≫ 1 it falls as (αD/γL)²: V − L ≈ (s²/2)·L'' near the centre.
     */
    static double singleDopplerNodeError(double alphaLoCm1, double alphaHiCm1, double lorentzOverDoppler) {
        return singleDopplerNodeError(alphaLoCm1, alphaHiCm1, lorentzOverDoppler, Form.UNTRUNCATED);
    }

    /** {@link #singleDopplerNodeError(double, double, double)} for a kernel form (in units of {@code alphaLoCm1}). */
    static double singleDopplerNodeError(double alphaLoCm1, double alphaHiCm1, double lorentzOverDoppler, Form form) {
        double node = singleDopplerNode(alphaLoCm1, alphaHiCm1);
        Form absolute = form.rescaled(1 / alphaLoCm1);
        return maxOverPlacements(9, q -> {
            int p = q - 1;
            double alpha = Math.sqrt(alphaLoCm1 * alphaLoCm1
                    + p / 8.0 * (alphaHiCm1 * alphaHiCm1 - alphaLoCm1 * alphaLoCm1));
            double gamma = lorentzOverDoppler * alpha;
            double[] x = detunings(alpha, gamma, absolute);
            double[] exact = new double[x.length];
            double[] approx = new double[x.length];
            for (int k = 0; k < x.length; k++) {
                exact[k] = VoigtProfile.value(x[k], alpha, gamma);
                approx[k] = VoigtProfile.value(x[k], node, gamma);
            }
            return formError(x, exact, approx, VoigtProfile.value(0, alpha, gamma), absolute);
        });
    }

    /**
     * Position error: a line of widths (αD, γL) spread over {@link #POSITION_POINTS} grid points {@code stepCm1}
     * apart with the weights of {@link LagrangeWeights#centred}, both sides of the centre, untruncated profile.
     */
    static double positionError(double stepCm1, double dopplerHwhmCm1, double lorentzHwhmCm1) {
        return positionError(stepCm1, dopplerHwhmCm1, lorentzHwhmCm1, Form.UNTRUNCATED);
    }

    /**
     * Position error for a kernel form (in cm⁻¹ here: the form's widths in the same unit as the step). Detunings
     * inside the edge band are left out: there the edge correction replaces the transform's value exactly in
     * position ({@link EdgeCorrection}).
     */
    static double positionError(double stepCm1, double dopplerHwhmCm1, double lorentzHwhmCm1, Form form) {
        double[] x = detunings(dopplerHwhmCm1, lorentzHwhmCm1, form);
        int n = x.length;
        double bandFrom = form.finite() ? form.cutoff() - form.band() : Double.POSITIVE_INFINITY;
        double floor = form.depth() * VoigtProfile.value(0, dopplerHwhmCm1, lorentzHwhmCm1);
        double pedestal = form.finite() && form.removePedestal()
                ? VoigtProfile.value(form.cutoff(), dopplerHwhmCm1, lorentzHwhmCm1) : 0;
        int shift = POSITION_POINTS / 2 - 1;
        return maxOverPlacements(POSITIONS, p -> {
            double tau = p / (POSITIONS + 1.0);
            double[] weights = new double[POSITION_POINTS];
            LagrangeWeights.centred(POSITION_POINTS, tau, weights, 0);
            double worst = 0;
            for (int side = -1; side <= 1; side += 2) {
                for (int k = 0; k < n; k++) {
                    if (x[k] >= bandFrom) {
                        continue;
                    }
                    double xs = side * x[k];
                    double exact = VoigtProfile.value(xs, dopplerHwhmCm1, lorentzHwhmCm1);
                    double approx = 0;
                    for (int j = 0; j < POSITION_POINTS; j++) {
                        // node j − shift sits (τ − (j − shift))·h away from the true centre
                        approx += weights[j] * VoigtProfile.value(xs + (tau - (j - shift)) * stepCm1, dopplerHwhmCm1,
                                lorentzHwhmCm1);
                    }
                    // a constant pedestal is reproduced exactly by the weights (they sum to 1)
                    worst = Math.max(worst, Math.abs(approx - exact) / Math.max(Math.abs(exact - pedestal), floor));
                }
            }
            return worst;
        });
    }

    /** The detuning where the profile falls to {@link #DEPTH} of its peak (doubling, then 60 bisections). */
    static double depthDetuning(double dopplerHwhmCm1, double lorentzHwhmCm1) {
        return depthDetuning(dopplerHwhmCm1, lorentzHwhmCm1, DEPTH);
    }

    /** The detuning where the profile falls to {@code depth} of its peak (doubling, then 60 bisections). */
    static double depthDetuning(double dopplerHwhmCm1, double lorentzHwhmCm1, double depth) {
        double target = depth * VoigtProfile.value(0, dopplerHwhmCm1, lorentzHwhmCm1);
        double hi = Math.max(dopplerHwhmCm1, lorentzHwhmCm1);
        while (VoigtProfile.value(hi, dopplerHwhmCm1, lorentzHwhmCm1) > target) {
            hi *= 2;
        }
        double lo = 0;
        for (int i = 0; i < 60; i++) {
            double mid = 0.5 * (lo + hi);
            if (VoigtProfile.value(mid, dopplerHwhmCm1, lorentzHwhmCm1) > target) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    /** Error as a function of a step, assumed to grow with it. */
    interface StepError {
        double at(double step);
    }

    /** Bisections of a step search: ln(2/10⁻³)/2¹² ≈ 0.002 in ln(step). */
    static final int BISECTIONS = 12;

    /**
     * The largest log step in [{@code minStep}, {@code maxStep}] whose error is within {@code budget}, by
     * {@value #BISECTIONS} bisections in ln(step) — to 0.2 % of the step over the searched range (the errors fall
     * about as its fourth power, so at most ~1 % of the budget is left unused); {@code minStep} if even that exceeds
     * the budget.
     */
    static double largestStep(StepError error, double budget, double minStep, double maxStep) {
        if (error.at(maxStep) <= budget) {
            return maxStep;
        }
        double lo = Math.log(minStep);
        double hi = Math.log(maxStep);
        if (error.at(minStep) > budget) {
            return minStep;
        }
        for (int i = 0; i < BISECTIONS; i++) {
            double mid = 0.5 * (lo + hi);
            if (error.at(Math.exp(mid)) <= budget) {
                lo = mid;
            } else {
                hi = mid;
            }
        }
        return Math.exp(lo);
    }

    /**
     * The error measures and step searches as the engine uses them, with their arguments reduced to dimensionless
     * ratios (the relative error of a profile does not depend on the width scale), rounded on a log grid of
     * {@link #ROUNDING_LOG_STEP} towards the worse side and remembered across calls. Each measure costs some 25 000
     * profile evaluations and a step search up to 26 measures; an engine plans every table block afresh from its
     * own lines, whose width ranges differ only slightly from block to block and from one (p, T) to the next, so
     * most plans repeat an earlier search exactly. Rounding keeps every answer conservative: an error is measured
     * at a ratio at least as unfavourable as the true one (the measures fall as a line gets wider relative to the
     * step or the node spacing, more Gaussian for the Lorentz axis and more Lorentzian for the Doppler axis — the
     * monotonicity {@code FastErrorModelTest} checks), and a search runs with a budget rounded down. Results are
     * pure functions of their arguments, so remembering them changes no bit of σ.
     */
    static final class Planner {
        private static final int DOPPLER_STEP = 1;
        private static final int LORENTZ_STEP = 2;
        private static final int FLOOR_RATIO = 3;
        private static final int SINGLE_NODE_INVERSE = 4;
        private static final int SINGLE_NODE_ERROR = 5;
        private static final int POSITION = 6;
        private static final int DOPPLER_ERROR = 7;
        private static final int LORENTZ_ERROR = 8;
        private static final int FLOOR_ERROR = 9;

        private Planner() {
        }

        /** {@code v} rounded up on the log grid (0 and negative values unchanged). */
        static double up(double v) {
            return v > 0 && Double.isFinite(v) ? Math.exp(Math.ceil(Math.log(v) / ROUNDING_LOG_STEP) * ROUNDING_LOG_STEP) : v;
        }

        /** {@code v} rounded down on the log grid (0 and negative values unchanged). */
        static double down(double v) {
            return v > 0 && Double.isFinite(v) ? Math.exp(Math.floor(Math.log(v) / ROUNDING_LOG_STEP) * ROUNDING_LOG_STEP) : v;
        }

        /**
         * A form rounded to the worse side: a shorter cutoff (the edge and the pedestal weigh more), a shallower
         * depth and a wider band.
         */
        static Form worse(Form f) {
            return new Form(down(f.cutoff()), f.removePedestal(), down(f.depth()), up(f.band()));
        }

        private static double remember(int kind, double a, double b, double c, double d, Form form,
                                       java.util.function.DoubleSupplier measure) {
            MemoKey key = new MemoKey(kind, a, b, c, d, form);
            Double known = MEMORY.get(key);
            if (known != null) {
                return known;
            }
            double value = measure.getAsDouble();
            if (MEMORY.size() >= MEMORY_LIMIT) {
                MEMORY.clear();
            }
            MEMORY.put(key, value);
            return value;
        }

        /** {@link #largestStep} of {@link #dopplerAxisError} at γL/αD = {@code lorentzOverDoppler}. */
        static double dopplerStep(double lorentzOverDoppler, double budget, double minStep, double maxStep, Form form) {
            double r = down(lorentzOverDoppler);
            double b = down(budget);
            Form f = worse(form);
            return remember(DOPPLER_STEP, r, b, minStep, maxStep, f,
                    () -> largestStep(s -> dopplerAxisError(s, r, f), b, minStep, maxStep));
        }

        /** {@link #largestStep} of {@link #lorentzAxisError} at αD/γL = {@code dopplerOverLorentz}. */
        static double lorentzStep(double dopplerOverLorentz, double budget, double minStep, double maxStep, Form form) {
            double r = down(dopplerOverLorentz);
            double b = down(budget);
            Form f = worse(form);
            return remember(LORENTZ_STEP, r, b, minStep, maxStep, f,
                    () -> largestStep(s -> lorentzAxisError(s, r, f), b, minStep, maxStep));
        }

        /**
         * The largest floor ratio x = γ_f/αD in [min, max] with {@link #flooredLorentzError}(δ, 1/x) within budget;
         * {@code formPerAlpha} in units of αD (rescaled to the floor for each ratio tried).
         */
        static double floorRatio(double logStep, double budget, double minRatio, double maxRatio, Form formPerAlpha) {
            double b = down(budget);
            Form f = worse(formPerAlpha);
            return remember(FLOOR_RATIO, logStep, b, minRatio, maxRatio, f,
                    () -> largestStep(x -> flooredLorentzError(logStep, 1 / x, f.rescaled(x)), b, minRatio, maxRatio));
        }

        /**
         * The smallest ratio r = γL/αD, 1/r in [min, max], from which one Doppler node keeps {@link
         * #singleDopplerNodeError}(lo, hi, r) within budget, for lines of αD in [lo, hi] (the error depends on hi/lo
         * only, rounded up; it grows with 1/r); +∞ when even 1/r = min exceeds the budget. {@code form} in units of
         * lo.
         */
        static double singleNodeSplitRatio(double loCm1, double hiCm1, double budget, double min, double max,
                                           Form form) {
            double spread = up(hiCm1 / loCm1);
            double b = down(budget);
            Form f = worse(form);
            return remember(SINGLE_NODE_INVERSE, spread, b, min, max, f, () -> {
                double inverse = largestStep(x -> singleDopplerNodeError(1.0, spread, 1 / x, f), b, min, max);
                return singleDopplerNodeError(1.0, spread, 1 / inverse, f) <= b ? 1 / inverse : Double.POSITIVE_INFINITY;
            });
        }

        /** {@link #singleDopplerNodeError}, rounded to the worse side ({@code form} in units of lo). */
        static double singleNodeError(double loCm1, double hiCm1, double lorentzOverDoppler, Form form) {
            double spread = up(hiCm1 / loCm1);
            double r = down(lorentzOverDoppler);
            Form f = worse(form);
            return remember(SINGLE_NODE_ERROR, spread, r, 0, 0, f, () -> singleDopplerNodeError(1.0, spread, r, f));
        }

        /**
         * {@link #positionError}, with h/αD rounded up and γL/αD down (h/γL up for pure Lorentz lines); {@code
         * formCm1} in cm⁻¹ (rescaled here to the line's reference width).
         */
        static double position(double stepCm1, double dopplerHwhmCm1, double lorentzHwhmCm1, Form formCm1) {
            if (dopplerHwhmCm1 > 0) {
                double h = up(stepCm1 / dopplerHwhmCm1);
                double g = down(lorentzHwhmCm1 / dopplerHwhmCm1);
                Form f = worse(formCm1.rescaled(dopplerHwhmCm1));
                return remember(POSITION, h, 1, g, 0, f, () -> positionError(h, 1.0, g, f));
            }
            double h = up(stepCm1 / lorentzHwhmCm1);
            Form f = worse(formCm1.rescaled(lorentzHwhmCm1));
            return remember(POSITION, h, 0, 1, 0, f, () -> positionError(h, 0.0, 1.0, f));
        }

        /** {@link #dopplerAxisError} with the ratio rounded down ({@code form} in units of αD). */
        static double dopplerError(double logStep, double lorentzOverDoppler, Form form) {
            double r = down(lorentzOverDoppler);
            Form f = worse(form);
            return remember(DOPPLER_ERROR, logStep, r, 0, 0, f, () -> dopplerAxisError(logStep, r, f));
        }

        /** {@link #lorentzAxisError} with the ratio rounded down ({@code form} in units of γL). */
        static double lorentzError(double logStep, double dopplerOverLorentz, Form form) {
            double r = down(dopplerOverLorentz);
            Form f = worse(form);
            return remember(LORENTZ_ERROR, logStep, r, 0, 0, f, () -> lorentzAxisError(logStep, r, f));
        }

        /** {@link #flooredLorentzError} with the ratio rounded down ({@code form} in units of the floor). */
        static double floorError(double logStep, double dopplerOverFloor, Form form) {
            double r = down(dopplerOverFloor);
            Form f = worse(form);
            return remember(FLOOR_ERROR, logStep, r, 0, 0, f, () -> flooredLorentzError(logStep, r, f));
        }
    }
}
