package org.linewright.grid.table;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.linewright.broadening.wings.WingKernel;
import org.linewright.grid.calc.LineFilter;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.NumericRowBytes;
import org.linewright.ingest.store.LineCursor;
import org.linewright.ingest.store.LineQuery;
import org.linewright.ingest.store.LineStore;

/**
 * The lines that differ between two versions of a plan's stores: per store (in plan order), the multiset of
 * lines only in the old version (removed) and only in the new one (added), lines being known by their
 * {@link NumericRowBytes} — what σ depends on. Found in one merge pass over both versions in wavenumber order;
 * lines equal in both are skipped without being kept, so memory follows the changed lines alone.
 */
public final class LineDelta {
    private static final int BATCH_ROWS = 8192;

    private final List<Map<ByteBuffer, Integer>> removed;
    private final List<Map<ByteBuffer, Integer>> added;
    private final double[] removedCm1;
    private final double[] addedCm1;

    private LineDelta(List<Map<ByteBuffer, Integer>> removed, List<Map<ByteBuffer, Integer>> added,
                      double[] removedCm1, double[] addedCm1) {
        this.removed = removed;
        this.added = added;
        this.removedCm1 = removedCm1;
        this.addedCm1 = addedCm1;
        Arrays.sort(this.removedCm1);
        Arrays.sort(this.addedCm1);
    }

    /**
     * The difference between {@code oldStores} and {@code newStores} (the same number, paired in order) over the
     * lines {@code species} selects with centres in [{@code lowCm1}, {@code highCm1}], or null when more than
     * {@code maxChanged} lines differ (a rebuild then recomputes the blocks instead).
     */
    public static LineDelta between(List<LineStore> oldStores, List<LineStore> newStores, LineQuery species,
                                    double lowCm1, double highCm1, long maxChanged) throws IOException {
        if (oldStores.size() != newStores.size()) {
            throw new IllegalArgumentException(oldStores.size() + " old stores against " + newStores.size());
        }
        List<Map<ByteBuffer, Integer>> removed = new ArrayList<>();
        List<Map<ByteBuffer, Integer>> added = new ArrayList<>();
        List<Double> removedCm1 = new ArrayList<>();
        List<Double> addedCm1 = new ArrayList<>();
        LineQuery query = species.withWavenumberRange(lowCm1, Math.nextUp(highCm1))
                .withColumns(NumericRowBytes.COLUMNS);
        long changed = 0;
        for (int s = 0; s < oldStores.size(); s++) {
            Map<ByteBuffer, Integer> gone = new HashMap<>();
            Map<ByteBuffer, Integer> come = new HashMap<>();
            try (Rows a = new Rows(oldStores.get(s).cursor(query)); Rows b = new Rows(newStores.get(s).cursor(query))) {
                a.next();
                b.next();
                while (a.valid || b.valid) {
                    if (a.valid && b.valid && a.nu == b.nu && a.sameRow(b)) {
                        a.next();
                        b.next();
                        continue;
                    }
                    if (!b.valid || a.valid && a.nu < b.nu) {
                        put(gone, a.key(), removedCm1, a.nu);
                        a.next();
                    } else if (!a.valid || b.nu < a.nu) {
                        put(come, b.key(), addedCm1, b.nu);
                        b.next();
                    } else {
                        // the same wavenumber, other lines: the runs of that wavenumber as multisets
                        double nu = a.nu;
                        Map<ByteBuffer, Integer> run = new HashMap<>();
                        while (a.valid && a.nu == nu) {
                            run.merge(a.key(), 1, Integer::sum);
                            a.next();
                        }
                        while (b.valid && b.nu == nu) {
                            ByteBuffer k = b.key();
                            Integer c = run.get(k);
                            if (c == null) {
                                put(come, k, addedCm1, nu);
                            } else if (c == 1) {
                                run.remove(k);
                            } else {
                                run.put(k, c - 1);
                            }
                            b.next();
                        }
                        for (Map.Entry<ByteBuffer, Integer> e : run.entrySet()) {
                            for (int i = 0; i < e.getValue(); i++) {
                                put(gone, e.getKey(), removedCm1, nu);
                            }
                        }
                    }
                    if (removedCm1.size() + addedCm1.size() > maxChanged) {
                        return null;
                    }
                }
            }
            removed.add(gone);
            added.add(come);
            changed = removedCm1.size() + addedCm1.size();
        }
        return changed > maxChanged ? null : new LineDelta(removed, added, toArray(removedCm1), toArray(addedCm1));
    }

    /** The removed lines, per old store. */
    public LineFilter removed() {
        return new LineFilter(removed);
    }

    /** The added lines, per new store. */
    public LineFilter added() {
        return new LineFilter(added);
    }

    /** Removed lines with centres in [lowCm1, highCm1]. */
    public int removedIn(double lowCm1, double highCm1) {
        return count(removedCm1, lowCm1, highCm1);
    }

    /** Added lines with centres in [lowCm1, highCm1]. */
    public int addedIn(double lowCm1, double highCm1) {
        return count(addedCm1, lowCm1, highCm1);
    }

    /** All removed lines. */
    public int removedLines() {
        return removedCm1.length;
    }

    /** All added lines. */
    public int addedLines() {
        return addedCm1.length;
    }

    private static int count(double[] sorted, double lo, double hi) {
        int from = WingKernel.firstIndexAtOrAbove(sorted, 0, sorted.length, lo);
        return WingKernel.firstIndexAbove(sorted, from, sorted.length, hi) - from;
    }

    private static void put(Map<ByteBuffer, Integer> m, ByteBuffer key, List<Double> where, double nu) {
        m.merge(key, 1, Integer::sum);
        where.add(nu);
    }

    private static double[] toArray(List<Double> list) {
        double[] a = new double[list.size()];
        for (int i = 0; i < a.length; i++) {
            a[i] = list.get(i);
        }
        return a;
    }

    /** One store's lines in order, a row at a time, with their bytes. */
    private static final class Rows implements AutoCloseable {
        private final LineCursor cursor;
        private final LineBatch batch = new LineBatch(BATCH_ROWS);
        private byte[] rows = new byte[BATCH_ROWS * NumericRowBytes.ROW_BYTES];
        private int index = -1;
        boolean valid;
        double nu;

        Rows(LineCursor cursor) {
            this.cursor = cursor;
        }

        void next() throws IOException {
            index++;
            while (index >= batch.size) {
                if (!cursor.read(batch)) {
                    valid = false;
                    return;
                }
                if (rows.length < batch.size * NumericRowBytes.ROW_BYTES) {
                    rows = new byte[batch.size * NumericRowBytes.ROW_BYTES];
                }
                NumericRowBytes.serialize(batch, batch.size, ByteBuffer.wrap(rows).order(ByteOrder.LITTLE_ENDIAN));
                index = 0;
            }
            valid = true;
            nu = batch.wavenumberCm1[index];
        }

        boolean sameRow(Rows other) {
            int n = NumericRowBytes.ROW_BYTES;
            return Arrays.equals(rows, index * n, index * n + n, other.rows, other.index * n, other.index * n + n);
        }

        ByteBuffer key() {
            int n = NumericRowBytes.ROW_BYTES;
            return ByteBuffer.wrap(Arrays.copyOfRange(rows, index * n, index * n + n));
        }

        @Override
        public void close() throws IOException {
            cursor.close();
        }
    }
}
