package org.linewright.reference.verify;

/**
 * The significant digits a number read from a record carries, and the rounding they imply. A value parsed from
 * {@code 1.751E-34} is the double nearest to 1.751 × 10⁻³⁴; rounding it to 4 significant digits gives it back,
 * rounding it to 3 does not, so it carries 4 digits. (Trailing zeros of the record are not seen: {@code 1.700E-20}
 * reads as 2 digits; callers take the largest count over many values.) No allocation.
 */
final class PrintedDigits {
    /** Doubles carry at most 17 significant decimal digits. */
    static final int MAX_DIGITS = 17;

    private PrintedDigits() {
    }

    /** Significant digits of {@code v} (1–17), 0 for zero, NaN or infinite values. */
    static int significantDigits(double v) {
        if (v == 0 || !Double.isFinite(v)) {
            return 0;
        }
        double a = Math.abs(v);
        int exponent = decimalExponent(a);
        // 4 ulps absorb the rounding of the inexact power of ten, the product and the quotient
        double slack = 4 * Math.ulp(a);
        for (int n = 1; n < MAX_DIGITS; n++) {
            int shift = n - 1 - exponent;
            double rounded = shift >= 0 ? Math.rint(a * Math.pow(10, shift)) / Math.pow(10, shift)
                    : Math.rint(a / Math.pow(10, -shift)) * Math.pow(10, -shift);
            if (Math.abs(rounded - a) <= slack) {
                return n;
            }
        }
        return MAX_DIGITS;
    }

    /**
     * Largest relative rounding error of a value printed with {@code digits} significant digits: half a unit
     * in the last place of its mantissa m ∈ [1, 10), i.e. ½ · 10^(1 − digits) / m. NaN for digits ≤ 0.
     */
    static double relativeRounding(double v, int digits) {
        if (digits <= 0 || v == 0 || !Double.isFinite(v)) {
            return Double.NaN;
        }
        double a = Math.abs(v);
        double mantissa = a / Math.pow(10, decimalExponent(a));
        return 0.5 * Math.pow(10, 1 - digits) / mantissa;
    }

    /** floor(log10 a) for a > 0, corrected where log10 rounds across a power of ten. */
    private static int decimalExponent(double a) {
        int e = (int) Math.floor(Math.log10(a));
        if (Math.pow(10, e) > a) {
            e--;
        } else if (Math.pow(10, e + 1) <= a) {
            e++;
        }
        return e;
    }
}
