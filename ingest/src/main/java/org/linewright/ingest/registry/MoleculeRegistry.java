package org.linewright.ingest.registry;

import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import org.linewright.ingest.source.IsotopologueLookup;
import org.linewright.ingest.source.LineFormatException;
import org.linewright.ingest.text.TabularDataFile;

/**
 * The molecules and isotopologues linewright knows: numbers, formulas, masses, natural abundances, Q(296 K)
 * and catalog tags, loaded from a TSV resource of our own documented format
 * ({@code org/linewright/ingest/registry/isotopologues.tsv}: comment lines, a header, a {@code #source} line
 * naming each column's source, one row per isotopologue). A user file of the same format adds isotopologues
 * or overrides rows ({@link #withUserFile(Path)}); that is how an unknown isotopologue becomes known.
 *
 * <p>Masses left as {@code -} are computed from {@link AtomicMasses} (AME2020). Immutable and thread-safe.
 *
 * <p>{@link #partitionSum} gives Q(296 K) from the table at 296 K; at other temperatures it asks the
 * {@link PartitionSumSource} attached with {@link #withPartitionSums} and is NaN when none is attached.
 */
public final class MoleculeRegistry implements IsotopologueLookup {
    static final String RESOURCE = "isotopologues.tsv";
    static final List<String> COLUMNS = List.of("molecule_id", "molecule", "molecule_name", "isotopologue", "code",
            "isotope_formula", "aliases", "abundance", "q296", "mass_g_per_mol", "catalog_tags", "provenance");
    private static final double REFERENCE_TEMPERATURE_K = 296.0;
    private static volatile MoleculeRegistry builtIn;

    private final TreeMap<Integer, Molecule> molecules;
    /** Isotopologues keyed by {@code moleculeId << 16 | number}, ascending. */
    private final TreeMap<Long, Isotopologue> isotopologues;
    private final Map<String, Isotopologue> byFormula;
    private final Map<Integer, Isotopologue> byTag;
    private final PartitionSumSource partitionSums;

    private MoleculeRegistry(TreeMap<Integer, Molecule> molecules, TreeMap<Long, Isotopologue> isotopologues,
                             PartitionSumSource partitionSums) {
        this.molecules = molecules;
        this.isotopologues = isotopologues;
        this.partitionSums = partitionSums;
        Map<String, Isotopologue> f = new HashMap<>();
        Map<Integer, Isotopologue> t = new HashMap<>();
        for (Isotopologue i : isotopologues.values()) {
            f.put(i.isotopeFormula(), i);
            for (String a : i.aliases()) {
                f.putIfAbsent(a, i);
            }
            for (int tag : i.catalogTags()) {
                t.put(tag, i);
            }
        }
        this.byFormula = f;
        this.byTag = t;
    }

    /** The built-in registry (loaded once from the resource). */
    public static MoleculeRegistry builtIn() {
        MoleculeRegistry r = builtIn;
        if (r == null) {
            try (InputStream in = MoleculeRegistry.class.getResourceAsStream(RESOURCE)) {
                if (in == null) {
                    throw new IllegalStateException("resource " + RESOURCE + " is missing from the build");
                }
                r = new MoleculeRegistry(new TreeMap<>(), new TreeMap<>(), null).merged(in, RESOURCE);
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            }
            builtIn = r;
        }
        return r;
    }

    /**
     * A registry with the rows of {@code file} (same TSV format) added; rows with the molecule id and
     * isotopologue number of an existing row replace it, and a molecule row's formula and name replace the
     * molecule's.
     *
     * @throws LineFormatException on a malformed row (file, line, column, field, text, expectation)
     */
    public MoleculeRegistry withUserFile(Path file) throws IOException {
        try (InputStream in = Files.newInputStream(file)) {
            return merged(in, file.toString());
        }
    }

    /** A registry whose {@link #partitionSum} uses {@code source} away from 296 K. */
    public MoleculeRegistry withPartitionSums(PartitionSumSource source) {
        return new MoleculeRegistry(molecules, isotopologues, source);
    }

    /** The attached partition sums, or null when none is attached. */
    public PartitionSumSource partitionSums() {
        return partitionSums;
    }

