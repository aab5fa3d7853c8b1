package org.linewright.ingest.store;

import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.line.TextColumn;

/**
 * One run of the external sort in memory: up to {@code capacity} lines of the stored columns only, each numeric
 * column as one {@code long} array (ints widened, doubles as their raw bits) and the text columns as
 * {@link TextColumn}s. Filling a run copies each column sequentially. The sorted write moves the numeric columns
 * into sorted order one whole column at a time: a column of a run (1 MB at 131,072 lines) stays in L2 cache while
 * it is gathered by the permutation, whereas gathering whole rows, or a column a few thousand rows at a time,
 * reads the run from main memory once per column and step.
 *
 * <p>Heap: {@code capacity × (8 × numeric columns + 8 + 4 + 4 + text bytes)} plus one column of scratch, the
 * stored columns only (a 131,072-line run of a 160-character source ≈ 30 MB).
 */
final class RunBuffer {
    private final int capacity;
    private final LineColumn[] numeric;
    private final LineColumn[] text;
    /** The numeric columns, one array each, in {@link #numeric} order. */
    private final long[][] columns;
    private final double[] keys;
    private final TextColumn[] texts;
    /** One column in sorted order, before it is copied back over its column. */
    private final long[] sortedColumn;
    private final WavenumberOrder order;
    private int size;
    /** Once sorted: the sorting permutation (sorted position to buffered row), else null. */
    private int[] perm;

    RunBuffer(int capacity, LineColumn[] columns) {
        this.capacity = capacity;
        List<LineColumn> num = new ArrayList<>();
        List<LineColumn> txt = new ArrayList<>();
        for (LineColumn c : columns) {
            (c.kind() == LineColumn.Kind.TEXT ? txt : num).add(c);
        }
        this.numeric = num.toArray(new LineColumn[0]);
        this.text = txt.toArray(new LineColumn[0]);
        if (!num.contains(LineColumn.WAVENUMBER)) {
            throw new IllegalArgumentException("a run must hold the wavenumber column");
        }
        this.columns = new long[numeric.length][capacity];
        this.keys = new double[capacity];
        this.texts = new TextColumn[text.length];
        for (int t = 0; t < text.length; t++) {
            texts[t] = new TextColumn(capacity, 15);
        }
        this.sortedColumn = new long[capacity];
        this.order = new WavenumberOrder(capacity);
    }

    int size() {
        return size;
    }

    boolean isFull() {
        return size == capacity;
    }

    /** Appends rows {@code [from, from+n)} of {@code src} (stored columns only); returns how many fitted. */
    int append(LineBatch src, int from, int n) {
        if (perm != null) {
            throw new IllegalStateException("run buffer already sorted");
        }
        int take = Math.min(n, capacity - size);
        for (int k = 0; k < numeric.length; k++) {
            LineColumn c = numeric[k];
            long[] d = columns[k];
            int at = size;
            switch (c.kind()) {
                case INT -> {
                    int[] s = c.ints(src);
                    for (int i = 0; i < take; i++) {
                        d[at + i] = s[from + i];
                    }
                }
                case LONG -> System.arraycopy(c.longs(src), from, d, at, take);
                case DOUBLE -> {
                    double[] s = c.doubles(src);
                    for (int i = 0; i < take; i++) {
                        d[at + i] = Double.doubleToRawLongBits(s[from + i]);
                    }
                }
                default -> throw new AssertionError(c);
            }
        }
        System.arraycopy(src.wavenumberCm1, from, keys, size, take);
        for (int t = 0; t < text.length; t++) {
            texts[t].appendRows(text[t].text(src), from, take);
        }
        size += take;
        return take;
    }

    /**
     * Puts the numeric columns in stable wavenumber order (the text columns are reordered as they are written) and
     * stops accepting lines until the buffer is written. Called by the thread that fills the buffer, so that the
     * thread that writes it has less to do; {@link #writeSorted} sorts if this was not called.
     */
    void sort() {
        if (perm != null) {
            return;
        }
        int n = size;
        int[] p = order.permutation(keys, n);
        long[] sorted = sortedColumn;
        for (long[] column : columns) {
            for (int i = 0; i < n; i++) {
                sorted[i] = column[p[i]];
            }
            System.arraycopy(sorted, 0, column, 0, n);
        }
        perm = p;
    }

