package org.linewright.ingest.source;

/**
 * Maps the ways other formats name an isotopologue to the registry's (molecule, isotopologue) numbers.
 * Implemented by the molecule registry; readers depend only on this interface.
 */
public interface IsotopologueLookup {

    /** A (molecule number, local isotopologue number) pair. */
    record Id(int moleculeId, int isotopologue) { }

    /**
     * @param isotopeFormula an isotopologue written atom by atom with mass numbers, as in state-list
     *                       file names, e.g. {@code 12C-16O}, {@code 1H2-16O}, {@code 31P-1H3}
     * @return the ids, or null when unknown
     */
    Id byIsotopeFormula(String isotopeFormula);

    /**
     * @param speciesTag the catalog species tag (molecular mass number × 1000 + running number, e.g. 28001)
     * @return the ids, or null when unknown
     */
    Id byCatalogTag(int speciesTag);

    /** True when the registry knows the (molecule, isotopologue) pair (its mass, abundance, Q(296 K)). */
    boolean isKnown(int moleculeId, int isotopologue);
}
