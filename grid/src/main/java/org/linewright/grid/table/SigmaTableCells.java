package org.linewright.grid.table;

import io.jhdf.HdfFile;
import io.jhdf.api.Attribute;
import io.jhdf.api.Dataset;
import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.apache.arrow.memory.BufferAllocator;
import org.apache.arrow.memory.RootAllocator;
import org.apache.arrow.vector.FieldVector;
import org.apache.arrow.vector.Float4Vector;
import org.apache.arrow.vector.Float8Vector;
import org.apache.arrow.vector.VectorSchemaRoot;
import org.apache.arrow.vector.ipc.ArrowFileReader;
import org.linewright.grid.plan.TablePlan;
import org.linewright.ingest.InputException;

/**
 * Reads a σ table (either format of {@link TableWriter}) one (p, T) cell at a time, so memory holds one σ row and
 * not the table: Arrow record batches in file order, HDF5 hyperslabs [p][T][:] of the σ dataset. The one reader of
 * table files: {@link CrossSectionTable} keeps the rows it hands over.
 */
public final class SigmaTableCells {
    /** Receives the cells in the order p-major, T-minor, each σ row for as long as the call lasts. */
    @FunctionalInterface
    public interface CellVisitor {
        void cell(int pressureIndex, int temperatureIndex, double[] sigmaCm2PerMolecule) throws IOException;
    }

    /**
     * The axes and metadata of a table.
     *
     * @param wavenumberCm1 the wavenumber axis
     * @param pressureBar   the pressure axis, in the order of the cells
     * @param temperatureK  the temperature axis, in the order of the cells
     * @param metadata      provenance metadata (keys without prefix)
     * @param precision     σ's element type in the file
     */
    public record Header(double[] wavenumberCm1, double[] pressureBar, double[] temperatureK,
                         Map<String, String> metadata, TablePlan.Precision precision) {
    }

    private SigmaTableCells() {
    }

    /**
     * Reads the header, then hands every cell to {@code visitor}.
     *
     * @param headerSeen called once with the header before the first cell
     * @throws InputException when the file is missing or not a linewright σ table
     */
    public static void read(Path file, java.util.function.Consumer<Header> headerSeen, CellVisitor visitor)
            throws IOException {
        if (!Files.isRegularFile(file)) {
            throw new InputException(file + ": no such table file");
        }
        if (TableFormat.of(file) == TableFormat.ARROW) {
            readArrow(file, headerSeen, visitor);
        } else {
            readHdf5(file, headerSeen, visitor);
        }
    }

    private static void readArrow(Path file, java.util.function.Consumer<Header> headerSeen, CellVisitor visitor)
            throws IOException {
        try (BufferAllocator allocator = new RootAllocator();
             FileChannel ch = FileChannel.open(file);
             ArrowFileReader reader = new ArrowFileReader(ch, allocator)) {
            VectorSchemaRoot root = reader.getVectorSchemaRoot();
            Map<String, String> metadata = new LinkedHashMap<>();
            Map<String, String> custom = root.getSchema().getCustomMetadata();
            if (custom != null) {
                custom.forEach((k, v) -> {
                    if (k.startsWith(TableWriter.ARROW_KEY_PREFIX)) {
                        metadata.put(k.substring(TableWriter.ARROW_KEY_PREFIX.length()), v);
                    }
                });
            }
            Float8Vector pv = column(file, root, TableFormat.PRESSURE, Float8Vector.class);
            Float8Vector tv = column(file, root, TableFormat.TEMPERATURE, Float8Vector.class);
            Float8Vector wv = column(file, root, TableFormat.WAVENUMBER, Float8Vector.class);
            FieldVector sv = column(file, root, TableFormat.SIGMA, FieldVector.class);
            // first pass over the batches: the (p, T) of each (the batches are small to skip through)
            int batches = reader.getRecordBlocks().size();
            List<Double> pressures = new ArrayList<>();
            List<Double> temperatures = new ArrayList<>();
            double[] nu = null;
            for (int b = 0; b < batches; b++) {
                reader.loadRecordBatch(reader.getRecordBlocks().get(b));
                int n = root.getRowCount();
                if (n == 0) {
                    throw new InputException(file + ": record batch " + (b + 1) + " is empty");
                }
                if (nu == null) {
                    nu = new double[n];
                    for (int i = 0; i < n; i++) {
                        nu[i] = wv.get(i);
                    }
                } else if (n != nu.length) {
                    throw new InputException(file + ": record batch " + (b + 1) + " has " + n
                            + " rows (expected " + nu.length + ", one per wavenumber)");
                }
                if (!pressures.contains(pv.get(0))) {
                    pressures.add(pv.get(0));
                }
                if (!temperatures.contains(tv.get(0))) {
                    temperatures.add(tv.get(0));
                }
            }
            if (nu == null) {
                throw new InputException(file + ": the table holds no record batch");
            }
            int np = pressures.size();
            int nt = temperatures.size();
            if (batches != np * nt) {
                throw new InputException(file + ": " + batches + " record batches for " + np + " pressures and "
                        + nt + " temperatures (expected one batch per (p, T))");
            }
            headerSeen.accept(new Header(nu, toArray(pressures), toArray(temperatures), metadata,
                    sv instanceof Float4Vector ? TablePlan.Precision.FLOAT32 : TablePlan.Precision.FLOAT64));
            double[] row = new double[nu.length];
            for (int b = 0; b < batches; b++) {
                reader.loadRecordBatch(reader.getRecordBlocks().get(b));
                if (sv instanceof Float4Vector f4) {
                    for (int i = 0; i < row.length; i++) {
                        row[i] = f4.get(i);
                    }
                } else if (sv instanceof Float8Vector f8) {
                    for (int i = 0; i < row.length; i++) {
                        row[i] = f8.get(i);
                    }
                } else {
                    throw new InputException(file + ": column " + TableFormat.SIGMA + " is not float32 or float64");
                }
                visitor.cell(b / nt, b % nt, row);
            }
        }
    }

