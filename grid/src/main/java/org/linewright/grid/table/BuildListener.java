package org.linewright.grid.table;

import org.linewright.ingest.pipeline.IngestListener;

/** Told how a table build goes (for progress bars). Every method has an empty default. */
public interface BuildListener extends IngestListener {
    /** Ignores everything. */
    BuildListener NONE = new BuildListener() { };

    /**
     * The lines are ingested and the blocks laid out; hashing the lines within each block's reach starts.
     *
     * @param blocks      blocks along the grid
     * @param blockPoints grid points per block
     * @param reachCm1    how far from a block its lines are taken, cm⁻¹
     */
    default void hashing(int blocks, int blockPoints, double reachCm1) {
    }

    /** After the blocks were hashed: {@code cells} (p, T, block) cells of which {@code toCompute} need computing. */
    default void planned(int cells, int toCompute, long pointsToCompute) {
    }

    /** A cell of {@code points} grid points was computed. */
    default void computed(int pressureIndex, int temperatureIndex, int block, int points) {
    }

    /** Writing the table file starts. */
    default void writing() {
    }
}
