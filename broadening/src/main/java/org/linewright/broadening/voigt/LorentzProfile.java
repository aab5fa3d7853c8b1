package org.linewright.broadening.voigt;

import static org.linewright.broadening.voigt.LineShapeConstants.INV_PI;

/**
 * Area-normalised Lorentz profile L(Δν) = (γL/π)/(Δν² + γL²) in cm, γL the half width at half maximum in cm⁻¹.
 * Exact to a few ulp.
 */
public final class LorentzProfile {

    private LorentzProfile() {
    }

    /**
     * @param detuningCm1    ν − ν₀ in cm⁻¹
     * @param lorentzHwhmCm1 γL &gt; 0 in cm⁻¹
     * @return L(Δν) in cm
     */
    public static double value(double detuningCm1, double lorentzHwhmCm1) {
        requirePositive(lorentzHwhmCm1);
        return INV_PI * lorentzHwhmCm1 / (detuningCm1 * detuningCm1 + lorentzHwhmCm1 * lorentzHwhmCm1);
    }

    /**
     * Adds {@code strength · L(gridCm1[i] − centerCm1)} to {@code out[i]} for {@code from ≤ i < to}.
     *
     * @param gridCm1        wavenumbers in cm⁻¹
     * @param from           first index, inclusive
     * @param to             last index, exclusive
     * @param centerCm1      line centre in cm⁻¹
     * @param lorentzHwhmCm1 γL &gt; 0 in cm⁻¹
     * @param strength       multiplier
     * @param out            accumulator
     */
    public static void addProfile(double[] gridCm1, int from, int to, double centerCm1, double lorentzHwhmCm1,
                                  double strength, double[] out) {
        addProfile(gridCm1, from, to, centerCm1, lorentzHwhmCm1, strength, 0.0, out);
    }

    /**
     * Adds {@code strength · (profile(gridCm1[i] − centerCm1) − baselineCm)} to {@code out[i]} for
     * {@code from ≤ i < to}; the baseline removes a pedestal inside a wing cutoff.
     *
     * @param gridCm1    wavenumbers in cm⁻¹
     * @param from       first index, inclusive
     * @param to         last index, exclusive
     * @param centerCm1  line centre in cm⁻¹
     * @param lorentzHwhmCm1 half width at half maximum in cm⁻¹, positive
     * @param strength   multiplier
     * @param baselineCm value subtracted from the profile at every point, in cm
     * @param out        accumulator
     */
    public static void addProfile(double[] gridCm1, int from, int to, double centerCm1, double lorentzHwhmCm1,
                                  double strength, double baselineCm, double[] out) {
        double offset = strength * baselineCm;
        requirePositive(lorentzHwhmCm1);
        double numerator = strength * INV_PI * lorentzHwhmCm1;
        double gamma2 = lorentzHwhmCm1 * lorentzHwhmCm1;
        for (int i = from; i < to; i++) {
            double d = gridCm1[i] - centerCm1;
            out[i] += numerator / (d * d + gamma2) - offset;
        }
    }

    private static void requirePositive(double lorentzHwhmCm1) {
        if (!(lorentzHwhmCm1 > 0) || Double.isInfinite(lorentzHwhmCm1)) {
            throw new IllegalArgumentException("Lorentz HWHM must be positive and finite, got " + lorentzHwhmCm1);
        }
    }
}
