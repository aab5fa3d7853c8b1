package org.linewright.grid.engine.fast;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * The measured errors against Lagrange's remainder theorem (Abramowitz &amp; Stegun 25.2.3): error =
 * ω(u)·f⁽ⁿ⁾(ξ)/n! for n nodes, so convergence of order n, and for a Lorentzian at its centre a closed form.
 */
class FastErrorModelTest {

    @Test
    void positionErrorOfALorentzianMatchesTheRemainderAtTheCentre() {
        // six-point stencil, nodes −2 … 3: L(x) ∝ 1/(1 + x²/γ²) has |L⁽⁶⁾(0)/L(0)| = 720/γ⁶, the largest relative sixth
        // derivative; max |ω(τ)| over τ ∈ [0, 1] is (5/2·3/2·1/2)² = 225/64 at τ = ½ → relative error
        // (225/64)·(720/6!)·(h/γ)⁶ = (225/64)·(h/γ)⁶ as h → 0
        double gamma = 0.1;
        double h = 0.005;
        double predicted = 225.0 / 64.0 * Math.pow(h / gamma, 6);
        assertEquals(predicted, FastErrorModel.positionError(h, 0.0, gamma), 0.05 * predicted);
    }

    @Test
    void singleDopplerNodeErrorMatchesTheLeadingTermOfTheGaussianMomentExpansion() {
        // V = L + (s²/2)·L'' + … for γL ≫ αD (s² = αD²/(2 ln 2), the expansion of L ⊗ G in the Gaussian's moments, the
        // asymptotic series of the Faddeeva function, Abramowitz & Stegun §7.1); at the centre |L''(0)|/L(0) = 2/γ², so
        // replacing αD by the node changes V by |Δs²|/γ² relative. αD ∈ [1, 1.2], node² = 1.22, γL = 200·αD: largest
        // at αD = 1, |Δs²| = 0.22/(2 ln 2), γ = 200
        double predicted = 0.22 / (2 * Math.log(2)) / (200.0 * 200.0);
        assertEquals(predicted, FastErrorModel.singleDopplerNodeError(1.0, 1.2, 200.0), 0.05 * predicted);
        // and it falls as (αD/γL)²
        double ratio = FastErrorModel.singleDopplerNodeError(1.0, 1.2, 200.0)
                / FastErrorModel.singleDopplerNodeError(1.0, 1.2, 400.0);
        assertEquals(4.0, ratio, 0.2);
        assertEquals(Math.sqrt(1.22), FastErrorModel.singleDopplerNode(1.0, 1.2), 1e-15);
    }

    @Test
    void errorsFallAsTheFourthPowerOfTheStep() {
        // position: sixth order (six-point stencil)
        double coarse = FastErrorModel.positionError(0.002, 0.004, 0.01);
        double fine = FastErrorModel.positionError(0.001, 0.004, 0.01);
        assertEquals(64.0, coarse / fine, 12.0);
        double dopplerCoarse = FastErrorModel.dopplerAxisError(0.04, 0.0);
        double dopplerFine = FastErrorModel.dopplerAxisError(0.02, 0.0);
        assertEquals(16.0, dopplerCoarse / dopplerFine, 3.0);
        double lorentzCoarse = FastErrorModel.lorentzAxisError(0.2, 0.0);
        double lorentzFine = FastErrorModel.lorentzAxisError(0.1, 0.0);
        assertEquals(16.0, lorentzCoarse / lorentzFine, 3.0);
    }

    @Test
    void depthIsWhereTheProfileFallsToOneMillionthOfItsPeak() {
        // Gaussian of HWHM α: exp(−ln2·x²/α²) = 10⁻⁶ at x = α·√(ln 10⁶/ln 2) (closed form)
        double alpha = 0.01;
        assertEquals(alpha * Math.sqrt(Math.log(1e6) / Math.log(2)), FastErrorModel.depthDetuning(alpha, 0.0),
                1e-9 * alpha);
        // Lorentzian: 1/(1 + x²/γ²) = 10⁻⁶ at x = γ·√(10⁶ − 1)
        double gamma = 0.02;
        assertEquals(gamma * Math.sqrt(1e6 - 1), FastErrorModel.depthDetuning(0.0, gamma), 1e-7 * gamma * 1000);
    }

    @Test
    void largestStepMeetsItsBudget() {
        double step = FastErrorModel.largestStep(s -> FastErrorModel.lorentzAxisError(s, 0.1), 2e-4, 1e-3, 2.0);
        assertTrue(FastErrorModel.lorentzAxisError(step, 0.1) <= 2e-4);
        assertTrue(FastErrorModel.lorentzAxisError(step * 1.05, 0.1) > 2e-4 * 1.01);
    }

