package org.linewright.grid.hdf5;

import java.util.Arrays;
import java.util.zip.Deflater;

/**
 * Lossless chunk filters: HDF5's byte shuffle (filter 2) followed by deflate (filter 1, a zlib stream, which
 * {@link Deflater} writes), or nothing.
 *
 * @param shuffle      whether bytes are shuffled (byte j of every element together) before deflate
 * @param deflateLevel zlib level 1–9, or 0 for no compression at all
 */
public record Compression(boolean shuffle, int deflateLevel) {
    /** Shuffle and deflate level 4: most of the gain of higher levels at a fraction of the time (common practice). */
    public static final Compression DEFAULT = new Compression(true, 4);
    /** Stored as is. */
    public static final Compression NONE = new Compression(false, 0);
    private static final int FILTER_DEFLATE = 1;
    private static final int FILTER_SHUFFLE = 2;

    public Compression {
        if (deflateLevel < 0 || deflateLevel > 9) {
            throw new IllegalArgumentException("deflate level " + deflateLevel + " is not 0..9");
        }
        if (shuffle && deflateLevel == 0) {
            throw new IllegalArgumentException("shuffle without deflate gains nothing");
        }
    }

    boolean filters() {
        return deflateLevel > 0;
    }

    /** The filter pipeline message, version 2 (HDF5 File Format Specification, "Filter Pipeline Message"). */
    byte[] pipelineMessage(int elementBytes) {
        LittleEndianBuffer b = new LittleEndianBuffer().u8(2).u8(shuffle ? 2 : 1);
        if (shuffle) {
            // filter id, flags (1 = optional, as HDF5 marks shuffle), one client value: the element size
            b.u16(FILTER_SHUFFLE).u16(1).u16(1).u32(elementBytes);
        }
        b.u16(FILTER_DEFLATE).u16(0).u16(1).u32(deflateLevel);
        return b.toArray();
    }

    /** Applies the filters to one chunk; reuses buffers between calls (not thread-safe). */
    static final class Encoder implements AutoCloseable {
        private final Compression compression;
        private final int elementBytes;
        private final Deflater deflater;
        private byte[] shuffled = new byte[0];
        private byte[] out = new byte[0];
        private int length;

        Encoder(Compression compression, int elementBytes) {
            this.compression = compression;
            this.elementBytes = elementBytes;
            this.deflater = compression.filters() ? new Deflater(compression.deflateLevel()) : null;
        }

        /** Filters {@code raw[0, n)}; the result is {@link #bytes()}{@code [0, }{@link #length()}{@code )}. */
        void encode(byte[] raw, int n) {
            byte[] in = raw;
            if (compression.shuffle()) {
                if (shuffled.length < n) {
                    shuffled = new byte[n];
                }
                int count = n / elementBytes;
                for (int i = 0; i < count; i++) {
                    for (int j = 0; j < elementBytes; j++) {
                        shuffled[j * count + i] = raw[i * elementBytes + j];
                    }
                }
                in = shuffled;
            }
            if (deflater == null) {
                out = in;
                length = n;
                return;
            }
            deflater.reset();
            deflater.setInput(in, 0, n);
            deflater.finish();
            if (out.length < n + 64) {
                out = new byte[n + n / 1000 + 64];
            }
            length = 0;
            while (!deflater.finished()) {
                if (length == out.length) {
                    out = Arrays.copyOf(out, out.length * 2);
                }
                length += deflater.deflate(out, length, out.length - length);
            }
        }

        byte[] bytes() {
            return out;
        }

        int length() {
            return length;
        }

        @Override
        public void close() {
            if (deflater != null) {
                deflater.end();
            }
        }
    }
}
