package org.linewright.grid.table;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.grid.engine.CrossSectionEngine;
import org.linewright.grid.manifest.BuildManifest;
import org.linewright.grid.plan.LineCache;
import org.linewright.grid.plan.PlanReader;
import org.linewright.grid.plan.TablePlan;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.hitran.HitranRecordWriter;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.testsupport.SyntheticRecords;

/**
 * A block's reach taken from the lines' own pressure shifts, and block sizes chosen for the engine, on synthetic,
 * invented CO lines written as 160-character records: a bulk of weak lines with shifts of at most 0.01 cm⁻¹/atm
 * and two strong lines shifted by +0.4 cm⁻¹/atm, one just inside the reach of a block and reaching it at the
 * highest pressure, one just outside the reach of another block and (by geometry) unable to reach it. Every
 * build is checked against one calculation of σ over the whole grid with the exact engine (same lines, same
 * summation order: the same bits).
 *
 * <p>Geometry (fixed cutoff d = 1 cm⁻¹; common practice: a truncated line contributes only within d of its
 * shifted centre ν + δ·p): p_max = 2 bar = 1.973847 atm (1 bar = 10⁵ Pa, 1 atm = 101,325 Pa, definitions), so the
 * +0.4 cm⁻¹/atm line moves by 0.7895 cm⁻¹ at most, and the reach is d + 0.4·(1 + 10⁻⁶)·p_max + 8 grid steps of
 * 0.01 cm⁻¹ = 1.8695 cm⁻¹ (the old rule, d + 1 cm⁻¹/atm·p_max, gave 2.97 cm⁻¹).
 */
class BlockReachTest {
    private static final double FROM_CM1 = 2000.0;
    private static final double TO_CM1 = 2010.0;
    private static final double STEP_CM1 = 0.01;
    private static final double CUTOFF_CM1 = 1.0;
    private static final double SHIFT_CM1_PER_ATM = 0.4;
    private static final double[] PRESSURES_BAR = {0.1, 2.0};
    private static final double[] TEMPERATURES_K = {296.0, 700.0};
    /** 1 bar / 1 atm = 10⁵ Pa / 101,325 Pa (definitions). */
    private static final double MAX_PRESSURE_ATM = 2.0 * 1e5 / 101_325.0;
    private static final double REACH_CM1 = CUTOFF_CM1 + SHIFT_CM1_PER_ATM * (1 + 1e-6) * MAX_PRESSURE_ATM
            + 8 * STEP_CM1;
    /** Blocks of 100 points: block b spans 2000 + b .. 2000 + b + 0.99 cm⁻¹. */
    private static final int BLOCK_POINTS = 100;
    /** 1.78 cm⁻¹ below block 5 (inside its reach of 1.8695): at 2 bar its shifted centre is 0.9905 cm⁻¹ away. */
    private static final double INSIDE_CM1 = 2005.0 - 1.78;
    /** 1.88 cm⁻¹ below block 7 (outside its reach): at 2 bar its shifted centre is still 1.0905 cm⁻¹ away. */
    private static final double OUTSIDE_CM1 = 2007.0 - 1.88;

    @TempDir
    Path dir;

    /** Bulk lines every 0.05 cm⁻¹ over 1996–2014 cm⁻¹ plus the two shifted lines, in wavenumber order. */
    private static void writeLines(Path file, double outsideIntensity) throws IOException {
        int bulk = 361;
        LineBatch b = SyntheticRecords.block(bulk + 2, 11);
        double[] centres = new double[bulk + 2];
        for (int i = 0; i < bulk; i++) {
            centres[i] = Math.round((1996.0 + 0.05 * i) * 1e6) / 1e6 + 0.001; // off the shifted lines' centres
        }
        centres[bulk] = INSIDE_CM1;
        centres[bulk + 1] = OUTSIDE_CM1;
        java.util.Arrays.sort(centres);
        for (int i = 0; i < centres.length; i++) {
            b.wavenumberCm1[i] = centres[i];
            b.sourceLine[i] = i + 1;
            b.isotopologue[i] = 1;
            b.intensityCmPerMolecule[i] = 1.0E-22;
            if (centres[i] == INSIDE_CM1 || centres[i] == OUTSIDE_CM1) {
                b.airShiftCm1PerAtm[i] = SHIFT_CM1_PER_ATM;
                b.airWidthCm1PerAtm[i] = 0.05;
                b.intensityCmPerMolecule[i] = centres[i] == INSIDE_CM1 ? 1.0E-19 : outsideIntensity;
            }
        }
        try (OutputStream out = new BufferedOutputStream(Files.newOutputStream(file))) {
            new HitranRecordWriter().write(b, out);
        }
    }

