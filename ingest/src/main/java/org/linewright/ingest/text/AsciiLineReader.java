package org.linewright.ingest.text;

import java.io.Closeable;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;

/**
 * Reads a byte stream line by line into one reusable buffer: no object per line. After {@link #next()}
 * returns true the current line is {@code buffer()[lineStart(), lineEnd())}, without its terminator
 * ({@code \n} or {@code \r\n}). Lines longer than the buffer make it grow.
 */
public final class AsciiLineReader implements Closeable {
    private static final int DEFAULT_BUFFER_BYTES = 1 << 16;

    private final InputStream in;
    private byte[] buffer;
    /** Valid bytes are buffer[0, limit). */
    private int limit;
    /** Start of the unconsumed bytes. */
    private int position;
    private int lineStart;
    private int lineEnd;
    private long lineNumber;
    private boolean endOfStream;

    public AsciiLineReader(InputStream in) {
        this(in, DEFAULT_BUFFER_BYTES);
    }

    public AsciiLineReader(InputStream in, int initialBufferBytes) {
        this.in = in;
        this.buffer = new byte[Math.max(16, initialBufferBytes)];
    }

    /**
     * Advances to the next line.
     *
     * @return false at the end of the stream (a final line without terminator is still returned)
     */
    public boolean next() throws IOException {
        int scan = position;
        while (true) {
            for (int i = scan; i < limit; i++) {
                if (buffer[i] == '\n') {
                    lineStart = position;
                    lineEnd = i > position && buffer[i - 1] == '\r' ? i - 1 : i;
                    position = i + 1;
                    lineNumber++;
                    return true;
                }
            }
            if (endOfStream) {
                if (position < limit) {
                    lineStart = position;
                    lineEnd = buffer[limit - 1] == '\r' ? limit - 1 : limit;
                    position = limit;
                    lineNumber++;
                    return true;
                }
                return false;
            }
            scan = limit - position;
            fill();
        }
    }

    /** Moves the unconsumed bytes to the front (growing the buffer when full) and reads more. */
    private void fill() throws IOException {
        int remaining = limit - position;
        if (position > 0) {
            System.arraycopy(buffer, position, buffer, 0, remaining);
        } else if (remaining == buffer.length) {
            buffer = Arrays.copyOf(buffer, buffer.length * 2);
        }
        position = 0;
        limit = remaining;
        int n = in.read(buffer, limit, buffer.length - limit);
        if (n < 0) {
            endOfStream = true;
        } else {
            limit += n;
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

    /** 1-based number of the current line. */
    public long lineNumber() {
        return lineNumber;
    }

    /** The current line as text (allocates: for error messages and rejects only). */
    public String lineText() {
        return new String(buffer, lineStart, lineEnd - lineStart, StandardCharsets.ISO_8859_1);
    }

    @Override
    public void close() throws IOException {
        in.close();
    }
}
