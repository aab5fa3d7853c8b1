package org.linewright.ingest.line;

/**
 * The canonical line model: a batch of spectral lines held column by column in primitive arrays.
 *
 * <p>Readers fill a batch row by row ({@link #size} rows valid, at most {@link #capacity()}); the store
 * writes and reads whole batches; physics code loops over the arrays. A batch is reused: {@link #clear()}
 * resets it without allocating. Missing numeric values are {@code NaN}. Units are in the field names.
 * The full column list with store/CSV names is {@link LineColumn}.
 *
 * <p>Conventions (common practice of the 160-character line-list format):
 * <ul>
 *   <li>{@code moleculeId}/{@code isotopologue}: the molecule number and local isotopologue number of
 *       {@code org.linewright.ingest.registry}; isotopologue codes 0, A, B of the 160-character format are
 *       stored as 10, 11, 12.</li>
 *   <li>{@code intensityCmPerMolecule}: line intensity at {@link #REFERENCE_TEMPERATURE_K}, weighted by the
 *       isotopologue's natural abundance, in cm⁻¹/(molecule·cm⁻²).</li>
 *   <li>Widths are Lorentz half widths at half maximum at 296 K and 1 atm; exponents n in
 *       γ(T) = γ(296 K)·(296/T)ⁿ; shifts at 296 K per atm.</li>
 * </ul>
 */
public final class LineBatch {
    /** Temperature at which {@link #intensityCmPerMolecule} and the widths are given. */
    public static final double REFERENCE_TEMPERATURE_K = 296.0;

    private static final LineColumn[] COLUMNS = LineColumn.values();

    private final int capacity;
    /** Number of valid rows. */
    public int size;

    public final int[] moleculeId;
    public final int[] isotopologue;
    public final double[] wavenumberCm1;
    public final double[] intensityCmPerMolecule;
    public final double[] einsteinAS1;
    public final double[] airWidthCm1PerAtm;
    public final double[] selfWidthCm1PerAtm;
    public final double[] airWidthExponent;
    public final double[] airShiftCm1PerAtm;
    public final double[] lowerEnergyCm1;
    public final double[] upperDegeneracy;
    public final double[] lowerDegeneracy;
    /** Per-line foreign-broadener widths, indexed by {@link Broadener#ordinal()}. */
    public final double[][] foreignWidthCm1PerAtm;
    /** Per-line foreign-broadener temperature exponents, indexed by {@link Broadener#ordinal()}. */
    public final double[][] foreignWidthExponent;
    /** Per-line foreign-broadener pressure shifts, indexed by {@link Broadener#ordinal()}. */
    public final double[][] foreignShiftCm1PerAtm;
    /** Upper-state energy where the source gives it (state lists); else NaN. */
    public final double[] upperEnergyCm1;
    /** 1-σ uncertainty of the position where the source gives it as a number; else NaN. */
    public final double[] wavenumberUncertaintyCm1;
    /** Rotational quantum number J of the upper state, NaN when it cannot be read from the labels. */
    public final double[] upperJ;
    /** Rotational quantum number J of the lower state, NaN when it cannot be read from the labels. */
    public final double[] lowerJ;
    /** Upper-state K (Ka for asymmetric tops, K for symmetric tops), NaN when unknown or not applicable. */
    public final double[] upperK;
    /** 1-based line (record) number in the source file, for error reports and provenance. */
    public final long[] sourceLine;

    public final TextColumn upperGlobalQuanta;
    public final TextColumn lowerGlobalQuanta;
    public final TextColumn upperLocalQuanta;
    public final TextColumn lowerLocalQuanta;
    /** Uncertainty indices, verbatim (six digits in the 160-character format). */
    public final TextColumn uncertaintyCodes;
    /** Reference indices, verbatim (six pairs of digits in the 160-character format). */
    public final TextColumn referenceCodes;
    /** Line-mixing flag, verbatim (one character, possibly blank). */
    public final TextColumn lineMixingFlag;

    public LineBatch(int capacity) {
        if (capacity <= 0) {
            throw new IllegalArgumentException("capacity must be positive: " + capacity);
        }
        this.capacity = capacity;
        moleculeId = new int[capacity];
        isotopologue = new int[capacity];
        wavenumberCm1 = new double[capacity];
        intensityCmPerMolecule = new double[capacity];
        einsteinAS1 = new double[capacity];
        airWidthCm1PerAtm = new double[capacity];
        selfWidthCm1PerAtm = new double[capacity];
        airWidthExponent = new double[capacity];
        airShiftCm1PerAtm = new double[capacity];
        lowerEnergyCm1 = new double[capacity];
        upperDegeneracy = new double[capacity];
        lowerDegeneracy = new double[capacity];
        int nb = Broadener.values().length;
        foreignWidthCm1PerAtm = new double[nb][capacity];
        foreignWidthExponent = new double[nb][capacity];
        foreignShiftCm1PerAtm = new double[nb][capacity];
        upperEnergyCm1 = new double[capacity];
        wavenumberUncertaintyCm1 = new double[capacity];
        upperJ = new double[capacity];
        lowerJ = new double[capacity];
        upperK = new double[capacity];
        sourceLine = new long[capacity];
        upperGlobalQuanta = new TextColumn(capacity, 15);
        lowerGlobalQuanta = new TextColumn(capacity, 15);
        upperLocalQuanta = new TextColumn(capacity, 15);
        lowerLocalQuanta = new TextColumn(capacity, 15);
        uncertaintyCodes = new TextColumn(capacity, 6);
        referenceCodes = new TextColumn(capacity, 12);
        lineMixingFlag = new TextColumn(capacity, 1);
    }

