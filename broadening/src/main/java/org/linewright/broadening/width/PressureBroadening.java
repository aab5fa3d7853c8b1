package org.linewright.broadening.width;

import org.linewright.broadening.background.BackgroundGas;
import org.linewright.broadening.background.Composition;
import org.linewright.broadening.sources.ResolvedWidths;
import org.linewright.ingest.line.LineBatch;

/**
 * Lorentz (pressure) half width and pressure shift of a line in a gas mixture:
 * <pre>
 *   γ_L(p, T) = p · Σ_g x_g · γ_g · (T_ref/T)^n_g          δ(p) = p · Σ_g x_g · δ_g
 * </pre>
 * with p the total pressure in atm, x_g the mole fractions, γ_g (cm⁻¹/atm) and n_g the width and its
 * temperature exponent for gas g at T_ref = 296 K, and δ_g (cm⁻¹/atm) the pressure shift (common practice;
 * e.g. Rothman et al. 1998, JQSRT 60, 665, appendix, eqs. A12–A14, generalised to a sum over broadeners as in
 * Tan et al. 2022, ApJS 262, 40). The line model gives no temperature dependence of the shift, so none is
 * applied. Pressures are in atm here; converting from Pa or bar is the caller's job at the edge. Accuracy:
 * a few ulps per gas term (one {@code Math.pow}, or exp(n·ln(296/T)) in the batch form) beyond the inputs.
 */
public final class PressureBroadening {
    private static final double REFERENCE_TEMPERATURE_K = LineBatch.REFERENCE_TEMPERATURE_K;

    private PressureBroadening() {
    }

    /**
     * γ_L for one line.
     *
     * @param fractions x_g, one per gas
     * @param widthsCm1PerAtm γ_g at 296 K
     * @param exponents n_g
     */
    public static double lorentzHwhmCm1(double pressureAtm, double temperatureK, double[] fractions,
                                        double[] widthsCm1PerAtm, double[] exponents) {
        double tRatio = REFERENCE_TEMPERATURE_K / temperatureK;
        double sum = 0;
        for (int g = 0; g < fractions.length; g++) {
            sum += fractions[g] * widthsCm1PerAtm[g] * Math.pow(tRatio, exponents[g]);
        }
        return pressureAtm * sum;
    }

    /** δ for one line: p·Σ x_g·δ_g. */
    public static double shiftCm1(double pressureAtm, double[] fractions, double[] shiftsCm1PerAtm) {
        double sum = 0;
        for (int g = 0; g < fractions.length; g++) {
            sum += fractions[g] * shiftsCm1PerAtm[g];
        }
        return pressureAtm * sum;
    }

    /**
     * γ_L(p, T) for every row of a resolved batch (allocation-free; gases summed in {@link BackgroundGas} order,
     * so results do not depend on how rows are split between threads).
     *
     * @param out receives γ_L in cm⁻¹ for rows {@code 0 .. widths.size-1}
     */
    /**
     * One gas's part of a row's Lorentz HWHM, p·x_g·γ_g·(296/T)^n_g in cm⁻¹ (0 when the gas is absent): the
     * share of the width that gas's collisions make, for perturber-specific wing corrections.
     *
     * @param widths       resolved widths
     * @param gas          the background gas
     * @param row          row index
     * @param pressureAtm  total pressure in atm
     * @param temperatureK temperature in K
     * @return the gas's part of γL in cm⁻¹
     */
    public static double partialHwhmCm1(ResolvedWidths widths, BackgroundGas gas, int row, double pressureAtm,
                                        double temperatureK) {
        double[] w = widths.widthCm1PerAtm[gas.ordinal()];
        if (w == null) {
            return 0.0;
        }
        double px = pressureAtm * widths.composition().fraction(gas);
        return px * w[row] * Math.pow(REFERENCE_TEMPERATURE_K / temperatureK, widths.exponent[gas.ordinal()][row]);
    }

    public static void lorentzHwhmCm1(ResolvedWidths widths, double pressureAtm, double temperatureK, double[] out) {
        checkState(pressureAtm, temperatureK);
        int n = widths.size;
        Composition c = widths.composition();
        double tRatio = REFERENCE_TEMPERATURE_K / temperatureK;
        // log once: (296/T)^n = exp(n·ln(296/T)) costs one exp per gas and row instead of a pow
        double logRatio = Math.log(tRatio);
        for (int i = 0; i < n; i++) {
            out[i] = 0.0;
        }
        for (int g = 0; g < BackgroundGas.COUNT; g++) {
            double[] w = widths.widthCm1PerAtm[g];
            if (w == null) {
                continue;
            }
            double[] e = widths.exponent[g];
            double px = pressureAtm * c.fraction(BackgroundGas.ofOrdinal(g));
            for (int i = 0; i < n; i++) {
                out[i] += px * w[i] * Math.exp(e[i] * logRatio);
            }
        }
    }

    /** δ(p) for every row of a resolved batch: p·Σ x_g·δ_g in cm⁻¹. */
    public static void shiftCm1(ResolvedWidths widths, double pressureAtm, double[] out) {
        if (!(pressureAtm >= 0) || Double.isInfinite(pressureAtm)) {
            throw new IllegalArgumentException("pressure must be non-negative and finite: " + pressureAtm + " atm");
        }
        for (int i = 0; i < widths.size; i++) {
            out[i] = pressureAtm * widths.backgroundShiftCm1PerAtm[i];
        }
    }

    private static void checkState(double pressureAtm, double temperatureK) {
        if (!(pressureAtm >= 0) || Double.isInfinite(pressureAtm)) {
            throw new IllegalArgumentException("pressure must be non-negative and finite: " + pressureAtm + " atm");
        }
        if (!(temperatureK > 0) || Double.isInfinite(temperatureK)) {
            throw new IllegalArgumentException("temperature must be positive and finite: " + temperatureK + " K");
        }
    }
}
