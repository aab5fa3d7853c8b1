package org.linewright.ingest.store;

import java.io.IOException;
import java.lang.management.ManagementFactory;
import java.lang.management.MemoryPoolMXBean;
import java.lang.management.MemoryType;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.Locale;
import java.util.Map;
import java.util.stream.Stream;
import org.linewright.ingest.line.Broadener;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;

/**
 * Throughput and peak heap of the line store on generated (synthetic) lines: writes N lines (sorted, or
 * shuffled within blocks to force the external sort), then reloads them with the cross-section columns and
 * with all columns. Run by {@code LineStoreBenchmarkTest} (tag "benchmark") in a JVM limited to 512 MB of heap,
 * or directly: {@code java -Xmx512m --add-opens=java.base/java.nio=ALL-UNNAMED -cp ... LineStoreBenchmark N sorted|unsorted DIR}.
 */
public final class LineStoreBenchmark {
    private LineStoreBenchmark() {
    }

    public static void main(String[] args) throws IOException {
        long lines = Long.parseLong(args[0]);
        boolean sorted = args[1].equals("sorted");
        Path dir = Path.of(args[2]);
        resetPeaks();
        long t0 = System.nanoTime();
        LineBatch b = new LineBatch(65_536);
        byte[] quanta = "       0 0 0 01".getBytes(StandardCharsets.US_ASCII);
        byte[] local = "     P 12e     ".getBytes(StandardCharsets.US_ASCII);
        byte[] codes = "465332".getBytes(StandardCharsets.US_ASCII);
        byte[] refs = "  4 2 1 1 1 1".substring(0, 12).getBytes(StandardCharsets.US_ASCII);
        byte[] flag = " ".getBytes(StandardCharsets.US_ASCII);
        try (LineStoreWriter w = LineStoreWriter.create(dir, "synthetic-" + args[1], SourceMetadata.of("synthetic.par", "", "hitran160", Map.of()))) {
            for (long i = 0; i < lines; ) {
                b.clear();
                int n = (int) Math.min(b.capacity(), lines - i);
                for (int r = 0; r < n; r++, i++) {
                    // Unsorted: reverse order inside each block of 1000 lines, blocks ascending.
                    long k = sorted ? i : (i / 1000) * 1000 + 999 - (i % 1000);
                    b.moleculeId[r] = 2;
                    b.isotopologue[r] = 1 + (int) (k % 3);
                    b.wavenumberCm1[r] = 500.0 + k * 1e-4;
                    b.intensityCmPerMolecule[r] = 1e-22 * (1 + (k & 1023));
                    b.einsteinAS1[r] = 0.5;
                    b.airWidthCm1PerAtm[r] = 0.07;
                    b.selfWidthCm1PerAtm[r] = 0.09;
                    b.airWidthExponent[r] = 0.75;
                    b.airShiftCm1PerAtm[r] = -0.002;
                    b.lowerEnergyCm1[r] = k % 5000;
                    b.upperDegeneracy[r] = 3;
                    b.lowerDegeneracy[r] = 1;
                    b.clearOptional(r);
                    b.foreignWidthCm1PerAtm[Broadener.H2.ordinal()][r] = 0.1;
                    b.sourceLine[r] = k + 1;
                    b.upperGlobalQuanta.append(quanta, 0, quanta.length);
                    b.lowerGlobalQuanta.append(quanta, 0, quanta.length);
                    b.upperLocalQuanta.append(local, 0, local.length);
                    b.lowerLocalQuanta.append(local, 0, local.length);
                    b.uncertaintyCodes.append(codes, 0, codes.length);
                    b.referenceCodes.append(refs, 0, refs.length);
                    b.lineMixingFlag.append(flag, 0, flag.length);
                }
                b.size = n;
                w.write(b);
            }
            long tc = System.nanoTime();
            w.commit(new IngestCounts(lines, lines, 0, 0));
            System.out.printf(Locale.ROOT, "commit (final sort/merge, fsync, rename, index): %.2f s%n", (System.nanoTime() - tc) * 1e-9);
        }
        double writeS = (System.nanoTime() - t0) * 1e-9;
        long writePeakMb = peakHeapBytes() / (1 << 20);
        long fileBytes;
        try (Stream<Path> files = Files.list(dir)) {
            fileBytes = files.filter(p -> p.toString().endsWith(".arrow")).mapToLong(p -> p.toFile().length()).sum();
        }
        System.out.printf(Locale.ROOT, "write %s: %d lines in %.2f s = %.2f M lines/s, file %.0f MB, peak heap %d MB (max %d MB)%n",
                args[1], lines, writeS, lines / writeS / 1e6, fileBytes / 1e6, writePeakMb,
                Runtime.getRuntime().maxMemory() / (1 << 20));
        LineStore store = LineStore.open(dir);
        for (int rep = 0; rep < 3; rep++) {
            reload(store, LineQuery.all().withColumns(LineQuery.CROSS_SECTION_COLUMNS), "cross-section columns (" + LineQuery.CROSS_SECTION_COLUMNS.size() + ")");
            reload(store, LineQuery.all(), "all columns (" + LineColumn.values().length + ")");
        }
        System.out.printf(Locale.ROOT, "peak heap overall %d MB%n", peakHeapBytes() / (1 << 20));
    }

    private static void reload(LineStore store, LineQuery q, String what) throws IOException {
        long t0 = System.nanoTime();
        long n = 0;
        double check = 0;
        LineBatch b = new LineBatch(65_536);
        try (LineCursor c = store.cursor(q)) {
            while (c.read(b)) {
                n += b.size;
                check += b.wavenumberCm1[b.size - 1];
            }
        }
        double s = (System.nanoTime() - t0) * 1e-9;
        System.out.printf(Locale.ROOT, "reload %s: %d lines in %.3f s = %.1f M lines/s (checksum %.3f)%n", what, n, s, n / s / 1e6, check);
        if (n != store.totalLines()) {
            throw new IllegalStateException("reloaded " + n + " lines of " + store.totalLines());
        }
    }

    private static void resetPeaks() {
        for (MemoryPoolMXBean p : ManagementFactory.getMemoryPoolMXBeans()) {
            p.resetPeakUsage();
        }
    }

    private static long peakHeapBytes() {
        long sum = 0;
        for (MemoryPoolMXBean p : ManagementFactory.getMemoryPoolMXBeans()) {
            if (p.getType() == MemoryType.HEAP) {
                sum += p.getPeakUsage().getUsed();
            }
        }
        return sum;
    }

    static void deleteTree(Path dir) throws IOException {
        if (!Files.exists(dir)) {
            return;
        }
        try (Stream<Path> walk = Files.walk(dir)) {
            for (Path p : (Iterable<Path>) walk.sorted(Comparator.reverseOrder())::iterator) {
                Files.delete(p);
            }
        }
    }
}
