package org.linewright.reference.verify;

import java.util.Arrays;

import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.TextColumn;

/**
 * The same line twice — species, wavenumber and all four quantum labels equal — is an error (it would be counted
 * twice in every cross section). The store is sorted by wavenumber, so repeated lines are consecutive lines of
 * equal wavenumber; they are found across batch boundaries with memory bounded by the lines of one wavenumber.
 */
final class DuplicateLineCheck implements LineCheck {
    private final DuplicateWindow window = new DuplicateWindow();

    @Override
    public void check(LineBatch b, int r, Findings findings) {
        if (window.isDuplicate(b, r)) {
            findings.add(Check.DUPLICATE, Severity.ERROR, b, r, "quanta", Double.NaN, Double.NaN,
                    "the same line (species, wavenumber and quantum labels) occurs again");
        }
    }

    /**
     * Finds repeated lines among consecutive lines of equal wavenumber (the store is sorted by wavenumber), across
     * batch boundaries: the lines of the current wavenumber are kept as (species, four quantum labels) keys in a
     * reusable byte buffer.
     */
    private static final class DuplicateWindow {
        private double wavenumber = Double.NaN;
        private byte[] keys = new byte[1024];
        private int[] offsets = new int[17];
        private int count;

        boolean isDuplicate(LineBatch b, int r) {
            double nu = b.wavenumberCm1[r];
            if (nu != wavenumber) {
                wavenumber = nu;
                count = 0;
            }
            int start = offsets[count];
            int end = append(b, r, start);
            for (int k = 0; k < count; k++) {
                if (Arrays.equals(keys, offsets[k], offsets[k + 1], keys, start, end)) {
                    return true;
                }
            }
            if (count + 2 > offsets.length) {
                offsets = Arrays.copyOf(offsets, offsets.length * 2);
            }
            offsets[++count] = end;
            return false;
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

}
