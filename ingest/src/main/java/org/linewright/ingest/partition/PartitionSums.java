package org.linewright.ingest.partition;

import org.linewright.ingest.registry.SpeciesKey;
import java.io.IOException;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import org.linewright.ingest.InputException;
import org.linewright.ingest.registry.Isotopologue;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.registry.PartitionSumSource;
import org.linewright.ingest.source.IsotopologueLookup;

/**
 * Total internal partition sums Q(T) per isotopologue, each value with where it came from
 * ({@link Value#origin()}, {@link Value#source()}) and what it assumed ({@link Value#warnings()}).
 *
 * <p>Order of precedence, per isotopologue:
 * <ol>
 *   <li>{@link Origin#TABLE}: a user table ({@link #withTable}); both Q(296 K) and Q(T) come from it
 *       (interpolated; outside its range an {@link InputException}).</li>
 *   <li>{@link Origin#DATA_SET}: the partition function shipped with the lines (an ExoMol-style set's
 *       {@code .pf}, recorded in the line store at ingest; {@link #withDataSetTable}).</li>
 *   <li>{@link Origin#CATALOG}: a catalog's partition function given by the user ({@link CatalogPartitionFile},
 *       {@link #withCatalogTable}).</li>
 *   <li>{@link Origin#REGISTRY_296}: at exactly 296 K, the registry's tabulated Q(296 K).</li>
 *   <li>{@link Origin#BUILT_IN}: elsewhere, Q(T) = Q(296 K) · Q_model(T)/Q_model(296 K) with the isotopologue's
 *       own constants ({@link BuiltInPartitionSums}: direct level sums for diatomics, semiclassical rotor ×
 *       oscillator sums for polyatomics); a warning names the isotopologue and temperature where the model may
 *       be outside its stated accuracy (0.5 % for diatomics to 3000 K, 1 % for polyatomics to 1000 K).</li>
 * </ol>
 * A data-set or catalog table asked outside its range is extended with the built-in model's ratio from its
 * nearest end, with a warning. {@link Origin#RRHO_SCALED} is kept for callers of the earlier API; no value has
 * it any more. Immutable and thread-safe.
 */
public final class PartitionSums implements PartitionSumSource {
    /** Where a value came from. */
    public enum Origin {
        /** A user table. */
        TABLE,
        /** The registry's tabulated Q(296 K), at 296 K. */
        REGISTRY_296,
        /** No longer produced (the earlier rigid-rotor scaling with the parent's constants); see BUILT_IN. */
        RRHO_SCALED,
        /** The partition function of the line data's own set (ExoMol-style {@code .pf}). */
        DATA_SET,
        /** A catalog's partition function. */
        CATALOG,
        /** The built-in model times the registry's Q(296 K). */
        BUILT_IN
    }

    /**
     * A partition sum with its provenance.
     *
     * @param q Q(T)
     * @param origin the kind of source
     * @param source the source in words: file name, or the model with its version and method
     * @param warnings where the value may be outside the stated accuracy (isotopologue and temperature named);
     *                 empty when it is within it
     */
    public record Value(double q, Origin origin, String source, List<String> warnings) {
        public Value {
            Objects.requireNonNull(origin, "origin");
            source = source == null ? "" : source;
            warnings = List.copyOf(warnings);
        }

        /** A value without source text or warnings (the earlier two-field form). */
        public Value(double q, Origin origin) {
            this(q, origin, "", List.of());
        }

        /** True when nothing is known to put the value outside its source's stated accuracy. */
        public boolean withinStatedAccuracy() {
            return warnings.isEmpty();
        }
    }

    private static final double REFERENCE_TEMPERATURE_K = BuiltInPartitionSums.REFERENCE_TEMPERATURE_K;

    private record Table(PartitionTable table, Origin origin) { }

    private final MoleculeRegistry registry;
    private final Map<Long, Table> tables;
    private final BuiltInPartitionSums builtIn;

    private PartitionSums(MoleculeRegistry registry, Map<Long, Table> tables, BuiltInPartitionSums builtIn) {
        this.registry = registry;
        this.tables = tables;
        this.builtIn = builtIn;
    }

    /** Built-in partition sums for the registry's isotopologues. */
    public static PartitionSums of(MoleculeRegistry registry) {
        return new PartitionSums(Objects.requireNonNull(registry, "registry"), Map.of(), new BuiltInPartitionSums());
    }