    private Path plan(String folder, String engine, Integer blockPoints, double outsideIntensity) throws IOException {
        Path d = Files.createDirectories(dir.resolve(folder));
        writeLines(d.resolve("lines.par"), outsideIntensity);
        Path plan = d.resolve("plan.toml");
        Files.writeString(plan, String.format(Locale.ROOT, """
                [lines]
                sources = ["lines.par"]
                [grid]
                wavenumber = { from = %s, to = %s, step = %s }
                pressures_bar = [0.1, 2.0]
                temperatures_K = [296.0, 700.0]
                [background]
                air = 1.0
                [profile]
                engine = "%s"
                cutoff_cm1 = %s
                %s
                [output]
                table = "out/t.arrow"
                """, FROM_CM1, TO_CM1, STEP_CM1, engine, CUTOFF_CM1,
                blockPoints == null ? "" : "[build]\nblock_points = " + blockPoints));
        return plan;
    }

    private static BuildReport build(Path planFile) throws IOException {
        return TableBuilder.build(PlanReader.read(planFile), CalculatorBlocks.factory(), 1, false, BuildListener.NONE);
    }

    /** σ of every (p, T) computed once over the whole grid from the lines with centres in [low, high]. */
    private static double[][][] wholeGrid(Path planFile, double lowCm1, double highCm1) throws IOException {
        TablePlan plan = PlanReader.read(planFile);
        MoleculeRegistry registry = TableBuilder.registry(plan);
        LineCache.Loaded loaded = LineCache.load(plan.sources(), plan.baseDir().resolve(LineCache.CACHE_DIR),
                registry, BuildListener.NONE);
        double[][][] out = new double[PRESSURES_BAR.length][TEMPERATURES_K.length][];
        try (BlockCalculator calc = CalculatorBlocks.factory().create(plan, loaded.stores(), registry, 1)) {
            for (int p = 0; p < PRESSURES_BAR.length; p++) {
                for (int t = 0; t < TEMPERATURES_K.length; t++) {
                    out[p][t] = calc.compute(plan.grid(), plan.pressuresAtm()[p], TEMPERATURES_K[t], lowCm1, highCm1)
                            .sigmaCm2PerMolecule();
                }
            }
        }
        return out;
    }

    private static void assertTableEquals(double[][][] expected, Path table) throws IOException {
        CrossSectionTable t = CrossSectionTable.open(table);
        for (int p = 0; p < PRESSURES_BAR.length; p++) {
            for (int k = 0; k < TEMPERATURES_K.length; k++) {
                double[] x = expected[p][k];
                double[] y = t.sigma(p, k);
                assertEquals(x.length, y.length);
                for (int i = 0; i < x.length; i++) {
                    if (Double.doubleToRawLongBits(x[i]) != Double.doubleToRawLongBits(y[i])) {
                        throw new AssertionError("p" + p + " T" + k + " point " + i + ": whole grid " + x[i]
                                + ", table " + y[i]);
                    }
                }
            }
        }
    }

    @Test
    void reachComesFromTheLargestShiftAndTableEqualsOneWholeGridCalculation() throws IOException {
        Path planFile = plan("reach", "exact", BLOCK_POINTS, 1.0E-19);
        BuildReport first = build(planFile);
        BuildManifest m = BuildManifest.read(TableBuilder.workDir(first.table()));
        assertEquals(REACH_CM1, Double.parseDouble(m.get("reach_cm1")), 1e-9);
        assertEquals(SHIFT_CM1_PER_ATM * (1 + 1e-6), Double.parseDouble(m.get("reach.max_shift_cm1_per_atm")), 1e-12);

        // the line just inside block 5's reach is among its lines; the one just outside block 7's is not
        double[][][] all = wholeGrid(planFile, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY);
        assertTableEquals(all, first.table());
        assertEquals(bulkWithin(5) + 2, Long.parseLong(m.get("block.5.lines"))); // both shifted lines

        assertEquals(bulkWithin(7), Long.parseLong(m.get("block.7.lines")));

        // the inside line does reach block 5's first point at 2 bar: leaving it out changes σ there
        double[][][] without = wholeGrid(planFile, INSIDE_CM1 + 0.01, Double.POSITIVE_INFINITY);
        int first5 = 5 * BLOCK_POINTS;
        assertTrue(all[1][0][first5] > without[1][0][first5] * (1 + 1e-9),
                "the +0.4 cm-1/atm line reaches block 5 at 2 bar: " + all[1][0][first5] + " vs " + without[1][0][first5]);
        // ... and not its fifth point (0.9905 + 0.04 cm-1 from its shifted centre, beyond the cutoff)
        assertEquals(without[1][0][first5 + 4], all[1][0][first5 + 4], 0.0);
        // a change of the outside line recomputes only the blocks within whose reach it lies: 3, 4, 5 and 6
        // (2000 + b − 1.8695 ≤ 2005.12 ≤ 2000 + b + 0.99 + 1.8695), not block 7
        writeLines(planFile.resolveSibling("lines.par"), 3.0E-19);
        BuildReport second = build(planFile);
        int cellsPerBlock = PRESSURES_BAR.length * TEMPERATURES_K.length;
        assertEquals(4 * cellsPerBlock, second.computed());
        double[][][] changed = wholeGrid(planFile, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY);
        assertTableEquals(changed, second.table());
        // the outside line cannot reach block 7 at any pressure of the plan: its σ is the same for both lists,
        // while block 6, which the line does reach, changed
        boolean block6Changed = false;
        for (int p = 0; p < PRESSURES_BAR.length; p++) {
            for (int t = 0; t < TEMPERATURES_K.length; t++) {
                for (int i = 7 * BLOCK_POINTS; i < 8 * BLOCK_POINTS; i++) {
                    assertEquals(all[p][t][i], changed[p][t][i], 0.0, "p" + p + " T" + t + " point " + i);
                }
                for (int i = 6 * BLOCK_POINTS; i < 7 * BLOCK_POINTS; i++) {
                    block6Changed |= all[p][t][i] != changed[p][t][i];
                }
            }
        }
        assertTrue(block6Changed, "the changed line reaches block 6");
    }

