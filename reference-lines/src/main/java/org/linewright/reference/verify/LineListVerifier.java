package org.linewright.reference.verify;

import java.io.IOException;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.EnumMap;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.TreeMap;

import org.linewright.ingest.line.Broadener;
import org.linewright.ingest.line.EinsteinCoefficients;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.line.TextColumn;
import org.linewright.ingest.registry.Isotopologue;
import org.linewright.ingest.registry.Molecule;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.store.LineCursor;
import org.linewright.ingest.store.LineQuery;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.store.SourceInfo;
import org.linewright.reference.data.ReferenceLine;
import org.linewright.reference.data.ReferenceLines;

/**
 * Checks a line list (a line store) against physics and against reference lines, streaming it once in
 * wavenumber order with memory bounded by the batch size, the number of isotopologues and the listed findings.
 *
 * <p>Checks, each line:
 * <ul>
 *   <li><b>intensity relation</b>: with the relation of Šimečková et al., JQSRT 98 (2006) 130, eq. (20)
 *       ({@link EinsteinCoefficients}), S = Iₐ·A·g′/(8πcν²)·e^(−c₂E″/T)·(1 − e^(−c₂ν/T))/Q(T) at T = 296 K,
 *       every line with S and A implies Q(296 K)/Iₐ. Per isotopologue the consensus is the median of these
 *       (robust to a few bad lines); a line is flagged when S deviates from S(A) computed with the consensus
 *       by more than {@link VerifyOptions#relationTolerance()} relative (derivation in
 *       {@link VerifyOptions#DEFAULT_RELATION_TOLERANCE}), and the isotopologue when its consensus deviates from
 *       the registry's Q(296 K)/Iₐ by more than {@link VerifyOptions#registryTolerance()};</li>
 *   <li><b>sanity</b>: NaN where a value is required (ν, S, E″, g′); ν or S not positive; A, widths
 *       negative; E″ below zero; g′ or g″ not positive; the same line twice (species, ν and all four quantum
 *       labels); E′ ≠ E″ + ν beyond {@link VerifyOptions#upperEnergyToleranceCm1()} where E′ is given;</li>
 *   <li><b>reference lines</b>: each reference is looked for among the lines of its isotopologue within
 *       {@link #SEARCH_WINDOW_CM1} of its position: by J′, J″ (and K′ and the vibrational labels when the
 *       reference gives them), else — when the list carries no J for that species — the nearest line. An
 *       identified line beyond the reference's tolerance fails; a reference whose line is absent from a
 *       (possibly partial) list is reported but does not fail.</li>
 * </ul>
 */
public final class LineListVerifier {
    /**
     * Half width of the window around a reference position in which a line with the reference's labels counts
     * as that reference's line (0.5 cm⁻¹ ≈ 15 GHz: wider than any plausible error of a listed position, narrower
     * than the spacing of the same J labels in different vibrational states of the species in the built-in set).
     */
    public static final double SEARCH_WINDOW_CM1 = 0.5;
    private static final double REFERENCE_TEMPERATURE_K = LineBatch.REFERENCE_TEMPERATURE_K;

    private final MoleculeRegistry registry;
    private final List<ReferenceLine> references;
    private final VerifyOptions options;

    /**
     * @param registry   isotopologue abundances and Q(296 K) (the built-in registry or one with user data)
     * @param references the reference lines to look up (e.g. {@link ReferenceLines#builtIn()} plus user files)
     * @param options    tolerances and limits
     */
    public LineListVerifier(MoleculeRegistry registry, List<ReferenceLine> references, VerifyOptions options) {
        this.registry = Objects.requireNonNull(registry, "registry");
        this.references = List.copyOf(references);
        this.options = Objects.requireNonNull(options, "options");
    }

    /**
     * Verifies every line of {@code store} in two streaming passes: the first finds each isotopologue's consensus
     * (median) Q(296 K)/Iₐ implied by its lines, the second checks every line; {@code subject} names the list in
     * the report.
     */
    public VerificationReport verify(LineStore store, String subject) throws IOException {
        Run run = new Run();
        LineBatch batch = new LineBatch(8192);
        LineQuery relationColumns = LineQuery.all().withColumns(List.of(LineColumn.INTENSITY, LineColumn.EINSTEIN_A,
                LineColumn.UPPER_DEGENERACY, LineColumn.LOWER_ENERGY));
        try (LineCursor cursor = store.cursor(relationColumns)) {
            while (cursor.read(batch)) {
                run.collectConsensus(batch);
            }
        }
        run.resolveConsensus();
        try (LineCursor cursor = store.cursor(LineQuery.all())) {
            while (cursor.read(batch)) {
                run.accept(batch);
            }
        }
        return run.finish(subject, store.sources().stream().map(SourceInfo::name).toList());
    }

