package org.linewright.grid.table;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.function.UnaryOperator;
import org.junit.jupiter.api.BeforeEach;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.grid.plan.PlanReader;
import org.linewright.ingest.testsupport.ReferenceSamples;

/**
 * Rebuilds whose work follows the changed lines (exact engine, exact sums): after each kind of revision of a real
 * line list (HITRAN2020 CO sample, Gordon et al. 2022, JQSRT 277, 107949), the table rebuilt with 1 thread from the
 * previous build's sums and the changed lines alone has the same σ bits (SHA-256 of σ as stored) as a build from
 * scratch of the revised list with 2 threads, and only the blocks the change reaches are updated (counts asserted
 * against the changed lines' positions). A parameter that affects every line recomputes every cell instead; a
 * sequence of revisions and its reverse gives back the first build's bits.
 */
class LineDeltaRebuildTest {
    private static final double FROM_CM1 = 2000.0;
    private static final double TO_CM1 = 2300.0;
    private static final double STEP_CM1 = 0.01;
    private static final int BLOCK_POINTS = 6000;
    private static final int BLOCKS = 6; // 30,001 points
    private static final int CONDITIONS = 4; // 2 pressures × 2 temperatures
    /** 0-based columns of a 160-character record (HITRAN format, Rothman et al. 2005). */
    private static final int ISO = 2;
    private static final int NU_FROM = 3;
    private static final int NU_TO = 15;
    private static final int S_FROM = 15;
    private static final int S_TO = 25;
    private static final int AIR_FROM = 35;
    private static final int AIR_TO = 40;

    @TempDir
    Path dir;
    private List<String> original;
    private Path incremental;
    private int scratchBuilds;

    @BeforeEach
    void lines() throws IOException {
        List<String> all = Files.readAllLines(ReferenceSamples.hitranSample("sample_CO.par"), StandardCharsets.US_ASCII);
        original = new ArrayList<>();
        for (String r : all) {
            double nu = centre(r);
            if (nu > 1995 && nu < 2305) { // all within the blocks' reach (cutoff 5 cm-1 beyond the grid)
                original.add(r);
            }
        }
        original.sort(Comparator.comparingDouble(LineDeltaRebuildTest::centre));
        incremental = plan("incremental", original, 5.0);
        BuildReport first = build(incremental, 2);
        assertEquals(BLOCKS * CONDITIONS, first.computed());
    }

    @Test
    void oneLine() throws IOException {
        revise(withIntensity(r -> r, 600, 601, 2.0), 1, 1);
    }

    @Test
    void onePercentInADenseBand() throws IOException {
        int n = original.size() / 100;
        int from = firstAbove(2150.0);
        revise(withIntensity(r -> r, from, from + n, 2.0), n, n);
    }

    @Test
    void onePercentSpreadOverTheList() throws IOException {
        List<String> edited = new ArrayList<>(original);
        int n = 0;
        for (int i = 0; i < edited.size(); i += 100) {
            String r = edited.get(i);
            edited.set(i, r.substring(0, AIR_FROM) + ".0777" + r.substring(AIR_TO));
            n++;
        }
        revise(edited, n, n);
    }

    @Test
    void anAddedBand() throws IOException {
        List<String> edited = new ArrayList<>(original);
        int from = firstAbove(2100.0);
        for (int i = from; i < from + 40; i++) {
            String r = original.get(i);
            edited.add(r.substring(0, NU_FROM) + String.format(Locale.ROOT, "%12.6f", centre(r) + 0.0371)
                    + r.substring(NU_TO));
        }
        edited.sort(Comparator.comparingDouble(LineDeltaRebuildTest::centre));
        revise(edited, 0, 40);
    }

    @Test
    void aRemovedIsotopologue() throws IOException {
        List<String> edited = new ArrayList<>();
        int removed = 0;
        for (String r : original) {
            if (r.charAt(ISO) == '2') {
                removed++;
            } else {
                edited.add(r);
            }
        }
        revise(edited, removed, 0);
    }

