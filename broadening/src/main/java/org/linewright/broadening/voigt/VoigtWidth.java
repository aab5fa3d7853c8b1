package org.linewright.broadening.voigt;

/**
 * Width of the Voigt profile from its Lorentz and Gaussian widths by the approximation of J.J. Olivero and
 * R.L. Longbothum, "Empirical fits to the Voigt line width: a brief review", JQSRT 17 (1977) 233:
 * f_V ≈ 0.5346·f_L + √(0.2166·f_L² + f_G²), accurate to about 0.02 % for all ratios f_L/f_G. The formula is
 * homogeneous of degree one, so it applies equally to full and to half widths.
 */
public final class VoigtWidth {

    /** Coefficient of f_L outside the root. */
    private static final double LINEAR_COEFFICIENT = 0.5346;
    /** Coefficient of f_L² inside the root. */
    private static final double QUADRATIC_COEFFICIENT = 0.2166;

    private VoigtWidth() {
    }

    /**
     * Voigt full width at half maximum.
     *
     * @param lorentzFwhmCm1 Lorentz FWHM f_L ≥ 0 in cm⁻¹
     * @param gaussFwhmCm1   Gaussian FWHM f_G ≥ 0 in cm⁻¹
     * @return f_V in cm⁻¹
     */
    public static double fwhmCm1(double lorentzFwhmCm1, double gaussFwhmCm1) {
        return LINEAR_COEFFICIENT * lorentzFwhmCm1
                + Math.sqrt(QUADRATIC_COEFFICIENT * lorentzFwhmCm1 * lorentzFwhmCm1 + gaussFwhmCm1 * gaussFwhmCm1);
    }

    /**
     * Voigt half width at half maximum from the Doppler and Lorentz half widths (same formula as {@link #fwhmCm1}).
     *
     * @param dopplerHwhmCm1 αD ≥ 0 in cm⁻¹
     * @param lorentzHwhmCm1 γL ≥ 0 in cm⁻¹
     * @return Voigt HWHM in cm⁻¹
     */
    public static double hwhmCm1(double dopplerHwhmCm1, double lorentzHwhmCm1) {
        return fwhmCm1(lorentzHwhmCm1, dopplerHwhmCm1);
    }
}
