package org.linewright.grid.hdf5;

/** Element type of a variable in the file (values are handed over as {@code double} and narrowed if float32). */
public enum ElementType {
    /** IEEE 754 binary32. */
    FLOAT32(4),
    /** IEEE 754 binary64. */
    FLOAT64(8);

    private final int bytes;

    ElementType(int bytes) {
        this.bytes = bytes;
    }

    /** Bytes of one element. */
    public int bytes() {
        return bytes;
    }

    Datatype datatype() {
        return this == FLOAT32 ? Datatype.float32() : Datatype.float64();
    }
}
