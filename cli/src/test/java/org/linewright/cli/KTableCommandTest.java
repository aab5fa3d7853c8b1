package org.linewright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assumptions.assumeTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.Paths;
import java.util.Arrays;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.grid.ktable.GQuadrature;
import org.linewright.grid.ktable.KSampling;
import org.linewright.grid.ktable.KTable;
import org.linewright.grid.ktable.KTableBuilder;
import org.linewright.grid.ktable.KTableContent;
import org.linewright.grid.ktable.KTableRequest;
import org.linewright.grid.ktable.QuadratureKind;
import org.linewright.grid.table.CrossSectionTable;
import org.linewright.ingest.units.PhysicalConstants;

/** {@code linewright ktable}: the command is a thin shell over {@link KTableBuilder}, in both formats. */
class KTableCommandTest {
    /** The shipped SYNTHETIC demo lines, seen from the cli module. */
    private static final Path SYNTHETIC_CO = Paths.get("..", "demo", "data", "synthetic-co.par.bz2");

    @TempDir
    static Path dir;
    static Path table;

    private record Run(int code, String out, String err) {
    }

    private static Run run(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.commandLine(new PrintWriter(out, true), new PrintWriter(err, true)).execute(args);
        return new Run(code, out.toString(), err.toString());
    }

    @BeforeAll
    static void sigmaTable() throws Exception {
        assumeTrue(Files.isRegularFile(SYNTHETIC_CO), "shipped demo data not found");
        Path plan = dir.resolve("plan.toml");
        Files.writeString(plan, """
                # SYNTHETIC lines (the demo's invented CO list)
                [lines]
                sources = ["%s"]
                [grid]
                wavenumber = { from = 2100.0, to = 2200.0, step = 0.01 }
                pressures_bar = [0.01, 1.0]
                temperatures_K = [500.0, 1000.0]
                [background]
                H2 = 0.85
                He = 0.15
                [profile]
                cutoff_cm1 = 10.0
                [output]
                table = "t.arrow"
                """.formatted(SYNTHETIC_CO.toAbsolutePath().normalize().toString().replace("\\", "/")));
        Run build = run("build", plan.toString(), "--quiet");
        assertEquals(0, build.code(), build.err());
        table = dir.resolve("t.arrow");
    }

    @Test
    void writesWhatTheJavaApiComputesInBothFormats() throws Exception {
        KTableContent api = KTableBuilder.compute(table, KTableRequest.of(KTableRequest.Binning.resolvingPower(500))
                .withQuadrature(GQuadrature.of(QuadratureKind.SPLIT_GAUSS_LEGENDRE, 8))
                .withSampling(KSampling.INTERVAL_MEAN).withBandSigma(true, 1e20), 1).content();
        for (String name : new String[] {"k.h5", "k.arrow"}) {
            Path out = dir.resolve(name);
            Run r = run("ktable", table.toString(), "--resolving-power", "500", "--g-points", "8",
                    "--quadrature", "split-gauss-legendre", "--band-mean", "--transmission-column-per-cm2", "1e20",
                    "--threads", "2", "--out", out.toString());
            assertEquals(0, r.code(), r.err());
            // 100 cm-1 from 2100 at R = 500: ln(2200/2100)/ln(1.002) = 23.3 bins, the last cut at 2200
            assertTrue(r.out().contains("24 bins x 8 g points (split-gauss-legendre) at 2 pressures x 2 temperatures"),
                    r.out());
            assertTrue(r.out().contains("ktable " + out), r.out());
            assertTrue(r.out().contains("note: homogeneous-path band transmittance"), r.out());
            KTable k = KTable.open(out);
            assertTrue(Arrays.equals(api.k(), k.content().k()), name);
            assertTrue(Arrays.equals(api.bandMean(), k.content().bandMean()), name);
            assertTrue(Arrays.equals(api.transmissionEquivalent(), k.content().transmissionEquivalent()), name);
            assertEquals("split_gauss_legendre", k.metadata().get("g_quadrature_kind"));
            assertEquals(KTableBuilder.ACCURACY_NOTE, k.metadata().get("transmittance_accuracy_note"));
            // the σ table's provenance travels with the k-table
            CrossSectionTable sigma = CrossSectionTable.open(table);
            assertEquals(sigma.metadata().get("sigma_sha256"), k.metadata().get("sigma_sha256"));
            assertEquals(sigma.metadata().get("plan_file"), k.metadata().get("plan_file"));
        }
    }

