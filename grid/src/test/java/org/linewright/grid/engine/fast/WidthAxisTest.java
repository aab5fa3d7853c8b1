package org.linewright.grid.engine.fast;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/** The floored width axis against the defining properties of Lagrange interpolation (A&amp;S 25.2.2). */
class WidthAxisTest {

    @Test
    void flooredAxisHasAnExactZeroNodeAndCoversTheRange() {
        WidthAxis axis = WidthAxis.floored(1e-4, 0.1, 0.5);
        assertEquals(0.0, axis.lowestNodeCm1(), 0.0);
        assertEquals(1e-4, axis.widthCm1(1), 1e-18);
        // two margin... one node above 0.1 at least: the last interval's stencil reaches beyond the top width
        assertEquals(true, axis.widthCm1(axis.size() - 2) >= 0.1 * (1 - 1e-12));
    }

    @Test
    void zeroWidthGoesWhollyOnTheZeroNode() {
        // Lagrange weights are 1 at their own node and 0 at the others (A&S 25.2.2)
        WidthAxis axis = WidthAxis.floored(1e-4, 0.1, 0.5);
        double[] w = new double[4];
        int first = axis.stencil(0.0, w, 0);
        assertEquals(0, first);
        assertEquals(1.0, w[0], 1e-15);
        assertEquals(0.0, w[1], 1e-15);
        assertEquals(0.0, w[2], 1e-15);
        assertEquals(0.0, w[3], 1e-15);
    }

    @Test
    void widthsBelowTheFloorAreReproducedByTheirStencil() {
        // four-point weights reproduce polynomials of degree ≤ 3 exactly, so Σ wⱼ·uⱼ = u and Σ wⱼ = 1
        WidthAxis axis = WidthAxis.floored(1e-4, 0.1, 0.5);
        double[] w = new double[4];
        for (double g : new double[] {3e-6, 5e-5, 1e-4, 1.3e-4, 0.05, 0.1}) {
            int first = axis.stencil(g, w, 0);
            double sum = 0;
            double moment = 0;
            for (int j = 0; j < 4; j++) {
                sum += w[j];
                moment += w[j] * axis.widthCm1(first + j);
            }
            assertEquals(1.0, sum, 1e-12);
            assertEquals(g, moment, 1e-12 * Math.max(g, 1e-4));
        }
    }
}