    /** The registry these partition sums are for. */
    public MoleculeRegistry registry() {
        return registry;
    }

    /** Adds (or replaces) the user table of one isotopologue; it overrides data-set and catalog tables. */
    public PartitionSums withTable(int moleculeId, int isotopologue, PartitionTable table) {
        return with(moleculeId, isotopologue, new Table(table, Origin.TABLE));
    }

    /**
     * Adds the partition function that came with the lines of an isotopologue (an ExoMol-style {@code .pf});
     * a user table of the same isotopologue keeps precedence.
     */
    public PartitionSums withDataSetTable(int moleculeId, int isotopologue, PartitionTable table) {
        Table t = tables.get(key(moleculeId, isotopologue));
        if (t != null && t.origin() == Origin.TABLE) {
            return this;
        }
        return with(moleculeId, isotopologue, new Table(table, Origin.DATA_SET));
    }

    /** Adds a catalog's partition function of an isotopologue; user and data-set tables keep precedence. */
    public PartitionSums withCatalogTable(int moleculeId, int isotopologue, PartitionTable table) {
        Table t = tables.get(key(moleculeId, isotopologue));
        if (t != null && t.origin() != Origin.CATALOG) {
            return this;
        }
        return with(moleculeId, isotopologue, new Table(table, Origin.CATALOG));
    }

    private PartitionSums with(int moleculeId, int isotopologue, Table table) {
        Map<Long, Table> t = new HashMap<>(tables);
        t.put(key(moleculeId, isotopologue), table);
        return new PartitionSums(registry, Map.copyOf(t), builtIn);
    }

    /** Adds the tables named by {@code MOL/ISO=FILE} specifications, reading each file. */
    public PartitionSums withTables(List<TableSpec> specs) throws IOException {
        PartitionSums out = this;
        for (TableSpec s : specs) {
            out = out.withTable(s.moleculeId(), s.isotopologue(), PartitionTable.read(s.file()));
        }
        return out;
    }

    /**
     * Adds the catalog partition functions of a {@link CatalogPartitionFile} for every species tag the registry
     * knows ({@code byCatalogTag}); tags of species the registry does not know are not used.
     */
    public PartitionSums withCatalogFile(Path file) throws IOException {
        PartitionSums out = this;
        for (Map.Entry<Integer, PartitionTable> e : CatalogPartitionFile.read(file).entrySet()) {
            IsotopologueLookup.Id id = registry.byCatalogTag(e.getKey());
            if (id != null) {
                out = out.withCatalogTable(id.moleculeId(), id.isotopologue(), e.getValue());
            }
        }
        return out;
    }

    /** The registry with these partition sums attached (what readers take as their isotopologue lookup). */
    public MoleculeRegistry attachedRegistry() {
        return registry.withPartitionSums(this);
    }

    /**
     * Q(T) of an isotopologue with its provenance.
     *
     * @throws InputException for an isotopologue neither tabulated nor known to the registry, a temperature
     *                        outside a user table, or a molecule without built-in constants away from 296 K
     */
    public Value value(int moleculeId, int isotopologue, double temperatureK) {
        Table table = tables.get(key(moleculeId, isotopologue));
        if (table != null) {
            PartitionTable t = table.table();
            if (table.origin() == Origin.TABLE
                    || (temperatureK >= t.minTemperatureK() && temperatureK <= t.maxTemperatureK())) {
                return new Value(t.value(temperatureK), table.origin(), describe(table), List.of());
            }
        }
        Isotopologue iso = registry.isotopologue(moleculeId, isotopologue);
        if (iso == null) {
            throw new InputException("isotopologue " + moleculeId + "/" + isotopologue
                    + " is unknown: add it with a registry file or give its partition table as "
                    + moleculeId + "/" + isotopologue + "=FILE");
        }
        if (table != null) {
            return extended(table, iso, temperatureK);
        }
        if (temperatureK == REFERENCE_TEMPERATURE_K) {
            return new Value(iso.q296(), Origin.REGISTRY_296, "registry Q(296 K)"
                    + (iso.provenance().isEmpty() ? "" : " (" + iso.provenance() + ")"), List.of());
        }
        BuiltInPartitionSums.Estimate e = estimate(iso, temperatureK);
        return new Value(iso.q296() * e.ratio(), Origin.BUILT_IN, e.method(), e.warnings());
    }

