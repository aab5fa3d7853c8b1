package org.linewright.broadening.background;

import java.util.Locale;
import org.linewright.ingest.line.Broadener;

/**
 * The gases a background {@link Composition} may contain. {@link #SELF} stands for the absorber itself
 * (self-broadening); {@link #AIR} is the terrestrial-air mixture for which line lists carry per-line values.
 */
public enum BackgroundGas {
    AIR, H2, HE, CO2, N2, O2, H2O, SELF;

    private static final BackgroundGas[] VALUES = values();

    /** Number of gases, the length of per-gas arrays indexed by {@link #ordinal()}. */
    public static final int COUNT = VALUES.length;

    /** The gas at {@code ordinal}. */
    public static BackgroundGas ofOrdinal(int ordinal) {
        return VALUES[ordinal];
    }

    /**
     * Gas by name, case-insensitive ({@code air}, {@code h2}, {@code He}, {@code co2}, {@code n2}, {@code o2},
     * {@code h2o}, {@code self}); null when unknown.
     */
    public static BackgroundGas byName(String name) {
        String upper = name.trim().toUpperCase(Locale.ROOT);
        for (BackgroundGas gas : VALUES) {
            if (gas.name().equals(upper)) {
                return gas;
            }
        }
        return null;
    }

    /**
     * The line-list broadener whose per-line columns (width, exponent, shift) belong to this gas, or null for a
     * gas no line list carries columns for (air and self have their own columns; N2 and O2 none). The one home
     * of the gas-to-column mapping.
     */
    public Broadener lineBroadener() {
        return switch (this) {
            case H2 -> Broadener.H2;
            case HE -> Broadener.HE;
            case CO2 -> Broadener.CO2;
            case H2O -> Broadener.H2O;
            default -> null;
        };
    }

    /** Lower-case name as written in options and reports, e.g. {@code h2o}. */
    public String label() {
        return name().toLowerCase(Locale.ROOT);
    }
}
