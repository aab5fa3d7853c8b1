package org.linewright.reference.verify;

/**
 * One problem found in one line (or, for isotopologue-wide findings, at the line named in the message).
 *
 * @param check          which check found it
 * @param severity       error, warning or note
 * @param moleculeId     the line's molecule number
 * @param isotopologue   the line's isotopologue number
 * @param wavenumberCm1  the line's position in cm⁻¹ (NaN when no line is concerned)
 * @param sourceLine     the line's 1-based record number in its source file (0 when no line is concerned)
 * @param field          the store name of the offending column (e.g. {@code intensity_cm_per_molecule})
 * @param value          the offending value (NaN when not numeric)
 * @param expected       the value expected (NaN when there is none, e.g. for a duplicate)
 * @param message        one line saying what is wrong
 */
public record Finding(Check check, Severity severity, int moleculeId, int isotopologue, double wavenumberCm1,
                      long sourceLine, String field, double value, double expected, String message) {
}
