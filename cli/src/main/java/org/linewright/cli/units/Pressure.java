package org.linewright.cli.units;

import org.linewright.ingest.units.PhysicalConstants;

/**
 * A pressure given on the command line, held in pascals and handed to the modules in the unit they name.
 *
 * @param pascals the pressure in Pa, positive
 */
public record Pressure(double pascals) {
    /** Pascals per bar, exact by definition of the bar (10⁵ Pa). */
    public static final double PA_PER_BAR = 1.0e5;

    /** Pascals per Torr, exact by definition: one standard atmosphere divided by 760. */
    public static final double PA_PER_TORR = PhysicalConstants.STANDARD_ATMOSPHERE_PA / 760.0;

    /** @return the pressure in bar */
    public double bar() {
        return pascals / PA_PER_BAR;
    }

    /** @return the pressure in standard atmospheres (101 325 Pa) */
    public double atm() {
        return pascals / PhysicalConstants.STANDARD_ATMOSPHERE_PA;
    }
}
