package org.linewright.grid.hdf5;

import java.nio.charset.StandardCharsets;

/**
 * The bodies of the object header messages this package writes, each as the HDF5 File Format Specification lays
 * it out (section named beside each method).
 */
final class Messages {
    /** Space allocation time: incremental (chunks as they are written); fill value written only if set by user. */
    private static final int FILL_CHUNKED = 3 | 2 << 2;
    /** Space allocation time: late; fill value written only if set by user. */
    private static final int FILL_CONTIGUOUS = 2 | 2 << 2;

    private Messages() {
    }

    /** "Fill Value Message", version 3, the library's default fill (zero) for a chunked dataset. */
    static byte[] fillValueChunked() {
        return new byte[] {3, FILL_CHUNKED};
    }

    /** "Fill Value Message", version 3, the library's default fill (zero) for a contiguous dataset. */
    static byte[] fillValueContiguous() {
        return new byte[] {3, FILL_CONTIGUOUS};
    }

    /** "Data Layout Message", version 3, contiguous storage at {@code address} ({@code undefined} if none). */
    static byte[] contiguousLayout(long address, long bytes) {
        return new LittleEndianBuffer().u8(3).u8(1).u64(address).u64(bytes).toArray();
    }

    /** "Data Layout Message", version 3, chunked storage indexed by the version-1 B-tree at {@code btree}. */
    static byte[] chunkedLayout(long btree, int[] chunkShape, int elementBytes) {
        LittleEndianBuffer b = new LittleEndianBuffer().u8(3).u8(2).u8(chunkShape.length + 1).u64(btree);
        for (int c : chunkShape) {
            b.u32(c);
        }
        return b.u32(elementBytes).toArray();
    }

    /** "Link Info Message", version 0: links stored compactly in the header, creation order not tracked. */
    static byte[] linkInfo() {
        return new LittleEndianBuffer().u8(0).u8(0)
                .u64(LittleEndianBuffer.UNDEFINED_ADDRESS).u64(LittleEndianBuffer.UNDEFINED_ADDRESS).toArray();
    }

    /** "Group Info Message", version 0, default phase-change values. */
    static byte[] groupInfo() {
        return new byte[] {0, 0};
    }

    /** "Link Message", version 1: a hard link named {@code name} (UTF-8) to the object header at {@code address}. */
    static byte[] hardLink(String name, long address) {
        byte[] n = name.getBytes(StandardCharsets.UTF_8);
        LittleEndianBuffer b = new LittleEndianBuffer().u8(1);
        // flags bits 0-1: bytes of the name-length field; bit 4: character set field present
        if (n.length < 0x100) {
            b.u8(0x10).u8(1).u8(n.length);
        } else {
            b.u8(0x11).u8(1).u16(n.length);
        }
        return b.bytes(n).u64(address).toArray();
    }

    /** "Attribute Message", version 3, name in ASCII (character set 0) or else UTF-8 (1). */
    static byte[] attribute(String name, Datatype type, byte[] dataspace, byte[] data) {
        byte[] n = name.getBytes(StandardCharsets.UTF_8);
        int charset = n.length == name.length() ? 0 : 1;
        return new LittleEndianBuffer().u8(3).u8(0).u16(n.length + 1).u16(type.encoding().length)
                .u16(dataspace.length).u8(charset).bytes(n).u8(0).bytes(type.encoding()).bytes(dataspace).bytes(data)
                .toArray();
    }
}
