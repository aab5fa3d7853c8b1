package org.linewright.grid.engine.fast;

/**
 * One width axis of the fast engine: either a single exact width (every line of the family has it, zero included),
 * or nodes evenly spaced in the logarithm of the width, wₖ = w_lo·e^((k−1)·δ) for k = 0 … n+2, one node of margin
 * below w_lo and two above w_hi = w_lo·e^(nδ), so that every width in [w_lo, w_hi] has a four-node stencil around
 * it. A width is distributed over its stencil with {@link LagrangeWeights#general} in the variable u = w^power:
 * power 2 (the variance) for the Doppler axis, because Gaussians compose by adding variances; power 1 for the
 * Lorentz axis, because Lorentzians compose by adding widths.
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
        int j = (int) Math.floor(Math.log(widthCm1 / lowCm1) / logStep);
        j = Math.max(0, Math.min(intervals - 1, j));
        double u = power == 2 ? widthCm1 * widthCm1 : widthCm1;
        LagrangeWeights.general(u, variable, j, out, offset);
        return j;
    }
}
