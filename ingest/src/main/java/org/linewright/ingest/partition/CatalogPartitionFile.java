package org.linewright.ingest.partition;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.Map;
import org.linewright.ingest.source.LineFormatException;

/**
 * A catalog's partition functions, in linewright's documented format (see
 * {@code docs/formats-state-lists-and-catalogs.md}): one species per line, the species tag and then log10 Q at
 * the catalog's temperatures, whitespace-separated, {@code #} starting a comment. The temperatures are the
 * catalogs' standard ones, 300, 225, 150, 75, 37.5, 18.75 and 9.375 K in that order (Pickett et al., JQSRT 60
 * (1998) 883), unless a line {@code temperatures_K T1 T2 ...} before the species gives others (in any order,
 * e.g. 1000 500 300 225 ...); a species may list fewer values than there are temperatures (at least two), the
 * first ones. Each species becomes a {@link PartitionTable#logLog} table (interpolated in ln Q against ln T)
 * named {@code FILE tag N}.
 *
 * <p>The catalog's Q is that of its own intensities: the 300 K → 296 K conversion of its lines and Q(T) are
 * then consistent with them, including the catalog's nuclear-spin convention and whatever states it leaves out.
 */
public final class CatalogPartitionFile {
    /** The catalogs' standard temperatures in K, in the order of their tabulated log10 Q. */
    public static final double[] STANDARD_TEMPERATURES_K = {300.0, 225.0, 150.0, 75.0, 37.5, 18.75, 9.375};

    private CatalogPartitionFile() {
    }

    /** Reads a file: species tag → table. */
    public static Map<Integer, PartitionTable> read(Path file) throws IOException {
        try (InputStream in = Files.newInputStream(file)) {
            return read(in, file.getFileName().toString());
        }
    }

    /**
     * Reads a stream: species tag → table, in file order.
     *
     * @throws LineFormatException on a malformed line (file, line, field, text, expectation)
     */
    public static Map<Integer, PartitionTable> read(InputStream in, String fileName) throws IOException {
        BufferedReader reader = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8));
        double[] temperatures = STANDARD_TEMPERATURES_K;
        Map<Integer, PartitionTable> out = new LinkedHashMap<>();
        String line;
        long lineNumber = 0;
        while ((line = reader.readLine()) != null) {
            lineNumber++;
            int hash = line.indexOf('#');
            String data = (hash >= 0 ? line.substring(0, hash) : line).trim();
            if (data.isEmpty()) {
                continue;
            }
            String[] f = data.split("\\s+");
            if (f[0].equals("temperatures_K")) {
                if (!out.isEmpty()) {
                    throw new LineFormatException(fileName, lineNumber, 1, f[0].length(), "temperatures_K", line,
                            "the temperatures line before the first species");
                }
                temperatures = new double[f.length - 1];
                for (int i = 1; i < f.length; i++) {
                    temperatures[i - 1] = number(fileName, lineNumber, line, f[i], "temperature", "a temperature in K > 0");
                }
                if (temperatures.length < 2) {
                    throw new LineFormatException(fileName, lineNumber, 1, line.length(), "temperatures_K", line,
                            "at least two temperatures");
                }
                continue;
            }
            int tag;
            try {
                tag = Math.abs(Integer.parseInt(f[0]));
            } catch (NumberFormatException e) {
                throw new LineFormatException(fileName, lineNumber, 1, f[0].length(), "tag", f[0],
                        "a species tag (whole number) followed by log10 Q values");
            }
            int n = f.length - 1;
            if (n < 2 || n > temperatures.length) {
                throw new LineFormatException(fileName, lineNumber, 1, line.length(), "row", line,
                        "tag and 2 to " + temperatures.length + " log10 Q values (one per temperature "
                                + Arrays.toString(temperatures) + " K)");
            }
            double[] t = Arrays.copyOf(temperatures, n);
            double[] q = new double[n];
            for (int i = 0; i < n; i++) {
                String text = f[i + 1];
                double log10q;
                try {
                    log10q = Double.parseDouble(text);
                } catch (NumberFormatException e) {
                    throw new LineFormatException(fileName, lineNumber, 1, line.length(), "log10 Q", text, "a number");
                }
                q[i] = Math.pow(10.0, log10q);
            }
            // Tables need increasing temperatures: sort the pairs.
            Integer[] order = new Integer[n];
            for (int i = 0; i < n; i++) {
                order[i] = i;
            }
            Arrays.sort(order, (a, b) -> Double.compare(t[a], t[b]));
            double[] ts = new double[n];
            double[] qs = new double[n];
            for (int i = 0; i < n; i++) {
                ts[i] = t[order[i]];
                qs[i] = q[order[i]];
            }
            try {
                out.put(tag, PartitionTable.logLog(fileName + " tag " + tag, ts, qs));
            } catch (IllegalArgumentException e) {
                throw new LineFormatException(fileName, lineNumber, 1, line.length(), "row", line,
                        "distinct temperatures and finite log10 Q (" + e.getMessage() + ")");
            }
        }
        if (out.isEmpty()) {
            throw LineFormatException.ofFile(fileName, "no species found (expected lines: tag log10Q(300 K) log10Q(225 K) ...)", null);
        }
        return out;
    }

    private static double number(String file, long line, String text, String field, String name, String expected) {
        try {
            double v = Double.parseDouble(field);
            if (v > 0 && Double.isFinite(v)) {
                return v;
            }
        } catch (NumberFormatException e) {
            // reported below
        }
        throw new LineFormatException(file, line, 1, text.length(), name, field, expected);
    }
}
