package org.linewright.reference.compare;

import java.util.Collections;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;

import org.linewright.ingest.line.LineColumn;

/**
 * What changed between two line lists.
 *
 * @param oldName      the old list as given
 * @param newName      the new list as given
 * @param options      how lines were paired
 * @param oldLines     lines in the old list
 * @param newLines     lines in the new list
 * @param unchanged    paired lines with no field changed
 * @param changed      paired lines with at least one field changed
 * @param added        lines only in the new list
 * @param removed      lines only in the old list
 * @param fields       per changed field: how many lines and the largest change, in column order
 * @param bands        per band (species and global quanta pair): the counts, by molecule, isotopologue, labels
 * @param changes      the changes listed one by one, by wavenumber (at most {@link CompareOptions#maxListedChanges()})
 */
public record ComparisonReport(String oldName, String newName, CompareOptions options, long oldLines, long newLines,
                               long unchanged, long changed, long added, long removed,
                               Map<LineColumn, FieldSummary> fields, List<BandSummary> bands,
                               List<LineChange> changes) {
    public ComparisonReport {
        EnumMap<LineColumn, FieldSummary> f = new EnumMap<>(LineColumn.class);
        f.putAll(fields);
        fields = Collections.unmodifiableMap(f);
        bands = List.copyOf(bands);
        changes = List.copyOf(changes);
    }

    /** True when nothing was added, removed or changed. */
    public boolean identical() {
        return changed == 0 && added == 0 && removed == 0;
    }

    /** Changes counted but not listed. */
    public long changesNotListed() {
        return changed + added + removed - changes.size();
    }

    /**
     * How one field changed over all changed lines.
     *
     * @param lines               lines in which it changed
     * @param maxAbsoluteChange   largest |new − old| (NaN for text fields)
     * @param maxRelativeChange   largest |new − old|/|old| (NaN for text fields)
     * @param atWavenumberCm1     position of the line with the largest absolute change
     */
    public record FieldSummary(long lines, double maxAbsoluteChange, double maxRelativeChange, double atWavenumberCm1) {
    }

    /**
     * The changes within one band.
     *
     * @param moleculeId        molecule number
     * @param isotopologue      isotopologue number
     * @param upperGlobal       upper global quanta, trimmed with blanks collapsed
     * @param lowerGlobal       lower global quanta, trimmed with blanks collapsed
     * @param added             lines added
     * @param removed           lines removed
     * @param changed           lines changed
     * @param minWavenumberCm1  lowest position of a change
     * @param maxWavenumberCm1  highest position of a change
     */
    public record BandSummary(int moleculeId, int isotopologue, String upperGlobal, String lowerGlobal, long added,
                              long removed, long changed, double minWavenumberCm1, double maxWavenumberCm1) {
    }
}
