package org.linewright.grid.manifest;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.List;
import org.linewright.ingest.line.Broadener;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.line.NumericRowBytes;
import org.linewright.ingest.store.LineCursor;
import org.linewright.ingest.store.LineQuery;
import org.linewright.ingest.store.LineStore;

/**
 * The content hash of the lines within reach of each block: SHA-256 over, for every store in order and every
 * line of it in the store's order whose centre lies in the block's reach, its {@link NumericRowBytes} (what σ
 * depends on), preceded by the store's position. Computed in one pass over
 * each store: lines arrive in wavenumber order, so the blocks a line reaches are a window that only moves
 * forward.
 */
public final class LineReachHasher {
    private static final List<LineColumn> NUMERIC = NumericRowBytes.COLUMNS;
    private static final int BATCH_ROWS = 8192;
    /** Bytes of one line's numeric columns (INT 4, LONG and DOUBLE 8). */
    private static final int ROW_BYTES = NumericRowBytes.ROW_BYTES;

    private LineReachHasher() {
    }

    /**
     * Per-block line hashes and counts.
     *
     * @param hashes  hex SHA-256 per block
     * @param lines   lines within reach per block
     */
    public record Result(String[] hashes, long[] lines) {
    }

    /**
     * Hashes the lines of {@code stores} (restricted by {@code species}, a query whose species selection is used)
     * into the blocks of {@code layout}.
     */
    public static Result hash(List<LineStore> stores, LineQuery species, BlockLayout layout) throws IOException {
        int blocks = layout.blocks();
        MessageDigest[] digests = new MessageDigest[blocks];
        long[] lines = new long[blocks];
        for (int b = 0; b < blocks; b++) {
            digests[b] = sha256();
        }
        double lo = layout.lineMinCm1(0);
        double hi = layout.lineMaxCm1(blocks - 1);
        LineQuery query = species.withWavenumberRange(lo, hi).withColumns(NUMERIC);
        LineBatch batch = new LineBatch(BATCH_ROWS);
        int rowBytes = ROW_BYTES;
        byte[] rows = new byte[BATCH_ROWS * rowBytes];
        for (int s = 0; s < stores.size(); s++) {
            byte[] storeTag = ByteBuffer.allocate(8).order(ByteOrder.LITTLE_ENDIAN).putLong(s).array();
            for (MessageDigest d : digests) {
                d.update(storeTag);
            }
            int first = 0; // first block whose reach may still hold the next line
            try (LineCursor cursor = stores.get(s).cursor(query)) {
                while (cursor.read(batch)) {
                    int n = batch.size;
                    if (n == 0) {
                        continue;
                    }
                    if (rows.length < n * rowBytes) {
                        rows = new byte[n * rowBytes];
                    }
                    NumericRowBytes.serialize(batch, n, ByteBuffer.wrap(rows).order(ByteOrder.LITTLE_ENDIAN));
                    double[] nu = batch.wavenumberCm1;
                    while (first < blocks && layout.lineMaxCm1(first) < nu[0]) {
                        first++;
                    }
                    // rows come in wavenumber order, so a block's rows are one run of the batch: one update each
                    for (int b = first; b < blocks && layout.lineMinCm1(b) <= nu[n - 1]; b++) {
                        int from = firstAtOrAbove(nu, 0, n, layout.lineMinCm1(b));
                        int to = firstAbove(nu, from, n, layout.lineMaxCm1(b));
                        if (to > from) {
                            digests[b].update(rows, from * rowBytes, (to - from) * rowBytes);
                            lines[b] += to - from;
                        }
                    }
                }
            }
        }
        String[] hex = new String[blocks];
        for (int b = 0; b < blocks; b++) {
            hex[b] = HexFormat.of().formatHex(digests[b].digest());
        }
        return new Result(hex, lines);
    }

    /**
     * The largest |δ| (cm⁻¹/atm) among the pressure-shift columns a width source may read — the air shift and
     * every foreign broadener's shift — of the lines of {@code stores} (restricted by {@code species}) with
     * centres in [{@code minCm1}, {@code maxCm1}]. Non-finite values are left out: the width sources resolve
     * them to 0. Reads only those columns (a column store reads little).
     */
    public static double maxAbsShiftCm1PerAtm(List<LineStore> stores, LineQuery species, double minCm1,
                                              double maxCm1) throws IOException {
        List<LineColumn> columns = new ArrayList<>();
        columns.add(LineColumn.AIR_SHIFT);
        for (Broadener b : Broadener.values()) {
            columns.add(LineColumn.foreignColumns(b)[2]);
        }
        LineQuery query = species.withWavenumberRange(minCm1, maxCm1).withColumns(columns);
        LineBatch batch = new LineBatch(BATCH_ROWS);
        double max = 0;
        for (LineStore store : stores) {
            try (LineCursor cursor = store.cursor(query)) {
                while (cursor.read(batch)) {
                    for (LineColumn c : columns) {
                        double[] d = c.doubles(batch);
                        for (int i = 0; i < batch.size; i++) {
                            double a = Math.abs(d[i]);
                            // NaN and infinities fail the test: the width sources resolve them to 0
                            if (a > max && a < Double.POSITIVE_INFINITY) {
                                max = a;
                            }
                        }
                    }
                }
            }
        }
        return max;
    }

    /** First index in [from, to) of ascending {@code x} with x ≥ v ({@code to} if none). */
    private static int firstAtOrAbove(double[] x, int from, int to, double v) {
        int lo = from;
        int hi = to;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (x[mid] < v) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    /** First index in [from, to) of ascending {@code x} with x &gt; v ({@code to} if none). */
    private static int firstAbove(double[] x, int from, int to, double v) {
        int lo = from;
        int hi = to;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (x[mid] <= v) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    static MessageDigest sha256() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is required of every Java platform", e);
        }
    }
}
