package org.linewright.reference.verify;

import java.io.IOException;
import java.util.List;
import java.util.Objects;

import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.store.LineCursor;
import org.linewright.ingest.store.LineQuery;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.store.SourceInfo;
import org.linewright.reference.data.ReferenceLine;
import org.linewright.reference.data.ReferenceLines;

/**
 * Checks a line list (a line store) against physics and against reference lines, streaming it in wavenumber
 * order with memory bounded by the batch size, the number of isotopologues and the listed findings. The checks,
 * one class each behind {@link LineCheck}:
 * <ul>
 *   <li>{@link IntensityRelationCheck}: S against the Einstein A, calibrated per isotopologue from the list's own
 *       spread and digits, and each isotopologue's Q(296 K)/abundance against the registry's;</li>
 *   <li>{@link SanityCheck}: NaN, negative or impossible values, E′ ≠ E″ + ν;</li>
 *   <li>{@link DuplicateLineCheck}: the same line twice;</li>
 *   <li>{@link ReferenceLineCheck}: the positions of reference lines.</li>
 * </ul>
 * Findings are graded ({@link Severity}); the list passes when no error was found.
 */
public final class LineListVerifier {
    /**
     * Half width of the window around a reference position in which a line with the reference's labels counts
     * as that reference's line (0.5 cm⁻¹ ≈ 15 GHz: wider than any plausible error of a listed position, narrower
     * than the spacing of the same J labels in different vibrational states of the species in the built-in set).
     */
    public static final double SEARCH_WINDOW_CM1 = 0.5;

    private final MoleculeRegistry registry;
    private final List<ReferenceLine> references;
    private final VerifyOptions options;

    /**
     * @param registry   isotopologue abundances and Q(296 K) (the built-in registry or one with user data)
     * @param references the reference lines to look up (e.g. {@link ReferenceLines#builtIn()} plus user files)
     * @param options    tolerances, limits and strict mode
     */
    public LineListVerifier(MoleculeRegistry registry, List<ReferenceLine> references, VerifyOptions options) {
        this.registry = Objects.requireNonNull(registry, "registry");
        this.references = List.copyOf(references);
        this.options = Objects.requireNonNull(options, "options");
    }

    /**
     * Verifies every line of {@code store}: the checks prepare themselves (the intensity check reads the list once
     * to calibrate), then every line passes through every check; {@code subject} names the list in the report.
     */
    public VerificationReport verify(LineStore store, String subject) throws IOException {
        IntensityRelationCheck relation = new IntensityRelationCheck(registry, options);
        ReferenceLineCheck referenceLines = new ReferenceLineCheck(references);
        List<LineCheck> checks = List.of(relation, new SanityCheck(options), new DuplicateLineCheck(), referenceLines);
        Findings findings = new Findings(options.maxListedFindings(), options.strict());
        for (LineCheck c : checks) {
            c.prepare(store);
        }
        long lines = 0;
        LineBatch batch = new LineBatch(8192);
        try (LineCursor cursor = store.cursor(LineQuery.all())) {
            while (cursor.read(batch)) {
                for (int r = 0; r < batch.size; r++) {
                    for (LineCheck c : checks) {
                        c.check(batch, r, findings);
                    }
                }
                lines += batch.size;
            }
        }
        for (LineCheck c : checks) {
            c.finish(findings);
        }
        Consistency consistency = new Consistency(relation.consistencySpread(), relation.consistency99(),
                relation.withinDigitsFraction());
        return new VerificationReport(subject, store.sources().stream().map(SourceInfo::name).toList(), lines, options,
                relation.summaries(), referenceLines.matches(), findings.countsByCheck(), findings.countsBySeverity(),
                findings.listed(), relation.residuals(), consistency);
    }

    /** Q(296 K)/Iₐ implied by one line (see {@link IntensityRelationCheck#impliedQOverAbundance}). */
    static double impliedQOverAbundance(LineBatch b, int r) {
        return IntensityRelationCheck.impliedQOverAbundance(b, r);
    }

    /** The registry giving Q(296 K) and abundances. */
    public MoleculeRegistry registry() {
        return registry;
    }

    /** The reference lines this verifier looks up. */
    public List<ReferenceLine> references() {
        return references;
    }
}
