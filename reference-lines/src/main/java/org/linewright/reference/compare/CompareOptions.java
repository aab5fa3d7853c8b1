package org.linewright.reference.compare;

/**
 * How {@link LineListComparer} pairs lines.
 *
 * @param matchWindowCm1       lines with the same species and quantum labels are paired when their positions
 *                             differ by at most this (cm⁻¹); it bounds the memory of the merge (the lines of
 *                             the new list within about this distance of the current position are held)
 * @param nearestToleranceCm1  lines left unpaired by their labels are paired with the nearest unpaired line of
 *                             the same species within this distance (cm⁻¹), e.g. after a relabelling
 * @param maxListedChanges     changes listed one by one in the report (all are counted and summarised)
 */
public record CompareOptions(double matchWindowCm1, double nearestToleranceCm1, int maxListedChanges) {
    /** 0.5 cm⁻¹: well beyond the position corrections between versions of a list (typically below 0.05 cm⁻¹). */
    public static final double DEFAULT_MATCH_WINDOW_CM1 = 0.5;
    /** 10⁻³ cm⁻¹: a thousand times the last printed digit of the 160-character format's positions. */
    public static final double DEFAULT_NEAREST_TOLERANCE_CM1 = 1e-3;

    public CompareOptions {
        if (!(matchWindowCm1 > 0) || !(nearestToleranceCm1 >= 0) || Double.isInfinite(matchWindowCm1)
                || Double.isInfinite(nearestToleranceCm1)) {
            throw new IllegalArgumentException("window and tolerance must be finite, the window positive");
        }
        if (maxListedChanges < 0) {
            throw new IllegalArgumentException("maxListedChanges must not be negative: " + maxListedChanges);
        }
    }

    /** The documented defaults, listing up to 100,000 changes. */
    public static CompareOptions defaults() {
        return new CompareOptions(DEFAULT_MATCH_WINDOW_CM1, DEFAULT_NEAREST_TOLERANCE_CM1, 100_000);
    }
}
