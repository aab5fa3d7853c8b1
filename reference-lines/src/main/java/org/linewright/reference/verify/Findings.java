package org.linewright.reference.verify;

import java.util.ArrayList;
import java.util.Collections;
import java.util.EnumMap;
import java.util.List;
import java.util.Map;

import org.linewright.ingest.line.LineBatch;

/**
 * Where the checks of {@link LineListVerifier} put what they find: every finding is counted (per check and per
 * severity); at most {@code maxListed} findings of each severity are kept one by one, in list order, so that a
 * flood of warnings never hides the first errors. In strict mode every warning is raised to an error.
 */
public final class Findings {
    private final int maxListed;
    private final boolean strict;
    private final EnumMap<Check, Long> byCheck = new EnumMap<>(Check.class);
    private final EnumMap<Severity, Long> bySeverity = new EnumMap<>(Severity.class);
    private final EnumMap<Severity, List<Finding>> listed = new EnumMap<>(Severity.class);

    /**
     * @param maxListed findings of each severity kept one by one (all are counted)
     * @param strict    warnings become errors
     */
    public Findings(int maxListed, boolean strict) {
        this.maxListed = maxListed;
        this.strict = strict;
        for (Check c : Check.values()) {
            byCheck.put(c, 0L);
        }
        for (Severity s : Severity.values()) {
            bySeverity.put(s, 0L);
            listed.put(s, new ArrayList<>());
        }
    }

    /** Adds a finding about row {@code r} of {@code b}. */
    public void add(Check check, Severity severity, LineBatch b, int r, String field, double value, double expected,
                    String message) {
        add(check, severity, b.moleculeId[r], b.isotopologue[r], b.wavenumberCm1[r], b.sourceLine[r], field, value,
                expected, message);
    }

    /** Adds a finding. */
    public void add(Check check, Severity severity, int moleculeId, int isotopologue, double wavenumberCm1,
                    long sourceLine, String field, double value, double expected, String message) {
        Severity s = strict && severity == Severity.WARNING ? Severity.ERROR : severity;
        byCheck.merge(check, 1L, Long::sum);
        bySeverity.merge(s, 1L, Long::sum);
        List<Finding> list = listed.get(s);
        if (list.size() < maxListed) {
            list.add(new Finding(check, s, moleculeId, isotopologue, wavenumberCm1, sourceLine, field, value,
                    expected, message));
        }
    }

    /** Findings per check, every check present. */
    public Map<Check, Long> countsByCheck() {
        return Collections.unmodifiableMap(byCheck);
    }

    /** Findings per severity, every severity present. */
    public Map<Severity, Long> countsBySeverity() {
        return Collections.unmodifiableMap(bySeverity);
    }

    /** The listed findings: errors first, then warnings, then notes, each in list order. */
    public List<Finding> listed() {
        List<Finding> all = new ArrayList<>();
        for (Severity s : Severity.values()) {
            all.addAll(listed.get(s));
        }
        return all;
    }
}
