package org.linewright.grid.engine.fast;

import java.util.Arrays;

/**
 * The lines spread over the nodes of a {@link FastPlan}, one segment at a time: the lines within the segment's ring
 * ordered by their (family, Doppler, Lorentz) stencil key, in line order within a key, with their six position
 * weights (times the intensity) on the internal grid and their four Doppler and four Lorentz weights on their
 * family's width axes, computed for that segment in that order, so that spreading a slice reads them front to back.
 * Only the current segment's lines have weights in memory ({@value #BYTES_PER_SEGMENT_LINE} bytes each); a line
 * reached by two segments' rings is weighted twice, with the same bits.
 */
final class LineDistribution {
    private static final int P = FastPlanner.P;
    /** {@link #firstPoint} of a line in no ring. */
    static final long NONE = Long.MIN_VALUE;
    /**
     * Working memory per line of the current segment: its weights (6 + 4 + 4 doubles) and first point (an int).
     */
    static final int BYTES_PER_SEGMENT_LINE = (P + 8) * Double.BYTES + Integer.BYTES;

    private final FastPlan plan;
    private final LineBuffer lines;
    /** Internal indices of the first position nodes any ring takes. */
    final long lo;
    final long hi;

    /** The current segment's lines: bucketStart[key] .. bucketStart[key+1] of stencil key in the ordered arrays. */
    final int[] bucketStart;
    /** Ring index of internal point j in the current segment: j + shift. */
    int shift;
    double[] orderedPositionWeights = new double[0];
    double[] orderedDopplerWeights = new double[0];
    double[] orderedLorentzWeights = new double[0];
    int[] orderedFirstPoint = new int[0];
    private final double[] discard = new double[4];

    /**
     * Lines whose first position node lies outside [lo, hi] (internal indices) are in no ring: they lie farther than
     * the kernel reach from every point.
     */
    LineDistribution(FastPlan plan, LineBuffer lines, long lo, long hi) {
        this.plan = plan;
        this.lines = lines;
        this.lo = lo;
        this.hi = hi;
        bucketStart = new int[plan.keys + 1];
    }

    /**
     * Internal grid index of the first position node of a line at {@code centerCm1}, or {@link #NONE} when it is
     * summed directly or its first node lies outside [lo, hi].
     */
    static long firstPoint(double originCm1, double stepCm1, double centerCm1, int family, long lo, long hi) {
        double pos = (centerCm1 - originCm1) / stepCm1;
        double floor = Math.floor(pos);
        // compared as doubles: a line far off the grid may lie beyond the int range
        if (family == FastPlan.DIRECT || floor - FastPlanner.SHIFT < lo || floor - FastPlanner.SHIFT > hi) {
            return NONE;
        }
        return (int) floor - FastPlanner.SHIFT;
    }

    /** The six position weights × S of a line at {@code centerCm1}, into {@code out} from {@code at}. */
    static void positionWeights(double originCm1, double stepCm1, double centerCm1, double strength, double[] out,
                                int at) {
        double pos = (centerCm1 - originCm1) / stepCm1;
        LagrangeWeights.centred(P, pos - Math.floor(pos), out, at);
        for (int j = 0; j < P; j++) {
            out[at + j] *= strength;
        }
    }

    /**
     * The most lines any one segment's ring takes (for the memory check, before any work): segment s takes the
     * lines whose first node f satisfies start(s) − margin − offset ≤ f ≤ start(s) − margin − offset + L − P.
     */
    static int maxSegmentLines(FastPlan.Builder b, LineBuffer lines) {
        SegmentLayout layout = b.layout;
        int segments = layout.segments();
        int length = layout.ringLength();
        long lo = -b.offset - b.margin;
        long hi = layout.start(segments - 1) - b.margin - b.offset + length - P;
        int[] change = new int[segments + 1];
        for (int i = 0; i < lines.count; i++) {
            long f = firstPoint(b.originCm1, b.stepCm1, lines.centerCm1[i], b.lineFamily[i], lo, hi);
            if (f == NONE) {
                continue;
            }
            // start(s) within [f + margin + offset − (L − P), f + margin + offset]
            int first = firstSegmentStartingAtOrAbove(layout, f + b.margin + b.offset - (length - P));
            int last = firstSegmentStartingAtOrAbove(layout, f + b.margin + b.offset + 1) - 1;
            if (first <= last) {
                change[first]++;
                change[last + 1]--;
            }
        }
        int most = 0;
        int running = 0;
        for (int s = 0; s < segments; s++) {
            running += change[s];
            most = Math.max(most, running);
        }
        return most;
    }

