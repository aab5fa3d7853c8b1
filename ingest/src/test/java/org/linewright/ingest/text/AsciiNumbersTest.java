package org.linewright.ingest.text;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.StandardCharsets;
import java.util.Locale;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Test;

/** The reference for every check is the JDK's correctly rounded {@link Double#parseDouble(String)} / Long.parseLong. */
class AsciiNumbersTest {

    private static double parse(String s) {
        byte[] b = s.getBytes(StandardCharsets.ISO_8859_1);
        return AsciiNumbers.parseDouble(b, 0, b.length);
    }

    private static long parseLong(String s) {
        byte[] b = s.getBytes(StandardCharsets.ISO_8859_1);
        return AsciiNumbers.parseLong(b, 0, b.length);
    }

    @Test
    void fixedAndExponentFormsOfLineListsAreCorrectlyRounded() {
        String[] texts = {"3.845033", "  2143.271100", "7.207E-08", "1.2345e+05", "-0.000479", "0.5", ".5", "5.",
            "+12", "0", "-0.0", "1.438776877", "6.02214076D23", "115271.2018", "  -5.0105", "1.00000000000000000000001",
            "1e-320", "4.9e-324", "1.7976931348623157e308", "123456789012345678901234567890"};
        for (String t : texts) {
            double expected = Double.parseDouble(t.trim().replace('D', 'e'));
            assertEquals(Double.doubleToLongBits(expected), Double.doubleToLongBits(parse(t)), t);
        }
    }

    @Test
    void randomDecimalsAreWithinOneAndAHalfUlpAndExactInTheFastPath() {
        SplittableRandom random = new SplittableRandom(20261202L);
        for (int i = 0; i < 200_000; i++) {
            long mantissa = random.nextLong(1, 10_000_000_000L);
            int exponent = random.nextInt(-60, 40);
            String text = mantissa + "E" + exponent;
            double expected = Double.parseDouble(text);
            double actual = parse(text);
            if (Math.abs(exponent) <= 22) {
                // Clinger's fast path: exact significand and exact power of ten, one rounding
                assertEquals(expected, actual, 0.0, text);
            } else {
                assertTrue(Math.abs(actual - expected) <= 1.5 * Math.ulp(expected), text);
            }
            String fixed = String.format(Locale.ROOT, "%.6f", mantissa * 1e-7);
            assertEquals(Double.parseDouble(fixed), parse(fixed), 0.0, fixed);
        }
    }

    @Test
    void nonNumbersAreNaN() {
        for (String t : new String[] {"", "   ", "abc", "1.2.3", "12x", "1e", "1e+", "-", ".", "NaN", "Infinity", "1 2", "e5"}) {
            assertTrue(Double.isNaN(parse(t)), "'" + t + "'");
        }
    }

    @Test
    void integers() {
        assertEquals(Long.parseLong("12345678"), parseLong("  12345678 "));
        assertEquals(Long.parseLong("-28001"), parseLong(" -28001"));
        assertEquals(AsciiNumbers.NOT_AN_INTEGER, parseLong("12.0"));
        assertEquals(AsciiNumbers.NOT_AN_INTEGER, parseLong(""));
        assertEquals(AsciiNumbers.NOT_AN_INTEGER, parseLong("1234567890123456789"));
        assertTrue(AsciiNumbers.isBlank(" \t ".getBytes(StandardCharsets.ISO_8859_1), 0, 3));
    }
}
