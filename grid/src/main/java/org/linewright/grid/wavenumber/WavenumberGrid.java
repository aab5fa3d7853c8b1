package org.linewright.grid.wavenumber;

import java.util.LinkedHashMap;
import java.util.Map;
import org.linewright.ingest.InputException;

/**
 * An ascending wavenumber grid in cm⁻¹: a uniform step, or a constant resolving power R = ν/Δν (points spaced
 * evenly in ln ν, ν_k = ν_0·(1 + 1/R)^k). Immutable; {@link #pointsCm1()} returns the shared array, which callers
 * must not modify.
 */
public final class WavenumberGrid {
    /** How the points are spaced. */
    public enum Spacing { UNIFORM, RESOLVING_POWER }

    /** Refuse grids larger than this many points (memory guard: 8 bytes per point per σ array). */
    public static final int MAX_POINTS = 400_000_000;

    private final Spacing spacing;
    private final double fromCm1;
    private final double toCm1;
    /** Step in cm⁻¹ for uniform grids, resolving power for the other kind. */
    private final double parameter;
    private final double[] pointsCm1;

    private WavenumberGrid(Spacing spacing, double fromCm1, double toCm1, double parameter, double[] pointsCm1) {
        this.spacing = spacing;
        this.fromCm1 = fromCm1;
        this.toCm1 = toCm1;
        this.parameter = parameter;
        this.pointsCm1 = pointsCm1;
    }

    /**
     * Points {@code from, from+step, ...} up to and including {@code to} (within a 10⁻⁹ step tolerance);
     * point k is computed as {@code from + k·step}, never by accumulation, so no rounding drift builds up.
     */
    public static WavenumberGrid uniform(double fromCm1, double toCm1, double stepCm1) {
        checkRange(fromCm1, toCm1);
        if (!(stepCm1 > 0) || !Double.isFinite(stepCm1)) {
            throw new InputException("wavenumber step: " + stepCm1 + " (expected a positive number of cm-1)");
        }
        double count = Math.floor((toCm1 - fromCm1) / stepCm1 + 1e-9) + 1;
        if (count > MAX_POINTS) {
            throw new InputException("wavenumber grid: " + (long) count + " points (at most " + MAX_POINTS + ")");
        }
        double[] p = new double[(int) count];
        for (int k = 0; k < p.length; k++) {
            p[k] = fromCm1 + k * stepCm1;
        }
        return new WavenumberGrid(Spacing.UNIFORM, fromCm1, toCm1, stepCm1, p);
    }

    /**
     * Points ν_k = from·(1 + 1/R)^k up to {@code to}: the spacing Δν = ν/R (constant resolving power), computed as
     * from·exp(k·ln(1 + 1/R)) so each point is independent of the others.
     */
    public static WavenumberGrid resolvingPower(double fromCm1, double toCm1, double resolvingPower) {
        checkRange(fromCm1, toCm1);
        if (!(fromCm1 > 0)) {
            throw new InputException("wavenumber range: from " + fromCm1 + " cm-1 (a resolving-power grid needs a positive start)");
        }
        if (!(resolvingPower > 0) || !Double.isFinite(resolvingPower)) {
            throw new InputException("resolving power: " + resolvingPower + " (expected a positive number)");
        }
        double logStep = Math.log1p(1.0 / resolvingPower);
        double count = Math.floor(Math.log(toCm1 / fromCm1) / logStep + 1e-9) + 1;
        if (count > MAX_POINTS) {
            throw new InputException("wavenumber grid: " + (long) count + " points (at most " + MAX_POINTS + ")");
        }
        double[] p = new double[(int) count];
        for (int k = 0; k < p.length; k++) {
            p[k] = fromCm1 * Math.exp(k * logStep);
        }
        return new WavenumberGrid(Spacing.RESOLVING_POWER, fromCm1, toCm1, resolvingPower, p);
    }

    /**
     * The points {@code [fromIndex, toIndex)} of this grid as a grid of their own, bit for bit the same values (a
     * table's wavenumber blocks are slices, so a block computed alone equals the same points of the whole grid).
     */
    public WavenumberGrid slice(int fromIndex, int toIndex) {
        if (fromIndex < 0 || toIndex > pointsCm1.length || toIndex - fromIndex < 1) {
            throw new IllegalArgumentException("slice [" + fromIndex + ", " + toIndex + ") of a grid of " + pointsCm1.length);
        }
        double[] p = java.util.Arrays.copyOfRange(pointsCm1, fromIndex, toIndex);
        return new WavenumberGrid(spacing, p[0], p[p.length - 1], parameter, p);
    }

    private static void checkRange(double fromCm1, double toCm1) {
        if (!Double.isFinite(fromCm1) || !Double.isFinite(toCm1) || fromCm1 < 0 || !(toCm1 > fromCm1)) {
            throw new InputException("wavenumber range: " + fromCm1 + " to " + toCm1
                    + " cm-1 (expected 0 <= from < to, both finite)");
        }
    }

    public Spacing spacing() {
        return spacing;
    }

    /** The grid points in cm⁻¹, ascending (shared; do not modify). */
    public double[] pointsCm1() {
        return pointsCm1;
    }

    public int size() {
        return pointsCm1.length;
    }

    public double firstCm1() {
        return pointsCm1[0];
    }

    public double lastCm1() {
        return pointsCm1[pointsCm1.length - 1];
    }

    /** The step in cm⁻¹ (uniform grids) or NaN. */
    public double stepCm1() {
        return spacing == Spacing.UNIFORM ? parameter : Double.NaN;
    }

    /** The resolving power (resolving-power grids) or NaN. */
    public double resolvingPower() {
        return spacing == Spacing.RESOLVING_POWER ? parameter : Double.NaN;
    }

    /** The largest spacing between neighbouring points, cm⁻¹. */
    public double coarsestSpacingCm1() {
        return spacing == Spacing.UNIFORM ? parameter : lastCm1() / resolvingPower();
    }

    /** The grid's defining parameters, for output metadata. */
    public Map<String, String> describe() {
        Map<String, String> m = new LinkedHashMap<>();
        m.put("grid_spacing_kind", spacing.name().toLowerCase(java.util.Locale.ROOT));
        m.put("grid_from_cm1", Double.toString(fromCm1));
        m.put("grid_to_cm1", Double.toString(toCm1));
        m.put(spacing == Spacing.UNIFORM ? "grid_step_cm1" : "grid_resolving_power", Double.toString(parameter));
        m.put("grid_points", Integer.toString(pointsCm1.length));
        return m;
    }
}
