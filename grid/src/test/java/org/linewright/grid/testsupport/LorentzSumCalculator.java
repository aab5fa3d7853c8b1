package org.linewright.grid.testsupport;

import java.io.IOException;
import java.util.List;
import java.util.Map;
import org.linewright.broadening.voigt.LorentzProfile;
import org.linewright.grid.table.BlockCalculator;
import org.linewright.grid.table.BlockResult;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.store.LineCursor;
import org.linewright.ingest.store.LineQuery;
import org.linewright.ingest.store.LineStore;

/**
 * A plain block calculator for testing the builder's bookkeeping on its own: σ = Σ S·L(ν − ν₀; γ_air·p) with the
 * line-list intensity at 296 K and a fixed cutoff, read straight from the stores for the given line range. It
 * answers the builder's contract (deterministic, depends only on the lines in range) without the engines.
 * Optionally fails after a number of blocks, to simulate an interrupted build.
 */
public final class LorentzSumCalculator implements BlockCalculator {
    private final List<LineStore> stores;
    private final double cutoffCm1;
    private final int failAfter;
    private int computed;

    public LorentzSumCalculator(List<LineStore> stores, double cutoffCm1, int failAfter) {
        this.stores = stores;
        this.cutoffCm1 = cutoffCm1;
        this.failAfter = failAfter;
    }

    /** Blocks computed so far. */
    public int computed() {
        return computed;
    }

    @Override
    public BlockResult compute(WavenumberGrid blockGrid, double pressureAtm, double temperatureK, double lineMinCm1,
                               double lineMaxCm1) throws IOException {
        if (computed == failAfter) {
            throw new IOException("simulated interruption after " + failAfter + " blocks");
        }
        double[] nu = blockGrid.pointsCm1();
        double[] sigma = new double[nu.length];
        long used = 0;
        LineBatch batch = new LineBatch(4096);
        for (LineStore store : stores) {
            try (LineCursor c = store.cursor(LineQuery.all().withWavenumberRange(lineMinCm1, lineMaxCm1)
                    .withColumns(LineQuery.CROSS_SECTION_COLUMNS))) {
                while (c.read(batch)) {
                    for (int i = 0; i < batch.size; i++) {
                        double centre = batch.wavenumberCm1[i];
                        double gamma = batch.airWidthCm1PerAtm[i] * pressureAtm * Math.sqrt(296.0 / temperatureK);
                        for (int k = 0; k < nu.length; k++) {
                            double d = nu[k] - centre;
                            if (Math.abs(d) <= cutoffCm1) {
                                sigma[k] += batch.intensityCmPerMolecule[i] * LorentzProfile.value(d, gamma);
                            }
                        }
                        used++;
                    }
                }
            }
        }
        computed++;
        return new BlockResult(sigma, used, 0, Map.of("width.air.line", used), 0.0, List.of());
    }

    @Override
    public Map<String, String> describe() {
        return Map.of("calculator", "lorentz-sum-test", "cutoff_cm1", Double.toString(cutoffCm1), "threads", "1");
    }

    @Override
    public void close() {
    }
}
