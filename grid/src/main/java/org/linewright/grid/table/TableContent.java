package org.linewright.grid.table;

import java.util.LinkedHashMap;
import java.util.Map;
import org.linewright.grid.plan.TablePlan;

/**
 * What a table writer writes: the three axes, σ per (p, T), the element type of σ and the provenance metadata
 * (keys without prefix; the Arrow writer adds {@code linewright.}, HDF5 stores them as root attributes).
 *
 * @param wavenumberCm1  the wavenumber axis, cm⁻¹, ascending
 * @param pressureBar    the pressure axis, bar, ascending
 * @param temperatureK   the temperature axis, K, ascending
 * @param sigma          σ per (p, T)
 * @param precision      σ element type
 * @param metadata       provenance, in the order to write
 */
public record TableContent(double[] wavenumberCm1, double[] pressureBar, double[] temperatureK, SigmaSource sigma,
                           TablePlan.Precision precision, Map<String, String> metadata) {
    public TableContent {
        metadata = java.util.Collections.unmodifiableMap(new LinkedHashMap<>(metadata));
    }
}
