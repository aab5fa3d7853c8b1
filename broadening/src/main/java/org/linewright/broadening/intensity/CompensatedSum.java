package org.linewright.broadening.intensity;

/**
 * A running sum with Neumaier's compensation (Neumaier 1974, ZAMM 54, 39–51, the improved Kahan–Babuška
 * summation): the rounding error of each addition is carried in a second term, so a sum of terms spanning many
 * decades (line intensities span 30 and more) keeps the small terms; the error is bounded by about 2u·Σ|xᵢ|
 * independent of the count, against (n−1)u·Σ|xᵢ| for a plain sum (u the unit round-off). The one compensated sum
 * of line statistics (total, used, dropped and lost intensity). Not thread-safe; the caller fixes the order.
 */
public final class CompensatedSum {
    private double sum;
    private double compensation;

    /** Adds {@code x}. */
    public void add(double x) {
        double t = sum + x;
        // the low-order bits lost by t = sum + x, taken from the smaller operand
        compensation += Math.abs(sum) >= Math.abs(x) ? (sum - t) + x : (x - t) + sum;
        sum = t;
    }

    /** The compensated sum of everything added so far. */
    public double value() {
        return sum + compensation;
    }
}
