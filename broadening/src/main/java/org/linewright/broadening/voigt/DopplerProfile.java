package org.linewright.broadening.voigt;

import static org.linewright.broadening.voigt.LineShapeConstants.SQRT_LN2;
import static org.linewright.broadening.voigt.LineShapeConstants.SQRT_LN2_OVER_PI;

/**
 * Area-normalised Gaussian (Doppler) profile G(Δν) = √(ln2/π)/αD · exp(−ln2·Δν²/αD²) in cm, αD the half width
 * at half maximum in cm⁻¹. Exact to the accuracy of {@link Math#exp} (1 ulp).
 */
public final class DopplerProfile {

    private DopplerProfile() {
    }

    /**
     * @param detuningCm1    ν − ν₀ in cm⁻¹
     * @param dopplerHwhmCm1 αD &gt; 0 in cm⁻¹
     * @return G(Δν) in cm
     */
    public static double value(double detuningCm1, double dopplerHwhmCm1) {
        requirePositive(dopplerHwhmCm1);
        double x = SQRT_LN2 * detuningCm1 / dopplerHwhmCm1;
        return SQRT_LN2_OVER_PI / dopplerHwhmCm1 * Math.exp(-x * x);
    }

    /**
     * Adds {@code strength · G(gridCm1[i] − centerCm1)} to {@code out[i]} for {@code from ≤ i < to}.
     *
     * @param gridCm1        wavenumbers in cm⁻¹
     * @param from           first index, inclusive
     * @param to             last index, exclusive
     * @param centerCm1      line centre in cm⁻¹
     * @param dopplerHwhmCm1 αD &gt; 0 in cm⁻¹
     * @param strength       multiplier
     * @param out            accumulator
     */
    public static void addProfile(double[] gridCm1, int from, int to, double centerCm1, double dopplerHwhmCm1,
                                  double strength, double[] out) {
        addProfile(gridCm1, from, to, centerCm1, dopplerHwhmCm1, strength, 0.0, out);
    }

    /**
     * Adds {@code strength · (profile(gridCm1[i] − centerCm1) − baselineCm)} to {@code out[i]} for
     * {@code from ≤ i < to}; the baseline removes a pedestal inside a wing cutoff.
     *
     * @param gridCm1    wavenumbers in cm⁻¹
     * @param from       first index, inclusive
     * @param to         last index, exclusive
     * @param centerCm1  line centre in cm⁻¹
     * @param dopplerHwhmCm1 half width at half maximum in cm⁻¹, positive
     * @param strength   multiplier
     * @param baselineCm value subtracted from the profile at every point, in cm
     * @param out        accumulator
     */
    public static void addProfile(double[] gridCm1, int from, int to, double centerCm1, double dopplerHwhmCm1,
                                  double strength, double baselineCm, double[] out) {
        double offset = strength * baselineCm;
        requirePositive(dopplerHwhmCm1);
        double scale = SQRT_LN2 / dopplerHwhmCm1;
        double norm = strength * SQRT_LN2_OVER_PI / dopplerHwhmCm1;
        for (int i = from; i < to; i++) {
            double x = scale * (gridCm1[i] - centerCm1);
            out[i] += norm * Math.exp(-x * x) - offset;
        }
    }

    private static void requirePositive(double dopplerHwhmCm1) {
        if (!(dopplerHwhmCm1 > 0) || Double.isInfinite(dopplerHwhmCm1)) {
            throw new IllegalArgumentException("Doppler HWHM must be positive and finite, got " + dopplerHwhmCm1);
        }
    }
}
