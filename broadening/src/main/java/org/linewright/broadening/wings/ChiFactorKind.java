package org.linewright.broadening.wings;

import java.util.Locale;
import org.linewright.ingest.text.OffendingText;

/** Choice of far-wing correction factor applied to a line's profile. */
public enum ChiFactorKind {
    /** No correction (χ = 1 everywhere). */
    NONE,
    /** Perrin–Hartmann 1989 sub-Lorentzian factor for CO2 lines broadened by CO2, see {@link PerrinHartmannChi}. */
    PERRIN_HARTMANN_CO2;

    /**
     * @param name "none" or "perrin-hartmann-co2" (case-insensitive; '_' and '-' are interchangeable)
     * @return the kind
     * @throws IllegalArgumentException naming the accepted values
     */
    public static ChiFactorKind parse(String name) {
        String n = name.trim().toLowerCase(Locale.ROOT).replace('_', '-');
        switch (n) {
            case "none":
                return NONE;
            case "perrin-hartmann-co2":
                return PERRIN_HARTMANN_CO2;
            default:
                throw new IllegalArgumentException(
                        "unknown wing factor " + OffendingText.quote(name) + ": expected none or perrin-hartmann-co2");
        }
    }

    /** @return the lower-case hyphenated name used in metadata */
    public String label() {
        return name().toLowerCase(Locale.ROOT).replace('_', '-');
    }
}
