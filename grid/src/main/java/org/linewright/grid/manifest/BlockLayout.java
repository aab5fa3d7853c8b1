package org.linewright.grid.manifest;

import org.linewright.grid.wavenumber.WavenumberGrid;

/**
 * How a table's wavenumber grid is cut into build blocks: consecutive slices of {@code blockPoints} points (the
 * last one shorter), each computed from the lines whose centres lie within {@code reachCm1} of it.
 */
public final class BlockLayout {
    private final WavenumberGrid grid;
    private final int blockPoints;
    private final double reachCm1;
    private final int blocks;

    /**
     * @param grid        the table's grid
     * @param blockPoints points per block (positive)
     * @param reachCm1    how far from its centre a line contributes, cm⁻¹ (non-negative)
     */
    public BlockLayout(WavenumberGrid grid, int blockPoints, double reachCm1) {
        if (blockPoints < 1 || !(reachCm1 >= 0)) {
            throw new IllegalArgumentException("block points " + blockPoints + ", reach " + reachCm1);
        }
        this.grid = grid;
        this.blockPoints = blockPoints;
        this.reachCm1 = reachCm1;
        this.blocks = (int) ((grid.size() + (long) blockPoints - 1) / blockPoints);
    }

    public WavenumberGrid grid() {
        return grid;
    }

    public int blockPoints() {
        return blockPoints;
    }

    public double reachCm1() {
        return reachCm1;
    }

    /** Number of blocks. */
    public int blocks() {
        return blocks;
    }

    /** First grid index of block {@code b}. */
    public int fromIndex(int b) {
        return b * blockPoints;
    }

    /** One past the last grid index of block {@code b}. */
    public int toIndex(int b) {
        return Math.min(grid.size(), (b + 1) * blockPoints);
    }

    /** The block's points as a grid (bit-identical to the table grid's). */
    public WavenumberGrid slice(int b) {
        return grid.slice(fromIndex(b), toIndex(b));
    }

    /** Lowest line centre within reach of block {@code b}, cm⁻¹. */
    public double lineMinCm1(int b) {
        return grid.pointsCm1()[fromIndex(b)] - reachCm1;
    }

    /** Highest line centre within reach of block {@code b}, cm⁻¹. */
    public double lineMaxCm1(int b) {
        return grid.pointsCm1()[toIndex(b) - 1] + reachCm1;
    }
}
