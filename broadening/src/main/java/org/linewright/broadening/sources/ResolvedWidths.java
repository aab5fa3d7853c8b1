package org.linewright.broadening.sources;

import org.linewright.broadening.background.BackgroundGas;
import org.linewright.broadening.background.Composition;

/**
 * Per-line broadening parameters of a batch for each gas of a {@link Composition}, with their sources, and the
 * composition-weighted summaries. Filled by {@link WidthResolver#resolve}; reused batch after batch.
 *
 * <p>Per gas g present in the composition (arrays of absent gases are null):
 * {@code widthCm1PerAtm[g][row]} γ_g(296 K), {@code exponent[g][row]} n_g, {@code shiftCm1PerAtm[g][row]} δ_g,
 * {@code source[g][row]} the {@link WidthSource#code()} that gave γ_g.
 *
 * <p>Summaries (the {@code lines --background} columns):
 * <ul>
 *   <li>{@code backgroundWidthCm1PerAtm} = Σ x_g·γ_g — the Lorentz HWHM at 296 K and 1 atm;</li>
 *   <li>{@code backgroundWidthExponent} = Σ x_g·γ_g·n_g / Σ x_g·γ_g — the γ-weighted mean exponent. It is the
 *       n for which Σ x_g·γ_g·(296/T)^n_g and (Σ x_g·γ_g)·(296/T)^n agree in value and in slope with respect to
 *       ln T at 296 K (first-order Taylor match), it needs no arbitrary second temperature, and it is exact
 *       when all gases share one exponent. The exact sum is what {@code PressureBroadening} uses;</li>
 *   <li>{@code backgroundShiftCm1PerAtm} = Σ x_g·δ_g.</li>
 * </ul>
 */
public final class ResolvedWidths {
    /** Output column of {@link #backgroundWidthCm1PerAtm}. */
    public static final String WIDTH_COLUMN = "background_width_cm1_per_atm";
    /** Output column of {@link #backgroundWidthExponent}. */
    public static final String EXPONENT_COLUMN = "background_width_exponent";
    /** Output column of {@link #backgroundShiftCm1PerAtm}. */
    public static final String SHIFT_COLUMN = "background_shift_cm1_per_atm";

    /** Output column of the per-line width source code of {@code gas}, e.g. {@code h2_width_source}. */
    public static String sourceColumn(BackgroundGas gas) {
        return gas.label() + "_width_source";
    }

    private final int capacity;
    private final Composition composition;
    /** Number of valid rows. */
    public int size;
    public final double[][] widthCm1PerAtm = new double[BackgroundGas.COUNT][];
    public final double[][] exponent = new double[BackgroundGas.COUNT][];
    public final double[][] shiftCm1PerAtm = new double[BackgroundGas.COUNT][];
    public final byte[][] source = new byte[BackgroundGas.COUNT][];
    public final double[] backgroundWidthCm1PerAtm;
    public final double[] backgroundWidthExponent;
    public final double[] backgroundShiftCm1PerAtm;

    /** Arrays for {@code capacity} rows and the gases present in {@code composition}. */
    public ResolvedWidths(int capacity, Composition composition) {
        this.capacity = capacity;
        this.composition = composition;
        for (BackgroundGas g : composition.presentGases()) {
            widthCm1PerAtm[g.ordinal()] = new double[capacity];
            exponent[g.ordinal()] = new double[capacity];
            shiftCm1PerAtm[g.ordinal()] = new double[capacity];
            source[g.ordinal()] = new byte[capacity];
        }
        backgroundWidthCm1PerAtm = new double[capacity];
        backgroundWidthExponent = new double[capacity];
        backgroundShiftCm1PerAtm = new double[capacity];
    }

    public int capacity() {
        return capacity;
    }

    public Composition composition() {
        return composition;
    }

    /** Source of gas {@code gas}'s width on row {@code row}; null when the gas is absent. */
    public WidthSource source(BackgroundGas gas, int row) {
        byte[] s = source[gas.ordinal()];
        return s == null ? null : WidthSource.ofCode(s[row]);
    }
}
