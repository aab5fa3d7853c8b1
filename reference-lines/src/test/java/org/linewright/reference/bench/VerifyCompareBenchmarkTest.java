package org.linewright.reference.bench;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.ingest.line.EinsteinCoefficients;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.registry.Isotopologue;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.store.IngestCounts;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.store.LineStoreWriter;
import org.linewright.ingest.store.SourceMetadata;
import org.linewright.reference.compare.CompareOptions;
import org.linewright.reference.compare.ComparisonReport;
import org.linewright.reference.compare.LineListComparer;
import org.linewright.reference.data.ReferenceLines;
import org.linewright.reference.verify.LineListVerifier;
import org.linewright.reference.verify.VerificationReport;
import org.linewright.reference.verify.VerifyOptions;

/**
 * Throughput of verify and compare on two invented stores of 2,000,000 lines each (spacing 10⁻⁴ cm⁻¹, so the
 * default 0.5 cm⁻¹ window holds about 10,000 lines). Run with {@code ./mvnw -B -Pbenchmark -pl reference-lines -am verify};
 * figures go to docs/performance.md.
 */
@Tag("benchmark")
class VerifyCompareBenchmarkTest {
    private static final int LINES = 2_000_000;
    private static final int BATCH = 65_536;

    @TempDir
    Path temp;

    private LineStore store(String name, int changeEvery) throws IOException {
        Path dir = temp.resolve(name);
        Isotopologue co = MoleculeRegistry.builtIn().isotopologue(5, 1);
        LineBatch b = new LineBatch(BATCH);
        try (LineStoreWriter w = LineStoreWriter.create(dir, name + ".par",
                SourceMetadata.of(name + ".par", "", "hitran160", Map.of()))) {
            for (int i = 0; i < LINES; i++) {
                int r = b.size++;
                b.clearOptional(r);
                b.moleculeId[r] = 5;
                b.isotopologue[r] = 1;
                b.wavenumberCm1[r] = 1000 + i * 1e-4 + (changeEvery > 0 && i % changeEvery == 0 ? 1e-3 : 0);
                b.einsteinAS1[r] = 10.0;
                b.upperDegeneracy[r] = 3;
                b.lowerDegeneracy[r] = 1;
                b.lowerEnergyCm1[r] = (i % 5000) * 0.7;
                // invented lines that obey the S–A relation with the registry's Q(296 K) and abundance
                b.intensityCmPerMolecule[r] = EinsteinCoefficients.intensityFromEinsteinA(10.0, b.wavenumberCm1[r], 3,
                        b.lowerEnergyCm1[r], 296, co.q296(), co.abundance());
                b.airWidthCm1PerAtm[r] = 0.07;
                b.selfWidthCm1PerAtm[r] = 0.08;
                b.airWidthExponent[r] = 0.7;
                b.airShiftCm1PerAtm[r] = -0.003;
                b.sourceLine[r] = i + 1;
                b.upperGlobalQuanta.append("1");
                b.lowerGlobalQuanta.append("0");
                b.upperLocalQuanta.append("U" + i);
                b.lowerLocalQuanta.append("L" + i);
                b.uncertaintyCodes.append("000000");
                b.referenceCodes.append("000000000000");
                b.lineMixingFlag.append(" ");
                if (b.isFull()) {
                    w.write(b);
                    b.clear();
                }
            }
            w.write(b);
            w.commit(new IngestCounts(LINES, LINES, 0, 0));
        }
        return LineStore.open(dir);
    }

    @Test
    void verifyAndCompareThroughput() throws IOException {
        LineStore older = store("old", 0);
        LineStore newer = store("new", 1000);
        Runtime rt = Runtime.getRuntime();
        for (int round = 0; round < 3; round++) {
            long t0 = System.nanoTime();
            VerificationReport v = new LineListVerifier(MoleculeRegistry.builtIn(), List.of(), VerifyOptions.defaults())
                    .verify(older, "old");
            long t1 = System.nanoTime();
            ComparisonReport c = new LineListComparer(CompareOptions.defaults()).compare(older, "old", newer, "new");
            long t2 = System.nanoTime();
            assertTrue(v.passed(), v.findingCounts().toString());
            assertEquals(LINES / 1000, c.changed());
            System.out.printf(Locale.ROOT, "round %d: verify %d lines in %.2f s (%.2f M lines/s); compare 2 x %d lines "
                            + "in %.2f s (%.2f M line pairs/s); heap used %d MB%n", round, LINES, (t1 - t0) * 1e-9,
                    LINES / ((t1 - t0) * 1e-9) / 1e6, LINES, (t2 - t1) * 1e-9, LINES / ((t2 - t1) * 1e-9) / 1e6,
                    (rt.totalMemory() - rt.freeMemory()) >> 20);
        }
        assertTrue(ReferenceLines.builtIn().size() > 0);
    }
}
