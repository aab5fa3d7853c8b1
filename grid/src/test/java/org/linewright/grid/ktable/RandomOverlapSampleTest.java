package org.linewright.grid.ktable;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.broadening.background.Composition;
import org.linewright.broadening.sources.WidthOptions;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.grid.calc.CrossSectionCalculator;
import org.linewright.grid.calc.CrossSectionRequest;
import org.linewright.grid.calc.LineSelection;
import org.linewright.grid.calc.ProgressListener;
import org.linewright.grid.engine.exact.ExactEngine;
import org.linewright.grid.plan.TablePlan;
import org.linewright.grid.table.TableContent;
import org.linewright.grid.table.TableWriter;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.InputException;
import org.linewright.ingest.partition.PartitionSums;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.testsupport.ReferenceSamples;

/**
 * Random overlap with resorting and rebinning (Lacis &amp; Oinas 1991, JGR 96, 9027; Amundsen et al. 2017, A&amp;A
 * 598, A97) of two species whose real HITRAN2020 samples (Gordon et al. 2022; {@code ../shared/reference-data/})
 * overlap in 100–300 cm⁻¹: CO2 and PH3. Compared with the k-table of the VMR-weighted σ sum (the same quadrature,
 * no overlap assumption) and with the direct band transmittance of that sum.
 */
class RandomOverlapSampleTest {
    static final double[] P = {0.1, 1.0};
    static final double[] T = {296.0};
    static final double X_CO2 = 0.7;
    static final double X_PH3 = 0.3;

    @TempDir
    static Path tmp;
    static Path co2Table;
    static Path ph3Table;
    static Path mixTable;

    @BeforeAll
    static void tables() throws IOException {
        LineStore co2 = LineStore.open(ReferenceSamples.ingest(tmp.resolve("co2"), ReferenceSamples.hitranSample("sample_CO2.par")));
        LineStore ph3 = LineStore.open(ReferenceSamples.ingest(tmp.resolve("ph3"), ReferenceSamples.hitranSample("sample_PH3.par")));
        WavenumberGrid grid = WavenumberGrid.uniform(100.0, 300.0, 0.02);
        double[][][] a = sigma(co2, grid);
        double[][][] b = sigma(ph3, grid);
        co2Table = write(tmp.resolve("co2.h5"), grid, a, null, 1, 0);
        ph3Table = write(tmp.resolve("ph3.h5"), grid, b, null, 1, 0);
        mixTable = write(tmp.resolve("mix.h5"), grid, a, b, X_CO2, X_PH3);
    }

    static double[][][] sigma(LineStore store, WavenumberGrid grid) throws IOException {
        CrossSectionCalculator calc = new CrossSectionCalculator(List.of(store),
                PartitionSums.of(MoleculeRegistry.builtIn()).attachedRegistry());
        double[][][] s = new double[P.length][T.length][];
        try (ExactEngine engine = new ExactEngine(2, WingTreatment.defaults())) {
            for (int p = 0; p < P.length; p++) {
                for (int t = 0; t < T.length; t++) {
                    s[p][t] = calc.compute(new CrossSectionRequest(T[t], P[p] / 1.01325, Composition.air(), grid,
                            WingTreatment.defaults(), LineShapeKind.VOIGT, 0.0, LineSelection.ALL, WidthOptions.DEFAULTS),
                            engine, ProgressListener.NONE).sigmaCm2PerMolecule();
                }
            }
        }
        return s;
    }

    static Path write(Path file, WavenumberGrid grid, double[][][] a, double[][][] b, double xa, double xb)
            throws IOException {
        TableWriter.write(file, new TableContent(grid.pointsCm1(), P, T, (p, t) -> {
            double[] s = a[p][t].clone();
            for (int i = 0; i < s.length; i++) {
                s[i] = xa * s[i] + (b == null ? 0 : xb * b[p][t][i]);
            }
            return s;
        }, TablePlan.Precision.FLOAT64, Map.of()));
        return file;
    }

