package org.linewright.grid.hdf5;

import java.nio.charset.StandardCharsets;
import java.util.Arrays;

/** A growable byte array written little-endian, HDF5's byte order for every field this package writes. */
final class LittleEndianBuffer {
    /** HDF5's undefined address (all bits set). */
    static final long UNDEFINED_ADDRESS = -1L;

    private byte[] bytes = new byte[64];
    private int size;

    LittleEndianBuffer u8(int v) {
        ensure(1);
        bytes[size++] = (byte) v;
        return this;
    }

    LittleEndianBuffer u16(int v) {
        if (v < 0 || v > 0xffff) {
            throw new IllegalArgumentException("HDF5 field of 2 bytes cannot hold " + v);
        }
        return u8(v).u8(v >>> 8);
    }

    LittleEndianBuffer u32(long v) {
        return u8((int) v).u8((int) (v >>> 8)).u8((int) (v >>> 16)).u8((int) (v >>> 24));
    }

    LittleEndianBuffer u64(long v) {
        return u32(v).u32(v >>> 32);
    }

    /** An unsigned value in {@code width} bytes (1, 2, 4 or 8). */
    LittleEndianBuffer unsigned(long v, int width) {
        for (int i = 0; i < width; i++) {
            u8((int) (v >>> (8 * i)));
        }
        return this;
    }

    LittleEndianBuffer bytes(byte[] b) {
        ensure(b.length);
        System.arraycopy(b, 0, bytes, size, b.length);
        size += b.length;
        return this;
    }

    /** {@code s} in ASCII/UTF-8 followed by one NUL. */
    LittleEndianBuffer nulTerminated(String s) {
        return bytes(s.getBytes(StandardCharsets.UTF_8)).u8(0);
    }

    LittleEndianBuffer zeros(int n) {
        ensure(n);
        size += n;
        return this;
    }

    /** Zeros up to the next multiple of {@code alignment} bytes. */
    LittleEndianBuffer padTo(int alignment) {
        return zeros((alignment - size % alignment) % alignment);
    }

    int size() {
        return size;
    }

    byte[] toArray() {
        return Arrays.copyOf(bytes, size);
    }

    private void ensure(int n) {
        if (size + n > bytes.length) {
            bytes = Arrays.copyOf(bytes, Math.max(bytes.length * 2, size + n));
        }
    }
}
