package org.linewright.ingest.source;

import java.nio.charset.StandardCharsets;

/**
 * Parses a decimal number written in ASCII bytes (a fixed-width or delimited field) without creating a
 * String in the common case.
 *
 * <p>Method (Clinger, W. D., "How to read floating point numbers accurately", Proc. ACM SIGPLAN PLDI 1990,
 * pp. 92–101, the "fast path"): the digits are accumulated into an integer mantissa {@code m} and a decimal
 * exponent {@code e}; when {@code m < 2^53} and {@code |e| ≤ 22} both {@code m} and {@code 10^|e|} are exact
 * doubles, so one IEEE multiplication ({@code e ≥ 0}) or division ({@code e < 0}) gives the correctly rounded
 * value of {@code m·10^e}. Every other text (more than 18 significant digits, large exponents, hexadecimal,
 * {@code NaN}, {@code Infinity}, suffixes) goes to {@link Double#parseDouble}.
 *
 * <p>Accuracy: the result equals {@code Double.parseDouble} of the trimmed field text bit for bit (both are
 * correctly rounded to nearest-even; the sign of zero is kept).
 */
public final class DecimalParser {
    /** Largest mantissa for which the fast path is exact: 2^53. */
    private static final long EXACT_MANTISSA_LIMIT = 1L << 53;
    /** Powers of ten exactly representable as doubles (10^0 … 10^22). */
    private static final double[] EXACT_POWERS_OF_TEN = {
        1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11,
        1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22
    };
    /** Mantissa digits accumulated before giving up the fast path (10^18 < 2^63, no overflow). */
    private static final int MAX_FAST_DIGITS = 18;

    private DecimalParser() {
    }

    /**
     * The number in {@code bytes[from, to)}, surrounding spaces ignored.
     *
     * @return the value, identical to {@code Double.parseDouble(text.trim())}; {@code NaN} when the text
     *         is blank or not a number (callers report it; a literal {@code NaN} also gives NaN)
     */
    public static double parse(byte[] bytes, int from, int to) {
        int i = from;
        int end = to;
        while (i < end && bytes[i] == ' ') {
            i++;
        }
        while (end > i && bytes[end - 1] == ' ') {
            end--;
        }
        if (i == end) {
            return Double.NaN;
        }
        boolean negative = false;
        byte c = bytes[i];
        if (c == '-' || c == '+') {
            negative = c == '-';
            i++;
        }
        long mantissa = 0;
        int digits = 0;
        int fractionDigits = 0;
        boolean anyDigit = false;
        boolean dot = false;
        for (; i < end; i++) {
            c = bytes[i];
            if (c >= '0' && c <= '9') {
                anyDigit = true;
                if (mantissa == 0 && c == '0') {
                    // leading zeros carry no significant digit but still shift the decimal point
                    if (dot) {
                        fractionDigits++;
                    }
                    continue;
                }
                if (digits >= MAX_FAST_DIGITS) {
                    return slow(bytes, from, to);
                }
                mantissa = mantissa * 10 + (c - '0');
                digits++;
                if (dot) {
                    fractionDigits++;
                }
            } else if (c == '.' && !dot) {
                dot = true;
            } else {
                break;
            }
        }
        if (!anyDigit) {
            return slow(bytes, from, to);
        }
        int exponent = 0;
        if (i < end) {
            c = bytes[i];
            if (c != 'e' && c != 'E') {
                return slow(bytes, from, to);
            }
            i++;
            boolean negativeExponent = false;
            if (i < end && (bytes[i] == '-' || bytes[i] == '+')) {
                negativeExponent = bytes[i] == '-';
                i++;
            }
            int exponentStart = i;
            while (i < end && bytes[i] >= '0' && bytes[i] <= '9') {
                if (exponent > 10_000) {
                    return slow(bytes, from, to);
                }
                exponent = exponent * 10 + (bytes[i] - '0');
                i++;
            }
            if (i == exponentStart || i != end) {
                return slow(bytes, from, to);
            }
            if (negativeExponent) {
                exponent = -exponent;
            }
        }
        if (mantissa == 0) {
            return negative ? -0.0 : 0.0;
        }
        int decimalExponent = exponent - fractionDigits;
        if (mantissa < EXACT_MANTISSA_LIMIT && decimalExponent >= -22 && decimalExponent <= 22) {
            double value = decimalExponent >= 0
                    ? mantissa * EXACT_POWERS_OF_TEN[decimalExponent]
                    : mantissa / EXACT_POWERS_OF_TEN[-decimalExponent];
            return negative ? -value : value;
        }
        return slow(bytes, from, to);
    }

    /**
     * An integer in {@code bytes[from, to)}, surrounding spaces ignored, optional sign.
     *
     * @return the value, or {@code Long.MIN_VALUE} when the text is blank or not an integer
     */
    public static long parseInt(byte[] bytes, int from, int to) {
        int i = from;
        int end = to;
        while (i < end && bytes[i] == ' ') {
            i++;
        }
        while (end > i && bytes[end - 1] == ' ') {
            end--;
        }
        if (i == end) {
            return Long.MIN_VALUE;
        }
        boolean negative = false;
        if (bytes[i] == '-' || bytes[i] == '+') {
            negative = bytes[i] == '-';
            i++;
        }
        if (i == end || end - i > MAX_FAST_DIGITS) {
            return Long.MIN_VALUE;
        }
        long value = 0;
        for (; i < end; i++) {
            byte c = bytes[i];
            if (c < '0' || c > '9') {
                return Long.MIN_VALUE;
            }
            value = value * 10 + (c - '0');
        }
        return negative ? -value : value;
    }

    private static double slow(byte[] bytes, int from, int to) {
        String text = new String(bytes, from, to - from, StandardCharsets.ISO_8859_1);
        try {
            return Double.parseDouble(text.trim());
        } catch (NumberFormatException e) {
            return Double.NaN;
        }
    }
}
