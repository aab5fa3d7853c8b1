package org.linewright.grid.plan;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;
import org.linewright.broadening.background.BackgroundGas;
import org.linewright.broadening.background.Composition;
import org.linewright.broadening.intensity.IntensityConvention;
import org.linewright.broadening.intensity.IntensityScaling;
import org.linewright.broadening.sources.WidthSource;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.wings.ChiFactorKind;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.InputException;
import org.linewright.ingest.partition.TableSpec;
import org.linewright.ingest.registry.Isotopologue;
import org.linewright.ingest.registry.Molecule;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.units.PhysicalConstants;
import org.tomlj.Toml;
import org.tomlj.TomlArray;
import org.tomlj.TomlParseError;
import org.tomlj.TomlParseResult;
import org.tomlj.TomlTable;

/**
 * Reads and validates a table plan (TOML). Every problem is one {@link InputException} line naming the plan file,
 * the key (as {@code section.key}) or the file, the offending value and what was expected. Unknown sections and
 * keys are errors (a misspelt key must not be silently ignored). The accepted keys are listed in
 * {@code docs/table-format.md}.
 */
public final class PlanReader {
    /** GHz per cm⁻¹: ν[GHz] = c[cm/s]·ν̃[cm⁻¹]·10⁻⁹. */
    private static final double GHZ_PER_CM1 = PhysicalConstants.SPEED_OF_LIGHT_CM_PER_S * 1e-9;
    /** µm·cm⁻¹: λ[µm] = 10⁴ / ν̃[cm⁻¹]. */
    private static final double UM_TIMES_CM1 = 1.0e4;

    private static final Map<String, Set<String>> KEYS = Map.of(
            "lines", Set.of("sources"),
            "grid", Set.of("wavenumber", "pressures_bar", "temperatures_K"),
            "background", Set.of(),
            "profile", Set.of("engine", "max_relative_error", "shape", "cutoff_cm1", "cutoff_hwhm_multiple",
                    "cutoff_per_atm_cm1", "remove_pedestal", "chi_factor",
                    "threshold_cm_per_molecule", "tolerance", "cutoff_hwhm", "threshold"),
            "species", Set.of("molecules", "isotopologues", "intensity_per", "abundance", "vmr"),
            "partition_sums", Set.of("tables", "molecule_data", "catalog_partition"),
            "widths", Set.of("order", "no_default_widths", "forbid_defaults"),
            "build", Set.of("block_points"),
            "output", Set.of("table", "precision"),
            // read by org.linewright.grid.ktable.KTablePlanSection after the table is built
            "ktable", Set.of("out", "resolving_power", "bin_width_cm1", "bin_edges_file", "g_points",
                    "quadrature_kind", "band_mean", "transmission_column_per_cm2", "per_unit_mass_molecule"));
    /**
     * Keys renamed to the naming convention (DEVELOPERS.md, "Naming"): the old spelling is still read, for one
     * version, with a one-line note on standard error naming the new one.
     */
    static final Map<String, String> DEPRECATED_KEYS = Map.of(
            "profile.tolerance", "profile.max_relative_error",
            "profile.cutoff_hwhm", "profile.cutoff_hwhm_multiple",
            "profile.threshold", "profile.threshold_cm_per_molecule",
            "widths.forbid_defaults", "widths.no_default_widths");
    private static final Set<String> WAVENUMBER_KEYS = Set.of("from", "to", "step", "resolving_power", "unit");

    private final Path file;
    private final TomlParseResult toml;

    private PlanReader(Path file, TomlParseResult toml) {
        this.file = file;
        this.toml = toml;
    }

    /**
     * Reads and validates a plan.
     *
     * @throws InputException one line naming the key or file at fault
     */
    public static TablePlan read(Path planFile) throws IOException {
        Path file = planFile.toAbsolutePath().normalize();
        TomlParseResult toml;
        try {
            toml = Toml.parse(file);
        } catch (NoSuchFileException e) {
            throw new InputException(planFile + ": no such plan file");
        }
        if (toml.hasErrors()) {
            TomlParseError e = toml.errors().get(0);
            throw new InputException(planFile + ":" + e.position().line() + ":" + e.position().column()
                    + ": not valid TOML: " + e.getMessage());
        }
        return new PlanReader(file, toml).plan();
    }

