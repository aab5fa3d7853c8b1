package org.linewright.ingest.text;

import java.nio.charset.StandardCharsets;

/**
 * Parses decimal numbers straight from ASCII bytes (a field of a line-list record) without creating
 * strings, for the hot loops of the readers.
 *
 * <p>Floating-point syntax: optional blanks, optional sign, digits with an optional decimal point, optional
 * exponent introduced by {@code e}, {@code E}, {@code d} or {@code D} (the Fortran double-precision letter),
 * optional blanks. Anything else, including an empty field, {@code NaN} and {@code Infinity}, is not a number.
 *
 * <p>Accuracy: when the decimal significand (up to 18 digits) is below 2⁵³ and the
 * decimal exponent lies in [−22, 22], the result is correctly rounded, because both the significand and the
 * power of ten are exact doubles and IEEE 754 rounds the single product or quotient correctly (the "fast path"
 * of W.D. Clinger, "How to read floating point numbers accurately", PLDI 1990, ACM SIGPLAN Notices 25(6), 92).
 * Otherwise, with a significand below 2⁵³ and a decimal exponent in [−300, 300], the result is the significand
 * times or divided by the correctly rounded power of ten, within 1.5 units in the last place of the correctly
 * rounded value; all other inputs (more than 18 significant digits, extreme exponents) go to
 * {@link Double#parseDouble(String)}, which is correctly rounded. The result for a given text never depends on
 * anything but the text.
 */
public final class AsciiNumbers {
    /** Returned by {@link #parseLong} for text that is not an integer. */
    public static final long NOT_AN_INTEGER = Long.MIN_VALUE;

    /** Decimal exponents handled by the table; beyond it the JDK parser is used. */
    private static final int TABLE_POWER_LIMIT = 300;
    /** Significands below this are exact doubles. */
    private static final long EXACT_SIGNIFICAND_LIMIT = 1L << 53;
    /** 10^k, k = 0..300, each the correctly rounded double of the decimal value. */
    private static final double[] POWERS_OF_TEN = new double[TABLE_POWER_LIMIT + 1];

    static {
        for (int k = 0; k <= TABLE_POWER_LIMIT; k++) {
            POWERS_OF_TEN[k] = Double.parseDouble("1e" + k);
        }
    }

    private AsciiNumbers() {
    }

    /**
     * Parses {@code bytes[from, to)} as a floating-point number (see the class comment for syntax and accuracy).
     *
     * @return the value, or NaN when the text is not a number
     */
    public static double parseDouble(byte[] bytes, int from, int to) {
        int i = from;
        int end = to;
        while (i < end && bytes[i] == ' ') {
            i++;
        }
        while (end > i && (bytes[end - 1] == ' ' || bytes[end - 1] == '\r')) {
            end--;
        }
        if (i == end) {
            return Double.NaN;
        }
        boolean negative = false;
        if (bytes[i] == '-' || bytes[i] == '+') {
            negative = bytes[i] == '-';
            i++;
        }
        long significand = 0;
        int significantDigits = 0;
        int decimalExponent = 0;
        int digits = 0;
        boolean overflow = false;
        boolean seenPoint = false;
        for (; i < end; i++) {
            int c = bytes[i];
            if (c >= '0' && c <= '9') {
                digits++;
                if (significand == 0 && c == '0') {
                    // leading zeros carry no significance, only scale
                    if (seenPoint) {
                        decimalExponent--;
                    }
                    continue;
                }
                if (significantDigits < 18) {
                    significand = significand * 10 + (c - '0');
                    significantDigits++;
                    if (seenPoint) {
                        decimalExponent--;
                    }
                } else {
                    overflow = true;
                    if (!seenPoint) {
                        decimalExponent++;
                    }
                }
            } else if (c == '.' && !seenPoint) {
                seenPoint = true;
            } else {
                break;
            }
        }
        if (digits == 0) {
            return Double.NaN;
        }
        if (i < end) {
            int c = bytes[i];
            if (c != 'e' && c != 'E' && c != 'd' && c != 'D') {
                return Double.NaN;
            }
            i++;
            boolean negativeExponent = false;
            if (i < end && (bytes[i] == '-' || bytes[i] == '+')) {
                negativeExponent = bytes[i] == '-';
                i++;
            }
            if (i == end) {
                return Double.NaN;
            }
            int exponent = 0;
            for (; i < end; i++) {
                int d = bytes[i];
                if (d < '0' || d > '9') {
                    return Double.NaN;
                }
                if (exponent < 100_000) {
                    exponent = exponent * 10 + (d - '0');
                }
            }
            decimalExponent += negativeExponent ? -exponent : exponent;
        }
        double value;
        if (significand == 0) {
            value = 0.0;
        } else if (!overflow && significand < EXACT_SIGNIFICAND_LIMIT
                && Math.abs(decimalExponent) <= TABLE_POWER_LIMIT) {
            // exact significand: one rounding in the product/quotient (exact power up to 10^22, else one more)
            value = decimalExponent >= 0
                    ? significand * POWERS_OF_TEN[decimalExponent]
                    : significand / POWERS_OF_TEN[-decimalExponent];
        } else {
            value = Double.parseDouble(new String(bytes, from, to - from, StandardCharsets.ISO_8859_1)
                    .trim().replace('d', 'e').replace('D', 'e'));
        }
        return negative ? -value : value;
    }

    /**
     * Parses {@code bytes[from, to)} as a decimal integer with optional surrounding blanks and sign.
     *
     * @return the value, or {@link #NOT_AN_INTEGER} when the text is not an integer or exceeds 18 digits
     */
    public static long parseLong(byte[] bytes, int from, int to) {
        int i = from;
        int end = to;
        while (i < end && bytes[i] == ' ') {
            i++;
        }
        while (end > i && (bytes[end - 1] == ' ' || bytes[end - 1] == '\r')) {
            end--;
        }
        if (i == end) {
            return NOT_AN_INTEGER;
        }
        boolean negative = false;
        if (bytes[i] == '-' || bytes[i] == '+') {
            negative = bytes[i] == '-';
            i++;
        }
        if (i == end || end - i > 18) {
            return NOT_AN_INTEGER;
        }
        long value = 0;
        for (; i < end; i++) {
            int c = bytes[i];
            if (c < '0' || c > '9') {
                return NOT_AN_INTEGER;
            }
            value = value * 10 + (c - '0');
        }
        return negative ? -value : value;
    }

    /** True when {@code bytes[from, to)} holds only blanks (or is empty). */
    public static boolean isBlank(byte[] bytes, int from, int to) {
        for (int i = from; i < to; i++) {
            if (bytes[i] != ' ' && bytes[i] != '\t' && bytes[i] != '\r') {
                return false;
            }
        }
        return true;
    }
}
