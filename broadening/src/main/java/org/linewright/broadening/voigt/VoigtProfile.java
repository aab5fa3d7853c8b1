package org.linewright.broadening.voigt;

import static org.linewright.broadening.voigt.LineShapeConstants.PURE_LORENTZ_WIDTH_RATIO;
import static org.linewright.broadening.voigt.LineShapeConstants.SQRT_LN2;
import static org.linewright.broadening.voigt.LineShapeConstants.SQRT_LN2_OVER_PI;

/**
 * Area-normalised Voigt profile in cm (per cm⁻¹):
 * V(Δν) = √(ln2/π)/αD · K(x, y), x = √ln2·Δν/αD, y = √ln2·γL/αD,
 * with αD the Doppler and γL the Lorentz half width at half maximum (cm⁻¹) and K = Re w the Voigt function of
 * {@link Faddeeva}. Limits: αD → 0 (or γL/αD &gt; 10⁸) gives the Lorentz profile, γL = 0 the Gaussian.
 *
 * <p>{@link #value} has the accuracy of {@link Faddeeva#voigtK} (relative error below 1×10⁻¹³).
 * {@link #addProfile} uses, for |z| ≥ 250 (the far wing, most grid points of a line), the one-level continued
 * fraction K ≈ y(s + ½)/(√π·(s² − x² + y² + ¼)), s = x² + y², whose relative error is below 2.5/|z|⁴ ≤ 7×10⁻¹⁰,
 * costing one division per point; for 50 ≤ |z| &lt; 250 the two-level fraction in closed form (one division,
 * relative error ≤ 4×10⁻¹⁰); nearer the centre the methods of {@link Faddeeva}, with the
 * quantities that depend on y only (erfcx(y), the y-part of the first sum and the sums' denominators) computed once
 * per line.
 */
public final class VoigtProfile {

    /** |z|² from which {@link #addProfile} uses the one-level closed form (relative error ≤ 6.4e-10). */
    static final double FAST_FAR_WING_RADIUS_SQUARED = 250.0 * 250.0;
    /** |z|² from which {@link #addProfile} uses the two-level closed form (relative error ≤ 4e-10). */
    static final double TWO_LEVEL_RADIUS_SQUARED = 50.0 * 50.0;

    /** Per-thread table of the series denominators of the current line (reused, so the kernel allocates nothing). */
    private static final ThreadLocal<double[]> SERIES_RECIPROCALS =
            ThreadLocal.withInitial(() -> new double[Faddeeva.ZA_TABLE_LENGTH]);

    private VoigtProfile() {
    }

    /**
     * Voigt profile value V(Δν) in cm.
     *
     * @param detuningCm1    ν − ν₀ in cm⁻¹
     * @param dopplerHwhmCm1 αD ≥ 0 in cm⁻¹
     * @param lorentzHwhmCm1 γL ≥ 0 in cm⁻¹ (not both zero)
     * @return V in cm
     * @throws IllegalArgumentException if a width is negative, NaN or infinite, or both are zero
     */
    public static double value(double detuningCm1, double dopplerHwhmCm1, double lorentzHwhmCm1) {
        checkWidths(dopplerHwhmCm1, lorentzHwhmCm1);
        if (dopplerHwhmCm1 == 0 || lorentzHwhmCm1 > PURE_LORENTZ_WIDTH_RATIO * dopplerHwhmCm1) {
            return LorentzProfile.value(detuningCm1, lorentzHwhmCm1);
        }
        if (lorentzHwhmCm1 == 0) {
            return DopplerProfile.value(detuningCm1, dopplerHwhmCm1);
        }
        double scale = SQRT_LN2 / dopplerHwhmCm1;
        return SQRT_LN2_OVER_PI / dopplerHwhmCm1 * Faddeeva.voigtK(scale * detuningCm1, scale * lorentzHwhmCm1);
    }

    /**
     * Adds {@code strength · V(gridCm1[i] − centerCm1)} to {@code out[i]} for {@code from ≤ i < to}; allocation
     * free. Accuracy as in the class description.
     *
     * @param gridCm1        wavenumbers in cm⁻¹ (any order)
     * @param from           first index, inclusive
     * @param to             last index, exclusive
     * @param centerCm1      line centre in cm⁻¹
     * @param dopplerHwhmCm1 αD ≥ 0 in cm⁻¹
     * @param lorentzHwhmCm1 γL ≥ 0 in cm⁻¹ (not both zero)
     * @param strength       multiplier (e.g. line intensity in cm/molecule)
     * @param out            accumulator
     */
    public static void addProfile(double[] gridCm1, int from, int to, double centerCm1, double dopplerHwhmCm1,
                                  double lorentzHwhmCm1, double strength, double[] out) {
        addProfile(gridCm1, from, to, centerCm1, dopplerHwhmCm1, lorentzHwhmCm1, strength, 0.0, out);
    }