    /** The key to read for {@code newKey}: its deprecated spelling when only that one is given (with a note). */
    private String key(String newKey) {
        for (Map.Entry<String, String> e : DEPRECATED_KEYS.entrySet()) {
            if (e.getValue().equals(newKey) && toml.contains(e.getKey())) {
                if (toml.contains(newKey)) {
                    throw error(e.getKey(), "and " + newKey + " are both given", "only " + newKey);
                }
                System.err.println(file + ": note: plan key " + e.getKey() + " is deprecated, write " + newKey);
                return e.getKey();
            }
        }
        return newKey;
    }

    private TablePlan plan() throws IOException {
        for (String section : toml.keySet()) {
            Set<String> allowed = KEYS.get(section);
            if (allowed == null) {
                throw error(section, "unknown section", "one of " + new java.util.TreeSet<>(KEYS.keySet()));
            }
            if (!(toml.get(section) instanceof TomlTable)) {
                throw error(section, "is not a table", "a [" + section + "] section");
            }
            if (!section.equals("background")) {
                for (String key : toml.getTable(section).keySet()) {
                    if (!allowed.contains(key)) {
                        throw error(section + "." + key, "unknown key", "one of " + new java.util.TreeSet<>(allowed));
                    }
                }
            }
        }
        List<Path> sources = new ArrayList<>();
        for (String s : strings("lines.sources", true)) {
            Path p = resolve(s);
            if (!Files.exists(p)) {
                throw new InputException(file + ": lines.sources: " + p + ": no such file or folder");
            }
            sources.add(p);
        }
        if (sources.isEmpty()) {
            throw error("lines.sources", "is empty", "at least one line list or line-store folder");
        }
        WavenumberGrid grid = grid();
        double[] pressures = positiveAscending("grid.pressures_bar");
        double[] temperatures = positiveAscending("grid.temperatures_K");
        Composition composition = composition();
        TablePlan.Profile profile = profile();
        List<TableSpec> tables = new ArrayList<>();
        for (String spec : strings("partition_sums.tables", false)) {
            TableSpec t;
            try {
                t = TableSpec.parse(spec);
            } catch (InputException e) {
                throw new InputException(file + ": partition_sums.tables: " + e.getMessage());
            }
            Path p = resolve(t.file().toString());
            if (!Files.isRegularFile(p)) {
                throw new InputException(file + ": partition_sums.tables: " + p + ": no such file");
            }
            tables.add(new TableSpec(t.moleculeId(), t.isotopologue(), p));
        }
        Path moleculeData = null;
        String md = string("partition_sums.molecule_data", null);
        if (md != null) {
            moleculeData = resolve(md);
            if (!Files.isRegularFile(moleculeData)) {
                throw new InputException(file + ": partition_sums.molecule_data: " + moleculeData + ": no such file");
            }
        }
        Path catalogPartition = null;
        String cp = string("partition_sums.catalog_partition", null);
        if (cp != null) {
            catalogPartition = resolve(cp);
            if (!Files.isRegularFile(catalogPartition)) {
                throw new InputException(file + ": partition_sums.catalog_partition: " + catalogPartition
                        + ": no such file");
            }
        }
        TablePlan.Species species = species(moleculeData);
        List<String> order = strings("widths.order", false);
        for (String label : order) {
            if (WidthSource.byLabel(label) == null) {
                throw error("widths.order", "unknown width source \"" + label + "\"", "labels such as line, rule, "
                        + "table, air-proxy, default");
            }
            if (WidthSource.byLabel(label) == WidthSource.USER_CONSTANT) {
                // no plan key supplies user constants; a silent skip would hide the mistake
                throw error("widths.order", "names \"user\", whose constants only the command line supplies "
                        + "(--width-constants)", "line, rule, table, air-proxy, default");
            }
        }
        boolean forbidDefaults = bool(key("widths.no_default_widths"), false);
        long block = integer("build.block_points", Long.MIN_VALUE);
        if (block == Long.MIN_VALUE) {
            block = TablePlan.ENGINE_BLOCK_POINTS;
        } else if (block < 1 || block > Integer.MAX_VALUE) {
            throw error("build.block_points", "is " + block, "a positive whole number of grid points");
        }
        String table = string("output.table", null);
        if (table == null) {
            throw error("output.table", "is missing", "a file name ending in .arrow or .h5");
        }
        Path output = resolve(table);
        String name = output.getFileName().toString().toLowerCase(Locale.ROOT);
        if (!name.endsWith(".arrow") && !name.endsWith(".h5")) {
            throw error("output.table", "\"" + table + "\"", "a file name ending in .arrow or .h5");
        }
        String precisionText = string("output.precision", "float64");
        TablePlan.Precision precision;
        switch (precisionText) {
            case "float32" -> precision = TablePlan.Precision.FLOAT32;
            case "float64" -> precision = TablePlan.Precision.FLOAT64;
            default -> throw error("output.precision", "\"" + precisionText + "\"", "float32 or float64");
        }
        return new TablePlan(file, sources, grid, pressures, temperatures, composition, profile, species, tables,
                moleculeData, catalogPartition, new TablePlan.Widths(order, forbidDefaults), (int) block, output, precision);
    }

