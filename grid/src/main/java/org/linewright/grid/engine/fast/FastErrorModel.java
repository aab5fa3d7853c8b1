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
}
