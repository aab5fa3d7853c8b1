package org.linewright.cli.units;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.linewright.ingest.InputException;
import picocli.CommandLine.TypeConversionException;

/**
 * Unit factors checked against definitions of the units (SI Brochure, 9th ed. 2019, BIPM, Tables 8 and the
 * non-SI units it lists; NIST SP 811 (2008) Appendix B): 1 atm = 101 325 Pa exactly, 1 bar = 10⁵ Pa exactly,
 * 1 Torr = 101 325/760 Pa exactly, 1 mbar = 1 hPa = 100 Pa; c = 299 792 458 m/s exactly, so 1 GHz corresponds
 * to 1/29.9792458 cm⁻¹; ν̃ = 1/λ, so 1 µm corresponds to 10⁴ cm⁻¹.
 */
class QuantityParserTest {

    @Test
    void standardAtmosphereIs101325PascalAnd1point01325Bar() {
        // SI Brochure 2019 / NIST SP 811: 1 atm = 101 325 Pa (exact)
        assertEquals(101_325.0, QuantityParser.parsePressure("1 atm").pascals(), 0.0);
        assertEquals(1.01325, QuantityParser.parsePressure("1atm").bar(), 1e-15);
        assertEquals(1.0, QuantityParser.parsePressure("101325 Pa").atm(), 1e-15);
        assertEquals(1.0, QuantityParser.parsePressure("1.01325 bar").atm(), 1e-15);
    }

    @Test
    void torrIsOne760thOfAnAtmosphere() {
        // NIST SP 811 B.8: 1 torr = (101 325/760) Pa exactly = 133.322 368 4... Pa
        assertEquals(133.32236842105263, QuantityParser.parsePressure("1 Torr").pascals(), 1e-10);
        assertEquals(1.0, QuantityParser.parsePressure("760 torr").atm(), 1e-15);
    }

    @Test
    void bareNumberIsBarAndMillibarIsHectopascal() {
        // SI Brochure 2019 Table 8: 1 bar = 0.1 MPa = 100 kPa = 1000 hPa = 10^5 Pa
        assertEquals(1.0e5, QuantityParser.parsePressure("1").pascals(), 0.0);
        assertEquals(1.0e-3, QuantityParser.parsePressure("1e-3").bar(), 1e-18);
        assertEquals(100.0, QuantityParser.parsePressure("1 mbar").pascals(), 1e-12);
        assertEquals(100.0, QuantityParser.parsePressure("1 hPa").pascals(), 1e-12);
        assertEquals(1.0, QuantityParser.parsePressure("100 kPa").bar(), 1e-15);
        assertEquals(10.0, QuantityParser.parsePressure(" 10.0 BAR ").bar(), 1e-15);
    }

    @Test
    void temperaturesAreKelvin() {
        // common practice: a bare temperature is thermodynamic temperature in K
        assertEquals(300.0, QuantityParser.parseTemperature("300K").kelvin(), 0.0);
        assertEquals(296.0, QuantityParser.parseTemperature("296 K").kelvin(), 0.0);
        assertEquals(1100.0, QuantityParser.parseTemperature("1.1e3").kelvin(), 0.0);
    }

    @Test
    void micrometreIsTenThousandWavenumbers() {
        // definition ν̃ = 1/λ: 1 µm = 10⁻⁴ cm, so 1 µm ↔ 10⁴ cm⁻¹ and 5 µm ↔ 2000 cm⁻¹
        assertEquals(1.0e4, QuantityParser.parseWavenumber("1 um").cm1(), 1e-9);
        assertEquals(2000.0, QuantityParser.parseWavenumber("5um").cm1(), 1e-9);
        assertEquals(2000.0, QuantityParser.parseWavenumber("5 µm").cm1(), 1e-9);
        assertEquals(2000.0, QuantityParser.parseWavenumber("5000 nm").cm1(), 1e-9);
        assertEquals(2143.27, QuantityParser.parseWavenumber("2143.27 cm-1").cm1(), 0.0);
        assertEquals(2143.27, QuantityParser.parseWavenumber("2143.27").cm1(), 0.0);
    }

    @Test
    void gigahertzOver29point9792458IsWavenumber() {
        // c = 29.979 245 8 cm/ns exactly (SI 2019), so ν̃[cm⁻¹] = f[GHz] / 29.9792458
        assertEquals(1.0, QuantityParser.parseWavenumber("29.9792458 GHz").cm1(), 1e-15);
        assertEquals(115.2712018 / 29.9792458, QuantityParser.parseWavenumber("115271.2018 MHz").cm1(), 1e-12);
        assertEquals(0.01, QuantityParser.parseWavenumberInterval("299.792458 MHz").cm1(), 1e-15);
        assertEquals(0.01, QuantityParser.parseWavenumberInterval("0.01").cm1(), 0.0);
    }

    @Test
    void intervalRejectsWavelengthUnits() {
        InputException e = assertThrows(InputException.class, () -> QuantityParser.parseWavenumberInterval("1 um"));
        assertTrue(e.getMessage().contains("\"1 um\""), e.getMessage());
    }

    @ParameterizedTest
    @ValueSource(strings = {"", "  ", "bar", "abc", "1 psi", "-1 bar", "0", "1e999", "NaN", "1..2 bar", "1 bar x"})
    void badPressuresFailWithOneLineQuotingTheText(String text) {
        InputException e = assertThrows(InputException.class, () -> QuantityParser.parsePressure(text));
        assertFalse(e.getMessage().contains("\n"));
        assertTrue(e.getMessage().contains("pressure"), e.getMessage());
    }

    @Test
    void badTemperatureAndPositionAreRejected() {
        assertThrows(InputException.class, () -> QuantityParser.parseTemperature("300 C"));
        assertThrows(InputException.class, () -> QuantityParser.parseTemperature("-5 K"));
        assertThrows(InputException.class, () -> QuantityParser.parseWavenumber("3 THz"));
        assertThrows(InputException.class, () -> QuantityParser.parseWavenumber("0 um"));
    }

    @Test
    void convertersTurnBadValuesIntoPicocliConversionErrors() {
        var converter = new QuantityConverters.PressureConverter();
        assertEquals(1.0, converter.convert("1 atm").atm(), 1e-15);
        TypeConversionException e = assertThrows(TypeConversionException.class, () -> converter.convert("1 psi"));
        assertTrue(e.getMessage().contains("psi"));
    }
}
