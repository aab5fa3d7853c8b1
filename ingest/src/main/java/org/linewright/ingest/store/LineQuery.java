package org.linewright.ingest.store;

import org.linewright.ingest.registry.SpeciesKey;
import java.util.Arrays;
import java.util.Collection;
import java.util.Collections;
import java.util.EnumSet;
import java.util.Set;
import org.linewright.ingest.line.LineColumn;

/**
 * What a {@link LineCursor} delivers: a closed wavenumber range, a selection of molecules and isotopologues,
 * and a column projection. Immutable; each {@code with...} method returns a new query.
 *
 * <p>Species selection: with no selection every line passes; otherwise a line passes when its molecule is one
 * of {@link #withMolecules(int...)} or its (molecule, isotopologue) pair is one of
 * {@link #withIsotopologue(int, int)}.
 *
 * <p>Projection: only the projected columns are read and written into the caller's batch (the molecule,
 * isotopologue and wavenumber columns always are); the other numeric arrays of the batch are left untouched
 * and its other text columns are left empty.
 */
public final class LineQuery {
    /**
     * The columns a cross-section engine needs: every numeric column (identity, position, intensity, lower-state
     * energy, the air, self and foreign widths with their exponents and shifts, …) but the lower-state degeneracy,
     * the upper-state energy and the position uncertainty. The one definition, used by the calculator and the
     * listings alike.
     */
    public static final Set<LineColumn> CROSS_SECTION_COLUMNS = crossSectionColumns();

    private static Set<LineColumn> crossSectionColumns() {
        EnumSet<LineColumn> set = EnumSet.noneOf(LineColumn.class);
        for (LineColumn c : LineColumn.values()) {
            if (c.kind() != LineColumn.Kind.TEXT) {
                set.add(c);
            }
        }
        set.removeAll(EnumSet.of(LineColumn.LOWER_DEGENERACY, LineColumn.UPPER_ENERGY,
                LineColumn.WAVENUMBER_UNCERTAINTY));
        return Collections.unmodifiableSet(set);
    }

    private static final LineQuery ALL = new LineQuery(Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY,
            new int[0], new long[0], EnumSet.allOf(LineColumn.class));

    private final double minWavenumberCm1;
    private final double maxWavenumberCm1;
    private final int[] molecules;
    private final long[] isotopologues;
    private final EnumSet<LineColumn> columns;

    private LineQuery(double minCm1, double maxCm1, int[] molecules, long[] isotopologues, EnumSet<LineColumn> columns) {
        this.minWavenumberCm1 = minCm1;
        this.maxWavenumberCm1 = maxCm1;
        this.molecules = molecules;
        this.isotopologues = isotopologues;
        this.columns = columns;
        columns.add(LineColumn.MOLECULE);
        columns.add(LineColumn.ISOTOPOLOGUE);
        columns.add(LineColumn.WAVENUMBER);
    }

    /** Every line, every column. */
    public static LineQuery all() {
        return ALL;
    }

    /** Lines with {@code minCm1 <= wavenumber <= maxCm1}. */
    public LineQuery withWavenumberRange(double minCm1, double maxCm1) {
        if (!(minCm1 <= maxCm1)) {
            throw new IllegalArgumentException("wavenumber range [" + minCm1 + ", " + maxCm1 + "] cm-1 is empty or NaN");
        }
        return new LineQuery(minCm1, maxCm1, molecules, isotopologues, EnumSet.copyOf(columns));
    }

    /** Adds molecules (every isotopologue) to the species selection. */
    public LineQuery withMolecules(int... moleculeIds) {
        int[] m = Arrays.copyOf(molecules, molecules.length + moleculeIds.length);
        System.arraycopy(moleculeIds, 0, m, molecules.length, moleculeIds.length);
        return new LineQuery(minWavenumberCm1, maxWavenumberCm1, m, isotopologues, EnumSet.copyOf(columns));
    }

    /** Adds one (molecule, isotopologue) pair to the species selection. */
    public LineQuery withIsotopologue(int moleculeId, int isotopologue) {
        long[] i = Arrays.copyOf(isotopologues, isotopologues.length + 1);
        i[isotopologues.length] = key(moleculeId, isotopologue);
        return new LineQuery(minWavenumberCm1, maxWavenumberCm1, molecules, i, EnumSet.copyOf(columns));
    }

    /** Projects onto these columns (plus molecule, isotopologue and wavenumber). */
    public LineQuery withColumns(Collection<LineColumn> projected) {
        return new LineQuery(minWavenumberCm1, maxWavenumberCm1, molecules, isotopologues,
                projected.isEmpty() ? EnumSet.noneOf(LineColumn.class) : EnumSet.copyOf(projected));
    }

    public double minWavenumberCm1() {
        return minWavenumberCm1;
    }

    public double maxWavenumberCm1() {
        return maxWavenumberCm1;
    }

    /** The columns read (an unmodifiable view). */
    public Set<LineColumn> columns() {
        return Collections.unmodifiableSet(columns);
    }

    /** True when a species selection is set. */
    public boolean selectsSpecies() {
        return molecules.length > 0 || isotopologues.length > 0;
    }

    /** True when a line of this molecule and isotopologue passes the species selection. */
    public boolean selects(int moleculeId, int isotopologue) {
        if (!selectsSpecies()) {
            return true;
        }
        for (int m : molecules) {
            if (m == moleculeId) {
                return true;
            }
        }
        long k = key(moleculeId, isotopologue);
        for (long i : isotopologues) {
            if (i == k) {
                return true;
            }
        }
        return false;
    }

    private static long key(int moleculeId, int isotopologue) {
        return SpeciesKey.of(moleculeId, isotopologue);
    }

    @Override
    public String toString() {
        return "LineQuery[" + minWavenumberCm1 + ".." + maxWavenumberCm1 + " cm-1, molecules=" + Arrays.toString(molecules)
                + ", isotopologues=" + isotopologues.length + ", columns=" + columns.size() + "]";
    }
}
