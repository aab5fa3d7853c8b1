package org.linewright.grid.hdf5;

import java.util.ArrayList;
import java.util.List;

/**
 * The index of a chunked dataset's chunks: a version-1 B-tree of node type 1 (HDF5 File Format Specification,
 * "Version 1 B-trees"), as data layout message version 3 expects. Nodes hold at most 2K = 64 children (K = 32,
 * the library default for chunk B-trees when the superblock does not say otherwise) and are stored at full size,
 * as HDF5 reads them. Keys are a chunk's compressed size, filter mask and element offsets (plus a trailing 0 for
 * the datatype dimension); key i bounds child i from below, the last key bounds the last child from above.
 */
final class ChunkIndex {
    private static final int MAX_CHILDREN = 64;
    private static final int NODE_PREFIX_BYTES = 4 + 1 + 1 + 2 + 8 + 8;

    private final int rank;
    private final int keyBytes;

    ChunkIndex(int rank) {
        this.rank = rank;
        this.keyBytes = 4 + 4 + 8 * (rank + 1);
    }

    /** Bytes of one node on disk. */
    int nodeBytes() {
        return NODE_PREFIX_BYTES + (MAX_CHILDREN + 1) * keyBytes + MAX_CHILDREN * 8;
    }

    /**
     * Encodes the index, nodes laid out from {@code base}; the root is the last node.
     *
     * @param offsets   element offsets of each chunk, in increasing (row-major) order, plus one entry past the last
     * @param sizes     stored bytes of each chunk
     * @param addresses file address of each chunk
     */
    byte[] encode(long base, long[][] offsets, int[] sizes, long[] addresses) {
        int n = sizes.length;
        LittleEndianBuffer out = new LittleEndianBuffer();
        // one level: each entry is a child (chunk or node) with its lower key index into offsets/sizes
        List<long[]> children = new ArrayList<>(); // {address, first key index, end key index}
        for (int i = 0; i < n; i++) {
            children.add(new long[] {addresses[i], i, i + 1});
        }
        int level = 0;
        long next = base;
        do {
            List<long[]> parents = new ArrayList<>();
            int nodes = (children.size() + MAX_CHILDREN - 1) / MAX_CHILDREN;
            for (int node = 0; node < nodes; node++) {
                int from = node * MAX_CHILDREN;
                int to = Math.min(children.size(), from + MAX_CHILDREN);
                long address = next;
                next += nodeBytes();
                int start = out.size();
                out.bytes(new byte[] {'T', 'R', 'E', 'E'}).u8(1).u8(level).u16(to - from);
                out.u64(node == 0 ? LittleEndianBuffer.UNDEFINED_ADDRESS : address - nodeBytes());
                out.u64(node == nodes - 1 ? LittleEndianBuffer.UNDEFINED_ADDRESS : address + nodeBytes());
                for (int c = from; c < to; c++) {
                    key(out, offsets, sizes, (int) children.get(c)[1]);
                    out.u64(children.get(c)[0]);
                }
                key(out, offsets, sizes, (int) children.get(to - 1)[2]);
                out.zeros(start + nodeBytes() - out.size());
                parents.add(new long[] {address, children.get(from)[1], children.get(to - 1)[2]});
            }
            children = parents;
            level++;
        } while (children.size() > 1);
        return out.toArray();
    }

    private void key(LittleEndianBuffer out, long[][] offsets, int[] sizes, int index) {
        // the key past the last chunk carries no chunk (size 0); internal nodes' keys carry their child's first
        out.u32(index < sizes.length ? sizes[index] : 0).u32(0);
        for (int d = 0; d < rank; d++) {
            out.u64(offsets[index][d]);
        }
        out.u64(0);
    }
}
