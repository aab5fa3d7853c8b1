package org.linewright.grid.hdf5;

import java.util.ArrayList;
import java.util.List;

/**
 * One global heap collection (HDF5 File Format Specification, "Global Heap"): signature {@code GCOL}, version 1,
 * objects numbered from 1, each padded to 8 bytes, the remainder described by free-space object 0. Holds the data
 * of variable-length attributes.
 */
final class GlobalHeap {
    /** The smallest collection HDF5 itself writes. */
    private static final int MIN_COLLECTION_BYTES = 4096;
    private static final int HEADER_BYTES = 16;
    private static final int OBJECT_HEADER_BYTES = 16;

    private final long address;
    private final List<byte[]> objects = new ArrayList<>();

    /** A collection that will be written at {@code address}. */
    GlobalHeap(long address) {
        this.address = address;
    }

    /**
     * Adds an object and returns the 16-byte variable-length element that points to it: {@code count} (elements
     * of the sequence or bytes of the string), the collection's address, the object's index.
     */
    byte[] add(byte[] object, int count) {
        if (objects.size() == 0xfffe) {
            throw new IllegalStateException("more than 65534 variable-length values in one HDF5 file");
        }
        objects.add(object);
        return new LittleEndianBuffer().u32(count).u64(address).u32(objects.size()).toArray();
    }

    boolean isEmpty() {
        return objects.isEmpty();
    }

    byte[] toBytes() {
        LittleEndianBuffer b = new LittleEndianBuffer().bytes(new byte[] {'G', 'C', 'O', 'L'}).u8(1).zeros(3);
        int used = HEADER_BYTES;
        for (byte[] o : objects) {
            used += OBJECT_HEADER_BYTES + (o.length + 7) / 8 * 8;
        }
        // room for the free-space object, whose size counts its own header
        long size = Math.max(MIN_COLLECTION_BYTES, used + OBJECT_HEADER_BYTES);
        b.u64(size);
        int index = 1;
        for (byte[] o : objects) {
            b.u16(index++).u16(1).zeros(4).u64(o.length).bytes(o).padTo(8);
        }
        long free = size - b.size();
        b.u16(0).u16(0).zeros(4).u64(free);
        b.zeros((int) (size - b.size()));
        return b.toArray();
    }
}
