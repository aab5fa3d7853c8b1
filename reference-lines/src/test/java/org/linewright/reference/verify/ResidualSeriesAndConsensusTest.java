package org.linewright.reference.verify;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Arrays;
import java.util.SplittableRandom;

import org.junit.jupiter.api.Test;

class ResidualSeriesAndConsensusTest {
    /** Thinning keeps at most the capacity, evenly spaced, and the first point. */
    @Test
    void residualSeriesStaysBoundedAndEven() {
        ResidualSeries s = new ResidualSeries(100);
        for (int i = 0; i < 1000; i++) {
            s.add(i, i * 0.5);
        }
        assertTrue(s.size() <= 100 && s.size() >= 50, "size " + s.size());
        double[] x = s.x();
        assertEquals(0.0, x[0]);
        double step = x[1] - x[0];
        for (int i = 1; i < x.length; i++) {
            assertEquals(step, x[i] - x[i - 1], 0.0, "even spacing");
        }
        assertEquals(x[x.length - 1] * 0.5, s.y()[x.length - 1], 0.0);
    }

    /**
     * The histogram median agrees with the exact median of the sorted values (java.util.Arrays.sort as the
     * independent reference) to its stated resolution of half a bin, 5e-6 relative.
     */
    @Test
    void consensusMatchesTheSortedMedian() {
        SplittableRandom random = new SplittableRandom(42);
        double centre = 107.42 / 0.986544;
        double[] values = new double[10_001];
        ConsensusHistogram h = new ConsensusHistogram(centre);
        for (int i = 0; i < values.length; i++) {
            // rounding-like scatter of ±1e-3 around a value 3e-4 off the centre, plus a few gross outliers
            values[i] = centre * (1 + 3e-4 + (random.nextDouble() - 0.5) * 2e-3) * (i % 1000 == 0 ? 2.0 : 1.0);
            h.add(values[i]);
        }
        double[] sorted = values.clone();
        Arrays.sort(sorted);
        double exact = sorted[values.length / 2];
        assertEquals(1.0, h.median() / exact, 5.01e-6);
    }

    /** A median more than 10 % from the centre comes from the kept sample: median of {1, 2, 2} is 2. */
    @Test
    void consensusOutsideTheRangeComesFromTheSample() {
        ConsensusHistogram h = new ConsensusHistogram(1.0);
        assertTrue(Double.isNaN(h.median()), "nothing added");
        h.add(2.0);
        h.add(2.0);
        h.add(1.0);
        assertEquals(2.0, h.median(), 0.0);
    }
}
