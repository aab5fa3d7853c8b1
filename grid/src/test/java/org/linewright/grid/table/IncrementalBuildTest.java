package org.linewright.grid.table;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.TreeSet;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.grid.plan.PlanReader;
import org.linewright.grid.plan.TablePlan;
import org.linewright.grid.testsupport.InterruptingCalculator;
import org.linewright.ingest.testsupport.ReferenceSamples;

/**
 * Incremental rebuilds and resumed builds on real lines (HITRAN2020 CO sample, Gordon et al. 2022, JQSRT 277,
 * 107949): a rebuild after a change recomputes exactly the blocks within reach of the changed lines and gives
 * the same bits as a build from scratch (itself run with 2 engine threads, the others with 1: the thread count
 * must not change a bit); an interrupted build resumes with the blocks it had not saved.
 */
class IncrementalBuildTest {
    private static final double FROM_CM1 = 1900.0;
    private static final double STEP_CM1 = 0.02;
    private static final int BLOCK_POINTS = 1000;
    private static final double CUTOFF_CM1 = 5.0;
    private static final double[] PRESSURES_BAR = {0.1, 1.0};
    private static final double[] TEMPERATURES_K = {296.0, 1000.0};
    /** 0-based columns of the air-broadened width in a 160-character record (HITRAN format, Rothman et al. 2005). */
    private static final int AIR_WIDTH_FROM = 35;
    private static final int AIR_WIDTH_TO = 40;

    @TempDir
    Path dir;

    private Path plan(String folder, Path lines) throws IOException {
        Path d = Files.createDirectories(dir.resolve(folder));
        Files.copy(lines, d.resolve("co.par"), java.nio.file.StandardCopyOption.REPLACE_EXISTING);
        Path plan = d.resolve("plan.toml");
        Files.writeString(plan, String.format(Locale.ROOT, """
                [lines]
                sources = ["co.par"]
                [grid]
                wavenumber = { from = %s, to = 2400.0, step = %s }
                pressures_bar = [0.1, 1.0]
                temperatures_K = [296.0, 1000.0]
                [background]
                air = 1.0
                [profile]
                cutoff_cm1 = %s
                [build]
                block_points = %d
                [output]
                table = "out/co.arrow"
                """, FROM_CM1, STEP_CM1, CUTOFF_CM1, BLOCK_POINTS));
        return plan;
    }

    private static TableBuilder.CalculatorFactory calculator(int failAfter) {
        return (plan, stores, registry, threads) -> new InterruptingCalculator(
                CalculatorBlocks.factory().create(plan, stores, registry, threads), failAfter);
    }

    private static BuildReport build(Path planFile, int failAfter) throws IOException {
        return build(planFile, failAfter, 1);
    }

    private static BuildReport build(Path planFile, int failAfter, int threads) throws IOException {
        return TableBuilder.build(PlanReader.read(planFile), calculator(failAfter), threads, false, BuildListener.NONE);
    }

