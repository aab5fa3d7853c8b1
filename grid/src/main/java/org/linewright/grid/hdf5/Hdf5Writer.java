package org.linewright.grid.hdf5;

import java.io.Closeable;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;

/**
 * Writes an HDF5 file of dimensions with coordinates and chunked, compressed variables over them, readable as
 * netCDF-4 (HDF5 dimension scales: each dimension is a dataset with attributes {@code CLASS="DIMENSION_SCALE"},
 * {@code NAME} and {@code REFERENCE_LIST}; each variable carries {@code DIMENSION_LIST}). Use: declare the
 * dimensions ({@link #coordinate}, {@link #dimension}), then the variables ({@link #variable}), write their chunks
 * in any order as they are produced ({@link Hdf5Variable#writeChunk}), add attributes of the root group at any
 * time ({@link #attribute}), then {@link #close()}.
 *
 * <p>File layout (HDF5 File Format Specification, version 3.0 structures of HDF5 1.8): superblock version 2 at
 * offset 0; the coordinates' values and the variables' chunks in the order written; at close, one global heap
 * collection (every variable-length value), the chunk B-trees and the version-2 object headers of each dataset and
 * of the root group (links stored in its header). String attributes are variable-length UTF-8 strings, so there is
 * no limit on their length. Nothing the file needs is held in memory but the chunk addresses and the attributes.
 */
public final class Hdf5Writer implements Closeable {
    /** The attribute naming a dataset's unit (netCDF and CF convention). */
    public static final String UNITS = "units";
    private static final byte[] SIGNATURE = {(byte) 0x89, 'H', 'D', 'F', '\r', '\n', 0x1a, '\n'};
    private static final int SUPERBLOCK_BYTES = 48;

    private final FileChannel channel;
    private final Map<String, String> rootAttributes = new LinkedHashMap<>();
    private final List<Hdf5Dimension> dimensions = new ArrayList<>();
    private final List<Hdf5Variable> variables = new ArrayList<>();
    private final Set<String> names = new HashSet<>();
    private long end = SUPERBLOCK_BYTES;
    private boolean closed;

    private Hdf5Writer(FileChannel channel) {
        this.channel = channel;
    }

    /** Creates (or truncates) {@code file}. */
    public static Hdf5Writer create(Path file) throws IOException {
        return new Hdf5Writer(FileChannel.open(file, StandardOpenOption.CREATE, StandardOpenOption.WRITE,
                StandardOpenOption.TRUNCATE_EXISTING));
    }

    /** Sets a string attribute of the root group (netCDF: a global attribute). */
    public void attribute(String name, String value) {
        checkOpen();
        checkAttributeName(name);
        rootAttributes.put(name, value);
    }

    /**
     * Declares a dimension with coordinate values (float64), written at once: a netCDF-4 coordinate variable.
     *
     * @param attributes string attributes of the coordinate (e.g. {@code units})
     */
    public Hdf5Dimension coordinate(String name, double[] values, Map<String, String> attributes) throws IOException {
        checkOpen();
        claim(name);
        ByteBuffer b = ByteBuffer.allocate(values.length * Double.BYTES).order(ByteOrder.LITTLE_ENDIAN);
        for (double v : values) {
            b.putDouble(v);
        }
        long address = append(b.array(), b.capacity());
        Hdf5Dimension d = new Hdf5Dimension(name, values.length, values.clone(), copy(attributes), address);
        dimensions.add(d);
        return d;
    }

    /** Declares a dimension without coordinate values (netCDF-4: a dimension that is not a variable). */
    public Hdf5Dimension dimension(String name, int length) {
        checkOpen();
        claim(name);
        Hdf5Dimension d = new Hdf5Dimension(name, length, null, Map.of(), LittleEndianBuffer.UNDEFINED_ADDRESS);
        dimensions.add(d);
        return d;
    }

    /**
     * Declares a variable over {@code dims} (declared by this writer), chunked by {@code chunkShape} and filtered
     * by {@code compression}; its chunks are then written through the returned handle.
     *
     * @param attributes string attributes of the variable (e.g. {@code units})
     */
    public Hdf5Variable variable(String name, ElementType type, List<Hdf5Dimension> dims, int[] chunkShape,
                                 Compression compression, Map<String, String> attributes) {
        checkOpen();
        for (Hdf5Dimension d : dims) {
            if (!dimensions.contains(d)) {
                throw new IllegalArgumentException(name + ": dimension " + d.name() + " is not of this file");
            }
        }
        claim(name);
        Hdf5Variable v = new Hdf5Variable(this, name, type, dims, chunkShape, compression, copy(attributes));
        for (int i = 0; i < dims.size(); i++) {
            dims.get(i).users.add(new Hdf5Dimension.Use(v, i));
        }
        variables.add(v);
        return v;
    }

    /** Appends {@code bytes[0, length)} at the end of the file; returns their address. */
    long append(byte[] bytes, int length) throws IOException {
        long address = end;
        writeAt(address, ByteBuffer.wrap(bytes, 0, length));
        end += length;
        return address;
    }

