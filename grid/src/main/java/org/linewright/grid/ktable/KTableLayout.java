package org.linewright.grid.ktable;

/** Dataset / column names and units of k-tables, shared by both formats and the reader (see docs/table-format.md). */
public final class KTableLayout {
    public static final String PRESSURE = "pressure_bar";
    public static final String TEMPERATURE = "temperature_K";
    public static final String G = "g";
    public static final String G_WEIGHT = "g_weight";
    public static final String BIN_LOWER = "bin_lower_cm1";
    public static final String BIN_UPPER = "bin_upper_cm1";
    public static final String BIN_CENTRE = "bin_centre_cm1";
    public static final String POINTS_PER_BIN = "sigma_points_per_bin";
    /** k per molecule; per unit mass it is {@link #K_PER_GRAM}. */
    public static final String K_PER_MOLECULE = "k_cm2_per_molecule";
    public static final String K_PER_GRAM = "k_cm2_per_g";
    public static final String BAND_MEAN_PER_MOLECULE = "band_mean_sigma_cm2_per_molecule";
    public static final String BAND_MEAN_PER_GRAM = "band_mean_sigma_cm2_per_g";
    public static final String TRANSMISSION_EQUIVALENT_PER_MOLECULE = "transmission_equivalent_sigma_cm2_per_molecule";
    public static final String TRANSMISSION_EQUIVALENT_PER_GRAM = "transmission_equivalent_sigma_cm2_per_g";
    public static final String UNIT_PRESSURE = "bar";
    public static final String UNIT_TEMPERATURE = "K";
    public static final String UNIT_WAVENUMBER = "cm-1";
    public static final String UNIT_PER_MOLECULE = "cm2/molecule";
    public static final String UNIT_PER_GRAM = "cm2/g";
    public static final String UNIT_ONE = "1";
    /** k-table format version, metadata key {@code ktable_format}. */
    public static final String FORMAT_VERSION = "1";

    private KTableLayout() {
    }
}
