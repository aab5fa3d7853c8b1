package org.linewright.cli.units;

/**
 * A spectral position given on the command line as a wavenumber, a wavelength or a frequency, held as a
 * vacuum wavenumber.
 *
 * @param cm1 the wavenumber in cm⁻¹, positive
 */
public record Wavenumber(double cm1) {
}
