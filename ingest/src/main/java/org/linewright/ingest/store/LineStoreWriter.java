package org.linewright.ingest.store;

import java.io.IOException;
import java.io.InterruptedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.time.Instant;
import java.util.ArrayList;
import java.util.HexFormat;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.TreeMap;
import java.util.UUID;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.line.TextColumn;
import org.linewright.ingest.atomic.AtomicFile;

/**
 * Writes the lines of one source into a line store as one Arrow IPC file sorted by wavenumber (stable for
 * equal wavenumbers), with bounded memory whatever the number of lines.
 *
 * <p>Lines arriving in ascending order (the usual case) stream straight into the file. From the first line
 * out of order on, lines are collected in runs of at most {@code runLines} lines, each sorted in memory and
 * spilled to a temporary Arrow file; {@link #commit} then merges the runs (k-way, ties in input order). A full
 * run is sorted by the caller (its numeric columns) and written on a spill thread while the caller fills the next
 * run (two run buffers, each
 * holding only the stored columns: {@link RunBuffer}).
 *
 * <p>Atomicity: everything is written under temporary names ({@code .partial-...}) in the store directory;
 * {@link #commit} forces the finished file to disk, renames it over the source's file (replacing an earlier
 * ingest of the same source name) and then updates the store index atomically. A crash or {@link #abort()}
 * never leaves a file the store would list; the earlier file stays intact until the rename.
 *
 * <p>Columns: the file holds the columns the source provides (given at {@code create}, normally the reader's
 * {@link org.linewright.ingest.source.LineReader#columnsProvided()}) plus molecule, isotopologue, wavenumber and
 * source line, which every file holds; the temporary runs of the external sort hold the same columns. Columns
 * not stored read back as NaN (numbers) or empty (text). Without a column set, every column is stored.
 *
 * <p>Use: {@code create}, {@code write} batches, {@code commit(counts)}; {@code close()} without commit
 * aborts. Not thread-safe (its spill thread is its own business).
 */
public final class LineStoreWriter implements AutoCloseable {
    /**
     * Default maximum lines per sorted run. Two run buffers take turns (one fills while the other is sorted and
     * written), each holding the stored columns only: ≈ 2 × 30 MB of heap for a 160-character source.
     */
    public static final int DEFAULT_RUN_LINES = 131_072;
    /** Lines per record batch written by the merge. */
    static final int OUTPUT_BATCH_LINES = 65_536;
    /** Lines per record batch of the temporary runs (small, so that the merge reads them in small steps). */
    static final int SPILL_BATCH_LINES = 8_192;
    private static final String PARTIAL_PREFIX = AtomicFile.PARTIAL;
    /** Heap the merge's per-run slices may use together. */
    private static final long MERGE_HEAP_BYTES = 96L << 20;
    /** Heap per line of a {@link LineBatch} (numeric columns plus typical texts), for sizing slices. */
    private static final long BYTES_PER_LINE_ESTIMATE = 360;
    /** Default most runs merged at once (bounds open files and the merge's heap). */
    static final int DEFAULT_MERGE_FAN_IN = 128;
    /** Rows the merge copies into a packed block before spreading them into the output columns (fits L2 cache). */
    private static final int MERGE_BLOCK_ROWS = 1024;
    /** Smallest slice per run, whatever the number of runs (keeps reads efficient). */
    private static final int MIN_MERGE_SLICE_ROWS = 1024;
    private static final Set<LineColumn> ALL_COLUMNS = Set.of(LineColumn.values());

