package org.linewright.cli.impact;

import java.io.IOException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

import org.linewright.grid.manifest.BlockLayout;
import org.linewright.grid.plan.TablePlan;
import org.linewright.grid.table.BlockCalculator;
import org.linewright.grid.table.CalculatorBlocks;
import org.linewright.grid.table.TableBuilder;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.store.LineStore;
import org.linewright.reference.compare.ComparisonReport;
import org.linewright.reference.compare.LineChange;

/**
 * Which cells of a planned cross-section table a change of line list reaches, and how much σ changes there.
 *
 * <p>The table is cut into the table builder's blocks ({@link TableBuilder#blocks}: same block size and reach,
 * the wing cutoff plus the largest pressure shift of the lines at the highest pressure). A block is reached
 * when an added, removed or changed line lies (before or after the change) within its reach; for each reached
 * block and every (p, T) of the plan, σ is computed from the old and from the new list with the plan's engine,
 * profile and widths (the builder's own calculator), and the largest changes are reported:
 * max |σ_new − σ_old| in cm²/molecule, and max |σ_new − σ_old|/σ_old over the points where σ_old &gt; 0
 * (infinite when σ appears where it was zero).
 */
public final class TableImpact {
    private TableImpact() {
    }

    /**
     * One reached (p, T, block) cell.
     *
     * @param pressureBar          the cell's pressure, bar
     * @param temperatureK         the cell's temperature, K
     * @param block                block number in the table's grid
     * @param fromCm1              first grid point of the block, cm⁻¹
     * @param toCm1                last grid point of the block, cm⁻¹
     * @param changePositions      positions of changed lines (old and new) within the block's reach
     * @param maxAbsoluteChange    max |σ_new − σ_old|, cm²/molecule
     * @param maxRelativeChange    max |σ_new − σ_old|/σ_old where σ_old &gt; 0 (infinite where σ_old = 0 &lt; σ_new)
     * @param atWavenumberCm1      grid point of the largest absolute change
     */
    public record Cell(double pressureBar, double temperatureK, int block, double fromCm1, double toCm1,
                       int changePositions, double maxAbsoluteChange, double maxRelativeChange, double atWavenumberCm1) {
    }

    /**
     * Assesses the cells of {@code plan}'s table reached by the changes of {@code report} (which must list every
     * change) between {@code oldStore} and {@code newStore}. The plan's own sources are not read.
     *
     * @param threads threads for the engine (same results for any count)
     */
    public static List<Cell> assess(TablePlan plan, LineStore oldStore, LineStore newStore, ComparisonReport report,
                                    int threads) throws IOException {
        if (report.changesNotListed() > 0) {
            throw new IllegalArgumentException("the comparison must list every change to assess a table plan");
        }
        double[] positions = changePositions(report.changes());
        double[] pressuresAtm = plan.pressuresAtm();
        List<Cell> cells = new ArrayList<>();
        if (positions.length == 0) {
            return cells;
        }
        MoleculeRegistry registry = TableBuilder.registry(plan);
        try (BlockCalculator older = CalculatorBlocks.factory().create(plan, List.of(oldStore), registry, threads);
             BlockCalculator newer = CalculatorBlocks.factory().create(plan, List.of(newStore), registry, threads)) {
            // the builder's own blocks and reach, taken over both lists (a reach wide enough for either)
            BlockLayout layout = TableBuilder.blocks(plan, older, List.of(oldStore, newStore)).layout();
            for (int b = 0; b < layout.blocks(); b++) {
                double lo = layout.lineMinCm1(b);
                double hi = layout.lineMaxCm1(b);
                int changed = countWithin(positions, lo, hi);
                if (changed == 0) {
                    continue;
                }
                double[] points = layout.slice(b).pointsCm1();
                for (int p = 0; p < pressuresAtm.length; p++) {
                    for (int t = 0; t < plan.temperaturesK().length; t++) {
                        double temperatureK = plan.temperaturesK()[t];
                        double[] before = older.compute(layout.slice(b), pressuresAtm[p], temperatureK, lo, hi)
                                .sigmaCm2PerMolecule();
                        double[] after = newer.compute(layout.slice(b), pressuresAtm[p], temperatureK, lo, hi)
                                .sigmaCm2PerMolecule();
                        double maxAbs = 0;
                        double maxRel = 0;
                        double at = points[0];
                        for (int i = 0; i < before.length; i++) {
                            double d = Math.abs(after[i] - before[i]);
                            if (d > maxAbs) {
                                maxAbs = d;
                                at = points[i];
                            }
                            if (d > 0) {
                                maxRel = Math.max(maxRel, before[i] > 0 ? d / before[i] : Double.POSITIVE_INFINITY);
                            }
                        }
                        cells.add(new Cell(plan.pressuresBar()[p], temperatureK, b, points[0],
                                points[points.length - 1], changed, maxAbs, maxRel, at));
                    }
                }
            }
        }
        return cells;
    }

    /** Old and new positions of every change, sorted. */
    private static double[] changePositions(List<LineChange> changes) {
        double[] v = new double[2 * changes.size()];
        int n = 0;
        for (LineChange c : changes) {
            if (!Double.isNaN(c.oldWavenumberCm1())) {
                v[n++] = c.oldWavenumberCm1();
            }
            if (!Double.isNaN(c.newWavenumberCm1())) {
                v[n++] = c.newWavenumberCm1();
            }
        }
        double[] sorted = Arrays.copyOf(v, n);
        Arrays.sort(sorted);
        return sorted;
    }

    /** Number of sorted values in [lo, hi]. */
    private static int countWithin(double[] sorted, double lo, double hi) {
        int from = lowerBound(sorted, lo);
        int to = lowerBound(sorted, Math.nextUp(hi));
        return to - from;
    }

    private static int lowerBound(double[] sorted, double x) {
        int lo = 0;
        int hi = sorted.length;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (sorted[mid] < x) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }
}
