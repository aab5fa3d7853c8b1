package org.linewright.grid.calc;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.linewright.broadening.background.Composition;
import org.linewright.broadening.sources.WidthOptions;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.wings.ChiFactorKind;
import org.linewright.broadening.wings.WingCutoff;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.engine.CrossSectionEngine;
import org.linewright.grid.engine.EngineFactory;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.partition.PartitionSums;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.testsupport.JitteredSamples;
import org.linewright.ingest.testsupport.ReferenceSamples;

/**
 * The fast engine's promise, checked at every grid point over a matrix of regimes against the exact engine (direct
 * summation of {@link org.linewright.broadening.voigt.VoigtProfile}, itself checked against SciPy's wofz in the
 * broadening module): wherever the exact σ ≥ 10⁻⁶·max σ the relative difference is within the requested tolerance
 * and within the engine's own estimate, and everywhere the absolute difference is within tolerance·max σ.
 *
 * <p>Lines: real HITRAN2020 records ({@code ../shared/reference-data/hitran2020-samples/}: the CO fundamental band
 * and the CO2 far-infrared records), cycled and jittered by up to ±0.3 cm⁻¹ ({@link JitteredSamples}) into lists of
 * 8,000 lines that cluster in bands with empty regions between them — dense bands, troughs between lines, isolated
 * lines and wing-only regions between bands all occur on these grids. The regimes cover pressures 10⁻⁶–1000 bar,
 * temperatures 50–4000 K, every cutoff rule (fixed 0.1–100 cm⁻¹, HWHM multiple, per atm, none), pedestal kept and
 * removed, χ wings, uniform and resolving-power grids, fine and under-resolved steps, four backgrounds and
 * tolerances 10⁻² to 10⁻⁵. A larger matrix runs in the benchmark profile.
 */
class FastEngineRegimeMatrixTest {
    @TempDir
    static Path tmp;
    static LineStore co;
    static LineStore co2;

    @BeforeAll
    static void stores() throws IOException {
        Path coList = JitteredSamples.write(ReferenceSamples.hitranSample("sample_CO.par"), tmp.resolve("co.par"),
                8000, 1900, 2400, 0.3, 1);
        Path co2List = JitteredSamples.write(ReferenceSamples.hitranSample("sample_CO2.par"), tmp.resolve("co2.par"),
                8000, 0, 500, 0.3, 2);
        co = LineStore.open(ReferenceSamples.ingest(tmp.resolve("co"), coList));
        co2 = LineStore.open(ReferenceSamples.ingest(tmp.resolve("co2"), co2List));
    }

    /**
     * @param store      CO or CO2
     * @param grid       u:FROM:TO:STEP (uniform) or r:FROM:TO:R (resolving power)
     * @param cutoff     fixed:D, hwhm:N:CAP, peratm:K:CAP or none
     * @param pedestal   keep or remove
     * @param chi        chi (CO2 χ factor) or plain
     */
    @ParameterizedTest(name = "{0}: {1}, {2} bar, {3} K, {4}, cutoff {5}, pedestal {6}, {7}, tolerance {8}")
    @CsvSource({
            "CO, u:2000:2250:0.002, 1.01325, 296, air=1, fixed:25, keep, plain, 1e-3",
            "CO, u:2000:2250:0.002, 1.01325, 296, air=1, fixed:5, keep, plain, 1e-3",
            "CO, u:2000:2250:0.002, 1.01325, 296, air=1, fixed:1, keep, plain, 1e-3",
            "CO, u:2000:2250:0.002, 1.01325, 296, air=1, fixed:1, remove, plain, 1e-3",
            "CO, u:2000:2250:0.002, 1.01325, 296, air=1, fixed:0.1, keep, plain, 1e-3",
            "CO, u:2000:2250:0.002, 10.1325, 700, H2=0.85;He=0.15, fixed:25, keep, plain, 1e-3",
            "CO, u:2000:2250:0.002, 0.101325, 296, air=1, hwhm:200:25, keep, plain, 1e-3",
            "CO, u:2000:2250:0.002, 1e-4, 1500, air=1, fixed:25, keep, plain, 1e-3",
            "CO, u:2000:2250:0.002, 1e-6, 296, air=1, fixed:25, keep, plain, 1e-3",
            "CO, u:2000:2250:0.002, 1000, 296, N2=1, fixed:25, keep, plain, 1e-3",
            "CO, u:2000:2250:0.002, 1000, 296, N2=1, peratm:1:100, keep, plain, 1e-3",
            "CO, u:2000:2250:0.002, 1.01325, 50, air=1, fixed:25, keep, plain, 1e-3",
            "CO, u:2000:2250:0.002, 1.01325, 4000, air=1, fixed:25, keep, plain, 1e-3",
            "CO, u:2100:2150:0.002, 1.01325, 296, air=1, none, keep, plain, 1e-3",
            "CO, u:2000:2250:0.1, 1.01325, 296, air=1, fixed:25, keep, plain, 1e-3",
            "CO, u:2000:2250:0.05, 1e-3, 296, air=1, fixed:25, keep, plain, 1e-3",
            "CO, r:2050:2150:1e6, 1e-3, 296, air=1, fixed:25, keep, plain, 1e-3",
            "CO, r:2000:2250:1e5, 1.01325, 296, air=1, fixed:25, keep, plain, 1e-3",
            "CO, u:2000:2250:0.002, 1.01325, 296, air=1, fixed:25, keep, plain, 1e-2",
            "CO, u:2000:2250:0.002, 1.01325, 296, air=1, fixed:25, keep, plain, 1e-4",
            "CO, u:2000:2250:0.002, 1.01325, 296, air=1, fixed:25, remove, plain, 1e-5",
            "CO2, r:100:400:1e5, 1.01325, 1000, air=1, fixed:25, keep, plain, 1e-3",
            "CO2, u:100:400:0.01, 101.325, 740, CO2=1, peratm:1:100, keep, plain, 1e-3",
            "CO2, u:100:400:0.01, 101.325, 740, CO2=1, peratm:1:100, keep, chi, 1e-3",
            "CO2, u:100:400:0.005, 1.01325, 296, CO2=0.96;N2=0.04, fixed:25, remove, chi, 1e-3",
    })
    void withinToleranceAndEstimateAtEveryPoint(String store, String gridSpec, double pressureBar, double temperatureK,
                                               String background, String cutoff, String pedestal, String chi,
                                               double tolerance) {
        check(store.equals("CO") ? co : co2, store, gridSpec, pressureBar, temperatureK, background, cutoff, pedestal,
                chi, tolerance);
    }