    @Test
    void aChangedParameterRecomputesEveryCell() throws IOException {
        Path p = plan("incremental", original, 4.0);
        BuildReport r = build(p, 1);
        assertEquals(BLOCKS * CONDITIONS, r.computed());
        assertEquals(0, r.incremental().cellsUpdated(), r.incremental().mode());
        assertTrue(r.incremental().mode().contains("parameters"), r.incremental().mode());
        assertEquals(scratch(original, 4.0), r.written().sigmaSha256());
    }

    @Test
    void aRebuildInterruptedWhileUpdatingResumesFromTheSameBase() throws IOException {
        int from = firstAbove(2150.0);
        List<String> edited = withIntensity(r -> r, from, from + original.size() / 100, 2.0);
        write(incremental, edited);
        TableBuilder.CalculatorFactory interrupting = (plan, stores, registry, threads) ->
                new org.linewright.grid.testsupport.InterruptingCalculator(
                        CalculatorBlocks.factory().create(plan, stores, registry, threads), 3);
        IOException e = org.junit.jupiter.api.Assertions.assertThrows(IOException.class, () -> TableBuilder.build(
                PlanReader.read(incremental), interrupting, 1, false, BuildListener.NONE));
        assertTrue(e.getMessage().contains("simulated interruption"), e.getMessage());
        BuildReport resumed = build(incremental, 2);
        assertTrue(resumed.computed() > 0);
        assertEquals(resumed.computed(), resumed.incremental().cellsUpdated(), resumed.incremental().mode());
        assertEquals(scratch(edited, 5.0), resumed.written().sigmaSha256());
        assertEquals(null, org.linewright.grid.manifest.BuildManifest.read(TableBuilder.workDir(resumed.table()))
                .get("base.store.0.dir"), "a finished build keeps no base keys");
    }

    @Test
    void threeRevisionsAndTheirReverseGiveBackTheFirstBits() throws IOException {
        String first = sigmaSha(incremental);
        List<String> one = withIntensity(r -> r, 100, 140, 3.0);
        List<String> two = new ArrayList<>(one);
        two.remove(700);
        List<String> three = new ArrayList<>(two);
        three.set(900, three.get(900).substring(0, AIR_FROM) + ".0444" + three.get(900).substring(AIR_TO));
        for (List<String> v : List.of(one, two, three, two, one, original)) {
            write(incremental, v);
            BuildReport r = build(incremental, 1);
            assertTrue(r.computed() == 0 || r.incremental().cellsUpdated() == r.computed(), r.incremental().mode());
        }
        assertEquals(first, sigmaSha(incremental));
    }

    /** Rebuilds with {@code edited}, checks the counts and that σ matches a build from scratch bit for bit. */
    private void revise(List<String> edited, int removed, int added) throws IOException {
        write(incremental, edited);
        BuildReport dry = TableBuilder.build(PlanReader.read(incremental), CalculatorBlocks.factory(), 1, true,
                BuildListener.NONE);
        BuildReport r = build(incremental, 1);
        BuildReport.Incremental inc = r.incremental();
        assertEquals(removed, inc.linesRemoved(), inc.mode());
        assertEquals(added, inc.linesAdded(), inc.mode());
        assertEquals(r.computed(), inc.cellsUpdated(), inc.mode());
        assertEquals(0, inc.cellsRecomputed());
        assertEquals(dry.computed(), r.computed());
        assertEquals(dry.incremental().cellsUpdated(), inc.cellsUpdated());
        // the blocks whose reach (block ± reach) holds a changed line, at every (p, T)
        double reach = Double.parseDouble(org.linewright.grid.manifest.BuildManifest.read(
                TableBuilder.workDir(r.table())).get("reach_cm1"));
        List<Double> changed = changedCentres(edited);
        int reached = 0;
        for (int b = 0; b < BLOCKS; b++) {
            double lo = FROM_CM1 + b * BLOCK_POINTS * STEP_CM1 - reach;
            double hi = FROM_CM1 + (Math.min((b + 1) * BLOCK_POINTS, 30_001) - 1) * STEP_CM1 + reach;
            for (double c : changed) {
                if (c >= lo && c <= hi) {
                    reached++;
                    break;
                }
            }
        }
        assertTrue(reached > 0);
        assertEquals(reached * CONDITIONS, r.computed());
        assertTrue(inc.relativeCost() < 0.5, "cost " + inc.relativeCost());
        assertEquals(scratch(edited, 5.0), r.written().sigmaSha256());
    }

