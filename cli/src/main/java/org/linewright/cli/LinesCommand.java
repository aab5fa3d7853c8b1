package org.linewright.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.linewright.broadening.listing.LineListing;
import org.linewright.broadening.listing.LineListingRequest;
import org.linewright.grid.output.LineListingWriter;
import org.linewright.grid.output.ListingFormat;
import org.linewright.cli.plot.PlotStyle;
import org.linewright.cli.plot.StickSpectrumPlot;
import org.linewright.cli.units.QuantityParser;
import org.linewright.ingest.InputException;
import org.linewright.ingest.partition.PartitionSumNotes;
import org.linewright.ingest.partition.StoredPartitionFunctions;
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

/** {@code linewright lines}: list the lines of a store. */
@Command(name = "lines",
        mixinStandardHelpOptions = true,
        description = {
            "List the lines of a line store in wavenumber order: a window, a molecule or isotopologue, the strongest "
                    + "N; optionally with the intensity at a temperature and the width each line gets in a background.",
            "CSV output has every stored column (the first twelve: molecule,isotopologue,wavenumber_cm1,"
                    + "intensity_cm_per_molecule,einstein_a_s1,air_width_cm1_per_atm,self_width_cm1_per_atm,"
                    + "air_width_exponent,air_shift_cm1_per_atm,lower_energy_cm1,upper_degeneracy,lower_degeneracy), "
                    + "values that read back exactly, then the computed columns.",
            ""
        },
        footer = {
            "",
            "Examples:",
            "  linewright lines stores/planet-b --between 2100 2200 --molecule CO --strongest 20",
            "  linewright lines stores/planet-b --between 4.5 4.8 --unit um --temperature 800K \\",
            "      --background H2=0.85,He=0.15 --format csv --out co-800K.csv"
        })
public final class LinesCommand implements Callable<Integer> {
    /** Most lines drawn by --plot (the strongest of a larger selection). */
    private static final int PLOT_MAX_LINES = 200_000;

    @Spec
    private CommandSpec spec;

    @ParentCommand
    private LinewrightCommand root;

    @Parameters(index = "0", paramLabel = "DIR", description = "The line store.")
    private Path store;

    @ArgGroup(exclusive = false, multiplicity = "0..1")
    private SpectralWindowOptions window;

    @Mixin
    private LineSelectionOptions selection;

    @Option(names = "--strongest", paramLabel = "N",
            description = "Only the N strongest lines (by S(T) with --temperature, else by S(296 K)), in wavenumber order.")
    private int strongest;

    @Option(names = "--temperature", paramLabel = "T", description = "Add the intensity at this temperature, e.g. 800K.")
    private String temperature;

    @Option(names = "--format", paramLabel = "FORMAT", defaultValue = "table",
            description = "table, csv or arrow (default: ${DEFAULT-VALUE}).")
    private String format;

    @Option(names = "--out", paramLabel = "FILE", description = "Write here instead of standard output (needed for arrow).")
    private Path out;

    @Option(names = "--plot", paramLabel = "FILE.png",
            description = "Also draw a stick spectrum of the listed lines (S(T) with --temperature, else S(296 K); "
                    + "at most the 200000 strongest).")
    private Path plot;

    @Mixin
    private BackgroundOptions backgroundOptions;

    @Mixin
    private SpeciesDataOptions speciesData;

    @Override
    public Integer call() throws Exception {
        MoleculeRegistry registry = speciesData.registry();
        double low = Double.NEGATIVE_INFINITY;
        double high = Double.POSITIVE_INFINITY;
        if (window != null) {
            double[] range = window.rangeCm1();
            low = range[0];
            high = range[1];
        }
        LineSelectionOptions.Species species = selection.resolve(registry);
        double temperatureK = temperature == null ? Double.NaN : QuantityParser.parseTemperature(temperature).kelvin();
        LineListingRequest request = new LineListingRequest(low, high, species.moleculeId(), species.isotopologue(), strongest,
                temperatureK, backgroundOptions.compositionOrNull(), backgroundOptions.widthOptions());
        LineStore lineStore = LineStore.open(store);
        // The store's own partition functions (ExoMol-style .pf) apply at every temperature; user tables win.
        registry = (MoleculeRegistry) StoredPartitionFunctions.withStoredTables(registry, List.of(lineStore));
        LineListing.Summary summary = LineListingWriter.write(lineStore, request, registry,
                ListingFormat.byName(format), out, spec.commandLine().getOut());
        if (plot != null) {
            double[][] sticks = LineListing.sticks(lineStore, request, registry, PLOT_MAX_LINES);
            if (sticks[0].length == 0) {
                throw new InputException("--plot: no lines in the selection to draw");
            }
            String what = Double.isNaN(temperatureK) ? "S(296 K)" : String.format(Locale.ROOT, "S(%.6g K)", temperatureK);
            StickSpectrumPlot.write(plot, PlotStyle.of("Line intensities " + what + ": " + store.getFileName()),
                    List.of(new StickSpectrumPlot.Series(what, sticks[0], sticks[1])), floor(sticks[1]));
        }
        if (!root.globalOptions().quiet()) {
            PrintWriter err = spec.commandLine().getErr();
            err.printf(Locale.ROOT, "%d line(s) listed of %d in the selection%s%n", summary.linesListed(),
                    summary.linesInSelection(), out == null ? "" : " -> " + out);
            if (summary.widthSourcesOrNull() != null) {
                summary.widthSourcesOrNull().report().forEach(err::println);
                summary.widthSourcesOrNull().warnings().forEach(w -> err.println("warning: " + w));
            }
            err.flush();
        }
        if (!Double.isNaN(temperatureK)) {
            // A modelled Q(T) outside its stated accuracy changes every S(T) of its isotopologue: always say so.
            PrintWriter err = spec.commandLine().getErr();
            for (String warning : PartitionSumNotes.of(registry, List.of(lineStore), temperatureK).warnings()) {
                err.println("linewright: warning: " + warning);
            }
            err.flush();
        }
        return ExitCodes.OK;
    }

    /** Bottom of the plot's intensity axis: 10⁻⁹ of the strongest line (the demo's choice). */
    private static double floor(double[] intensities) {
        double max = 0;
        for (double v : intensities) {
            max = Math.max(max, v);
        }
        return max > 0 ? max * 1e-9 : Double.MIN_NORMAL;
    }
}
