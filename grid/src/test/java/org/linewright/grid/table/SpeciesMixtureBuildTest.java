package org.linewright.grid.table;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.Arrays;
import java.util.Locale;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.grid.plan.PlanReader;
import org.linewright.ingest.InputException;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.testsupport.ReferenceSamples;

/**
 * {@code build} with the plan's intensity convention, abundances and mixing ratios, on real lines: the HITRAN2020
 * CO and CO2 samples (Gordon et al. 2022, JQSRT 277, 107949; {@code ../shared/reference-data/hitran2020-samples/}),
 * whose pure rotational lines overlap in 20–300 cm⁻¹. Every check compares tables cell by cell at every point.
 */
class SpeciesMixtureBuildTest {
    /** The registry's (HITRAN) natural abundance of 13C16O, CO isotopologue 2. */
    private static final double CO_13C_ABUNDANCE = MoleculeRegistry.builtIn().naturalAbundance(5, 2);

    @TempDir
    Path dir;

    /** A plan over the given samples in its own folder, with {@code species} as the [species] section's body. */
    private Path plan(String folder, String species, String... samples) throws IOException {
        Path d = Files.createDirectories(dir.resolve(folder));
        StringBuilder sources = new StringBuilder();
        for (String s : samples) {
            Files.copy(ReferenceSamples.hitranSample(s), d.resolve(s), StandardCopyOption.REPLACE_EXISTING);
            sources.append(sources.length() == 0 ? "" : ", ").append('"').append(s).append('"');
        }
        Path plan = d.resolve("plan.toml");
        Files.writeString(plan, String.format(Locale.ROOT, """
                [lines]
                sources = [%s]
                [grid]
                wavenumber = { from = 20.0, to = 300.0, step = 0.5 }
                pressures_bar = [0.1, 1.0]
                temperatures_K = [296.0, 700.0]
                [background]
                air = 1.0
                [profile]
                cutoff_cm1 = 5.0
                [build]
                block_points = 200
                [species]
                %s
                [output]
                table = "out/t.arrow"
                """, sources, species));
        return plan;
    }

    private static BuildReport build(Path plan) throws IOException {
        return TableBuilder.build(PlanReader.read(plan), CalculatorBlocks.factory(), 1, false, BuildListener.NONE);
    }

    private static CrossSectionTable table(Path plan) throws IOException {
        return CrossSectionTable.open(build(plan).table());
    }

    private static double max(double[] v) {
        return Arrays.stream(v).max().orElseThrow();
    }

    @Test
    void doublingAnIsotopologuesAbundanceDoublesItsContribution() throws IOException {
        // S is linear in the isotopologue's abundance (Simeckova et al. 2006, JQSRT 98, 130, eq. 20; HITRAN S
        // includes I_a, Rothman et al. 1998, JQSRT 60, 665): doubling 13C16O's abundance adds its natural sigma,
        // taken from a scratch build of that isotopologue alone, once more at every point
        CrossSectionTable natural = table(plan("natural", "", "sample_CO.par"));
        CrossSectionTable doubled = table(plan("doubled", String.format(Locale.ROOT,
                "abundance = { \"CO/2\" = %s }", 2 * CO_13C_ABUNDANCE), "sample_CO.par"));
        CrossSectionTable iso2 = table(plan("iso2", "isotopologues = [\"5/2\"]", "sample_CO.par"));
        for (int p = 0; p < 2; p++) {
            for (int t = 0; t < 2; t++) {
                double[] n = natural.sigma(p, t);
                double[] d = doubled.sigma(p, t);
                double[] i2 = iso2.sigma(p, t);
                assertTrue(max(i2) > 1e-4 * max(n), "13C16O contributes in cell " + p + "," + t);
                for (int i = 0; i < n.length; i++) {
                    // (n - i2) is 12C16O and the rest; the doubled table holds it plus 2 x 13C16O
                    assertEquals((n[i] - i2[i]) + 2 * i2[i], d[i], 1e-12 * max(d), "cell " + p + "," + t + " point " + i);
                }
            }
        }
        Map<String, String> m = doubled.metadata();
        assertEquals("natural-abundance", m.get("intensity_convention"));
        assertEquals(String.format(Locale.ROOT, "5/2=%.10g; others natural (registry)", 2 * CO_13C_ABUNDANCE),
                m.get("isotopologue_abundances"));
        assertEquals("natural (registry)", natural.metadata().get("isotopologue_abundances"));
    }

