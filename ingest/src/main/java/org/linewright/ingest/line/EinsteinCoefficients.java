package org.linewright.ingest.line;

import org.linewright.ingest.units.PhysicalConstants;

/**
 * The relation between the Einstein coefficient of spontaneous emission A and the line intensity S of a
 * line in thermal equilibrium, as given by M. Šimečková, D. Jacquemart, L.S. Rothman, R.R. Gamache and
 * A. Goldman, "Einstein A-coefficients and statistical weights for molecular absorption transitions in the
 * HITRAN database", JQSRT 98 (2006) 130, eq. (20):
 *
 * <pre>
 *   S(T) = Iₐ · A · g′ / (8π c ν²) · exp(−c₂E″/T) · (1 − exp(−c₂ν/T)) / Q(T)
 * </pre>
 *
 * with S in cm⁻¹/(molecule·cm⁻²) (written cm/molecule), A in s⁻¹, ν the wavenumber in cm⁻¹, c the speed of
 * light in cm/s, E″ the lower-state energy in cm⁻¹, g′ the upper-state statistical weight, Q(T) the total
 * internal partition sum (same degeneracy convention as g′), Iₐ the isotopologue abundance (1 for a pure
 * isotopologue) and c₂ = hc/k the second radiation constant in cm·K (CODATA 2018).
 *
 * <p>Accuracy: a few units in the last place; the stimulated-emission factor is evaluated as
 * {@code -expm1(-c₂ν/T)} so that it keeps full relative precision for microwave lines (c₂ν/T ≪ 1), where
 * {@code 1 - exp(...)} would lose up to half the digits.
 */
public final class EinsteinCoefficients {
    private static final double EIGHT_PI_C_CM_PER_S = 8.0 * Math.PI * PhysicalConstants.SPEED_OF_LIGHT_CM_PER_S;
    private static final double C2_CM_K = PhysicalConstants.SECOND_RADIATION_CONSTANT_CM_K;

    private EinsteinCoefficients() {
    }

    /**
     * S(T) from A by the relation in the class comment.
     *
     * @return the intensity in cm/molecule (NaN if any input is NaN)
     */
    public static double intensityFromEinsteinA(double einsteinAS1, double wavenumberCm1, double upperDegeneracy,
                                                double lowerEnergyCm1, double temperatureK, double partitionSum,
                                                double abundance) {
        return abundance * einsteinAS1 * upperDegeneracy / (EIGHT_PI_C_CM_PER_S * wavenumberCm1 * wavenumberCm1)
                * Math.exp(-C2_CM_K * lowerEnergyCm1 / temperatureK)
                * -Math.expm1(-C2_CM_K * wavenumberCm1 / temperatureK)
                / partitionSum;
    }

    /**
     * A from S(T), the inverse of {@link #intensityFromEinsteinA}.
     *
     * @return the Einstein A coefficient in s⁻¹ (infinite or NaN when g′ is 0 or an input is NaN)
     */
    public static double einsteinAFromIntensity(double intensityCmPerMolecule, double wavenumberCm1,
                                                double upperDegeneracy, double lowerEnergyCm1, double temperatureK,
                                                double partitionSum, double abundance) {
        return intensityCmPerMolecule * EIGHT_PI_C_CM_PER_S * wavenumberCm1 * wavenumberCm1 * partitionSum
                / (abundance * upperDegeneracy
                   * Math.exp(-C2_CM_K * lowerEnergyCm1 / temperatureK)
                   * -Math.expm1(-C2_CM_K * wavenumberCm1 / temperatureK));
    }

    /**
     * The factor S(T₂)/S(T₁) of one line between two temperatures, from the same relation (A and g′ cancel):
     * Q(T₁)/Q(T₂) · exp(−c₂E″/T₂)/exp(−c₂E″/T₁) · (1 − exp(−c₂ν/T₂))/(1 − exp(−c₂ν/T₁)).
     */
    public static double intensityRatio(double wavenumberCm1, double lowerEnergyCm1,
                                        double fromTemperatureK, double fromPartitionSum,
                                        double toTemperatureK, double toPartitionSum) {
        return fromPartitionSum / toPartitionSum
                // one exponential of the difference: no underflow for high E″ where each factor alone would
                * Math.exp(-C2_CM_K * lowerEnergyCm1 * (1.0 / toTemperatureK - 1.0 / fromTemperatureK))
                * Math.expm1(-C2_CM_K * wavenumberCm1 / toTemperatureK)
                / Math.expm1(-C2_CM_K * wavenumberCm1 / fromTemperatureK);
    }
}
