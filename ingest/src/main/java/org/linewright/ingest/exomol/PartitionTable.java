package org.linewright.ingest.exomol;

import java.io.IOException;
import java.io.InputStream;
import java.util.Arrays;
import org.linewright.ingest.source.LineFormatException;
import org.linewright.ingest.text.ByteLineScanner;
import org.linewright.ingest.text.DecimalParser;

/**
 * A tabulated total internal partition sum Q(T), as in the two-column {@code .pf} file of a state/transition
 * set (temperature in K, Q), with strictly increasing temperatures.
 */
public final class PartitionTable {
    private final double[] temperatureK;
    private final double[] partitionSum;

    /**
     * @param temperatureK strictly increasing temperatures in K (copied)
     * @param partitionSum Q at those temperatures, positive (copied)
     */
    public PartitionTable(double[] temperatureK, double[] partitionSum) {
        if (temperatureK.length != partitionSum.length || temperatureK.length == 0) {
            throw new IllegalArgumentException("need the same, non-zero number of temperatures and values");
        }
        this.temperatureK = temperatureK.clone();
        this.partitionSum = partitionSum.clone();
    }

    /** The temperatures in K (a copy). */
    public double[] temperaturesK() {
        return temperatureK.clone();
    }

    /** The partition sums at {@link #temperaturesK()} (a copy). */
    public double[] partitionSums() {
        return partitionSum.clone();
    }

    public double minTemperatureK() {
        return temperatureK[0];
    }

    public double maxTemperatureK() {
        return temperatureK[temperatureK.length - 1];
    }

    /**
     * Q(T) by linear interpolation between the two bracketing table rows (exact at tabulated temperatures;
     * the sets tabulate Q every 1 K, where linear interpolation errs by less than 10⁻⁵ relative for smooth Q).
     *
     * @return Q(T), or NaN outside [{@link #minTemperatureK()}, {@link #maxTemperatureK()}]
     */
    public double valueAt(double temperatureKValue) {
        int i = Arrays.binarySearch(temperatureK, temperatureKValue);
        if (i >= 0) {
            return partitionSum[i];
        }
        int upper = -i - 1;
        if (upper == 0 || upper == temperatureK.length) {
            return Double.NaN;
        }
        int lower = upper - 1;
        double w = (temperatureKValue - temperatureK[lower]) / (temperatureK[upper] - temperatureK[lower]);
        return partitionSum[lower] + w * (partitionSum[upper] - partitionSum[lower]);
    }

    /**
     * Reads a {@code .pf} table: per line a temperature in K and Q, separated by blanks; blank lines and
     * lines starting with {@code #} are skipped.
     *
     * @throws LineFormatException for a non-numeric field, a missing column, a non-positive Q or a temperature
     *                             not above the previous one, and for an empty table
     */
    public static PartitionTable read(InputStream in, String fileName) throws IOException {
        double[] t = new double[4096];
        double[] q = new double[4096];
        int n = 0;
        try (ByteLineScanner lines = new ByteLineScanner(in)) {
            int[] start = new int[3];
            int[] end = new int[3];
            while (lines.next()) {
                byte[] b = lines.buffer();
                int count = lines.splitOnBlanks(start, end);
                if (count == 0 || b[start[0]] == '#') {
                    continue;
                }
                if (count < 2) {
                    throw new LineFormatException(fileName, lines.lineNumber(), 0, 0, "Q", lines.lineText(),
                            "two fields: temperature in K and partition sum");
                }
                double temperature = DecimalParser.parse(b, start[0], end[0]);
                double value = DecimalParser.parse(b, start[1], end[1]);
                if (!(temperature >= 0) || Double.isInfinite(temperature)) {
                    throw LineFormatException.atField(fileName, lines, start[0], end[0], "temperature",
                            "a non-negative number in K");
                }
                if (!(value > 0) || Double.isInfinite(value)) {
                    throw LineFormatException.atField(fileName, lines, start[1], end[1], "Q", "a positive number");
                }
                if (n > 0 && temperature <= t[n - 1]) {
                    throw LineFormatException.atField(fileName, lines, start[0], end[0], "temperature",
                            "a temperature above the previous row's " + t[n - 1] + " K");
                }
                if (n == t.length) {
                    t = Arrays.copyOf(t, 2 * n);
                    q = Arrays.copyOf(q, 2 * n);
                }
                t[n] = temperature;
                q[n] = value;
                n++;
            }
        }
        if (n == 0) {
            throw LineFormatException.ofFile(fileName, "partition-function file holds no rows (expected lines 'T Q')", null);
        }
        return new PartitionTable(Arrays.copyOf(t, n), Arrays.copyOf(q, n));
    }
}