    private final Path storeDir;
    private final String sourceName;
    private final SourceMetadata metadata;
    private final Instant created;
    private final int runLines;
    /** Most runs merged at once; more runs are merged in several passes. */
    private final int mergeFanIn;
    private final Map<String, String> schemaMetadata;
    /** The columns the file and its runs hold, in declaration order. */
    private final LineColumn[] columns;
    /** The file being streamed (final when no line came out of order, else the first run). */
    private ArrowLineFileWriter stream;
    private final List<Path> runs = new ArrayList<>();
    /** The run being filled. */
    private RunBuffer runBuffer;
    /** The other run buffer (allocated with the second run): free, or being written by {@link #spiller}. */
    private RunBuffer spare;
    /** Batch the spill gathers sorted lines into; used by one spill at a time. */
    private LineBatch gather;
    /** Sorts and writes full runs while the caller fills the next one. */
    private ExecutorService spiller;
    /** The spill in progress, if any. */
    private Future<?> pendingSpill;
    private long linesWritten;
    private boolean done;

    private LineStoreWriter(Path storeDir, String sourceName, SourceMetadata metadata, Set<LineColumn> columnsProvided,
                            int runLines, int mergeFanIn) {
        this.storeDir = storeDir;
        this.columns = StoreColumns.stored(columnsProvided);
        this.sourceName = sourceName;
        this.metadata = metadata;
        this.runLines = runLines;
        this.mergeFanIn = mergeFanIn;
        this.created = Instant.now();
        Map<String, String> m = new LinkedHashMap<>();
        m.put(StoreColumns.KEY_STORE_FORMAT, StoreColumns.STORE_FORMAT_VERSION);
        m.put(StoreColumns.KEY_SOURCE_NAME, sourceName);
        m.put(StoreColumns.KEY_SOURCE_FILE, metadata.sourceFileName());
        m.put(StoreColumns.KEY_SOURCE_SHA256, metadata.sourceSha256());
        m.put(StoreColumns.KEY_READER_FORMAT, metadata.readerFormat());
        m.put(StoreColumns.KEY_TOOL_VERSION, metadata.toolVersion());
        m.put(StoreColumns.KEY_CREATED, created.toString());
        m.put(StoreColumns.KEY_SORT_ORDER, StoreColumns.SORT_ORDER_VALUE);
        metadata.creationParameters().forEach((k, v) -> m.put(StoreColumns.PARAM_PREFIX + k, v));
        this.schemaMetadata = m;
    }

    /** Starts writing source {@code sourceName} into the store directory (created if missing), storing every column. */
    public static LineStoreWriter create(Path storeDir, String sourceName, SourceMetadata metadata) throws IOException {
        return create(storeDir, sourceName, metadata, DEFAULT_RUN_LINES);
    }

    /**
     * As {@link #create(Path, String, SourceMetadata)}, storing only {@code columnsProvided} (the columns the source
     * can fill, e.g. {@link org.linewright.ingest.source.LineReader#columnsProvided()}) plus the columns every
     * store file holds (molecule, isotopologue, wavenumber, source line). Values of other columns in the written
     * batches are not stored: they read back as NaN or empty.
     */
    public static LineStoreWriter create(Path storeDir, String sourceName, SourceMetadata metadata,
                                         Set<LineColumn> columnsProvided) throws IOException {
        return create(storeDir, sourceName, metadata, columnsProvided, DEFAULT_RUN_LINES);
    }

    /** As {@link #create(Path, String, SourceMetadata)} with the maximum lines per sorted run of the external sort. */
    public static LineStoreWriter create(Path storeDir, String sourceName, SourceMetadata metadata, int runLines)
            throws IOException {
        return create(storeDir, sourceName, metadata, ALL_COLUMNS, runLines);
    }

    /** As {@link #create(Path, String, SourceMetadata, Set)} with the maximum lines per sorted run of the external sort. */
    public static LineStoreWriter create(Path storeDir, String sourceName, SourceMetadata metadata,
                                         Set<LineColumn> columnsProvided, int runLines) throws IOException {
        Objects.requireNonNull(metadata, "metadata");
        Objects.requireNonNull(columnsProvided, "columnsProvided");
        if (sourceName == null || sourceName.isBlank()) {
            throw new IllegalArgumentException("source name must not be blank");
        }
        if (runLines < 1) {
            throw new IllegalArgumentException("runLines must be positive: " + runLines);
        }
        return create(storeDir, sourceName, metadata, columnsProvided, runLines, DEFAULT_MERGE_FAN_IN);
    }