    @Test
    void perUnitMassAndUnderResolvedBinsAreSaid() throws Exception {
        Path perMolecule = dir.resolve("m.h5");
        Path perGram = dir.resolve("g.h5");
        assertEquals(0, run("ktable", table.toString(), "--bin-width", "0.1", "--g-points", "16",
                "--out", perMolecule.toString(), "--quiet").code());
        Run r = run("ktable", table.toString(), "--bin-width", "0.1", "--g-points", "16", "--per-unit-mass", "CO",
                "--out", perGram.toString());
        assertEquals(0, r.code(), r.err());
        // 0.1 cm-1 bins of a 0.01 cm-1 grid: 10 points for 16 g points, said on stdout and in the metadata
        assertTrue(r.out().contains("warning: 1000 of 1000 bins hold fewer sigma points than g points"), r.out());
        assertTrue(r.out().contains("k in cm2/g (molar mass 28.01"), r.out());
        KTable g = KTable.open(perGram);
        KTable m = KTable.open(perMolecule);
        double mass = Double.parseDouble(g.metadata().get("molar_mass_g_per_mol"));
        assertEquals("1000", g.metadata().get("under_resolved_bins"));
        double[] kg = g.k(1, 1, 500);
        double[] km = m.k(1, 1, 500);
        for (int i = 0; i < kg.length; i++) {
            assertEquals(km[i] * PhysicalConstants.AVOGADRO_PER_MOL / mass, kg[i], 1e-14 * kg[i]);
        }
    }

    @Test
    void aPlanWithAKTableSectionBuildsTheKTableAfterTheTable(@TempDir Path planDir) throws Exception {
        Path plan = planDir.resolve("plan.toml");
        Files.writeString(plan, """
                # SYNTHETIC lines (the demo's invented CO list)
                [lines]
                sources = ["%s"]
                [grid]
                wavenumber = { from = 2100.0, to = 2110.0, step = 0.01 }
                pressures_bar = [1.0]
                temperatures_K = [500.0]
                [background]
                H2 = 0.85
                He = 0.15
                [output]
                table = "t.h5"
                [ktable]
                out = "k.arrow"
                bin_width_cm1 = 1.0
                g_points = 8
                band_mean = true
                """.formatted(SYNTHETIC_CO.toAbsolutePath().normalize().toString().replace("\\", "/")));
        Run r = run("build", plan.toString());
        assertEquals(0, r.code(), r.err());
        assertTrue(r.out().contains("ktable " + planDir.resolve("k.arrow") + " (10 bins x 8 g points"), r.out());
        Run cmd = run("ktable", planDir.resolve("t.h5").toString(), "--bin-width", "1", "--g-points", "8",
                "--band-mean", "--out", planDir.resolve("k2.arrow").toString(), "--quiet");
        assertEquals(0, cmd.code(), cmd.err());
        assertTrue(Arrays.equals(KTable.open(planDir.resolve("k2.arrow")).content().k(),
                KTable.open(planDir.resolve("k.arrow")).content().k()));
        Files.writeString(plan, Files.readString(plan).replace("g_points = 8", "g_points = 8\nbin_edges_file = \"e.txt\""));
        Run bad = run("build", plan.toString());
        assertEquals(2, bad.code(), bad.out());
        assertTrue(bad.err().contains("ktable: 2 of resolving_power, bin_width_cm1, bin_edges_file given"), bad.err());
    }
}
