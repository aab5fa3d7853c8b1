package org.linewright.reference.report;

import java.util.Locale;

import org.linewright.ingest.InputException;
import org.linewright.ingest.text.OffendingText;

/** The forms of a report: for people ({@code text}) or for programs ({@code csv}, {@code json}). */
public enum ReportFormat {
    TEXT, CSV, JSON;

    /** The format named {@code id} (text, csv or json, any case). */
    public static ReportFormat byId(String id) {
        try {
            return valueOf(id.toUpperCase(Locale.ROOT));
        } catch (IllegalArgumentException e) {
            throw new InputException("--format: " + OffendingText.quote(id) + " (expected text, csv or json)");
        }
    }

    /** The lower-case name. */
    public String id() {
        return name().toLowerCase(Locale.ROOT);
    }
}
