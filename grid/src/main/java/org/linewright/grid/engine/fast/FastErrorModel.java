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

    private record MemoKey(int kind, double a, double b, double c, double d) {
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
     * Doppler-axis error: a line of αD = 1, γL = {@code lorentzOverDoppler} placed between log-spaced nodes
     * {@code logStep} apart, weights Lagrange in αD².
     */
    static double dopplerAxisError(double logStep, double lorentzOverDoppler) {
        return widthAxisError(logStep, lorentzOverDoppler, true);
    }

    /**
     * Lorentz-axis error: a line of γL = 1, αD = {@code dopplerOverLorentz} placed between log-spaced nodes
     * {@code logStep} apart, weights Lagrange in γL.
     */
    static double lorentzAxisError(double logStep, double dopplerOverLorentz) {
        return widthAxisError(logStep, dopplerOverLorentz, false);
    }

    private static double widthAxisError(double logStep, double otherWidth, boolean dopplerAxis) {
        double alpha = dopplerAxis ? 1.0 : otherWidth;
        double gamma = dopplerAxis ? otherWidth : 1.0;
        double xDepth = depthDetuning(alpha, gamma);
        double[] nodes = new double[4];
        double[] variable = new double[4];
        double[] weights = new double[4];
        double worst = 0;
        for (int p = 1; p <= POSITIONS; p++) {
            double t = p / (POSITIONS + 1.0);
            for (int j = 0; j < 4; j++) {
                double w = Math.exp((j - 1 - t) * logStep);
                nodes[j] = w;
                variable[j] = dopplerAxis ? w * w : w;
            }
            // the line's own width is 1, so its variable (w or w²) is 1 as well
            LagrangeWeights.general(1.0, variable, 0, weights, 0);
            for (int k = 0; k <= DETUNINGS; k++) {
                double f = (double) k / DETUNINGS;
                double x = xDepth * f * f * f;
                double exact = VoigtProfile.value(x, alpha, gamma);
                double approx = 0;
                for (int j = 0; j < 4; j++) {
                    approx += weights[j] * (dopplerAxis ? VoigtProfile.value(x, nodes[j], gamma)
                            : VoigtProfile.value(x, alpha, nodes[j]));
                }
                worst = Math.max(worst, Math.abs(approx - exact) / exact);
            }
        }
        return worst;
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
        double alpha = dopplerOverFloor;
        double[] nodes = {0.0, 1.0, Math.exp(logStep), Math.exp(2 * logStep)};
        double[] weights = new double[4];
        double worst = 0;
        for (int p = 1; p <= POSITIONS; p++) {
            double gamma = p / (POSITIONS + 1.0) * nodes[2];
            double xDepth = depthDetuning(alpha, gamma);
            LagrangeWeights.general(gamma, nodes, 0, weights, 0);
            for (int k = 0; k <= DETUNINGS; k++) {
                double f = (double) k / DETUNINGS;
                double x = xDepth * f * f * f;
                double exact = VoigtProfile.value(x, alpha, gamma);
                double approx = 0;
                for (int j = 0; j < 4; j++) {
                    approx += weights[j] * VoigtProfile.value(x, alpha, nodes[j]);
                }
                worst = Math.max(worst, Math.abs(approx - exact) / exact);
            }
        }
        return worst;
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
     * against the line's own, at 9 values of αD evenly spaced in αD² over the range (the ends included), over
     * 257 detunings to the criterion's depth. For r ≫ 1 it falls as (αD/γL)²: V − L ≈ (s²/2)·L'' near the centre.
     */
    static double singleDopplerNodeError(double alphaLoCm1, double alphaHiCm1, double lorentzOverDoppler) {
        double node = singleDopplerNode(alphaLoCm1, alphaHiCm1);
        double worst = 0;
        for (int p = 0; p <= 8; p++) {
            double alpha = Math.sqrt(alphaLoCm1 * alphaLoCm1
                    + p / 8.0 * (alphaHiCm1 * alphaHiCm1 - alphaLoCm1 * alphaLoCm1));
            double gamma = lorentzOverDoppler * alpha;
            double xDepth = depthDetuning(alpha, gamma);
            for (int k = 0; k <= DETUNINGS; k++) {
                double f = (double) k / DETUNINGS;
                double x = xDepth * f * f * f;
                double exact = VoigtProfile.value(x, alpha, gamma);
                double approx = VoigtProfile.value(x, node, gamma);
                worst = Math.max(worst, Math.abs(approx - exact) / exact);
            }
        }
        return worst;
    }

    /**
     * Position error: a line of widths (αD, γL) spread over {@link #POSITION_POINTS} grid points {@code stepCm1}
     * apart with the weights of {@link LagrangeWeights#centred}, both sides of the centre.
     */
    static double positionError(double stepCm1, double dopplerHwhmCm1, double lorentzHwhmCm1) {
        double xDepth = depthDetuning(dopplerHwhmCm1, lorentzHwhmCm1);
        double[] weights = new double[POSITION_POINTS];
        int shift = POSITION_POINTS / 2 - 1;
        double worst = 0;
        for (int p = 1; p <= POSITIONS; p++) {
            double tau = p / (POSITIONS + 1.0);
            LagrangeWeights.centred(POSITION_POINTS, tau, weights, 0);
            for (int k = -DETUNINGS; k <= DETUNINGS; k++) {
                double f = (double) k / DETUNINGS;
                double x = xDepth * f * f * f;
                double exact = VoigtProfile.value(x, dopplerHwhmCm1, lorentzHwhmCm1);
                double approx = 0;
                for (int j = 0; j < POSITION_POINTS; j++) {
                    // node j − shift sits (τ − (j − shift))·h away from the true centre
                    approx += weights[j] * VoigtProfile.value(x + (tau - (j - shift)) * stepCm1, dopplerHwhmCm1,
                            lorentzHwhmCm1);
                }
                worst = Math.max(worst, Math.abs(approx - exact) / exact);
            }
        }
        return worst;
    }

    /** The detuning where the profile falls to {@link #DEPTH} of its peak (doubling, then 60 bisections). */
    static double depthDetuning(double dopplerHwhmCm1, double lorentzHwhmCm1) {
        double target = DEPTH * VoigtProfile.value(0, dopplerHwhmCm1, lorentzHwhmCm1);
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

    /**
     * The largest log step in [{@code minStep}, {@code maxStep}] whose error is within {@code budget}, by 24
     * bisections in ln(step); {@code minStep} if even that exceeds the budget.
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
        for (int i = 0; i < 24; i++) {
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

        private static double remember(int kind, double a, double b, double c, double d,
                                       java.util.function.DoubleSupplier measure) {
            MemoKey key = new MemoKey(kind, a, b, c, d);
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
        static double dopplerStep(double lorentzOverDoppler, double budget, double minStep, double maxStep) {
            double r = down(lorentzOverDoppler);
            double b = down(budget);
            return remember(DOPPLER_STEP, r, b, minStep, maxStep,
                    () -> largestStep(s -> dopplerAxisError(s, r), b, minStep, maxStep));
        }

        /** {@link #largestStep} of {@link #lorentzAxisError} at αD/γL = {@code dopplerOverLorentz}. */
        static double lorentzStep(double dopplerOverLorentz, double budget, double minStep, double maxStep) {
            double r = down(dopplerOverLorentz);
            double b = down(budget);
            return remember(LORENTZ_STEP, r, b, minStep, maxStep,
                    () -> largestStep(s -> lorentzAxisError(s, r), b, minStep, maxStep));
        }

        /** The largest floor ratio x = γ_f/αD in [min, max] with {@link #flooredLorentzError}(δ, 1/x) within budget. */
        static double floorRatio(double logStep, double budget, double minRatio, double maxRatio) {
            double b = down(budget);
            return remember(FLOOR_RATIO, logStep, b, minRatio, maxRatio,
                    () -> largestStep(x -> flooredLorentzError(logStep, 1 / x), b, minRatio, maxRatio));
        }

        /**
         * The smallest ratio r = γL/αD, 1/r in [min, max], from which one Doppler node keeps {@link
         * #singleDopplerNodeError}(lo, hi, r) within budget, for lines of αD in [lo, hi] (the error depends on hi/lo
         * only, rounded up; it grows with 1/r); +∞ when even 1/r = min exceeds the budget.
         */
        static double singleNodeSplitRatio(double loCm1, double hiCm1, double budget, double min, double max) {
            double spread = up(hiCm1 / loCm1);
            double b = down(budget);
            return remember(SINGLE_NODE_INVERSE, spread, b, min, max, () -> {
                double inverse = largestStep(x -> singleDopplerNodeError(1.0, spread, 1 / x), b, min, max);
                return singleDopplerNodeError(1.0, spread, 1 / inverse) <= b ? 1 / inverse : Double.POSITIVE_INFINITY;
            });
        }

        /** {@link #singleDopplerNodeError}, rounded to the worse side. */
        static double singleNodeError(double loCm1, double hiCm1, double lorentzOverDoppler) {
            double spread = up(hiCm1 / loCm1);
            double r = down(lorentzOverDoppler);
            return remember(SINGLE_NODE_ERROR, spread, r, 0, 0, () -> singleDopplerNodeError(1.0, spread, r));
        }

        /** {@link #positionError}, with h/αD rounded up and γL/αD down (h/γL up for pure Lorentz lines). */
        static double position(double stepCm1, double dopplerHwhmCm1, double lorentzHwhmCm1) {
            if (dopplerHwhmCm1 > 0) {
                double h = up(stepCm1 / dopplerHwhmCm1);
                double g = down(lorentzHwhmCm1 / dopplerHwhmCm1);
                return remember(POSITION, h, 1, g, 0, () -> positionError(h, 1.0, g));
            }
            double h = up(stepCm1 / lorentzHwhmCm1);
            return remember(POSITION, h, 0, 1, 0, () -> positionError(h, 0.0, 1.0));
        }

        /** {@link #dopplerAxisError} with the ratio rounded down. */
        static double dopplerError(double logStep, double lorentzOverDoppler) {
            double r = down(lorentzOverDoppler);
            return remember(DOPPLER_ERROR, logStep, r, 0, 0, () -> dopplerAxisError(logStep, r));
        }

        /** {@link #lorentzAxisError} with the ratio rounded down. */
        static double lorentzError(double logStep, double dopplerOverLorentz) {
            double r = down(dopplerOverLorentz);
            return remember(LORENTZ_ERROR, logStep, r, 0, 0, () -> lorentzAxisError(logStep, r));
        }

        /** {@link #flooredLorentzError} with the ratio rounded down. */
        static double floorError(double logStep, double dopplerOverFloor) {
            double r = down(dopplerOverFloor);
            return remember(FLOOR_ERROR, logStep, r, 0, 0, () -> flooredLorentzError(logStep, r));
        }
    }
}
