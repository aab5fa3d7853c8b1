package org.linewright.grid.table;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.linewright.broadening.background.BackgroundGas;
import org.linewright.broadening.intensity.IntensityScaling;
import org.linewright.broadening.sources.GasParameters;
import org.linewright.broadening.sources.WidthResolver;
import org.linewright.broadening.sources.WidthSource;
import org.linewright.broadening.sources.WidthSourceTally;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.calc.CrossSectionCalculator;
import org.linewright.grid.calc.CrossSectionRequest;
import org.linewright.grid.calc.CrossSectionResult;
import org.linewright.grid.calc.LineFilter;
import org.linewright.grid.calc.LineSelection;
import org.linewright.grid.calc.ProgressListener;
import org.linewright.broadening.sources.WidthOptions;
import org.linewright.grid.engine.CountOnlyEngine;
import org.linewright.grid.engine.CrossSectionEngine;
import org.linewright.grid.engine.EngineFactory;
import org.linewright.grid.engine.exact.ExactEngine;
import org.linewright.grid.engine.exact.FixedPointSums;
import org.linewright.grid.plan.TablePlan;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.store.LineStore;

/**
 * The table builder's blocks computed by the cross-section calculator with the plan's engine: each block is one
 * {@link CrossSectionCalculator#compute} on the block's slice of the grid, restricted to the lines whose stored
 * centres lie within the block's reach, with the plan's intensity convention and abundances. With mixing ratios
 * declared ({@code species.vmr}) a block is one computation over the declared molecules' lines, each S(T) carrying
 * its molecule's share, which gives σ per molecule of the mixture ({@code MixtureCrossSection}) with the engine's
 * error estimate and the threshold applying to σ_mix itself. The engine uses the build's threads (same bits for any count).
 */
public final class CalculatorBlocks implements BlockCalculator {
    private final CrossSectionCalculator calculator;
    private final CrossSectionEngine engine;
    private final TablePlan plan;
    private final WingTreatment wings;
    private final LineSelection selection;
    /** The plan's intensity convention and abundances, with the molecules' shares of a declared mixture. */
    private final IntensityScaling scaling;
    private final WidthOptions widths;

    private CalculatorBlocks(TablePlan plan, List<LineStore> stores, MoleculeRegistry registry, int threads) {
        this.plan = plan;
        this.calculator = new CrossSectionCalculator(stores, registry, threads);
        this.wings = plan.profile().wings();
        // the exact engine keeps exact sums in a table build: a block can then be updated from changed lines alone
        this.engine = ExactEngine.ID.equalsIgnoreCase(plan.profile().engine().trim())
                ? new ExactEngine(threads, wings, true)
                : EngineFactory.create(plan.profile().engine(), threads, wings, plan.profile().tolerance());
        int[] molecules = plan.species().molecules().stream().mapToInt(Integer::intValue).toArray();
        TablePlan.Species species = plan.species();
        if (species.mixture()) {
            // σ_mix = Σ x_m σ_m / Σ x in one pass, as sigma --vmr: the declared molecules' lines, each S(T)
            // multiplied by its molecule's share x_m / Σ x (IntensityScaling.withMoleculeShares)
            Map<Integer, Double> ratios = new LinkedHashMap<>();
            for (TablePlan.Vmr v : species.vmr()) {
                ratios.put(v.moleculeId(), v.ratio());
            }
            this.selection = LineSelection.molecules(ratios.keySet().stream().mapToInt(Integer::intValue).toArray());
            this.scaling = species.intensityScaling().withMoleculeShares(ratios);
        } else {
            this.selection = new LineSelection(molecules, species.isotopologues().toArray(new int[0][]));
            this.scaling = species.intensityScaling();
        }
        List<WidthSource> order = new ArrayList<>();
        for (String label : plan.widths().order()) {
            order.add(WidthSource.byLabel(label));
        }
        WidthOptions w = WidthOptions.DEFAULTS.withOrder(order);
        this.widths = plan.widths().forbidDefaults() ? w.withDefaultsForbidden() : w;
    }

    /** The factory the build command and the demo use. */
    public static TableBuilder.CalculatorFactory factory() {
        return CalculatorBlocks::new;
    }

    @Override
    public BlockResult compute(WavenumberGrid blockGrid, double pressureAtm, double temperatureK, double lineMinCm1,
                               double lineMaxCm1) {
        return block(compute(request(blockGrid, pressureAtm, temperatureK), engine, lineMinCm1, lineMaxCm1, null),
                sums());
    }

