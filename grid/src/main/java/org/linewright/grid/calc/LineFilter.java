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
    /** Per store, the distinct wavenumbers of its lines, ascending: rows at other wavenumbers are not looked up. */
    private final List<double[]> wavenumbersByStore;
    private final long lines;

    /**
     * @param byStore per store (in the calculator's store order) the lines to take and how many copies of each
     */
    public LineFilter(List<Map<ByteBuffer, Integer>> byStore) {
        this.byStore = List.copyOf(byStore);
        List<double[]> nus = new java.util.ArrayList<>();
        for (Map<ByteBuffer, Integer> m : this.byStore) {
            java.util.TreeSet<Double> distinct = new java.util.TreeSet<>();
            for (ByteBuffer k : m.keySet()) {
                distinct.add(k.duplicate().order(ByteOrder.LITTLE_ENDIAN)
                        .getDouble(k.position() + NumericRowBytes.WAVENUMBER_OFFSET));
            }
            nus.add(distinct.stream().mapToDouble(Double::doubleValue).toArray());
        }
        this.wavenumbersByStore = List.copyOf(nus);
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
            double[] nus = wavenumbersByStore.get(store);
            double[] nu = batch.wavenumberCm1;
            int rowBytes = NumericRowBytes.ROW_BYTES;
            byte[] row = new byte[rowBytes];
            ByteBuffer rowBuffer = ByteBuffer.wrap(row).order(ByteOrder.LITTLE_ENDIAN);
            int[] kept = new int[n];
            int k = 0;
            // rows come in wavenumber order: one walk along the filter's wavenumbers finds the candidates
            int at = java.util.Arrays.binarySearch(nus, nu[0]);
            at = at < 0 ? -at - 1 : at;
            for (int i = 0; i < n; i++) {
                while (at < nus.length && nus[at] < nu[i]) {
                    at++;
                }
                if (at == nus.length || nus[at] != nu[i]) {
                    continue;
                }
                NumericRowBytes.serializeRow(batch, i, rowBuffer, 0);
                ByteBuffer key = ByteBuffer.wrap(row); // for the look-up only
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
