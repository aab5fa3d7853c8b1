package org.linewright.ingest.partition;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import org.linewright.ingest.InputException;
import org.linewright.ingest.source.LineFormatException;

/**
 * A tabulated partition sum Q(T): two whitespace-separated columns, temperature in K and Q, one point per
 * line, strictly increasing temperatures, {@code #} starting a comment. ExoMol {@code .pf} files have this
 * layout and are read the same way.
 *
 * <p>Interpolation (common practice for tabulated partition sums): 4-point Lagrange (cubic) interpolation in
 * T on the two points either side of T,
 * <pre>Q(T) = Σ_{k=0..3} Q_k Π_{j≠k} (T − T_j)/(T_k − T_j),</pre>
 * exact for polynomials of degree ≤ 3; in the first and last interval of the table (where a point is
 * missing on one side) and for two-point tables, linear interpolation. The value at a tabulated temperature
 * is the tabulated Q. Accuracy: the cubic's error is O(h⁴·Q⁗); for tables in 1 K steps (as in the ExoMol
 * files) it is far below the tables' own accuracy. Outside the table's range there is no extrapolation: an
 * {@link InputException} names the file and the range.
 */
public final class PartitionTable {
    private final String name;
    private final double[] temperatureK;
    private final double[] q;
    /** Interpolate ln Q linearly in ln T (sparse catalog tables) instead of the cubic in T. */
    private final boolean logLog;

    private PartitionTable(String name, double[] temperatureK, double[] q) {
        this(name, temperatureK, q, false);
    }

    private PartitionTable(String name, double[] temperatureK, double[] q, boolean logLog) {
        this.name = name;
        this.temperatureK = temperatureK;
        this.q = q;
        this.logLog = logLog;
    }

    /**
     * A sparse table interpolated linearly in ln Q against ln T, ln Q(T) = ln Q_j + (ln Q_{j+1} − ln Q_j)·
     * (ln T − ln T_j)/(ln T_{j+1} − ln T_j) — exact for a power law Q ∝ T^n, the form of a rotational partition
     * function (common practice for the few temperatures a catalog tabulates). Same checks as {@link #of}.
     */
    public static PartitionTable logLog(String name, double[] temperatureK, double[] q) {
        PartitionTable t = of(name, temperatureK, q);
        return new PartitionTable(t.name, t.temperatureK, t.q, true);
    }

    /** True for a table interpolated in ln Q against ln T ({@link #logLog}). */
    public boolean interpolatesLogLog() {
        return logLog;
    }

    /** A table from arrays (copied); temperatures strictly increasing, at least two points, Q positive. */
    public static PartitionTable of(String name, double[] temperatureK, double[] q) {
        if (temperatureK.length != q.length || temperatureK.length < 2) {
            throw new IllegalArgumentException(name + ": a partition table needs at least two (T, Q) points of equal count");
        }
        for (int i = 0; i < temperatureK.length; i++) {
            if (!(temperatureK[i] > 0) || Double.isInfinite(temperatureK[i]) || !(q[i] > 0) || Double.isInfinite(q[i])) {
                throw new IllegalArgumentException(name + ": point " + (i + 1) + " (" + temperatureK[i] + " K, " + q[i]
                        + ") must have positive finite T and Q");
            }
            if (i > 0 && !(temperatureK[i] > temperatureK[i - 1])) {
                throw new IllegalArgumentException(name + ": temperatures must increase strictly: " + temperatureK[i - 1]
                        + " K then " + temperatureK[i] + " K");
            }
        }
        return new PartitionTable(name, temperatureK.clone(), q.clone());
    }

    /** Reads a table file. */
    public static PartitionTable read(Path file) throws IOException {
        try (InputStream in = Files.newInputStream(file)) {
            return read(in, file.toString());
        }
    }

