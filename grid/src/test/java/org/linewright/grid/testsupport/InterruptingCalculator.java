package org.linewright.grid.testsupport;

import java.io.IOException;
import java.util.Map;
import org.linewright.grid.table.BlockCalculator;
import org.linewright.grid.table.BlockResult;
import org.linewright.grid.wavenumber.WavenumberGrid;

/** Passes blocks to a real calculator and fails after a number of them, as an interrupted build would stop. */
public final class InterruptingCalculator implements BlockCalculator {
    private final BlockCalculator delegate;
    private final int failAfter;
    private int computed;

    /** @param failAfter blocks computed before the simulated interruption (negative: never) */
    public InterruptingCalculator(BlockCalculator delegate, int failAfter) {
        this.delegate = delegate;
        this.failAfter = failAfter;
    }

    @Override
    public BlockResult compute(WavenumberGrid blockGrid, double pressureAtm, double temperatureK, double lineMinCm1,
                               double lineMaxCm1) throws IOException {
        if (computed == failAfter) {
            throw new IOException("simulated interruption after " + failAfter + " blocks");
        }
        computed++;
        return delegate.compute(blockGrid, pressureAtm, temperatureK, lineMinCm1, lineMaxCm1);
    }

    @Override
    public boolean keepsExactSums() {
        return delegate.keepsExactSums();
    }

    @Override
    public BlockResult computeSelected(WavenumberGrid blockGrid, double pressureAtm, double temperatureK,
                                       double lineMinCm1, double lineMaxCm1,
                                       org.linewright.grid.calc.LineFilter filter) throws IOException {
        if (computed == failAfter) {
            throw new IOException("simulated interruption after " + failAfter + " blocks");
        }
        computed++;
        return delegate.computeSelected(blockGrid, pressureAtm, temperatureK, lineMinCm1, lineMaxCm1, filter);
    }

    @Override
    public BlockResult statistics(WavenumberGrid blockGrid, double pressureAtm, double temperatureK,
                                  double lineMinCm1, double lineMaxCm1) throws IOException {
        return delegate.statistics(blockGrid, pressureAtm, temperatureK, lineMinCm1, lineMaxCm1);
    }

    @Override
    public int preferredBlockPoints(WavenumberGrid grid, double paddingCm1) {
        return delegate.preferredBlockPoints(grid, paddingCm1);
    }

    @Override
    public double maxConstantShiftCm1PerAtm() {
        return delegate.maxConstantShiftCm1PerAtm();
    }

    @Override
    public Map<String, String> describe() {
        return delegate.describe();
    }

    @Override
    public void close() {
        delegate.close();
    }
}
