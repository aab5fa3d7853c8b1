package org.linewright.broadening.voigt;

/**
 * An area-normalised line shape φ(Δν; αD, γL) in cm (per cm⁻¹), ∫φ dΔν = 1, parameterised by the Doppler
 * half width at half maximum αD and the Lorentz half width at half maximum γL (both cm⁻¹). Shapes that do not
 * depend on one of the widths ignore it. Implementations are stateless and thread-safe.
 */
public interface LineShape {

    /**
     * Profile value at one detuning.
     *
     * @param detuningCm1     ν − ν₀ in cm⁻¹
     * @param dopplerHwhmCm1  αD in cm⁻¹
     * @param lorentzHwhmCm1  γL in cm⁻¹
     * @return φ in cm
     */
    double value(double detuningCm1, double dopplerHwhmCm1, double lorentzHwhmCm1);

    /**
     * Adds {@code strength · φ(gridCm1[i] − centerCm1)} to {@code out[i]} for {@code from ≤ i < to}, without
     * allocating. The per-line set-up is done once; the per-point work is a few flops in the far wing.
     *
     * @param gridCm1         wavenumbers in cm⁻¹ (any order)
     * @param from            first index, inclusive
     * @param to              last index, exclusive
     * @param centerCm1       line centre ν₀ in cm⁻¹ (pressure shift already applied)
     * @param dopplerHwhmCm1  αD in cm⁻¹
     * @param lorentzHwhmCm1  γL in cm⁻¹
     * @param strength        factor applied to φ (e.g. the line intensity in cm/molecule, giving cm²/molecule)
     * @param out             accumulator, same indexing as {@code gridCm1}
     */
    default void addProfile(double[] gridCm1, int from, int to, double centerCm1, double dopplerHwhmCm1,
                            double lorentzHwhmCm1, double strength, double[] out) {
        addProfile(gridCm1, from, to, centerCm1, dopplerHwhmCm1, lorentzHwhmCm1, strength, 0.0, out);
    }

    /**
     * Adds {@code strength · (φ(gridCm1[i] − centerCm1) − baselineCm)} to {@code out[i]} for {@code from ≤ i < to},
     * without allocating; the baseline lets a caller remove the pedestal φ(cutoff) inside a wing cutoff.
     *
     * @param gridCm1         wavenumbers in cm⁻¹ (any order)
     * @param from            first index, inclusive
     * @param to              last index, exclusive
     * @param centerCm1       line centre ν₀ in cm⁻¹
     * @param dopplerHwhmCm1  αD in cm⁻¹
     * @param lorentzHwhmCm1  γL in cm⁻¹
     * @param strength        factor applied to φ
     * @param baselineCm      value subtracted from φ at every point, in cm
     * @param out             accumulator, same indexing as {@code gridCm1}
     */
    void addProfile(double[] gridCm1, int from, int to, double centerCm1, double dopplerHwhmCm1,
                    double lorentzHwhmCm1, double strength, double baselineCm, double[] out);

    /**
     * Half width at half maximum of this shape for the given widths, in cm⁻¹.
     *
     * @param dopplerHwhmCm1 αD in cm⁻¹
     * @param lorentzHwhmCm1 γL in cm⁻¹
     * @return HWHM in cm⁻¹
     */
    double hwhmCm1(double dopplerHwhmCm1, double lorentzHwhmCm1);
}
