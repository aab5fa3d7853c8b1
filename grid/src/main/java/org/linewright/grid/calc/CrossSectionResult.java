package org.linewright.grid.calc;

import java.util.List;
import java.util.Map;
import org.linewright.broadening.sources.WidthSourceTally;

/**
 * A computed cross section with its statistics.
 *
 * @param sigmaCm2PerMolecule      σ in cm²/molecule, one value per grid point
 * @param linesUsed                lines that reached the engine
 * @param linesBelowThreshold      lines left out by the intensity threshold (or without a usable intensity)
 * @param droppedIntensityFraction Σ S(T) of the lines left out / Σ S(T) of all lines read for the range
 * @param sumIntensityCmPerMolecule Σ S(T) of the lines used, cm/molecule
 * @param widthSources             which source gave each gas's width, over the lines read
 * @param estimatedRelativeError   the engine's estimate of its largest relative error (0 for the exact engine)
 * @param metadata                 every parameter of the computation (engine, grid, wings, shape, threshold,
 *                                 composition, p, T, tool version, ...), insertion-ordered
 * @param seconds                  wall time of the computation
 * @param wingLossFraction         Σ S·(area fraction removed by cutoff, pedestal and χ) / Σ S over the lines
 *                                 used: on an infinitely fine, wide enough grid ∫σ dν = (1 − this)·Σ S
 * @param warnings                 things the user should know (under-resolved lines, default widths, ...)
 */
public record CrossSectionResult(double[] sigmaCm2PerMolecule, long linesUsed, long linesBelowThreshold,
                                 double droppedIntensityFraction, double sumIntensityCmPerMolecule,
                                 WidthSourceTally widthSources, double estimatedRelativeError,
                                 Map<String, String> metadata, double seconds, double wingLossFraction,
                                 List<String> warnings) {

    public CrossSectionResult {
        metadata = java.util.Collections.unmodifiableMap(new java.util.LinkedHashMap<>(metadata));
        warnings = List.copyOf(warnings);
    }
}
