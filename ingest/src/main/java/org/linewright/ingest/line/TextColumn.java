package org.linewright.ingest.line;

import java.nio.charset.StandardCharsets;
import java.util.Arrays;

/**
 * A column of short texts (quantum labels, codes) stored as one byte array plus offsets, in the manner
 * of Arrow's variable-width vectors: no object per row. Rows are appended in order; {@link #clear()}
 * resets the column for reuse without releasing its arrays.
 */
public final class TextColumn {
    private byte[] data;
    private int[] offsets;
    private int rows;

    public TextColumn(int capacityRows, int expectedBytesPerRow) {
        this.data = new byte[Math.max(16, capacityRows * Math.max(1, expectedBytesPerRow))];
        this.offsets = new int[capacityRows + 1];
    }

    /** Appends the bytes {@code src[from, from+length)} as the next row (bytes are copied verbatim). */
    public void append(byte[] src, int from, int length) {
        ensureRows(rows + 1);
        int start = offsets[rows];
        ensureBytes(start + length);
        System.arraycopy(src, from, data, start, length);
        offsets[++rows] = start + length;
    }

    /** Appends a string as UTF-8 (a convenience for readers that are not on a hot path). */
    public void append(String text) {
        byte[] bytes = text.getBytes(StandardCharsets.UTF_8);
        append(bytes, 0, bytes.length);
    }

    /**
     * Appends {@code count} rows in one copy: row {@code fromRow} of a source laid out like this column
     * ({@code offsets} giving row boundaries) whose bytes begin at {@code bytes[bytesFrom]}.
     */
    public void appendRows(byte[] bytes, int bytesFrom, int[] offsets, int fromRow, int count) {
        ensureRows(rows + count);
        int base = offsets[fromRow];
        int length = offsets[fromRow + count] - base;
        int start = this.offsets[rows];
        ensureBytes(start + length);
        System.arraycopy(bytes, bytesFrom, data, start, length);
        int shift = start - base;
        for (int i = 1; i <= count; i++) {
            this.offsets[rows + i] = offsets[fromRow + i] + shift;
        }
        rows += count;
    }

    /** Appends rows {@code [fromRow, fromRow+count)} of another column in one copy. */
    public void appendRows(TextColumn src, int fromRow, int count) {
        appendRows(src.data, src.offsets[fromRow], src.offsets, fromRow, count);
    }

    /** Appends an empty value. */
    public void appendEmpty() {
        ensureRows(rows + 1);
        offsets[rows + 1] = offsets[rows];
        rows++;
    }

    /** Appends {@code count} empty values (one fill of the offsets). */
    public void appendEmpty(int count) {
        ensureRows(rows + count);
        Arrays.fill(offsets, rows + 1, rows + count + 1, offsets[rows]);
        rows += count;
    }

    public int rows() {
        return rows;
    }

    /** Start offset of {@code row} in {@link #bytes()}. */
    public int start(int row) {
        return offsets[row];
    }

    /** Length in bytes of {@code row}. */
    public int length(int row) {
        return offsets[row + 1] - offsets[row];
    }

    /** The backing bytes; valid in {@code [start(row), start(row)+length(row))}. */
    public byte[] bytes() {
        return data;
    }

    /** The backing offsets ({@code rows()+1} valid entries, first is 0). */
    public int[] offsets() {
        return offsets;
    }

    /** The row decoded as UTF-8 (allocates; for output and tests, not for hot paths). */
    public String get(int row) {
        return new String(data, offsets[row], length(row), StandardCharsets.UTF_8);
    }

    public void clear() {
        rows = 0;
        offsets[0] = 0;
    }

    private void ensureRows(int needed) {
        if (needed + 1 > offsets.length) {
            offsets = Arrays.copyOf(offsets, Math.max(needed + 1, offsets.length * 2));
        }
    }

    private void ensureBytes(int needed) {
        if (needed > data.length) {
            data = Arrays.copyOf(data, Math.max(needed, data.length * 2));
        }
    }
}
