package org.linewright.ingest.store;

import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.line.TextColumn;

/**
 * Streams the lines of several store files as one list in ascending wavenumber order (a k-way merge of the
 * sorted files; lines of equal wavenumber come in file order, then in their order within the file), with the
 * filter and projection of a {@link LineQuery}. Obtained from {@link LineStore#cursor(LineQuery)}; close it
 * when done. Not thread-safe.
 *
 * <p>The merge copies runs of consecutive lines from one file at a time (all lines below the next file's
 * current wavenumber) with bulk array copies; with a single file, whole batches are copied.
 */
public final class LineCursor implements AutoCloseable {
    private final FileScanner[] scanners;
    private final LineColumn[] numeric;
    private final LineColumn[] text;
    private long delivered;

    /** Rows each file's scanner holds at most when reading for the store (a record batch at a time). */
    static final int DEFAULT_SLICE_ROWS = 65_536;

    LineCursor(List<ArrowLineFile> files, LineQuery query, int sliceRows) throws IOException {
        List<LineColumn> num = new ArrayList<>();
        List<LineColumn> txt = new ArrayList<>();
        for (LineColumn c : query.columns()) {
            (c.kind() == LineColumn.Kind.TEXT ? txt : num).add(c);
        }
        this.numeric = num.toArray(new LineColumn[0]);
        this.text = txt.toArray(new LineColumn[0]);
        List<FileScanner> open = new ArrayList<>();
        try {
            for (ArrowLineFile f : files) {
                open.add(new FileScanner(f, query, present(f, numeric), present(f, text), sliceRows));
            }
        } catch (IOException | RuntimeException e) {
            for (FileScanner s : open) {
                try {
                    s.close();
                } catch (IOException suppressed) {
                    e.addSuppressed(suppressed);
                }
            }
            throw e;
        }
        this.scanners = open.toArray(new FileScanner[0]);
    }

    private static LineColumn[] present(ArrowLineFile f, LineColumn[] columns) {
        List<LineColumn> out = new ArrayList<>();
        for (LineColumn c : columns) {
            if (f.has(c)) {
                out.add(c);
            }
        }
        return out.toArray(new LineColumn[0]);
    }

    /**
     * Clears {@code batch} and fills it with up to {@code batch.capacity()} lines, continuing in wavenumber
     * order.
     *
     * @return false when no lines are left (the batch is then empty)
     */
    public boolean read(LineBatch batch) throws IOException {
        batch.clear();
        int capacity = batch.capacity();
        while (batch.size < capacity) {
            FileScanner best = null;
            int bestIndex = -1;
            double bestKey = 0;
            for (int i = 0; i < scanners.length; i++) {
                FileScanner s = scanners[i];
                // Strictly smaller: among equal wavenumbers the lowest file index wins.
                if (s.ensure() && (best == null || s.key() < bestKey)) {
                    best = s;
                    bestIndex = i;
                    bestKey = s.key();
                }
            }
            if (best == null) {
                break;
            }
            double nextKey = Double.POSITIVE_INFINITY;
            int nextIndex = Integer.MAX_VALUE;
            for (int i = 0; i < scanners.length; i++) {
                FileScanner s = scanners[i];
                if (i != bestIndex && s.ensure() && s.key() < nextKey) {
                    nextKey = s.key();
                    nextIndex = i;
                }
            }
            // Take lines of the best file while they precede the other files' current line.
            double[] wn = best.buf.wavenumberCm1;
            int limit = Math.min(best.buf.size, best.pos + capacity - batch.size);
            int end = best.pos;
            boolean takeTies = bestIndex < nextIndex;
            while (end < limit && (wn[end] < nextKey || (takeTies && wn[end] == nextKey))) {
                end++;
            }
            copy(best.buf, best.pos, batch, batch.size, end - best.pos);
            batch.size += end - best.pos;
            best.pos = end;
        }
        delivered += batch.size;
        return batch.size > 0;
    }

    /** Lines delivered so far. */
    public long linesDelivered() {
        return delivered;
    }

    private void copy(LineBatch src, int from, LineBatch dst, int to, int n) {
        for (LineColumn c : numeric) {
            switch (c.kind()) {
                case INT -> System.arraycopy(c.ints(src), from, c.ints(dst), to, n);
                case LONG -> System.arraycopy(c.longs(src), from, c.longs(dst), to, n);
                default -> System.arraycopy(c.doubles(src), from, c.doubles(dst), to, n);
            }
        }
        for (LineColumn c : text) {
            TextColumn s = c.text(src);
            TextColumn d = c.text(dst);
            if (s.rows() == 0 && src.size > 0) {
                // Column absent from this file: empty texts keep the rows aligned.
                d.appendEmpty(n);
                continue;
            }
            d.appendRows(s, from, n);
        }
    }

    @Override
    public void close() throws IOException {
        IOException first = null;
        for (FileScanner s : scanners) {
            try {
                s.close();
            } catch (IOException e) {
                if (first == null) {
                    first = e;
                } else {
                    first.addSuppressed(e);
                }
            }
        }
        if (first != null) {
            throw first;
        }
    }
}
