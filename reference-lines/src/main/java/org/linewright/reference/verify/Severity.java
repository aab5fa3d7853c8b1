package org.linewright.reference.verify;

/**
 * How much a {@link Finding} matters. Only errors make {@code verify} fail (exit code 1); with
 * {@link VerifyOptions#strict()} warnings count as errors too.
 */
public enum Severity {
    /** A fault of the list: a line or an isotopologue that cannot be right (exit code 1). */
    ERROR("error"),
    /** Something that stands out and deserves a look, but that clean published lists also show. */
    WARNING("warning"),
    /** Information: what could not be checked, and why. */
    NOTE("note");

    private final String id;

    Severity(String id) {
        this.id = id;
    }

    /** The name used in reports. */
    public String id() {
        return id;
    }
}
