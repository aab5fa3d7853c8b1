package org.linewright.grid.calc;

import java.io.IOException;
import org.linewright.grid.engine.LineChunk;

/**
 * The k-way merge of several stores' prepared lines into engine chunks, ascending in stored wavenumber; among
 * equal wavenumbers the earlier store wins (store order breaks ties), so the order of lines — and with it every
 * sum — is fixed by the stores alone. Consecutive lines of one store are moved with bulk copies. A full chunk goes
 * to the {@link LineRouter} and the progress listener hears of it.
 */
final class StoreMerge {
    private StoreMerge() {
    }

    /**
     * Merges every line of {@code sources} into σ.
     *
     * @param chunkLines capacity of the chunks handed to the engine
     */
    static void merge(StoreFeed[] sources, int chunkLines, LineRouter router, double[] sigma,
                      LinePreparation preparation, CrossSectionStatistics statistics, ProgressListener progress)
            throws IOException {
        LineChunk chunk = new LineChunk(chunkLines);
        double lastKey = Double.NaN;
        while (true) {
            int best = -1;
            double bestKey = 0;
            for (int i = 0; i < sources.length; i++) {
                // strictly smaller: among equal wavenumbers the earlier store wins
                if (sources[i].ensure(sources) && (best < 0 || sources[i].key() < bestKey)) {
                    best = i;
                    bestKey = sources[i].key();
                }
            }
            if (best < 0) {
                break;
            }
            double nextKey = Double.POSITIVE_INFINITY;
            int nextIndex = Integer.MAX_VALUE;
            for (int i = 0; i < sources.length; i++) {
                if (i != best && sources[i].ensure(sources) && sources[i].key() < nextKey) {
                    nextKey = sources[i].key();
                    nextIndex = i;
                }
            }
            PreparedBatch s = sources[best].current();
            boolean takeTies = best < nextIndex;
            int from = sources[best].position();
            int end = from;
            int limit = Math.min(s.count, from + chunk.capacity() - chunk.size);
            while (end < limit && (s.keyCm1[end] < nextKey || (takeTies && s.keyCm1[end] == nextKey))) {
                end++;
            }
            // a run of consecutive lines of one store: bulk copies
            int n = end - from;
            int c = chunk.size;
            System.arraycopy(s.centerCm1, from, chunk.centerCm1, c, n);
            System.arraycopy(s.usedIntensity, from, chunk.intensityCmPerMolecule, c, n);
            System.arraycopy(s.usedDoppler, from, chunk.dopplerHwhmCm1, c, n);
            System.arraycopy(s.usedLorentz, from, chunk.lorentzHwhmCm1, c, n);
            System.arraycopy(s.usedChi, from, chunk.chiFactor, c, n);
            System.arraycopy(s.usedVanVleckWeisskopf, from, chunk.vanVleckWeisskopf, c, n);
            System.arraycopy(s.usedChiExempt, from, chunk.chiExemptShare, c, n);
            chunk.size += n;
            sources[best].advanceTo(end);
            if (n > 0) {
                lastKey = s.keyCm1[end - 1];
            }
            if (chunk.size == chunk.capacity()) {
                router.feed(chunk, sigma);
                chunk.size = 0;
                progress.progress(statistics.linesRead(), fractionDone(preparation, lastKey));
            }
        }
        if (chunk.size > 0) {
            router.feed(chunk, sigma);
            chunk.size = 0;
        }
    }

    /** How far through the lines that can reach the grid a stored wavenumber is, 0..1 (for progress). */
    static double fractionDone(LinePreparation preparation, double keyCm1) {
        double lo = Math.max(preparation.queryMinCm1, preparation.gridFirstCm1);
        double hi = Math.min(preparation.queryMaxCm1, preparation.gridLastCm1);
        if (!(hi > lo)) {
            return 0.5;
        }
        return Math.min(1.0, Math.max(0.0, (keyCm1 - lo) / (hi - lo)));
    }
}
