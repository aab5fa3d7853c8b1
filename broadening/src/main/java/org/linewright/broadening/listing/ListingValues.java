package org.linewright.broadening.listing;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import org.linewright.broadening.background.BackgroundGas;
import org.linewright.broadening.intensity.LineIntensity;
import org.linewright.broadening.isotopologue.IsotopologueCache;
import org.linewright.broadening.sources.ResolvedWidths;
import org.linewright.broadening.sources.WidthResolver;
import org.linewright.broadening.sources.WidthSourceTally;
import org.linewright.ingest.ToolVersion;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.source.IsotopologueLookup;

/**
 * The values a listing computes for each batch of selected lines: S(T) when the request has a temperature, and
 * the background width, exponent and shift (with each gas's width source) when it has a background; their column
 * names, units and the listing's metadata. Filled by {@link LineListing} row for row with the batch it delivers;
 * valid until the next batch.
 */
public final class ListingValues {
    /** Name of the computed column of intensities at the requested temperature. */
    public static final String INTENSITY_AT_T_COLUMN = "intensity_at_temperature_cm_per_molecule";

    private final LineListingRequest request;
    private final IsotopologueCache cache;
    private final WidthResolver resolver;
    private final ResolvedWidths widths;
    private final double[] intensityAtT;
    private final BackgroundGas[] gases;

    ListingValues(LineListingRequest request, IsotopologueLookup lookup, int capacity) {
        this.request = request;
        this.intensityAtT = new double[capacity];
        this.cache = Double.isNaN(request.temperatureK()) ? null : new IsotopologueCache(lookup, request.temperatureK());
        this.resolver = request.backgroundOrNull() == null ? null : request.widths().newResolver(request.backgroundOrNull());
        this.widths = resolver == null ? null : resolver.newResult(capacity);
        this.gases = resolver == null ? new BackgroundGas[0] : resolver.composition().presentGases();
    }

    /** Whether S(T) is computed (the request has a temperature). */
    public boolean hasTemperature() {
        return cache != null;
    }

    /** Whether background widths are computed (the request has a background). */
    public boolean hasWidths() {
        return resolver != null;
    }

    /** How many lines each width source served so far, per gas; null without a background. */
    public WidthSourceTally tally() {
        return resolver == null ? null : resolver.tally();
    }

    void compute(LineBatch b) {
        if (cache != null) {
            LineIntensity.atTemperature(b, cache, intensityAtT);
        }
        if (resolver != null) {
            resolver.resolve(b, widths);
        }
    }

    /** Names of the computed columns of a delimited listing: the value columns, then each gas's width source. */
    public List<String> csvColumns() {
        List<String> names = new ArrayList<>(arrowColumns().keySet());
        for (BackgroundGas g : gases) {
            names.add(ResolvedWidths.sourceColumn(g));
        }
        return names;
    }

    /** Names and units of the computed value columns. */
    public Map<String, String> arrowColumns() {
        Map<String, String> m = new LinkedHashMap<>();
        if (cache != null) {
            m.put(INTENSITY_AT_T_COLUMN, "cm-1/(molecule cm-2) at " + request.temperatureK() + " K");
        }
        if (resolver != null) {
            m.put(ResolvedWidths.WIDTH_COLUMN, "cm-1/atm at 296 K");
            m.put(ResolvedWidths.EXPONENT_COLUMN, "1");
            m.put(ResolvedWidths.SHIFT_COLUMN, "cm-1/atm");
        }
        return m;
    }

    /** The computed value columns of the current batch, in {@link #arrowColumns()} order. */
    public double[][] arrowValues() {
        List<double[]> v = new ArrayList<>();
        if (cache != null) {
            v.add(intensityAtT);
        }
        if (resolver != null) {
            v.add(widths.backgroundWidthCm1PerAtm);
            v.add(widths.backgroundWidthExponent);
            v.add(widths.backgroundShiftCm1PerAtm);
        }
        return v.toArray(new double[0][]);
    }

    /** What the listing selected and computed, as file metadata. */
    public Map<String, String> metadata() {
        Map<String, String> m = new LinkedHashMap<>();
        m.put("linewright.tool_version", ToolVersion.get());
        m.put("linewright.listing.window_cm1", request.lowCm1() + " " + request.highCm1());
        m.put("linewright.listing.molecule", Integer.toString(request.moleculeId()));
        m.put("linewright.listing.isotopologue", Integer.toString(request.isotopologue()));
        m.put("linewright.listing.strongest", Integer.toString(request.strongest()));
        if (cache != null) {
            m.put("linewright.listing.temperature_K", Double.toString(request.temperatureK()));
        }
        if (resolver != null) {
            m.put("linewright.listing.background", resolver.composition().toString());
            m.put("linewright.listing.background_width_exponent",
                    "width-weighted mean sum(x*g*n)/sum(x*g) of the gases' exponents");
        }
        return m;
    }

    /** S(T) of each row of the current batch, cm/molecule (valid when {@link #hasTemperature()}). */
    public double[] intensityAtTemperature() {
        return intensityAtT;
    }

    /** The resolved background widths of the current batch (valid when {@link #hasWidths()}). */
    public ResolvedWidths widths() {
        return widths;
    }

    /** The background gases whose width sources are listed, in column order. */
    public BackgroundGas[] gases() {
        return gases.clone();
    }
}
