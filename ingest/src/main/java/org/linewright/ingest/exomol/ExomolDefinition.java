package org.linewright.ingest.exomol;

import java.io.IOException;
import java.io.InputStream;
import java.util.Locale;
import org.linewright.ingest.source.LineFormatException;
import org.linewright.ingest.text.ByteLineScanner;

/**
 * What the reader takes from a {@code .def} file: which optional numeric columns follow J in the states file.
 * Each line of the file is {@code VALUE # DESCRIPTION}; the lines used are those whose description contains
 * "uncertainty availability", "lifetime availability" or "g-factor availability" (value 1 = column present).
 * Without a {@code .def} file no optional column is assumed: everything after J is taken as labels.
 *
 * @param uncertainty the states carry an energy uncertainty (cm⁻¹) after J
 * @param lifetime the states carry a lifetime (s) after that
 * @param landeFactor the states carry a Landé g-factor after that
 */
record ExomolDefinition(boolean uncertainty, boolean lifetime, boolean landeFactor) {

    static final ExomolDefinition NONE = new ExomolDefinition(false, false, false);

    /** Number of optional numeric columns between J and the labels. */
    int optionalColumns() {
        return (uncertainty ? 1 : 0) + (lifetime ? 1 : 0) + (landeFactor ? 1 : 0);
    }

    static ExomolDefinition read(InputStream in, String fileName) throws IOException {
        boolean unc = false;
        boolean life = false;
        boolean lande = false;
        try (ByteLineScanner lines = new ByteLineScanner(in)) {
            while (lines.next()) {
                String line = lines.lineText();
                int hash = line.indexOf('#');
                if (hash < 0) {
                    continue;
                }
                String description = line.substring(hash + 1).toLowerCase(Locale.ROOT);
                String value = line.substring(0, hash).trim();
                boolean isFlag = description.contains("uncertainty availability")
                        || description.contains("lifetime availability")
                        || description.contains("g-factor availability");
                if (!isFlag) {
                    continue;
                }
                if (!value.equals("0") && !value.equals("1")) {
                    throw new LineFormatException(fileName, lines.lineNumber(), 1, Math.max(1, hash), "availability flag",
                            value, "0 or 1");
                }
                boolean on = value.equals("1");
                if (description.contains("uncertainty availability")) {
                    unc = on;
                } else if (description.contains("lifetime availability")) {
                    life = on;
                } else {
                    lande = on;
                }
            }
        }
        return new ExomolDefinition(unc, life, lande);
    }
}
