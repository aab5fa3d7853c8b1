package org.linewright.grid.table;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;

/**
 * What a table build did (or, for a dry run, would do).
 *
 * @param table             the table file (not written by a dry run)
 * @param dryRun            true when nothing was computed or written
 * @param cells             (p, T, block) cells of the table
 * @param computed          cells computed now (dry run: that would be)
 * @param reused            cells taken from the work folder
 * @param pending           the cells computed (dry run: to compute), as (p, T, ν range) descriptions
 * @param linesInStores     lines of the stores used
 * @param linesUsed         lines used, summed over the cells computed or reused
 * @param counts            named counts summed over the cells (width sources per gas ...)
 * @param estimatedRelativeError the largest engine error estimate of the cells
 * @param warnings          the calculator's warnings, each once
 * @param written           the file and σ checksums (null for a dry run)
 * @param ingested          raw line lists ingested into the cache by this build
 * @param seconds           wall time
 */
public record BuildReport(Path table, boolean dryRun, int cells, int computed, int reused, List<String> pending,
                          long linesInStores, long linesUsed, Map<String, Long> counts,
                          double estimatedRelativeError, List<String> warnings, TableWriter.Written written, int ingested, double seconds) {
    public BuildReport {
        pending = List.copyOf(pending);
        counts = Map.copyOf(counts);
        warnings = List.copyOf(warnings);
    }
}