    /**
     * Q(296 K)/Iₐ implied by one line: S(A) computed with Q = Iₐ = 1 divided by the listed S; NaN when the line
     * lacks a usable S, A, g′, E″ or ν.
     */
    static double impliedQOverAbundance(LineBatch b, int r) {
        double s = b.intensityCmPerMolecule[r];
        double a = b.einsteinAS1[r];
        double nu = b.wavenumberCm1[r];
        double g = b.upperDegeneracy[r];
        double e = b.lowerEnergyCm1[r];
        if (!(s > 0) || !(a > 0) || !(nu > 0) || !(g > 0) || !(e >= 0) || Double.isInfinite(a)) {
            return Double.NaN;
        }
        // S(A) with Q = Iₐ = 1 equals S·Q/Iₐ of this line, so its ratio to S is the implied Q/Iₐ
        double implied = EinsteinCoefficients.intensityFromEinsteinA(a, nu, g, e, REFERENCE_TEMPERATURE_K, 1.0, 1.0) / s;
        return implied > 0 && !Double.isInfinite(implied) ? implied : Double.NaN;
    }

    /** The state of one verification. */
    private final class Run {
        private final TreeMap<Long, Accumulator> species = new TreeMap<>();
        private final EnumMap<Check, Long> counts = new EnumMap<>(Check.class);
        private final List<Finding> findings = new ArrayList<>();
        private final ResidualSeries residuals = new ResidualSeries(options.maxPlotPoints());
        private final RefState[] refs;
        private final DuplicateWindow duplicates = new DuplicateWindow();
        private long lines;
        private Accumulator last;

        Run() {
            for (Check c : Check.values()) {
                counts.put(c, 0L);
            }
            refs = new RefState[references.size()];
            for (int i = 0; i < refs.length; i++) {
                refs[i] = new RefState(references.get(i));
            }
        }

        void accept(LineBatch b) {
            for (int r = 0; r < b.size; r++) {
                Accumulator acc = accumulator(b.moleculeId[r], b.isotopologue[r]);
                acc.lines++;
                sanity(b, r);
                relation(b, r, acc);
                if (duplicates.isDuplicate(b, r)) {
                    add(Check.DUPLICATE, b, r, "quanta", Double.NaN, Double.NaN,
                            "the same line (species, wavenumber and quantum labels) occurs again");
                }
                for (RefState s : refs) {
                    if (s.ref.moleculeId() == b.moleculeId[r] && s.ref.isotopologue() == b.isotopologue[r]) {
                        s.offer(b, r);
                    }
                }
            }
            lines += b.size;
        }

        private Accumulator accumulator(int molecule, int isotopologue) {
            long key = ((long) molecule << 32) | (isotopologue & 0xffffffffL);
            if (last != null && last.key == key) {
                return last;
            }
            Accumulator acc = species.get(key);
            if (acc == null) {
                acc = new Accumulator(key, molecule, isotopologue);
                species.put(key, acc);
            }
            last = acc;
            return acc;
        }

