package org.linewright.grid.calc;

/** Told how far a cross-section computation has come; called on the computing thread after each chunk. */
@FunctionalInterface
public interface ProgressListener {

    /** A listener that ignores every report. */
    ProgressListener NONE = (linesRead, fractionDone) -> { };

    /**
     * @param linesRead    lines read from the stores so far
     * @param fractionDone fraction of the wavenumber range read, in [0, 1]
     */
    void progress(long linesRead, double fractionDone);
}