    /** The first segment whose start is at least {@code point} (segments() when none). */
    private static int firstSegmentStartingAtOrAbove(SegmentLayout layout, long point) {
        int a = 0;
        int z = layout.segments();
        while (a < z) {
            int mid = (a + z) >>> 1;
            if (layout.start(mid) >= point) {
                z = mid;
            } else {
                a = mid + 1;
            }
        }
        return a;
    }

    /**
     * Takes the lines whose first position node lies in [segmentLo, segmentHi] (internal indices: their whole
     * stencil then lies in the segment's ring), orders them by stencil key, in line order within a key, and
     * computes their weights in that order.
     */
    void bucket(long segmentLo, long segmentHi, int ringShift) {
        int keys = bucketStart.length - 1;
        Arrays.fill(bucketStart, 0);
        // two passes over the lines (count per key, then place), so that nothing per line is kept between them
        int m = 0;
        for (int i = 0; i < lines.count; i++) {
            int key = segmentKey(i, segmentLo, segmentHi);
            if (key >= 0) {
                bucketStart[key + 1]++;
                m++;
            }
        }
        for (int k = 0; k < keys; k++) {
            bucketStart[k + 1] += bucketStart[k];
        }
        int[] fill = Arrays.copyOf(bucketStart, keys);
        if (orderedFirstPoint.length < m) {
            // the last segment's arrays go first, so that both are never held at once
            release();
            orderedPositionWeights = new double[P * m];
            orderedDopplerWeights = new double[4 * m];
            orderedLorentzWeights = new double[4 * m];
            orderedFirstPoint = new int[m];
        }
        double origin = plan.originCm1;
        double h = plan.stepCm1;
        for (int i = 0; i < lines.count; i++) {
            int key = segmentKey(i, segmentLo, segmentHi);
            if (key < 0) {
                continue;
            }
            int q = fill[key]++;
            double c = lines.centerCm1[i];
            positionWeights(origin, h, c, lines.strength[i], orderedPositionWeights, P * q);
            Family f = plan.families[plan.lineFamily[i]];
            f.doppler.stencil(lines.dopplerCm1[i], orderedDopplerWeights, 4 * q);
            f.lorentz.stencil(lines.lorentzCm1[i], orderedLorentzWeights, 4 * q);
            orderedFirstPoint[q] = (int) firstPoint(origin, h, c, plan.lineFamily[i], lo, hi);
        }
        shift = ringShift;
    }

    /** Stencil key of line i when its first node lies in [segmentLo, segmentHi] (and in a ring), else −1. */
    private int segmentKey(int i, long segmentLo, long segmentHi) {
        long p = firstPoint(plan.originCm1, plan.stepCm1, lines.centerCm1[i], plan.lineFamily[i], lo, hi);
        if (p == NONE || p < segmentLo || p > segmentHi) {
            return -1;
        }
        Family f = plan.families[plan.lineFamily[i]];
        int jg = f.doppler.stencil(lines.dopplerCm1[i], discard, 0);
        int jl = f.lorentz.stencil(lines.lorentzCm1[i], discard, 0);
        return f.firstKey + jg * f.lorentz.size() + jl;
    }

    /** Lets go of the last segment's weights (the edge correction needs the heap next). */
    void release() {
        orderedPositionWeights = new double[0];
        orderedDopplerWeights = new double[0];
        orderedLorentzWeights = new double[0];
        orderedFirstPoint = new int[0];
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
