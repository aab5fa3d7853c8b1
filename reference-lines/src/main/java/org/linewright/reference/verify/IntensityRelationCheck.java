package org.linewright.reference.verify;

import org.linewright.ingest.registry.SpeciesKey;
import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.TreeMap;

import org.linewright.ingest.line.EinsteinCoefficients;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.line.LineColumn;
import org.linewright.ingest.registry.Isotopologue;
import org.linewright.ingest.registry.Molecule;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.store.LineCursor;
import org.linewright.ingest.store.LineQuery;
import org.linewright.ingest.store.LineStore;
import org.linewright.ingest.store.SourceInfo;

/**
 * The intensity/Einstein-A relation, calibrated from the list itself.
 *
 * <p>With the relation of Šimečková et al., JQSRT 98 (2006) 130, eq. (20) ({@link EinsteinCoefficients}),
 * S = Iₐ·A·g′/(8πcν²)·e^(−c₂E″/T)·(1 − e^(−c₂ν/T))/Q(T) at T = 296 K, every line with S and A implies
 * Q(296 K)/Iₐ. {@link #prepare} reads the list once: per isotopologue the consensus is the median of these
 * (robust to a few bad lines), the isotopologue's own scatter is their robust spread σ (1.4826 × median absolute
 * deviation), and the digits of S and A the records carry give each line's rounding bound
 * u = ½·10^(1−n_S)/m_S + ½·10^(1−n_A)/m_A (m the mantissa). Then every line's deviation d = S/S(A) − 1, with S(A)
 * from the consensus, is graded:
 * <ul>
 *   <li>|d| ≥ {@link VerifyOptions#GROSS_LINE_DEVIATION}: an <b>error</b>, whatever the isotopologue's spread;</li>
 *   <li>|d| &gt; max({@link VerifyOptions#RELATION_FLOOR}, {@link VerifyOptions#OUTLIER_SPREADS}·σ, u + c), with
 *       c the consensus's own uncertainty (3 × 1.2533·σ/√n, the standard error of a median, plus the histogram
 *       resolution): a <b>warning</b>, the line stands out from its isotopologue's own distribution;</li>
 *   <li>A = 0 with S &gt; 0: an error.</li>
 * </ul>
 * After the last line each isotopologue's consensus is compared with the registry's Q(296 K)/Iₐ: beyond
 * {@link VerifyOptions#REGISTRY_ACCURACY} plus the rounding of the registry's values plus the consensus's
 * uncertainty (max(c, ū/√n), ū the mean rounding bound of the lines) a <b>warning</b> naming both values and their
 * sources; beyond {@link VerifyOptions#GROSS_REGISTRY_DEVIATION} an <b>error</b> (a wrong Q or abundance, or
 * intensities in another unit). The list's internal consistency is the robust spread of d over all its lines.
 * In strict mode the fixed tolerances of {@link VerifyOptions} apply instead and every finding is an error.
 */
final class IntensityRelationCheck implements LineCheck {
    private static final double REFERENCE_TEMPERATURE_K = LineBatch.REFERENCE_TEMPERATURE_K;
    /** Asymptotic standard error of a median is 1.2533·σ/√n for normal data (common practice). */
    private static final double MEDIAN_STANDARD_ERROR = 1.2533;

    private final MoleculeRegistry registry;
    private final VerifyOptions options;
    private final TreeMap<Long, Species> species = new TreeMap<>();
    private final ResidualSeries residuals;
    private final DeviationQuantiles pooled = new DeviationQuantiles();
    private String sourceNames = "";
    private long withinDigits;
    private Species last;

    IntensityRelationCheck(MoleculeRegistry registry, VerifyOptions options) {
        this.registry = registry;
        this.options = options;
        this.residuals = new ResidualSeries(options.maxPlotPoints());
    }

