package org.linewright.grid.output;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.linewright.broadening.listing.LineListing;
import org.linewright.broadening.listing.LineListingRequest;
import org.linewright.ingest.testsupport.ReferenceSamples;
import org.linewright.ingest.pipeline.IngestListener;
import org.linewright.ingest.pipeline.IngestOptions;
import org.linewright.ingest.pipeline.IngestPipeline;
import org.linewright.ingest.registry.MoleculeRegistry;
import org.linewright.ingest.store.LineStore;

/**
 * Record → store → CSV on the real HITRAN2020 samples (../shared/reference-data/hitran2020-samples): every field
 * of every record must come back. The expected values are read straight from the record text with the column
 * layout of the 160-character format (HITRAN 2004 layout: Rothman et al. 2005, JQSRT 96, 139, table 1; common
 * practice) and {@link Double#parseDouble}, independently of the project's reader.
 */
class LineListingWriterTest {
    private static final MoleculeRegistry REGISTRY = MoleculeRegistry.builtIn();
    private static final String[] SAMPLES = {"sample_CO.par", "sample_CO2.par", "sample_N2O.par", "sample_PH3.par"};

    @TempDir
    static Path tmp;
    static LineStore store;
    static Map<String, String> recordByKey = new HashMap<>();

    @BeforeAll
    static void ingestSamples() throws Exception {
        List<Path> files = new ArrayList<>();
        for (String s : SAMPLES) {
            Path p = ReferenceSamples.dir("hitran2020-samples").resolve(s);
            files.add(p);
            List<String> lines = Files.readAllLines(p, StandardCharsets.ISO_8859_1);
            int molecule = Integer.parseInt(lines.get(0).substring(0, 2).strip());
            for (int i = 0; i < lines.size(); i++) {
                recordByKey.put(molecule + ":" + (i + 1), lines.get(i));
            }
        }
        IngestPipeline.run(files, tmp.resolve("store"), IngestOptions.strict(REGISTRY), IngestListener.NONE);
        store = LineStore.open(tmp.resolve("store"));
    }

    @Test
    void csvRoundTripReproducesEveryFieldOfEveryRecord() throws Exception {
        StringWriter out = new StringWriter();
        LineListingWriter.write(store, LineListingRequest.all(), REGISTRY, ListingFormat.CSV, null, out);
        List<String> rows = List.of(out.toString().split("\n"));
        List<String> header = List.of(rows.get(0).split(","));
        assertEquals(List.of("molecule", "isotopologue", "wavenumber_cm1", "intensity_cm_per_molecule", "einstein_a_s1",
                "air_width_cm1_per_atm", "self_width_cm1_per_atm", "air_width_exponent", "air_shift_cm1_per_atm",
                "lower_energy_cm1", "upper_degeneracy", "lower_degeneracy"), header.subList(0, 12));
        assertEquals(5381 + 5492 + 5446 + 4424, rows.size() - 1);
        int sourceLine = header.indexOf("source_line");
        for (String row : rows.subList(1, rows.size())) {
            List<String> f = splitCsv(row);
            String record = recordByKey.get(f.get(0) + ":" + f.get(sourceLine));
            assertEquals(160, record.length());
            // Numeric fields: (column, first char, last char) of the 160-character layout.
            int[][] numeric = {{2, 4, 15}, {3, 16, 25}, {4, 26, 35}, {5, 36, 40}, {6, 41, 45}, {7, 56, 59},
                {8, 60, 67}, {9, 46, 55}, {10, 147, 153}, {11, 154, 160}};
            for (int[] n : numeric) {
                double expected = Double.parseDouble(record.substring(n[1] - 1, n[2]).strip());
                assertEquals(expected, Double.parseDouble(f.get(n[0])), 0.0, header.get(n[0]) + " of " + record);
            }
            assertEquals(Integer.parseInt(record.substring(0, 2).strip()), Integer.parseInt(f.get(0)));
            char isoCode = record.charAt(2);
            int iso = isoCode == '0' ? 10 : isoCode == 'A' ? 11 : isoCode == 'B' ? 12 : isoCode - '0';
            assertEquals(iso, Integer.parseInt(f.get(1)));
            // Text fields verbatim: quanta (68-127), uncertainty codes (128-133), references (134-145), flag (146).
            assertEquals(record.substring(67, 82), f.get(header.indexOf("upper_global_quanta")));
            assertEquals(record.substring(82, 97), f.get(header.indexOf("lower_global_quanta")));
            assertEquals(record.substring(97, 112), f.get(header.indexOf("upper_local_quanta")));
            assertEquals(record.substring(112, 127), f.get(header.indexOf("lower_local_quanta")));
            assertEquals(record.substring(127, 133), f.get(header.indexOf("uncertainty_codes")));
            assertEquals(record.substring(133, 145), f.get(header.indexOf("reference_codes")));
            assertEquals(record.substring(145, 146), f.get(header.indexOf("line_mixing_flag")));
        }
    }

