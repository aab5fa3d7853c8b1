package org.linewright.ingest.registry;

import java.util.List;

/**
 * An isotopologue of the registry.
 *
 * @param moleculeId the molecule number
 * @param number the local isotopologue number within the molecule (codes 0, A, B of the 160-character
 *               format are 10, 11, 12)
 * @param code the short code made of the last digits of the atoms' mass numbers, e.g. {@code 626}
 * @param isotopeFormula the formula written atom by atom with mass numbers, e.g. {@code 16O-12C-18O}
 * @param aliases other spellings of the isotope formula accepted on lookup
 * @param massGPerMol the mass in g/mol (computed from {@link AtomicMasses} unless given)
 * @param abundance the natural (terrestrial) abundance weighting the line intensities
 * @param q296 the total internal partition sum at 296 K
 * @param catalogTags species tags of the catalog format (mass number × 1000 + running number)
 * @param provenance where the abundance and Q(296 K) come from
 */
public record Isotopologue(int moleculeId, int number, String code, String isotopeFormula, List<String> aliases,
                           double massGPerMol, double abundance, double q296, List<Integer> catalogTags,
                           String provenance) {
    public Isotopologue {
        aliases = List.copyOf(aliases);
        catalogTags = List.copyOf(catalogTags);
    }

    /** {@code molecule/number}, e.g. {@code 2/1}. */
    public String key() {
        return moleculeId + "/" + number;
    }
}
