package org.linewright.grid.output;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;

/**
 * CSV of one cross section: the header {@value #HEADER}, then one line per grid point with both values written
 * by {@link Double#toString(double)} (the shortest decimal that reads back to the same double, so values
 * round-trip exactly).
 */
final class CsvCrossSectionWriter {
    /** The header line. */
    static final String HEADER = CrossSectionFiles.WAVENUMBER_NAME + "," + CrossSectionFiles.SIGMA_NAME;

    private CsvCrossSectionWriter() {
    }

    static void write(Path file, double[] wavenumberCm1, double[] sigma) throws IOException {
        try (BufferedWriter w = Files.newBufferedWriter(file, StandardCharsets.US_ASCII)) {
            w.write(HEADER);
            w.write('\n');
            for (int i = 0; i < sigma.length; i++) {
                w.write(Double.toString(wavenumberCm1[i]));
                w.write(',');
                w.write(Double.toString(sigma[i]));
                w.write('\n');
            }
        }
    }
}
