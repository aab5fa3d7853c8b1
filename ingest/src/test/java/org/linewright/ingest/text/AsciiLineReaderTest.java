package org.linewright.ingest.text;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.Test;

/** Reference: {@link String#lines()} of the JDK splits on the same terminators. */
class AsciiLineReaderTest {

    private static List<String> readAll(String text, int bufferBytes, boolean trickle) throws IOException {
        byte[] bytes = text.getBytes(StandardCharsets.ISO_8859_1);
        InputStream in = new ByteArrayInputStream(bytes);
        if (trickle) {
            // a stream that returns at most 3 bytes per read, as decompressors may
            in = new java.io.FilterInputStream(in) {
                @Override
                public int read(byte[] b, int off, int len) throws IOException {
                    return super.read(b, off, Math.min(3, len));
                }
            };
        }
        List<String> lines = new ArrayList<>();
        try (AsciiLineReader r = new AsciiLineReader(in, bufferBytes)) {
            while (r.next()) {
                lines.add(r.lineText());
                assertEquals(lines.size(), r.lineNumber());
            }
            assertFalse(r.next());
        }
        return lines;
    }

    @Test
    void matchesStringLinesForLfCrLfAndMissingFinalTerminator() throws IOException {
        String long1 = "x".repeat(1000);
        String text = "a b\r\n\nc\n" + long1 + "\r\nlast";
        for (boolean trickle : new boolean[] {false, true}) {
            assertEquals(text.lines().toList(), readAll(text, 16, trickle));
            assertEquals(text.lines().toList(), readAll(text, 1 << 16, trickle));
        }
        assertTrue(readAll("", 16, false).isEmpty());
    }
}