    @Test
    void rebuildAfterChangingOnePercentOfLinesRecomputesOnlyReachedBlocksAndMatchesAFreshBuild() throws IOException {
        Path sample = ReferenceSamples.hitranSample("sample_CO.par");
        List<String> records = Files.readAllLines(sample, StandardCharsets.US_ASCII);
        // 1 % of the lines, consecutive in wavenumber from 2150 cm-1 on (a band update): new air widths
        int change = records.size() / 100;
        List<String> edited = new ArrayList<>(records);
        TreeSet<Double> changedCentres = new TreeSet<>();
        List<Integer> order = new ArrayList<>();
        for (int i = 0; i < records.size(); i++) {
            order.add(i);
        }
        order.sort((a, b) -> Double.compare(centre(records.get(a)), centre(records.get(b))));
        int done = 0;
        for (int i : order) {
            if (done < change && centre(records.get(i)) >= 2150.0) {
                String r = records.get(i);
                edited.set(i, r.substring(0, AIR_WIDTH_FROM) + ".0999" + r.substring(AIR_WIDTH_TO));
                changedCentres.add(centre(r));
                done++;
            }
        }
        assertEquals(change, done);
        Path editedFile = dir.resolve("co-edited.par");
        Files.write(editedFile, edited, StandardCharsets.US_ASCII);

        Path incremental = plan("incremental", sample);
        BuildReport first = build(incremental, -1);
        int blocks = (int) Math.ceil((Math.floor((2400.0 - FROM_CM1) / STEP_CM1 + 1e-9) + 1) / BLOCK_POINTS);
        int cells = blocks * PRESSURES_BAR.length * TEMPERATURES_K.length;
        assertEquals(cells, first.cells());
        assertEquals(cells, first.computed());

        Files.copy(editedFile, incremental.resolveSibling("co.par"), java.nio.file.StandardCopyOption.REPLACE_EXISTING);
        BuildReport dry = TableBuilder.build(PlanReader.read(incremental), calculator(-1), 1, true, BuildListener.NONE);
        BuildReport second = build(incremental, -1);

        // Blocks whose reach (block range ± (cutoff + max|δ_air| × highest pressure + 8 grid steps)) holds a changed
        // centre; δ_air read from the records' columns 60–67 (HITRAN format, Rothman et al. 2005), the sample's
        // only shift column; 1 + 1e-6 the composition's sum tolerance
        double maxShift = 0;
        double seen = CUTOFF_CM1 + 1.0 * TablePlan.barToAtm(1.0) + 8 * STEP_CM1; // lines the calculator may read
        for (String r : records) {
            if (centre(r) < FROM_CM1 - seen || centre(r) > 2400.0 + seen) {
                continue;
            }
            maxShift = Math.max(maxShift, Math.abs(Double.parseDouble(r.substring(59, 67).trim())));
        }
        assertTrue(maxShift > 0 && maxShift < 0.1, "air shifts of CO lines: " + maxShift);
        double reach = CUTOFF_CM1 + maxShift * (1 + 1e-6) * TablePlan.barToAtm(1.0) + 8 * STEP_CM1;
        assertEquals(reach, Double.parseDouble(org.linewright.grid.manifest.BuildManifest
                .read(TableBuilder.workDir(first.table())).get("reach_cm1")), 1e-9);
        int reached = 0;
        for (int b = 0; b < blocks; b++) {
            double lo = FROM_CM1 + b * BLOCK_POINTS * STEP_CM1 - reach;
            double hi = FROM_CM1 + (Math.min((b + 1) * BLOCK_POINTS, 25_001) - 1) * STEP_CM1 + reach;
            Double c = changedCentres.ceiling(lo);
            if (c != null && c <= hi) {
                reached++;
            }
        }
        assertTrue(reached >= 1 && reached < blocks / 2, "the change reaches a few blocks: " + reached);
        int expected = reached * PRESSURES_BAR.length * TEMPERATURES_K.length;
        assertEquals(expected, dry.computed(), "dry run counts the blocks to compute");
        assertTrue(dry.dryRun());
        assertNull(dry.written());
        assertEquals(expected, second.computed());
        assertEquals(1, first.ingested(), "the raw list is ingested into the cache once");
        assertEquals(1, dry.ingested(), "a changed list (new SHA-256) is ingested again, by the dry run here");
        assertEquals(0, second.ingested(), "an unchanged list comes from the cache");
        assertEquals(cells - expected, second.reused());

        Path fresh = plan("fresh", editedFile);
        BuildReport scratch = build(fresh, -1, 2);
        assertEquals(cells, scratch.computed());
        assertSameTable(scratch.table(), second.table());
        assertEquals(scratch.written().sigmaSha256(), second.written().sigmaSha256());
    }

    @Test
    void interruptedBuildResumesWithTheBlocksItHadNotSaved() throws IOException {
        Path sample = ReferenceSamples.hitranSample("sample_CO.par");
        Path resumed = plan("resumed", sample);
        int interruptAfter = 7;
        IOException e = assertThrows(IOException.class, () -> build(resumed, interruptAfter));
        assertTrue(e.getMessage().contains("simulated interruption"));
        assertTrue(!Files.exists(resumed.resolveSibling("out/co.arrow")), "no table after an interruption");
        BuildReport second = build(resumed, -1);
        assertEquals(interruptAfter, second.reused());
        assertEquals(second.cells() - interruptAfter, second.computed());

        BuildReport scratch = build(plan("scratch", sample), -1);
        assertSameTable(scratch.table(), second.table());
        // A build with nothing changed reuses everything and writes the same σ
        BuildReport again = build(resumed, -1);
        assertEquals(0, again.computed());
        assertEquals(scratch.written().sigmaSha256(), again.written().sigmaSha256());
    }

    private static void assertSameTable(Path expected, Path actual) throws IOException {
        CrossSectionTable a = CrossSectionTable.open(expected);
        CrossSectionTable b = CrossSectionTable.open(actual);
        assertArrayEquals(a.wavenumberCm1(), b.wavenumberCm1());
        // the table records where Q(T) of each isotopologue came from (12C16O is 5/1, HITRAN numbering)
        String q = b.metadata().get("partition_sum.5/1");
        if (q == null || q.isBlank()) {
            throw new AssertionError("no partition-sum source for 5/1 in " + b.metadata().keySet());
        }
        // and the line-shape rule with the count of lines that had the Van Vleck-Weisskopf shape
        if (!b.metadata().containsKey("line_shape_rule") || !b.metadata().containsKey("count.lines_van_vleck_weisskopf")) {
            throw new AssertionError("no line-shape rule or Van Vleck-Weisskopf count in " + b.metadata().keySet());
        }
        for (int p = 0; p < PRESSURES_BAR.length; p++) {
            for (int t = 0; t < TEMPERATURES_K.length; t++) {
                double[] x = a.sigma(p, t);
                double[] y = b.sigma(p, t);
                for (int k = 0; k < x.length; k++) {
                    if (Double.doubleToRawLongBits(x[k]) != Double.doubleToRawLongBits(y[k])) {
                        throw new AssertionError("p" + p + " t" + t + " point " + k + ": " + x[k] + " != " + y[k]);
                    }
                }
            }
        }
        assertTrue(a.sigma(1, 0)[12_500] > 0, "σ is not trivially zero");
    }

    private static double centre(String record) {
        return Double.parseDouble(record.substring(3, 15).trim());
    }
}
