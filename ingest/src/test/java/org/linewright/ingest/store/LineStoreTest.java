package org.linewright.ingest.store;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.Comparator;
import java.util.EnumSet;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.apache.arrow.memory.BufferAllocator;
import org.apache.arrow.memory.RootAllocator;
import org.apache.arrow.vector.Float8Vector;
import org.apache.arrow.vector.VarCharVector;
import org.apache.arrow.vector.VectorSchemaRoot;
import org.apache.arrow.vector.ipc.ArrowFileReader;
import org.apache.arrow.vector.types.pojo.Field;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.ingest.InputException;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.source.IsotopologueLookup;

class LineStoreTest {
    @TempDir
    Path dir;

    private static final SourceMetadata META = new SourceMetadata("synthetic.par", "ab".repeat(32), "hitran160",
            "9.9.9-test", Map.of("lenient", "true", "filter", "a=b c"));

    /** A planned line: its id (which determines every other column) and its wavenumber and species. */
    record Planned(long id, double wavenumberCm1, int molecule, int iso) { }

    private static List<Planned> plan(int n, long seed, boolean sorted, int distinctWavenumbers) {
        Random r = new Random(seed);
        List<Planned> lines = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            // Few distinct wavenumbers make many ties, which exercises stability.
            double wn = distinctWavenumbers > 0 ? 100 + r.nextInt(distinctWavenumbers) * 0.5 : 100 + r.nextDouble() * 1000;
            lines.add(new Planned(seed * 1_000_000 + i, wn, 1 + r.nextInt(3), 1 + r.nextInt(2)));
        }
        if (sorted) {
            lines.sort(Comparator.comparingDouble(Planned::wavenumberCm1));
        }
        return lines;
    }

    private static SourceInfo ingest(Path store, String name, List<Planned> lines, int batchSize, int runLines) throws IOException {
        try (LineStoreWriter w = LineStoreWriter.create(store, name, META, runLines)) {
            LineBatch b = new LineBatch(batchSize);
            for (Planned p : lines) {
                SyntheticLines.fillRow(b, b.size, p.id, p.wavenumberCm1, p.molecule, p.iso);
                b.size++;
                if (b.isFull()) {
                    w.write(b);
                    b.clear();
                }
            }
            w.write(b);
            return w.commit(new IngestCounts(lines.size() + 3, lines.size(), 3, 1));
        }
    }

    private static List<long[]> readIds(LineStore store, LineQuery q, int batchSize) throws IOException {
        List<long[]> out = new ArrayList<>();
        try (LineCursor c = store.cursor(q)) {
            LineBatch b = new LineBatch(batchSize);
            while (c.read(b)) {
                for (int i = 0; i < b.size; i++) {
                    out.add(new long[] {b.sourceLine[i], Double.doubleToLongBits(b.wavenumberCm1[i])});
                }
            }
        }
        return out;
    }

    /** Expected order: java.util.List.sort, documented as stable (general-purpose reference implementation). */
    private static List<Long> expectedOrder(List<Planned> lines) {
        List<Planned> copy = new ArrayList<>(lines);
        copy.sort(Comparator.comparingDouble(Planned::wavenumberCm1));
        return copy.stream().map(Planned::id).collect(Collectors.toList());
    }

    @Test
    void roundTripsEveryColumnIncludingNaNEmptyAndLongTexts() throws IOException {
        List<Planned> lines = plan(5000, 1, true, 0);
        SourceInfo info = ingest(dir, "one", lines, 777, LineStoreWriter.DEFAULT_RUN_LINES);
        assertEquals(5000, info.lines());
        LineStore store = LineStore.open(dir);
        LineBatch expected = new LineBatch(1);
        int seen = 0;
        try (LineCursor c = store.cursor(LineQuery.all())) {
            LineBatch b = new LineBatch(1000);
            while (c.read(b)) {
                for (int i = 0; i < b.size; i++, seen++) {
                    Planned p = lines.get(seen);
                    expected.clear();
                    SyntheticLines.fillRow(expected, 0, p.id, p.wavenumberCm1, p.molecule, p.iso);
                    expected.size = 1;
                    for (LineColumn col : LineColumn.values()) {
                        String what = col.columnName() + " of line " + p.id;
                        switch (col.kind()) {
                            case INT -> assertEquals(col.ints(expected)[0], col.ints(b)[i], what);
                            case LONG -> assertEquals(col.longs(expected)[0], col.longs(b)[i], what);
                            // Bitwise equality: NaN must come back as NaN.
                            case DOUBLE -> assertEquals(Double.doubleToLongBits(col.doubles(expected)[0]),
                                    Double.doubleToLongBits(col.doubles(b)[i]), what);
                            case TEXT -> assertEquals(col.text(expected).get(0), col.text(b).get(i), what);
                            default -> throw new AssertionError(col);
                        }
                    }
                }
            }
        }
        assertEquals(5000, seen);
    }

    @Test
    void fileIsReadableByArrowItselfWithUnitsAndProvenance() throws IOException {
        List<Planned> lines = plan(300, 2, true, 0);
        SourceInfo info = ingest(dir, "arrow-check", lines, 128, LineStoreWriter.DEFAULT_RUN_LINES);
        // Reference: the Arrow Java IPC file reader (independent of the store's own column reader).
        try (BufferAllocator a = new RootAllocator();
             FileChannel ch = FileChannel.open(info.file(), StandardOpenOption.READ);
             ArrowFileReader r = new ArrowFileReader(ch, a)) {
            VectorSchemaRoot root = r.getVectorSchemaRoot();
            Field wn = root.getSchema().findField("wavenumber_cm1");
            assertEquals("cm-1", wn.getMetadata().get("unit"));
            assertEquals("cm-1/atm at 296 K", root.getSchema().findField("air_width_cm1_per_atm").getMetadata().get("unit"));
            Map<String, String> meta = root.getSchema().getCustomMetadata();
            assertEquals("synthetic.par", meta.get("linewright.source_file"));
            assertEquals("ab".repeat(32), meta.get("linewright.source_sha256"));
            assertEquals("hitran160", meta.get("linewright.reader_format"));
            assertEquals("9.9.9-test", meta.get("linewright.tool_version"));
            assertEquals("a=b c", meta.get("linewright.param.filter"));
            // Counts are known only at the end: they are in the schema the footer carries.
            assertEquals("303", meta.get("linewright.records_read"));
            assertEquals("300", meta.get("linewright.lines"));
            int row = 0;
            while (r.loadNextBatch()) {
                Float8Vector w = (Float8Vector) root.getVector("wavenumber_cm1");
                VarCharVector g = (VarCharVector) root.getVector("lower_global_quanta");
                for (int i = 0; i < root.getRowCount(); i++, row++) {
                    assertEquals(lines.get(row).wavenumberCm1, w.get(i));
                    long id = lines.get(row).id;
                    assertEquals(id % 13 == 0 ? "x".repeat(300) : "g" + id, g.getObject(i).toString());
                }
            }
            assertEquals(300, row);
        }
    }

    @Test
    void metadataAndCountsComeBack() throws IOException {
        ingest(dir, "meta", plan(10, 3, true, 0), 4, LineStoreWriter.DEFAULT_RUN_LINES);
        LineStore store = LineStore.open(dir);
        SourceInfo s = store.source("meta");
        assertNotNull(s);
        assertEquals(META, s.metadata());
        assertEquals(new IngestCounts(13, 10, 3, 1), s.counts());
        assertEquals(10, store.totalLines());
        assertTrue(s.created().isBefore(java.time.Instant.now().plusSeconds(1)));
        assertFalse(s.isotopologues().isEmpty());
    }

    @Test
    void externalSortWithSmallRunsIsStableAndComplete() throws IOException {
        // 20 distinct wavenumbers over 5000 lines: heavy ties; runs of 300 lines force ~17 spilled runs.
        List<Planned> lines = plan(5000, 4, false, 20);
        ingest(dir, "unsorted", lines, 256, 300);
        LineStore store = LineStore.open(dir);
        List<long[]> got = readIds(store, LineQuery.all(), 999);
        assertEquals(expectedOrder(lines), got.stream().map(x -> x[0]).collect(Collectors.toList()));
        try (Stream<Path> files = Files.list(dir)) {
            assertEquals(List.of(), files.map(p -> p.getFileName().toString()).filter(f -> f.startsWith(".partial"))
                    .collect(Collectors.toList()), "no temporary run files left");
        }
    }

    @Test
    void manyRunsAreMergedInSeveralPassesStably() throws IOException {
        // Runs of 37 lines, at most 3 merged at once: 2000 lines make 55 runs and four merge passes.
        List<Planned> lines = plan(2000, 19, false, 25);
        try (LineStoreWriter w = LineStoreWriter.create(dir, "passes", META, 37, 3)) {
            LineBatch b = new LineBatch(50);
            for (Planned p : lines) {
                SyntheticLines.fillRow(b, b.size++, p.id, p.wavenumberCm1, p.molecule, p.iso);
                if (b.isFull()) {
                    w.write(b);
                    b.clear();
                }
            }
            w.write(b);
            w.commit(new IngestCounts(2000, 2000, 0, 0));
        }
        assertEquals(expectedOrder(lines), readIds(LineStore.open(dir), LineQuery.all(), 128).stream().map(x -> x[0])
                .collect(Collectors.toList()));
        try (Stream<Path> files = Files.list(dir)) {
            assertEquals(0, files.filter(p -> p.getFileName().toString().startsWith(".partial")).count());
        }
    }

    @Test
    void unsortedIngestStoresEveryColumnOfEveryLineAsTheSortedIngestDoes() throws IOException {
        // The same lines ingested once pre-sorted (java.util.List.sort, documented as stable: the streamed path,
        // no runs) and once shuffled through the external sort (runs of 97 lines, at most 4 merged at once, so
        // intermediate passes too): every column of every row must read back bit for bit the same.
        List<Planned> shuffled = plan(3000, 23, false, 60);
        List<Planned> sorted = new ArrayList<>(shuffled);
        sorted.sort(Comparator.comparingDouble(Planned::wavenumberCm1));
        Path sortedDir = dir.resolve("sorted");
        Path unsortedDir = dir.resolve("unsorted");
        writeAll(LineStoreWriter.create(sortedDir, "s", META, LineStoreWriter.DEFAULT_RUN_LINES, 4), sorted, 250);
        writeAll(LineStoreWriter.create(unsortedDir, "s", META, 97, 4), shuffled, 250);
        List<String> expected = allColumns(LineStore.open(sortedDir));
        List<String> got = allColumns(LineStore.open(unsortedDir));
        assertEquals(3000, expected.size());
        for (int i = 0; i < expected.size(); i++) {
            assertEquals(expected.get(i), got.get(i), "row " + i);
        }
    }

    private static void writeAll(LineStoreWriter w, List<Planned> lines, int batchLines) throws IOException {
        try (w) {
            LineBatch b = new LineBatch(batchLines);
            for (Planned p : lines) {
                SyntheticLines.fillRow(b, b.size++, p.id, p.wavenumberCm1, p.molecule, p.iso);
                if (b.isFull()) {
                    w.write(b);
                    b.clear();
                }
            }
            w.write(b);
            w.commit(new IngestCounts(lines.size(), lines.size(), 0, 0));
        }
    }

    /** Every column of every row, numbers as their exact bits, texts verbatim, one string per row. */
    private static List<String> allColumns(LineStore store) throws IOException {
        List<String> rows = new ArrayList<>();
        try (LineCursor c = store.cursor(LineQuery.all())) {
            LineBatch b = new LineBatch(333);
            while (c.read(b)) {
                for (int i = 0; i < b.size; i++) {
                    StringBuilder sb = new StringBuilder();
                    for (LineColumn col : LineColumn.values()) {
                        sb.append(col.columnName()).append('=');
                        switch (col.kind()) {
                            case INT -> sb.append(col.ints(b)[i]);
                            case LONG -> sb.append(col.longs(b)[i]);
                            case DOUBLE -> sb.append(Long.toHexString(Double.doubleToRawLongBits(col.doubles(b)[i])));
                            default -> sb.append(col.text(b).get(i));
                        }
                        sb.append(' ');
                    }
                    rows.add(sb.toString());
                }
            }
        }
        return rows;
    }

    @Test
    void sortedPrefixThenDisorderIsMergedInInputOrderForTies() throws IOException {
        List<Planned> lines = new ArrayList<>(plan(1000, 5, true, 30));
        lines.addAll(plan(1000, 6, false, 30));
        ingest(dir, "mixed", lines, 100, 128);
        List<long[]> got = readIds(LineStore.open(dir), LineQuery.all(), 64);
        assertEquals(expectedOrder(lines), got.stream().map(x -> x[0]).collect(Collectors.toList()));
    }

    @Test
    void multiSourceMergeIsOrderedWithTiesBySourceName() throws IOException {
        List<Planned> b = plan(700, 7, false, 50);
        List<Planned> a = plan(900, 8, true, 50);
        List<Planned> c = plan(10, 9, true, 50);
        ingest(dir, "b-source", b, 64, 100);
        ingest(dir, "a-source", a, 64, 100);
        ingest(dir, "c-source", c, 64, 100);
        LineStore store = LineStore.open(dir);
        assertEquals(List.of("a-source", "b-source", "c-source"),
                store.sources().stream().map(SourceInfo::name).collect(Collectors.toList()));
        List<Planned> all = new ArrayList<>(expectedOrderPlanned(a));
        all.addAll(expectedOrderPlanned(b));
        all.addAll(expectedOrderPlanned(c));
        // Stable sort of the concatenation in source-name order = the required tie order.
        assertEquals(expectedOrder(all), readIds(store, LineQuery.all(), 77).stream().map(x -> x[0]).collect(Collectors.toList()));
        assertEquals(1610, store.totalLines());
        assertEquals(all.stream().mapToDouble(Planned::wavenumberCm1).min().getAsDouble(), store.minWavenumberCm1());
        assertEquals(all.stream().mapToDouble(Planned::wavenumberCm1).max().getAsDouble(), store.maxWavenumberCm1());
    }

    private static List<Planned> expectedOrderPlanned(List<Planned> lines) {
        List<Planned> copy = new ArrayList<>(lines);
        copy.sort(Comparator.comparingDouble(Planned::wavenumberCm1));
        return copy;
    }

    @Test
    void filtersByWavenumberRangeMoleculeAndIsotopologue() throws IOException {
        List<Planned> a = plan(3000, 10, true, 0);
        List<Planned> b = plan(2000, 11, true, 0);
        ingest(dir, "a", a, 100, 1000);
        ingest(dir, "b", b, 100, 1000);
        LineStore store = LineStore.open(dir);
        List<Planned> all = new ArrayList<>(a);
        all.addAll(b);
        double lo = 333.3;
        double hi = 512.25;
        LineQuery q = LineQuery.all().withWavenumberRange(lo, hi).withMolecules(2).withIsotopologue(3, 1);
        List<Planned> want = all.stream()
                .filter(p -> p.wavenumberCm1 >= lo && p.wavenumberCm1 <= hi)
                .filter(p -> p.molecule == 2 || (p.molecule == 3 && p.iso == 1))
                .sorted(Comparator.comparingDouble(Planned::wavenumberCm1)).collect(Collectors.toList());
        assertTrue(want.size() > 100, "the test selects a fair number of lines");
        assertEquals(want.stream().map(Planned::id).collect(Collectors.toList()),
                readIds(store, q, 50).stream().map(x -> x[0]).collect(Collectors.toList()));
        // A range between lines and outside all lines selects nothing.
        assertEquals(List.of(), readIds(store, LineQuery.all().withWavenumberRange(5000, 6000), 10));
        assertThrows(IllegalArgumentException.class, () -> LineQuery.all().withWavenumberRange(2, 1));
    }

    @Test
    void projectionReadsOnlyRequestedColumns() throws IOException {
        List<Planned> lines = plan(400, 12, true, 0);
        ingest(dir, "p", lines, 100, 1000);
        LineStore store = LineStore.open(dir);
        LineBatch b = new LineBatch(1000);
        java.util.Arrays.fill(b.einsteinAS1, -1.0);
        try (LineCursor c = store.cursor(LineQuery.all().withColumns(EnumSet.of(LineColumn.INTENSITY, LineColumn.UPPER_LOCAL_QUANTA)))) {
            assertTrue(c.read(b));
            assertEquals(400, b.size);
            LineBatch e = new LineBatch(1);
            for (int i = 0; i < b.size; i++) {
                Planned p = lines.get(i);
                e.clear();
                SyntheticLines.fillRow(e, 0, p.id, p.wavenumberCm1, p.molecule, p.iso);
                assertEquals(e.intensityCmPerMolecule[0], b.intensityCmPerMolecule[i]);
                assertEquals(e.upperLocalQuanta.get(0), b.upperLocalQuanta.get(i));
                assertEquals(p.molecule, b.moleculeId[i]);
                assertEquals(-1.0, b.einsteinAS1[i], "unprojected column untouched");
            }
            assertEquals(0, b.lowerGlobalQuanta.rows(), "unprojected text column empty");
            assertFalse(c.read(b));
        }
    }

    @Test
    void abortedOrFailedWriteLeavesTheEarlierFileIntact() throws IOException {
        List<Planned> v1 = plan(500, 13, true, 0);
        ingest(dir, "src", v1, 100, 1000);
        List<long[]> before = readIds(LineStore.open(dir), LineQuery.all(), 100);

        // A failure half-way (a line without wavenumber) followed by abort.
        LineStoreWriter w = LineStoreWriter.create(dir, "src", META);
        LineBatch b = new LineBatch(10);
        for (int i = 0; i < 10; i++) {
            SyntheticLines.fillRow(b, i, 99_000 + i, 50.0 + i, 1, 1);
        }
        b.size = 10;
        w.write(b);
        b.wavenumberCm1[5] = Double.NaN;
        assertThrows(IllegalArgumentException.class, () -> w.write(b));
        w.abort();
        assertThrows(IllegalStateException.class, () -> w.commit(new IngestCounts(0, 0, 0, 0)));

        // A writer left unfinished (as after a crash): its partial file must not be listed or look finished.
        LineStoreWriter crashed = LineStoreWriter.create(dir, "src", META, 4);
        b.wavenumberCm1[5] = 55.0;
        crashed.write(b);
        b.wavenumberCm1[0] = 1e6;
        crashed.write(b);
        try (Stream<Path> files = Files.list(dir)) {
            List<String> names = files.map(p -> p.getFileName().toString()).sorted().collect(Collectors.toList());
            assertEquals(1, names.stream().filter(n -> n.startsWith("lines-")).count(), names.toString());
            assertTrue(names.stream().anyMatch(n -> n.startsWith(".partial-")), names.toString());
            for (String n : names) {
                if (n.startsWith(".partial-lines")) {
                    assertThrows(InputException.class, () -> ArrowLineFile.open(dir.resolve(n)), "unfinished file has no footer");
                }
            }
        }
        LineStore store = LineStore.open(dir);
        assertEquals(1, store.sources().size());
        assertEquals(500, store.totalLines());
        assertEquals(before.stream().map(x -> x[0]).collect(Collectors.toList()),
                readIds(store, LineQuery.all(), 100).stream().map(x -> x[0]).collect(Collectors.toList()));
        crashed.abort();
    }

    @Test
    void reingestingReplacesTheSourceFile() throws IOException {
        ingest(dir, "dup", plan(100, 14, true, 0), 30, 1000);
        ingest(dir, "dup", plan(40, 15, true, 0), 30, 1000);
        LineStore store = LineStore.open(dir);
        assertEquals(1, store.sources().size());
        assertEquals(40, store.totalLines());
        try (Stream<Path> files = Files.list(dir)) {
            assertEquals(1, files.filter(p -> p.getFileName().toString().endsWith(".arrow")).count());
        }
    }

    @Test
    void concurrentCommitsOfDifferentSourcesAllReachTheIndex() throws Exception {
        int sources = 8;
        java.util.concurrent.ExecutorService pool = java.util.concurrent.Executors.newFixedThreadPool(4);
        try {
            List<java.util.concurrent.Future<SourceInfo>> done = new ArrayList<>();
            for (int i = 0; i < sources; i++) {
                int k = i;
                done.add(pool.submit(() -> ingest(dir, "src-" + k, plan(200, 100 + k, k % 2 == 0, 0), 64, 50)));
            }
            for (java.util.concurrent.Future<SourceInfo> f : done) {
                assertEquals(200, f.get().lines());
            }
        } finally {
            pool.shutdown();
        }
        LineStore store = LineStore.open(dir);
        assertEquals(sources, store.sources().size());
        assertEquals(200L * sources, store.totalLines());
    }

    @Test
    void emptySourceIsAllowed() throws IOException {
        try (LineStoreWriter w = LineStoreWriter.create(dir, "empty", META)) {
            w.commit(new IngestCounts(2, 0, 2, 0));
        }
        LineStore store = LineStore.open(dir);
        assertEquals(0, store.totalLines());
        assertTrue(Double.isNaN(store.minWavenumberCm1()));
        assertEquals(List.of(), readIds(store, LineQuery.all(), 10));
    }

    @Test
    void isotopologuesPresentAreRecorded() throws IOException {
        List<Planned> lines = plan(200, 16, true, 0);
        SourceInfo info = ingest(dir, "iso", lines, 64, 1000);
        List<IsotopologueLookup.Id> want = lines.stream().map(p -> new IsotopologueLookup.Id(p.molecule, p.iso)).distinct()
                .sorted(Comparator.comparingInt(IsotopologueLookup.Id::moleculeId).thenComparingInt(IsotopologueLookup.Id::isotopologue))
                .collect(Collectors.toList());
        assertEquals(want, info.isotopologues());
        // A molecule absent from the store selects nothing.
        assertEquals(List.of(), readIds(LineStore.open(dir), LineQuery.all().withMolecules(47), 10));
    }

    @Test
    void smallSlicesOfRecordBatchesGiveTheSameLines() throws IOException {
        List<Planned> a = plan(1500, 17, true, 0);
        List<Planned> b = plan(900, 18, true, 40);
        SourceInfo sa = ingest(dir, "a", a, 256, 1000);
        SourceInfo sb = ingest(dir, "b", b, 100, 1000);
        LineStore store = LineStore.open(dir);
        LineQuery q = LineQuery.all().withWavenumberRange(300, 900).withMolecules(1, 3);
        List<long[]> whole = readIds(store, q, 64);
        List<long[]> sliced = new ArrayList<>();
        // Scanners holding 7 rows at a time read each record batch in many slices.
        try (LineCursor c = new LineCursor(List.of(ArrowLineFile.open(sa.file()), ArrowLineFile.open(sb.file())), q, 7)) {
            LineBatch batch = new LineBatch(33);
            while (c.read(batch)) {
                for (int i = 0; i < batch.size; i++) {
                    sliced.add(new long[] {batch.sourceLine[i], Double.doubleToLongBits(batch.wavenumberCm1[i])});
                }
            }
        }
        List<Planned> all = new ArrayList<>(a);
        all.addAll(b);
        List<Long> want = all.stream().filter(p -> p.wavenumberCm1 >= 300 && p.wavenumberCm1 <= 900)
                .filter(p -> p.molecule == 1 || p.molecule == 3)
                .sorted(Comparator.comparingDouble(Planned::wavenumberCm1)).map(Planned::id).collect(Collectors.toList());
        assertEquals(want, sliced.stream().map(x -> x[0]).collect(Collectors.toList()));
        assertEquals(want, whole.stream().map(x -> x[0]).collect(Collectors.toList()));
    }

    @Test
    void sha256OfAFileMatchesThePublishedTestVector() throws IOException {
        // FIPS 180-2 example: SHA-256("abc") = ba7816bf 8f01cfea 414140de 5dae2223 b00361a3 96177a9c b410ff61 f20015ad.
        Path f = dir.resolve("abc.txt");
        Files.writeString(f, "abc");
        assertEquals("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad", SourceMetadata.sha256(f));
    }

    @Test
    void notAStoreIsAClearError() throws IOException {
        InputException e = assertThrows(InputException.class, () -> LineStore.open(dir));
        assertTrue(e.getMessage().contains("linestore.properties"), e.getMessage());
    }

    @Test
    void rejectsTextColumnsOutOfStep() throws IOException {
        try (LineStoreWriter w = LineStoreWriter.create(dir, "bad", META)) {
            LineBatch b = new LineBatch(4);
            SyntheticLines.fillRow(b, 0, 1, 1.0, 1, 1);
            b.size = 2;
            b.moleculeId[1] = 1;
            b.wavenumberCm1[1] = 2.0;
            assertThrows(IllegalArgumentException.class, () -> w.write(b));
        }
    }
}
