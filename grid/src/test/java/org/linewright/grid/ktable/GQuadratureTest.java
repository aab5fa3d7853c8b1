package org.linewright.grid.ktable;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.linewright.ingest.InputException;

/**
 * The g quadratures against numpy's Gauss–Legendre nodes and weights, mapped to [0, 1] (g = (x + 1)/2, w/2).
 * Generated once with numpy 1.24.2 (Python 3.11.2, /usr/bin/python3):
 * <pre>
 * python3 -c "import numpy as np; x,w=np.polynomial.legendre.leggauss(N); print((x+1)/2, w/2)"   # N = 8, 16, 32
 * </pre>
 * (upper halves listed; the rule is symmetric about g = 1/2). The 8-point values also agree with Abramowitz &amp;
 * Stegun (1964), table 25.4 (x = 0.18343 46424 95650, 0.52553 24099 16329, …).
 */
class GQuadratureTest {
    private static final double[] G8 = {0.5917173212478248, 0.7627662049581645, 0.8983332387068134, 0.9801449282487681};
    private static final double[] W8 = {0.18134189168918088, 0.15685332293894352, 0.11119051722668717,
        0.050614268145188344};
    private static final double[] G16 = {0.5475062549188188, 0.6408017753896295, 0.7290083888286136,
        0.8089381222013219, 0.8777022041775016, 0.9328156011939159, 0.9722875115366163, 0.994700467495825};
    private static final double[] W16 = {0.09472530522753429, 0.0913017075224618, 0.08457825969750131,
        0.07479799440828838, 0.062314485627767015, 0.047579255841246296, 0.031126761969323853, 0.013576229705877019};
    private static final double[] G32 = {0.5241538328438692, 0.5722359807913983, 0.6196436811260685,
        0.6659343011410639, 0.7106756380653176, 0.7534499544661146, 0.7938578786203812, 0.8315221334651076,
        0.8660910593701449, 0.8972418979839711, 0.924683806866285, 0.9481605778830261, 0.9674530379688698,
        0.9823811277937532, 0.9928057557726342, 0.9986319309247408};
    private static final double[] W32 = {0.048270044257363906, 0.04781936003963742, 0.04692219954040228,
        0.04558693934788193, 0.043826046502201954, 0.04165596211347342, 0.039096947893535156, 0.036172897054424225,
        0.032911111388180876, 0.029342046739267852, 0.025499029631188122, 0.021417949011113213,
        0.017136931456510813, 0.012696032654631213, 0.008137197365452983, 0.003509305004734649};

    private static void check(int n, double[] upperG, double[] upperW) {
        GQuadrature q = GQuadrature.of(QuadratureKind.GAUSS_LEGENDRE, n);
        double[] g = q.nodes();
        double[] w = q.weights();
        assertEquals(n, g.length);
        for (int i = 0; i < n / 2; i++) {
            int hi = n / 2 + i;
            int lo = n / 2 - 1 - i;
            assertEquals(upperG[i], g[hi], 2e-15, "g " + hi);
            assertEquals(1 - upperG[i], g[lo], 2e-15, "g " + lo);
            assertEquals(upperW[i], w[hi], 2e-15, "w " + hi);
            assertEquals(upperW[i], w[lo], 2e-15, "w " + lo);
        }
        double[] edges = q.intervalEdges();
        assertEquals(0.0, edges[0]);
        assertEquals(1.0, edges[n]);
        for (int i = 0; i < n; i++) {
            // each node lies inside the g-interval its weight stands for (a property of Gauss rules, Szegő 1939)
            assertTrue(edges[i] < g[i] && g[i] < edges[i + 1], "node " + i + " inside its interval");
        }
    }

    @Test
    void gaussLegendreMatchesNumpy() {
        check(8, G8, W8);
        check(16, G16, W16);
        check(32, G32, W32);
    }

    @Test
    void splitRuleIsTwoGaussLegendreRulesOnEitherSideOfTheSplit() {
        GQuadrature q = GQuadrature.of(QuadratureKind.SPLIT_GAUSS_LEGENDRE, 16);
        double[] g = q.nodes();
        double[] w = q.weights();
        // 8 numpy nodes on [0, 0.95] and 8 on [0.95, 1]: g = a + (b − a)(x + 1)/2, w = (b − a)·w_numpy/2
        for (int i = 0; i < 4; i++) {
            assertEquals(0.95 * G8[i], g[4 + i], 2e-15);
            assertEquals(0.95 * W8[i], w[4 + i], 2e-15);
            assertEquals(0.95 + 0.05 * G8[i], g[12 + i], 2e-15);
            assertEquals(0.05 * W8[i], w[12 + i], 2e-16);
        }
        assertEquals(0.95, q.intervalEdges()[8], 1e-15);
        double sum = 0;
        for (double v : w) {
            sum += v;
        }
        assertEquals(1.0, sum, 1e-15);
        // integrates polynomials of degree ≤ 15 on each part exactly: ∫₀¹ g⁷ dg = 1/8
        double integral = 0;
        for (int i = 0; i < 16; i++) {
            integral += w[i] * Math.pow(g[i], 7);
        }
        assertEquals(0.125, integral, 1e-15);
        assertThrows(InputException.class, () -> GQuadrature.of(QuadratureKind.SPLIT_GAUSS_LEGENDRE, 7));
        assertThrows(InputException.class, () -> GQuadrature.of(QuadratureKind.GAUSS_LEGENDRE, 0));
        assertThrows(InputException.class, () -> QuadratureKind.parse("simpson"));
        assertEquals(QuadratureKind.SPLIT_GAUSS_LEGENDRE, QuadratureKind.parse("split-gauss-legendre"));
    }
}
