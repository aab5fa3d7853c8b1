package org.linewright.grid.engine;

import java.util.Map;
import org.linewright.grid.wavenumber.WavenumberGrid;

/**
 * An engine that sums nothing: a computation with it prepares every line (intensity, widths, thresholds) and
 * gives the counts, width sources and warnings of the lines, with σ left at zero. An incremental table build uses
 * it for the statistics of a block whose σ it updates from the changed lines alone.
 */
public final class CountOnlyEngine implements CrossSectionEngine {
    /** The engine id. */
    public static final String ID = "count-only";

    @Override
    public void begin(WavenumberGrid grid, double pressureAtm, double temperatureK) {
        // nothing to set up
    }

    @Override
    public void accumulate(LineChunk chunk, double[] sigmaCm2PerMolecule) {
        // the lines are counted by the calculator; nothing is summed
    }

    @Override
    public void finish(double[] sigmaCm2PerMolecule) {
        // nothing deferred
    }

    @Override
    public String id() {
        return ID;
    }

    @Override
    public Map<String, String> describe() {
        return Map.of("method", "none (counts only)");
    }

    @Override
    public double estimatedRelativeError() {
        return 0;
    }

    @Override
    public void close() {
        // no resources
    }
}
