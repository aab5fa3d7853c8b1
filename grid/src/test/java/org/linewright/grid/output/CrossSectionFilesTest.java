package org.linewright.grid.output;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import io.jhdf.HdfFile;
import io.jhdf.api.Dataset;
import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.stream.Stream;
import org.apache.arrow.memory.RootAllocator;
import org.apache.arrow.vector.Float8Vector;
import org.apache.arrow.vector.VectorSchemaRoot;
import org.apache.arrow.vector.ipc.ArrowFileReader;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.InputException;

/** Files read back with the general-purpose readers: Arrow Java's IPC file reader, jHDF, and plain text parsing. */
class CrossSectionFilesTest {

    @TempDir
    Path dir;

    private final WavenumberGrid grid = WavenumberGrid.uniform(1000.0, 1001.0, 0.1);
    private final double[] sigma = {0.0, 1.0e-30, 2.5e-22, 3.3333333333333333e-21, Double.MIN_NORMAL, 4.9e-324,
        1.2345678901234567e-19, 7.0e-25, 0.1, 1.0e-40, 6.02214076e-23};
    private final Map<String, String> metadata = new LinkedHashMap<>(Map.of("engine", "exact",
            "temperature_K", "296.0", "composition", "air=1.0"));

    @Test
    void csvHasTheExactHeaderAndRoundTripsEveryValue() throws IOException {
        Path out = dir.resolve("s.csv");
        CrossSectionFiles.write(out, CrossSectionFormat.CSV, grid, sigma, metadata);
        List<String> lines = Files.readAllLines(out, StandardCharsets.US_ASCII);
        // the header the brief fixes, character for character
        assertEquals("wavenumber_cm1,cross_section_cm2_per_molecule", lines.get(0));
        assertEquals(grid.size() + 1, lines.size());
        for (int i = 0; i < sigma.length; i++) {
            String[] f = lines.get(i + 1).split(",");
            // Double.parseDouble is the JDK's reference decimal reader: exact round trip
            assertEquals(Double.doubleToLongBits(grid.pointsCm1()[i]), Double.doubleToLongBits(Double.parseDouble(f[0])));
            assertEquals(Double.doubleToLongBits(sigma[i]), Double.doubleToLongBits(Double.parseDouble(f[1])));
        }
        try (Stream<Path> files = Files.list(dir)) {
            assertEquals(1, files.count(), "no temporary file left behind");
        }
    }

    @Test
    void arrowReadsBackWithUnitsAndMetadata() throws IOException {
        Path out = dir.resolve("s.arrow");
        CrossSectionFiles.write(out, CrossSectionFormat.ARROW, grid, sigma, metadata);
        try (RootAllocator allocator = new RootAllocator();
             FileChannel ch = FileChannel.open(out, StandardOpenOption.READ);
             ArrowFileReader reader = new ArrowFileReader(ch, allocator)) {
            VectorSchemaRoot root = reader.getVectorSchemaRoot();
            assertEquals("cm-1", root.getSchema().findField("wavenumber_cm1").getMetadata().get("unit"));
            assertEquals("cm2/molecule",
                    root.getSchema().findField("cross_section_cm2_per_molecule").getMetadata().get("unit"));
            assertEquals("exact", root.getSchema().getCustomMetadata().get("engine"));
            assertEquals("air=1.0", root.getSchema().getCustomMetadata().get("composition"));
            int row = 0;
            while (reader.loadNextBatch()) {
                Float8Vector nu = (Float8Vector) root.getVector("wavenumber_cm1");
                Float8Vector xs = (Float8Vector) root.getVector("cross_section_cm2_per_molecule");
                for (int i = 0; i < root.getRowCount(); i++, row++) {
                    assertEquals(grid.pointsCm1()[row], nu.get(i));
                    assertEquals(Double.doubleToLongBits(sigma[row]), Double.doubleToLongBits(xs.get(i)));
                }
            }
            assertEquals(sigma.length, row);
        }
    }

    @Test
    void hdf5ReadsBackWithJhdf() throws IOException {
        Path out = dir.resolve("s.h5");
        CrossSectionFiles.write(out, CrossSectionFormat.HDF5, grid, sigma, metadata);
        try (HdfFile hdf = new HdfFile(out)) {
            Dataset nu = hdf.getDatasetByPath("/wavenumber_cm1");
            Dataset xs = hdf.getDatasetByPath("/cross_section_cm2_per_molecule");
            assertArrayEquals(grid.pointsCm1(), (double[]) nu.getData());
            assertArrayEquals(sigma, (double[]) xs.getData());
            assertEquals("cm-1", nu.getAttribute("units").getData());
            assertEquals("cm2/molecule", xs.getAttribute("units").getData());
            assertEquals("exact", hdf.getAttribute("engine").getData());
            assertEquals("296.0", hdf.getAttribute("temperature_K").getData());
        }
    }

    @Test
    void formatFromExtensionAndName() {
        assertEquals(CrossSectionFormat.CSV, CrossSectionFormat.fromExtension(Path.of("a/b.CSV")));
        assertEquals(CrossSectionFormat.ARROW, CrossSectionFormat.fromExtension(Path.of("x.arrow")));
        assertEquals(CrossSectionFormat.HDF5, CrossSectionFormat.fromExtension(Path.of("x.h5")));
        assertEquals(CrossSectionFormat.HDF5, CrossSectionFormat.fromExtension(Path.of("x.hdf5")));
        assertEquals(CrossSectionFormat.HDF5, CrossSectionFormat.parse("HDF5"));
        assertThrows(InputException.class, () -> CrossSectionFormat.fromExtension(Path.of("x.txt")));
        assertThrows(InputException.class, () -> CrossSectionFormat.parse("netcdf"));
    }

    @Test
    void failedWriteKeepsThePreviousFile() throws IOException {
        Path out = dir.resolve("keep.csv");
        Files.writeString(out, "previous");
        assertThrows(IllegalArgumentException.class,
                () -> CrossSectionFiles.write(out, CrossSectionFormat.CSV, grid, new double[3], metadata));
        assertEquals("previous", Files.readString(out));
        try (Stream<Path> left = Files.list(dir)) {
            assertFalse(left.anyMatch(p -> p.getFileName().toString().startsWith(".partial-")), "no temporary file left");
        }
        assertTrue(Files.exists(out));
    }
}
