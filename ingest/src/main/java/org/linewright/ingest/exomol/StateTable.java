package org.linewright.ingest.exomol;

import java.io.IOException;
import java.io.InputStream;
import java.util.Arrays;
import org.linewright.ingest.source.LineFormatException;
import org.linewright.ingest.source.ReadOptions;
import org.linewright.ingest.text.ByteLineScanner;
import org.linewright.ingest.text.DecimalParser;

/**
 * The states of a set in primitive arrays (no object per state), with their texts in one byte array:
 * per state the J field verbatim and the labels (every field after the numeric columns, joined by one blank).
 * Ids may be sparse and in any order: a direct table maps them to rows when they are dense enough, else a
 * sorted (id, row) array searched by bisection.
 */
final class StateTable {
    /** Direct id table when maxId ≤ DENSE_FACTOR × count + DENSE_SLACK (memory at most a few ints per state). */
    private static final int DENSE_FACTOR = 4;
    private static final int DENSE_SLACK = 1024;
    private static final int MAX_FIELDS = 64;

    private int count;
    private long[] ids = new long[1024];
    double[] energyCm1 = new double[1024];
    double[] degeneracy = new double[1024];
    double[] j = new double[1024];
    /** Energy uncertainty in cm⁻¹, NaN when the set gives none. */
    double[] uncertaintyCm1 = new double[1024];
    /** texts of row r: [textStart[r], textStart[r] + jLength[r]) is J, then a blank and the labels up to textStart[r+1]. */
    private int[] textStart = new int[1025];
    private byte[] jLength = new byte[1024];
    private byte[] text = new byte[1 << 16];
    private long rejected;

    private int[] denseRows;
    /** sorted (id << 32 | row) when not dense. */
    private long[] sortedIdRows;

    int count() {
        return count;
    }

    long rejected() {
        return rejected;
    }

    /** Row of a state id, or −1 when the id is not in the table. */
    int rowOf(long id) {
        if (denseRows != null) {
            return id >= 0 && id < denseRows.length ? denseRows[(int) id] : -1;
        }
        int lo = 0;
        int hi = sortedIdRows.length - 1;
        while (lo <= hi) {
            int mid = (lo + hi) >>> 1;
            long midId = sortedIdRows[mid] >>> 32;
            if (midId < id) {
                lo = mid + 1;
            } else if (midId > id) {
                hi = mid - 1;
            } else {
                return (int) sortedIdRows[mid];
            }
        }
        return -1;
    }

    byte[] textBytes() {
        return text;
    }

    int jStart(int row) {
        return textStart[row];
    }

    int jLength(int row) {
        return jLength[row];
    }

    /** Start of the labels of {@code row} (equal to {@link #labelsEnd} when it has none). */
    int labelsStart(int row) {
        int s = textStart[row] + jLength[row];
        return s < textStart[row + 1] ? s + 1 : s;
    }

    int labelsEnd(int row) {
        return textStart[row + 1];
    }

    /**
     * Reads a states file: per line id, energy (cm⁻¹), total degeneracy, J, then the optional numeric columns the
     * definition announces, then labels.
     */
    static StateTable read(InputStream in, String fileName, ExomolDefinition definition, ReadOptions options)
            throws IOException {
        StateTable t = new StateTable();
        int optional = definition.optionalColumns();
        int[] start = new int[MAX_FIELDS];
        int[] end = new int[MAX_FIELDS];
        long maxId = -1;
        try (ByteLineScanner lines = new ByteLineScanner(in)) {
            while (lines.next()) {
                int n = lines.splitOnBlanks(start, end);
                if (n == 0) {
                    continue;
                }
                try {
                    long id = t.parseRow(fileName, lines, start, end, n, optional, definition.uncertainty());
                    maxId = Math.max(maxId, id);
                } catch (LineFormatException e) {
                    if (!options.lenient()) {
                        throw e;
                    }
                    t.rejected++;
                    options.rejects().reject(fileName, lines.lineNumber(), lines.lineText(), e.reason());
                }
            }
        }
        t.buildIndex(fileName, maxId, options);
        return t;
    }

