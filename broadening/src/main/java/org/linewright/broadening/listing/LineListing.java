package org.linewright.broadening.listing;

import java.io.IOException;
import java.util.Arrays;
import org.linewright.broadening.intensity.LineIntensity;
import org.linewright.broadening.isotopologue.IsotopologueCache;
import org.linewright.broadening.sources.WidthSourceTally;
import org.linewright.ingest.InputException;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.source.IsotopologueLookup;
import org.linewright.ingest.store.LineCursor;
import org.linewright.ingest.store.LineQuery;
import org.linewright.ingest.store.LineStore;

/**
 * Selects the lines of a store — a wavenumber window, a molecule or isotopologue, the N strongest — and gives them
 * what the physics gives them: the intensity at a temperature and the width every line gets in a chosen
 * background ({@link ListingValues}). Lines come out in wavenumber order whatever the selection. Streams the store
 * (twice for {@code strongest}: once to rank, once to list), so memory stays bounded by one batch plus N ranks.
 * Knows no file format: a {@link Sink} receives the batches (the grid module's listing writer writes them as a
 * table, CSV or Arrow).
 */
public final class LineListing {
    private static final int BATCH = 8192;

    /**
     * What a listing did.
     *
     * @param linesListed lines delivered
     * @param linesInSelection lines in the window and species selection (before {@code strongest})
     * @param widthSourcesOrNull how many lines each width source served, per gas (null without a background)
     */
    public record Summary(long linesListed, long linesInSelection, WidthSourceTally widthSourcesOrNull) { }

    /** Receives the selected lines, batch by batch, with their computed values. */
    public interface Sink {
        /** Called once before the first batch, with the (still empty) computed values and their columns. */
        void begin(ListingValues values) throws IOException;

        /** One batch of selected lines; {@code values} holds their computed values, row for row. */
        void accept(LineBatch lines, ListingValues values) throws IOException;
    }

    private LineListing() {
    }

    /**
     * Streams the lines selected by {@code request} into {@code sink}.
     *
     * @param lookup isotopologue data (Q(T), abundances, masses) for the computed values
     */
    public static Summary stream(LineStore store, LineListingRequest request, IsotopologueLookup lookup, Sink sink)
            throws IOException {
        LineQuery query = query(request);
        long[] selected = request.strongest() > 0 ? strongestSequence(store, query, request, lookup) : null;
        ListingValues values = new ListingValues(request, lookup, BATCH);
        LineBatch batch = new LineBatch(BATCH);
        LineBatch chosen = new LineBatch(BATCH);
        int[] rows = new int[BATCH];
        long seq = 0;
        int nextSelected = 0;
        long listed = 0;
        try (LineCursor cursor = store.cursor(query)) {
            sink.begin(values);
            while (cursor.read(batch)) {
                LineBatch out = batch;
                if (selected != null) {
                    int m = 0;
                    for (int i = 0; i < batch.size; i++, seq++) {
                        if (nextSelected < selected.length && selected[nextSelected] == seq) {
                            rows[m++] = i;
                            nextSelected++;
                        }
                    }
                    chosen.clear();
                    chosen.gatherRows(batch, rows, 0, m);
                    chosen.size = m;
                    out = chosen;
                }
                if (out.size == 0) {
                    continue;
                }
                values.compute(out);
                sink.accept(out, values);
                listed += out.size;
            }
            return new Summary(listed, cursor.linesDelivered(), values.tally());
        }
    }

    /**
     * Positions and intensities of the selected lines — S(T) when the request has a temperature, else S(296 K) —
     * in wavenumber order, for a stick spectrum. At most {@code maxLines} lines: a larger selection is cut to its
     * {@code maxLines} strongest.
     *
     * @return {wavenumbers in cm⁻¹, intensities in cm/molecule}
     */
    public static double[][] sticks(LineStore store, LineListingRequest request, IsotopologueLookup lookup, int maxLines)
            throws IOException {
        LineQuery query = query(request).withColumns(LineQuery.CROSS_SECTION_COLUMNS);
        int limit = request.strongest() > 0 ? Math.min(request.strongest(), maxLines) : maxLines;
        LineListingRequest ranked = new LineListingRequest(request.lowCm1(), request.highCm1(), request.moleculeId(),
                request.isotopologue(), limit, request.temperatureK(), null, null);
        long[] selected = strongestSequence(store, query, ranked, lookup);
        double[] nu = new double[selected.length];
        double[] s = new double[selected.length];
        IsotopologueCache cache = Double.isNaN(request.temperatureK()) ? null
                : new IsotopologueCache(lookup, request.temperatureK());
        LineBatch batch = new LineBatch(BATCH);
        double[] key = new double[BATCH];
        long seq = 0;
        int next = 0;
        try (LineCursor cursor = store.cursor(query)) {
            while (cursor.read(batch) && next < selected.length) {
                rankingIntensity(batch, cache, key);
                for (int i = 0; i < batch.size; i++, seq++) {
                    if (next < selected.length && selected[next] == seq) {
                        nu[next] = batch.wavenumberCm1[i];
                        s[next] = key[i];
                        next++;
                    }
                }
            }
        }
        return new double[][] {Arrays.copyOf(nu, next), Arrays.copyOf(s, next)};
    }

