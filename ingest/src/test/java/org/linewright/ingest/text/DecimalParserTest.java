package org.linewright.ingest.text;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Random;
import org.junit.jupiter.api.Test;
import org.linewright.ingest.testsupport.ReferenceSamples;

/** Reference for every check: the JDK's {@code Double.parseDouble} (correctly rounded, JLS / IEEE 754). */
class DecimalParserTest {

    private static void assertSameAsJdk(String text) {
        byte[] b = (" " + text + "  ").getBytes(StandardCharsets.ISO_8859_1);
        double actual = DecimalParser.parse(b, 0, b.length);
        double expected;
        try {
            expected = Double.parseDouble(text.trim());
        } catch (NumberFormatException e) {
            expected = Double.NaN;
        }
        assertEquals(Double.doubleToRawLongBits(expected), Double.doubleToRawLongBits(actual), "\"" + text + "\"");
    }

    @Test
    void everyNumericFieldOfEverySampleIsBitwiseEqual() throws IOException {
        int[][] columns = {{3, 15}, {15, 25}, {25, 35}, {35, 40}, {40, 45}, {45, 55}, {55, 59}, {59, 67}, {146, 153}, {153, 160}};
        int fields = 0;
        for (String f : new String[] {"sample_CO.par", "sample_CO2.par", "sample_N2O.par", "sample_PH3.par"}) {
            List<String> lines = ReferenceSamples.lines(ReferenceSamples.hitranSample(f));
            for (String line : lines) {
                byte[] b = line.getBytes(StandardCharsets.ISO_8859_1);
                for (int[] c : columns) {
                    double expected = Double.parseDouble(line.substring(c[0], c[1]).trim());
                    double actual = DecimalParser.parse(b, c[0], c[1]);
                    assertEquals(Double.doubleToRawLongBits(expected), Double.doubleToRawLongBits(actual),
                            f + " \"" + line.substring(c[0], c[1]) + "\"");
                    fields++;
                }
            }
        }
        assertEquals(10 * (5381 + 5492 + 5446 + 4424), fields);
    }

    @Test
    void edgeCasesFallBackCorrectly() {
        for (String t : new String[] {"0", "-0.000000", "+1.5", ".5", "5.", "-.000479", "1e22", "1e23", "1e-22", "1e-23",
            "9007199254740993", "123456789012345678901234", "0.30000000000000004", "2.2250738585072014E-308",
            "4.9e-324", "1e-400", "1e400", "-1e400", "1.7976931348623157e308", "NaN", "Infinity", "-Infinity",
            "1.5d", "0x1p3", ".", "-", "", "e5", "1e", "1e+", "1.2.3", "12 34", "1,5", "00000000000000000000012.5",
            "0.000000000000000000000000001", "1E+05", "1.0E-05", "9.883E-43", "   "}) {
            assertSameAsJdk(t);
        }
    }

    @Test
    void randomDecimalTextsAreBitwiseEqual() {
        Random random = new Random(20261202L);
        for (int i = 0; i < 200_000; i++) {
            StringBuilder sb = new StringBuilder();
            if (random.nextInt(4) == 0) {
                sb.append('-');
            }
            int intDigits = random.nextInt(8);
            for (int k = 0; k < intDigits; k++) {
                sb.append((char) ('0' + random.nextInt(10)));
            }
            sb.append('.');
            int fracDigits = random.nextInt(14) + (intDigits == 0 ? 1 : 0);
            for (int k = 0; k < fracDigits; k++) {
                sb.append((char) ('0' + random.nextInt(10)));
            }
            if (random.nextBoolean()) {
                sb.append('E').append(random.nextInt(61) - 30);
            }
            assertSameAsJdk(sb.toString());
        }
    }

    /** Shortest representations of random doubles over the whole exponent range, and their last digit ±1. */
    @Test
    void randomDoublesOverTheWholeRangeAreBitwiseEqual() {
        Random random = new Random(7L);
        for (int i = 0; i < 100_000; i++) {
            double v = Double.longBitsToDouble(random.nextLong() & 0x7fffffffffffffffL);
            if (!Double.isFinite(v)) {
                continue;
            }
            String text = Double.toString(v);
            assertSameAsJdk(text);
            int e = text.indexOf('E');
            int last = (e < 0 ? text.length() : e) - 1;
            char c = text.charAt(last);
            if (c > '0' && c < '9') {
                assertSameAsJdk(text.substring(0, last) + (char) (c + 1) + text.substring(last + 1));
                assertSameAsJdk(text.substring(0, last) + (char) (c - 1) + text.substring(last + 1));
            }
        }
    }

