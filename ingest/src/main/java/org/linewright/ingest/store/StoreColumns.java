package org.linewright.ingest.store;

import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Set;
import java.util.Map;
import org.apache.arrow.vector.BigIntVector;
import org.apache.arrow.vector.BitVectorHelper;
import org.apache.arrow.vector.FieldVector;
import org.apache.arrow.vector.Float8Vector;
import org.apache.arrow.vector.IntVector;
import org.apache.arrow.vector.VarCharVector;
import org.apache.arrow.vector.VectorSchemaRoot;
import org.apache.arrow.vector.types.FloatingPointPrecision;
import org.apache.arrow.vector.types.pojo.ArrowType;
import org.apache.arrow.vector.types.pojo.Field;
import org.apache.arrow.vector.types.pojo.FieldType;
import org.apache.arrow.vector.types.pojo.Schema;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.line.TextColumn;

/**
 * The Arrow schema of a store file, derived from {@link LineColumn} (one field per stored column, in declaration
 * order, units in the field metadata), and the metadata keys of the store format.
 *
 * <p>A store file holds the columns its source can fill ({@link org.linewright.ingest.source.LineReader#columnsProvided()})
 * plus the {@link #ALWAYS_STORED} ones; readers see a column the file lacks as NaN (numbers) or empty (text).
 */
final class StoreColumns {
    /** Version of the store file layout, in the schema metadata. */
    static final String STORE_FORMAT_VERSION = "1";

    // Schema metadata (known when the file is created).
    static final String KEY_STORE_FORMAT = "linewright.store_format";
    static final String KEY_SOURCE_NAME = "linewright.source_name";
    static final String KEY_SOURCE_FILE = "linewright.source_file";
    static final String KEY_SOURCE_SHA256 = "linewright.source_sha256";
    static final String KEY_READER_FORMAT = "linewright.reader_format";
    static final String KEY_TOOL_VERSION = "linewright.tool_version";
    static final String KEY_CREATED = "linewright.created_utc";
    static final String PARAM_PREFIX = "linewright.param.";
    static final String KEY_SORT_ORDER = "linewright.sort_order";
    static final String SORT_ORDER_VALUE = "wavenumber_cm1 ascending, stable";

    // Schema metadata completed when the file is finished (in the footer's copy of the schema).
    static final String KEY_RECORDS_READ = "linewright.records_read";
    static final String KEY_LINES_KEPT = "linewright.lines_kept";
    static final String KEY_RECORDS_REJECTED = "linewright.records_rejected";
    static final String KEY_DUPLICATES = "linewright.duplicates";
    static final String KEY_LINES = "linewright.lines";
    static final String KEY_WAVENUMBER_MIN = "linewright.wavenumber_min_cm1";
    static final String KEY_WAVENUMBER_MAX = "linewright.wavenumber_max_cm1";
    /** Per record batch "rows min max" separated by ';' (exact decimal doubles), for range skipping. */
    static final String KEY_BATCHES = "linewright.batches";
    /** The (molecule/isotopologue) pairs present, e.g. "2/1 2/2 5/1". */
    static final String KEY_ISOTOPOLOGUES = "linewright.isotopologues";

    /** Field metadata key holding the column's unit (absent for labels and counts). */
    static final String FIELD_UNIT = "unit";

    static final LineColumn[] COLUMNS = LineColumn.values();

    /**
     * Columns every store file holds whatever its source provides: the species and wavenumber (the sort key and
     * the columns a store reader requires) and the source line (an integer column, which has no "missing" value).
     */
    static final Set<LineColumn> ALWAYS_STORED = Set.copyOf(EnumSet.of(LineColumn.MOLECULE, LineColumn.ISOTOPOLOGUE,
            LineColumn.WAVENUMBER, LineColumn.SOURCE_LINE));

    private StoreColumns() {
    }

    /** The columns a file for a source providing {@code provided} holds: those plus {@link #ALWAYS_STORED}, in declaration order. */
    static LineColumn[] stored(Set<LineColumn> provided) {
        EnumSet<LineColumn> set = EnumSet.copyOf(ALWAYS_STORED);
        set.addAll(provided);
        return set.toArray(new LineColumn[0]);
    }

    /** The schema holding every column. */
    static Schema schema(Map<String, String> schemaMetadata) {
        return schema(schemaMetadata, COLUMNS);
    }

