package org.linewright.reference.verify;

/**
 * Per-isotopologue result of the intensity/Einstein-A check.
 *
 * @param moleculeId                 molecule number
 * @param isotopologue               isotopologue number
 * @param name                       the registry's formula and isotope formula, or empty when unknown
 * @param lines                      lines of this isotopologue
 * @param relationChecked            lines with S, A, g′, E″ and ν usable for the relation
 * @param relationWarnings           of those, lines standing out from the isotopologue's distribution
 * @param relationErrors             lines beyond the gross limit (and lines with A = 0 but S &gt; 0)
 * @param registryQOverAbundance     the registry's Q(296 K)/Iₐ (NaN when the isotopologue is unknown)
 * @param registryProvenance         the registry's provenance of Q(296 K) and Iₐ (empty when unknown)
 * @param consensusQOverAbundance    the median Q(296 K)/Iₐ implied by the lines (to ±5 × 10⁻⁶ relative)
 * @param impliedQOverAbundanceMin   smallest Q(296 K)/Iₐ implied by a line
 * @param impliedQOverAbundanceMax   largest Q(296 K)/Iₐ implied by a line
 * @param impliedQOverAbundanceMean  mean Q(296 K)/Iₐ implied by the lines
 * @param maxAbsDeviation            largest |S/S(A) − 1| with the consensus (NaN when not checked)
 * @param maxDeviationWavenumberCm1  position of the line with that deviation
 * @param robustSpread               1.4826 × median |S/S(A) − 1| of the lines: the isotopologue's own scatter
 * @param outlierLimit               |S/S(A) − 1| beyond which a line stands out (at least; a line's own rounding
 *                                   bound raises it where larger)
 * @param intensityDigits            significant digits of S the records carry (largest seen)
 * @param einsteinADigits            significant digits of A the records carry (largest seen)
 * @param registryAllowance          |consensus/registry − 1| accepted without a finding
 */
public record IsotopologueSummary(int moleculeId, int isotopologue, String name, long lines, long relationChecked,
                                  long relationWarnings, long relationErrors, double registryQOverAbundance,
                                  String registryProvenance, double consensusQOverAbundance,
                                  double impliedQOverAbundanceMin, double impliedQOverAbundanceMax,
                                  double impliedQOverAbundanceMean, double maxAbsDeviation,
                                  double maxDeviationWavenumberCm1, double robustSpread, double outlierLimit,
                                  int intensityDigits, int einsteinADigits, double registryAllowance) {
    /** consensus / registry − 1: how far the lines' Q(296 K)/Iₐ lies from the registry's (NaN when unknown). */
    public double registryDeviation() {
        return consensusQOverAbundance / registryQOverAbundance - 1.0;
    }

    /** Lines flagged by the relation check (warnings and errors). */
    public long relationFlagged() {
        return relationWarnings + relationErrors;
    }

    /** {@code molecule/isotopologue}. */
    public String key() {
        return moleculeId + "/" + isotopologue;
    }
}
