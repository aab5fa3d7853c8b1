package org.linewright.grid.output;

import org.linewright.ingest.InputException;
import org.linewright.ingest.text.OffendingText;

/** Output formats of a line listing ({@link LineListingWriter}). */
public enum ListingFormat {
    /** Aligned columns for people: the main parameters, not every column. */
    TABLE,
    /** Every column, a header row, values that reproduce the stored doubles exactly. */
    CSV,
    /** An Arrow IPC file: the line store's columns plus the computed ones. */
    ARROW;

    public static ListingFormat byName(String name) {
        for (ListingFormat f : values()) {
            if (f.name().equalsIgnoreCase(name)) {
                return f;
            }
        }
        throw new InputException("format " + OffendingText.quote(name) + " (expected table, csv or arrow)");
    }
}
