package org.linewright.cli;

import java.util.ArrayList;
import java.util.List;
import org.linewright.broadening.background.Composition;
import org.linewright.broadening.sources.UserConstants;
import org.linewright.broadening.sources.WidthOptions;
import org.linewright.broadening.sources.WidthSource;
import org.linewright.ingest.InputException;
import picocli.CommandLine.Option;

/**
 * The background gas and how line widths are found for it: a picocli mixin shared by the commands that
 * broaden lines ({@code lines}, {@code sigma}).
 */
public final class BackgroundOptions {
    @Option(names = "--background", paramLabel = "GAS=X,...",
            description = "Background composition as mole fractions summing to 1 over air, H2, He, CO2, N2, O2, H2O "
                    + "and self (the absorber itself), e.g. H2=0.85,He=0.15.")
    String background;

    @Option(names = "--width-sources", paramLabel = "ORDER",
            description = "Order in which width sources are tried for each line and gas, comma-separated from: "
                    + "line, rule, table, user, air-proxy, default (default: line,rule,table,user,air-proxy,default).")
    String order;

    @Option(names = "--no-default-widths",
            description = "Fail with an error instead of giving a line the default width of a gas.")
    boolean forbidDefaults;

    @Option(names = "--width-constants", paramLabel = "GAS=GAMMA[:N],...",
            description = "Constant widths (cm-1/atm at 296 K) and exponents per gas for the 'user' source, "
                    + "e.g. h2=0.06:0.6,he=0.045:0.5.")
    String constants;

    /** The composition, or null when no background was given. */
    public Composition compositionOrNull() {
        return background == null ? null : Composition.parse(background);
    }

    /** The composition; a one-line error naming the option when it was not given. */
    public Composition requiredComposition() {
        Composition c = compositionOrNull();
        if (c == null) {
            throw new InputException("--background is required (e.g. --background air=1 or H2=0.85,He=0.15)");
        }
        return c;
    }

    /** How widths are found: source order, defaults allowed or not, user constants. */
    public WidthOptions widthOptions() {
        WidthOptions w = WidthOptions.DEFAULTS;
        if (order != null) {
            List<WidthSource> sources = new ArrayList<>();
            for (String label : order.split(",")) {
                WidthSource source = WidthSource.byLabel(label.strip());
                if (source == null) {
                    throw new InputException("--width-sources: '" + label.strip()
                            + "' (expected line, rule, table, user, air-proxy or default)");
                }
                sources.add(source);
            }
            w = w.withOrder(sources);
        }
        if (forbidDefaults) {
            w = w.withDefaultsForbidden();
        }
        if (constants != null) {
            w = w.withUserConstants(UserConstants.parse(constants));
        }
        return w;
    }
}
