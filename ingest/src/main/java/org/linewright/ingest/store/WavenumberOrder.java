package org.linewright.ingest.store;

/**
 * The stable ascending order of wavenumbers: a permutation {@code p} with {@code keys[p[0]] <= keys[p[1]] <= ...}
 * and equal keys in their original order (so {@code -0.0} and {@code 0.0} are equal, as {@code <=} has them).
 *
 * <p>Method: least-significant-digit radix sort (common practice) on the IEEE-754 bits of each key, mapped to an
 * unsigned integer of the same order (sign bit flipped for non-negative numbers, every bit flipped for negative
 * ones; {@code -0.0} first turned into {@code 0.0}). Six passes of 11 bits, one histogram pre-pass for all of them,
 * and a pass is skipped when every key has the same digit there. Each pass reads and writes the keys sequentially,
 * unlike a comparison sort of indices whose key look-ups jump around the array. LSD radix sort is stable, which
 * keeps ties in input order. Keys must not be NaN.
 */
final class WavenumberOrder {
    private static final int DIGIT_BITS = 11;
    private static final int BUCKETS = 1 << DIGIT_BITS;
    private static final int PASSES = (Long.SIZE + DIGIT_BITS - 1) / DIGIT_BITS;

    private final long[] keysA;
    private final long[] keysB;
    private final int[] orderA;
    private final int[] orderB;
    private final int[][] counts = new int[PASSES][BUCKETS];

    /** Scratch for sorting up to {@code capacity} keys, reused by every {@link #permutation} call. */
    WavenumberOrder(int capacity) {
        keysA = new long[capacity];
        keysB = new long[capacity];
        orderA = new int[capacity];
        orderB = new int[capacity];
    }

    /** The order-preserving unsigned image of a (non-NaN) double. */
    static long sortableBits(double key) {
        // + 0.0 turns -0.0 into 0.0 (IEEE-754 round to nearest) and leaves every other value as it is.
        long bits = Double.doubleToRawLongBits(key + 0.0);
        return bits ^ ((bits >> 63) | Long.MIN_VALUE);
    }

    /**
     * Returns the stable sorting permutation of {@code keys[0..n)}; the returned array is this object's scratch,
     * valid until the next call.
     */
    int[] permutation(double[] keys, int n) {
        long[] srcKeys = keysA;
        int[] srcOrder = orderA;
        for (int[] c : counts) {
            java.util.Arrays.fill(c, 0);
        }
        boolean sorted = true;
        long previous = Long.MIN_VALUE;
        for (int i = 0; i < n; i++) {
            long k = sortableBits(keys[i]);
            srcKeys[i] = k;
            srcOrder[i] = i;
            // Compared as unsigned numbers: the image maps the doubles' order onto unsigned order.
            sorted &= i == 0 || Long.compareUnsigned(previous, k) <= 0;
            previous = k;
            for (int p = 0; p < PASSES; p++) {
                counts[p][(int) (k >>> (p * DIGIT_BITS)) & (BUCKETS - 1)]++;
            }
        }
        if (sorted) {
            return srcOrder;
        }
        long[] dstKeys = keysB;
        int[] dstOrder = orderB;
        for (int p = 0; p < PASSES; p++) {
            int[] count = counts[p];
            int shift = p * DIGIT_BITS;
            // Every key has the same digit here: this pass would not move anything.
            if (count[(int) (srcKeys[0] >>> shift) & (BUCKETS - 1)] == n) {
                continue;
            }
            int sum = 0;
            for (int b = 0; b < BUCKETS; b++) {
                int c = count[b];
                count[b] = sum;
                sum += c;
            }
            for (int i = 0; i < n; i++) {
                long k = srcKeys[i];
                int at = count[(int) (k >>> shift) & (BUCKETS - 1)]++;
                dstKeys[at] = k;
                dstOrder[at] = srcOrder[i];
            }
            long[] tk = srcKeys;
            srcKeys = dstKeys;
            dstKeys = tk;
            int[] to = srcOrder;
            srcOrder = dstOrder;
            dstOrder = to;
        }
        return srcOrder;
    }
}
