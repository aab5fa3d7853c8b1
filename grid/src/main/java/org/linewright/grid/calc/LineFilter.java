package org.linewright.grid.calc;

import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.NumericRowBytes;

/**
 * A chosen multiset of lines per store, by their {@link NumericRowBytes}: a computation given a filter sums only
 * those lines (as many copies of a line as the multiset holds, the first ones read), with everything else about it
 * — preparation, widths, engine — as without the filter. Immutable; each computation takes its own
 * {@link #start() selection}.
 */
public final class LineFilter {
    private final List<Map<ByteBuffer, Integer>> byStore;
    private final long lines;

    /**
     * @param byStore per store (in the calculator's store order) the lines to take and how many copies of each
     */
    public LineFilter(List<Map<ByteBuffer, Integer>> byStore) {
        this.byStore = List.copyOf(byStore);
        long n = 0;
        for (Map<ByteBuffer, Integer> m : this.byStore) {
            for (int c : m.values()) {
                n += c;
            }
        }
        this.lines = n;
    }

    /** Lines the filter takes, summed over the stores. */
    public long lines() {
        return lines;
    }

    /** The selection state of one computation. */
    Selection start() {
        return new Selection();
    }

    /** What is left to take, per store, during one computation. */
    final class Selection {
        private final Map<Integer, Map<ByteBuffer, Integer>> left = new HashMap<>();

        /**
         * Keeps, in order, the rows of {@code batch} (read from store {@code store}) the filter still takes, moving
         * them to the front via {@code scratch}; returns the batch's new size.
         */
        int keep(int store, LineBatch batch, LineBatch scratch) {
            Map<ByteBuffer, Integer> wanted = left.computeIfAbsent(store,
                    s -> s < byStore.size() ? new HashMap<>(byStore.get(s)) : new HashMap<>());
            int n = batch.size;
            if (wanted.isEmpty() || n == 0) {
                return 0;
            }
            int rowBytes = NumericRowBytes.ROW_BYTES;
            byte[] rows = new byte[n * rowBytes];
            NumericRowBytes.serialize(batch, n, ByteBuffer.wrap(rows).order(ByteOrder.LITTLE_ENDIAN));
            int[] kept = new int[n];
            int k = 0;
            for (int i = 0; i < n; i++) {
                ByteBuffer key = ByteBuffer.wrap(rows, i * rowBytes, rowBytes).slice();
                Integer c = wanted.get(key);
                if (c != null) {
                    if (c == 1) {
                        wanted.remove(key);
                    } else {
                        wanted.put(key, c - 1);
                    }
                    kept[k++] = i;
                }
            }
            if (k == n) {
                return n;
            }
            scratch.clear();
            scratch.copyRows(batch, 0, 0, n);
            scratch.size = n;
            batch.clear();
            batch.gatherRows(scratch, kept, 0, k);
            batch.size = k;
            return k;
        }
    }
}
