package org.linewright.ingest.partition;

import java.io.IOException;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import org.linewright.ingest.InputException;
import org.linewright.ingest.registry.Isotopologue;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.registry.PartitionSumSource;

/**
 * Total internal partition sums Q(T) per isotopologue, from a user table when one is supplied, else built in.
 *
 * <ul>
 *   <li>{@link Origin#TABLE}: the isotopologue has a user table ({@link PartitionTable}, e.g. an ExoMol
 *       {@code .pf} file); both Q(296 K) and Q(T) come from it (interpolated; out of range is an error).</li>
 *   <li>{@link Origin#REGISTRY_296}: T is 296 K: the registry's tabulated Q(296 K).</li>
 *   <li>{@link Origin#RRHO_SCALED}: other temperatures: Q(T) = Q(296 K) · Q_RRHO(T) / Q_RRHO(296 K), the
 *       registry's Q(296 K) scaled by the rigid-rotor / harmonic-oscillator model
 *       ({@link RigidRotorHarmonicOscillator}) with the constants of the molecule's main isotopologue
 *       ({@link MolecularConstants}). An approximation: it neglects anharmonicity, centrifugal distortion and
 *       rotation–vibration coupling (a few % at 1000 K and above; more for the minor, e.g. deuterated,
 *       isotopologues whose vibrational wavenumbers differ from the main one's). Callers can warn on it.</li>
 * </ul>
 * Immutable and thread-safe.
 */
public final class PartitionSums implements PartitionSumSource {
    /** Where a value came from. */
    public enum Origin { TABLE, REGISTRY_296, RRHO_SCALED }

    /** A partition sum and its origin. */
    public record Value(double q, Origin origin) { }

    private static final double REFERENCE_TEMPERATURE_K = 296.0;

    private final MoleculeRegistry registry;
    private final Map<Long, PartitionTable> tables;

    private PartitionSums(MoleculeRegistry registry, Map<Long, PartitionTable> tables) {
        this.registry = registry;
        this.tables = tables;
    }

    /** Built-in partition sums for the registry's isotopologues. */
    public static PartitionSums of(MoleculeRegistry registry) {
        return new PartitionSums(Objects.requireNonNull(registry, "registry"), Map.of());
    }

    /** Adds (or replaces) the table of one isotopologue. */
    public PartitionSums withTable(int moleculeId, int isotopologue, PartitionTable table) {
        Map<Long, PartitionTable> t = new HashMap<>(tables);
        t.put(key(moleculeId, isotopologue), table);
        return new PartitionSums(registry, Map.copyOf(t));
    }

    /** Adds the tables named by {@code MOL/ISO=FILE} specifications, reading each file. */
    public PartitionSums withTables(List<TableSpec> specs) throws IOException {
        PartitionSums out = this;
        for (TableSpec s : specs) {
            out = out.withTable(s.moleculeId(), s.isotopologue(), PartitionTable.read(s.file()));
        }
        return out;
    }

    /** The registry with these partition sums attached (what readers take as their isotopologue lookup). */
    public MoleculeRegistry attachedRegistry() {
        return registry.withPartitionSums(this);
    }

    /**
     * Q(T) of an isotopologue with its origin.
     *
     * @throws InputException for an isotopologue neither tabulated by the user nor known to the registry,
     *                        or a temperature outside a user table
     */
    public Value value(int moleculeId, int isotopologue, double temperatureK) {
        PartitionTable table = tables.get(key(moleculeId, isotopologue));
        if (table != null) {
            return new Value(table.value(temperatureK), Origin.TABLE);
        }
        Isotopologue iso = registry.isotopologue(moleculeId, isotopologue);
        if (iso == null) {
            throw new InputException("isotopologue " + moleculeId + "/" + isotopologue
                    + " is unknown: add it with a registry file or give its partition table as "
                    + moleculeId + "/" + isotopologue + "=FILE");
        }
        if (temperatureK == REFERENCE_TEMPERATURE_K) {
            return new Value(iso.q296(), Origin.REGISTRY_296);
        }
        MolecularConstants c = MolecularConstants.forMolecule(moleculeId);
        if (c == null) {
            throw new InputException("isotopologue " + moleculeId + "/" + isotopologue + ": no partition sum at "
                    + temperatureK + " K (only Q(296 K) is built in for this molecule; give a table as "
                    + moleculeId + "/" + isotopologue + "=FILE)");
        }
        double ratio = RigidRotorHarmonicOscillator.partitionSum(c, temperatureK)
                / RigidRotorHarmonicOscillator.partitionSum(c, REFERENCE_TEMPERATURE_K);
        return new Value(iso.q296() * ratio, Origin.RRHO_SCALED);
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
        if (!tables.containsKey(key(m, i)) && temperatureK != REFERENCE_TEMPERATURE_K
                && MolecularConstants.forMolecule(m) == null) {
            return Double.NaN;
        }
        return value(m, i, temperatureK).q();
    }

    /** True when the isotopologue has a user table. */
    public boolean hasTable(int moleculeId, int isotopologue) {
        return tables.containsKey(key(moleculeId, isotopologue));
    }

    private static long key(int moleculeId, int isotopologue) {
        return ((long) moleculeId << 32) | (isotopologue & 0xffffffffL);
    }
}
