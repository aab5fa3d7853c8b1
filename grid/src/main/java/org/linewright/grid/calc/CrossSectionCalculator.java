package org.linewright.grid.calc;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Objects;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.concurrent.LinkedBlockingQueue;
import java.util.concurrent.ThreadPoolExecutor;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.voigt.VanVleckWeisskopfProfile;
import org.linewright.grid.engine.CrossSectionEngine;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.InputException;
import org.linewright.ingest.partition.StoredPartitionFunctions;
import org.linewright.ingest.source.IsotopologueLookup;
import org.linewright.ingest.source.SynchronizedIsotopologueLookup;
import org.linewright.ingest.store.LineQuery;
import org.linewright.ingest.store.LineStore;

/**
 * The one place that turns stored lines into engine input for one (p, T). For a {@link CrossSectionRequest} it
 * reads the lines that can reach the grid — centres within [first point − largest cutoff − shift margin,
 * last point + largest cutoff + shift margin] — from every store, merged in ascending wavenumber order, projected
 * to the columns the physics reads, a batch of {@value #CHUNK_LINES} lines at a time (bounded memory),
 * and per batch computes:
 * <ul>
 *   <li>S(T) with {@link LineIntensity} (partition sums and abundances from an {@link IsotopologueCache});</li>
 *   <li>each background gas's width, exponent and shift with a {@link WidthResolver} (sources tallied), then
 *       γL = p·Σ x_g·γ_g·(296/T)^n_g and δ = p·Σ x_g·δ_g with {@link PressureBroadening};</li>
 *   <li>αD = ν/c·√(2 ln2 kT/m) with {@link DopplerWidth};</li>
 *   <li>the intensity threshold (lines with S(T) below it, or not finite, are dropped and their intensity
 *       reported);</li>
 *   <li>the χ factor: for CO2 lines (molecule 2) when the wing treatment asks for the CO2 χ factor and CO2
 *       (as a foreign gas, or the absorber itself) is in the background, applied to the CO2-broadened share w of
 *       the line's γL only (far wing (1 − w)·V + w·χ·V) and only inside the fit's range of validity
 *       ({@link PerrinHartmannChi#validFor}); lines outside are counted and warned about.</li>
 * </ul>
 * The line shape is conveyed to the engines through the widths: a Doppler-only request zeroes γL, a Lorentz-only
 * request zeroes αD, and the Voigt kernels reduce exactly to the pure shapes in those limits. The Van
 * Vleck–Weisskopf shape travels as a per-line flag ({@link LineChunk#vanVleckWeisskopf}): set on every line with
 * ν₀ &gt; 0 for the {@code vvw} shape, and, with the Voigt or Lorentz shape, on the lines
 * {@link VanVleckWeisskopfProfile#chosenFor} picks (γL/ν₀ &gt; 10⁻⁴ and c₂ν₀/T ≤ 0.2). The exact engine evaluates
 * it; for any other engine those lines are summed directly by an {@link ExactEngine} into the same σ. The area a
 * symmetric shape puts at ν ≤ 0 ({@link WingKernel#negativeFrequencyFraction}) is counted in the wing loss,
 * recorded as {@code negative_wavenumber_loss_fraction} and warned about above 10⁻⁶.
 * Kept lines fill a reused {@link LineChunk} passed to {@link CrossSectionEngine#accumulate}. Lines reach σ only
 * within their cutoff of the shifted centre (the engines apply the {@link WingKernel}).
 *
 * S(T) is rescaled by the request's {@link CrossSectionRequest#intensityScaling} (intensity convention and user
 * abundances): the calculator holds no state of a request, so one calculator serves requests of different
 * scalings, also concurrently.
 *
 * <p>The work is shared out by concept: {@link LinePreparation} (query range, columns and the per-batch physics),
 * {@link StoreFeed} (the ordered read-ahead of one store's batches and their hand-over to the workers),
 * {@link StoreMerge} (the k-way merge of the stores into engine chunks), {@link LineRouter} (which lines the engine
 * sums and which an exact engine beside it) and {@link CrossSectionStatistics} (the reduced statistics and the
 * result's metadata and warnings). This class owns the stores, the registry view, the worker threads and the pool
 * of batch buffers, and runs one computation through them.
 *
 * <p><b>Threads.</b> With {@code threads} &gt; 1 the per-batch physics runs on worker threads while the calling
 * thread reads the stores, merges and feeds the engine: each store is read ahead by up to 2·threads batches (a
 * fixed number of batches in flight, so memory stays bounded), each batch's physics is one task, and the calling
 * thread takes the batches back in exactly the order a single thread would prepare them. The statistics are
 * reduced there, batch after batch and line after line (the same Neumaier sums, counts, width-source tallies and
 * worst-resolution search as on one thread), and the engine receives the same chunks with the same contents, so
 * σ and every statistic are bitwise identical for any thread count. A failure — an {@link InputException} from a
 * width source or the registry, or a read error — is kept with its batch and thrown when that batch's turn comes:
 * the first failure in line order is the one reported, as on one thread. The workers call the lookup one at a
 * time (first sight of each isotopologue only), so it need not be thread-safe.
 *
 * <p>Concurrent {@code compute} calls are safe when the lookup is (each call opens its own cursors; batch buffers
 * are taken from a pool the calculator keeps for reuse between calls); an engine serves one computation at a time.
 * Statistics are accumulated with compensated (Neumaier) sums, and the order of lines is fixed by the stores, so
 * results do not depend on timing.
 */