    private MoleculeRegistry merged(InputStream in, String fileName) throws IOException {
        TreeMap<Integer, Molecule> mols = new TreeMap<>(molecules);
        TreeMap<Long, Isotopologue> isos = new TreeMap<>(isotopologues);
        TabularDataFile.read(in, fileName, COLUMNS, (lineNumber, line, afterHeader) -> {
            if (line.startsWith("#source") && afterHeader && line.split("\t", -1).length != COLUMNS.size() + 1) {
                throw new LineFormatException(fileName, lineNumber, 0, 0, "#source", line,
                        "one source per column: " + COLUMNS.size() + " tab-separated entries after #source");
            }
        }, (lineNumber, line, cells) -> {
            Row row = new Row(fileName, lineNumber, line, cells);
            int moleculeId = row.integer(0);
            String formula = row.text(1);
            String name = row.text(2);
            int number = row.integer(3);
            String isotopeFormula = row.text(5);
            double mass;
            if (row.isEmpty(9)) {
                try {
                    mass = AtomicMasses.massGPerMol(isotopeFormula);
                } catch (IllegalArgumentException e) {
                    throw row.error(5, e.getMessage().replace("'", ""), "an isotope formula such as 1H2-16O");
                }
                if (Double.isNaN(mass)) {
                    throw row.error(5, isotopeFormula, "nuclides listed in AtomicMasses, or a mass in column mass_g_per_mol");
                }
            } else {
                mass = row.positive(9);
            }
            List<String> aliases = row.isEmpty(6) ? List.of() : List.of(row.text(6).split(","));
            List<Integer> tags = new ArrayList<>();
            if (!row.isEmpty(10)) {
                for (String tag : row.text(10).split(",")) {
                    try {
                        tags.add(Integer.parseInt(tag.trim()));
                    } catch (NumberFormatException e) {
                        throw row.error(10, row.text(10), "comma-separated whole numbers");
                    }
                }
            }
            Isotopologue iso = new Isotopologue(moleculeId, number, row.isEmpty(4) ? "" : row.text(4), isotopeFormula,
                    aliases, mass, row.fraction(7), row.positive(8), tags, row.isEmpty(11) ? "" : row.text(11));
            mols.put(moleculeId, new Molecule(moleculeId, formula, name));
            isos.put(key(moleculeId, number), iso);
        });
        return new MoleculeRegistry(mols, isos, partitionSums);
    }

    /** One data row, with located errors. */
    private static final class Row {
        final String file;
        final long line;
        final String text;
        final String[] cells;

        Row(String file, long line, String text, String[] cells) {
            this.file = file;
            this.line = line;
            this.text = text;
            this.cells = cells;
            if (cells.length != COLUMNS.size()) {
                throw new LineFormatException(file, line, 1, text.length(), "row", text,
                        COLUMNS.size() + " tab-separated fields, found " + cells.length);
            }
        }

        LineFormatException error(int column, String offending, String expected) {
            int start = 1;
            for (int i = 0; i < column; i++) {
                start += cells[i].length() + 1;
            }
            return new LineFormatException(file, line, start, start + Math.max(0, cells[column].length() - 1),
                    COLUMNS.get(column), offending, expected);
        }

        boolean isEmpty(int c) {
            String s = cells[c].trim();
            return s.isEmpty() || s.equals("-");
        }

        String text(int c) {
            if (isEmpty(c)) {
                throw error(c, cells[c], "a value");
            }
            return cells[c].trim();
        }

        int integer(int c) {
            try {
                int v = Integer.parseInt(cells[c].trim());
                if (v < 0) {
                    throw error(c, cells[c], "a whole number ≥ 0");
                }
                return v;
            } catch (NumberFormatException e) {
                throw error(c, cells[c], "a whole number");
            }
        }

        double positive(int c) {
            double v = number(c);
            if (!(v > 0) || Double.isInfinite(v)) {
                throw error(c, cells[c], "a positive number");
            }
            return v;
        }

        double fraction(int c) {
            double v = number(c);
            if (!(v > 0 && v <= 1)) {
                throw error(c, cells[c], "an abundance in (0, 1]");
            }
            return v;
        }

        private double number(int c) {
            try {
                return Double.parseDouble(cells[c].trim());
            } catch (NumberFormatException e) {
                throw error(c, cells[c], "a number");
            }
        }
    }

    private static long key(int moleculeId, int number) {
        return ((long) moleculeId << 16) | number;
    }

    /** All molecules, by id. */
    public List<Molecule> molecules() {
        return List.copyOf(molecules.values());
    }

    /** All isotopologues, by molecule id then number. */
    public List<Isotopologue> isotopologues() {
        return List.copyOf(isotopologues.values());
    }

