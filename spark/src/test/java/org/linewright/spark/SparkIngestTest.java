package org.linewright.spark;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.stream.Stream;
import org.apache.spark.SparkConf;
import org.apache.spark.api.java.JavaSparkContext;
import org.junit.jupiter.api.AfterAll;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.ingest.InputException;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.partition.SpeciesDataFiles;
import org.linewright.ingest.pipeline.IngestListener;
import org.linewright.ingest.pipeline.IngestOptions;
import org.linewright.ingest.pipeline.IngestPipeline;
import org.linewright.ingest.store.LineCursor;
import org.linewright.ingest.store.LineQuery;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.store.SourceInfo;
import org.linewright.ingest.testsupport.ReferenceSamples;

/**
 * File-parallel ingest on real Spark in local mode ({@code local[2]}) against the local sequential ingest of the
 * same files, on real lines: the HITRAN2020 samples of CO, CO2 and N2O (Gordon et al. 2022, JQSRT 277, 107949), cut
 * into several files, some of them shuffled so that their ingest goes through the external sort. The independent
 * reference is the sequential in-process ingest: every column of every line, bit for bit, the metadata but for the
 * creation time, and the file sizes must be the same.
 */
class SparkIngestTest {
    private static JavaSparkContext spark;

    @TempDir
    Path dir;

    @BeforeAll
    static void startSpark() throws Exception {
        SparkConf conf = new SparkConf().setAppName("linewright ingest test")
                .setMaster(SparkTableBuild.effectiveMaster("local[2]")).set("spark.ui.enabled", "false");
        spark = new JavaSparkContext(conf);
    }

    @AfterAll
    static void stopSpark() {
        if (spark != null) {
            spark.stop();
        }
    }

    /** The samples cut into files of about {@code perFile} records; every other file shuffled (seeded). */
    private List<Path> set() throws IOException {
        List<String> records = new ArrayList<>();
        for (String sample : new String[] {"sample_CO.par", "sample_CO2.par", "sample_N2O.par"}) {
            records.addAll(ReferenceSamples.lines(ReferenceSamples.hitranSample(sample)));
        }
        Path folder = Files.createDirectories(dir.resolve("set"));
        List<Path> files = new ArrayList<>();
        int perFile = 2500;
        Random random = new Random(3);
        for (int from = 0, n = 0; from < records.size(); from += perFile, n++) {
            List<String> part = new ArrayList<>(records.subList(from, Math.min(records.size(), from + perFile)));
            if (n % 2 == 1) {
                Collections.shuffle(part, random);
            }
            Path f = folder.resolve(String.format("part-%02d.par", n));
            Files.write(f, part, StandardCharsets.ISO_8859_1);
            files.add(f);
        }
        return files;
    }

    private static void sequential(List<Path> files, Path store) throws IOException {
        IngestPipeline.run(files, store, new IngestOptions(null, false, null, SpeciesDataFiles.none().registry(),
                Map.of("command", "ingest")), IngestListener.NONE);
    }

    private static void onSpark(List<Path> files, Path store) throws IOException {
        SparkIngest.on(spark).ingest(files, store, null, Map.of("command", "ingest"), SpeciesDataFiles.none(), null);
    }

    @Test
    void fileParallelIngestStoresWhatASequentialIngestStores() throws IOException {
        List<Path> files = set();
        assertTrue(files.size() >= 6, "a set of several files");
        Path local = dir.resolve("local");
        Path parallel = dir.resolve("parallel");
        sequential(files, local);
        onSpark(files, parallel);
        LineStore a = LineStore.open(local);
        LineStore b = LineStore.open(parallel);
        assertEquals(files.size(), b.sources().size());
        assertEquals(a.totalLines(), b.totalLines());
        for (SourceInfo sa : a.sources()) {
            SourceInfo sb = b.source(sa.name());
            assertEquals(sa.metadata(), sb.metadata(), sa.name());
            assertEquals(sa.counts(), sb.counts(), sa.name());
            assertEquals(sa.isotopologues(), sb.isotopologues(), sa.name());
            assertEquals(Files.size(sa.file()), Files.size(sb.file()), sa.name() + ": file size");
        }
        List<String> want = allColumns(a);
        List<String> got = allColumns(b);
        assertEquals(want.size(), got.size());
        for (int i = 0; i < want.size(); i++) {
            assertEquals(want.get(i), got.get(i), "line " + i);
        }
        try (Stream<Path> left = Files.list(parallel)) {
            assertFalse(left.anyMatch(p -> p.getFileName().toString().startsWith(".partial-")), "staging removed");
        }
    }

    @Test
    void aBadRecordInOneFileIsOneLineNamingItAndTheStoreKeepsWhatItHad() throws IOException {
        List<Path> files = set();
        Path store = dir.resolve("store");
        sequential(List.of(files.get(0)), store);
        List<String> before = allColumns(LineStore.open(store));
        Path bad = files.get(3);
        List<String> lines = new ArrayList<>(Files.readAllLines(bad, StandardCharsets.ISO_8859_1));
        // Columns 4-15 hold the wavenumber (HITRAN 160-character format, Rothman et al. 2005).
        lines.set(10, lines.get(10).substring(0, 3) + "   abc.defgh" + lines.get(10).substring(15));
        Files.write(bad, lines, StandardCharsets.ISO_8859_1);
        InputException e = assertThrows(InputException.class, () -> onSpark(files, store));
        assertTrue(e.getMessage().contains(bad.getFileName().toString()), e.getMessage());
        assertFalse(e.getMessage().contains("\n"), "one line");
        LineStore after = LineStore.open(store);
        assertEquals(1, after.sources().size(), "nothing of the failed ingest committed");
        assertEquals(before, allColumns(after), "the store keeps what it had");
        try (Stream<Path> left = Files.list(store)) {
            assertFalse(left.anyMatch(p -> p.getFileName().toString().startsWith(".partial-")), "staging removed");
        }
    }

    @Test
    void aFileMissingOnTheExecutorsIsOneLine() throws IOException {
        List<Path> files = new ArrayList<>(set());
        files.add(dir.resolve("set/not-there.par"));
        InputException e = assertThrows(InputException.class, () -> onSpark(files, dir.resolve("store")));
        assertTrue(e.getMessage().contains("not-there.par") && e.getMessage().contains("executor"), e.getMessage());
    }

    @Test
    void anUnreachableMasterIsOneLineBeforeSparkStarts() {
        InputException e = assertThrows(InputException.class, () -> SparkIngest.start("spark://127.0.0.1:1"));
        assertTrue(e.getMessage().contains("does not answer"), e.getMessage());
        assertThrows(InputException.class, () -> SparkIngest.start("bogus://nowhere"));
    }

    /** Every column of every line, numbers as their exact bits, texts verbatim. */
    private static List<String> allColumns(LineStore store) throws IOException {
        List<String> rows = new ArrayList<>();
        try (LineCursor c = store.cursor(LineQuery.all())) {
            LineBatch b = new LineBatch(1000);
            while (c.read(b)) {
                for (int i = 0; i < b.size; i++) {
                    StringBuilder sb = new StringBuilder();
                    for (LineColumn col : LineColumn.values()) {
                        switch (col.kind()) {
                            case INT -> sb.append(col.ints(b)[i]);
                            case LONG -> sb.append(col.longs(b)[i]);
                            case DOUBLE -> sb.append(Long.toHexString(Double.doubleToRawLongBits(col.doubles(b)[i])));
                            default -> sb.append(col.text(b).get(i));
                        }
                        sb.append('|');
                    }
                    rows.add(sb.toString());
                }
            }
        }
        return rows;
    }
}