    /** One regime: fast against exact at every point (shared with the benchmark profile's larger matrix). */
    static void check(LineStore lines, String store, String gridSpec, double pressureBar, double temperatureK,
                      String background, String cutoff, String pedestal, String chi, double tolerance) {
        WavenumberGrid grid = grid(gridSpec);
        WingTreatment wings = WingTreatment.defaults().withCutoff(cutoff(cutoff))
                .withPedestalRemoval(pedestal.equals("remove"))
                .withChiFactor(chi.equals("chi") ? ChiFactorKind.PERRIN_HARTMANN_CO2 : ChiFactorKind.NONE);
        CrossSectionRequest request = new CrossSectionRequest(temperatureK, pressureBar / 1.01325,
                Composition.parse(background.replace(';', ',')), grid, wings, LineShapeKind.VOIGT, 0.0,
                LineSelection.ALL, WidthOptions.DEFAULTS);
        MoleculeRegistry registry = PartitionSums.of(MoleculeRegistry.builtIn()).attachedRegistry();
        CrossSectionCalculator calc = new CrossSectionCalculator(List.of(lines), registry, 2);
        CrossSectionResult exact;
        CrossSectionResult fast;
        try (CrossSectionEngine e = EngineFactory.create("exact", 2, wings, tolerance)) {
            exact = calc.compute(request, e, ProgressListener.NONE);
        }
        try (CrossSectionEngine e = EngineFactory.create("fast", 2, wings, tolerance)) {
            fast = calc.compute(request, e, ProgressListener.NONE);
        }
        double[] a = exact.sigmaCm2PerMolecule();
        double[] b = fast.sigmaCm2PerMolecule();
        double max = 0;
        for (double v : a) {
            max = Math.max(max, v);
        }
        assertTrue(max > 0, "lines in range");
        double worst = 0;
        double worstAbsolute = 0;
        int worstAt = -1;
        for (int i = 0; i < a.length; i++) {
            double diff = Math.abs(b[i] - a[i]);
            worstAbsolute = Math.max(worstAbsolute, diff / max);
            if (a[i] >= 1e-6 * max && diff / a[i] > worst) {
                worst = diff / a[i];
                worstAt = i;
            }
        }
        String where = worstAt < 0 ? "" : String.format(" at %.4f cm-1 (sigma/max %.2e)",
                grid.pointsCm1()[worstAt], a[worstAt] / max);
        double estimate = fast.estimatedRelativeError();
        System.out.printf(java.util.Locale.ROOT, "%s %s %s bar %s K %s %s %s %s tol %s: observed %.2e, estimate %.2e, "
                        + "absolute %.2e of max, %s of %d lines summed directly, %d points%n", store, gridSpec,
                pressureBar, temperatureK, background, cutoff, pedestal, chi, tolerance, worst, estimate, worstAbsolute,
                fast.metadata().getOrDefault("engine.fast.direct_lines", "0"), fast.linesUsed(), a.length);
        assertTrue(worst <= tolerance, "worst relative difference " + worst + where + " above the tolerance "
                + tolerance + " (estimate " + estimate + ")");
        assertTrue(worst <= estimate, "observed " + worst + where + " beyond the estimate " + estimate);
        assertTrue(worstAbsolute <= tolerance, "absolute difference " + worstAbsolute + " of max sigma");
    }

    static WavenumberGrid grid(String spec) {
        String[] f = spec.split(":");
        double from = Double.parseDouble(f[1]);
        double to = Double.parseDouble(f[2]);
        double x = Double.parseDouble(f[3]);
        return f[0].equals("u") ? WavenumberGrid.uniform(from, to, x) : WavenumberGrid.resolvingPower(from, to, x);
    }

    static WingCutoff cutoff(String spec) {
        String[] f = spec.split(":");
        return switch (f[0]) {
            case "fixed" -> WingCutoff.fixed(Double.parseDouble(f[1]));
            case "hwhm" -> WingCutoff.hwhmMultiple(Double.parseDouble(f[1]), Double.parseDouble(f[2]));
            case "peratm" -> WingCutoff.pressureScaled(Double.parseDouble(f[1]), WingCutoff.PRESSURE_RULE_MIN_CM1,
                    Double.parseDouble(f[2]));
            case "none" -> WingCutoff.none();
            default -> throw new IllegalArgumentException(spec);
        };
    }
}
