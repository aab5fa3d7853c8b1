package org.linewright.reference.verify;

import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.source.DuplicateTracker;

/**
 * The same line twice — species, wavenumber and all four quantum labels equal — is an error (it would be counted
 * twice in every cross section). The definition is the readers' ({@link DuplicateTracker}): the store is sorted by
 * wavenumber, so repeated lines are consecutive lines of equal wavenumber, found across batch boundaries with
 * memory bounded by the lines of one wavenumber.
 */
final class DuplicateLineCheck implements LineCheck {
    private final DuplicateTracker tracker = new DuplicateTracker();

    @Override
    public void check(LineBatch b, int r, Findings findings) {
        if (tracker.offer(b, r)) {
            findings.add(Check.DUPLICATE, Severity.ERROR, b, r, "quanta", Double.NaN, Double.NaN,
                    "the same line (species, wavenumber and quantum labels) occurs again");
        }
    }
}