    /**
     * Writes the metadata (heap, chunk indexes, object headers, superblock) and closes the file.
     *
     * @throws IllegalStateException when a variable has chunks that were never written (the file is then closed
     *                               unfinished)
     */
    @Override
    public void close() throws IOException {
        if (closed) {
            return;
        }
        closed = true;
        try {
            for (Hdf5Variable v : variables) {
                v.checkComplete();
            }
            finish();
        } finally {
            variables.forEach(Hdf5Variable::release);
            channel.close();
        }
    }

    private void finish() throws IOException {
        long base = (end + 7) / 8 * 8;
        int objects = dimensions.size() + variables.size();
        // a first encoding with provisional addresses gives every structure's size (addresses are fixed-width)
        Layout sizes = encode(new long[objects + 1], 0, new long[variables.size()]);
        long heapAddress = base;
        long next = heapAddress + sizes.heap.length;
        long[] btree = new long[variables.size()];
        List<byte[]> indexes = new ArrayList<>();
        for (int i = 0; i < variables.size(); i++) {
            Hdf5Variable v = variables.get(i);
            ChunkIndex index = new ChunkIndex(v.shape().length);
            long first = next;
            byte[] nodes = index.encode(first, v.chunkOffsets(), v.chunkBytes(), v.chunkAddresses());
            // the root is the last node written
            btree[i] = first + nodes.length - index.nodeBytes();
            indexes.add(nodes);
            next += nodes.length;
        }
        long[] headers = new long[objects + 1];
        for (int i = 0; i <= objects; i++) {
            headers[i] = next;
            next += sizes.headers.get(i).length;
        }
        Layout layout = encode(headers, heapAddress, btree);
        writeAt(heapAddress, ByteBuffer.wrap(layout.heap));
        long at = heapAddress + layout.heap.length;
        for (byte[] nodes : indexes) {
            writeAt(at, ByteBuffer.wrap(nodes));
            at += nodes.length;
        }
        for (int i = 0; i <= objects; i++) {
            if (layout.headers.get(i).length != sizes.headers.get(i).length) {
                throw new IllegalStateException("object header size changed between passes");
            }
            writeAt(headers[i], ByteBuffer.wrap(layout.headers.get(i)));
        }
        writeAt(0, ByteBuffer.wrap(superblock(next, headers[objects])));
    }

    private record Layout(List<byte[]> headers, byte[] heap) {
    }

    /** Encodes the object headers (dimensions, variables, root last) and the heap for the given addresses. */
    private Layout encode(long[] headers, long heapAddress, long[] btree) {
        GlobalHeap heap = new GlobalHeap(heapAddress);
        List<byte[]> out = new ArrayList<>();
        for (Hdf5Dimension d : dimensions) {
            out.add(dimensionHeader(d, heap, headers));
        }
        for (int i = 0; i < variables.size(); i++) {
            out.add(variableHeader(variables.get(i), heap, headers, btree[i]));
        }
        ObjectHeader root = new ObjectHeader()
                .message(ObjectHeader.LINK_INFO, 0, Messages.linkInfo())
                .message(ObjectHeader.GROUP_INFO, 0, Messages.groupInfo());
        for (int i = 0; i < dimensions.size(); i++) {
            root.message(ObjectHeader.LINK, 0, Messages.hardLink(dimensions.get(i).name(), headers[i]));
        }
        for (int i = 0; i < variables.size(); i++) {
            root.message(ObjectHeader.LINK, 0,
                    Messages.hardLink(variables.get(i).name(), headers[dimensions.size() + i]));
        }
        stringAttributes(root, rootAttributes, heap);
        out.add(root.toBytes());
        return new Layout(out, heap.isEmpty() ? new byte[0] : heap.toBytes());
    }

    private byte[] dimensionHeader(Hdf5Dimension d, GlobalHeap heap, long[] headers) {
        ObjectHeader h = new ObjectHeader();
        boolean values = d.hasCoordinates();
        Datatype type = values ? Datatype.float64() : Datatype.float32();
        h.message(ObjectHeader.DATASPACE, 0, Dataspace.simple(d.length()));
        h.message(ObjectHeader.DATATYPE, ObjectHeader.FLAG_CONSTANT, type.encoding());
        h.message(ObjectHeader.FILL_VALUE, ObjectHeader.FLAG_CONSTANT, Messages.fillValueContiguous());
        h.message(ObjectHeader.DATA_LAYOUT, 0, Messages.contiguousLayout(d.dataAddress(),
                (long) d.length() * type.size()));
        // the dimension-scale convention (HDF5 "Dimension Scale Specification"): fixed-length NUL-terminated strings
        fixedString(h, "CLASS", "DIMENSION_SCALE");
        fixedString(h, "NAME", values ? d.name() : Hdf5Dimension.NOT_A_VARIABLE + String.format("%10d", d.length()));
        stringAttributes(h, d.attributes(), heap);
        if (!d.users.isEmpty()) {
            // REFERENCE_LIST: {dataset: object reference, dimension: int} per using variable, laid out as the
            // library's own struct (reference at 0, int at 8, 16 bytes)
            Datatype entry = Datatype.compound(16, "dataset", Datatype.objectReference(), "dimension", 8,
                    Datatype.int32());
            LittleEndianBuffer data = new LittleEndianBuffer();
            for (Hdf5Dimension.Use use : d.users) {
                data.u64(headers[dimensions.size() + variables.indexOf(use.variable())]).u32(use.axis()).zeros(4);
            }
            h.message(ObjectHeader.ATTRIBUTE, 0, Messages.attribute("REFERENCE_LIST", entry,
                    Dataspace.simple(d.users.size()), data.toArray()));
        }
        return h.toBytes();
    }

