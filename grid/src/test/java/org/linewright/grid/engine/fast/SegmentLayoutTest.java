package org.linewright.grid.engine.fast;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/** The segment layout: its cost choice and that the segments tile the internal grid. */
class SegmentLayoutTest {

    @Test
    void millionPointsWithAFiftyThousandStepReachTakeThreeRingsOfTwoToTheNineteen() {
        // 10⁶ + 1 points, 25 cm⁻¹ cutoff at 0.0005 cm⁻¹ (reach 50,001 steps): one ring would be 2²¹ (48 % padding).
        // FFT times per point measured on the reference machine (project brief, JTransforms realForward, one
        // thread): 2¹⁸ 6.0, 2¹⁹ 6.3, 2²⁰ 6.8, 2²¹ 9.8 ns. By hand: 7 rings of 2¹⁸ cost 11.0 ms-units, 3 of 2¹⁹ 9.9,
        // 2 of 2²⁰ 14.3, 1 of 2²¹ 20.6 — three rings of 2¹⁹ (424,278 useful points each) are the cheapest.
        long pad = 2 * 50_001 + 8;
        SegmentLayout layout = SegmentLayout.choose(1_000_001, pad, FastEngine.MAX_FFT_LENGTH, 0);
        assertEquals(1 << 19, layout.ringLength());
        assertEquals(3, layout.segments());
        assertTiles(layout, 1_000_001, pad);
    }

    @Test
    void aGridThatFitsASmallRingStaysOneSegment() {
        // 5,001 points with a reach of 501: one ring of 8,192; two rings of 4,096 cost the same per point (5.3 ns)
        // and re-spread the boundary lines, so one ring
        SegmentLayout layout = SegmentLayout.choose(5_001, 2 * 501 + 8, FastEngine.MAX_FFT_LENGTH, 0);
        assertEquals(1, layout.segments());
        assertEquals(8192, layout.ringLength());
        assertTiles(layout, 5_001, 2 * 501 + 8);
    }

    @Test
    void forcedRingLength() {
        SegmentLayout layout = SegmentLayout.choose(10_001, 1_010, FastEngine.MAX_FFT_LENGTH, 2048);
        assertEquals(2048, layout.ringLength());
        // ⌈10,001 / (2,048 − 1,010)⌉ = 10
        assertEquals(10, layout.segments());
        assertTiles(layout, 10_001, 1_010);
        assertThrows(IllegalArgumentException.class,
                () -> SegmentLayout.choose(10_001, 1_010, FastEngine.MAX_FFT_LENGTH, 512));
        // a forced ring longer than one ring needs: one ring of the usual length
        assertEquals(1, SegmentLayout.choose(10_001, 1_010, FastEngine.MAX_FFT_LENGTH, 1 << 20).segments());
    }

    @Test
    void fewerSegmentsForALongerReach() {
        // reach 300,000 steps: rings of 2¹⁹ would own only 124,280 points each; 2²⁰ or more is cheaper
        SegmentLayout layout = SegmentLayout.choose(1_000_001, 600_008, FastEngine.MAX_FFT_LENGTH, 0);
        assertTrue(layout.ringLength() >= 1 << 20, "ring " + layout.ringLength());
        assertTiles(layout, 1_000_001, 600_008);
    }

    /** Consecutive, non-empty, gap-free segments that each fit their ring. */
    private static void assertTiles(SegmentLayout layout, long points, long pad) {
        assertEquals(0, layout.start(0));
        assertEquals(points, layout.end(layout.segments() - 1));
        for (int s = 0; s < layout.segments(); s++) {
            assertTrue(layout.end(s) > layout.start(s));
            assertTrue(layout.end(s) - layout.start(s) + pad <= layout.ringLength(), "segment " + s);
            if (s > 0) {
                assertEquals(layout.end(s - 1), layout.start(s));
            }
        }
    }
}