    /** As {@link #create(Path, String, SourceMetadata, int)} with the most runs merged at once (≥ 2). */
    static LineStoreWriter create(Path storeDir, String sourceName, SourceMetadata metadata, int runLines, int mergeFanIn)
            throws IOException {
        return create(storeDir, sourceName, metadata, ALL_COLUMNS, runLines, mergeFanIn);
    }

    /** As {@link #create(Path, String, SourceMetadata, Set, int)} with the most runs merged at once (≥ 2). */
    static LineStoreWriter create(Path storeDir, String sourceName, SourceMetadata metadata, Set<LineColumn> columnsProvided,
                                  int runLines, int mergeFanIn) throws IOException {
        if (mergeFanIn < 2) {
            throw new IllegalArgumentException("mergeFanIn must be at least 2: " + mergeFanIn);
        }
        Files.createDirectories(storeDir);
        return new LineStoreWriter(storeDir, sourceName, metadata, columnsProvided, runLines, mergeFanIn);
    }

    /**
     * Adds the batch's lines (copied; the batch may be reused). Wavenumbers may come in any order but must
     * be numbers.
     *
     * @throws IllegalArgumentException on a NaN wavenumber or a text column whose row count differs from the batch's
     */
    public void write(LineBatch batch) throws IOException {
        checkOpen();
        int n = batch.size;
        if (n == 0) {
            return;
        }
        double[] wn = batch.wavenumberCm1;
        boolean ascending = true;
        double previous = stream == null ? Double.NEGATIVE_INFINITY : stream.lastWavenumberCm1();
        for (int i = 0; i < n; i++) {
            double w = wn[i];
            if (Double.isNaN(w)) {
                throw new IllegalArgumentException("line without wavenumber (NaN) from source line " + batch.sourceLine[i]);
            }
            ascending &= w >= previous;
            previous = w;
        }
        for (LineColumn c : StoreColumns.COLUMNS) {
            if (c.kind() == LineColumn.Kind.TEXT && c.text(batch).rows() != n) {
                throw new IllegalArgumentException("text column " + c.columnName() + " has " + c.text(batch).rows()
                        + " rows but the batch has " + n);
            }
        }
        if (runBuffer == null && ascending) {
            if (stream == null) {
                stream = new ArrowLineFileWriter(partialPath("lines"), schemaMetadata, columns);
            }
            stream.write(batch);
        } else {
            if (runBuffer == null) {
                runBuffer = new RunBuffer(runLines, columns);
                gather = new LineBatch(Math.min(runLines, SPILL_BATCH_LINES));
            }
            int from = 0;
            while (from < n) {
                from += runBuffer.append(batch, from, n - from);
                if (runBuffer.isFull()) {
                    spillInBackground();
                }
            }
        }
        linesWritten += n;
    }

    /**
     * Hands the full run buffer to the spill thread and continues with the other buffer. At most one spill is in
     * progress: this waits for the previous one (and reports its failure). Runs are listed in input order when
     * handed over, so ties keep their input order in the merge.
     */
    private void spillInBackground() throws IOException {
        RunBuffer full = runBuffer;
        // Sorted here, while the spill thread still writes the previous run: the writing thread has the most work.
        full.sort();
        awaitSpill();
        Path path = partialPath("run");
        runs.add(path);
        if (spare == null) {
            spare = new RunBuffer(runLines, columns);
        }
        runBuffer = spare;
        spare = full;
        if (spiller == null) {
            spiller = Executors.newSingleThreadExecutor(r -> {
                Thread t = new Thread(r, "linewright-spill");
                t.setDaemon(true);
                return t;
            });
        }
        pendingSpill = spiller.submit(() -> {
            writeRun(full, path);
            return null;
        });
    }

