package org.linewright.broadening.sources;

import java.util.EnumMap;
import java.util.Map;

import org.linewright.broadening.background.BackgroundGas;
import org.linewright.ingest.InputException;
import org.linewright.ingest.text.OffendingText;

/**
 * Parses user-given broadening constants written {@code GAS=γ[:n[:δ]],...}, e.g. {@code h2=0.06:0.6,he=0.05};
 * γ and δ in cm⁻¹/atm at 296 K, n dimensionless. A missing n is 0.5 and a missing δ is 0 (the defaults of
 * {@link GasParameters#defaultFor}).
 */
public final class UserConstants {
    private UserConstants() {
    }

    /**
     * @throws InputException one line naming the offending item and what was expected
     */
    public static Map<BackgroundGas, GasParameters> parse(String text) {
        Map<BackgroundGas, GasParameters> out = new EnumMap<>(BackgroundGas.class);
        if (text == null || text.isBlank()) {
            throw new InputException("broadening constants: empty (expected GAS=width[:exponent[:shift]],...)");
        }
        for (String item : text.split(",", -1)) {
            int eq = item.indexOf('=');
            if (eq < 0) {
                throw new InputException("broadening constants " + OffendingText.quote(text) + ": item \"" + item.trim()
                        + "\" (expected GAS=width[:exponent[:shift]])");
            }
            String name = item.substring(0, eq).trim();
            BackgroundGas gas = BackgroundGas.byName(name);
            if (gas == null) {
                throw new InputException("broadening constants " + OffendingText.quote(text) + ": unknown gas \"" + name
                        + "\" (expected air, h2, he, co2, n2, o2, h2o or self)");
            }
            if (out.containsKey(gas)) {
                throw new InputException("broadening constants " + OffendingText.quote(text) + ": gas \"" + name
                        + "\" given twice (expected each gas once)");
            }
            String[] parts = item.substring(eq + 1).split(":", -1);
            if (parts.length > 3) {
                throw new InputException("broadening constants " + OffendingText.quote(text) + ": \"" + item.trim()
                        + "\" has more than three values (expected width[:exponent[:shift]])");
            }
            GasParameters d = GasParameters.defaultFor(gas);
            double width = number(text, gas, "width", parts[0]);
            double exponent = parts.length > 1 ? number(text, gas, "exponent", parts[1]) : d.exponent();
            double shift = parts.length > 2 ? number(text, gas, "shift", parts[2]) : d.shiftCm1PerAtm();
            if (!(width > 0)) {
                throw new InputException("broadening constants " + OffendingText.quote(text) + ": width of " + gas.label() + " is "
                        + width + " (expected a positive width in cm-1/atm)");
            }
            out.put(gas, new GasParameters(width, exponent, shift));
        }
        return out;
    }

    private static double number(String text, BackgroundGas gas, String what, String value) {
        try {
            double v = Double.parseDouble(value.trim());
            if (Double.isFinite(v)) {
                return v;
            }
        } catch (NumberFormatException e) {
            // reported below
        }
        throw new InputException("broadening constants " + OffendingText.quote(text) + ": " + what + " of " + gas.label() + " \""
                + value.trim() + "\" is not a finite number");
    }
}
