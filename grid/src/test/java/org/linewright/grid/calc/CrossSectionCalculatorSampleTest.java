package org.linewright.grid.calc;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.broadening.background.Composition;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.wings.ChiFactorKind;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.engine.exact.ExactEngine;
import org.linewright.grid.testsupport.ReferenceData;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.store.LineStore;

/**
 * The calculator with the exact engine on real HITRAN2020 samples (Gordon et al. 2022, JQSRT 277, 107949;
 * {@code ../shared/reference-data/hitran2020-samples/}), checked against values read independently from the
 * 160-character records (the fixed columns of the published format: ν in 4–15, S in 16–25, γ_air in 36–40).
 */
class CrossSectionCalculatorSampleTest {

    @TempDir
    static Path tmp;
    static Path coSample;
    static Path co2Sample;
    static LineStore coStore;
    static LineStore co2Store;

    @BeforeAll
    static void ingest() throws IOException {
        coSample = ReferenceData.hitranSample("sample_CO.par");
        co2Sample = ReferenceData.hitranSample("sample_CO2.par");
        coStore = LineStore.open(ReferenceData.ingest(tmp.resolve("co"), coSample));
        co2Store = LineStore.open(ReferenceData.ingest(tmp.resolve("co2"), co2Sample));
    }

    /** {ν, S(296 K), γ_air} of every record, from the fixed columns of the 160-character format. */
    private static double[][] records(Path sample) throws IOException {
        return Files.readAllLines(sample, StandardCharsets.US_ASCII).stream()
                .filter(l -> l.length() >= 160)
                .map(l -> new double[] {Double.parseDouble(l.substring(3, 15).trim()),
                    Double.parseDouble(l.substring(15, 25).trim()), Double.parseDouble(l.substring(35, 40).trim())})
                .toArray(double[][]::new);
    }

    private static double trapezoid(WavenumberGrid grid, double[] sigma) {
        double[] p = grid.pointsCm1();
        double sum = 0;
        for (int i = 1; i < p.length; i++) {
            sum += 0.5 * (sigma[i] + sigma[i - 1]) * (p[i] - p[i - 1]);
        }
        return sum;
    }

    private static CrossSectionRequest request(WavenumberGrid grid, double threshold) {
        return new CrossSectionRequest(296.0, 1.0, Composition.air(), grid, WingTreatment.defaults(),
                LineShapeKind.VOIGT, threshold, LineSelection.ALL, WidthOptions.DEFAULTS);
    }

    @Test
    void integratedSigmaEqualsSumOfIntensitiesLessLorentzWingLoss() throws IOException {
        double low = 1000.0;
        double high = 3000.0;
        double cutoff = 25.0;
        // the grid covers every selected line's ±25 cm-1 (and its shift of < 0.01 cm-1 at 1 atm)
        WavenumberGrid grid = WavenumberGrid.uniform(low - 30, high + 30, 0.01);
        CrossSectionCalculator calc = new CrossSectionCalculator(List.of(coStore), MoleculeRegistry.builtIn());
        CrossSectionResult r;
        try (ExactEngine engine = new ExactEngine(2, WingTreatment.defaults())) {
            r = calc.compute(request(grid, 0.0), engine, low, high, ProgressListener.NONE);
        }
        // Expected: at T = 296 K, S(T) = S(296 K) of the file; at 1 atm air, γL = γ_air of the file (n irrelevant
        // at 296 K); area kept by a Voigt line of γL ≫ αD inside ±d is 1 − (2/π)·atan(γ/d) (exact for the
        // Lorentzian, common practice; the Gaussian core changes it by O((αD/d)²) < 1e-8)
        double sumS = 0;
        double kept = 0;
        int n = 0;
        for (double[] rec : records(coSample)) {
            if (rec[0] >= low && rec[0] < high) {
                sumS += rec[1];
                kept += rec[1] * (1 - 2 / Math.PI * Math.atan(rec[2] / cutoff));
                n++;
            }
        }
        assertTrue(n > 100, "lines in range: " + n);
        assertEquals(n, r.linesUsed());
        assertEquals(sumS, r.sumIntensityCmPerMolecule(), 1e-12 * sumS);
        assertEquals(1 - kept / sumS, r.wingLossFraction(), 1e-6 * (1 - kept / sumS));
        assertEquals(kept, trapezoid(grid, r.sigmaCm2PerMolecule()), 1e-6 * kept);
        assertEquals(0.0, r.droppedIntensityFraction());
        assertEquals("exact", r.metadata().get("engine"));
        assertEquals("296.0", r.metadata().get("temperature_k"));
        // 0.01 cm-1 resolves lines of half width ≈ 0.05 cm-1: no resolution warning
        assertTrue(r.warnings().stream().noneMatch(w -> w.contains("coarser")), r.warnings().toString());
    }

