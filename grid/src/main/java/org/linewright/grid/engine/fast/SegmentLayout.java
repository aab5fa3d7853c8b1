package org.linewright.grid.engine.fast;

/**
 * How the fast engine cuts its internal uniform grid into consecutive segments, each convolved in its own FFT ring
 * of one common power-of-two length L. A segment owning U internal points needs a ring of U + pad points, pad being
 * twice the kernel reach plus the guard points and, on resolving-power grids, the interpolation stencil's margin
 * (all supplied by the caller). The layout depends on the grid size and the reach only — never on the thread count —
 * so results are bitwise the same for any number of threads.
 *
 * <p><b>Choice of L.</b> The cost of one slice's convolution is proportional to Σ L·t(L) over the rings, t(L) the
 * FFT time per point, which grows with L (measured on the reference machine with the FFT library used here, one
 * thread, warmed: about 5.3 ns/point up to 2¹⁷, 6.0 at 2¹⁸, 6.3 at 2¹⁹, 6.8 at 2²⁰, then a cache cliff: 9.8 at 2²¹,
 * 10.9 from 2²²; {@link #nanosPerPoint}). L is the power of two minimising segments(L)·L·t(L), where
 * segments(L) = ⌈N/(L − pad)⌉; a segmented layout is taken only when it is at least
 * {@value #MIN_GAIN} cheaper than one ring, since each segment also re-spreads the lines near its edges and repeats
 * per-slice bookkeeping. The N points are shared out evenly: segment s owns [⌊s·N/S⌋, ⌊(s+1)·N/S⌋).
 */
final class SegmentLayout {

    /** Relative saving a segmented layout must offer over one ring. */
    static final double MIN_GAIN = 0.1;

    private final long points;
    private final int ringLength;
    private final int segments;

    private SegmentLayout(long points, int ringLength, int segments) {
        this.points = points;
        this.ringLength = ringLength;
        this.segments = segments;
    }

    /**
     * The cheapest layout.
     *
     * @param points          internal grid points to cover, at least 1
     * @param pad             ring points a segment needs beyond those it owns (reach, guards, margins)
     * @param maxRingLength   largest ring length accepted (a power of two)
     * @param forcedRingLength a power of two to use instead of the cost model (0: choose), for tests
     * @return the layout
     * @throws IllegalArgumentException when no ring of at most {@code maxRingLength} leaves a point to own, or the
     *                                  forced length is too short for the pad
     */
    static SegmentLayout choose(long points, long pad, int maxRingLength, int forcedRingLength) {
        if (points < 1 || pad < 0) {
            throw new IllegalArgumentException("points " + points + ", pad " + pad);
        }
        long oneRing = points + pad;
        if (forcedRingLength > 0) {
            if (Integer.bitCount(forcedRingLength) != 1 || forcedRingLength <= pad) {
                throw new IllegalArgumentException("ring length " + forcedRingLength + " for a pad of " + pad
                        + " (expected a power of two above the pad)");
            }
            if (forcedRingLength >= oneRing) {
                return new SegmentLayout(points, FastEngine.fftLength((int) oneRing), 1);
            }
            return of(points, pad, forcedRingLength);
        }
        if (pad + 1 > maxRingLength) {
            throw new IllegalArgumentException("a ring of more than " + maxRingLength + " points is needed (pad "
                    + pad + ")");
        }
        SegmentLayout best = null;
        double bestCost = Double.POSITIVE_INFINITY;
        if (oneRing <= maxRingLength) {
            int length = FastEngine.fftLength((int) oneRing);
            if (length <= maxRingLength) {
                best = new SegmentLayout(points, length, 1);
                bestCost = cost(best) * (1 - MIN_GAIN);
            }
        }
        int shortest = FastEngine.fftLength((int) (pad + 1));
        int start = best == null ? maxRingLength : best.ringLength / 2;
        for (int length = start; length >= shortest; length /= 2) {
            SegmentLayout candidate = of(points, pad, length);
            double c = cost(candidate);
            if (c < bestCost) {
                best = candidate;
                bestCost = c;
            }
        }
        return best;
    }

    private static SegmentLayout of(long points, long pad, int length) {
        long useful = length - pad;
        long segments = (points + useful - 1) / useful;
        if (segments > Integer.MAX_VALUE) {
            throw new IllegalArgumentException("too many segments: " + segments);
        }
        return new SegmentLayout(points, length, (int) segments);
    }

    /** Estimated relative cost of one slice over all rings, segments·L·t(L). */
    static double cost(SegmentLayout layout) {
        return (double) layout.segments * layout.ringLength * nanosPerPoint(layout.ringLength);
    }

    /**
     * FFT time per point of a real transform of length {@code length} (a power of two), in ns: measured on the
     * reference machine (2 cores, one thread, warmed), only the ratios matter.
     */
    static double nanosPerPoint(int length) {
        if (length <= 1 << 17) {
            return 5.3;
        } else if (length <= 1 << 18) {
            return 6.0;
        } else if (length <= 1 << 19) {
            return 6.3;
        } else if (length <= 1 << 20) {
            return 6.8;
        } else if (length <= 1 << 21) {
            return 9.8;
        }
        return 10.9;
    }

    /** The common ring length L, a power of two. */
    int ringLength() {
        return ringLength;
    }

    /** Number of segments. */
    int segments() {
        return segments;
    }

    /** First internal point owned by segment s. */
    long start(int s) {
        return s * points / segments;
    }

    /** One past the last internal point owned by segment s. */
    long end(int s) {
        return (s + 1) * points / segments;
    }
}
