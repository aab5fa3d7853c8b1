package org.linewright.ingest.partition;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
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
 */
public record PartitionSumNotes(List<String> sources, List<String> warnings) {
    public PartitionSumNotes {
        sources = List.copyOf(sources);
        warnings = List.copyOf(warnings);
    }

    /** The notes for the isotopologues of {@code stores} at {@code temperatureK}. */
    public static PartitionSumNotes of(IsotopologueLookup lookup, List<LineStore> stores, double temperatureK) {
        IsotopologueLookup withData = StoredPartitionFunctions.withStoredTables(lookup, stores);
        TreeSet<Long> ids = new TreeSet<>();
        for (LineStore store : stores) {
            for (SourceInfo s : store.sources()) {
                for (IsotopologueLookup.Id id : s.isotopologues()) {
                    ids.add(((long) id.moleculeId() << 32) | id.isotopologue());
                }
            }
        }
        List<String> sources = new ArrayList<>();
        List<String> warnings = new ArrayList<>();
        for (long key : ids) {
            int mol = (int) (key >>> 32);
            int iso = (int) key;
            String source = withData.partitionSumSource(mol, iso, temperatureK);
            if (!source.isEmpty()) {
                sources.add(String.format(Locale.ROOT, "Q(%.6g K) of %d/%d: %s", temperatureK, mol, iso, source));
            }
            warnings.addAll(withData.partitionSumWarnings(mol, iso, temperatureK));
        }
        return new PartitionSumNotes(sources, warnings);
    }
}
