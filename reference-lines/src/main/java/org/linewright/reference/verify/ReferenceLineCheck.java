package org.linewright.reference.verify;

import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.line.TextColumn;
import org.linewright.reference.data.ReferenceLine;

/**
 * The positions of reference lines: each reference is looked for among the lines of its isotopologue within
 * {@link LineListVerifier#SEARCH_WINDOW_CM1} of its position: by J′, J″ (and K′ and the vibrational labels when the
 * reference gives them), else — when the list carries no J for that species — the nearest line. An identified line
 * beyond the reference's tolerance is an error (a misplaced line, or a shifted band); a reference whose line is
 * absent from a (possibly partial) list is reported in the table but is no finding.
 */
final class ReferenceLineCheck implements LineCheck {
    private final RefState[] refs;

    ReferenceLineCheck(List<ReferenceLine> references) {
        refs = new RefState[references.size()];
        for (int i = 0; i < refs.length; i++) {
            refs[i] = new RefState(references.get(i));
        }
    }

    @Override
    public void check(LineBatch b, int r, Findings findings) {
        for (RefState s : refs) {
            if (s.ref.moleculeId() == b.moleculeId[r] && s.ref.isotopologue() == b.isotopologue[r]) {
                s.speciesPresent = true;
                s.offer(b, r);
            }
        }
    }

    @Override
    public void finish(Findings findings) {
        for (RefState s : refs) {
            ReferenceMatch m = s.result(s.speciesPresent);
            if (m.status() == ReferenceMatch.Status.OFFSET) {
                findings.add(Check.REFERENCE_POSITION, Severity.ERROR, s.ref.moleculeId(), s.ref.isotopologue(),
                        m.wavenumberCm1(), m.sourceLine(), LineColumn.WAVENUMBER.columnName(), m.wavenumberCm1(),
                        s.ref.wavenumberCm1(), String.format(Locale.ROOT,
                                "%s: listed at %s cm-1, reference %s cm-1 (offset %s, tolerance %s cm-1; %s)",
                                s.ref.label(), m.wavenumberCm1(), s.ref.wavenumberCm1(), m.offsetCm1(),
                                s.ref.toleranceCm1(), s.ref.source()));
            }
        }
    }

    /** The look-up of every reference line, in the order given. */
    List<ReferenceMatch> matches() {
        List<ReferenceMatch> out = new ArrayList<>();
        for (RefState s : refs) {
            out.add(s.result(s.speciesPresent));
        }
        return out;
    }

    /** The search for one reference line. */
    private static final class RefState {
        final ReferenceLine ref;
        final byte[] upperGlobal;
        final byte[] lowerGlobal;
        double bestLabelled = Double.NaN;
        long bestLabelledSource;
        double bestUnlabelled = Double.NaN;
        long bestUnlabelledSource;
        boolean labelsSeen;
        boolean speciesPresent;

        RefState(ReferenceLine ref) {
            this.ref = ref;
            this.upperGlobal = ref.upperGlobal().getBytes(StandardCharsets.UTF_8);
            this.lowerGlobal = ref.lowerGlobal().getBytes(StandardCharsets.UTF_8);
        }

        void offer(LineBatch b, int r) {
            double nu = b.wavenumberCm1[r];
            boolean labelled = !Double.isNaN(b.upperJ[r]) || !Double.isNaN(b.lowerJ[r]);
            labelsSeen |= labelled;
            double distance = Math.abs(nu - ref.wavenumberCm1());
            if (!(distance <= LineListVerifier.SEARCH_WINDOW_CM1)) {
                return;
            }
            if (labelled && ref.hasQuantumNumbers()) {
                if (matches(ref.upperJ(), b.upperJ[r]) && matches(ref.lowerJ(), b.lowerJ[r])
                        && matches(ref.upperK(), b.upperK[r])
                        && sameLabel(upperGlobal, b.upperGlobalQuanta, r) && sameLabel(lowerGlobal, b.lowerGlobalQuanta, r)
                        && !(Math.abs(bestLabelled - ref.wavenumberCm1()) <= distance)) {
                    bestLabelled = nu;
                    bestLabelledSource = b.sourceLine[r];
                }
            } else if (!(Math.abs(bestUnlabelled - ref.wavenumberCm1()) <= distance)) {
                bestUnlabelled = nu;
                bestUnlabelledSource = b.sourceLine[r];
            }
        }

        private static boolean matches(double wanted, double listed) {
            return Double.isNaN(wanted) || wanted == listed;
        }

        /** Compares a normalised label with a listed one, ignoring leading, trailing and repeated blanks. */
        private static boolean sameLabel(byte[] wanted, TextColumn column, int row) {
            if (wanted.length == 0) {
                return true;
            }
            byte[] data = column.bytes();
            int i = column.start(row);
            int end = i + column.length(row);
            while (i < end && data[i] == ' ') {
                i++;
            }
            while (end > i && data[end - 1] == ' ') {
                end--;
            }
            int k = 0;
            while (i < end) {
                if (data[i] == ' ') {
                    while (i < end && data[i] == ' ') {
                        i++;
                    }
                    if (k >= wanted.length || wanted[k] != ' ') {
                        return false;
                    }
                    k++;
                    continue;
                }
                if (k >= wanted.length || wanted[k] != data[i]) {
                    return false;
                }
                k++;
                i++;
            }
            return k == wanted.length;
        }

        ReferenceMatch result(boolean speciesPresent) {
            if (!speciesPresent) {
                return new ReferenceMatch(ref, ReferenceMatch.Status.NOT_COVERED, Double.NaN, Double.NaN, 0);
            }
            if (!Double.isNaN(bestLabelled)) {
                double offset = bestLabelled - ref.wavenumberCm1();
                return new ReferenceMatch(ref, Math.abs(offset) <= ref.toleranceCm1() ? ReferenceMatch.Status.FOUND
                        : ReferenceMatch.Status.OFFSET, bestLabelled, offset, bestLabelledSource);
            }
            // without quantum numbers for this species (or in the reference), the nearest line stands in
            if ((!labelsSeen || !ref.hasQuantumNumbers()) && !Double.isNaN(bestUnlabelled)
                    && Math.abs(bestUnlabelled - ref.wavenumberCm1()) <= ref.toleranceCm1()) {
                return new ReferenceMatch(ref, ReferenceMatch.Status.FOUND_BY_POSITION, bestUnlabelled,
                        bestUnlabelled - ref.wavenumberCm1(), bestUnlabelledSource);
            }
            return new ReferenceMatch(ref, ReferenceMatch.Status.ABSENT, Double.NaN, Double.NaN, 0);
        }
    }

}
