package org.linewright.grid.hdf5;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.util.Arrays;
import java.util.BitSet;
import java.util.List;
import java.util.Map;

/**
 * A chunked, filtered n-D variable of an HDF5 file written by {@link Hdf5Writer}, filled chunk by chunk in any
 * order; each chunk is filtered and written to the file at once, so the variable is never held in memory. Every
 * chunk must be written exactly once before the file is closed. Not thread-safe.
 */
public final class Hdf5Variable {
    private final Hdf5Writer file;
    private final String name;
    private final ElementType type;
    private final List<Hdf5Dimension> dimensions;
    private final long[] shape;
    private final int[] chunkShape;
    private final long[] chunksPerDimension;
    private final Compression compression;
    private final Map<String, String> attributes;
    private final long[] chunkAddress;
    private final int[] chunkBytes;
    private final BitSet written = new BitSet();
    private final byte[] raw;
    private final ByteBuffer rawView;
    private final Compression.Encoder encoder;
    private final int[] extent;
    private final int[] counter;

    Hdf5Variable(Hdf5Writer file, String name, ElementType type, List<Hdf5Dimension> dimensions, int[] chunkShape,
                 Compression compression, Map<String, String> attributes) {
        this.file = file;
        this.name = name;
        this.type = type;
        this.dimensions = List.copyOf(dimensions);
        int rank = dimensions.size();
        if (rank == 0 || chunkShape.length != rank) {
            throw new IllegalArgumentException(name + ": chunk shape " + Arrays.toString(chunkShape) + " for "
                    + rank + " dimensions");
        }
        this.shape = new long[rank];
        this.chunkShape = chunkShape.clone();
        this.chunksPerDimension = new long[rank];
        long chunks = 1;
        long elements = 1;
        for (int d = 0; d < rank; d++) {
            shape[d] = dimensions.get(d).length();
            if (shape[d] < 1) {
                throw new IllegalArgumentException(name + ": dimension " + dimensions.get(d).name() + " is empty");
            }
            if (chunkShape[d] < 1 || chunkShape[d] > shape[d]) {
                throw new IllegalArgumentException(name + ": chunk shape " + Arrays.toString(chunkShape)
                        + " does not fit dimension " + dimensions.get(d).name() + " of length " + shape[d]);
            }
            chunksPerDimension[d] = (shape[d] + chunkShape[d] - 1) / chunkShape[d];
            chunks *= chunksPerDimension[d];
            elements *= chunkShape[d];
        }
        if (elements * type.bytes() > Integer.MAX_VALUE - 1024 || chunks > Integer.MAX_VALUE) {
            throw new IllegalArgumentException(name + ": chunk of " + elements + " elements or " + chunks
                    + " chunks is too many");
        }
        this.compression = compression;
        this.attributes = attributes;
        this.chunkAddress = new long[(int) chunks];
        this.chunkBytes = new int[(int) chunks];
        this.raw = new byte[(int) elements * type.bytes()];
        this.rawView = ByteBuffer.wrap(raw).order(ByteOrder.LITTLE_ENDIAN);
        this.encoder = new Compression.Encoder(compression, type.bytes());
        this.extent = new int[rank];
        this.counter = new int[rank];
    }

    public String name() {
        return name;
    }

    /** The chunk shape (a copy). */
    public int[] chunkShape() {
        return chunkShape.clone();
    }

    /** Number of chunks along dimension {@code d}. */
    public long chunksAlong(int d) {
        return chunksPerDimension[d];
    }

    /**
     * Writes one chunk. {@code values} holds, from {@code offset}, the chunk's elements in row-major order over the
     * chunk's extent clipped to the variable (a chunk at the far edge of a dimension is shorter there); the writer
     * pads the stored chunk with zeros, as HDF5 stores edge chunks at full size.
     *
     * @param chunkIndex the chunk's position in chunks along each dimension
     * @throws IllegalArgumentException for an index outside the variable, a chunk written before or too few values
     */
    public void writeChunk(long[] chunkIndex, double[] values, int offset) throws IOException {
        int linear = linearIndex(chunkIndex);
        int count = 1;
        for (int d = 0; d < shape.length; d++) {
            extent[d] = (int) Math.min(chunkShape[d], shape[d] - chunkIndex[d] * chunkShape[d]);
            count *= extent[d];
        }
        if (offset < 0 || values.length - offset < count) {
            throw new IllegalArgumentException(name + ": chunk " + Arrays.toString(chunkIndex) + " needs " + count
                    + " values from offset " + offset + ", got " + (values.length - offset));
        }
        Arrays.fill(raw, (byte) 0);
        // copy runs along the last dimension, walking the other dimensions of the clipped extent row-major
        Arrays.fill(counter, 0);
        int rank = shape.length;
        int run = extent[rank - 1];
        int src = offset;
        int esize = type.bytes();
        for (int runs = count / run; runs > 0; runs--) {
            int dst = 0;
            for (int d = 0; d < rank - 1; d++) {
                dst = dst * chunkShape[d] + counter[d];
            }
            dst *= chunkShape[rank - 1];
            if (type == ElementType.FLOAT32) {
                for (int i = 0; i < run; i++) {
                    rawView.putFloat((dst + i) * esize, (float) values[src + i]);
                }
            } else {
                for (int i = 0; i < run; i++) {
                    rawView.putDouble((dst + i) * esize, values[src + i]);
                }
            }
            src += run;
            for (int d = rank - 2; d >= 0; d--) {
                if (++counter[d] < extent[d]) {
                    break;
                }
                counter[d] = 0;
            }
        }
        encoder.encode(raw, raw.length);
        chunkAddress[linear] = file.append(encoder.bytes(), encoder.length());
        chunkBytes[linear] = encoder.length();
        written.set(linear);
    }