public final class CrossSectionCalculator {
    /** Lines per batch read from a store and per chunk handed to the engine. */
    public static final int CHUNK_LINES = 16_384;
    /**
     * Extra distance per atm read beyond the cutoff on both sides so that lines pushed into range by their
     * pressure shift are not missed, cm⁻¹/atm. Measured shifts are below 0.1 cm⁻¹/atm (from memory); 1 is safe.
     */
    public static final double SHIFT_MARGIN_CM1_PER_ATM = 1.0;
    /** Batches read ahead per store and worker thread (the bound on memory in flight). */
    static final int BATCHES_AHEAD_PER_THREAD = 2;
    /** Seconds an idle worker thread lives before it ends (no thread outlives a quiet calculator for long). */
    private static final long WORKER_KEEP_ALIVE_SECONDS = 30;
    private final List<LineStore> stores;
    private final IsotopologueLookup lookup;
    private final int threads;
    private final int chunkLines;
    /** Worker threads (none for one thread); idle threads end after {@value #WORKER_KEEP_ALIVE_SECONDS} s. */
    private final ThreadPoolExecutor workers;
    /** Batch buffers of earlier computations, reused instead of allocated per call. */
    private final ConcurrentLinkedQueue<PreparedBatch> freeBatches = new ConcurrentLinkedQueue<>();

    /**
     * A calculator that prepares the lines on the calling thread.
     *
     * @param stores line stores read together (their lines merged in wavenumber order; store order breaks ties)
     * @param lookup the registry with masses, abundances and partition sums (user tables included)
     */
    public CrossSectionCalculator(List<LineStore> stores, IsotopologueLookup lookup) {
        this(stores, lookup, 1);
    }

    /**
     * A calculator that prepares the lines (S(T), widths, shifts, threshold) on {@code threads} worker threads —
     * usually the engine's thread count. The results do not depend on {@code threads}, bit for bit.
     *
     * @param stores  line stores read together (their lines merged in wavenumber order; store order breaks ties)
     * @param lookup  the registry with masses, abundances and partition sums (user tables included)
     * @param threads worker threads, at least 1 (1: everything on the calling thread)
     */
    public CrossSectionCalculator(List<LineStore> stores, IsotopologueLookup lookup, int threads) {
        this(stores, lookup, threads, CHUNK_LINES);
    }


    /** With another batch size (tests use small batches to get many of them from small samples). */
    CrossSectionCalculator(List<LineStore> stores, IsotopologueLookup lookup, int threads, int chunkLines) {
        this.stores = List.copyOf(stores);
        Objects.requireNonNull(lookup, "lookup");
        if (this.stores.isEmpty()) {
            throw new InputException("no line store given (expected at least one store directory)");
        }
        if (threads < 1) {
            throw new IllegalArgumentException("threads must be at least 1: " + threads);
        }
        if (chunkLines < 1) {
            throw new IllegalArgumentException("chunk size must be positive: " + chunkLines);
        }
        this.threads = threads;
        this.chunkLines = chunkLines;
        // The stores' own partition functions (ExoMol-style .pf) apply at every temperature; user tables win.
        IsotopologueLookup withData = StoredPartitionFunctions.withStoredTables(lookup, this.stores);
        this.lookup = threads == 1 ? withData : SynchronizedIsotopologueLookup.of(withData);
        if (threads == 1) {
            this.workers = null;
        } else {
            AtomicInteger count = new AtomicInteger();
            this.workers = new ThreadPoolExecutor(threads, threads, WORKER_KEEP_ALIVE_SECONDS, TimeUnit.SECONDS,
                    new LinkedBlockingQueue<>(), r -> {
                        Thread t = new Thread(r, "linewright-calc-" + count.incrementAndGet());
                        t.setDaemon(true);
                        return t;
                    });
            workers.allowCoreThreadTimeOut(true);
        }
    }

