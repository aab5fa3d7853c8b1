package org.linewright.broadening.intensity;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.math.MathContext;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/** The compensated sum against exact decimal arithmetic ({@link BigDecimal}, the JDK's arbitrary precision). */
class CompensatedSumTest {

    /**
     * One strong line and 10⁶ lines 10⁻¹⁸ times weaker (intensities spanning decades, as in a real list): a plain
     * double sum loses every weak line (each is below half an ulp of the running sum), the compensated sum keeps
     * them to within a few ulps of the exact sum.
     */
    @Test
    void keepsWeakTermsBesideAStrongOne() {
        CompensatedSum sum = new CompensatedSum();
        double plain = 0;
        BigDecimal exact = BigDecimal.ZERO;
        sum.add(1e-18);
        plain += 1e-18;
        exact = exact.add(new BigDecimal(1e-18));
        SplittableRandom random = new SplittableRandom(7);
        for (int i = 0; i < 1_000_000; i++) {
            double x = 1e-36 * (0.5 + random.nextDouble());
            sum.add(x);
            plain += x;
            exact = exact.add(new BigDecimal(x));
        }
        double reference = exact.round(MathContext.DECIMAL64).doubleValue();
        assertEquals(reference, sum.value(), 4 * Math.ulp(reference));
        // the plain sum is off by the whole weak share (about 10⁻³⁰ relative ≈ 10⁻¹² of an ulp: invisible) — so use
        // a case where the weak share is visible:
        CompensatedSum visible = new CompensatedSum();
        double plainVisible = 0;
        BigDecimal exactVisible = BigDecimal.ZERO;
        visible.add(1.0);
        plainVisible += 1.0;
        exactVisible = exactVisible.add(BigDecimal.ONE);
        for (int i = 0; i < 1_000_000; i++) {
            double x = 1e-17 * (0.5 + random.nextDouble());
            visible.add(x);
            plainVisible += x;
            exactVisible = exactVisible.add(new BigDecimal(x));
        }
        double referenceVisible = exactVisible.doubleValue();
        assertEquals(referenceVisible, visible.value(), 2 * Math.ulp(referenceVisible));
        assertTrue(Math.abs(plainVisible - referenceVisible) > 1e-12, "a plain sum loses the weak 1e-11 share: " + plainVisible);
    }

    /** Cancellation: +big, many small, −big leaves exactly the small ones (exact arithmetic as reference). */
    @Test
    void survivesCancellation() {
        CompensatedSum sum = new CompensatedSum();
        BigDecimal exact = BigDecimal.ZERO;
        double[] terms = {1e20, 3.25, -1e20, 1e-3, 7.0};
        for (double x : terms) {
            sum.add(x);
            exact = exact.add(new BigDecimal(x));
        }
        assertEquals(exact.doubleValue(), sum.value(), 0.0);
    }
}