    /** Sorts {@code buffer} (stable) and writes it as the temporary run file {@code path}; empties the buffer. */
    private void writeRun(RunBuffer buffer, Path path) throws IOException {
        try (ArrowLineFileWriter run = new ArrowLineFileWriter(path, schemaMetadata, columns)) {
            buffer.writeSorted(run, gather);
            run.finishTemporary();
        }
    }

    /** Waits for the spill in progress, if any, rethrowing its failure. */
    private void awaitSpill() throws IOException {
        Future<?> f = pendingSpill;
        if (f == null) {
            return;
        }
        pendingSpill = null;
        await(f, "writing a sorted run");
    }

    /** Waits for the spill in progress and stops the spill thread; failures are left to the caller's own path. */
    private void stopSpiller() {
        if (pendingSpill != null) {
            try {
                awaitSpill();
            } catch (IOException | RuntimeException ignored) {
                // aborting anyway; the run files are deleted
            }
        }
        if (spiller != null) {
            spiller.shutdown();
            spiller = null;
        }
    }

    /**
     * Finishes the file, makes it the store's file for this source (replacing an earlier one) and updates
     * the index.
     *
     * @return the committed source as the store now lists it
     */
    public SourceInfo commit(IngestCounts counts) throws IOException {
        return commit(counts, metadata.sourceSha256());
    }

    /**
     * As {@link #commit(IngestCounts)}, with the source's SHA-256 known only now: a source is hashed while it
     * is streamed, so its digest is complete only after its last line. The value replaces the one given at
     * {@link #create} in the file's (footer) metadata and in the store index.
     */
    public SourceInfo commit(IngestCounts counts, String sourceSha256) throws IOException {
        checkOpen();
        Objects.requireNonNull(counts, "counts");
        Objects.requireNonNull(sourceSha256, "sourceSha256");
        Map<String, String> completion = new LinkedHashMap<>();
        completion.put(StoreColumns.KEY_SOURCE_SHA256, sourceSha256);
        completion.put(StoreColumns.KEY_RECORDS_READ, Long.toString(counts.recordsRead()));
        completion.put(StoreColumns.KEY_LINES_KEPT, Long.toString(counts.linesKept()));
        completion.put(StoreColumns.KEY_RECORDS_REJECTED, Long.toString(counts.recordsRejected()));
        completion.put(StoreColumns.KEY_DUPLICATES, Long.toString(counts.duplicates()));
        ArrowLineFileWriter finished;
        try {
            if (runBuffer == null) {
                if (stream == null) {
                    stream = new ArrowLineFileWriter(partialPath("lines"), schemaMetadata, columns);
                }
                finished = stream;
                finished.finish(completion);
            } else {
                finished = mergeRuns(completion);
            }
            Path target = storeDir.resolve(fileName(sourceName));
            AtomicFile.rename(finished.path(), target);
            StoreIndex.syncDirectory(storeDir);
            SourceInfo info = StoreIndex.locked(storeDir, () -> {
                TreeMap<String, StoreIndex.Entry> entries = StoreIndex.read(storeDir);
                SourceInfo committed = LineStore.describe(sourceName, ArrowLineFile.open(target));
                entries.put(sourceName, new StoreIndex.Entry(sourceName, target.getFileName().toString(),
                        committed.lines(), committed.minWavenumberCm1(), committed.maxWavenumberCm1(),
                        sourceSha256, metadata.readerFormat()));
                StoreIndex.write(storeDir, entries);
                return committed;
            });
            done = true;
            return info;
        } finally {
            if (!done) {
                abort();
            }
        }
    }

