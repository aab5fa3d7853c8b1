package org.linewright.broadening.sources;

import java.util.ArrayList;
import java.util.List;
import java.util.StringJoiner;

import org.linewright.broadening.background.BackgroundGas;

/**
 * How many lines each width source served for each background gas, accumulated over every batch resolved;
 * also how many exponents had to be taken from a later source than their width. Not thread-safe: use one
 * tally per thread and {@link #add} them in a fixed order.
 */
public final class WidthSourceTally {
    private final long[][] widthCounts = new long[BackgroundGas.COUNT][WidthSource.values().length];
    private final long[][] exponentCounts = new long[BackgroundGas.COUNT][WidthSource.values().length];

    void countWidth(BackgroundGas gas, WidthSource source, long lines) {
        widthCounts[gas.ordinal()][source.ordinal()] += lines;
    }

    void countExponent(BackgroundGas gas, WidthSource source) {
        exponentCounts[gas.ordinal()][source.ordinal()]++;
    }

    /** Lines whose width for {@code gas} came from {@code source}. */
    public long widths(BackgroundGas gas, WidthSource source) {
        return widthCounts[gas.ordinal()][source.ordinal()];
    }

    /** Lines whose exponent for {@code gas} came from {@code source} (any source, same as the width or later). */
    public long exponents(BackgroundGas gas, WidthSource source) {
        return exponentCounts[gas.ordinal()][source.ordinal()];
    }

    /** Adds another tally's counts to this one. */
    public void add(WidthSourceTally other) {
        for (int g = 0; g < BackgroundGas.COUNT; g++) {
            for (int s = 0; s < widthCounts[g].length; s++) {
                widthCounts[g][s] += other.widthCounts[g][s];
                exponentCounts[g][s] += other.exponentCounts[g][s];
            }
        }
    }

    /** One line per gas that served lines, e.g. {@code he: line 0, rule 5381, ...; exponents: rule 5381}. */
    public List<String> report() {
        List<String> lines = new ArrayList<>();
        for (BackgroundGas gas : BackgroundGas.values()) {
            long total = 0;
            StringJoiner w = new StringJoiner(", ");
            StringJoiner e = new StringJoiner(", ");
            for (WidthSource s : WidthSource.values()) {
                long cw = widthCounts[gas.ordinal()][s.ordinal()];
                long ce = exponentCounts[gas.ordinal()][s.ordinal()];
                total += cw;
                if (cw > 0) {
                    w.add(s.label() + " " + cw);
                }
                if (ce > 0) {
                    e.add(s.label() + " " + ce);
                }
            }
            if (total > 0) {
                lines.add(gas.label() + " widths: " + w + "; exponents: " + e);
            }
        }
        return lines;
    }

    /** Warnings for widths or exponents taken from the defaults or from air values standing in for N2/O2. */
    public List<String> warnings() {
        List<String> out = new ArrayList<>();
        for (BackgroundGas gas : BackgroundGas.values()) {
            for (WidthSource s : new WidthSource[] {WidthSource.AIR_PROXY, WidthSource.DEFAULT}) {
                long cw = widthCounts[gas.ordinal()][s.ordinal()];
                long ce = exponentCounts[gas.ordinal()][s.ordinal()];
                if (cw > 0 || ce > 0) {
                    out.add("warning: " + gas.label() + ": " + cw + " widths and " + ce + " exponents from "
                            + (s == WidthSource.DEFAULT ? "the default (no data for these lines)"
                            : "the lines' air values (no " + gas.label() + " data)"));
                }
            }
        }
        return out;
    }
}
