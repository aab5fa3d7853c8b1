package org.linewright.grid.calc;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.EnumSet;
import java.util.Set;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.StringJoiner;
import org.linewright.broadening.background.BackgroundGas;
import org.linewright.broadening.background.Composition;
import org.linewright.broadening.intensity.IntensityCut;
import org.linewright.broadening.intensity.LineIntensity;
import org.linewright.broadening.isotopologue.IsotopologueCache;
import org.linewright.broadening.sources.ResolvedWidths;
import org.linewright.broadening.sources.WidthResolver;
import org.linewright.broadening.sources.WidthSourceTally;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.width.DopplerWidth;
import org.linewright.broadening.width.PressureBroadening;
import org.linewright.broadening.wings.ChiFactorKind;
import org.linewright.broadening.wings.FixedCutoff;
import org.linewright.broadening.wings.HwhmMultipleCutoff;
import org.linewright.broadening.wings.PressureScaledCutoff;
import org.linewright.broadening.wings.WingCutoff;
import org.linewright.broadening.wings.WingKernel;
import org.linewright.grid.engine.CrossSectionEngine;
import org.linewright.grid.engine.LineChunk;
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.InputException;
import org.linewright.ingest.ToolVersion;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.source.IsotopologueLookup;
import org.linewright.ingest.store.LineCursor;
import org.linewright.ingest.store.LineQuery;
import org.linewright.ingest.store.LineStore;

/**
 * The one place that turns stored lines into engine input for one (p, T). For a {@link CrossSectionRequest} it
 * reads the lines that can reach the grid — centres within [first point − largest cutoff − shift margin,
 * last point + largest cutoff + shift margin] — from every store, merged in ascending wavenumber order, projected
 * to the numeric columns, a batch of {@value #CHUNK_LINES} lines at a time (bounded memory),
 * and per batch computes:
 * <ul>
 *   <li>S(T) with {@link LineIntensity} (partition sums and abundances from an {@link IsotopologueCache});</li>
 *   <li>each background gas's width, exponent and shift with a {@link WidthResolver} (sources tallied), then
 *       γL = p·Σ x_g·γ_g·(296/T)^n_g and δ = p·Σ x_g·δ_g with {@link PressureBroadening};</li>
 *   <li>αD = ν/c·√(2 ln2 kT/m) with {@link DopplerWidth};</li>
 *   <li>the intensity threshold with {@link IntensityCut} (dropped intensity reported);</li>
 *   <li>the χ-factor flag: CO2 lines (molecule 2) when the wing treatment asks for the CO2 χ factor and CO2
 *       (as a foreign gas, or the absorber itself) is in the background.</li>
 * </ul>
 * The line shape is conveyed to the engines through the widths: a Doppler-only request zeroes γL, a Lorentz-only
 * request zeroes αD, and the Voigt kernels reduce exactly to the pure shapes in those limits.
 * Kept lines fill a reused {@link LineChunk} passed to {@link CrossSectionEngine#accumulate}. Lines reach σ only
 * within their cutoff of the shifted centre (the engines apply the {@link WingKernel}).
 *
 * <p>Concurrent {@code compute} calls are safe when the lookup is (each call opens its own cursors and scratch
 * arrays); an engine serves one computation at a time. Statistics are accumulated with compensated (Neumaier)
 * sums, and the order of lines is fixed by the stores, so results do not depend on timing.
 */
public final class CrossSectionCalculator {
    /** Lines per batch read from a store and per chunk handed to the engine. */
    public static final int CHUNK_LINES = 16_384;
    /**
     * Extra distance per atm read beyond the cutoff on both sides so that lines pushed into range by their
     * pressure shift are not missed, cm⁻¹/atm. Measured shifts are below 0.1 cm⁻¹/atm (from memory); 1 is safe.
     */
    public static final double SHIFT_MARGIN_CM1_PER_ATM = 1.0;
    /**
     * The columns read: every numeric column (S(296 K) or A and g' for S(T), E'', the widths, exponents and
     * shifts of every broadener, the J and K numbers the broadening rules use, the source line for messages).
     */
    static final Set<LineColumn> PHYSICS_COLUMNS = numericColumns();
    /** HITRAN molecule number of CO2 (common practice), whose lines the CO2 χ factor applies to. */
    static final int CO2_MOLECULE_ID = 2;

