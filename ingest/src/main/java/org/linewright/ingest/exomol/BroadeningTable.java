package org.linewright.ingest.exomol;

import java.io.IOException;
import java.io.InputStream;
import java.util.Arrays;
import org.linewright.ingest.source.LineFormatException;
import org.linewright.ingest.text.ByteLineScanner;
import org.linewright.ingest.text.DecimalParser;

/**
 * Lorentz half widths γ (cm⁻¹/atm at 296 K) and temperature exponents n, γ(T) = γ(296 K)·(296/T)ⁿ, of one
 * broadening gas as a function of the lower-state J″, read from a {@code .broad} file of a state/transition set.
 *
 * <p>Each non-blank line is {@code code γ n [J″]} (blank-separated). Codes understood (the two J″-only codes
 * of the format, common practice):
 * <ul>
 *   <li>{@code a0} without J″ — one γ, n for every line (the table's default);</li>
 *   <li>{@code a0} or {@code a1} with J″ — γ, n for lines whose lower state has that J″.</li>
 * </ul>
 * Rows that carry further quantum numbers (broadening that depends on more than J″) and other codes are
 * rejected with a {@link LineFormatException} rather than used in part.
 *
 * <p>Lookup ({@link #widthAt}, {@link #exponentAt}): the row of the exact J″; for J″ above the last tabulated
 * value the last row (common practice: widths are nearly constant at high J); otherwise the default, or NaN
 * when the file gives none.
 */
public final class BroadeningTable {
    private final String broadener;
    private final double defaultWidthCm1PerAtm;
    private final double defaultExponent;
    private final double[] lowerJ;
    private final double[] widthCm1PerAtm;
    private final double[] exponent;

    /**
     * @param broadener the broadening gas as named in the file name (e.g. {@code H2}, {@code He}, {@code air})
     * @param defaultWidthCm1PerAtm γ for J″ not covered by the rows, NaN for none
     * @param defaultExponent n for J″ not covered by the rows, NaN for none
     * @param lowerJ strictly increasing J″ values (copied)
     * @param widthCm1PerAtm γ per row (copied)
     * @param exponent n per row (copied)
     */
    public BroadeningTable(String broadener, double defaultWidthCm1PerAtm, double defaultExponent,
                           double[] lowerJ, double[] widthCm1PerAtm, double[] exponent) {
        if (lowerJ.length != widthCm1PerAtm.length || lowerJ.length != exponent.length) {
            throw new IllegalArgumentException("J, width and exponent arrays differ in length");
        }
        for (int i = 1; i < lowerJ.length; i++) {
            if (!(lowerJ[i] > lowerJ[i - 1])) {
                throw new IllegalArgumentException("J'' values must increase strictly");
            }
        }
        this.broadener = broadener;
        this.defaultWidthCm1PerAtm = defaultWidthCm1PerAtm;
        this.defaultExponent = defaultExponent;
        this.lowerJ = lowerJ.clone();
        this.widthCm1PerAtm = widthCm1PerAtm.clone();
        this.exponent = exponent.clone();
    }

    /** The broadening gas as named in the file name. */
    public String broadener() {
        return broadener;
    }

    public double defaultWidthCm1PerAtm() {
        return defaultWidthCm1PerAtm;
    }

    public double defaultExponent() {
        return defaultExponent;
    }

    /** The tabulated J″ values (a copy), increasing. */
    public double[] lowerJ() {
        return lowerJ.clone();
    }

    /** γ per tabulated J″ in cm⁻¹/atm at 296 K (a copy). */
    public double[] widthsCm1PerAtm() {
        return widthCm1PerAtm.clone();
    }

    /** n per tabulated J″ (a copy). */
    public double[] exponents() {
        return exponent.clone();
    }

    /** γ(296 K) in cm⁻¹/atm for a line with lower-state J″ (lookup rule in the class comment). */
    public double widthAt(double lowerJValue) {
        int row = rowOf(lowerJValue);
        return row >= 0 ? widthCm1PerAtm[row] : defaultWidthCm1PerAtm;
    }

    /** n for a line with lower-state J″ (lookup rule in the class comment). */
    public double exponentAt(double lowerJValue) {
        int row = rowOf(lowerJValue);
        return row >= 0 ? exponent[row] : defaultExponent;
    }

    private int rowOf(double j) {
        if (lowerJ.length == 0 || Double.isNaN(j)) {
            return -1;
        }
        int i = Arrays.binarySearch(lowerJ, j);
        if (i >= 0) {
            return i;
        }
        return j > lowerJ[lowerJ.length - 1] ? lowerJ.length - 1 : -1;
    }

