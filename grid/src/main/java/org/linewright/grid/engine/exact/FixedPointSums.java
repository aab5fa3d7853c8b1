package org.linewright.grid.engine.exact;

import java.io.DataInputStream;
import java.io.DataOutputStream;
import java.io.IOException;

/**
 * Per-point sums kept exactly: each term is rounded once to a multiple of 2⁻¹⁵⁰ (≈ 7.0×10⁻⁴⁶ in the unit of the
 * terms, cm²/molecule for σ) and added to a 128-bit two's-complement integer per point. Integer addition is
 * associative, so a sum does not depend on the order of its terms, and removing a term (adding its negation)
 * gives back exactly the sum without it: σ after any sequence of line-list revisions is the same bits as σ summed
 * from scratch over the final list. Range: a term below 2⁻²⁴ ≈ 6×10⁻⁸ (one beyond it is refused), sums below 2⁻²³;
 * terms below half a quantum count as zero (far below any cross section a model uses). 16 bytes per point.
 */
public final class FixedPointSums {
    /** Bits below the unit: the quantum is 2^-FRACTION_BITS. */
    public static final int FRACTION_BITS = 150;
    /** Bytes per point of the stored form. */
    public static final int BYTES_PER_POINT = 16;
    /** Largest left shift of a 53-bit significand that keeps the term below 2¹²⁶ (headroom for sums). */
    private static final int MAX_SHIFT = 126 - 53;

    private final long[] high;
    private final long[] low;

    /** Sums of {@code points} points, all zero. */
    public FixedPointSums(int points) {
        this.high = new long[points];
        this.low = new long[points];
    }

    /** Points held. */
    public int size() {
        return low.length;
    }

    /** Sets every sum to zero on [from, to). */
    public void clear(int from, int to) {
        java.util.Arrays.fill(high, from, to, 0L);
        java.util.Arrays.fill(low, from, to, 0L);
    }

    /**
     * Adds {@code value} rounded to the nearest multiple of the quantum (ties away from zero) at {@code point}.
     *
     * @throws IllegalArgumentException for a non-finite value or one beyond the range
     */
    public void add(int point, double value) {
        if (value == 0) {
            return;
        }
        long bits = Double.doubleToRawLongBits(value);
        int biased = (int) ((bits >>> 52) & 0x7ff);
        if (biased == 0x7ff) {
            throw new IllegalArgumentException("sum term " + value + " is not finite");
        }
        if (biased == 0) {
            return; // subnormal: far below the quantum
        }
        long significand = (bits & 0xfffffffffffffL) | (1L << 52);
        int shift = biased - 1075 + FRACTION_BITS; // value = significand · 2^(shift − FRACTION_BITS)
        long hi;
        long lo;
        if (shift < 0) {
            if (shift < -54) {
                return;
            }
            lo = (significand + (1L << (-shift - 1))) >>> -shift;
            hi = 0;
        } else if (shift <= 10) {
            lo = significand << shift;
            hi = 0;
        } else if (shift <= MAX_SHIFT) {
            if (shift < 64) {
                lo = significand << shift;
                hi = significand >>> (64 - shift);
            } else {
                lo = 0;
                hi = significand << (shift - 64);
            }
        } else {
            throw new IllegalArgumentException("sum term " + value + " beyond the exact sums' range (2^-24)");
        }
        if (value < 0) {
            lo = -lo;
            hi = lo == 0 ? -hi : ~hi;
        }
        addRaw(point, hi, lo);
    }

    private void addRaw(int point, long hi, long lo) {
        long l = low[point];
        long sum = l + lo;
        high[point] += hi + (Long.compareUnsigned(sum, l) < 0 ? 1 : 0);
        low[point] = sum;
    }

    /** Adds {@code other}'s sums at every point (same size). */
    public void add(FixedPointSums other) {
        check(other);
        for (int k = 0; k < low.length; k++) {
            addRaw(k, other.high[k], other.low[k]);
        }
    }

    /** Subtracts {@code other}'s sums at every point (same size). */
    public void subtract(FixedPointSums other) {
        check(other);
        for (int k = 0; k < low.length; k++) {
            long lo = -other.low[k];
            long hi = lo == 0 ? -other.high[k] : ~other.high[k];
            addRaw(k, hi, lo);
        }
    }

    /** The sum at {@code point} as a double (a fixed function of the exact sum, within 2 ulp of it). */
    public double value(int point) {
        long hi = high[point];
        long lo = low[point];
        boolean negative = hi < 0;
        if (negative) {
            lo = -lo;
            hi = lo == 0 ? -hi : ~hi;
        }
        double magnitude = hi == 0 ? unsigned(lo) : hi * 0x1.0p64 + unsigned(lo);
        double v = Math.scalb(magnitude, -FRACTION_BITS);
        return negative ? -v : v;
    }

    /** Writes every value into {@code out} (same size). */
    public void values(double[] out) {
        if (out.length != low.length) {
            throw new IllegalArgumentException("out has " + out.length + " points, the sums " + low.length);
        }
        for (int k = 0; k < low.length; k++) {
            out[k] = value(k);
        }
    }

    /** A copy. */
    public FixedPointSums copy() {
        FixedPointSums c = new FixedPointSums(low.length);
        System.arraycopy(high, 0, c.high, 0, low.length);
        System.arraycopy(low, 0, c.low, 0, low.length);
        return c;
    }

    /** Bitwise equality of every sum. */
    public boolean sameAs(FixedPointSums other) {
        return java.util.Arrays.equals(high, other.high) && java.util.Arrays.equals(low, other.low);
    }

    /** Writes the sums (point count, then per point the high and low 64 bits). */
    public void write(DataOutputStream out) throws IOException {
        out.writeInt(low.length);
        java.nio.ByteBuffer b = java.nio.ByteBuffer.allocate(BYTES_PER_POINT * low.length);
        for (int k = 0; k < low.length; k++) {
            b.putLong(high[k]).putLong(low[k]);
        }
        out.write(b.array());
    }

    /** Reads sums written by {@link #write}. */
    public static FixedPointSums read(DataInputStream in) throws IOException {
        int n = in.readInt();
        if (n < 0) {
            throw new IOException("negative point count " + n);
        }
        byte[] bytes = in.readNBytes(BYTES_PER_POINT * n);
        if (bytes.length != BYTES_PER_POINT * n) {
            throw new IOException("truncated sums: " + bytes.length + " of " + BYTES_PER_POINT * n + " bytes");
        }
        java.nio.ByteBuffer b = java.nio.ByteBuffer.wrap(bytes);
        FixedPointSums s = new FixedPointSums(n);
        for (int k = 0; k < n; k++) {
            s.high[k] = b.getLong();
            s.low[k] = b.getLong();
        }
        return s;
    }

    private static double unsigned(long v) {
        return v >= 0 ? v : (double) (v >>> 1) * 2.0 + (v & 1);
    }

    private void check(FixedPointSums other) {
        if (other.low.length != low.length) {
            throw new IllegalArgumentException("sums of " + other.low.length + " points, expected " + low.length);
        }
    }
}
