package org.linewright.grid.table;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.util.Arrays;
import java.util.Locale;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.grid.plan.PlanReader;
import org.linewright.ingest.partition.PartitionSums;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.testsupport.ReferenceSamples;

/**
 * A plan's {@code partition_sums.catalog_partition}: the catalog's partition functions give Q(T) of its
 * isotopologues in every cell, as {@code sigma --catalog-partition} does. Lines: the HITRAN2020 CO sample (Gordon
 * et al. 2022, JQSRT 277, 107949), 12C16O only. S(T) of a line given by S(296 K) is S(296)·Q(296)/Q(T)·(Boltzmann
 * and stimulated-emission factors) (Rothman et al. 1998, JQSRT 60, 665, eq. A11), so a catalog whose Q(T) differs
 * from the built-in one scales σ of a cell by [Q_b(T)/Q_b(296)]/[Q_c(T)/Q_c(296)] at every point.
 */
class CatalogPartitionBuildTest {
    @TempDir
    Path dir;

    /** Invented catalog partition function of CO (tag 28001, as catalogs number CO): Q = 0.30·T^1.2. */
    private static double catalogQ(double t) {
        return 0.30 * Math.pow(t, 1.2);
    }

    private Path plan(String folder, String partitionSums) throws IOException {
        Path d = Files.createDirectories(dir.resolve(folder));
        Files.copy(ReferenceSamples.hitranSample("sample_CO.par"), d.resolve("sample_CO.par"),
                StandardCopyOption.REPLACE_EXISTING);
        StringBuilder q = new StringBuilder("28001");
        for (double t : new double[] {300, 225, 150, 75, 37.5, 18.75, 9.375}) {
            q.append(String.format(Locale.ROOT, " %.10f", Math.log10(catalogQ(t))));
        }
        Files.writeString(d.resolve("catalog.part"), "# tag log10 Q at 300 225 150 75 37.5 18.75 9.375 K\n" + q
                + "\n");
        Path plan = d.resolve("plan.toml");
        Files.writeString(plan, String.format(Locale.ROOT, """
                [lines]
                sources = ["sample_CO.par"]
                [grid]
                wavenumber = { from = 2000.0, to = 2250.0, step = 0.05 }
                pressures_bar = [1.0]
                temperatures_K = [150.0, 296.0]
                [background]
                air = 1.0
                [species]
                isotopologues = ["5/1"]
                [partition_sums]
                %s
                [output]
                table = "out/t.arrow"
                """, partitionSums));
        return plan;
    }

    private static BuildReport build(Path plan) throws IOException {
        return TableBuilder.build(PlanReader.read(plan), CalculatorBlocks.factory(), 1, false, BuildListener.NONE);
    }

    @Test
    void theCatalogsPartitionFunctionScalesEveryPointAndItsChangeRecomputesTheCells() throws IOException {
        CrossSectionTable builtIn = CrossSectionTable.open(build(plan("built-in", "")).table());
        Path withCatalog = plan("catalog", "catalog_partition = \"catalog.part\"");
        BuildReport first = build(withCatalog);
        CrossSectionTable catalog = CrossSectionTable.open(first.table());
        PartitionSums model = PartitionSums.of(MoleculeRegistry.builtIn());
        double qb150 = model.value(5, 1, 150.0).q();
        double qb296 = model.value(5, 1, 296.0).q();
        double factor = (qb150 / qb296) / (catalogQ(150) / catalogQ(296));
        assertTrue(Math.abs(factor - 1) > 0.05, "the invented catalog differs from the model: " + factor);
        double[] b = builtIn.sigma(0, 0);
        double[] c = catalog.sigma(0, 0);
        double max = Arrays.stream(b).max().orElseThrow();
        for (int i = 0; i < b.length; i++) {
            // log-log interpolation of a power law is exact (common practice), so only round-off remains
            assertEquals(factor * b[i], c[i], 1e-9 * factor * max, "150 K, point " + i);
        }
        double[] b296 = builtIn.sigma(0, 1);
        double[] c296 = catalog.sigma(0, 1);
        for (int i = 0; i < b296.length; i++) {
            assertEquals(b296[i], c296[i], 1e-12 * max, "296 K, point " + i);
        }
        String source = catalog.metadata().get("partition_sum.5/1");
        assertTrue(source != null && source.contains("catalog.part"), String.valueOf(source));
        assertTrue(catalog.metadata().containsKey("catalog_partition.sha256"), catalog.metadata().keySet().toString());

        // the same plan again reuses every cell; a changed catalog file recomputes them
        assertEquals(0, build(withCatalog).computed());
        Files.writeString(withCatalog.resolveSibling("catalog.part"), "28001 2.1 1.9 1.7 1.4 1.1 0.8 0.5\n");
        assertEquals(first.cells(), build(withCatalog).computed());
    }
}
