package org.linewright.ingest.pipeline;

import java.io.IOException;
import java.io.InterruptedIOException;
import java.util.concurrent.ArrayBlockingQueue;
import java.util.concurrent.BlockingQueue;
import java.util.function.LongConsumer;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.source.LineReader;
import org.linewright.ingest.store.LineStoreWriter;

/**
 * Overlaps parsing and storing: a reader thread fills batches from a small pool while the calling thread writes
 * them to the store, in the order read. Three batches circulate (one being filled, one being written, one
 * waiting), so memory stays at three batches whatever the size of the source. A failure on either side stops
 * both and is rethrown on the calling thread as it was thrown.
 */
final class BatchHandoff {
    private static final int POOL = 3;
    /** Marks the end of the stream (or a failure of the reader thread). */
    private static final LineBatch END = new LineBatch(1);

    private final LineReader reader;
    private final BlockingQueue<LineBatch> free = new ArrayBlockingQueue<>(POOL);
    private final BlockingQueue<LineBatch> filled = new ArrayBlockingQueue<>(POOL + 1);
    private volatile Throwable readerFailure;
    private volatile long recordsRead;

    BatchHandoff(LineReader reader, int batchCapacity) {
        this.reader = reader;
        for (int i = 0; i < POOL; i++) {
            free.add(new LineBatch(batchCapacity));
        }
    }

    /** Reads the whole source into {@code writer}; {@code progress} gets the records read after each batch. */
    void drainInto(LineStoreWriter writer, LongConsumer progress) throws IOException {
        Thread thread = new Thread(this::readAll, "linewright-reader");
        thread.setDaemon(true);
        thread.start();
        boolean finished = false;
        try {
            while (true) {
                LineBatch batch = filled.take();
                if (batch == END) {
                    break;
                }
                writer.write(batch);
                progress.accept(recordsRead);
                free.put(batch);
            }
            thread.join();
            finished = true;
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new InterruptedIOException("ingest interrupted");
        } finally {
            if (!finished) {
                thread.interrupt();
            }
        }
        Throwable failure = readerFailure;
        if (failure instanceof IOException io) {
            throw io;
        }
        if (failure instanceof RuntimeException re) {
            throw re;
        }
        if (failure instanceof Error err) {
            throw err;
        }
    }

    private void readAll() {
        try {
            while (true) {
                LineBatch batch = free.take();
                boolean more = reader.read(batch);
                recordsRead = reader.recordsRead();
                if (!more) {
                    break;
                }
                filled.put(batch);
            }
        } catch (InterruptedException e) {
            // The writing side stopped first; it reports its own failure.
            Thread.currentThread().interrupt();
        } catch (IOException | RuntimeException | Error e) {
            readerFailure = e;
        } finally {
            // Always room: at most POOL batches plus this marker are ever queued.
            filled.offer(END);
        }
    }
}
