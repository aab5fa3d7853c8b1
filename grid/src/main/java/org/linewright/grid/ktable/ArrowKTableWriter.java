package org.linewright.grid.ktable;

import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.apache.arrow.memory.BufferAllocator;
import org.apache.arrow.memory.RootAllocator;
import org.apache.arrow.vector.Float8Vector;
import org.apache.arrow.vector.IntVector;
import org.apache.arrow.vector.VectorSchemaRoot;
import org.apache.arrow.vector.ipc.ArrowFileWriter;
import org.apache.arrow.vector.types.FloatingPointPrecision;
import org.apache.arrow.vector.types.pojo.ArrowType;
import org.apache.arrow.vector.types.pojo.Field;
import org.apache.arrow.vector.types.pojo.FieldType;
import org.apache.arrow.vector.types.pojo.Schema;
import org.linewright.grid.table.TableWriter;

/**
 * The Arrow IPC layout of a k-table: one record batch per (p, T), in p-major order, one row per (bin, g) (bins
 * ascending, g ascending within a bin), columns {@code pressure_bar}, {@code temperature_K}, {@code bin_lower_cm1},
 * {@code bin_upper_cm1}, {@code bin_centre_cm1}, {@code sigma_points_per_bin}, {@code g}, {@code g_weight}, k and the
 * optional band σ (repeated on the g rows of a bin); each field has a {@code unit}; the metadata are schema metadata
 * with the prefix {@code linewright.}, as in σ tables.
 */
final class ArrowKTableWriter {
    private ArrowKTableWriter() {
    }

    private static Field field(String name, ArrowType type, String unit) {
        return new Field(name, new FieldType(false, type, null, Map.of("unit", unit)), null);
    }

    static void write(Path file, KTableContent c) throws IOException {
        ArrowType f64 = new ArrowType.FloatingPoint(FloatingPointPrecision.DOUBLE);
        List<Field> fields = new ArrayList<>(List.of(
                field(KTableLayout.PRESSURE, f64, KTableLayout.UNIT_PRESSURE),
                field(KTableLayout.TEMPERATURE, f64, KTableLayout.UNIT_TEMPERATURE),
                field(KTableLayout.BIN_LOWER, f64, KTableLayout.UNIT_WAVENUMBER),
                field(KTableLayout.BIN_UPPER, f64, KTableLayout.UNIT_WAVENUMBER),
                field(KTableLayout.BIN_CENTRE, f64, KTableLayout.UNIT_WAVENUMBER),
                field(KTableLayout.POINTS_PER_BIN, new ArrowType.Int(32, true), KTableLayout.UNIT_ONE),
                field(KTableLayout.G, f64, KTableLayout.UNIT_ONE),
                field(KTableLayout.G_WEIGHT, f64, KTableLayout.UNIT_ONE),
                field(c.kName(), f64, c.unit())));
        if (c.bandMean() != null) {
            fields.add(field(c.bandMeanName(), f64, c.unit()));
        }
        if (c.transmissionEquivalent() != null) {
            fields.add(field(c.transmissionEquivalentName(), f64, c.unit()));
        }
        Map<String, String> meta = new LinkedHashMap<>();
        c.metadata().forEach((k, v) -> meta.put(TableWriter.ARROW_KEY_PREFIX + k, v));
        Schema schema = new Schema(fields, meta);
        int nb = c.bins();
        int ng = c.gPoints();
        int rows = nb * ng;
        try (BufferAllocator allocator = new RootAllocator();
             VectorSchemaRoot root = VectorSchemaRoot.create(schema, allocator);
             FileChannel ch = FileChannel.open(file, StandardOpenOption.WRITE, StandardOpenOption.TRUNCATE_EXISTING);
             ArrowFileWriter writer = new ArrowFileWriter(root, null, ch)) {
            writer.start();
            Float8Vector pv = (Float8Vector) root.getVector(KTableLayout.PRESSURE);
            Float8Vector tv = (Float8Vector) root.getVector(KTableLayout.TEMPERATURE);
            Float8Vector lo = (Float8Vector) root.getVector(KTableLayout.BIN_LOWER);
            Float8Vector hi = (Float8Vector) root.getVector(KTableLayout.BIN_UPPER);
            Float8Vector ce = (Float8Vector) root.getVector(KTableLayout.BIN_CENTRE);
            IntVector np = (IntVector) root.getVector(KTableLayout.POINTS_PER_BIN);
            Float8Vector gv = (Float8Vector) root.getVector(KTableLayout.G);
            Float8Vector wv = (Float8Vector) root.getVector(KTableLayout.G_WEIGHT);
            Float8Vector kv = (Float8Vector) root.getVector(c.kName());
            Float8Vector mv = c.bandMean() == null ? null : (Float8Vector) root.getVector(c.bandMeanName());
            Float8Vector ev = c.transmissionEquivalent() == null ? null
                    : (Float8Vector) root.getVector(c.transmissionEquivalentName());
            for (int p = 0; p < c.pressureBar().length; p++) {
                for (int t = 0; t < c.temperatureK().length; t++) {
                    root.allocateNew();
                    for (int b = 0; b < nb; b++) {
                        int kOff = c.kOffset(p, t, b);
                        for (int g = 0; g < ng; g++) {
                            int r = b * ng + g;
                            pv.setSafe(r, c.pressureBar()[p]);
                            tv.setSafe(r, c.temperatureK()[t]);
                            lo.setSafe(r, c.binLowerCm1()[b]);
                            hi.setSafe(r, c.binUpperCm1()[b]);
                            ce.setSafe(r, c.binCentreCm1(b));
                            np.setSafe(r, c.pointsPerBin()[b]);
                            gv.setSafe(r, c.g()[g]);
                            wv.setSafe(r, c.gWeight()[g]);
                            kv.setSafe(r, c.k()[kOff + g]);
                            if (mv != null) {
                                mv.setSafe(r, c.bandMean()[c.bandOffset(p, t, b)]);
                            }
                            if (ev != null) {
                                ev.setSafe(r, c.transmissionEquivalent()[c.bandOffset(p, t, b)]);
                            }
                        }
                    }
                    root.setRowCount(rows);
                    writer.writeBatch();
                }
            }
            writer.end();
        }
    }
}
