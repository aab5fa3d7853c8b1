package org.linewright.broadening.wings;

import java.util.Map;

/**
 * Policy giving the distance from the line centre beyond which a line's profile is not evaluated (a symmetric
 * cutoff, cm⁻¹). Implementations are immutable and thread-safe; {@link #describe()} gives a flat string map for
 * output metadata.
 */
public interface WingCutoff {

    /** Conventional default cutoff distance, 25 cm⁻¹ (common practice for line-by-line cross sections). */
    double DEFAULT_DISTANCE_CM1 = 25.0;

    /**
     * Cutoff distance for one line.
     *
     * @param dopplerHwhmCm1 the line's Doppler HWHM αD in cm⁻¹
     * @param lorentzHwhmCm1 the line's Lorentz HWHM γL in cm⁻¹
     * @param pressureAtm    total pressure in atm
     * @return distance in cm⁻¹, positive; {@link Double#POSITIVE_INFINITY} for no cutoff
     */
    double distanceCm1(double dopplerHwhmCm1, double lorentzHwhmCm1, double pressureAtm);

    /**
     * The largest distance this policy gives any line at one pressure: what a caller needs to know how far a line
     * can reach without asking for each line's widths.
     *
     * @param pressureAtm total pressure in atm
     * @return the bound in cm⁻¹; {@link Double#POSITIVE_INFINITY} when the policy has none
     */
    double maxDistanceCm1(double pressureAtm);

    /** @return metadata describing this policy (keys {@code wing.cutoff.rule} and rule parameters) */
    Map<String, String> describe();

    /**
     * Whether the distance depends on the line's widths (then two lines at one (p, T) may have different cutoffs).
     * Engines that share one kernel across lines need to know.
     *
     * @return true unless the policy gives every line at one pressure the same distance
     */
    default boolean dependsOnWidths() {
        return true;
    }

    /** @return the default policy: a fixed 25 cm⁻¹ cutoff */
    static WingCutoff defaultCutoff() {
        return fixed(DEFAULT_DISTANCE_CM1);
    }

    /**
     * @param distanceCm1 fixed cutoff distance, positive
     * @return the policy
     */
    static WingCutoff fixed(double distanceCm1) {
        return new FixedCutoff(distanceCm1);
    }

    /**
     * @param multiple       cutoff as this multiple of the line's Voigt HWHM (Olivero–Longbothum), positive
     * @param maxDistanceCm1 upper bound of the distance, positive (may be infinite)
     * @return the policy
     */
    static WingCutoff hwhmMultiple(double multiple, double maxDistanceCm1) {
        return new HwhmMultipleCutoff(multiple, maxDistanceCm1);
    }

    /**
     * @param distancePerAtmCm1 distance per unit pressure k in cm⁻¹/atm, positive
     * @param minDistanceCm1    lower bound, positive
     * @param maxDistanceCm1    upper bound, at least the lower bound
     * @return the policy d = min(max, max(min, k·p))
     */
    static WingCutoff pressureScaled(double distancePerAtmCm1, double minDistanceCm1, double maxDistanceCm1) {
        return new PressureScaledCutoff(distancePerAtmCm1, minDistanceCm1, maxDistanceCm1);
    }

    /** Lower bound of the pressure-scaled rule chosen by {@link #of}, cm⁻¹. */
    double PRESSURE_RULE_MIN_CM1 = 1.0;

    /**
     * The cutoff a user describes with a cap and at most one rule: a multiple of each line's Voigt HWHM, or a
     * distance per atm of pressure (bounded below by {@link #PRESSURE_RULE_MIN_CM1}), both capped; with neither,
     * the cap itself as a fixed distance.
     *
     * @param capCm1            the fixed distance, or the cap of a rule; positive
     * @param hwhmMultipleOrNaN the HWHM multiple, or NaN for none
     * @param perAtmCm1OrNaN    the distance per atm, or NaN for none
     * @throws org.linewright.ingest.InputException for a non-positive value or two rules at once
     */
    static WingCutoff of(double capCm1, double hwhmMultipleOrNaN, double perAtmCm1OrNaN) {
        if (!(capCm1 > 0)) {
            throw new org.linewright.ingest.InputException("cutoff: " + capCm1 + " (expected a positive distance in cm-1)");
        }
        boolean hwhm = !Double.isNaN(hwhmMultipleOrNaN);
        boolean perAtm = !Double.isNaN(perAtmCm1OrNaN);
        if (hwhm && perAtm) {
            throw new org.linewright.ingest.InputException(
                    "cutoff: a HWHM multiple and a distance per atm given together (expected one rule)");
        }
        if (hwhm) {
            if (!(hwhmMultipleOrNaN > 0)) {
                throw new org.linewright.ingest.InputException("cutoff HWHM multiple: " + hwhmMultipleOrNaN
                        + " (expected a positive number)");
            }
            return hwhmMultiple(hwhmMultipleOrNaN, capCm1);
        }
        if (perAtm) {
            if (!(perAtmCm1OrNaN > 0)) {
                throw new org.linewright.ingest.InputException("cutoff per atm: " + perAtmCm1OrNaN
                        + " (expected a positive cm-1 per atm)");
            }
            return pressureScaled(perAtmCm1OrNaN, Math.min(PRESSURE_RULE_MIN_CM1, capCm1), capCm1);
        }
        return fixed(capCm1);
    }

    /** @return the policy without cutoff (the whole grid) */
    static WingCutoff none() {
        return NoCutoff.INSTANCE;
    }
}