    private WavenumberGrid grid() {
        Object o = toml.get("grid.wavenumber");
        if (o == null) {
            throw error("grid.wavenumber", "is missing", "{ from = ..., to = ..., step = ... } or resolving_power = ...");
        }
        if (!(o instanceof TomlTable t)) {
            throw error("grid.wavenumber", "is not an inline table", "{ from = ..., to = ..., step = ... }");
        }
        for (String k : t.keySet()) {
            if (!WAVENUMBER_KEYS.contains(k)) {
                throw error("grid.wavenumber." + k, "unknown key", "one of " + new java.util.TreeSet<>(WAVENUMBER_KEYS));
            }
        }
        double from = number(t, "grid.wavenumber.from", null);
        double to = number(t, "grid.wavenumber.to", null);
        String unit = t.get("unit") == null ? "cm-1" : text(t.get("unit"), "grid.wavenumber.unit");
        boolean hasStep = t.get("step") != null;
        boolean hasPower = t.get("resolving_power") != null;
        if (hasStep == hasPower) {
            throw error("grid.wavenumber", hasStep ? "has both step and resolving_power" : "has neither step nor resolving_power",
                    "exactly one of them");
        }
        double fromCm1;
        double toCm1;
        double stepCm1 = hasStep ? number(t, "grid.wavenumber.step", null) : Double.NaN;
        switch (unit) {
            case "cm-1" -> {
                fromCm1 = from;
                toCm1 = to;
            }
            case "GHz" -> {
                fromCm1 = from / GHZ_PER_CM1;
                toCm1 = to / GHZ_PER_CM1;
                stepCm1 = stepCm1 / GHZ_PER_CM1;
            }
            case "um" -> {
                if (hasStep) {
                    throw error("grid.wavenumber.step", "given with unit = \"um\"",
                            "resolving_power (a wavelength step is not uniform in wavenumber)");
                }
                if (!(from > 0) || !(to > 0)) {
                    throw error("grid.wavenumber", "from " + from + " to " + to + " um", "positive wavelengths");
                }
                fromCm1 = UM_TIMES_CM1 / Math.max(from, to);
                toCm1 = UM_TIMES_CM1 / Math.min(from, to);
            }
            default -> throw error("grid.wavenumber.unit", "\"" + unit + "\"", "cm-1, um or GHz");
        }
        if (!(fromCm1 < toCm1) || fromCm1 < 0) {
            throw error("grid.wavenumber", "from " + from + " to " + to + " " + unit, "0 <= from < to (a non-empty range)");
        }
        try {
            return hasStep ? WavenumberGrid.uniform(fromCm1, toCm1, stepCm1)
                    : WavenumberGrid.resolvingPower(fromCm1, toCm1, number(t, "grid.wavenumber.resolving_power", null));
        } catch (InputException e) {
            throw new InputException(file + ": grid.wavenumber: " + e.getMessage());
        }
    }

