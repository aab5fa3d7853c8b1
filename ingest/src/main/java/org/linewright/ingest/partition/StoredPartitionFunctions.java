package org.linewright.ingest.partition;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.linewright.ingest.InputException;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.source.IsotopologueLookup;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.store.SourceInfo;

/**
 * A data set's own partition function (e.g. an ExoMol-style {@code .pf}) kept in the line store, so that the
 * intensities computed from the store use it at every temperature — the same Q(296 K) the reader converted
 * the Einstein coefficients with, and the set's Q(T) elsewhere.
 *
 * <p>Stored as two creation parameters of the source's file (schema metadata, see {@code docs/line-store.md}):
 * {@code partition_function.MOL/ISO} = {@code T:Q;T:Q;...} (every point of the table, Java's shortest
 * round-trip decimal form, so the values read back are bit-identical) and {@code partition_function_file.MOL/ISO}
 * = the file name it was read from.
 */
public final class StoredPartitionFunctions {
    /** Parameter key prefix of a stored table. */
    public static final String TABLE_KEY = "partition_function.";
    /** Parameter key prefix of a stored table's file name. */
    public static final String FILE_KEY = "partition_function_file.";

    private StoredPartitionFunctions() {
    }

    /** The creation parameters that record {@code table} for an isotopologue. */
    public static Map<String, String> parameters(int moleculeId, int isotopologue, PartitionTable table) {
        double[] t = table.temperaturesK();
        double[] q = table.partitionSums();
        StringBuilder sb = new StringBuilder(t.length * 20);
        for (int i = 0; i < t.length; i++) {
            if (i > 0) {
                sb.append(';');
            }
            sb.append(t[i]).append(':').append(q[i]);
        }
        Map<String, String> out = new LinkedHashMap<>();
        String id = moleculeId + "/" + isotopologue;
        out.put(TABLE_KEY + id, sb.toString());
        out.put(FILE_KEY + id, table.name());
        return out;
    }

    /** A stored table of one source: the isotopologue and its table. */
    public record Stored(IsotopologueLookup.Id id, PartitionTable table, String sourceName) { }

    /**
     * The tables recorded in a store's sources.
     *
     * @throws InputException when a recorded table cannot be read back
     */
    public static List<Stored> tables(LineStore store) {
        List<Stored> out = new ArrayList<>();
        for (SourceInfo s : store.sources()) {
            for (Map.Entry<String, String> e : s.creationParameters().entrySet()) {
                if (!e.getKey().startsWith(TABLE_KEY)) {
                    continue;
                }
                String id = e.getKey().substring(TABLE_KEY.length());
                String file = s.creationParameters().getOrDefault(FILE_KEY + id, s.name());
                out.add(new Stored(parseId(id, s), decode(file + " (stored with " + s.name() + ")", e.getValue(), s),
                        s.name()));
            }
        }
        return out;
    }

    /**
     * The lookup with the stores' recorded partition functions attached (origin
     * {@link PartitionSums.Origin#DATA_SET}); a user table of the same isotopologue keeps precedence. Returns
     * {@code lookup} itself when no store records a table, or when it is not a {@link MoleculeRegistry}.
     *
     * @throws InputException when two stores record different tables for one isotopologue
     */
    public static IsotopologueLookup withStoredTables(IsotopologueLookup lookup, List<LineStore> stores) {
        List<Stored> all = new ArrayList<>();
        for (LineStore store : stores) {
            all.addAll(tables(store));
        }
        if (all.isEmpty() || !(lookup instanceof MoleculeRegistry registry)) {
            return lookup;
        }
        PartitionSums sums = registry.partitionSums() instanceof PartitionSums p ? p : PartitionSums.of(registry);
        Map<IsotopologueLookup.Id, Stored> seen = new LinkedHashMap<>();
        for (Stored s : all) {
            Stored earlier = seen.putIfAbsent(s.id(), s);
            if (earlier != null && !sameTable(earlier.table(), s.table())) {
                throw new InputException("sources " + earlier.sourceName() + " and " + s.sourceName()
                        + " carry different partition functions for isotopologue " + s.id().moleculeId() + "/"
                        + s.id().isotopologue() + " (expected one: read them separately, or give one table as "
                        + s.id().moleculeId() + "/" + s.id().isotopologue() + "=FILE)");
            }
        }
        for (Stored s : seen.values()) {
            sums = sums.withDataSetTable(s.id().moleculeId(), s.id().isotopologue(), s.table());
        }
        return sums.attachedRegistry();
    }

    private static boolean sameTable(PartitionTable a, PartitionTable b) {
        return Arrays.equals(a.temperaturesK(), b.temperaturesK()) && Arrays.equals(a.partitionSums(), b.partitionSums());
    }

    private static IsotopologueLookup.Id parseId(String id, SourceInfo s) {
        int slash = id.indexOf('/');
        try {
            return new IsotopologueLookup.Id(Integer.parseInt(id.substring(0, slash)), Integer.parseInt(id.substring(slash + 1)));
        } catch (RuntimeException e) {
            throw new InputException(s.file() + ": stored partition function key '" + TABLE_KEY + id
                    + "' (expected " + TABLE_KEY + "MOL/ISO)");
        }
    }

    private static PartitionTable decode(String name, String value, SourceInfo s) {
        String[] points = value.split(";");
        double[] t = new double[points.length];
        double[] q = new double[points.length];
        try {
            for (int i = 0; i < points.length; i++) {
                int colon = points[i].indexOf(':');
                t[i] = Double.parseDouble(points[i].substring(0, colon));
                q[i] = Double.parseDouble(points[i].substring(colon + 1));
            }
            return PartitionTable.of(name, t, q);
        } catch (RuntimeException e) {
            throw new InputException(String.format(Locale.ROOT, "%s: stored partition function of %s is malformed "
                    + "(expected T:Q;T:Q;... with increasing positive T): %s", s.file(), name, e.getMessage()));
        }
    }
}
