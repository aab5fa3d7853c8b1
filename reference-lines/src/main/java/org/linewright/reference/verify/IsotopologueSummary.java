package org.linewright.reference.verify;

/**
 * Per-isotopologue result of the intensity/Einstein-A check.
 *
 * @param moleculeId                 molecule number
 * @param isotopologue               isotopologue number
 * @param name                       the registry's formula and isotope formula, or empty when unknown
 * @param lines                      lines of this isotopologue
 * @param relationChecked            lines with S, A, g′, E″ and ν usable for the relation
 * @param relationFlagged            of those, lines beyond the tolerance
 * @param registryQOverAbundance     the registry's Q(296 K)/Iₐ (NaN when the isotopologue is unknown)
 * @param consensusQOverAbundance    the median Q(296 K)/Iₐ implied by the lines (to ±5 × 10⁻⁶ relative)
 * @param impliedQOverAbundanceMin   smallest Q(296 K)/Iₐ implied by a line
 * @param impliedQOverAbundanceMax   largest Q(296 K)/Iₐ implied by a line
 * @param impliedQOverAbundanceMean  mean Q(296 K)/Iₐ implied by the lines
 * @param maxAbsDeviation            largest |S/S(A) − 1| with the consensus (NaN when not checked)
 * @param maxDeviationWavenumberCm1  position of the line with that deviation
 */
public record IsotopologueSummary(int moleculeId, int isotopologue, String name, long lines, long relationChecked,
                                  long relationFlagged, double registryQOverAbundance,
                                  double consensusQOverAbundance,
                                  double impliedQOverAbundanceMin, double impliedQOverAbundanceMax,
                                  double impliedQOverAbundanceMean, double maxAbsDeviation,
                                  double maxDeviationWavenumberCm1) {
    /** consensus / registry − 1: how far the lines' Q(296 K)/Iₐ lies from the registry's (NaN when unknown). */
    public double registryDeviation() {
        return consensusQOverAbundance / registryQOverAbundance - 1.0;
    }

    /** {@code molecule/isotopologue}. */
    public String key() {
        return moleculeId + "/" + isotopologue;
    }
}
