package org.linewright.ingest.source;

import java.util.Arrays;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.TextColumn;

/**
 * Counts duplicate lines for a {@link DuplicateCounter}: a row is a duplicate when its molecule, isotopologue,
 * wavenumber (the same double) and its four quanta texts (upper/lower global and local, byte for byte) equal
 * those of the row offered before it. The row before may lie in an earlier batch: its texts are kept in one
 * reusable buffer (no allocation once the buffer has grown to the longest texts).
 */
public final class DuplicateTracker {
    private byte[] previousQuanta = new byte[64];
    /** Length of each previous text; -1 before the first row. */
    private final int[] previousLength = {-1, -1, -1, -1};
    /** Where the next text goes in {@link #previousQuanta}. */
    private int cursor;
    private int previousMolecule = -1;
    private int previousIsotopologue = -1;
    private long previousWavenumberBits;
    private long duplicates;

    /**
     * Compares row {@code row} of {@code batch} with the row offered before, then keeps it as the new previous row.
     *
     * @return true when the row is a duplicate (it is then counted)
     */
    public boolean offer(LineBatch batch, int row) {
        long bits = Double.doubleToRawLongBits(batch.wavenumberCm1[row]);
        boolean same = batch.moleculeId[row] == previousMolecule && batch.isotopologue[row] == previousIsotopologue
                && bits == previousWavenumberBits;
        int total = batch.upperGlobalQuanta.length(row) + batch.lowerGlobalQuanta.length(row)
                + batch.upperLocalQuanta.length(row) + batch.lowerLocalQuanta.length(row);
        if (previousQuanta.length < total) {
            previousQuanta = Arrays.copyOf(previousQuanta, Math.max(total, 2 * previousQuanta.length));
        }
        cursor = 0;
        // every text is kept, so no short-circuit here
        same &= keep(batch.upperGlobalQuanta, row, 0);
        same &= keep(batch.lowerGlobalQuanta, row, 1);
        same &= keep(batch.upperLocalQuanta, row, 2);
        same &= keep(batch.lowerLocalQuanta, row, 3);
        previousMolecule = batch.moleculeId[row];
        previousIsotopologue = batch.isotopologue[row];
        previousWavenumberBits = bits;
        if (same) {
            duplicates++;
        }
        return same;
    }

    /** Compares text {@code k} of the row with the previous row's at {@link #cursor}, then keeps it there. */
    private boolean keep(TextColumn c, int row, int k) {
        int len = c.length(row);
        int from = c.start(row);
        boolean equal = len == previousLength[k]
                && Arrays.equals(c.bytes(), from, from + len, previousQuanta, cursor, cursor + len);
        System.arraycopy(c.bytes(), from, previousQuanta, cursor, len);
        previousLength[k] = len;
        cursor += len;
        return equal;
    }

    /** Duplicates counted so far. */
    public long duplicates() {
        return duplicates;
    }
}
