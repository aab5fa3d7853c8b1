package org.linewright.broadening.wings;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * The χ factor of Perrin and Hartmann 1989 (JQSRT 42, 311). The functional form and coefficients are from
 * memory (see the class comment); the expected numbers below were worked out from that form with Python's math.exp.
 */
class PerrinHartmannChiTest {

    @Test
    void coefficientsAtRoomTemperature() {
        PerrinHartmannChi chi = new PerrinHartmannChi(296);
        // B1 = 0.0888 − 0.160·exp(−0.0041·296) = 0.0888 − 0.160·0.297126 = 0.041260 (coefficients from memory;
        // arithmetic with Python's math.exp)
        assertEquals(0.041260, chi.b1PerCm1(), 1e-6);
        // B2 = 0.0526·exp(−0.00152·296) = 0.0526·0.637679 = 0.033542 (same)
        assertEquals(0.033542, chi.b2PerCm1(), 1e-6);
        assertEquals(0.0232, chi.b3PerCm1(), 1e-15);
    }

    @Test
    void shapeIsOneThenContinuousAndDecreasing() {
        PerrinHartmannChi chi = new PerrinHartmannChi(250);
        assertEquals(1.0, chi.factor(0));
        assertEquals(1.0, chi.factor(-3.0));
        assertEquals(1.0, chi.factor(3.0));
        for (double edge : new double[] {3.0, 30.0, 120.0}) {
            assertEquals(chi.factor(edge), chi.factor(Math.nextUp(edge)), 1e-12, "continuous at " + edge);
        }
        double previous = 1.0;
        for (double d = 3.5; d < 500; d += 0.5) {
            double f = chi.factor(d);
            assertTrue(f < previous && f > 0, "monotone at " + d);
            assertEquals(f, chi.factor(-d), 0.0);
            previous = f;
        }
        // at 30 cm-1: exp(−27·B1(250 K)); B1(250) = 0.0888 − 0.160·exp(−1.025) = 0.0888 − 0.160·0.358796 = 0.031393 (math.exp)
        assertEquals(Math.exp(-27 * 0.031393), chi.factor(30.0), 1e-5);
    }
}