    /** The stores read. */
    public List<LineStore> stores() {
        return stores;
    }

    /** Threads that prepare the lines. */
    public int threads() {
        return threads;
    }

    /**
     * σ for one (p, T), plus statistics. Streams the lines in wavenumber order chunk by chunk (bounded memory).
     *
     * @throws InputException       when a line lacks what the physics needs (a partition sum, a mass, a width)
     * @throws UncheckedIOException when a store cannot be read
     */
    public CrossSectionResult compute(CrossSectionRequest request, CrossSectionEngine engine, ProgressListener l) {
        return compute(request, engine, Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY, l);
    }

    /**
     * Same, restricted to lines whose centres (as stored, before the pressure shift) lie in
     * [{@code lowCm1}, {@code highCm1}) — the table builder's wavenumber blocks: σ of adjacent blocks adds up to
     * σ of their union (up to rounding of the sum).
     *
     * @throws IllegalArgumentException when the range is empty or NaN
     */
    public CrossSectionResult compute(CrossSectionRequest request, CrossSectionEngine engine, double lowCm1,
                                      double highCm1, ProgressListener l) {
        return compute(request, engine, lowCm1, highCm1, l, null);
    }

    /**
     * As {@link #compute(CrossSectionRequest, CrossSectionEngine, double, double, ProgressListener)}, summing only
     * the lines {@code filter} takes (null: every line); the statistics then count only those.
     */
    public CrossSectionResult compute(CrossSectionRequest request, CrossSectionEngine engine, double lowCm1,
                                      double highCm1, ProgressListener l, LineFilter filter) {
        if (!(lowCm1 < highCm1)) {
            throw new IllegalArgumentException("line range [" + lowCm1 + ", " + highCm1 + ") cm-1 is empty or NaN");
        }
        ProgressListener progress = l == null ? ProgressListener.NONE : l;
        long startNanos = System.nanoTime();
        LinePreparation preparation = new LinePreparation(request, lowCm1, highCm1, lookup, chunkLines);
        CrossSectionStatistics statistics = new CrossSectionStatistics(preparation);
        WavenumberGrid grid = request.grid();
        double[] sigma = new double[grid.size()];
        engine.begin(grid, request.pressureAtm(), request.temperatureK());
        List<StoreFeed> open = new ArrayList<>();
        boolean sideSummation;
        try (LineRouter router = new LineRouter(engine, request, threads)) {
            try {
                if (!preparation.readsNothing()) {
                    LineQuery query = preparation.query();
                    LineFilter.Selection selection = null;
                    if (filter != null) {
                        // the filter knows lines by all their numeric columns
                        java.util.LinkedHashSet<org.linewright.ingest.line.LineColumn> columns =
                                new java.util.LinkedHashSet<>(query.columns());
                        columns.addAll(org.linewright.ingest.line.NumericRowBytes.COLUMNS);
                        query = query.withColumns(List.copyOf(columns));
                        selection = filter.start();
                    }
                    int depth = threads == 1 ? 1 : BATCHES_AHEAD_PER_THREAD * threads;
                    for (int s = 0; s < stores.size(); s++) {
                        open.add(new StoreFeed(stores.get(s).cursor(query), preparation, statistics, workers, depth,
                                freeBatches, chunkLines, selection, s));
                    }
                }
                StoreMerge.merge(open.toArray(new StoreFeed[0]), chunkLines, router, sigma, preparation, statistics,
                        progress);
                router.finish(sigma);
                sideSummation = router.usedSideEngine();
            } catch (IOException e) {
                throw new UncheckedIOException(e);
            } finally {
                for (StoreFeed f : open) {
                    f.release();
                }
                for (StoreFeed f : open) {
                    try {
                        f.close();
                    } catch (IOException ignored) {
                        // the result (or the exception in flight) is what matters; the files are read-only
                    }
                }
            }
        }
        engine.finish(sigma);
        progress.progress(statistics.linesRead(), 1.0);
        double seconds = (System.nanoTime() - startNanos) * 1e-9;
        return statistics.result(sigma, engine, seconds, stores, sideSummation);
    }

    /** The shape rule in words, for the metadata of σ files and tables. */
    public static String shapeRule(LineShapeKind shape) {
        return switch (shape) {
            case VAN_VLECK_WEISSKOPF -> "Van Vleck-Weisskopf (1945) shape, (nu/nu0)^2 [V(nu-nu0) + V(nu+nu0)], for "
                    + "every line with nu0 > 0";
            case VOIGT, LORENTZ -> VanVleckWeisskopfProfile.ruleDescription();
            default -> "doppler shape for every line (no pressure width: the Van Vleck-Weisskopf rule never applies)";
        };
    }
}
