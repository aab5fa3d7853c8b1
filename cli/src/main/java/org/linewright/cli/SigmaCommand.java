package org.linewright.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;
import org.linewright.broadening.background.Composition;
import org.linewright.broadening.intensity.IntensityScaling;
import org.linewright.broadening.sources.WidthOptions;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.cli.plot.CrossSectionPlot;
import org.linewright.cli.plot.PlotStyle;
import org.linewright.cli.progress.Progress;
import org.linewright.cli.units.Pressure;
import org.linewright.cli.units.QuantityParser;
import org.linewright.cli.units.Temperature;
import org.linewright.grid.calc.CrossSectionCalculator;
import org.linewright.grid.calc.CrossSectionRequest;
import org.linewright.grid.calc.CrossSectionResult;
import org.linewright.grid.calc.LineSelection;
import org.linewright.grid.calc.MixtureCrossSection;
import org.linewright.grid.calc.StoreMolecules;
import org.linewright.grid.engine.CrossSectionEngine;
import org.linewright.grid.engine.EngineFactory;
import org.linewright.grid.output.CrossSectionFiles;
import org.linewright.grid.output.CrossSectionFormat;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.InputException;
import org.linewright.ingest.partition.PartitionSumNotes;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.store.LineStore;
import picocli.CommandLine.ArgGroup;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Spec;

/** {@code linewright sigma}: one absorption cross section σ(ν) at one (p, T) from line stores. */
@Command(name = "sigma",
        mixinStandardHelpOptions = true,
        description = {
            "Compute one absorption cross section (cm^2/molecule over wavenumber) at one temperature and pressure "
                    + "from line stores, with Voigt profiles broadened by the given background gas, and write it as "
                    + "CSV, Arrow IPC or HDF5.",
            "Lines are scaled to the temperature with their partition sums, cut at the wing cutoff, and summed "
                    + "exactly on the grid (engine 'exact'). A summary (lines used, width sources per gas, dropped "
                    + "intensity, warnings, time) is printed unless --quiet.",
            ""
        },
        footer = {
            "",
            "Examples:",
            "  linewright sigma stores/planet-b --temperature 800 --pressure 1bar --background H2=0.85,He=0.15 \\",
            "      --between 2000 2300 --step 0.01 --out co-800K.csv --plot co-800K.png",
            "  linewright sigma stores/planet-b --temperature 296K --pressure 760Torr --background air=1 \\",
            "      --between 4.3 4.5 --unit um --resolving-power 1e5 --molecule CO2 --out co2.arrow"
        })
public final class SigmaCommand implements Callable<Integer> {
    /** Resolution of the progress bar: the wavenumber range in this many steps. */
    private static final int PROGRESS_STEPS = 100;

    @Spec
    private CommandSpec spec;

    @ParentCommand
    private LinewrightCommand root;

    @Parameters(arity = "1..*", paramLabel = "DIR", description = "Line stores (written by 'linewright ingest').")
    private List<Path> stores;

    @Option(names = "--temperature", required = true, paramLabel = "K", description = "Temperature, e.g. 296 or 800K.")
    private Temperature temperature;

    @Option(names = "--pressure", required = true, paramLabel = "VALUE[unit]",
            description = "Total pressure: Pa, hPa, kPa, mbar, bar, atm or Torr; a bare number is bar.")
    private Pressure pressure;

    @Mixin
    private BackgroundOptions backgroundOptions;

    @ArgGroup(exclusive = false, multiplicity = "1")
    private SpectralWindowOptions window;

    @ArgGroup(exclusive = true, multiplicity = "1")
    private Spacing spacing;

    /** Either a fixed step or a constant resolving power. */
    static final class Spacing {
        @Option(names = "--step", paramLabel = "S", description = "Grid step (cm-1, or GHz with --unit GHz).")
        String step;

        @Option(names = "--resolving-power", paramLabel = "R", description = "Constant resolving power ν/Δν.")
        Double resolvingPower;
    }


    @Mixin
    private WingOptions wingOptions;

    @Option(names = "--engine", paramLabel = "ID", defaultValue = "exact",
            description = "Summation engine: exact or fast (default ${DEFAULT-VALUE}).")
    private String engine;

    @Option(names = "--max-relative-error", paramLabel = "T", defaultValue = "1e-3",
            description = "Largest relative error of the fast engine wherever sigma >= 1e-6 max sigma, in [1e-5, 0.1] "
                    + "(default ${DEFAULT-VALUE}; the exact engine ignores it). The summary prints the engine's estimate.")
    private double tolerance;

