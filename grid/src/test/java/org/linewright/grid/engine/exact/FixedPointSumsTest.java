package org.linewright.grid.engine.exact;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.math.MathContext;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;

/**
 * Exact sums against java.math.BigDecimal (exact decimal arithmetic of the JDK): terms over 26 decades, summed
 * in any order, give the same bits and lie within 2 ulp of the exact sum; taking terms out gives back the sum
 * without them bit for bit.
 */
class FixedPointSumsTest {

    @Test
    void anyOrderGivesTheSameBitsWithinTwoUlpOfTheExactSum() {
        Random random = new Random(11);
        List<Double> terms = new ArrayList<>();
        for (int i = 0; i < 20_000; i++) {
            terms.add(Math.pow(10, -16 - 26 * random.nextDouble()) * (random.nextInt(10) == 0 ? -0.5 : 1));
        }
        FixedPointSums a = new FixedPointSums(1);
        BigDecimal exact = BigDecimal.ZERO;
        for (double t : terms) {
            a.add(0, t);
            exact = exact.add(new BigDecimal(t));
        }
        Collections.shuffle(terms, random);
        FixedPointSums b = new FixedPointSums(1);
        for (double t : terms) {
            b.add(0, t);
        }
        assertTrue(a.sameAs(b));
        double expected = exact.round(MathContext.DECIMAL64).doubleValue();
        assertTrue(Math.abs(a.value(0) - expected) <= 2 * Math.ulp(expected), a.value(0) + " vs " + expected);
    }

    @Test
    void takingTermsOutGivesBackTheSumWithoutThem() {
        Random random = new Random(5);
        FixedPointSums kept = new FixedPointSums(3);
        FixedPointSums all = new FixedPointSums(3);
        FixedPointSums extra = new FixedPointSums(3);
        for (int i = 0; i < 5000; i++) {
            int k = random.nextInt(3);
            double t = Math.pow(10, -18 - 20 * random.nextDouble());
            all.add(k, t);
            if (i % 7 == 0) {
                extra.add(k, t);
            } else {
                kept.add(k, t);
            }
        }
        all.subtract(extra);
        assertTrue(all.sameAs(kept));
        all.subtract(kept);
        for (int k = 0; k < 3; k++) {
            assertEquals(0.0, all.value(k));
        }
    }

    @Test
    void termsBeyondTheRangeAreRefused() {
        FixedPointSums s = new FixedPointSums(1);
        assertThrows(IllegalArgumentException.class, () -> s.add(0, 1e-7));
        assertThrows(IllegalArgumentException.class, () -> s.add(0, Double.NaN));
        s.add(0, 1e-50); // below half a quantum: nothing
        assertEquals(0.0, s.value(0));
    }
}
