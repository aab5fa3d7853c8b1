package org.linewright.broadening.intensity;

import java.util.Locale;

/**
 * What one "molecule" in σ's cm²/molecule is (docs/physics.md, "Per molecule of what").
 *
 * <p>Every reader stores S(296 K) weighted by the isotopologue's abundance a_list (the registry's natural
 * abundance; the state-list and catalog readers multiply it in), so the stored lines are per molecule of the
 * natural-abundance species whatever the input format.
 */
public enum IntensityConvention {
    /** Per molecule of the species at the given (default: natural) isotopic abundances: S · a_user/a_list. */
    NATURAL_ABUNDANCE("natural-abundance"),
    /** Per molecule of one isotopologue (an isotopically pure sample): S / a_list. */
    ISOTOPOLOGUE("isotopologue");

    private final String label;

    IntensityConvention(String label) {
        this.label = label;
    }

    /** The name written to output metadata and accepted by {@link #parse}. */
    public String label() {
        return label;
    }

    /**
     * @throws IllegalArgumentException for a name that is neither label
     */
    public static IntensityConvention parse(String name) {
        String n = name.trim().toLowerCase(Locale.ROOT);
        for (IntensityConvention c : values()) {
            if (c.label.equals(n)) {
                return c;
            }
        }
        throw new IllegalArgumentException("unknown intensity convention '" + name
                + "' (expected natural-abundance or isotopologue)");
    }
}
