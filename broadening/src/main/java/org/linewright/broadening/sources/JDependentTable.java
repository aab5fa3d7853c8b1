package org.linewright.broadening.sources;

import java.util.Arrays;

/**
 * A J''-dependent broadening table for one isotopologue and one background gas: γ(296 K) and n by the
 * lower-state J, as in the J-indexed broadening files of state-list databases (the file parser lives in the
 * ingest module; this class takes its arrays).
 *
 * <p>Lookup: the row with exactly the line's J''; for J'' beyond the last row the last row is used, below the
 * first row the first (the usual convention of such tables, whose last entry stands for all higher J); for a
 * J'' between two tabulated values (a gap) the row of the next lower J. NaN J'' gives NaN.
 */
public final class JDependentTable {
    private final double[] lowerJ;
    private final double[] widthCm1PerAtm;
    private final double[] exponent;

    /**
     * @param lowerJ J'' values, strictly increasing
     * @param widthCm1PerAtm γ at 296 K in cm⁻¹/atm per row
     * @param exponent n per row (NaN where the table has none)
     */
    public JDependentTable(double[] lowerJ, double[] widthCm1PerAtm, double[] exponent) {
        if (lowerJ.length == 0 || lowerJ.length != widthCm1PerAtm.length || lowerJ.length != exponent.length) {
            throw new IllegalArgumentException("table arrays must be non-empty and of equal length: "
                    + lowerJ.length + ", " + widthCm1PerAtm.length + ", " + exponent.length);
        }
        for (int i = 1; i < lowerJ.length; i++) {
            if (!(lowerJ[i] > lowerJ[i - 1])) {
                throw new IllegalArgumentException("J'' must increase strictly: " + lowerJ[i - 1] + " then "
                        + lowerJ[i] + " at row " + i);
            }
        }
        this.lowerJ = lowerJ.clone();
        this.widthCm1PerAtm = widthCm1PerAtm.clone();
        this.exponent = exponent.clone();
    }

    /** Row index serving {@code j}, or -1 for NaN. */
    private int row(double j) {
        if (Double.isNaN(j)) {
            return -1;
        }
        int i = Arrays.binarySearch(lowerJ, j);
        if (i >= 0) {
            return i;
        }
        int insertion = -i - 1;
        return insertion == 0 ? 0 : insertion - 1;
    }

    /** γ(296 K) in cm⁻¹/atm for a line of lower-state J {@code j}; NaN when j is NaN. */
    public double widthCm1PerAtm(double j) {
        int r = row(j);
        return r < 0 ? Double.NaN : widthCm1PerAtm[r];
    }

    /** n for a line of lower-state J {@code j}; NaN when j is NaN or the table has none. */
    public double exponent(double j) {
        int r = row(j);
        return r < 0 ? Double.NaN : exponent[r];
    }

    /** Number of rows. */
    public int size() {
        return lowerJ.length;
    }
}
