package org.linewright.ingest.store;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.Collections;
import java.util.Comparator;
import java.util.EnumSet;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.apache.arrow.memory.BufferAllocator;
import org.apache.arrow.memory.RootAllocator;
import org.apache.arrow.vector.ipc.ArrowFileReader;
import org.apache.arrow.vector.types.pojo.Field;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;

/**
 * Store files holding only the columns their source provides: the file's schema (read back with Arrow's own
 * {@link ArrowFileReader}) lists exactly those, and the store reads a column a file lacks as NaN or empty text,
 * alone, with a projection, with a species selection, after the external sort, and merged with files holding
 * other columns. Lines are synthetic ({@link SyntheticLines}); expected values are recomputed from each line's id.
 */
class StoreColumnsTest {
    @TempDir
    Path dir;

    private static final SourceMetadata META = SourceMetadata.of("synthetic.par", "", "hitran160", Map.of());

    /** A reduced set: no He broadening, no upper energy, no K, no reference codes nor line-mixing flag. */
    private static final Set<LineColumn> LACKING = Collections.unmodifiableSet(EnumSet.of(LineColumn.HE_WIDTH,
            LineColumn.HE_WIDTH_EXPONENT, LineColumn.HE_SHIFT, LineColumn.UPPER_ENERGY, LineColumn.UPPER_K,
            LineColumn.REFERENCE_CODES, LineColumn.LINE_MIXING_FLAG));

    record Planned(long id, double wavenumberCm1, int molecule, int iso, boolean reduced) { }

    private static List<Planned> plan(int n, long seed, int distinctWavenumbers, boolean reduced) {
        Random r = new Random(seed);
        List<Planned> lines = new ArrayList<>();
        for (int i = 0; i < n; i++) {
            // Few distinct wavenumbers: many ties within and across files.
            lines.add(new Planned(seed * 1_000_000 + i, 100 + r.nextInt(distinctWavenumbers) * 0.25, 1 + r.nextInt(3),
                    1 + r.nextInt(2), reduced));
        }
        return lines;
    }

    private static Set<LineColumn> provided(boolean reduced) {
        EnumSet<LineColumn> all = EnumSet.allOf(LineColumn.class);
        if (reduced) {
            all.removeAll(LACKING);
        }
        return all;
    }

    /** Writes the lines (every column filled, also the ones the source does not provide) as one source. */
    private static void ingest(Path store, String name, List<Planned> lines, Set<LineColumn> provided, int runLines)
            throws IOException {
        try (LineStoreWriter w = LineStoreWriter.create(store, name, META, provided, runLines)) {
            LineBatch b = new LineBatch(333);
            for (Planned p : lines) {
                SyntheticLines.fillRow(b, b.size, p.id, p.wavenumberCm1, p.molecule, p.iso);
                b.size++;
                if (b.isFull()) {
                    w.write(b);
                    b.clear();
                }
            }
            w.write(b);
            w.commit(new IngestCounts(lines.size(), lines.size(), 0, 0));
        }
    }

    /** The line as the store must return it: a column the file lacks is NaN or empty. */
    private static LineBatch expected(Planned p) {
        LineBatch e = new LineBatch(1);
        SyntheticLines.fillRow(e, 0, p.id, p.wavenumberCm1, p.molecule, p.iso);
        e.size = 1;
        if (p.reduced) {
            for (LineColumn c : LACKING) {
                if (c.kind() == LineColumn.Kind.TEXT) {
                    c.text(e).clear();
                    c.text(e).appendEmpty();
                } else {
                    c.doubles(e)[0] = Double.NaN;
                }
            }
        }
        return e;
    }

    /** Reads the query and checks every projected column of every line against {@code want}, in order. */
    private static void assertReads(LineStore store, LineQuery q, List<Planned> want) throws IOException {
        int seen = 0;
        try (LineCursor c = store.cursor(q)) {
            LineBatch b = new LineBatch(1000);
            while (c.read(b)) {
                for (int i = 0; i < b.size; i++, seen++) {
                    Planned p = want.get(seen);
                    LineBatch e = expected(p);
                    for (LineColumn col : q.columns()) {
                        String what = col.columnName() + " of line " + p.id + (p.reduced ? " (reduced file)" : "");
                        switch (col.kind()) {
                            case INT -> assertEquals(col.ints(e)[0], col.ints(b)[i], what);
                            case LONG -> assertEquals(col.longs(e)[0], col.longs(b)[i], what);
                            // Bitwise: NaN must come back as NaN.
                            case DOUBLE -> assertEquals(Double.doubleToLongBits(col.doubles(e)[0]),
                                    Double.doubleToLongBits(col.doubles(b)[i]), what);
                            case TEXT -> assertEquals(col.text(e).get(0), col.text(b).get(i), what);
                            default -> throw new AssertionError(col);
                        }
                    }
                }
            }
        }
        assertEquals(want.size(), seen);
    }

    /** Expected order: java.util.List.sort (documented as stable) of the sources' lines in source order. */
    private static List<Planned> sorted(List<Planned> lines) {
        List<Planned> copy = new ArrayList<>(lines);
        copy.sort(Comparator.comparingDouble(Planned::wavenumberCm1));
        return copy;
    }

    /** Field names as Arrow's own file reader reports them (the footer schema). */
    private static List<String> arrowFieldNames(Path file) throws IOException {
        try (FileChannel ch = FileChannel.open(file, StandardOpenOption.READ);
             BufferAllocator a = new RootAllocator();
             ArrowFileReader r = new ArrowFileReader(ch, a)) {
            return r.getVectorSchemaRoot().getSchema().getFields().stream().map(Field::getName).collect(Collectors.toList());
        }
    }

