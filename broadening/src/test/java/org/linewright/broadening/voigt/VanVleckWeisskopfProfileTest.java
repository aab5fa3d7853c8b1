package org.linewright.broadening.voigt;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * The Van Vleck–Weisskopf shape against values computed independently with SciPy, its Lorentz limit and its
 * area on ν &gt; 0 against the hand-derived antiderivative.
 *
 * <p>Reference values: Python 3.11.7, SciPy 1.17.1, NumPy 2.4.6,
 * <pre>
 *   from scipy.special import voigt_profile; import numpy as np
 *   V = lambda x, a, g: voigt_profile(x, a / np.sqrt(2 * np.log(2)), g)   # a = HWHM Doppler, g = HWHM Lorentz
 *   vvw = lambda nu, nu0, a, g: (nu / nu0)**2 * (V(nu - nu0, a, g) + V(nu + nu0, a, g))
 *   vvw(nu, 8.9, 9.47e-6, 0.3) for nu in (8.9, 9.2, 9.9, 11.9, 5.9, 2.0, 0.5, 20.0, 33.9)
 * </pre>
 * (a PH3-like line at 8.9 cm⁻¹, αD = 9.47×10⁻⁶ cm⁻¹ for m = 34 u at 300 K, γL = 0.3 cm⁻¹: about 3 atm of CO2 at
 * an assumed CO2-broadening coefficient of 0.1 cm⁻¹/atm, an illustrative value).
 */
class VanVleckWeisskopfProfileTest {

    private static final double NU0_CM1 = 8.9;
    private static final double ALPHA_CM1 = 9.47e-6;
    private static final double GAMMA_CM1 = 0.3;

    /** {ν, φ_VVW (SciPy), Voigt at ν − ν₀ (SciPy)}. */
    private static final double[][] SCIPY = {
        {8.9, 1.061334259357717, 1.061032953183309},
        {9.2, 0.5671957963567739, 0.5305164771636512},
        {9.9, 0.10873571443167454, 0.08760822556905302},
        {11.9, 0.019175635902043558, 0.010505276771963588},
        {5.9, 0.004808209377338356, 0.010505276771963588},
        {2.0, 0.0001416531131189222, 0.0020019489697175002},
        {0.5, 7.673465654793473e-06, 0.00135163433624061},
        {20.0, 0.004488313942150058, 0.0007744766087209033},
        {33.9, 0.0029726791066969106, 0.00015276674695670526},
    };

    @Test
    void matchesScipyAtSeveralOffsets() {
        for (double[] row : SCIPY) {
            double value = VanVleckWeisskopfProfile.value(row[0], NU0_CM1, ALPHA_CM1, GAMMA_CM1);
            assertEquals(row[1], value, 1e-11 * row[1], "nu = " + row[0]);
            // the Voigt of the same line, also from SciPy, through the project's profile
            assertEquals(row[2], VoigtProfile.value(row[0] - NU0_CM1, ALPHA_CM1, GAMMA_CM1), 1e-11 * row[2]);
        }
    }

    @Test
    void pressureBroadenedMillimetreLineDiffersFromVoigtInTheWings() {
        // issue: 8.9 cm⁻¹ line, CO2 at several bar; the VVW values themselves are asserted above (SciPy), and
        // here the shapes differ by far more than a 1e-3 tolerance relative to the peak in the wings
        double peak = SCIPY[0][1];
        for (double[] row : SCIPY) {
            if (Math.abs(row[0] - NU0_CM1) >= 3.0) {
                double vvw = VanVleckWeisskopfProfile.value(row[0], NU0_CM1, ALPHA_CM1, GAMMA_CM1);
                assertEquals(row[1], vvw, 1e-11 * row[1]);
                assertTrue(Math.abs(vvw - row[2]) > 1e-3 * peak || Math.abs(vvw / row[2] - 1) > 0.5,
                        "nu = " + row[0]);
            }
        }
    }

    @Test
    void lorentzOnlyByHand() {
        // αD = 0: (ν/ν₀)²·(1/π)[γ/((ν−ν₀)²+γ²) + γ/((ν+ν₀)²+γ²)], by hand at ν = 12: (12/8.9)²·(1/π)·
        // [0.3/(3.1² + 0.09) + 0.3/(20.9² + 0.09)] = 1.81795·0.318310·(0.0309278 + 0.00068668) = 0.0182944
        assertEquals(0.018294426540774247, VanVleckWeisskopfProfile.value(12.0, NU0_CM1, 0.0, GAMMA_CM1),
                1e-13);
        assertEquals(0.0182944, VanVleckWeisskopfProfile.value(12.0, NU0_CM1, 0.0, GAMMA_CM1), 1e-6);
        assertEquals(1.0613342601203768, VanVleckWeisskopfProfile.value(NU0_CM1, NU0_CM1, 0.0, GAMMA_CM1),
                1e-12);
    }

