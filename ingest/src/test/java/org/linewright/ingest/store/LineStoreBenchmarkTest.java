package org.linewright.ingest.store;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.Tag;
import org.junit.jupiter.api.Test;

/**
 * Store benchmark (excluded from the default build): 10,000,000 generated lines written sorted and unsorted
 * in a child JVM with -Xmx512m, then reloaded; figures are printed (record them in docs/performance.md).
 * Run: {@code ./mvnw -B -Pbenchmark -pl ingest -am verify}. Lines: system property
 * {@code linewright.benchmark.lines} (default 10,000,000).
 */
@Tag("benchmark")
class LineStoreBenchmarkTest {
    @Test
    void writeAndReloadTenMillionLinesIn512MbOfHeap() throws IOException, InterruptedException {
        long lines = Long.getLong("linewright.benchmark.lines", 10_000_000L);
        for (String order : new String[] {"sorted", "unsorted"}) {
            Path dir = Files.createTempDirectory("lw-store-bench-");
            try {
                String java = Path.of(System.getProperty("java.home"), "bin", "java").toString();
                Process p = new ProcessBuilder(List.of(java, "-Xmx512m", "--add-opens=java.base/java.nio=ALL-UNNAMED",
                        "-cp", System.getProperty("surefire.test.class.path", System.getProperty("java.class.path")), LineStoreBenchmark.class.getName(),
                        Long.toString(lines), order, dir.toString()))
                        .redirectErrorStream(true).start();
                String output = new String(p.getInputStream().readAllBytes(), StandardCharsets.UTF_8);
                System.out.print(output);
                // The child fails (non-zero exit) on OutOfMemoryError or a wrong line count.
                assertEquals(0, p.waitFor(), "benchmark child JVM exit code (" + order + "):\n" + output);
                assertTrue(output.contains("reload cross-section columns"), output);
            } finally {
                LineStoreBenchmark.deleteTree(dir);
            }
        }
        System.out.println("machine: " + Runtime.getRuntime().availableProcessors() + " cores, java " + System.getProperty("java.version"));
    }
}
