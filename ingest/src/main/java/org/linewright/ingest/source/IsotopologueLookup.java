package org.linewright.ingest.source;

import java.util.List;

/**
 * What readers need to know of isotopologues: how other formats name them, their natural abundance and
 * partition sum. Implemented by the molecule registry; readers depend only on this interface.
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

    /** Mass of the isotopologue in g/mol (numerically, in unified atomic mass units); NaN when unknown. */
    double massGPerMol(int moleculeId, int isotopologue);

    /**
     * Natural (terrestrial) abundance of the isotopologue, the weight included in the line intensities
     * of the line model; NaN when unknown.
     */
    double naturalAbundance(int moleculeId, int isotopologue);

    /**
     * Total internal partition sum Q(T) of the isotopologue (user table when supplied, else the built-in
     * value); readers need it to convert intensities given at another reference temperature. NaN when unknown.
     */
    double partitionSum(int moleculeId, int isotopologue, double temperatureK);

    /**
     * Where Q(T) of the isotopologue comes from, in words (user table, the data set's partition function, a
     * catalog's, or the built-in model with its version and method), for provenance records; empty when unknown.
     */
    default String partitionSumSource(int moleculeId, int isotopologue, double temperatureK) {
        return "";
    }

    /**
     * Warnings on Q(T) of the isotopologue, each naming the isotopologue and temperature, where the value may be
     * outside its source's stated accuracy (e.g. a modelled Q beyond its checked range); empty when there are none.
     */
    default List<String> partitionSumWarnings(int moleculeId, int isotopologue, double temperatureK) {
        return List.of();
    }
}
