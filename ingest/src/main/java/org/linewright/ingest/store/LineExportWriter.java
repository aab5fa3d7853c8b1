package org.linewright.ingest.store;

import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
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
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.atomic.AtomicFile;

/**
 * Writes selected lines to a stand-alone Arrow IPC file: every column of the line store's layout, followed by
 * extra float64 columns computed by the caller (e.g. S(T), background widths). Written under a temporary name
 * and renamed by {@link #commit()}.
 */
public final class LineExportWriter implements AutoCloseable {
    private final Path target;
    private final Path partial;
    private final BufferAllocator allocator = new RootAllocator();
    private final VectorSchemaRoot root;
    private final FileChannel channel;
    private final ArrowFileWriter writer;
    private final int firstExtra;
    private final int extraCount;
    private boolean committed;
    private boolean released;

    /**
     * @param target the file to write
     * @param extraColumns names of the extra float64 columns with their units ("" for none), in order
     * @param metadata schema metadata (what was selected, at which temperature, ...)
     */
    public LineExportWriter(Path target, Map<String, String> extraColumns, Map<String, String> metadata) throws IOException {
        this.target = target.toAbsolutePath();
        this.partial = AtomicFile.temporaryPathFor(this.target);
        Schema base = StoreColumns.schema(metadata);
        List<Field> fields = new ArrayList<>(base.getFields());
        firstExtra = fields.size();
        extraColumns.forEach((name, unit) -> fields.add(new Field(name, new FieldType(true,
                new ArrowType.FloatingPoint(FloatingPointPrecision.DOUBLE), null,
                unit.isEmpty() ? null : Map.of(StoreColumns.FIELD_UNIT, unit)), null)));
        extraCount = extraColumns.size();
        Files.createDirectories(this.partial.getParent());
        root = VectorSchemaRoot.create(new Schema(fields, metadata), allocator);
        channel = FileChannel.open(partial, StandardOpenOption.CREATE, StandardOpenOption.TRUNCATE_EXISTING,
                StandardOpenOption.WRITE);
        writer = new ArrowFileWriter(root, null, channel);
        writer.start();
    }

    /**
     * Writes the first {@code batch.size} lines with their extra values ({@code extras[k][row]} for the k-th extra
     * column; NaN is written as null).
     */
    public void write(LineBatch batch, double[][] extras) throws IOException {
        int n = batch.size;
        StoreColumns.fill(root, batch);
        for (int k = 0; k < extraCount; k++) {
            Float8Vector v = (Float8Vector) root.getVector(firstExtra + k);
            v.allocateNew(n);
            double[] values = extras[k];
            for (int i = 0; i < n; i++) {
                if (Double.isNaN(values[i])) {
                    v.setNull(i);
                } else {
                    v.set(i, values[i]);
                }
            }
            v.setValueCount(n);
        }
        root.setRowCount(n);
        writer.writeBatch();
    }

    /** Ends the file and renames it to its target name. */
    public void commit() throws IOException {
        writer.end();
        channel.force(true);
        release();
        AtomicFile.rename(partial, target);
        committed = true;
    }

    /** Releases everything; without a {@link #commit()} the partial file is deleted. */
    @Override
    public void close() throws IOException {
        if (!committed) {
            release();
            Files.deleteIfExists(partial);
        }
    }

    private void release() throws IOException {
        if (released) {
            return;
        }
        released = true;
        try {
            writer.close();
        } finally {
            root.close();
            allocator.close();
            if (channel.isOpen()) {
                channel.close();
            }
        }
    }
}