    private Composition composition() {
        TomlTable t = toml.getTable("background");
        if (t == null || t.isEmpty()) {
            throw error("background", "is missing", "mole fractions such as H2 = 0.85, He = 0.15");
        }
        Map<BackgroundGas, Double> fractions = new EnumMap<>(BackgroundGas.class);
        for (String key : t.keySet()) {
            BackgroundGas gas = BackgroundGas.byName(key);
            if (gas == null) {
                StringBuilder names = new StringBuilder();
                for (BackgroundGas g : BackgroundGas.values()) {
                    names.append(names.length() == 0 ? "" : ", ").append(g.label());
                }
                throw error("background." + key, "unknown gas", "one of " + names);
            }
            if (fractions.containsKey(gas)) {
                throw error("background." + key, "gas given twice", "each gas once");
            }
            fractions.put(gas, number(t, "background." + key, null));
        }
        try {
            return Composition.of(fractions);
        } catch (InputException e) {
            throw new InputException(file + ": background: " + e.getMessage());
        }
    }

    private TablePlan.Profile profile() {
        String engine = string("profile.engine", "exact");
        if (!engine.equals("exact") && !engine.equals("fast")) {
            throw error("profile.engine", "\"" + engine + "\"", "exact or fast");
        }
        String toleranceKey = key("profile.max_relative_error");
        double tolerance = number(toml, toleranceKey, 1e-3);
        if (!(tolerance > 0 && tolerance < 1)) {
            throw error(toleranceKey, "is " + tolerance, "a relative tolerance between 0 and 1");
        }
        if (engine.equals(org.linewright.grid.engine.fast.FastEngine.ID)
                && !(tolerance >= org.linewright.grid.engine.fast.FastEngine.MIN_TOLERANCE
                && tolerance <= org.linewright.grid.engine.fast.FastEngine.MAX_TOLERANCE)) {
            // refused before any work: the fast engine cannot keep it (its round-off, or beyond its method)
            throw error(toleranceKey, "is " + tolerance, "a tolerance the fast engine can keep, in ["
                    + org.linewright.grid.engine.fast.FastEngine.MIN_TOLERANCE + ", "
                    + org.linewright.grid.engine.fast.FastEngine.MAX_TOLERANCE + "] (or the exact engine)");
        }
        LineShapeKind shape;
        String shapeText = string("profile.shape", "voigt");
        try {
            shape = LineShapeKind.parse(shapeText);
        } catch (IllegalArgumentException e) {
            throw error("profile.shape", "\"" + shapeText + "\"", "voigt, doppler, lorentz or vvw");
        }
        double cutoff = number(toml, "profile.cutoff_cm1", 25.0);
        if (!(cutoff > 0) || !Double.isFinite(cutoff)) {
            throw error("profile.cutoff_cm1", "is " + cutoff, "a positive distance in cm-1");
        }
        String hwhmKey = key("profile.cutoff_hwhm_multiple");
        double hwhm = number(toml, hwhmKey, Double.NaN);
        double perAtm = number(toml, "profile.cutoff_per_atm_cm1", Double.NaN);
        if (!Double.isNaN(hwhm) && !Double.isNaN(perAtm)) {
            throw error(hwhmKey, "and profile.cutoff_per_atm_cm1 are both given", "one cutoff rule");
        }
        if (!Double.isNaN(hwhm) && !(hwhm > 0)) {
            throw error(hwhmKey, "is " + hwhm, "a positive multiple of the line's half width");
        }
        if (!Double.isNaN(perAtm) && !(perAtm > 0)) {
            throw error("profile.cutoff_per_atm_cm1", "is " + perAtm, "a positive distance per atm in cm-1");
        }
        boolean pedestal = bool("profile.remove_pedestal", false);
        ChiFactorKind chi;
        String chiText = string("profile.chi_factor", "none");
        try {
            chi = ChiFactorKind.parse(chiText);
        } catch (IllegalArgumentException e) {
            throw error("profile.chi_factor", "\"" + chiText + "\"", "none or perrin-hartmann-co2");
        }
        String thresholdKey = key("profile.threshold_cm_per_molecule");
        double threshold = number(toml, thresholdKey, 0.0);
        if (!(threshold >= 0) || !Double.isFinite(threshold)) {
            throw error(thresholdKey, "is " + threshold, "an intensity >= 0 in cm/molecule");
        }
        return new TablePlan.Profile(engine, tolerance, shape, cutoff, hwhm, perAtm, pedestal, chi, threshold);
    }

