package org.linewright.reference.compare;

import java.io.IOException;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.line.TextColumn;
import org.linewright.ingest.store.LineCursor;

/**
 * A sliding window over one list streamed in wavenumber order: whole batches read from a {@link LineCursor} are
 * held as chunks, lines are addressed by their global index in the list, and chunks before a given index are
 * released (and reused) once the caller is done with them. Each line carries a 64-bit hash of its identity
 * (species and the four quantum labels) and a "done" mark.
 */
final class LineWindow implements AutoCloseable {
    static final int CHUNK_ROWS = 4096;

    private final LineCursor cursor;
    private final ArrayDeque<Chunk> chunks = new ArrayDeque<>();
    private final List<Chunk> spare = new ArrayList<>();
    /** Global index of the first line of the first chunk held. */
    private long base;
    /** Global index one past the last line loaded. */
    private long end;
    private boolean exhausted;
    private Chunk[] view = new Chunk[0];
    private boolean viewStale = true;

    LineWindow(LineCursor cursor) {
        this.cursor = cursor;
    }

    /** One batch and its per-line marks. */
    static final class Chunk {
        final LineBatch batch = new LineBatch(CHUNK_ROWS);
        final long[] identity = new long[CHUNK_ROWS];
        final boolean[] done = new boolean[CHUNK_ROWS];
        /** Global index of the previous line held with the same identity hash, or −1. */
        final long[] previousSame = new long[CHUNK_ROWS];
        /** The batch's arrays of {@link #NUMERIC_COMPARED}, looked up once (the batch's arrays never change). */
        final double[][] numeric = new double[NUMERIC_COMPARED.length][];
        /** The batch's columns of {@link #TEXT_COMPARED}. */
        final TextColumn[] text = new TextColumn[TEXT_COMPARED.length];

        Chunk() {
            for (int k = 0; k < numeric.length; k++) {
                numeric[k] = NUMERIC_COMPARED[k].doubles(batch);
            }
            for (int k = 0; k < text.length; k++) {
                text[k] = TEXT_COMPARED[k].text(batch);
            }
        }
    }

    /** Numeric fields compared between paired lines: every double column. */
    static final LineColumn[] NUMERIC_COMPARED = Arrays.stream(LineColumn.values())
            .filter(c -> c.kind() == LineColumn.Kind.DOUBLE).toArray(LineColumn[]::new);
    /** Text fields compared between paired lines: every text column. */
    static final LineColumn[] TEXT_COMPARED = Arrays.stream(LineColumn.values())
            .filter(c -> c.kind() == LineColumn.Kind.TEXT).toArray(LineColumn[]::new);

    /*
     * Identity index: an open-addressing table (linear probing) from identity hash to the global index of the
     * newest line with that hash; older lines with the hash follow through Chunk.previousSame. Entries of released
     * lines go stale and are skipped; the table is rebuilt from the lines held once stale entries could dominate.
     */
    private long[] tableKeys = new long[1 << 12];
    private long[] tableHeads = filled(1 << 12);
    private int tableEntries;

    /** Loads batches until a line beyond {@code wavenumberCm1} is held or the list ends. */
    void loadBeyond(double wavenumberCm1) throws IOException {
        while (!exhausted && (end == base || !(wavenumber(end - 1) > wavenumberCm1))) {
            loadOne();
        }
    }

    /** Loads one more batch; false at the end of the list. */
    boolean loadOne() throws IOException {
        if (exhausted) {
            return false;
        }
        Chunk c = spare.isEmpty() ? new Chunk() : spare.remove(spare.size() - 1);
        if (!cursor.read(c.batch)) {
            exhausted = true;
            spare.add(c);
            return false;
        }
        for (int r = 0; r < c.batch.size; r++) {
            c.identity[r] = identityHash(c.batch, r);
            c.done[r] = false;
        }
        chunks.addLast(c);
        long first = end;
        end += c.batch.size;
        viewStale = true;
        if (2L * tableEntries + 2L * c.batch.size > tableKeys.length) {
            rebuildIndex(first);
        }
        for (int r = 0; r < c.batch.size; r++) {
            c.previousSame[r] = insert(c.identity[r], first + r);
        }
        return true;
    }

    /** The newest held line with this identity hash, or −1; older ones follow with {@link #previousSame}. */
    long newestWithIdentity(long identity) {
        int mask = tableKeys.length - 1;
        for (int slot = spread(identity) & mask; tableHeads[slot] >= 0; slot = (slot + 1) & mask) {
            if (tableKeys[slot] == identity) {
                long head = tableHeads[slot];
                return head >= base ? head : -1;
            }
        }
        return -1;
    }