    /** Set by the deprecated spelling; applied after parsing, when picocli has filled in defaults. */
    private Double toleranceDeprecated;

    /** Deprecated spelling of --max-relative-error, read for one version. */
    @Option(names = "--tolerance", hidden = true, paramLabel = "T")
    private void deprecatedTolerance(double value) {
        DeprecatedSpelling.note(spec, "--tolerance", "--max-relative-error");
        toleranceDeprecated = value;
    }

    @Option(names = "--shape", paramLabel = "SHAPE", defaultValue = "voigt",
            description = "Line shape: voigt, doppler, lorentz or vvw (Van Vleck-Weisskopf for every line; voigt and lorentz give it to lines with gamma_L/nu0 > 1e-4 and c2*nu0/T <= 0.2) (default ${DEFAULT-VALUE}).")
    private String shape;

    @Option(names = "--threshold-cm-per-molecule", paramLabel = "S", defaultValue = "0",
            description = "Leave out lines with S(T) below this, cm/molecule (default ${DEFAULT-VALUE}: keep all).")
    private double threshold;

    /** Set by the deprecated spelling; applied after parsing, when picocli has filled in defaults. */
    private Double thresholdDeprecated;

    /** Deprecated spelling of --threshold-cm-per-molecule, read for one version. */
    @Option(names = "--threshold", hidden = true, paramLabel = "S")
    private void deprecatedThresholdCmPerMolecule(double value) {
        DeprecatedSpelling.note(spec, "--threshold", "--threshold-cm-per-molecule");
        thresholdDeprecated = value;
    }

    @Mixin
    private LineSelectionOptions lineSelection;

    @Option(names = "--vmr", paramLabel = "MOLECULE=RATIO", split = ",",
            description = "Volume mixing ratios of the absorbers when the stores hold several molecules, e.g. "
                    + "CO=0.2,CO2=0.8: sigma per molecule of the mixture, sum x_m sigma_m / sum x_m.")
    private List<String> vmrs;

    @Option(names = "--threads", paramLabel = "N", description = "Worker threads (default: the number of processors).")
    private Integer threads;

    @Option(names = "--format", paramLabel = "FORMAT", description = "Output format: arrow, csv or hdf5 (default: from the --out extension).")
    private String format;

    @Option(names = "--out", required = true, paramLabel = "FILE", description = "The cross-section file to write (.csv, .arrow, .h5).")
    private Path out;

    @Option(names = "--plot", paramLabel = "FILE.png", description = "Also draw σ on a log axis to this PNG file.")
    private Path plot;

    @Option(names = "--plot-wavelength", description = "Draw the plot against wavelength (µm) instead of wavenumber.")
    private boolean plotWavelength;

    @Mixin
    private SpeciesDataOptions speciesData;

    @Mixin
    private IntensityConventionOptions intensityConvention;

