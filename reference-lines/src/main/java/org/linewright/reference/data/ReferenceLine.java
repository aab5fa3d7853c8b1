package org.linewright.reference.data;

import java.util.Objects;

/**
 * One reference line: a published (or well-known) position of a transition of one isotopologue, with the
 * quantum labels that identify it in a line list and the tolerance within which a listed line must lie.
 *
 * @param category        free-form group, e.g. {@code rotational}, {@code wavenumber-standard}
 * @param moleculeId      molecule number of the isotopologue registry
 * @param isotopologue    local isotopologue number of the registry
 * @param upperJ          J′ identifying the line, NaN when not used for matching
 * @param lowerJ          J″ identifying the line, NaN when not used for matching
 * @param upperK          K′ (Ka′ for asymmetric tops) identifying the line, NaN when not used for matching
 * @param upperGlobal     upper vibrational label, trimmed with blanks collapsed; empty = any
 * @param lowerGlobal     lower vibrational label, trimmed with blanks collapsed; empty = any
 * @param wavenumberCm1   the reference position in cm⁻¹ (converted from the file's unit)
 * @param toleranceCm1    how far a listed line may lie from the reference, in cm⁻¹
 * @param label           a short human-readable name, e.g. {@code CO J=1-0}
 * @param source          where the value comes from (publication, "common practice" or "from memory")
 * @param origin          file and line the reference was read from
 */
public record ReferenceLine(String category, int moleculeId, int isotopologue, double upperJ, double lowerJ,
                            double upperK, String upperGlobal, String lowerGlobal, double wavenumberCm1,
                            double toleranceCm1, String label, String source, String origin) {
    public ReferenceLine {
        Objects.requireNonNull(category, "category");
        Objects.requireNonNull(upperGlobal, "upperGlobal");
        Objects.requireNonNull(lowerGlobal, "lowerGlobal");
        Objects.requireNonNull(label, "label");
        Objects.requireNonNull(source, "source");
        Objects.requireNonNull(origin, "origin");
        if (!(toleranceCm1 > 0)) {
            throw new IllegalArgumentException("tolerance must be positive: " + toleranceCm1);
        }
    }

    /** True when J′ or J″ identifies the line (then lines are matched by quantum numbers). */
    public boolean hasQuantumNumbers() {
        return !Double.isNaN(upperJ) || !Double.isNaN(lowerJ);
    }

    /** {@code molecule/isotopologue}, e.g. {@code 5/1}. */
    public String isotopologueKey() {
        return moleculeId + "/" + isotopologue;
    }
}
