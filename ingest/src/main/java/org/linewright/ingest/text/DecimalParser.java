package org.linewright.ingest.text;

import java.math.BigDecimal;
import java.math.MathContext;
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
 * <p>Second fast path, for the exponents of line intensities ({@code 1.234E-25} is 1234·10⁻²⁸, beyond the
 * exact range): {@code m·10^e} for {@code |e| ≤ 290} is evaluated in double-double arithmetic (Dekker, T. J.,
 * "A floating-point technique for extending the available precision", Numer. Math. 18 (1971) 224–242; the
 * product error is exact through a fused multiply-add) from a table of 10^e as unevaluated sums
 * {@code hi + lo} (relative error below 2⁻¹⁰⁶, built once from exact {@link BigDecimal} values). The
 * rounded sum {@code r} and its exact rounding error are obtained by Fast-Two-Sum; with a total relative
 * error bound of 2⁻⁹⁶ (several times the worst case), {@code r} is the correctly rounded value whenever the
 * error plus the bound stays below half the spacing of doubles at {@code r} (a quarter below a power of two),
 * the distance to the nearest rounding boundary. Otherwise (ties and near-ties, about one text in 2⁴⁰) the
 * text goes to {@code Double.parseDouble}.
 * This is the test-and-fallback scheme of Clinger's 1990 paper with a wider fast step.
 *
 * <p>Fortran double-precision exponents: {@code d} or {@code D} followed by an (optionally signed) exponent, as
 * in {@code 6.02214076D23}, is read as {@code E} (common practice in Fortran-written data files). The JDK rejects
 * such texts; every text the JDK accepts (including a lone {@code d} type suffix, {@code 1.5d}) keeps its JDK value.
 *
 * <p>Accuracy: the result equals {@code Double.parseDouble} of the trimmed field text bit for bit (both are
 * correctly rounded to nearest-even; the sign of zero is kept), with a Fortran {@code D} exponent read as {@code E}.
 */
public final class DecimalParser {
    /** Returned by {@link #parseInt} for text that is blank or not an integer. */
    public static final long NOT_AN_INTEGER = Long.MIN_VALUE;
    /** Largest mantissa for which the fast path is exact: 2^53. */
    private static final long EXACT_MANTISSA_LIMIT = 1L << 53;
    /** Powers of ten exactly representable as doubles (10^0 … 10^22). */
    private static final double[] EXACT_POWERS_OF_TEN = {
        1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11,
        1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19, 1e20, 1e21, 1e22
    };
    /** Mantissa digits accumulated before giving up the fast path (10^18 < 2^63, no overflow). */
    private static final int MAX_FAST_DIGITS = 18;
    /**
     * Decimal exponents covered by the double-double path: with |e| ≤ 290 the product and its error term
     * stay normal doubles for mantissas ≥ 1, so no precision is lost to underflow.
     */
    private static final int DOUBLE_DOUBLE_MAX_EXPONENT = 290;
    /** 10^e rounded to a double, e = -290 … 290 (index e + 290). */
    private static final double[] POWER_HI = new double[2 * DOUBLE_DOUBLE_MAX_EXPONENT + 1];
    /** 10^e − POWER_HI, rounded to a double. */
    private static final double[] POWER_LO = new double[2 * DOUBLE_DOUBLE_MAX_EXPONENT + 1];
    /** Relative error bound of the double-double product (true worst case is below 2^-103). */
    private static final double PRODUCT_ERROR_BOUND = 0x1p-96;
    /** Results outside [2^-1000, 2^1000] (near subnormal or overflow) take the slow path. */
    private static final double SAFE_MIN = 0x1p-1000;
    private static final double SAFE_MAX = 0x1p1000;
    private static final long SIGNIFICAND_MASK = 0x000F_FFFF_FFFF_FFFFL;

    static {
        // 60 significant digits: far more than the 2^-106 relative accuracy the table needs
        MathContext context = new MathContext(60);
        for (int e = -DOUBLE_DOUBLE_MAX_EXPONENT; e <= DOUBLE_DOUBLE_MAX_EXPONENT; e++) {
            BigDecimal exact = e >= 0 ? BigDecimal.TEN.pow(e) : BigDecimal.ONE.divide(BigDecimal.TEN.pow(-e), context);
            double hi = exact.doubleValue();
            POWER_HI[e + DOUBLE_DOUBLE_MAX_EXPONENT] = hi;
            POWER_LO[e + DOUBLE_DOUBLE_MAX_EXPONENT] = exact.subtract(new BigDecimal(hi)).doubleValue();
        }
    }

    private DecimalParser() {
    }

