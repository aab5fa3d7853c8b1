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
class ByteLineScannerTest {

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
        try (ByteLineScanner r = new ByteLineScanner(in, bufferBytes)) {
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

    /** Reference: the JDK's {@code String.split("[ \\t\\r]+")} of the stripped line. */
    @Test
    void splitOnBlanksMatchesTheJdkSplit() throws IOException {
        String text = "  1   0.000000 \t 1  0 + e X1Sigma+\r\r\n\t\n7 8 9\n";
        int[] start = new int[8];
        int[] end = new int[8];
        try (ByteLineScanner r = new ByteLineScanner(new ByteArrayInputStream(text.getBytes(StandardCharsets.ISO_8859_1)))) {
            while (r.next()) {
                String line = r.lineText();
                String stripped = line.replaceAll("^[ \\t\\r]+|[ \\t\\r]+$", "");
                List<String> expected = stripped.isEmpty() ? List.of() : List.of(stripped.split("[ \\t\\r]+"));
                int n = r.splitOnBlanks(start, end);
                List<String> actual = new ArrayList<>();
                for (int k = 0; k < n; k++) {
                    actual.add(r.text(start[k], end[k]));
                }
                assertEquals(expected, actual, line);
                assertEquals(expected.isEmpty(), r.isBlank(), line);
            }
        }
        try (ByteLineScanner r = new ByteLineScanner(new ByteArrayInputStream("a b c d".getBytes(StandardCharsets.ISO_8859_1)))) {
            assertTrue(r.next());
            // more fields than fit: one more than the arrays hold
            assertEquals(4, r.splitOnBlanks(new int[3], new int[3]));
        }
    }
}