        private void sanity(LineBatch b, int r) {
            required(b, r, LineColumn.WAVENUMBER, b.wavenumberCm1[r], true);
            required(b, r, LineColumn.INTENSITY, b.intensityCmPerMolecule[r], true);
            optionalNotNegative(b, r, LineColumn.EINSTEIN_A, b.einsteinAS1[r]);
            optionalNotNegative(b, r, LineColumn.AIR_WIDTH, b.airWidthCm1PerAtm[r]);
            optionalNotNegative(b, r, LineColumn.SELF_WIDTH, b.selfWidthCm1PerAtm[r]);
            for (int k = 0; k < b.foreignWidthCm1PerAtm.length; k++) {
                optionalNotNegative(b, r, FOREIGN_WIDTHS[k], b.foreignWidthCm1PerAtm[k][r]);
            }
            double lowerEnergy = b.lowerEnergyCm1[r];
            if (Double.isNaN(lowerEnergy)) {
                add(Check.NAN_VALUE, b, r, LineColumn.LOWER_ENERGY.columnName(), lowerEnergy, Double.NaN,
                        "lower_energy_cm1 is NaN (expected a number >= 0)");
            } else if (lowerEnergy < 0) {
                add(Check.LOWER_ENERGY, b, r, LineColumn.LOWER_ENERGY.columnName(), lowerEnergy, 0.0,
                        fmt("lower_energy_cm1 = %s (expected >= 0)", lowerEnergy));
            }
            double gUpper = b.upperDegeneracy[r];
            if (!(gUpper > 0)) {
                add(Check.DEGENERACY, b, r, LineColumn.UPPER_DEGENERACY.columnName(), gUpper, Double.NaN,
                        fmt("upper_degeneracy = %s (expected > 0)", gUpper));
            }
            double gLower = b.lowerDegeneracy[r];
            if (gLower <= 0) {
                add(Check.DEGENERACY, b, r, LineColumn.LOWER_DEGENERACY.columnName(), gLower, Double.NaN,
                        fmt("lower_degeneracy = %s (expected > 0)", gLower));
            }
            double upperEnergy = b.upperEnergyCm1[r];
            if (!Double.isNaN(upperEnergy) && !Double.isNaN(lowerEnergy)) {
                double expected = lowerEnergy + b.wavenumberCm1[r];
                if (!(Math.abs(upperEnergy - expected) <= options.upperEnergyToleranceCm1())) {
                    add(Check.UPPER_ENERGY, b, r, LineColumn.UPPER_ENERGY.columnName(), upperEnergy, expected,
                            fmt("upper_energy_cm1 = %s but lower_energy_cm1 + wavenumber_cm1 = %s (tolerance %s cm-1)",
                                    upperEnergy, expected, options.upperEnergyToleranceCm1()));
                }
            }
        }

        private void required(LineBatch b, int r, LineColumn column, double v, boolean positive) {
            if (Double.isNaN(v)) {
                add(Check.NAN_VALUE, b, r, column.columnName(), v, Double.NaN,
                        column.columnName() + " is NaN (expected a number > 0)");
            } else if (positive && !(v > 0)) {
                add(Check.NEGATIVE_VALUE, b, r, column.columnName(), v, Double.NaN,
                        fmt(column.columnName() + " = %s (expected > 0)", v));
            }
        }

        private void optionalNotNegative(LineBatch b, int r, LineColumn column, double v) {
            if (v < 0) {
                add(Check.NEGATIVE_VALUE, b, r, column.columnName(), v, Double.NaN,
                        fmt(column.columnName() + " = %s (expected >= 0)", v));
            }
        }

        void collectConsensus(LineBatch b) {
            for (int r = 0; r < b.size; r++) {
                double implied = impliedQOverAbundance(b, r);
                if (!Double.isNaN(implied)) {
                    accumulator(b.moleculeId[r], b.isotopologue[r]).offerConsensus(implied);
                }
            }
        }

        void resolveConsensus() {
            for (Accumulator a : species.values()) {
                a.resolveConsensus();
            }
        }

        private void relation(LineBatch b, int r, Accumulator acc) {
            double implied = impliedQOverAbundance(b, r);
            if (Double.isNaN(implied)) {
                if (b.einsteinAS1[r] == 0 && b.intensityCmPerMolecule[r] > 0) {
                    acc.relationFlagged++;
                    add(Check.INTENSITY_RELATION, b, r, LineColumn.EINSTEIN_A.columnName(), 0.0, Double.NaN,
                            fmt("einstein_a_s1 = 0 but intensity = %s (expected both zero or both positive)",
                                    b.intensityCmPerMolecule[r]));
                }
                return;
            }
            acc.relationChecked++;
            acc.impliedMin = Math.min(acc.impliedMin, implied);
            acc.impliedMax = Math.max(acc.impliedMax, implied);
            acc.impliedSum += implied;
            double nu = b.wavenumberCm1[r];
            // S / S(A) − 1, where S(A) uses the isotopologue's consensus Q/Iₐ
            double deviation = acc.consensus / implied - 1.0;
            residuals.add(nu, deviation);
            double abs = Math.abs(deviation);
            if (!(abs <= acc.maxAbsDeviation)) {
                acc.maxAbsDeviation = abs;
                acc.maxDeviationWavenumberCm1 = nu;
            }
            if (!(abs <= options.relationTolerance())) {
                acc.relationFlagged++;
                double s = b.intensityCmPerMolecule[r];
                double expected = s / (1.0 + deviation);
                add(Check.INTENSITY_RELATION, b, r, LineColumn.INTENSITY.columnName(), s, expected,
                        fmt("intensity %s but %s from einstein_a_s1 = %s with the isotopologue's consensus "
                                        + "Q(296 K)/abundance %s (relative deviation %s, tolerance %s)", s, expected,
                                b.einsteinAS1[r], acc.consensus, deviation, options.relationTolerance()));
            }
        }