    /**
     * Adds {@code strength · (V(gridCm1[i] − centerCm1) − baselineCm)} to {@code out[i]} for {@code from ≤ i < to};
     * the baseline lets a caller remove the pedestal V(cutoff) inside a wing cutoff. Allocation free.
     *
     * @param gridCm1        wavenumbers in cm⁻¹ (any order)
     * @param from           first index, inclusive
     * @param to             last index, exclusive
     * @param centerCm1      line centre in cm⁻¹
     * @param dopplerHwhmCm1 αD ≥ 0 in cm⁻¹
     * @param lorentzHwhmCm1 γL ≥ 0 in cm⁻¹ (not both zero)
     * @param strength       multiplier
     * @param baselineCm     profile value subtracted at every point, in cm
     * @param out            accumulator
     */
    public static void addProfile(double[] gridCm1, int from, int to, double centerCm1, double dopplerHwhmCm1,
                                  double lorentzHwhmCm1, double strength, double baselineCm, double[] out) {
        checkWidths(dopplerHwhmCm1, lorentzHwhmCm1);
        if (dopplerHwhmCm1 == 0 || lorentzHwhmCm1 > PURE_LORENTZ_WIDTH_RATIO * dopplerHwhmCm1) {
            double numerator = strength * LineShapeConstants.INV_PI * lorentzHwhmCm1;
            double offset = strength * baselineCm;
            double gamma2 = lorentzHwhmCm1 * lorentzHwhmCm1;
            for (int i = from; i < to; i++) {
                double d = gridCm1[i] - centerCm1;
                out[i] += numerator / (d * d + gamma2) - offset;
            }
            return;
        }
        double scale = SQRT_LN2 / dopplerHwhmCm1;
        double norm = strength * SQRT_LN2_OVER_PI / dopplerHwhmCm1;
        double offset = strength * baselineCm;
        if (lorentzHwhmCm1 == 0) {
            for (int i = from; i < to; i++) {
                double x = scale * (gridCm1[i] - centerCm1);
                out[i] += norm * Math.exp(-x * x) - offset;
            }
            return;
        }
        double y = scale * lorentzHwhmCm1;
        double y2 = y * y;
        // the series near the centre needs y-only quantities: compute them once per line
        double erfcxOfY = 0;
        double sum1OfY = 0;
        double[] reciprocals = null;
        if (y2 < Faddeeva.SERIES_RADIUS_SQUARED) {
            erfcxOfY = Faddeeva.erfcx(y);
            sum1OfY = Faddeeva.zaghloulAliSum1(y);
            reciprocals = SERIES_RECIPROCALS.get();
            Faddeeva.zaghloulAliReciprocals(y, reciprocals);
        }
        for (int i = from; i < to; i++) {
            double x = scale * (gridCm1[i] - centerCm1);
            double s = x * x + y2;
            double k;
            if (s >= FAST_FAR_WING_RADIUS_SQUARED) {
                k = Faddeeva.farWingK(Math.abs(x), y);
            } else if (s >= TWO_LEVEL_RADIUS_SQUARED) {
                k = Faddeeva.twoLevelK(Math.abs(x), y);
            } else if (s < Faddeeva.SERIES_RADIUS_SQUARED) {
                k = Faddeeva.zaghloulAliK(Math.abs(x), y, erfcxOfY, sum1OfY, reciprocals);
            } else {
                k = Faddeeva.voigtK(x, y);
            }
            out[i] += norm * k - offset;
        }
    }

    private static void checkWidths(double dopplerHwhmCm1, double lorentzHwhmCm1) {
        if (!(dopplerHwhmCm1 >= 0) || !(lorentzHwhmCm1 >= 0)
                || Double.isInfinite(dopplerHwhmCm1) || Double.isInfinite(lorentzHwhmCm1)
                || (dopplerHwhmCm1 == 0 && lorentzHwhmCm1 == 0)) {
            throw new IllegalArgumentException("Voigt widths must be finite, non-negative and not both zero: αD="
                    + dopplerHwhmCm1 + " γL=" + lorentzHwhmCm1 + " cm-1");
        }
    }
}
