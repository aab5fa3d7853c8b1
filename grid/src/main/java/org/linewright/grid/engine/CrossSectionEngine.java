package org.linewright.grid.engine;

import java.util.Map;
import org.linewright.grid.wavenumber.WavenumberGrid;

/**
 * Turns lines into an absorption cross section σ(ν) in cm²/molecule on a wavenumber grid. The calculator feeds
 * chunks of lines in ascending wavenumber order; the engine adds each chunk's contribution to {@code sigma}.
 * Implementations use every thread they were given, splitting the work into fixed blocks combined in a fixed
 * order, so that σ is the same bit for bit whatever the thread count. One engine instance serves one
 * computation at a time.
 */
public interface CrossSectionEngine extends AutoCloseable {

    /** Called once before the first chunk of a cross section (per (p, T)). */
    void begin(WavenumberGrid grid, double pressureAtm, double temperatureK);

    /** Adds the contribution of {@code chunk}'s lines to {@code sigmaCm2PerMolecule} (length = grid size). */
    void accumulate(LineChunk chunk, double[] sigmaCm2PerMolecule);

    /** Called after the last chunk; engines that defer work (transforms) finish {@code sigma} here. */
    void finish(double[] sigmaCm2PerMolecule);

    /** Engine id as written in metadata and accepted by {@code --engine}: {@code exact} or {@code fast}. */
    String id();

    /**
     * Grid points per table block for an engine whose cost grows with points × lines in reach (direct
     * summation): small enough that a changed line recomputes little, large enough that per-block overheads
     * (reading the lines in reach, S(T), widths) stay small beside the summation.
     */
    int DIRECT_SUM_BLOCK_POINTS = 20_000;

    /**
     * Grid points per block a table builder should use with this engine when its plan sets none. A block is
     * computed alone from the lines within {@code paddingCm1} (the largest wing cutoff) of it, so an engine
     * whose work covers the block plus its padding (a transform) prefers blocks that are long beside the
     * padding. The default suits direct summation: {@value #DIRECT_SUM_BLOCK_POINTS} points, capped by the grid.
     *
     * @param grid       the table's grid
     * @param paddingCm1 how far beyond a block its lines are taken from (the largest wing cutoff), cm⁻¹
     * @return points per block, between 1 and the grid size
     */
    default int preferredBlockPoints(WavenumberGrid grid, double paddingCm1) {
        return Math.min(grid.size(), DIRECT_SUM_BLOCK_POINTS);
    }

    /**
     * Block length for an engine that convolves the block and its padding on both sides with a power-of-two FFT:
     * with P the padding on both sides in points (2·paddingCm1 over the smallest grid step), the FFT length L is
     * the smallest power of two ≥ {@code efficiencyFactor}·P and the block is B = L − P − {@value
     * #TRANSFORM_SLACK_POINTS} (room for the interpolation stencil and kernel rounding), so that every block's
     * transform is used for B / L ≥ 1 − 1/{@code efficiencyFactor} of its length. Capped by the grid size; the
     * whole grid (one block) when the padding is not finite.
     *
     * @param efficiencyFactor smallest ratio L / P (above 1)
     */
    static int transformBlockPoints(WavenumberGrid grid, double paddingCm1, double efficiencyFactor) {
        if (!(efficiencyFactor > 1)) {
            throw new IllegalArgumentException("efficiency factor " + efficiencyFactor + " (above 1 expected)");
        }
        int n = grid.size();
        if (!Double.isFinite(paddingCm1) || n < 2) {
            return n;
        }
        double[] x = grid.pointsCm1();
        double minStep = Double.POSITIVE_INFINITY;
        for (int i = 1; i < n; i++) {
            minStep = Math.min(minStep, x[i] - x[i - 1]);
        }
        // a hair below the ceiling: the grid's round-off must not add a point to a padding of whole steps
        double bothSides = Math.ceil(2 * Math.max(paddingCm1, 0) / minStep * (1 - 1e-6));
        double wanted = Math.max(efficiencyFactor * bothSides, 2.0 * TRANSFORM_SLACK_POINTS);
        if (wanted >= n) {
            return n;
        }
        long fft = Long.highestOneBit((long) Math.ceil(wanted) - 1) << 1; // smallest power of two >= wanted
        long block = fft - (long) bothSides - TRANSFORM_SLACK_POINTS;
        return (int) Math.max(1, Math.min(n, block));
    }

    /** Points kept free in a transform block beyond the padding (stencil and kernel rounding of a transform engine). */
    int TRANSFORM_SLACK_POINTS = 64;

    /** Every parameter that affects the result, for output metadata. */
    Map<String, String> describe();

    /**
     * The engine's own estimate of its largest relative error over points where σ ≥ 10⁻⁶·max σ for the last
     * computation; 0 for reference engines that are exact to the profile accuracy.
     */
    double estimatedRelativeError();

    @Override
    void close();
}