    @Test
    void flooredLorentzErrorFallsAsTheFourthPowerOfTheFloor() {
        // four nodes {0, γf, γf·e^δ, γf·e^2δ}: the remainder scales as γf⁴·∂⁴V/∂γ⁴ (A&S 25.2.3) while γf ≪ αD; the
        // criterion's depth moves out slowly with γL, so the measured ratio per halving approaches 2⁴ from below
        double coarse = FastErrorModel.flooredLorentzError(0.3, 160.0);
        double fine = FastErrorModel.flooredLorentzError(0.3, 320.0);
        assertEquals(14.0, coarse / fine, 3.0);
        // and it only falls as αD grows against the floor: the smallest αD of a family is its worst case
        assertTrue(FastErrorModel.flooredLorentzError(0.3, 10.0) > FastErrorModel.flooredLorentzError(0.3, 20.0));
    }

    /**
     * The planner's rounding is conservative: at ratios between two grid values the measured error never exceeds
     * the error at the value the planner rounds to (the monotonicity its rounding relies on), and its step
     * searches never return a larger step than the exact search. Checked with the measures themselves at ratios
     * spread over the ranges the engine meets (a test of the assumption, not of numbers the planner produced).
     */
    @Test
    void plannerRoundingIsOnTheWorseSide() {
        double[] ratios = {0.013, 0.27, 1.9, 23.0};
        FastErrorModel.Form untruncated = FastErrorModel.Form.UNTRUNCATED;
        for (double r : ratios) {
            double lower = FastErrorModel.Planner.down(r);
            assertTrue(lower <= r && lower > r * Math.exp(-FastErrorModel.ROUNDING_LOG_STEP) * (1 - 1e-12), "down " + r);
            assertTrue(FastErrorModel.dopplerAxisError(0.4, lower) >= FastErrorModel.dopplerAxisError(0.4, r), "doppler " + r);
            assertTrue(FastErrorModel.lorentzAxisError(0.4, lower) >= FastErrorModel.lorentzAxisError(0.4, r), "lorentz " + r);
            assertTrue(FastErrorModel.Planner.position(0.5, 1.0, r, untruncated)
                            >= FastErrorModel.positionError(0.5, 1.0, r), "position " + r);
            assertTrue(FastErrorModel.Planner.dopplerStep(r, 1e-4, 1e-3, 2.0, untruncated)
                    <= FastErrorModel.largestStep(s -> FastErrorModel.dopplerAxisError(s, r), 1e-4, 1e-3, 2.0), "step " + r);
            assertTrue(FastErrorModel.Planner.lorentzStep(r, 1e-4, 1e-3, 2.0, untruncated)
                    <= FastErrorModel.largestStep(s -> FastErrorModel.lorentzAxisError(s, r), 1e-4, 1e-3, 2.0), "step " + r);
        }
        for (double a : new double[] {3.3, 17.0}) {
            assertTrue(FastErrorModel.Planner.floorError(0.3, a, untruncated) >= FastErrorModel.flooredLorentzError(0.3, a),
                    "floor " + a);
        }
        assertTrue(FastErrorModel.Planner.singleNodeError(1.0, 1.37, 12.0, untruncated)
                >= FastErrorModel.singleDopplerNodeError(1.0, 1.37, 12.0));
        // remembered answers are the measures' own values
        assertEquals(FastErrorModel.Planner.position(0.5, 1.0, 0.27, untruncated),
                FastErrorModel.Planner.position(0.5, 1.0, 0.27, untruncated));
    }

    /**
     * With a cutoff a few widths away the kernel's edge and its pedestal weigh against the criterion's floor: the
     * measured error grows as the cutoff shortens (the monotonicity the planner's rounding of the cutoff relies on),
     * and the planner's rounded form never measures less than the exact one.
     */
    @Test
    void aCloserCutoffWeighsMore() {
        for (boolean removed : new boolean[] {false, true}) {
            double far = FastErrorModel.lorentzAxisError(0.3, 0.1, new FastErrorModel.Form(40.0, removed, 1e-6, 0.05));
            double near = FastErrorModel.lorentzAxisError(0.3, 0.1, new FastErrorModel.Form(4.0, removed, 1e-6, 0.05));
            assertTrue(near > far, "pedestal removed " + removed + ": near " + near + ", far " + far);
            FastErrorModel.Form form = new FastErrorModel.Form(7.3, removed, 3e-7, 0.05);
            assertTrue(FastErrorModel.Planner.lorentzError(0.3, 0.1, form) >= FastErrorModel.lorentzAxisError(0.3, 0.1, form));
            assertTrue(FastErrorModel.Planner.dopplerError(0.3, 0.5, form) >= FastErrorModel.dopplerAxisError(0.3, 0.5, form));
        }
    }
}
