package org.linewright.grid.table;

import java.io.IOException;
import java.util.Map;
import org.linewright.grid.calc.CrossSectionCalculator;
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

    /**
     * Whether {@link #compute} gives exact sums ({@link BlockResult#exactSumsOrNull}), so that a block can be
     * updated from changed lines alone ({@link #computeSelected}, {@link #statistics}).
     */
    default boolean keepsExactSums() {
        return false;
    }

    /**
     * As {@link #compute}, over only the lines {@code filter} takes, with exact sums (for {@link #keepsExactSums}
     * calculators).
     */
    default BlockResult computeSelected(WavenumberGrid blockGrid, double pressureAtm, double temperatureK,
                                        double lineMinCm1, double lineMaxCm1,
                                        org.linewright.grid.calc.LineFilter filter) throws IOException {
        throw new UnsupportedOperationException("this calculator keeps no exact sums");
    }

    /** The counts and warnings {@link #compute} would give, without σ (an empty array), for {@link #keepsExactSums}. */
    default BlockResult statistics(WavenumberGrid blockGrid, double pressureAtm, double temperatureK,
                                   double lineMinCm1, double lineMaxCm1) throws IOException {
        throw new UnsupportedOperationException("this calculator keeps no exact sums");
    }

    /**
     * Grid points per block when the plan sets none (see {@link
     * org.linewright.grid.engine.CrossSectionEngine#preferredBlockPoints}); by default that of direct summation.
     *
     * @param grid       the table's grid
     * @param paddingCm1 the largest wing cutoff, cm⁻¹
     */
    default int preferredBlockPoints(WavenumberGrid grid, double paddingCm1) {
        return Math.min(grid.size(), org.linewright.grid.engine.CrossSectionEngine.DIRECT_SUM_BLOCK_POINTS);
    }

    /**
     * The largest |δ| (cm⁻¹/atm) that a constant of the calculator's width options (user constants, defaults)
     * can give a line of the background, as opposed to the shift columns of the lines themselves. The table
     * builder adds the lines' own shifts and bounds a line's reach with both. By default the calculator's own
     * read margin, {@link CrossSectionCalculator#SHIFT_MARGIN_CM1_PER_ATM}, which bounds every calculator that
     * reads its lines through {@link CrossSectionCalculator}.
     */
    default double maxConstantShiftCm1PerAtm() {
        return CrossSectionCalculator.SHIFT_MARGIN_CM1_PER_ATM;
    }

    /** Every parameter of the calculator and its engine that affects σ (for block hashes and table metadata). */
    Map<String, String> describe();

    @Override
    void close();
}
