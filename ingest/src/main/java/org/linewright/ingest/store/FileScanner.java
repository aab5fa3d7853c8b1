package org.linewright.ingest.store;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.util.Arrays;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.line.TextColumn;

/**
 * Walks the record batches of one store file in order, skipping those outside the query's wavenumber range
 * (per-batch ranges from the file metadata; binary search inside the batch), reading only the projected columns of
 * the rows in range (in slices of bounded size), and dropping lines outside the species selection. Holds the
 * current slice's selected rows in {@link #buf} at {@code [pos, buf.size)}.
 */
final class FileScanner implements AutoCloseable {
    final LineBatch buf;
    int pos;
    private final ArrowLineFile file;
    private final ArrowLineFile.BlockReader reader;
    private final LineQuery query;
    private final LineColumn[] numeric;
    private final LineColumn[] text;
    private final boolean[] keep;
    private final int[] textOffsets;
    private byte[] textBytes = new byte[1 << 16];
    private final double[] blockWavenumbers;
    /** The arrays of {@link #buf} behind {@link #numeric}, resolved once. */
    private final Object[] numericArrays;
    private int nextBlock;
    /** Rows of the current record batch still to load: [sliceFrom, blockEnd). */
    private int sliceFrom;
    private int blockEnd;
    private boolean exhausted;

    /**
     * @param sliceRows the most rows held at once (batches are read in slices of this size; bounds memory
     *                  when many files are merged)
     */
    FileScanner(ArrowLineFile file, LineQuery query, LineColumn[] numeric, LineColumn[] text, int sliceRows) throws IOException {
        this.file = file;
        this.query = query;
        this.numeric = numeric;
        this.text = text;
        this.blockWavenumbers = new double[Math.max(1, file.maxBlockRows)];
        int capacity = Math.max(1, Math.min(sliceRows, file.maxBlockRows));
        this.buf = new LineBatch(capacity);
        this.keep = new boolean[capacity];
        this.textOffsets = new int[capacity + 1];
        for (LineColumn c : LineColumn.values()) {
            // A double column the file lacks (an older layout) reads as missing values.
            if (c.kind() == LineColumn.Kind.DOUBLE && !file.has(c)) {
                Arrays.fill(c.doubles(buf), Double.NaN);
            }
        }
        this.numericArrays = new Object[numeric.length];
        for (int k = 0; k < numeric.length; k++) {
            LineColumn c = numeric[k];
            numericArrays[k] = switch (c.kind()) {
                case INT -> c.ints(buf);
                case LONG -> c.longs(buf);
                default -> c.doubles(buf);
            };
        }
        this.reader = file.new BlockReader();
    }

    /** Makes sure a row is available at {@link #pos}; false when the file has no more selected lines. */
    boolean ensure() throws IOException {
        while (pos >= buf.size) {
            if (exhausted || !loadNext()) {
                exhausted = true;
                return false;
            }
        }
        return true;
    }

    double key() {
        return buf.wavenumberCm1[pos];
    }

    private boolean loadNext() throws IOException {
        while (true) {
            if (sliceFrom >= blockEnd && !openNextBlock()) {
                return false;
            }
            int lo = sliceFrom;
            int hi = Math.min(blockEnd, lo + buf.capacity());
            sliceFrom = hi;
            int n = hi - lo;
            buf.clear();
            System.arraycopy(blockWavenumbers, lo, buf.wavenumberCm1, 0, n);
            for (LineColumn c : numeric) {
                switch (c.kind()) {
                    case INT -> reader.readInts(c, lo, hi, c.ints(buf), 0);
                    case LONG -> reader.readLongs(c, lo, hi, c.longs(buf), 0);
                    case DOUBLE -> {
                        if (c != LineColumn.WAVENUMBER) {
                            reader.readDoubles(c, lo, hi, c.doubles(buf), 0);
                        }
                    }
                    default -> throw new AssertionError(c);
                }
            }
            int kept = n;
            if (query.selectsSpecies()) {
                kept = select(n);
            }
            for (LineColumn c : text) {
                readText(c, lo, hi, n);
            }
            buf.size = kept;
            pos = 0;
            if (kept > 0) {
                return true;
            }
        }
    }

    /**
     * Opens the next record batch holding lines in the wavenumber range: reads its wavenumbers and sets the
     * row range {@code [sliceFrom, blockEnd)} in range. False when no batch is left.
     */
    private boolean openNextBlock() throws IOException {
        double qMin = query.minWavenumberCm1();
        double qMax = query.maxWavenumberCm1();
        while (nextBlock < file.blocks.size()) {
            int b = nextBlock++;
            if (file.blockMaxCm1[b] < qMin) {
                continue;
            }
            if (file.blockMinCm1[b] > qMax) {
                // The file is sorted: no later batch can be in range.
                nextBlock = file.blocks.size();
                return false;
            }
            int rows = reader.open(b);
            reader.readDoubles(LineColumn.WAVENUMBER, 0, rows, blockWavenumbers, 0);
            int lo = file.blockMinCm1[b] >= qMin ? 0 : firstAtLeast(blockWavenumbers, rows, qMin);
            int hi = file.blockMaxCm1[b] <= qMax ? rows : firstAbove(blockWavenumbers, rows, qMax);
            if (lo < hi) {
                sliceFrom = lo;
                blockEnd = hi;
                return true;
            }
        }
        return false;
    }

    /** Marks the rows passing the species selection and compacts the numeric columns; returns the count. */
    private int select(int n) {
        int[] mol = buf.moleculeId;
        int[] iso = buf.isotopologue;
        int m = 0;
        for (int i = 0; i < n; i++) {
            keep[i] = query.selects(mol[i], iso[i]);
            if (keep[i]) {
                if (m != i) {
                    moveRow(i, m);
                }
                m++;
            }
        }
        return m;
    }

    /** Copies numeric row {@code from} to row {@code to} in every column read. */
    private void moveRow(int from, int to) {
        for (int k = 0; k < numericArrays.length; k++) {
            Object a = numericArrays[k];
            if (a instanceof double[] d) {
                d[to] = d[from];
            } else if (a instanceof int[] v) {
                v[to] = v[from];
            } else {
                long[] l = (long[]) a;
                l[to] = l[from];
            }
        }
    }

    private void readText(LineColumn c, int lo, int hi, int n) throws IOException {
        reader.readTextOffsets(c, lo, hi, textOffsets);
        int from = textOffsets[0];
        int to = textOffsets[n];
        int length = to - from;
        if (textBytes.length < length) {
            textBytes = new byte[Math.max(length, textBytes.length * 2)];
        }
        ByteBuffer bytes = reader.readTextBytes(c, from, to);
        bytes.get(textBytes, 0, length);
        TextColumn column = c.text(buf);
        if (!query.selectsSpecies()) {
            column.appendRows(textBytes, 0, textOffsets, 0, n);
            return;
        }
        for (int i = 0; i < n; i++) {
            if (keep[i]) {
                column.append(textBytes, textOffsets[i] - from, textOffsets[i + 1] - textOffsets[i]);
            }
        }
    }

    /** First index with wn[i] >= x (wn sorted ascending). */
    static int firstAtLeast(double[] wn, int n, double x) {
        int lo = 0;
        int hi = n;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (wn[mid] < x) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    /** First index with wn[i] > x (wn sorted ascending). */
    static int firstAbove(double[] wn, int n, double x) {
        int lo = 0;
        int hi = n;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (wn[mid] <= x) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    @Override
    public void close() throws IOException {
        reader.close();
    }
}
