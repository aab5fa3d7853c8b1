package org.linewright.ingest.hitran;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.ByteArrayOutputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import org.apache.commons.compress.compressors.bzip2.BZip2CompressorOutputStream;
import org.apache.commons.compress.compressors.gzip.GzipCompressorOutputStream;
import org.apache.commons.compress.compressors.zstandard.ZstdCompressorOutputStream;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.source.LineSources;
import org.linewright.ingest.source.OpenedSource;
import org.linewright.ingest.source.ReadOptions;
import org.linewright.ingest.testsupport.SyntheticRecords;
import org.linewright.ingest.testsupport.SampleIsotopologues;

/**
 * Parse throughput of {@link HitranRecordReader} on one thread over generated (synthetic, invented)
 * records served from memory, so that only parsing is timed. Run with
 * {@code ./mvnw -B -Pbenchmark -pl ingest -am verify}; prints records per second.
 */
@Tag("benchmark")
class HitranRecordReaderBenchmark {
    private static final int DISTINCT_RECORDS = 20_000;
    private static final long RECORDS = 5_000_000L;

    /** Serves {@code copies} copies of a block of records. */
    private static final class RepeatingStream extends InputStream {
        private final byte[] block;
        private long remaining;
        private int position;

        RepeatingStream(byte[] block, long copies) {
            this.block = block;
            this.remaining = copies;
        }

        @Override
        public int read() {
            byte[] one = new byte[1];
            return read(one, 0, 1) < 0 ? -1 : one[0] & 0xff;
        }

        @Override
        public int read(byte[] b, int off, int len) {
            if (remaining == 0) {
                return -1;
            }
            int n = Math.min(len, block.length - position);
            System.arraycopy(block, position, b, off, n);
            position += n;
            if (position == block.length) {
                position = 0;
                remaining--;
            }
            return n;
        }
    }

    static byte[] syntheticBlock() throws IOException {
        LineBatch b = SyntheticRecords.block(DISTINCT_RECORDS, 42);
        for (int i = 0; i < DISTINCT_RECORDS; i++) {
            b.wavenumberCm1[i] = Math.round((10 + i * 0.37) * 1e6) / 1e6;
        }
        ByteArrayOutputStream out = new ByteArrayOutputStream();
        new HitranRecordWriter().write(b, out);
        return out.toByteArray();
    }

    @Test
    void parseThroughput() throws IOException {
        byte[] block = syntheticBlock();
        ReadOptions options = ReadOptions.strict(new SampleIsotopologues());
        LineBatch batch = new LineBatch(ReadOptions.DEFAULT_BATCH_SIZE);
        long copies = RECORDS / DISTINCT_RECORDS;
        for (int run = 0; run < 5; run++) {
            HitranRecordReader r = new HitranRecordReader(new RepeatingStream(block, copies), "synthetic.par", options);
            long t0 = System.nanoTime();
            double checksum = 0;
            while (r.read(batch)) {
                checksum += batch.wavenumberCm1[batch.size - 1];
            }
            long t1 = System.nanoTime();
            assertEquals(copies * DISTINCT_RECORDS, r.recordsRead());
            double perSecond = r.recordsRead() / ((t1 - t0) / 1e9);
            System.out.printf("HitranRecordReader run %d: %d records in %.3f s = %.0f records/s (%.0f MB/s), checksum %.3f%n",
                    run, r.recordsRead(), (t1 - t0) / 1e9, perSecond, perSecond * 161 / 1e6, checksum);
        }
    }

    /** Whole-source throughput: file → decompression (read-ahead thread for bzip2 and xz) → records. */
    @Test
    void compressedSourceThroughput(@TempDir Path dir) throws IOException {
        byte[] block = syntheticBlock();
        int copies = 25; // 500,000 records, 80.5 MB
        ReadOptions options = ReadOptions.strict(new SampleIsotopologues());
        LineBatch batch = new LineBatch(ReadOptions.DEFAULT_BATCH_SIZE);
        for (String kind : new String[] {"none", "gzip", "zstd", "bzip2", "xz"}) {
            Path p = dir.resolve("synthetic." + kind);
            try (OutputStream o = compressor(kind, Files.newOutputStream(p))) {
                for (int c = 0; c < copies; c++) {
                    o.write(block);
                }
            }
            for (int run = 0; run < 2; run++) {
                long t0 = System.nanoTime();
                long records;
                try (OpenedSource s = LineSources.open(p, null, options)) {
                    while (s.reader().read(batch)) {
                        // parse only
                    }
                    records = s.reader().recordsRead();
                    s.sha256Hex().get();
                }
                long t1 = System.nanoTime();
                assertEquals((long) copies * DISTINCT_RECORDS, records);
                System.out.printf("LineSources %-5s run %d: %d records in %.3f s = %.0f records/s (file %.1f MB)%n", kind, run,
                        records, (t1 - t0) / 1e9, records / ((t1 - t0) / 1e9), Files.size(p) / 1e6);
            }
        }
    }

    private static OutputStream compressor(String kind, OutputStream raw) throws IOException {
        switch (kind) {
            case "gzip": return new GzipCompressorOutputStream(raw);
            case "zstd": return new ZstdCompressorOutputStream(raw);
            case "bzip2": return new BZip2CompressorOutputStream(raw);
            case "xz": return new org.tukaani.xz.XZOutputStream(raw, new org.tukaani.xz.LZMA2Options(1));
            default: return raw;
        }
    }
}
