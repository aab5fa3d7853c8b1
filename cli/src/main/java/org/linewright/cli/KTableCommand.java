package org.linewright.cli;

import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.linewright.grid.ktable.GQuadrature;
import org.linewright.grid.ktable.KSampling;
import org.linewright.grid.ktable.KTableBuilder;
import org.linewright.grid.ktable.KTableRequest;
import org.linewright.grid.ktable.QuadratureKind;
import org.linewright.grid.ktable.SpectralBins;
import org.linewright.grid.ktable.SpeciesMass;
import org.linewright.ingest.registry.MoleculeRegistry;
import picocli.CommandLine.ArgGroup;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.ParameterException;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Spec;

/** {@code linewright ktable}: a correlated-k table of a (p, T) cross-section table. */
@Command(name = "ktable",
        mixinStandardHelpOptions = true,
        description = {
            "Make a correlated-k table of a cross-section table (written by 'linewright build'): the table's "
                    + "wavenumber range is cut into spectral bins, the sigma values of each bin at each (pressure, "
                    + "temperature) are sorted into their distribution k(g), and k is written at the g points of a "
                    + "quadrature in g in [0, 1], with the weights, as HDF5 (.h5) or Arrow IPC (.arrow).",
            "Each k_i is the mean of k(g) over the g-interval its weight stands for (exact band mean; the band "
                    + "transmittance sum w_i exp(-k_i u) errs low, by up to a few percent with 16 points on thick "
                    + "paths: see docs/physics.md). The sigma table is read one (p, T) cell at a time.",
            ""
        },
        footer = {
            "",
            "Examples:",
            "  linewright ktable tables/co-h2he.h5 --resolving-power 1000 --g-points 16 --out tables/co-h2he-k.h5",
            "  linewright ktable tables/co-h2he.arrow --bin-width 10 --quadrature split_gauss_legendre \\",
            "      --band-mean --transmission-column-per-cm2 1e21 --per-unit-mass CO --out co-k.arrow"
        })
public final class KTableCommand implements Callable<Integer> {
    @Spec
    private CommandSpec spec;

    @ParentCommand
    private LinewrightCommand root;

    @Parameters(index = "0", paramLabel = "TABLE", description = "The cross-section table (.h5 or .arrow).")
    private Path table;

    @ArgGroup(exclusive = true, multiplicity = "1")
    private Bins bins;

    /** One way of making the bins. */
    static final class Bins {
        @Option(names = "--resolving-power", paramLabel = "R",
                description = "Bins of constant resolving power nu/dnu = R from the table's first wavenumber.")
        Double resolvingPower;

        @Option(names = "--bin-width", paramLabel = "CM1", description = "Bins of a fixed width in cm-1.")
        Double binWidthCm1;

        @Option(names = "--bin-edges", paramLabel = "FILE",
                description = "Bin edges in cm-1, one per line, ascending ('#' starts a comment line).")
        Path binEdges;
    }

    @Option(names = "--g-points", paramLabel = "N", defaultValue = "16",
            description = "Number of g points, 1 to 256 (even for the split quadrature; default ${DEFAULT-VALUE}).")
    private int gPoints;

    @Option(names = "--quadrature", paramLabel = "KIND", defaultValue = "gauss_legendre",
            description = "g quadrature: gauss_legendre or split_gauss_legendre (N/2 points on [0, 0.95], N/2 on "
                    + "[0.95, 1]) (default ${DEFAULT-VALUE}).")
    private String quadrature;

    @Option(names = "--band-mean", description = "Also write the band-mean sigma of every bin.")
    private boolean bandMean;

    @Option(names = "--transmission-column-per-cm2", paramLabel = "U",
            description = "Also write the transmission-equivalent sigma of every bin, -ln(mean exp(-sigma U))/U, "
                    + "for this column U in molecules/cm2.")
    private Double transmissionColumn;

    @Option(names = "--per-unit-mass", paramLabel = "MOLECULE",
            description = "Write opacity per unit mass (cm2/g) of MOLECULE, using its isotopologue-weighted molar "
                    + "mass from the built-in registry.")
    private String perUnitMass;

    @Option(names = "--threads", paramLabel = "N",
            description = "Threads (default: the number of processors); results are the same for any number.")
    private Integer threads;

    @Option(names = "--out", required = true, paramLabel = "KTABLE", description = "The k-table to write (.h5 or .arrow).")
    private Path out;

    @Override
    public Integer call() throws Exception {
        int threadCount = threads == null ? Runtime.getRuntime().availableProcessors() : threads;
        if (threadCount < 1) {
            throw new ParameterException(spec.commandLine(), "--threads: " + threadCount + " (expected a positive number)");
        }
        if (transmissionColumn != null && !(transmissionColumn > 0 && Double.isFinite(transmissionColumn))) {
            throw new ParameterException(spec.commandLine(), "--transmission-column-per-cm2: " + transmissionColumn
                    + " (expected a positive number of molecules/cm2)");
        }
        KTableRequest.Binning binning;
        if (bins.resolvingPower != null) {
            double r = bins.resolvingPower;
            SpectralBins.resolvingPower(1.0, 2.0, r); // reject a bad R before reading the table
            binning = KTableRequest.Binning.resolvingPower(r);
        } else if (bins.binWidthCm1 != null) {
            double w = bins.binWidthCm1;
            SpectralBins.fixedWidth(1.0, 2.0, w);
            binning = KTableRequest.Binning.fixedWidth(w);
        } else {
            binning = KTableRequest.Binning.of(SpectralBins.readEdges(bins.binEdges));
        }
        KTableRequest request = new KTableRequest(binning, GQuadrature.of(QuadratureKind.parse(quadrature), gPoints),
                KSampling.INTERVAL_MEAN, transmissionColumn == null ? Double.NaN : transmissionColumn, bandMean,
                Double.NaN, null);
        if (perUnitMass != null) {
            MoleculeRegistry registry = MoleculeRegistry.builtIn();
            request = request.withPerMass(SpeciesMass.isotopologueWeightedGPerMol(registry, perUnitMass),
                    SpeciesMass.source(registry, perUnitMass));
        }
        long start = System.nanoTime();
        KTableBuilder.Report report = KTableBuilder.build(table, request, threadCount, out);
        PrintWriter stdout = spec.commandLine().getOut();
        for (String w : report.warnings()) {
            stdout.println("warning: " + w);
        }
        if (!root.globalOptions().quiet()) {
            var c = report.content();
            stdout.printf(Locale.ROOT, "%d bins x %d g points (%s) at %d pressures x %d temperatures; fewest sigma "
                            + "points in a bin: %s; %.2f s%n", c.bins(), c.gPoints(), quadrature, c.pressureBar().length,
                    c.temperatureK().length, c.metadata().get("sigma_points_per_bin_min"),
                    (System.nanoTime() - start) / 1e9);
            stdout.printf(Locale.ROOT, "k in %s%s%n", c.unit(), request.massGPerMol() > 0
                    ? String.format(Locale.ROOT, " (molar mass %.6g g/mol)", request.massGPerMol()) : "");
            stdout.println("note: " + KTableBuilder.ACCURACY_NOTE);
            stdout.printf(Locale.ROOT, "ktable %s (sha256 %s)%n", report.written().file(), report.written().fileSha256());
        }
        return ExitCodes.OK;
    }
}
