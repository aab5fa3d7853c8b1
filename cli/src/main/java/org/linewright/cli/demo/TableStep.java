package org.linewright.cli.demo;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import org.linewright.cli.table.TablePlot;
import org.linewright.grid.plan.PlanReader;
import org.linewright.grid.plan.TablePlan;
import org.linewright.grid.table.BuildListener;
import org.linewright.grid.table.BuildReport;
import org.linewright.grid.table.CalculatorBlocks;
import org.linewright.grid.table.CrossSectionTable;
import org.linewright.grid.table.TableBuilder;

/**
 * Builds the table the staged demo plan describes (exactly as {@code linewright build plan.toml} does, into the
 * output folder) and plots σ at its temperatures and pressures.
 */
public final class TableStep implements DemoStep {
    /** The plot's file inside the output folder. */
    public static final String PLOT = "plots/cross-sections.png";

    @Override
    public String name() {
        return "build the (p, T) cross-section table";
    }

    @Override
    public StepOutcome run(DemoContext context) throws IOException {
        TablePlan plan = PlanReader.read(context.outDir().resolve(StageDataStep.PLAN_FILE));
        int threads = Math.max(1, Runtime.getRuntime().availableProcessors());
        BuildReport report = TableBuilder.build(plan, CalculatorBlocks.factory(), threads, false, BuildListener.NONE);
        CrossSectionTable table = CrossSectionTable.open(report.table());
        Path plot = context.outDir().resolve(PLOT);
        TablePlot.write(table, plot, "Synthetic sub-Neptune (SYNTHETIC lines): " + plan.outputTable().getFileName());
        List<String> details = new ArrayList<>();
        details.add(String.format(Locale.ROOT, "grid %d points (%.2f-%.2f cm-1), %d pressures x %d temperatures, "
                        + "background %s, engine %s", plan.grid().size(), plan.grid().firstCm1(), plan.grid().lastCm1(),
                plan.pressuresBar().length, plan.temperaturesK().length, plan.composition(), plan.profile().engine()));
        details.add(String.format(Locale.ROOT, "blocks: %d computed, %d reused; %d lines in the stores; %.2f s",
                report.computed(), report.reused(), report.linesInStores(), report.seconds()));
        details.add("table " + context.outDir().relativize(report.table()) + " sha256 " + report.written().fileSha256());
        for (String warning : report.warnings()) {
            details.add("warning: " + warning);
        }
        return new StepOutcome(details, List.of(report.table(), plot));
    }
}
