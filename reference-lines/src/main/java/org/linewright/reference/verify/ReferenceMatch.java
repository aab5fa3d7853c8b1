package org.linewright.reference.verify;

import org.linewright.reference.data.ReferenceLine;

/**
 * The outcome of looking a reference line up in a line list.
 *
 * @param reference      the reference line
 * @param status         what was found
 * @param wavenumberCm1  the listed line's position in cm⁻¹ (NaN when none was found)
 * @param offsetCm1      listed − reference, in cm⁻¹ (NaN when none was found)
 * @param sourceLine     the listed line's record number in its source (0 when none was found)
 */
public record ReferenceMatch(ReferenceLine reference, Status status, double wavenumberCm1, double offsetCm1,
                             long sourceLine) {
    /** What the look-up found. */
    public enum Status {
        /** The line with the reference's quantum numbers lies within the tolerance. */
        FOUND(true),
        /** The list gives no quantum numbers for the species; the nearest line lies within the tolerance. */
        FOUND_BY_POSITION(true),
        /** The line with the reference's quantum numbers lies outside the tolerance: a failure. */
        OFFSET(false),
        /** The species is in the list but no line with the reference's labels is near the reference. */
        ABSENT(true),
        /** The list holds no line of the reference's isotopologue. */
        NOT_COVERED(true);

        private final boolean passes;

        Status(boolean passes) {
            this.passes = passes;
        }

        /** False only for a line that was identified and found misplaced. */
        public boolean passes() {
            return passes;
        }
    }

    /** offset / reference position: the relative residual plotted by {@code verify --plot}. */
    public double relativeOffset() {
        return offsetCm1 / reference.wavenumberCm1();
    }
}
