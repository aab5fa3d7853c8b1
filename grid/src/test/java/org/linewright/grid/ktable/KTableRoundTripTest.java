package org.linewright.grid.ktable;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.Arrays;
import java.util.HexFormat;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.linewright.grid.plan.TablePlan;
import org.linewright.grid.table.TableContent;
import org.linewright.grid.table.TableWriter;
import org.linewright.ingest.InputException;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.units.PhysicalConstants;

/** k-tables written and read back in both formats, with synthetic σ tables whose k-distribution is known. */
class KTableRoundTripTest {
    static final double[] P = {1e-3, 0.1, 10.0};
    static final double[] T = {300.0, 700.0};

    @TempDir
    Path dir;

    /**
     * A σ field on 1000–1100 cm⁻¹ (step 0.01): in every 10 cm⁻¹ bin σ rises linearly across the bin, so its sorted
     * distribution is linear in g, k(g) = a + b g, and the interval mean of [G_{i−1}, G_i] is a + b (G_{i−1}+G_i)/2
     * (up to the 1/n steps of the grid); scaled by a factor bilinear in (ln p, T).
     */
    static double scale(double p, double t) {
        return 1 + 0.1 * Math.log(p) + 0.002 * t + 0.0001 * t * Math.log(p);
    }

    static Path sigmaTable(Path file, TablePlan.Precision precision) throws IOException {
        int n = 10001;
        double[] nu = new double[n];
        for (int i = 0; i < n; i++) {
            nu[i] = 1000.0 + i / 100.0; // i/100 rounded once: the bin edges 1010, 1020 … are hit exactly
        }
        TableWriter.write(file, new TableContent(nu, P, T, (p, t) -> {
            double[] s = new double[n];
            for (int i = 0; i < n; i++) {
                double frac = (i % 1000) / 1000.0;
                s[i] = 1e-20 * scale(P[p], T[t]) * (1 + 9 * frac);
            }
            return s;
        }, precision, Map.of("engine", "exact", "input.lines.par.sha256", "ab12")));
        return file;
    }

