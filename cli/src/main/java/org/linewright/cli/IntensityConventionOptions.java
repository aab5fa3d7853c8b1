package org.linewright.cli;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.linewright.broadening.intensity.IntensityConvention;
import org.linewright.broadening.intensity.IntensityScaling;
import org.linewright.ingest.InputException;
import org.linewright.ingest.registry.Isotopologue;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.text.OffendingText;
import picocli.CommandLine.Option;

/**
 * {@code --intensity-per} and {@code --abundance}: what one molecule of σ's cm²/molecule is, and user isotopologue
 * abundances (a picocli mixin). Checked against the registry here; bad values are one line, exit code 2.
 */
public final class IntensityConventionOptions {
    @Option(names = "--intensity-per", paramLabel = "CONVENTION", defaultValue = "natural-abundance",
            description = "sigma per molecule of: natural-abundance (the species at its isotopic abundances; "
                    + "default) or isotopologue (one isotopologue, isotopically pure: S divided by its abundance; "
                    + "needs --molecule and --isotopologue).")
    private String convention;

    @Option(names = "--abundance", paramLabel = "MOL/ISO=FRACTION", split = ",",
            description = "Isotopologue abundance replacing the registry's, e.g. H2O/4=3.1e-3 (rescales that "
                    + "isotopologue's intensities by FRACTION/registry value; others keep theirs).")
    private List<String> abundances;

    /**
     * @param singleIsotopologue true when the line selection is one isotopologue
     * @throws InputException for an unknown convention or isotopologue, a bad fraction, or the isotopologue
     *         convention over more than one isotopologue
     */
    public IntensityScaling scaling(MoleculeRegistry registry, boolean singleIsotopologue) {
        IntensityConvention c;
        try {
            c = IntensityConvention.parse(convention);
        } catch (IllegalArgumentException e) {
            throw new InputException("--intensity-per: " + OffendingText.quote(convention)
                    + " (expected natural-abundance or isotopologue)");
        }
        if (c == IntensityConvention.ISOTOPOLOGUE && !singleIsotopologue) {
            throw new InputException("--intensity-per isotopologue: sigma per molecule of one isotopologue needs "
                    + "one isotopologue selected (expected --molecule M --isotopologue N)");
        }
        Map<String, Double> byName = new LinkedHashMap<>();
        if (abundances != null) {
            for (String item : abundances) {
                int eq = item.indexOf('=');
                Isotopologue iso = eq > 0 ? registry.isotopologue(item.substring(0, eq)) : null;
                if (iso == null) {
                    throw new InputException("--abundance " + OffendingText.quote(item)
                            + ": expected MOL/ISO=FRACTION with an isotopologue of the registry, e.g. H2O/4=3.1e-3");
                }
                double a;
                try {
                    a = Double.parseDouble(item.substring(eq + 1).trim());
                } catch (NumberFormatException e) {
                    a = Double.NaN;
                }
                if (!(a > 0 && a <= 1)) {
                    throw new InputException("--abundance " + OffendingText.quote(item)
                            + ": expected a fraction in (0, 1] after '='");
                }
                if (c == IntensityConvention.ISOTOPOLOGUE) {
                    throw new InputException("--abundance " + OffendingText.quote(item) + ": no abundance applies "
                            + "with --intensity-per isotopologue (expected one or the other)");
                }
                byName.put(iso.moleculeId() + "/" + iso.number(), a);
            }
        }
        return new IntensityScaling(c, byName);
    }
}
