package org.linewright.grid.engine.fast;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * The measured errors against Lagrange's remainder theorem (Abramowitz &amp; Stegun 25.2.3): error =
 * ω(u)·f⁗(ξ)/4!, so fourth-order convergence, and for a Lorentzian at its centre a closed form.
 */
class FastErrorModelTest {

    @Test
    void positionErrorOfALorentzianMatchesTheRemainderAtTheCentre() {
        // L(x) ∝ 1/(1 + x²/γ²): L⁗(0)/L(0) = 24/γ⁴, the largest relative fourth derivative; max |ω(τ)| over
        // τ ∈ [0, 1] for nodes −1, 0, 1, 2 is 9/16 at τ = ½ → relative error (9/16)·(h/γ)⁴ as h → 0
        double gamma = 0.1;
        double h = 0.005;
        double predicted = 9.0 / 16.0 * Math.pow(h / gamma, 4);
        assertEquals(predicted, FastErrorModel.positionError(h, 0.0, gamma), 0.05 * predicted);
    }

    @Test
    void errorsFallAsTheFourthPowerOfTheStep() {
        double coarse = FastErrorModel.positionError(0.002, 0.004, 0.01);
        double fine = FastErrorModel.positionError(0.001, 0.004, 0.01);
        assertEquals(16.0, coarse / fine, 3.0);
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
}
