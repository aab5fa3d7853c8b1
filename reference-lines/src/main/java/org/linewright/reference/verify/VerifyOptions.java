package org.linewright.reference.verify;

/**
 * Tolerances and limits of {@link LineListVerifier}.
 *
 * <p>By default the intensity/Einstein-A check calibrates itself from the list (see
 * {@link IntensityRelationCheck}): a line is a warning when it stands out from its isotopologue's own
 * distribution, an error only beyond {@link #GROSS_LINE_DEVIATION}; an isotopologue's Q(296 K)/abundance unlike
 * the registry's is a warning, an error only beyond {@link #GROSS_REGISTRY_DEVIATION}. With {@code strict} the
 * fixed tolerances {@code relationTolerance} and {@code registryTolerance} apply and every warning is an error
 * (the behaviour before the calibration).
 *
 * @param relationTolerance        strict mode: largest accepted |S / S(A) − 1| with the isotopologue's consensus;
 *                                 see {@link #DEFAULT_RELATION_TOLERANCE}
 * @param registryTolerance        strict mode: largest accepted relative deviation of an isotopologue's consensus
 *                                 Q(296 K)/Iₐ from the registry's; see {@link #DEFAULT_REGISTRY_TOLERANCE}
 * @param upperEnergyToleranceCm1  largest accepted |E′ − (E″ + ν)| in cm⁻¹ where E′ is given
 * @param maxListedFindings        findings of each severity listed one by one in the report (all are counted)
 * @param maxPlotPoints            residual points kept for plotting (evenly thinned beyond that)
 * @param strict                   fixed tolerances, warnings count as errors
 */
public record VerifyOptions(double relationTolerance, double registryTolerance, double upperEnergyToleranceCm1,
                            int maxListedFindings, int maxPlotPoints, boolean strict) {
    /**
     * 1.5 × 10⁻³ (strict mode). The 160-character format prints S and A with 4 significant digits (mantissa
     * 1.000–9.999), so each carries a rounding error of at most 0.5 × 10⁻³ relative; S/A is therefore exact to
     * 1 × 10⁻³ in the worst case. The margin of 0.5 × 10⁻³ covers the consensus itself and the rounding of ν and E″.
     */
    public static final double DEFAULT_RELATION_TOLERANCE = 1.5e-3;

    /**
     * 5 × 10⁻³ (strict mode): the registry's Q(296 K) and Iₐ are confirmed against real lists to 2 × 10⁻³ where
     * checked (the registry's provenance column); the consensus adds at most 10⁻³; the rest is margin.
     */
    public static final double DEFAULT_REGISTRY_TOLERANCE = 5e-3;

    /**
     * 10⁻³ cm⁻¹: the coarsest common printing is E″ with 4 decimals and ν with 6 (rounding ≤ 0.5 × 10⁻⁴ +
     * 0.5 × 10⁻⁶ cm⁻¹), leaving a margin of about 20 for energies printed with fewer digits.
     */
    public static final double DEFAULT_UPPER_ENERGY_TOLERANCE_CM1 = 1e-3;

    /**
     * 2 × 10⁻³: the smallest |S/S(A) − 1| ever reported as standing out, whatever the list's own spread and digits:
     * twice the worst rounding of S and A printed with 4 significant digits (10⁻³). Real clean lists go slightly
     * beyond the rounding bound (up to 1.14 × 10⁻³ in the HITRAN2020 CO sample, whose lines' own bounds are
     * 0.7–0.9 × 10⁻³), and no published line intensity is known to better than about 1 % (from memory): a smaller
     * deviation is nothing anybody could act on.
     */
    public static final double RELATION_FLOOR = 2e-3;

    /**
     * 5: a line stands out when it lies more than 5 robust spreads from its isotopologue's consensus (for normal
     * scatter 6 × 10⁻⁷ of lines, i.e. under one false warning in a million lines; common practice for outliers).
     */
    public static final double OUTLIER_SPREADS = 5;

    /**
     * 2 × 10⁻² ("a few per cent"): a line whose S and A disagree by this much with its isotopologue's consensus is
     * an error whatever the isotopologue's spread. Clean published lists were seen with isotopologues whose lines
     * scatter by 0.15–0.9 % (S and A from different sources); a doubled or halved S or A, a slipped exponent or a
     * digit typed wrong in the mantissa lie far beyond.
     */
    public static final double GROSS_LINE_DEVIATION = 2e-2;

    /**
     * 2 × 10⁻³: the accuracy the registry states for its Q(296 K) and abundances where they were confirmed against
     * real lists (its provenance column). A consensus within this (plus its own uncertainty from the lines' digits
     * and spread) of the registry's value is not reported.
     */
    public static final double REGISTRY_ACCURACY = 2e-3;

    /**
     * 1 × 10⁻²: an isotopologue whose lines imply a Q(296 K)/abundance this far from the registry's is an error.
     * Registry values wrong by up to about 0.5 % were seen (a warning then, naming both values), but a list whose
     * every intensity is off by a per cent or more was computed with a wrong Q or abundance, or is in another
     * unit — nothing in the lines themselves can show it, only this comparison.
     */
    public static final double GROSS_REGISTRY_DEVIATION = 1e-2;

    public VerifyOptions {
        if (!(relationTolerance > 0) || !(registryTolerance > 0) || !(upperEnergyToleranceCm1 > 0)) {
            throw new IllegalArgumentException("tolerances must be positive");
        }
        if (maxListedFindings < 0 || maxPlotPoints < 2) {
            throw new IllegalArgumentException("maxListedFindings >= 0 and maxPlotPoints >= 2 required");
        }
    }

    /** The documented defaults: calibrated (not strict), 1000 findings of each severity listed, 100,000 plot points. */
    public static VerifyOptions defaults() {
        return new VerifyOptions(DEFAULT_RELATION_TOLERANCE, DEFAULT_REGISTRY_TOLERANCE,
                DEFAULT_UPPER_ENERGY_TOLERANCE_CM1, 1000, 100_000, false);
    }

    /** These options in strict mode or not. */
    public VerifyOptions withStrict(boolean strictMode) {
        return new VerifyOptions(relationTolerance, registryTolerance, upperEnergyToleranceCm1, maxListedFindings,
                maxPlotPoints, strictMode);
    }
}