    /** Centres of the lines in one version and not the other (as records, compared whole). */
    private List<Double> changedCentres(List<String> edited) {
        List<Double> out = new ArrayList<>();
        java.util.Map<String, Integer> before = new java.util.HashMap<>();
        for (String r : original) {
            before.merge(r, 1, Integer::sum);
        }
        for (String r : edited) {
            Integer c = before.get(r);
            if (c == null) {
                out.add(centre(r));
            } else if (c == 1) {
                before.remove(r);
            } else {
                before.put(r, c - 1);
            }
        }
        before.forEach((r, c) -> out.add(centre(r)));
        return out;
    }

    private String scratch(List<String> lines, double cutoffCm1) throws IOException {
        Path p = plan("scratch-" + (++scratchBuilds), lines, cutoffCm1);
        BuildReport r = build(p, 2);
        assertEquals(r.cells(), r.computed());
        return r.written().sigmaSha256();
    }

    private List<String> withIntensity(UnaryOperator<String> base, int from, int to, double factor) {
        List<String> edited = new ArrayList<>(original);
        for (int i = from; i < to; i++) {
            String r = base.apply(edited.get(i));
            double s = Double.parseDouble(r.substring(S_FROM, S_TO).trim());
            edited.set(i, r.substring(0, S_FROM) + String.format(Locale.ROOT, "%10.3E", s * factor) + r.substring(S_TO));
        }
        return edited;
    }

    private int firstAbove(double cm1) {
        for (int i = 0; i < original.size(); i++) {
            if (centre(original.get(i)) >= cm1) {
                return i;
            }
        }
        throw new AssertionError("no line above " + cm1);
    }

    private Path plan(String folder, List<String> lines, double cutoffCm1) throws IOException {
        Path d = Files.createDirectories(dir.resolve(folder));
        write(d.resolve("plan.toml"), lines);
        Path plan = d.resolve("plan.toml");
        Files.writeString(plan, String.format(Locale.ROOT, """
                [lines]
                sources = ["co.par"]
                [grid]
                wavenumber = { from = %s, to = %s, step = %s }
                pressures_bar = [0.1, 1.0]
                temperatures_K = [296.0, 1000.0]
                [background]
                air = 1.0
                [profile]
                engine = "exact"
                cutoff_cm1 = %s
                [build]
                block_points = %d
                [output]
                table = "out/co.arrow"
                """, FROM_CM1, TO_CM1, STEP_CM1, cutoffCm1, BLOCK_POINTS));
        return plan;
    }

    private static void write(Path plan, List<String> lines) throws IOException {
        Path tmp = plan.resolveSibling("co.par.tmp");
        Files.write(tmp, lines, StandardCharsets.US_ASCII);
        Files.move(tmp, plan.resolveSibling("co.par"), StandardCopyOption.REPLACE_EXISTING);
    }

    private static BuildReport build(Path plan, int threads) throws IOException {
        return TableBuilder.build(PlanReader.read(plan), CalculatorBlocks.factory(), threads, false, BuildListener.NONE);
    }

    private static String sigmaSha(Path plan) throws IOException {
        return org.linewright.grid.manifest.BuildManifest.read(TableBuilder.workDir(plan.resolveSibling("out/co.arrow")))
                .get("sigma_sha256");
    }

    private static double centre(String record) {
        return Double.parseDouble(record.substring(NU_FROM, NU_TO).trim());
    }
}