    private ArrowLineFileWriter mergeRuns(Map<String, String> completion) throws IOException {
        if (stream != null) {
            // The lines streamed before the first out-of-order line form the first (oldest) run.
            stream.finishTemporary();
            runs.add(0, stream.path());
            stream = null;
        }
        awaitSpill();
        stopSpiller();
        if (runBuffer.size() > 0) {
            Path last = partialPath("run");
            runs.add(last);
            writeRun(runBuffer, last);
        }
        runBuffer = null;
        spare = null;
        gather = null;
        // Intermediate passes while there are too many runs for one merge: each group of consecutive runs
        // becomes one run, in place, so the runs stay in input order and ties stay stable.
        LineBatch spillBatch = new LineBatch(SPILL_BATCH_LINES);
        while (runs.size() > mergeFanIn) {
            List<Path> pass = new ArrayList<>(runs);
            for (int from = 0; from < pass.size(); from += mergeFanIn) {
                List<Path> group = pass.subList(from, Math.min(pass.size(), from + mergeFanIn));
                Path merged = group.size() == 1 ? group.get(0) : partialPath("run");
                if (group.size() > 1) {
                    // Listed at once so that an abort deletes it too.
                    runs.add(merged);
                    try (ArrowLineFileWriter w = new ArrowLineFileWriter(merged, schemaMetadata, columns)) {
                        mergeInto(group, w, spillBatch, columns);
                        w.finishTemporary();
                    }
                    for (Path p : group) {
                        Files.deleteIfExists(p);
                    }
                    runs.removeAll(group);
                }
                // Moved to the end: after the pass the list holds the pass's outputs in input order.
                runs.remove(merged);
                runs.add(merged);
            }
        }
        ArrowLineFileWriter out = new ArrowLineFileWriter(partialPath("lines"), schemaMetadata, columns);
        stream = out;
        mergeInto(runs, out, new LineBatch(OUTPUT_BATCH_LINES), columns);
        out.finish(completion);
        deleteRuns();
        return out;
    }

    /**
     * k-way merges the sorted run files into {@code out} (ties in run order), on two threads: one lane fills the
     * numeric columns of each output batch, the other its text columns ({@link MergeLane}). Each lane reads the
     * runs' wavenumbers and its own columns and finds the same merge order from the wavenumbers alone, so the
     * lanes need to meet only once per output batch, and the result does not depend on timing.
     */
    private static void mergeInto(List<Path> runFiles, ArrowLineFileWriter out, LineBatch batch, LineColumn[] columns)
            throws IOException {
        List<LineColumn> numericList = new ArrayList<>();
        List<LineColumn> textList = new ArrayList<>();
        for (LineColumn c : columns) {
            (c.kind() == LineColumn.Kind.TEXT ? textList : numericList).add(c);
        }
        LineColumn[] numeric = numericList.toArray(new LineColumn[0]);
        LineColumn[] text = textList.toArray(new LineColumn[0]);
        int lanes = text.length > 0 ? 2 : 1;
        // Each lane's scanner per run holds a slice of its lines (and its packed copy): together within MERGE_HEAP_BYTES.
        int sliceRows = (int) Math.max(MIN_MERGE_SLICE_ROWS, MERGE_HEAP_BYTES
                / ((long) lanes * runFiles.size() * (BYTES_PER_LINE_ESTIMATE + (long) numeric.length * Long.BYTES)));
        LineQuery query = LineQuery.all().withColumns(List.of(columns));
        ExecutorService helper = null;
        try (MergeLane numbers = new MergeLane(runFiles, query, numeric, new LineColumn[0], sliceRows, batch.capacity());
             MergeLane texts = lanes == 2 ? new MergeLane(runFiles, query, new LineColumn[0], text, sliceRows,
                     batch.capacity()) : null) {
            if (texts != null) {
                helper = Executors.newSingleThreadExecutor(r -> {
                    Thread t = new Thread(r, "linewright-merge");
                    t.setDaemon(true);
                    return t;
                });
            }
            while (true) {
                batch.clear();
                Future<Integer> textRows = texts == null ? null : helper.submit(() -> texts.fill(batch));
                int rows;
                try {
                    rows = numbers.fill(batch);
                } catch (IOException | RuntimeException | Error e) {
                    // The text lane must be done with its files before they are closed.
                    if (textRows != null) {
                        try {
                            await(textRows);
                        } catch (IOException | RuntimeException ignored) {
                            // the first failure is the one reported
                        }
                    }
                    throw e;
                }
                if (textRows != null && await(textRows) != rows) {
                    throw new IllegalStateException("merge lanes disagree on the number of lines");
                }
                batch.size = rows;
                if (rows > 0) {
                    out.write(batch);
                }
                if (rows < batch.capacity()) {
                    break;
                }
            }
            batch.clear();
        } finally {
            if (helper != null) {
                helper.shutdownNow();
            }
        }
    }

