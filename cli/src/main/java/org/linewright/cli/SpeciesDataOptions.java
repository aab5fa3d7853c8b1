package org.linewright.cli;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import org.linewright.ingest.partition.PartitionSums;
import org.linewright.ingest.partition.TableSpec;
import org.linewright.ingest.registry.MoleculeRegistry;
import picocli.CommandLine.Option;

/**
 * Options shared by every command that needs isotopologue data: the user's own isotopologue metadata (which
 * makes an unknown isotopologue known) and partition-sum tables. A picocli mixin.
 */
public final class SpeciesDataOptions {
    @Option(names = "--molecule-data", paramLabel = "FILE",
            description = "Extra or corrected isotopologue metadata (mass, abundance, Q(296 K)) in the registry's "
                    + "tab-separated format (see docs/line-store.md).")
    private Path moleculeData;

    @Option(names = "--partition-sum", paramLabel = "MOL/ISO=FILE",
            description = "Partition-sum table for one isotopologue: two columns, T in K and Q; e.g. 5/1=q-co.txt. "
                    + "When given, both Q(296 K) and Q(T) come from it. Repeatable.")
    private List<String> partitionSumSpecs = new ArrayList<>();

    /** The registry with the user's metadata and partition-sum tables attached. */
    public MoleculeRegistry registry() throws IOException {
        return partitionSums().attachedRegistry();
    }

    /** The partition sums with the user's tables (built-in values for the rest). */
    public PartitionSums partitionSums() throws IOException {
        MoleculeRegistry base = MoleculeRegistry.builtIn();
        if (moleculeData != null) {
            base = base.withUserFile(moleculeData);
        }
        List<TableSpec> specs = new ArrayList<>();
        for (String s : partitionSumSpecs) {
            specs.add(TableSpec.parse(s));
        }
        return PartitionSums.of(base).withTables(specs);
    }
}
