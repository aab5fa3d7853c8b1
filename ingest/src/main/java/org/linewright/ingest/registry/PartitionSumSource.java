package org.linewright.ingest.registry;

import java.util.List;

/**
 * Total internal partition sums Q(T) of isotopologues, as attached to a registry with
 * {@link MoleculeRegistry#withPartitionSums(PartitionSumSource)} (implemented by
 * {@code org.linewright.ingest.partition.PartitionSums}).
 */
@FunctionalInterface
public interface PartitionSumSource {
    /** Q(T) of the isotopologue; NaN when unknown. */
    double partitionSum(Isotopologue isotopologue, double temperatureK);

    /** Where Q(T) comes from, in words; empty when unknown. */
    default String source(Isotopologue isotopologue, double temperatureK) {
        return "";
    }

    /** Warnings naming the isotopologue and temperature where Q(T) may be outside its stated accuracy. */
    default List<String> warnings(Isotopologue isotopologue, double temperatureK) {
        return List.of();
    }
}
