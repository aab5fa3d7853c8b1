package org.linewright.reference.verify;

/**
 * Tolerances and limits of {@link LineListVerifier}.
 *
 * @param relationTolerance        largest accepted |S / S(A) − 1|, where S(A) is the intensity computed from the
 *                                 line's Einstein A with the registry's Q(296 K) and abundance; see
 *                                 {@link #DEFAULT_RELATION_TOLERANCE} for the derivation
 * @param registryTolerance        largest accepted relative deviation of an isotopologue's consensus
 *                                 Q(296 K)/Iₐ from the registry's; see {@link #DEFAULT_REGISTRY_TOLERANCE}
 * @param upperEnergyToleranceCm1  largest accepted |E′ − (E″ + ν)| in cm⁻¹ where E′ is given
 * @param maxListedFindings        findings listed one by one in the report (all are counted)
 * @param maxPlotPoints            residual points kept for plotting (evenly thinned beyond that)
 */
public record VerifyOptions(double relationTolerance, double registryTolerance, double upperEnergyToleranceCm1, int maxListedFindings,
                            int maxPlotPoints) {
    /**
     * 1.5 × 10⁻³. The 160-character format prints S and A with 4 significant digits (mantissa 1.000–9.999), so
     * each carries a rounding error of at most 0.5 × 10⁻³ relative (half a unit in the last place of a mantissa
     * of 1.000); S/A is therefore exact to 2 × 0.5 × 10⁻³ = 1 × 10⁻³ in the worst case. The margin of 0.5 × 10⁻³
     * covers the consensus itself (a median of values each within 10⁻³, resolved to 5 × 10⁻⁶) and the rounding of
     * ν and E″ (E″ to 10⁻⁴ cm⁻¹ changes exp(−c₂E″/T) by ≤ 2.5 × 10⁻⁷ at 296 K). A line with a doubled S or A
     * deviates by about 1, far beyond this.
     */
    public static final double DEFAULT_RELATION_TOLERANCE = 1.5e-3;

    /**
     * 5 × 10⁻³: the registry's Q(296 K) and Iₐ are recalled values confirmed against real lists to 2 × 10⁻³ (see
     * the registry's provenance column); the consensus adds at most 10⁻³ (rounding of S and A, which a median
     * does not remove when it is systematic); the rest is margin. A list computed with another partition-sum
     * convention (e.g. nuclear-spin weights left out) differs by a factor of 2 or more.
     */
    public static final double DEFAULT_REGISTRY_TOLERANCE = 5e-3;

    /**
     * 10⁻³ cm⁻¹: the coarsest common printing is E″ with 4 decimals and ν with 6 (rounding ≤ 0.5 × 10⁻⁴ +
     * 0.5 × 10⁻⁶ cm⁻¹), leaving a margin of about 20 for energies printed with fewer digits.
     */
    public static final double DEFAULT_UPPER_ENERGY_TOLERANCE_CM1 = 1e-3;

    public VerifyOptions {
        if (!(relationTolerance > 0) || !(registryTolerance > 0) || !(upperEnergyToleranceCm1 > 0)) {
            throw new IllegalArgumentException("tolerances must be positive");
        }
        if (maxListedFindings < 0 || maxPlotPoints < 2) {
            throw new IllegalArgumentException("maxListedFindings >= 0 and maxPlotPoints >= 2 required");
        }
    }

    /** The documented defaults: 1000 findings listed, 100,000 plot points. */
    public static VerifyOptions defaults() {
        return new VerifyOptions(DEFAULT_RELATION_TOLERANCE, DEFAULT_REGISTRY_TOLERANCE,
                DEFAULT_UPPER_ENERGY_TOLERANCE_CM1, 1000, 100_000);
    }
}
