package org.linewright.cli;

import org.linewright.ingest.InputException;
import org.linewright.ingest.registry.Isotopologue;
import org.linewright.ingest.registry.Molecule;
import org.linewright.ingest.registry.MoleculeRegistry;
import picocli.CommandLine.Option;

/**
 * {@code --molecule} and {@code --isotopologue}, shared by the commands that select lines of one species (a picocli
 * mixin). The choice is checked against the registry in one place: an unknown molecule, an isotopologue the
 * molecule does not have, or an isotopologue without a molecule is bad input (one line, exit code 2).
 */
public final class LineSelectionOptions {
    @Option(names = "--molecule", paramLabel = "ID|FORMULA",
            description = "Only lines of this molecule: its number or formula in the registry, e.g. 5 or CO.")
    private String molecule;

    @Option(names = "--isotopologue", paramLabel = "N",
            description = "Only this isotopologue (local number) of --molecule, e.g. 1.")
    private Integer isotopologue;

    /** The selected species: molecule number and isotopologue number, 0 for "any". */
    public record Species(int moleculeId, int isotopologue) {
        /** Every line. */
        public static final Species ANY = new Species(0, 0);
    }

    /** The selection checked against {@code registry}. */
    public Species resolve(MoleculeRegistry registry) {
        if (molecule == null) {
            if (isotopologue != null) {
                throw new InputException("--isotopologue " + isotopologue + ": needs --molecule (expected e.g. "
                        + "--molecule CO2 --isotopologue 1)");
            }
            return Species.ANY;
        }
        Molecule m = registry.molecule(molecule);
        if (m == null) {
            throw new InputException("--molecule " + org.linewright.ingest.text.OffendingText.quote(molecule) + ": unknown (expected a molecule "
                    + "number or formula of the registry, e.g. 2 or CO2)");
        }
        if (isotopologue == null) {
            return new Species(m.id(), 0);
        }
        Isotopologue iso = registry.isotopologue(m.id(), isotopologue);
        if (iso == null) {
            throw new InputException("--isotopologue " + isotopologue + ": molecule " + m.formula()
                    + " has no such isotopologue in the registry (expected one of "
                    + registry.isotopologues(m.id()).stream().map(i -> Integer.toString(i.number())).toList() + ")");
        }
        return new Species(m.id(), isotopologue);
    }
}
