package org.linewright.ingest.text;

import java.io.Closeable;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;

/**
 * Splits a byte stream into lines over one large reusable buffer, without an object per line. A line ends
 * at LF; a CR before the LF is not part of the line (LF and CRLF files read alike); the last line may lack
 * its terminator. After {@link #next()} returns true the current line is
 * {@code buffer()[lineStart(), lineEnd())}, valid until the next call. Lines longer than the buffer make it
 * grow. {@link #splitOnBlanks} splits the current line into blank-separated fields for the formats written
 * as free-format columns.
 */
public final class ByteLineScanner implements Closeable {
    /** Default buffer size: large enough for thousands of records per refill. */
    public static final int DEFAULT_BUFFER_BYTES = 1 << 20;

    private final InputStream in;
    private byte[] buffer;
    private int position;
    private int limit;
    private boolean endOfInput;
    private int lineStart;
    private int lineEnd;
    private long lineNumber;

    public ByteLineScanner(InputStream in) {
        this(in, DEFAULT_BUFFER_BYTES);
    }

    public ByteLineScanner(InputStream in, int bufferBytes) {
        this.in = in;
        this.buffer = new byte[Math.max(256, bufferBytes)];
    }

    /**
     * Advances to the next line.
     *
     * @return false at the end of the input
     */
    public boolean next() throws IOException {
        int scanFrom = position;
        while (true) {
            byte[] b = buffer;
            for (int i = scanFrom; i < limit; i++) {
                if (b[i] == '\n') {
                    setLine(position, i);
                    position = i + 1;
                    return true;
                }
            }
            if (endOfInput) {
                if (position < limit) {
                    setLine(position, limit);
                    position = limit;
                    return true;
                }
                return false;
            }
            // the bytes scanned so far hold no LF: after the refill moves them to the front, resume behind them
            int scanned = limit - position;
            fill();
            scanFrom = scanned;
        }
    }

    private void setLine(int start, int end) {
        lineStart = start;
        lineEnd = end > start && buffer[end - 1] == '\r' ? end - 1 : end;
        lineNumber++;
    }

    private void fill() throws IOException {
        int remaining = limit - position;
        if (position > 0) {
            System.arraycopy(buffer, position, buffer, 0, remaining);
        } else if (remaining == buffer.length) {
            // a line longer than the buffer: grow rather than split it
            byte[] bigger = new byte[buffer.length * 2];
            System.arraycopy(buffer, 0, bigger, 0, remaining);
            buffer = bigger;
        }
        position = 0;
        limit = remaining;
        while (limit < buffer.length) {
            int n = in.read(buffer, limit, buffer.length - limit);
            if (n < 0) {
                endOfInput = true;
                return;
            }
            limit += n;
            if (n > 0) {
                return;
            }
        }
    }

    public byte[] buffer() {
        return buffer;
    }

    public int lineStart() {
        return lineStart;
    }

    public int lineEnd() {
        return lineEnd;
    }

    public int lineLength() {
        return lineEnd - lineStart;
    }

    /** 1-based number of the current line. */
    public long lineNumber() {
        return lineNumber;
    }

    /** True when the current line holds only blanks (spaces, tabs, stray CRs) or nothing. */
    public boolean isBlank() {
        return isBlank(buffer, lineStart, lineEnd);
    }

    /** True when {@code bytes[from, to)} holds only blanks (spaces, tabs, stray CRs) or nothing. */
    public static boolean isBlank(byte[] bytes, int from, int to) {
        for (int i = from; i < to; i++) {
            if (!isBlank(bytes[i])) {
                return false;
            }
        }
        return true;
    }

    /**
     * Splits the current line into fields separated by runs of blanks (spaces, tabs, stray CRs), without
     * allocating: field {@code k} is {@code buffer()[start[k], end[k])}.
     *
     * @param start receives the start of each field (its length is the most fields wanted)
     * @param end receives the end of each field
     * @return the number of fields, or {@code start.length + 1} when the line holds more fields than fit
     */
    public int splitOnBlanks(int[] start, int[] end) {
        return splitOnBlanks(buffer, lineStart, lineEnd, start, end);
    }

    /**
     * Splits {@code bytes[from, to)} into fields separated by runs of blanks (spaces, tabs, stray CRs), without
     * allocating: field {@code k} is {@code bytes[start[k], end[k])}.
     *
     * @return the number of fields, or {@code start.length + 1} when there are more fields than fit
     */
    public static int splitOnBlanks(byte[] bytes, int from, int to, int[] start, int[] end) {
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

    private static boolean isBlank(byte b) {
        return b == ' ' || b == '\t' || b == '\r';
    }

    /** The current line as text (allocates; for error reports and rejects). */
    public String lineText() {
        return new String(buffer, lineStart, lineEnd - lineStart, StandardCharsets.UTF_8);
    }

    /** The bytes {@code buffer()[from, to)} of the current line as text (allocates; for error reports). */
    public String text(int from, int to) {
        return new String(buffer, from, to - from, StandardCharsets.UTF_8);
    }

    /** Closes the underlying stream. */
    @Override
    public void close() throws IOException {
        in.close();
    }
}
