package org.linewright.grid.calc;

import java.io.IOException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.StringJoiner;
import org.linewright.broadening.intensity.CompensatedSum;
import org.linewright.broadening.sources.WidthSourceTally;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.voigt.VanVleckWeisskopfProfile;
import org.linewright.broadening.wings.PerrinHartmannChi;
import org.linewright.grid.engine.CrossSectionEngine;
import org.linewright.ingest.ToolVersion;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.units.PhysicalConstants;

/**
 * The statistics of one computation, reduced on the calling thread batch after batch and line after line in the
 * order a single thread prepares them (Neumaier sums of S(T) used, dropped, lost to the wings and at ν ≤ 0; line
 * counts; the first line of the worst resolution), so every statistic is the same bit for bit for any thread
 * count; and the result they make: σ with its summary, warnings and metadata.
 */
final class CrossSectionStatistics {
    /**
     * Fraction of the used intensity at ν ≤ 0 (lost under a symmetric shape) above which the result warns: 10⁻⁶,
     * far below any engine tolerance, so that a warning appears only where the loss can matter.
     */
    static final double NEGATIVE_WAVENUMBER_WARNING_FRACTION = 1e-6;

    private final LinePreparation lines;
    private long linesRead;
    private long linesUsed;
    private long linesBelowThreshold;
    private long linesWithoutWidth;
    private long linesVanVleckWeisskopf;
    private long linesVanVleckWeisskopfOutsideLimit;
    private long linesChiOutsideValidity;
    private final CompensatedSum totalIntensity = new CompensatedSum();
    private final CompensatedSum negativeIntensity = new CompensatedSum();
    private final CompensatedSum droppedIntensity = new CompensatedSum();
    private final CompensatedSum usedIntensity = new CompensatedSum();
    private final CompensatedSum lostIntensity = new CompensatedSum();
    /** Smallest HWHM / local grid spacing of the lines centred on the grid, and that line's widths and spacing. */
    private double worstResolution = Double.POSITIVE_INFINITY;
    private double worstHwhmCm1 = Double.NaN;
    private double worstDopplerCm1 = Double.NaN;
    private double worstSpacingCm1 = Double.NaN;

    /** @param lines the computation's preparation (its request, constants and width-source tallies) */
    CrossSectionStatistics(LinePreparation lines) {
        this.lines = lines;
    }

    /** Lines read from the stores so far (for progress). */
    long linesRead() {
        return linesRead;
    }

    /**
     * Adds a batch's statistics, in the order the batches are taken and the lines within them (the order of
     * a single thread); throws the batch's failure instead when it has one.
     */
    void reduce(PreparedBatch s) throws IOException {
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
                case PreparedBatch.BELOW_THRESHOLD -> {
                    if (finite) {
                        droppedIntensity.add(sT);
                    }
                }
                case PreparedBatch.WITHOUT_WIDTH -> droppedIntensity.add(sT);
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

    /**
     * The result of the computation once every batch is reduced.
     *
     * @param stores             the stores read (named in the metadata)
     * @param exactSideSummation true when some lines were summed by an exact engine beside {@code engine}
     */
    CrossSectionResult result(double[] sigma, CrossSectionEngine engine, double seconds, List<LineStore> stores,
                              boolean exactSideSummation) {
        WidthSourceTally tally = lines.widthSources();
        CrossSectionRequest request = lines.request;
        double gridFirstCm1 = lines.gridFirstCm1;
        double gridLastCm1 = lines.gridLastCm1;
        double temperatureK = lines.temperatureK;
        double pressureAtm = lines.pressureAtm;
        LineShapeKind shape = lines.shape;
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
        m.put("pressure_bar", Double.toString(pressureAtm * PhysicalConstants.STANDARD_ATMOSPHERE_PA / 1e5));
        m.put("composition", request.composition().toString());
        m.put("line_shape", shape.label());
        m.put("line_shape_rule", CrossSectionCalculator.shapeRule(shape));
        m.put("lines_van_vleck_weisskopf", Long.toString(linesVanVleckWeisskopf));
        if (exactSideSummation) {
            m.put("exact_summation", "lines with the Van Vleck-Weisskopf shape or chi on part of their width "
                    + "summed by the exact engine; the " + engine.id() + " engine sums the others");
        }
        m.put("negative_wavenumber_loss_fraction", Double.toString(negativeFraction));
        if (lines.chiForCo2Lines) {
            m.put("wing.chi.lines_outside_validity", Long.toString(linesChiOutsideValidity));
        }
        m.putAll(lines.kernel.describe());
        m.put("intensity_threshold_cm_per_molecule", Double.toString(lines.threshold));
        m.put("line_selection", request.selection().describe());
        m.put("width_options", request.widths().describe());
        StringJoiner dirs = new StringJoiner(";");
        for (LineStore store : stores) {
            dirs.add(store.directory().toString());
        }
        m.put("line_stores", dirs.toString());
        if (lines.lowCm1 != Double.NEGATIVE_INFINITY || lines.highCm1 != Double.POSITIVE_INFINITY) {
            m.put("line_centre_range_cm1", lines.lowCm1 + ".." + lines.highCm1);
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
