package org.linewright.cli;

import org.linewright.ingest.InputException;
import org.linewright.ingest.source.LineFormat;

/** Parsing of format option values into the modules' enums, with one-line errors. */
final class Formats {
    private Formats() {
    }

    static LineFormat lineFormat(String id) {
        try {
            return LineFormat.byId(id);
        } catch (IllegalArgumentException e) {
            throw new InputException("--input-format: " + e.getMessage());
        }
    }
}
