package org.linewright.grid.hdf5;

/**
 * An HDF5 datatype message (HDF5 File Format Specification, "Datatype Message"), little-endian, version 1
 * except compounds (version 3, members packed without padding).
 *
 * @param encoding the message's bytes
 * @param size     bytes of one element in the file
 */
record Datatype(byte[] encoding, int size) {
    private static final int CLASS_FIXED_POINT = 0;
    private static final int CLASS_FLOATING_POINT = 1;
    private static final int CLASS_STRING = 3;
    private static final int CLASS_COMPOUND = 6;
    private static final int CLASS_REFERENCE = 7;
    private static final int CLASS_VARIABLE_LENGTH = 9;
    /** Bytes of a variable-length element: sequence length (4), global heap collection address (8), index (4). */
    static final int VLEN_ELEMENT_BYTES = 16;
    /** Bytes of an object reference: the object header's address. */
    static final int OBJECT_REFERENCE_BYTES = 8;

    private static LittleEndianBuffer header(int version, int typeClass, int bits0, int bits8, int bits16, int size) {
        return new LittleEndianBuffer().u8(version << 4 | typeClass).u8(bits0).u8(bits8).u8(bits16).u32(size);
    }

    /** IEEE 754 binary64, little-endian. */
    static Datatype float64() {
        // bit field: byte order LE, mantissa normalisation 2 (MSB implied), sign at bit 63
        byte[] e = header(1, CLASS_FLOATING_POINT, 0x20, 63, 0, 8)
                .u16(0).u16(64).u8(52).u8(11).u8(0).u8(52).u32(1023).toArray();
        return new Datatype(e, 8);
    }

    /** IEEE 754 binary32, little-endian. */
    static Datatype float32() {
        byte[] e = header(1, CLASS_FLOATING_POINT, 0x20, 31, 0, 4)
                .u16(0).u16(32).u8(23).u8(8).u8(0).u8(23).u32(127).toArray();
        return new Datatype(e, 4);
    }

    /** Signed 32-bit integer, little-endian. */
    static Datatype int32() {
        return new Datatype(header(1, CLASS_FIXED_POINT, 0x08, 0, 0, 4).u16(0).u16(32).toArray(), 4);
    }

    /** Unsigned 8-bit integer (the base type of variable-length strings). */
    static Datatype uint8() {
        return new Datatype(header(1, CLASS_FIXED_POINT, 0, 0, 0, 1).u16(0).u16(8).toArray(), 1);
    }

    /** Fixed-length ASCII string of {@code length} bytes, NUL-terminated. */
    static Datatype fixedString(int length) {
        return new Datatype(header(1, CLASS_STRING, 0, 0, 0, length).toArray(), length);
    }

    /** Variable-length UTF-8 string, NUL-terminated padding (data in the global heap). */
    static Datatype variableLengthUtf8String() {
        byte[] e = header(1, CLASS_VARIABLE_LENGTH, 1, 1, 0, VLEN_ELEMENT_BYTES).bytes(uint8().encoding).toArray();
        return new Datatype(e, VLEN_ELEMENT_BYTES);
    }

    /** Variable-length sequence of {@code base} elements (data in the global heap). */
    static Datatype variableLengthSequence(Datatype base) {
        byte[] e = header(1, CLASS_VARIABLE_LENGTH, 0, 0, 0, VLEN_ELEMENT_BYTES).bytes(base.encoding).toArray();
        return new Datatype(e, VLEN_ELEMENT_BYTES);
    }

    /** Object reference (the address of an object header). */
    static Datatype objectReference() {
        return new Datatype(header(1, CLASS_REFERENCE, 0, 0, 0, OBJECT_REFERENCE_BYTES).toArray(),
                OBJECT_REFERENCE_BYTES);
    }

    /**
     * Compound of two members at byte offsets 0 and {@code secondOffset}, of total {@code size} bytes (version 3:
     * names NUL-terminated without padding, offsets in the fewest bytes that hold {@code size}).
     */
    static Datatype compound(int size, String firstName, Datatype first, String secondName, int secondOffset,
                             Datatype second) {
        int offsetBytes = size < 0x100 ? 1 : size < 0x10000 ? 2 : size < 0x1000000 ? 3 : 4;
        LittleEndianBuffer b = header(3, CLASS_COMPOUND, 2, 0, 0, size);
        b.nulTerminated(firstName).unsigned(0, offsetBytes).bytes(first.encoding);
        b.nulTerminated(secondName).unsigned(secondOffset, offsetBytes).bytes(second.encoding);
        return new Datatype(b.toArray(), size);
    }
}
