package org.linewright.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Locale;
import java.util.PriorityQueue;
import org.apache.spark.SparkConf;
import org.apache.spark.api.java.JavaSparkContext;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.grid.plan.PlanReader;
import org.linewright.grid.table.BuildListener;
import org.linewright.grid.table.BuildReport;
import org.linewright.ingest.testsupport.ReferenceSamples;

/**
 * local[1] against local[2] for a 64-cell table (16 blocks, 2 pressures, 2 temperatures) (HITRAN2020 CO sample, exact engine), each from an empty work
 * folder, and a schedule model for 8, 64 and 512 executors.
 *
 * <p>Schedule model: T(E) = D + M(E), where D is the driver's serial work (reading the plan, ingest or cache load,
 * hashing, planning, the pre-flight job, writing the table: the build's wall time less its task phase) and M(E)
 * the makespan of the measured task times on E single-core executors under greedy longest-first list scheduling
 * plus a per-task scheduling overhead o (the task phase of local[1] less the sum of its task run times, divided
 * by the tasks). Predicted speed-up S(E) = T(1) / T(E). Neither data transfer nor executor start-up is modelled.
 */
@Tag("benchmark")
class SparkScalingBenchmark {
    @TempDir
    Path dir;

    private record Run(double wallS, double taskPhaseS, List<Double> taskS, String sigma) {
    }

    private Run run(String master, String folder) throws Exception {
        Path d = Files.createDirectories(dir.resolve(folder));
        Files.copy(ReferenceSamples.hitranSample("sample_CO.par"), d.resolve("co.par"), StandardCopyOption.REPLACE_EXISTING);
        Path plan = d.resolve("plan.toml");
        Files.writeString(plan, """
                [lines]
                sources = ["co.par"]
                [grid]
                wavenumber = { from = 2000.0, to = 2250.0, step = 0.001 }
                pressures_bar = [0.1, 1.0]
                temperatures_K = [296.0, 1000.0]
                [background]
                air = 1.0
                [profile]
                engine = "exact"
                cutoff_cm1 = 25.0
                [build]
                block_points = 15625
                [output]
                table = "out/co.arrow"
                """);
        SparkConf conf = new SparkConf().setAppName("bench").setMaster(SparkTableBuild.effectiveMaster(master))
                .set("spark.ui.enabled", "false");
        JavaSparkContext sc = new JavaSparkContext(conf);
        try (SparkTableBuild b = SparkTableBuild.on(sc, null)) {
            long t0 = System.nanoTime();
            BuildReport r = b.build(PlanReader.read(plan), BuildListener.NONE);
            double wall = (System.nanoTime() - t0) * 1e-9;
            assertEquals(r.cells(), r.computed());
            return new Run(wall, b.taskPhaseSeconds(), b.taskSeconds(), r.written().sigmaSha256());
        } finally {
            sc.stop();
        }
    }

    private static double makespan(List<Double> tasks, int executors, double overheadS) {
        List<Double> sorted = new ArrayList<>(tasks);
        sorted.sort(Collections.reverseOrder());
        PriorityQueue<Double> free = new PriorityQueue<>();
        for (int i = 0; i < Math.min(executors, sorted.size()); i++) {
            free.add(0.0);
        }
        double end = 0;
        for (double t : sorted) {
            double start = free.poll();
            double finish = start + t + overheadS;
            end = Math.max(end, finish);
            free.add(finish);
        }
        return end;
    }

    @Test
    void localOneAgainstLocalTwoAndAScheduleModel() throws Exception {
        run("local[1]", "warm"); // JIT and class loading warm-up, not measured
        Run one = run("local[1]", "one");
        Run two = run("local[2]", "two");
        assertEquals(one.sigma(), two.sigma());
        double sum = one.taskS().stream().mapToDouble(Double::doubleValue).sum();
        List<Double> sorted = new ArrayList<>(one.taskS());
        Collections.sort(sorted);
        double driver = one.wallS() - one.taskPhaseS();
        double overhead = Math.max(0, (one.taskPhaseS() - sum) / sorted.size());
        StringBuilder out = new StringBuilder();
        out.append(String.format(Locale.ROOT, "cells %d; local[1] wall %.2f s (task phase %.2f s), local[2] wall %.2f s"
                        + " (task phase %.2f s): speed-up %.2f (task phase %.2f)%n", sorted.size(), one.wallS(),
                one.taskPhaseS(), two.wallS(), two.taskPhaseS(), one.wallS() / two.wallS(),
                one.taskPhaseS() / two.taskPhaseS()));
        out.append(String.format(Locale.ROOT, "task run time local[1]: min %.3f, median %.3f, p90 %.3f, max %.3f, sum %.2f s;"
                        + " local[2] sum %.2f s%n", sorted.get(0), sorted.get(sorted.size() / 2),
                sorted.get((int) (sorted.size() * 0.9)), sorted.get(sorted.size() - 1), sum,
                two.taskS().stream().mapToDouble(Double::doubleValue).sum()));
        out.append(String.format(Locale.ROOT, "driver serial D = %.2f s, per-task overhead o = %.4f s%n", driver, overhead));
        double t1 = driver + makespan(one.taskS(), 1, overhead);
        for (int e : new int[] {1, 2, 8, 64, 512}) {
            double te = driver + makespan(one.taskS(), e, overhead);
            out.append(String.format(Locale.ROOT, "E=%d: predicted %.2f s, speed-up %.2f%n", e, te, t1 / te));
        }
        System.out.print(out);
        Files.writeString(Path.of("target", "spark-scaling.txt"), out.toString());
    }
}
