package org.linewright.grid.testsupport;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import org.linewright.grid.calc.CrossSectionCalculator;
import org.linewright.grid.engine.CrossSectionEngine;
import org.linewright.grid.engine.LineChunk;
import org.linewright.grid.wavenumber.WavenumberGrid;

/**
 * An engine that computes nothing: it copies each chunk of its input (what any engine reads at least once), to time
 * the calculator's own work, and with {@link #keeping()} keeps the copies to replay them into a real engine.
 */
public final class RecordingEngine implements CrossSectionEngine {
    /** The kept chunks, in order ({@link #keeping()} only). */
    public final List<LineChunk> chunks = new ArrayList<>();
    /** Lines received since {@link #begin}. */
    public long lines;
    private final boolean keep;
    private final LineChunk scratch;

    private RecordingEngine(boolean keep) {
        this.keep = keep;
        this.scratch = keep ? null : new LineChunk(CrossSectionCalculator.CHUNK_LINES);
    }

    /** Copies every chunk into one reused buffer (no allocation per chunk). */
    public static RecordingEngine copying() {
        return new RecordingEngine(false);
    }

    /** Keeps a copy of every chunk in {@link #chunks}. */
    public static RecordingEngine keeping() {
        return new RecordingEngine(true);
    }

    @Override
    public void begin(WavenumberGrid grid, double pressureAtm, double temperatureK) {
        chunks.clear();
        lines = 0;
    }

    @Override
    public void accumulate(LineChunk chunk, double[] sigmaCm2PerMolecule) {
        int n = chunk.size;
        LineChunk copy = keep ? new LineChunk(n) : scratch;
        System.arraycopy(chunk.centerCm1, 0, copy.centerCm1, 0, n);
        System.arraycopy(chunk.intensityCmPerMolecule, 0, copy.intensityCmPerMolecule, 0, n);
        System.arraycopy(chunk.dopplerHwhmCm1, 0, copy.dopplerHwhmCm1, 0, n);
        System.arraycopy(chunk.lorentzHwhmCm1, 0, copy.lorentzHwhmCm1, 0, n);
        System.arraycopy(chunk.chiFactor, 0, copy.chiFactor, 0, n);
        copy.size = n;
        if (keep) {
            chunks.add(copy);
        }
        lines += n;
    }

    @Override
    public void finish(double[] sigmaCm2PerMolecule) {
    }

    @Override
    public String id() {
        return "recorder";
    }

    @Override
    public Map<String, String> describe() {
        return Map.of();
    }

    @Override
    public double estimatedRelativeError() {
        return 0;
    }

    @Override
    public void close() {
    }
}
