package org.linewright.reference.compare;

import java.util.List;

/**
 * A line added, removed or changed between two lists.
 *
 * @param kind             what happened
 * @param matchedBy        how a changed line was paired (null for added and removed lines)
 * @param moleculeId       molecule number
 * @param isotopologue     isotopologue number
 * @param oldWavenumberCm1 position in the old list (NaN when added)
 * @param newWavenumberCm1 position in the new list (NaN when removed)
 * @param oldSourceLine    record number in the old source (0 when added)
 * @param newSourceLine    record number in the new source (0 when removed)
 * @param upperGlobal      upper global quanta (of the new line when there is one)
 * @param lowerGlobal      lower global quanta
 * @param upperLocal       upper local quanta
 * @param lowerLocal       lower local quanta
 * @param fields           the fields that differ (empty for added and removed lines)
 */
public record LineChange(Kind kind, MatchedBy matchedBy, int moleculeId, int isotopologue, double oldWavenumberCm1,
                         double newWavenumberCm1, long oldSourceLine, long newSourceLine, String upperGlobal,
                         String lowerGlobal, String upperLocal, String lowerLocal, List<FieldChange> fields) {
    public LineChange {
        fields = List.copyOf(fields);
    }

    /** What happened to a line. */
    public enum Kind { ADDED, REMOVED, CHANGED }

    /** How two lines were paired. */
    public enum MatchedBy {
        /** Same species and identical quantum labels. */
        QUANTA,
        /** Same species, nearest position within the tolerance (labels differ). */
        NEAREST
    }

    /** The position to sort and summarise by: the new one, else the old one. */
    public double wavenumberCm1() {
        return Double.isNaN(newWavenumberCm1) ? oldWavenumberCm1 : newWavenumberCm1;
    }
}
