package org.linewright.grid.table;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.linewright.grid.plan.TablePlan;
import org.linewright.ingest.InputException;

class TableRoundTripTest {
    private static final double[] NU = {2000.0, 2000.5, 2001.0, 2001.5, 2002.0};
    private static final double[] P = {1e-3, 1e-1, 10.0};
    private static final double[] T = {300.0, 700.0};

    @TempDir
    Path dir;

    /** A σ field with values across many decades (and subnormal-free), different in every cell. */
    private static double sigma(int p, int t, int k) {
        return Math.scalb(1.0 + 0.123456789 * k + 0.01 * t, -60 - 3 * p - k) * (1 + 1e-13 * (p + t));
    }

    private static TableContent content(TablePlan.Precision precision) {
        return new TableContent(NU, P, T, (p, t) -> {
            double[] s = new double[NU.length];
            for (int k = 0; k < s.length; k++) {
                s[k] = sigma(p, t, k);
            }
            return s;
        }, precision, Map.of("engine", "exact", "input.lines.par.sha256", "ab12"));
    }

    @ParameterizedTest(name = "{0} {1}")
    @CsvSource({"t.arrow,FLOAT64", "t.arrow,FLOAT32", "t.h5,FLOAT64", "t.h5,FLOAT32"})
    void roundTripKeepsAxesValuesAndMetadata(String name, TablePlan.Precision precision) throws Exception {
        Path file = dir.resolve(name);
        TableWriter.Written w = TableWriter.write(file, content(precision));
        CrossSectionTable table = CrossSectionTable.open(file);
        assertArrayEquals(NU, table.wavenumberCm1());
        assertArrayEquals(P, table.pressureBar());
        assertArrayEquals(T, table.temperatureK());
        assertEquals(precision, table.precision());
        for (int p = 0; p < P.length; p++) {
            for (int t = 0; t < T.length; t++) {
                double[] s = table.sigma(p, t);
                for (int k = 0; k < NU.length; k++) {
                    double expected = precision == TablePlan.Precision.FLOAT32 ? (float) sigma(p, t, k) : sigma(p, t, k);
                    assertEquals(expected, s[k], 0.0, "p" + p + " t" + t + " k" + k);
                }
            }
        }
        assertEquals("exact", table.metadata().get("engine"));
        assertEquals("ab12", table.metadata().get("input.lines.par.sha256"));
        assertEquals(precision.id(), table.metadata().get("sigma_precision"));
        assertEquals(table.metadata().get(TableWriter.KEY_SIGMA_SHA256), table.sigmaSha256());
        assertEquals(w.sigmaSha256(), table.sigmaSha256());
        // Sidecar in the form sha256sum writes (common practice): "<hex>  <name>\n", hex of the file's bytes,
        // checked here with the JDK's SHA-256.
        String hex = HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(file)));
        assertEquals(hex + "  " + name + "\n", Files.readString(TableWriter.sidecar(file)));
        try (var files = Files.list(dir)) {
            assertFalse(files.anyMatch(f -> f.getFileName().toString().contains(".partial-")), "no temporary left");
        }
    }

    @Test
    void interpolationIsExactForFunctionsBilinearInLogPressureAndTemperature() throws IOException {
        // sigma = a + b ln p + c T + d T ln p: bilinear in (ln p, T), reproduced exactly up to rounding
        double a = 3e-20;
        double b = 2e-21;
        double c = 5e-23;
        double d = -1e-24;
        TableContent field = new TableContent(NU, P, T, (p, t) -> {
            double[] s = new double[NU.length];
            for (int k = 0; k < s.length; k++) {
                double lp = Math.log(P[p]);
                s[k] = (k + 1) * (a + b * lp + c * T[t] + d * T[t] * lp);
            }
            return s;
        }, TablePlan.Precision.FLOAT64, Map.of());
        Path file = dir.resolve("lin.arrow");
        TableWriter.write(file, field);
        CrossSectionTable table = CrossSectionTable.open(file);
        double[][] queries = {{1e-3, 300.0}, {0.037, 412.5}, {3.3, 699.0}, {10.0, 700.0}, {0.1, 500.0}};
        for (double[] q : queries) {
            double[] s = table.sigmaAt(q[0], q[1]);
            double lp = Math.log(q[0]);
            for (int k = 0; k < NU.length; k++) {
                double expected = (k + 1) * (a + b * lp + c * q[1] + d * q[1] * lp);
                assertEquals(expected, s[k], 1e-12 * Math.abs(expected), "p=" + q[0] + " T=" + q[1]);
            }
        }
        InputException low = assertThrows(InputException.class, () -> table.sigmaAt(1e-4, 400.0));
        assertTrue(low.getMessage().contains("pressure 1.0E-4 bar is outside"), low.getMessage());
        InputException hot = assertThrows(InputException.class, () -> table.sigmaAt(1.0, 800.0));
        assertTrue(hot.getMessage().contains("temperature 800.0 K is outside"), hot.getMessage());
    }

    @Test
    void hdf5RowsLongerThanOneChunkReadBackAndAreCompressed() throws IOException {
        // 2.5 chunks of TableWriter.HDF5_CHUNK_POINTS per (p, T): full chunks and a shorter edge chunk per row;
        // a smooth σ (Lorentzian-like), which shuffle + deflate must store in fewer bytes than raw float64
        int n = 2 * TableWriter.HDF5_CHUNK_POINTS + TableWriter.HDF5_CHUNK_POINTS / 2;
        double[] nu = new double[n];
        for (int k = 0; k < n; k++) {
            nu[k] = 1000.0 + 0.01 * k;
        }
        double[] p = {0.1, 1.0};
        double[] t = {300.0};
        SigmaSource sigma = (i, j) -> {
            double[] s = new double[n];
            for (int k = 0; k < n; k++) {
                double x = (nu[k] - 1200.0) / (0.1 + i);
                s[k] = 1e-20 / (1 + x * x);
            }
            return s;
        };
        Path file = dir.resolve("long.h5");
        TableWriter.write(file, new TableContent(nu, p, t, sigma, TablePlan.Precision.FLOAT64, Map.of()));
        CrossSectionTable table = CrossSectionTable.open(file);
        assertArrayEquals(nu, table.wavenumberCm1());
        for (int i = 0; i < p.length; i++) {
            assertArrayEquals(sigma.sigma(i, 0), table.sigma(i, 0), "p index " + i);
        }
        // the file also holds the (uncompressed) axes: compare with σ and ν as raw float64
        long raw = (long) n * (p.length + 1) * Double.BYTES;
        assertTrue(Files.size(file) < raw, Files.size(file) + " bytes for " + raw + " bytes of σ and ν");
    }

    @Test
    void openingSomethingElseIsAClearError() throws IOException {
        Path junk = dir.resolve("junk.arrow");
        Files.writeString(junk, "not arrow");
        assertThrows(Exception.class, () -> CrossSectionTable.open(junk));
        InputException missing = assertThrows(InputException.class, () -> CrossSectionTable.open(dir.resolve("none.h5")));
        assertTrue(missing.getMessage().contains("none.h5"));
        assertThrows(InputException.class, () -> CrossSectionTable.open(dir.resolve("x.csv")));
    }
}
