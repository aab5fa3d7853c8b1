package org.linewright.broadening.wings;

import java.util.LinkedHashMap;
import java.util.Map;

/**
 * Cutoff at a fixed distance from every line centre.
 *
 * @param distanceCm1 the distance in cm⁻¹, positive and finite
 */
public record FixedCutoff(double distanceCm1) implements WingCutoff {

    /** Validates the distance. */
    public FixedCutoff {
        Checks.positiveFinite(distanceCm1, "cutoff distance (cm-1)");
    }

    @Override
    public double maxDistanceCm1(double pressureAtm) {
        return distanceCm1;
    }

    @Override
    public double distanceCm1(double dopplerHwhmCm1, double lorentzHwhmCm1, double pressureAtm) {
        return distanceCm1;
    }

    @Override
    public Map<String, String> describe() {
        Map<String, String> m = new LinkedHashMap<>();
        m.put("wing.cutoff.rule", "fixed");
        m.put("wing.cutoff.distance_cm1", Double.toString(distanceCm1));
        return m;
    }

    @Override
    public boolean dependsOnWidths() {
        return false;
    }
}
