package org.linewright.reference.verify;

/** What a {@link Finding} is about; each finding names one of these and a {@link Severity}. */
public enum Check {
    /** A line's S and A disagree with its isotopologue's consensus Q(296 K)/abundance ({@link IntensityRelationCheck}). */
    INTENSITY_RELATION("intensity-relation"),
    /** An isotopologue's lines imply a Q(296 K)/abundance unlike the registry's, or the registry lacks it. */
    REGISTRY_VALUES("registry-values"),
    /** A required value is NaN. */
    NAN_VALUE("nan"),
    /** A value that must be positive (or not negative) is not. */
    NEGATIVE_VALUE("negative"),
    /** The lower-state energy is below zero. */
    LOWER_ENERGY("lower-energy"),
    /** A statistical weight is not positive. */
    DEGENERACY("degeneracy"),
    /** The same line (species, wavenumber and all four quantum labels) occurs twice. */
    DUPLICATE("duplicate"),
    /** The upper-state energy differs from E″ + ν. */
    UPPER_ENERGY("upper-energy"),
    /** A line identified as a reference line lies outside the reference's tolerance. */
    REFERENCE_POSITION("reference-position");

    private final String id;

    Check(String id) {
        this.id = id;
    }

    /** The name used in reports. */
    public String id() {
        return id;
    }
}
