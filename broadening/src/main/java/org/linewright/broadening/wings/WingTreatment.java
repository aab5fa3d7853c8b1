package org.linewright.broadening.wings;

import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Objects;

/**
 * How line wings are treated: a {@link WingCutoff} policy, whether the pedestal left at the cutoff is removed
 * (the profile minus its value at the cutoff, so each line goes to zero there), and an optional far-wing χ factor.
 * Immutable; {@link #atConditions} gives the per-(p, T) {@link WingKernel} that applies it to lines.
 * The default is a fixed 25 cm⁻¹ cutoff, pedestal kept, no χ factor.
 */
public final class WingTreatment {

    private final WingCutoff cutoff;
    private final boolean removePedestal;
    private final ChiFactorKind chiFactor;

    /**
     * @param cutoff         cutoff policy
     * @param removePedestal whether to subtract the profile value at the cutoff
     * @param chiFactor      far-wing χ factor choice
     */
    public WingTreatment(WingCutoff cutoff, boolean removePedestal, ChiFactorKind chiFactor) {
        this.cutoff = Objects.requireNonNull(cutoff, "cutoff");
        this.removePedestal = removePedestal;
        this.chiFactor = Objects.requireNonNull(chiFactor, "chiFactor");
    }

    /** @return fixed 25 cm⁻¹ cutoff, pedestal kept, no χ factor */
    public static WingTreatment defaults() {
        return new WingTreatment(WingCutoff.defaultCutoff(), false, ChiFactorKind.NONE);
    }

    /** @return the cutoff policy */
    public WingCutoff cutoff() {
        return cutoff;
    }

    /** @return whether the pedestal is removed */
    public boolean removePedestal() {
        return removePedestal;
    }

    /** @return the χ factor choice */
    public ChiFactorKind chiFactor() {
        return chiFactor;
    }

    /**
     * @param newCutoff the cutoff policy
     * @return a copy with that policy
     */
    public WingTreatment withCutoff(WingCutoff newCutoff) {
        return new WingTreatment(newCutoff, removePedestal, chiFactor);
    }

    /**
     * @param remove whether to remove the pedestal
     * @return a copy with that choice
     */
    public WingTreatment withPedestalRemoval(boolean remove) {
        return new WingTreatment(cutoff, remove, chiFactor);
    }

    /**
     * @param kind the χ factor choice
     * @return a copy with that choice
     */
    public WingTreatment withChiFactor(ChiFactorKind kind) {
        return new WingTreatment(cutoff, removePedestal, kind);
    }

    /**
     * Prepares the treatment for one thermodynamic condition.
     *
     * @param pressureAtm  total pressure in atm, non-negative
     * @param temperatureK temperature in K, positive
     * @return the kernel
     */
    public WingKernel atConditions(double pressureAtm, double temperatureK) {
        if (!(pressureAtm >= 0) || Double.isInfinite(pressureAtm)) {
            throw new IllegalArgumentException("pressure (atm) must be non-negative and finite, got " + pressureAtm);
        }
        Checks.positiveFinite(temperatureK, "temperature (K)");
        PerrinHartmannChi chi = chiFactor == ChiFactorKind.PERRIN_HARTMANN_CO2
                ? new PerrinHartmannChi(temperatureK) : null;
        return new WingKernel(this, pressureAtm, chi);
    }

    /** @return metadata: the cutoff's entries plus {@code wing.pedestal_removed} and {@code wing.chi} */
    public Map<String, String> describe() {
        Map<String, String> m = new LinkedHashMap<>(cutoff.describe());
        m.put("wing.pedestal_removed", Boolean.toString(removePedestal));
        m.put("wing.chi", chiFactor.label());
        return m;
    }

    @Override
    public String toString() {
        return "WingTreatment" + describe();
    }
}
