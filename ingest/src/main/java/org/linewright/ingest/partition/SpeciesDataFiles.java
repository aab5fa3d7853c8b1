package org.linewright.ingest.partition;

import java.io.IOException;
import java.io.Serializable;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.linewright.ingest.registry.MoleculeRegistry;

/**
 * The user's isotopologue data as file names, so that another process (a Spark executor) can build the same
 * registry as the command line: extra isotopologue metadata, partition-sum tables ({@code MOL/ISO=FILE}) and a
 * catalog's partition functions, each optional.
 */
public record SpeciesDataFiles(String moleculeDataOrNull, List<String> partitionSumSpecs, String catalogPartitionOrNull)
        implements Serializable {
    public SpeciesDataFiles {
        partitionSumSpecs = List.copyOf(partitionSumSpecs);
    }

    /** No user data: the built-in registry and partition sums. */
    public static SpeciesDataFiles none() {
        return new SpeciesDataFiles(null, List.of(), null);
    }

    /** The partition sums with the user's tables (built-in values for the rest). */
    public PartitionSums partitionSums() throws IOException {
        MoleculeRegistry base = MoleculeRegistry.builtIn();
        if (moleculeDataOrNull != null) {
            base = base.withUserFile(Path.of(moleculeDataOrNull));
        }
        List<TableSpec> specs = new ArrayList<>();
        for (String s : partitionSumSpecs) {
            specs.add(TableSpec.parse(s));
        }
        PartitionSums sums = PartitionSums.of(base).withTables(specs);
        return catalogPartitionOrNull == null ? sums : sums.withCatalogFile(Path.of(catalogPartitionOrNull));
    }

    /** The registry with the user's data attached. */
    public MoleculeRegistry registry() throws IOException {
        return partitionSums().attachedRegistry();
    }

    /** The files named (each must be readable wherever the registry is built). */
    public List<String> files() {
        List<String> files = new ArrayList<>();
        if (moleculeDataOrNull != null) {
            files.add(moleculeDataOrNull);
        }
        for (String s : partitionSumSpecs) {
            files.add(TableSpec.parse(s).file().toString());
        }
        if (catalogPartitionOrNull != null) {
            files.add(catalogPartitionOrNull);
        }
        return files;
    }
}