    public int capacity() {
        return capacity;
    }

    public boolean isFull() {
        return size == capacity;
    }

    /** Empties the batch for reuse. Numeric arrays keep stale values; readers set every field of a row. */
    public void clear() {
        size = 0;
        upperGlobalQuanta.clear();
        lowerGlobalQuanta.clear();
        upperLocalQuanta.clear();
        lowerLocalQuanta.clear();
        uncertaintyCodes.clear();
        referenceCodes.clear();
        lineMixingFlag.clear();
    }

    /**
     * Sets every optional numeric field of every row to NaN (the foreign-broadener columns, upper energy, position
     * uncertainty, J and K): one sequential fill per column, for readers that clear a whole batch at once rather
     * than row by row.
     */
    public void clearOptional() {
        for (int b = 0; b < foreignWidthCm1PerAtm.length; b++) {
            java.util.Arrays.fill(foreignWidthCm1PerAtm[b], Double.NaN);
            java.util.Arrays.fill(foreignWidthExponent[b], Double.NaN);
            java.util.Arrays.fill(foreignShiftCm1PerAtm[b], Double.NaN);
        }
        java.util.Arrays.fill(upperEnergyCm1, Double.NaN);
        java.util.Arrays.fill(wavenumberUncertaintyCm1, Double.NaN);
        java.util.Arrays.fill(upperJ, Double.NaN);
        java.util.Arrays.fill(lowerJ, Double.NaN);
        java.util.Arrays.fill(upperK, Double.NaN);
    }

    /**
     * Sets every optional numeric field of row {@code row} to NaN (the foreign-broadener columns, upper
     * energy, position uncertainty, J and K). Readers call it before filling what their format carries.
     */
    public void clearOptional(int row) {
        for (int b = 0; b < foreignWidthCm1PerAtm.length; b++) {
            foreignWidthCm1PerAtm[b][row] = Double.NaN;
            foreignWidthExponent[b][row] = Double.NaN;
            foreignShiftCm1PerAtm[b][row] = Double.NaN;
        }
        upperEnergyCm1[row] = Double.NaN;
        wavenumberUncertaintyCm1[row] = Double.NaN;
        upperJ[row] = Double.NaN;
        lowerJ[row] = Double.NaN;
        upperK[row] = Double.NaN;
    }

    /**
     * Copies rows {@code [from, from+n)} of every column of {@code src} to rows {@code [to, to+n)} of this batch.
     * Text rows are appended, so {@code to} must equal the text columns' current row count.
     */
    public void copyRows(LineBatch src, int from, int to, int n) {
        for (LineColumn c : COLUMNS) {
            switch (c.kind()) {
                case INT -> System.arraycopy(c.ints(src), from, c.ints(this), to, n);
                case LONG -> System.arraycopy(c.longs(src), from, c.longs(this), to, n);
                case DOUBLE -> System.arraycopy(c.doubles(src), from, c.doubles(this), to, n);
                case TEXT -> c.text(this).appendRows(c.text(src), from, n);
                default -> throw new AssertionError(c);
            }
        }
    }

    /**
     * Copies rows {@code rows[from..from+n)} of {@code src}, in that order, to rows {@code [0, n)} of this batch
     * (which must be empty of text rows); does not set {@link #size}.
     */
    public void gatherRows(LineBatch src, int[] rows, int from, int n) {
        for (LineColumn c : COLUMNS) {
            switch (c.kind()) {
                case INT -> {
                    int[] s = c.ints(src);
                    int[] d = c.ints(this);
                    for (int i = 0; i < n; i++) {
                        d[i] = s[rows[from + i]];
                    }
                }
                case LONG -> {
                    long[] s = c.longs(src);
                    long[] d = c.longs(this);
                    for (int i = 0; i < n; i++) {
                        d[i] = s[rows[from + i]];
                    }
                }
                case DOUBLE -> {
                    double[] s = c.doubles(src);
                    double[] d = c.doubles(this);
                    for (int i = 0; i < n; i++) {
                        d[i] = s[rows[from + i]];
                    }
                }
                case TEXT -> {
                    TextColumn s = c.text(src);
                    TextColumn d = c.text(this);
                    for (int i = 0; i < n; i++) {
                        int r = rows[from + i];
                        d.append(s.bytes(), s.start(r), s.length(r));
                    }
                }
                default -> throw new AssertionError(c);
            }
        }
    }
}
