package org.linewright.ingest.line;

import java.nio.ByteBuffer;
import java.util.ArrayList;
import java.util.List;

/**
 * A line's identity for what σ depends on: its numeric columns ({@link LineColumn} kinds INT, LONG and DOUBLE, in
 * declaration order, little-endian) except the source line number, which says where the line stood in its file and
 * changes for every line after an insertion. Text columns (quantum labels, reference codes) do not affect σ and are
 * left out. Two lines with the same bytes contribute the same σ under the same parameters.
 */
public final class NumericRowBytes {
    /** The columns serialised, in order. */
    public static final List<LineColumn> COLUMNS = columns();
    /** Bytes per line (INT 4, LONG and DOUBLE 8). */
    public static final int ROW_BYTES = rowBytes();
    /** Where the wavenumber lies in a line's bytes. */
    public static final int WAVENUMBER_OFFSET = offsetOf(LineColumn.WAVENUMBER);

    private NumericRowBytes() {
    }

    /**
     * Writes rows 0..n−1 of {@code batch} one after the other into {@code out} (little-endian, at least
     * n·{@link #ROW_BYTES} bytes), column by column (one pass over each column array).
     */
    public static void serialize(LineBatch batch, int n, ByteBuffer out) {
        int offset = 0;
        for (LineColumn c : COLUMNS) {
            switch (c.kind()) {
                case INT -> {
                    int[] a = c.ints(batch);
                    for (int i = 0, at = offset; i < n; i++, at += ROW_BYTES) {
                        out.putInt(at, a[i]);
                    }
                    offset += Integer.BYTES;
                }
                case LONG -> {
                    long[] a = c.longs(batch);
                    for (int i = 0, at = offset; i < n; i++, at += ROW_BYTES) {
                        out.putLong(at, a[i]);
                    }
                    offset += Long.BYTES;
                }
                default -> {
                    double[] a = c.doubles(batch);
                    for (int i = 0, at = offset; i < n; i++, at += ROW_BYTES) {
                        out.putDouble(at, a[i]);
                    }
                    offset += Double.BYTES;
                }
            }
        }
    }

    /** Writes row {@code row} of {@code batch} at {@code at} of {@code out} (little-endian, {@link #ROW_BYTES}). */
    public static void serializeRow(LineBatch batch, int row, ByteBuffer out, int at) {
        int offset = at;
        for (LineColumn c : COLUMNS) {
            switch (c.kind()) {
                case INT -> {
                    out.putInt(offset, c.ints(batch)[row]);
                    offset += Integer.BYTES;
                }
                case LONG -> {
                    out.putLong(offset, c.longs(batch)[row]);
                    offset += Long.BYTES;
                }
                default -> {
                    out.putDouble(offset, c.doubles(batch)[row]);
                    offset += Double.BYTES;
                }
            }
        }
    }

    private static int offsetOf(LineColumn column) {
        int n = 0;
        for (LineColumn c : COLUMNS) {
            if (c == column) {
                return n;
            }
            n += c.kind() == LineColumn.Kind.INT ? Integer.BYTES : Long.BYTES;
        }
        throw new AssertionError(column);
    }

    private static List<LineColumn> columns() {
        List<LineColumn> out = new ArrayList<>();
        for (LineColumn c : LineColumn.values()) {
            if (c.kind() != LineColumn.Kind.TEXT && c != LineColumn.SOURCE_LINE) {
                out.add(c);
            }
        }
        return List.copyOf(out);
    }

    private static int rowBytes() {
        int n = 0;
        for (LineColumn c : COLUMNS) {
            n += c.kind() == LineColumn.Kind.INT ? Integer.BYTES : Long.BYTES;
        }
        return n;
    }
}
