package org.linewright.grid.output;

import java.nio.file.Path;
import java.util.Locale;
import org.linewright.ingest.InputException;
import org.linewright.ingest.text.OffendingText;

/** File formats for one cross section. */
public enum CrossSectionFormat {
    /** Comma-separated text: header {@value CsvCrossSectionWriter#HEADER}, one point per line. */
    CSV("csv"),
    /** Arrow IPC file: two float64 columns, units in field metadata, parameters in schema metadata. */
    ARROW("arrow"),
    /** HDF5: two float64 datasets with a {@code units} attribute, parameters as root attributes. */
    HDF5("hdf5");

    private final String label;

    CrossSectionFormat(String label) {
        this.label = label;
    }

    /** The name used by {@code --format}. */
    public String label() {
        return label;
    }

    /**
     * @param name {@code csv}, {@code arrow} or {@code hdf5} (case-insensitive; {@code h5} and {@code ipc}
     *             accepted)
     * @throws InputException naming the accepted values
     */
    public static CrossSectionFormat parse(String name) {
        switch (name.trim().toLowerCase(Locale.ROOT)) {
            case "csv":
                return CSV;
            case "arrow":
            case "ipc":
                return ARROW;
            case "hdf5":
            case "h5":
                return HDF5;
            default:
                throw new InputException("format " + OffendingText.quote(name) + ": unknown (expected csv, arrow or hdf5)");
        }
    }

    /**
     * The format named by a file's extension ({@code .csv}, {@code .arrow}, {@code .h5}, {@code .hdf5}).
     *
     * @throws InputException when the extension names no format
     */
    public static CrossSectionFormat fromExtension(Path file) {
        String name = file.getFileName().toString().toLowerCase(Locale.ROOT);
        if (name.endsWith(".csv")) {
            return CSV;
        }
        if (name.endsWith(".arrow")) {
            return ARROW;
        }
        if (name.endsWith(".h5") || name.endsWith(".hdf5")) {
            return HDF5;
        }
        throw new InputException(file + ": cannot tell the format from the extension (expected .csv, .arrow, .h5 "
                + "or .hdf5, or give the format explicitly)");
    }
}
