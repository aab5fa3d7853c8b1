package org.linewright.grid.engine.fast;

/**
 * Reads σ at the output points from each segment's ring. Uniform grids: output point k is internal point k·m.
 * Resolving-power grids: six-point Lagrange interpolation ({@link LagrangeWeights#centred}) of the internal points
 * around the output point; an output point belongs to the segment owning its lower neighbour k0, whose stencil
 * k0 − 2 … k0 + 3 lies within the segment's margin. Values are written raw (they may be slightly negative: FFT
 * round-off where no line reaches); the engine clips after the edge correction.
 */
final class OutputSampler {
    private static final int P = FastPlanner.P;

    private final FastPlan plan;
    private final double[] weights = new double[P];
    private int next;

    OutputSampler(FastPlan plan) {
        this.plan = plan;
    }

    /**
     * Writes the output points segment {@code seg} owns into {@code raw}.
     *
     * @param ring σ on the segment's ring, or null when no line reaches the segment (its points stay 0)
     */
    void sample(int seg, double[] ring, double[] raw) {
        SegmentLayout layout = plan.layout;
        long ownedTo = layout.end(seg);
        long ringStart = layout.start(seg) - plan.margin;
        boolean last = seg == layout.segments() - 1;
        double[] points = plan.pointsCm1;
        int n = points.length;
        int m = plan.oversampling;
        double origin = plan.originCm1;
        double h = plan.stepCm1;
        int offset = plan.offset;
        if (plan.uniform) {
            int to = last ? n : (int) Math.min(n, (ownedTo - 1) / m + 1);
            if (ring != null) {
                for (int k = next; k < to; k++) {
                    raw[k] = ring[(int) ((long) k * m - ringStart) + offset];
                }
            }
            next = Math.max(next, to);
            return;
        }
        int k = next;
        for (; k < n; k++) {
            double pos = (points[k] - origin) / h;
            int k0 = (int) Math.floor(pos);
            if (k0 >= ownedTo && !last) {
                break;
            }
            if (ring != null) {
                LagrangeWeights.centred(P, pos - k0, weights, 0);
                int base = (int) (k0 - FastPlanner.SHIFT - ringStart) + offset;
                double value = 0;
                for (int j = 0; j < P; j++) {
                    value += weights[j] * ring[base + j];
                }
                raw[k] = value;
            }
        }
        next = k;
    }
}
