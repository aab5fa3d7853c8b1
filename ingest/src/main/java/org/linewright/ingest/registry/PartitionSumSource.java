package org.linewright.ingest.registry;

/**
 * Total internal partition sums Q(T) of isotopologues, as attached to a registry with
 * {@link MoleculeRegistry#withPartitionSums(PartitionSumSource)} (implemented by
 * {@code org.linewright.ingest.partition.PartitionSums}).
 */
@FunctionalInterface
public interface PartitionSumSource {
    /** Q(T) of the isotopologue; NaN when unknown. */
    double partitionSum(Isotopologue isotopologue, double temperatureK);
}