    @Override
    public Integer call() throws Exception {
        if (toleranceDeprecated != null) {
            tolerance = toleranceDeprecated;
        }
        if (thresholdDeprecated != null) {
            threshold = thresholdDeprecated;
        }
        boolean quiet = root.globalOptions().quiet();
        CrossSectionFormat fileFormat = format == null ? CrossSectionFormat.fromExtension(out)
                : CrossSectionFormat.parse(format);
        Composition composition = backgroundOptions.requiredComposition();
        LineShapeKind lineShape = parseShape(shape);
        if (!(threshold >= 0) || Double.isInfinite(threshold)) {
            throw new InputException("--threshold-cm-per-molecule: " + threshold + " (expected a non-negative intensity in cm/molecule)");
        }
        if (!(tolerance > 0 && tolerance < 1)) {
            // checked for every engine: a value the exact engine ignores today is still a mistake of the caller
            throw new InputException("--max-relative-error: " + tolerance + " (expected a target relative error between 0 and "
                    + "1, e.g. 1e-3)");
        }
        int threadCount = threads == null ? Runtime.getRuntime().availableProcessors() : threads;
        WavenumberGrid grid = grid();
        MoleculeRegistry registry = speciesData.registry();
        LineSelection selection = selection(registry);
        IntensityScaling scaling = intensityConvention.scaling(registry,
                lineSelection.resolve(registry).isotopologue() != 0);
        List<LineStore> opened = new ArrayList<>();
        for (Path dir : stores) {
            opened.add(LineStore.open(dir));
        }
        Map<Integer, Double> mixture = mixture(registry);
        if (mixture != null && selection != LineSelection.ALL) {
            throw new InputException("--vmr with --molecule: a mixture of the declared molecules or one molecule "
                    + "(expected one of the two)");
        }
        if (selection == LineSelection.ALL) {
            refuseSeveralMolecules(opened, registry, mixture);
        }
        WingTreatment wings = wingOptions.treatment();
        WidthOptions widths = backgroundOptions.widthOptions();
        Map<String, Double> vmrByFormula = new LinkedHashMap<>();
        if (mixture != null) {
            // σ_mix = Σ x_m σ_m / Σ x in one pass: each line's S(T) carries its molecule's share (IntensityScaling)
            int[] ids = new int[mixture.size()];
            int m = 0;
            for (Map.Entry<Integer, Double> e : mixture.entrySet()) {
                ids[m++] = e.getKey();
                vmrByFormula.put(registry.molecule(e.getKey()).formula(), e.getValue());
            }
            selection = LineSelection.molecules(ids);
            scaling = scaling.withMoleculeShares(mixture);
        }
        CrossSectionRequest request = new CrossSectionRequest(temperature.kelvin(), pressure.atm(), composition, grid,
                wings, lineShape, threshold, selection, widths, scaling);
        CrossSectionResult result;
        try (CrossSectionEngine eng = EngineFactory.create(engine, threadCount, wings, tolerance);
             Progress progress = Progress.start("sigma", PROGRESS_STEPS, "%", 1, quiet)) {
            CrossSectionCalculator calculator = new CrossSectionCalculator(opened, registry, threadCount);
            result = calculator.compute(request, eng,
                    (lines, fraction) -> progress.stepTo(Math.round(fraction * PROGRESS_STEPS)));
        }
        // The file records per isotopologue where its Q(T) came from, and any warning on it.
        PartitionSumNotes partitionSums = PartitionSumNotes.of(registry, opened, temperature.kelvin());
        Map<String, String> metadata = new LinkedHashMap<>(result.metadata());
        metadata.putAll(partitionSums.metadata());
        metadata.putAll(scaling.metadata());
        if (mixture != null) {
            metadata.putAll(MixtureCrossSection.metadata(vmrByFormula));
        }
        CrossSectionFiles.write(out, fileFormat, grid, result.sigmaCm2PerMolecule(), metadata);
        if (plot != null) {
            CrossSectionPlot.write(plot, PlotStyle.of(String.format(Locale.ROOT, "T = %s K, p = %s bar, %s",
                            fmt(temperature.kelvin()), fmt(pressure.bar()), composition)),
                    grid.pointsCm1(), List.of(new CrossSectionPlot.Series(
                            "T = " + fmt(temperature.kelvin()) + " K", result.sigmaCm2PerMolecule())), plotWavelength);
        }
        if (!quiet) {
            if (mixture != null) {
                spec.commandLine().getOut().println("mixture, per molecule of the declared absorbers (shares "
                        + MixtureCrossSection.metadata(vmrByFormula).get("mixture_shares") + "):");
            }
            summary(spec.commandLine().getOut(), result, grid);
        }
        // A modelled Q(T) outside its stated accuracy changes every S(T) of its isotopologue: always say so.
        for (String warning : partitionSums.warnings()) {
            spec.commandLine().getErr().println("linewright: warning: " + warning);
        }
        spec.commandLine().getErr().flush();
        return ExitCodes.OK;
    }

    /**
     * σ in cm²/molecule over lines of several molecules has no single "molecule": refused (docs/physics.md,
     * "Per molecule of what") until mixing ratios can be declared.
     */
    private static void refuseSeveralMolecules(List<LineStore> opened, MoleculeRegistry registry,
                                               Map<Integer, Double> mixture) {
        java.util.SortedSet<Integer> molecules = StoreMolecules.of(opened);
        if (mixture != null) {
            for (int id : molecules) {
                if (!mixture.containsKey(id)) {
                    throw new InputException("--vmr: no mixing ratio for " + StoreMolecules.name(registry, id)
                            + ", whose lines are in the stores (expected a ratio for every molecule of the stores)");
                }
            }
            return;
        }
        if (molecules.size() > 1) {
            throw new InputException("the stores hold lines of several molecules "
                    + StoreMolecules.names(registry, molecules) + ": sigma per molecule "
                    + "of a mixture needs declared mixing ratios (expected --vmr, e.g. CO=0.2,CO2=0.8, or --molecule)");
        }
    }

