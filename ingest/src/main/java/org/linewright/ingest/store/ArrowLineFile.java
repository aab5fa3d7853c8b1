package org.linewright.ingest.store;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;
import org.apache.arrow.flatbuf.Buffer;
import org.apache.arrow.flatbuf.FieldNode;
import org.apache.arrow.flatbuf.Message;
import org.apache.arrow.flatbuf.MessageHeader;
import org.apache.arrow.flatbuf.RecordBatch;
import org.apache.arrow.memory.BufferAllocator;
import org.apache.arrow.memory.RootAllocator;
import org.apache.arrow.vector.ipc.ArrowFileReader;
import org.apache.arrow.vector.ipc.ReadChannel;
import org.apache.arrow.vector.ipc.message.ArrowBlock;
import org.apache.arrow.vector.ipc.message.MessageMetadataResult;
import org.apache.arrow.vector.ipc.message.MessageSerializer;
import org.apache.arrow.vector.types.pojo.Field;
import org.apache.arrow.vector.types.pojo.Schema;
import org.linewright.ingest.InputException;
import org.linewright.ingest.line.LineColumn;

/**
 * The layout of one finished store file: schema metadata, record-batch positions with their
 * row counts and wavenumber ranges, and where each column's buffers sit in a record batch. Reading the
 * columns themselves is done by {@link BlockReader}, column by column and row range by row range, so that a
 * projection reads only the bytes of the projected columns.
 */
final class ArrowLineFile {
    final Path path;
    /** The schema metadata (from the footer's schema: provenance, counts, summary, batch index). */
    final Map<String, String> metadata;
    final List<ArrowBlock> blocks;
    final int[] blockRows;
    final double[] blockMinCm1;
    final double[] blockMaxCm1;
    final int maxBlockRows;
    /** Index of the column's first buffer (validity) among the record batch's buffers; -1 when absent. */
    final EnumMap<LineColumn, Integer> firstBuffer = new EnumMap<>(LineColumn.class);
    /** Index of the column's field node; -1 when absent. */
    final EnumMap<LineColumn, Integer> fieldNode = new EnumMap<>(LineColumn.class);

    private ArrowLineFile(Path path, Schema schema, List<ArrowBlock> blocks) {
        this.path = path;
        this.metadata = schema.getCustomMetadata() == null ? Map.of() : Map.copyOf(schema.getCustomMetadata());
        this.blocks = List.copyOf(blocks);
        int buffer = 0;
        List<Field> fields = schema.getFields();
        for (int f = 0; f < fields.size(); f++) {
            Field field = fields.get(f);
            LineColumn c = LineColumn.byName(field.getName());
            if (c != null) {
                if (!StoreColumns.arrowType(c.kind()).equals(field.getType())) {
                    throw new InputException(path + ": column " + field.getName() + " has type " + field.getType()
                            + " (expected " + StoreColumns.arrowType(c.kind()) + ")");
                }
                firstBuffer.put(c, buffer);
                fieldNode.put(c, f);
            }
            buffer += StoreColumns.bufferCount(field.getType());
        }
        for (LineColumn required : new LineColumn[] {LineColumn.WAVENUMBER, LineColumn.MOLECULE, LineColumn.ISOTOPOLOGUE}) {
            if (!firstBuffer.containsKey(required)) {
                throw new InputException(path + ": not a line store file (no column " + required.columnName() + ")");
            }
        }
        int n = blocks.size();
        blockRows = new int[n];
        blockMinCm1 = new double[n];
        blockMaxCm1 = new double[n];
        String index = metadata.get(StoreColumns.KEY_BATCHES);
        String[] entries = index == null || index.isEmpty() ? new String[0] : index.split(";");
        if (entries.length != n) {
            throw new InputException(path + ": metadata lists " + entries.length + " batches but the file has " + n);
        }
        int max = 0;
        for (int i = 0; i < n; i++) {
            String[] parts = entries[i].split(" ");
            try {
                blockRows[i] = Integer.parseInt(parts[0]);
                blockMinCm1[i] = Double.parseDouble(parts[1]);
                blockMaxCm1[i] = Double.parseDouble(parts[2]);
            } catch (RuntimeException e) {
                throw new InputException(path + ": metadata " + StoreColumns.KEY_BATCHES + ": \"" + entries[i]
                        + "\" (expected rows, min and max wavenumber)", e);
            }
            max = Math.max(max, blockRows[i]);
        }
        maxBlockRows = max;
    }

