package org.linewright.ingest.pipeline;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Comparator;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * End-to-end ingest benchmark (excluded from the default build): {@link IngestBenchmark} in a child JVM with
 * -Xmx512m on 10,000,000 generated records (system property {@code linewright.benchmark.records}). Figures are
 * printed; record them in docs/performance.md. Run: {@code ./mvnw -B -Pbenchmark -pl ingest -am verify
 * -Dtest=IngestBenchmarkTest -Dsurefire.failIfNoSpecifiedTests=false}.
 */
@Tag("benchmark")
class IngestBenchmarkTest {
    @Test
    void ingestTenMillionRecordsIn512MbOfHeap() throws IOException, InterruptedException {
        long records = Long.getLong("linewright.benchmark.records", 10_000_000L);
        Path dir = Files.createTempDirectory("lw-ingest-bench-");
        try {
            Path file = dir.resolve("synthetic.par");
            IngestBenchmark.generate(file, records);
            String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
            Process p = new ProcessBuilder(List.of(java, "-Xmx512m", "--add-opens=java.base/java.nio=ALL-UNNAMED",
                    "-cp", System.getProperty("surefire.test.class.path", System.getProperty("java.class.path")),
                    IngestBenchmark.class.getName(), Long.toString(records), file.toString(), dir.resolve("store").toString()))
                    .redirectErrorStream(true).start();
            String output = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
            System.out.print(output);
            // Non-zero on OutOfMemoryError or a wrong count.
            assertEquals(0, p.waitFor(), output);
        } finally {
            try (Stream<Path> walk = Files.walk(dir)) {
                walk.sorted(Comparator.reverseOrder()).forEach(f -> f.toFile().delete());
            }
        }
        System.out.println("machine: " + Runtime.getRuntime().availableProcessors() + " cores, java " + System.getProperty("java.version"));
    }
}
