package org.linewright.grid.calc;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.EnumSet;
import java.util.List;
import java.util.Set;
import java.util.concurrent.ConcurrentLinkedQueue;
import org.linewright.broadening.background.BackgroundGas;
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
import org.linewright.grid.wavenumber.WavenumberGrid;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.source.IsotopologueLookup;
import org.linewright.ingest.store.LineQuery;
import org.linewright.ingest.units.PhysicalConstants;

/**
 * The physics of the lines of one computation (one request, one line-centre range), batch by batch: which lines
 * are read (the query range and columns), then for each batch S(T) with {@link LineIntensity} and the request's
 * {@link IntensityScaling}, the Doppler and Lorentz widths and shifts, the intensity threshold, the χ factor's
 * share, the line shape each line gets (Van Vleck–Weisskopf by rule or for every line) and the batch's
 * statistics (wing loss, loss at ν ≤ 0, worst resolution). Any thread may prepare any batch: the per-thread tools
 * (registry values at T, a width resolver with its tally, scratch arrays) are taken from a pool, one batch at a
 * time, and a batch's result depends only on its lines.
 */
final class LinePreparation {
    /**
     * Every column the physics may read: S(296 K) or A and g' for S(T), E'', the widths, exponents and shifts of
     * every broadener, the J and K numbers the broadening rules and tables use, the source line for messages.
     * A request reads only those of its background's gases ({@link #columnsFor}).
     */
    static final Set<LineColumn> PHYSICS_COLUMNS = LineQuery.CROSS_SECTION_COLUMNS;
    /** HITRAN molecule number of CO2 (common practice), whose lines the CO2 χ factor applies to. */
    static final int CO2_MOLECULE_ID = 2;

    final CrossSectionRequest request;
    final double lowCm1;
    final double highCm1;
    /** Closed range of stored centres read from the stores ([low, high) is enforced per line). */
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
    private final boolean uniform;
    private final double spacingParameter;
    private final IsotopologueLookup lookup;
    private final int chunkLines;
    /** Idle per-thread tools, and all made (their tallies are added up at the end). */
    private final ConcurrentLinkedQueue<Physics> idle = new ConcurrentLinkedQueue<>();
    private final List<Physics> made = Collections.synchronizedList(new ArrayList<>());

    /**
     * @param lookup     registry values (thread-safe when batches are prepared on several threads)
     * @param chunkLines capacity of a batch
     * @throws org.linewright.ingest.InputException when the request cannot be prepared (checked at once, on the
     *         calling thread, by making the first batch's tools)
     */
    LinePreparation(CrossSectionRequest request, double lowCm1, double highCm1, IsotopologueLookup lookup,
                    int chunkLines) {
        this.request = request;
        this.lowCm1 = lowCm1;
        this.highCm1 = highCm1;
        this.lookup = lookup;
        this.chunkLines = chunkLines;
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
                + CrossSectionCalculator.SHIFT_MARGIN_CM1_PER_ATM * pressureAtm;
        this.queryMinCm1 = Math.max(lowCm1, gridFirstCm1 - reach);
        // the query range is closed; [low, high) is enforced per line
        this.queryMaxCm1 = Math.min(highCm1, gridLastCm1 + reach);
        // tools for the first batch made here, on the calling thread, so that a bad request fails at once
        Physics first = new Physics(lookup, request, chunkLines);
        made.add(first);
        idle.add(first);
    }

    /** The store query of this computation: the request's selection, the query range, the columns read. */
    LineQuery query() {
        return request.selection().applyTo(LineQuery.all()
                .withWavenumberRange(queryMinCm1, queryMaxCm1)
                .withColumns(columns));
    }

    /** True when no line can reach the grid (the query range is empty). */
    boolean readsNothing() {
        return !(queryMinCm1 <= queryMaxCm1);
    }

    /**
     * The width sources used by every batch prepared so far, summed over the per-thread tools (counts only: the
     * sum does not depend on the order the threads' tallies are added in).
     */
    WidthSourceTally widthSources() {
        WidthSourceTally tally = new WidthSourceTally();
        synchronized (made) {
            for (Physics p : made) {
                tally.add(p.resolver.tally());
            }
        }
        return tally;
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

    /** The pure shape the Voigt kernels reduce to for these widths (for the wing-loss formulas). */
    static LineShapeKind effectiveShape(double dopplerHwhmCm1, double lorentzHwhmCm1) {
        if (!(dopplerHwhmCm1 > 0)) {
            return LineShapeKind.LORENTZ;
        }
        return lorentzHwhmCm1 > 0 ? LineShapeKind.VOIGT : LineShapeKind.DOPPLER;
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

    /** {@link #prepare} with a thread's tools; a failure is kept with the batch. */
    void prepareOrRecord(PreparedBatch b) {
        Physics p = idle.poll();
        try {
            if (p == null) {
                p = new Physics(lookup, request, chunkLines);
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
    private void prepare(PreparedBatch s, Physics p) {
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
                s.fate[i] = PreparedBatch.BELOW_THRESHOLD;
                s.belowThreshold++;
                continue;
            }
            double aD = doppler[i];
            double gL = lorentz[i];
            if (!(aD > 0) && !(gL > 0)) {
                // a line of zero width (ν = 0 with the Doppler shape): no profile exists; counted and reported
                s.fate[i] = PreparedBatch.WITHOUT_WIDTH;
                s.withoutWidth++;
                s.belowThreshold++;
                continue;
            }
            s.fate[i] = PreparedBatch.USED;
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

    /**
     * The per-thread tools of the physics for one computation: registry values at T, a width resolver (with its
     * tally), the intensity scaling's factors and scratch arrays. Taken by one batch at a time.
     */
    private static final class Physics {
        final IsotopologueCache isotopologues;
        final WidthResolver resolver;
        final ResolvedWidths widths;
        final double[] doppler;
        final double[] lorentz;
        final double[] shift;
        final IntensityScaling.Applier scaling;

        Physics(IsotopologueLookup lookup, CrossSectionRequest request, int capacity) {
            isotopologues = new IsotopologueCache(lookup, request.temperatureK());
            this.scaling = request.intensityScaling().newApplier();
            resolver = request.widths().newResolver(request.composition());
            widths = resolver.newResult(capacity);
            doppler = new double[capacity];
            lorentz = new double[capacity];
            shift = new double[capacity];
        }
    }
}
