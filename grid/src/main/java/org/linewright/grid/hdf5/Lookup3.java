package org.linewright.grid.hdf5;

/**
 * The checksum of HDF5's version-2 metadata (superblock, object headers): Bob Jenkins' lookup3 {@code hashlittle}
 * with initial value 0, as the HDF5 File Format Specification (section "Checksums") prescribes.
 */
final class Lookup3 {
    private Lookup3() {
    }

    /** lookup3 hashlittle of {@code data[off, off + len)} with initial value 0. */
    static int hash(byte[] data, int off, int len) {
        int a = 0xdeadbeef + len;
        int b = a;
        int c = a;
        int k = off;
        while (len > 12) {
            a += word(data, k);
            b += word(data, k + 4);
            c += word(data, k + 8);
            a -= c; a ^= Integer.rotateLeft(c, 4); c += b;
            b -= a; b ^= Integer.rotateLeft(a, 6); a += c;
            c -= b; c ^= Integer.rotateLeft(b, 8); b += a;
            a -= c; a ^= Integer.rotateLeft(c, 16); c += b;
            b -= a; b ^= Integer.rotateLeft(a, 19); a += c;
            c -= b; c ^= Integer.rotateLeft(b, 4); b += a;
            len -= 12;
            k += 12;
        }
        if (len == 0) {
            return c;
        }
        // the last 1..12 bytes, zero-padded (hashlittle's byte-wise tail)
        byte[] tail = new byte[12];
        System.arraycopy(data, k, tail, 0, len);
        a += word(tail, 0);
        b += word(tail, 4);
        c += word(tail, 8);
        c ^= b; c -= Integer.rotateLeft(b, 14);
        a ^= c; a -= Integer.rotateLeft(c, 11);
        b ^= a; b -= Integer.rotateLeft(a, 25);
        c ^= b; c -= Integer.rotateLeft(b, 16);
        a ^= c; a -= Integer.rotateLeft(c, 4);
        b ^= a; b -= Integer.rotateLeft(a, 14);
        c ^= b; c -= Integer.rotateLeft(b, 24);
        return c;
    }

    private static int word(byte[] d, int i) {
        return (d[i] & 0xff) | (d[i + 1] & 0xff) << 8 | (d[i + 2] & 0xff) << 16 | (d[i + 3] & 0xff) << 24;
    }
}
