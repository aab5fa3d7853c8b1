package org.linewright.broadening.wings;

import java.util.LinkedHashMap;
import java.util.Map;

/**
 * Pressure-dependent cutoff, a rule of this project (not a published one): the distance grows linearly with
 * the total pressure, because the Lorentz wings widen in proportion to it, and is clamped to a range:
 * d = min(maxDistance, max(minDistance, k · p)).
 *
 * @param distancePerAtmCm1 k in cm⁻¹ per atm, positive and finite
 * @param minDistanceCm1    lower bound in cm⁻¹, positive and finite
 * @param maxDistanceCm1    upper bound in cm⁻¹, at least the lower bound (may be infinite)
 */
public record PressureScaledCutoff(double distancePerAtmCm1, double minDistanceCm1, double maxDistanceCm1)
        implements WingCutoff {

    /** Validates the parameters. */
    public PressureScaledCutoff {
        Checks.positiveFinite(distancePerAtmCm1, "cutoff distance per atm (cm-1/atm)");
        Checks.positiveFinite(minDistanceCm1, "minimum cutoff distance (cm-1)");
        if (!(maxDistanceCm1 >= minDistanceCm1)) {
            throw new IllegalArgumentException("maximum cutoff distance (cm-1) " + maxDistanceCm1
                    + " must be at least the minimum " + minDistanceCm1);
        }
    }

    @Override
    public double maxDistanceCm1(double pressureAtm) {
        return Math.min(maxDistanceCm1, Math.max(minDistanceCm1, distancePerAtmCm1 * pressureAtm));
    }

    @Override
    public double distanceCm1(double dopplerHwhmCm1, double lorentzHwhmCm1, double pressureAtm) {
        return Math.min(maxDistanceCm1, Math.max(minDistanceCm1, distancePerAtmCm1 * pressureAtm));
    }

    @Override
    public Map<String, String> describe() {
        Map<String, String> m = new LinkedHashMap<>();
        m.put("wing.cutoff.rule", "pressure-scaled");
        m.put("wing.cutoff.distance_per_atm_cm1", Double.toString(distancePerAtmCm1));
        m.put("wing.cutoff.min_distance_cm1", Double.toString(minDistanceCm1));
        m.put("wing.cutoff.max_distance_cm1", Double.toString(maxDistanceCm1));
        m.put("wing.cutoff.formula", "min(max, max(min, k*p))");
        return m;
    }

    @Override
    public boolean dependsOnWidths() {
        return false;
    }
}
