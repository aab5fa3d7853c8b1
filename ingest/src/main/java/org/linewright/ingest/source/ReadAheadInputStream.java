package org.linewright.ingest.source;

import java.io.IOException;
import java.io.InputStream;
import java.io.InterruptedIOException;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.BlockingQueue;

/**
 * Reads a slow stream (a bzip2 or xz decompressor) on a background thread, a few chunks ahead of the
 * consumer, so that decompression overlaps parsing. Errors of the source are re-thrown to the consumer at
 * the point in the data where they occurred; nothing is dropped.
 */
final class ReadAheadInputStream extends InputStream {
    private static final int CHUNK_BYTES = 1 << 20;
    private static final int CHUNKS_AHEAD = 4;

    /** One chunk of data, or the end of the data, or the failure that ended it. */
    private static final class Chunk {
        final byte[] data;
        final int length;
        final IOException failure;

        Chunk(byte[] data, int length, IOException failure) {
            this.data = data;
            this.length = length;
            this.failure = failure;
        }
    }

    private static final Chunk END = new Chunk(new byte[0], 0, null);

    private final BlockingQueue<Chunk> queue = new ArrayBlockingQueue<>(CHUNKS_AHEAD);
    private final Thread producer;
    private final InputStream source;
    private volatile boolean closed;
    private Chunk current;
    private int position;
    private boolean finished;
    private IOException failure;

    ReadAheadInputStream(InputStream source, String threadName) {
        this.source = source;
        this.producer = new Thread(this::produce, threadName);
        producer.setDaemon(true);
        producer.start();
    }

    private void produce() {
        try {
            while (!closed) {
                byte[] data = new byte[CHUNK_BYTES];
                int length = 0;
                int n = 0;
                while (length < data.length && (n = source.read(data, length, data.length - length)) >= 0) {
                    length += n;
                }
                if (length > 0) {
                    queue.put(new Chunk(data, length, null));
                }
                if (n < 0) {
                    queue.put(END);
                    return;
                }
            }
        } catch (IOException e) {
            offerQuietly(new Chunk(null, 0, e));
        } catch (RuntimeException e) {
            offerQuietly(new Chunk(null, 0, new IOException(e.getMessage(), e)));
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
    }

    private void offerQuietly(Chunk chunk) {
        try {
            queue.put(chunk);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
    }

    private boolean ensureData() throws IOException {
        if (failure != null) {
            throw failure; // again on every read: never a short read after a failure
        }
        if (finished) {
            return false;
        }
        while (current == null || position == current.length) {
            try {
                current = queue.take();
            } catch (InterruptedException e) {
                Thread.currentThread().interrupt();
                throw new InterruptedIOException("interrupted while waiting for decompressed data");
            }
            position = 0;
            if (current.failure != null) {
                failure = current.failure;
                throw failure;
            }
            if (current == END) {
                finished = true;
                return false;
            }
        }
        return true;
    }

    @Override
    public int read() throws IOException {
        if (!ensureData()) {
            return -1;
        }
        return current.data[position++] & 0xff;
    }

    @Override
    public int read(byte[] b, int off, int len) throws IOException {
        if (len == 0) {
            return 0;
        }
        if (!ensureData()) {
            return -1;
        }
        int n = Math.min(len, current.length - position);
        System.arraycopy(current.data, position, b, off, n);
        position += n;
        return n;
    }

    @Override
    public void close() throws IOException {
        if (closed) {
            return;
        }
        closed = true;
        producer.interrupt();
        queue.clear();
        try {
            producer.join(10_000);
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
        }
        source.close();
    }
}
