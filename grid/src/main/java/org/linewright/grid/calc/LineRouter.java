package org.linewright.grid.calc;

import org.linewright.grid.engine.CrossSectionEngine;
import org.linewright.grid.engine.LineChunk;
import org.linewright.grid.engine.exact.ExactEngine;

/**
 * Hands the merged chunks of one computation to its engine. An engine other than the exact one does not evaluate
 * the Van Vleck–Weisskopf shape, nor χ on part of a line's width: those lines are moved (in order) to a chunk of
 * their own and summed directly by an {@link ExactEngine} into the same σ; the rest keep their order for the
 * engine. The side engine is made when first needed and closed with {@link #close}.
 */
final class LineRouter implements AutoCloseable {
    private final CrossSectionEngine engine;
    private final CrossSectionRequest request;
    private final int threads;
    /** Direct summation of the lines the engine does not evaluate; made when needed. */
    private ExactEngine sideEngine;
    private LineChunk sideChunk;

    /**
     * @param engine  the computation's engine, already begun on the request's grid and conditions
     * @param threads threads of the side engine
     */
    LineRouter(CrossSectionEngine engine, CrossSectionRequest request, int threads) {
        this.engine = engine;
        this.request = request;
        this.threads = threads;
    }

    /** Adds a chunk's lines to σ (the chunk's contents may be reordered). */
    void feed(LineChunk chunk, double[] sigma) {
        if (engine instanceof ExactEngine) {
            engine.accumulate(chunk, sigma);
            return;
        }
        int n = chunk.size;
        int flagged = 0;
        for (int i = 0; i < n; i++) {
            if (direct(chunk, i)) {
                flagged++;
            }
        }
        if (flagged == 0) {
            engine.accumulate(chunk, sigma);
            return;
        }
        if (sideEngine == null) {
            sideEngine = new ExactEngine(threads, request.wings());
            sideEngine.begin(request.grid(), request.pressureAtm(), request.temperatureK());
            sideChunk = new LineChunk(chunk.capacity());
        }
        LineChunk side = sideChunk;
        side.size = 0;
        int kept = 0;
        for (int i = 0; i < n; i++) {
            if (direct(chunk, i)) {
                copyRow(chunk, i, side, side.size++);
            } else {
                copyRow(chunk, i, chunk, kept++);
            }
        }
        chunk.size = kept;
        if (kept > 0) {
            engine.accumulate(chunk, sigma);
        }
        sideEngine.accumulate(side, sigma);
        side.size = 0;
    }

    /** True when some lines were summed by the side engine. */
    boolean usedSideEngine() {
        return sideEngine != null;
    }

    /** Finishes the side engine's part of σ (the computation's engine is finished by its owner). */
    void finish(double[] sigma) {
        if (sideEngine != null) {
            sideEngine.finish(sigma);
        }
    }

    @Override
    public void close() {
        if (sideEngine != null) {
            sideEngine.close();
        }
    }

    /** Lines only the exact engine evaluates: the Van Vleck–Weisskopf shape, χ on part of the width. */
    private static boolean direct(LineChunk chunk, int i) {
        return chunk.vanVleckWeisskopf[i] || (chunk.chiFactor[i] && chunk.chiExemptShare[i] > 0);
    }

    private static void copyRow(LineChunk from, int i, LineChunk to, int j) {
        to.centerCm1[j] = from.centerCm1[i];
        to.intensityCmPerMolecule[j] = from.intensityCmPerMolecule[i];
        to.dopplerHwhmCm1[j] = from.dopplerHwhmCm1[i];
        to.lorentzHwhmCm1[j] = from.lorentzHwhmCm1[i];
        to.chiFactor[j] = from.chiFactor[i];
        to.vanVleckWeisskopf[j] = from.vanVleckWeisskopf[i];
        to.chiExemptShare[j] = from.chiExemptShare[i];
    }
}
