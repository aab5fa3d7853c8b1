package org.linewright.grid.engine;

/**
 * Lines ready for a cross-section engine at one (p, T): pressure-shifted centres, intensities S(T), Doppler and
 * Lorentz half widths, in ascending order of centre. Primitive arrays, reused chunk after chunk; {@link #size}
 * rows valid. Built from the line store by the cross-section calculator, consumed by every engine.
 *
 * <p>The line shape travels in the widths: a Doppler-only computation has γL = 0 on every row, a Lorentz-only one
 * αD = 0; engines evaluate the Voigt profile, which reduces exactly to the pure shape in those limits. Centres are
 * ascending before the shift is applied (the shift may swap neighbours closer than their shift difference).
 */
public final class LineChunk {
    /** Number of valid rows. */
    public int size;
    /** Line centre including the pressure shift, cm⁻¹. */
    public final double[] centerCm1;
    /** Line intensity S(T), cm⁻¹/(molecule·cm⁻²). */
    public final double[] intensityCmPerMolecule;
    /** Doppler HWHM αD, cm⁻¹. */
    public final double[] dopplerHwhmCm1;
    /** Lorentz HWHM γL at this pressure and temperature, cm⁻¹. */
    public final double[] lorentzHwhmCm1;
    /** Whether the line gets the sub-Lorentzian χ factor (CO2 broadened by CO2). */
    public final boolean[] chiFactor;
    /**
     * Whether the line has the Van Vleck–Weisskopf shape (see
     * {@link org.linewright.broadening.voigt.VanVleckWeisskopfProfile}) instead of the Voigt profile. Engines that
     * do not evaluate it leave such lines to {@link org.linewright.grid.engine.exact.ExactEngine} (the
     * cross-section calculator routes them).
     */
    public final boolean[] vanVleckWeisskopf;
    /**
     * For a line with {@link #chiFactor}: the share 1 − w of its Lorentz width from gases the χ factor does not
     * apply to (w the CO2-broadened share), so that its far wing is (1 − w)·V + w·χ·V. 0 (the default) applies χ
     * to the whole line. Engines that do not evaluate it leave such lines to
     * {@link org.linewright.grid.engine.exact.ExactEngine} (the cross-section calculator routes them).
     */
    public final double[] chiExemptShare;

    public LineChunk(int capacity) {
        centerCm1 = new double[capacity];
        intensityCmPerMolecule = new double[capacity];
        dopplerHwhmCm1 = new double[capacity];
        lorentzHwhmCm1 = new double[capacity];
        chiFactor = new boolean[capacity];
        vanVleckWeisskopf = new boolean[capacity];
        chiExemptShare = new double[capacity];
    }

    public int capacity() {
        return centerCm1.length;
    }
}