    private static int await(Future<Integer> f) throws IOException {
        return await(f, "merging sorted runs");
    }

    /** The result of a task of this writer's threads, its failure rethrown as itself (IOException, unchecked). */
    private static <T> T await(Future<T> f, String what) throws IOException {
        try {
            return f.get();
        } catch (InterruptedException e) {
            Thread.currentThread().interrupt();
            throw new InterruptedIOException("interrupted while " + what);
        } catch (ExecutionException e) {
            Throwable cause = e.getCause();
            if (cause instanceof IOException io) {
                throw io;
            }
            if (cause instanceof RuntimeException re) {
                throw re;
            }
            if (cause instanceof Error err) {
                throw err;
            }
            throw new IOException(what + " failed", cause);
        }
    }

    /**
     * One lane of the k-way merge: walks every run in merge order (found on the wavenumbers, ties to the older
     * run) and fills its own columns of the output batches. Numeric columns: each run's slice is packed by row as
     * it is loaded ({@link RunBuffer#pack}), taking a line copies its packed row (one or two cache lines), and
     * blocks of taken rows are spread into the output columns. Text columns are gathered for a stretch of output
     * rows (a stretch ends when the batch is full or a run's slice must be refilled).
     */
    private static final class MergeLane implements AutoCloseable {
        private final LineColumn[] numeric;
        private final LineColumn[] text;
        private final int w;
        private final FileScanner[] scanners;
        private final LineBatch[] slices;
        private final long[][] packed;
        /** Current key of each run; +infinity once the run is exhausted. */
        private final double[] keys;
        private final int[] fromRun;
        private final int[] fromRow;
        private final long[] block;

        MergeLane(List<Path> runFiles, LineQuery query, LineColumn[] numeric, LineColumn[] text, int sliceRows,
                  int capacity) throws IOException {
            this.numeric = numeric;
            this.text = text;
            this.w = numeric.length;
            int k = runFiles.size();
            scanners = new FileScanner[k];
            slices = new LineBatch[k];
            packed = new long[k][];
            keys = new double[k];
            try {
                for (int i = 0; i < k; i++) {
                    scanners[i] = new FileScanner(ArrowLineFile.open(runFiles.get(i)), query, numeric, text, sliceRows);
                    slices[i] = scanners[i].buf;
                    packed[i] = new long[scanners[i].buf.capacity() * w];
                    keys[i] = load(i) ? scanners[i].key() : Double.POSITIVE_INFINITY;
                }
            } catch (IOException | RuntimeException e) {
                close();
                throw e;
            }
            fromRun = new int[capacity];
            fromRow = new int[capacity];
            block = new long[MERGE_BLOCK_ROWS * w];
        }

        /** Makes sure run {@code i} has a line at its position, packing a newly loaded slice; false when exhausted. */
        private boolean load(int i) throws IOException {
            FileScanner s = scanners[i];
            if (s.pos < s.buf.size) {
                return true;
            }
            if (!s.ensure()) {
                return false;
            }
            if (w > 0) {
                RunBuffer.pack(numeric, s.buf, packed[i]);
            }
            return true;
        }