    private byte[] variableHeader(Hdf5Variable v, GlobalHeap heap, long[] headers, long btree) {
        ObjectHeader h = new ObjectHeader();
        Datatype type = v.type().datatype();
        h.message(ObjectHeader.DATASPACE, 0, Dataspace.simple(v.shape()));
        h.message(ObjectHeader.DATATYPE, ObjectHeader.FLAG_CONSTANT, type.encoding());
        h.message(ObjectHeader.FILL_VALUE, ObjectHeader.FLAG_CONSTANT, Messages.fillValueChunked());
        if (v.compression().filters()) {
            h.message(ObjectHeader.FILTER_PIPELINE, 0, v.compression().pipelineMessage(type.size()));
        }
        h.message(ObjectHeader.DATA_LAYOUT, 0, Messages.chunkedLayout(btree, v.chunkShapeView(), type.size()));
        stringAttributes(h, v.attributes(), heap);
        // DIMENSION_LIST: per dimension, a variable-length sequence of object references to its scale(s)
        LittleEndianBuffer data = new LittleEndianBuffer();
        for (Hdf5Dimension d : v.dimensions()) {
            byte[] ref = new LittleEndianBuffer().u64(headers[dimensions.indexOf(d)]).toArray();
            data.bytes(heap.add(ref, 1));
        }
        h.message(ObjectHeader.ATTRIBUTE, 0, Messages.attribute("DIMENSION_LIST",
                Datatype.variableLengthSequence(Datatype.objectReference()),
                Dataspace.simple(v.dimensions().size()), data.toArray()));
        return h.toBytes();
    }

    private static void fixedString(ObjectHeader h, String name, String value) {
        byte[] b = (value + "\0").getBytes(StandardCharsets.US_ASCII);
        h.message(ObjectHeader.ATTRIBUTE, 0, Messages.attribute(name, Datatype.fixedString(b.length),
                Dataspace.scalar(), b));
    }

    private static void stringAttributes(ObjectHeader h, Map<String, String> attributes, GlobalHeap heap) {
        for (Map.Entry<String, String> e : attributes.entrySet()) {
            byte[] value = e.getValue().getBytes(StandardCharsets.UTF_8);
            h.message(ObjectHeader.ATTRIBUTE, 0, Messages.attribute(e.getKey(), Datatype.variableLengthUtf8String(),
                    Dataspace.scalar(), heap.add(value, value.length)));
        }
    }

    /** Superblock version 2 (HDF5 File Format Specification, "Superblock"), 8-byte addresses and lengths. */
    private static byte[] superblock(long endOfFile, long root) {
        LittleEndianBuffer b = new LittleEndianBuffer().bytes(SIGNATURE).u8(2).u8(8).u8(8).u8(0)
                .u64(0).u64(LittleEndianBuffer.UNDEFINED_ADDRESS).u64(endOfFile).u64(root);
        byte[] body = b.toArray();
        return b.u32(Lookup3.hash(body, 0, body.length)).toArray();
    }

    private void writeAt(long position, ByteBuffer b) throws IOException {
        while (b.hasRemaining()) {
            position += channel.write(b, position);
        }
    }

    private void claim(String name) {
        checkAttributeName(name);
        if (name.indexOf('/') >= 0 || name.equals(".")) {
            throw new IllegalArgumentException("HDF5 dataset name " + name + " contains '/' or is '.'");
        }
        if (!names.add(name)) {
            throw new IllegalArgumentException("HDF5 dataset " + name + " declared twice");
        }
    }

    private static void checkAttributeName(String name) {
        if (name.isEmpty() || name.indexOf('\0') >= 0) {
            throw new IllegalArgumentException("HDF5 name \"" + name + "\" is empty or holds a NUL");
        }
    }

    private void checkOpen() {
        if (closed) {
            throw new IllegalStateException("the HDF5 file is closed");
        }
    }

    private static Map<String, String> copy(Map<String, String> attributes) {
        return java.util.Collections.unmodifiableMap(new LinkedHashMap<>(attributes));
    }
}