    @Test
    void randomOverlapAgreesWithTheKTableOfTheVmrWeightedSum() throws IOException {
        KTableRequest req = KTableRequest.of(KTableRequest.Binning.fixedWidth(10.0));
        KTableContent co2 = KTableBuilder.compute(co2Table, req, 2).content();
        KTableContent ph3 = KTableBuilder.compute(ph3Table, req, 2).content();
        KTableContent mix = KTableBuilder.compute(mixTable, req, 2).content();
        KTableContent ro = RandomOverlap.combine(List.of(co2, ph3), new double[] {X_CO2, X_PH3}, List.of("CO2", "PH3"));
        double worstVsMix = 0;
        double worstVsDirect = 0;
        double worstMixVsDirect = 0;
        double worstVsMixAbove01 = 0;
        double worstAbsolute = 0;
        double worstProductVsDirect = 0;
        double worstRoVsProduct = 0;
        double[][] sa = {org.linewright.grid.table.CrossSectionTable.open(co2Table).sigma(0, 0),
            org.linewright.grid.table.CrossSectionTable.open(co2Table).sigma(1, 0)};
        double[][] sb = {org.linewright.grid.table.CrossSectionTable.open(ph3Table).sigma(0, 0),
            org.linewright.grid.table.CrossSectionTable.open(ph3Table).sigma(1, 0)};
        org.linewright.grid.table.CrossSectionTable sigma = org.linewright.grid.table.CrossSectionTable.open(mixTable);
        double[] optical = {1e-3, 0.01, 0.1, 0.3, 1, 3, 10};
        for (int p = 0; p < P.length; p++) {
            double[] s = sigma.sigma(p, 0);
            double[] nu = sigma.wavenumberCm1();
            for (int b = 0; b < mix.bins(); b++) {
                double mean = 0;
                int n = 0;
                for (int i = 0; i < nu.length; i++) {
                    if (nu[i] >= mix.binLowerCm1()[b] && (nu[i] < mix.binUpperCm1()[b] || b == mix.bins() - 1)) {
                        mean += s[i];
                        n++;
                    }
                }
                mean /= n;
                // the band mean is kept exactly by random overlap: Σ w_i k_i = x_A σ̄_A + x_B σ̄_B
                double roMean = 0;
                for (int i = 0; i < ro.gPoints(); i++) {
                    roMean += ro.gWeight()[i] * ro.k()[ro.kOffset(p, 0, b) + i];
                }
                assertEquals(mean, roMean, 1e-10 * mean, "band mean, bin " + b);
                for (double tau : optical) {
                    double u = tau / mean;
                    double direct = 0;
                    for (int i = 0; i < nu.length; i++) {
                        if (nu[i] >= mix.binLowerCm1()[b] && (nu[i] < mix.binUpperCm1()[b] || b == mix.bins() - 1)) {
                            direct += Math.exp(-s[i] * u);
                        }
                    }
                    direct /= n;
                    double ta = 0;
                    double tb = 0;
                    for (int i = 0; i < nu.length; i++) {
                        if (nu[i] >= mix.binLowerCm1()[b] && (nu[i] < mix.binUpperCm1()[b] || b == mix.bins() - 1)) {
                            ta += Math.exp(-X_CO2 * sa[p][i] * u);
                            tb += Math.exp(-X_PH3 * sb[p][i] * u);
                        }
                    }
                    // random overlap before any quadrature: T_mix = T_A(x_A u) T_B(x_B u)
                    double product = (ta / n) * (tb / n);
                    if (direct >= 1e-3) {
                        worstProductVsDirect = Math.max(worstProductVsDirect, Math.abs(product - direct) / direct);
                        worstRoVsProduct = Math.max(worstRoVsProduct,
                                Math.abs(transmittance(ro, p, b, u) - product) / product);
                    }
                    if (direct < 1e-3) {
                        continue;
                    }
                    double tRo = transmittance(ro, p, b, u);
                    double tMix = transmittance(mix, p, b, u);
                    worstVsMix = Math.max(worstVsMix, Math.abs(tRo - tMix) / tMix);
                    worstVsDirect = Math.max(worstVsDirect, Math.abs(tRo - direct) / direct);
                    worstMixVsDirect = Math.max(worstMixVsDirect, Math.abs(tMix - direct) / direct);
                    worstAbsolute = Math.max(worstAbsolute, Math.abs(tRo - tMix));
                    if (tMix >= 0.1) {
                        worstVsMixAbove01 = Math.max(worstVsMixAbove01, Math.abs(tRo - tMix) / tMix);
                    }
                }
            }
        }
        System.out.printf(Locale.ROOT, "random overlap CO2+PH3 (x = %.1f, %.1f), 16 GL points, 10 cm-1 bins, 100-300 cm-1: "
                        + "worst |T_ro - T_k(mix)|/T_k(mix) %.3e, |T_ro - T_direct|/T_direct %.3e, "
                        + "|T_k(mix) - T_direct|/T_direct %.3e (where T >= 1e-3); where T >= 0.1: %.3e; "
                        + "worst |T_ro - T_k(mix)| %.3e; product of direct T_A T_B vs direct %.3e; T_ro vs that product %.3e%n",
                X_CO2, X_PH3, worstVsMix, worstVsDirect, worstMixVsDirect, worstVsMixAbove01, worstAbsolute, worstProductVsDirect, worstRoVsProduct);
        // What random overlap promises is the product of the species' band transmittances, T_A(x_A u) T_B(x_B u)
        // (Lacis & Oinas 1991, eq. 22, from memory): computed directly from the σ tables, the resorted and rebinned
        // 16-point table keeps it to the quadrature's few percent (found 2.7 %).
        assertTrue(worstRoVsProduct <= 0.035, "random overlap vs the product of band transmittances: " + worstRoVsProduct);
        // Against the true mixture the assumption itself fails in these bins: the two samples' lines are not
        // uncorrelated within 10 cm-1 (the product alone is off by up to 52 %). Bounds: the figures found, rounded
        // up (docs/physics.md), so a regression fails; they are no accuracy claim.
        assertTrue(worstVsMix <= 0.55, "random overlap vs k-table of the sum: " + worstVsMix);
        assertTrue(worstVsMixAbove01 <= 0.21, "random overlap vs k-table of the sum where T >= 0.1: " + worstVsMixAbove01);
        assertTrue(worstMixVsDirect <= 0.02, "k-table of the sum vs direct: " + worstMixVsDirect);
    }

