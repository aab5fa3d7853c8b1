package org.linewright.grid.calc;

import java.io.IOException;
import java.util.ArrayDeque;
import java.util.Queue;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.Executor;
import java.util.concurrent.atomic.AtomicBoolean;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.store.LineCursor;

/**
 * One store's lines for the merge, read ahead in order: up to {@code depth} batches are read from the store's
 * cursor and handed to the worker threads for their {@link LinePreparation} (a fixed number in flight, so memory
 * stays bounded), and are taken back in the order they were read — the order a single thread would prepare them —
 * each reduced into the {@link CrossSectionStatistics} as it becomes the batch being merged. While a batch is still
 * with a worker, the calling thread does the batches no worker has started yet, earliest first, and waits (parks)
 * only when every batch in flight is being worked on. A read or preparation failure is kept with its batch and
 * thrown when that batch's turn comes. Batch buffers come from, and go back to, the calculator's pool.
 */
final class StoreFeed {
    private final LineCursor cursor;
    private final LinePreparation preparation;
    private final CrossSectionStatistics statistics;
    /** The worker threads, or null to prepare every batch on the calling thread as it is read. */
    private final Executor workers;
    private final Queue<PreparedBatch> freeBatches;
    private final int chunkLines;
    private final int depth;
    private final ArrayDeque<Handover> ahead = new ArrayDeque<>();
    private PreparedBatch current;
    private int pos;
    private boolean exhausted;
    /** The lines to keep (null: every line) and this store's index for it. */
    private final LineFilter.Selection selection;
    private final int storeIndex;
    private final LineBatch filterScratch;

    /**
     * @param workers     worker threads, or null for none
     * @param depth       batches read ahead at most
     * @param freeBatches the pool of batch buffers (thread-safe)
     * @param chunkLines  capacity of a new batch buffer
     */
    StoreFeed(LineCursor cursor, LinePreparation preparation, CrossSectionStatistics statistics, Executor workers,
              int depth, Queue<PreparedBatch> freeBatches, int chunkLines) {
        this(cursor, preparation, statistics, workers, depth, freeBatches, chunkLines, null, 0);
    }

    /** As above, keeping only the lines {@code selection} takes of store {@code storeIndex} (null: every line). */
    StoreFeed(LineCursor cursor, LinePreparation preparation, CrossSectionStatistics statistics, Executor workers,
              int depth, Queue<PreparedBatch> freeBatches, int chunkLines, LineFilter.Selection selection,
              int storeIndex) {
        this.selection = selection;
        this.storeIndex = storeIndex;
        this.filterScratch = selection == null ? null : new LineBatch(chunkLines);
        this.cursor = cursor;
        this.preparation = preparation;
        this.statistics = statistics;
        this.workers = workers;
        this.depth = depth;
        this.freeBatches = freeBatches;
        this.chunkLines = chunkLines;
    }

    /**
     * True when a line is available at {@link #position}, taking further batches as needed; tops up the read-ahead
     * of every feed (the merge may need any store next).
     */
    boolean ensure(StoreFeed[] all) throws IOException {
        while (current == null || pos >= current.count) {
            if (current != null) {
                freeBatches.add(current);
                current = null;
            }
            if (ahead.isEmpty()) {
                if (exhausted) {
                    return false;
                }
                readAhead();
                if (ahead.isEmpty()) {
                    return false;
                }
            }
            Handover h = ahead.poll();
            helpUntilDone(h, all);
            h.await();
            current = h.batch;
            pos = 0;
            statistics.reduce(h.batch);
            for (StoreFeed f : all) {
                f.readAhead();
            }
        }
        return true;
    }

    /** The batch being merged (after {@link #ensure} returned true). */
    PreparedBatch current() {
        return current;
    }

    /** Index of the next line to merge in {@link #current}. */
    int position() {
        return pos;
    }

    /** Marks the lines before {@code newPosition} of {@link #current} as merged. */
    void advanceTo(int newPosition) {
        pos = newPosition;
    }

    /** Stored wavenumber of the line at {@link #position} (after {@link #ensure} returned true). */
    double key() {
        return current.keyCm1[pos];
    }

