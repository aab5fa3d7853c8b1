package org.linewright.broadening.voigt;

import org.linewright.ingest.units.PhysicalConstants;

/**
 * Van Vleck–Weisskopf line shape for low-frequency (microwave, millimetre, sub-millimetre) lines, in cm (per cm⁻¹):
 * <pre>
 *   φ_VVW(ν; ν₀, γL) = (ν/ν₀)² · (1/π) · [ γL/((ν − ν₀)² + γL²) + γL/((ν + ν₀)² + γL²) ]
 * </pre>
 * J.H. Van Vleck and V.F. Weisskopf, "On the shape of collision-broadened lines", Rev. Mod. Phys. 17 (1945) 227:
 * the absorption coefficient of a collision-broadened line in the limit hν ≪ kT is proportional to
 * ν²·[resonance at +ν₀ + resonance at −ν₀]; dividing by the integrated intensity S of a line whose S is defined at
 * ν₀ with stimulated emission included (S ∝ ν₀·(1 − e^(−c₂ν₀/T)) ≈ ν₀²·c₂/T in that limit) gives the factor
 * (ν/ν₀)² (form as recalled from the paper, from memory). For γL ≪ ν₀ and ν near ν₀ it tends to the Lorentz
 * profile; the −ν₀ resonance carries, on ν &gt; 0, the area that a Lorentz profile centred at ν₀ would put at
 * ν &lt; 0 (∫₀^∞ [L(ν − ν₀) + L(ν + ν₀)] dν = ∫_(−∞)^∞ L = 1 exactly). The (ν/ν₀)² factor makes the far wing
 * above the line tend to the constant γL/(πν₀²), so the shape is used inside a wing cutoff.
 *
 * <p>Doppler broadening: each resonance is replaced by the Voigt profile V of {@link VoigtProfile} with the
 * line's αD,
 * <pre>
 *   φ(ν) = (ν/ν₀)² · [ V(ν − ν₀; αD, γL) + V(ν + ν₀; αD, γL) ]
 * </pre>
 * the factor applied after the convolution (common practice, from memory). Convolving the (ν/ν₀)²-weighted shape
 * instead differs from this by terms of relative order αD/ν₀ (the factor varies by 2αD/ν₀ across the Doppler core),
 * about 10⁻⁶ for any molecule at any temperature this tool covers (αD/ν₀ = √(2 ln2·kT/(mc²))): far below the
 * accuracy of the engines. With γL = 0 it is the same construction with Gaussians.
 *
 * <p>Validity: the (ν/ν₀)² factor is the hν ≪ kT limit of ν·tanh(c₂ν/2T)/(ν₀·tanh(c₂ν₀/2T)) (J.H. Van Vleck
 * and D.L. Huber, Rev. Mod. Phys. 49 (1977) 939, from memory); where c₂ν₀/T ≤ {@value #MAX_REDUCED_FREQUENCY}
 * the two factors differ by less than 1 % over 0 &lt; ν ≤ 2ν₀ (tanh(x)/x ≈ 1 − x²/3). {@link #chosenFor} picks lines in that range only.
 *
 * <p>Accuracy: that of {@link VoigtProfile#value} (relative error below 1×10⁻¹³) for each resonance. Stateless
 * and thread-safe.
 */
public final class VanVleckWeisskopfProfile {

    /**
     * γL/ν₀ above which a line gets this shape automatically. For γL ≪ ν₀ the largest difference between
     * φ_VVW and the Lorentz profile, relative to the line's peak 1/(πγL), is γL/ν₀ (the factor (ν/ν₀)² ≈
     * 1 + 2(ν − ν₀)/ν₀ times L(ν − ν₀)/L(0) = γL²/((ν − ν₀)² + γL²) is largest at |ν − ν₀| = γL), plus
     * γL²/(4ν₀²) from the −ν₀ resonance; 10⁻⁴ is a tenth of the default fast-engine tolerance (10⁻³), so a line
     * left as Voigt differs from its VVW shape by less than a tenth of that tolerance.
     */
    public static final double AUTOMATIC_WIDTH_RATIO = 1e-4;

    /**
     * Largest c₂ν₀/T (hν₀/kT) for which the shape is chosen automatically: there the (ν/ν₀)² factor and the
     * Van Vleck–Huber factor differ by less than 1 % for 0 &lt; ν ≤ 2ν₀ (tanh(x)/x ≈ 1 − x²/3 with x = c₂ν/2T ≤ 0.2).
     */
    public static final double MAX_REDUCED_FREQUENCY = 0.2;

    private VanVleckWeisskopfProfile() {
    }