    /**
     * Reads a table from a stream.
     *
     * @param fileName the name used in error messages
     * @throws LineFormatException on a malformed line (file, line, columns, field, text, expectation)
     */
    public static PartitionTable read(InputStream in, String fileName) throws IOException {
        BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8));
        double[] t = new double[256];
        double[] v = new double[256];
        int n = 0;
        String line;
        long lineNumber = 0;
        while ((line = reader.readLine()) != null) {
            lineNumber++;
            int hash = line.indexOf('#');
            String data = hash >= 0 ? line.substring(0, hash) : line;
            int[] bounds = fields(data);
            if (bounds.length == 0) {
                continue;
            }
            if (bounds.length != 4) {
                int c0 = bounds.length > 4 ? bounds[4] + 1 : 1;
                throw new LineFormatException(fileName, lineNumber, c0, Math.max(c0, data.stripTrailing().length()), "row",
                        line, "two columns: temperature in K and partition sum");
            }
            double temperature = number(fileName, lineNumber, data, bounds[0], bounds[1], "temperature", "a temperature in K > 0");
            double value = number(fileName, lineNumber, data, bounds[2], bounds[3], "partition sum", "a partition sum > 0");
            if (n > 0 && !(temperature > t[n - 1])) {
                throw new LineFormatException(fileName, lineNumber, bounds[0] + 1, bounds[1], "temperature",
                        data.substring(bounds[0], bounds[1]), "a temperature above the previous line's " + t[n - 1] + " K");
            }
            if (n == t.length) {
                t = Arrays.copyOf(t, n * 2);
                v = Arrays.copyOf(v, n * 2);
            }
            t[n] = temperature;
            v[n] = value;
            n++;
        }
        if (n < 2) {
            throw LineFormatException.ofFile(fileName, "a partition table needs at least two (T, Q) lines, found " + n, null);
        }
        return new PartitionTable(fileName, Arrays.copyOf(t, n), Arrays.copyOf(v, n));
    }

    /** Start/end offsets of the whitespace-separated fields: [s0, e0, s1, e1, ...]. */
    private static int[] fields(String s) {
        int[] out = new int[8];
        int k = 0;
        int i = 0;
        int n = s.length();
        while (i < n) {
            while (i < n && Character.isWhitespace(s.charAt(i))) {
                i++;
            }
            if (i == n) {
                break;
            }
            int start = i;
            while (i < n && !Character.isWhitespace(s.charAt(i))) {
                i++;
            }
            if (k + 2 > out.length) {
                out = Arrays.copyOf(out, out.length * 2);
            }
            out[k++] = start;
            out[k++] = i;
        }
        return Arrays.copyOf(out, k);
    }

    private static double number(String file, long line, String data, int start, int end, String field, String expected) {
        String text = data.substring(start, end);
        double v;
        try {
            v = Double.parseDouble(text);
        } catch (NumberFormatException e) {
            throw new LineFormatException(file, line, start + 1, end, field, text, expected);
        }
        if (!(v > 0) || Double.isInfinite(v)) {
            throw new LineFormatException(file, line, start + 1, end, field, text, expected);
        }
        return v;
    }

    /** Where the table came from (file name). */
    public String name() {
        return name;
    }

    public double minTemperatureK() {
        return temperatureK[0];
    }

    public double maxTemperatureK() {
        return temperatureK[temperatureK.length - 1];
    }

    /** The tabulated temperatures in K (a copy). */
    public double[] temperaturesK() {
        return temperatureK.clone();
    }

    /** The tabulated partition sums (a copy). */
    public double[] partitionSums() {
        return q.clone();
    }

    /** Number of tabulated points. */
    public int size() {
        return q.length;
    }

    /**
     * Q at {@code temperatureK}, interpolated as described in the class documentation.
     *
     * @throws InputException when the temperature is outside the table's range
     */
    public double value(double temperatureK) {
        double[] t = this.temperatureK;
        int n = t.length;
        if (!(temperatureK >= t[0] && temperatureK <= t[n - 1])) {
            throw new InputException(name + ": partition sum asked at " + temperatureK + " K, outside the table's range "
                    + t[0] + "–" + t[n - 1] + " K (no extrapolation)");
        }
        int i = Arrays.binarySearch(t, temperatureK);
        if (i >= 0) {
            return q[i];
        }
        // Interval [t[j], t[j+1]] containing the temperature.
        int j = -i - 2;
        if (logLog) {
            double w = Math.log(temperatureK / t[j]) / Math.log(t[j + 1] / t[j]);
            return q[j] * Math.exp(w * Math.log(q[j + 1] / q[j]));
        }
        if (j == 0 || j == n - 2) {
            // First or last interval: one neighbour is missing, so interpolate linearly.
            double w = (temperatureK - t[j]) / (t[j + 1] - t[j]);
            return q[j] + w * (q[j + 1] - q[j]);
        }
        double x = temperatureK;
        double sum = 0;
        for (int k = j - 1; k <= j + 2; k++) {
            double basis = 1;
            for (int m = j - 1; m <= j + 2; m++) {
                if (m != k) {
                    basis *= (x - t[m]) / (t[k] - t[m]);
                }
            }
            sum += q[k] * basis;
        }
        return sum;
    }
}