    /**
     * While {@code h} is still with a worker, does the batches no worker has started yet, earliest first, on this
     * thread.
     */
    private static void helpUntilDone(Handover h, StoreFeed[] all) {
        h.runHere();
        for (StoreFeed f : all) {
            for (Handover other : f.ahead) {
                if (h.isDone()) {
                    return;
                }
                other.runHere();
            }
        }
    }

    /** Reads batches until {@link #depth} are ahead or the store is exhausted, handing each to a worker. */
    private void readAhead() {
        while (!exhausted && ahead.size() < depth) {
            PreparedBatch b = freeBatches.poll();
            if (b == null) {
                b = new PreparedBatch(chunkLines);
            }
            b.reset();
            try {
                boolean read = cursor.read(b.lines);
                while (read && selection != null && selection.keep(storeIndex, b.lines, filterScratch) == 0) {
                    read = cursor.read(b.lines);
                }
                if (!read) {
                    exhausted = true;
                    freeBatches.add(b);
                    return;
                }
            } catch (IOException | RuntimeException e) {
                // thrown when this batch's turn comes, as if read then
                exhausted = true;
                b.failure = e;
                ahead.add(Handover.done(b));
                return;
            }
            b.rowsRead = b.lines.size;
            if (workers == null) {
                preparation.prepareOrRecord(b);
                ahead.add(Handover.done(b));
            } else {
                ahead.add(Handover.submit(b, preparation, workers));
            }
        }
    }

    /**
     * Skips the batches no worker has started (after a failure), waits for those being worked on and returns
     * every buffer to the pool.
     */
    void release() {
        for (Handover h : ahead) {
            h.skip();
        }
        for (Handover h : ahead) {
            h.await();
            freeBatches.add(h.batch);
        }
        ahead.clear();
        if (current != null) {
            freeBatches.add(current);
            current = null;
        }
    }

    /** Closes the store's cursor. */
    void close() throws IOException {
        cursor.close();
    }

    /**
     * One batch's preparation in flight. Whoever claims it first — a worker, or the calling thread while it
     * waits — does the work (or skips it when the computation is abandoned). One handover per use of a buffer: a
     * task left in the workers' queue holds its own handover, so it can never touch a later use of the buffer.
     */
    private static final class Handover {
        final PreparedBatch batch;
        /** Null when nothing is pending (prepared already, or failed to read). */
        private final AtomicBoolean claim;
        /** Counted down when the claimed work is finished (or skipped). */
        private final CountDownLatch finished;
        private final LinePreparation preparation;

        private Handover(PreparedBatch batch, LinePreparation preparation, boolean pending) {
            this.batch = batch;
            this.preparation = preparation;
            this.claim = pending ? new AtomicBoolean() : null;
            this.finished = pending ? new CountDownLatch(1) : null;
        }

        /** A batch with nothing left to do. */
        static Handover done(PreparedBatch batch) {
            return new Handover(batch, null, false);
        }

        /** Hands the preparation to the workers (the calling thread may still do it first, see {@link #runHere}). */
        static Handover submit(PreparedBatch batch, LinePreparation preparation, Executor workers) {
            Handover h = new Handover(batch, preparation, true);
            workers.execute(h::work);
            return h;
        }

        private void work() {
            if (claim.compareAndSet(false, true)) {
                try {
                    preparation.prepareOrRecord(batch);
                } finally {
                    finished.countDown();
                }
            }
        }

        /** Does the preparation on the calling thread unless it has been claimed already (then a no-op). */
        void runHere() {
            if (claim != null) {
                work();
            }
        }

        /** Whether the preparation is finished (or was never handed to the workers). */
        boolean isDone() {
            return finished == null || finished.getCount() == 0;
        }

        /** Gives up the preparation unless it has been claimed already: the computation no longer needs it. */
        void skip() {
            if (claim != null && claim.compareAndSet(false, true)) {
                finished.countDown();
            }
        }

        /** Waits for the preparation (uninterruptible: a batch's work is short and its buffer must not be reused early). */
        void await() {
            if (finished == null) {
                return;
            }
            runHere();
            boolean interrupted = false;
            while (true) {
                try {
                    finished.await();
                    break;
                } catch (InterruptedException e) {
                    interrupted = true;
                }
            }
            if (interrupted) {
                Thread.currentThread().interrupt();
            }
        }
    }
}
