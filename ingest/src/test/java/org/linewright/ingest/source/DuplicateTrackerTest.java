package org.linewright.ingest.source;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;
import org.linewright.ingest.line.LineBatch;

/**
 * The rule of {@link DuplicateCounter} (and of verify): equal molecule, isotopologue and four quanta texts as an
 * earlier row of the same run of equal wavenumbers.
 */
class DuplicateTrackerTest {

    private static void add(LineBatch b, int molecule, double nu, String... quanta) {
        int row = b.size;
        b.clearOptional(row);
        b.moleculeId[row] = molecule;
        b.isotopologue[row] = 1;
        b.wavenumberCm1[row] = nu;
        b.upperGlobalQuanta.append(quanta[0]);
        b.lowerGlobalQuanta.append(quanta[1]);
        b.upperLocalQuanta.append(quanta[2]);
        b.lowerLocalQuanta.append(quanta[3]);
        b.size++;
    }

    @Test
    void countsConsecutiveEqualRowsAcrossBatches() {
        DuplicateTracker t = new DuplicateTracker();
        LineBatch b = new LineBatch(8);
        add(b, 5, 3.845033, "v=0", "v=0", "J=1", "J=0");
        add(b, 5, 3.845033, "v=0", "v=0", "J=1", "J=0");
        // the same texts split differently between the columns are different quanta
        add(b, 5, 3.845033, "v=0v", "=0", "J=1", "J=0");
        add(b, 5, 3.845033, "v=0", "v=0", "J=1", "J=0");
        add(b, 6, 3.845033, "v=0", "v=0", "J=1", "J=0");
        add(b, 6, Math.nextUp(3.845033), "v=0", "v=0", "J=1", "J=0");
        assertFalse(t.offer(b, 0));
        assertTrue(t.offer(b, 1));
        assertFalse(t.offer(b, 2));
        assertTrue(t.offer(b, 3), "a repeat of row 0 with a different line between, at the same wavenumber");
        assertFalse(t.offer(b, 4));
        assertFalse(t.offer(b, 5));
        b.clear();
        add(b, 6, Math.nextUp(3.845033), "v=0", "v=0", "J=1", "J=0");
        add(b, 6, Math.nextUp(3.845033), "v=0", "v=0", "J=1", "J=0");
        assertTrue(t.offer(b, 0), "the previous row lies in the batch before");
        assertTrue(t.offer(b, 1));
        assertEquals(4, t.duplicates());
    }

    @Test
    void emptyQuantaAreEqualToo() {
        DuplicateTracker t = new DuplicateTracker();
        LineBatch b = new LineBatch(2);
        add(b, 5, 1.0, "", "", "", "");
        add(b, 5, 1.0, "", "", "", "");
        assertFalse(t.offer(b, 0));
        assertTrue(t.offer(b, 1));
    }
}
