package org.linewright.ingest.partition;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.source.LineFormatException;

class CatalogPartitionFileTest {
    @TempDir
    Path tmp;

    @Test
    void logLogInterpolationIsExactForAPowerLaw() {
        // ln Q linear in ln T reproduces Q = a·T^n exactly (common practice; n = 1.5 is a non-linear rotor).
        double[] t = {9.375, 18.75, 37.5, 75, 150, 225, 300};
        double[] q = new double[t.length];
        for (int i = 0; i < t.length; i++) {
            q[i] = 0.7 * Math.pow(t[i], 1.5);
        }
        PartitionTable table = PartitionTable.logLog("power", t, q);
        for (double x : new double[] {10, 50, 100, 296, 299.9}) {
            assertEquals(0.7 * Math.pow(x, 1.5), table.value(x), 1e-12 * Math.pow(x, 1.5), "T = " + x);
        }
    }

    @Test
    void carbonMonoxideCatalogValuesGiveTheTabulatedQ296() throws IOException {
        // log10 Q of CO (tag 28001) at the catalog temperatures 300 ... 9.375 K, as the JPL catalog lists them
        // (Pickett et al. 1998; from memory). Interpolated to 296 K they reproduce the registry's Q(296 K) =
        // 107.42 (TIPS-2021, confirmed by the HITRAN2020 samples): CO has no spin or hyperfine convention issue.
        Path f = tmp.resolve("catalog-q.txt");
        Files.writeString(f, "# tag  log10 Q at 300 225 150 75 37.5 18.75 9.375 K\n"
                + "28001  2.0369 1.9123 1.7361 1.4362 1.1389 0.8464 0.5625\n"
                + "99999  1.0 0.9\n");
        Map<Integer, PartitionTable> tables = CatalogPartitionFile.read(f);
        assertEquals(2, tables.size());
        assertTrue(tables.get(28001).interpolatesLogLog());
        PartitionSums sums = PartitionSums.of(MoleculeRegistry.builtIn()).withCatalogFile(f);
        PartitionSums.Value at296 = sums.value(5, 1, 296.0);
        assertEquals(PartitionSums.Origin.CATALOG, at296.origin());
        assertEquals(107.42, at296.q(), 107.42 * 1e-3);
        assertTrue(at296.source().contains("catalog-q.txt"), at296.source());
        // Beyond the catalog's 300 K: the catalog's Q(300 K) times the built-in ratio, with a warning.
        PartitionSums.Value hot = sums.value(5, 1, 1000.0);
        assertEquals(PartitionSums.Origin.CATALOG, hot.origin());
        assertFalse(hot.withinStatedAccuracy());
        assertTrue(hot.warnings().get(0).contains("12C-16O") && hot.warnings().get(0).contains("1000"), hot.warnings().toString());
        // The numpy level sum gives Q(1000 K) = 380.2997 for 12C16O (co-level-sum-reference.tsv, tools/partition);
        // the catalog's Q(300 K) agrees with it to its 4-decimal log10 rounding, so the extension must too.
        assertEquals(380.2997, hot.q(), 380.2997 * 1e-3);
        // A user table still wins.
        PartitionSums user = sums.withTable(5, 1, PartitionTable.of("u", new double[] {200, 400}, new double[] {70, 140}));
        assertEquals(PartitionSums.Origin.TABLE, user.value(5, 1, 296.0).origin());
    }

    @Test
    void otherTemperaturesAndMalformedLines() throws IOException {
        Path f = tmp.resolve("q1000.txt");
        Files.writeString(f, "temperatures_K 1000 500 300\n28001 2.6 2.25 2.0369\n");
        PartitionTable t = CatalogPartitionFile.read(f).get(28001);
        assertEquals(300.0, t.minTemperatureK());
        assertEquals(1000.0, t.maxTemperatureK());
        assertEquals(Math.pow(10, 2.25), t.value(500), 1e-9);

        Path bad = tmp.resolve("bad.txt");
        Files.writeString(bad, "28001 2.0 x\n");
        LineFormatException e = assertThrows(LineFormatException.class, () -> CatalogPartitionFile.read(bad));
        assertEquals("x", e.offendingText());
        Path tooMany = tmp.resolve("many.txt");
        Files.writeString(tooMany, "28001 1 1 1 1 1 1 1 1\n");
        assertThrows(LineFormatException.class, () -> CatalogPartitionFile.read(tooMany));
        Path empty = tmp.resolve("empty.txt");
        Files.writeString(empty, "# nothing\n");
        assertThrows(LineFormatException.class, () -> CatalogPartitionFile.read(empty));
    }
}
