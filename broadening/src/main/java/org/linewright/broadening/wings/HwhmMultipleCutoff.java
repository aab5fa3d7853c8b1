package org.linewright.broadening.wings;

import java.util.LinkedHashMap;
import java.util.Map;
import org.linewright.broadening.voigt.VoigtWidth;

/**
 * Cutoff at a multiple of each line's Voigt half width (Olivero–Longbothum approximation, see
 * {@link VoigtWidth}), bounded above: d = min(maxDistance, multiple · HWHM_V(αD, γL)).
 *
 * @param multiple       the multiple of the Voigt HWHM, positive and finite
 * @param maxDistanceCm1 upper bound in cm⁻¹, positive (may be infinite)
 */
public record HwhmMultipleCutoff(double multiple, double maxDistanceCm1) implements WingCutoff {

    /** Validates the parameters. */
    public HwhmMultipleCutoff {
        Checks.positiveFinite(multiple, "HWHM multiple");
        if (!(maxDistanceCm1 > 0)) {
            throw new IllegalArgumentException("maximum cutoff distance (cm-1) must be positive, got " + maxDistanceCm1);
        }
    }

    @Override
    public double maxDistanceCm1(double pressureAtm) {
        return maxDistanceCm1;
    }

    @Override
    public double distanceCm1(double dopplerHwhmCm1, double lorentzHwhmCm1, double pressureAtm) {
        return Math.min(maxDistanceCm1, multiple * VoigtWidth.hwhmCm1(dopplerHwhmCm1, lorentzHwhmCm1));
    }

    @Override
    public Map<String, String> describe() {
        Map<String, String> m = new LinkedHashMap<>();
        m.put("wing.cutoff.rule", "voigt-hwhm-multiple");
        m.put("wing.cutoff.hwhm_multiple", Double.toString(multiple));
        m.put("wing.cutoff.max_distance_cm1", Double.toString(maxDistanceCm1));
        m.put("wing.cutoff.hwhm_formula", "Olivero-Longbothum 1977");
        return m;
    }
}