    /** Reads the footer of a finished file (a file without a valid footer is rejected). */
    static ArrowLineFile open(Path path) throws IOException {
        try (FileChannel ch = FileChannel.open(path, StandardOpenOption.READ);
             BufferAllocator allocator = new RootAllocator();
             ArrowFileReader reader = new ArrowFileReader(ch, allocator)) {
            List<ArrowBlock> blocks = reader.getRecordBlocks();
            Schema schema = reader.getVectorSchemaRoot().getSchema();
            return new ArrowLineFile(path, schema, blocks);
        } catch (IOException | RuntimeException e) {
            if (e instanceof InputException) {
                throw e;
            }
            throw new InputException(path + ": not a finished line store file (" + e.getMessage() + ")", e);
        }
    }

    boolean has(LineColumn c) {
        return firstBuffer.containsKey(c);
    }

    /** Reads record-batch metadata and column bytes of one file through one channel and one scratch buffer. */
    final class BlockReader implements AutoCloseable {
        private final FileChannel channel;
        private ByteBuffer scratch = ByteBuffer.allocateDirect(1 << 16);
        private final RecordBatch batch = new RecordBatch();
        private final Buffer buffer = new Buffer();
        private final FieldNode node = new FieldNode();
        private long bodyStart;
        private int rows;

        BlockReader() throws IOException {
            channel = FileChannel.open(path, StandardOpenOption.READ);
        }

        /** Positions on block {@code b}: reads its message header. Returns the row count. */
        int open(int b) throws IOException {
            ArrowBlock block = blocks.get(b);
            channel.position(block.getOffset());
            MessageMetadataResult meta = MessageSerializer.readMessage(new ReadChannel(channel));
            Message message = meta.getMessage();
            if (message.headerType() != MessageHeader.RecordBatch) {
                throw new InputException(path + ": block " + b + " is not a record batch");
            }
            message.header(batch);
            if (batch.compression() != null) {
                throw new InputException(path + ": compressed record batches are not supported");
            }
            bodyStart = block.getOffset() + block.getMetadataLength();
            rows = (int) batch.length();
            if (rows != blockRows[b]) {
                throw new InputException(path + ": block " + b + " has " + rows + " rows, metadata says " + blockRows[b]);
            }
            return rows;
        }

        /** Checks that the column holds no nulls (store files never do). */
        private void checkNoNulls(LineColumn c) {
            batch.nodes(node, fieldNode.get(c));
            if (node.nullCount() != 0) {
                throw new InputException(path + ": column " + c.columnName() + " holds null values");
            }
        }

        /**
         * Reads bytes {@code [from, from+length)} of buffer {@code k} of the current block into the scratch
         * buffer, returned positioned at 0, little-endian.
         */
        ByteBuffer read(int k, long from, int length) throws IOException {
            batch.buffers(buffer, k);
            if (from + length > buffer.length()) {
                throw new InputException(path + ": buffer " + k + " is shorter than its row count requires");
            }
            if (scratch.capacity() < length) {
                scratch = ByteBuffer.allocateDirect(Math.max(length, scratch.capacity() * 2));
            }
            scratch.clear().limit(length);
            long position = bodyStart + buffer.offset() + from;
            while (scratch.hasRemaining()) {
                int r = channel.read(scratch, position + scratch.position());
                if (r < 0) {
                    throw new InputException(path + ": file ends inside a record batch");
                }
            }
            scratch.flip();
            return StoreColumns.littleEndian(scratch);
        }

        void readInts(LineColumn c, int lo, int hi, int[] dst, int at) throws IOException {
            checkNoNulls(c);
            read(firstBuffer.get(c) + 1, (long) lo * Integer.BYTES, (hi - lo) * Integer.BYTES).asIntBuffer().get(dst, at, hi - lo);
        }

        void readLongs(LineColumn c, int lo, int hi, long[] dst, int at) throws IOException {
            checkNoNulls(c);
            read(firstBuffer.get(c) + 1, (long) lo * Long.BYTES, (hi - lo) * Long.BYTES).asLongBuffer().get(dst, at, hi - lo);
        }

        void readDoubles(LineColumn c, int lo, int hi, double[] dst, int at) throws IOException {
            checkNoNulls(c);
            read(firstBuffer.get(c) + 1, (long) lo * Double.BYTES, (hi - lo) * Double.BYTES).asDoubleBuffer().get(dst, at, hi - lo);
        }

        /** Reads the offsets {@code [lo, hi]} of a text column into {@code offsets[0..hi-lo]}. */
        void readTextOffsets(LineColumn c, int lo, int hi, int[] offsets) throws IOException {
            checkNoNulls(c);
            read(firstBuffer.get(c) + 1, (long) lo * Integer.BYTES, (hi - lo + 1) * Integer.BYTES).asIntBuffer().get(offsets, 0, hi - lo + 1);
        }

        /** Reads the value bytes {@code [from, to)} of a text column. */
        ByteBuffer readTextBytes(LineColumn c, int from, int to) throws IOException {
            return read(firstBuffer.get(c) + 2, from, to - from);
        }

        @Override
        public void close() throws IOException {
            channel.close();
        }
    }
}
