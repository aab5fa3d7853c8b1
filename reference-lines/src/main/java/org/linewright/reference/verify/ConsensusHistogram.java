package org.linewright.reference.verify;

import java.util.Arrays;

/**
 * The median of many values that cluster tightly around a known centre, in bounded memory: a histogram of
 * ln(value/centre) with {@value #BINS} bins of width {@value #BIN_WIDTH} over ±{@value #HALF_RANGE}, plus counts
 * below and above. The median is the centre of its bin, so it is exact to ±{@value #BIN_WIDTH}/2 relative when it
 * falls inside the range. Otherwise (the lines disagree with the centre by more than 10 %, e.g. another
 * partition-sum convention) the median of an evenly thinned sample of at most {@value #SAMPLE} values stands in.
 * The same counts give the robust spread (scaled median absolute deviation, {@link #robustSpread()}).
 */
final class ConsensusHistogram {
    static final double HALF_RANGE = 0.1;
    static final double BIN_WIDTH = 1e-5;
    static final int BINS = 20_001;
    static final int SAMPLE = 4096;

    private final double centre;
    private final int[] counts = new int[BINS];
    private long below;
    private long above;
    private long total;
    private final ResidualSeries sample = new ResidualSeries(SAMPLE);

    ConsensusHistogram(double centre) {
        if (!(centre > 0) || Double.isInfinite(centre)) {
            throw new IllegalArgumentException("centre must be positive and finite: " + centre);
        }
        this.centre = centre;
    }

    void add(double value) {
        double x = Math.log(value / centre);
        total++;
        sample.add(value, 0.0);
        if (!(x >= -HALF_RANGE)) {
            below++;
        } else if (x > HALF_RANGE) {
            above++;
        } else {
            // bin k covers [−R + (k − ½)w, −R + (k + ½)w): its centre is −R + k·w
            int k = (int) Math.rint((x + HALF_RANGE) / BIN_WIDTH);
            counts[Math.min(BINS - 1, k)]++;
        }
    }

    long total() {
        return total;
    }

    /**
     * The robust spread of ln(value): 1.4826 × the median absolute deviation from the median (Hampel 1974, JASA 69,
     * 383; the factor makes it equal to σ for normally distributed values), resolved to {@value #BIN_WIDTH}, from
     * the histogram when the median lies inside it (values outside count as farther than any bin), else from the
     * thinned sample; NaN when nothing was added. For small relative deviations ln(v/m) ≈ v/m − 1, so this is
     * the relative spread.
     */
    double robustSpread() {
        if (total == 0) {
            return Double.NaN;
        }
        long rank = (total + 1) / 2;
        int medianBin = medianBin(rank);
        if (medianBin < 0) {
            double[] values = sample.x();
            Arrays.sort(values);
            double median = values[(values.length - 1) / 2];
            double[] dev = new double[values.length];
            for (int i = 0; i < values.length; i++) {
                dev[i] = Math.abs(Math.log(values[i] / median));
            }
            Arrays.sort(dev);
            return MAD_TO_SIGMA * dev[(dev.length - 1) / 2];
        }
        long seen = counts[medianBin];
        for (int d = 0; d < BINS; d++) {
            if (seen >= rank) {
                return MAD_TO_SIGMA * d * BIN_WIDTH;
            }
            seen += (medianBin - d - 1 >= 0 ? counts[medianBin - d - 1] : 0)
                    + (medianBin + d + 1 < BINS ? counts[medianBin + d + 1] : 0);
        }
        return Double.POSITIVE_INFINITY;
    }

    /** 1/Φ⁻¹(3/4): turns a median absolute deviation into σ for normal data. */
    static final double MAD_TO_SIGMA = 1.4826;

    /** The histogram bin holding the value of rank {@code rank}, or −1 when it lies outside the histogram. */
    private int medianBin(long rank) {
        if (rank <= below || rank > total - above) {
            return -1;
        }
        long seen = below;
        for (int k = 0; k < BINS; k++) {
            seen += counts[k];
            if (seen >= rank) {
                return k;
            }
        }
        return -1;
    }

    /**
     * The median value (lower median for an even count), from the histogram when it lies inside it, else from the
     * thinned sample; NaN when nothing was added.
     */
    double median() {
        if (total == 0) {
            return Double.NaN;
        }
        long rank = (total + 1) / 2;
        if (rank <= below || rank > total - above) {
            double[] values = sample.x();
            Arrays.sort(values);
            return values[(values.length - 1) / 2];
        }
        long seen = below;
        for (int k = 0; k < BINS; k++) {
            seen += counts[k];
            if (seen >= rank) {
                return centre * Math.exp(-HALF_RANGE + k * BIN_WIDTH);
            }
        }
        return Double.NaN;
    }
}
