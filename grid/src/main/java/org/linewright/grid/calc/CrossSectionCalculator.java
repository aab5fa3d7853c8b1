package org.linewright.grid.calc;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayDeque;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.EnumSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Set;
import java.util.StringJoiner;
import java.util.concurrent.ConcurrentLinkedQueue;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.Executor;
import java.util.concurrent.LinkedBlockingQueue;
import java.util.concurrent.ThreadPoolExecutor;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicBoolean;
import java.util.concurrent.atomic.AtomicInteger;
import org.linewright.broadening.background.BackgroundGas;
import org.linewright.broadening.intensity.CompensatedSum;
import org.linewright.broadening.background.Composition;
import org.linewright.broadening.intensity.IntensityScaling;
import org.linewright.broadening.intensity.LineIntensity;
import org.linewright.broadening.isotopologue.IsotopologueCache;
import org.linewright.broadening.sources.ResolvedWidths;
import org.linewright.broadening.sources.WidthResolver;
import org.linewright.broadening.sources.WidthSourceTally;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.voigt.VanVleckWeisskopfProfile;
import org.linewright.broadening.width.DopplerWidth;
import org.linewright.broadening.width.PressureBroadening;
import org.linewright.broadening.wings.ChiFactorKind;
import org.linewright.broadening.wings.PerrinHartmannChi;
import org.linewright.broadening.wings.WingCutoff;
import org.linewright.broadening.wings.WingKernel;
import org.linewright.grid.engine.CrossSectionEngine;
import org.linewright.grid.engine.LineChunk;
import org.linewright.grid.engine.exact.ExactEngine;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.InputException;
import org.linewright.ingest.ToolVersion;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.partition.StoredPartitionFunctions;
import org.linewright.ingest.source.IsotopologueLookup;
import org.linewright.ingest.source.SynchronizedIsotopologueLookup;
import org.linewright.ingest.store.LineCursor;
import org.linewright.ingest.store.LineQuery;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.units.PhysicalConstants;

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
    /**
     * Every column the physics may read: S(296 K) or A and g' for S(T), E'', the widths, exponents and shifts of
     * every broadener, the J and K numbers the broadening rules and tables use, the source line for messages.
     * A request reads only those of its background's gases ({@link #columnsFor}).
     */
    static final Set<LineColumn> PHYSICS_COLUMNS = LineQuery.CROSS_SECTION_COLUMNS;
    /** HITRAN molecule number of CO2 (common practice), whose lines the CO2 χ factor applies to. */
    static final int CO2_MOLECULE_ID = 2;

    /** Line fates in a prepared batch. */
    private static final byte BELOW_THRESHOLD = 0;
    private static final byte WITHOUT_WIDTH = 1;
    private static final byte USED = 2;

    private final List<LineStore> stores;
    private final IsotopologueLookup lookup;
    private final int threads;
    private final int chunkLines;
    /** Convention and user abundances applied to S(T) of every line (docs/physics.md, "Per molecule of what"). */
    private volatile IntensityScaling intensityScaling = IntensityScaling.NATURAL;
    /** Worker threads (none for one thread); idle threads end after {@value #WORKER_KEEP_ALIVE_SECONDS} s. */
    private final ThreadPoolExecutor workers;
    /** Batch buffers of earlier computations, reused instead of allocated per call. */
    private final ConcurrentLinkedQueue<Batch> freeBatches = new ConcurrentLinkedQueue<>();

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

    /**
     * Sets the intensity convention and user isotopologue abundances for the following computations (default:
     * per molecule of the natural-abundance species, registry abundances).
     *
     * @return this calculator
     */
    public CrossSectionCalculator withIntensityScaling(IntensityScaling scaling) {
        this.intensityScaling = Objects.requireNonNull(scaling, "scaling");
        return this;
    }

    /** The intensity convention and user abundances in use. */
    public IntensityScaling intensityScaling() {
        return intensityScaling;
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
        if (!(lowCm1 < highCm1)) {
            throw new IllegalArgumentException("line range [" + lowCm1 + ", " + highCm1 + ") cm-1 is empty or NaN");
        }
        ProgressListener progress = l == null ? ProgressListener.NONE : l;
        long startNanos = System.nanoTime();
        Run run = new Run(request, lowCm1, highCm1);
        WavenumberGrid grid = request.grid();
        double[] sigma = new double[grid.size()];
        engine.begin(grid, request.pressureAtm(), request.temperatureK());
        List<Feed> open = new ArrayList<>();
        try {
            if (run.queryMinCm1 <= run.queryMaxCm1) {
                LineQuery query = request.selection().applyTo(LineQuery.all()
                        .withWavenumberRange(run.queryMinCm1, run.queryMaxCm1)
                        .withColumns(run.columns));
                for (LineStore store : stores) {
                    open.add(new Feed(run, store.cursor(query)));
                }
            }
            merge(run, open.toArray(new Feed[0]), engine, sigma, progress);
            run.finishVanVleckWeisskopf(sigma);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        } finally {
            run.closeVanVleckWeisskopf();
            for (Feed f : open) {
                f.release();
            }
            for (Feed f : open) {
                try {
                    f.cursor.close();
                } catch (IOException ignored) {
                    // the result (or the exception in flight) is what matters; the files are read-only
                }
            }
        }
        engine.finish(sigma);
        progress.progress(run.linesRead, 1.0);
        double seconds = (System.nanoTime() - startNanos) * 1e-9;
        return run.result(sigma, engine, seconds);
    }

    /** K-way merge of the stores' prepared lines into engine chunks, ascending in stored wavenumber. */
    private void merge(Run run, Feed[] sources, CrossSectionEngine engine, double[] sigma,
                       ProgressListener progress) throws IOException {
        LineChunk chunk = new LineChunk(chunkLines);
        double lastKey = Double.NaN;
        while (true) {
            int best = -1;
            double bestKey = 0;
            for (int i = 0; i < sources.length; i++) {
                // strictly smaller: among equal wavenumbers the earlier store wins
                if (sources[i].ensure(sources) && (best < 0 || sources[i].key() < bestKey)) {
                    best = i;
                    bestKey = sources[i].key();
                }
            }
            if (best < 0) {
                break;
            }
            double nextKey = Double.POSITIVE_INFINITY;
            int nextIndex = Integer.MAX_VALUE;
            for (int i = 0; i < sources.length; i++) {
                if (i != best && sources[i].ensure(sources) && sources[i].key() < nextKey) {
                    nextKey = sources[i].key();
                    nextIndex = i;
                }
            }
            Batch s = sources[best].current;
            boolean takeTies = best < nextIndex;
            int from = sources[best].pos;
            int end = from;
            int limit = Math.min(s.count, from + chunk.capacity() - chunk.size);
            while (end < limit && (s.keyCm1[end] < nextKey || (takeTies && s.keyCm1[end] == nextKey))) {
                end++;
            }
            // a run of consecutive lines of one store: bulk copies
            int n = end - from;
            int c = chunk.size;
            System.arraycopy(s.centerCm1, from, chunk.centerCm1, c, n);
            System.arraycopy(s.usedIntensity, from, chunk.intensityCmPerMolecule, c, n);
            System.arraycopy(s.usedDoppler, from, chunk.dopplerHwhmCm1, c, n);
            System.arraycopy(s.usedLorentz, from, chunk.lorentzHwhmCm1, c, n);
            System.arraycopy(s.usedChi, from, chunk.chiFactor, c, n);
            System.arraycopy(s.usedVanVleckWeisskopf, from, chunk.vanVleckWeisskopf, c, n);
            System.arraycopy(s.usedChiExempt, from, chunk.chiExemptShare, c, n);
            chunk.size += n;
            sources[best].pos = end;
            if (n > 0) {
                lastKey = s.keyCm1[end - 1];
            }
            if (chunk.size == chunk.capacity()) {
                run.feed(engine, chunk, sigma);
                chunk.size = 0;
                progress.progress(run.linesRead, run.fractionDone(lastKey));
            }
        }
        if (chunk.size > 0) {
            run.feed(engine, chunk, sigma);
            chunk.size = 0;
        }
    }

    /**
     * Largest cutoff distance any line can have under {@code cutoff} at this pressure, cm⁻¹ (infinite when the
     * policy is unbounded or unknown).
     */
    static double maxCutoffCm1(WingCutoff cutoff, double pressureAtm) {
        return cutoff.maxDistanceCm1(pressureAtm);
    }

    /**
     * The columns a request reads: {@link #PHYSICS_COLUMNS} without the foreign-broadener columns of gases absent
     * from its background (the width resolver reads a gas's columns only when the gas is present).
     */
    static Set<LineColumn> columnsFor(Composition composition) {
        EnumSet<LineColumn> set = EnumSet.copyOf(PHYSICS_COLUMNS);
        for (BackgroundGas gas : BackgroundGas.values()) {
            if (gas.lineBroadener() != null && !(composition.fraction(gas) > 0)) {
                set.removeAll(List.of(LineColumn.foreignColumns(gas.lineBroadener())));
            }
        }
        return set;
    }

    /**
     * One batch of one store: the lines as read, their physics, and the lines that reach σ. Filled by a worker
     * (or the calling thread), read by the calling thread once the physics is finished ({@link #await}).
     */
    private static final class Batch {
        final LineBatch lines;
        /** S(T) and fate of each row of {@link #lines} (after the range filter). */
        final double[] intensity;
        final byte[] fate;
        /** S(T)·(fraction of the profile lost to the wing treatment) of each used row. */
        final double[] lostIntensity;
        /** The used lines, in order: stored wavenumber (the merge key), shifted centre, S(T), widths, χ flag. */
        final double[] keyCm1;
        final double[] centerCm1;
        final double[] usedIntensity;
        final double[] usedDoppler;
        final double[] usedLorentz;
        final boolean[] usedChi;
        final boolean[] usedVanVleckWeisskopf;
        final double[] usedChiExempt;
        /** S(T)·(fraction of the profile at ν ≤ 0, where no grid reaches) of each used Voigt-shaped row. */
        final double[] negativeIntensity;
        int rowsRead;
        int rows;
        int count;
        long belowThreshold;
        long withoutWidth;
        long vanVleckWeisskopfLines;
        long vanVleckWeisskopfOutsideLimit;
        long chiOutsideValidity;
        /** This batch's smallest HWHM / spacing (first such line) and that line's widths and spacing. */
        double worstResolution;
        double worstHwhmCm1;
        double worstDopplerCm1;
        double worstSpacingCm1;
        /** The read or physics failure of this batch, thrown when its turn comes. */
        Throwable failure;
        /**
         * This use's claim on the physics: whoever sets it first — a worker, or the calling thread while it waits —
         * does the work (or skips it when the computation is abandoned). Null when nothing is pending. A task left in
         * the workers' queue holds the claim of its own use, so it can never touch a later use of the buffers.
         */
        private AtomicBoolean claim;
        /** Counted down when the claimed work is finished (or skipped). */
        private CountDownLatch finished;
        private Run owner;

        Batch(int capacity) {
            lines = new LineBatch(capacity);
            intensity = new double[capacity];
            fate = new byte[capacity];
            lostIntensity = new double[capacity];
            keyCm1 = new double[capacity];
            centerCm1 = new double[capacity];
            usedIntensity = new double[capacity];
            usedDoppler = new double[capacity];
            usedLorentz = new double[capacity];
            usedChi = new boolean[capacity];
            usedVanVleckWeisskopf = new boolean[capacity];
            usedChiExempt = new double[capacity];
            negativeIntensity = new double[capacity];
        }

        void reset() {
            rowsRead = 0;
            rows = 0;
            count = 0;
            belowThreshold = 0;
            withoutWidth = 0;
            vanVleckWeisskopfLines = 0;
            vanVleckWeisskopfOutsideLimit = 0;
            chiOutsideValidity = 0;
            worstResolution = Double.POSITIVE_INFINITY;
            worstHwhmCm1 = Double.NaN;
            worstDopplerCm1 = Double.NaN;
            worstSpacingCm1 = Double.NaN;
            failure = null;
            claim = null;
            finished = null;
            owner = null;
        }

        /** Hands the physics to the workers (the calling thread may still do it first, see {@link #runHere}). */
        void submit(Executor workers, Run run) {
            AtomicBoolean c = new AtomicBoolean();
            CountDownLatch f = new CountDownLatch(1);
            claim = c;
            finished = f;
            owner = run;
            workers.execute(() -> work(c, f, run));
        }

        private void work(AtomicBoolean c, CountDownLatch f, Run run) {
            if (c.compareAndSet(false, true)) {
                try {
                    run.prepareOrRecord(this);
                } finally {
                    f.countDown();
                }
            }
        }

        /** Does the physics on the calling thread unless it has been claimed already (then a no-op). */
        void runHere() {
            if (claim != null) {
                work(claim, finished, owner);
            }
        }

        /** Whether the physics is finished (or was never handed to the workers). */
        boolean isDone() {
            return finished == null || finished.getCount() == 0;
        }

        /** Gives up the physics unless it has been claimed already: the computation no longer needs it. */
        void skip() {
            if (claim != null && claim.compareAndSet(false, true)) {
                finished.countDown();
            }
        }

        /** Waits for the physics (uninterruptible: a batch's work is short and its buffers must not be reused early). */
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

    /** One store's cursor, its batches read ahead (in order) and the batch being merged. */
    private final class Feed {
        final Run run;
        final LineCursor cursor;
        final ArrayDeque<Batch> ahead = new ArrayDeque<>();
        final int depth;
        Batch current;
        int pos;
        boolean exhausted;

        Feed(Run run, LineCursor cursor) {
            this.run = run;
            this.cursor = cursor;
            this.depth = threads == 1 ? 1 : BATCHES_AHEAD_PER_THREAD * threads;
        }

        /**
         * True when a line is available at {@link #pos}, taking further batches as needed; tops up the read-ahead
         * of every feed (the merge may need any store next).
         */
        boolean ensure(Feed[] all) throws IOException {
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
                Batch b = ahead.poll();
                helpUntilDone(b, all);
                b.await();
                current = b;
                pos = 0;
                run.reduce(b);
                for (Feed f : all) {
                    f.readAhead();
                }
            }
            return true;
        }

        /**
         * While {@code b} is still with a worker, does the batches no worker has started yet, earliest first, on
         * this thread: the calling thread waits (parks) only when every batch in flight is being worked on, which
         * keeps hand-overs few on a busy machine.
         */
        private void helpUntilDone(Batch b, Feed[] all) {
            b.runHere();
            for (Feed f : all) {
                for (Batch other : f.ahead) {
                    if (b.isDone()) {
                        return;
                    }
                    other.runHere();
                }
            }
        }

        /** Stored wavenumber of the line at {@link #pos} (after {@link #ensure} returned true). */
        double key() {
            return current.keyCm1[pos];
        }

        /** Reads batches until {@link #depth} are ahead or the store is exhausted, handing each to a worker. */
        void readAhead() {
            while (!exhausted && ahead.size() < depth) {
                Batch b = freeBatches.poll();
                if (b == null) {
                    b = new Batch(chunkLines);
                }
                b.reset();
                try {
                    if (!cursor.read(b.lines)) {
                        exhausted = true;
                        freeBatches.add(b);
                        return;
                    }
                } catch (IOException | RuntimeException e) {
                    // thrown when this batch's turn comes, as if read then
                    exhausted = true;
                    b.failure = e;
                    ahead.add(b);
                    return;
                }
                b.rowsRead = b.lines.size;
                ahead.add(b);
                if (workers == null) {
                    run.prepareOrRecord(b);
                } else {
                    b.submit(workers, run);
                }
            }
        }

        /**
         * Skips the batches no worker has started (after a failure), waits for those being worked on and returns
         * every buffer to the pool.
         */
        void release() {
            for (Batch b : ahead) {
                b.skip();
            }
            for (Batch b : ahead) {
                b.await();
                freeBatches.add(b);
            }
            ahead.clear();
            if (current != null) {
                freeBatches.add(current);
                current = null;
            }
        }
    }

    /**
     * The per-thread tools of the physics for one computation: registry values at T, a width resolver (with its
     * tally) and scratch arrays. Taken by one batch at a time.
     */
    private static final class Physics {
        final IsotopologueCache isotopologues;
        final WidthResolver resolver;
        final ResolvedWidths widths;
        final double[] doppler;
        final double[] lorentz;
        final double[] shift;
        final IntensityScaling.Applier scaling;

        Physics(IsotopologueLookup lookup, CrossSectionRequest request, int capacity, IntensityScaling scaling) {
            isotopologues = new IsotopologueCache(lookup, request.temperatureK());
            this.scaling = scaling.newApplier();
            resolver = request.widths().newResolver(request.composition());
            widths = resolver.newResult(capacity);
            doppler = new double[capacity];
            lorentz = new double[capacity];
            shift = new double[capacity];
        }
    }

    /** The state of one computation: the request's constants, the per-thread tools and the reduced statistics. */
    private final class Run {
        final CrossSectionRequest request;
        /** The scaling of this computation, read once: every batch's tools use the same one. */
        final IntensityScaling scaling = intensityScaling;
        final double lowCm1;
        final double highCm1;
        final double queryMinCm1;
        final double queryMaxCm1;
        final double pressureAtm;
        final double temperatureK;
        final LineShapeKind shape;
        final WingKernel kernel;
        final WingKernel kernelNoChi;
        final boolean chiForCo2Lines;
        final double threshold;
        final Set<LineColumn> columns;
        final double gridFirstCm1;
        final double gridLastCm1;
        final boolean uniform;
        final double spacingParameter;
        /** Idle per-thread tools, and all made (their tallies are added up at the end). */
        final ConcurrentLinkedQueue<Physics> idle = new ConcurrentLinkedQueue<>();
        final List<Physics> made = Collections.synchronizedList(new ArrayList<>());

        long linesRead;
        long linesUsed;
        long linesBelowThreshold;
        long linesWithoutWidth;
        long linesVanVleckWeisskopf;
        long linesVanVleckWeisskopfOutsideLimit;
        long linesChiOutsideValidity;
        /** Direct summation of the Van Vleck–Weisskopf lines when the engine is not the exact one; made when needed. */
        ExactEngine vanVleckWeisskopfEngine;
        LineChunk vanVleckWeisskopfChunk;
        final CompensatedSum totalIntensity = new CompensatedSum();
        final CompensatedSum negativeIntensity = new CompensatedSum();
        final CompensatedSum droppedIntensity = new CompensatedSum();
        final CompensatedSum usedIntensity = new CompensatedSum();
        final CompensatedSum lostIntensity = new CompensatedSum();
        /** Smallest HWHM / local grid spacing of the lines centred on the grid, and that line's widths and spacing. */
        double worstResolution = Double.POSITIVE_INFINITY;
        double worstHwhmCm1 = Double.NaN;
        double worstDopplerCm1 = Double.NaN;
        double worstSpacingCm1 = Double.NaN;

        Run(CrossSectionRequest request, double lowCm1, double highCm1) {
            this.request = request;
            this.lowCm1 = lowCm1;
            this.highCm1 = highCm1;
            this.pressureAtm = request.pressureAtm();
            this.temperatureK = request.temperatureK();
            this.shape = request.shape();
            this.threshold = request.intensityThresholdCmPerMolecule();
            this.kernel = request.wings().atConditions(pressureAtm, temperatureK);
            this.kernelNoChi = request.wings().withChiFactor(ChiFactorKind.NONE)
                    .atConditions(pressureAtm, temperatureK);
            Composition composition = request.composition();
            this.chiForCo2Lines = request.wings().chiFactor() == ChiFactorKind.PERRIN_HARTMANN_CO2
                    && composition.fraction(BackgroundGas.CO2) + composition.fraction(BackgroundGas.SELF) > 0;
            this.columns = columnsFor(composition);
            WavenumberGrid grid = request.grid();
            this.gridFirstCm1 = grid.firstCm1();
            this.gridLastCm1 = grid.lastCm1();
            this.uniform = grid.spacing() == WavenumberGrid.Spacing.UNIFORM;
            this.spacingParameter = uniform ? grid.stepCm1() : grid.resolvingPower();
            double reach = maxCutoffCm1(request.wings().cutoff(), pressureAtm)
                    + SHIFT_MARGIN_CM1_PER_ATM * pressureAtm;
            this.queryMinCm1 = Math.max(lowCm1, gridFirstCm1 - reach);
            // the query range is closed; [low, high) is enforced per line
            this.queryMaxCm1 = Math.min(highCm1, gridLastCm1 + reach);
            // tools for the first batch made here, on the calling thread, so that a bad request fails at once
            Physics first = new Physics(lookup, request, chunkLines, scaling);
            made.add(first);
            idle.add(first);
        }

        /** Whether a line of shifted centre ν₀ and Lorentz HWHM γL gets the Van Vleck–Weisskopf shape. */
        boolean vanVleckWeisskopf(double centreCm1, double lorentzHwhmCm1) {
            if (!(centreCm1 > 0) || Double.isInfinite(centreCm1)) {
                return false;
            }
            return switch (shape) {
                case VAN_VLECK_WEISSKOPF -> true;
                case VOIGT, LORENTZ -> VanVleckWeisskopfProfile.chosenFor(centreCm1, lorentzHwhmCm1, temperatureK);
                default -> false;
            };
        }

        /**
         * Hands a chunk to the engine. An engine other than the exact one does not evaluate the Van Vleck–Weisskopf
         * shape: those lines are moved (in order) to a chunk of their own and summed directly by an
         * {@link ExactEngine} into the same σ; the rest keep their order for the engine.
         */
        void feed(CrossSectionEngine engine, LineChunk chunk, double[] sigma) {
            if (engine instanceof ExactEngine) {
                engine.accumulate(chunk, sigma);
                return;
            }
            int n = chunk.size;
            int flagged = 0;
            for (int i = 0; i < n; i++) {
                if (direct(chunk, i)) {
                    flagged++;
                }
            }
            if (flagged == 0) {
                engine.accumulate(chunk, sigma);
                return;
            }
            if (vanVleckWeisskopfEngine == null) {
                vanVleckWeisskopfEngine = new ExactEngine(threads, request.wings());
                vanVleckWeisskopfEngine.begin(request.grid(), pressureAtm, temperatureK);
                vanVleckWeisskopfChunk = new LineChunk(chunk.capacity());
            }
            LineChunk side = vanVleckWeisskopfChunk;
            side.size = 0;
            int kept = 0;
            for (int i = 0; i < n; i++) {
                if (direct(chunk, i)) {
                    copyRow(chunk, i, side, side.size++);
                } else {
                    copyRow(chunk, i, chunk, kept++);
                }
            }
            chunk.size = kept;
            if (kept > 0) {
                engine.accumulate(chunk, sigma);
            }
            vanVleckWeisskopfEngine.accumulate(side, sigma);
            side.size = 0;
        }

        /** Lines only the exact engine evaluates: the Van Vleck–Weisskopf shape, χ on part of the width. */
        private static boolean direct(LineChunk chunk, int i) {
            return chunk.vanVleckWeisskopf[i] || (chunk.chiFactor[i] && chunk.chiExemptShare[i] > 0);
        }

        void finishVanVleckWeisskopf(double[] sigma) {
            if (vanVleckWeisskopfEngine != null) {
                vanVleckWeisskopfEngine.finish(sigma);
            }
        }

        void closeVanVleckWeisskopf() {
            if (vanVleckWeisskopfEngine != null) {
                vanVleckWeisskopfEngine.close();
            }
        }

        /** {@link #prepare} with a thread's tools; a failure is kept with the batch. */
        void prepareOrRecord(Batch b) {
            Physics p = idle.poll();
            try {
                if (p == null) {
                    p = new Physics(lookup, request, chunkLines, scaling);
                    made.add(p);
                }
                prepare(b, p);
            } catch (RuntimeException | Error e) {
                b.failure = e;
            } finally {
                if (p != null) {
                    idle.add(p);
                }
            }
        }

        /** Physics for a batch just read: the fate of each line, the lines that reach σ, the batch's statistics. */
        private void prepare(Batch s, Physics p) {
            LineBatch b = s.lines;
            int n = b.size;
            // rows outside [low, high) belong to another block: skip them before any physics
            int from = 0;
            while (from < n && b.wavenumberCm1[from] < lowCm1) {
                from++;
            }
            int to = from;
            while (to < n && b.wavenumberCm1[to] < highCm1) {
                to++;
            }
            if (from > 0 || to < n) {
                compact(b, columns, from, to);
                n = b.size;
            }
            s.rows = n;
            if (n == 0) {
                return;
            }
            double[] intensity = s.intensity;
            double[] doppler = p.doppler;
            double[] lorentz = p.lorentz;
            double[] shift = p.shift;
            LineIntensity.atTemperature(b, p.isotopologues, intensity);
            p.scaling.apply(b, p.isotopologues, intensity);
            if (shape == LineShapeKind.LORENTZ) {
                Arrays.fill(doppler, 0, n, 0.0);
            } else {
                DopplerWidth.hwhmCm1(b, p.isotopologues, doppler);
            }
            p.resolver.resolve(b, p.widths);
            PressureBroadening.shiftCm1(p.widths, pressureAtm, shift);
            if (shape == LineShapeKind.DOPPLER) {
                // Doppler only: no pressure broadening, but the pressure shift still moves the centre
                Arrays.fill(lorentz, 0, n, 0.0);
            } else {
                PressureBroadening.lorentzHwhmCm1(p.widths, pressureAtm, temperatureK, lorentz);
            }
            int m = 0;
            for (int i = 0; i < n; i++) {
                double sT = intensity[i];
                // NaN (no intensity) and infinities are dropped with the weak lines
                if (!(sT >= threshold) || !Double.isFinite(sT)) {
                    s.fate[i] = BELOW_THRESHOLD;
                    s.belowThreshold++;
                    continue;
                }
                double aD = doppler[i];
                double gL = lorentz[i];
                if (!(aD > 0) && !(gL > 0)) {
                    // a line of zero width (ν = 0 with the Doppler shape): no profile exists; counted and reported
                    s.fate[i] = WITHOUT_WIDTH;
                    s.withoutWidth++;
                    s.belowThreshold++;
                    continue;
                }
                s.fate[i] = USED;
                double nu = b.wavenumberCm1[i];
                boolean chiLine = chiForCo2Lines && b.moleculeId[i] == CO2_MOLECULE_ID && gL > 0;
                LineShapeKind effective = effectiveShape(aD, gL);
                double centre = nu + shift[i];
                double chiShare = 0.0;
                if (chiLine) {
                    if (PerrinHartmannChi.validFor(temperatureK, centre)) {
                        // the CO2-broadened share of γL: CO2 as a foreign gas plus the absorber's own (CO2) part
                        chiShare = Math.min(1.0, (PressureBroadening.partialHwhmCm1(p.widths, BackgroundGas.CO2, i,
                                pressureAtm, temperatureK) + PressureBroadening.partialHwhmCm1(p.widths,
                                BackgroundGas.SELF, i, pressureAtm, temperatureK)) / gL);
                    } else {
                        s.chiOutsideValidity++;
                    }
                    chiLine = chiShare > 0;
                }
                boolean vvw = vanVleckWeisskopf(centre, gL);
                if (vvw) {
                    s.vanVleckWeisskopfLines++;
                    if (PhysicalConstants.SECOND_RADIATION_CONSTANT_CM_K * centre
                            > VanVleckWeisskopfProfile.MAX_REDUCED_FREQUENCY * temperatureK) {
                        s.vanVleckWeisskopfOutsideLimit++;
                    }
                }
                s.usedVanVleckWeisskopf[m] = vvw;
                s.keyCm1[m] = nu;
                s.centerCm1[m] = centre;
                s.usedIntensity[m] = sT;
                s.usedDoppler[m] = aD;
                s.usedLorentz[m] = gL;
                s.usedChi[m] = chiLine;
                s.usedChiExempt[m] = chiLine ? 1.0 - chiShare : 0.0;
                m++;
                double lost = kernelNoChi.lostFraction(effective, aD, gL);
                if (chiLine) {
                    // linear in χ: the CO2-broadened share w loses what the χ kernel loses, the rest the plain one
                    lost = chiShare * kernel.lostFraction(effective, aD, gL) + (1.0 - chiShare) * lost;
                }
                s.lostIntensity[i] = sT * lost;
                // a symmetric shape puts part of a low-frequency line's area at ν ≤ 0: counted as lost, reported
                s.negativeIntensity[i] = vvw ? 0.0
                        : sT * kernelNoChi.negativeFrequencyFraction(effective, centre, aD, gL);
                s.lostIntensity[i] += s.negativeIntensity[i];
                if (nu >= gridFirstCm1 && nu <= gridLastCm1) {
                    // resolution is judged on the line's full half width (Voigt: Olivero–Longbothum), which is αD
                    // at low pressure: a pressure-broadened line is resolved even when αD is below the step
                    double hwhm = effective.hwhmCm1(aD, gL);
                    double spacing = uniform ? spacingParameter : nu / spacingParameter;
                    double ratio = hwhm / spacing;
                    if (ratio < s.worstResolution) {
                        s.worstResolution = ratio;
                        s.worstHwhmCm1 = hwhm;
                        s.worstDopplerCm1 = aD;
                        s.worstSpacingCm1 = spacing;
                    }
                }
            }
            s.count = m;
        }

        /**
         * Adds a batch's statistics, in the order the batches are taken and the lines within them (the order of
         * a single thread); throws the batch's failure instead when it has one.
         */
        void reduce(Batch s) throws IOException {
            linesRead += s.rowsRead;
            if (s.failure != null) {
                Throwable f = s.failure;
                if (f instanceof IOException e) {
                    throw e;
                }
                if (f instanceof RuntimeException e) {
                    throw e;
                }
                if (f instanceof Error e) {
                    throw e;
                }
                throw new IllegalStateException(f);
            }
            double[] intensity = s.intensity;
            byte[] fate = s.fate;
            for (int i = 0; i < s.rows; i++) {
                double sT = intensity[i];
                boolean finite = Double.isFinite(sT);
                if (finite) {
                    totalIntensity.add(sT);
                }
                switch (fate[i]) {
                    case BELOW_THRESHOLD -> {
                        if (finite) {
                            droppedIntensity.add(sT);
                        }
                    }
                    case WITHOUT_WIDTH -> droppedIntensity.add(sT);
                    default -> {
                        usedIntensity.add(sT);
                        lostIntensity.add(s.lostIntensity[i]);
                        negativeIntensity.add(s.negativeIntensity[i]);
                    }
                }
            }
            linesUsed += s.count;
            linesBelowThreshold += s.belowThreshold;
            linesWithoutWidth += s.withoutWidth;
            linesVanVleckWeisskopf += s.vanVleckWeisskopfLines;
            linesVanVleckWeisskopfOutsideLimit += s.vanVleckWeisskopfOutsideLimit;
            linesChiOutsideValidity += s.chiOutsideValidity;
            // strictly smaller: the first line of the smallest ratio wins, as in one pass over all lines
            if (s.worstResolution < worstResolution) {
                worstResolution = s.worstResolution;
                worstHwhmCm1 = s.worstHwhmCm1;
                worstDopplerCm1 = s.worstDopplerCm1;
                worstSpacingCm1 = s.worstSpacingCm1;
            }
        }

        double fractionDone(double keyCm1) {
            double lo = Math.max(queryMinCm1, gridFirstCm1);
            double hi = Math.min(queryMaxCm1, gridLastCm1);
            if (!(hi > lo)) {
                return 0.5;
            }
            return Math.min(1.0, Math.max(0.0, (keyCm1 - lo) / (hi - lo)));
        }

        CrossSectionResult result(double[] sigma, CrossSectionEngine engine, double seconds) {
            // counts only: the sum does not depend on the order the threads' tallies are added in
            WidthSourceTally tally = new WidthSourceTally();
            synchronized (made) {
                for (Physics p : made) {
                    tally.add(p.resolver.tally());
                }
            }
            double total = totalIntensity.value();
            double droppedFraction = total > 0 ? droppedIntensity.value() / total : 0.0;
            double used = usedIntensity.value();
            double lossFraction = used > 0 ? lostIntensity.value() / used : 0.0;
            List<String> warnings = new ArrayList<>();
            if (linesUsed == 0) {
                warnings.add("no lines reach the grid " + gridFirstCm1 + ".." + gridLastCm1
                        + " cm-1 (sigma is zero everywhere)");
            }
            if (worstResolution < 1.0) {
                warnings.add(String.format(Locale.ROOT, "grid spacing %.6g cm-1 is coarser than the narrowest line "
                        + "half width %.6g cm-1 (Doppler HWHM %.6g cm-1) of the lines on the grid: those lines are "
                        + "under-resolved (use a step of at most %.3g cm-1)", worstSpacingCm1, worstHwhmCm1,
                        worstDopplerCm1, worstHwhmCm1));
            }
            if (linesWithoutWidth > 0) {
                warnings.add(linesWithoutWidth + " lines have zero Doppler and Lorentz width and were left out");
            }
            double negativeFraction = used > 0 ? negativeIntensity.value() / used : 0.0;
            if (negativeFraction > NEGATIVE_WAVENUMBER_WARNING_FRACTION) {
                warnings.add(String.format(Locale.ROOT, "%.3g of the line intensity falls at wavenumbers <= 0 under "
                        + "the %s shape and is lost (use --shape vvw for low-frequency lines)", negativeFraction,
                        shape.label()));
            }
            if (linesChiOutsideValidity > 0) {
                warnings.add(String.format(Locale.ROOT, "%d CO2 lines lie outside the chi factor's range of validity "
                        + "(T %.0f-%.0f K, line centres %.0f-%.0f cm-1): their wings are left Lorentzian",
                        linesChiOutsideValidity, PerrinHartmannChi.VALID_MIN_TEMPERATURE_K,
                        PerrinHartmannChi.VALID_MAX_TEMPERATURE_K, PerrinHartmannChi.VALID_MIN_CENTRE_CM1,
                        PerrinHartmannChi.VALID_MAX_CENTRE_CM1));
            }
            if (linesVanVleckWeisskopfOutsideLimit > 0) {
                warnings.add(linesVanVleckWeisskopfOutsideLimit + " lines have the Van Vleck-Weisskopf shape with "
                        + "c2*nu0/T > " + VanVleckWeisskopfProfile.MAX_REDUCED_FREQUENCY + ", where its (nu/nu0)^2 "
                        + "factor (the h*nu << kT limit) is more than 1 % from the Van Vleck-Huber factor");
            }
            for (String w : tally.warnings()) {
                // the tally words its lines for printing; the result's warnings carry no prefix
                warnings.add(w.startsWith("warning: ") ? w.substring("warning: ".length()) : w);
            }
            Map<String, String> m = new LinkedHashMap<>();
            m.put("tool_version", ToolVersion.get());
            m.put("engine", engine.id());
            engine.describe().forEach((k, v) -> m.put("engine." + k, v));
            m.putAll(request.grid().describe());
            m.put("temperature_K", Double.toString(temperatureK));
            // bar, as in tables (1 bar = 1e5 Pa exactly); the calculation itself works in atm
            m.put("pressure_bar", Double.toString(pressureAtm * org.linewright.ingest.units.PhysicalConstants.STANDARD_ATMOSPHERE_PA / 1e5));
            m.put("composition", request.composition().toString());
            m.put("line_shape", shape.label());
            m.put("line_shape_rule", shapeRule(shape));
            m.put("lines_van_vleck_weisskopf", Long.toString(linesVanVleckWeisskopf));
            if (vanVleckWeisskopfEngine != null) {
                m.put("exact_summation", "lines with the Van Vleck-Weisskopf shape or chi on part of their width "
                        + "summed by the exact engine; the " + engine.id() + " engine sums the others");
            }
            m.put("negative_wavenumber_loss_fraction", Double.toString(negativeFraction));
            if (chiForCo2Lines) {
                m.put("wing.chi.lines_outside_validity", Long.toString(linesChiOutsideValidity));
            }
            m.putAll(kernel.describe());
            m.put("intensity_threshold_cm_per_molecule", Double.toString(threshold));
            m.put("line_selection", request.selection().describe());
            m.put("width_options", request.widths().describe());
            StringJoiner dirs = new StringJoiner(";");
            for (LineStore store : stores) {
                dirs.add(store.directory().toString());
            }
            m.put("line_stores", dirs.toString());
            if (lowCm1 != Double.NEGATIVE_INFINITY || highCm1 != Double.POSITIVE_INFINITY) {
                m.put("line_centre_range_cm1", lowCm1 + ".." + highCm1);
            }
            m.put("lines_used", Long.toString(linesUsed));
            m.put("lines_below_threshold", Long.toString(linesBelowThreshold));
            m.put("dropped_intensity_fraction", Double.toString(droppedFraction));
            m.put("sum_intensity_cm_per_molecule", Double.toString(used));
            m.put("wing_loss_fraction", Double.toString(lossFraction));
            List<String> report = tally.report();
            if (!report.isEmpty()) {
                m.put("width_sources", String.join("; ", report));
            }
            return new CrossSectionResult(sigma, linesUsed, linesBelowThreshold, droppedFraction, used, tally,
                    engine.estimatedRelativeError(), m, seconds, lossFraction, warnings);
        }
    }

    /**
     * Fraction of the used intensity at ν ≤ 0 (lost under a symmetric shape) above which the result warns: 10⁻⁶,
     * far below any engine tolerance, so that a warning appears only where the loss can matter.
     */
    static final double NEGATIVE_WAVENUMBER_WARNING_FRACTION = 1e-6;

    /** The shape rule in words, for the metadata of σ files and tables. */
    public static String shapeRule(LineShapeKind shape) {
        return switch (shape) {
            case VAN_VLECK_WEISSKOPF -> "Van Vleck-Weisskopf (1945) shape, (nu/nu0)^2 [V(nu-nu0) + V(nu+nu0)], for "
                    + "every line with nu0 > 0";
            case VOIGT, LORENTZ -> VanVleckWeisskopfProfile.ruleDescription();
            default -> "doppler shape for every line (no pressure width: the Van Vleck-Weisskopf rule never applies)";
        };
    }

    private static void copyRow(LineChunk from, int i, LineChunk to, int j) {
        to.centerCm1[j] = from.centerCm1[i];
        to.intensityCmPerMolecule[j] = from.intensityCmPerMolecule[i];
        to.dopplerHwhmCm1[j] = from.dopplerHwhmCm1[i];
        to.lorentzHwhmCm1[j] = from.lorentzHwhmCm1[i];
        to.chiFactor[j] = from.chiFactor[i];
        to.vanVleckWeisskopf[j] = from.vanVleckWeisskopf[i];
        to.chiExemptShare[j] = from.chiExemptShare[i];
    }

    /** The pure shape the Voigt kernels reduce to for these widths (for the wing-loss formulas). */
    static LineShapeKind effectiveShape(double dopplerHwhmCm1, double lorentzHwhmCm1) {
        if (!(dopplerHwhmCm1 > 0)) {
            return LineShapeKind.LORENTZ;
        }
        return lorentzHwhmCm1 > 0 ? LineShapeKind.VOIGT : LineShapeKind.DOPPLER;
    }

    /**
     * Every numeric column but those no physics reads (lower degeneracy, upper energy, position uncertainty).
     */

    /** Keeps rows [from, to) of the batch's projected columns, moved to the front. */
    private static void compact(LineBatch b, Set<LineColumn> columns, int from, int to) {
        int n = to - from;
        if (from > 0) {
            for (LineColumn c : columns) {
                switch (c.kind()) {
                    case INT -> System.arraycopy(c.ints(b), from, c.ints(b), 0, n);
                    case LONG -> System.arraycopy(c.longs(b), from, c.longs(b), 0, n);
                    default -> System.arraycopy(c.doubles(b), from, c.doubles(b), 0, n);
                }
            }
        }
        b.size = n;
    }
}