    private static Path storeFile(Path store, String name) {
        return store.resolve(LineStoreWriter.fileName(name));
    }

    @Test
    void reducedFileListsOnlyItsColumnsAndReadsTheOthersAsMissing() throws IOException {
        List<Planned> lines = plan(4000, 3, 400, true);
        // Unsorted input with small runs: the external sort's runs and merge passes use the reduced schema too.
        ingest(dir, "reduced", lines, provided(true), 500);

        List<String> expectedNames = Stream.of(LineColumn.values()).filter(c -> !LACKING.contains(c))
                .map(LineColumn::columnName).collect(Collectors.toList());
        assertEquals(expectedNames, arrowFieldNames(storeFile(dir, "reduced")));

        LineStore store = LineStore.open(dir);
        List<Planned> want = sorted(lines);
        assertReads(store, LineQuery.all(), want);
        // Projection onto present and absent columns.
        assertReads(store, LineQuery.all().withColumns(List.of(LineColumn.HE_WIDTH, LineColumn.INTENSITY,
                LineColumn.REFERENCE_CODES, LineColumn.LOWER_GLOBAL_QUANTA, LineColumn.UPPER_K)), want);
        // Species selection compacts the rows read; absent columns stay missing.
        assertReads(store, LineQuery.all().withMolecules(2).withWavenumberRange(120, 180),
                want.stream().filter(p -> p.molecule == 2 && p.wavenumberCm1 >= 120 && p.wavenumberCm1 <= 180)
                        .collect(Collectors.toList()));
    }

    @Test
    void alwaysStoredColumnsStayWhenTheSourceProvidesNothingElse() throws IOException {
        List<Planned> lines = plan(300, 4, 50, false);
        ingest(dir, "bare", lines, EnumSet.noneOf(LineColumn.class), LineStoreWriter.DEFAULT_RUN_LINES);
        assertEquals(List.of("molecule", "isotopologue", "wavenumber_cm1", "source_line"),
                arrowFieldNames(storeFile(dir, "bare")));
        try (LineCursor c = LineStore.open(dir).cursor(LineQuery.all())) {
            LineBatch b = new LineBatch(1000);
            assertTrue(c.read(b));
            assertEquals(300, b.size);
            for (int i = 0; i < b.size; i++) {
                assertTrue(Double.isNaN(b.intensityCmPerMolecule[i]) && Double.isNaN(b.upperJ[i]));
                assertEquals("", b.upperGlobalQuanta.get(i));
            }
        }
    }

    @Test
    void sourcesWithDifferentColumnSetsMergeAsIfEveryColumnWereWritten() throws IOException {
        // "a-full" sorts before "b-reduced": among equal wavenumbers its lines come first.
        List<Planned> full = plan(2500, 5, 300, false);
        List<Planned> reduced = plan(2500, 6, 300, true);
        ingest(dir, "a-full", full, provided(false), 700);
        ingest(dir, "b-reduced", reduced, provided(true), 700);
        assertEquals(LineColumn.values().length, arrowFieldNames(storeFile(dir, "a-full")).size());
        assertEquals(LineColumn.values().length - LACKING.size(), arrowFieldNames(storeFile(dir, "b-reduced")).size());

        List<Planned> want = new ArrayList<>(sorted(full));
        want.addAll(sorted(reduced));
        want = sorted(want);
        LineStore store = LineStore.open(dir);
        assertReads(store, LineQuery.all(), want);
        assertReads(store, LineQuery.all().withColumns(List.of(LineColumn.HE_SHIFT, LineColumn.LINE_MIXING_FLAG)), want);
        assertReads(store, LineQuery.all().withIsotopologue(3, 2),
                want.stream().filter(p -> p.molecule == 3 && p.iso == 2).collect(Collectors.toList()));
    }

    @Test
    void fileShrinksByAtLeastTheValuesOfTheColumnsLeftOut() throws IOException {
        List<Planned> lines = sorted(plan(20_000, 7, 5000, false));
        Set<LineColumn> withoutFourteen = EnumSet.allOf(LineColumn.class);
        for (LineColumn c : LineColumn.values()) {
            if (c.columnName().startsWith("h2_") || c.columnName().startsWith("he_") || c.columnName().startsWith("co2_")
                    || c.columnName().startsWith("h2o_")) {
                withoutFourteen.remove(c);
            }
        }
        withoutFourteen.remove(LineColumn.UPPER_ENERGY);
        withoutFourteen.remove(LineColumn.WAVENUMBER_UNCERTAINTY);
        assertEquals(LineColumn.values().length - 14, withoutFourteen.size());
        ingest(dir, "full", lines, EnumSet.allOf(LineColumn.class), LineStoreWriter.DEFAULT_RUN_LINES);
        ingest(dir, "lean", lines, withoutFourteen, LineStoreWriter.DEFAULT_RUN_LINES);
        long fullBytes = Files.size(storeFile(dir, "full"));
        long leanBytes = Files.size(storeFile(dir, "lean"));
        // Arrow columnar format (specification, "Fixed-size primitive layout"): a float64 value takes 8 bytes,
        // so leaving out 14 float64 columns saves at least 14 * 8 bytes per line.
        assertTrue(fullBytes - leanBytes >= 14L * Double.BYTES * lines.size(),
                "full " + fullBytes + " bytes, without 14 columns " + leanBytes + " bytes");
    }
}
