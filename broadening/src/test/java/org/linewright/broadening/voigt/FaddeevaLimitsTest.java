package org.linewright.broadening.voigt;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.hipparchus.special.Erf;
import org.junit.jupiter.api.Test;

/** Faddeeva function on the axes and in its limits, against independent formulas and Hipparchus. */
class FaddeevaLimitsTest {

    /**
     * w(iy) = e^(y²)·erfc(y) (Abramowitz and Stegun 7.1.3 with z = iy), erfc from Hipparchus
     * {@code org.hipparchus.special.Erf}. Where e^(y²) overflows or erfc underflows (y &gt; 26) the scaled form is
     * checked against the asymptotic series erfcx(y) ≈ (1/(√π·y))·Σ (−1)ᵐ (2m−1)!!/(2y²)ᵐ (A&amp;S 7.1.23).
     */
    @Test
    void imaginaryAxisIsScaledComplementaryErrorFunction() {
        double worst = 0;
        for (double logY = -8; logY <= 4.0001; logY += 0.05) {
            double y = Math.pow(10, logY);
            double expected;
            if (y <= 26) {
                expected = Math.exp(y * y) * Erf.erfc(y);
            } else {
                expected = asymptoticErfcx(y);
            }
            double k = Faddeeva.voigtK(0, y);
            worst = Math.max(worst, Math.abs(k / expected - 1));
            assertEquals(0.0, Faddeeva.voigtL(0, y), 0.0, "L(0, y) must vanish");
            assertEquals(k, Faddeeva.erfcx(y), 2e-15 * k, "erfcx(y) and K(0, y) agree");
        }
        // Hipparchus erfc has about 1e-15 relative accuracy, amplified by nothing here; 1e-12 leaves margin.
        assertTrue(worst < 1e-12, "worst relative deviation " + worst);
    }

    /** erfcx(−y) = 2e^(y²) − erfcx(y): check at a few points against Hipparchus (A&amp;S 7.1.3 and 7.1.2). */
    @Test
    void erfcxForNegativeArgument() {
        for (double y : new double[] {0.1, 1.0, 3.0, 5.0}) {
            double expected = Math.exp(y * y) * Erf.erfc(-y);
            assertEquals(expected, Faddeeva.erfcx(-y), 1e-14 * expected);
        }
    }

    /** Gaussian limit K(x, 0) = e^(−x²) (A&amp;S 7.1.3 on the real axis), for x up to the underflow of e^(−x²). */
    @Test
    void realAxisIsGaussian() {
        for (double x = 0; x <= 27; x += 0.03125) {
            double expected = Math.exp(-x * x);
            assertEquals(expected, Faddeeva.voigtK(x, 0), 1e-13 * expected, "x=" + x);
            assertEquals(expected, Faddeeva.voigtK(-x, 0), 1e-13 * expected, "x=" + -x);
        }
    }

    /**
     * Far from the centre the Voigt function becomes the Lorentzian y/(√π(x² + y²)) with relative correction
     * (3x² − y²)/(2(x² + y²)²)·… of the asymptotic expansion w ≈ i/(√π z)·(1 + 1/(2z²)) (A&amp;S 7.1.23);
     * check K against the two-term expansion where its remainder is below 1e-12.
     */
    @Test
    void farWingIsLorentzian() {
        for (double x : new double[] {1e3, 3e3, 1e4, 1e5, 1e6, -1e6}) {
            for (double y : new double[] {1e-8, 1e-3, 1.0, 1e2, 1e3}) {
                double zRe = x;
                double zIm = y;
                // i/(√π z)·(1 + 1/(2z²)): compute in complex arithmetic
                double m2 = zRe * zRe + zIm * zIm;
                double invRe = zRe / m2;
                double invIm = -zIm / m2;
                double inv2Re = invRe * invRe - invIm * invIm;
                double inv2Im = 2 * invRe * invIm;
                double fRe = 1 + 0.5 * inv2Re;
                double fIm = 0.5 * inv2Im;
                double pRe = invRe * fRe - invIm * fIm;
                double pIm = invRe * fIm + invIm * fRe;
                double expectedK = -pIm * Faddeeva.INV_SQRT_PI;
                double expectedL = pRe * Faddeeva.INV_SQRT_PI;
                assertEquals(expectedK, Faddeeva.voigtK(x, y), 1e-11 * expectedK, "K at x=" + x + " y=" + y);
                assertEquals(expectedL, Faddeeva.voigtL(x, y), 1e-11 * Math.abs(expectedL), "L at x=" + x);
            }
        }
    }

