package org.linewright.broadening.intensity;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.partition.PartitionSumNotes;
import org.linewright.ingest.partition.PartitionSums;
import org.linewright.ingest.partition.PartitionTable;
import org.linewright.ingest.partition.StoredPartitionFunctions;
import org.linewright.ingest.pipeline.IngestListener;
import org.linewright.ingest.pipeline.IngestOptions;
import org.linewright.ingest.pipeline.IngestPipeline;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.source.IsotopologueLookup;
import org.linewright.ingest.store.LineCursor;
import org.linewright.ingest.store.LineQuery;
import org.linewright.ingest.store.LineStore;

/**
 * S(T) of lines from an ExoMol-style set uses the set's own {@code .pf} at every temperature, through the line
 * store. The set is synthetic (invented energies, A coefficients and partition function) in the layout of the
 * ExoMol format (J. Tennyson et al., J. Mol. Spectrosc. 327 (2016) 73: states "id E g J labels", transitions
 * "upper lower A", partition function "T Q").
 */
class DataSetPartitionFunctionTest {
    private static final double C2 = 1.438776877; // cm K, CODATA 2018
    private static final double C_CM_S = 2.99792458e10; // exact
    private static final double ABUNDANCE_12C16O = 0.986544; // samples README (HITRAN metadata)

    @TempDir
    Path dir;

    /** Synthetic Q(T) of the .pf file: 0.4·T + 1e-5·T² (8 % above a real CO Q at 1000 K, 11 % at 296 K). */
    private static double syntheticQ(double t) {
        return 0.4 * t + 1e-5 * t * t;
    }

    @Test
    void intensityAt1000KUsesTheSetsOwnPartitionFunction() throws IOException {
        double[] energy = {0.0, 3.845033, 11.534953, 23.069466, 38.448187};
        double[] a = {7.2e-8, 6.9e-7, 2.5e-6, 6.1e-6};
        StringBuilder states = new StringBuilder();
        for (int j = 0; j < energy.length; j++) {
            states.append(String.format(Locale.ROOT, "%12d %12.6f %6d %7d + e X1Sigma+ 0%n", j + 1, energy[j], 2 * j + 1, j));
        }
        StringBuilder trans = new StringBuilder();
        for (int j = 0; j < a.length; j++) {
            trans.append(String.format(Locale.ROOT, "%12d %12d %10.4e%n", j + 2, j + 1, a[j]));
        }
        StringBuilder pf = new StringBuilder();
        double[] temperatures = {100, 200, 296, 400, 500, 600, 700, 800, 900, 1000, 1200, 1500, 2000};
        for (double t : temperatures) {
            pf.append(String.format(Locale.ROOT, "%8.1f %14.6f%n", t, syntheticQ(t)));
        }
        Files.writeString(dir.resolve("12C-16O__SynthPf.states"), states);
        Files.writeString(dir.resolve("12C-16O__SynthPf.trans"), trans);
        Files.writeString(dir.resolve("12C-16O__SynthPf.pf"), pf);
        MoleculeRegistry registry = MoleculeRegistry.builtIn();
        Path storeDir = dir.resolve("store");
        IngestPipeline.run(List.of(dir.resolve("12C-16O__SynthPf.states")), storeDir, IngestOptions.strict(registry),
                IngestListener.NONE);
        LineStore store = LineStore.open(storeDir);

        IsotopologueLookup withData = StoredPartitionFunctions.withStoredTables(PartitionSums.of(registry).attachedRegistry(),
                List.of(store));
        double t = 1000.0;
        double q1000 = syntheticQ(t); // the file's Q(1000 K), a tabulated point
        assertEquals(q1000, withData.partitionSum(5, 1, t), q1000 * 1e-6);
        PartitionSums.Value v = ((PartitionSums) ((MoleculeRegistry) withData).partitionSums()).value(5, 1, t);
        assertEquals(PartitionSums.Origin.DATA_SET, v.origin());
        assertTrue(v.source().contains("12C-16O__SynthPf.pf"), v.source());

        LineBatch batch = new LineBatch(16);
        double[] withSetQ = new double[16];
        double[] withRegistry = new double[16];
        try (LineCursor c = store.cursor(LineQuery.all())) {
            assertTrue(c.read(batch));
        }
        LineIntensity.atTemperature(batch, t, withData, withSetQ);
        LineIntensity.atTemperature(batch, t, PartitionSums.of(registry).attachedRegistry(), withRegistry);
        assertEquals(a.length, batch.size);
        for (int i = 0; i < batch.size; i++) {
            int j = (int) batch.lowerJ[i];
            double nu = energy[j + 1] - energy[j];
            // S(T) = Iₐ·A·g′/(8πcν²)·e^(−c2E″/T)·(1−e^(−c2ν/T))/Q(T) (Šimečková et al. 2006, JQSRT 98, 130, eq. 20)
            double expected = ABUNDANCE_12C16O * a[j] * (2 * j + 3) / (8 * Math.PI * C_CM_S * nu * nu)
                    * Math.exp(-C2 * energy[j] / t) * -Math.expm1(-C2 * nu / t) / q1000;
            assertEquals(expected, withSetQ[i], expected * 1e-9, "line " + i);
            // Without the stored .pf the registry's Q(296 K) and the built-in Q(T) would be used: 3 % off here.
            assertTrue(Math.abs(withRegistry[i] / expected - 1) > 0.02, "line " + i + ": " + withRegistry[i] / expected);
        }
        // What a command reports: the set's .pf named as the source, nothing to warn about inside its range;
        // beyond it (3000 K) the extension by the built-in model is stated.
        PartitionSumNotes notes = PartitionSumNotes.of(registry, List.of(store), t);
        assertEquals(1, notes.sources().size());
        assertTrue(notes.sources().get(0).contains("12C-16O__SynthPf.pf"), notes.sources().toString());
        assertTrue(notes.warnings().isEmpty(), notes.warnings().toString());
        List<String> hot = PartitionSumNotes.of(registry, List.of(store), 3000).warnings();
        assertTrue(hot.size() == 1 && hot.get(0).contains("extended from 2000.0 K"), hot.toString());
        // A user table wins over the set's .pf (documented precedence).
        PartitionSums user = PartitionSums.of(registry).withTable(5, 1,
                PartitionTable.of("user.txt", new double[] {200, 2000}, new double[] {70, 800}));
        IsotopologueLookup withUser = StoredPartitionFunctions.withStoredTables(user.attachedRegistry(), List.of(store));
        assertEquals(70 + (1000 - 200) / 1800.0 * 730, withUser.partitionSum(5, 1, t), 1e-9);
        PartitionTable stored = StoredPartitionFunctions.tables(store).get(0).table();
        assertEquals(temperatures.length, stored.size());
    }
}
