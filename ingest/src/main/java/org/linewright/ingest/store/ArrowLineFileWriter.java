package org.linewright.ingest.store;

import org.linewright.ingest.registry.SpeciesKey;
import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.BitSet;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.TreeSet;
import org.apache.arrow.memory.BufferAllocator;
import org.apache.arrow.memory.RootAllocator;
import org.apache.arrow.vector.VectorSchemaRoot;
import org.apache.arrow.vector.ipc.ArrowFileWriter;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;

/**
 * Writes one Arrow IPC file of lines whose wavenumbers never decrease, one record batch per
 * {@link #write(LineBatch)}, and adds per-batch wavenumber ranges, the line count and the isotopologues
 * present to the schema metadata when the file ends (see {@link CompletedSchemaFileWriter}). Used for finished store files and for the sorted runs of the external sort.
 */
final class ArrowLineFileWriter implements AutoCloseable {
    /** Isotopologue numbers below this bound are tracked in a bit set; larger ones in a tree set. */
    private static final int ISO_SLOTS = 1024;

    private final Path path;
    /** The columns written, in schema order. */
    private final LineColumn[] columns;
    private final BufferAllocator allocator;
    private final VectorSchemaRoot root;
    private final FileChannel channel;
    private final ArrowFileWriter writer;
    /** Metadata completed at the end; the Arrow writer adds it to the footer's schema. */
    private final Map<String, String> completion = new LinkedHashMap<>();
    private final StringBuilder batchIndex = new StringBuilder();
    private final BitSet isotopologueBits = new BitSet();
    private final TreeSet<Long> otherIsotopologues = new TreeSet<>();
    private long lines;
    private double minWavenumberCm1 = Double.NaN;
    private double lastWavenumberCm1 = Double.NEGATIVE_INFINITY;
    private boolean closed;
    /** Bytes of the file already handed to the background flush. */
    private long flushRequestedBytes;
    /** The background flush in progress, if any. */
    private java.util.concurrent.Future<?> pendingFlush;
    /** A failure of a background flush, reported by {@link #finish}. */
    private volatile IOException flushFailure;

    /**
     * Written data is flushed to disk in the background every this many bytes, so the disk works while lines are
     * still being parsed and the final fsync has only the tail left (the kernel would otherwise keep gigabytes of
     * dirty pages until then).
     */
    private static final long FLUSH_STEP_BYTES = 64L << 20;
    /** One daemon thread for the background flushes of every file. */
    private static final java.util.concurrent.ExecutorService FLUSHER =
            java.util.concurrent.Executors.newSingleThreadExecutor(r -> {
                Thread t = new Thread(r, "linewright-store-flush");
                t.setDaemon(true);
                return t;
            });

    /**
     * @param columns the columns the file holds, in schema (declaration) order; the batch's other columns are not
     *                written (readers see them as NaN or empty)
     */
    ArrowLineFileWriter(Path path, Map<String, String> schemaMetadata, LineColumn[] columns) throws IOException {
        this.path = path;
        this.columns = columns.clone();
        BufferAllocator a = new RootAllocator();
        VectorSchemaRoot r = null;
        FileChannel ch = null;
        try {
            r = VectorSchemaRoot.create(StoreColumns.schema(schemaMetadata, this.columns), a);
            ch = FileChannel.open(path, StandardOpenOption.CREATE_NEW, StandardOpenOption.WRITE);
            ArrowFileWriter w = new CompletedSchemaFileWriter(r, ch, completion);
            w.start();
            this.allocator = a;
            this.root = r;
            this.channel = ch;
            this.writer = w;
        } catch (IOException | RuntimeException e) {
            closeQuietly(ch);
            if (r != null) {
                r.close();
            }
            a.close();
            Files.deleteIfExists(path);
            throw e;
        }
    }

    Path path() {
        return path;
    }

    long lines() {
        return lines;
    }

    double lastWavenumberCm1() {
        return lastWavenumberCm1;
    }