    /** The isotopologues of a molecule, by number; empty when unknown. */
    public List<Isotopologue> isotopologues(int moleculeId) {
        return List.copyOf(isotopologues.subMap(key(moleculeId, 0), true, key(moleculeId, 0xffff), true).values());
    }

    /** The molecule with this id, or null. */
    public Molecule molecule(int moleculeId) {
        return molecules.get(moleculeId);
    }

    /**
     * The molecule named by its formula (case-insensitive, e.g. {@code CO}, {@code co2}) or its id
     * ({@code 5}), or null.
     */
    public Molecule molecule(String formulaOrId) {
        String s = formulaOrId.trim();
        if (!s.isEmpty() && s.chars().allMatch(Character::isDigit)) {
            try {
                return molecules.get(Integer.parseInt(s));
            } catch (NumberFormatException e) {
                return null;
            }
        }
        for (Molecule m : molecules.values()) {
            if (m.formula().equalsIgnoreCase(s)) {
                return m;
            }
        }
        return null;
    }

    /** The isotopologue, or null. */
    public Isotopologue isotopologue(int moleculeId, int number) {
        return isotopologues.get(key(moleculeId, number));
    }

    /**
     * The isotopologue named {@code MOL/ISO} (molecule id or formula, then local number, e.g. {@code 2/1},
     * {@code CO2/1}) or by isotope formula ({@code 12C-16O2}), or null.
     */
    public Isotopologue isotopologue(String spec) {
        String s = spec.trim();
        int slash = s.indexOf('/');
        if (slash > 0) {
            Molecule m = molecule(s.substring(0, slash));
            if (m == null) {
                return null;
            }
            try {
                return isotopologue(m.id(), Integer.parseInt(s.substring(slash + 1).trim()));
            } catch (NumberFormatException e) {
                return null;
            }
        }
        return byFormula.get(s);
    }

    @Override
    public Id byIsotopeFormula(String isotopeFormula) {
        Isotopologue i = byFormula.get(isotopeFormula.trim());
        return i == null ? null : new Id(i.moleculeId(), i.number());
    }

    @Override
    public Id byCatalogTag(int speciesTag) {
        Isotopologue i = byTag.get(speciesTag);
        return i == null ? null : new Id(i.moleculeId(), i.number());
    }

    @Override
    public boolean isKnown(int moleculeId, int isotopologue) {
        return isotopologues.containsKey(key(moleculeId, isotopologue));
    }

    @Override
    public double massGPerMol(int moleculeId, int isotopologue) {
        Isotopologue i = isotopologue(moleculeId, isotopologue);
        return i == null ? Double.NaN : i.massGPerMol();
    }

    @Override
    public double naturalAbundance(int moleculeId, int isotopologue) {
        Isotopologue i = isotopologue(moleculeId, isotopologue);
        return i == null ? Double.NaN : i.abundance();
    }

    /**
     * Q(T): from the attached {@link PartitionSumSource} when there is one; otherwise the tabulated Q(296 K)
     * at exactly 296 K and NaN elsewhere. NaN for an unknown isotopologue.
     */
    @Override
    public double partitionSum(int moleculeId, int isotopologue, double temperatureK) {
        Isotopologue i = isotopologue(moleculeId, isotopologue);
        if (i == null) {
            return Double.NaN;
        }
        if (partitionSums != null) {
            return partitionSums.partitionSum(i, temperatureK);
        }
        return temperatureK == REFERENCE_TEMPERATURE_K ? i.q296() : Double.NaN;
    }

    @Override
    public String partitionSumSource(int moleculeId, int isotopologue, double temperatureK) {
        Isotopologue i = isotopologue(moleculeId, isotopologue);
        if (i == null) {
            return "";
        }
        if (partitionSums != null) {
            return partitionSums.source(i, temperatureK);
        }
        return temperatureK == REFERENCE_TEMPERATURE_K ? "registry Q(296 K)" : "";
    }

    @Override
    public List<String> partitionSumWarnings(int moleculeId, int isotopologue, double temperatureK) {
        Isotopologue i = isotopologue(moleculeId, isotopologue);
        return i == null || partitionSums == null ? List.of() : partitionSums.warnings(i, temperatureK);
    }

    @Override
    public String toString() {
        return String.format(Locale.ROOT, "MoleculeRegistry[%d molecules, %d isotopologues]", molecules.size(),
                isotopologues.size());
    }

    /** Unmodifiable view for tests and listings: isotope formula and aliases to isotopologue. */
    Map<String, Isotopologue> formulas() {
        return Collections.unmodifiableMap(byFormula);
    }
}