        /**
         * Fills rows {@code [0, n)} of this lane's columns of {@code batch} (text columns empty on entry) with the
         * next merged lines; returns n, less than the batch's capacity only when the runs are exhausted.
         */
        int fill(LineBatch batch) throws IOException {
            int capacity = batch.capacity();
            int k = keys.length;
            int filled = 0;
            // Rows [filled, filled + stretch) are taken; the last blockRows of them wait in block.
            int stretch = 0;
            int blockRows = 0;
            while (filled + stretch < capacity) {
                int best = -1;
                double bestKey = Double.POSITIVE_INFINITY;
                for (int i = 0; i < k; i++) {
                    // Strictly smaller: among equal wavenumbers the lowest run (the oldest input) wins.
                    if (keys[i] < bestKey) {
                        bestKey = keys[i];
                        best = i;
                    }
                }
                if (best < 0) {
                    break;
                }
                FileScanner s = scanners[best];
                if (w > 0) {
                    System.arraycopy(packed[best], s.pos * w, block, blockRows * w, w);
                }
                blockRows++;
                fromRun[stretch] = best;
                fromRow[stretch] = s.pos;
                stretch++;
                s.pos++;
                if (blockRows == MERGE_BLOCK_ROWS) {
                    RunBuffer.spread(numeric, block, blockRows, batch, filled + stretch - blockRows);
                    blockRows = 0;
                }
                boolean refill = s.pos >= s.buf.size;
                if (refill || filled + stretch == capacity) {
                    // Texts gathered before a slice is overwritten or when the output batch is full.
                    RunBuffer.spread(numeric, block, blockRows, batch, filled + stretch - blockRows);
                    blockRows = 0;
                    gatherRows(text, slices, fromRun, fromRow, 0, stretch, batch, filled);
                    filled += stretch;
                    stretch = 0;
                }
                if (refill) {
                    keys[best] = load(best) ? s.key() : Double.POSITIVE_INFINITY;
                } else {
                    keys[best] = s.buf.wavenumberCm1[s.pos];
                }
            }
            if (stretch > 0) {
                RunBuffer.spread(numeric, block, blockRows, batch, filled + stretch - blockRows);
                gatherRows(text, slices, fromRun, fromRow, 0, stretch, batch, filled);
                filled += stretch;
            }
            return filled;
        }

        @Override
        public void close() throws IOException {
            IOException first = null;
            for (FileScanner s : scanners) {
                if (s != null) {
                    try {
                        s.close();
                    } catch (IOException e) {
                        first = first == null ? e : first;
                    }
                }
            }
            if (first != null) {
                throw first;
            }
        }
    }

    /**
     * Copies the stored {@code columns} of rows {@code rows[from..from+n)} of the sources (row {@code i} from
     * {@code sources[fromSource[i]]}, or from {@code sources[0]} when {@code fromSource} is null) to rows
     * {@code [at, at+n)} of {@code dst}, column by column; text rows are appended (dst must hold {@code at}).
     */
    private static void gatherRows(LineColumn[] columns, LineBatch[] sources, int[] fromSource, int[] rows, int from,
                                   int n, LineBatch dst, int at) {
        int k = sources.length;
        for (LineColumn c : columns) {
            switch (c.kind()) {
                case INT -> {
                    int[][] s = new int[k][];
                    for (int j = 0; j < k; j++) {
                        s[j] = c.ints(sources[j]);
                    }
                    int[] d = c.ints(dst);
                    for (int i = 0; i < n; i++) {
                        d[at + i] = s[fromSource == null ? 0 : fromSource[from + i]][rows[from + i]];
                    }
                }
                case LONG -> {
                    long[][] s = new long[k][];
                    for (int j = 0; j < k; j++) {
                        s[j] = c.longs(sources[j]);
                    }
                    long[] d = c.longs(dst);
                    for (int i = 0; i < n; i++) {
                        d[at + i] = s[fromSource == null ? 0 : fromSource[from + i]][rows[from + i]];
                    }
                }
                case DOUBLE -> {
                    double[][] s = new double[k][];
                    for (int j = 0; j < k; j++) {
                        s[j] = c.doubles(sources[j]);
                    }
                    double[] d = c.doubles(dst);
                    for (int i = 0; i < n; i++) {
                        d[at + i] = s[fromSource == null ? 0 : fromSource[from + i]][rows[from + i]];
                    }
                }
                case TEXT -> {
                    TextColumn[] s = new TextColumn[k];
                    for (int j = 0; j < k; j++) {
                        s[j] = c.text(sources[j]);
                    }
                    TextColumn d = c.text(dst);
                    for (int i = 0; i < n; i++) {
                        TextColumn src = s[fromSource == null ? 0 : fromSource[from + i]];
                        int r = rows[from + i];
                        d.append(src.bytes(), src.start(r), src.length(r));
                    }
                }
                default -> throw new AssertionError(c);
            }
        }
    }

