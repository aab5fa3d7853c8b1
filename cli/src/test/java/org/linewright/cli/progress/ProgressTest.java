package org.linewright.cli.progress;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import org.junit.jupiter.api.Assumptions;
import org.junit.jupiter.api.Test;

/** The progress wrapper: silent when asked or off a terminal, drawing through the library otherwise. */
class ProgressTest {

    @Test
    void quietIsSilent() {
        try (Progress p = Progress.start("reading", 100, "lines", 1, true)) {
            assertTrue(p.isSilent());
            p.stepBy(50);
            p.message("file.par");
        }
    }

    @Test
    void withoutAConsoleItIsSilent() {
        // Surefire runs tests with stdin/stdout redirected, so the JVM normally has no console
        Assumptions.assumeTrue(System.console() == null, "this JVM has a console; the off-terminal case cannot be seen");
        try (Progress p = Progress.start("reading", 100, "lines", 1, false)) {
            assertTrue(p.isSilent());
        }
    }

    @Test
    void onAStreamItDrawsTheTaskAndTheCount() {
        ByteArrayOutputStream bytes = new ByteArrayOutputStream();
        try (PrintStream stream = new PrintStream(bytes, true, StandardCharsets.UTF_8)) {
            try (Progress p = Progress.toStream(stream, "reading lines", 2_000_000, "MB", 1_000_000)) {
                assertFalse(p.isSilent());
                p.stepBy(1_000_000);
                p.stepTo(2_000_000);
            }
        }
        String drawn = bytes.toString(StandardCharsets.UTF_8);
        assertTrue(drawn.contains("reading lines"), drawn);
        assertTrue(drawn.contains("100%"), drawn);
        assertTrue(drawn.contains("MB"), drawn);
        assertEquals(-1, drawn.indexOf('\u0000'));
    }
}
