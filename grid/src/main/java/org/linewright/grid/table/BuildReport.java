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
                          double estimatedRelativeError, List<String> warnings, TableWriter.Written written, int ingested,
                          double seconds, Incremental incremental) {
    public BuildReport {
        pending = List.copyOf(pending);
        counts = Map.copyOf(counts);
        warnings = List.copyOf(warnings);
    }

    /** A report without an incremental part. */
    public BuildReport(Path table, boolean dryRun, int cells, int computed, int reused, List<String> pending,
                       long linesInStores, long linesUsed, Map<String, Long> counts, double estimatedRelativeError,
                       List<String> warnings, TableWriter.Written written, int ingested, double seconds) {
        this(table, dryRun, cells, computed, reused, pending, linesInStores, linesUsed, counts, estimatedRelativeError,
                warnings, written, ingested, seconds, Incremental.NONE);
    }

    /**
     * How the computed cells were (or, in a dry run, would be) obtained against the previous build.
     *
     * @param mode               why cells are or are not updated from changed lines (one line, for the summary)
     * @param linesRemoved       lines of the previous version not in the current one (0 when not compared)
     * @param linesAdded         lines of the current version not in the previous one
     * @param cellsUpdated       computed cells updated from the changed lines alone
     * @param cellsRecomputed    computed cells summed afresh over all their lines
     * @param relativeCost       the computed cells' profile evaluations (line × reached point) relative to a
     *                           build from scratch, counted as lines within reach (changed lines for updated cells)
     */
    public record Incremental(String mode, long linesRemoved, long linesAdded, int cellsUpdated, int cellsRecomputed,
                              double relativeCost) {
        /** No comparison with a previous build. */
        public static final Incremental NONE = new Incremental("", 0, 0, 0, 0, Double.NaN);
    }
}
