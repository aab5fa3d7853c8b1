package org.linewright.cli.units;

import java.util.Locale;
import org.linewright.ingest.InputException;
import org.linewright.ingest.units.PhysicalConstants;
import org.linewright.ingest.text.OffendingText;

/**
 * Parses physical quantities written by people: a decimal number, optional blanks, an optional unit.
 * Units are matched without regard to case ({@code torr}, {@code Torr}, {@code TORR}); a bare number takes the
 * default unit of the quantity. Every failure is an {@link InputException} whose one-line message quotes the
 * text and lists the accepted units.
 *
 * <ul>
 *   <li>pressure: {@code Pa}, {@code hPa}, {@code kPa}, {@code mbar}, {@code bar}, {@code atm}, {@code Torr};
 *       bare number = bar</li>
 *   <li>temperature: {@code K}; bare number = K</li>
 *   <li>spectral position: {@code cm-1} (also {@code cm^-1}, {@code /cm}), {@code um} (also {@code µm},
 *       {@code micron}), {@code nm}, {@code GHz}, {@code MHz}; bare number = cm⁻¹. Wavelengths are vacuum
 *       wavelengths: ν̃ = 1/λ; frequencies: ν̃ = f/c.</li>
 *   <li>spectral interval (a step or a width): {@code cm-1}, {@code GHz}, {@code MHz} only, since a wavelength
 *       interval has no fixed wavenumber width</li>
 * </ul>
 */
public final class QuantityParser {
    /** Micrometres per centimetre: ν̃[cm⁻¹] = 10⁴ / λ[µm]. */
    private static final double UM_PER_CM = 1.0e4;
    /** Nanometres per centimetre: ν̃[cm⁻¹] = 10⁷ / λ[nm]. */
    private static final double NM_PER_CM = 1.0e7;
    /** Hertz per GHz. */
    private static final double HZ_PER_GHZ = 1.0e9;
    /** Hertz per MHz. */
    private static final double HZ_PER_MHZ = 1.0e6;

    private static final String PRESSURE_UNITS = "Pa, hPa, kPa, mbar, bar, atm or Torr; a bare number is bar";
    private static final String TEMPERATURE_UNITS = "K; a bare number is K";
    private static final String POSITION_UNITS = "cm-1, um, nm, GHz or MHz; a bare number is cm-1";
    private static final String INTERVAL_UNITS = "cm-1, GHz or MHz; a bare number is cm-1";

    private QuantityParser() {
    }

    /**
     * @param text e.g. {@code 1.5 bar}, {@code 760Torr}, {@code 101325 Pa}, {@code 0.1}
     * @return the pressure
     * @throws InputException when the text is not a positive, finite pressure in a known unit
     */
    public static Pressure parsePressure(String text) {
        Split s = split(text, "pressure", PRESSURE_UNITS);
        double factorPa;
        switch (s.unit) {
            case "", "bar" -> factorPa = Pressure.PA_PER_BAR;
            case "pa" -> factorPa = 1.0;
            case "hpa", "mbar" -> factorPa = 100.0;
            case "kpa" -> factorPa = 1000.0;
            case "atm" -> factorPa = PhysicalConstants.STANDARD_ATMOSPHERE_PA;
            case "torr" -> factorPa = Pressure.PA_PER_TORR;
            default -> throw unknownUnit(text, "pressure", PRESSURE_UNITS);
        }
        requirePositive(s.value, text, "pressure", PRESSURE_UNITS);
        return new Pressure(s.value * factorPa);
    }

    /**
     * @param text e.g. {@code 300K}, {@code 296 K}, {@code 1100}
     * @return the temperature
     * @throws InputException when the text is not a positive, finite temperature in kelvin
     */
    public static Temperature parseTemperature(String text) {
        Split s = split(text, "temperature", TEMPERATURE_UNITS);
        if (!s.unit.isEmpty() && !s.unit.equals("k")) {
            throw unknownUnit(text, "temperature", TEMPERATURE_UNITS);
        }
        requirePositive(s.value, text, "temperature", TEMPERATURE_UNITS);
        return new Temperature(s.value);
    }

