package org.linewright.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.TreeMap;
import org.apache.spark.SparkConf;
import org.apache.spark.api.java.JavaSparkContext;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.grid.plan.PlanReader;
import org.linewright.grid.table.BuildListener;
import org.linewright.grid.table.BuildReport;
import org.linewright.grid.table.CalculatorBlocks;
import org.linewright.grid.table.CrossSectionTable;
import org.linewright.grid.table.TableBuilder;
import org.linewright.ingest.testsupport.ReferenceSamples;

/**
 * Builds on real Spark in local mode ({@code local[2]}, tasks tried up to 4 times) against the local builder, on
 * real lines (HITRAN2020 CO sample, Gordon et al. 2022, JQSRT 277, 107949). The independent reference of each
 * check is the local in-process build: Spark must give its σ bits (SHA-256 of σ as stored), its metadata but for
 * the runner, and recompute exactly the cells it recomputes. The test hook fails the first attempt of cell
 * (0, 0, 0) in every Spark build of this class, so every build that computes that cell goes through a retry.
 */
class SparkTableBuildTest {
    /** 0-based columns of the air-broadened width in a 160-character record (HITRAN format, Rothman et al. 2005). */
    private static final int AIR_WIDTH_FROM = 35;
    private static final int AIR_WIDTH_TO = 40;
    private static JavaSparkContext spark;

    @TempDir
    Path dir;

    @BeforeAll
    static void startSpark() throws Exception {
        SparkConf conf = new SparkConf().setAppName("linewright test")
                .setMaster(SparkTableBuild.effectiveMaster("local[2]"))
                .set("spark.ui.enabled", "false").set(SparkTableBuild.FAIL_ONCE_KEY, "0,0,0");
        spark = new JavaSparkContext(conf);
    }

    @AfterAll
    static void stopSpark() {
        if (spark != null) {
            spark.stop();
        }
    }

    private Path plan(String folder, Path lines) throws IOException {
        Path d = Files.createDirectories(dir.resolve(folder));
        Files.copy(lines, d.resolve("co.par"), StandardCopyOption.REPLACE_EXISTING);
        Path plan = d.resolve("plan.toml");
        Files.writeString(plan, """
                [lines]
                sources = ["co.par"]
                [grid]
                wavenumber = { from = 2000.0, to = 2250.0, step = 0.02 }
                pressures_bar = [0.1, 1.0]
                temperatures_K = [296.0, 1000.0]
                [background]
                air = 1.0
                [profile]
                cutoff_cm1 = 5.0
                [build]
                block_points = 2500
                [output]
                table = "out/co.arrow"
                """);
        return plan;
    }

    private static BuildReport local(Path plan) throws IOException {
        return TableBuilder.build(PlanReader.read(plan), CalculatorBlocks.factory(), 2, false, BuildListener.NONE);
    }

    private static BuildReport onSpark(SparkTableBuild b, Path plan) throws IOException {
        return b.build(PlanReader.read(plan), BuildListener.NONE);
    }

    private static Map<String, String> metadataWithout(Path table, String... keys) throws IOException {
        Map<String, String> m = new TreeMap<>(CrossSectionTable.open(table).metadata());
        for (String k : keys) {
            m.remove(k);
        }
        return m;
    }

    @Test
    void sparkBuildIsTheLocalBuildBitForBitAndTheyReuseEachOthersCells() throws IOException {
        Path sample = ReferenceSamples.hitranSample("sample_CO.par");
        Path localPlan = plan("local", sample);
        Path sparkPlan = plan("spark", sample);
        BuildReport l = local(localPlan);
        try (SparkTableBuild b = SparkTableBuild.on(spark, null)) {
            BuildReport s = onSpark(b, sparkPlan);
            assertEquals(l.cells(), s.computed());
            assertTrue(b.failedTasks() >= 1, "the hook's failed attempt was seen and retried");
            assertEquals(l.written().sigmaSha256(), s.written().sigmaSha256());
            assertEquals(metadataWithout(l.table(), "created_utc", "runner"),
                    metadataWithout(s.table(), "created_utc", "runner"));
            assertEquals("spark", CrossSectionTable.open(s.table()).metadata().get("runner"));
            assertEquals("local", CrossSectionTable.open(l.table()).metadata().get("runner"));
            // a local rebuild of the Spark-built table computes nothing, and a Spark rebuild of the local one neither
            assertEquals(0, local(sparkPlan).computed());
            assertEquals(0, onSpark(b, localPlan).computed());
            assertEquals(l.written().sigmaSha256(), local(sparkPlan).written().sigmaSha256());
        }
    }

    @Test
    void incrementalSparkRebuildRecomputesExactlyTheLocalBuildersCells() throws IOException {
        Path sample = ReferenceSamples.hitranSample("sample_CO.par");
        List<String> records = Files.readAllLines(sample, StandardCharsets.US_ASCII);
        List<String> edited = new ArrayList<>(records);
        int changed = 0;
        for (int i = 0; i < records.size(); i++) {
            String r = records.get(i);
            double centre = Double.parseDouble(r.substring(3, 15).trim());
            if (centre > 2180.0 && centre < 2200.0) {
                edited.set(i, r.substring(0, AIR_WIDTH_FROM) + ".0999" + r.substring(AIR_WIDTH_TO));
                changed++;
            }
        }
        assertTrue(changed > 0);
        Path editedFile = dir.resolve("edited.par");
        Files.write(editedFile, edited, StandardCharsets.US_ASCII);
        Path localPlan = plan("local-inc", sample);
        Path sparkPlan = plan("spark-inc", sample);
        local(localPlan);
        try (SparkTableBuild b = SparkTableBuild.on(spark, null)) {
            onSpark(b, sparkPlan);
            Files.copy(editedFile, localPlan.resolveSibling("co.par"), StandardCopyOption.REPLACE_EXISTING);
            Files.copy(editedFile, sparkPlan.resolveSibling("co.par"), StandardCopyOption.REPLACE_EXISTING);
            BuildReport l = local(localPlan);
            BuildReport s = onSpark(b, sparkPlan);
            assertTrue(l.computed() > 0 && l.computed() < l.cells(),
                    String.format(Locale.ROOT, "a local change: %d of %d", l.computed(), l.cells()));
            assertEquals(l.pending(), s.pending());
            assertEquals(l.written().sigmaSha256(), s.written().sigmaSha256());
        }
    }
}