    @Test
    void aTwoMoleculePlanWithMixingRatiosIsTheirWeightedSumAndAVmrChangeRecomputesEveryCell() throws IOException {
        Path mixPlan = plan("mix", "vmr = { CO = 0.1, CO2 = 0.3 }", "sample_CO.par", "sample_CO2.par");
        BuildReport first = build(mixPlan);
        CrossSectionTable mix = CrossSectionTable.open(first.table());
        CrossSectionTable co = table(plan("co", "", "sample_CO.par"));
        CrossSectionTable co2 = table(plan("co2", "", "sample_CO2.par"));
        // sigma per molecule of the absorbing mixture: sum_m x_m sigma_m / sum_m x_m (docs/physics.md, common practice)
        for (int p = 0; p < 2; p++) {
            for (int t = 0; t < 2; t++) {
                double[] s = mix.sigma(p, t);
                double[] a = co.sigma(p, t);
                double[] b = co2.sigma(p, t);
                assertTrue(max(a) > 0 && max(b) > 0, "both molecules absorb in cell " + p + "," + t);
                for (int i = 0; i < s.length; i++) {
                    double expected = (0.1 * a[i] + 0.3 * b[i]) / 0.4;
                    assertEquals(expected, s[i], 1e-12 * max(s), "cell " + p + "," + t + " point " + i);
                }
            }
        }
        assertEquals("CO=0.2500000000;CO2=0.7500000000", mix.metadata().get("mixture_shares"));
        assertEquals("0.4000000000", mix.metadata().get("mixture_vmr_sum"));

        // unchanged plan: every cell reused; one ratio changed: every cell recomputed, and the new shares used
        assertEquals(0, build(mixPlan).computed());
        Files.writeString(mixPlan, Files.readString(mixPlan).replace("CO2 = 0.3", "CO2 = 0.1"));
        BuildReport changed = build(mixPlan);
        assertEquals(first.cells(), changed.computed());
        assertEquals(0, changed.reused());
        CrossSectionTable rebuilt = CrossSectionTable.open(changed.table());
        assertEquals("CO=0.5000000000;CO2=0.5000000000", rebuilt.metadata().get("mixture_shares"));
        double[] s = rebuilt.sigma(1, 0);
        double[] a = co.sigma(1, 0);
        double[] b = co2.sigma(1, 0);
        for (int i = 0; i < s.length; i++) {
            assertEquals((0.1 * a[i] + 0.1 * b[i]) / 0.2, s[i], 1e-12 * max(s), "point " + i);
        }
    }

    @Test
    void severalMoleculesWithoutMixingRatiosAreRefusedBeforeAnyCell() throws IOException {
        Path plan = plan("refused", "", "sample_CO.par", "sample_CO2.par");
        InputException e = assertThrows(InputException.class, () -> build(plan));
        assertTrue(e.getMessage().contains("[CO2, CO]") || e.getMessage().contains("[CO, CO2]"), e.getMessage());
        assertTrue(e.getMessage().contains("species.vmr"), e.getMessage());
        assertTrue(!Files.exists(plan.resolveSibling("out").resolve("t.arrow.work")), "no work folder");
        // a ratio for only one of them: refused, naming the other
        Path partial = plan("partial", "vmr = { CO = 1.0 }", "sample_CO.par", "sample_CO2.par");
        InputException p = assertThrows(InputException.class, () -> build(partial));
        assertTrue(p.getMessage().contains("no mixing ratio for CO2"), p.getMessage());
    }
}