    /** The warnings of {@link #value}: empty when Q(T) is within its source's stated accuracy. */
    public List<String> warnings(int moleculeId, int isotopologue, double temperatureK) {
        return value(moleculeId, isotopologue, temperatureK).warnings();
    }

    private BuiltInPartitionSums.Estimate estimate(Isotopologue iso, double temperatureK) {
        if (!(temperatureK > 0) || Double.isInfinite(temperatureK)) {
            throw new InputException("partition sum of " + iso.key() + " asked at " + temperatureK
                    + " K (expected a positive finite temperature)");
        }
        BuiltInPartitionSums.Estimate e = builtIn.estimate(iso, temperatureK);
        if (e == null) {
            throw new InputException("isotopologue " + iso.key() + ": no partition sum at " + temperatureK
                    + " K (only Q(296 K) is built in for this molecule; give a table as " + iso.key() + "=FILE)");
        }
        return e;
    }

    /** A data-set or catalog table beyond its range: its end value times the built-in model's ratio. */
    private Value extended(Table table, Isotopologue iso, double temperatureK) {
        PartitionTable t = table.table();
        double end = temperatureK < t.minTemperatureK() ? t.minTemperatureK() : t.maxTemperatureK();
        BuiltInPartitionSums.Estimate atT = estimate(iso, temperatureK);
        BuiltInPartitionSums.Estimate atEnd = estimate(iso, end);
        List<String> warnings = new java.util.ArrayList<>(atT.warnings());
        warnings.add(0, "Q(" + temperatureK + " K) of " + iso.isotopeFormula() + " (" + iso.key() + "): " + t.name()
                + " covers " + t.minTemperatureK() + "–" + t.maxTemperatureK() + " K; extended from " + end
                + " K with the built-in model's ratio");
        return new Value(t.value(end) * atT.ratio() / atEnd.ratio(), table.origin(),
                describe(table) + ", extended by " + atT.method(), warnings);
    }

    private static String describe(Table table) {
        return switch (table.origin()) {
            case TABLE -> "user table " + table.table().name();
            case DATA_SET -> "partition function of the data set: " + table.table().name();
            case CATALOG -> "catalog partition function: " + table.table().name();
            default -> table.table().name();
        };
    }

    /** Q(T) of an isotopologue (see {@link #value}). */
    public double partitionSum(int moleculeId, int isotopologue, double temperatureK) {
        return value(moleculeId, isotopologue, temperatureK).q();
    }

    /** Q(T); NaN when the isotopologue has neither a table nor built-in values. */
    @Override
    public double partitionSum(Isotopologue isotopologue, double temperatureK) {
        int m = isotopologue.moleculeId();
        int i = isotopologue.number();
        Table table = tables.get(key(m, i));
        boolean inTable = table != null && (table.origin() == Origin.TABLE
                || (temperatureK >= table.table().minTemperatureK() && temperatureK <= table.table().maxTemperatureK()));
        if (!inTable && temperatureK != REFERENCE_TEMPERATURE_K
                && builtIn.estimate(isotopologue, REFERENCE_TEMPERATURE_K) == null) {
            return Double.NaN;
        }
        return value(m, i, temperatureK).q();
    }

    /** {@link Value#source()} of {@link #value}; empty when there is no value. */
    @Override
    public String source(Isotopologue isotopologue, double temperatureK) {
        try {
            return value(isotopologue.moleculeId(), isotopologue.number(), temperatureK).source();
        } catch (InputException e) {
            return "";
        }
    }

    /** {@link Value#warnings()} of {@link #value}; the reason as the one warning when there is no value. */
    @Override
    public List<String> warnings(Isotopologue isotopologue, double temperatureK) {
        try {
            return value(isotopologue.moleculeId(), isotopologue.number(), temperatureK).warnings();
        } catch (InputException e) {
            return List.of(e.getMessage());
        }
    }

    /** True when the isotopologue has a user table. */
    public boolean hasTable(int moleculeId, int isotopologue) {
        Table t = tables.get(key(moleculeId, isotopologue));
        return t != null && t.origin() == Origin.TABLE;
    }

    /** The origin of the table attached to an isotopologue, or null when it has none. */
    public Origin tableOrigin(int moleculeId, int isotopologue) {
        Table t = tables.get(key(moleculeId, isotopologue));
        return t == null ? null : t.origin();
    }

    private static long key(int moleculeId, int isotopologue) {
        return SpeciesKey.of(moleculeId, isotopologue);
    }
}