    private final List<LineStore> stores;
    private final IsotopologueLookup lookup;

    /**
     * @param stores line stores read together (their lines merged in wavenumber order; store order breaks ties)
     * @param lookup the registry with masses, abundances and partition sums (user tables included)
     */
    public CrossSectionCalculator(List<LineStore> stores, IsotopologueLookup lookup) {
        this.stores = List.copyOf(stores);
        this.lookup = Objects.requireNonNull(lookup, "lookup");
        if (this.stores.isEmpty()) {
            throw new InputException("no line store given (expected at least one store directory)");
        }
    }

    /** The stores read. */
    public List<LineStore> stores() {
        return stores;
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
        List<StoreLines> open = new ArrayList<>();
        try {
            if (run.queryMinCm1 <= run.queryMaxCm1) {
                LineQuery query = request.selection().applyTo(LineQuery.all()
                        .withWavenumberRange(run.queryMinCm1, run.queryMaxCm1)
                        .withColumns(PHYSICS_COLUMNS));
                for (LineStore store : stores) {
                    open.add(new StoreLines(store.cursor(query)));
                }
            }
            merge(run, open.toArray(new StoreLines[0]), engine, sigma, progress);
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        } finally {
            for (StoreLines s : open) {
                try {
                    s.cursor.close();
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
    private void merge(Run run, StoreLines[] sources, CrossSectionEngine engine, double[] sigma,
                       ProgressListener progress) throws IOException {
        LineChunk chunk = run.chunk;
        chunk.size = 0;
        double lastKey = Double.NaN;
        while (true) {
            int best = -1;
            double bestKey = 0;
            for (int i = 0; i < sources.length; i++) {
                // strictly smaller: among equal wavenumbers the earlier store wins
                if (sources[i].ensure(run) && (best < 0 || sources[i].key() < bestKey)) {
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
                if (i != best && sources[i].ensure(run) && sources[i].key() < nextKey) {
                    nextKey = sources[i].key();
                    nextIndex = i;
                }
            }
            StoreLines s = sources[best];
            boolean takeTies = best < nextIndex;
            while (s.pos < s.count && chunk.size < chunk.capacity()
                    && (s.keyCm1[s.pos] < nextKey || (takeTies && s.keyCm1[s.pos] == nextKey))) {
                int r = s.pos++;
                int c = chunk.size++;
                chunk.centerCm1[c] = s.centerCm1[r];
                chunk.intensityCmPerMolecule[c] = s.intensity[r];
                chunk.dopplerHwhmCm1[c] = s.doppler[r];
                chunk.lorentzHwhmCm1[c] = s.lorentz[r];
                chunk.chiFactor[c] = s.chi[r];
                lastKey = s.keyCm1[r];
            }
            if (chunk.size == chunk.capacity()) {
                engine.accumulate(chunk, sigma);
                chunk.size = 0;
                progress.progress(run.linesRead, run.fractionDone(lastKey));
            }
        }
        if (chunk.size > 0) {
            engine.accumulate(chunk, sigma);
            chunk.size = 0;
        }
    }

    /**
     * Largest cutoff distance any line can have under {@code cutoff} at this pressure, cm⁻¹ (infinite when the
     * policy is unbounded or unknown).
     */
    static double maxCutoffCm1(WingCutoff cutoff, double pressureAtm) {
        if (cutoff instanceof FixedCutoff f) {
            return f.distanceCm1();
        }
        if (cutoff instanceof HwhmMultipleCutoff h) {
            return h.maxDistanceCm1();
        }
        if (cutoff instanceof PressureScaledCutoff ps) {
            // independent of the widths: d = min(max, max(min, k·p))
            return ps.distanceCm1(0.0, 0.0, pressureAtm);
        }
        return Double.POSITIVE_INFINITY;
    }

    /** One store's cursor and its current batch, physics applied and reduced to the lines that reach σ. */
    private static final class StoreLines {
        final LineCursor cursor;
        final double[] keyCm1 = new double[CHUNK_LINES];
        final double[] centerCm1 = new double[CHUNK_LINES];
        final double[] intensity = new double[CHUNK_LINES];
        final double[] doppler = new double[CHUNK_LINES];
        final double[] lorentz = new double[CHUNK_LINES];
        final boolean[] chi = new boolean[CHUNK_LINES];
        int count;
        int pos;
        boolean exhausted;

        StoreLines(LineCursor cursor) {
            this.cursor = cursor;
        }

        /** True when a line is available at {@link #pos}, reading further batches as needed. */
        boolean ensure(Run run) throws IOException {
            while (pos >= count) {
                if (exhausted) {
                    return false;
                }
                if (!cursor.read(run.batch)) {
                    exhausted = true;
                    return false;
                }
                count = run.prepare(this);
                pos = 0;
            }
            return true;
        }

        double key() {
            return keyCm1[pos];
        }
    }

    /** The state of one computation: scratch arrays (shared by the stores, used one batch at a time) and statistics. */
    private final class Run {
        final CrossSectionRequest request;
        final double lowCm1;
        final double highCm1;
        final double queryMinCm1;
        final double queryMaxCm1;
        final double pressureAtm;
        final LineShapeKind shape;
        final WingKernel kernel;
        final WingKernel kernelNoChi;
        final boolean chiForCo2Lines;
        final double threshold;
        final LineBatch batch = new LineBatch(CHUNK_LINES);
        final LineChunk chunk = new LineChunk(CHUNK_LINES);
        final IsotopologueCache isotopologues;
        final WidthResolver resolver;
        final ResolvedWidths widths;
        final double[] intensity = new double[CHUNK_LINES];
        final double[] doppler = new double[CHUNK_LINES];
        final double[] lorentz = new double[CHUNK_LINES];
        final double[] shift = new double[CHUNK_LINES];
        final boolean[] keep = new boolean[CHUNK_LINES];
        final double gridFirstCm1;
        final double gridLastCm1;
        final boolean uniform;
        final double spacingParameter;

        long linesRead;
        long linesUsed;
        long linesBelowThreshold;
        long linesWithoutWidth;
        final Sum totalIntensity = new Sum();
        final Sum droppedIntensity = new Sum();
        final Sum usedIntensity = new Sum();
        final Sum lostIntensity = new Sum();
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
            this.shape = request.shape();
            this.threshold = request.intensityThresholdCmPerMolecule();
            this.kernel = request.wings().atConditions(pressureAtm, request.temperatureK());
            this.kernelNoChi = request.wings().withChiFactor(ChiFactorKind.NONE)
                    .atConditions(pressureAtm, request.temperatureK());
            Composition composition = request.composition();
            this.chiForCo2Lines = request.wings().chiFactor() == ChiFactorKind.PERRIN_HARTMANN_CO2
                    && composition.fraction(BackgroundGas.CO2) + composition.fraction(BackgroundGas.SELF) > 0;
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
            this.isotopologues = new IsotopologueCache(lookup, request.temperatureK());
            this.resolver = request.widths().newResolver(composition);
            this.widths = resolver.newResult(CHUNK_LINES);
        }

        /** Physics for the batch just read; writes the lines that reach σ into {@code s}; returns their count. */
        int prepare(StoreLines s) {
            LineBatch b = batch;
            int n = b.size;
            linesRead += n;
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
                compact(b, from, to);
                n = b.size;
            }
            if (n == 0) {
                return 0;
            }
            LineIntensity.atTemperature(b, isotopologues, intensity);
            IntensityCut.apply(intensity, n, threshold, keep);
            if (shape == LineShapeKind.LORENTZ) {
                Arrays.fill(doppler, 0, n, 0.0);
            } else {
                DopplerWidth.hwhmCm1(b, isotopologues, doppler);
            }
            resolver.resolve(b, widths);
            PressureBroadening.shiftCm1(widths, pressureAtm, shift);
            if (shape == LineShapeKind.DOPPLER) {
                // Doppler only: no pressure broadening, but the pressure shift still moves the centre
                Arrays.fill(lorentz, 0, n, 0.0);
            } else {
                PressureBroadening.lorentzHwhmCm1(widths, pressureAtm, request.temperatureK(), lorentz);
            }
            int m = 0;
            for (int i = 0; i < n; i++) {
                double sT = intensity[i];
                boolean finite = Double.isFinite(sT);
                if (finite) {
                    totalIntensity.add(sT);
                }
                if (!keep[i]) {
                    linesBelowThreshold++;
                    if (finite) {
                        droppedIntensity.add(sT);
                    }
                    continue;
                }
                double aD = doppler[i];
                double gL = lorentz[i];
                if (!(aD > 0) && !(gL > 0)) {
                    // a line of zero width (ν = 0 with the Doppler shape): no profile exists; counted and reported
                    linesWithoutWidth++;
                    linesBelowThreshold++;
                    droppedIntensity.add(sT);
                    continue;
                }
                double nu = b.wavenumberCm1[i];
                boolean chiLine = chiForCo2Lines && b.moleculeId[i] == CO2_MOLECULE_ID;
                s.keyCm1[m] = nu;
                s.centerCm1[m] = nu + shift[i];
                s.intensity[m] = sT;
                s.doppler[m] = aD;
                s.lorentz[m] = gL;
                s.chi[m] = chiLine;
                m++;
                linesUsed++;
                usedIntensity.add(sT);
                WingKernel k = chiLine ? kernel : kernelNoChi;
                lostIntensity.add(sT * k.lostFraction(effectiveShape(aD, gL), aD, gL));
                if (nu >= gridFirstCm1 && nu <= gridLastCm1) {
                    // resolution is judged on the line's full half width (Voigt: Olivero–Longbothum), which is αD
                    // at low pressure: a pressure-broadened line is resolved even when αD is below the step
                    double hwhm = effectiveShape(aD, gL).hwhmCm1(aD, gL);
                    double spacing = uniform ? spacingParameter : nu / spacingParameter;
                    double ratio = hwhm / spacing;
                    if (ratio < worstResolution) {
                        worstResolution = ratio;
                        worstHwhmCm1 = hwhm;
                        worstDopplerCm1 = aD;
                        worstSpacingCm1 = spacing;
                    }
                }
            }
            return m;
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
            WidthSourceTally tally = resolver.tally();
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
            for (String w : tally.warnings()) {
                // the tally words its lines for printing; the result's warnings carry no prefix
                warnings.add(w.startsWith("warning: ") ? w.substring("warning: ".length()) : w);
            }
            Map<String, String> m = new LinkedHashMap<>();
            m.put("tool_version", ToolVersion.get());
            m.put("engine", engine.id());
            engine.describe().forEach((k, v) -> m.put("engine." + k, v));
            m.putAll(request.grid().describe());
            m.put("temperature_k", Double.toString(request.temperatureK()));
            m.put("pressure_atm", Double.toString(pressureAtm));
            m.put("composition", request.composition().toString());
            m.put("line_shape", shape.label());
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

    /** The pure shape the Voigt kernels reduce to for these widths (for the wing-loss formulas). */
    static LineShapeKind effectiveShape(double dopplerHwhmCm1, double lorentzHwhmCm1) {
        if (!(dopplerHwhmCm1 > 0)) {
            return LineShapeKind.LORENTZ;
        }
        return lorentzHwhmCm1 > 0 ? LineShapeKind.VOIGT : LineShapeKind.DOPPLER;
    }

    private static Set<LineColumn> numericColumns() {
        EnumSet<LineColumn> set = EnumSet.noneOf(LineColumn.class);
        for (LineColumn c : LineColumn.values()) {
            if (c.kind() != LineColumn.Kind.TEXT) {
                set.add(c);
            }
        }
        return Collections.unmodifiableSet(set);
    }

    /** Keeps rows [from, to) of the batch's projected columns, moved to the front. */
    private static void compact(LineBatch b, int from, int to) {
        int n = to - from;
        if (from > 0) {
            for (LineColumn c : PHYSICS_COLUMNS) {
                switch (c.kind()) {
                    case INT -> System.arraycopy(c.ints(b), from, c.ints(b), 0, n);
                    case LONG -> System.arraycopy(c.longs(b), from, c.longs(b), 0, n);
                    default -> System.arraycopy(c.doubles(b), from, c.doubles(b), 0, n);
                }
            }
        }
        b.size = n;
    }

    /** Neumaier-compensated running sum (line intensities span many decades). */
    private static final class Sum {
        private double sum;
        private double compensation;

        void add(double x) {
            double t = sum + x;
            compensation += Math.abs(sum) >= Math.abs(x) ? (sum - t) + x : (x - t) + sum;
            sum = t;
        }

        double value() {
            return sum + compensation;
        }
    }
}