    /** Intensity-like texts d.dddE-xx and long mantissas with exponents from -330 to 330. */
    @Test
    void scientificTextsOfAllExponentsAreBitwiseEqual() {
        Random random = new Random(11L);
        for (int i = 0; i < 100_000; i++) {
            int digits = 1 + random.nextInt(18);
            StringBuilder sb = new StringBuilder();
            sb.append((char) ('1' + random.nextInt(9))).append('.');
            for (int k = 1; k < digits; k++) {
                sb.append((char) ('0' + random.nextInt(10)));
            }
            sb.append('E').append(random.nextInt(661) - 330);
            assertSameAsJdk(sb.toString());
        }
    }

    /** The double-double step itself decides (almost) every intensity-like value, always as the JDK does. */
    @Test
    void doubleDoubleStepDecidesTypicalIntensities() {
        Random random = new Random(3L);
        int decided = 0;
        for (int i = 0; i < 100_000; i++) {
            long mantissa = 1000 + random.nextInt(9000);
            int exponent = -23 - random.nextInt(290 - 23 + 1);
            double v = DecimalParser.doubleDouble(mantissa, exponent);
            if (v == v) {
                decided++;
                assertEquals(Double.parseDouble(mantissa + "E" + exponent), v, 0.0);
            }
        }
        assertTrue(decided > 99_900, "decided " + decided);
    }

    /** Field texts of fixed-column and free-format line lists; reference: the JDK parser. */
    @Test
    void fixedAndExponentFormsOfLineListsAreBitwiseEqual() {
        for (String t : new String[] {"3.845033", "  2143.271100", "7.207E-08", "1.2345e+05", "-0.000479", "0.5", ".5",
            "5.", "+12", "-0.0", "1.438776877", "115271.2018", "  -5.0105", "1.00000000000000000000001", "1e-320",
            "123456789012345678901234567890", "abc", "12x", "1 2", "1e+"}) {
            assertSameAsJdk(t);
        }
    }

    /**
     * Fortran double-precision exponents read as E exponents; reference: the JDK parser of the same text with
     * D replaced by E (the D exponent is the E exponent of double precision, common practice in Fortran output).
     */
    @Test
    void fortranDoublePrecisionExponents() {
        for (String t : new String[] {"6.02214076D23", "1.5d-3", "-2.5D+02", ".5D0", "7.D-400", "1d99999", "9.883D-43"}) {
            byte[] b = t.getBytes(StandardCharsets.ISO_8859_1);
            double expected = Double.parseDouble(t.replace('d', 'E').replace('D', 'E'));
            assertEquals(Double.doubleToRawLongBits(expected), Double.doubleToRawLongBits(DecimalParser.parse(b, 0, b.length)), t);
        }
        // a lone d stays the JDK's type suffix; a D without exponent digits is not a number
        for (String t : new String[] {"1.5d", "1.5D", "1d+", "1dd5", "d5", "0x1d5"}) {
            assertSameAsJdk(t);
        }
    }

    @Test
    void integers() {
        byte[] b = " -12 ".getBytes(StandardCharsets.ISO_8859_1);
        assertEquals(-12, DecimalParser.parseInt(b, 0, b.length));
        byte[] bad = " 1 2".getBytes(StandardCharsets.ISO_8859_1);
        assertEquals(Long.MIN_VALUE, DecimalParser.parseInt(bad, 0, bad.length));
        assertTrue(DecimalParser.parseInt(b, 0, 1) == Long.MIN_VALUE);
        // reference: Long.parseLong of the trimmed text; more than 18 digits and decimals are refused
        for (String t : new String[] {"  12345678 ", " -28001", "+7"}) {
            byte[] bytes = t.getBytes(StandardCharsets.ISO_8859_1);
            assertEquals(Long.parseLong(t.trim()), DecimalParser.parseInt(bytes, 0, bytes.length), t);
        }
        for (String t : new String[] {"12.0", "", "1234567890123456789", "-", "1e3"}) {
            byte[] bytes = t.getBytes(StandardCharsets.ISO_8859_1);
            assertEquals(DecimalParser.NOT_AN_INTEGER, DecimalParser.parseInt(bytes, 0, bytes.length), t);
        }
    }
}
