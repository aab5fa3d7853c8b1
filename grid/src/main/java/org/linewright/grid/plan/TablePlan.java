package org.linewright.grid.plan;

import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.linewright.broadening.background.Composition;
import org.linewright.broadening.intensity.IntensityScaling;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.wings.ChiFactorKind;
import org.linewright.broadening.wings.WingCutoff;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.partition.TableSpec;
import org.linewright.ingest.units.PhysicalConstants;

/**
 * A validated table plan: which lines, on which wavenumber grid, at which pressures and temperatures, broadened by
 * which background gases, with which line shape and engine, written where. Read from TOML by {@link PlanReader};
 * every path is absolute (resolved against the plan file's folder).
 *
 * @param planFile            the plan file (absolute)
 * @param sources             raw line lists or line-store folders, in the order given
 * @param grid                the wavenumber grid in cm⁻¹
 * @param pressuresBar        pressures, bar, ascending, all positive
 * @param temperaturesK       temperatures, K, ascending, all positive
 * @param composition         background gas mole fractions (sum 1)
 * @param profile             line shape, engine and wing options
 * @param species             molecule / isotopologue selection (empty: every line)
 * @param partitionTables     user partition-sum tables, {@code MOL/ISO=FILE} (files absolute)
 * @param moleculeDataOrNull  user isotopologue metadata file, or null
 * @param catalogPartitionOrNull partition functions of an 80-column catalog (its isotopologues' Q(T)), or null
 * @param widths              width source options
 * @param blockPoints         wavenumber points per block of the build (the unit of incremental rebuilds), or
 *                            {@link #ENGINE_BLOCK_POINTS} to let the build choose for the engine
 * @param outputTable         the table file: {@code .arrow} for Arrow IPC, {@code .h5} for HDF5
 * @param precision           σ element type in the table
 */