    private TablePlan.Species species(Path moleculeData) throws IOException {
        TablePlan.Species selection = selection();
        // molecule and isotopologue names are those of the registry the build will use (built-in plus the plan's)
        MoleculeRegistry registry = MoleculeRegistry.builtIn();
        if (moleculeData != null) {
            registry = registry.withUserFile(moleculeData);
        }
        String conventionText = string("species.intensity_per", IntensityConvention.NATURAL_ABUNDANCE.label());
        IntensityConvention convention;
        try {
            convention = IntensityConvention.parse(conventionText);
        } catch (IllegalArgumentException e) {
            throw error("species.intensity_per", "\"" + conventionText + "\"", "natural-abundance or isotopologue");
        }
        boolean oneIsotopologue = selection.molecules().isEmpty() && selection.isotopologues().size() == 1;
        if (convention == IntensityConvention.ISOTOPOLOGUE && !oneIsotopologue) {
            throw error("species.intensity_per", "is \"isotopologue\" without one isotopologue selected",
                    "species.isotopologues with one MOL/ISO and no species.molecules (sigma per molecule of one "
                            + "isotopologue)");
        }
        Map<String, Double> abundances = new LinkedHashMap<>();
        TomlTable a = table("species.abundance");
        if (a != null) {
            for (String name : a.keySet()) {
                String key = "species.abundance.\"" + name + "\"";
                Isotopologue iso = registry.isotopologue(name);
                if (iso == null) {
                    throw error(key, "unknown isotopologue", "MOL/ISO of the registry, e.g. \"H2O/4\" or \"1/4\"");
                }
                Object v = a.get(List.of(name));
                if (!(v instanceof Number n) || !(n.doubleValue() > 0 && n.doubleValue() <= 1)) {
                    throw error(key, "is " + show(v), "a fraction in (0, 1]");
                }
                if (convention == IntensityConvention.ISOTOPOLOGUE) {
                    throw error(key, "is given with species.intensity_per = \"isotopologue\"",
                            "one or the other (no abundance applies per molecule of one isotopologue)");
                }
                String id = iso.moleculeId() + "/" + iso.number();
                if (abundances.containsKey(id)) {
                    throw error(key, "names isotopologue " + id + " a second time", "each isotopologue once");
                }
                abundances.put(id, n.doubleValue());
            }
        }
        List<TablePlan.Vmr> vmr = new ArrayList<>();
        TomlTable x = table("species.vmr");
        if (x != null) {
            if (x.isEmpty()) {
                throw error("species.vmr", "is empty", "a mixing ratio per molecule, e.g. { CO = 0.2, CO2 = 0.8 }");
            }
            if (!selection.all()) {
                throw error("species.vmr", "is given with species.molecules or species.isotopologues",
                        "a mixture of the declared molecules or a selection (one of the two)");
            }
            java.util.Set<Integer> seen = new java.util.HashSet<>();
            for (String name : x.keySet()) {
                String key = "species.vmr." + name;
                Molecule m = registry.molecule(name);
                if (m == null) {
                    throw error(key, "unknown molecule", "a molecule of the registry, e.g. CO or 5");
                }
                Object v = x.get(List.of(name));
                if (!(v instanceof Number n) || !(n.doubleValue() > 0) || !Double.isFinite(n.doubleValue())) {
                    throw error(key, "is " + show(v), "a positive mixing ratio");
                }
                if (!seen.add(m.id())) {
                    throw error(key, "names " + m.formula() + " a second time", "each molecule once");
                }
                vmr.add(new TablePlan.Vmr(m.id(), m.formula(), n.doubleValue()));
            }
        }
        return new TablePlan.Species(selection.molecules(), selection.isotopologues(),
                new IntensityScaling(convention, abundances), vmr);
    }

    private TomlTable table(String key) {
        Object o = toml.get(key);
        if (o == null) {
            return null;
        }
        if (!(o instanceof TomlTable t)) {
            throw error(key, "is " + show(o), "an inline table such as { KEY = VALUE, ... }");
        }
        return t;
    }