        private void add(Check check, LineBatch b, int r, String field, double value, double expected, String message) {
            counts.merge(check, 1L, Long::sum);
            if (findings.size() < options.maxListedFindings()) {
                findings.add(new Finding(check, b.moleculeId[r], b.isotopologue[r], b.wavenumberCm1[r],
                        b.sourceLine[r], field, value, expected, message));
            }
        }

        VerificationReport finish(String subject, List<String> sources) {
            List<ReferenceMatch> matches = new ArrayList<>();
            for (RefState s : refs) {
                Accumulator acc = species.get(((long) s.ref.moleculeId() << 32) | (s.ref.isotopologue() & 0xffffffffL));
                ReferenceMatch m = s.result(acc != null && acc.lines > 0);
                matches.add(m);
                if (m.status() == ReferenceMatch.Status.OFFSET) {
                    counts.merge(Check.REFERENCE_POSITION, 1L, Long::sum);
                    if (findings.size() < options.maxListedFindings()) {
                        findings.add(new Finding(Check.REFERENCE_POSITION, s.ref.moleculeId(), s.ref.isotopologue(),
                                m.wavenumberCm1(), m.sourceLine(), LineColumn.WAVENUMBER.columnName(),
                                m.wavenumberCm1(), s.ref.wavenumberCm1(),
                                fmt("%s: listed at %s cm-1, reference %s cm-1 (offset %s, tolerance %s cm-1; %s)",
                                        s.ref.label(), m.wavenumberCm1(), s.ref.wavenumberCm1(), m.offsetCm1(),
                                        s.ref.toleranceCm1(), s.ref.source())));
                    }
                }
            }
            List<IsotopologueSummary> summaries = new ArrayList<>();
            for (Accumulator a : species.values()) {
                IsotopologueSummary summary = a.summary();
                summaries.add(summary);
                double d = summary.registryDeviation();
                if (!Double.isNaN(d) && !(Math.abs(d) <= options.registryTolerance())) {
                    counts.merge(Check.REGISTRY_VALUES, 1L, Long::sum);
                    if (findings.size() < options.maxListedFindings()) {
                        findings.add(new Finding(Check.REGISTRY_VALUES, a.molecule, a.isotopologue, Double.NaN, 0,
                                "q296/abundance", a.consensus, a.registryQOverAbundance,
                                fmt("%s %s: the lines imply Q(296 K)/abundance = %s, the registry gives %s "
                                                + "(relative deviation %s, tolerance %s)", a.molecule + "/" + a.isotopologue,
                                        a.name, a.consensus, a.registryQOverAbundance, d, options.registryTolerance())));
                    }
                }
            }
            return new VerificationReport(subject, sources, lines, options, summaries, matches, counts, findings, residuals);
        }
    }

    private static final LineColumn[] FOREIGN_WIDTHS = foreignWidthColumns();

    private static LineColumn[] foreignWidthColumns() {
        // indexed like LineBatch.foreignWidthCm1PerAtm (Broadener ordinal)
        LineColumn[] c = new LineColumn[Broadener.values().length];
        for (Broadener b : Broadener.values()) {
            c[b.ordinal()] = LineColumn.valueOf(b.name() + "_WIDTH");
        }
        return c;
    }

    /** Per-isotopologue sums. */
    private final class Accumulator {
        final long key;
        final int molecule;
        final int isotopologue;
        final String name;
        final double registryQOverAbundance;
        long lines;
        long relationChecked;
        long relationFlagged;
        double impliedMin = Double.POSITIVE_INFINITY;
        double impliedMax = Double.NEGATIVE_INFINITY;
        double impliedSum;
        double maxAbsDeviation = Double.NaN;
        double maxDeviationWavenumberCm1 = Double.NaN;
        ConsensusHistogram histogram;
        double consensus = Double.NaN;

