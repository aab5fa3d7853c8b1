package org.linewright.broadening.wings;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import org.hipparchus.analysis.integration.IterativeLegendreGaussIntegrator;
import org.hipparchus.special.Erf;
import org.junit.jupiter.api.Test;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.voigt.LorentzProfile;

/** Area fractions removed by cutoffs, against closed forms, Hipparchus and SciPy. */
class WingLossTest {

    /**
     * Lorentz tail (2/π)·atan(γ/d): equals 1/2 at d = γ (atan 1 = π/4, common practice) and 1 − 2∫₀^d L
     * computed by Hipparchus' Gauss–Legendre integrator.
     */
    @Test
    void lorentzTailFormula() {
        assertEquals(0.5, WingLoss.lorentzTailFraction(0.07, 0.07), 1e-15);
        assertEquals(1.0, WingLoss.lorentzTailFraction(0.0, 0.07), 0.0);
        IterativeLegendreGaussIntegrator integrator = new IterativeLegendreGaussIntegrator(10, 1e-14, 1e-16);
        for (double d : new double[] {0.01, 0.3, 2.0, 25.0}) {
            double gamma = 0.07;
            double inner = 0;
            double lo = 0;
            for (double hi = gamma / 8; lo < d; hi *= 2) {
                double top = Math.min(hi, d);
                inner += integrator.integrate(Integer.MAX_VALUE, x -> LorentzProfile.value(x, gamma), lo, top);
                lo = top;
            }
            assertEquals(1 - 2 * inner, WingLoss.lorentzTailFraction(d, gamma), 1e-13, "d=" + d);
        }
        // 25 cm-1 cutoff, γ = 0.07 cm-1: 0.178 % of the area lost (value from the formula with a hand calculator,
        // 2/π·atan(0.0028) = 0.0017825307, cross-checked with numpy.arctan)
        assertEquals(0.0017825307043, WingLoss.lorentzTailFraction(25, 0.07), 1e-13);
    }

    /** Gaussian tail erfc(√ln2·d/αD) against Hipparchus' Erf.erfc. */
    @Test
    void dopplerTailAgainstHipparchus() {
        for (double ratio : new double[] {0.0, 0.1, 1.0, 3.0, 6.0, 20.0}) {
            double alphaD = 0.004;
            double expected = Erf.erfc(Math.sqrt(Math.log(2)) * ratio);
            double actual = WingLoss.dopplerTailFraction(ratio * alphaD, alphaD);
            // a rounding of the argument u is amplified 2u² times in the relative value of erfc(u)
            double u = Math.sqrt(Math.log(2)) * ratio;
            double tolerance = (1e-14 + 2 * u * u * 4e-16) * expected;
            assertEquals(expected, actual, tolerance, "d/αD=" + ratio);
        }
    }

    /** Voigt tail against scipy.integrate.quad on scipy.special.voigt_profile (wing-loss-reference.csv). */
    @Test
    void voigtTailAgainstScipy() throws IOException {
        int checked = 0;
        try (InputStream in = getClass().getResourceAsStream("wing-loss-reference.csv");
             BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8))) {
            String line;
            while ((line = r.readLine()) != null) {
                if (line.startsWith("#") || line.startsWith("alphaD")) {
                    continue;
                }
                String[] f = line.split(",");
                double alphaD = Double.parseDouble(f[0]);
                double gammaL = Double.parseDouble(f[1]);
                double d = Double.parseDouble(f[2]);
                double expected = Double.parseDouble(f[3]);
                double actual = WingLoss.tailFraction(LineShapeKind.VOIGT, d, alphaD, gammaL);
                assertEquals(expected, actual, 1e-10 * expected, line);
                checked++;
            }
        }
        assertEquals(8, checked);
    }

    /**
     * Near |Z| = 50 the asymptotic form and the numerical quadrature meet; both are checked against SciPy above.
     * Here they must agree with each other to 1e-10 on either side of the switch (the quadrature is reached just
     * inside |Z| = 50, the asymptotic form just outside; the tail changes by far less than 1e-10 in between).
     */
    @Test
    void voigtTailContinuousAtMethodSwitch() {
        double alphaD = 0.01;
        double scale = Math.sqrt(Math.log(2)) / alphaD;
        for (double y : new double[] {1e-3, 1.0, 10.0, 30.0}) {
            double gamma = y / scale;
            double x = Math.sqrt(2500 - y * y);
            double inside = WingLoss.voigtTailFraction((x - 1e-9) / scale, alphaD, gamma);
            double outside = WingLoss.voigtTailFraction((x + 1e-9) / scale, alphaD, gamma);
            assertEquals(inside, outside, 1e-10 * inside, "y=" + y);
        }
    }

    /** Voigt tail tends to the Lorentz and Gaussian closed forms in its limits. */
    @Test
    void voigtTailLimits() {
        // αD/γL = 1e-5: Voigt and Lorentz tails agree to ~(αD/d)²
        assertEquals(WingLoss.lorentzTailFraction(1.0, 0.05), WingLoss.voigtTailFraction(1.0, 5e-7, 0.05), 1e-12);
        // γL = 1e-12·αD: Gaussian tail, plus a Lorentz wing of about (2/π)·γL/d
        double gauss = Erf.erfc(Math.sqrt(Math.log(2)) * 2.0);
        assertEquals(gauss, WingLoss.voigtTailFraction(0.02, 0.01, 1e-14), 1e-10 * gauss);
        assertEquals(0.0, WingLoss.tailFraction(LineShapeKind.VOIGT, Double.POSITIVE_INFINITY, 0.01, 0.1));
    }

    /** Pedestal area 2d·φ(d) (rectangle of height φ(d) over the interval ±d). */
    @Test
    void pedestalFraction() {
        double d = 25;
        double gamma = 0.07;
        double expected = 2 * d * gamma / Math.PI / (d * d + gamma * gamma);
        assertEquals(expected, WingLoss.pedestalFraction(LineShapeKind.LORENTZ, d, 0, gamma, null), 1e-15);
        assertTrue(WingLoss.pedestalFraction(LineShapeKind.VOIGT, Double.POSITIVE_INFINITY, 0.01, 0.1, null) == 0);
    }
}
