package org.linewright.broadening.background;

import java.util.Arrays;
import java.util.EnumMap;
import java.util.Map;
import java.util.StringJoiner;

import org.linewright.ingest.InputException;
import org.linewright.ingest.text.OffendingText;

/**
 * Mole fractions of the background gases around the absorber, e.g. {@code H2=0.85,He=0.15}.
 *
 * <p>Fractions are non-negative and sum to 1 within {@link #SUM_TOLERANCE}; they are then used as given
 * (no renormalisation: a composition that does not add up is a user error, reported, never silently
 * rescaled). {@link BackgroundGas#SELF} — the absorber itself — defaults to 0 (a trace gas) and takes part in the
 * sum like any other gas when given.
 */
public final class Composition {
    /** Tolerance on |Σx − 1|. */
    public static final double SUM_TOLERANCE = 1e-6;

    private final double[] fractions;

    private Composition(double[] fractions) {
        this.fractions = fractions;
    }

    /** Pure air, the composition of terrestrial line lists' reference widths. */
    public static Composition air() {
        double[] x = new double[BackgroundGas.COUNT];
        x[BackgroundGas.AIR.ordinal()] = 1.0;
        return new Composition(x);
    }

    /**
     * Builds a composition from a map of fractions.
     *
     * @throws InputException for a negative or non-finite fraction, or fractions not summing to 1
     */
    public static Composition of(Map<BackgroundGas, Double> fractions) {
        double[] x = new double[BackgroundGas.COUNT];
        for (Map.Entry<BackgroundGas, Double> e : fractions.entrySet()) {
            x[e.getKey().ordinal()] = e.getValue();
        }
        return validated(x, describe(fractions));
    }

    /**
     * Parses {@code GAS=X,GAS=X,...}: gas names case-insensitive (see {@link BackgroundGas#byName}), X a
     * decimal number; blanks around tokens are ignored.
     *
     * @throws InputException one line naming the offending item and what was expected
     */
    public static Composition parse(String text) {
        if (text == null || text.isBlank()) {
            throw new InputException("background composition: empty (expected GAS=X,... e.g. H2=0.85,He=0.15)");
        }
        double[] x = new double[BackgroundGas.COUNT];
        boolean[] seen = new boolean[BackgroundGas.COUNT];
        for (String item : text.split(",", -1)) {
            int eq = item.indexOf('=');
            if (eq < 0) {
                throw new InputException("background composition " + OffendingText.quote(text) + ": item \"" + item.trim()
                        + "\" (expected GAS=X)");
            }
            String name = item.substring(0, eq).trim();
            String value = item.substring(eq + 1).trim();
            BackgroundGas gas = BackgroundGas.byName(name);
            if (gas == null) {
                throw new InputException("background composition " + OffendingText.quote(text) + ": unknown gas \"" + name
                        + "\" (expected one of " + knownNames() + ")");
            }
            if (seen[gas.ordinal()]) {
                throw new InputException("background composition " + OffendingText.quote(text) + ": gas \"" + name
                        + "\" given twice (expected each gas once)");
            }
            seen[gas.ordinal()] = true;
            double fraction;
            try {
                fraction = Double.parseDouble(value);
            } catch (NumberFormatException e) {
                throw new InputException("background composition " + OffendingText.quote(text) + ": fraction of " + gas.label()
                        + " " + OffendingText.quote(value) + " is not a number (expected a mole fraction between 0 and 1)", e);
            }
            x[gas.ordinal()] = fraction;
        }
        return validated(x, text);
    }

    private static Composition validated(double[] x, String text) {
        double sum = 0;
        for (int g = 0; g < x.length; g++) {
            if (!Double.isFinite(x[g]) || x[g] < 0 || x[g] > 1) {
                throw new InputException("background composition " + OffendingText.quote(text) + ": fraction of "
                        + BackgroundGas.ofOrdinal(g).label() + " is " + x[g]
                        + " (expected a mole fraction between 0 and 1)");
            }
            sum += x[g];
        }
        if (Math.abs(sum - 1.0) > SUM_TOLERANCE) {
            throw new InputException("background composition " + OffendingText.quote(text) + ": fractions sum to " + sum
                    + " (expected 1 within " + SUM_TOLERANCE + ")");
        }
        return new Composition(x);
    }

    private static String knownNames() {
        StringJoiner j = new StringJoiner(", ");
        for (BackgroundGas gas : BackgroundGas.values()) {
            j.add(gas.label());
        }
        return j.toString();
    }

    private static String describe(Map<BackgroundGas, Double> fractions) {
        StringJoiner j = new StringJoiner(",");
        fractions.forEach((g, x) -> j.add(g.label() + "=" + x));
        return j.toString();
    }

    /** Mole fraction of {@code gas} (0 when absent). */
    public double fraction(BackgroundGas gas) {
        return fractions[gas.ordinal()];
    }

    /** The gases with a non-zero fraction, in {@link BackgroundGas} order. */
    public BackgroundGas[] presentGases() {
        return Arrays.stream(BackgroundGas.values()).filter(g -> fractions[g.ordinal()] > 0)
                .toArray(BackgroundGas[]::new);
    }

    /** The fractions as a map of the present gases, in {@link BackgroundGas} order. */
    public Map<BackgroundGas, Double> asMap() {
        Map<BackgroundGas, Double> m = new EnumMap<>(BackgroundGas.class);
        for (BackgroundGas g : presentGases()) {
            m.put(g, fractions[g.ordinal()]);
        }
        return m;
    }

    @Override
    public String toString() {
        StringJoiner j = new StringJoiner(",");
        for (BackgroundGas g : presentGases()) {
            j.add(g.label() + "=" + fractions[g.ordinal()]);
        }
        return j.toString();
    }

    @Override
    public boolean equals(Object o) {
        return o instanceof Composition c && Arrays.equals(fractions, c.fractions);
    }

    @Override
    public int hashCode() {
        return Arrays.hashCode(fractions);
    }
}