    /** Writes the batch as one record batch; its wavenumbers must not decrease, nor start below the last. */
    void write(LineBatch batch) throws IOException {
        int n = batch.size;
        if (n == 0) {
            return;
        }
        double[] wn = batch.wavenumberCm1;
        double previous = lastWavenumberCm1;
        for (int i = 0; i < n; i++) {
            if (!(wn[i] >= previous)) {
                throw new IllegalStateException("lines out of wavenumber order at row " + i + ": " + wn[i] + " after " + previous);
            }
            previous = wn[i];
        }
        int[] mol = batch.moleculeId;
        int[] iso = batch.isotopologue;
        int lastMol = Integer.MIN_VALUE;
        int lastIso = Integer.MIN_VALUE;
        for (int i = 0; i < n; i++) {
            // Consecutive rows mostly share their isotopologue: only record changes.
            if (mol[i] != lastMol || iso[i] != lastIso) {
                lastMol = mol[i];
                lastIso = iso[i];
                if (lastMol >= 0 && lastIso >= 0 && lastIso < ISO_SLOTS && lastMol < Integer.MAX_VALUE / ISO_SLOTS) {
                    isotopologueBits.set(lastMol * ISO_SLOTS + lastIso);
                } else {
                    otherIsotopologues.add(SpeciesKey.of(lastMol, lastIso));
                }
            }
        }
        StoreColumns.fill(root, batch, columns);
        writer.writeBatch();
        requestFlushIfDue();
        if (lines == 0) {
            minWavenumberCm1 = wn[0];
        }
        lines += n;
        lastWavenumberCm1 = wn[n - 1];
        if (batchIndex.length() > 0) {
            batchIndex.append(';');
        }
        batchIndex.append(n).append(' ').append(wn[0]).append(' ').append(wn[n - 1]);
    }

    /** Ends the file, its schema completed with the summary and {@code extra}, forces it to disk and closes it. */
    void finish(Map<String, String> extra) throws IOException {
        finish(extra, true);
    }

    /**
     * Ends and closes a temporary file (a sorted run of the external sort) without forcing it to disk: it is read
     * back and deleted by the same process, and a crash never lets the store list it, so an fsync would only cost
     * time.
     */
    void finishTemporary() throws IOException {
        finish(Map.of(), false);
    }

    private void finish(Map<String, String> extra, boolean durable) throws IOException {
        completion.put(StoreColumns.KEY_LINES, Long.toString(lines));
        completion.put(StoreColumns.KEY_WAVENUMBER_MIN, Double.toString(lines == 0 ? Double.NaN : minWavenumberCm1));
        completion.put(StoreColumns.KEY_WAVENUMBER_MAX, Double.toString(lines == 0 ? Double.NaN : lastWavenumberCm1));
        completion.put(StoreColumns.KEY_BATCHES, batchIndex.toString());
        completion.put(StoreColumns.KEY_ISOTOPOLOGUES, isotopologueList());
        completion.putAll(extra);
        writer.end();
        awaitFlush();
        if (flushFailure != null) {
            throw flushFailure;
        }
        if (durable) {
            channel.force(true);
        }
        close();
    }

    private void requestFlushIfDue() throws IOException {
        long written = channel.position();
        if (written - flushRequestedBytes >= FLUSH_STEP_BYTES && (pendingFlush == null || pendingFlush.isDone())) {
            flushRequestedBytes = written;
            pendingFlush = FLUSHER.submit(() -> {
                try {
                    channel.force(false);
                } catch (java.nio.channels.ClosedChannelException closedMeanwhile) {
                    // the file was discarded; nothing to flush
                } catch (IOException e) {
                    flushFailure = e;
                }
            });
        }
    }

    private void awaitFlush() throws IOException {
        if (pendingFlush == null) {
            return;
        }
        try {
            pendingFlush.get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new java.io.InterruptedIOException("interrupted while flushing " + path);
        } catch (java.util.concurrent.ExecutionException e) {
            throw new IOException("flushing " + path + " failed", e.getCause());
        }
    }

    private String isotopologueList() {
        StringBuilder sb = new StringBuilder();
        for (int k = isotopologueBits.nextSetBit(0); k >= 0; k = isotopologueBits.nextSetBit(k + 1)) {
            sb.append(sb.length() > 0 ? " " : "").append(k / ISO_SLOTS).append('/').append(k % ISO_SLOTS);
        }
        for (long key : otherIsotopologues) {
            sb.append(sb.length() > 0 ? " " : "").append(SpeciesKey.label(key));
        }
        return sb.toString();
    }

    /** Closes without finishing when not finished (the file then has no footer: never a valid store file). */
    @Override
    public void close() throws IOException {
        if (closed) {
            return;
        }
        closed = true;
        try {
            channel.close();
        } finally {
            root.close();
            allocator.close();
        }
    }

    /** Closes and deletes the unfinished file. */
    void discard() {
        try {
            close();
        } catch (IOException ignored) {
            // the file is deleted below either way
        }
        try {
            Files.deleteIfExists(path);
        } catch (IOException ignored) {
            // an unfinished temporary file has no footer and is never listed by the store
        }
    }

    private static void closeQuietly(FileChannel ch) {
        if (ch != null) {
            try {
                ch.close();
            } catch (IOException ignored) {
                // already failing
            }
        }
    }
}
