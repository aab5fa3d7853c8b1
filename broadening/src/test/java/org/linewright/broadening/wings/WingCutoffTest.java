package org.linewright.broadening.wings;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.Map;
import org.junit.jupiter.api.Test;

/** The cutoff policies' distances and metadata. */
class WingCutoffTest {

    @Test
    void defaultIsFixedTwentyFiveWavenumbers() {
        // 25 cm-1: the conventional line-by-line cutoff (common practice)
        WingCutoff c = WingCutoff.defaultCutoff();
        assertEquals(25.0, c.distanceCm1(0.004, 0.07, 1.0));
        assertEquals(25.0, c.distanceCm1(1.0, 1.0, 100.0));
        assertEquals(Map.of("wing.cutoff.rule", "fixed", "wing.cutoff.distance_cm1", "25.0"), c.describe());
    }

    @Test
    void hwhmMultipleUsesVoigtHalfWidth() {
        WingCutoff c = WingCutoff.hwhmMultiple(500, 25);
        // pure Lorentz: Olivero–Longbothum gives 0.5346γ + √0.2166·γ = 1.0000 γ (to 2e-4)
        assertEquals(500 * 0.01, c.distanceCm1(0, 0.01, 1), 500 * 0.01 * 2e-4);
        // pure Doppler: HWHM = αD exactly
        assertEquals(500 * 0.004, c.distanceCm1(0.004, 0, 1), 1e-15);
        assertEquals(25.0, c.distanceCm1(0.004, 0.5, 1));
        assertEquals("voigt-hwhm-multiple", c.describe().get("wing.cutoff.rule"));
    }

    @Test
    void pressureScaledIsClamped() {
        WingCutoff c = WingCutoff.pressureScaled(10, 5, 100);
        assertEquals(5.0, c.distanceCm1(0.004, 0.07, 0.1));
        assertEquals(20.0, c.distanceCm1(0.004, 0.07, 2.0));
        assertEquals(100.0, c.distanceCm1(0.004, 0.07, 90.0));
        assertEquals("min(max, max(min, k*p))", c.describe().get("wing.cutoff.formula"));
    }

    @Test
    void noneIsInfinite() {
        assertEquals(Double.POSITIVE_INFINITY, WingCutoff.none().distanceCm1(0.004, 0.07, 1));
        assertEquals("none", WingCutoff.none().describe().get("wing.cutoff.rule"));
    }

    @Test
    void rejectsInvalidParameters() {
        assertThrows(IllegalArgumentException.class, () -> WingCutoff.fixed(0));
        assertThrows(IllegalArgumentException.class, () -> WingCutoff.fixed(Double.NaN));
        assertThrows(IllegalArgumentException.class, () -> WingCutoff.hwhmMultiple(-1, 25));
        assertThrows(IllegalArgumentException.class, () -> WingCutoff.pressureScaled(1, 10, 5));
    }

    /**
     * The bound a policy reports is reached and never exceeded: over widths from pure Doppler to pure Lorentz
     * (10⁻⁴ to 10² cm⁻¹) and pressures 10⁻³ to 10³ atm, every line's distance is at most the bound, and for the
     * fixed and pressure rules every line gets exactly the bound (the rules as defined in WingCutoff).
     */
    @Test
    void maxDistanceBoundsEveryLineDistance() {
        WingCutoff[] policies = {WingCutoff.fixed(25), WingCutoff.hwhmMultiple(50, 25), WingCutoff.pressureScaled(2, 1, 25),
            WingCutoff.none()};
        double[] widths = {1e-4, 1e-3, 1e-2, 0.1, 1, 10, 100};
        double[] pressures = {1e-3, 0.1, 1, 10, 1e3};
        for (WingCutoff c : policies) {
            for (double p : pressures) {
                double bound = c.maxDistanceCm1(p);
                double largest = 0;
                for (double aD : widths) {
                    for (double gL : widths) {
                        double d = c.distanceCm1(aD, gL, p);
                        largest = Math.max(largest, d);
                        org.junit.jupiter.api.Assertions.assertTrue(d <= bound, c + " at " + p + " atm: " + d + " > " + bound);
                        if (!c.dependsOnWidths()) {
                            assertEquals(bound, d, 0.0, c + " at " + p + " atm");
                        }
                    }
                }
                assertEquals(bound, largest, 0.0, c + " at " + p + " atm: the bound is reached by some line");
            }
        }
    }
}
