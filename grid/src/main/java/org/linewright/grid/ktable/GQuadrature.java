package org.linewright.grid.ktable;

import org.hipparchus.analysis.integration.gauss.GaussIntegrator;
import org.hipparchus.analysis.integration.gauss.GaussIntegratorFactory;
import org.linewright.ingest.InputException;

/**
 * A quadrature in the cumulative probability g ∈ [0, 1]: nodes g_i (ascending) and weights w_i with Σ w_i = 1, and
 * the g-intervals [G_{i−1}, G_i] (G_0 = 0, G_i = Σ_{j≤i} w_j) that each weight stands for. Gauss–Legendre nodes and
 * weights come from Hipparchus' {@code GaussIntegratorFactory.legendreHighPrecision} (computed in extended precision,
 * then rounded to double: accurate to the last bit or two), mapped from [−1, 1] to the sub-interval.
 */
public final class GQuadrature {
    /** The most g points a table can have. */
    public static final int MAX_POINTS = 256;
    /** Where the split quadrature divides [0, 1]. */
    public static final double SPLIT_G = 0.95;

    private final QuadratureKind kind;
    private final double[] nodes;
    private final double[] weights;
    private final double[] intervalEdges;

    private GQuadrature(QuadratureKind kind, double[] nodes, double[] weights) {
        this.kind = kind;
        this.nodes = nodes;
        this.weights = weights;
        this.intervalEdges = new double[nodes.length + 1];
        // cumulative sums in order; the last edge is 1 by construction, set exactly so no σ point falls beyond it
        for (int i = 0; i < weights.length; i++) {
            intervalEdges[i + 1] = intervalEdges[i] + weights[i];
        }
        intervalEdges[weights.length] = 1.0;
    }

    /**
     * The quadrature of a kind with {@code points} nodes.
     *
     * @throws InputException for fewer than 1 or more than {@link #MAX_POINTS} points, or an odd count for the split kind
     */
    public static GQuadrature of(QuadratureKind kind, int points) {
        if (points < 1 || points > MAX_POINTS) {
            throw new InputException("g points: " + points + " (expected 1 to " + MAX_POINTS + ")");
        }
        double[] g = new double[points];
        double[] w = new double[points];
        if (kind == QuadratureKind.GAUSS_LEGENDRE) {
            fill(points, 0.0, 1.0, g, w, 0);
        } else {
            if (points % 2 != 0) {
                throw new InputException("g points: " + points + " (the split quadrature needs an even number, "
                        + "half on each side of g = " + SPLIT_G + ")");
            }
            fill(points / 2, 0.0, SPLIT_G, g, w, 0);
            fill(points / 2, SPLIT_G, 1.0, g, w, points / 2);
        }
        return new GQuadrature(kind, g, w);
    }

    /** Gauss–Legendre on [a, b] into g/w from {@code offset}, ascending. */
    private static void fill(int n, double a, double b, double[] g, double[] w, int offset) {
        GaussIntegrator gl = new GaussIntegratorFactory().legendreHighPrecision(n, a, b);
        for (int i = 0; i < n; i++) {
            g[offset + i] = gl.getPoint(i);
            w[offset + i] = gl.getWeight(i);
        }
        // the interval edges need ascending nodes: order the (node, weight) pairs (insertion sort of n ≤ 256 pairs)
        for (int i = offset + 1; i < offset + n; i++) {
            double gi = g[i];
            double wi = w[i];
            int j = i - 1;
            while (j >= offset && g[j] > gi) {
                g[j + 1] = g[j];
                w[j + 1] = w[j];
                j--;
            }
            g[j + 1] = gi;
            w[j + 1] = wi;
        }
    }

    /**
     * The quadrature of a k-table read back: its nodes and weights as stored (the kind is taken to be
     * Gauss–Legendre for the record; only the nodes, weights and interval edges are used).
     */
    public static GQuadrature fromNodes(double[] nodes, double[] weights) {
        if (nodes.length != weights.length || nodes.length < 1) {
            throw new InputException("g quadrature: " + nodes.length + " nodes and " + weights.length + " weights");
        }
        return new GQuadrature(QuadratureKind.GAUSS_LEGENDRE, nodes.clone(), weights.clone());
    }

    public QuadratureKind kind() {
        return kind;
    }

    /** The number of g points. */
    public int size() {
        return nodes.length;
    }

    /** The nodes g_i, ascending (a copy). */
    public double[] nodes() {
        return nodes.clone();
    }

    /** The weights w_i (a copy); they sum to 1. */
    public double[] weights() {
        return weights.clone();
    }

    /** The g-interval edges G_0 = 0, …, G_N = 1 (a copy). */
    public double[] intervalEdges() {
        return intervalEdges.clone();
    }

    double node(int i) {
        return nodes[i];
    }

    double weight(int i) {
        return weights[i];
    }

    double intervalEdge(int i) {
        return intervalEdges[i];
    }
}
