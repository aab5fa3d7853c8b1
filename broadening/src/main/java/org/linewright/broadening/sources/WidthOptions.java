package org.linewright.broadening.sources;

import java.util.List;
import java.util.Map;
import org.linewright.broadening.background.BackgroundGas;
import org.linewright.broadening.background.Composition;
import org.linewright.broadening.rules.RuleSet;
import org.linewright.ingest.exomol.BroadeningTable;

/**
 * Everything the width resolver needs besides the composition: the order of the width sources, whether the
 * last-resort defaults are forbidden, the user's constants per gas, the rule set and J''-dependent tables.
 * Immutable; {@link #DEFAULTS} is the resolver's default order with the built-in rules.
 *
 * @param order          sources tried in this order (null or empty: {@link WidthResolver#DEFAULT_ORDER})
 * @param forbidDefaults whether to remove {@link WidthSource#DEFAULT} from the order
 * @param userConstants  constants per gas (may be empty)
 * @param rules          the rule set (null: the built-in rules)
 * @param tables         J''-dependent tables (may be empty)
 */
public record WidthOptions(List<WidthSource> order, boolean forbidDefaults,
                           Map<BackgroundGas, GasParameters> userConstants, RuleSet rules, List<Table> tables) {

    /** The default order, defaults allowed, no user constants, built-in rules, no tables. */
    public static final WidthOptions DEFAULTS = new WidthOptions(List.of(), false, Map.of(), null, List.of());

    /**
     * A J''-dependent table for an isotopologue (0: every isotopologue of the molecule) and gas.
     *
     * @param moleculeId   molecule number
     * @param isotopologue isotopologue number, 0 for all
     * @param gas          the broadening gas
     * @param table        the table
     */
    public record Table(int moleculeId, int isotopologue, BackgroundGas gas, BroadeningTable table) { }

    public WidthOptions {
        order = order == null ? List.of() : List.copyOf(order);
        userConstants = userConstants == null ? Map.of() : Map.copyOf(userConstants);
        tables = tables == null ? List.of() : List.copyOf(tables);
    }

    /** A copy with the defaults forbidden. */
    public WidthOptions withDefaultsForbidden() {
        return new WidthOptions(order, true, userConstants, rules, tables);
    }

    /** A copy with these user constants. */
    public WidthOptions withUserConstants(Map<BackgroundGas, GasParameters> constants) {
        return new WidthOptions(order, forbidDefaults, constants, rules, tables);
    }

    /** A copy with this source order. */
    public WidthOptions withOrder(List<WidthSource> sources) {
        return new WidthOptions(sources, forbidDefaults, userConstants, rules, tables);
    }

    /** A new resolver for {@code composition} with these options (one per thread: resolvers keep a tally). */
    public WidthResolver newResolver(Composition composition) {
        WidthResolver.Builder b = WidthResolver.builder(composition);
        if (!order.isEmpty()) {
            b.order(order);
        }
        if (forbidDefaults) {
            b.forbidDefaults();
        }
        if (rules != null) {
            b.rules(rules);
        }
        b.userConstants(userConstants);
        for (Table t : tables) {
            b.table(t.moleculeId(), t.isotopologue(), t.gas(), t.table());
        }
        return b.build();
    }

    /** For metadata: the order and choices in words. */
    public String describe() {
        StringBuilder sb = new StringBuilder("order=");
        List<WidthSource> o = order.isEmpty() ? WidthResolver.DEFAULT_ORDER : order;
        for (int i = 0; i < o.size(); i++) {
            sb.append(i == 0 ? "" : ",").append(o.get(i).label());
        }
        if (forbidDefaults) {
            sb.append(" defaults=forbidden");
        }
        if (!userConstants.isEmpty()) {
            sb.append(" user=");
            userConstants.entrySet().stream().sorted(Map.Entry.comparingByKey())
                    .forEach(e -> sb.append(e.getKey().label()).append(':').append(e.getValue()).append(';'));
        }
        if (rules != null) {
            sb.append(" rules=").append(String.join("|", rules.sources()));
        }
        if (!tables.isEmpty()) {
            sb.append(" tables=").append(tables.size());
        }
        return sb.toString();
    }
}
