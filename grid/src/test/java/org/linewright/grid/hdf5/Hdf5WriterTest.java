package org.linewright.grid.hdf5;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import io.jhdf.HdfFile;
import io.jhdf.api.Dataset;
import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Files written by {@link Hdf5Writer} read back with jHDF, an HDF5 reader that shares no code with it (the
 * netCDF-4 view of the files is checked with xarray, netCDF4 and h5netcdf by tools/check-table-readers.sh).
 */
class Hdf5WriterTest {
    @TempDir
    Path dir;

    private static double value(int i, int j, int k) {
        return Math.scalb(1.0 + 0.001 * k, -40 - i) + j * 1e-3;
    }

    @Test
    void threeLevelChunkIndexWithEdgeChunksReadsBackExactly() throws IOException {
        // 2 x 3 x 3100 values in chunks of 1 x 2 x 3: 2 x 2 x 1034 = 4136 chunks, more than two B-tree levels hold
        // (64 x 64 = 4096), so the index has three,
        // with shorter edge chunks along the last two dimensions
        Path file = dir.resolve("t.h5");
        int ni = 2;
        int nj = 3;
        int nk = 3100;
        double[] kAxis = new double[nk];
        for (int k = 0; k < nk; k++) {
            kAxis[k] = 100 + 0.25 * k;
        }
        try (Hdf5Writer w = Hdf5Writer.create(file)) {
            Hdf5Dimension a = w.coordinate("a", new double[] {1, 2}, Map.of("units", "bar"));
            Hdf5Dimension b = w.coordinate("b", new double[] {10, 20, 30}, Map.of("units", "K"));
            Hdf5Dimension c = w.coordinate("c", kAxis, Map.of("units", "cm-1"));
            Hdf5Variable v = w.variable("v", ElementType.FLOAT64, List.of(a, b, c), new int[] {1, 2, 3},
                    Compression.DEFAULT, Map.of("units", "cm2/molecule"));
            // chunks in reverse order: the index must not depend on the order of writing
            for (long ci = v.chunksAlong(0) - 1; ci >= 0; ci--) {
                for (long cj = v.chunksAlong(1) - 1; cj >= 0; cj--) {
                    for (long ck = v.chunksAlong(2) - 1; ck >= 0; ck--) {
                        int ej = (int) Math.min(2, nj - cj * 2);
                        int ek = (int) Math.min(3, nk - ck * 3);
                        double[] chunk = new double[ej * ek];
                        for (int j = 0; j < ej; j++) {
                            for (int k = 0; k < ek; k++) {
                                chunk[j * ek + k] = value((int) ci, (int) (cj * 2 + j), (int) (ck * 3 + k));
                            }
                        }
                        v.writeChunk(new long[] {ci, cj, ck}, chunk, 0);
                    }
                }
            }
            w.attribute("engine", "exact");
            w.attribute("long", "é".repeat(70_000)); // longer than one header message may be
        }
        try (HdfFile h5 = new HdfFile(file)) {
            assertArrayEquals(kAxis, (double[]) h5.getDatasetByPath("/c").getData());
            Dataset v = h5.getDatasetByPath("/v");
            double[][][] data = (double[][][]) v.getData();
            for (int i = 0; i < ni; i++) {
                for (int j = 0; j < nj; j++) {
                    for (int k = 0; k < nk; k++) {
                        assertEquals(value(i, j, k), data[i][j][k], 0.0, i + "," + j + "," + k);
                    }
                }
            }
            assertEquals("cm2/molecule", v.getAttribute("units").getData());
            assertEquals("K", h5.getDatasetByPath("/b").getAttribute("units").getData());
            assertEquals("DIMENSION_SCALE", h5.getDatasetByPath("/a").getAttribute("CLASS").getData());
            assertEquals("exact", h5.getAttribute("engine").getData());
            assertEquals("é".repeat(70_000), h5.getAttribute("long").getData());
        }
    }

    @Test
    void float32WriteAllAndUncompressedReadBack() throws IOException {
        Path file = dir.resolve("f.h5");
        double[] values = new double[5 * 7];
        for (int n = 0; n < values.length; n++) {
            values[n] = 1.0 / (n + 3);
        }
        try (Hdf5Writer w = Hdf5Writer.create(file)) {
            Hdf5Dimension g = w.coordinate("g", new double[] {0.1, 0.2, 0.3, 0.4, 0.5}, Map.of());
            Hdf5Dimension bin = w.dimension("bin", 7);
            w.variable("k", ElementType.FLOAT32, List.of(g, bin), new int[] {2, 3}, Compression.NONE, Map.of())
                    .writeAll(values);
            w.variable("bin_centre_cm1", ElementType.FLOAT64, List.of(bin), new int[] {7},
                    new Compression(false, 9), Map.of("units", "cm-1")).writeAll(new double[] {1, 2, 3, 4, 5, 6, 7});
        }
        try (HdfFile h5 = new HdfFile(file)) {
            float[][] k = (float[][]) h5.getDatasetByPath("/k").getData();
            for (int i = 0; i < 5; i++) {
                for (int j = 0; j < 7; j++) {
                    assertEquals((float) values[i * 7 + j], k[i][j], 0.0f);
                }
            }
            assertArrayEquals(new double[] {1, 2, 3, 4, 5, 6, 7},
                    (double[]) h5.getDatasetByPath("/bin_centre_cm1").getData());
            assertTrue(((String) h5.getDatasetByPath("/bin").getAttribute("NAME").getData())
                    .startsWith("This is a netCDF dimension but not a netCDF variable."));
        }
    }

    @Test
    void chunksWrittenTwiceOrNeverAreRefused() throws IOException {
        Hdf5Writer w = Hdf5Writer.create(dir.resolve("x.h5"));
        Hdf5Dimension d = w.coordinate("d", new double[] {1, 2, 3, 4}, Map.of());
        Hdf5Variable v = w.variable("v", ElementType.FLOAT64, List.of(d), new int[] {2}, Compression.DEFAULT, Map.of());
        v.writeChunk(new long[] {0}, new double[] {1, 2}, 0);
        assertThrows(IllegalArgumentException.class, () -> v.writeChunk(new long[] {0}, new double[] {1, 2}, 0));
        assertThrows(IllegalArgumentException.class, () -> v.writeChunk(new long[] {2}, new double[] {1, 2}, 0));
        assertThrows(IllegalArgumentException.class, () -> v.writeChunk(new long[] {1}, new double[] {1}, 0));
        IllegalStateException e = assertThrows(IllegalStateException.class, w::close);
        assertTrue(e.getMessage().contains("never written"), e.getMessage());
    }
}
