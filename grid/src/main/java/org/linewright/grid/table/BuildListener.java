package org.linewright.grid.table;

import org.linewright.ingest.pipeline.IngestListener;

/** Told how a table build goes (for progress bars). Every method has an empty default. */
public interface BuildListener extends IngestListener {
    /** Ignores everything. */
    BuildListener NONE = new BuildListener() { };

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
