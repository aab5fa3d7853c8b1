package org.linewright.grid.table;

import java.nio.file.Path;
import java.util.Locale;
import org.linewright.ingest.InputException;

/** The two table file formats, chosen by file name extension. */
public enum TableFormat {
    /** Apache Arrow IPC file ({@code .arrow}): one record batch per (p, T). */
    ARROW,
    /** HDF5 ({@code .h5}): axes and a 3-D σ dataset [p][T][ν]. */
    HDF5;

    /** Dataset / column names and units shared by both formats. */
    public static final String WAVENUMBER = "wavenumber_cm1";
    public static final String PRESSURE = "pressure_bar";
    public static final String TEMPERATURE = "temperature_K";
    public static final String SIGMA = "cross_section_cm2_per_molecule";
    public static final String UNIT_WAVENUMBER = "cm-1";
    public static final String UNIT_PRESSURE = "bar";
    public static final String UNIT_TEMPERATURE = "K";
    public static final String UNIT_SIGMA = "cm2/molecule";

    /** Table format version written in the metadata key {@code table_format}. */
    public static final String FORMAT_VERSION = "1";

    /**
     * The format of a table file, by extension.
     *
     * @throws InputException for any other extension
     */
    public static TableFormat of(Path file) {
        String name = file.getFileName().toString().toLowerCase(Locale.ROOT);
        if (name.endsWith(".arrow")) {
            return ARROW;
        }
        if (name.endsWith(".h5") || name.endsWith(".hdf5")) {
            return HDF5;
        }
        throw new InputException(file + ": unknown table format (expected a file name ending in .arrow or .h5)");
    }
}