    /**
     * Reads a {@code .broad} file (format in the class comment). J″ rows may come in any order; a repeated J″
     * or a repeated default is an error.
     */
    public static BroadeningTable read(InputStream in, String fileName, String broadener) throws IOException {
        double defaultWidth = Double.NaN;
        double defaultN = Double.NaN;
        double[] j = new double[256];
        double[] g = new double[256];
        double[] n = new double[256];
        long[] lineOf = new long[256];
        int rows = 0;
        try (ByteLineScanner lines = new ByteLineScanner(in)) {
            int[] start = new int[4];
            int[] end = new int[4];
            while (lines.next()) {
                byte[] b = lines.buffer();
                int count = lines.splitOnBlanks(start, end);
                if (count == 0 || b[start[0]] == '#') {
                    continue;
                }
                String code = new String(b, start[0], end[0] - start[0], java.nio.charset.StandardCharsets.ISO_8859_1);
                if (!code.equals("a0") && !code.equals("a1")) {
                    throw LineFormatException.atField(fileName, lines, start[0], end[0], "code",
                            "a0 or a1 (broadening by J'' only)");
                }
                if (count < 3) {
                    throw new LineFormatException(fileName, lines.lineNumber(), 0, 0, "gamma", lines.lineText(),
                            "fields: code, gamma (cm-1/atm), n [, J'']");
                }
                if (count > 4) {
                    throw new LineFormatException(fileName, lines.lineNumber(), 0, 0, "quantum numbers",
                            lines.lineText(), "at most one quantum number (J''); broadening by further quantum "
                            + "numbers is not supported");
                }
                double width = DecimalParser.parse(b, start[1], end[1]);
                if (!(width >= 0) || Double.isInfinite(width)) {
                    throw LineFormatException.atField(fileName, lines, start[1], end[1], "gamma",
                            "a non-negative number in cm-1/atm");
                }
                double exp = DecimalParser.parse(b, start[2], end[2]);
                if (Double.isNaN(exp) || Double.isInfinite(exp)) {
                    throw LineFormatException.atField(fileName, lines, start[2], end[2], "n", "a number");
                }
                if (count == 3) {
                    if (!code.equals("a0")) {
                        throw new LineFormatException(fileName, lines.lineNumber(), 0, 0, "J''", lines.lineText(),
                                "a J'' value after gamma and n for code " + code);
                    }
                    if (!Double.isNaN(defaultWidth)) {
                        throw new LineFormatException(fileName, lines.lineNumber(), 0, 0, "code", lines.lineText(),
                                "a single a0 row without J''");
                    }
                    defaultWidth = width;
                    defaultN = exp;
                    continue;
                }
                double jValue = DecimalParser.parse(b, start[3], end[3]);
                if (!(jValue >= 0) || Double.isInfinite(jValue) || jValue * 2 != Math.rint(jValue * 2)) {
                    throw LineFormatException.atField(fileName, lines, start[3], end[3], "J''",
                            "an integer or half-integer J'' >= 0");
                }
                if (rows == j.length) {
                    j = Arrays.copyOf(j, 2 * rows);
                    g = Arrays.copyOf(g, 2 * rows);
                    n = Arrays.copyOf(n, 2 * rows);
                    lineOf = Arrays.copyOf(lineOf, 2 * rows);
                }
                j[rows] = jValue;
                g[rows] = width;
                n[rows] = exp;
                lineOf[rows] = lines.lineNumber();
                rows++;
            }
        }
        if (rows == 0 && Double.isNaN(defaultWidth)) {
            throw LineFormatException.ofFile(fileName, "broadening file holds no rows (expected 'code gamma n [J'']')", null);
        }
        // sort rows by J'' (files are usually ordered, but need not be)
        Integer[] order = new Integer[rows];
        for (int i = 0; i < rows; i++) {
            order[i] = i;
        }
        final double[] jj = j;
        Arrays.sort(order, (x, y) -> Double.compare(jj[x], jj[y]));
        double[] sj = new double[rows];
        double[] sg = new double[rows];
        double[] sn = new double[rows];
        for (int i = 0; i < rows; i++) {
            int r = order[i];
            if (i > 0 && j[r] == sj[i - 1]) {
                throw new LineFormatException(fileName, lineOf[r], 0, 0, "J''", Double.toString(j[r]),
                        "each J'' once (also on line " + lineOf[order[i - 1]] + ")");
            }
            sj[i] = j[r];
            sg[i] = g[r];
            sn[i] = n[r];
        }
        return new BroadeningTable(broadener, defaultWidth, defaultN, sj, sg, sn);
    }
}
