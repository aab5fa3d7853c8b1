package org.linewright.ingest.exomol;

import org.linewright.ingest.source.LineFormatException;
import org.linewright.ingest.text.AsciiLineReader;

/** Splits a line of blank-separated fields into token boundaries without allocating. */
final class Tokens {
    private Tokens() {
    }

    /**
     * Finds up to {@code start.length} fields of {@code bytes[from, to)} separated by blanks or tabs.
     *
     * @return the number of fields found, or {@code start.length + 1} when there are more than fit
     */
    static int split(byte[] bytes, int from, int to, int[] start, int[] end) {
        int count = 0;
        int i = from;
        while (true) {
            while (i < to && isBlank(bytes[i])) {
                i++;
            }
            if (i == to) {
                return count;
            }
            if (count == start.length) {
                return count + 1;
            }
            start[count] = i;
            while (i < to && !isBlank(bytes[i])) {
                i++;
            }
            end[count] = i;
            count++;
        }
    }

    static boolean isBlank(byte b) {
        return b == ' ' || b == '\t' || b == '\r';
    }

    /** A located error for the field {@code [from, to)} of the current line. */
    static LineFormatException error(String file, AsciiLineReader lines, int lineBase, int from, int to,
                                     String field, String expected) {
        String text = new String(lines.buffer(), from, to - from, java.nio.charset.StandardCharsets.ISO_8859_1);
        return new LineFormatException(file, lines.lineNumber(), from - lineBase + 1, to - lineBase, field, text,
                expected);
    }
}
