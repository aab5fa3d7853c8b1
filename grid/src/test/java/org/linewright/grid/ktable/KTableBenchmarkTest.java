package org.linewright.grid.ktable;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.Locale;
import java.util.Map;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.grid.plan.TablePlan;
import org.linewright.grid.table.TableContent;
import org.linewright.grid.table.TableWriter;

/**
 * k-table of a 10 × 10-cell σ table of 10⁶ points per cell (1000–3000 cm⁻¹, SYNTHETIC σ: an invented smooth-plus-
 * oscillating field, not a spectrum) at R = 1000 with 16 g points; target under 10 s. Run with
 * {@code ./mvnw -B -Pbenchmark -pl grid -am verify -Dtest=KTableBenchmarkTest -Dsurefire.failIfNoSpecifiedTests=false}.
 * Figures in docs/performance.md.
 */
@Tag("benchmark")
class KTableBenchmarkTest {
    static final int POINTS = 1_000_000;
    static final int CELLS_PER_AXIS = 10;

    @TempDir
    Path dir;

    /** SYNTHETIC σ: a field of many decades that changes with ν on several scales and with the cell. */
    static double sigma(int p, int t, double nu) {
        double lines = Math.sin(nu * 7.3 + p) * Math.sin(nu * 0.91 + t) + 0.5 * Math.sin(nu * 31.7);
        return 1e-22 * Math.exp(6 * lines - 1e-3 * (nu - 1000) + 0.1 * p);
    }

    @Test
    void tenByTenCellsOfAMillionPointsAtResolvingPower1000() throws IOException {
        double[] nu = new double[POINTS];
        for (int i = 0; i < POINTS; i++) {
            nu[i] = 1000.0 + i * (2000.0 / (POINTS - 1));
        }
        double[] p = new double[CELLS_PER_AXIS];
        double[] t = new double[CELLS_PER_AXIS];
        for (int i = 0; i < CELLS_PER_AXIS; i++) {
            p[i] = Math.pow(10, -4 + i);
            t[i] = 200 + 200 * i;
        }
        Path table = dir.resolve("synthetic.h5");
        TableWriter.write(table, new TableContent(nu, p, t, (a, b) -> {
            double[] s = new double[POINTS];
            for (int i = 0; i < POINTS; i++) {
                s[i] = sigma(a, b, nu[i]);
            }
            return s;
        }, TablePlan.Precision.FLOAT32, Map.of("note", "SYNTHETIC benchmark field")));
        KTableRequest req = KTableRequest.of(KTableRequest.Binning.resolvingPower(1000));
        double[] first = null;
        StringBuilder report = new StringBuilder();
        for (int threads : new int[] {1, 2, 1, 2}) {
            long start = System.nanoTime();
            KTableBuilder.Report r = KTableBuilder.build(table, req, threads, dir.resolve("k" + threads + ".h5"));
            double seconds = (System.nanoTime() - start) / 1e9;
            report.append(String.format(Locale.ROOT, "threads %d: %.2f s (%d bins x %d g, fewest %s points per bin)%n",
                    threads, seconds, r.content().bins(), r.content().gPoints(),
                    r.content().metadata().get("sigma_points_per_bin_min")));
            if (first == null) {
                first = r.content().k();
            } else {
                assertTrue(Arrays.equals(first, r.content().k()), "same bits for " + threads + " threads");
            }
            // ln 3 / ln 1.001 = 1099.2: 1100 bins
            assertEquals(1100, r.content().bins());
        }
        System.out.println("k-table benchmark, 100 cells x 1e6 points, R = 1000, 16 g:\n" + report);
    }
}