    /**
     * φ_VVW(ν) in cm, as in the class description.
     *
     * @param wavenumberCm1  ν in cm⁻¹
     * @param centerCm1      ν₀ &gt; 0 in cm⁻¹
     * @param dopplerHwhmCm1 αD ≥ 0 in cm⁻¹
     * @param lorentzHwhmCm1 γL ≥ 0 in cm⁻¹ (not both zero)
     * @return φ_VVW in cm
     * @throws IllegalArgumentException if ν₀ is not positive and finite, or the widths are invalid
     */
    public static double value(double wavenumberCm1, double centerCm1, double dopplerHwhmCm1, double lorentzHwhmCm1) {
        checkCenter(centerCm1);
        double ratio = wavenumberCm1 / centerCm1;
        return ratio * ratio * (VoigtProfile.value(wavenumberCm1 - centerCm1, dopplerHwhmCm1, lorentzHwhmCm1)
                + VoigtProfile.value(wavenumberCm1 + centerCm1, dopplerHwhmCm1, lorentzHwhmCm1));
    }

    /**
     * Adds {@code strength · (ν/ν₀)² · (V(ν − ν₀) + V(ν + ν₀) − baselineCm)} at ν = {@code gridCm1[i]} to
     * {@code out[i]} for {@code from ≤ i < to}: the pedestal, when a caller removes one, is taken off the +ν₀
     * resonance inside the factor, so that the shape still goes to (ν/ν₀)²·V(ν + ν₀) (the −ν₀ resonance's wing,
     * below 10⁻⁶ of the peak for the lines this shape is chosen for) at the cutoff. Allocation free.
     *
     * @param gridCm1        wavenumbers in cm⁻¹
     * @param from           first index, inclusive
     * @param to             last index, exclusive
     * @param centerCm1      ν₀ &gt; 0 in cm⁻¹
     * @param dopplerHwhmCm1 αD ≥ 0 in cm⁻¹
     * @param lorentzHwhmCm1 γL ≥ 0 in cm⁻¹ (not both zero)
     * @param strength       multiplier (e.g. the line intensity in cm/molecule)
     * @param baselineCm     pedestal subtracted from the +ν₀ resonance, in cm
     * @param out            accumulator
     */
    public static void addProfile(double[] gridCm1, int from, int to, double centerCm1, double dopplerHwhmCm1,
                                  double lorentzHwhmCm1, double strength, double baselineCm, double[] out) {
        checkCenter(centerCm1);
        double inverseCenter = 1.0 / centerCm1;
        for (int i = from; i < to; i++) {
            double nu = gridCm1[i];
            double ratio = nu * inverseCenter;
            double sum = VoigtProfile.value(nu - centerCm1, dopplerHwhmCm1, lorentzHwhmCm1)
                    + VoigtProfile.value(nu + centerCm1, dopplerHwhmCm1, lorentzHwhmCm1) - baselineCm;
            out[i] += strength * ratio * ratio * sum;
        }
    }

    /**
     * The rule for choosing this shape automatically: γL/ν₀ &gt; {@value #AUTOMATIC_WIDTH_RATIO} and
     * c₂ν₀/T ≤ {@value #MAX_REDUCED_FREQUENCY} (c₂ the second radiation constant), ν₀ &gt; 0.
     *
     * @param centerCm1      ν₀ in cm⁻¹
     * @param lorentzHwhmCm1 γL in cm⁻¹
     * @param temperatureK   T in K
     * @return whether the line gets the Van Vleck–Weisskopf shape
     */
    public static boolean chosenFor(double centerCm1, double lorentzHwhmCm1, double temperatureK) {
        return centerCm1 > 0 && lorentzHwhmCm1 > AUTOMATIC_WIDTH_RATIO * centerCm1
                && PhysicalConstants.SECOND_RADIATION_CONSTANT_CM_K * centerCm1
                <= MAX_REDUCED_FREQUENCY * temperatureK;
    }

    /** @return the automatic rule in words, for output metadata */
    public static String ruleDescription() {
        return "Van Vleck-Weisskopf (1945) shape, (nu/nu0)^2 [V(nu-nu0) + V(nu+nu0)], for lines with gamma_L/nu0 > "
                + AUTOMATIC_WIDTH_RATIO + " and c2*nu0/T <= " + MAX_REDUCED_FREQUENCY + "; Voigt otherwise";
    }

    private static void checkCenter(double centerCm1) {
        if (!(centerCm1 > 0) || Double.isInfinite(centerCm1)) {
            throw new IllegalArgumentException("Van Vleck-Weisskopf shape needs a positive finite line centre: "
                    + centerCm1 + " cm-1");
        }
    }
}
