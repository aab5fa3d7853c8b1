package org.linewright.cli;

import org.linewright.broadening.wings.ChiFactorKind;
import org.linewright.broadening.wings.WingCutoff;
import org.linewright.broadening.wings.WingTreatment;
import org.linewright.ingest.InputException;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * How line wings are treated: a picocli mixin for the commands that compute cross sections. The cutoff is a
 * fixed distance, or a multiple of each line's Voigt half width, or proportional to pressure — the last two
 * capped by {@code --cutoff}; the pedestal left at the cutoff can be removed; CO2-broadened CO2 lines can get the
 * sub-Lorentzian χ factor of Perrin &amp; Hartmann (1989). Every choice goes into the output's metadata.
 */
public final class WingOptions {
    @Spec(Spec.Target.MIXEE)
    private CommandSpec mixee;

    @Option(names = "--cutoff", paramLabel = "CM1", defaultValue = "25",
            description = "Wing cutoff distance from each line centre in cm-1, or the cap of the rules below "
                    + "(default ${DEFAULT-VALUE}).")
    double cutoffCm1;

    @Option(names = "--cutoff-hwhm-multiple", paramLabel = "N",
            description = "Cut each line at N times its own Voigt half width (at most --cutoff).")
    Double hwhmMultiple;

    /** Deprecated spelling of --cutoff-hwhm-multiple, read for one version. */
    @Option(names = "--cutoff-hwhm", hidden = true, paramLabel = "N")
    void deprecatedHwhm(double value) {
        DeprecatedSpelling.note(mixee, "--cutoff-hwhm", "--cutoff-hwhm-multiple");
        hwhmMultiple = value;
    }

    @Option(names = "--cutoff-per-atm", paramLabel = "CM1",
            description = "Cut at this many cm-1 per atm of pressure (at least 1 cm-1, at most --cutoff).")
    Double perAtmCm1;

    @Option(names = "--remove-pedestal",
            description = "Subtract each line's profile value at its cutoff, so it goes to zero there.")
    boolean removePedestal;

    @Option(names = "--chi-factor",
            description = "Sub-Lorentzian far wings (chi factor, Perrin-Hartmann 1989) on the CO2-broadened share "
                    + "of each CO2 line's width, only at 200-300 K and for lines at 2200-2450 cm-1 (warning outside).")
    boolean chiFactor;

    /** The wing treatment these options describe. */
    public WingTreatment treatment() {
        WingCutoff cutoff;
        try {
            cutoff = WingCutoff.of(cutoffCm1, hwhmMultiple == null ? Double.NaN : hwhmMultiple,
                    perAtmCm1 == null ? Double.NaN : perAtmCm1);
        } catch (InputException e) {
            // The same rules as plans; named here by their options.
            throw new InputException("--" + e.getMessage().replace("cutoff HWHM multiple", "cutoff-hwhm-multiple")
                    .replace("cutoff per atm", "cutoff-per-atm"));
        }
        return new WingTreatment(cutoff, removePedestal, chiFactor ? ChiFactorKind.PERRIN_HARTMANN_CO2 : ChiFactorKind.NONE);
    }
}
