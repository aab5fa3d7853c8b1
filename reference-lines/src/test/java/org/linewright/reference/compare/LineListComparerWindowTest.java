package org.linewright.reference.compare;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Map;
import java.util.function.IntFunction;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.store.IngestCounts;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.store.LineStoreWriter;
import org.linewright.ingest.store.SourceMetadata;

/**
 * The windowed merge on long, dense synthetic lists (invented lines, many times the window and the chunk size):
 * every planted change, and nothing else, is reported, whatever the window.
 */
class LineListComparerWindowTest {
    private static final int LINES = 30_000;
    private static final double SPACING_CM1 = 0.001;

    @TempDir
    Path temp;

    /** One synthetic line per index: position, intensity and a unique local label. */
    private static void fill(LineBatch b, int i, double wavenumberCm1, double intensity, String upperLocal) {
        int r = b.size++;
        b.clearOptional(r);
        b.moleculeId[r] = 5;
        b.isotopologue[r] = 1 + (i % 2);
        b.wavenumberCm1[r] = wavenumberCm1;
        b.intensityCmPerMolecule[r] = intensity;
        b.einsteinAS1[r] = 1.0;
        b.airWidthCm1PerAtm[r] = 0.07;
        b.selfWidthCm1PerAtm[r] = 0.08;
        b.airWidthExponent[r] = 0.7;
        b.airShiftCm1PerAtm[r] = -0.003;
        b.lowerEnergyCm1[r] = i;
        b.upperDegeneracy[r] = 3;
        b.lowerDegeneracy[r] = 1;
        b.sourceLine[r] = i + 1;
        b.upperGlobalQuanta.append("1");
        b.lowerGlobalQuanta.append("0");
        b.upperLocalQuanta.append(upperLocal);
        b.lowerLocalQuanta.append("L" + i);
        b.uncertaintyCodes.append("000000");
        b.referenceCodes.append("000000000000");
        b.lineMixingFlag.append(" ");
    }

    private LineStore store(String name, IntFunction<double[]> position, IntFunction<String> label, int skip)
            throws IOException {
        Path dir = temp.resolve(name);
        LineBatch b = new LineBatch(LINES + 1);
        for (int i = 0; i < LINES; i++) {
            if (i == skip) {
                continue;
            }
            double[] p = position.apply(i);
            fill(b, i, p[0], p[1], label.apply(i));
        }
        try (LineStoreWriter w = LineStoreWriter.create(dir, name + ".par", SourceMetadata.of(name + ".par", "",
                "hitran160", Map.of()))) {
            w.write(b);
            w.commit(new IngestCounts(b.size, b.size, 0, 0));
        }
        return LineStore.open(dir);
    }

    @Test
    void plantedChangesInADenseListAreExactlyTheReport() throws IOException {
        int shifted = 7_000;       // position +0.2 cm-1: 200 line spacings, paired by its labels
        int relabelled = 12_345;   // same position, new upper label: paired by position
        int rescaled = 20_000;     // intensity ×1.5
        int removed = 25_000;
        int added = 29_000;
        LineStore older = store("old", i -> new double[] {1000 + i * SPACING_CM1, 1e-20}, i -> "U" + i, added);
        LineStore newer = store("new",
                i -> new double[] {1000 + i * SPACING_CM1 + (i == shifted ? 0.2 : 0), i == rescaled ? 1.5e-20 : 1e-20},
                i -> i == relabelled ? "relabelled" : "U" + i, removed);
        for (CompareOptions options : new CompareOptions[] {CompareOptions.defaults(), new CompareOptions(0.25, 1e-4, 10),
            new CompareOptions(3.0, 1e-4, 10)}) {
            ComparisonReport r = new LineListComparer(options).compare(older, "old", newer, "new");
            assertEquals(LINES - 1, r.oldLines());
            assertEquals(LINES - 1, r.newLines());
            assertEquals(1, r.added());
            assertEquals(1, r.removed());
            assertEquals(3, r.changed());
            assertEquals(LINES - 2 - 3, r.unchanged());
            assertEquals(0.2, r.fields().get(LineColumn.WAVENUMBER).maxAbsoluteChange(), 1e-9);
            assertEquals(0.5, r.fields().get(LineColumn.INTENSITY).maxRelativeChange(), 1e-12);
            assertEquals(1, r.fields().get(LineColumn.UPPER_LOCAL_QUANTA).lines());
            assertEquals(3, r.fields().size());
            for (LineChange c : r.changes()) {
                if (c.kind() == LineChange.Kind.CHANGED && c.fields().get(0).column() == LineColumn.UPPER_LOCAL_QUANTA) {
                    assertEquals(LineChange.MatchedBy.NEAREST, c.matchedBy());
                    assertEquals(relabelled + 1, c.newSourceLine());
                }
                if (c.kind() == LineChange.Kind.ADDED) {
                    assertEquals(added + 1, c.newSourceLine());
                }
                if (c.kind() == LineChange.Kind.REMOVED) {
                    assertEquals(removed + 1, c.oldSourceLine());
                }
            }
            // both isotopologues of the one band: counts per band add up
            long sum = r.bands().stream().mapToLong(x -> x.added() + x.removed() + x.changed()).sum();
            assertEquals(5, sum);
        }
    }

    /** A shift beyond the window: the line is reported removed and added, not changed. */
    @Test
    void shiftBeyondTheWindowIsRemovalAndAddition() throws IOException {
        LineStore older = store("old2", i -> new double[] {1000 + i * SPACING_CM1, 1e-20}, i -> "U" + i, -1);
        LineStore newer = store("new2", i -> new double[] {1000 + i * SPACING_CM1 + (i == 100 ? 0.3 : 0), 1e-20},
                i -> "U" + i, -1);
        ComparisonReport r = new LineListComparer(new CompareOptions(0.25, 1e-4, 10)).compare(older, "o", newer, "n");
        assertEquals(1, r.added());
        assertEquals(1, r.removed());
        assertEquals(0, r.changed());
        r = new LineListComparer(new CompareOptions(0.35, 1e-4, 10)).compare(older, "o", newer, "n");
        assertEquals(1, r.changed());
        assertEquals(0, r.added() + r.removed());
    }
}
