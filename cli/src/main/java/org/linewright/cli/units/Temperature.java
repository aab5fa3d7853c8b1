package org.linewright.cli.units;

/**
 * A temperature given on the command line.
 *
 * @param kelvin the thermodynamic temperature in K, positive
 */
public record Temperature(double kelvin) {
}
