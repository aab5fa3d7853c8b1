package org.linewright.broadening.sources;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.EnumMap;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.StringJoiner;

import org.linewright.broadening.background.BackgroundGas;
import org.linewright.broadening.background.Composition;
import org.linewright.broadening.rules.BroadeningRule;
import org.linewright.broadening.rules.RuleSet;
import org.linewright.ingest.InputException;
import org.linewright.ingest.exomol.BroadeningTable;
import org.linewright.ingest.line.Broadener;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.text.OffendingText;

/**
 * Finds, for every line and every gas of a background {@link Composition}, the Lorentz width γ(296 K), its
 * temperature exponent n and the pressure shift δ, by walking a chain of sources in a chosen order
 * (default {@link #DEFAULT_ORDER}):
 * <ol>
 *   <li>{@link WidthSource#LINE_LIST}: the line's own values — air: air width, exponent, shift; self: self
 *       width with the air exponent (the line model carries no self exponent; using n_air for self is common
 *       practice of the 160-character format) and no shift; H2, He, CO2, H2O: the foreign-broadener columns.
 *       N2 and O2 have no per-line columns. A width counts as given when it is finite and positive;</li>
 *   <li>{@link WidthSource#RULE}: a quantum-number rule of the {@link RuleSet} for the molecule and gas (for
 *       {@code self} without rules of its own: the rules of the gas the absorber is — CO2, H2O or H2);</li>
 *   <li>{@link WidthSource#J_TABLE}: a J''-dependent table ({@link BroadeningTable}, read from the broadening
 *       files of a state/transition set, lookup rule there) for the isotopologue (or, failing that, for any
 *       isotopologue of the molecule) and gas;</li>
 *   <li>{@link WidthSource#USER_CONSTANT}: constants given for the gas;</li>
 *   <li>{@link WidthSource#AIR_PROXY}: for N2 and O2 only, the line's air values;</li>
 *   <li>{@link WidthSource#DEFAULT}: {@link GasParameters#defaultFor} (may be forbidden).</li>
 * </ol>
 * The first source giving a width serves the line for that gas. When that source has no exponent, the
 * exponent is taken from the next source down the chain that has one. The shift comes from the serving source
 * when it has one, else it is 0 (shifts are small and seldom known; they are not chained). A line for which no
 * source in the order gives a width (or an exponent) is an {@link InputException} naming the molecule, the gas
 * and the line. Every choice is counted in a {@link WidthSourceTally}.
 *
 * <p>A resolver is not thread-safe (it keeps the tally and scratch counts): build one per thread from the same
 * {@link Builder} settings and {@link WidthSourceTally#add add} their tallies in a fixed order.
 */
public final class WidthResolver {
    /** Line list, rules, tables, user constants, air proxy (N2/O2), default. */
    public static final List<WidthSource> DEFAULT_ORDER = List.of(WidthSource.LINE_LIST, WidthSource.RULE,
            WidthSource.J_TABLE, WidthSource.USER_CONSTANT, WidthSource.AIR_PROXY, WidthSource.DEFAULT);

    private final Composition composition;
    private final BackgroundGas[] gases;
    private final WidthSource[] order;
    private final RuleSet rules;
    private final Map<Long, BroadeningTable> tables;
    private final GasParameters[] userConstants;
    private final WidthSourceTally tally = new WidthSourceTally();
    /** Scratch counts per source for one gas and batch (keeps {@link #resolve} allocation-free). */
    private final long[] sourceCounts = new long[SOURCES.length];
    private static final WidthSource[] SOURCES = WidthSource.values();

    private WidthResolver(Builder b) {
        this.composition = b.composition;
        this.gases = composition.presentGases();
        this.order = b.order.toArray(new WidthSource[0]);
        this.rules = b.rules;
        this.tables = new HashMap<>(b.tables);
        this.userConstants = new GasParameters[BackgroundGas.COUNT];
        b.userConstants.forEach((g, p) -> userConstants[g.ordinal()] = p);
    }

    /** A builder for {@code composition} with the built-in rules and the default order. */
    public static Builder builder(Composition composition) {
        return new Builder(composition);
    }

    /** The composition resolved for. */
    public Composition composition() {
        return composition;
    }

    /** Counts of the sources used so far. */
    public WidthSourceTally tally() {
        return tally;
    }

