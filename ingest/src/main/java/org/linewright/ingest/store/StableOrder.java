package org.linewright.ingest.store;

/**
 * The stable ascending order of a key array: a permutation {@code p} with {@code keys[p[0]] <= keys[p[1]] <= ...}
 * and equal keys in their original order. Bottom-up merge sort on primitive index arrays (O(n log n), no
 * boxing); keys must not be NaN.
 */
final class StableOrder {
    private StableOrder() {
    }

    /** Returns the stable sorting permutation of {@code keys[0..n)}, reusing {@code scratch} arrays of length ≥ n. */
    static int[] permutation(double[] keys, int n, int[] a, int[] b) {
        for (int i = 0; i < n; i++) {
            a[i] = i;
        }
        // Already sorted (the common case for line lists): nothing to do.
        boolean sorted = true;
        for (int i = 1; i < n && sorted; i++) {
            sorted = keys[i - 1] <= keys[i];
        }
        if (sorted) {
            return a;
        }
        int[] src = a;
        int[] dst = b;
        for (int width = 1; width < n; width <<= 1) {
            for (int lo = 0; lo < n; lo += width << 1) {
                int mid = Math.min(lo + width, n);
                int hi = Math.min(lo + (width << 1), n);
                int i = lo;
                int j = mid;
                int k = lo;
                while (i < mid && j < hi) {
                    // Take from the right run only when strictly smaller: keeps ties in input order.
                    dst[k++] = keys[src[j]] < keys[src[i]] ? src[j++] : src[i++];
                }
                while (i < mid) {
                    dst[k++] = src[i++];
                }
                while (j < hi) {
                    dst[k++] = src[j++];
                }
            }
            int[] t = src;
            src = dst;
            dst = t;
        }
        return src;
    }
}