    /** The next older held line with the same identity hash as line {@code index}, or −1. */
    long previousSame(long index) {
        long p = chunk(index).previousSame[row(index)];
        return p >= base ? p : -1;
    }

    /** Inserts a line; returns the previous head for its hash (or −1). */
    private long insert(long identity, long index) {
        int mask = tableKeys.length - 1;
        int slot = spread(identity) & mask;
        while (tableHeads[slot] >= 0) {
            if (tableKeys[slot] == identity) {
                long previous = tableHeads[slot];
                tableHeads[slot] = index;
                return previous;
            }
            slot = (slot + 1) & mask;
        }
        tableKeys[slot] = identity;
        tableHeads[slot] = index;
        tableEntries++;
        return -1;
    }

    /** Rebuilds the table from the held lines before {@code upTo}, sized for them and the next chunk. */
    private void rebuildIndex(long upTo) {
        long held = Math.max(0, upTo - base);
        int capacity = Integer.highestOneBit((int) Math.min(1 << 30, Math.max(1 << 12, 4 * (held + CHUNK_ROWS)))) * 2;
        tableKeys = new long[capacity];
        tableHeads = filled(capacity);
        tableEntries = 0;
        for (long g = base; g < upTo; g++) {
            Chunk c = chunk(g);
            int r = row(g);
            c.previousSame[r] = insert(c.identity[r], g);
        }
    }

    private static long[] filled(int n) {
        long[] a = new long[n];
        Arrays.fill(a, -1L);
        return a;
    }

    private static int spread(long h) {
        // the identity is already a 64-bit hash: fold its halves for the table index
        return (int) (h ^ (h >>> 32));
    }

    /** Global index one past the last line loaded. */
    long end() {
        return end;
    }

    /** Releases the chunks lying wholly before global index {@code index}. */
    void releaseBefore(long index) {
        while (!chunks.isEmpty() && base + chunks.peekFirst().batch.size <= index) {
            Chunk c = chunks.removeFirst();
            base += c.batch.size;
            spare.add(c);
            viewStale = true;
        }
    }

    Chunk chunk(long index) {
        if (viewStale) {
            view = chunks.toArray(new Chunk[0]);
            viewStale = false;
        }
        // every chunk but the last holds CHUNK_ROWS lines (the cursor fills a batch unless the list ends)
        return view[(int) ((index - base) / CHUNK_ROWS)];
    }

    /** The row of line {@code index} in its chunk. */
    int row(long index) {
        return (int) ((index - base) % CHUNK_ROWS);
    }

    double wavenumber(long index) {
        return chunk(index).batch.wavenumberCm1[row(index)];
    }

    /** The first held index whose wavenumber is at least {@code wavenumberCm1} (binary search). */
    long lowerBound(double wavenumberCm1) {
        long lo = base;
        long hi = end;
        while (lo < hi) {
            long mid = (lo + hi) >>> 1;
            if (wavenumber(mid) < wavenumberCm1) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    /** FNV-1a over species and the four quantum labels: equal lines hash equal; equality is then checked bytewise. */
    static long identityHash(LineBatch b, int r) {
        long h = 0xcbf29ce484222325L;
        h = mix(h, b.moleculeId[r]);
        h = mix(h, b.isotopologue[r]);
        h = mix(h, b.upperGlobalQuanta, r);
        h = mix(h, b.lowerGlobalQuanta, r);
        h = mix(h, b.upperLocalQuanta, r);
        return mix(h, b.lowerLocalQuanta, r);
    }

    private static long mix(long h, int v) {
        for (int k = 0; k < 4; k++) {
            h ^= (v >>> (8 * k)) & 0xff;
            h *= 0x100000001b3L;
        }
        return h;
    }

    private static long mix(long h, TextColumn c, int r) {
        if (c.rows() <= r) {
            return mix(h, -1);
        }
        byte[] d = c.bytes();
        int s = c.start(r);
        int n = c.length(r);
        for (int i = s; i < s + n; i++) {
            h ^= d[i] & 0xff;
            h *= 0x100000001b3L;
        }
        // the length separates the labels, so "ab"+"c" differs from "a"+"bc"
        return mix(h, n);
    }

    @Override
    public void close() throws IOException {
        cursor.close();
    }
}