    /** New result arrays sized for {@code capacity} rows of this resolver's composition. */
    public ResolvedWidths newResult(int capacity) {
        return new ResolvedWidths(capacity, composition);
    }

    /**
     * Resolves every row of {@code batch} into {@code out} (same composition, capacity ≥ batch.size) and
     * computes the composition-weighted summaries. Allocation-free apart from the error path.
     *
     * @throws InputException when a line has no width or exponent for a gas from any allowed source
     */
    public void resolve(LineBatch batch, ResolvedWidths out) {
        if (out.composition() != composition && !out.composition().equals(composition)) {
            throw new IllegalArgumentException("result arrays were made for composition " + out.composition()
                    + ", not " + composition);
        }
        if (out.capacity() < batch.size) {
            throw new IllegalArgumentException("result capacity " + out.capacity() + " < batch size " + batch.size);
        }
        int n = batch.size;
        out.size = n;
        Arrays.fill(out.backgroundWidthCm1PerAtm, 0, n, 0.0);
        Arrays.fill(out.backgroundWidthExponent, 0, n, 0.0);
        Arrays.fill(out.backgroundShiftCm1PerAtm, 0, n, 0.0);
        for (BackgroundGas gas : gases) {
            resolveGas(batch, gas, out);
            double x = composition.fraction(gas);
            double[] w = out.widthCm1PerAtm[gas.ordinal()];
            double[] e = out.exponent[gas.ordinal()];
            double[] d = out.shiftCm1PerAtm[gas.ordinal()];
            for (int i = 0; i < n; i++) {
                double xw = x * w[i];
                out.backgroundWidthCm1PerAtm[i] += xw;
                // numerator of the γ-weighted mean exponent, divided below
                out.backgroundWidthExponent[i] += xw * e[i];
                out.backgroundShiftCm1PerAtm[i] += x * d[i];
            }
        }
        for (int i = 0; i < n; i++) {
            out.backgroundWidthExponent[i] /= out.backgroundWidthCm1PerAtm[i];
        }
    }

    private void resolveGas(LineBatch batch, BackgroundGas gas, ResolvedWidths out) {
        int g = gas.ordinal();
        double[] width = out.widthCm1PerAtm[g];
        double[] exponent = out.exponent[g];
        double[] shift = out.shiftCm1PerAtm[g];
        byte[] source = out.source[g];
        int lastMol = Integer.MIN_VALUE;
        int lastIso = Integer.MIN_VALUE;
        BroadeningRule widthRule = null;
        BroadeningRule exponentRule = null;
        BroadeningTable table = null;
        long[] counts = sourceCounts;
        Arrays.fill(counts, 0L);
        for (int i = 0; i < batch.size; i++) {
            int mol = batch.moleculeId[i];
            int iso = batch.isotopologue[i];
            if (mol != lastMol) { // rules hold for every isotopologue of a molecule
                BackgroundGas ruleGas = gas;
                if (gas == BackgroundGas.SELF && rules.rule(mol, gas, BroadeningRule.Quantity.WIDTH) == null) {
                    // self-broadening of CO2, H2O or H2 is broadening by that gas: its rules apply
                    BackgroundGas species = selfSpecies(mol);
                    ruleGas = species != null ? species : gas;
                }
                widthRule = rules.rule(mol, ruleGas, BroadeningRule.Quantity.WIDTH);
                exponentRule = rules.rule(mol, ruleGas, BroadeningRule.Quantity.EXPONENT);
            }
            if ((mol != lastMol || iso != lastIso) && !tables.isEmpty()) {
                table = tables.get(tableKey(mol, iso, gas));
                if (table == null) {
                    table = tables.get(tableKey(mol, 0, gas));
                }
            }
            lastMol = mol;
            lastIso = iso;
            double w = Double.NaN;
            double e = Double.NaN;
            double d = Double.NaN;
            int k = 0;
            WidthSource served = null;
            for (; k < order.length; k++) {
                WidthSource s = order[k];
                w = width(s, gas, batch, i, widthRule, table);
                if (w > 0 && Double.isFinite(w)) {
                    served = s;
                    e = exponent(s, gas, batch, i, exponentRule, table);
                    d = shift(s, gas, batch, i);
                    break;
                }
            }
            if (served == null) {
                throw missing(batch, i, gas, "width");
            }
            WidthSource exponentSource = served;
            for (int k2 = k + 1; !Double.isFinite(e) && k2 < order.length; k2++) {
                exponentSource = order[k2];
                e = exponent(exponentSource, gas, batch, i, exponentRule, table);
            }
            if (!Double.isFinite(e)) {
                throw missing(batch, i, gas, "temperature exponent");
            }
            width[i] = w;
            exponent[i] = e;
            shift[i] = Double.isFinite(d) ? d : 0.0;
            source[i] = served.code();
            counts[served.ordinal()]++;
            tally.countExponent(gas, exponentSource);
        }
        for (WidthSource s : SOURCES) {
            tally.countWidth(gas, s, counts[s.ordinal()]);
        }
    }