    private static LineQuery query(LineListingRequest r) {
        LineQuery q = LineQuery.all();
        if (Double.isFinite(r.lowCm1()) || Double.isFinite(r.highCm1())) {
            q = q.withWavenumberRange(r.lowCm1(), r.highCm1());
        }
        if (r.moleculeId() > 0) {
            q = r.isotopologue() > 0 ? q.withIsotopologue(r.moleculeId(), r.isotopologue()) : q.withMolecules(r.moleculeId());
        } else if (r.isotopologue() > 0) {
            throw new InputException("isotopologue " + r.isotopologue() + " given without a molecule");
        }
        return q;
    }

    /**
     * First pass for {@code strongest}: the stream positions of the N largest ranking intensities (ties broken by
     * position, earlier first), sorted ascending. A binary min-heap on primitive arrays.
     */
    private static long[] strongestSequence(LineStore store, LineQuery query, LineListingRequest request,
                                            IsotopologueLookup lookup) throws IOException {
        int n = request.strongest();
        double[] heapKey = new double[n];
        long[] heapSeq = new long[n];
        int heapSize = 0;
        LineBatch batch = new LineBatch(BATCH);
        double[] key = new double[BATCH];
        IsotopologueCache cache = Double.isNaN(request.temperatureK()) ? null
                : new IsotopologueCache(lookup, request.temperatureK());
        long seq = 0;
        try (LineCursor cursor = store.cursor(query.withColumns(LineQuery.CROSS_SECTION_COLUMNS))) {
            while (cursor.read(batch)) {
                rankingIntensity(batch, cache, key);
                for (int i = 0; i < batch.size; i++, seq++) {
                    double k = Double.isNaN(key[i]) ? Double.NEGATIVE_INFINITY : key[i];
                    if (heapSize < n) {
                        heapKey[heapSize] = k;
                        heapSeq[heapSize] = seq;
                        siftUp(heapKey, heapSeq, heapSize++);
                    } else if (k > heapKey[0]) {
                        // Strictly greater: on ties the earlier line (already in the heap) stays.
                        heapKey[0] = k;
                        heapSeq[0] = seq;
                        siftDown(heapKey, heapSeq, heapSize);
                    }
                }
            }
        }
        long[] result = Arrays.copyOf(heapSeq, heapSize);
        Arrays.sort(result);
        return result;
    }

    private static void rankingIntensity(LineBatch batch, IsotopologueCache cacheOrNull, double[] out) {
        if (cacheOrNull == null) {
            System.arraycopy(batch.intensityCmPerMolecule, 0, out, 0, batch.size);
        } else {
            LineIntensity.atTemperature(batch, cacheOrNull, out);
        }
    }

    // Min-heap ordered by key, then by later sequence first, so the root is the line to evict.
    private static boolean below(double[] k, long[] s, int a, int b) {
        return k[a] < k[b] || (k[a] == k[b] && s[a] > s[b]);
    }

    private static void siftUp(double[] k, long[] s, int i) {
        while (i > 0) {
            int parent = (i - 1) >>> 1;
            if (!below(k, s, i, parent)) {
                return;
            }
            swap(k, s, i, parent);
            i = parent;
        }
    }

    private static void siftDown(double[] k, long[] s, int size) {
        int i = 0;
        while (true) {
            int l = 2 * i + 1;
            int r = l + 1;
            int m = i;
            if (l < size && below(k, s, l, m)) {
                m = l;
            }
            if (r < size && below(k, s, r, m)) {
                m = r;
            }
            if (m == i) {
                return;
            }
            swap(k, s, i, m);
            i = m;
        }
    }

    private static void swap(double[] k, long[] s, int a, int b) {
        double tk = k[a];
        k[a] = k[b];
        k[b] = tk;
        long ts = s[a];
        s[a] = s[b];
        s[b] = ts;
    }

}