    @Test
    void tendsToLorentzForNarrowLines() {
        // γ ≪ ν₀: φ_VVW/L = (1 + u/ν₀)²·(1 + L(u + 2ν₀)/L(u)) → 1 + 2u/ν₀ (from the closed form)
        double nu0 = 1000.0;
        double gamma = 1e-3;
        for (double u : new double[] {0.0, 1e-3, -3e-3, 1e-2}) {
            double ratio = VanVleckWeisskopfProfile.value(nu0 + u, nu0, 0.0, gamma) / LorentzProfile.value(u, gamma);
            assertEquals(1.0 + 2 * u / nu0, ratio, 1e-9, "u = " + u);
        }
        assertEquals(LorentzProfile.value(0, gamma), VanVleckWeisskopfProfile.value(nu0, nu0, 0.0, gamma),
                1e-12 * LorentzProfile.value(0, gamma));
    }

    @Test
    void areaOnPositiveWavenumbersMatchesTheAntiderivative() {
        // ∫₀^(ν₀+d) φ_VVW dν with αD = 0, d = 25 cm⁻¹: hand-derived antiderivative (d/du gives γν²/(u²+γ²)/πν₀²)
        //   F₊(u) = [(ν₀²−γ²)·atan(u/γ) + ν₀γ·ln(u²+γ²) + γu]/(πν₀²), u = ν − ν₀
        //   F₋(w) = [(ν₀²−γ²)·atan(w/γ) − ν₀γ·ln(w²+γ²) + γw]/(πν₀²), w = ν + ν₀
        // and SciPy quad of the same integrand: 1.0630207304422636
        double d = 25.0;
        double analytic = plus(d) - plus(-NU0_CM1) + minus(2 * NU0_CM1 + d) - minus(NU0_CM1);
        assertEquals(1.0630207304422636, analytic, 1e-12);
        // the implementation's array kernel on a fine grid, trapezoid rule
        int n = 2_000_001;
        double[] grid = new double[n];
        double step = (NU0_CM1 + d) / (n - 1);
        for (int i = 0; i < n; i++) {
            grid[i] = i * step;
        }
        double[] out = new double[n];
        VanVleckWeisskopfProfile.addProfile(grid, 0, n, NU0_CM1, 0.0, GAMMA_CM1, 1.0, 0.0, out);
        double area = 0;
        for (int i = 1; i < n; i++) {
            area += 0.5 * step * (out[i - 1] + out[i]);
        }
        assertEquals(analytic, area, 1e-7);
        // without the −ν₀ resonance the area on ν > 0 would be short by ∫_{ν<0} of it: (1/π)atan(γ/ν₀) = 1.07 %
        assertTrue(analytic > 1.0);
    }

    private static double plus(double u) {
        double g = GAMMA_CM1;
        return ((NU0_CM1 * NU0_CM1 - g * g) * Math.atan(u / g) + NU0_CM1 * g * Math.log(u * u + g * g) + g * u)
                / (Math.PI * NU0_CM1 * NU0_CM1);
    }

    private static double minus(double w) {
        double g = GAMMA_CM1;
        return ((NU0_CM1 * NU0_CM1 - g * g) * Math.atan(w / g) - NU0_CM1 * g * Math.log(w * w + g * g) + g * w)
                / (Math.PI * NU0_CM1 * NU0_CM1);
    }

    @Test
    void automaticRule() {
        // γL/ν₀ = 0.034 at 300 K, c2ν₀/T = 0.043: chosen
        assertTrue(VanVleckWeisskopfProfile.chosenFor(NU0_CM1, GAMMA_CM1, 300.0));
        // the same line at low pressure (γL/ν₀ = 1e-5): Voigt
        assertFalse(VanVleckWeisskopfProfile.chosenFor(NU0_CM1, 8.9e-5, 300.0));
        // an infrared line at 10 atm: hν₀ ≫ kT, the (ν/ν₀)² factor is not the right one, so not chosen
        assertFalse(VanVleckWeisskopfProfile.chosenFor(2000.0, 0.7, 300.0));
        assertFalse(VanVleckWeisskopfProfile.chosenFor(0.0, 0.3, 300.0));
        assertThrows(IllegalArgumentException.class, () -> VanVleckWeisskopfProfile.value(1, 0, 0, 0.1));
        assertEquals(LineShapeKind.VAN_VLECK_WEISSKOPF, LineShapeKind.parse("VVW"));
    }
}
