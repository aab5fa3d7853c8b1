package org.linewright.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.linewright.grid.ktable.KTable;
import org.linewright.grid.ktable.KTableContent;
import org.linewright.grid.ktable.KTableWriter;
import org.linewright.grid.ktable.RandomOverlap;
import org.linewright.ingest.InputException;
import org.linewright.ingest.text.OffendingText;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.ParentCommand;
import picocli.CommandLine.Spec;

/** {@code linewright ktable-mix}: the k-table of a gas mixture from per-species k-tables, by random overlap. */
@Command(name = "ktable-mix",
        mixinStandardHelpOptions = true,
        description = {
            "Combine the k-tables of several absorbers (written by 'linewright ktable' on the same pressures, "
                    + "temperatures, bins and g quadrature, per molecule) into the k-table of their mixture with "
                    + "the given volume mixing ratios, by random overlap with resorting and rebinning (Lacis & Oinas "
                    + "1991; Amundsen et al. 2017): every pair of g points is an overlap of the two k's, weighted by "
                    + "the product of their weights, and the pairs are sorted into the quadrature again.",
            "An approximation: it assumes the absorbers' lines are uncorrelated within each bin. Where their lines "
                    + "are few or share structure it can be off by tens of percent in transmittance (measured in "
                    + "docs/physics.md); the k-table of the mixture's sigma ('build' with mixing ratios, then "
                    + "'ktable') is then the correct one.",
            ""
        },
        footer = {
            "",
            "Example:",
            "  linewright ktable-mix k-co2.h5=0.96 k-h2o.h5=0.03 --out k-mix.h5"
        })
public final class KTableMixCommand implements Callable<Integer> {
    @Spec
    private CommandSpec spec;

    @ParentCommand
    private LinewrightCommand root;

    @Parameters(paramLabel = "KTABLE=VMR", arity = "2..*",
            description = "A k-table and the absorber's volume mixing ratio, two or more.")
    private List<String> inputs;

    @Option(names = "--out", required = true, paramLabel = "KTABLE",
            description = "The mixture's k-table to write (.h5 or .arrow).")
    private Path out;

    @Override
    public Integer call() throws IOException {
        List<KTableContent> tables = new ArrayList<>();
        List<String> names = new ArrayList<>();
        double[] vmr = new double[inputs.size()];
        for (int m = 0; m < inputs.size(); m++) {
            String item = inputs.get(m);
            int eq = item.lastIndexOf('=');
            if (eq <= 0 || eq == item.length() - 1) {
                throw new InputException("KTABLE=VMR " + OffendingText.quote(item)
                        + " (expected a k-table file and a mixing ratio, e.g. k-co2.h5=0.96)");
            }
            String ratio = item.substring(eq + 1);
            try {
                vmr[m] = Double.parseDouble(ratio);
            } catch (NumberFormatException e) {
                throw new InputException("KTABLE=VMR " + OffendingText.quote(item) + ": mixing ratio "
                        + OffendingText.quote(ratio) + " (expected a number)");
            }
            if (!(vmr[m] > 0) || Double.isInfinite(vmr[m])) {
                throw new InputException("KTABLE=VMR " + OffendingText.quote(item)
                        + " (expected a positive mixing ratio)");
            }
            Path file = Path.of(item.substring(0, eq));
            tables.add(KTable.open(file).content());
            names.add(file.getFileName().toString());
        }
        KTableContent mixture = RandomOverlap.combine(tables, vmr, names);
        KTableWriter.Written written = KTableWriter.write(out, mixture);
        if (!root.globalOptions().quiet()) {
            PrintWriter stdout = spec.commandLine().getOut();
            stdout.printf(Locale.ROOT, "%d absorbers by random overlap (uncorrelated lines assumed within each "
                    + "bin): %d bins x %d g points%n", tables.size(), mixture.bins(), mixture.gPoints());
            stdout.printf(Locale.ROOT, "ktable %s (sha256 %s)%n", written.file(), written.fileSha256());
        }
        return ExitCodes.OK;
    }
}