    /** Bulk lines whose centres lie within the reach of block b (the bulk centres are 1996.001 + 0.05·i). */
    private static long bulkWithin(int b) {
        double lo = FROM_CM1 + b - REACH_CM1;
        double hi = FROM_CM1 + b + 0.99 + REACH_CM1;
        long n = 0;
        for (int i = 0; i < 361; i++) {
            double c = Math.round((1996.0 + 0.05 * i) * 1e6) / 1e6 + 0.001;
            if (c >= lo && c <= hi) {
                n++;
            }
        }
        return n;
    }

    @Test
    void changedBlockSizeRecomputesEveryCellAndKeepsTheBits() throws IOException {
        Path planFile = plan("size", "exact", BLOCK_POINTS, 1.0E-19);
        BuildReport first = build(planFile);
        assertEquals(first.cells(), first.computed());
        double[][][] all = wholeGrid(planFile, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY);

        // a plan with another block size reuses nothing, whatever the work folder holds
        Path other = planFile.resolveSibling("plan.toml");
        Files.writeString(other, Files.readString(planFile).replace("block_points = 100", "block_points = 300"));
        BuildReport resized = build(other);
        assertEquals(0, resized.reused());
        assertEquals(4 * PRESSURES_BAR.length * TEMPERATURES_K.length, resized.cells()); // ⌈1001 / 300⌉ = 4
        assertTableEquals(all, resized.table());

        // no block size in the plan: the exact engine's 20,000 points, capped by the 1001-point grid
        Files.writeString(other, Files.readString(other).replace("[build]\nblock_points = 300", ""));
        BuildReport engineSized = build(other);
        BuildManifest m = BuildManifest.read(TableBuilder.workDir(engineSized.table()));
        assertEquals("1001", m.get("block_points"));
        assertEquals("engine", m.get("block_points_from"));
        assertEquals(0, engineSized.reused());
        assertTableEquals(all, engineSized.table());
        assertEquals(0, build(other).computed(), "unchanged: everything reused");
    }

    @Test
    void fastEngineBlocksFillAPowerOfTwoTransform() throws IOException {
        // 2000–2500 cm⁻¹ by 0.0005 cm⁻¹, 25 cm⁻¹ cutoff: padding on both sides 2·25/0.0005 = 100,000 points;
        // 2.5 × 100,000 = 250,000 → next power of two 2¹⁸ = 262,144; block 262,144 − 100,000 − 64 = 162,080 points.
        WavenumberGrid grid = WavenumberGrid.uniform(2000.0, 2500.0, 0.0005);
        assertEquals(162_080, CrossSectionEngine.transformBlockPoints(grid, 25.0, 2.5));
        // factor 5: 500,000 → 2¹⁹ = 524,288 → 424,224 points
        assertEquals(424_224, CrossSectionEngine.transformBlockPoints(grid, 25.0, 5.0));
        // a grid shorter than the wanted transform is one block; so is a grid with an unbounded padding
        assertEquals(grid.size(), CrossSectionEngine.transformBlockPoints(grid, 250.0, 2.5));
        assertEquals(grid.size(), CrossSectionEngine.transformBlockPoints(grid, Double.POSITIVE_INFINITY, 2.5));

        // through a plan with the fast engine and no block size: 2·1/0.01 = 200 points, 2.5 × 200 = 500 → 512,
        // block 512 − 200 − 64 = 248 points
        Path planFile = plan("fast", "fast", null, 1.0E-19);
        BuildReport r = build(planFile);
        BuildManifest m = BuildManifest.read(TableBuilder.workDir(r.table()));
        assertEquals("248", m.get("block_points"));
        assertEquals(5 * PRESSURES_BAR.length * TEMPERATURES_K.length, r.cells()); // ⌈1001 / 248⌉ = 5
    }

    @Test
    void directSummationKeepsTwentyThousandPoints() {
        WavenumberGrid grid = WavenumberGrid.uniform(2000.0, 2500.0, 0.0005);
        CrossSectionEngine direct = new org.linewright.grid.engine.exact.ExactEngine(1,
                org.linewright.broadening.wings.WingTreatment.defaults());
        assertEquals(20_000, direct.preferredBlockPoints(grid, 25.0));
        assertEquals(List.of(1001), List.of(direct.preferredBlockPoints(
                WavenumberGrid.uniform(FROM_CM1, TO_CM1, STEP_CM1), 25.0)));
    }
}