    /** The declared mixing ratios by molecule id, in declaration order; null without {@code --vmr}. */
    private Map<Integer, Double> mixture(MoleculeRegistry registry) {
        if (vmrs == null || vmrs.isEmpty()) {
            return null;
        }
        Map<Integer, Double> byId = new LinkedHashMap<>();
        for (String item : vmrs) {
            int eq = item.indexOf('=');
            org.linewright.ingest.registry.Molecule m = eq > 0 ? registry.molecule(item.substring(0, eq).trim()) : null;
            double x;
            try {
                x = eq > 0 ? Double.parseDouble(item.substring(eq + 1).trim()) : Double.NaN;
            } catch (NumberFormatException e) {
                x = Double.NaN;
            }
            if (m == null || !(x > 0) || Double.isInfinite(x) || byId.containsKey(m.id())) {
                throw new InputException("--vmr " + org.linewright.ingest.text.OffendingText.quote(item)
                        + ": expected MOLECULE=RATIO with a molecule of the registry, once, and a positive ratio, "
                        + "e.g. CO=0.2");
            }
            byId.put(m.id(), x);
        }
        return byId;
    }

    private static String fmt(double v) {
        return String.format(Locale.ROOT, "%.6g", v);
    }

    private void summary(PrintWriter w, CrossSectionResult r, WavenumberGrid grid) {
        w.printf(Locale.ROOT, "%s: %d points %.6f-%.6f cm-1, engine %s%n", out, grid.size(), grid.firstCm1(),
                grid.lastCm1(), r.metadata().get("engine"));
        w.printf(Locale.ROOT, "lines used: %d; below threshold: %d (%.3e of the intensity)%n", r.linesUsed(),
                r.linesBelowThreshold(), r.droppedIntensityFraction());
        w.printf(Locale.ROOT, "sum of S(T) used: %.6e cm/molecule; wing loss beyond the cutoff: %.3e%n",
                r.sumIntensityCmPerMolecule(), r.wingLossFraction());
        for (String line : r.widthSources().report()) {
            w.println("width sources, " + line);
        }
        String criterion = r.metadata().get("engine.fast.criterion");
        if (criterion != null) {
            w.printf(Locale.ROOT, "estimated error: %.2e (tolerance %s; %s)%n", r.estimatedRelativeError(),
                    r.metadata().get("engine.fast.tolerance"), criterion);
            String direct = r.metadata().get("engine.fast.direct_lines");
            if (direct != null && !direct.equals("0")) {
                w.println("summed exactly instead of by the transform: " + direct + " lines ("
                        + r.metadata().get("engine.fast.direct_reason") + ")");
            }
        } else {
            w.println("estimated error: 0 (exact summation; profile accuracy about 1e-9)");
        }
        for (String warning : r.warnings()) {
            w.println("warning: " + warning);
        }
        w.printf(Locale.ROOT, "time: %.2f s%n", r.seconds());
        w.flush();
    }

    private WavenumberGrid grid() {
        double[] range = window.rangeCm1();
        double low = range[0];
        double high = range[1];
        if (!(low < high)) {
            throw new InputException("--between " + window.asWritten()
                    + ": empty range (expected two different spectral positions)");
        }
        if (spacing.resolvingPower != null) {
            return WavenumberGrid.resolvingPower(low, high, spacing.resolvingPower);
        }
        String stepUnit = window.gigahertz() ? window.unit() : "cm-1";
        double step = QuantityParser.parseWavenumberInterval(SpectralWindowOptions.withUnit(spacing.step, stepUnit)).cm1();
        if (step > high - low) {
            throw new InputException("--step " + spacing.step + ": larger than the range " + low + "-" + high
                    + " cm-1 (expected a step smaller than the range)");
        }
        return WavenumberGrid.uniform(low, high, step);
    }

    private static LineShapeKind parseShape(String name) {
        try {
            return LineShapeKind.parse(name);
        } catch (IllegalArgumentException e) {
            throw new InputException("--shape: " + e.getMessage());
        }
    }

    private LineSelection selection(MoleculeRegistry registry) {
        LineSelectionOptions.Species species = lineSelection.resolve(registry);
        if (species.moleculeId() == 0) {
            return LineSelection.ALL;
        }
        return species.isotopologue() == 0 ? LineSelection.molecules(species.moleculeId())
                : LineSelection.isotopologue(species.moleculeId(), species.isotopologue());
    }
}