    /**
     * Symmetry (A&amp;S 7.1.11 and 7.1.12): w(−z̄) = conj w(z), so K is even and L odd in x; for y &lt; 0,
     * w(z) = 2e^(−z²) − w(−z) (A&amp;S 7.1.11). Checked at z = 1 − i, where e^(−z²) = e^(2i) = cos 2 + i sin 2.
     */
    @Test
    void symmetryAndReflection() {
        assertEquals(Faddeeva.voigtK(2.5, 0.3), Faddeeva.voigtK(-2.5, 0.3), 0.0);
        assertEquals(-Faddeeva.voigtL(2.5, 0.3), Faddeeva.voigtL(-2.5, 0.3), 0.0);
        double reW = Faddeeva.voigtK(-1, 1);
        double imW = Faddeeva.voigtL(-1, 1);
        double expectedRe = 2 * Math.cos(2) - reW;
        double expectedIm = 2 * Math.sin(2) - imW;
        assertEquals(expectedRe, Faddeeva.voigtK(1, -1), 1e-14);
        assertEquals(expectedIm, Faddeeva.voigtL(1, -1), 1e-14);
    }

    /** w(1 + i) = 0.30474420525691254 + 0.2082189382028316·i (scipy.special.wofz(1+1j), SciPy 1.17.1). */
    @Test
    void knownValueAtOnePlusI() {
        assertEquals(0.30474420525691254, Faddeeva.voigtK(1, 1), 1e-15);
        assertEquals(0.2082189382028316, Faddeeva.voigtL(1, 1), 1e-15);
    }

    /** Limits at infinity: w(z) → 0 as |z| → ∞ in the upper half plane (w ~ i/(√π z), A&amp;S 7.1.23). */
    @Test
    void infiniteArguments() {
        double inf = Double.POSITIVE_INFINITY;
        assertEquals(0.0, Faddeeva.voigtK(inf, 1.0));
        assertEquals(0.0, Faddeeva.voigtL(inf, 1.0));
        assertEquals(0.0, Faddeeva.voigtK(-inf, 1.0));
        assertEquals(0.0, Faddeeva.voigtK(3.0, inf));
        assertEquals(0.0, Faddeeva.voigtL(3.0, inf));
        assertEquals(0.0, Faddeeva.erfcx(inf));
        assertTrue(Double.isNaN(Faddeeva.voigtK(Double.NaN, 1.0)));
    }

    /**
     * On the real axis L(x, 0) = (2/√π)·F(x), F Dawson's integral (A&amp;S 7.1.3 with 7.1.17); F from
     * scipy.special.dawsn (SciPy 1.17.1), printed with repr.
     */
    @Test
    void realAxisImaginaryPartIsDawson() {
        double[][] dawson = {
            {0.001, 0.0009999993333336}, {0.5, 0.4244363835020223}, {1.0, 0.5380795069127684},
            {3.0, 0.17827103061055827}, {7.9, 0.0638109032198449}, {8.5, 0.05923937177997215},
            {20.0, 0.02503136792640365}, {1000.0, 0.000500000250000375}};
        for (double[] row : dawson) {
            double expected = 2 / Faddeeva.SQRT_PI * row[1];
            // the accuracy of L is stated relative to |w| = hypot(e^(−x²), L)
            double modulus = Math.hypot(Math.exp(-row[0] * row[0]), expected);
            assertEquals(expected, Faddeeva.voigtL(row[0], 0), 1e-14 * modulus, "x=" + row[0]);
            assertEquals(-expected, Faddeeva.voigtL(-row[0], 0), 1e-14 * modulus, "x=" + -row[0]);
        }
    }

    /** Σ_{m=0}^{M} (−1)ᵐ (2m−1)!!/(2y²)ᵐ /(√π y), A&amp;S 7.1.23; for y ≥ 26 ten terms reach 1e-20. */
    private static double asymptoticErfcx(double y) {
        double term = 1.0;
        double sum = 1.0;
        double inv2y2 = 1.0 / (2 * y * y);
        for (int m = 1; m <= 10; m++) {
            term *= -(2 * m - 1) * inv2y2;
            sum += term;
        }
        return sum / (Faddeeva.SQRT_PI * y);
    }
}
