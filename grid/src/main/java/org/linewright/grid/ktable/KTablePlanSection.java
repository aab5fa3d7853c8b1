package org.linewright.grid.ktable;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Optional;
import org.linewright.ingest.InputException;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.tomlj.Toml;
import org.tomlj.TomlParseResult;
import org.tomlj.TomlTable;

/**
 * The {@code [ktable]} section of a build plan: a k-table made of the plan's σ table after it is built.
 * <pre>
 * [ktable]
 * out = "co-k.h5"                       # relative to the plan's folder
 * resolving_power = 1000                # or bin_width_cm1 = 10.0, or bin_edges_file = "edges.txt"
 * g_points = 16                         # default 16
 * quadrature_kind = "gauss_legendre"    # or "split_gauss_legendre"
 * band_mean = true                      # optional
 * transmission_column_per_cm2 = 1e21    # optional
 * per_unit_mass_molecule = "CO"         # optional: cm2/g
 * </pre>
 * The plan reader checks the section's key names; this class their values.
 */
public final class KTablePlanSection {
    /**
     * What to make.
     *
     * @param out     the k-table file
     * @param request the k-table request
     */
    public record Planned(Path out, KTableRequest request) {
    }

    private KTablePlanSection() {
    }

    /** The plan's {@code [ktable]} section, or empty when it has none. */
    public static Optional<Planned> read(Path planFile) throws IOException {
        Path file = planFile.toAbsolutePath().normalize();
        TomlParseResult toml = Toml.parse(file);
        if (toml.hasErrors() || !toml.isTable("ktable")) {
            return Optional.empty(); // the plan reader reports a broken plan; no section: nothing to do
        }
        TomlTable t = toml.getTable("ktable");
        Path dir = file.getParent();
        String out = string(file, t, "out", true);
        int ways = (t.contains("resolving_power") ? 1 : 0) + (t.contains("bin_width_cm1") ? 1 : 0)
                + (t.contains("bin_edges_file") ? 1 : 0);
        if (ways != 1) {
            throw error(file, "ktable", ways + " of resolving_power, bin_width_cm1, bin_edges_file given",
                    "exactly one");
        }
        KTableRequest.Binning binning;
        if (t.contains("resolving_power")) {
            double r = number(file, t, "resolving_power");
            SpectralBins.resolvingPower(1.0, 2.0, r);
            binning = KTableRequest.Binning.resolvingPower(r);
        } else if (t.contains("bin_width_cm1")) {
            double w = number(file, t, "bin_width_cm1");
            SpectralBins.fixedWidth(1.0, 2.0, w);
            binning = KTableRequest.Binning.fixedWidth(w);
        } else {
            binning = KTableRequest.Binning.of(SpectralBins.readEdges(dir.resolve(string(file, t, "bin_edges_file", true))));
        }
        int g = t.contains("g_points") ? (int) number(file, t, "g_points") : 16;
        QuadratureKind kind = t.contains("quadrature_kind") ? QuadratureKind.parse(string(file, t, "quadrature_kind", true))
                : QuadratureKind.GAUSS_LEGENDRE;
        boolean mean = false;
        if (t.contains("band_mean")) {
            if (!(t.get("band_mean") instanceof Boolean b)) {
                throw error(file, "ktable.band_mean", "is not a boolean", "true or false");
            }
            mean = b;
        }
        double column = Double.NaN;
        if (t.contains("transmission_column_per_cm2")) {
            column = number(file, t, "transmission_column_per_cm2");
            if (!(column > 0) || Double.isInfinite(column)) {
                throw error(file, "ktable.transmission_column_per_cm2", "is " + column, "a positive number");
            }
        }
        KTableRequest request = new KTableRequest(binning, GQuadrature.of(kind, g), KSampling.INTERVAL_MEAN, column,
                mean, Double.NaN, null);
        String molecule = string(file, t, "per_unit_mass_molecule", false);
        if (molecule != null) {
            MoleculeRegistry registry = MoleculeRegistry.builtIn();
            request = request.withPerMass(SpeciesMass.isotopologueWeightedGPerMol(registry, molecule),
                    SpeciesMass.source(registry, molecule));
        }
        return Optional.of(new Planned(dir.resolve(out), request));
    }

    private static String string(Path file, TomlTable t, String key, boolean required) {
        Object v = t.get(key);
        if (v == null && !required) {
            return null;
        }
        if (!(v instanceof String s) || s.isBlank()) {
            throw error(file, "ktable." + key, v == null ? "is missing" : "is not a text", "a text");
        }
        return s;
    }

    private static double number(Path file, TomlTable t, String key) {
        Object v = t.get(key);
        if (v instanceof Long l) {
            return l;
        }
        if (v instanceof Double d) {
            return d;
        }
        throw error(file, "ktable." + key, "is not a number", "a number");
    }

    private static InputException error(Path file, String key, String problem, String expected) {
        return new InputException(file + ": " + key + ": " + problem + " (expected " + expected + ")");
    }
}
