package org.linewright.reference.verify;

import java.io.IOException;

import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.store.LineStore;

/**
 * One check of {@link LineListVerifier}. The verifier calls {@link #prepare} once (a check that calibrates itself
 * from the list reads it there), then {@link #check} for every line in the store's (wavenumber) order, then
 * {@link #finish}.
 */
public interface LineCheck {
    /** Reads what the check needs to know about the whole list before the lines are checked (default: nothing). */
    default void prepare(LineStore store) throws IOException {
    }

    /** Checks row {@code row} of {@code batch}. */
    void check(LineBatch batch, int row, Findings findings);

    /** Reports what can only be said after the last line (default: nothing). */
    default void finish(Findings findings) {
    }
}
