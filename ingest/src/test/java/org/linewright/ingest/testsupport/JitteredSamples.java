package org.linewright.ingest.testsupport;

import java.io.BufferedWriter;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Random;

/**
 * Realistic line lists for accuracy tests and benchmarks, made from the real records of a sample
 * ({@link ReferenceSamples}): the records whose position lies in a window are cycled until the wanted count, each
 * copy's position moved by a uniform random offset of at most ± jitter (seeded), and written sorted by position
 * as 160-character records (positions rewritten in the record's own 12-character field). Every other field —
 * intensities, widths, lower-state energies, isotopologues — is the published record's, so the list clusters in
 * bands with empty regions between them, as real lists do.
 */
public final class JitteredSamples {
    /** Columns of the position field in the 160-character record (common practice: characters 4–15, F12.6). */
    private static final int POSITION_FROM = 3;
    private static final int POSITION_TO = 15;

    private JitteredSamples() {
    }

    /**
     * Writes the jittered list.
     *
     * @param sample    a 160-character sample file
     * @param out       the file to write
     * @param count     records to write
     * @param fromCm1   lower end of the window of sample positions taken
     * @param toCm1     upper end of that window
     * @param jitterCm1 largest position offset
     * @param seed      random seed
     * @return {@code out}
     * @throws IllegalArgumentException when no sample record lies in the window
     */
    public static Path write(Path sample, Path out, int count, double fromCm1, double toCm1, double jitterCm1,
                             long seed) throws IOException {
        List<String> records = new ArrayList<>();
        for (String line : ReferenceSamples.lines(sample)) {
            if (line.length() < 160) {
                continue;
            }
            double nu = Double.parseDouble(line.substring(POSITION_FROM, POSITION_TO).trim());
            if (nu >= fromCm1 && nu <= toCm1) {
                records.add(line.substring(0, 160));
            }
        }
        if (records.isEmpty()) {
            throw new IllegalArgumentException(sample + ": no record within " + fromCm1 + "-" + toCm1 + " cm-1");
        }
        Random random = new Random(seed);
        double[] positions = new double[count];
        String[] rows = new String[count];
        Integer[] order = new Integer[count];
        for (int k = 0; k < count; k++) {
            String r = records.get(k % records.size());
            double nu = Double.parseDouble(r.substring(POSITION_FROM, POSITION_TO).trim())
                    + jitterCm1 * (2 * random.nextDouble() - 1);
            nu = Math.max(nu, 1e-6);
            positions[k] = nu;
            rows[k] = r.substring(0, POSITION_FROM) + String.format(Locale.ROOT, "%12.6f", nu) + r.substring(POSITION_TO);
            order[k] = k;
        }
        java.util.Arrays.sort(order, (a, b) -> Double.compare(positions[a], positions[b]));
        try (BufferedWriter w = Files.newBufferedWriter(out, StandardCharsets.ISO_8859_1)) {
            for (Integer k : order) {
                w.write(rows[k]);
                w.write('\n');
            }
        }
        return out;
    }
}
