package org.linewright.broadening.sources;

import org.linewright.broadening.background.BackgroundGas;

/**
 * Constant broadening parameters of one background gas: Lorentz HWHM γ at 296 K and 1 atm, its temperature
 * exponent n (γ(T) = γ·(296/T)ⁿ) and the pressure shift δ at 296 K (0 when unknown).
 *
 * @param widthCm1PerAtm γ in cm⁻¹/atm, positive
 * @param exponent n, dimensionless
 * @param shiftCm1PerAtm δ in cm⁻¹/atm
 */
public record GasParameters(double widthCm1PerAtm, double exponent, double shiftCm1PerAtm) {

    /**
     * Defaults used as the last resort, with a warning: γ = 0.07 cm⁻¹/atm and n = 0.5 for every gas, δ = 0.
     * These are typical magnitudes of rotational-line widths in the absence of data (common practice, values
     * from memory), not measurements: supply user constants, rules or tables where accuracy matters.
     */
    public static GasParameters defaultFor(BackgroundGas gas) {
        return DEFAULT;
    }

    private static final GasParameters DEFAULT = new GasParameters(0.07, 0.5, 0.0);

    public GasParameters {
        if (!(widthCm1PerAtm > 0) || Double.isInfinite(widthCm1PerAtm)) {
            throw new IllegalArgumentException("width must be positive and finite: " + widthCm1PerAtm);
        }
        if (!Double.isFinite(exponent)) {
            throw new IllegalArgumentException("exponent must be finite: " + exponent);
        }
        if (!Double.isFinite(shiftCm1PerAtm)) {
            throw new IllegalArgumentException("shift must be finite: " + shiftCm1PerAtm);
        }
    }
}