    /** A species of zero mixing ratio leaves the other's k-table as it is (resorting then rebinning is exact then). */
    @Test
    void aZeroMixingRatioGivesBackTheOtherTable() throws IOException {
        KTableRequest req = KTableRequest.of(KTableRequest.Binning.fixedWidth(10.0));
        KTableContent co2 = KTableBuilder.compute(co2Table, req, 1).content();
        KTableContent ph3 = KTableBuilder.compute(ph3Table, req, 1).content();
        KTableContent ro = RandomOverlap.combine(List.of(co2, ph3), new double[] {1.0, 0.0}, List.of("CO2", "PH3"));
        for (int i = 0; i < co2.k().length; i++) {
            assertEquals(co2.k()[i], ro.k()[i], 1e-12 * co2.k()[i] + 1e-300, "k " + i);
        }
    }

    static double transmittance(KTableContent k, int p, int b, double u) {
        double t = 0;
        int o = k.kOffset(p, 0, b);
        for (int i = 0; i < k.gPoints(); i++) {
            t += k.gWeight()[i] * Math.exp(-k.k()[o + i] * u);
        }
        return t;
    }

    @Test
    void mismatchedTablesAreRefused() throws IOException {
        KTableContent a = KTableBuilder.compute(co2Table, KTableRequest.of(KTableRequest.Binning.fixedWidth(10.0)), 1).content();
        KTableContent b = KTableBuilder.compute(ph3Table, KTableRequest.of(KTableRequest.Binning.fixedWidth(20.0)), 1).content();
        InputException e = assertThrows(InputException.class,
                () -> RandomOverlap.combine(List.of(a, b), new double[] {0.5, 0.5}, List.of("CO2", "PH3")));
        assertTrue(e.getMessage().contains("differs"), e.getMessage());
    }
}
