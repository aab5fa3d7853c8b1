package org.linewright.ingest.pipeline;

import java.io.BufferedOutputStream;
import java.io.IOException;
import java.io.OutputStream;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Locale;
import org.linewright.ingest.hitran.HitranRecordWriter;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.store.LineCursor;
import org.linewright.ingest.store.LineQuery;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.testsupport.SyntheticRecords;

/**
 * End-to-end ingest benchmark: an uncompressed file of generated (synthetic, invented) 160-character records,
 * ingested into a store through {@link IngestPipeline} (detection, SHA-256, parsing, store writing), then
 * reloaded. Run in a JVM of its own to measure heap: {@code java -Xmx512m ... IngestBenchmark RECORDS FILE STORE}.
 */
public final class IngestBenchmark {
    private static final int BLOCK = 20_000;

    private IngestBenchmark() {
    }

    public static void main(String[] args) throws IOException {
        long records = Long.parseLong(args[0]);
        Path file = Path.of(args[1]);
        Path store = Path.of(args[2]);
        if (!Files.isRegularFile(file)) {
            generate(file, records);
        }
        for (MemoryPoolMXBean p : ManagementFactory.getMemoryPoolMXBeans()) {
            p.resetPeakUsage();
        }
        long t0 = System.nanoTime();
        IngestReport report = IngestPipeline.run(List.of(file), store, IngestOptions.strict(MoleculeRegistry.builtIn()),
                IngestListener.NONE);
        double s = (System.nanoTime() - t0) * 1e-9;
        if (report.linesKept() != records) {
            throw new IllegalStateException("kept " + report.linesKept() + " of " + records);
        }
        System.out.printf(Locale.ROOT, "ingest: %d records (%.0f MB) in %.2f s = %.2f M records/s, peak heap %d MB (max %d MB)%n",
                records, Files.size(file) / 1e6, s, records / s / 1e6, peakHeapMb(), Runtime.getRuntime().maxMemory() >> 20);
        long storeBytes = 0;
        try (java.util.stream.Stream<Path> files = Files.list(store)) {
            for (Path f : (Iterable<Path>) files.filter(f -> f.getFileName().toString().endsWith(".arrow"))::iterator) {
                storeBytes += Files.size(f);
            }
        }
        System.out.printf(Locale.ROOT, "store file: %.0f MB = %.0f bytes/line%n", storeBytes / 1e6, (double) storeBytes / records);
        LineStore opened = LineStore.open(store);
        for (int rep = 0; rep < 3; rep++) {
            reload(opened, LineQuery.all().withColumns(LineQuery.CROSS_SECTION_COLUMNS), "cross-section columns");
            reload(opened, LineQuery.all(), "all columns");
        }
        System.out.printf(Locale.ROOT, "peak heap overall %d MB%n", peakHeapMb());
    }

    /** Writes {@code records} sorted records: a block of varied records repeated with rising wavenumbers. */
    static void generate(Path file, long records) throws IOException {
        LineBatch b = SyntheticRecords.block(BLOCK, 7);
        HitranRecordWriter writer = new HitranRecordWriter();
        try (OutputStream out = new BufferedOutputStream(Files.newOutputStream(file), 1 << 20)) {
            for (long done = 0; done < records; ) {
                int n = (int) Math.min(BLOCK, records - done);
                for (int i = 0; i < n; i++) {
                    // 0.009 cm-1 apart: 10^7 records end below 90,010 cm-1, within the F12.6 field.
                    b.wavenumberCm1[i] = Math.round((10 + (done + i) * 0.009) * 1e6) / 1e6;
                }
                b.size = n;
                writer.write(b, out);
                done += n;
            }
        }
    }

    private static void reload(LineStore store, LineQuery q, String what) throws IOException {
        long t0 = System.nanoTime();
        long n = 0;
        LineBatch b = new LineBatch(65_536);
        try (LineCursor c = store.cursor(q)) {
            while (c.read(b)) {
                n += b.size;
            }
        }
        double s = (System.nanoTime() - t0) * 1e-9;
        System.out.printf(Locale.ROOT, "reload %s: %d lines in %.3f s = %.1f M lines/s%n", what, n, s, n / s / 1e6);
    }

    private static long peakHeapMb() {
        long sum = 0;
        for (MemoryPoolMXBean p : ManagementFactory.getMemoryPoolMXBeans()) {
            if (p.getType() == MemoryType.HEAP) {
                sum += p.getPeakUsage().getUsed();
            }
        }
        return sum >> 20;
    }
}