    /**
     * The number in {@code bytes[from, to)}, surrounding spaces ignored.
     *
     * @return the value, identical to {@code Double.parseDouble(text.trim())}; {@code NaN} when the text
     *         is blank or not a number (callers report it; a literal {@code NaN} also gives NaN)
     */
    public static double parse(byte[] bytes, int from, int to) {
        int i = skipSpaces(bytes, from, to);
        int end = trimSpaces(bytes, i, to);
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
            if (c != 'e' && c != 'E' && c != 'd' && c != 'D') {
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
        if (decimalExponent >= -DOUBLE_DOUBLE_MAX_EXPONENT && decimalExponent <= DOUBLE_DOUBLE_MAX_EXPONENT) {
            double value = doubleDouble(mantissa, decimalExponent);
            if (value == value) {
                return negative ? -value : value;
            }
        }
        return slow(bytes, from, to);
    }

    /** m·10^e correctly rounded, or NaN when the double-double estimate cannot decide the rounding. */
    static double doubleDouble(long mantissa, int decimalExponent) {
        double mHi = (double) mantissa;
        // exact: m < 2^60, so m − round(m) is an integer below 2^7
        double mLo = (double) (mantissa - (long) mHi);
        double pHi = POWER_HI[decimalExponent + DOUBLE_DOUBLE_MAX_EXPONENT];
        double pLo = POWER_LO[decimalExponent + DOUBLE_DOUBLE_MAX_EXPONENT];
        double product = mHi * pHi;
        // exact rounding error of mHi·pHi (Dekker's product, here by one fused multiply-add)
        double productError = Math.fma(mHi, pHi, -product);
        double tail = productError + (mHi * pLo + mLo * pHi);
        double rounded = product + tail;
        // Fast-Two-Sum (|product| ≥ |tail|): the exact error of the rounded sum
        double roundingError = tail - (rounded - product);
        double magnitude = Math.abs(rounded);
        if (magnitude < SAFE_MIN || magnitude > SAFE_MAX) {
            return Double.NaN;
        }
        // the nearest rounding boundary is half a spacing away; below a power of two the spacing halves
        boolean powerOfTwo = (Double.doubleToRawLongBits(rounded) & SIGNIFICAND_MASK) == 0;
        double halfGap = (powerOfTwo && roundingError < 0 ? 0.25 : 0.5) * Math.ulp(rounded);
        if (Math.abs(roundingError) + magnitude * PRODUCT_ERROR_BOUND < halfGap) {
            return rounded;
        }
        return Double.NaN;
    }

    /**
     * An integer in {@code bytes[from, to)}, surrounding spaces ignored, optional sign.
     *
     * @return the value, or {@link #NOT_AN_INTEGER} when the text is blank, not an integer or longer than 18 digits
     */
    public static long parseInt(byte[] bytes, int from, int to) {
        int i = skipSpaces(bytes, from, to);
        int end = trimSpaces(bytes, i, to);
        if (i == end) {
            return NOT_AN_INTEGER;
        }
        boolean negative = false;
        if (bytes[i] == '-' || bytes[i] == '+') {
            negative = bytes[i] == '-';
            i++;
        }
        if (i == end || end - i > MAX_FAST_DIGITS) {
            return NOT_AN_INTEGER;
        }
        long value = 0;
        for (; i < end; i++) {
            byte c = bytes[i];
            if (c < '0' || c > '9') {
                return NOT_AN_INTEGER;
            }
            value = value * 10 + (c - '0');
        }
        return negative ? -value : value;
    }

    /** The first index of {@code bytes[from, to)} that is not a space, or {@code to} when there is none. */
    public static int skipSpaces(byte[] bytes, int from, int to) {
        int i = from;
        while (i < to && bytes[i] == ' ') {
            i++;
        }
        return i;
    }

    /** The end of {@code bytes[from, to)} without its trailing spaces ({@code from} when all are spaces). */
    public static int trimSpaces(byte[] bytes, int from, int to) {
        int end = to;
        while (end > from && bytes[end - 1] == ' ') {
            end--;
        }
        return end;
    }

    private static double slow(byte[] bytes, int from, int to) {
        String text = new String(bytes, from, to - from, StandardCharsets.ISO_8859_1).trim();
        try {
            return Double.parseDouble(text);
        } catch (NumberFormatException e) {
            return fortranExponent(text);
        }
    }

    /** A text the JDK rejected, read again with a Fortran {@code D} exponent written as {@code E}; else NaN. */
    private static double fortranExponent(String text) {
        int d = Math.max(text.indexOf('d'), text.indexOf('D'));
        // only "digits D [sign] digits": a trailing d is the JDK's type suffix, handled (or rejected) above
        if (d <= 0 || d == text.length() - 1 || !Character.isDigit(text.charAt(text.length() - 1))
                || (text.charAt(d - 1) != '.' && !Character.isDigit(text.charAt(d - 1)))) {
            return Double.NaN;
        }
        try {
            return Double.parseDouble(text.substring(0, d) + 'E' + text.substring(d + 1));
        } catch (NumberFormatException e) {
            return Double.NaN;
        }
    }
}
