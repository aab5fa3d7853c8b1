package org.linewright.reference.verify;

import java.util.Collections;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;

/**
 * Everything {@link LineListVerifier} found in one line list.
 *
 * @param subject            what was verified (a store directory or source names)
 * @param sources            the store's source names (finding line numbers are record numbers in these files)
 * @param lines              lines checked
 * @param options            the tolerances used
 * @param isotopologues      per-isotopologue results of the intensity/Einstein-A check, by molecule and number
 * @param references         the look-up of every reference line, in the order given
 * @param findingCounts      number of findings per check (every check present, zero included), in check order
 * @param findings           the findings listed one by one, in list order (at most
 *                           {@link VerifyOptions#maxListedFindings()})
 * @param relationResiduals  S/S(A) − 1 over wavenumber, thinned for plotting
 */
public record VerificationReport(String subject, List<String> sources, long lines, VerifyOptions options,
                                 List<IsotopologueSummary> isotopologues, List<ReferenceMatch> references,
                                 Map<Check, Long> findingCounts, List<Finding> findings,
                                 ResidualSeries relationResiduals) {
    public VerificationReport {
        sources = List.copyOf(sources);
        isotopologues = List.copyOf(isotopologues);
        references = List.copyOf(references);
        EnumMap<Check, Long> ordered = new EnumMap<>(Check.class);
        ordered.putAll(findingCounts);
        findingCounts = Collections.unmodifiableMap(ordered);
        findings = List.copyOf(findings);
    }

    /** All findings, listed or not. */
    public long totalFindings() {
        long n = 0;
        for (long c : findingCounts.values()) {
            n += c;
        }
        return n;
    }

    /** Findings counted but not listed (beyond {@link VerifyOptions#maxListedFindings()}). */
    public long findingsNotListed() {
        return totalFindings() - findings.size();
    }

    /** True when no check failed. */
    public boolean passed() {
        return totalFindings() == 0;
    }

    /** Findings of one check (0 when none). */
    public long count(Check check) {
        return findingCounts.getOrDefault(check, 0L);
    }
}
