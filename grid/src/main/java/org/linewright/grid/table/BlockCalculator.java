package org.linewright.grid.table;

import java.io.IOException;
import java.util.Map;
import org.linewright.grid.wavenumber.WavenumberGrid;

/**
 * Computes σ on one block of a table's grid at one (p, T) from the lines whose centres lie in a given range — the
 * table builder's view of the cross-section calculator. An implementation must be deterministic: the same block,
 * conditions and lines give the same bits, whatever else was computed before and whatever its thread count.
 */
public interface BlockCalculator extends AutoCloseable {

    /**
     * σ on {@code blockGrid}.
     *
     * @param blockGrid      a slice of the table's grid
     * @param pressureAtm    pressure, atm
     * @param temperatureK   temperature, K
     * @param lineMinCm1     lowest line centre (unshifted) taken into account, cm⁻¹
     * @param lineMaxCm1     highest line centre (unshifted) taken into account, cm⁻¹
     */
    BlockResult compute(WavenumberGrid blockGrid, double pressureAtm, double temperatureK, double lineMinCm1,
                        double lineMaxCm1) throws IOException;

    /** Every parameter of the calculator and its engine that affects σ (for block hashes and table metadata). */
    Map<String, String> describe();

    @Override
    void close();
}
