package org.linewright.ingest.store;

import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.line.TextColumn;

/**
 * One run of the external sort in memory: up to {@code capacity} lines of the stored columns only, the numeric
 * columns packed row by row (one {@code long} slot per column: ints widened, doubles as their raw bits) and the
 * text columns as {@link TextColumn}s. Packing by row is what makes the sorted write cheap: gathering a line in
 * sorted order touches the one or two cache lines of its row instead of one cache line per column.
 *
 * <p>Heap: {@code capacity × (8 × numeric columns + 8 + 4 + 4 + text bytes)}, the stored columns only (a
 * 262,144-line run of a 160-character source ≈ 60 MB).
 */
final class RunBuffer {
    /** Rows gathered at once into the scratch before they are spread into columns (scratch stays in L2 cache). */
    private static final int GATHER_BLOCK_ROWS = 1024;

    private final int capacity;
    private final LineColumn[] numeric;
    private final LineColumn[] text;
    /** Slots per row. */
    private final int width;
    private final long[] packed;
    private final double[] keys;
    private final TextColumn[] texts;
    private final long[] scratch;
    private final WavenumberOrder order;
    private int size;

    RunBuffer(int capacity, LineColumn[] columns) {
        this.capacity = capacity;
        List<LineColumn> num = new ArrayList<>();
        List<LineColumn> txt = new ArrayList<>();
        for (LineColumn c : columns) {
            (c.kind() == LineColumn.Kind.TEXT ? txt : num).add(c);
        }
        this.numeric = num.toArray(new LineColumn[0]);
        this.text = txt.toArray(new LineColumn[0]);
        this.width = numeric.length;
        if (!num.contains(LineColumn.WAVENUMBER)) {
            throw new IllegalArgumentException("a run must hold the wavenumber column");
        }
        this.packed = new long[Math.multiplyExact(capacity, width)];
        this.keys = new double[capacity];
        this.texts = new TextColumn[text.length];
        for (int t = 0; t < text.length; t++) {
            texts[t] = new TextColumn(capacity, 15);
        }
        this.scratch = new long[GATHER_BLOCK_ROWS * width];
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
        int take = Math.min(n, capacity - size);
        int w = width;
        for (int k = 0; k < w; k++) {
            LineColumn c = numeric[k];
            int at = size * w + k;
            switch (c.kind()) {
                case INT -> {
                    int[] s = c.ints(src);
                    for (int i = 0; i < take; i++, at += w) {
                        packed[at] = s[from + i];
                    }
                }
                case LONG -> {
                    long[] s = c.longs(src);
                    for (int i = 0; i < take; i++, at += w) {
                        packed[at] = s[from + i];
                    }
                }
                case DOUBLE -> {
                    double[] s = c.doubles(src);
                    for (int i = 0; i < take; i++, at += w) {
                        packed[at] = Double.doubleToRawLongBits(s[from + i]);
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
     * Writes the buffered lines in stable wavenumber order to {@code out}, one record batch per
     * {@code gather.capacity()} lines, then empties the buffer.
     */
    void writeSorted(ArrowLineFileWriter out, LineBatch gather) throws IOException {
        int n = size;
        int[] perm = order.permutation(keys, n);
        int w = width;
        for (int from = 0; from < n; from += gather.capacity()) {
            int m = Math.min(gather.capacity(), n - from);
            gather.clear();
            for (int b = 0; b < m; b += GATHER_BLOCK_ROWS) {
                int rows = Math.min(GATHER_BLOCK_ROWS, m - b);
                for (int i = 0; i < rows; i++) {
                    System.arraycopy(packed, perm[from + b + i] * w, scratch, i * w, w);
                }
                spread(scratch, rows, gather, b);
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

    /** Spreads {@code rows} packed rows of {@code block} into rows {@code [at, at+rows)} of the batch's columns. */
    private void spread(long[] block, int rows, LineBatch dst, int at) {
        spread(numeric, block, rows, dst, at);
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
        for (TextColumn t : texts) {
            t.clear();
        }
    }
}
