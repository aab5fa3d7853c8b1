package org.linewright.broadening.intensity;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.Test;

class IntensityCutTest {

    @Test
    void keepsLinesAtOrAboveThresholdAndReportsDroppedFraction() {
        double[] s = {1e-20, 5e-23, 3e-21, 1e-25, Double.NaN, 1e-22};
        boolean[] keep = new boolean[s.length];
        IntensityCut.Result r = IntensityCut.apply(s, s.length, 1e-22, keep);
        assertArrayEquals(new boolean[] {true, false, true, false, false, true}, keep);
        assertEquals(3, r.keptCount());
        assertEquals(3, r.droppedCount());
        // by hand: dropped 5e-23 + 1e-25 = 5.01e-23 of total 1.31501e-20
        assertEquals(5.01e-23 / 1.31501e-20, r.droppedFraction(), 1e-15);
    }

    @Test
    void compensatedSumKeepsManySmallDroppedLines() {
        // dropped: one line of 1.0 and 10^6 lines of 1e-16; kept: one line of 3.0 (threshold 2.0).
        // Exact share (by hand): (1 + 1e-10)/(4 + 1e-10) = 0.25000000001875 (to 14 digits). A plain running
        // sum stays at 1.0 (each 1e-16 is below half an ulp of 1) and would report 0.25.
        int n = 1_000_002;
        double[] s = new double[n];
        java.util.Arrays.fill(s, 1e-16);
        s[0] = 1.0;
        s[n - 1] = 3.0;
        IntensityCut.Result r = IntensityCut.apply(s, n, 2.0, new boolean[n]);
        assertEquals(1, r.keptCount());
        assertEquals(0.25000000001875, r.droppedFraction(), 1e-15);
    }

    @Test
    void zeroThresholdKeepsAllAndNegativeIsRejected() {
        double[] s = {0.0, 1e-30};
        IntensityCut.Result r = IntensityCut.apply(s, 2, 0.0, new boolean[2]);
        assertEquals(2, r.keptCount());
        assertEquals(0.0, r.droppedFraction());
        assertThrows(IllegalArgumentException.class, () -> IntensityCut.apply(s, 2, -1, new boolean[2]));
    }
}
