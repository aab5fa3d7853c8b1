package org.linewright.broadening.wings;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.voigt.LorentzProfile;

/** Applying cutoff, pedestal removal and χ factor to a line on a grid. */
class WingKernelTest {

    private static double[] grid(double start, double step, int n) {
        double[] g = new double[n];
        for (int i = 0; i < n; i++) {
            g[i] = start + step * i;
        }
        return g;
    }

    @Test
    void cutoffAndPedestal() {
        double[] g = grid(900, 0.01, 20001); // 900 .. 1100 cm-1
        double center = 1000.0;
        WingKernel kernel = new WingTreatment(WingCutoff.fixed(25), true, ChiFactorKind.NONE).atConditions(1, 296);
        double[] out = new double[g.length];
        kernel.addLine(LineShapeKind.LORENTZ, g, 0, g.length, center, 0.004, 0.07, 2.0, out);
        double pedestal = LorentzProfile.value(25, 0.07);
        for (int i = 0; i < g.length; i++) {
            double d = g[i] - center;
            if (Math.abs(d) > 25 + 1e-9) {
                assertEquals(0.0, out[i], 0.0, "beyond cutoff at " + g[i]);
            } else if (Math.abs(d) < 24.9) {
                double expected = 2 * (LorentzProfile.value(d, 0.07) - pedestal);
                assertEquals(expected, out[i], 1e-12 * Math.abs(expected) + 1e-18);
            }
        }
        // trapezoid sum ≈ 2·(1 − lost) (rule error ~ 1e-7 for this grid); lost from the closed forms
        double sum = 0;
        for (int i = 0; i + 1 < g.length; i++) {
            sum += 0.5 * (out[i] + out[i + 1]) * 0.01;
        }
        double lost = kernel.lostFraction(LineShapeKind.LORENTZ, 0.004, 0.07);
        double expectedLost = 2 / Math.PI * Math.atan(0.07 / 25) + 2 * 25 * pedestal;
        assertEquals(expectedLost, lost, 1e-15);
        assertEquals(2 * (1 - lost), sum, 2e-5);
    }

    @Test
    void chiFactorAppliesBeyondThreeWavenumbers() {
        double[] g = grid(950, 0.01, 10001); // 950 .. 1050
        double center = 1000.0;
        WingKernel kernel = new WingTreatment(WingCutoff.fixed(40), false, ChiFactorKind.PERRIN_HARTMANN_CO2)
                .atConditions(1, 296);
        double[] out = new double[g.length];
        kernel.addLine(LineShapeKind.VOIGT, g, 0, g.length, center, 0.003, 0.1, 1.0, out);
        PerrinHartmannChi chi = new PerrinHartmannChi(296);
        for (int i = 0; i < g.length; i += 7) {
            double d = g[i] - center;
            double v = LineShapeKind.VOIGT.value(d, 0.003, 0.1);
            double expected = Math.abs(d) <= 40 ? v * chi.factor(d) : 0;
            assertEquals(expected, out[i], 1e-9 * expected, "at " + d);
        }
        double lost = kernel.lostFraction(LineShapeKind.VOIGT, 0.003, 0.1);
        double tail = WingLoss.voigtTailFraction(40, 0.003, 0.1);
        assertTrue(lost > tail, "χ deficit adds to the tail");
        double sum = 0;
        for (int i = 0; i + 1 < g.length; i++) {
            sum += 0.5 * (out[i] + out[i + 1]) * 0.01;
        }
        assertEquals(1 - lost, sum, 2e-5);
        assertEquals("perrin-hartmann-co2", kernel.describe().get("wing.chi"));
    }

    @Test
    void noCutoffCoversWholeGridAndRespectsRange() {
        double[] g = grid(0, 1, 11);
        WingKernel kernel = new WingTreatment(WingCutoff.none(), false, ChiFactorKind.NONE).atConditions(1, 296);
        double[] out = new double[g.length];
        kernel.addLine(LineShapeKind.LORENTZ, g, 2, 9, 5.0, 0, 0.5, 1.0, out);
        assertEquals(0.0, out[1]);
        assertEquals(0.0, out[9]);
        assertEquals(LorentzProfile.value(3, 0.5), out[2], 1e-16);
        assertEquals(0.0, kernel.lostFraction(LineShapeKind.LORENTZ, 0, 0.5));
    }

    @Test
    void indexSearch() {
        double[] g = {1, 2, 2, 3, 5};
        assertEquals(1, WingKernel.firstIndexAtOrAbove(g, 0, 5, 2));
        assertEquals(3, WingKernel.firstIndexAbove(g, 0, 5, 2));
        assertEquals(5, WingKernel.firstIndexAbove(g, 0, 5, 9));
        assertEquals(0, WingKernel.firstIndexAtOrAbove(g, 0, 5, -9));
    }
}
