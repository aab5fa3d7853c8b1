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
 * @param severityCounts     number of findings per severity (every severity present)
 * @param findings           the findings listed one by one: errors, warnings, notes, each in list order (at most
 *                           {@link VerifyOptions#maxListedFindings()} of each)
 * @param relationResiduals  S/S(A) − 1 over wavenumber, thinned for plotting
 * @param consistency        the list's internal consistency of S and A
 */
public record VerificationReport(String subject, List<String> sources, long lines, VerifyOptions options,
                                 List<IsotopologueSummary> isotopologues, List<ReferenceMatch> references,
                                 Map<Check, Long> findingCounts, Map<Severity, Long> severityCounts,
                                 List<Finding> findings, ResidualSeries relationResiduals, Consistency consistency) {
    public VerificationReport {
        sources = List.copyOf(sources);
        isotopologues = List.copyOf(isotopologues);
        references = List.copyOf(references);
        EnumMap<Check, Long> ordered = new EnumMap<>(Check.class);
        ordered.putAll(findingCounts);
        findingCounts = Collections.unmodifiableMap(ordered);
        EnumMap<Severity, Long> bySeverity = new EnumMap<>(Severity.class);
        for (Severity s : Severity.values()) {
            bySeverity.put(s, severityCounts.getOrDefault(s, 0L));
        }
        severityCounts = Collections.unmodifiableMap(bySeverity);
        findings = List.copyOf(findings);
    }

    /** All findings, listed or not, of every severity. */
    public long totalFindings() {
        long n = 0;
        for (long c : severityCounts.values()) {
            n += c;
        }
        return n;
    }

    /** Findings counted but not listed (beyond {@link VerifyOptions#maxListedFindings()} of a severity). */
    public long findingsNotListed() {
        return totalFindings() - findings.size();
    }

    /** Findings of one severity. */
    public long count(Severity severity) {
        return severityCounts.get(severity);
    }

    /** Errors found (warnings too in strict mode). */
    public long errors() {
        return count(Severity.ERROR);
    }

    /** True when no error was found (warnings and notes do not fail a list). */
    public boolean passed() {
        return errors() == 0;
    }

    /** Findings of one check, of every severity (0 when none). */
    public long count(Check check) {
        return findingCounts.getOrDefault(check, 0L);
    }

    /** Findings of one check and severity, among the listed ones. */
    public long listedCount(Check check, Severity severity) {
        return findings.stream().filter(f -> f.check() == check && f.severity() == severity).count();
    }

    /** "2 errors, 1 warning, 0 notes". */
    public String severitySummary() {
        return plural(errors(), "error") + ", " + plural(count(Severity.WARNING), "warning") + ", "
                + plural(count(Severity.NOTE), "note");
    }

    private static String plural(long n, String word) {
        return n + " " + word + (n == 1 ? "" : "s");
    }
}
