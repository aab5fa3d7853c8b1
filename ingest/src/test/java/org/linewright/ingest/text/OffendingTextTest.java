package org.linewright.ingest.text;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

/**
 * Offending text made fit for one line: control characters (Unicode general category Cc), format characters (Cf)
 * and line/paragraph separators (Zl, Zp) escaped; printable text, including non-ASCII letters, kept (categories
 * from the Unicode Standard, common practice).
 */
class OffendingTextTest {
    @Test
    void controlCharactersAreEscaped() {
        assertEquals("a\\nb\\rc\\td", OffendingText.escape("a\nb\rc\td"));
        assertEquals("\\x01\\x1B[31mred\\x07\\x7F", OffendingText.escape("\u0001\u001b[31mred\u0007\u007f"));
        assertEquals("\\x85\\u2028\\u200B", OffendingText.escape("\u0085\u2028\u200b"), "C1 NEL, LINE SEPARATOR, ZWSP");
        assertEquals("\\uFFFD", OffendingText.escape("\ufffd"), "what invalid UTF-8 decodes to");
    }

    @Test
    void printableTextIsKept() {
        String text = "Šimečková σ(ν) 12.3x4 µm";
        assertEquals(text, OffendingText.escape(text));
        assertTrue(OffendingText.isPrintable(text));
        assertFalse(OffendingText.isPrintable("a\u0000b"));
    }

    @Test
    void longTextIsCutWithACount() {
        String text = "x".repeat(200);
        String escaped = OffendingText.escape(text);
        assertEquals("x".repeat(80) + "... (120 more characters)", escaped);
        assertEquals("\"abc\"", OffendingText.quote("abc"));
        assertEquals("null", OffendingText.escape(null));
    }
}
