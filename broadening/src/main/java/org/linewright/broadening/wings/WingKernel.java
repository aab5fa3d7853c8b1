package org.linewright.broadening.wings;

import java.util.LinkedHashMap;
import java.util.Map;
import org.linewright.broadening.voigt.LineShape;
import org.linewright.broadening.voigt.LineShapeKind;
import org.linewright.broadening.voigt.VanVleckWeisskopfProfile;
import org.linewright.broadening.voigt.VoigtProfile;

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

    /**
     * Adds one line with the Van Vleck–Weisskopf shape when {@code vanVleckWeisskopf} is set, else as
     * {@link #addLine(LineShape, double[], int, int, double, double, double, double, double[])} with {@code shape}.
     * The Van Vleck–Weisskopf line is {@code strength · (ν/ν₀)² · [V(ν − ν₀)·χ(ν − ν₀) + V(ν + ν₀)·χ(ν + ν₀)
     * − pedestal]} on the grid points within the cutoff of the +ν₀ resonance (|ν − ν₀| ≤ d), the pedestal
     * V(d)·χ(d) when removal is on (see {@link VanVleckWeisskopfProfile#addProfile}).
     *
     * @param shape             line shape of the lines without the flag
     * @param vanVleckWeisskopf whether this line has the Van Vleck–Weisskopf shape
     * @param gridCm1           wavenumbers in cm⁻¹, ascending on [gridFrom, gridTo)
     * @param gridFrom          first grid index considered, inclusive
     * @param gridTo            last grid index considered, exclusive
     * @param centerCm1         line centre in cm⁻¹ (positive for the Van Vleck–Weisskopf shape)
     * @param dopplerHwhmCm1    αD in cm⁻¹
     * @param lorentzHwhmCm1    γL in cm⁻¹
     * @param strength          multiplier (e.g. line intensity, cm/molecule)
     * @param out               accumulator indexed like {@code gridCm1}
     */
    public void addLine(LineShape shape, boolean vanVleckWeisskopf, double[] gridCm1, int gridFrom, int gridTo,
                        double centerCm1, double dopplerHwhmCm1, double lorentzHwhmCm1, double strength,
                        double[] out) {
        if (!vanVleckWeisskopf) {
            addLine(shape, gridCm1, gridFrom, gridTo, centerCm1, dopplerHwhmCm1, lorentzHwhmCm1, strength, out);
            return;
        }
        double d = cutoffCm1(dopplerHwhmCm1, lorentzHwhmCm1);
        int lo = firstIndexAtOrAbove(gridCm1, gridFrom, gridTo, centerCm1 - d);
        int hi = firstIndexAbove(gridCm1, lo, gridTo, centerCm1 + d);
        if (lo >= hi) {
            return;
        }
        double baseline = 0.0;
        if (treatment.removePedestal() && d != Double.POSITIVE_INFINITY) {
            baseline = VoigtProfile.value(d, dopplerHwhmCm1, lorentzHwhmCm1) * (chi == null ? 1.0 : chi.factor(d));
        }
        if (chi == null) {
            VanVleckWeisskopfProfile.addProfile(gridCm1, lo, hi, centerCm1, dopplerHwhmCm1, lorentzHwhmCm1, strength,
                    baseline, out);
            return;
        }
        double inverseCenter = 1.0 / centerCm1;
        for (int i = lo; i < hi; i++) {
            double nu = gridCm1[i];
            double ratio = nu * inverseCenter;
            double sum = VoigtProfile.value(nu - centerCm1, dopplerHwhmCm1, lorentzHwhmCm1) * chi.factor(nu - centerCm1)
                    + VoigtProfile.value(nu + centerCm1, dopplerHwhmCm1, lorentzHwhmCm1) * chi.factor(nu + centerCm1)
                    - baseline;
            out[i] += strength * ratio * ratio * sum;
        }
    }

    /**
     * Fraction of a line's area (∫φ = 1) that lies at ν ≤ 0 within its cutoff, which a symmetric shape centred at
     * ν₀ puts where no wavenumber grid reaches (grids start above 0): ½·(T(ν₀) − T(d)) for d &gt; ν₀, with T the
     * two-sided tail fraction of {@link WingLoss#tailFraction} (the part beyond d is already in
     * {@link #lostFraction}); 0 when the cutoff stays above ν = 0. A Van Vleck–Weisskopf line has none: its −ν₀
     * resonance carries that area onto ν &gt; 0.
     *
     * @param shape          the pure shape the kernels reduce to for these widths
     * @param centerCm1      ν₀ in cm⁻¹
     * @param dopplerHwhmCm1 αD in cm⁻¹
     * @param lorentzHwhmCm1 γL in cm⁻¹
     * @return fraction in [0, 1] (at most ½ for ν₀ &gt; 0)
     */
    public double negativeFrequencyFraction(LineShapeKind shape, double centerCm1, double dopplerHwhmCm1,
                                            double lorentzHwhmCm1) {
        double d = cutoffCm1(dopplerHwhmCm1, lorentzHwhmCm1);
        if (!(d > centerCm1)) {
            return 0.0;
        }
        double beyondCutoff = WingLoss.tailFraction(shape, d, dopplerHwhmCm1, lorentzHwhmCm1);
        double distanceToZero = Math.abs(centerCm1);
        // both tails beyond |ν₀| but inside d, halved: the side of the profile across ν = 0
        double across = d > distanceToZero
                ? 0.5 * (WingLoss.tailFraction(shape, distanceToZero, dopplerHwhmCm1, lorentzHwhmCm1) - beyondCutoff)
                : 0.0;
        double fraction = centerCm1 > 0 ? across : (1.0 - beyondCutoff) - across;
        return Math.min(1.0, Math.max(0.0, fraction));
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
