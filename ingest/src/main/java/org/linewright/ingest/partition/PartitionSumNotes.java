package org.linewright.ingest.partition;

import org.linewright.ingest.registry.SpeciesKey;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeSet;
import org.linewright.ingest.source.IsotopologueLookup;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.store.SourceInfo;

/**
 * What the partition sums of a computation at one temperature are and assume, per isotopologue present in the
 * stores: the source of Q(T) ({@code Q(1000 K) of 12C-16O (5/1): built-in v2: ...}) and any warning that the
 * value may be outside its stated accuracy. Uses the stores' recorded partition functions as the calculator does
 * ({@link StoredPartitionFunctions#withStoredTables}).
 *
 * @param sources one line per isotopologue: where its Q(T) comes from
 * @param warnings the warnings of those values (each names the isotopologue and temperature)
 * @param metadata file metadata recording the same: {@code partition_sum.MOL/ISO} = the source of Q(T), and
 *                 {@code partition_sum_warning.N} = each warning (N from 1)
 */
public record PartitionSumNotes(List<String> sources, List<String> warnings, Map<String, String> metadata) {
    public PartitionSumNotes {
        sources = List.copyOf(sources);
        warnings = List.copyOf(warnings);
        metadata = Collections.unmodifiableMap(new LinkedHashMap<>(metadata));
    }

    /** The notes for the isotopologues of {@code stores} at {@code temperatureK}. */
    public static PartitionSumNotes of(IsotopologueLookup lookup, List<LineStore> stores, double temperatureK) {
        IsotopologueLookup withData = StoredPartitionFunctions.withStoredTables(lookup, stores);
        TreeSet<Long> ids = new TreeSet<>();
        for (LineStore store : stores) {
            for (SourceInfo s : store.sources()) {
                for (IsotopologueLookup.Id id : s.isotopologues()) {
                    ids.add(SpeciesKey.of(id.moleculeId(), id.isotopologue()));
                }
            }
        }
        List<String> sources = new ArrayList<>();
        List<String> warnings = new ArrayList<>();
        Map<String, String> metadata = new LinkedHashMap<>();
        for (long key : ids) {
            int mol = SpeciesKey.molecule(key);
            int iso = SpeciesKey.isotopologue(key);
            String source = withData.partitionSumSource(mol, iso, temperatureK);
            if (!source.isEmpty()) {
                sources.add(String.format(Locale.ROOT, "Q(%.6g K) of %d/%d: %s", temperatureK, mol, iso, source));
                metadata.put("partition_sum." + mol + "/" + iso, source);
            }
            warnings.addAll(withData.partitionSumWarnings(mol, iso, temperatureK));
        }
        for (int i = 0; i < warnings.size(); i++) {
            metadata.put("partition_sum_warning." + (i + 1), warnings.get(i));
        }
        return new PartitionSumNotes(sources, warnings, metadata);
    }
}
