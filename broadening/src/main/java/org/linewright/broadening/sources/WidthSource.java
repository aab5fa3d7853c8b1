package org.linewright.broadening.sources;

/**
 * Where a line's broadening parameters for one background gas came from. The per-line source code written
 * next to the widths is {@link #code()}; 0 means the gas is not part of the composition.
 */
public enum WidthSource {
    /** Per-line values of the line list (air, self and the foreign-broadener columns). */
    LINE_LIST("line"),
    /** A published quantum-number rule for the molecule and gas ({@link org.linewright.broadening.rules.RuleSet}). */
    RULE("rule"),
    /** A J''-dependent table for the isotopologue and gas ({@link org.linewright.ingest.exomol.BroadeningTable}). */
    J_TABLE("table"),
    /** A constant γ, n (and δ) given by the user for the gas. */
    USER_CONSTANT("user"),
    /** N2 and O2 only: the line's air values stand in (air is 99 % N2 + O2); counted as a warning. */
    AIR_PROXY("air-proxy"),
    /** The documented default of the gas ({@link GasParameters#defaultFor}); counted as a warning. */
    DEFAULT("default");

    private static final WidthSource[] VALUES = values();

    private final String label;

    WidthSource(String label) {
        this.label = label;
    }

    /** Short name used in options and reports. */
    public String label() {
        return label;
    }

    /** Per-line code: {@code ordinal() + 1} (1 = line list … 6 = default); 0 is "gas absent". */
    public byte code() {
        return (byte) (ordinal() + 1);
    }

    /** The source of a per-line code, null for 0. */
    public static WidthSource ofCode(byte code) {
        return code == 0 ? null : VALUES[code - 1];
    }

    /** Source by its {@link #label()}, case-insensitive; null when unknown. */
    public static WidthSource byLabel(String label) {
        for (WidthSource s : VALUES) {
            if (s.label.equalsIgnoreCase(label.trim())) {
                return s;
            }
        }
        return null;
    }
}
