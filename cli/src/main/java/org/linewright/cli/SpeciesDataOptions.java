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

    @Option(names = "--catalog-partition", paramLabel = "FILE",
            description = "Partition functions of an 80-column catalog: per line a species tag and log10 Q at "
                    + "300, 225, 150, 75, 37.5, 18.75, 9.375 K (see docs/formats-state-lists-and-catalogs.md). Used "
                    + "for the catalog's isotopologues (user --partition-sum tables and a data set's own .pf win); "
                    + "give it to ingest and to the commands that compute intensities.")
    private Path catalogPartition;

    /** The registry with the user's metadata and partition-sum tables attached. */
    /** The same data as file names, for a registry built in another process (a Spark executor). */
    public org.linewright.ingest.partition.SpeciesDataFiles files() {
        return new org.linewright.ingest.partition.SpeciesDataFiles(
                moleculeData == null ? null : moleculeData.toAbsolutePath().toString(), partitionSumSpecs,
                catalogPartition == null ? null : catalogPartition.toAbsolutePath().toString());
    }

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
        PartitionSums sums = PartitionSums.of(base).withTables(specs);
        return catalogPartition == null ? sums : sums.withCatalogFile(catalogPartition);
    }
}