    /**
     * Writes the buffered lines in stable wavenumber order to {@code out}, one record batch per
     * {@code gather.capacity()} lines, then empties the buffer.
     */
    void writeSorted(ArrowLineFileWriter out, LineBatch gather) throws IOException {
        sort();
        int n = size;
        int[] perm = this.perm;
        for (int from = 0; from < n; from += gather.capacity()) {
            int m = Math.min(gather.capacity(), n - from);
            gather.clear();
            for (int k = 0; k < numeric.length; k++) {
                LineColumn c = numeric[k];
                long[] s = columns[k];
                switch (c.kind()) {
                    case INT -> {
                        int[] d = c.ints(gather);
                        for (int i = 0; i < m; i++) {
                            d[i] = (int) s[from + i];
                        }
                    }
                    case LONG -> System.arraycopy(s, from, c.longs(gather), 0, m);
                    case DOUBLE -> {
                        double[] d = c.doubles(gather);
                        for (int i = 0; i < m; i++) {
                            d[i] = Double.longBitsToDouble(s[from + i]);
                        }
                    }
                    default -> throw new AssertionError(c);
                }
            }
            for (int t = 0; t < text.length; t++) {
                TextColumn s = texts[t];
                TextColumn d = text[t].text(gather);
                byte[] bytes = s.bytes();
                int[] offsets = s.offsets();
                for (int i = 0; i < m; i++) {
                    int r = perm[from + i];
                    d.append(bytes, offsets[r], offsets[r + 1] - offsets[r]);
                }
            }
            gather.size = m;
            out.write(gather);
        }
        clear();
    }

    /**
     * Spreads {@code rows} rows of {@code block}, packed with one slot per column of {@code numeric} in that order,
     * into rows {@code [at, at+rows)} of those columns of {@code dst}.
     */
    static void spread(LineColumn[] numeric, long[] block, int rows, LineBatch dst, int at) {
        int w = numeric.length;
        for (int k = 0; k < w; k++) {
            LineColumn c = numeric[k];
            switch (c.kind()) {
                case INT -> {
                    int[] d = c.ints(dst);
                    for (int i = 0, j = k; i < rows; i++, j += w) {
                        d[at + i] = (int) block[j];
                    }
                }
                case LONG -> {
                    long[] d = c.longs(dst);
                    for (int i = 0, j = k; i < rows; i++, j += w) {
                        d[at + i] = block[j];
                    }
                }
                case DOUBLE -> {
                    double[] d = c.doubles(dst);
                    for (int i = 0, j = k; i < rows; i++, j += w) {
                        d[at + i] = Double.longBitsToDouble(block[j]);
                    }
                }
                default -> throw new AssertionError(c);
            }
        }
    }

    /** Packs rows {@code [0, src.size)} of the {@code numeric} columns of {@code src} by row into {@code dst}. */
    static void pack(LineColumn[] numeric, LineBatch src, long[] dst) {
        int w = numeric.length;
        int n = src.size;
        for (int k = 0; k < w; k++) {
            LineColumn c = numeric[k];
            switch (c.kind()) {
                case INT -> {
                    int[] s = c.ints(src);
                    for (int i = 0, j = k; i < n; i++, j += w) {
                        dst[j] = s[i];
                    }
                }
                case LONG -> {
                    long[] s = c.longs(src);
                    for (int i = 0, j = k; i < n; i++, j += w) {
                        dst[j] = s[i];
                    }
                }
                case DOUBLE -> {
                    double[] s = c.doubles(src);
                    for (int i = 0, j = k; i < n; i++, j += w) {
                        dst[j] = Double.doubleToRawLongBits(s[i]);
                    }
                }
                default -> throw new AssertionError(c);
            }
        }
    }

    void clear() {
        size = 0;
        perm = null;
        for (TextColumn t : texts) {
            t.clear();
        }
    }
}
