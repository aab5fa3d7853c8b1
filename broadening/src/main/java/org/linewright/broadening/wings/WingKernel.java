package org.linewright.broadening.wings;

import java.util.LinkedHashMap;
import java.util.Map;
import org.linewright.broadening.voigt.LineShape;
import org.linewright.broadening.voigt.LineShapeKind;

/**
 * A {@link WingTreatment} prepared for one pressure and temperature: adds lines to a grid with the cutoff,
 * pedestal removal and χ factor applied, and reports the fraction of each line's area they remove.
 * Immutable and thread-safe; allocation-free in {@link #addLine}.
 */
public final class WingKernel {

    private final WingTreatment treatment;
    private final double pressureAtm;
    /** χ factor at this temperature, or {@code null} for none. */
    private final PerrinHartmannChi chi;

    WingKernel(WingTreatment treatment, double pressureAtm, PerrinHartmannChi chi) {
        this.treatment = treatment;
        this.pressureAtm = pressureAtm;
        this.chi = chi;
    }

    /**
     * @param dopplerHwhmCm1 αD in cm⁻¹
     * @param lorentzHwhmCm1 γL in cm⁻¹
     * @return the line's cutoff distance in cm⁻¹ (infinite for none)
     */
    public double cutoffCm1(double dopplerHwhmCm1, double lorentzHwhmCm1) {
        return treatment.cutoff().distanceCm1(dopplerHwhmCm1, lorentzHwhmCm1, pressureAtm);
    }

    /**
     * Adds one line, {@code strength · (φ(Δν)·χ(Δν) − pedestal)}, to the grid points within its cutoff
     * (|Δν| ≤ d). The pedestal is φ(d)·χ(d) when removal is on, else 0.
     *
     * @param shape          line shape
     * @param gridCm1        wavenumbers in cm⁻¹, ascending on [gridFrom, gridTo)
     * @param gridFrom       first grid index considered, inclusive
     * @param gridTo         last grid index considered, exclusive
     * @param centerCm1      line centre in cm⁻¹
     * @param dopplerHwhmCm1 αD in cm⁻¹
     * @param lorentzHwhmCm1 γL in cm⁻¹
     * @param strength       multiplier (e.g. line intensity, cm/molecule)
     * @param out            accumulator indexed like {@code gridCm1}
     */
    public void addLine(LineShape shape, double[] gridCm1, int gridFrom, int gridTo, double centerCm1,
                        double dopplerHwhmCm1, double lorentzHwhmCm1, double strength, double[] out) {
        double d = cutoffCm1(dopplerHwhmCm1, lorentzHwhmCm1);
        int lo = firstIndexAtOrAbove(gridCm1, gridFrom, gridTo, centerCm1 - d);
        int hi = firstIndexAbove(gridCm1, lo, gridTo, centerCm1 + d);
        if (lo >= hi) {
            return;
        }
        double baseline = 0.0;
        if (treatment.removePedestal() && d != Double.POSITIVE_INFINITY) {
            baseline = shape.value(d, dopplerHwhmCm1, lorentzHwhmCm1) * (chi == null ? 1.0 : chi.factor(d));
        }
        if (chi == null || d <= PerrinHartmannChi.SIGMA1_CM1) {
            shape.addProfile(gridCm1, lo, hi, centerCm1, dopplerHwhmCm1, lorentzHwhmCm1, strength, baseline, out);
            return;
        }
        // χ = 1 inside σ1: the fast kernel there, per point with χ outside
        int innerLo = firstIndexAtOrAbove(gridCm1, lo, hi, centerCm1 - PerrinHartmannChi.SIGMA1_CM1);
        int innerHi = firstIndexAbove(gridCm1, innerLo, hi, centerCm1 + PerrinHartmannChi.SIGMA1_CM1);
        shape.addProfile(gridCm1, innerLo, innerHi, centerCm1, dopplerHwhmCm1, lorentzHwhmCm1, strength, baseline,
                out);
        addWithChi(shape, gridCm1, lo, innerLo, centerCm1, dopplerHwhmCm1, lorentzHwhmCm1, strength, baseline, out);
        addWithChi(shape, gridCm1, innerHi, hi, centerCm1, dopplerHwhmCm1, lorentzHwhmCm1, strength, baseline, out);
    }

    private void addWithChi(LineShape shape, double[] gridCm1, int from, int to, double centerCm1,
                            double dopplerHwhmCm1, double lorentzHwhmCm1, double strength, double baseline,
                            double[] out) {
        for (int i = from; i < to; i++) {
            double detuning = gridCm1[i] - centerCm1;
            double value = shape.value(detuning, dopplerHwhmCm1, lorentzHwhmCm1) * chi.factor(detuning);
            out[i] += strength * (value - baseline);
        }
    }

    /**
     * Fraction of the line's area (∫φ = 1) that {@link #addLine} leaves out on an infinitely fine grid: the tail
     * beyond the cutoff, plus the removed pedestal, plus the χ-factor deficit inside the cutoff
     * (see {@link WingLoss}).
     *
     * @param shape          line shape
     * @param dopplerHwhmCm1 αD in cm⁻¹
     * @param lorentzHwhmCm1 γL in cm⁻¹
     * @return fraction in [0, 1]
     */
    public double lostFraction(LineShapeKind shape, double dopplerHwhmCm1, double lorentzHwhmCm1) {
        double d = cutoffCm1(dopplerHwhmCm1, lorentzHwhmCm1);
        double lost = WingLoss.tailFraction(shape, d, dopplerHwhmCm1, lorentzHwhmCm1);
        if (treatment.removePedestal()) {
            lost += WingLoss.pedestalFraction(shape, d, dopplerHwhmCm1, lorentzHwhmCm1, chi);
        }
        if (chi != null) {
            lost += WingLoss.chiDeficitFraction(shape, d, dopplerHwhmCm1, lorentzHwhmCm1, chi);
        }
        return lost;
    }

    /** @return the χ factor at this temperature, or {@code null} */
    public PerrinHartmannChi chiFactor() {
        return chi;
    }

    /** @return the treatment's metadata plus the condition-dependent χ coefficients */
    public Map<String, String> describe() {
        Map<String, String> m = new LinkedHashMap<>(treatment.describe());
        if (chi != null) {
            m.putAll(chi.describe());
        }
        return m;
    }

    /**
     * @param gridCm1 ascending on [from, to)
     * @param from    first index, inclusive
     * @param to      last index, exclusive
     * @param value   wavenumber in cm⁻¹
     * @return the first index in [from, to) with grid ≥ value, or {@code to}
     */
    public static int firstIndexAtOrAbove(double[] gridCm1, int from, int to, double value) {
        int lo = from;
        int hi = to;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (gridCm1[mid] < value) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }

    /**
     * @param gridCm1 ascending on [from, to)
     * @param from    first index, inclusive
     * @param to      last index, exclusive
     * @param value   wavenumber in cm⁻¹
     * @return the first index in [from, to) with grid &gt; value, or {@code to}
     */
    public static int firstIndexAbove(double[] gridCm1, int from, int to, double value) {
        int lo = from;
        int hi = to;
        while (lo < hi) {
            int mid = (lo + hi) >>> 1;
            if (gridCm1[mid] <= value) {
                lo = mid + 1;
            } else {
                hi = mid;
            }
        }
        return lo;
    }
}
