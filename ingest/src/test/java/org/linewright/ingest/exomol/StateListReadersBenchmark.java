package org.linewright.ingest.exomol;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.SplittableRandom;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.ingest.catalog.CatalogReader;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.source.ReadOptions;

/**
 * Throughput of the state/transition reader and the catalog reader on invented synthetic files (random
 * energies and A values, not physical data). Run with {@code ./mvnw -B -Pbenchmark -pl ingest -am verify};
 * figures go to docs/performance.md.
 */
@Tag("benchmark")
class StateListReadersBenchmark {
    private static final int STATES = 200_000;
    private static final int TRANSITIONS = 4_000_000;
    private static final int CATALOG_LINES = 1_000_000;

    @TempDir
    Path dir;

    @Test
    void stateTransitionSet() throws IOException {
        SplittableRandom random = new SplittableRandom(1);
        try (BufferedWriter w = Files.newBufferedWriter(dir.resolve("12C-16O__Bench.states"), StandardCharsets.US_ASCII)) {
            for (int i = 1; i <= STATES; i++) {
                w.write(String.format(Locale.ROOT, "%12d %12.6f %6d %7d + e X1Sigma+ %d%n", i, i * 0.05, 2 * (i % 80) + 1,
                        i % 80, i % 30));
            }
        }
        try (BufferedWriter w = Files.newBufferedWriter(dir.resolve("12C-16O__Bench.trans"), StandardCharsets.US_ASCII)) {
            for (int k = 0; k < TRANSITIONS; k++) {
                int lower = 1 + random.nextInt(STATES - 1);
                int upper = lower + 1 + random.nextInt(Math.min(1000, STATES - lower));
                w.write(String.format(Locale.ROOT, "%12d %12d %10.4e%n", upper, lower, random.nextDouble() * 1e-3));
            }
        }
        Files.writeString(dir.resolve("12C-16O__Bench.pf"), "296.0 107.42\n");
        long bytes = Files.size(dir.resolve("12C-16O__Bench.trans"));
        for (int round = 0; round < 3; round++) {
            long t0 = System.nanoTime();
            long lines = 0;
            try (ExomolReader r = ExomolReader.open(dir.resolve("12C-16O__Bench.states"), Files::newInputStream,
                    ReadOptions.strict(new CarbonMonoxideLookup()))) {
                long t1 = System.nanoTime();
                LineBatch batch = new LineBatch(ReadOptions.DEFAULT_BATCH_SIZE);
                while (r.read(batch)) {
                    lines += batch.size;
                }
                long t2 = System.nanoTime();
                System.out.printf(Locale.ROOT, "state/transition set: %d states in %.0f ms; %d transitions (%.0f MB) in %.0f ms"
                        + " = %.2f M lines/s%n", STATES, (t1 - t0) / 1e6, lines, bytes / 1e6, (t2 - t1) / 1e6,
                        lines / ((t2 - t1) / 1e9) / 1e6);
            }
            assertEquals(TRANSITIONS, lines);
        }
    }

    @Test
    void catalog() throws IOException {
        Path file = dir.resolve("c028001.cat");
        SplittableRandom random = new SplittableRandom(2);
        try (BufferedWriter w = Files.newBufferedWriter(file, StandardCharsets.US_ASCII)) {
            for (int k = 0; k < CATALOG_LINES; k++) {
                int j = random.nextInt(60);
                w.write(String.format(Locale.ROOT, "%13.4f%8.4f%8.4f%2d%10.4f%3d%7d%4d%2d%10s%2d%10s%n",
                        1000 + random.nextDouble() * 1e6, 0.0005, -3 - random.nextDouble() * 5, 2, j * 1.9225 * (j + 1),
                        2 * j + 3, -28001, 101, j + 1, "", j, ""));
            }
        }
        for (int round = 0; round < 3; round++) {
            long t0 = System.nanoTime();
            long lines = 0;
            try (InputStream in = Files.newInputStream(file);
                 CatalogReader r = new CatalogReader(in, "c028001.cat", ReadOptions.strict(new CarbonMonoxideLookup()))) {
                LineBatch batch = new LineBatch(ReadOptions.DEFAULT_BATCH_SIZE);
                while (r.read(batch)) {
                    lines += batch.size;
                }
            }
            long t1 = System.nanoTime();
            System.out.printf(Locale.ROOT, "catalog: %d lines (%.0f MB) in %.0f ms = %.2f M lines/s%n", lines,
                    Files.size(file) / 1e6, (t1 - t0) / 1e6, lines / ((t1 - t0) / 1e9) / 1e6);
            assertEquals(CATALOG_LINES, lines);
        }
    }
}
