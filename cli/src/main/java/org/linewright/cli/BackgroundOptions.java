package org.linewright.cli;

import org.linewright.broadening.background.Composition;
import org.linewright.broadening.sources.UserConstants;
import org.linewright.broadening.sources.WidthResolver;
import picocli.CommandLine.Option;

/**
 * The background gas and how line widths are found for it: a picocli mixin shared by the commands that
 * broaden lines.
 */
public final class BackgroundOptions {
    @Option(names = "--background", paramLabel = "GAS=X,...",
            description = "Background composition as mole fractions summing to 1 over air, H2, He, CO2, N2, O2, H2O "
                    + "and self (the absorber itself), e.g. H2=0.85,He=0.15.")
    String background;

    @Option(names = "--width-sources", paramLabel = "ORDER",
            description = "Order in which width sources are tried for each line and gas, comma-separated from: "
                    + "line, rule, table, user, air-proxy, default (default: ${DEFAULT-VALUE}).",
            defaultValue = "line,rule,table,user,air-proxy,default")
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

    /** A width-resolver builder for the background, or null when no background was given. */
    public WidthResolver.Builder resolverOrNull() {
        Composition composition = compositionOrNull();
        if (composition == null) {
            return null;
        }
        WidthResolver.Builder b = WidthResolver.builder(composition).order(order);
        if (forbidDefaults) {
            b.forbidDefaults();
        }
        if (constants != null) {
            b.userConstants(UserConstants.parse(constants));
        }
        return b;
    }
}