    private long parseRow(String fileName, ByteLineScanner lines, int[] start, int[] end, int n, int optional,
                          boolean hasUncertainty) {
        byte[] b = lines.buffer();
        if (n < 4 + optional) {
            throw new LineFormatException(fileName, lines.lineNumber(), 0, 0, "fields", lines.lineText(),
                    (4 + optional) + " or more fields: id, energy (cm-1), degeneracy, J"
                            + (optional > 0 ? " and the " + optional + " optional columns the .def file announces" : ""));
        }
        if (n > MAX_FIELDS) {
            throw new LineFormatException(fileName, lines.lineNumber(), 0, 0, "fields", lines.lineText(),
                    "at most " + MAX_FIELDS + " fields");
        }
        long id = DecimalParser.parseInt(b, start[0], end[0]);
        if (id == DecimalParser.NOT_AN_INTEGER || id < 0 || id >= Integer.MAX_VALUE) {
            throw LineFormatException.atField(fileName, lines, start[0], end[0], "state id", "a non-negative integer below 2^31-1");
        }
        double energy = DecimalParser.parse(b, start[1], end[1]);
        if (Double.isNaN(energy) || Double.isInfinite(energy)) {
            throw LineFormatException.atField(fileName, lines, start[1], end[1], "energy", "a number in cm-1");
        }
        if (energy < 0) {
            throw LineFormatException.atField(fileName, lines, start[1], end[1], "energy", "a non-negative energy in cm-1");
        }
        double g = DecimalParser.parse(b, start[2], end[2]);
        if (!(g >= 0) || Double.isInfinite(g) || g != Math.rint(g)) {
            throw LineFormatException.atField(fileName, lines, start[2], end[2], "degeneracy", "a non-negative integer");
        }
        double jValue = DecimalParser.parse(b, start[3], end[3]);
        if (!(jValue >= 0) || Double.isInfinite(jValue) || jValue * 2 != Math.rint(jValue * 2)) {
            throw LineFormatException.atField(fileName, lines, start[3], end[3], "J", "an integer or half-integer J >= 0");
        }
        if (end[3] - start[3] > Byte.MAX_VALUE) {
            throw LineFormatException.atField(fileName, lines, start[3], end[3], "J", "at most 127 characters");
        }
        double unc = Double.NaN;
        if (hasUncertainty) {
            // the uncertainty, when announced, is the first optional column
            unc = DecimalParser.parse(b, start[4], end[4]);
            if (!(unc >= 0) || Double.isInfinite(unc)) {
                throw LineFormatException.atField(fileName, lines, start[4], end[4], "energy uncertainty",
                        "a non-negative number in cm-1");
            }
        }
        append(id, energy, g, jValue, unc, b, start, end, n, 4 + optional);
        return id;
    }

    private void append(long id, double energy, double g, double jValue, double unc, byte[] b,
                        int[] start, int[] end, int n, int firstLabel) {
        if (count == ids.length) {
            int cap = count * 2;
            ids = Arrays.copyOf(ids, cap);
            energyCm1 = Arrays.copyOf(energyCm1, cap);
            degeneracy = Arrays.copyOf(degeneracy, cap);
            j = Arrays.copyOf(j, cap);
            uncertaintyCm1 = Arrays.copyOf(uncertaintyCm1, cap);
            jLength = Arrays.copyOf(jLength, cap);
            textStart = Arrays.copyOf(textStart, cap + 1);
        }
        int pos = textStart[count];
        int needed = end[3] - start[3];
        for (int k = firstLabel; k < n; k++) {
            needed += 1 + end[k] - start[k];
        }
        if (pos + needed > text.length) {
            long grown = Math.max((long) pos + needed, 2L * text.length);
            if (grown > Integer.MAX_VALUE - 8) {
                throw new IllegalStateException("state labels exceed 2 GB");
            }
            text = Arrays.copyOf(text, (int) grown);
        }
        System.arraycopy(b, start[3], text, pos, end[3] - start[3]);
        pos += end[3] - start[3];
        for (int k = firstLabel; k < n; k++) {
            text[pos++] = ' ';
            System.arraycopy(b, start[k], text, pos, end[k] - start[k]);
            pos += end[k] - start[k];
        }
        ids[count] = id;
        energyCm1[count] = energy;
        degeneracy[count] = g;
        j[count] = jValue;
        uncertaintyCm1[count] = unc;
        jLength[count] = (byte) (end[3] - start[3]);
        textStart[count + 1] = pos;
        count++;
    }

    private void buildIndex(String fileName, long maxId, ReadOptions options) {
        if (count == 0) {
            throw LineFormatException.ofFile(fileName, "states file holds no states (expected lines 'id energy degeneracy J ...')", null);
        }
        if (maxId <= (long) DENSE_FACTOR * count + DENSE_SLACK) {
            denseRows = new int[(int) maxId + 1];
            Arrays.fill(denseRows, -1);
            for (int r = 0; r < count; r++) {
                int id = (int) ids[r];
                if (denseRows[id] >= 0) {
                    throw duplicate(fileName, id);
                }
                denseRows[id] = r;
            }
        } else {
            sortedIdRows = new long[count];
            for (int r = 0; r < count; r++) {
                sortedIdRows[r] = ids[r] << 32 | r;
            }
            Arrays.sort(sortedIdRows);
            for (int k = 1; k < count; k++) {
                if (sortedIdRows[k] >>> 32 == sortedIdRows[k - 1] >>> 32) {
                    throw duplicate(fileName, sortedIdRows[k] >>> 32);
                }
            }
        }
        ids = null; // no longer needed: the index holds them
    }

    private static LineFormatException duplicate(String fileName, long id) {
        return LineFormatException.ofFile(fileName, "state id " + id + " appears twice (expected unique ids)", null);
    }
}
