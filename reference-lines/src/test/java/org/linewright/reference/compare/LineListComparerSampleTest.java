package org.linewright.reference.compare;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.testsupport.ReferenceSamples;
import org.linewright.reference.input.LineListInput;
import org.linewright.reference.testsupport.ParFiles;

/**
 * Comparison of modified copies (in a temporary folder) of the real HITRAN2020 samples: the changes planted are
 * exactly the changes reported.
 */
class LineListComparerSampleTest {
    @TempDir
    Path temp;

    private static ComparisonReport compare(Path oldFile, Path newFile, CompareOptions options) throws IOException {
        MoleculeRegistry registry = MoleculeRegistry.builtIn();
        try (LineListInput o = LineListInput.open(oldFile, registry); LineListInput n = LineListInput.open(newFile, registry)) {
            return new LineListComparer(options).compare(o.store(), "old", n.store(), "new");
        }
    }

    /** A sample compared with itself: nothing changed. */
    @ParameterizedTest
    @ValueSource(strings = {"sample_CO.par", "sample_PH3.par"})
    void identicalListsShowNoChange(String name) throws IOException {
        Path sample = ReferenceSamples.hitranSample(name);
        ComparisonReport r = compare(sample, sample, CompareOptions.defaults());
        assertTrue(r.identical(), () -> r.changes().subList(0, Math.min(5, r.changes().size())).toString());
        assertEquals(ParFiles.records(sample).size(), r.unchanged());
        assertEquals(r.oldLines(), r.newLines());
    }

    /**
     * NEW = the sample with one line shifted by +0.01 cm-1 and another removed; OLD = the sample without a third
     * line (so it appears added in NEW). Exactly those three changes are reported, small and large windows alike
     * (the small window forces chunks to be released during the merge).
     */
    @ParameterizedTest
    @ValueSource(strings = {"sample_CO.par", "sample_CO2.par", "sample_N2O.par", "sample_PH3.par"})
    void shiftedRemovedAndAddedLinesAreExactlyTheChanges(String name) throws IOException {
        List<String> records = ParFiles.records(ReferenceSamples.hitranSample(name));
        int shiftedIndex = records.size() / 3;
        int removedIndex = records.size() / 2;
        int addedIndex = 2 * records.size() / 3;
        String shifted = records.get(shiftedIndex);
        String removedLine = records.get(removedIndex);
        String addedLine = records.get(addedIndex);

        List<String> newer = new ArrayList<>(records);
        newer.set(shiftedIndex, ParFiles.withWavenumber(shifted, ParFiles.wavenumber(shifted) + 0.01));
        newer.remove(removedIndex);
        List<String> older = new ArrayList<>(records);
        older.remove(addedIndex);
        Path oldFile = ParFiles.write(temp.resolve("old-" + name), older);
        Path newFile = ParFiles.write(temp.resolve("new-" + name), newer);

        for (CompareOptions options : List.of(CompareOptions.defaults(), new CompareOptions(0.02, 1e-4, 100))) {
            ComparisonReport r = compare(oldFile, newFile, options);
            assertEquals(1, r.changed(), () -> r.changes().toString());
            assertEquals(1, r.added(), () -> r.changes().toString());
            assertEquals(1, r.removed(), () -> r.changes().toString());
            assertEquals(records.size() - 3, r.unchanged());
            assertEquals(records.size() - 1, r.oldLines());
            assertEquals(records.size() - 1, r.newLines());
            assertEquals(3, r.changes().size());
            for (LineChange c : r.changes()) {
                switch (c.kind()) {
                    case CHANGED -> {
                        assertEquals(LineChange.MatchedBy.QUANTA, c.matchedBy());
                        assertEquals(1, c.fields().size(), c.fields().toString());
                        FieldChange f = c.fields().get(0);
                        assertEquals(LineColumn.WAVENUMBER, f.column());
                        assertEquals(0.01, f.absoluteChange(), 1e-9);
                        assertEquals(ParFiles.wavenumber(shifted), c.oldWavenumberCm1(), 0.0);
                    }
                    case ADDED -> assertEquals(ParFiles.wavenumber(addedLine), c.newWavenumberCm1(), 0.0);
                    case REMOVED -> assertEquals(ParFiles.wavenumber(removedLine), c.oldWavenumberCm1(), 0.0);
                    default -> throw new AssertionError(c);
                }
            }
            assertEquals(1, r.fields().size());
            assertEquals(0.01, r.fields().get(LineColumn.WAVENUMBER).maxAbsoluteChange(), 1e-9);
            long bandTotal = r.bands().stream().mapToLong(b -> b.added() + b.removed() + b.changed()).sum();
            assertEquals(3, bandTotal);
        }
    }
}
