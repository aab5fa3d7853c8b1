package org.linewright.reference.compare;

import java.io.IOException;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.List;

import org.linewright.ingest.line.LineBatch;
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
    }

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
        end += c.batch.size;
        viewStale = true;
        return true;
    }

    boolean exhausted() {
        return exhausted;
    }

    /** Global index of the first line held. */
    long first() {
        return base;
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

    static int row(long index, long base) {
        return (int) ((index - base) % CHUNK_ROWS);
    }

    int row(long index) {
        return row(index, base);
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