    /** The schema holding {@code columns} (in the given order, which is declaration order for store files). */
    static Schema schema(Map<String, String> schemaMetadata, LineColumn[] columns) {
        List<Field> fields = new ArrayList<>(columns.length);
        for (LineColumn c : columns) {
            Map<String, String> fieldMeta = c.unit().isEmpty() ? null : Map.of(FIELD_UNIT, c.unit());
            fields.add(new Field(c.columnName(), new FieldType(false, arrowType(c.kind()), null, fieldMeta), null));
        }
        return new Schema(fields, schemaMetadata);
    }

    static ArrowType arrowType(LineColumn.Kind kind) {
        switch (kind) {
            case INT: return new ArrowType.Int(32, true);
            case LONG: return new ArrowType.Int(64, true);
            case DOUBLE: return new ArrowType.FloatingPoint(FloatingPointPrecision.DOUBLE);
            case TEXT: return ArrowType.Utf8.INSTANCE;
            default: throw new AssertionError(kind);
        }
    }

    /** Arrow buffers per field of this kind in an IPC record batch (validity, [offsets,] values). */
    static int bufferCount(ArrowType type) {
        return type instanceof ArrowType.Utf8 ? 3 : 2;
    }

    /**
     * Copies the first {@code batch.size} rows of every column into {@code root} (bulk copies into the Arrow
     * buffers; no per-row objects) and sets the row count.
     */
    static void fill(VectorSchemaRoot root, LineBatch batch) {
        fill(root, batch, COLUMNS);
    }

    /**
     * As {@link #fill(VectorSchemaRoot, LineBatch)} for a root whose vectors are {@code columns}, in that order.
     */
    static void fill(VectorSchemaRoot root, LineBatch batch, LineColumn[] columns) {
        int n = batch.size;
        for (int i = 0; i < columns.length; i++) {
            LineColumn c = columns[i];
            FieldVector v = root.getVector(i);
            switch (c.kind()) {
                case INT -> {
                    IntVector iv = (IntVector) v;
                    iv.allocateNew(Math.max(n, 1));
                    littleEndian(iv.getDataBuffer().nioBuffer(0, n * Integer.BYTES)).asIntBuffer().put(c.ints(batch), 0, n);
                    setAllValid(iv.getValidityBuffer(), n);
                }
                case LONG -> {
                    BigIntVector lv = (BigIntVector) v;
                    lv.allocateNew(Math.max(n, 1));
                    littleEndian(lv.getDataBuffer().nioBuffer(0, n * Long.BYTES)).asLongBuffer().put(c.longs(batch), 0, n);
                    setAllValid(lv.getValidityBuffer(), n);
                }
                case DOUBLE -> {
                    Float8Vector dv = (Float8Vector) v;
                    dv.allocateNew(Math.max(n, 1));
                    littleEndian(dv.getDataBuffer().nioBuffer(0, n * Double.BYTES)).asDoubleBuffer().put(c.doubles(batch), 0, n);
                    setAllValid(dv.getValidityBuffer(), n);
                }
                case TEXT -> {
                    TextColumn text = c.text(batch);
                    if (text.rows() != n) {
                        throw new IllegalArgumentException("text column " + c.columnName() + " has " + text.rows()
                                + " rows but the batch has " + n);
                    }
                    VarCharVector sv = (VarCharVector) v;
                    int bytes = text.start(n);
                    sv.allocateNew(Math.max(bytes, 1), Math.max(n, 1));
                    littleEndian(sv.getOffsetBuffer().nioBuffer(0, (n + 1) * Integer.BYTES)).asIntBuffer()
                            .put(text.offsets(), 0, n + 1);
                    sv.getDataBuffer().setBytes(0, text.bytes(), 0, bytes);
                    setAllValid(sv.getValidityBuffer(), n);
                    // Without this the row-count call below would treat every row as unset and rewrite the offsets.
                    sv.setLastSet(n - 1);
                }
                default -> throw new AssertionError(c);
            }
        }
        root.setRowCount(n);
    }

    private static void setAllValid(org.apache.arrow.memory.ArrowBuf validity, int n) {
        validity.setOne(0L, (long) BitVectorHelper.getValidityBufferSize(n));
    }

    static ByteBuffer littleEndian(ByteBuffer b) {
        return b.order(ByteOrder.LITTLE_ENDIAN);
    }
}
