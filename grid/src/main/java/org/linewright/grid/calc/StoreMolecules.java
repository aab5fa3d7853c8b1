package org.linewright.grid.calc;

import java.util.ArrayList;
import java.util.List;
import java.util.SortedSet;
import java.util.TreeSet;
import org.linewright.ingest.registry.Molecule;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.source.IsotopologueLookup;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.store.SourceInfo;

/**
 * The molecules whose lines a set of stores holds (from each store's recorded sources, no line read). σ in
 * cm²/molecule over lines of several molecules has no single "molecule" (docs/physics.md, "Per molecule of
 * what"): {@code sigma} and {@code build} ask for declared mixing ratios when this finds more than one.
 */
public final class StoreMolecules {
    private StoreMolecules() {
    }

    /** Molecule numbers of every line of the stores, ascending. */
    public static SortedSet<Integer> of(List<LineStore> stores) {
        SortedSet<Integer> molecules = new TreeSet<>();
        for (LineStore store : stores) {
            for (SourceInfo source : store.sources()) {
                for (IsotopologueLookup.Id id : source.isotopologues()) {
                    molecules.add(id.moleculeId());
                }
            }
        }
        return molecules;
    }

    /** A molecule's formula in the registry, or its number when the registry does not know it. */
    public static String name(MoleculeRegistry registry, int moleculeId) {
        Molecule m = registry.molecule(moleculeId);
        return m == null ? Integer.toString(moleculeId) : m.formula();
    }

    /** The formulas of {@code moleculeIds}, in their order. */
    public static List<String> names(MoleculeRegistry registry, Iterable<Integer> moleculeIds) {
        List<String> names = new ArrayList<>();
        for (int id : moleculeIds) {
            names.add(name(registry, id));
        }
        return names;
    }
}
