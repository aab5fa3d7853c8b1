package org.linewright.grid.calc;

import org.linewright.ingest.line.LineBatch;

/**
 * One batch of one store after {@link LinePreparation}: the lines as read, the fate and S(T) of each, the lines
 * that reach σ (in stored order, ready for the merge) and the batch's own statistics, which
 * {@link CrossSectionStatistics#reduce} adds up in line order. Buffers are reused between computations (the
 * calculator keeps a pool); {@link #reset} clears a buffer's statistics before its next use.
 */
final class PreparedBatch {
    /** Line fates in a prepared batch. */
    static final byte BELOW_THRESHOLD = 0;
    static final byte WITHOUT_WIDTH = 1;
    static final byte USED = 2;

    final LineBatch lines;
    /** S(T) and fate of each row of {@link #lines} (after the range filter). */
    final double[] intensity;
    final byte[] fate;
    /** S(T)·(fraction of the profile lost to the wing treatment) of each used row. */
    final double[] lostIntensity;
    /** The used lines, in order: stored wavenumber (the merge key), shifted centre, S(T), widths, χ flag. */
    final double[] keyCm1;
    final double[] centerCm1;
    final double[] usedIntensity;
    final double[] usedDoppler;
    final double[] usedLorentz;
    final boolean[] usedChi;
    final boolean[] usedVanVleckWeisskopf;
    final double[] usedChiExempt;
    /** S(T)·(fraction of the profile at ν ≤ 0, where no grid reaches) of each used Voigt-shaped row. */
    final double[] negativeIntensity;
    int rowsRead;
    int rows;
    int count;
    long belowThreshold;
    long withoutWidth;
    long vanVleckWeisskopfLines;
    long vanVleckWeisskopfOutsideLimit;
    long chiOutsideValidity;
    /** This batch's smallest HWHM / spacing (first such line) and that line's widths and spacing. */
    double worstResolution;
    double worstHwhmCm1;
    double worstDopplerCm1;
    double worstSpacingCm1;
    /** The read or preparation failure of this batch, thrown when its turn comes. */
    Throwable failure;

    PreparedBatch(int capacity) {
        lines = new LineBatch(capacity);
        intensity = new double[capacity];
        fate = new byte[capacity];
        lostIntensity = new double[capacity];
        keyCm1 = new double[capacity];
        centerCm1 = new double[capacity];
        usedIntensity = new double[capacity];
        usedDoppler = new double[capacity];
        usedLorentz = new double[capacity];
        usedChi = new boolean[capacity];
        usedVanVleckWeisskopf = new boolean[capacity];
        usedChiExempt = new double[capacity];
        negativeIntensity = new double[capacity];
    }

    void reset() {
        rowsRead = 0;
        rows = 0;
        count = 0;
        belowThreshold = 0;
        withoutWidth = 0;
        vanVleckWeisskopfLines = 0;
        vanVleckWeisskopfOutsideLimit = 0;
        chiOutsideValidity = 0;
        worstResolution = Double.POSITIVE_INFINITY;
        worstHwhmCm1 = Double.NaN;
        worstDopplerCm1 = Double.NaN;
        worstSpacingCm1 = Double.NaN;
        failure = null;
    }
}
