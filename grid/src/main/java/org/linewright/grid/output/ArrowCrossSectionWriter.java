package org.linewright.grid.output;

import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.List;
import java.util.Map;
import org.apache.arrow.memory.BufferAllocator;
import org.apache.arrow.memory.RootAllocator;
import org.apache.arrow.vector.Float8Vector;
import org.apache.arrow.vector.VectorSchemaRoot;
import org.apache.arrow.vector.ipc.ArrowFileWriter;
import org.apache.arrow.vector.types.FloatingPointPrecision;
import org.apache.arrow.vector.types.pojo.ArrowType;
import org.apache.arrow.vector.types.pojo.Field;
import org.apache.arrow.vector.types.pojo.FieldType;
import org.apache.arrow.vector.types.pojo.Schema;

/**
 * Arrow IPC file of one cross section: float64 columns {@code wavenumber_cm1} and
 * {@code cross_section_cm2_per_molecule} with their unit in the field metadata (key {@code unit}), the
 * computation's parameters in the schema metadata; written in record batches of {@value #BATCH_ROWS} rows.
 */
final class ArrowCrossSectionWriter {
    /** Rows per record batch. */
    static final int BATCH_ROWS = 1 << 20;

    private ArrowCrossSectionWriter() {
    }

    static void write(Path file, double[] wavenumberCm1, double[] sigma, Map<String, String> metadata)
            throws IOException {
        ArrowType f64 = new ArrowType.FloatingPoint(FloatingPointPrecision.DOUBLE);
        Field nu = new Field(CrossSectionFiles.WAVENUMBER_NAME, new FieldType(false, f64, null,
                Map.of(CrossSectionFiles.UNIT_KEY, CrossSectionFiles.WAVENUMBER_UNIT)), null);
        Field xs = new Field(CrossSectionFiles.SIGMA_NAME, new FieldType(false, f64, null,
                Map.of(CrossSectionFiles.UNIT_KEY, CrossSectionFiles.SIGMA_UNIT)), null);
        Schema schema = new Schema(List.of(nu, xs), metadata);
        try (BufferAllocator allocator = new RootAllocator();
             VectorSchemaRoot root = VectorSchemaRoot.create(schema, allocator);
             FileChannel channel = FileChannel.open(file, StandardOpenOption.CREATE, StandardOpenOption.WRITE,
                     StandardOpenOption.TRUNCATE_EXISTING);
             ArrowFileWriter writer = new ArrowFileWriter(root, null, channel)) {
            writer.start();
            Float8Vector nuVector = (Float8Vector) root.getVector(0);
            Float8Vector xsVector = (Float8Vector) root.getVector(1);
            int from = 0;
            do {
                // an empty σ still gets one (empty) batch, so readers see the schema and zero rows
                int rows = Math.min(BATCH_ROWS, sigma.length - from);
                nuVector.allocateNew(rows);
                xsVector.allocateNew(rows);
                for (int i = 0; i < rows; i++) {
                    nuVector.set(i, wavenumberCm1[from + i]);
                    xsVector.set(i, sigma[from + i]);
                }
                root.setRowCount(rows);
                writer.writeBatch();
                from += rows;
            } while (from < sigma.length);
            writer.end();
        }
    }
}
