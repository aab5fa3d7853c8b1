package org.linewright.grid.ktable;

import java.util.List;
import org.linewright.ingest.InputException;
import org.linewright.ingest.registry.Isotopologue;
import org.linewright.ingest.registry.Molecule;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.text.OffendingText;

/**
 * The molar mass of a molecule in its natural isotopic mix, M̄ = Σ_i a_i M_i / Σ_i a_i over the registry's
 * isotopologues (abundance a_i, mass M_i in g/mol): the mass per molecule that turns σ per molecule (of natural
 * abundance, as line intensities scaled by abundance give) into opacity per unit mass, κ = σ N_A / M̄.
 */
public final class SpeciesMass {
    private SpeciesMass() {
    }

    /**
     * @param formulaOrId the molecule (formula such as {@code CO2}, or its id)
     * @return M̄ in g/mol
     * @throws InputException for an unknown molecule or one without abundances and masses
     */
    public static double isotopologueWeightedGPerMol(MoleculeRegistry registry, String formulaOrId) {
        Molecule m = registry.molecule(formulaOrId);
        if (m == null) {
            throw new InputException("molecule " + OffendingText.quote(formulaOrId) + " is not in the registry");
        }
        List<Isotopologue> isos = registry.isotopologues(m.id());
        double sumA = 0;
        double sumAM = 0;
        for (Isotopologue i : isos) {
            if (i.abundance() > 0 && i.massGPerMol() > 0) {
                sumA += i.abundance();
                sumAM += i.abundance() * i.massGPerMol();
            }
        }
        if (!(sumA > 0)) {
            throw new InputException("molecule " + m.formula() + ": no isotopologue with an abundance and a mass in the registry");
        }
        return sumAM / sumA;
    }

    /** The metadata text saying where M̄ came from. */
    public static String source(MoleculeRegistry registry, String formulaOrId) {
        Molecule m = registry.molecule(formulaOrId);
        return "isotopologue-weighted molar mass of " + (m == null ? formulaOrId : m.formula())
                + " (sum a_i M_i / sum a_i over the built-in registry's isotopologues)";
    }
}
