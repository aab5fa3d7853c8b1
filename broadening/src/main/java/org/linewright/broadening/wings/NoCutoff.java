package org.linewright.broadening.wings;

import java.util.Map;

/** No cutoff: every line is evaluated over the whole grid. */
public final class NoCutoff implements WingCutoff {

    /** The single instance. */
    public static final NoCutoff INSTANCE = new NoCutoff();

    private NoCutoff() {
    }

    @Override
    public double maxDistanceCm1(double pressureAtm) {
        return Double.POSITIVE_INFINITY;
    }

    @Override
    public double distanceCm1(double dopplerHwhmCm1, double lorentzHwhmCm1, double pressureAtm) {
        return Double.POSITIVE_INFINITY;
    }

    @Override
    public Map<String, String> describe() {
        return Map.of("wing.cutoff.rule", "none");
    }

    @Override
    public String toString() {
        return "NoCutoff";
    }

    @Override
    public boolean dependsOnWidths() {
        return false;
    }
}
