package org.linewright.grid.table;

import java.util.Map;
import java.util.TreeMap;

/**
 * σ of one block at one (p, T) with the counts worth keeping for the table's summary and metadata.
 *
 * @param sigmaCm2PerMolecule     σ at each point of the block, cm²/molecule
 * @param linesUsed               lines that contributed
 * @param linesBelowThreshold     lines skipped by the intensity threshold
 * @param counts                  further counts by name (e.g. width sources per gas: {@code width.H2.line})
 * @param estimatedRelativeError  the engine's error estimate for this block
 * @param warnings                things the user should know (default widths, under-resolved lines ...)
 * @param exactSumsOrNull         the exact per-point sums σ was rounded from (exact engine), from which changed
 *                                lines can be taken out and added; null when the engine keeps none
 */
public record BlockResult(double[] sigmaCm2PerMolecule, long linesUsed, long linesBelowThreshold,
                          Map<String, Long> counts, double estimatedRelativeError, java.util.List<String> warnings,
                          org.linewright.grid.engine.exact.FixedPointSums exactSumsOrNull) {
    public BlockResult {
        counts = java.util.Collections.unmodifiableMap(new TreeMap<>(counts));
        warnings = java.util.List.copyOf(warnings);
    }

    /** A result without exact sums. */
    public BlockResult(double[] sigmaCm2PerMolecule, long linesUsed, long linesBelowThreshold,
                       Map<String, Long> counts, double estimatedRelativeError, java.util.List<String> warnings) {
        this(sigmaCm2PerMolecule, linesUsed, linesBelowThreshold, counts, estimatedRelativeError, warnings, null);
    }
}
