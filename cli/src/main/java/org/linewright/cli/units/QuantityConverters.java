package org.linewright.cli.units;

import java.util.function.Function;
import org.linewright.ingest.InputException;
import picocli.CommandLine.ITypeConverter;
import picocli.CommandLine.TypeConversionException;

/**
 * picocli type converters for quantities with units, so that an option declared as {@code Pressure},
 * {@code Temperature} or {@code Wavenumber} accepts {@code 10 mbar}, {@code 800K} or {@code 4.6um}. A bad value
 * becomes a picocli usage error (exit code 2) carrying the parser's one-line message.
 * Register them with {@link #registerAll(picocli.CommandLine)}; use {@link WavenumberInterval} explicitly on
 * options that are widths or steps.
 */
public final class QuantityConverters {
    private QuantityConverters() {
    }

    /** Registers the pressure, temperature and spectral-position converters on a command line. */
    public static void registerAll(picocli.CommandLine commandLine) {
        commandLine.registerConverter(Pressure.class, new PressureConverter());
        commandLine.registerConverter(Temperature.class, new TemperatureConverter());
        commandLine.registerConverter(Wavenumber.class, new WavenumberConverter());
    }

    private static <T> T convert(String value, Function<String, T> parser) {
        try {
            return parser.apply(value);
        } catch (InputException e) {
            throw new TypeConversionException(e.getMessage());
        }
    }

    /** {@code 1e-3 bar}, {@code 100 Pa}, {@code 1 atm}, {@code 760 Torr}; bare number = bar. */
    public static final class PressureConverter implements ITypeConverter<Pressure> {
        @Override
        public Pressure convert(String value) {
            return QuantityConverters.convert(value, QuantityParser::parsePressure);
        }
    }

    /** {@code 300K}, {@code 300 K}; bare number = K. */
    public static final class TemperatureConverter implements ITypeConverter<Temperature> {
        @Override
        public Temperature convert(String value) {
            return QuantityConverters.convert(value, QuantityParser::parseTemperature);
        }
    }

    /** A spectral position: {@code 2100 cm-1}, {@code 4.76 um}, {@code 476 nm}, {@code 1000 GHz}. */
    public static final class WavenumberConverter implements ITypeConverter<Wavenumber> {
        @Override
        public Wavenumber convert(String value) {
            return QuantityConverters.convert(value, QuantityParser::parseWavenumber);
        }
    }

    /** A spectral step or width: {@code 0.01 cm-1}, {@code 300 MHz}; no wavelength units. */
    public static final class WavenumberInterval implements ITypeConverter<Wavenumber> {
        @Override
        public Wavenumber convert(String value) {
            return QuantityConverters.convert(value, QuantityParser::parseWavenumberInterval);
        }
    }
}
