package org.linewright.ingest.source;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;

/**
 * Splits a byte stream into lines over one large reusable buffer, without an object per line. A line ends
 * at LF; a CR before the LF is not part of the line (LF and CRLF files read alike); the last line may lack
 * its terminator. After {@link #next()} returns true the current line is
 * {@code buffer()[lineStart(), lineEnd())}, valid until the next call.
 */
public final class ByteLineScanner {
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
        while (true) {
            byte[] b = buffer;
            for (int i = position; i < limit; i++) {
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
            fill();
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

    /** True when the current line holds only spaces and tabs (or nothing). */
    public boolean isBlank() {
        for (int i = lineStart; i < lineEnd; i++) {
            if (buffer[i] != ' ' && buffer[i] != '\t') {
                return false;
            }
        }
        return true;
    }

    /** The current line as text (allocates; for error reports and rejects). */
    public String lineText() {
        return new String(buffer, lineStart, lineEnd - lineStart, StandardCharsets.UTF_8);
    }
}
