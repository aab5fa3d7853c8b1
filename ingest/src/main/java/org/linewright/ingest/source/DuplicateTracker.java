package org.linewright.ingest.source;

import java.util.Arrays;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.TextColumn;

/**
 * The one definition of a duplicate line, used by the readers (a {@link DuplicateCounter}'s count) and by
 * {@code verify} alike: a row is a duplicate when an earlier row of the same run of consecutive rows with equal
 * wavenumber (the same double) has the same molecule, isotopologue and four quanta texts (upper/lower global and
 * local, byte for byte). In a list sorted by wavenumber that finds every repeated line; in an unsorted one, every
 * repeat that follows its original within the run of its wavenumber. Rows of earlier batches count: the keys of
 * the current wavenumber are kept in one reusable buffer (no allocation once it has grown to the largest run).
 */
public final class DuplicateTracker {
    private double wavenumberCm1 = Double.NaN;
    /** (molecule, isotopologue, four length-prefixed quanta texts) of each row of the current wavenumber. */
    private byte[] keys = new byte[1024];
    /** keys of row k of the run: [offsets[k], offsets[k+1]). */
    private int[] offsets = new int[17];
    private int count;
    private long duplicates;

    /**
     * Compares row {@code row} of {@code batch} with the earlier rows of its wavenumber, then keeps it among them.
     *
     * @return true when the row is a duplicate (it is then counted)
     */
    public boolean offer(LineBatch batch, int row) {
        double nu = batch.wavenumberCm1[row];
        // compared as bits so that equal doubles (and only they) share a run; NaN never equals NaN
        if (Double.doubleToRawLongBits(nu) != Double.doubleToRawLongBits(wavenumberCm1)) {
            wavenumberCm1 = nu;
            count = 0;
        }
        int start = offsets[count];
        int end = append(batch, row, start);
        for (int k = 0; k < count; k++) {
            if (Arrays.equals(keys, offsets[k], offsets[k + 1], keys, start, end)) {
                duplicates++;
                return true;
            }
        }
        if (count + 2 > offsets.length) {
            offsets = Arrays.copyOf(offsets, offsets.length * 2);
        }
        offsets[++count] = end;
        return false;
    }

    /** Duplicates counted so far. */
    public long duplicates() {
        return duplicates;
    }

    private int append(LineBatch b, int r, int at) {
        at = putInt(at, b.moleculeId[r]);
        at = putInt(at, b.isotopologue[r]);
        at = putText(at, b.upperGlobalQuanta, r);
        at = putText(at, b.lowerGlobalQuanta, r);
        at = putText(at, b.upperLocalQuanta, r);
        return putText(at, b.lowerLocalQuanta, r);
    }

    private int putInt(int at, int v) {
        ensure(at + 4);
        keys[at] = (byte) (v >>> 24);
        keys[at + 1] = (byte) (v >>> 16);
        keys[at + 2] = (byte) (v >>> 8);
        keys[at + 3] = (byte) v;
        return at + 4;
    }

    private int putText(int at, TextColumn column, int row) {
        int length = column.rows() > row ? column.length(row) : 0;
        at = putInt(at, length);
        ensure(at + length);
        if (length > 0) {
            System.arraycopy(column.bytes(), column.start(row), keys, at, length);
        }
        return at + length;
    }

    private void ensure(int size) {
        if (size > keys.length) {
            keys = Arrays.copyOf(keys, Math.max(size, keys.length * 2));
        }
    }
}
