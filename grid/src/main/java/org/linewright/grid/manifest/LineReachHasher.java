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
import org.linewright.ingest.store.LineCursor;
import org.linewright.ingest.store.LineQuery;
import org.linewright.ingest.store.LineStore;

/**
 * The content hash of the lines within reach of each block: SHA-256 over, for every store in order and every
 * line of it in the store's order whose centre lies in the block's reach, all numeric columns of the line model
 * ({@link LineColumn} kinds INT, LONG and DOUBLE, in declaration order, little-endian; text columns such as
 * quantum labels do not affect σ and are left out), preceded by the store's position. Computed in one pass over
 * each store: lines arrive in wavenumber order, so the blocks a line reaches are a window that only moves
 * forward.
 */
public final class LineReachHasher {
    private static final List<LineColumn> NUMERIC = numericColumns();
    private static final int BATCH_ROWS = 8192;

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
        ByteBuffer row = ByteBuffer.allocate(8 * NUMERIC.size() + 8).order(ByteOrder.LITTLE_ENDIAN);
        for (int s = 0; s < stores.size(); s++) {
            byte[] storeTag = ByteBuffer.allocate(8).order(ByteOrder.LITTLE_ENDIAN).putLong(s).array();
            for (MessageDigest d : digests) {
                d.update(storeTag);
            }
            int first = 0; // first block whose reach may still hold the next line
            try (LineCursor cursor = stores.get(s).cursor(query)) {
                while (cursor.read(batch)) {
                    double[] nu = batch.wavenumberCm1;
                    for (int i = 0; i < batch.size; i++) {
                        double x = nu[i];
                        while (first < blocks && layout.lineMaxCm1(first) < x) {
                            first++;
                        }
                        if (first == blocks) {
                            break;
                        }
                        if (layout.lineMinCm1(first) > x) {
                            continue;
                        }
                        row.clear();
                        for (LineColumn c : NUMERIC) {
                            switch (c.kind()) {
                                case INT -> row.putInt(c.ints(batch)[i]);
                                case LONG -> row.putLong(c.longs(batch)[i]);
                                default -> row.putDouble(c.doubles(batch)[i]);
                            }
                        }
                        for (int b = first; b < blocks && layout.lineMinCm1(b) <= x; b++) {
                            digests[b].update(row.array(), 0, row.position());
                            lines[b]++;
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

    private static List<LineColumn> numericColumns() {
        List<LineColumn> out = new ArrayList<>();
        for (LineColumn c : LineColumn.values()) {
            // The source line number says where a line was in its file, not what it is: an edit that inserts
            // a line must not change the hash of every line after it.
            if (c.kind() != LineColumn.Kind.TEXT && c != LineColumn.SOURCE_LINE) {
                out.add(c);
            }
        }
        return List.copyOf(out);
    }

    static MessageDigest sha256() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is required of every Java platform", e);
        }
    }
}
