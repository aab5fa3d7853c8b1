package org.linewright.grid.engine.fast;

/**
 * One width axis of the fast engine: either a single exact width (every line of the family has it, zero included),
 * or nodes evenly spaced in the logarithm of the width, wₖ = w_lo·e^((k−1)·δ) for k = 0 … n+2, one node of margin
 * below w_lo and two above w_hi = w_lo·e^(nδ), so that every width in [w_lo, w_hi] has a four-node stencil around
 * it. A width is distributed over its stencil with {@link LagrangeWeights#general} in the variable u = w^power:
 * power 2 (the variance) for the Doppler axis, because Gaussians compose by adding variances; power 1 for the
 * Lorentz axis, because Lorentzians compose by adding widths.
 *
 * <p>A floored axis ({@link #floored}) replaces the lowest (margin) node by an exact node at width 0: widths from 0
 * up to the floor's second node share the stencil {0, w_lo, w_lo·e^δ, w_lo·e^(2δ)}, so Lorentz widths far below what
 * the Doppler width lets one see (pure-Doppler lines included) need no nodes of their own.
 */
final class WidthAxis {

    private final double[] widthsCm1;
    private final double[] variable;
    private final double lowCm1;
    private final double logStep;
    private final int intervals;
    private final int power;

    private WidthAxis(double[] widthsCm1, double lowCm1, double logStep, int intervals, int power) {
        this.widthsCm1 = widthsCm1;
        this.lowCm1 = lowCm1;
        this.logStep = logStep;
        this.intervals = intervals;
        this.power = power;
        this.variable = new double[widthsCm1.length];
        for (int k = 0; k < widthsCm1.length; k++) {
            variable[k] = power == 2 ? widthsCm1[k] * widthsCm1[k] : widthsCm1[k];
        }
    }

    /** An axis with the one width every line has. */
    static WidthAxis exact(double widthCm1) {
        return new WidthAxis(new double[] {widthCm1}, widthCm1, 0, 0, 1);
    }

    /**
     * Nodes covering [low, high] with a log step no larger than {@code maxLogStep}; a range narrower than a relative
     * 10⁻⁹ becomes a single node at its geometric mean (the width error is then below 10⁻⁹ relative).
     */
    static WidthAxis geometric(double lowCm1, double highCm1, double maxLogStep, int power) {
        double span = Math.log(highCm1 / lowCm1);
        if (span < 1e-9) {
            return exact(Math.sqrt(lowCm1 * highCm1));
        }
        int n = (int) Math.ceil(span / maxLogStep);
        double step = span / n;
        double[] w = new double[n + 3];
        for (int k = 0; k < w.length; k++) {
            w[k] = lowCm1 * Math.exp((k - 1) * step);
        }
        return new WidthAxis(w, lowCm1, step, n, power);
    }

    /**
     * Nodes {0, floor, floor·e^δ, …} covering [0, max(high, floor·e^δ)] with a log step no larger than
     * {@code maxLogStep} above the floor; interpolation variable the width itself (power 1).
     *
     * @param floorCm1   the first non-zero node, &gt; 0
     * @param highCm1    the largest width to cover
     * @param maxLogStep the largest log step between non-zero nodes
     */
    static WidthAxis floored(double floorCm1, double highCm1, double maxLogStep) {
        double span = Math.log(Math.max(highCm1, floorCm1) / floorCm1);
        int n = Math.max(1, (int) Math.ceil(span / maxLogStep));
        // one interval: the full allowed step (its error is what was budgeted), covering any span up to it
        double step = n == 1 ? maxLogStep : span / n;
        double[] w = new double[n + 3];
        for (int k = 1; k < w.length; k++) {
            w[k] = floorCm1 * Math.exp((k - 1) * step);
        }
        // w[0] = 0: the exact zero-width node that replaces the margin node below the floor
        return new WidthAxis(w, floorCm1, step, n, 1);
    }

    /** @return the lowest node width, cm⁻¹ (0 for a floored axis) */
    double lowestNodeCm1() {
        return widthsCm1[0];
    }

    /** @return number of nodes */
    int size() {
        return widthsCm1.length;
    }

    /** @return width of node k, cm⁻¹ */
    double widthCm1(int k) {
        return widthsCm1[k];
    }

    /** @return the log step δ between nodes (0 for an exact axis) */
    double logStep() {
        return logStep;
    }

    /** @return 1 for an exact axis, 4 otherwise */
    int stencilSize() {
        return intervals == 0 ? 1 : 4;
    }

    /**
     * Distributes a width over its stencil.
     *
     * @param widthCm1 the width, inside the axis range
     * @param out      receives {@link #stencilSize()} weights from {@code offset}
     * @param offset   first index written
     * @return the index of the first stencil node
     */
    int stencil(double widthCm1, double[] out, int offset) {
        if (intervals == 0) {
            out[offset] = 1.0;
            return 0;
        }
        // widths below the floor (zero included) take the first stencil: log of 0 is −∞, clamped to 0 below
        int j = widthCm1 <= lowCm1 ? 0 : (int) Math.floor(Math.log(widthCm1 / lowCm1) / logStep);
        j = Math.max(0, Math.min(intervals - 1, j));
        double u = power == 2 ? widthCm1 * widthCm1 : widthCm1;
        LagrangeWeights.general(u, variable, j, out, offset);
        return j;
    }
}