    /** Writes the whole variable from {@code values} in row-major order (convenient for small variables). */
    public void writeAll(double[] values) throws IOException {
        long total = 1;
        for (long s : shape) {
            total *= s;
        }
        if (values.length != total) {
            throw new IllegalArgumentException(name + ": " + values.length + " values for " + total + " elements");
        }
        int rank = shape.length;
        long[] index = new long[rank];
        double[] block = new double[raw.length / type.bytes()];
        for (int c = 0; c < chunkAddress.length; c++) {
            int n = 0;
            int[] ext = new int[rank];
            int count = 1;
            for (int d = 0; d < rank; d++) {
                ext[d] = (int) Math.min(chunkShape[d], shape[d] - index[d] * chunkShape[d]);
                count *= ext[d];
            }
            int[] at = new int[rank];
            for (int k = 0; k < count; k++) {
                long flat = 0;
                for (int d = 0; d < rank; d++) {
                    flat = flat * shape[d] + index[d] * chunkShape[d] + at[d];
                }
                block[n++] = values[(int) flat];
                for (int d = rank - 1; d >= 0; d--) {
                    if (++at[d] < ext[d]) {
                        break;
                    }
                    at[d] = 0;
                }
            }
            writeChunk(index, block, 0);
            for (int d = rank - 1; d >= 0; d--) {
                if (++index[d] < chunksPerDimension[d]) {
                    break;
                }
                index[d] = 0;
            }
        }
    }

    private int linearIndex(long[] chunkIndex) {
        if (chunkIndex.length != shape.length) {
            throw new IllegalArgumentException(name + ": chunk index " + Arrays.toString(chunkIndex) + " for "
                    + shape.length + " dimensions");
        }
        long linear = 0;
        for (int d = 0; d < shape.length; d++) {
            if (chunkIndex[d] < 0 || chunkIndex[d] >= chunksPerDimension[d]) {
                throw new IllegalArgumentException(name + ": chunk index " + Arrays.toString(chunkIndex)
                        + " outside " + Arrays.toString(chunksPerDimension) + " chunks");
            }
            linear = linear * chunksPerDimension[d] + chunkIndex[d];
        }
        if (written.get((int) linear)) {
            throw new IllegalArgumentException(name + ": chunk " + Arrays.toString(chunkIndex) + " written twice");
        }
        return (int) linear;
    }

    /** Throws unless every chunk was written. */
    void checkComplete() {
        int missing = written.nextClearBit(0);
        if (missing < chunkAddress.length) {
            throw new IllegalStateException(name + ": " + (chunkAddress.length - written.cardinality()) + " of "
                    + chunkAddress.length + " chunks were never written (first: chunk number " + missing + ")");
        }
    }

    ElementType type() {
        return type;
    }

    List<Hdf5Dimension> dimensions() {
        return dimensions;
    }

    long[] shape() {
        return shape;
    }

    int[] chunkShapeView() {
        return chunkShape;
    }

    Compression compression() {
        return compression;
    }

    Map<String, String> attributes() {
        return attributes;
    }

    int chunkCount() {
        return chunkAddress.length;
    }

    /** Element offsets of chunk {@code linear} (row-major), and of the position one chunk past the last. */
    long[][] chunkOffsets() {
        int rank = shape.length;
        long[][] offsets = new long[chunkAddress.length + 1][rank];
        long[] index = new long[rank];
        for (int c = 0; c < chunkAddress.length; c++) {
            for (int d = 0; d < rank; d++) {
                offsets[c][d] = index[d] * chunkShape[d];
            }
            for (int d = rank - 1; d >= 0; d--) {
                if (++index[d] < chunksPerDimension[d]) {
                    break;
                }
                index[d] = 0;
            }
        }
        // past the last chunk: one chunk further along every dimension (the library's own right-most key)
        for (int d = 0; d < rank; d++) {
            offsets[chunkAddress.length][d] = offsets[chunkAddress.length - 1][d] + chunkShape[d];
        }
        return offsets;
    }

    long[] chunkAddresses() {
        return chunkAddress;
    }

    int[] chunkBytes() {
        return chunkBytes;
    }

    void release() {
        encoder.close();
    }
}
