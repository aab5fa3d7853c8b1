package org.linewright.grid.manifest;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.ByteOrder;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.List;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.store.LineCursor;
import org.linewright.ingest.store.LineQuery;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.testsupport.ReferenceSamples;

/**
 * Block line hashes on real lines (HITRAN2020 CO and CO2 samples, Gordon et al. 2022, JQSRT 277, 107949) against
 * a line-by-line reference written here with the JDK's SHA-256 (FIPS 180-4): for each block, the store tag and
 * then each line whose centre lies in [block start − reach, block end + reach], its numeric columns in declaration
 * order, little-endian, one {@code update} per line. The hasher serialises whole batches and updates once per
 * block run; the bytes, so the hashes, must be the same.
 */
class LineReachHasherTest {
    @TempDir
    Path dir;

    @Test
    void batchedHashesEqualLineByLineHashes() throws IOException {
        LineStore co = LineStore.open(ReferenceSamples.ingest(dir.resolve("co"),
                ReferenceSamples.hitranSample("sample_CO.par")));
        LineStore co2 = LineStore.open(ReferenceSamples.ingest(dir.resolve("co2"),
                ReferenceSamples.hitranSample("sample_CO2.par")));
        List<LineStore> stores = List.of(co, co2);
        // blocks of 700 points of 0.01 cm-1 (7 cm-1) with a 3.3 cm-1 reach: most lines fall in two blocks
        BlockLayout layout = new BlockLayout(WavenumberGrid.uniform(2000.0, 2400.0, 0.01), 700, 3.3);
        LineReachHasher.Result got = LineReachHasher.hash(stores, LineQuery.all(), layout);

        List<LineColumn> numeric = new java.util.ArrayList<>();
        for (LineColumn c : LineColumn.values()) {
            if (c.kind() != LineColumn.Kind.TEXT && c != LineColumn.SOURCE_LINE) {
                numeric.add(c);
            }
        }
        String[] expected = new String[layout.blocks()];
        long[] counts = new long[layout.blocks()];
        for (int b = 0; b < layout.blocks(); b++) {
            MessageDigest d = sha256();
            for (int s = 0; s < stores.size(); s++) {
                d.update(ByteBuffer.allocate(8).order(ByteOrder.LITTLE_ENDIAN).putLong(s).array());
                LineBatch batch = new LineBatch(1000);
                try (LineCursor cursor = stores.get(s).cursor(LineQuery.all().withColumns(numeric))) {
                    while (cursor.read(batch)) {
                        for (int i = 0; i < batch.size; i++) {
                            double x = batch.wavenumberCm1[i];
                            if (x < layout.lineMinCm1(b) || x > layout.lineMaxCm1(b)) {
                                continue;
                            }
                            ByteBuffer row = ByteBuffer.allocate(8 * numeric.size()).order(ByteOrder.LITTLE_ENDIAN);
                            for (LineColumn c : numeric) {
                                switch (c.kind()) {
                                    case INT -> row.putInt(c.ints(batch)[i]);
                                    case LONG -> row.putLong(c.longs(batch)[i]);
                                    default -> row.putDouble(c.doubles(batch)[i]);
                                }
                            }
                            d.update(row.array(), 0, row.position());
                            counts[b]++;
                        }
                    }
                }
            }
            expected[b] = HexFormat.of().formatHex(d.digest());
        }
        assertTrue(counts[10] > 0 && counts[30] > 0, "blocks hold lines");
        assertArrayEquals(counts, got.lines());
        for (int b = 0; b < expected.length; b++) {
            assertEquals(expected[b], got.hashes()[b], "block " + b);
        }
    }

    private static MessageDigest sha256() {
        try {
            return MessageDigest.getInstance("SHA-256");
        } catch (java.security.NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }
}
