package org.linewright.ingest.source;

/**
 * A reader that counts duplicate lines: lines kept although identical in molecule, isotopologue,
 * wavenumber and quantum labels to the line before (each reader documents its exact rule).
 */
public interface DuplicateCounter {
    /** Duplicate lines seen so far (all of them are also counted as kept). */
    long duplicatesSeen();
}