    private TablePlan.Species selection() {
        List<Integer> molecules = new ArrayList<>();
        TomlArray m = array("species.molecules");
        if (m != null) {
            for (int i = 0; i < m.size(); i++) {
                Object v = m.get(i);
                if (!(v instanceof Long l) || l < 1 || l > Integer.MAX_VALUE) {
                    throw error("species.molecules", "item " + (i + 1) + " is " + show(v), "a positive molecule number");
                }
                molecules.add(l.intValue());
            }
        }
        List<int[]> isotopologues = new ArrayList<>();
        for (String s : strings("species.isotopologues", false)) {
            int slash = s.indexOf('/');
            try {
                if (slash < 0) {
                    throw new NumberFormatException();
                }
                int mol = Integer.parseInt(s.substring(0, slash).trim());
                int iso = Integer.parseInt(s.substring(slash + 1).trim());
                if (mol < 1 || iso < 0) {
                    throw new NumberFormatException();
                }
                isotopologues.add(new int[] {mol, iso});
            } catch (NumberFormatException e) {
                throw error("species.isotopologues", "\"" + s + "\"", "MOL/ISO, e.g. \"5/1\"");
            }
        }
        return new TablePlan.Species(molecules, isotopologues);
    }

    private double[] positiveAscending(String key) {
        TomlArray a = array(key);
        if (a == null) {
            throw error(key, "is missing", "a list of positive numbers");
        }
        if (a.isEmpty()) {
            throw error(key, "is empty", "at least one positive number");
        }
        double[] v = new double[a.size()];
        for (int i = 0; i < v.length; i++) {
            Object o = a.get(i);
            if (!(o instanceof Number n)) {
                throw error(key, "item " + (i + 1) + " is " + show(o), "a positive number");
            }
            v[i] = n.doubleValue();
            if (!(v[i] > 0) || !Double.isFinite(v[i])) {
                throw error(key, "item " + (i + 1) + " is " + v[i], "a positive finite number");
            }
            if (i > 0 && !(v[i] > v[i - 1])) {
                throw error(key, "item " + (i + 1) + " (" + v[i] + ") is not above the one before",
                        "strictly ascending values");
            }
        }
        return v;
    }

    private TomlArray array(String key) {
        Object o = toml.get(key);
        if (o == null) {
            return null;
        }
        if (!(o instanceof TomlArray a)) {
            throw error(key, "is " + show(o), "a list");
        }
        return a;
    }

    private List<String> strings(String key, boolean required) {
        TomlArray a = array(key);
        if (a == null) {
            if (required) {
                throw error(key, "is missing", "a list of strings");
            }
            return List.of();
        }
        List<String> out = new ArrayList<>();
        for (int i = 0; i < a.size(); i++) {
            Object o = a.get(i);
            if (!(o instanceof String s)) {
                throw error(key, "item " + (i + 1) + " is " + show(o), "a string");
            }
            out.add(s);
        }
        return out;
    }

    private String string(String key, String defaultValue) {
        Object o = toml.get(key);
        return o == null ? defaultValue : text(o, key);
    }

    private String text(Object o, String key) {
        if (!(o instanceof String s)) {
            throw error(key, "is " + show(o), "a string");
        }
        return s;
    }

    private boolean bool(String key, boolean defaultValue) {
        Object o = toml.get(key);
        if (o == null) {
            return defaultValue;
        }
        if (!(o instanceof Boolean b)) {
            throw error(key, "is " + show(o), "true or false");
        }
        return b;
    }

    private long integer(String key, long defaultValue) {
        Object o = toml.get(key);
        if (o == null) {
            return defaultValue;
        }
        if (!(o instanceof Long l)) {
            throw error(key, "is " + show(o), "a whole number");
        }
        return l;
    }

    private double number(TomlTable table, String fullKey, Double defaultValue) {
        String local = table == toml ? fullKey : fullKey.substring(fullKey.lastIndexOf('.') + 1);
        Object o = table.get(local);
        if (o == null) {
            if (defaultValue == null) {
                throw error(fullKey, "is missing", "a number");
            }
            return defaultValue;
        }
        if (!(o instanceof Number n)) {
            throw error(fullKey, "is " + show(o), "a number");
        }
        return n.doubleValue();
    }

    private static String show(Object o) {
        if (o instanceof String s) {
            return "the string \"" + s + "\"";
        }
        if (o instanceof TomlArray) {
            return "a list";
        }
        if (o instanceof TomlTable) {
            return "a table";
        }
        return String.valueOf(o);
    }

    private Path resolve(String relative) {
        return file.getParent().resolve(relative).normalize();
    }

    private InputException error(String key, String problem, String expected) {
        return new InputException(file + ": " + key + ": " + problem + " (expected " + expected + ")");
    }
}