    private double width(WidthSource s, BackgroundGas gas, LineBatch b, int i, BroadeningRule rule,
                         BroadeningTable table) {
        switch (s) {
            case LINE_LIST:
                switch (gas) {
                    case AIR: return b.airWidthCm1PerAtm[i];
                    case SELF: return b.selfWidthCm1PerAtm[i];
                    case N2: case O2: return Double.NaN;
                    default: return b.foreignWidthCm1PerAtm[broadener(gas).ordinal()][i];
                }
            case RULE:
                return rule == null ? Double.NaN : rule.evaluate(b.lowerJ[i], b.upperJ[i], b.upperK[i]);
            case J_TABLE:
                return table == null ? Double.NaN : table.widthAt(b.lowerJ[i]);
            case USER_CONSTANT: {
                GasParameters p = userConstants[gas.ordinal()];
                return p == null ? Double.NaN : p.widthCm1PerAtm();
            }
            case AIR_PROXY:
                return gas == BackgroundGas.N2 || gas == BackgroundGas.O2 ? b.airWidthCm1PerAtm[i] : Double.NaN;
            case DEFAULT:
                return GasParameters.defaultFor(gas).widthCm1PerAtm();
            default:
                throw new AssertionError(s);
        }
    }

    private double exponent(WidthSource s, BackgroundGas gas, LineBatch b, int i, BroadeningRule rule,
                            BroadeningTable table) {
        switch (s) {
            case LINE_LIST:
                switch (gas) {
                    case AIR: case SELF: return b.airWidthExponent[i];
                    case N2: case O2: return Double.NaN;
                    default: return b.foreignWidthExponent[broadener(gas).ordinal()][i];
                }
            case RULE:
                return rule == null ? Double.NaN : rule.evaluate(b.lowerJ[i], b.upperJ[i], b.upperK[i]);
            case J_TABLE:
                return table == null ? Double.NaN : table.exponentAt(b.lowerJ[i]);
            case USER_CONSTANT: {
                GasParameters p = userConstants[gas.ordinal()];
                return p == null ? Double.NaN : p.exponent();
            }
            case AIR_PROXY:
                return gas == BackgroundGas.N2 || gas == BackgroundGas.O2 ? b.airWidthExponent[i] : Double.NaN;
            case DEFAULT:
                return GasParameters.defaultFor(gas).exponent();
            default:
                throw new AssertionError(s);
        }
    }

    private double shift(WidthSource s, BackgroundGas gas, LineBatch b, int i) {
        switch (s) {
            case LINE_LIST:
                switch (gas) {
                    case AIR: return b.airShiftCm1PerAtm[i];
                    case SELF: case N2: case O2: return Double.NaN;
                    default: return b.foreignShiftCm1PerAtm[broadener(gas).ordinal()][i];
                }
            case USER_CONSTANT: {
                GasParameters p = userConstants[gas.ordinal()];
                return p == null ? Double.NaN : p.shiftCm1PerAtm();
            }
            case AIR_PROXY:
                return b.airShiftCm1PerAtm[i];
            case DEFAULT:
                return GasParameters.defaultFor(gas).shiftCm1PerAtm();
            default:
                return Double.NaN;
        }
    }

    /** The background gas that is molecule {@code moleculeId} itself (HITRAN numbers 1 H2O, 2 CO2, 45 H2), or null. */
    static BackgroundGas selfSpecies(int moleculeId) {
        switch (moleculeId) {
            case 1: return BackgroundGas.H2O;
            case 2: return BackgroundGas.CO2;
            case 45: return BackgroundGas.H2;
            default: return null;
        }
    }

