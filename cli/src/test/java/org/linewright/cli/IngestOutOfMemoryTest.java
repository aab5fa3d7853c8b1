package org.linewright.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.ingest.testsupport.ReferenceSamples;

/**
 * An ingest that runs out of heap ends with one line saying what ran out and how to give more, exit code 3, and
 * leaves no source in the store. The real command runs in a child JVM with a heap too small for the external
 * sort's two run buffers (-Xmx40m), on the HITRAN2020 CO sample in reverse order, repeated (215,240 records out
 * of wavenumber order, so the lines go through the run buffers and their spill thread).
 */
class IngestOutOfMemoryTest {
    @TempDir
    Path tmp;

    @Test
    void outOfHeapDuringAnUnsortedIngestIsOneLine() throws IOException, InterruptedException {
        List<String> records = new ArrayList<>(Files.readAllLines(ReferenceSamples.hitranSample("sample_CO.par"),
                StandardCharsets.ISO_8859_1));
        Collections.reverse(records);
        Path input = tmp.resolve("reversed.par");
        List<String> repeated = new ArrayList<>();
        for (int i = 0; i < 40; i++) {
            repeated.addAll(records);
        }
        Files.write(input, repeated, StandardCharsets.ISO_8859_1);
        Path store = tmp.resolve("store");
        Path java = Path.of(System.getProperty("java.home"), "bin", "java");
        Process p = new ProcessBuilder(java.toString(), "-Xmx40m", "--add-opens=java.base/java.nio=ALL-UNNAMED",
                "-cp", System.getProperty("java.class.path"), Main.class.getName(),
                "ingest", input.toString(), "--store", store.toString(), "--quiet")
                .redirectOutput(ProcessBuilder.Redirect.DISCARD)
                .redirectError(tmp.resolve("stderr.txt").toFile())
                .start();
        assertTrue(p.waitFor(60, TimeUnit.SECONDS), "ingest did not finish");
        String stderr = Files.readString(tmp.resolve("stderr.txt")).strip();
        assertEquals(ExitCodes.INTERNAL_ERROR, p.exitValue(), stderr);
        assertEquals(1, stderr.split("\\R").length, stderr);
        assertTrue(stderr.startsWith(ErrorReporting.PREFIX + "out of memory: the Java heap"), stderr);
        assertTrue(stderr.contains("LINEWRIGHT_JAVA_OPTS=-Xmx"), stderr);
        assertFalse(Files.exists(store.resolve("linestore.properties")), "no source committed");
    }
}
