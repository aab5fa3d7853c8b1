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
