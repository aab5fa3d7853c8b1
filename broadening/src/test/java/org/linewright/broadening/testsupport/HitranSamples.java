package org.linewright.broadening.testsupport;

import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.linewright.ingest.hitran.HitranRecordReader;
import org.linewright.ingest.line.LineBatch;
import org.linewright.ingest.source.ReadOptions;
import org.linewright.ingest.testsupport.ReferenceSamples;
import org.linewright.ingest.testsupport.SampleIsotopologues;

/**
 * Reads the HITRAN2020 samples of {@code reference-data/hitran2020-samples} (README there): the records with the
 * project's 160-character reader, and the comma-separated (value, uncertainty code, reference code) triples
 * appended after column 160 in the {@code *_out.par} files.
 */
public final class HitranSamples {
    /** Record length of the 160-character format. */
    private static final int RECORD_LENGTH = 160;

    private HitranSamples() {
    }

    /** The folder of the samples, or a visible skip. */
    public static Path folder() {
        return ReferenceSamples.dir("hitran2020-samples");
    }

    /** Every record of {@code sample_<name>.par} in one batch. */
    public static LineBatch records(String name) throws IOException {
        Path file = folder().resolve("sample_" + name + ".par");
        LineBatch batch = new LineBatch(8192);
        try (InputStream in = Files.newInputStream(file);
             HitranRecordReader reader = new HitranRecordReader(in, file.toString(),
                     ReadOptions.strict(SampleIsotopologues.withLinearRotorQ()))) {
            if (!reader.read(batch)) {
                throw new IOException("no records in " + file);
            }
            LineBatch rest = new LineBatch(1);
            if (reader.read(rest)) {
                throw new IOException("more than 8192 records in " + file);
            }
        }
        return batch;
    }

    /** The values (first of each triple) appended to each record of {@code sample_<name>_out.par}. */
    public static double[][] appendedValues(String name) throws IOException {
        List<String> lines = Files.readAllLines(folder().resolve("sample_" + name + "_out.par"),
                StandardCharsets.US_ASCII);
        double[][] out = new double[lines.size()][];
        for (int i = 0; i < lines.size(); i++) {
            String tail = lines.get(i).substring(RECORD_LENGTH);
            String[] items = tail.split(",");
            // items: "" (text before the first comma), then value, code, reference repeated
            int triples = (items.length - 1) / 3;
            out[i] = new double[triples];
            for (int t = 0; t < triples; t++) {
                out[i][t] = Double.parseDouble(items[1 + 3 * t].trim());
            }
        }
        return out;
    }

    /** The 160-character record of each line of {@code sample_<name>_out.par}. */
    public static List<String> outRecords(String name) throws IOException {
        return Files.readAllLines(folder().resolve("sample_" + name + "_out.par"), StandardCharsets.US_ASCII)
                .stream().map(l -> l.substring(0, RECORD_LENGTH)).toList();
    }
}