    @Test
    void ph3RotationalLineAt1123MicronsIsFoundAt89043Cm1() throws Exception {
        // PH3 J=1-0 at 266.9445 GHz (1.123 mm; common practice) = 8.9043 cm-1; molecule 28.
        double cm1 = 266.9445e9 / 2.99792458e10;
        StringWriter out = new StringWriter();
        LineListingRequest r = new LineListingRequest(cm1 - 0.01, cm1 + 0.01, 28, 0, 0, Double.NaN, null, null);
        LineListing.Summary s = LineListingWriter.write(store, r, REGISTRY, ListingFormat.CSV, null, out);
        assertTrue(s.linesListed() >= 1, "no PH3 line near " + cm1);
        boolean found = false;
        for (String row : out.toString().split("\n")) {
            if (row.startsWith("28,")) {
                List<String> f = splitCsv(row);
                double nu = Double.parseDouble(f.get(2));
                found |= Math.round(nu * 1e4) == 89043;
            }
        }
        assertTrue(found, "8.9043 cm-1 line not listed");
    }

    @Test
    void strongestListsTheLargestIntensitiesInWavenumberOrder() throws Exception {
        // Independent ranking: the 10 largest S(296 K) of the CO sample file, straight from its text.
        List<Double> all = new ArrayList<>();
        for (String record : Files.readAllLines(ReferenceSamples.dir("hitran2020-samples").resolve("sample_CO.par"), StandardCharsets.ISO_8859_1)) {
            all.add(Double.parseDouble(record.substring(15, 25).strip()));
        }
        all.sort((a, b) -> Double.compare(b, a));
        StringWriter out = new StringWriter();
        LineListingWriter.write(store, new LineListingRequest(Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY, 5, 0, 10,
                Double.NaN, null, null), REGISTRY, ListingFormat.CSV, null, out);
        String[] rows = out.toString().split("\n");
        assertEquals(11, rows.length);
        List<Double> listed = new ArrayList<>();
        double lastNu = -1;
        for (int i = 1; i < rows.length; i++) {
            List<String> f = splitCsv(rows[i]);
            double nu = Double.parseDouble(f.get(2));
            assertTrue(nu >= lastNu, "wavenumber order");
            lastNu = nu;
            listed.add(Double.parseDouble(f.get(3)));
        }
        listed.sort((a, b) -> Double.compare(b, a));
        assertEquals(all.subList(0, 10), listed);
    }

    /** RFC 4180 fields (quoted fields may hold commas and doubled quotes). */
    static List<String> splitCsv(String row) {
        List<String> fields = new ArrayList<>();
        StringBuilder sb = new StringBuilder();
        boolean quoted = false;
        for (int i = 0; i < row.length(); i++) {
            char c = row.charAt(i);
            if (quoted) {
                if (c == '"' && i + 1 < row.length() && row.charAt(i + 1) == '"') {
                    sb.append('"');
                    i++;
                } else if (c == '"') {
                    quoted = false;
                } else {
                    sb.append(c);
                }
            } else if (c == '"') {
                quoted = true;
            } else if (c == ',') {
                fields.add(sb.toString());
                sb.setLength(0);
            } else {
                sb.append(c);
            }
        }
        fields.add(sb.toString());
        return fields;
    }
}
