package org.linewright.grid.hdf5;

/** An HDF5 dataspace message, version 2 (HDF5 File Format Specification, "Dataspace Message"); fixed size. */
final class Dataspace {
    private Dataspace() {
    }

    /** A single element. */
    static byte[] scalar() {
        return new LittleEndianBuffer().u8(2).u8(0).u8(0).u8(0).toArray();
    }

    /** An array of the given dimension sizes (maximum sizes equal to them). */
    static byte[] simple(long... dims) {
        LittleEndianBuffer b = new LittleEndianBuffer().u8(2).u8(dims.length).u8(0).u8(1);
        for (long d : dims) {
            b.u64(d);
        }
        return b.toArray();
    }
}