    private static <V> V column(Path file, VectorSchemaRoot root, String name, Class<V> type) {
        FieldVector v = root.getVector(name);
        if (v == null || !type.isInstance(v)) {
            throw new InputException(file + ": no column " + name + " of the expected type (not a linewright table?)");
        }
        return type.cast(v);
    }

    private static double[] toArray(List<Double> list) {
        double[] a = new double[list.size()];
        for (int i = 0; i < a.length; i++) {
            a[i] = list.get(i);
        }
        return a;
    }

    private static void readHdf5(Path file, java.util.function.Consumer<Header> headerSeen, CellVisitor visitor)
            throws IOException {
        try (HdfFile h5 = new HdfFile(file)) {
            double[] nu = (double[]) dataset(file, h5, TableFormat.WAVENUMBER).getData();
            double[] p = (double[]) dataset(file, h5, TableFormat.PRESSURE).getData();
            double[] t = (double[]) dataset(file, h5, TableFormat.TEMPERATURE).getData();
            Dataset sigma = dataset(file, h5, TableFormat.SIGMA);
            int[] dims = sigma.getDimensions();
            if (dims.length != 3 || dims[0] != p.length || dims[1] != t.length || dims[2] != nu.length) {
                throw new InputException(file + ": dataset " + TableFormat.SIGMA + " does not have the shape [p][T][ν]");
            }
            Map<String, String> metadata = new LinkedHashMap<>();
            for (Map.Entry<String, Attribute> e : h5.getAttributes().entrySet()) {
                Object v = e.getValue().getData();
                metadata.put(e.getKey(), v instanceof String s ? s : String.valueOf(v));
            }
            headerSeen.accept(new Header(nu, p, t, metadata, sigma.getJavaType() == float.class
                    ? TablePlan.Precision.FLOAT32 : TablePlan.Precision.FLOAT64));
            double[] row = new double[nu.length];
            for (int i = 0; i < p.length; i++) {
                for (int j = 0; j < t.length; j++) {
                    Object slab = sigma.getData(new long[] {i, j, 0}, new int[] {1, 1, nu.length});
                    if (slab instanceof float[][][] f) {
                        for (int k = 0; k < row.length; k++) {
                            row[k] = f[0][0][k];
                        }
                    } else if (slab instanceof double[][][] d) {
                        System.arraycopy(d[0][0], 0, row, 0, row.length);
                    } else {
                        throw new InputException(file + ": dataset " + TableFormat.SIGMA + " is not a 3-D float array");
                    }
                    visitor.cell(i, j, row);
                }
            }
        }
    }

    private static Dataset dataset(Path file, HdfFile h5, String name) {
        try {
            return h5.getDatasetByPath("/" + name);
        } catch (RuntimeException e) {
            throw new InputException(file + ": no dataset /" + name + " (not a linewright table?)");
        }
    }
}
