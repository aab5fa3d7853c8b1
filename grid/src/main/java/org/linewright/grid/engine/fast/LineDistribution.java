package org.linewright.grid.engine.fast;

import java.util.Arrays;

/**
 * The lines spread over the nodes of a {@link FastPlan}: each line's six position weights (times its intensity) on
 * the internal grid and its four Doppler and four Lorentz weights on its family's width axes, computed once for all
 * segments; and, per segment, the lines within its ring ordered by their (family, Doppler, Lorentz) stencil key, with
 * their weights copied into that order so that spreading a slice reads them front to back.
 */
final class LineDistribution {
    private static final int P = FastPlanner.P;

    /** Stencil key of each line, −1 for a line outside every ring or summed directly. */
    final int[] key;
    /** Internal grid index of each line's first position node. */
    final int[] firstPoint;
    /** Position weights × S, {@value FastPlanner#P} per line. */
    final double[] positionWeights;
    final double[] dopplerWeights;
    final double[] lorentzWeights;

    /** The current segment's lines: bucketStart[key] .. bucketStart[key+1] of stencil key in {@link #order}. */
    final int[] order;
    final int[] bucketStart;
    /** Ring index of internal point j in the current segment: j + shift. */
    int shift;
    double[] orderedPositionWeights;
    double[] orderedDopplerWeights;
    double[] orderedLorentzWeights;
    int[] orderedFirstPoint;

    /**
     * Position and width weights of every line of the plan's families; lines whose first position node lies outside
     * [lo, hi] (internal indices) are in no ring: they lie farther than the kernel reach from every point.
     */
    LineDistribution(FastPlan plan, LineBuffer lines, long lo, long hi) {
        int count = lines.count;
        firstPoint = new int[count];
        key = new int[count];
        positionWeights = new double[P * count];
        dopplerWeights = new double[4 * count];
        lorentzWeights = new double[4 * count];
        double origin = plan.originCm1;
        double h = plan.stepCm1;
        for (int i = 0; i < count; i++) {
            int family = plan.lineFamily[i];
            double pos = (lines.centerCm1[i] - origin) / h;
            double floor = Math.floor(pos);
            // compared as doubles: a line far off the grid may lie beyond the int range
            if (family == FastPlan.DIRECT || floor - FastPlanner.SHIFT < lo || floor - FastPlanner.SHIFT > hi) {
                key[i] = -1;
                continue;
            }
            int k0 = (int) floor;
            LagrangeWeights.centred(P, pos - floor, positionWeights, P * i);
            for (int j = 0; j < P; j++) {
                positionWeights[P * i + j] *= lines.strength[i];
            }
            firstPoint[i] = k0 - FastPlanner.SHIFT;
            Family f = plan.families[family];
            int jg = f.doppler.stencil(lines.dopplerCm1[i], dopplerWeights, 4 * i);
            int jl = f.lorentz.stencil(lines.lorentzCm1[i], lorentzWeights, 4 * i);
            key[i] = f.firstKey + jg * f.lorentz.size() + jl;
        }
        order = new int[count];
        bucketStart = new int[plan.keys + 1];
    }

    /**
     * Orders the lines whose first position node lies in [lo, hi] (internal indices: their whole stencil then lies
     * in the segment's ring) by stencil key, in line order within a key, and copies their weights in that order.
     */
    void bucket(long lo, long hi, int ringShift) {
        int keys = bucketStart.length - 1;
        Arrays.fill(bucketStart, 0);
        int n = key.length;
        for (int i = 0; i < n; i++) {
            int p = firstPoint[i];
            if (key[i] >= 0 && p >= lo && p <= hi) {
                bucketStart[key[i] + 1]++;
            }
        }
        for (int k = 0; k < keys; k++) {
            bucketStart[k + 1] += bucketStart[k];
        }
        int[] fill = Arrays.copyOf(bucketStart, keys);
        for (int i = 0; i < n; i++) {
            int p = firstPoint[i];
            if (key[i] >= 0 && p >= lo && p <= hi) {
                order[fill[key[i]]++] = i;
            }
        }
        int m = bucketStart[keys];
        if (orderedFirstPoint == null || orderedFirstPoint.length < m) {
            orderedPositionWeights = new double[P * m];
            orderedDopplerWeights = new double[4 * m];
            orderedLorentzWeights = new double[4 * m];
            orderedFirstPoint = new int[m];
        }
        for (int q = 0; q < m; q++) {
            int i = order[q];
            System.arraycopy(positionWeights, P * i, orderedPositionWeights, P * q, P);
            System.arraycopy(dopplerWeights, 4 * i, orderedDopplerWeights, 4 * q, 4);
            System.arraycopy(lorentzWeights, 4 * i, orderedLorentzWeights, 4 * q, 4);
            orderedFirstPoint[q] = firstPoint[i];
        }
        shift = ringShift;
    }

    /** Number of lines (in the current segment) whose stencil touches slice (ig, il) of a family. */
    int linesOfSlice(Family f, int ig, int il) {
        int sg = f.doppler.stencilSize();
        int sl = f.lorentz.stencilSize();
        int nl = f.lorentz.size();
        int lines = 0;
        for (int jg = Math.max(0, ig - sg + 1); jg <= ig; jg++) {
            for (int jl = Math.max(0, il - sl + 1); jl <= il; jl++) {
                int k = f.firstKey + jg * nl + jl;
                lines += bucketStart[k + 1] - bucketStart[k];
            }
        }
        return lines;
    }

    /** The slice's line distribution (position weights × width weights) on the ring, in {@code out}. */
    void spread(Family f, int dopplerNode, int lorentzNode, double[] out) {
        Arrays.fill(out, 0.0);
        int sg = f.doppler.stencilSize();
        int sl = f.lorentz.stencilSize();
        int nl = f.lorentz.size();
        double[] gw = orderedDopplerWeights;
        double[] lw = orderedLorentzWeights;
        double[] pw = orderedPositionWeights;
        int[] first = orderedFirstPoint;
        for (int jg = Math.max(0, dopplerNode - sg + 1); jg <= dopplerNode; jg++) {
            int gIndex = dopplerNode - jg;
            for (int jl = Math.max(0, lorentzNode - sl + 1); jl <= lorentzNode; jl++) {
                int lIndex = lorentzNode - jl;
                int k = f.firstKey + jg * nl + jl;
                for (int q = bucketStart[k]; q < bucketStart[k + 1]; q++) {
                    double w = gw[4 * q + gIndex] * lw[4 * q + lIndex];
                    int p = first[q] + shift;
                    for (int j = 0; j < P; j++) {
                        out[p + j] += w * pw[P * q + j];
                    }
                }
            }
        }
    }
}