    /**
     * @param text e.g. {@code 2143.27 cm-1}, {@code 4.67um}, {@code 2500 nm}, {@code 115.27 GHz}
     * @return the position as a vacuum wavenumber
     * @throws InputException when the text is not a positive, finite spectral position in a known unit
     */
    public static Wavenumber parseWavenumber(String text) {
        Split s = split(text, "spectral position", POSITION_UNITS);
        requirePositive(s.value, text, "spectral position", POSITION_UNITS);
        double cm1;
        switch (s.unit) {
            case "", "cm-1", "cm^-1", "/cm", "1/cm" -> cm1 = s.value;
            case "um", "µm", "μm", "micron", "microns" -> cm1 = UM_PER_CM / s.value;
            case "nm" -> cm1 = NM_PER_CM / s.value;
            case "ghz" -> cm1 = s.value * HZ_PER_GHZ / PhysicalConstants.SPEED_OF_LIGHT_CM_PER_S;
            case "mhz" -> cm1 = s.value * HZ_PER_MHZ / PhysicalConstants.SPEED_OF_LIGHT_CM_PER_S;
            default -> throw unknownUnit(text, "spectral position", POSITION_UNITS);
        }
        return new Wavenumber(cm1);
    }

    /**
     * @param text e.g. {@code 0.01}, {@code 0.01 cm-1}, {@code 300 MHz}
     * @return the interval as a wavenumber width
     * @throws InputException when the text is not a positive, finite interval in cm⁻¹, GHz or MHz
     */
    public static Wavenumber parseWavenumberInterval(String text) {
        Split s = split(text, "spectral interval", INTERVAL_UNITS);
        requirePositive(s.value, text, "spectral interval", INTERVAL_UNITS);
        double cm1;
        switch (s.unit) {
            case "", "cm-1", "cm^-1", "/cm", "1/cm" -> cm1 = s.value;
            case "ghz" -> cm1 = s.value * HZ_PER_GHZ / PhysicalConstants.SPEED_OF_LIGHT_CM_PER_S;
            case "mhz" -> cm1 = s.value * HZ_PER_MHZ / PhysicalConstants.SPEED_OF_LIGHT_CM_PER_S;
            default -> throw unknownUnit(text, "spectral interval", INTERVAL_UNITS);
        }
        return new Wavenumber(cm1);
    }

    /** The number and the lower-cased unit of a quantity. */
    private record Split(double value, String unit) {
    }

    private static Split split(String text, String quantity, String units) {
        if (text == null || text.isBlank()) {
            throw new InputException("empty " + quantity + " (expected a number with unit " + units + ")");
        }
        String t = text.strip();
        int end = numberEnd(t);
        if (end == 0) {
            throw new InputException(OffendingText.quote(text) + " is not a " + quantity + " (expected a number with unit "
                    + units + ")");
        }
        double value;
        try {
            value = Double.parseDouble(t.substring(0, end));
        } catch (NumberFormatException e) {
            throw new InputException(OffendingText.quote(text) + " is not a " + quantity + " (expected a number with unit "
                    + units + ")", e);
        }
        return new Split(value, t.substring(end).strip().toLowerCase(Locale.ROOT));
    }

    /** Length of the leading decimal number: sign, digits, point, digits, exponent (not a following unit). */
    private static int numberEnd(String t) {
        int i = 0;
        int n = t.length();
        if (i < n && (t.charAt(i) == '+' || t.charAt(i) == '-')) {
            i++;
        }
        int digits = 0;
        while (i < n && Character.isDigit(t.charAt(i))) {
            i++;
            digits++;
        }
        if (i < n && t.charAt(i) == '.') {
            i++;
            while (i < n && Character.isDigit(t.charAt(i))) {
                i++;
                digits++;
            }
        }
        if (digits == 0) {
            return 0;
        }
        // an exponent only when 'e' is followed by digits, so that a unit starting with 'e' is not eaten
        if (i < n && (t.charAt(i) == 'e' || t.charAt(i) == 'E')) {
            int j = i + 1;
            if (j < n && (t.charAt(j) == '+' || t.charAt(j) == '-')) {
                j++;
            }
            int expDigits = 0;
            while (j < n && Character.isDigit(t.charAt(j))) {
                j++;
                expDigits++;
            }
            if (expDigits > 0) {
                i = j;
            }
        }
        return i;
    }

    private static void requirePositive(double value, String text, String quantity, String units) {
        if (!(value > 0.0) || Double.isInfinite(value)) {
            throw new InputException(OffendingText.quote(text) + " is not a positive, finite " + quantity
                    + " (expected a number greater than zero with unit " + units + ")");
        }
    }

    private static InputException unknownUnit(String text, String quantity, String units) {
        return new InputException(OffendingText.quote(text) + " has an unknown " + quantity + " unit (expected " + units + ")");
    }
}