    private static Broadener broadener(BackgroundGas gas) {
        Broadener b = gas.lineBroadener();
        if (b == null) {
            throw new AssertionError(gas);
        }
        return b;
    }

    private InputException missing(LineBatch b, int i, BackgroundGas gas, String what) {
        StringJoiner tried = new StringJoiner(", ");
        for (WidthSource s : order) {
            tried.add(s.label());
        }
        boolean defaultsAllowed = List.of(order).contains(WidthSource.DEFAULT);
        return new InputException("molecule " + b.moleculeId[i] + " isotopologue " + b.isotopologue[i]
                + ", line " + b.sourceLine[i] + " at " + b.wavenumberCm1[i] + " cm-1: no " + gas.label() + " "
                + what + " from any source (tried " + tried + (defaultsAllowed ? "" : "; defaults forbidden")
                + "; expected per-line values, a rule, a table or user constants for " + gas.label() + ")");
    }

    private static long tableKey(int mol, int iso, BackgroundGas gas) {
        return ((long) mol << 24) | ((long) iso << 8) | gas.ordinal();
    }

    /** Configures a {@link WidthResolver}. */
    public static final class Builder {
        private final Composition composition;
        private List<WidthSource> order = new ArrayList<>(DEFAULT_ORDER);
        private RuleSet rules = RuleSet.builtIn();
        private final Map<Long, BroadeningTable> tables = new HashMap<>();
        private final Map<BackgroundGas, GasParameters> userConstants = new EnumMap<>(BackgroundGas.class);

        private Builder(Composition composition) {
            this.composition = composition;
        }

        /**
         * Sets the order in which sources are tried; sources left out are not used.
         *
         * @throws InputException for an empty order or a source given twice
         */
        public Builder order(List<WidthSource> sources) {
            if (sources.isEmpty()) {
                throw new InputException("width source order: empty (expected some of line, rule, table, user, "
                        + "air-proxy, default)");
            }
            if (sources.stream().distinct().count() != sources.size()) {
                throw new InputException("width source order " + sources + ": a source is given twice "
                        + "(expected each source once)");
            }
            this.order = new ArrayList<>(sources);
            return this;
        }

        /** Parses an order such as {@code user,line,rule} (labels of {@link WidthSource}). */
        public Builder order(String commaSeparated) {
            List<WidthSource> list = new ArrayList<>();
            for (String label : commaSeparated.split(",", -1)) {
                WidthSource s = WidthSource.byLabel(label);
                if (s == null) {
                    throw new InputException("width source order " + OffendingText.quote(commaSeparated) + ": unknown source \""
                            + label.trim() + "\" (expected line, rule, table, user, air-proxy or default)");
                }
                list.add(s);
            }
            return order(list);
        }

        /** Forbids the last-resort defaults: removes {@link WidthSource#DEFAULT} from the order. */
        public Builder forbidDefaults() {
            order.remove(WidthSource.DEFAULT);
            if (order.isEmpty()) {
                throw new InputException("width source order: only 'default' was given and defaults are forbidden");
            }
            return this;
        }

        /** Replaces the rule set (default {@link RuleSet#builtIn()}). */
        public Builder rules(RuleSet ruleSet) {
            this.rules = ruleSet;
            return this;
        }

        /**
         * Adds a J''-dependent table for an isotopologue and gas; isotopologue 0 makes it serve every
         * isotopologue of the molecule that has no table of its own. The gas named in a table file maps to a
         * gas with {@link BackgroundGas#byName} ({@code H2}, {@code He}, {@code air}, ...).
         */
        public Builder table(int moleculeId, int isotopologue, BackgroundGas gas, BroadeningTable table) {
            tables.put(tableKey(moleculeId, isotopologue, gas), table);
            return this;
        }

        /** Sets the user's constants for several gases (e.g. from {@link UserConstants#parse}). */
        public Builder userConstants(Map<BackgroundGas, GasParameters> constants) {
            userConstants.putAll(constants);
            return this;
        }

        /** Sets the user's constants for a gas. */
        public Builder userConstant(BackgroundGas gas, GasParameters parameters) {
            userConstants.put(gas, parameters);
            return this;
        }

        public WidthResolver build() {
            return new WidthResolver(this);
        }
    }
}