    @Test
    void thresholdDropsTheWeakLinesAndReportsTheirShare() throws IOException {
        double[][] recs = records(coSample);
        double[] s = Arrays.stream(recs).mapToDouble(r -> r[1]).sorted().toArray();
        double threshold = s[s.length / 2];
        double total = 0;
        double below = 0;
        long belowCount = 0;
        for (double[] rec : recs) {
            total += rec[1];
            if (rec[1] < threshold) {
                below += rec[1];
                belowCount++;
            }
        }
        // a grid spanning every line of the sample (3.4–14478 cm-1) with its 25 cm-1 reach
        WavenumberGrid grid = WavenumberGrid.uniform(1.0, 14600.0, 0.5);
        CrossSectionCalculator calc = new CrossSectionCalculator(List.of(coStore), MoleculeRegistry.builtIn());
        CrossSectionResult r;
        try (ExactEngine engine = new ExactEngine(1, WingTreatment.defaults())) {
            r = calc.compute(request(grid, threshold), engine, ProgressListener.NONE);
        }
        assertEquals(belowCount, r.linesBelowThreshold());
        assertEquals(recs.length - belowCount, r.linesUsed());
        assertEquals(below / total, r.droppedIntensityFraction(), 1e-12);
        // a 0.5 cm-1 step cannot resolve lines of half width ~0.05 cm-1 (1 atm of air): warned
        assertTrue(r.warnings().stream().anyMatch(w -> w.contains("coarser than the narrowest line half width")),
                r.warnings().toString());
    }

    @Test
    void bitwiseIdenticalAcrossThreadCountsOnRealCo2WithChiAndPedestal() throws IOException {
        WavenumberGrid grid = WavenumberGrid.uniform(400.0, 520.0, 0.004);
        WingTreatment wings = WingTreatment.defaults().withPedestalRemoval(true)
                .withChiFactor(ChiFactorKind.PERRIN_HARTMANN_CO2);
        CrossSectionRequest req = new CrossSectionRequest(296.0, 0.5, Composition.parse("co2=0.95,n2=0.05"), grid,
                wings, LineShapeKind.VOIGT, 0.0, LineSelection.ALL, WidthOptions.DEFAULTS);
        CrossSectionCalculator calc = new CrossSectionCalculator(List.of(co2Store), MoleculeRegistry.builtIn());
        double[][] sigma = new double[3][];
        for (int t = 1; t <= 3; t++) {
            try (ExactEngine engine = new ExactEngine(t, wings)) {
                sigma[t - 1] = calc.compute(req, engine, ProgressListener.NONE).sigmaCm2PerMolecule();
            }
        }
        assertTrue(Arrays.stream(sigma[0]).anyMatch(v -> v > 0));
        // Arrays.equals on double[] compares doubleToLongBits: bit for bit
        assertTrue(Arrays.equals(sigma[0], sigma[1]), "1 vs 2 threads");
        assertTrue(Arrays.equals(sigma[0], sigma[2]), "1 vs 3 threads");
    }

    @Test
    void adjacentLineBlocksAddUpToTheWhole() throws IOException {
        WavenumberGrid grid = WavenumberGrid.uniform(2000.0, 2200.0, 0.01);
        CrossSectionCalculator calc = new CrossSectionCalculator(List.of(coStore), MoleculeRegistry.builtIn());
        CrossSectionRequest req = request(grid, 0.0);
        try (ExactEngine engine = new ExactEngine(2, WingTreatment.defaults())) {
            double[] whole = calc.compute(req, engine, ProgressListener.NONE).sigmaCm2PerMolecule();
            double[] a = calc.compute(req, engine, Double.NEGATIVE_INFINITY, 2100.0, ProgressListener.NONE)
                    .sigmaCm2PerMolecule();
            double[] b = calc.compute(req, engine, 2100.0, Double.POSITIVE_INFINITY, ProgressListener.NONE)
                    .sigmaCm2PerMolecule();
            for (int i = 0; i < whole.length; i++) {
                // only the order of the additions differs: a few ulps of the largest term
                assertEquals(whole[i], a[i] + b[i], 1e-12 * whole[i] + 1e-40, "point " + i);
            }
        }
    }

    @Test
    void twoStoresGiveTheSumOfEach() throws IOException {
        WavenumberGrid grid = WavenumberGrid.uniform(400.0, 2200.0, 0.02);
        CrossSectionRequest req = request(grid, 0.0);
        MoleculeRegistry registry = MoleculeRegistry.builtIn();
        try (ExactEngine engine = new ExactEngine(2, WingTreatment.defaults())) {
            double[] both = new CrossSectionCalculator(List.of(coStore, co2Store), registry)
                    .compute(req, engine, ProgressListener.NONE).sigmaCm2PerMolecule();
            double[] co = new CrossSectionCalculator(List.of(coStore), registry)
                    .compute(req, engine, ProgressListener.NONE).sigmaCm2PerMolecule();
            double[] co2 = new CrossSectionCalculator(List.of(co2Store), registry)
                    .compute(req, engine, ProgressListener.NONE).sigmaCm2PerMolecule();
            for (int i = 0; i < both.length; i++) {
                assertEquals(co[i] + co2[i], both[i], 1e-12 * both[i] + 1e-40, "point " + i);
            }
        }
    }
}
