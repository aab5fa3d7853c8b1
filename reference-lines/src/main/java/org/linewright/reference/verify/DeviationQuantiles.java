package org.linewright.reference.verify;

/**
 * Quantiles of |S/S(A) − 1| over a whole list in bounded memory: a histogram with {@value #BINS} bins of width
 * {@value #BIN_WIDTH} from 0 to {@value #RANGE}, plus a count beyond. A quantile is the upper edge of its bin, so
 * it is exact to {@value #BIN_WIDTH} (absolute) inside the range and reported as infinite beyond.
 */
final class DeviationQuantiles {
    static final double BIN_WIDTH = 1e-6;
    static final double RANGE = 0.1;
    static final int BINS = 100_000;

    private final int[] counts = new int[BINS];
    private long beyond;
    private long total;

    void add(double absDeviation) {
        if (Double.isNaN(absDeviation)) {
            return;
        }
        total++;
        if (!(absDeviation < RANGE)) {
            beyond++;
        } else {
            counts[Math.min(BINS - 1, (int) (absDeviation / BIN_WIDTH))]++;
        }
    }

    long total() {
        return total;
    }

    /** The value below which a fraction {@code p} of the deviations lie (bin upper edge); NaN when empty. */
    double quantile(double p) {
        if (total == 0) {
            return Double.NaN;
        }
        long rank = Math.max(1, (long) Math.ceil(p * total));
        long seen = 0;
        for (int k = 0; k < BINS; k++) {
            seen += counts[k];
            if (seen >= rank) {
                return (k + 1) * BIN_WIDTH;
            }
        }
        return Double.POSITIVE_INFINITY;
    }
}
