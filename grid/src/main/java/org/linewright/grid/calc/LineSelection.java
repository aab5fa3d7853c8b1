package org.linewright.grid.calc;

import java.util.Arrays;
import org.linewright.ingest.store.LineQuery;

/**
 * Which species take part in a cross section: whole molecules and single (molecule, isotopologue) pairs. A line
 * is selected when its molecule is listed or its pair is listed; with neither list given every line is.
 *
 * @param moleculeIds    molecule numbers selected with all their isotopologues
 * @param isotopologues  selected pairs, each {@code {moleculeId, isotopologue}}
 */
public record LineSelection(int[] moleculeIds, int[][] isotopologues) {

    /** Every line of the stores. */
    public static final LineSelection ALL = new LineSelection(new int[0], new int[0][]);

    public LineSelection {
        moleculeIds = moleculeIds.clone();
        isotopologues = Arrays.stream(isotopologues).map(p -> {
            if (p.length != 2) {
                throw new IllegalArgumentException("an isotopologue selection is {moleculeId, isotopologue}, got "
                        + Arrays.toString(p));
            }
            return p.clone();
        }).toArray(int[][]::new);
    }

    /** Lines of these molecules (all isotopologues). */
    public static LineSelection molecules(int... moleculeIds) {
        return new LineSelection(moleculeIds, new int[0][]);
    }

    /** Lines of one isotopologue. */
    public static LineSelection isotopologue(int moleculeId, int isotopologue) {
        return new LineSelection(new int[0], new int[][] {{moleculeId, isotopologue}});
    }

    /** True when every line is selected. */
    public boolean selectsAll() {
        return moleculeIds.length == 0 && isotopologues.length == 0;
    }

    /** The store query restricted to this selection. */
    public LineQuery applyTo(LineQuery query) {
        LineQuery q = moleculeIds.length > 0 ? query.withMolecules(moleculeIds) : query;
        for (int[] pair : isotopologues) {
            q = q.withIsotopologue(pair[0], pair[1]);
        }
        return q;
    }

    /** For metadata: {@code all}, or e.g. {@code molecules=2 isotopologues=1/1}. */
    public String describe() {
        if (selectsAll()) {
            return "all";
        }
        StringBuilder sb = new StringBuilder();
        if (moleculeIds.length > 0) {
            sb.append("molecules=");
            for (int i = 0; i < moleculeIds.length; i++) {
                sb.append(i == 0 ? "" : ",").append(moleculeIds[i]);
            }
        }
        if (isotopologues.length > 0) {
            sb.append(sb.length() == 0 ? "" : " ").append("isotopologues=");
            for (int i = 0; i < isotopologues.length; i++) {
                sb.append(i == 0 ? "" : ",").append(isotopologues[i][0]).append('/').append(isotopologues[i][1]);
            }
        }
        return sb.toString();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof LineSelection s && Arrays.equals(moleculeIds, s.moleculeIds)
                && Arrays.deepEquals(isotopologues, s.isotopologues);
    }

    @Override
    public int hashCode() {
        return 31 * Arrays.hashCode(moleculeIds) + Arrays.deepHashCode(isotopologues);
    }

    @Override
    public String toString() {
        return "LineSelection[" + describe() + "]";
    }
}
