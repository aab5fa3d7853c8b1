package org.linewright.cli.demo;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.linewright.cli.plot.PlotStyle;
import org.linewright.cli.plot.StickSpectrumPlot;
import org.linewright.ingest.InputException;

/** Draws the line sets of the context as a stick spectrum ({@code plots/stick-spectrum.png}). */
public final class StickSpectrumStep implements DemoStep {
    /** The plot's path relative to the output folder. */
    public static final String PLOT_FILE = "plots/stick-spectrum.png";
    /** Dynamic range shown: lines weaker than this fraction of the strongest are left out. */
    private static final double DYNAMIC_RANGE = 1e-9;

    @Override
    public String name() {
        return "stick-spectrum plot";
    }

    @Override
    public StepOutcome run(DemoContext context) throws IOException {
        List<DemoContext.LineSet> sets = context.lineSets();
        if (sets.isEmpty()) {
            throw new InputException("no lines to plot (expected an earlier step to provide line sets)");
        }
        List<StickSpectrumPlot.Series> series = new ArrayList<>();
        double strongest = 0.0;
        int count = 0;
        for (DemoContext.LineSet set : sets) {
            series.add(new StickSpectrumPlot.Series(set.label(), set.wavenumberCm1(), set.intensityCmPerMolecule()));
            for (double s : set.intensityCmPerMolecule()) {
                strongest = Math.max(strongest, s);
            }
        }
        double floor = strongest * DYNAMIC_RANGE;
        for (DemoContext.LineSet set : sets) {
            for (double s : set.intensityCmPerMolecule()) {
                count += s > floor ? 1 : 0;
            }
        }
        Path png = context.outDir().resolve(PLOT_FILE);
        StickSpectrumPlot.write(png, new PlotStyle("Synthetic line list at 296 K (invented data)", 1200, 600),
                series, floor);
        return new StepOutcome(List.of(String.format(Locale.ROOT,
                "%d lines above %.1e cm/molecule (1e-9 of the strongest), %d series", count, floor, series.size())),
                List.of(png));
    }
}
