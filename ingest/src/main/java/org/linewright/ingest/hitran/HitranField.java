package org.linewright.ingest.hitran;

/**
 * The fields of the 160-character record (2004 and later layout), with their 0-based column range
 * {@code [start, end)} and Fortran edit descriptor (common practice of the format).
 */
public enum HitranField {
    MOLECULE("molecule", 0, 2, "I2"),
    ISOTOPOLOGUE("isotopologue", 2, 3, "A1: 1-9, 0 (10), A (11), B (12)"),
    WAVENUMBER("wavenumber", 3, 15, "F12.6"),
    INTENSITY("intensity", 15, 25, "E10.3"),
    EINSTEIN_A("einstein_a", 25, 35, "E10.3"),
    AIR_WIDTH("air_width", 35, 40, "F5.4"),
    SELF_WIDTH("self_width", 40, 45, "F5.3"),
    LOWER_ENERGY("lower_energy", 45, 55, "F10.4"),
    AIR_WIDTH_EXPONENT("air_width_exponent", 55, 59, "F4.2"),
    AIR_SHIFT("air_shift", 59, 67, "F8.6"),
    UPPER_GLOBAL_QUANTA("upper_global_quanta", 67, 82, "A15"),
    LOWER_GLOBAL_QUANTA("lower_global_quanta", 82, 97, "A15"),
    UPPER_LOCAL_QUANTA("upper_local_quanta", 97, 112, "A15"),
    LOWER_LOCAL_QUANTA("lower_local_quanta", 112, 127, "A15"),
    UNCERTAINTY_CODES("uncertainty_codes", 127, 133, "6I1"),
    REFERENCE_CODES("reference_codes", 133, 145, "6I2"),
    LINE_MIXING_FLAG("line_mixing_flag", 145, 146, "A1"),
    UPPER_DEGENERACY("upper_degeneracy", 146, 153, "F7.1"),
    LOWER_DEGENERACY("lower_degeneracy", 153, 160, "F7.1");

    /** Length of a record without its line terminator. */
    public static final int RECORD_LENGTH = 160;

    private final String fieldName;
    private final int start;
    private final int end;
    private final String format;

    HitranField(String fieldName, int start, int end, String format) {
        this.fieldName = fieldName;
        this.start = start;
        this.end = end;
        this.format = format;
    }

    /** Field name used in error messages. */
    public String fieldName() {
        return fieldName;
    }

    /** 0-based first column. */
    public int start() {
        return start;
    }

    /** 0-based column after the last. */
    public int end() {
        return end;
    }

    public int width() {
        return end - start;
    }

    /** Fortran edit descriptor of the field. */
    public String format() {
        return format;
    }
}
