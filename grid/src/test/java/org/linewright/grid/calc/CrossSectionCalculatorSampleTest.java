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
import org.linewright.broadening.sources.WidthOptions;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.wings.ChiFactorKind;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.engine.exact.ExactEngine;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.testsupport.ReferenceSamples;

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
        coSample = ReferenceSamples.hitranSample("sample_CO.par");
        co2Sample = ReferenceSamples.hitranSample("sample_CO2.par");
        coStore = LineStore.open(ReferenceSamples.ingest(tmp.resolve("co"), coSample));
        co2Store = LineStore.open(ReferenceSamples.ingest(tmp.resolve("co2"), co2Sample));
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
        assertEquals("296.0", r.metadata().get("temperature_K"));
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

    /** {ν, S, γ_air, δ_air, molecule, isotopologue} of every record (160-character columns 1–2, 3, 4–15, 16–25, 36–40, 60–67). */
    private static double[][] fullRecords(Path sample) throws IOException {
        return Files.readAllLines(sample, StandardCharsets.US_ASCII).stream()
                .filter(l -> l.length() >= 160)
                .map(l -> new double[] {Double.parseDouble(l.substring(3, 15).trim()),
                    Double.parseDouble(l.substring(15, 25).trim()), Double.parseDouble(l.substring(35, 40).trim()),
                    Double.parseDouble(l.substring(59, 67).trim()), Double.parseDouble(l.substring(0, 2).trim()),
                    Double.parseDouble(l.substring(2, 3).trim())})
                .toArray(double[][]::new);
    }

    /** The strongest record of the sample with 2000 ≤ ν < 2200. */
    private static double[] strongestNear2100(double[][] recs) {
        double[] best = null;
        for (double[] r : recs) {
            if (r[0] >= 2000 && r[0] < 2200 && (best == null || r[1] > best[1])) {
                best = r;
            }
        }
        return best;
    }

    @Test
    void lorentzShapeMatchesAnIndependentSumOverTheRecords() throws IOException {
        double[][] recs = fullRecords(coSample);
        double[] line = strongestNear2100(recs);
        double p = 0.8;
        double centre = line[0] + line[3] * p;
        // 41 points centred on the strongest line's shifted centre
        WavenumberGrid grid = WavenumberGrid.uniform(centre - 0.2, centre + 0.2, 0.01);
        CrossSectionRequest req = new CrossSectionRequest(296.0, p, Composition.air(), grid, WingTreatment.defaults(),
                LineShapeKind.LORENTZ, 0.0, LineSelection.ALL, WidthOptions.DEFAULTS);
        CrossSectionResult r;
        try (ExactEngine engine = new ExactEngine(2, WingTreatment.defaults())) {
            r = new CrossSectionCalculator(List.of(coStore), MoleculeRegistry.builtIn())
                    .compute(req, engine, ProgressListener.NONE);
        }
        // σ(ν) = Σ S·γ/(π((ν − ν0)² + γ²)) over records with |ν − ν0| ≤ 25, γ = p·γ_air (T = 296 K),
        // ν0 = ν + p·δ_air: the Lorentz profile and the line-list conventions of the 160-character format
        // (Rothman et al. 1998, JQSRT 60, 665, appendix), summed here in long-double-free plain Java
        double[] points = grid.pointsCm1();
        for (int j = 0; j < points.length; j++) {
            double expected = 0;
            for (double[] rec : recs) {
                double nu0 = rec[0] + rec[3] * p;
                double d = points[j] - nu0;
                double gamma = rec[2] * p;
                if (Math.abs(d) <= 25) {
                    expected += rec[1] * gamma / (Math.PI * (d * d + gamma * gamma));
                }
            }
            assertEquals(expected, r.sigmaCm2PerMolecule()[j], 1e-11 * expected, "point " + points[j]);
        }
    }

    @Test
    void dopplerShapePeakHasTheHandbookDopplerWidth() throws IOException {
        double[][] recs = fullRecords(coSample);
        double[] line = strongestNear2100(recs);
        assertEquals(1.0, line[5], "the strongest CO line is of 12C16O");
        double p = 1.0;
        double t = 296.0;
        double centre = line[0] + line[3] * p;
        WavenumberGrid grid = WavenumberGrid.uniform(centre - 0.01, centre + 0.01, 0.0005);
        CrossSectionRequest req = new CrossSectionRequest(t, p, Composition.air(), grid, WingTreatment.defaults(),
                LineShapeKind.DOPPLER, 0.0, LineSelection.ALL, WidthOptions.DEFAULTS);
        CrossSectionResult r;
        try (ExactEngine engine = new ExactEngine(1, WingTreatment.defaults())) {
            r = new CrossSectionCalculator(List.of(coStore), MoleculeRegistry.builtIn())
                    .compute(req, engine, ProgressListener.NONE);
        }
        // αD = 3.581e-7·ν·sqrt(T/M) (handbook form of the Doppler HWHM, common practice), M(12C16O) = 27.9949 g/mol
        // (from memory); Gaussian peak S·sqrt(ln2/π)/αD. The handbook constant has 4 digits: 1e-3 tolerance.
        double alphaD = 3.581e-7 * line[0] * Math.sqrt(t / 27.9949);
        double peak = line[1] * Math.sqrt(Math.log(2) / Math.PI) / alphaD;
        assertEquals(peak, r.sigmaCm2PerMolecule()[20], 1e-3 * peak);
        // the other lines lie > 1 cm-1 away: hundreds of Doppler widths, nothing of them reaches these points
        assertEquals(0.0, r.sigmaCm2PerMolecule()[0] - line[1] * Math.sqrt(Math.log(2) / Math.PI) / alphaD
                * Math.exp(-Math.log(2) * Math.pow(0.01 / alphaD, 2)), 1e-3 * peak);
    }
}