    @ParameterizedTest
    @ValueSource(strings = {"k.h5", "k.arrow"})
    void roundTripKeepsAxesKMetadataAndInterpolatesInLogPressureAndTemperature(String name) throws IOException {
        Path sigma = sigmaTable(dir.resolve(name.endsWith(".h5") ? "s.arrow" : "s.h5"), TablePlan.Precision.FLOAT64);
        Path out = dir.resolve(name);
        KTableRequest req = KTableRequest.of(KTableRequest.Binning.fixedWidth(10.0))
                .withQuadrature(GQuadrature.of(QuadratureKind.GAUSS_LEGENDRE, 8)).withBandSigma(true, 1e20);
        KTableBuilder.Report r = KTableBuilder.build(sigma, req, 2, out);
        KTable k = KTable.open(out);
        KTableContent c = k.content();
        assertArrayEquals(P, c.pressureBar());
        assertArrayEquals(T, c.temperatureK());
        assertEquals(10, c.bins());
        assertEquals(8, c.gPoints());
        assertArrayEquals(r.content().k(), c.k());
        assertArrayEquals(r.content().bandMean(), c.bandMean());
        assertArrayEquals(r.content().transmissionEquivalent(), c.transmissionEquivalent());
        assertArrayEquals(GQuadrature.of(QuadratureKind.GAUSS_LEGENDRE, 8).weights(), c.gWeight());
        assertEquals(1000.0, c.binLowerCm1()[0]);
        assertEquals(1100.0, c.binUpperCm1()[9]);
        // 1001 points from 1000 to 1010 in the first bin (lower ≤ ν < upper) ... the last bin also takes 1100
        assertEquals(1000, c.pointsPerBin()[0]);
        assertEquals(1001, c.pointsPerBin()[9]);
        // provenance of the source and its file checksum (the JDK's SHA-256 of its bytes)
        assertEquals("ab12", k.metadata().get("input.lines.par.sha256"));
        String sha = sha(sigma);
        assertEquals(sha, k.metadata().get("source_table_sha256"));
        assertEquals("gauss_legendre", k.metadata().get("g_quadrature_kind"));
        assertEquals("0", k.metadata().get("under_resolved_bins"));
        assertEquals("1000", k.metadata().get("sigma_points_per_bin_min"));
        // k(g) of a linear ramp: the interval means are a + b·(mid-interval g), a = 1e-20 s, b = 9e-20 s
        double[] edges = GQuadrature.of(QuadratureKind.GAUSS_LEGENDRE, 8).intervalEdges();
        for (int p = 0; p < P.length; p++) {
            for (int t = 0; t < T.length; t++) {
                double s = scale(P[p], T[t]);
                double[] kk = k.k(p, t, 3);
                for (int i = 0; i < 8; i++) {
                    // the 1000 points of a bin make k(g) a staircase of the left values 1 + 9 j/1000 on
                    // [j/1000, (j+1)/1000): its interval mean is the ramp's less half a step (0.0045)
                    double expected = 1e-20 * s * (1 + 9 * 0.5 * (edges[i] + edges[i + 1]) - 0.0045);
                    // (within the part of a step an interval edge cuts off: ≤ 0.009·0.001/w_i ≈ 2e-4 relative)
                    assertEquals(expected, kk[i], 2e-4 * expected, "p" + p + " t" + t + " g" + i);
                }
                // band mean of the staircase 1 + 9 j/1000, j = 0…999 (in 1e-20 s): 5.5 less half a step
                assertEquals(5.4955e-20 * s, c.bandMean()[c.bandOffset(p, t, 3)], 1e-12 * 5.5e-20 * s);
            }
        }
        // interpolation: exact for a field bilinear in (ln p, T), point by point in g
        double[] q = k.kAt(0.037, 412.5, 3);
        double[] corner = k.k(0, 0, 3);
        double ratio = scale(0.037, 412.5) / scale(P[0], T[0]);
        for (int i = 0; i < 8; i++) {
            assertEquals(corner[i] * ratio, q[i], 1e-12 * q[i]);
        }
        InputException outside = assertThrows(InputException.class, () -> k.kAt(1e-4, 400.0, 0));
        assertTrue(outside.getMessage().contains("pressure 1.0E-4 bar is outside"), outside.getMessage());
        assertEquals(sha(out) + "  " + name + "\n", Files.readString(TableWriter.sidecar(out)));
    }