    /**
     * Moves every source of the finished store {@code stagedStoreDir} (written by {@link #commit} there, e.g. by a
     * task of a file-parallel ingest) into {@code storeDir}, replacing sources of the same names, and updates the
     * index as a commit does: each file is renamed into place (same file system), then the index is replaced
     * atomically under the store's lock. The files' bytes are not touched.
     */
    public static void adopt(Path storeDir, Path stagedStoreDir) throws IOException {
        Files.createDirectories(storeDir);
        TreeMap<String, StoreIndex.Entry> staged = StoreIndex.read(stagedStoreDir);
        for (StoreIndex.Entry e : staged.values()) {
            AtomicFile.rename(stagedStoreDir.resolve(e.fileName()), storeDir.resolve(e.fileName()));
        }
        StoreIndex.syncDirectory(storeDir);
        StoreIndex.locked(storeDir, () -> {
            TreeMap<String, StoreIndex.Entry> entries = StoreIndex.read(storeDir);
            entries.putAll(staged);
            StoreIndex.write(storeDir, entries);
            return null;
        });
    }

    /** Discards everything written so far; the store is left as it was. Idempotent. */
    public void abort() {
        if (done) {
            return;
        }
        done = true;
        // A run being written must be closed before the run files are deleted.
        stopSpiller();
        if (stream != null) {
            stream.discard();
            stream = null;
        }
        deleteRuns();
        runBuffer = null;
        spare = null;
    }

    /** Aborts unless committed. */
    @Override
    public void close() {
        abort();
    }

    /** Lines accepted so far. */
    public long linesWritten() {
        return linesWritten;
    }

    private void deleteRuns() {
        for (Path run : runs) {
            try {
                Files.deleteIfExists(run);
            } catch (IOException ignored) {
                // a leftover temporary file is never listed by the store
            }
        }
        runs.clear();
    }

    private void checkOpen() {
        if (done) {
            throw new IllegalStateException("writer for source '" + sourceName + "' is already committed or aborted");
        }
    }

    private Path partialPath(String kind) {
        return storeDir.resolve(PARTIAL_PREFIX + kind + "-" + UUID.randomUUID() + ".arrow");
    }

    /**
     * The store file name of a source: {@code lines-<name with unusual characters replaced>-<hash>.arrow},
     * where the hash (8 hex digits of the SHA-256 of the name) keeps distinct names apart.
     */
    static String fileName(String sourceName) {
        StringBuilder slug = new StringBuilder();
        for (int i = 0; i < sourceName.length() && slug.length() < 64; i++) {
            char c = sourceName.charAt(i);
            slug.append((c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z') || (c >= '0' && c <= '9') || c == '-' || c == '_'
                    || (c == '.' && i > 0) ? c : '_');
        }
        try {
            byte[] digest = MessageDigest.getInstance("SHA-256").digest(sourceName.getBytes(StandardCharsets.UTF_8));
            return "lines-" + slug + "-" + HexFormat.of().formatHex(digest, 0, 4) + ".arrow";
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is required of every Java platform", e);
        }
    }
}
