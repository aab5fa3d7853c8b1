package org.linewright.ingest.source;

import org.linewright.ingest.InputException;
import org.linewright.ingest.text.ByteLineScanner;
import org.linewright.ingest.text.OffendingText;

/**
 * Bad input, located exactly: the file, the 1-based line, the 1-based column range, the field, the
 * offending text and what was expected. {@link #getMessage()} is the one line shown to the user, e.g.
 * {@code lines.par:12:cols 4-15: field wavenumber: "12.3x4" is not a number (expected F12.6)}.
 * Problems that concern a whole file (empty, wrong format, corrupt compression) use line 0 and no columns. The
 * offending text is escaped and cut by {@link OffendingText}.
 */
public final class LineFormatException extends InputException {
    private final String file;
    private final long lineNumber;
    private final int firstColumn;
    private final int lastColumn;
    private final String field;
    private final String offendingText;
    private final String expected;

    public LineFormatException(String file, long lineNumber, int firstColumn, int lastColumn,
                               String field, String offendingText, String expected) {
        this(file, lineNumber, firstColumn, lastColumn, field, offendingText, expected, null);
    }

    public LineFormatException(String file, long lineNumber, int firstColumn, int lastColumn,
                               String field, String offendingText, String expected, Throwable cause) {
        super(format(file, lineNumber, firstColumn, lastColumn, field, offendingText, expected), cause);
        this.file = file;
        this.lineNumber = lineNumber;
        this.firstColumn = firstColumn;
        this.lastColumn = lastColumn;
        this.field = field;
        this.offendingText = offendingText;
        this.expected = expected;
    }

    /** A whole-file problem (empty file, wrong format, corrupt or truncated compressed stream). */
    public static LineFormatException ofFile(String file, String problem, Throwable cause) {
        return new LineFormatException(file, 0, 0, 0, null, null, problem, cause);
    }

    /**
     * A bad field {@code lines.buffer()[from, to)} of the current line of {@code lines}: the columns are counted
     * from the line's start, the offending text is the field's bytes.
     */
    public static LineFormatException atField(String file, ByteLineScanner lines, int from, int to, String field,
                                              String expected) {
        int base = lines.lineStart();
        return new LineFormatException(file, lines.lineNumber(), from - base + 1, to - base, field,
                lines.text(from, to), expected);
    }

    /** The reason without the file and line prefix, as written to a rejects file. */
    public String reason() {
        return format(null, 0, firstColumn, lastColumn, field, offendingText, expected);
    }

    private static String format(String file, long line, int c0, int c1, String field, String text, String expected) {
        StringBuilder sb = new StringBuilder();
        if (file != null) {
            sb.append(file);
            if (line > 0) {
                sb.append(':').append(line);
            }
        }
        if (c0 > 0) {
            if (sb.length() > 0) {
                sb.append(':');
            }
            sb.append(c0 == c1 ? "col " + c0 : "cols " + c0 + "-" + c1);
        }
        if (sb.length() > 0) {
            sb.append(": ");
        }
        if (field != null) {
            sb.append("field ").append(field).append(": ");
        }
        if (text != null) {
            sb.append(OffendingText.quote(text)).append(' ');
        }
        if (expected != null) {
            sb.append(text != null ? "(expected " + expected + ")" : expected);
        }
        return sb.toString().trim();
    }

    public String file() { return file; }
    public long lineNumber() { return lineNumber; }
    public int firstColumn() { return firstColumn; }
    public int lastColumn() { return lastColumn; }
    public String field() { return field; }
    public String offendingText() { return offendingText; }
    public String expected() { return expected; }
}
