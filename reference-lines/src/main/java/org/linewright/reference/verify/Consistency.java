package org.linewright.reference.verify;

/**
 * How well a list's intensities agree with its Einstein A values, over all its lines (each line with its own
 * isotopologue's consensus Q(296 K)/abundance).
 *
 * @param robustSpread         1.4826 × median |S/S(A) − 1| (to 1.5 × 10⁻⁶): the list's internal consistency
 * @param deviation99          the |S/S(A) − 1| that 99 % of the lines stay within (to 10⁻⁶)
 * @param withinDigitsFraction the fraction of lines that agree within the rounding of the digits they carry
 */
public record Consistency(double robustSpread, double deviation99, double withinDigitsFraction) {
}