    private static String sha(Path f) throws IOException {
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(f)));
        } catch (java.security.NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }

    @Test
    void sameBitsForAnyThreadCount() throws IOException {
        Path sigma = sigmaTable(dir.resolve("s.h5"), TablePlan.Precision.FLOAT32);
        KTableRequest req = KTableRequest.of(KTableRequest.Binning.resolvingPower(2000)).withBandSigma(true, 3e19);
        KTableContent one = KTableBuilder.compute(sigma, req, 1).content();
        for (int threads : new int[] {2, 3}) {
            KTableContent many = KTableBuilder.compute(sigma, req, threads).content();
            assertTrue(Arrays.equals(one.k(), many.k()), threads + " threads");
            assertTrue(Arrays.equals(one.transmissionEquivalent(), many.transmissionEquivalent()));
        }
        // R = 2000 over 1000–1100 cm-1: ln(1.1)/ln(1 + 1/2000) = 190.7 bins (the last one cut at 1100)
        assertEquals(191, one.bins());
        assertEquals(2000.0, one.binLowerCm1()[10] / (one.binUpperCm1()[10] - one.binLowerCm1()[10]), 1e-6);
    }

    @Test
    void underResolvedBinsAreSaidAndEmptyBinsRefused() throws IOException {
        Path sigma = sigmaTable(dir.resolve("s.arrow"), TablePlan.Precision.FLOAT64);
        KTableRequest req = KTableRequest.of(KTableRequest.Binning.fixedWidth(0.05));
        KTableBuilder.Report r = KTableBuilder.compute(sigma, req, 2);
        assertEquals(1, r.warnings().size());
        assertTrue(r.warnings().get(0).contains("fewer sigma points than g points (16; fewest 5"), r.warnings().get(0));
        assertEquals("2000", r.content().metadata().get("under_resolved_bins"));
        InputException empty = assertThrows(InputException.class,
                () -> KTableBuilder.compute(sigma, KTableRequest.of(KTableRequest.Binning.fixedWidth(0.001)), 1));
        assertTrue(empty.getMessage().contains("holds no sigma point"), empty.getMessage());
        Path edges = Files.writeString(dir.resolve("edges.txt"), "# edges\n1000\n1050\n1200\n");
        InputException outside = assertThrows(InputException.class,
                () -> KTableBuilder.compute(sigma, KTableRequest.of(KTableRequest.Binning.of(SpectralBins.readEdges(edges))), 1));
        assertTrue(outside.getMessage().contains("reach outside"), outside.getMessage());
        Path bad = Files.writeString(dir.resolve("bad.txt"), "1000\n990\n");
        InputException descending = assertThrows(InputException.class, () -> SpectralBins.readEdges(bad));
        assertTrue(descending.getMessage().contains("line 2, column 1"), descending.getMessage());
    }

    @Test
    void perUnitMassDividesByTheIsotopologueWeightedMolarMass() throws IOException {
        Path sigma = sigmaTable(dir.resolve("s.h5"), TablePlan.Precision.FLOAT64);
        MoleculeRegistry registry = MoleculeRegistry.builtIn();
        double m = SpeciesMass.isotopologueWeightedGPerMol(registry, "CO");
        // CO in natural abundance: 28.0101 g/mol (IUPAC standard atomic weights C 12.011, O 15.999; handbook value)
        assertEquals(28.0101, m, 0.002);
        KTableRequest base = KTableRequest.of(KTableRequest.Binning.fixedWidth(10.0));
        KTableContent perMolecule = KTableBuilder.compute(sigma, base, 1).content();
        KTableContent perGram = KTableBuilder.compute(sigma, base.withPerMass(m, "CO"), 1).content();
        assertEquals("cm2/g", perGram.unit());
        assertEquals("cm2/g", perGram.metadata().get("k_unit"));
        for (int i = 0; i < perGram.k().length; i += 37) {
            assertEquals(perMolecule.k()[i] * PhysicalConstants.AVOGADRO_PER_MOL / m, perGram.k()[i],
                    1e-14 * perGram.k()[i]);
        }
        Path out = dir.resolve("g.h5");
        KTableWriter.write(out, perGram);
        assertTrue(KTable.open(out).content().perGram());
    }

    @Test
    void transmissionEquivalentSigmaLiesBetweenTheMinimumAndTheMean() throws IOException {
        Path sigma = sigmaTable(dir.resolve("s.h5"), TablePlan.Precision.FLOAT64);
        for (double u : new double[] {1e15, 1e20, 1e21, 1e24}) {
            KTableContent c = KTableBuilder.compute(sigma,
                    KTableRequest.of(KTableRequest.Binning.fixedWidth(10.0)).withBandSigma(true, u), 1).content();
            double s = scale(P[0], T[0]);
            double te = c.transmissionEquivalent()[c.bandOffset(0, 0, 2)];
            double mean = c.bandMean()[c.bandOffset(0, 0, 2)];
            // σ_j = a + b j/n, j = 0…n−1: mean exp(−σu) = e^{−au}(1 − e^{−bu})/(n(1 − e^{−bu/n})) (geometric series)
            double a = 1e-20 * s;
            double b = 9e-20 * s;
            int n = 1000;
            double expected = -Math.log(Math.exp(-a * u) * (-Math.expm1(-b * u)) / (n * -Math.expm1(-b * u / n))) / u;
            assertTrue(te <= mean * (1 + 1e-12) && te >= a * (1 - 1e-12), "u=" + u);
            assertEquals(expected, te, 1e-9 * expected, "u=" + u);
        }
    }
}
