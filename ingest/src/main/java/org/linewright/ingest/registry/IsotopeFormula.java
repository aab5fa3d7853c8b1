package org.linewright.ingest.registry;

import java.util.ArrayList;
import java.util.List;

/**
 * Isotopologue formulas written atom by atom with mass numbers, joined by '-', with an optional count after
 * the element symbol, as in state-list file names: {@code 12C-16O}, {@code 1H2-16O}, {@code 16O-12C-18O},
 * {@code 12C-1H3-2H}.
 */
public final class IsotopeFormula {
    /** One nuclide of a formula and how many times it occurs there. */
    public record Part(String nuclide, int count) { }

    private IsotopeFormula() {
    }

    /**
     * Splits a formula into its parts, in order.
     *
     * @throws IllegalArgumentException naming the offending part when the formula is malformed
     */
    public static List<Part> parse(String formula) {
        List<Part> parts = new ArrayList<>();
        if (formula == null || formula.isEmpty()) {
            throw new IllegalArgumentException("empty isotopologue formula (expected e.g. 12C-16O2)");
        }
        for (String token : formula.split("-", -1)) {
            int i = 0;
            int n = token.length();
            while (i < n && Character.isDigit(token.charAt(i))) {
                i++;
            }
            int massEnd = i;
            if (i < n && Character.isUpperCase(token.charAt(i))) {
                i++;
                while (i < n && Character.isLowerCase(token.charAt(i))) {
                    i++;
                }
            }
            int symbolEnd = i;
            while (i < n && Character.isDigit(token.charAt(i))) {
                i++;
            }
            if (massEnd == 0 || symbolEnd == massEnd || i != n) {
                throw new IllegalArgumentException("isotopologue formula '" + formula + "': part '" + token
                        + "' (expected mass number, element symbol and optional count, e.g. 1H2)");
            }
            int count = symbolEnd == n ? 1 : Integer.parseInt(token.substring(symbolEnd));
            if (count < 1) {
                throw new IllegalArgumentException("isotopologue formula '" + formula + "': part '" + token + "' has count 0");
            }
            parts.add(new Part(token.substring(0, symbolEnd), count));
        }
        return parts;
    }

    /** The chemical formula without mass numbers, atoms in order of first appearance: {@code 12C-1H3-2H} → {@code CH4}. */
    public static String chemicalFormula(String formula) {
        java.util.LinkedHashMap<String, Integer> counts = new java.util.LinkedHashMap<>();
        for (Part p : parse(formula)) {
            String element = p.nuclide().replaceAll("^[0-9]+", "");
            counts.merge(element, p.count(), Integer::sum);
        }
        StringBuilder sb = new StringBuilder();
        counts.forEach((e, c) -> sb.append(e).append(c == 1 ? "" : Integer.toString(c)));
        return sb.toString();
    }
}
