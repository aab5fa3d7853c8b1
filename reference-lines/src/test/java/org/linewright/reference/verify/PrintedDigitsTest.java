package org.linewright.reference.verify;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/** Significant digits of decimal numbers and their rounding (decimal arithmetic, common practice). */
class PrintedDigitsTest {
    @Test
    void digitsOfParsedRecords() {
        // fields as printed in 160-character records: E10.3 (4 digits), F12.6
        assertEquals(4, PrintedDigits.significantDigits(Double.parseDouble("1.751E-34")));
        assertEquals(4, PrintedDigits.significantDigits(Double.parseDouble("9.999E-20")));
        assertEquals(4, PrintedDigits.significantDigits(Double.parseDouble("1.656E-01")));
        assertEquals(4, PrintedDigits.significantDigits(14.58));
        assertEquals(4, PrintedDigits.significantDigits(0.002758));
        assertEquals(10, PrintedDigits.significantDigits(2147.081134));
        assertEquals(1, PrintedDigits.significantDigits(1000.0));
        assertEquals(2, PrintedDigits.significantDigits(Double.parseDouble("1.700E-20")), "trailing zeros are not seen");
        assertEquals(16, PrintedDigits.significantDigits(Math.PI), "3.141592653589793: all the digits of a computed double");
        assertEquals(0, PrintedDigits.significantDigits(0.0));
        assertEquals(0, PrintedDigits.significantDigits(Double.NaN));
    }

    @Test
    void roundingIsHalfAUnitOfTheLastDigit() {
        // 1.751 with 4 digits: ±0.0005 absolute, 0.0005/1.751 relative
        assertEquals(0.0005 / 1.751, PrintedDigits.relativeRounding(1.751e-34, 4), 1e-15);
        assertEquals(0.0005 / 9.999, PrintedDigits.relativeRounding(9.999, 4), 1e-15);
        assertEquals(0.05 / 1.0, PrintedDigits.relativeRounding(100.0, 2), 1e-15);
    }
}
