package org.linewright.grid.hdf5;

/**
 * A version-2 object header (HDF5 File Format Specification, "Version 2 Object Header"): signature {@code OHDR},
 * one chunk holding every message, attribute phase-change values stored (so any number of attributes may stay
 * compact), lookup3 checksum.
 */
final class ObjectHeader {
    static final int DATASPACE = 0x01;
    static final int LINK_INFO = 0x02;
    static final int DATATYPE = 0x03;
    static final int FILL_VALUE = 0x05;
    static final int LINK = 0x06;
    static final int DATA_LAYOUT = 0x08;
    static final int GROUP_INFO = 0x0A;
    static final int FILTER_PIPELINE = 0x0B;
    static final int ATTRIBUTE = 0x0C;
    static final int ATTRIBUTE_INFO = 0x15;
    /** Message flag: the message's data never change. */
    static final int FLAG_CONSTANT = 0x01;
    private static final int MAX_MESSAGE_BYTES = 0xffff;

    private final LittleEndianBuffer messages = new LittleEndianBuffer();
    private int attributes;

    /** Appends one message. */
    ObjectHeader message(int type, int flags, byte[] data) {
        if (data.length > MAX_MESSAGE_BYTES) {
            throw new IllegalArgumentException("HDF5 header message of type " + type + " has " + data.length
                    + " bytes (at most " + MAX_MESSAGE_BYTES + ")");
        }
        messages.u8(type).u16(data.length).u8(flags).bytes(data);
        if (type == ATTRIBUTE) {
            attributes++;
        }
        return this;
    }

    /** The header's bytes. */
    byte[] toBytes() {
        // flags: chunk-0 size in 4 bytes (bits 0-1 = 2), attribute phase-change values stored (bit 4)
        LittleEndianBuffer b = new LittleEndianBuffer().bytes(new byte[] {'O', 'H', 'D', 'R'}).u8(2).u8(0x12);
        int maxCompact = Math.max(8, attributes);
        b.u16(maxCompact).u16(Math.min(6, maxCompact));
        // a version-2 header counts its attributes through an attribute info message (without one, the library
        // reports 0 attributes although it lists them): compact storage, no heap or index, order not tracked
        byte[] info = attributes == 0 ? new byte[0] : new LittleEndianBuffer().u8(ATTRIBUTE_INFO).u16(18).u8(0)
                .u8(0).u8(0).u64(LittleEndianBuffer.UNDEFINED_ADDRESS).u64(LittleEndianBuffer.UNDEFINED_ADDRESS)
                .toArray();
        b.u32(info.length + messages.size()).bytes(info).bytes(messages.toArray());
        byte[] body = b.toArray();
        return b.u32(Lookup3.hash(body, 0, body.length)).toArray();
    }
}