    @Override
    public boolean keepsExactSums() {
        return engine instanceof ExactEngine;
    }

    @Override
    public BlockResult computeSelected(WavenumberGrid blockGrid, double pressureAtm, double temperatureK,
                                       double lineMinCm1, double lineMaxCm1, LineFilter filter) {
        if (!keepsExactSums()) {
            throw new UnsupportedOperationException("engine " + engine.id() + " keeps no exact sums");
        }
        return block(compute(request(blockGrid, pressureAtm, temperatureK), engine, lineMinCm1, lineMaxCm1, filter),
                sums());
    }

    @Override
    public BlockResult statistics(WavenumberGrid blockGrid, double pressureAtm, double temperatureK,
                                  double lineMinCm1, double lineMaxCm1) {
        try (CountOnlyEngine none = new CountOnlyEngine()) {
            CrossSectionResult r = compute(request(blockGrid, pressureAtm, temperatureK), none, lineMinCm1,
                    lineMaxCm1, null);
            return block(r, null);
        }
    }

    private CrossSectionRequest request(WavenumberGrid blockGrid, double pressureAtm, double temperatureK) {
        return new CrossSectionRequest(temperatureK, pressureAtm, plan.composition(), blockGrid, wings,
                plan.profile().shape(), plan.profile().thresholdCmPerMolecule(), selection, widths, scaling);
    }

    private FixedPointSums sums() {
        return engine instanceof ExactEngine exact ? exact.sums().copy() : null;
    }

    private CrossSectionResult compute(CrossSectionRequest request, CrossSectionEngine e, double lineMinCm1,
                                       double lineMaxCm1, LineFilter filter) {
        // the calculator's range is half-open [low, high); the block's reach is closed
        return calculator.compute(request, e, lineMinCm1, Math.nextUp(lineMaxCm1), ProgressListener.NONE, filter);
    }

    private static BlockResult block(CrossSectionResult r, FixedPointSums sums) {
        Map<String, Long> counts = new LinkedHashMap<>();
        WidthSourceTally tally = r.widthSources();
        for (BackgroundGas gas : BackgroundGas.values()) {
            for (WidthSource source : WidthSource.values()) {
                long n = tally.widths(gas, source);
                if (n > 0) {
                    counts.put("width." + gas.label() + "." + source.label(), n);
                }
            }
        }
        // lines that had the Van Vleck-Weisskopf shape (recorded in the table as count.lines_van_vleck_weisskopf)
        counts.put("lines_van_vleck_weisskopf",
                Long.parseLong(r.metadata().getOrDefault("lines_van_vleck_weisskopf", "0")));
        return new BlockResult(r.sigmaCm2PerMolecule(), r.linesUsed(), r.linesBelowThreshold(), counts,
                r.estimatedRelativeError(), r.warnings(), sums);
    }

    /** The engine's preference ({@link CrossSectionEngine#preferredBlockPoints}). */
    @Override
    public int preferredBlockPoints(WavenumberGrid grid, double paddingCm1) {
        return engine.preferredBlockPoints(grid, paddingCm1);
    }

    /**
     * max |δ| over the constants the width options can serve for a gas of the background: user constants, and
     * the defaults unless they are forbidden or left out of the source order. Shifts from rules and tables do
     * not exist (0), and line-list shifts are the lines' own columns.
     */
    @Override
    public double maxConstantShiftCm1PerAtm() {
        List<WidthSource> order = widths.order().isEmpty() ? WidthResolver.DEFAULT_ORDER : widths.order();
        boolean defaults = !widths.forbidDefaults() && order.contains(WidthSource.DEFAULT);
        boolean user = order.contains(WidthSource.USER_CONSTANT);
        double max = 0;
        for (BackgroundGas gas : plan.composition().presentGases()) {
            GasParameters constant = widths.userConstants().get(gas);
            if (user && constant != null) {
                max = Math.max(max, Math.abs(constant.shiftCm1PerAtm()));
            }
            if (defaults) {
                max = Math.max(max, Math.abs(GasParameters.defaultFor(gas).shiftCm1PerAtm()));
            }
        }
        return max;
    }

    @Override
    public Map<String, String> describe() {
        Map<String, String> m = new LinkedHashMap<>();
        m.put("engine", engine.id());
        engine.describe().forEach((k, v) -> m.put("engine." + k, v));
        m.putAll(wings.describe()); // keys already start with "wing."
        m.put("selection", selection.describe());
        m.put("widths", widths.describe());
        return m;
    }

    @Override
    public void close() {
        engine.close();
    }
}