        Accumulator(long key, int molecule, int isotopologue) {
            this.key = key;
            this.molecule = molecule;
            this.isotopologue = isotopologue;
            Isotopologue iso = registry.isotopologue(molecule, isotopologue);
            if (iso == null) {
                name = "";
                registryQOverAbundance = Double.NaN;
            } else {
                Molecule m = registry.molecule(molecule);
                name = (m == null ? "" : m.formula() + " ") + iso.isotopeFormula();
                double q = registry.partitionSum(molecule, isotopologue, REFERENCE_TEMPERATURE_K);
                registryQOverAbundance = q / iso.abundance();
            }
        }

        void offerConsensus(double implied) {
            if (histogram == null) {
                // centred on the registry's value, or on the first line of an isotopologue the registry lacks
                histogram = new ConsensusHistogram(Double.isNaN(registryQOverAbundance) ? implied : registryQOverAbundance);
            }
            histogram.add(implied);
        }

        void resolveConsensus() {
            consensus = histogram == null ? Double.NaN : histogram.median();
        }

        IsotopologueSummary summary() {
            boolean any = relationChecked > 0;
            return new IsotopologueSummary(molecule, isotopologue, name, lines, relationChecked, relationFlagged,
                    registryQOverAbundance, consensus, any ? impliedMin : Double.NaN, any ? impliedMax : Double.NaN,
                    any ? impliedSum / relationChecked : Double.NaN, maxAbsDeviation, maxDeviationWavenumberCm1);
        }
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

        RefState(ReferenceLine ref) {
            this.ref = ref;
            this.upperGlobal = ref.upperGlobal().getBytes(java.nio.charset.StandardCharsets.UTF_8);
            this.lowerGlobal = ref.lowerGlobal().getBytes(java.nio.charset.StandardCharsets.UTF_8);
        }

        void offer(LineBatch b, int r) {
            double nu = b.wavenumberCm1[r];
            boolean labelled = !Double.isNaN(b.upperJ[r]) || !Double.isNaN(b.lowerJ[r]);
            labelsSeen |= labelled;
            double distance = Math.abs(nu - ref.wavenumberCm1());
            if (!(distance <= SEARCH_WINDOW_CM1)) {
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

    /**
     * Finds repeated lines among consecutive lines of equal wavenumber (the store is sorted by wavenumber), across
     * batch boundaries: the lines of the current wavenumber are kept as (species, four quantum labels) keys in a
     * reusable byte buffer.
     */
    private static final class DuplicateWindow {
        private double wavenumber = Double.NaN;
        private byte[] keys = new byte[1024];
        private int[] offsets = new int[17];
        private int count;

        boolean isDuplicate(LineBatch b, int r) {
            double nu = b.wavenumberCm1[r];
            if (nu != wavenumber) {
                wavenumber = nu;
                count = 0;
            }
            int start = offsets[count];
            int end = append(b, r, start);
            for (int k = 0; k < count; k++) {
                if (Arrays.equals(keys, offsets[k], offsets[k + 1], keys, start, end)) {
                    return true;
                }
            }
            if (count + 2 > offsets.length) {
                offsets = Arrays.copyOf(offsets, offsets.length * 2);
            }
            offsets[++count] = end;
            return false;
        }

        private int append(LineBatch b, int r, int at) {
            at = putInt(at, b.moleculeId[r]);
            at = putInt(at, b.isotopologue[r]);
            at = putText(at, b.upperGlobalQuanta, r);
            at = putText(at, b.lowerGlobalQuanta, r);
            at = putText(at, b.upperLocalQuanta, r);
            return putText(at, b.lowerLocalQuanta, r);
        }

        private int putInt(int at, int v) {
            ensure(at + 4);
            keys[at] = (byte) (v >>> 24);
            keys[at + 1] = (byte) (v >>> 16);
            keys[at + 2] = (byte) (v >>> 8);
            keys[at + 3] = (byte) v;
            return at + 4;
        }

        private int putText(int at, TextColumn column, int row) {
            int length = column.rows() > row ? column.length(row) : 0;
            at = putInt(at, length);
            ensure(at + length);
            if (length > 0) {
                System.arraycopy(column.bytes(), column.start(row), keys, at, length);
            }
            return at + length;
        }

        private void ensure(int size) {
            if (size > keys.length) {
                keys = Arrays.copyOf(keys, Math.max(size, keys.length * 2));
            }
        }
    }

    /** Formats a message; numbers appear in Java's shortest round-trip form. */
    private static String fmt(String format, Object... args) {
        return String.format(Locale.ROOT, format, args);
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
