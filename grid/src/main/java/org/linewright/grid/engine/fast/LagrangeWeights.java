package org.linewright.grid.engine.fast;

/**
 * Lagrange weights, the distribution rule of the fast engine on all three of its axes: six points in position, four
 * on each width axis. Spreading a unit point mass at u over nodes u₀ … u_(n−1) with weights
 * ℓⱼ(u) = Πₖ≠ⱼ (u − uₖ)/(uⱼ − uₖ) reproduces the moments Σ ℓⱼ·uⱼᵏ = uᵏ for k = 0 … n−1 exactly, so a profile built
 * from the node profiles differs from the true one by the interpolation remainder ω(u)·f⁽ⁿ⁾(ξ)/n!,
 * ω(u) = Π (u − uⱼ) (Lagrange's remainder theorem; e.g. Abramowitz &amp; Stegun 25.2.3).
 */
public final class LagrangeWeights {

    private LagrangeWeights() {
    }

    /**
     * Weights for the equally spaced nodes −1, 0, 1, 2 at fraction τ (0 ≤ τ &lt; 1 between nodes 0 and 1), from the
     * closed forms ℓ₋₁ = −τ(τ−1)(τ−2)/6, ℓ₀ = (τ+1)(τ−1)(τ−2)/2, ℓ₁ = −(τ+1)τ(τ−2)/2, ℓ₂ = (τ+1)τ(τ−1)/6.
     *
     * @param tau position between nodes 0 and 1
     * @param out receives the four weights at {@code out[offset .. offset+3]}
     * @param offset first index written
     */
    public static void uniform(double tau, double[] out, int offset) {
        double tp1 = tau + 1;
        double tm1 = tau - 1;
        double tm2 = tau - 2;
        out[offset] = -tau * tm1 * tm2 / 6;
        out[offset + 1] = tp1 * tm1 * tm2 / 2;
        out[offset + 2] = -tp1 * tau * tm2 / 2;
        out[offset + 3] = tp1 * tau * tm1 / 6;
    }

    /**
     * Weights for {@code points} (even) equally spaced nodes −(points/2 − 1), …, points/2 at fraction τ (0 ≤ τ &lt; 1
     * between nodes 0 and 1): ℓⱼ(τ) = Πₖ≠ⱼ (τ − xₖ)/(xⱼ − xₖ).
     *
     * @param points number of nodes, even
     * @param tau    position between nodes 0 and 1
     * @param out    receives the weights at {@code out[offset .. offset+points-1]}
     * @param offset first index written
     */
    public static void centred(int points, double tau, double[] out, int offset) {
        int shift = points / 2 - 1;
        for (int j = 0; j < points; j++) {
            double xj = j - shift;
            double w = 1;
            for (int k = 0; k < points; k++) {
                if (k != j) {
                    double xk = k - shift;
                    w *= (tau - xk) / (xj - xk);
                }
            }
            out[offset + j] = w;
        }
    }

    /**
     * Weights for four arbitrary distinct nodes.
     *
     * @param u      where the mass sits
     * @param nodes  node values {@code nodes[first .. first+3]}
     * @param first  index of the first node
     * @param out    receives the four weights at {@code out[offset .. offset+3]}
     * @param offset first index written
     */
    public static void general(double u, double[] nodes, int first, double[] out, int offset) {
        for (int j = 0; j < 4; j++) {
            double uj = nodes[first + j];
            double w = 1;
            for (int k = 0; k < 4; k++) {
                if (k != j) {
                    double uk = nodes[first + k];
                    w *= (u - uk) / (uj - uk);
                }
            }
            out[offset + j] = w;
        }
    }
}