    @Override
    public void prepare(LineStore store) throws IOException {
        sourceNames = String.join(", ", store.sources().stream().map(SourceInfo::name).toList());
        LineBatch batch = new LineBatch(8192);
        LineQuery columns = LineQuery.all().withColumns(List.of(LineColumn.INTENSITY, LineColumn.EINSTEIN_A,
                LineColumn.UPPER_DEGENERACY, LineColumn.LOWER_ENERGY));
        try (LineCursor cursor = store.cursor(columns)) {
            while (cursor.read(batch)) {
                for (int r = 0; r < batch.size; r++) {
                    double implied = impliedQOverAbundance(batch, r);
                    if (!Double.isNaN(implied)) {
                        species(batch.moleculeId[r], batch.isotopologue[r]).calibrate(implied,
                                batch.intensityCmPerMolecule[r], batch.einsteinAS1[r]);
                    }
                }
            }
        }
        for (Species s : species.values()) {
            s.resolve();
        }
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

    @Override
    public void check(LineBatch b, int r, Findings findings) {
        Species sp = species(b.moleculeId[r], b.isotopologue[r]);
        sp.lines++;
        double s = b.intensityCmPerMolecule[r];
        if (s > sp.strongestIntensity) {
            sp.strongestIntensity = s;
            sp.strongestSourceLine = b.sourceLine[r];
            sp.strongestWavenumberCm1 = b.wavenumberCm1[r];
        }
        double implied = impliedQOverAbundance(b, r);
        if (Double.isNaN(implied)) {
            if (b.einsteinAS1[r] == 0 && s > 0) {
                sp.errors++;
                findings.add(Check.INTENSITY_RELATION, Severity.ERROR, b, r, LineColumn.EINSTEIN_A.columnName(), 0.0,
                        Double.NaN, fmt("einstein_a_s1 = 0 but intensity = %s (expected both zero or both positive)", s));
            }
            return;
        }
        sp.checked++;
        sp.impliedMin = Math.min(sp.impliedMin, implied);
        sp.impliedMax = Math.max(sp.impliedMax, implied);
        sp.impliedSum += implied;
        double nu = b.wavenumberCm1[r];
        // S / S(A) − 1, where S(A) uses the isotopologue's consensus Q/Iₐ
        double deviation = sp.consensus / implied - 1.0;
        residuals.add(nu, deviation);
        double abs = Math.abs(deviation);
        pooled.add(abs);
        if (!(abs <= sp.maxAbsDeviation)) {
            sp.maxAbsDeviation = abs;
            sp.maxDeviationWavenumberCm1 = nu;
        }
        double rounding = PrintedDigits.relativeRounding(s, sp.intensityDigits)
                + PrintedDigits.relativeRounding(b.einsteinAS1[r], sp.einsteinADigits);
        sp.roundingSum += rounding;
        double digitBound = rounding + sp.consensusUncertainty;
        if (abs <= digitBound) {
            withinDigits++;
        }
        double expected = s / (1.0 + deviation);
        String values = fmt("intensity %s but %s from einstein_a_s1 = %s with the isotopologue's consensus "
                + "Q(296 K)/abundance %s: S/S(A) - 1 = %s", s, expected, b.einsteinAS1[r], sp.consensus, deviation);
        if (options.strict()) {
            if (!(abs <= options.relationTolerance())) {
                sp.errors++;
                findings.add(Check.INTENSITY_RELATION, Severity.ERROR, b, r, LineColumn.INTENSITY.columnName(), s,
                        expected, values + fmt(" (tolerance %s, strict)", options.relationTolerance()));
            }
        } else if (!(abs < VerifyOptions.GROSS_LINE_DEVIATION)) {
            sp.errors++;
            findings.add(Check.INTENSITY_RELATION, Severity.ERROR, b, r, LineColumn.INTENSITY.columnName(), s,
                    expected, values + fmt(" (gross fault: limit %s for every line)", VerifyOptions.GROSS_LINE_DEVIATION));
        } else if (!(abs <= Math.max(sp.outlierLimit, digitBound))) {
            sp.warnings++;
            findings.add(Check.INTENSITY_RELATION, Severity.WARNING, b, r, LineColumn.INTENSITY.columnName(), s,
                    expected, values + fmt(" stands out from the isotopologue's own distribution (robust spread %s; "
                                    + "limit %s: the larger of %s spreads, the floor %s and the printed digits' bound %s)",
                            sig(sp.spread), sig(Math.max(sp.outlierLimit, digitBound)), VerifyOptions.OUTLIER_SPREADS,
                            VerifyOptions.RELATION_FLOOR, sig(digitBound)));
        }
    }

    @Override
    public void finish(Findings findings) {
        for (Species sp : species.values()) {
            if (sp.lines == 0) {
                continue;
            }
            if (sp.checked == 0) {
                findings.add(Check.INTENSITY_RELATION, Severity.NOTE, sp.molecule, sp.isotopologue, Double.NaN, 0,
                        "einstein_a_s1", Double.NaN, Double.NaN, fmt("%s %s: none of its %d lines carries a usable S "
                                + "and Einstein A; the relation could not be checked", sp.key(), sp.name, sp.lines));
                continue;
            }
            if (Double.isNaN(sp.registryQOverAbundance)) {
                findings.add(Check.REGISTRY_VALUES, Severity.NOTE, sp.molecule, sp.isotopologue, Double.NaN, 0,
                        "q296/abundance", sp.consensus, Double.NaN, fmt("%s: not in the registry; its lines imply "
                                + "Q(296 K)/abundance = %s (median of %d lines), checked against each other only",
                                sp.key(), six(sp.consensus), sp.checked));
                continue;
            }
            double d = sp.consensus / sp.registryQOverAbundance - 1.0;
            sp.registryAllowance = registryAllowance(sp);
            double abs = Math.abs(d);
            Severity severity;
            String limit;
            if (options.strict()) {
                severity = abs <= options.registryTolerance() ? null : Severity.ERROR;
                limit = fmt("tolerance %s, strict", options.registryTolerance());
            } else if (!(abs < VerifyOptions.GROSS_REGISTRY_DEVIATION)) {
                severity = Severity.ERROR;
                limit = fmt("a list-wide fault beyond %s: wrong Q(296 K), abundance or intensity unit",
                        VerifyOptions.GROSS_REGISTRY_DEVIATION);
            } else if (!(abs <= sp.registryAllowance)) {
                severity = Severity.WARNING;
                limit = fmt("beyond the registry's stated accuracy %s, its rounding and the lines' own uncertainty: "
                        + "allowance %s", VerifyOptions.REGISTRY_ACCURACY, sig(sp.registryAllowance));
            } else {
                severity = null;
                limit = "";
            }
            if (severity != null) {
                double factor = 1.0 / (1.0 + d);
                findings.add(Check.REGISTRY_VALUES, severity, sp.molecule, sp.isotopologue, sp.strongestWavenumberCm1,
                        sp.strongestSourceLine, "q296/abundance", sp.consensus, sp.registryQOverAbundance,
                        fmt("%s %s: the lines imply Q(296 K)/abundance = %s (median of %d lines of %s); the registry "
                                        + "gives %s (Q(296 K) = %s, abundance = %s; registry provenance: %s); relative "
                                        + "deviation %s (%s); the intensities are %s times what A and the registry "
                                        + "give%s; line given: the isotopologue's strongest",
                                sp.key(), sp.name, six(sp.consensus), sp.checked, sourceNames,
                                six(sp.registryQOverAbundance), sp.registryQ, sp.registryAbundance, sp.provenance,
                                sig(d), limit, sig(factor), powerOfTenHint(factor)));
            }
        }
    }

    /** REGISTRY_ACCURACY + rounding of the registry's printed Q and abundance + the consensus's uncertainty. */
    private static double registryAllowance(Species sp) {
        double meanRounding = sp.roundingSum / sp.checked;
        double consensus = Math.max(sp.consensusUncertainty, meanRounding / Math.sqrt(sp.checked));
        double registryRounding = PrintedDigits.relativeRounding(sp.registryQ, PrintedDigits.significantDigits(sp.registryQ))
                + PrintedDigits.relativeRounding(sp.registryAbundance,
                PrintedDigits.significantDigits(sp.registryAbundance));
        return VerifyOptions.REGISTRY_ACCURACY + (Double.isNaN(registryRounding) ? 0 : registryRounding) + consensus;
    }

    /** " (a power of ten: intensities in another unit?)" when {@code factor} is within 2 % of 10^k, k ≠ 0. */
    private static String powerOfTenHint(double factor) {
        double log = Math.log10(factor);
        long k = Math.round(log);
        if (k != 0 && Math.abs(log - k) < Math.log10(1.02)) {
            return fmt(" (10^%d: intensities in another unit?)", k);
        }
        return "";
    }

    /** Per-isotopologue summaries, by molecule and isotopologue number. */
    List<IsotopologueSummary> summaries() {
        List<IsotopologueSummary> out = new ArrayList<>();
        for (Species sp : species.values()) {
            if (sp.lines == 0) {
                continue;
            }
            boolean any = sp.checked > 0;
            if (any && Double.isNaN(sp.registryAllowance) && !Double.isNaN(sp.registryQOverAbundance)) {
                sp.registryAllowance = registryAllowance(sp);
            }
            out.add(new IsotopologueSummary(sp.molecule, sp.isotopologue, sp.name, sp.lines, sp.checked, sp.warnings,
                    sp.errors, sp.registryQOverAbundance, sp.provenance, sp.consensus,
                    any ? sp.impliedMin : Double.NaN, any ? sp.impliedMax : Double.NaN,
                    any ? sp.impliedSum / sp.checked : Double.NaN, sp.maxAbsDeviation, sp.maxDeviationWavenumberCm1,
                    any ? sp.spread : Double.NaN, any ? sp.outlierLimit : Double.NaN, sp.intensityDigits,
                    sp.einsteinADigits, sp.registryAllowance));
        }
        return out;
    }

    /** S/S(A) − 1 over wavenumber, thinned for plotting. */
    ResidualSeries residuals() {
        return residuals;
    }

    /**
     * The list's internal consistency: 1.4826 × the median |S/S(A) − 1| over all checked lines, each with its own
     * isotopologue's consensus (NaN when no line could be checked).
     */
    double consistencySpread() {
        return ConsensusHistogram.MAD_TO_SIGMA * pooled.quantile(0.5);
    }

    /** The |S/S(A) − 1| that 99 % of the checked lines stay within. */
    double consistency99() {
        return pooled.quantile(0.99);
    }

    /** The fraction of checked lines within their printed digits' bound (NaN when none was checked). */
    double withinDigitsFraction() {
        return pooled.total() == 0 ? Double.NaN : (double) withinDigits / pooled.total();
    }

    private Species species(int molecule, int isotopologue) {
        long key = SpeciesKey.of(molecule, isotopologue);
        if (last != null && last.key == key) {
            return last;
        }
        Species sp = species.get(key);
        if (sp == null) {
            sp = new Species(key, molecule, isotopologue);
            species.put(key, sp);
        }
        last = sp;
        return sp;
    }

    private static String fmt(String format, Object... args) {
        return String.format(Locale.ROOT, format, args);
    }

    /** Six significant digits, for Q(296 K)/abundance values (resolved to 10⁻⁵ relative). */
    private static String six(double v) {
        return String.format(Locale.ROOT, "%.6g", v);
    }

    /** Three significant digits, for limits and spreads in messages. */
    private static String sig(double v) {
        return String.format(Locale.ROOT, "%.3g", v);
    }

    /** One isotopologue's calibration and counts. */
    private final class Species {
        final long key;
        final int molecule;
        final int isotopologue;
        final String name;
        final double registryQOverAbundance;
        final double registryQ;
        final double registryAbundance;
        final String provenance;
        ConsensusHistogram histogram;
        int intensityDigits;
        int einsteinADigits;
        double consensus = Double.NaN;
        double spread = Double.NaN;
        double consensusUncertainty = Double.NaN;
        double outlierLimit = Double.NaN;
        long lines;
        long checked;
        long warnings;
        long errors;
        double impliedMin = Double.POSITIVE_INFINITY;
        double impliedMax = Double.NEGATIVE_INFINITY;
        double impliedSum;
        double roundingSum;
        double maxAbsDeviation = Double.NaN;
        double maxDeviationWavenumberCm1 = Double.NaN;
        double strongestIntensity = Double.NEGATIVE_INFINITY;
        long strongestSourceLine;
        double strongestWavenumberCm1 = Double.NaN;
        double registryAllowance = Double.NaN;

        Species(long key, int molecule, int isotopologue) {
            this.key = key;
            this.molecule = molecule;
            this.isotopologue = isotopologue;
            Isotopologue iso = registry.isotopologue(molecule, isotopologue);
            if (iso == null) {
                name = "";
                registryQOverAbundance = Double.NaN;
                registryQ = Double.NaN;
                registryAbundance = Double.NaN;
                provenance = "";
            } else {
                Molecule m = registry.molecule(molecule);
                name = (m == null ? "" : m.formula() + " ") + iso.isotopeFormula();
                registryQ = registry.partitionSum(molecule, isotopologue, REFERENCE_TEMPERATURE_K);
                registryAbundance = iso.abundance();
                registryQOverAbundance = registryQ / registryAbundance;
                provenance = iso.provenance();
            }
        }

        String key() {
            return molecule + "/" + isotopologue;
        }

        void calibrate(double implied, double intensity, double einsteinA) {
            if (histogram == null) {
                // centred on the registry's value, or on the first line of an isotopologue the registry lacks
                histogram = new ConsensusHistogram(Double.isNaN(registryQOverAbundance) ? implied : registryQOverAbundance);
            }
            histogram.add(implied);
            intensityDigits = Math.max(intensityDigits, PrintedDigits.significantDigits(intensity));
            einsteinADigits = Math.max(einsteinADigits, PrintedDigits.significantDigits(einsteinA));
        }

        void resolve() {
            if (histogram == null) {
                return;
            }
            consensus = histogram.median();
            spread = histogram.robustSpread();
            long n = histogram.total();
            consensusUncertainty = 3 * MEDIAN_STANDARD_ERROR * spread / Math.sqrt(n) + ConsensusHistogram.BIN_WIDTH;
            outlierLimit = Math.max(VerifyOptions.RELATION_FLOOR, VerifyOptions.OUTLIER_SPREADS * spread);
        }
    }
}