public record TablePlan(Path planFile, List<Path> sources, WavenumberGrid grid, double[] pressuresBar,
                        double[] temperaturesK, Composition composition, Profile profile, Species species,
                        List<TableSpec> partitionTables, Path moleculeDataOrNull, Path catalogPartitionOrNull, Widths widths, int blockPoints,
                        Path outputTable, Precision precision) {

    /** Pascal per bar (definition of the bar). */
    public static final double PA_PER_BAR = 1.0e5;

    /**
     * {@code blockPoints} when the plan sets none: the build takes the engine's preferred block length
     * ({@code CrossSectionEngine#preferredBlockPoints}).
     */
    public static final int ENGINE_BLOCK_POINTS = 0;

    public TablePlan {
        if (blockPoints < 0) {
            throw new IllegalArgumentException("block points " + blockPoints);
        }
        sources = List.copyOf(sources);
        pressuresBar = pressuresBar.clone();
        temperaturesK = temperaturesK.clone();
        partitionTables = List.copyOf(partitionTables);
    }

    /** A pressure in bar as atmospheres (the unit of line-list widths). */
    public static double barToAtm(double pressureBar) {
        return pressureBar * PA_PER_BAR / PhysicalConstants.STANDARD_ATMOSPHERE_PA;
    }

    /** Element type of σ in a written table. */
    public enum Precision {
        FLOAT32, FLOAT64;

        /** The plan / metadata spelling: {@code float32} or {@code float64}. */
        public String id() {
            return name().toLowerCase(Locale.ROOT);
        }
    }

    /**
     * Line shape and engine.
     *
     * @param engine                   engine id: {@code exact} or {@code fast}
     * @param tolerance                the fast engine's relative tolerance
     * @param shape                    the line shape
     * @param cutoffCm1                wing cutoff distance from the line centre, cm⁻¹ (also the reach of a line
     *                                 into neighbouring build blocks)
     * @param removePedestal           subtract the profile's value at the cutoff
     * @param chiFactor                sub-Lorentzian far-wing factor
     * @param thresholdCmPerMolecule   lines with S(T) below this are skipped (0: none)
     */
    public record Profile(String engine, double tolerance, LineShapeKind shape, double cutoffCm1,
                          double cutoffHwhmMultiple, double cutoffPerAtmCm1, boolean removePedestal,
                          ChiFactorKind chiFactor, double thresholdCmPerMolecule) {
        /** The wing treatment of this profile: the cutoff rule (capped at {@code cutoffCm1}), pedestal, χ. */
        public WingTreatment wings() {
            return new WingTreatment(WingCutoff.of(cutoffCm1, cutoffHwhmMultiple, cutoffPerAtmCm1), removePedestal,
                    chiFactor);
        }
    }

    /**
     * Species selection, intensity convention and mixture: lines pass when their molecule is listed or their
     * (molecule, isotopologue) pair is; with both lists empty every line passes. S(T) of every line is rescaled by
     * {@code intensityScaling} (docs/physics.md, "Per molecule of what"); with mixing ratios declared the table
     * holds σ per molecule of the mixture, Σ x_m σ_m / Σ x_m ({@code MixtureCrossSection}).
     *
     * @param molecules        molecule numbers
     * @param isotopologues    {@code {molecule, isotopologue}} pairs
     * @param intensityScaling intensity convention and user isotopologue abundances (null: natural, registry)
     * @param vmr              declared volume mixing ratios, in plan order (empty: no mixture; then only lines of
     *                         one molecule may take part)
     */
    public record Species(List<Integer> molecules, List<int[]> isotopologues, IntensityScaling intensityScaling,
                          List<Vmr> vmr) {
        public Species {
            molecules = List.copyOf(molecules);
            isotopologues = List.copyOf(isotopologues);
            intensityScaling = intensityScaling == null ? IntensityScaling.NATURAL : intensityScaling;
            vmr = vmr == null ? List.of() : List.copyOf(vmr);
        }

        /** A selection with the stored intensities unchanged and no mixture. */
        public Species(List<Integer> molecules, List<int[]> isotopologues) {
            this(molecules, isotopologues, IntensityScaling.NATURAL, List.of());
        }

        /** True when no selection is set. */
        public boolean all() {
            return molecules.isEmpty() && isotopologues.isEmpty();
        }

        /** True when mixing ratios are declared. */
        public boolean mixture() {
            return !vmr.isEmpty();
        }

        /** The declared ratios by formula, in plan order (for {@code MixtureCrossSection.metadata}). */
        public Map<String, Double> vmrByFormula() {
            Map<String, Double> m = new LinkedHashMap<>();
            for (Vmr v : vmr) {
                m.put(v.formula(), v.ratio());
            }
            return m;
        }

        /** Text form for metadata, e.g. {@code molecules=5 isotopologues=2/1}. */
        public String describe() {
            if (all()) {
                return "all";
            }
            StringBuilder b = new StringBuilder();
            for (int m : molecules) {
                b.append(b.length() == 0 ? "" : " ").append(m);
            }
            for (int[] i : isotopologues) {
                b.append(b.length() == 0 ? "" : " ").append(i[0]).append('/').append(i[1]);
            }
            return b.toString();
        }
    }

    /**
     * One declared volume mixing ratio.
     *
     * @param moleculeId molecule number
     * @param formula    its formula in the registry (for metadata and messages)
     * @param ratio      x_m, positive and finite (only the ratios' proportions matter)
     */
    public record Vmr(int moleculeId, String formula, double ratio) {
    }

    /**
     * Where Lorentz widths come from.
     *
     * @param order           width sources in order of preference (labels such as {@code line}, {@code rule},
     *                        {@code table}, {@code user}, {@code air-proxy}, {@code default}); empty: the
     *                        calculator's default order
     * @param forbidDefaults  fail instead of falling back to a default width
     */
    public record Widths(List<String> order, boolean forbidDefaults) {
        public Widths {
            order = List.copyOf(order);
        }
    }

    /** Pressures in atm, in plan order. */
    public double[] pressuresAtm() {
        double[] a = new double[pressuresBar.length];
        for (int i = 0; i < a.length; i++) {
            a[i] = barToAtm(pressuresBar[i]);
        }
        return a;
    }

    /** Folder of the plan file (paths in the plan are relative to it). */
    public Path baseDir() {
        return planFile.getParent();
    }

    /** Every parameter that affects σ, as text, for metadata and block hashes (paths excluded). */
    public Map<String, String> describe() {
        Map<String, String> m = new LinkedHashMap<>(grid.describe());
        m.put("composition", composition.toString());
        m.put("engine", profile.engine());
        m.put("tolerance", Double.toString(profile.tolerance()));
        m.put("shape", profile.shape().name().toLowerCase(Locale.ROOT));
        m.put("cutoff_cm1", Double.toString(profile.cutoffCm1()));
        m.put("remove_pedestal", Boolean.toString(profile.removePedestal()));
        m.put("chi_factor", profile.chiFactor().name().toLowerCase(Locale.ROOT));
        m.put("threshold_cm_per_molecule", Double.toString(profile.thresholdCmPerMolecule()));
        m.put("species", species.describe());
        // exact values (not the metadata's rounded ones): a change of any bit changes the cells' hashes
        m.put("intensity_per", species.intensityScaling().convention().label());
        StringBuilder abundance = new StringBuilder();
        species.intensityScaling().userAbundances().forEach((iso, a) ->
                abundance.append(abundance.length() == 0 ? "" : ";").append(iso).append('=').append(a));
        m.put("abundance", abundance.length() == 0 ? "natural" : abundance.toString());
        StringBuilder vmr = new StringBuilder();
        for (Vmr v : species.vmr()) {
            vmr.append(vmr.length() == 0 ? "" : ";").append(v.formula()).append('=').append(v.ratio());
        }
        m.put("vmr", vmr.length() == 0 ? "none" : vmr.toString());
        m.put("width_order", String.join(",", widths.order()));
        m.put("no_default_widths", Boolean.toString(widths.forbidDefaults()));
        m.put("block_points", blockPoints == ENGINE_BLOCK_POINTS ? "engine" : Integer.toString(blockPoints));
        return m;
    }
}
